package lazyssa_test

import (
	"slices"
	"testing"

	"github.com/stretchr/testify/assert"
	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/analysistest"
	"golang.org/x/tools/go/analysis/passes/buildssa"

	"roundoff/analyzers/internal/lazyssa"
)

// The lazy build is buildssa's, done once however often it is asked for.
func TestSameAsBuildSSA(t *testing.T) {
	var names, want []string
	var same bool
	compare := &analysis.Analyzer{
		Name:     "compare",
		Doc:      "compare lazyssa with buildssa",
		Requires: []*analysis.Analyzer{lazyssa.Analyzer, buildssa.Analyzer},
		Run: func(pass *analysis.Pass) (any, error) {
			lazy := pass.ResultOf[lazyssa.Analyzer].(*lazyssa.Lazy)
			first := lazy.SSA()
			same = first == lazy.SSA()
			for _, fn := range first.SrcFuncs {
				names = append(names, fn.String())
			}
			for _, fn := range pass.ResultOf[buildssa.Analyzer].(*buildssa.SSA).SrcFuncs {
				want = append(want, fn.String())
			}
			return nil, nil
		},
	}
	analysistest.Run(t, analysistest.TestData(), compare, "steps")
	assert.True(t, same, "built twice")
	assert.Equal(t, want, names)
	assert.True(t, slices.Contains(names, "steps.central$1"), "closures included: %v", names)
}
