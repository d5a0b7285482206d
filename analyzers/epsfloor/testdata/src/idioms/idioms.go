// Package idioms holds tolerances and tiny constants that are right, and
// must not be reported.
package idioms

import "math"

const safmin = 0x1p-1022 // smallest normal: a safe minimum

func unitRoundoff(a, b float64) bool {
	return math.Abs(a-b) <= 0x1p-53*math.Abs(b) // u itself: converged to full precision
}

func betweenUAndEps(a, b float64) bool {
	return math.Abs(a-b) <= 1.5e-16*math.Abs(b) // between u and eps: say nothing
}

func epsRelative(a, b float64) bool {
	return math.Abs(a-b) <= 2.220446049250313e-16*math.Max(math.Abs(a), math.Abs(b))
}

func saneRelative(a, b float64) bool {
	return math.Abs(a-b) < 1e-12*math.Abs(b)
}

func saneAbsolute(a, b float64) bool {
	return math.Abs(a-b) < 1e-9
}

// 2e-16 exceeds the 1.11e-16 gap between floats just under 0.75: the
// neighbouring double passes, so the test is not exact equality.
func oneUlpNearThreeQuarters(x float64) bool {
	return math.Abs(x-0.75) < 2e-16
}

func zeroTolerance(a, b float64) bool {
	return math.Abs(a-b) <= 0 // exact on purpose
}

func safeMinimum(a, b float64) bool {
	return math.Abs(a-b) < safmin // an underflow guard, not a tolerance
}

func smallNumber(a, b float64) bool {
	return math.Abs(a-b) <= 1e-292 // LAPACK-style small number
}

func divisionGuard(d float64) float64 {
	if math.Abs(d) < 1e-300 { // a single magnitude guarding a division
		d = 1e-300
	}
	return 1 / d
}

func tinyDenominator(x, y float64) float64 {
	return x / (y + 1e-30) // not a comparison
}

func squared(re, im float64) bool {
	abs2 := re*re + im*im
	return abs2 < 1e-16 // |z| < 1e-8: a threshold on a squared quantity
}

func mixed(a, b float64) bool {
	return math.Abs(a-b) <= 1e-30+1e-12*math.Abs(b) // atol + rtol·|b|
}

func floors(x float64) float64 {
	return math.Max(x, 1e-20) // a floor, not a comparison
}

func physical(m float64) float64 {
	const planck = 6.62607015e-34 // a physical constant in arithmetic
	return m * planck
}

var table = []float64{1e-20, 1e-30, 1e-40} // constants in a data table

func knownTinyMagnitude(x float64) bool {
	return math.Abs(x-1e-20) < 1e-30 // values near 1e-20 are 1.5e-36 apart: resolvable
}

func magnitudeTest(r float64) bool {
	return math.Abs(r) < 1e-20 // a residual, not an iterate or a difference
}

func iterateSane(x float64) float64 {
	for range 10 {
		x -= x / 2
		if math.Abs(x) < 1e-6 { // a sane threshold
			break
		}
	}
	return x
}

func negativeSentinel(a, b, tol float64) bool { // want negativeSentinel:"parameter 2 is an absolute tolerance of float64 in negativeSentinel"
	return math.Abs(a-b) < tol
}

func sentinelCalls(a, b float64) bool {
	return negativeSentinel(a, b, -1) || negativeSentinel(a, b, math.NaN())
}

func representableSum() float64 {
	return 1 + 0x1p-52 // the next float after 1: has an effect
}

func halfUlp() float64 {
	return 1 - 0x1p-53 // the float just below 1 is 1-2^-53: representable
}

func intSum() int {
	return 1 + 2 // not a float
}

type config struct {
	Tol float64 // want Tol:"a relative tolerance of float64 in close"
}

func (c config) close(a, b float64) bool {
	return math.Abs(a-b) < c.Tol*math.Abs(b)
}

func saneField() config {
	return config{Tol: 1e-10}
}

func saneDefault(c *config) {
	if c.Tol == 0 {
		c.Tol = 4 * 0x1p-52
	}
}

// Go evaluates constant expressions exactly and rounds once: each 1e-16
// alone is below half the spacing at 1, but together they reach the next
// float64, 1 + 2^-52, and neither is without effect.
const twoTiny = 1 + 1e-16 + 1e-16

// A tiny constant added to a run-time value with no constant beside it is
// not judged: the value may be as small as the constant (x + 1e-300 inside
// a logarithm keeps it finite at x = 0).
func keepFinite(x float64) float64 { return math.Log(x + 1e-300) }

