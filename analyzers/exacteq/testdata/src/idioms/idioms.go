// Package idioms holds exact comparisons that are deliberate and must not be
// reported.
package idioms

import (
	"errors"
	"math"
	"sort"
	"strconv"
)

func nanSelfTest(x float64) bool {
	return x != x // the NaN self-test
}

func zeroGuard(a, b float64) float64 {
	d := a - b
	if d == 0 { // guard before a division: exact zero is the point
		return 0
	}
	return 1 / d
}

func underflow(y float64) bool {
	return math.Exp(y) == 0 // underflow detection
}

func zeroPivot(a [][]float64, k int) bool {
	return a[k][k] == 0 // a zero pivot
}

func blasBeta(beta float64, y []float64) {
	if beta == 0 { // BLAS-style shortcut on a parameter
		for i := range y {
			y[i] = 0
		}
	}
}

type settings struct{ Step float64 }

func defaults(s *settings) {
	if s.Step == 0 { // defaulting an unset field
		s.Step = 1e-3
	}
}

func unitAlpha(alpha float64, x []float64) {
	if alpha == 1 { // a sentinel on an unmodified parameter
		return
	}
	for i := range x {
		x[i] *= alpha
	}
}

func infinities(a, b float64) bool {
	s := a * b
	return s == math.Inf(1) || s == math.Inf(-1) || s == math.MaxFloat64 || -s == -math.MaxFloat64
}

func sorted(a []float64) bool {
	sort.Float64s(a)
	for i := 1; i < len(a); i++ {
		if a[i] == a[i-1] { // duplicates of loaded values
			return true
		}
	}
	return false
}

func knot(xs []float64, x float64) int {
	for i, k := range xs {
		if x == k { // an exact knot hit in interpolation
			return i
		}
	}
	return -1
}

func exactFunctions(x, y float64) bool {
	return math.Abs(x) == y || math.Max(x, y) == math.Min(x, y) || math.Trunc(x) == math.Floor(y)
}

func integerTest(x float64) bool {
	return x == math.Floor(x) // integer test
}

func integerTestSum(a, b float64) bool {
	v := a + b
	return v == math.Floor(v) // a sum of inputs: whole exactly when the inputs' fractions cancel, not judged
}

func bisectionStop(a, b float64) bool {
	m := (a + b) / 2
	return m == a || m == b // no float left between a and b
}

// bracket keeps a root finder's ends in fields.
type bracket struct{ lo, hi float64 }

// The same stop on fields read twice: each read is the same variable.
func (b *bracket) exhausted() bool {
	m := (b.lo + b.hi) / 2
	return m == b.lo || m == b.hi // no float left between the ends
}

func overflowTest(x, c float64) bool {
	return x*c == x // the product is derived from x on purpose
}

func machineEpsilon() float64 {
	eps := 1.0
	for 1+eps != 1 { // halving until absorbed is the point
		eps /= 2
	}
	return eps
}

func clampedLoop(t0, t1, h float64) int {
	n := 0
	for t := t0; t != t1; t = math.Min(t+h, t1) { // clamped to the bound: lands on it
		n++
	}
	return n
}

func clampedBranch(x, hi float64) bool {
	if x > hi {
		x = hi
	}
	return x == hi // merge of copies: the clamp took effect
}

func unknownCalls(s, u string) bool {
	a, _ := strconv.ParseFloat(s, 64)
	b, _ := strconv.ParseFloat(u, 64)
	return a == b // results of functions from other packages
}

func changed(tscal, x float64, big bool) bool {
	uscal := tscal
	if big {
		uscal = tscal / x
	}
	return uscal == tscal // did the branch change uscal?
}

func brentCopies(f func(float64) float64, a, b float64) float64 {
	c := b
	for range 50 {
		if f(b)*f(c) > 0 {
			c = a
		}
		if math.Abs(f(c)) < math.Abs(f(b)) {
			a, b, c = b, c, b
		}
		if a == c { // which copy is which: both are merges of the same points
			return b
		}
		a, b = b, b+0.5*(c-b)
	}
	return b
}

func fastPath(got, want, tol float64) bool {
	g, w := got*2+1, want*2+1
	if g == w { // a shortcut before the tolerance test of the same pair
		return true
	}
	return math.Abs(g-w) <= tol*math.Abs(w)
}

type box struct{ MinX, MaxX float64 }

func split(b box) box {
	old := b
	b.MinX += (b.MaxX - b.MinX) / 2
	if b == old { // the box against its own earlier value
		panic("plane too big")
	}
	return b
}

func exactLoop() int {
	n := 0
	for x := 0.0; x != 1; x += 0.25 { // quarters add exactly: the loop lands on 1
		n++
	}
	return n
}

func scaleShortcut(sl, su float64) bool {
	scale := sl * su
	return scale != 1 // a representable sentinel: skipping work when exactly 1
}

