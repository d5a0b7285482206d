package epsfloor_test

import (
	"fmt"
	"go/format"
	"go/token"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/analysistest"

	"roundoff/analyzers/epsfloor"
	"roundoff/analyzers/internal/testrun"
	"roundoff/internal/config"
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

// TestHelperAtSize checks calls of a comparison helper whose compared
// values have a known size: the expected values of a table declared in
// test support code, or constants. The spacing of binary64 values in
// [2^23, 2^24) is 2^-29 ≈ 1.86e-9 (IEEE 754-2019 §3.3), half of it
// 9.31e-10, and in [2^21, 2^22) 2^-31 ≈ 4.66e-10, half of it 2.33e-10.
func TestHelperAtSize(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), epsfloor.Analyzer, "heatcheck")
	assert.Equal(t, math.Ldexp(1, -29), math.Nextafter(1.194354902e7, math.Inf(1))-1.194354902e7)
	assert.Equal(t, math.Ldexp(1, -31), math.Nextafter(3.9960019993e6, math.Inf(1))-3.9960019993e6)
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
// It also checks that the overflow test's fix sees both infinities.
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
	// 2e10·1e300 overflows to +Inf and -2e10·1e300 to -Inf (IEEE 754-2019
	// §7.4: overflow gives ∞ with the sign of the result); before the fix
	// only the positive overflow is seen.
	wantBefore.WriteString("overflow 1 false\noverflow 2e+10 true\noverflow -2e+10 false\n")
	wantAfter.WriteString("overflow 1 false\noverflow 2e+10 true\noverflow -2e+10 true\n")
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

// quiet is an analysistest.Testing that ignores the demo's missing
// expectations: the demo carries no "// want" comments.
type quiet struct{}

func (quiet) Errorf(string, ...any) {}

// TestDemoFlowConverges applies epsfloor's fix to the demo's Penstock.Flow
// (testdata/demo/turbine) and runs the loop before and after it, for 30
// pipes at the heads h = 20 and 80 m, counting the passes. Before, the
// test |r| < SmallestNonzeroFloat64 on r = k·q² - h passes only when
// rounding gives exactly 0, and several pipes run to the cap of 100; after
// the fix every solve converges in a few passes (see
// TestFixedNewtonConverges for why).
func TestDemoFlowConverges(t *testing.T) {
	demo := filepath.Join("..", "..", "testdata", "demo", "turbine", "penstock.go")
	orig, err := os.ReadFile(demo)
	require.NoError(t, err)
	dir := t.TempDir()
	require.NoError(t, os.MkdirAll(filepath.Join(dir, "src", "turbine"), 0o755))
	require.NoError(t, os.WriteFile(filepath.Join(dir, "src", "turbine", "penstock.go"), append(orig, "\nconst grav = 9.80665\n"...), 0o644))
	var fixed []byte
	for _, res := range analysistest.Run(quiet{}, dir, epsfloor.Analyzer, "turbine") {
		for _, d := range res.Diagnostics {
			if strings.Contains(d.Message, "SmallestNonzeroFloat64") && len(d.SuggestedFixes) > 0 {
				fixed = applyEdits(t, res.Pass.Fset, orig, d.SuggestedFixes[0].TextEdits)
			}
		}
	}
	require.NotNil(t, fixed, "epsfloor offers a fix for Flow")
	fixed, err = format.Source(fixed)
	require.NoError(t, err)
	assert.Contains(t, string(fixed), "math.Abs(r) < 4*0x1p-52*math.Max(math.Abs(k*q*q), math.Abs(h))")
	before := testrun.Values(t, testrun.Output(t, flowProgram(t, orig)))
	after := testrun.Values(t, testrun.Output(t, flowProgram(t, fixed)))
	for _, h := range []string{"20", "80"} {
		assert.Greater(t, before["capped-"+h], 0.0, "h = %s: some pipes run to the cap before the fix", h)
		assert.Zero(t, after["capped-"+h], "h = %s: every pipe converges after the fix", h)
		assert.Less(t, after["most-"+h], 10.0, "h = %s", h)
	}
}

