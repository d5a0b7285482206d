package fixes

import (
	"go/ast"
	"go/token"
	"slices"
	"strings"
	"sync"

	"golang.org/x/tools/go/analysis"

	"roundoff/analyzers/internal/config"
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

// ReviewUsed reports whether the directive on the given line of filename
// has suppressed a finding of analyzer name during this run.
func ReviewUsed(filename string, line int, name string) bool {
	_, ok := used.Load(reviewKey{filename, line, name})
	return ok
}

// dropped reports whether d must not be reported: its analyzer is turned
// off or its file excluded by the run's configuration, or a review
// directive with a reason covers it.
func dropped(pass *analysis.Pass, d analysis.Diagnostic) bool {
	if pass.Analyzer == nil || pass.Fset == nil {
		return false // a bare pass, as unit tests build
	}
	cfg := config.Current()
	posn := pass.Fset.PositionFor(d.Pos, false)
	if !cfg.Enabled(pass.Analyzer.Name) || cfg.Excluded(posn.Filename) {
		return true
	}
	return reviewed(pass, posn)
}

// reviewed reports whether a review directive with a reason covers the
// analyzer's finding at posn, recording the directive as used.
func reviewed(pass *analysis.Pass, posn token.Position) bool {
	file := fileOf(pass, posn.Filename)
	if file == nil {
		return false
	}
	name := pass.Analyzer.Name
	for _, r := range Reviews(pass.Fset, file) {
		if (r.Line == posn.Line || r.Line == posn.Line-1) && r.Reason != "" && slices.Contains(r.Names, name) {
			used.Store(reviewKey{posn.Filename, r.Line, name}, true)
			return true
		}
	}
	return false
}

// fileOf returns the syntax of the pass's file called filename.
func fileOf(pass *analysis.Pass, filename string) *ast.File {
	for _, f := range pass.Files {
		if tf := pass.Fset.File(f.FileStart); tf != nil && tf.Name() == filename {
			return f
		}
	}
	return nil
}
