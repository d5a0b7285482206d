package epsfloor_test

import (
	"fmt"
	"math"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"golang.org/x/tools/go/analysis/analysistest"

	"roundoff/analyzers/epsfloor"
	"roundoff/analyzers/internal/testrun"
	"roundoff/internal/numeric"
)

func TestHazards(t *testing.T) {
	analysistest.RunWithSuggestedFixes(t, analysistest.TestData(), epsfloor.Analyzer, "hazards", "runfix", "newton")
}

func TestIdioms(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), epsfloor.Analyzer, "idioms")
}

// TestAcrossPackages checks that a tolerance parameter or field of one
// package is judged where another package passes it a constant.
func TestAcrossPackages(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), epsfloor.Analyzer, "tolapi", "tolclient")
}

// TestFormats checks the quantities epsfloor judges by against the IEEE
// 754-2019 binary formats: eps = 2^(1-p) and u = 2^-p for precision p
// (53 bits for binary64, 24 for binary32), and the smallest subnormal
// binary64 2^-1074, which is math.SmallestNonzeroFloat64.
func TestFormats(t *testing.T) {
	assert.Equal(t, math.Ldexp(1, -52), numeric.Float64.Eps)
	assert.Equal(t, math.Ldexp(1, -53), numeric.Float64.U)
	assert.Equal(t, math.Ldexp(1, -23), numeric.Float32.Eps)
	assert.Equal(t, math.Ldexp(1, -24), numeric.Float32.U)
	assert.Equal(t, math.Ldexp(1, -1074), numeric.Float64.Smallest)
	assert.Equal(t, math.SmallestNonzeroFloat64, numeric.Float64.Smallest)
	assert.Equal(t, math.Ldexp(1, -149), numeric.Float32.Smallest) // binary32 smallest subnormal
}

// TestFixedProgramRuns runs testdata/src/runfix before and after its fixes
// with values 0 to 3 ulps apart near 1 and near 1e6, stepped with
// math.Nextafter (IEEE 754-2019 nextUp). Before, the tests pass only for
// bit-identical values; after, 4 ulps of relative tolerance accept all.
func TestFixedProgramRuns(t *testing.T) {
	src := filepath.Join("testdata", "src", "runfix")
	before := testrun.Output(t, filepath.Join(src, "main.go"))
	after := testrun.Output(t, filepath.Join(src, "main.go.golden"))
	var wantBefore, wantAfter strings.Builder
	for _, b := range []string{"1", "1e+06"} {
		for k := range 4 {
			fmt.Fprintf(&wantBefore, "%s %d %t %t\n", b, k, k == 0, k == 0)
			fmt.Fprintf(&wantAfter, "%s %d true true\n", b, k)
		}
	}
	assert.Equal(t, wantBefore.String(), before)
	assert.Equal(t, wantAfter.String(), after)
}

// TestFixedNewtonConverges runs testdata/src/newton, Newton's method on the
// residual r = k·q² - h, before and after its fix, for 1000 values of k at
// h = 20 and 80 (the heads of the demo's Flow). The residual of the best q
// rounds at about eps·h (IEEE 754-2019: each of k·q·q and the subtraction
// errs by up to u relative, and the neighbours of the root move k·q² by
// about 2h·u), so the test |r| < SmallestNonzeroFloat64 passes only when
// rounding happens to give exactly 0; the fixed test, |r| below 4 ulps of
// max(|k·q²|, |h|), passes for every k in a few iterations (Newton's
// quadratic convergence from q = 1, Nocedal & Wright 2nd ed. Thm 11.2).
func TestFixedNewtonConverges(t *testing.T) {
	src := filepath.Join("testdata", "src", "newton")
	before := testrun.Values(t, testrun.Output(t, filepath.Join(src, "main.go")))
	after := testrun.Values(t, testrun.Output(t, filepath.Join(src, "main.go.golden")))
	for _, h := range []string{"20", "80"} {
		// Before: many solves hit the cap of 100 (which ones depends on
		// how the platform rounds and fuses k*q*q - h).
		assert.Greater(t, before["capped-"+h], 0.0, "h = %s: some solves should never pass the subnormal test", h)
		assert.Zero(t, after["capped-"+h], "h = %s: every fixed solve should converge", h)
		assert.Less(t, after["most-"+h], 10.0, "h = %s: Newton needs only a few iterations", h)
	}
}
