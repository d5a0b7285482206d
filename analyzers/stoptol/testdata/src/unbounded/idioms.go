package unbounded

import "math"

// Loops left alone: each ends for a reason the floats cannot take away.

// halve scales by a constant factor: it reaches 0 within about 1075
// halvings whatever the start.
func halve(h float64) int {
	n := 0
	for h > 1e-12 { // scaled each pass
		h /= 3
		n++
	}
	return n
}

// outward doubles an offset that starts away from 0 whatever x is: it
// reaches +Inf within about 1100 doublings.
func outward(gauge func(float64) float64, x float64) float64 {
	d := 1e-8 * math.Max(1, math.Abs(x))
	for gauge(x+d) <= 0 { // scaled each pass from a positive start
		d *= 2
	}
	return x + d
}

// rescale grows a weight that can start at 0 into range, but its own test
// excludes 0: at 0 the loop is never entered.
func rescale(a, b float64) float64 {
	w := a - b
	for w <= 1e-100 && w != 0 { // compares the weight itself
		w *= 1e50
	}
	return w
}

// narrowTo halves a width that starts as a difference: 0 is where halving
// leads anyway, so a zero start changes nothing.
func narrowTo(lo, hi float64) int {
	n := 0
	for w := hi - lo; w > 1e-9; w /= 2 {
		n++
	}
	return n
}

// expSeries stops on the term of a series; the term is scaled each pass
// by x/k, which tends to 0, and a NaN term fails the loop condition.
func expSeries(x float64) float64 {
	sum, term, k := 1.0, 1.0, 1.0
	for math.Abs(term) > 1e-17*math.Abs(sum) { // the term of a series
		term *= x / k
		sum += term
		k++
	}
	return sum
}

// reject draws until a sample lands: each pass is a fresh draw.
func reject(draw func() float64) float64 {
	for {
		u := draw()
		if u*u < 0.5 { // a fresh draw each pass
			return u
		}
	}
}

// bestOrder moves through integer orders: an integer counter moves
// exactly and each pass scores a new order.
func bestOrder(score func(int) float64, best float64) int {
	for k := 2; ; k++ {
		if score(k) < best { // read at a new integer each pass
			return k
		}
	}
}

// ticks scans from lo to hi by the caller's step.
func ticks(lo, hi, dx float64, mark func(float64)) {
	for x := lo; x <= hi; x += dx { // the caller chose the step
		mark(x)
	}
}

// spread divides the span by a count: that many passes.
func spread(lo, hi float64, n int, mark func(float64)) {
	dx := (hi - lo) / float64(n)
	for x := lo; x < hi; x += dx { // a span over a count
		mark(x)
	}
}

// degrees counts from a constant start by a constant step.
func degrees(mark func(float64)) {
	for d := -90.0; d <= 90; d++ { // a fixed number of passes
		mark(d)
	}
}

// cells steps by the reciprocal of a slope, which is never 0 for a finite
// slope.
func cells(slope float64, visit func(float64)) {
	t, dt := 0.0, math.Abs(1/slope)
	for t < 1 { // the step cannot round to 0
		visit(t)
		t += dt
	}
}

type knot struct {
	x    float64
	next *knot
}

// walk follows a list until a knot lies past a mark: a pointer walks data.
func walk(k *knot, mark float64) *knot {
	for k.x < mark { // the loop carries a pointer, not floats
		k = k.next
	}
	return k
}

// lift scales a tiny value up by an invariant factor until it is large
// enough: finitely many passes unless the factor is exactly 1.
func lift(b, floor float64) float64 {
	up := 1 / floor
	for {
		b *= up
		if math.Abs(b) >= floor { // scaled by a factor the loop does not change
			return b
		}
	}
}

// guarded caps its passes with a panic.
func guarded(f func(float64) float64, x float64) float64 {
	for n := 0; f(x) > 1e-9; n++ {
		if n > 100 { // a cap that panics
			panic("no progress")
		}
		x = f(x)
	}
	return x
}

// marks steps a float counter and places marks from it until one passes
// the end: a scan by the caller's spacing.
func marks(start, gap, end float64, mark func(float64)) {
	var i float64
	for {
		v := start + i*gap
		if v > end { // computed from a counter stepped by 1
			return
		}
		mark(v)
		i++
	}
}

// wrapSmall is unexported: its callers are this package's own, which
// stoptol does not follow; a value within a few periods takes a pass or
// two.
func wrapSmall(p float64) float64 {
	for p < 0 { // an unexported helper
		p += 2 * math.Pi
	}
	return p
}

