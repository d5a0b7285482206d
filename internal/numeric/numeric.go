// Package numeric holds the floating-point facts every roundoff analyzer
// reasons with: machine epsilon, unit roundoff, the spacing of floats at a
// magnitude, and the optimal finite-difference steps. Every value is derived
// from the math package at start-up rather than typed in, so it follows the
// IEEE 754-2019 binary formats exactly.
package numeric

import (
	"go/constant"
	"math"
	"math/big"
	"strconv"
	"strings"
)

// Format describes one IEEE 754-2019 binary floating-point format.
type Format struct {
	Name     string  // "float64" or "float32"
	Eps      float64 // machine epsilon: the spacing of floats just above 1
	U        float64 // unit roundoff: Eps/2, the largest relative error of one correctly rounded operation
	Bits     int     // significand precision in bits, hidden bit included
	Smallest float64 // the smallest positive (subnormal) value
}

var (
	// Float64 is the binary64 format.
	Float64 = Format{Name: "float64", Eps: math.Nextafter(1, 2) - 1, U: (math.Nextafter(1, 2) - 1) / 2, Bits: 53,
		Smallest: math.Nextafter(0, 1)}
	// Float32 is the binary32 format.
	Float32 = Format{Name: "float32", Eps: float64(math.Nextafter32(1, 2) - 1), U: float64(math.Nextafter32(1, 2)-1) / 2, Bits: 24,
		Smallest: float64(math.Nextafter32(0, 1))}
)

// SqrtEps returns sqrt(Eps): the relative precision to which a minimizer
// can be located by comparing function values, and the optimal relative
// forward-difference step.
func (f Format) SqrtEps() float64 { return math.Sqrt(f.Eps) }

// EpsMultiple returns k when t is exactly k·Eps for a whole k from 1 to
// 1000, or Eps/2 (k = 0.5): a value derived from machine epsilon by
// arithmetic, which a decimal literal (2.2e-16, 1e-14) never is, since Eps
// is a power of two and such literals carry low-order bits. It returns
// false otherwise.
func (f Format) EpsMultiple(t float64) (float64, bool) {
	// Both exact: Eps is a power of two, and math.Mod rounds nothing.
	k := t / f.Eps
	return k, k == 0.5 || k >= 1 && k <= 1000 && math.Mod(t, f.Eps) == 0
}

// CbrtEps returns Eps^(1/3), the optimal relative central-difference step.
func (f Format) CbrtEps() float64 { return math.Cbrt(f.Eps) }

// QuartEps returns Eps^(1/4), the optimal relative second-difference step.
func (f Format) QuartEps() float64 { return math.Sqrt(math.Sqrt(f.Eps)) }

// Ulp returns the spacing of float64 values at magnitude |x|: the distance
// from |x| to the next float64 away from zero. It is +Inf for ±Inf and NaN
// for NaN.
func Ulp(x float64) float64 {
	x = math.Abs(x)
	switch {
	case math.IsInf(x, 0):
		return x
	case x == math.MaxFloat64:
		return x - math.Nextafter(x, 0) // the spacing below, 2^971
	}
	return math.Nextafter(x, math.Inf(1)) - x
}

// Spacing returns the spacing of values of format f at magnitude |x|.
func (f Format) Spacing(x float64) float64 {
	if f == Float32 {
		return float64(Ulp32(float32(x)))
	}
	return Ulp(x)
}

// SpacingAbove returns the smallest magnitude from which the spacing of
// values of format f exceeds tol, a power of two: from there on, two
// different values are always more than tol apart, so |a-b| < tol holds
// only when a == b.
func (f Format) SpacingAbove(tol float64) float64 {
	_, e := math.Frexp(tol) // tol = m·2^e with m in [0.5, 1), so 2^(e-1) <= tol < 2^e
	return math.Ldexp(1, e+f.Bits-1)
}

// Ulp32 returns the spacing of float32 values at magnitude |x|.
func Ulp32(x float32) float32 {
	x = float32(math.Abs(float64(x)))
	return math.Nextafter32(x, float32(math.Inf(1))) - x
}

