package config

import (
	"go/ast"
	"go/token"
	"strings"
	"sync"
)

// ReviewDirective starts a comment by which a person records that a
// finding was reviewed and accepted:
//
//	//roundoff:reviewed <analyzer>[,<analyzer>...] <reason>
//
// It suppresses the named analyzers' findings on its own line and on the
// line below, provided it gives a reason.
const ReviewDirective = "//roundoff:reviewed"

// A Review is one review directive in a file.
type Review struct {
	Comment *ast.Comment
	Line    int      // the directive's line
	Names   []string // the analyzers named, as written
	Reason  string   // "" when missing
}

// ParseReview parses the text of a comment as a review directive; ok is
// false when it is not one.
func ParseReview(text string) (names []string, reason string, ok bool) {
	rest, ok := strings.CutPrefix(text, ReviewDirective)
	if !ok || rest != "" && rest[0] != ' ' && rest[0] != '\t' {
		return nil, "", false
	}
	fields := strings.Fields(rest)
	if len(fields) == 0 {
		return nil, "", true
	}
	reason = strings.TrimSpace(strings.TrimSpace(rest)[len(fields[0]):])
	return strings.Split(fields[0], ","), reason, true
}

// Reviews returns the review directives of file, in order.
func Reviews(fset *token.FileSet, file *ast.File) []Review {
	var out []Review
	for _, g := range file.Comments {
		for _, c := range g.List {
			if names, reason, ok := ParseReview(c.Text); ok {
				out = append(out, Review{c, fset.PositionFor(c.Slash, false).Line, names, reason})
			}
		}
	}
	return out
}

// A reviewKey names one analyzer of one directive.
type reviewKey struct {
	file string
	line int
	name string
}

// used records the directives that suppressed a finding in this process.
var used sync.Map // reviewKey → bool

// MarkReviewUsed records that the directive on the given line of filename
// suppressed a finding of analyzer name.
func MarkReviewUsed(filename string, line int, name string) {
	used.Store(reviewKey{filename, line, name}, true)
}

// ReviewUsed reports whether the directive on the given line of filename
// has suppressed a finding of analyzer name during this run.
func ReviewUsed(filename string, line int, name string) bool {
	_, ok := used.Load(reviewKey{filename, line, name})
	return ok
}
