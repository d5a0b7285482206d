// Package hazards holds tolerances below what the float type resolves.
package hazards

import "math"

const tight = 1e-18

var loose = 1e-20 // never reassigned

func relLiteral(a, b float64) bool {
	return math.Abs(a-b) <= 1e-17*math.Abs(b) // want `relative tolerance 1e-17 is below the unit roundoff of float64 \(1.11e-16\): two different float64 values always differ by more, so the test is exact equality; use a few ulps, such as 4\*0x1p-52 \(8.9e-16\)`
}

func relQuotient(a, b float64) bool {
	return math.Abs(a-b)/math.Abs(b) < 1e-20 // want `relative tolerance 1e-20 is below the unit roundoff`
}

func relMax(a, b float64) bool {
	return math.Abs(a-b) < tight*math.Max(math.Abs(a), math.Abs(b)) // want `relative tolerance tight \(1e-18\) is below the unit roundoff`
}

func relInner(a, b float64) bool {
	return math.Abs((a-b)/b) < 1e-19 // want `relative tolerance 1e-19 is below`
}

func relFlipped(a, b float64) bool {
	return 1e-17*math.Abs(a) >= math.Abs(a-b) // want `relative tolerance 1e-17 is below`
}

func relVariable(a, b float64) bool {
	d := math.Abs(a - b)
	r := d / math.Abs(a)
	return r < loose // want `relative tolerance loose \(1e-20\) is below`
}

func absTight(a, b float64) bool {
	return math.Abs(a-b) < 1e-20 // want `absolute tolerance 1e-20 is below float64 epsilon \(2.22e-16\): the test can hold for unequal values only when they are below about 4.5e-05 \(tol/eps\), and is exact equality above; add a relative term`
}

func absKnown(x float64) bool {
	return math.Abs(x-1) <= 1e-17 // want `absolute tolerance 1e-17 is below half the spacing of float64 values at 1 \(1.11e-16\): the test passes only on exact equality`
}

// Floats just under 0.75 are 1.11e-16 apart, so two different values near
// 0.75 differ by at least that (Goldberg 1991, Thm 11: the difference is
// exact); 1e-16 is above half the spacing yet still admits only equality.
func absUnderGap(x float64) bool {
	return math.Abs(x-0.75) < 1e-16 // want `absolute tolerance 1e-16 is below the spacing of float64 values just under 0.75 \(1.11e-16\): two different values there differ by at least that much, so the test passes only on exact equality`
}

func absNeq(x, y float64) bool {
	return math.Abs(x-y) > 5e-17 // want `absolute tolerance 5e-17 is below float64 epsilon`
}

func subnormal(a, b float64) bool {
	return math.Abs(a-b) < math.SmallestNonzeroFloat64 // want `math.SmallestNonzeroFloat64 \(5e-324\) is the smallest positive float64: it says how small a number can be, not how close two can be \(float64 epsilon is 2.22e-16\)`
}

func subnormalLiteral(a, b float64) bool {
	return math.Abs(a-b) <= 4.9406564584124654e-324 // want `is the smallest positive float64`
}

func float32Rel(a, b float32) bool {
	return math.Abs(float64(a-b)) < 1e-9*math.Abs(float64(b)) // want `relative tolerance 1e-9 is below the unit roundoff of float32 \(5.96e-08\)`
}

func float32Native(a, b float32) bool {
	d := a - b
	if d < 0 {
		d = -d
	}
	return float32(math.Abs(float64(a-b))) < 1e-9 // want `absolute tolerance 1e-9 is below float32 epsilon \(1.19e-07\)`
}

// Real is a type set that admits float32.
type Real interface{ ~float32 | ~float64 }

func generic[T Real](a, b T) bool {
	return T(math.Abs(float64(a-b))) < 1e-12 // want `absolute tolerance 1e-12 is below float32 epsilon`
}

func newton(f, df func(float64) float64, theta float64) float64 {
	for range 50 {
		theta -= f(theta) / df(theta)
		if math.Abs(theta) < 1e-16 { // want `tolerance 1e-16 tests the iterate theta itself, not its change: \|theta\| < 1e-16 holds only for a root within 1e-16 of zero`
			break
		}
	}
	return theta
}