func loads(p, q struct{ X float64 }) bool {
	return p.X == q.X
}

func params(x, y float64) bool {
	return x == y
}

func complexZero(z, w complex128) bool {
	return z*w == 0
}

func halves(a float64) bool {
	return a*0.5 == a/4*2 // scaling by powers of two is exact
}

func representableLiteral(a, b float64) bool {
	return a+b == 0.5 // 0.5 is stored exactly
}

type memo struct{ key, val float64 }

func (m *memo) lookup(a, b float64) float64 {
	k := a * b
	if m.key == k { // a cache compares the key it stored last
		return m.val
	}
	m.key, m.val = k, math.Sqrt(k)
	return m.val
}

// Ordered float loops whose pass count agrees with exact arithmetic are
// left alone, whatever their last value: quarter steps are exact, and from
// -1 by 0.1 to 1 the rounded values (last 0.9999999999999998) still pass 21
// times, as the exact ones do.
func countsAgree() int {
	n := 0
	for w := 0.0; w <= 1; w += 0.25 {
		n++
	}
	for a := -1.0; a <= 1.0; a += 0.1 {
		n++
	}
	for v := 0.0; v < 10; v += 0.5 {
		n++
	}
	return n
}

// A step that is not a constant is not simulated.
func variableStep(h float64) int {
	n := 0
	for w := 0.0; w <= 1; w += h {
		n++
	}
	return n
}

// Zero tests that are not residues of cancelling computed terms: a
// difference of inputs is 0 exactly when they are equal (Sterbenz), a sum
// of squares only for the zero vector, and a remainder reduction x - k*y
// with k = Floor(x/y) is exact where exact sign algorithms use it.
func zeroTests(x1, x2, y1, y2 float64) int {
	n := 0
	if x2-x1 == 0 {
		n++
	}
	if x1*x1+y1*y1 == 0 {
		n++
	}
	k := math.Floor(x2 / x1)
	if x2-k*x1 == 0 {
		n++
	}
	return n
}

// A series summed until adding a term no longer changes the sum: the
// exact test asks whether the term was absorbed, which is the right stop
// (the sum then holds every digit the format can).
func seriesUntilStagnant(x float64) float64 {
	sum, term := 1.0, 1.0
	for k := 1; k < 1000; k++ {
		term *= x / float64(k)
		prev := sum
		sum += term
		if sum == prev {
			break
		}
	}
	return sum
}

// The same stop written against the sum of the previous pass.
func seriesAgainstLast(x float64) float64 {
	sum, last := 0.0, -1.0
	term := 1.0
	for k := 1; sum != last && k < 1000; k++ {
		last = sum
		sum += term
		term *= x / float64(k)
	}
	return sum
}

// Infinities held in variables are exact sentinels, as math.Inf is.
var posInf = math.Inf(1)

func saturated(a, b float64) bool {
	negInf := math.Inf(-1)
	s := a * b
	return s == posInf || s == negInf
}

// Wrapping an angle into [0, 2π): adding the period to a tiny negative
// angle can round to exactly 2π, which the test catches and maps to 0.
func wrapAngle(a float64) float64 {
	const period = 2 * math.Pi
	a = math.Mod(a, period)
	if a < 0 {
		a += period
		if a == period {
			a = 0
		}
	}
	return a
}

// A step clamped to land on the end of the interval: t + (end - t)
// rounds to end when t and end are within a factor of two (Sterbenz), and
// the test asks whether this is the last step.
func lastStep(t, end, h float64) bool {
	if t+h > end {
		h = end - t
	}
	t += h
	return t == end
}

// Absorption guards: x + 1 == x holds exactly when 1 is below half the
// spacing at x, the question the test asks.
func absorbs(x, d float64) bool {
	return x+1 == x || x+d == x
}

// A recurrence term tested for zero before it divides: a residue there
// only scales the next convergent of the continued fraction.
func convergents(x float64) float64 {
	p0, q0, p1, q1 := 1.0, x, x+1, x*x
	ans := p1 / q1
	for k := 1.0; k < 50; k++ {
		p := p1*x - p0*k
		q := q1*x - q0*k
		if q != 0 {
			ans = p / q
		}
		p0, q0, p1, q1 = p1, q1, p, q
	}
	return ans
}

// A float counter stopped where subtracting 1 no longer changes it: the
// test asks whether 1 is absorbed (|i| >= 2^53).
func countDown(from float64) int {
	n := 0
	for i := from; i != i-1 && n < 10; i++ {
		n++
	}
	return n
}

type shade struct{ r, g, b float64 }

func tone(s shade) float64 { return (s.r - s.b) / (s.g + 1) }

// The same function of values passed by value: equal inputs round the
// same way, so the test compares the inputs as the function sees them (a
// comparator breaking ties).
func sameTone(a, b shade) bool {
	return tone(a) == tone(b)
}

