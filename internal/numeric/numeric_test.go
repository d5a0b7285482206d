package numeric_test

import (
	"math"
	"math/big"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/gonum/floats/scalar"

	"roundoff/internal/numeric"
)

const prec = 200 // bits for math/big reference computations

// pow2 returns 2^e exactly, built with math/big rather than math.Nextafter.
func pow2(e int) float64 {
	f, acc := new(big.Float).SetMantExp(big.NewFloat(1), e).Float64()
	if acc != big.Exact {
		panic("2^e not exact in float64")
	}
	return f
}

// root returns x^(1/n) to about prec bits by Newton's method in math/big.
func root(x float64, n int) *big.Float {
	bx := new(big.Float).SetPrec(prec).SetFloat64(x)
	y := new(big.Float).SetPrec(prec).SetFloat64(math.Pow(x, 1/float64(n)))
	for range 8 { // quadratic convergence: 53 bits -> > prec bits
		p := new(big.Float).SetPrec(prec).SetInt64(1)
		for range n - 1 {
			p.Mul(p, y)
		}
		t := new(big.Float).SetPrec(prec).Quo(bx, p)                              // x / y^(n-1)
		t.Add(t, new(big.Float).SetPrec(prec).Mul(y, big.NewFloat(float64(n-1)))) // + (n-1)y
		y.Quo(t, big.NewFloat(float64(n)))
	}
	return y
}

// withinULP asserts |got - want| <= maxUlps * ulp(want), ulp = 2^(e-52).
func withinULP(t *testing.T, want *big.Float, got float64, maxUlps float64, msg string) {
	t.Helper()
	w, _ := want.Float64()
	_, e := math.Frexp(w) // w = m·2^e, m in [0.5,1): ulp = 2^(e-53)
	assert.LessOrEqual(t, math.Abs(got-w), maxUlps*math.Ldexp(1, e-53), msg)
}

func TestFormats(t *testing.T) {
	// IEEE 754-2019 §3.6: binary64 has p = 53, binary32 has p = 24;
	// eps = 2^(1-p), u = eps/2 = 2^-p (Higham 2002, §2.1).
	assert.Equal(t, pow2(-52), numeric.Float64.Eps)
	assert.Equal(t, pow2(-53), numeric.Float64.U)
	assert.Equal(t, 53, numeric.Float64.Bits)
	assert.Equal(t, pow2(-23), numeric.Float32.Eps)
	assert.Equal(t, pow2(-24), numeric.Float32.U)
	assert.Equal(t, 24, numeric.Float32.Bits)
	// Decimal renderings from NUMERICS.md (IEEE 754-2019; Higham 2002, ch. 2).
	assert.Equal(t, 2.220446049250313e-16, numeric.Float64.Eps)
	assert.Equal(t, 1.1102230246251565e-16, numeric.Float64.U)
	assert.Equal(t, float32(1.1920929e-07), float32(numeric.Float32.Eps))
	assert.Equal(t, float32(5.9604645e-08), float32(numeric.Float32.U))
	// Both must agree with the Bits field: eps = 2^(1-Bits).
	for _, f := range []numeric.Format{numeric.Float64, numeric.Float32} {
		assert.Equal(t, math.Ldexp(1, 1-f.Bits), f.Eps, f.Name)
		assert.Equal(t, f.Eps/2, f.U, f.Name)
	}
}

// TestEpsMultiple checks which tolerances read as derived from machine
// epsilon: whole multiples k·2^-52 (IEEE 754-2019 binary64: eps = 2^-52,
// u = 2^-53), built here with math/big, against decimal literals, whose
// nearest binary64 value carries low-order bits (common practice).
func TestEpsMultiple(t *testing.T) {
	for _, k := range []int64{1, 2, 4, 10, 100, 1000} {
		v, _ := new(big.Float).SetMantExp(big.NewFloat(float64(k)), -52).Float64()
		got, ok := numeric.Float64.EpsMultiple(v)
		assert.True(t, ok, "%d·eps", k)
		assert.Equal(t, float64(k), got)
	}
	_, ok := numeric.Float64.EpsMultiple(pow2(-53))
	assert.True(t, ok, "u = eps/2")
	_, ok = numeric.Float32.EpsMultiple(100 * pow2(-23))
	assert.True(t, ok, "100·eps of binary32")
	for _, v := range []float64{2.2e-16, 1e-15, 2.2e-14, 1e-14, 1e-12, 2001 * pow2(-52), pow2(-54)} {
		_, ok := numeric.Float64.EpsMultiple(v)
		assert.False(t, ok, "%g", v)
	}
}