func absorbedAdd() float64 {
	p := 0.3125 + math.SmallestNonzeroFloat64 // want `math.SmallestNonzeroFloat64 has no effect on 0.3125: it is below half the spacing of float64 values there \(2.78e-17\), so the sum rounds back to exactly 0.3125`
	return p
}

func absorbedSub() float64 {
	return 1 - math.SmallestNonzeroFloat64 // want `math.SmallestNonzeroFloat64 has no effect on 1`
}

func absorbedLeft() float64 {
	return 1e-30 + 1 // want `1e-30 has no effect on 1`
}

func absorbed32() float32 {
	var x float32 = 1 + 1e-9 // want `1e-9 has no effect on 1: it is below half the spacing of float32 values there \(5.96e-08\)`
	return x
}

// Options configures a solver.
type Options struct {
	RelTol float64 // want RelTol:"a relative tolerance of float64 in converged"
	AbsTol float64 // want AbsTol:"an? absolute tolerance of float64 in close"
}

func (o *Options) converged(a, b float64) bool {
	return math.Abs(a-b) <= o.RelTol*math.Abs(b)
}

func (o *Options) close(a, b float64) bool {
	return math.Abs(a-b) < o.AbsTol
}

func defaults(o *Options) {
	if o.RelTol == 0 {
		o.RelTol = 1e-18 // want `1e-18, assigned to field RelTol \(a relative tolerance of float64 in converged, tested at \w+\.go:\d+\), is below the unit roundoff`
	}
	if o.AbsTol == 0 {
		o.AbsTol = 1e-30 // want `1e-30, assigned to field AbsTol \(an absolute tolerance of float64 in close, tested at \w+\.go:\d+\), is below float64 epsilon`
	}
}

func literalField() *Options {
	return &Options{RelTol: 1e-19} // want `1e-19, set as field RelTol \(a relative tolerance of float64 in converged, tested at \w+\.go:\d+\), is below`
}

func solve(a, b, tol float64) bool { // want solve:"parameter 2 is a relative tolerance of float64 in solve"
	return math.Abs(a-b) <= tol*math.Abs(a)
}

func callsSolve(a, b float64) bool {
	return solve(a, b, tight) // want `tight \(1e-18\), passed as tol to solve \(a relative tolerance of float64 in [A-Za-z]+, tested at \w+\.go:\d+\), is below`
}

// Limits holds a tolerance that its reader copies, with a default, before
// the test: the field still reaches the test whenever it is set.
type Limits struct {
	Rel float64 // want Rel:"a relative tolerance of float64 in within"
}

func (l Limits) within(a, b float64) bool {
	rel := l.Rel
	if rel == 0 {
		rel = 4 * 0x1p-52
	}
	return math.Abs(a-b) <= rel*math.Abs(b)
}

func tightLimits() Limits {
	return Limits{Rel: 1e-20} // want `1e-20, set as field Rel \(a relative tolerance of float64 in within, tested at \w+\.go:\d+\), is below`
}

func agree(a, b, tol float64) bool { // want agree:"parameter 2 is a relative tolerance of float64 in agree"
	t := tol
	return math.Abs(a-b) <= t*math.Abs(b)
}

func callsAgree(a, b float64) bool {
	return agree(a, b, 1e-19) // want `1e-19, passed as tol to agree \(a relative tolerance of float64 in agree, tested at \w+\.go:\d+\), is below`
}

func stepTest(x float64) float64 {
	for range 50 {
		step := x/2 - 1
		x -= step
		if math.Abs(step) < 1e-16*math.Abs(x) { // want `relative tolerance 1e-16 is below the unit roundoff of float64`
			break
		}
	}
	return x
}

func withDefault(a, b, tol float64) bool { // want withDefault:"parameter 2 is a relative tolerance of float64 in withDefault"
	if tol == 0 {
		tol = 1e-20 // want `1e-20, given as the default of tol \(a relative tolerance of float64 in withDefault, tested at \w+\.go:\d+\), is below the unit roundoff`
	}
	return math.Abs(a-b) <= tol*math.Abs(b)
}

