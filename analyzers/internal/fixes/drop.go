package fixes

import (
	"go/ast"
	"go/token"
	"slices"

	"golang.org/x/tools/go/analysis"

	"roundoff/internal/config"
)

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
	for _, r := range config.Reviews(pass.Fset, file) {
		if (r.Line == posn.Line || r.Line == posn.Line-1) && r.Reason != "" && slices.Contains(r.Names, name) {
			config.MarkReviewUsed(posn.Filename, r.Line, name)
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
