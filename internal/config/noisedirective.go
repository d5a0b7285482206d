package config

import (
	"fmt"
	"go/ast"
	"strings"

	"roundoff/internal/numeric"
)

// NoiseDirective is the comment prefix that declares a function's noise
// level; the analyzers read it and `roundoff noise -write` writes it.
const NoiseDirective = "//roundoff:noise"

// FindNoiseDirective finds the noise directive in a doc comment and
// returns it, nil when there is none. Its first word is the level, checked
// by ParseNoise; words after it are a free explanation. err says what is
// wrong with a malformed one.
func FindNoiseDirective(doc *ast.CommentGroup) (level float64, directive *ast.Comment, err error) {
	if doc == nil {
		return 0, nil, nil
	}
	for _, c := range doc.List {
		rest, ok := strings.CutPrefix(c.Text, NoiseDirective)
		if !ok || rest != "" && rest[0] != ' ' && rest[0] != '\t' {
			continue
		}
		rest, _, _ = strings.Cut(rest, "//") // a trailing comment is no part of it
		fields := strings.Fields(rest)
		if len(fields) == 0 {
			return 0, c, fmt.Errorf("%s takes a relative accuracy, such as %s 1e-6", NoiseDirective, NoiseDirective)
		}
		v, err := ParseNoise(fields[0], numeric.Float64)
		if err != nil {
			return 0, c, fmt.Errorf("%s %s: %v", NoiseDirective, fields[0], err)
		}
		return v, c, nil
	}
	return 0, nil, nil
}