// residualMoved gets no fix: q changes between the residual and its test,
// so k*q*q written at the test would be another value.
func residualMoved(k, h float64) float64 {
	q := 1.0
	r := k*q*q - h
	q = h / k
	if math.Abs(r) < math.SmallestNonzeroFloat64 { // want `math.SmallestNonzeroFloat64 \(5e-324\) is the smallest positive float64`
		return q
	}
	return 0
}

// ledgerBalanced gets no fix: its comment says the test is exact, and a
// tolerance would make that untrue.
func ledgerBalanced(debit, credit float64) bool {
	// The ledger must balance exactly.
	return math.Abs(debit-credit) < 1e-20 // want `absolute tolerance 1e-20 is below float64 epsilon`
}

// A constant sum rounds once, to its type: each addend is judged against
// the whole.
func absorbedChain() float64 {
	return 1 + 1e-17 + 2e-17 // want `1e-17 has no effect on the rest of the sum: it is below half the spacing of float64 values there \(1.11e-16\), so the sum rounds back to exactly 1`
}

// A float32 correction kept from float64 code: 6.1e-17 is far below the
// spacing of float32 values at 1.57.
func quarterTurn(x float32, g func(float32) float32) float32 {
	const halfPi float32 = 1.5707963267948966
	const extra float32 = 6.123233995736766e-17
	return halfPi - g(x) + extra // want `extra has no effect next to halfPi: it is below half the spacing of float32 values there \(5.96e-08\), so it is absorbed while the sum stays near 1.5707963705062866`
}

// contFrac evaluates a continued fraction by the modified Lentz method with
// the smallest subnormal as its floor.
func contFrac(a, b func(int) float64) float64 {
	const tiny = math.SmallestNonzeroFloat64
	f, c, d := tiny, tiny, 0.0 // want `tiny \(5e-324\) floors c, which then divides: 1/4.9e-324 overflows to \+Inf \(the largest float64 is 1.8e\+308\)`
	for j := 1; j < 100; j++ {
		d = b(j) + a(j)*d
		if d == 0 {
			d = math.SmallestNonzeroFloat64 // want `math.SmallestNonzeroFloat64 \(5e-324\) floors d, which then divides`
		}
		c = b(j) + a(j)/c
		d = 1 / d
		f *= c * d
	}
	return f
}

// peak keeps a running maximum from the smallest positive float.
func peak(xs []float64) float64 {
	best := math.SmallestNonzeroFloat64 // want `math.SmallestNonzeroFloat64 starts the running maximum best at 4.9e-324, the smallest positive float64, not the most negative: when every value is ≤ 0 the maximum comes out as 4.9e-324; start at math.Inf\(-1\) or -math.MaxFloat64`
	for _, x := range xs {
		if x > best {
			best = x
		}
	}
	return best
}

func peak32(xs []float32) float32 {
	var best float32
	best = math.SmallestNonzeroFloat32 // want `starts the running maximum best at 1.4e-45, the smallest positive float32`
	for _, x := range xs {
		if best < x {
			best = x
		}
	}
	return best
}

// A squared norm compared with the smallest subnormal, meant to catch
// denormal values.
func denormal(x, y float64) bool {
	return x*x+y*y < math.SmallestNonzeroFloat64 // want `math.SmallestNonzeroFloat64 is the smallest positive float64 \(4.9e-324\): no float64 lies between it and 0, so for x ≥ 0 this is a test for x == 0; write that if it is meant, or compare with the smallest normal float64, 0x1p-1022 \(2.2e-308\)`
}

// A crane's tolerance defined as the smallest positive float, squared and
// scaled: the square rounds to 0 and ten of it is still subnormal.
const slack = math.SmallestNonzeroFloat64

func apart(dx, dy float64) bool {
	return dx*dx+dy*dy > slack*slack // want `slack \* slack is 2.44101e-647 as written but rounds to 0 in float64, being at most half its smallest positive value \(4.9e-324\), so for x ≥ 0 this is a test for x > 0`
}

