package limits_test

import (
	"bytes"
	"encoding/json"
	"math"
	"math/big"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"roundoff/cmd/roundoff/internal/limits"
	"roundoff/internal/numeric"
)

// run calls limits.Run and returns its status, stdout and stderr.
func run(args ...string) (int, string, string) {
	var out, errb bytes.Buffer
	code := limits.Run(args, &out, &errb)
	return code, out.String(), errb.String()
}

// runJSON runs the calculator with -json and decodes its rows.
func runJSON(t *testing.T, args ...string) []limits.Limits {
	t.Helper()
	code, out, stderr := run(append([]string{"-json"}, args...)...)
	require.Equal(t, 0, code, stderr)
	var rows []limits.Limits
	require.NoError(t, json.Unmarshal([]byte(out), &rows))
	return rows
}

// pow2 returns 2^e, built with math/big.
func pow2(e int) float64 {
	f, _ := new(big.Float).SetMantExp(big.NewFloat(1), e).Float64()
	return f
}

func TestUlpFloat64(t *testing.T) {
	rows := runJSON(t, "1", "1e6", "-3", "0.1", "1e300", "0")
	// IEEE 754-2019 binary64: ulp = 2^(e-52) for 2^e <= |x| < 2^(e+1);
	// 2^-1074 at zero.
	for i, e := range []int{-52, 19 - 52, 1 - 52, -4 - 52, 996 - 52, -1074} {
		assert.Equal(t, pow2(e), rows[i].Ulp, "x=%g", rows[i].X)
	}
	// The same spacing by math.Nextafter (NUMERICS.md).
	for _, r := range rows {
		ax := math.Abs(r.X)
		assert.Equal(t, math.Nextafter(ax, math.Inf(1))-ax, r.Ulp, "x=%g", r.X)
	}
}

func TestUlpFloat32(t *testing.T) {
	rows := runJSON(t, "-type", "float32", "1", "3.5", "1e6", "0")
	// IEEE 754-2019 binary32: ulp = 2^(e-23); 2^-149 at zero.
	for i, e := range []int{-23, 1 - 23, 19 - 23, -149} {
		assert.Equal(t, pow2(e), rows[i].Ulp, "x=%g", rows[i].X)
	}
	for _, r := range rows {
		ax := float32(math.Abs(r.X))
		assert.Equal(t, float64(math.Nextafter32(ax, float32(math.Inf(1)))-ax), r.Ulp, "x=%g", r.X)
		assert.Equal(t, pow2(-23), r.Eps) // IEEE 754-2019: binary32 eps = 2^(1-24)
	}
}

func TestTolerances(t *testing.T) {
	rows := runJSON(t, "1", "1e8", "0.5", "0")
	eps := pow2(-52) // IEEE 754-2019 binary64 machine epsilon
	for _, r := range rows {
		assert.Equal(t, eps, r.Eps)
		xc := math.Max(1, math.Abs(r.X))
		// NUMERICS.md, stopping tests: root finding pins x to about eps·|x|,
		// never below ulp(x); minimization to sqrt(eps)·x_c [Brent 1973, ch. 5;
		// Numerical Recipes 3rd ed. §10.2].
		assert.Equal(t, math.Max(eps*math.Abs(r.X), r.Ulp), r.RootTol, "x=%g", r.X)
		assert.Equal(t, pow2(-26)*xc, r.MinTol, "x=%g", r.X)
	}
	// At x = 0 an absolute tolerance below the smallest subnormal cannot pass.
	assert.Equal(t, math.SmallestNonzeroFloat64, rows[3].RootTol)
}