// applyEdits applies text edits, given by position in fset, to src.
func applyEdits(t *testing.T, fset *token.FileSet, src []byte, edits []analysis.TextEdit) []byte {
	slices.SortFunc(edits, func(a, b analysis.TextEdit) int { return int(b.Pos - a.Pos) })
	out := slices.Clone(src)
	for _, e := range edits {
		start, end := fset.Position(e.Pos).Offset, fset.Position(e.End).Offset
		require.LessOrEqual(t, end, len(out))
		out = slices.Concat(out[:start], e.NewText, out[end:])
	}
	return out
}

// flowProgram turns the demo's penstock.go into a program that counts the
// passes of Flow's loop for 30 pipes at h = 20 and 80 and prints, per
// head, how many solves ran to the cap and the most passes of the others.
func flowProgram(t *testing.T, penstock []byte) string {
	src := strings.Replace(string(penstock), "package turbine", "package main", 1)
	src = strings.Replace(src, "for range 100 {", "for passes = 0; passes < 100; passes++ {", 1)
	src += `
const grav = 9.80665 // standard gravity, m/s², as the demo's turbine.go

var passes int

func main() {
	for _, h := range []float64{20, 80} {
		capped, most := 0, 0
		for _, length := range []float64{60, 85, 120, 140, 180, 250} {
			for _, diameter := range []float64{0.3, 0.4, 0.5, 0.6, 0.8} {
				Penstock{Length: length, Diameter: diameter}.Flow(h)
				if passes == 100 {
					capped++
				} else {
					most = max(most, passes)
				}
			}
		}
		fmt.Printf("capped-%g %d\nmost-%g %d\n", h, capped, h, most)
	}
}
`
	src = strings.Replace(src, "import \"math\"", "import (\n\t\"fmt\"\n\t\"math\"\n)", 1)
	file := filepath.Join(t.TempDir(), "main.go")
	require.NoError(t, os.WriteFile(file, []byte(src), 0o644))
	return file
}

// TestSiteRelated checks that a constant passed to a tolerance parameter
// names the test that uses it as its second place, in the message and as
// related information (common practice).
func TestSiteRelated(t *testing.T) {
	res := analysistest.Run(t, analysistest.TestData(), epsfloor.Analyzer, "hazards")
	found := false
	for _, r := range res {
		for _, d := range r.Diagnostics {
			if !strings.Contains(d.Message, "passed as tol to solve") {
				continue
			}
			require.Len(t, d.Related, 1)
			test := r.Pass.Fset.Position(d.Related[0].Pos)
			assert.Contains(t, d.Message, fmt.Sprintf("tested at hazards.go:%d", test.Line))
			found = true
		}
	}
	assert.True(t, found)
}

// TestDataSize checks the data-size rule: an absolute tolerance t on a
// quantity of degree d stops meaning anything once the data reach
// (t/eps)^(1/d) (eps = 2^-52, IEEE 754-2019 binary64), below the assumed
// size 1e3; and, with a size of 1e6 declared for a package, where that
// size puts the limit.
func TestDataSize(t *testing.T) {
	analysistest.RunWithSuggestedFixes(t, analysistest.TestData(), epsfloor.Analyzer, "datasize")
	cfg := config.Default(nil, "")
	cfg.DataSizes = []config.DataSize{{Package: "bigdata", Size: 1e6}}
	config.Use(cfg)
	defer config.Use(config.Default(nil, ""))
	analysistest.Run(t, analysistest.TestData(), epsfloor.Analyzer, "bigdata")
}

// TestOffsetDirection checks the numbers of the offset-direction rule
// against IEEE 754-2019 (§5.3.1 nextUp; binary64 spacing 2^(e-52) in
// [2^e, 2^(e+1))): t+1 is t itself from 2^54 on (and for even
// significands from 2^53), so Nextafter(t, t+1) - t is 0 there, while
// the direction math.Inf(1) gives the spacing; below, both agree.
func TestOffsetDirection(t *testing.T) {
	for _, x := range []float64{math.Ldexp(1, 53), math.Ldexp(1, 54), 1e17} {
		assert.Equal(t, x, x+1, x)
		assert.Equal(t, 0.0, math.Nextafter(x, x+1)-x, x)
		assert.Equal(t, math.Ldexp(1, math.Ilogb(x)-52), math.Nextafter(x, math.Inf(1))-x, x)
	}
	for _, x := range []float64{-3, 0.5, 1, 1e15, math.Ldexp(1, 53) - 1} {
		assert.Equal(t, math.Nextafter(x, math.Inf(1)), math.Nextafter(x, x+1), x)
	}
}