func touching(a, b float64) bool {
	gap := b - a
	return gap < 10*slack // want `10 \* slack is subnormal \(4.9e-323, 10 times the smallest positive float64\): no float64 but 0 and that many subnormal values lies below it, so for x ≥ 0 this is a test for x == 0`
}

func solid(ax, ay, bx, by float64) bool {
	area := ax*by - ay*bx
	return area > slack // want `slack is the smallest positive float64 \(4.9e-324\): no float64 lies between it and 0, so for x ≥ 0 this is a test for x > 0`
}

// A coefficient times the value beside it is a relative tolerance, held
// to the unit roundoff like any other.
const lens = 3.5e-19

type lensCase struct {
	want float64
	tol  float64 // want tol:"an absolute tolerance of float64 in lensOK"
}

var lensCases = []lensCase{{want: lens, tol: 1e-18 * lens}} // want `1e-18, the coefficient of lens in a tolerance set as field tol \(an absolute tolerance of float64 in lensOK, tested at \w+\.go:\d+\), is below the unit roundoff`

func lensOK(c lensCase, got float64) bool { return math.Abs(got-c.want) <= c.tol }

// A variable last given a constant holds exactly that value at the test,
// so the tolerance is judged there: 1e-14 at 1000.5 is below half the
// spacing of float64 values (5.68e-14).
func logSumChecks(small, large float64) bool {
	want := 2.5
	ok := math.Abs(small-want) < 1e-14
	want = -1000.5
	return ok && math.Abs(large-want) < 1e-14 // want `absolute tolerance 1e-14 is below half the spacing of float64 values at 1000.5 \(5.68e-14\): the test passes only on exact equality`
}

// No finite float64 exceeds math.MaxFloat64, so the overflow test is
// x == +Inf and a negative value scaled past the range (-Inf) slips by.
func rescale(x, k float64) float64 {
	y := x * k
	if y > math.MaxFloat64 { // want `y > math.MaxFloat64 holds only for y = \+Inf: no finite float64 exceeds 1.8e\+308, so an overflow of a negative value \(-Inf\) passes unseen; test math.IsInf\(y, 0\)`
		return x
	}
	return y / k
}

func rescale32(x, k float32) float32 {
	if y := x * k; math.MaxFloat32 <= y { // want `math.MaxFloat32 <= y holds only for y = \+Inf: no finite float32 exceeds 3.4e\+38`
		return x
	}
	return x * k
}

// The expected value of each case, computed from the case's own
// constants, reaches 580 in the second case, where float64 values are
// 1.14e-13 apart: 1e-14 there is exact equality.
func conditionalMeans(mean func(mu, slope, x float64) float64) bool {
	for _, tc := range []struct {
		mu, slope float64
		x         []float64
	}{
		{mu: 1, slope: 0.5, x: []float64{2, 4}},
		{mu: 20, slope: -0.6, x: []float64{1000, 0}},
	} {
		slope := tc.slope
		want := tc.mu + slope*(tc.x[0]-tc.x[1])
		if math.Abs(mean(tc.mu, slope, tc.x[0])-want) > 1e-14 { // want `absolute tolerance 1e-14 is below half the spacing of float64 values at 580 \(5.68e-14\)`
			return false
		}
	}
	return true
}

// A tolerance variable set again to a constant before a test holds that
// constant there.
func tightened(a, b, c float64) bool {
	tol := 1e-9
	ok := math.Abs(a-b) < tol
	tol = 1e-20
	return ok && math.Abs(b-c) < tol // want `absolute tolerance tol \(1e-20\) is below float64 epsilon`
}

// scaledStillTight multiplies the difference by a constant and still asks
// for less than the spacing: |4(x-1e6)| < 1e-12 holds when
// |x-1e6| < 2.5e-13, below half the spacing at 1e6 (5.82e-11).
func scaledStillTight(x float64) bool {
	return math.Abs(4*(x-1e6)) < 1e-12 // want `absolute tolerance 1e-12 on the difference times 4, 2.5e-13 on the difference itself, is below half the spacing of float64 values at 1e\+06 \(5.82e-11\): the test passes only on exact equality`
}

