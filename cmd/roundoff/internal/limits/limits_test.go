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
		{[]string{"1e999"}, "1e999 overflows float64 (largest 1.7976931348623157e+308)"},
		{[]string{"-type", "float32", "1e39"}, "1e39 overflows float32 (largest 3.4028235e+38)"},
		{[]string{"1e-400"}, "1e-400 underflows to zero in float64 (smallest positive 5e-324)"},
		{[]string{"-type", "float32", "1e-50"}, "1e-50 underflows to zero in float32 (smallest positive 1e-45)"},
		{[]string{"-noise", "-1e-6", "1"}, "-noise -1e-6: not a relative accuracy between the unit roundoff of float64"},
		{[]string{"-noise", "NaN", "1"}, "-noise NaN: not a number"},
		{[]string{"-noise", "0", "1"}, "-noise 0: below the unit roundoff of float64 (1.11e-16)"},
		{[]string{"-noise", "x", "1"}, "-noise x: not a number"},
		{[]string{"-noise", "2", "1"}, "-noise 2: not a relative accuracy between"},
		{[]string{"-noise", "1e-20", "1"}, "-noise 1e-20: below the unit roundoff of float64"},
		{[]string{"-type", "float32", "-noise", "1e-8", "1"}, "-noise 1e-8: below the unit roundoff of float32 (5.96e-08)"},
		{[]string{"-type", "float16", "1"}, `unknown -type "float16"`},
		{[]string{}, "no magnitude given"},
		{[]string{"-bogus", "1"}, "flag provided but not defined"},
	} {
		code, out, stderr := run(c.args...)
		assert.Equal(t, 1, code, c.args) // bad input: status 1, as README's table says
		assert.Empty(t, out, c.args)
		assert.Contains(t, stderr, c.msg, c.args)
		assert.Equal(t, 1, strings.Count(stderr, "\n"), "one line: %s", stderr)
	}
}

// The unit roundoff itself is an accepted noise level (IEEE 754-2019:
// u = 2^-53 for binary64, 2^-24 for binary32).
func TestNoiseAtUnitRoundoff(t *testing.T) {
	assert.Equal(t, pow2(-53), runJSON(t, "-noise", "0x1p-53", "1")[0].Accuracy)
	assert.Equal(t, pow2(-24), runJSON(t, "-type", "float32", "-noise", "0x1p-24", "1")[0].Accuracy)
}

// At the top of the float32 range the spacing is 2^(emax-p+1) = 2^104
// (IEEE 754-2019 §3.3, binary32: emax 127, p 24); x+h overflows for every
// step, which the output says; and the printed x reads back.
func TestTopOfFloat32(t *testing.T) {
	r := runJSON(t, "-type", "float32", "3.4028235e+38")[0]
	assert.Equal(t, float64(math.MaxFloat32), r.X)
	assert.Equal(t, pow2(104), r.Ulp)
	for _, s := range []limits.Step{r.Forward, r.Central, r.Second} {
		assert.Zero(t, s.H)
		assert.Equal(t, "x+h overflows float32: no difference quotient can be formed at x", s.None)
	}
	code, out, stderr := run("-type", "float32", "3.4028235e+38")
	require.Equal(t, 0, code, stderr)
	assert.Contains(t, out, "x = 3.4028235e+38 ")
	assert.Contains(t, out, "ulp                    2.028241e+31 ")
	assert.Contains(t, out, "forward step           none                     x+h overflows float32")
	// binary64 likewise: 2^(1023-52).
	assert.Equal(t, pow2(971), runJSON(t, "1.7976931348623157e308")[0].Ulp)
}

// Negative magnitudes need no "--", before or after the flags.
func TestNegativeMagnitudes(t *testing.T) {
	rows := runJSON(t, "-3", "-type", "float32", "-0.5", "-noise", "1e-6", "-1e3")
	require.Len(t, rows, 3)
	assert.Equal(t, []float64{-3, -0.5, -1e3}, []float64{rows[0].X, rows[1].X, rows[2].X})
	assert.Equal(t, "float32", rows[0].Type)
	assert.Equal(t, 1e-6, rows[0].Accuracy)
}

// -h prints the usage on standard output and succeeds.
func TestHelp(t *testing.T) {
	code, out, stderr := run("-h")
	assert.Equal(t, 0, code)
	assert.Empty(t, stderr)
	assert.True(t, strings.HasPrefix(out, "usage: roundoff limits "), out)
	assert.Contains(t, out, "-noise")
}
