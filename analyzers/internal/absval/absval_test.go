package absval_test

import (
	"go/ast"
	"testing"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/analysistest"

	"roundoff/analyzers/internal/absval"
	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
)

// probe reports every call that absval reads as an absolute value.
var probe = &analysis.Analyzer{
	Name:     "probe",
	Doc:      "probe: report absolute values",
	Requires: []*analysis.Analyzer{absval.Analyzer, constval.Analyzer},
	Run: func(pass *analysis.Pass) (any, error) {
		k, decls := absval.Of(pass), constval.DeclsOf(pass)
		for _, f := range pass.Files {
			ast.Inspect(f, func(n ast.Node) bool {
				if call, ok := n.(*ast.CallExpr); ok {
					if x, ok := k.Arg(pass.TypesInfo, decls, call); ok {
						pass.Reportf(call.Pos(), "|%s|", fixes.Source(pass.Fset, x))
					}
				}
				return true
			})
		}
		return nil, nil
	},
}

// TestFacts checks which functions of a float32 math library are learned
// as absolute values, by their bodies (IEEE 754-2019 §5.5.1: abs clears
// the sign bit, bit 31 of binary32).
func TestFacts(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), absval.Analyzer, "lowmath")
}

// TestCalls checks the calls recognised in an importing package: through
// facts, a local helper, and variables bound once.
func TestCalls(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), probe, "user")
}