// A gauge's resolution meant as the gap above 1, stepping toward 1
// itself: the result is 1 and the resolution 0, so the test below it is
// exact equality.
func levelled(a, b float64) bool {
	resolution := math.Nextafter(1, 1) - 1 // want `math.Nextafter\(1, 1\) steps toward its own value and returns it unchanged`
	return math.Abs(a-b) <= resolution
}

// The same mistake on a variable.
func nudged(x float32) float32 {
	return math.Nextafter32(x, x) // want `math.Nextafter32\(x, x\) steps toward its own value`
}

// straddles bounds a difference from both sides: |a-b| < 1e-20 written
// without an absolute value.
func straddles(a, b float64) bool {
	return -1e-20 < a-b && a-b < 1e-20 // want `absolute tolerance 1e-20 is below float64 epsilon`
}

// inBand is a two-sided helper: its tolerance is its callers'.
func inBand(a, b, e float64) bool { // want inBand:"parameter 2 is an absolute tolerance of float64 in inBand"
	return a-b > -e && a-b < e
}

func callsInBand(a, b float64) bool {
	return inBand(a, b, 1e-18) // want `1e-18, passed as e to inBand \(an absolute tolerance of float64 in inBand, tested at \w+\.go:\d+\), is below float64 epsilon`
}

// clockUlp measures the spacing of floats at a simulation time t by
// stepping toward t+1, which is t itself once t reaches 2^53.
func clockUlp(t float64) float64 {
	return math.Nextafter(t, t+1) - t // want `math.Nextafter\(t, t \+ 1\) steps toward t itself once \|t\| reaches 9.01e\+15 \(2\^53·1\): t \+ 1 rounds to t there`
}

// clockStep steps toward t plus a step the caller chose: no constant
// whose absorption could be judged.
func clockStep(t, h float64) float64 {
	return math.Nextafter(t, t+h) - t
}

// A sum inside a larger constant expression is not rounded by itself: the
// quotient is, once. (1e16 + 1) / 2e16 is 0.50000000000000005 exactly,
// which rounds to 0.5, as 1e16 / 2e16 does.
func absorbedInQuotient() float64 {
	return (1e16 + 1) / 2e16 // want `1 has no effect on \(1e16 \+ 1\) / 2e16: the constant is evaluated exactly and rounded once to float64, to 0.5, the value it has without 1`
}

// sameReading compares two gauge readings within a millionth of the
// smallest positive float64: 4.9e-330 as written, 0 in float64, so no
// pair passes, equal readings included.
func sameReading(a, b float64) bool {
	const fraction = 0.000001
	return math.Abs(a-b) < fraction*math.SmallestNonzeroFloat64 // want `tolerance fraction \* math.SmallestNonzeroFloat64 is 4.94066e-330 as written but rounds to 0 in float64.*holds for no pair of values, equal ones included`
}

// sameReadingHeld holds the fraction in a variable: the product rounds
// to 0 at run time, and a non-strict test is exact equality.
func sameReadingHeld(a, b float64) bool {
	fraction := 0.000001
	return math.Abs(a-b) <= fraction*math.SmallestNonzeroFloat64 // want `rounds to 0 in float64, being at most half its smallest positive value \(4.9e-324\), so the test is exact equality`
}

// fitKnots stands for a spline fit over a kiln's firing schedule: it
// only reads the hours and set points it is given.
func fitKnots(hours, temps []float64) float64 {
	total := 0.0
	for i := range hours {
		total += hours[i] * temps[i]
	}
	return total
}

func slopeAt(h float64) float64 { return 2 * h }

// lastSlope evaluates just before the last knot, hours[len(hours)-1] =
// 8: floats there are 1.8e-15 apart, so 8 - 1e-17 is 8 itself.
func lastSlope() float64 {
	hours := []float64{0, 2.5, 8}
	temps := []float64{20, 600, 1200}
	_ = fitKnots(hours, temps)
	last := len(hours) - 1
	return slopeAt(hours[last] - 1e-17) // want `1e-17 has no effect on hours\[last\]: it is below half the spacing of float64 values there \(8.88e-16\), so the sum rounds back to exactly 8`
}