func TestRootsOfEps(t *testing.T) {
	f64, f32 := numeric.Float64, numeric.Float32
	// Exact powers of two: sqrt(2^-52) = 2^-26, (2^-52)^(1/4) = 2^-13 (NUMERICS.md; IEEE 754-2019).
	assert.Equal(t, pow2(-26), f64.SqrtEps())
	assert.Equal(t, 1.4901161193847656e-08, f64.SqrtEps())
	assert.Equal(t, pow2(-13), f64.QuartEps())
	assert.Equal(t, 1.220703125e-04, f64.QuartEps())
	// eps^(1/3) for float64: NUMERICS.md gives 6.0554544523933395e-06, which
	// is the correctly rounded value (within half an ulp of a 200-bit
	// math/big cube root). math.Cbrt is not correctly rounded and returns the
	// float64 one ulp below (6.055454452393339e-06); accept one ulp.
	ref := root(f64.Eps, 3)
	withinULP(t, ref, 6.0554544523933395e-06, 0.5, "NUMERICS.md cbrt(eps) vs math/big")
	withinULP(t, ref, f64.CbrtEps(), 1, "CbrtEps vs math/big")

	// float32 roots are returned in float64. NUMERICS.md quotes them to 8
	// significant digits: accept one unit in the last quoted digit (its
	// cbrt entry 4.921566e-03 is truncated; the value is 4.92156660e-03).
	// Against math/big allow an ulp: math.Sqrt is correctly rounded
	// (IEEE 754-2019 §5.4.1) but QuartEps rounds twice and Cbrt is inexact.
	for _, c := range []struct {
		name         string
		got          float64
		table, digit float64
		n            int
		ulps         float64
	}{
		{"sqrt", f32.SqrtEps(), 3.4526698e-04, 1e-11, 2, 0.5},
		{"cbrt", f32.CbrtEps(), 4.921566e-03, 1e-9, 3, 1},
		{"quart", f32.QuartEps(), 1.8581361e-02, 1e-9, 4, 1},
	} {
		assert.InDelta(t, c.table, c.got, c.digit, c.name)
		withinULP(t, root(f32.Eps, c.n), c.got, c.ulps, c.name+" vs math/big")
	}
	// Cross-check the exact binary64 roots through math/big too.
	withinULP(t, root(f64.Eps, 2), f64.SqrtEps(), 0, "float64 sqrt(eps) vs math/big")
	withinULP(t, root(f64.Eps, 4), f64.QuartEps(), 0, "float64 eps^(1/4) vs math/big")
}

func TestUlp(t *testing.T) {
	// IEEE 754-2019 binary64: for 2^e <= |x| < 2^(e+1) (normal), ulp = 2^(e-52);
	// below 2^-1022 (subnormal and zero) the spacing is 2^-1074.
	for _, c := range []struct {
		x float64
		e int // ulp = 2^e
	}{
		{1, -52},
		{-1, -52},
		{1.5, -52},
		{0.1, -56}, // 2^-4 <= 0.1 < 2^-3
		{1e8, -26}, // 2^26 <= 1e8 < 2^27
		{math.Ldexp(1, 27), -25},
		{math.Nextafter(math.Ldexp(1, 27), 0), -26}, // just below 2^27
		{1e9, -23},                    // 2^29 <= 1e9 < 2^30: 1.1920928955078125e-07
		{1e300, 996 - 52},             // 2^996 <= 1e300 < 2^997
		{math.Ldexp(1, -1022), -1074}, // smallest normal
		{math.Ldexp(1, -1030), -1074}, // subnormal
		{3 * math.SmallestNonzeroFloat64, -1074},
		{math.Ldexp(1, -1022) - math.SmallestNonzeroFloat64, -1074}, // largest subnormal
		{0, -1074},
		{math.SmallestNonzeroFloat64, -1074},
	} {
		assert.Equal(t, pow2(c.e), numeric.Ulp(c.x), "Ulp(%g)", c.x)
	}
	assert.Equal(t, 1.1920928955078125e-07, numeric.Ulp(1e9)) // = 2^-23 exactly (IEEE 754-2019 binary64)
	assert.Equal(t, 4.9406564584124654e-324, numeric.Ulp(0))  // smallest subnormal, NUMERICS.md

	// NUMERICS.md: for normal x, eps·|x|/2 < ulp(x) <= eps·|x|.
	for _, x := range []float64{1, 1.0000001, 1.9999999, 3, 1e-300, 12345.678, 1e300} {
		u := numeric.Ulp(x)
		assert.Less(t, numeric.Float64.Eps*x/2, u, "x=%g", x)
		assert.LessOrEqual(t, u, numeric.Float64.Eps*x, "x=%g", x)
	}
	assert.True(t, math.IsNaN(numeric.Ulp(math.NaN()))) // as documented in numeric.go
}