// Align brings one angle within a turn of another: how far apart they
// start is the caller's, and here the loop does not even run when
// delta >= 0.
func Align(start, delta float64) float64 {
	end := start + delta
	if delta >= 0 {
		for end < start { // bounded by another variable, not a fixed range
			end += 2 * math.Pi
		}
	}
	return end
}

// segments cuts a span into pieces whose sag stays within slack: each pass
// takes the fraction f = sqrt(8·slack/|k|)/w > 0 of what is left (slack is
// floored at 1e-12 by its only caller), and the loop ends when f reaches
// 1 or is NaN (NaN < 1 is false): a sweep by positive fractions, not a
// convergence loop.
func segments(lo, hi, slack float64, k func(float64) float64) []float64 {
	xs := []float64{lo}
	f := 0.0
	for f < 1 { // positive fractions of the rest: no iteration cap needed
		f = math.Min(math.Sqrt(8*slack/math.Abs(k(lo)))/(hi-lo), 2)
		if f >= 1 {
			break
		}
		lo, hi = shave(lo, hi, f)
		xs = append(xs, lo)
	}
	return append(xs, hi)
}

// Segments floors the slack before cutting.
func Segments(lo, hi, slack float64, k func(float64) float64) []float64 {
	slack = math.Max(slack, 1e-12)
	return segments(lo, hi, slack, k)
}

// Pieces floors the slack itself: the fraction is positive on every pass.
func Pieces(lo, hi, slack float64, k func(float64) float64) []float64 {
	slack = math.Max(slack, 1e-12)
	var xs []float64
	for f := 0.0; f < 1; { // positive fractions of the rest
		f = 0.5 * math.Cbrt(slack/math.Abs(k(lo)))
		if f < 1 {
			lo, hi = shave(lo, hi, f)
		}
		xs = append(xs, lo)
	}
	return xs
}

// floatCounted caps a series with a float counter: k starts at the
// constant 1 and moves by exactly 1 each pass (integers below 2^53 are
// exact in float64), so k > 60 ends the loop after 59 passes, NaN terms
// included.
func floatCounted(x float64) (float64, bool) {
	sum, term := 0.0, 1.0
	k := 1.0
	for {
		k += 1
		term *= x / k
		sum += term
		if k > 60 || math.Abs(term) > 1e300 {
			return sum, false
		}
		if math.Abs(term) < 1e-15 {
			return sum, true
		}
	}
}

// halfStepCounted counts in steps of 0.5 in the loop's post statement:
// 0.5 is exact and the bound 40 lies far below 2^52·0.5.
func halfStepCounted(g func(float64) float64, x float64) float64 {
	for t := 0.0; ; t += 0.5 {
		if t >= 40 || math.Abs(g(x)) < 1e-12 {
			return x
		}
		x = g(x)
	}
}

// WidenBracket pushes the low end of a bracket away from the high end by
// the bracket's own width: the width doubles each pass, so a step that is
// not 0 on entry (the ends were made distinct first) never falls below the
// spacing of lo, and lo overflows to -Inf within about 2100 passes, where a
// distribution function is 0.
func WidenBracket(cdf func(float64) float64, lo, hi float64) (float64, float64) {
	if lo == hi {
		lo, hi = lo-1, hi+1
	}
	for cdf(lo) > 0.005 {
		lo -= hi - lo
	}
	for cdf(hi) < 0.995 {
		hi += hi - lo
	}
	return lo, hi
}

// settleBounded keeps a hard cap in the body beside the optional one of
// its condition: every path is bounded.
func settleBounded(next func(float64) float64, x, tol float64, max int) float64 {
	for i := 0; max == 0 || i < max; i++ {
		if i >= 10000 {
			break
		}
		y := next(x)
		if math.Abs(y-x) < tol {
			return y
		}
		x = y
	}
	return x
}

// pair tries two cases in a for block written for its breaks: every path
// through the body leaves on the first pass, so it never repeats.
type vec struct{ X, Y float64 }

func (v vec) neg() vec           { return vec{-v.X, -v.Y} }
func scale(k float64, v vec) vec { return vec{k * v.X, k * v.Y} }

type pair struct{ v vec }

func (p *pair) add(d vec) { p.v.X += d.X; p.v.Y += d.Y }

func (p *pair) resolve(k float64) {
	for {
		x := scale(k, p.v).neg()
		if x.X >= 0 && x.Y >= 0 {
			p.add(x)
			break
		}
		x = scale(2*k, p.v)
		if x.X >= 0 {
			p.add(x)
			break
		}
		break
	}
}

