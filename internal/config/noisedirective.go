package config

import (
	"fmt"
	"go/ast"
	"math"
	"strconv"
	"strings"
)

// NoiseDirective is the comment prefix that declares a function's noise
// level; the analyzers read it and `roundoff noise -write` writes it.
const NoiseDirective = "//roundoff:noise"

// ParseNoise finds the noise directive in a doc comment and returns it, nil
// when there is none. Its first word is the level, a number strictly
// between 0 and 1; words after it are a free explanation. err says what is
// wrong with a malformed one.
func ParseNoise(doc *ast.CommentGroup) (level float64, directive *ast.Comment, err error) {
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
		v, perr := strconv.ParseFloat(fields[0], 64)
		if perr != nil || !(v > 0 && v < 1) || math.IsNaN(v) {
			return 0, c, fmt.Errorf("%s %s: the relative accuracy must be a number between 0 and 1", NoiseDirective, fields[0])
		}
		return v, c, nil
	}
	return 0, nil, nil
}