func TestUlpInf(t *testing.T) {
	assert.True(t, math.IsInf(numeric.Ulp(math.Inf(1)), 1))
	assert.True(t, math.IsInf(numeric.Ulp(math.Inf(-1)), 1))
}

func TestUlp32(t *testing.T) {
	// IEEE 754-2019 binary32: ulp = 2^(e-23) for 2^e <= |x| < 2^(e+1); 2^-149 below 2^-126.
	for _, c := range []struct {
		x float32
		e int
	}{
		{1, -23},
		{-1, -23},
		{1e8, 26 - 23}, // 2^26 <= 1e8 < 2^27
		{1e9, 29 - 23}, // 2^29 <= 1e9 < 2^30
		{0.1, -4 - 23},
		{0, -149},
		{math.SmallestNonzeroFloat32, -149},
		{float32(math.Ldexp(1, -126)), -149}, // smallest normal
	} {
		assert.Equal(t, float32(pow2(c.e)), numeric.Ulp32(c.x), "Ulp32(%g)", c.x)
	}
}

func TestAbsorbingMagnitude(t *testing.T) {
	// NUMERICS.md: h = 1e-8 vanishes against every x from 2^27 ≈ 1.34e8 up.
	m := numeric.Float64.AbsorbingMagnitude(1e-8)
	assert.Equal(t, pow2(27), m)
	assert.InDelta(t, 1.34e8, m, 0.01e8)

	// Brute force in binary64 arithmetic (IEEE 754-2019 roundTiesToEven).
	// h is not a power of two here, so below m there is a tie-free survivor.
	for _, h := range []float64{1e-8, 3e-5, 0.1, 0.7, 7, 1e10, 1e-300, 5e-320} {
		m := numeric.Float64.AbsorbingMagnitude(h)
		for _, x := range absorbers(m) {
			assert.Equal(t, x, x+h, "h=%g x=%g (>= %g) must absorb", h, x, m)
			assert.Equal(t, -x, -x-h, "h=%g x=%g: symmetric", h, -x)
		}
		assert.NotEqual(t, m/2, m/2+h, "h=%g survives at m/2=%g", h, m/2)
		assert.Equal(t, m, numeric.Float64.AbsorbingMagnitude(-h), "sign of h is irrelevant")
	}
	// Powers of two: at m/2 the step is exactly ulp/2, a tie; roundTiesToEven
	// (IEEE 754-2019 §4.3.1) keeps m/2 itself (even significand) but moves
	// the odd neighbour, so absorption "from there on" starts at m.
	for _, h := range []float64{1, 0.5, pow2(-30)} {
		m := numeric.Float64.AbsorbingMagnitude(h)
		for _, x := range absorbers(m) {
			assert.Equal(t, x, x+h, "h=%g x=%g", h, x)
		}
		odd := math.Nextafter(m/2, 0) // significand all ones: odd
		assert.NotEqual(t, odd, odd+h, "h=%g x=%g", h, odd)
	}

	// binary32 arithmetic, with h representable in float32.
	for _, h := range []float32{1e-3, 0.1, 3, 1e-8} {
		m := float32(numeric.Float32.AbsorbingMagnitude(float64(h)))
		for _, x := range absorbers(float64(m)) {
			x := float32(x)
			if math.IsInf(float64(x), 0) {
				continue
			}
			assert.Equal(t, x, x+h, "float32 h=%g x=%g", h, x)
		}
		assert.NotEqual(t, m/2, m/2+h, "float32 h=%g survives at %g", h, m/2)
	}
}