// A choice between two bins by a primary cost, with a tie swapping in a
// secondary cost before the order is taken: a tie missed by an ulp leaves
// the primary costs, which differ by that ulp, to choose.
type bin struct{ w, h, fill float64 }

func (b bin) area() float64 { return b.w * b.h }

func pickBin(p, q bin, add float64) bin {
	costP := q.area() + (p.w+add)*p.h
	costQ := p.area() + (q.w+add)*q.h
	if costP == costQ {
		costP, costQ = p.fill, q.fill
	}
	if costQ < costP {
		return q
	}
	return p
}

// An extra pass runs at 0.9999999999999999, within the range w < 1 admits.
func extraPass() int {
	n := 0
	for w := 0.0; w < 1; w += 0.1 {
		n++
	}
	return n
}

// A cross product tested for zero only to guard the divisions by it: a
// residue in place of zero gives a large finite ratio, which the range
// test then rejects.
func crossingRatio(ux, uy, vx, vy, wx, wy float64) (float64, bool) {
	det := ux*vy - uy*vx
	if det == 0 {
		return 0, false
	}
	r := (wx*vy - wy*vx) / det
	return r, r >= 0 && r <= 1
}

// A determinant tested for zero only to guard the division by it, the
// singular case reported as an error: a residue in place of zero gives a
// large finite reciprocal, and conditioning is the caller's question.
type frame2 [4]float64

var blank frame2

func (m frame2) inverse() (*frame2, error) {
	det := m[0]*m[3] - m[1]*m[2]
	if det == 0 {
		return &blank, errors.New("frame2: singular")
	}
	k := 1 / det
	return &frame2{m[3] * k, -m[1] * k, -m[2] * k, m[0] * k}, nil
}

// A determinant asserted nonzero before the division by it: the package's
// assertion panics on false, as a zero branch that panics would.
func require(ok bool, msg string) {
	if !ok {
		panic(msg)
	}
}

func (m frame2) solve(b0, b1 float64) (float64, float64) {
	det := m[0]*m[3] - m[1]*m[2]
	require(det != 0, "frame2: singular")
	k := 1 / det
	return (m[3]*b0 - m[1]*b1) * k, (m[0]*b1 - m[2]*b0) * k
}

// The same under a release build, whose assertion ignores its argument.
func check(_ bool, _ ...any) {}

func (m frame2) det() float64 {
	d := m[0]*m[3] - m[1]*m[2]
	check(d != 0)
	return 1 / d
}

// A field filled by a function and compared with that function's result:
// the same function gives the same bits for the same inputs, so the test
// asks whether the default is still in use.
type sieve struct {
	tier  int
	reach float64
}

func (s *sieve) defaultReach(tier int) float64 { return math.Ldexp(1, -tier) * 2.5 / 3 }

func (s *sieve) widen(tier int) {
	s.tier = tier
	s.reach = s.defaultReach(tier)
}

func (s *sieve) margin() float64 {
	if s.reach == s.defaultReach(s.tier) {
		return s.reach / 2
	}
	return s.reach
}

// A bracket search whose step doubles each pass: x overflows onto +Inf
// exactly within about 1100 passes, and no float lies beyond an infinity
// to step over, so the exact test against it ends the loop.
func bracketDoubling(f func(float64) float64, y float64) float64 {
	top := math.Inf(1)
	x, d := 0.0, 1.0
	for x != top && f(x) < y {
		x += d
		d *= 2
	}
	return x
}

// unitStencil scales weights to unit sum: nothing in the loop says they
// take either sign (a smoothing stencil's are positive), and a sum of
// terms of one sign is 0 only when every term is, exactly.
func unitStencil(weights []float64) {
	sum := 0.0
	for _, w := range weights {
		sum += w
	}
	if sum != 0 {
		for i := range weights {
			weights[i] /= sum
		}
	}
}

// checkedLoad sums the loads of a beam's supports, rejecting a negative
// one: the loop keeps one sign, so the total is 0 only when every load is.
func checkedLoad(loads []float64) float64 {
	total := 0.0
	for _, l := range loads {
		if l < 0 {
			panic("negative load")
		}
		total += l
	}
	if total == 0 {
		return 0
	}
	return loads[0] / total
}

// cloud is an invented point-cloud hull builder; its floor scales with
// the cloud's extent, so the package fills it with a computed value.
type cloud struct{ floor float64 }

func (c *cloud) setup(extent float64) { c.floor = 1e-12 * extent * extent }

// flat seeds a running maximum of squared offsets with the floor and
// asks, after the loop, whether any exceeded it: the maximum is the floor
// itself, bit for bit, until a larger value replaces it.
func (c *cloud) flat(d []float64) bool {
	best := c.floor
	for _, d := range d {
		if sq := d * d; sq > best {
			best = sq
		}
	}
	return best == c.floor
}