func TestStepRules(t *testing.T) {
	// Numerical Recipes 3rd ed. §5.7 and Nocedal & Wright 2nd ed. §8.1:
	// forward h = sqrt(eps_f)·x_c (error ~ sqrt(eps_f)), central
	// h = eps_f^(1/3)·x_c (error ~ eps_f^(2/3)), second difference
	// h = eps_f^(1/4)·x_c (error ~ eps_f^(1/2)), x_c = max(1,|x|).
	for _, c := range []struct {
		args []string
		accF float64
	}{
		{[]string{"0", "2", "-1e4", "0.25"}, pow2(-52)},
		{[]string{"-noise", "1e-6", "0", "2", "-1e4", "0.25"}, 1e-6},
	} {
		for _, r := range runJSON(t, c.args...) {
			xc := math.Max(1, math.Abs(r.X))
			assert.Equal(t, c.accF, r.Accuracy)
			// The printed step is the representable (x+h)-x [NR §5.7]:
			// within one ulp of x of the formula, which math.Pow evaluates
			// here to a few ulps of the step (hence 1e-15 relative).
			tol := r.Ulp + 1e-15*xc
			assert.InDelta(t, math.Pow(c.accF, 0.5)*xc, r.Forward.H, tol, "forward x=%g", r.X)
			assert.InDelta(t, math.Pow(c.accF, 1.0/3)*xc, r.Central.H, tol, "central x=%g", r.X)
			assert.InDelta(t, math.Pow(c.accF, 0.25)*xc, r.Second.H, tol, "second x=%g", r.X)
			assert.Equal(t, r.Forward.H, (r.X+r.Forward.H)-r.X, "forward step representable")
			assert.Equal(t, r.Central.H, (r.X+r.Central.H)-r.X, "central step representable")
			assert.InDelta(t, math.Sqrt(c.accF), r.Forward.Error, 1e-15)
			assert.InDelta(t, math.Pow(c.accF, 2.0/3), r.Central.Error, 1e-15)
			assert.InDelta(t, math.Sqrt(c.accF), r.Second.Error, 1e-15)
			// NUMERICS.md, noisy functions: minimization precision sqrt(eps_f)·x_c.
			assert.InDelta(t, math.Sqrt(c.accF)*xc, r.MinTol, 1e-15*xc)
		}
	}
	// The table values of NUMERICS.md at x = 0 (x_c = 1), where no
	// representability adjustment applies: 2^-26, 6.0554544523933395e-06
	// (math.Cbrt may be one ulp below it), 2^-13.
	r := runJSON(t, "0")[0]
	assert.Equal(t, pow2(-26), r.Forward.H)
	assert.InDelta(t, 6.0554544523933395e-06, r.Central.H, numeric.Ulp(6e-6))
	assert.Equal(t, pow2(-13), r.Second.H)
}

func TestNoiseExample(t *testing.T) {
	// NUMERICS.md: an ODE solve good to 1e-6 gives x-precision about
	// 1e-3·x_c in a minimization (common practice; Gill, Murray & Wright 1981).
	r := runJSON(t, "-noise", "1e-6", "50")[0]
	assert.InDelta(t, 1e-3*50, r.MinTol, 1e-12)
	assert.InDelta(t, 1e-6*50, r.RootTol, 1e-18)
}

func TestText(t *testing.T) {
	code, out, _ := run("1")
	require.Equal(t, 0, code)
	for _, want := range []string{
		"float64: machine epsilon 2.220446049250313e-16", // NUMERICS.md
		"ulp                    2.220446049250313e-16",
		"minimization tol       1.4901161193847656e-08",
		"second-difference step 0.0001220703125", // 2^-13, NUMERICS.md
	} {
		assert.Contains(t, out, want)
	}
	_, out, _ = run("-type", "float32", "1")
	assert.Contains(t, out, "float32: machine epsilon 1.1920929e-07") // NUMERICS.md
}

func TestBadInput(t *testing.T) {
	for _, c := range []struct {
		args []string
		msg  string
	}{
		{[]string{"abc"}, `"abc" is not a number`},
		{[]string{"NaN"}, "not a finite magnitude"},
		{[]string{"Inf"}, "not a finite magnitude"},
		{[]string{"1e999"}, "not a finite magnitude"},
		{[]string{"-type", "float32", "1e39"}, "overflows float32"},
		{[]string{"-noise", "-1e-6", "1"}, "must be a positive relative accuracy"},
		{[]string{"-noise", "NaN", "1"}, "must be a positive relative accuracy"},
		{[]string{"-noise", "0", "1"}, "must be a positive relative accuracy"},
		{[]string{"-noise", "x", "1"}, `-noise "x" is not a number`},
		{[]string{"-noise", "2", "1"}, "no correct digit"},
		{[]string{"-noise", "1e-20", "1"}, "below float64 machine epsilon"},
		{[]string{"-type", "float16", "1"}, `unknown -type "float16"`},
		{[]string{}, "no magnitude given"},
		{[]string{"-bogus", "1"}, "flag provided but not defined"},
	} {
		code, out, stderr := run(c.args...)
		assert.Equal(t, 2, code, c.args)
		assert.Empty(t, out, c.args)
		assert.Contains(t, stderr, c.msg, c.args)
		assert.Equal(t, 1, strings.Count(stderr, c.msg), c.args)
	}
}