// A tiny floor that never divides, a running minimum from the largest
// float, and a running maximum from the most negative one are right.
func seedsRight(xs []float64) (float64, float64, float64) {
	floor := math.SmallestNonzeroFloat64
	lo, hi := math.MaxFloat64, -math.MaxFloat64
	for _, x := range xs {
		if x < lo {
			lo = x
		}
		if x > hi {
			hi = x
		}
		floor = math.Max(floor, x*x)
	}
	return floor, lo, hi
}

// A floor whose reciprocal is finite (1e-300 gives 1e300) may divide.
func lentzSafe(a float64) float64 {
	d := a
	if d == 0 {
		d = 1e-300
	}
	return 1 / d
}

// Values a production type's fields take somewhere in the package do not
// say what reaches a test of them: only a test's own table of cases does.
type span struct{ lo, hi float64 }

var spans = []span{{0, 99}, {1, 100}}

func nearEnd(s span, x float64) bool { return math.Abs(s.hi-x) < 1e-15 }

// 1 - p is exact for p in [0.5, 2] (Sterbenz), so at p = 1 the sum is
// exactly 1e-16 and the tiny addend keeps the logarithm finite.
func crossEntropy(p float64) float64 { return -math.Log(1 - p + 1e-16) }

// A tolerance written as a coefficient times the value it is compared
// with is relative: 1e-13 of an area of 2.5e-21 is 2.5e-34, far below eps,
// yet it asks for 13 significant digits of the area, which float64 holds.
const sliver = 2.5e-21

type areaCase struct {
	want   float64
	within float64 // want within:"an absolute tolerance of float64 in areaOK"
}

var areaCases = []areaCase{{want: sliver, within: 1e-13 * sliver}, {1, 1e-12}}

func areaOK(c areaCase, got float64) bool { return math.Abs(got-c.want) <= c.within }

func areaNear(got, want, within float64) bool { // want areaNear:"parameter 2 is an absolute tolerance of float64 in areaNear"
	return math.Abs(got-want) <= within
}

func sliverArea(got float64) bool { return areaNear(got, sliver, sliver*1e-13) }

// The value a variable holds at a test is known only when nothing but a
// constant assignment can have set it: a branch, a loop that updates it
// after the test, or a closure may have moved it, so 1e-14 (above eps)
// is not judged at 1000.5 in any of these. The compared values are of
// degree 1, which the data-size rule judges only at a declared size.
func branchSet(got float64, big bool) bool {
	want := 0.5
	if big {
		want = 1000.5
	}
	return math.Abs(got-want) < 1e-14
}

func loopSet(xs []float64) bool {
	ref := 1000.5
	for _, x := range xs {
		if math.Abs(x-ref) < 1e-14 {
			return true
		}
		ref = x / 1e3
	}
	return false
}

func closureSet(got float64, rescale func(func())) bool {
	want := 1000.5
	shrink := func() { want /= 1e3 }
	rescale(shrink)
	return math.Abs(got-want) < 1e-14
}

// A non-negative value can overflow only to +Inf, and a test of both
// sides catches both infinities: neither misses an overflow.
func normOverflows(x, y float64) bool {
	return math.Hypot(x, y) > math.MaxFloat64
}

func eitherOverflows(y float64) bool {
	return y > math.MaxFloat64 || y < -math.MaxFloat64
}

// A float64 compared with the largest float32 is a range test with finite
// values on both sides.
func fitsFloat32(y float64) bool {
	return y > math.MaxFloat32
}

// A case's expected value is known only when every case's can be worked
// out from its constants: a call (a square root) or a loop that changes
// the case leaves it unknown, and 1e-14, above eps, is not judged at the
// size of the cases.
func rootCases(root func(float64) float64) bool {
	for _, tc := range []struct{ a float64 }{{2}, {1e6}} {
		want := math.Sqrt(tc.a)
		if math.Abs(root(tc.a)-want) > 1e-14 {
			return false
		}
	}
	return true
}

func shrunkCases(f func(float64) float64) bool {
	for _, tc := range []struct{ x, want float64 }{{1, 2}, {1000, 2000}} {
		tc.want /= 1e3
		if math.Abs(f(tc.x)-(tc.want+1)) > 1e-14 {
			return false
		}
	}
	return true
}

// An infinity test written with comparisons, one side per sign.
func isInf32(f float32, sign int) bool {
	return sign >= 0 && f > math.MaxFloat32 || sign <= 0 && f < -math.MaxFloat32
}

// A pointer method may change the value it is called on.
type level float64

func (l *level) halve() { *l /= 2 }

func halved(got float64) bool {
	want := level(1000.5)
	want.halve()
	return math.Abs(got-float64(want)) < 1e-14
}