// absorbers returns sample magnitudes at and above m.
func absorbers(m float64) []float64 {
	xs := []float64{m, math.Nextafter(m, math.Inf(1)), 2*m - numeric.Ulp(m), 1.5 * m, 1024 * m}
	for i := range 40 {
		xs = append(xs, m*(1+float64(i)/37))
	}
	return xs
}

// exact0p1 is the exact value of the binary64 nearest 0.1 (Goldberg 1991; IEEE 754-2019).
const exact0p1 = "0.1000000000000000055511151231257827021181583404541015625"

func TestDecimal(t *testing.T) {
	// Reference: 0.1 rounds to m·2^-56 with m an integer; m·5^56 / 10^56 is
	// its exact decimal expansion (math/big integer arithmetic).
	mant := new(big.Float).SetFloat64(0.1)
	exp := mant.MantExp(mant) // 0.1 = mant·2^exp, mant in [0.5,1)
	mInt, acc := new(big.Float).SetMantExp(mant, 53).Int(nil)
	require.Equal(t, big.Exact, acc)
	k := 53 - exp // 0.1 = mInt·2^-k
	digits := new(big.Int).Mul(mInt, new(big.Int).Exp(big.NewInt(5), big.NewInt(int64(k)), nil)).String()
	require.Len(t, digits, k) // 0.1 <= value < 1: k digits after the point
	ref := strings.TrimRight("0."+digits, "0")
	assert.Equal(t, exact0p1, ref, "math/big agrees with the quoted expansion")

	assert.Equal(t, "0.1000000000000000055511151231257827...", numeric.Decimal(0.1, 34))
	assert.True(t, strings.HasPrefix(ref, strings.TrimSuffix(numeric.Decimal(0.1, 34), "...")))
	assert.Equal(t, "0.5", numeric.Decimal(0.5, 34))    // 2^-1 is exact in decimal
	assert.Equal(t, "-0.75", numeric.Decimal(-0.75, 5)) // 3·2^-2
	assert.Equal(t, "3", numeric.Decimal(3, 1))
	// Subnormal: 2^-1074 = 4.940656458412465441765687928682213723650598...e-324
	// (exact value computed with math/big: 5^1074 / 10^1074).
	sub := new(big.Int).Exp(big.NewInt(5), big.NewInt(1074), nil).String()
	// 18 digits: the 19th digit is 1, so cutting and rounding agree here.
	assert.Equal(t, sub[:1]+"."+sub[1:18]+"...e-324", numeric.Decimal(math.SmallestNonzeroFloat64, 18))
}

func TestDecimalShortExact(t *testing.T) {
	assert.Equal(t, exact0p1, numeric.Decimal(0.1, 60))
	// The binary64 value nearest 1e23 is 99999999999999991611392 (math/big);
	// beyond 10^20 Decimal writes it with an exponent.
	assert.Equal(t, "9.9999999999999991611392e22", numeric.Decimal(1e23, 30))
}

func TestDecimalCutIsPrefix(t *testing.T) {
	// Exact digits of 0.1 (Goldberg 1991): 0.10000000000000000555..., cut at 17.
	assert.Equal(t, "0.10000000000000000...", numeric.Decimal(0.1, 17))
}

func TestShort(t *testing.T) {
	// Goldberg 1991: 0.1 + 0.2 != 0.3 in binary; the shortest round-trip
	// rendering of the binary64 sum is 0.30000000000000004.
	a, b := 0.1, 0.2 // variables: the constant expression 0.1+0.2 would be folded exactly to 0.3
	assert.Equal(t, "0.30000000000000004", numeric.Short(a+b))
	assert.Equal(t, "0.1", numeric.Short(0.1))
	assert.Equal(t, "2.220446049250313e-16", numeric.Short(numeric.Float64.Eps)) // NUMERICS.md
	assert.Equal(t, "5e-324", numeric.Short(math.SmallestNonzeroFloat64))
}

// TestUlpAgainstGonum checks Ulp against gonum's floats/scalar.EqualWithinULP,
// an independent implementation of ULP distance: x and x+Ulp(x) are one ULP
// apart, x and x+2·Ulp(x) are not.
func TestUlpAgainstGonum(t *testing.T) {
	for _, x := range []float64{1, 0.1, 3, 1e8, 1e9, 1e-300, 123456.789} {
		u := numeric.Ulp(x)
		assert.True(t, scalar.EqualWithinULP(x, x+u, 1), x)
		assert.False(t, scalar.EqualWithinULP(x, x+2*u, 1), x)
	}
}