// AbsorbingMagnitude returns the smallest power-of-two magnitude |x| at which
// a step of size |h| is absorbed (x+h == x) in format f: |h| < ulp(x)/2 holds
// from there on.
func (f Format) AbsorbingMagnitude(h float64) float64 {
	// ulp(x) = 2^(e-(Bits-1)) for 2^e <= |x|; need ulp > 2|h|,
	// except that at ulp == 2|h| ties go to even and x survives only half the time.
	_, e := math.Frexp(math.Abs(h)) // |h| = m·2^e, m in [0.5, 1)
	return math.Ldexp(1, e+f.Bits)
}

// Decimal returns the exact decimal value of x, which every binary float
// has, cut (not rounded) to the given number of significant digits with a
// trailing "..." when digits are dropped: Decimal(0.1, 34) is
// "0.1000000000000000055511151231257827...".
func Decimal(x float64, digits int) string {
	if x == 0 || math.IsInf(x, 0) || math.IsNaN(x) {
		return Short(x)
	}
	// %e with enough digits is exact for every float64 (at most 767 significant digits).
	e := new(big.Float).SetFloat64(x).Text('e', 800)
	mant, exp, _ := strings.Cut(e, "e")
	sign := ""
	if mant[0] == '-' {
		sign, mant = "-", mant[1:]
	}
	ds := strings.TrimRight(strings.Replace(mant, ".", "", 1), "0")
	more := ""
	if len(ds) > digits {
		ds, more = ds[:digits], "..."
	}
	p, _ := strconv.Atoi(exp)
	return sign + positional(ds, p, more)
}

// positional writes the digit string ds (d.ddd times 10^p), followed by
// more, without an exponent when p is moderate, else in e-notation.
func positional(ds string, p int, more string) string {
	switch {
	case p < -7 || p > 20:
		if len(ds) > 1 {
			ds = ds[:1] + "." + ds[1:]
		}
		return ds + more + "e" + strconv.Itoa(p)
	case p < 0:
		return "0." + strings.Repeat("0", -p-1) + ds + more
	case len(ds) <= p+1:
		return ds + strings.Repeat("0", p+1-len(ds)) + more
	}
	return ds[:p+1] + "." + ds[p+1:] + more
}

// Short formats x in the shortest form that reads back as the same float64.
func Short(x float64) string { return strconv.FormatFloat(x, 'g', -1, 64) }

// Select returns Float32 when single is set, else Float64.
func Select(single bool) Format {
	if single {
		return Float32
	}
	return Float64
}

// Value returns the value format f stores for the constant v.
func (f Format) Value(v constant.Value) float64 {
	x, _ := constant.Float64Val(constant.ToFloat(v))
	if f == Float32 {
		return float64(float32(x))
	}
	return x
}

// EpsLiteral writes f's machine epsilon exactly, as Go source.
func (f Format) EpsLiteral() string {
	return strconv.FormatFloat(f.Eps, 'x', -1, 64)
}

// FewUlpsLiteral writes 4 ulps at 1, 4·eps, exactly: a relative tolerance
// that lets values a few roundings apart compare equal.
func (f Format) FewUlpsLiteral() string { return "4*" + f.EpsLiteral() }

// SqrtEpsLiteral writes sqrt(eps) exactly for float64 (2^-26); for
// float32, whose sqrt(eps) is 2^-11.5, the power of two just above it.
func (f Format) SqrtEpsLiteral() string {
	frac, e := math.Frexp(f.SqrtEps())
	if frac == 0.5 {
		e-- // a power of two already
	}
	return strconv.FormatFloat(math.Ldexp(1, e), 'x', -1, 64)
}

// WithValue writes a constant as the source does, src, adding its value
// when src is not a literal: "tol (1e-12)".
func WithValue(src string, v float64) string {
	if _, err := strconv.ParseFloat(src, 64); err == nil {
		return src
	}
	return src + " (" + Short(v) + ")"
}