// scaledByLiteral divides the difference by the expected value written as
// a literal: |x - 3.6e6|/3.6e6 < 1e-15 holds when |x - 3.6e6| < 3.6e-9,
// about 7 spacings of float64 there (4.66e-10), so it can pass for
// neighbouring values.
func scaledByLiteral(x float64) bool {
	return math.Abs((x-3.6e6)/3.6e6) < 1e-15
}

// halvedWidth tests half a distance: |a-0.9|/2 < 1e-16 holds when
// |a-0.9| < 2e-16, above the spacing of float64 values around 0.9
// (1.11e-16), so the neighbours of 0.9 pass.
func halvedWidth(a float64) bool {
	return math.Abs((a-0.9)/2) < 1e-16
}

// Steps toward a different value reach the neighbouring float: the gap
// above 1 is eps, and a step toward +Inf from x moves up by one ulp.
func gapAbove(x float64) (float64, float64) {
	return math.Nextafter(1, 2) - 1, math.Nextafter(x, math.Inf(1))
}

// inWindow bounds a difference between two different limits: a window,
// not a tolerance around equality.
func inWindow(a, b float64) bool {
	return -1e-20 < a-b && a-b < 1
}

// A ratio checked for sign as the caller gave it: it carries no residue
// of this code, so the smallest positive float as its floor is a
// positivity test on purpose.
func gearRatio(r float64) float64 {
	if !(r > math.SmallestNonzeroFloat64) {
		panic("ratio must be positive")
	}
	return 1 / r
}

// An arc length checked for zero as the caller gave it, after negative
// values were refused: below the smallest positive float lies only 0,
// which is what the test means.
func arcFraction(phi, k float64) float64 {
	if phi < 0 {
		panic("negative arc")
	}
	if phi < math.SmallestNonzeroFloat64 {
		return 0
	}
	return phi * k
}

// An underflow guard at the reciprocal of the largest float (5.6e-309,
// with 2^50 subnormal values below it): the quotient 1/t stays finite
// above it, which is what the guard asks.
func safeInverse(a, b float64) float64 {
	t := 2 * a * b
	if t > 1/math.MaxFloat64 {
		return 1 / t
	}
	return math.MaxFloat64
}

// cfRatio evaluates a continued fraction by the modified Lentz method: the
// floors keep C and D off zero before they divide, and end nothing, so
// they are no convergence tests of the iterates.
func cfRatio(a, b func(int) float64) float64 {
	const tiny = 1e-30
	f, C, D := b(0), b(0), 0.0
	if f == 0 {
		f, C = tiny, tiny
	}
	for k := 1; k < 500; k++ {
		D = b(k) + a(k)*D
		if math.Abs(D) < tiny {
			D = tiny
		}
		C = b(k) + a(k)/C
		if math.Abs(C) < tiny {
			C = tiny
		}
		D = 1 / D
		delta := C * D
		f *= delta
		if math.Abs(delta-1) < 1e-15 {
			break
		}
	}
	return f
}

// The addend moves the rounded quotient: (2 + 1e-15) / 4 is 0.50000000000000025
// exactly and rounds to 0.5000000000000002, not 0.5.
const nudgedHalf = (2 + 1e-15) / 4

// A table written for every row: the first row's factor 0 removes the
// addend exactly, not by rounding.
const firstRow = (1.0-1.0/30)*0/4 + 1.0/30

// closeReading scales a tiny constant by another: 1e-6·1e-300 is 1e-306,
// a normal float64, so the product keeps its value.
func closeReading(a, b float64) bool {
	const fraction, floor = 0.000001, 1e-300
	return math.Abs(a-b) < fraction*floor
}

// readKnots stands for a spline fit that only reads its knots; shiftKnots
// moves them in place.
func readKnots(hours []float64) float64 { return hours[len(hours)-1] - hours[0] }

func shiftKnots(hours []float64) {
	for i := range hours {
		hours[i] += 0.5
	}
}

func slopeNear(h float64) float64 { return 2 * h }

// firstSlope steps 1e-17 off the first knot, 0, where floats are far
// denser than that: the offset counts.
func firstSlope() float64 {
	hours := []float64{0, 2.5, 8}
	_ = readKnots(hours)
	return slopeNear(hours[0] + 1e-17)
}

// shiftedSlope hands the knots to a function that stores into them: the
// last one need no longer be the 8 written, so nothing is claimed.
func shiftedSlope() float64 {
	hours := []float64{0, 2.5, 8}
	shiftKnots(hours)
	last := len(hours) - 1
	return slopeNear(hours[last] - 1e-17)
}

// eachSlope steps off every knot: the index is the loop's, so the element
// is not known.
func eachSlope() float64 {
	hours := []float64{0, 2.5, 8}
	s := 0.0
	for i := range hours {
		s += slopeNear(hours[i] - 1e-17)
	}
	return s
}
