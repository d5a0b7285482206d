package noiselevel_test

import (
	"go/ast"
	"go/parser"
	"go/token"
	"go/types"
	"testing"

	"github.com/stretchr/testify/assert"
	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/analysistest"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/noiselevel"
	"roundoff/internal/config"
)

// probe reports the noise level noiselevel knows for every call.
var probe = &analysis.Analyzer{
	Name:     "probe",
	Doc:      "probe: report known noise levels",
	Requires: []*analysis.Analyzer{noiselevel.Analyzer},
	Run: func(pass *analysis.Pass) (any, error) {
		levels := pass.ResultOf[noiselevel.Analyzer].(*noiselevel.Levels)
		for _, f := range pass.Files {
			ast.Inspect(f, func(n ast.Node) bool {
				if call, ok := n.(*ast.CallExpr); ok {
					fn, _ := typeutil.Callee(pass.TypesInfo, call).(*types.Func)
					if v, ok := levels.Of(fn); ok {
						pass.Reportf(call.Pos(), "noise %g", v)
					}
				}
				return true
			})
		}
		return nil, nil
	},
}

// TestAcrossPackages checks that levels declared by a directive, or by the
// configuration file, reach calls in another package as facts.
func TestAcrossPackages(t *testing.T) {
	cfg := config.Default(nil, "")
	cfg.NoiseLevels = []config.NoiseLevel{{Package: "model", Function: "Exact", Relative: 1e-4}}
	config.Use(cfg)
	t.Cleanup(func() { config.Use(nil) })
	analysistest.Run(t, analysistest.TestData(), noiselevel.Analyzer, "model")
	analysistest.Run(t, analysistest.TestData(), probe, "uses")
}

func TestParse(t *testing.T) {
	for src, want := range map[string]struct {
		level float64
		found bool
		bad   bool
	}{
		"//roundoff:noise 1e-6":                      {1e-6, true, false},
		"//roundoff:noise 0.01 solver tolerance":     {0.01, true, false},
		"//roundoff:noise 1e-3 // the ODE tolerance": {1e-3, true, false},
		"//roundoff:noise":                           {0, true, true},
		"//roundoff:noise 0":                         {0, true, true},
		"//roundoff:noise 1":                         {0, true, true},
		"//roundoff:noise NaN":                       {0, true, true},
		"//roundoff:noise -1e-6":                     {0, true, true},
		"//roundoff:noisy 1e-6":                      {0, false, false},
		"// roundoff:noise 1e-6":                     {0, false, false},
	} {
		f, err := parser.ParseFile(token.NewFileSet(), "x.go", "package p\n\n"+src+"\nfunc F() {}\n", parser.ParseComments)
		assert.NoError(t, err)
		level, c, err := config.FindNoiseDirective(f.Decls[0].(*ast.FuncDecl).Doc)
		assert.Equal(t, want.found, c != nil, src)
		assert.Equal(t, want.bad, err != nil, src)
		assert.Equal(t, want.level, level, src)
	}
}