// rows steps by a fixed fraction of the caller's spacing: the sine of a
// constant angle is a constant 0.866, never 0.
func rows(y0, y1, spacing float64, mark func(float64)) {
	d := spacing * math.Sin(60*math.Pi/180)
	mark(y0)
	fill := func() {
		for y := y0; y <= y1; y += 2 * d { // the caller's spacing, scaled
			mark(y)
		}
	}
	fill()
}

// settleCapped stops on the comparator or after 100 passes.
func settleCapped(y float64) float64 {
	p, prev := 1.0, 0.0
	for i := 0; i < 100 && compare(prev, p, 1e-12) != 0; i++ {
		prev = p
		p = y * math.Cos(p)
	}
	return p
}

// Heading wraps an angle that Atan2 returns within [-π, π]: one pass at
// most, whatever the caller's coordinates.
func Heading(dx, dy float64) float64 {
	h := math.Atan2(dy, dx)
	for h < 0 {
		h += 2 * math.Pi
	}
	return h
}

// Clock reduces the caller's hour angle with math.Mod first, so the loop
// sees a value within one turn.
func Clock(hours float64) float64 {
	a := math.Mod(hours*15, 360)
	for a < 0 {
		a += 360
	}
	return a
}

// sim advances a simulation clock; Step reports whether time is left.
type sim struct{ t, end float64 }

func (s *sim) Step(dt float64) bool {
	s.t += dt
	return s.t < s.end
}

// Run steps the simulation to its end: the exit is the method's state, a
// machine the loop drives, not a float test of the loop's own values.
func Run(s *sim) int {
	n := 0
	for s.Step(0.01) {
		n++
	}
	return n
}

// allZero reports whether every component of g is 0.
func allZero(g []float64) bool {
	for _, x := range g {
		if x != 0 {
			return false
		}
	}
	return true
}

// Descend steps against the gradient until it vanishes or the value stops
// falling: the first exit reads a slice of data through a helper, not a
// float value of the loop, and is not read as a tolerance test.
func Descend(f func([]float64) float64, grad func([]float64) []float64, x []float64) []float64 {
	last := f(x)
	for {
		g := grad(x)
		if allZero(g) {
			break
		}
		axpy(x, -0.1, g)
		v := f(x)
		if v >= last {
			break
		}
		last = v
	}
	return x
}

// axpy adds a·y to x in place.
func axpy(x []float64, a float64, y []float64) {
	for i := range x {
		x[i] += a * y[i]
	}
}

// dimmest is a golden-section search whose tolerance the function
// floors before the loop: a caller's 0 never reaches the test.
func dimmest(glow func(float64) float64, lo, hi, tol float64) float64 { // want dimmest:"parameter 3 is an absolute x-tolerance of a minimization in dimmest"
	if tol <= 0 {
		tol = 1e-6
	}
	h := hi - lo
	for {
		if h < tol {
			return (lo + hi) / 2
		}
		if glow(lo+h/3) < glow(hi-h/3) {
			hi -= h / 3
		} else {
			lo += h / 3
		}
		h *= 2.0 / 3
	}
}

// decade looks for the power of ten below a caller's value: the loop
// condition cursor > 0 ends it where tenths underflow to 0, whatever the
// value given.
func decade(delta float64) float64 {
	for cursor := 1e10; cursor > 0; cursor /= 10 {
		if delta > cursor {
			return cursor
		}
	}
	return 0
}

// throughThree turns three survey points until neither of the first two
// steps is vertical: the loop only rearranges the same six values and
// works the steps out afresh from them, so it visits at most three
// arrangements, and rounding can make none of them drift.
func throughThree(xa, ya, xb, yb, xc, yc float64) (float64, float64) {
	da, db := xb-xa, xc-xb
	for da == 0 || db == 0 {
		xa, ya, xb, yb, xc, yc = xb, yb, xc, yc, xa, ya
		da, db = xb-xa, xc-xb
	}
	return (yb - ya) / da, (yc - yb) / db
}

// narrow halves a valve's travel while it exceeds the caller's
// tolerance: halving reaches exactly 0 (IEEE 754-2019: half the smallest
// subnormal rounds to 0 under ties to even), where travel <= 0 holds, so
// even tol = 0 ends it.
func narrow(travel, tol float64) int {
	n := 0
	for travel > tol {
		travel /= 2
		n++
	}
	return n
}
