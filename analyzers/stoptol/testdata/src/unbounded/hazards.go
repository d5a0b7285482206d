// Package unbounded holds loops with no iteration cap whose only exits
// are float tests.
package unbounded

import "math"

// WrapPhase reduces any phase its callers pass by repeated addition: 1e10
// takes 1.6e9 passes, and from 2^56 ≈ 7.21e16 on, adding 2π is absorbed
// (IEEE 754-2019 binary64: the spacing there is 16, more than twice 6.28).
func WrapPhase(p float64) float64 {
	for p < 0 { // want `range reduction by repeated addition of 2 \* math.Pi \(6.283185307179586\) takes \|p\|/6.28 passes and never ends once \|p\| >= 7.21e\+16, where adding 6.28 is absorbed; use math.Mod or math.Remainder`
		p += 2 * math.Pi
	}
	return p
}

// Turns counts down by whole turns: from 2^33 ≈ 8.59e9 on, float32
// values are 1024 apart and subtracting 360 is absorbed.
func Turns(deg float32) float32 {
	for deg >= 360 { // want `range reduction by repeated addition of 360 takes \|deg\|/360 passes and never ends once \|deg\| >= 8.59e\+09`
		deg -= 360
	}
	return deg
}

// traceRim steps around a rim by an angle that rounds to 0 for a wide
// rim: acos(r/(r+0.05)) is 0 once 0.05/r is below about 1.1e-16.
func traceRim(r float64, plot func(float64)) {
	da := 2 * math.Acos(r/(r+0.05))
	a := 0.0
	for {
		if a > 2*math.Pi { // want `loop advances a by the computed step da and ends only on float tests: when the step rounds to 0, is NaN, or is below half the spacing of a \(1.11e-16·\|a\| in float64\), a stops moving`
			return
		}
		plot(a)
		a += da
	}
}

// settle repeats a smoothing map until two passes agree; a map that
// oscillates, or a NaN (which fails gap < 1e-9), keeps it running.
func settle(level []float64, smooth func([]float64) []float64, gap func(a, b []float64) float64) []float64 {
	for {
		next := smooth(level)
		d := gap(level, next)
		level = next
		if d < 1e-9 { // want `iteration may never end: its only exits are float tests \(d < 1e-9\) and nothing caps the passes, so an iteration that stalls, oscillates or diverges keeps it running, and so does a NaN, which fails every ordered comparison; add an iteration limit`
			return level
		}
	}
}

// heron is Newton's method for sqrt(a) written as Heron's rule, with no
// cap: from a negative a it wanders forever.
func heron(a float64) float64 {
	x := a
	for {
		next := (x + a/x) / 2
		if math.Abs(next-x) <= 1e-15*math.Abs(next) { // want `iteration may never end: its only exits are float tests`
			return next
		}
		x = next
	}
}

// ratioSeries stops on a term of a series with no cap: a NaN term (an
// overflow in pow) fails t < 1e-16 and the loop never ends.
func ratioSeries(x float64) float64 {
	sum, pow, k := 0.0, x, 1.0
	for {
		t := pow / k
		sum += t
		if math.Abs(t) < 1e-16 { // want `series may never end: its only exits test the term \(math.Abs\(t\) < 1e-16\) and nothing caps the passes, so a NaN term`
			return sum
		}
		pow *= x
		k++
	}
}

type field struct{ v []float64 }

// relax applies an operator in place until two passes agree: the state
// changes through calls, unseen by the loop's assignments.
func relax(op func(dst, src *field), cur, prev *field, gap func(a, b []float64) float64, tol float64) {
	for {
		cur, prev = prev, cur
		op(cur, prev)
		if gap(cur.v, prev.v) < tol { // want `iteration may never end: its only exits are float tests \(gap\(cur.v, prev.v\) < tol\)`
			return
		}
	}
}

// pivots repeats an exchange until no reduced cost is below -tol; its
// other exit is a failure, which bounds nothing.
func pivots(exchange func(r []float64) error, costs func(r []float64), r []float64, tol float64) error {
	for {
		costs(r)
		if r[0] >= -tol { // want `iteration may never end: its only exits are float tests \(r\[0\] >= -tol\)`
			return nil
		}
		if err := exchange(r); err != nil {
			return err
		}
	}
}

// within repeats a map until successive values agree to a named
// tolerance; the message gives its value.
func within(g func(float64) float64, x float64) float64 {
	const agree = 1e-12
	for {
		next := g(x)
		if d := next - x; d*d < agree { // want `iteration may never end: its only exits are float tests \(d\*d < agree, agree = 1e-12\)`
			return next
		}
		x = next
	}
}

// relaxUntilSettled keeps a flag that reads itself: the loop still ends
// only on a float test.
func relaxUntilSettled(g func(float64) float64, x float64) float64 {
	settled := false
	for !settled { // want `iteration may never end: its only exits are float tests`
		next := g(x)
		settled = settled || math.Abs(next-x) < 1e-9
		x = next
	}
	return x
}

// shave returns what is left of [lo, hi] after its first fraction f.
func shave(lo, hi, f float64) (float64, float64) { return lo + f*(hi-lo), hi }

// chordsOf lays chords along a bending beam, each taking the fraction of
// the span left whose sag stays within slack: f = sqrt(8·slack/|k|)/w is 0
// when slack is 0, and with nothing to cap the passes the loop then cuts
// nothing off forever.
func chordsOf(lo, hi, slack float64, k func(float64) float64) []float64 {
	xs := []float64{lo}
	for f := 0.0; f < 1; { // want `loop cuts its state at f = math.Sqrt\(8\*slack/math.Abs\(k\(lo\)\)\) / \(hi - lo\) each pass and ends only when f reaches 1: f is 0 when slack is 0, which neither chordsOf nor its callers exclude, and the loop then never advances; floor slack at a positive value \(math.Max\(slack, c\)\) or add an iteration limit`
		f = math.Sqrt(8*slack/math.Abs(k(lo))) / (hi - lo)
		if f >= 1 {
			break
		}
		lo, hi = shave(lo, hi, f)
		xs = append(xs, lo)
	}
	return append(xs, hi)
}

// Chords is the public face of chordsOf; a slack of 0 reaches it as is.
func Chords(lo, hi, slack float64, k func(float64) float64) []float64 {
	return chordsOf(lo, hi, slack, k)
}

// stripsOf cuts like chordsOf with the slack floored, but its only exit is
// f >= 1, false for NaN: a NaN fraction (k returning NaN) cuts nothing off
// and keeps the loop running, so it is no sweep.
func stripsOf(lo, hi, slack float64, k func(float64) float64) []float64 {
	slack = math.Max(slack, 1e-9)
	xs := []float64{lo}
	for {
		f := math.Sqrt(8*slack/math.Abs(k(lo))) / (hi - lo)
		if f >= 1 { // want `iteration may never end: its only exits are float tests \(f >= 1\) and nothing caps the passes, so an iteration that stalls, oscillates or diverges keeps it running, and so does a NaN`
			break
		}
		lo, hi = shave(lo, hi, f)
		xs = append(xs, lo)
	}
	return append(xs, hi)
}

// sameBearing tells whether two bearings agree to a millionth of a radian.
func sameBearing(a, b float64) bool { return math.Abs(a-b) < 1e-6 }

// sweepBearing turns from a to b by steps that shrink with the remaining
// turn; its only exit is the helper's float test, and a step that rounds
// to 0 leaves it spinning.
func sweepBearing(a, b float64, mark func(float64)) {
	for t := a; !sameBearing(t, b); { // want `loop advances t by the computed step dt and ends only on float tests`
		dt := math.Acos(math.Cos(b - t))
		mark(t)
		t += dt
	}
}

// countedFrom starts its float counter at a caller's value: a NaN start
// fails k > 60 on every pass, so the counter caps nothing.
func countedFrom(x, k float64) float64 {
	sum, term := 0.0, 1.0
	for {
		k += 1
		term *= x / k
		sum += term
		if k > 60 || math.Abs(term) < 1e-15 { // want `series may never end`
			return sum
		}
	}
}

// skippedCount steps its counter after a continue that can skip it: a
// pass that continues leaves n where it was, so n > 60 need never hold.
func skippedCount(x float64) float64 {
	sum, term, k, n := 0.0, 1.0, 0.0, 0.0
	for {
		k++
		term *= x / k
		if term == 0 {
			continue
		}
		n++
		sum += term
		if n > 60 || math.Abs(term) < 1e-15 { // want `series may never end`
			return sum
		}
	}
}

// tinyStepCount steps its counter by 1e-20 towards 1: from n = 0.5 on,
// n + 1e-20 rounds back to n (half the spacing there is 5.55e-17), so
// n > 1 never holds.
func tinyStepCount(x float64) float64 {
	n := 0.0
	sum, term := x, x
	for k := 1.0; ; k += 2 {
		n += 1e-20
		term = -term * x * x / ((k + 1) * (k + 2))
		if sum += term; n > 1 || math.Abs(term) <= 1e-16*math.Abs(sum) { // want `series may never end`
			return sum
		}
	}
}

// resetByClosure keeps a float counter that a closure called every pass
// sets back to 0, so n > 60 never holds.
func resetByClosure(x float64) float64 {
	n := 0.0
	restart := func() { n = 0 }
	sum, term := 0.0, 1.0
	for k := 1.0; ; k++ {
		n++
		restart()
		term *= x / k
		sum += term
		if n > 60 || math.Abs(term) < 1e-15 { // want `series may never end`
			return sum
		}
	}
}

// backAndForth steps its float counter up every pass and down on some:
// when g keeps x above 1 the two steps cancel and n never reaches 60.
func backAndForth(g func(float64) float64, x float64) float64 {
	n := 0.0
	sum := 0.0
	for {
		n += 1
		t := g(x) / (n + 1)
		if x > 1 {
			n -= 1
		}
		sum += t
		if n > 60 || math.Abs(t) < 1e-15 { // want `series may never end`
			return sum
		}
		x *= 0.5
	}
}

// declaredInside declares its float counter in the loop body, so every
// pass starts it again at 0 and n > 60 never holds.
func declaredInside(x float64) float64 {
	sum, term := 0.0, 1.0
	for k := 1.0; ; k++ {
		var n = 0.0
		n += 1
		term *= x / k
		sum += term
		if n > 60 || math.Abs(term) < 1e-15 { // want `series may never end`
			return sum
		}
	}
}

// SettleOnto moves a probe onto a target by its own distance to it: the
// step target - x shrinks to 0 (after one pass exactly), so a test that
// still holds there keeps the loop running.
func SettleOnto(level func(float64) float64, x, target float64) float64 {
	for level(x) > 0.5 { // want `loop advances x by the computed step target - x and ends only on float tests`
		x += target - x
	}
	return x
}

// Relaxer settles a fixed point with an optional cap: zero means no limit.
type Relaxer struct {
	MaxPasses int
	Tol       float64
}

// Settle stops on the change alone when MaxPasses is 0: the cap beside
// the zero test is off there, and a change that stalls above Tol (or is
// NaN) keeps it running.
func (r Relaxer) Settle(next func(float64) float64, x float64) float64 {
	for i := 0; r.MaxPasses == 0 || i < r.MaxPasses; i++ {
		y := next(x)
		if math.Abs(y-x) < r.Tol { // want `iteration may never end: its only exits are float tests \(math.Abs\(y-x\) < r.Tol\) and its cap is off when r.MaxPasses == 0 \(r.MaxPasses == 0 \|\| i < r.MaxPasses then never fails\)`
			return y
		}
		x = y
	}
	return x
}

// Polish refines only when a tolerance is set: the guard selects the exit
// and ends nothing itself, so the loop is judged by the test inside it.
func (r Relaxer) Polish(next func(float64) float64, x float64) float64 {
	for {
		y := next(x)
		if r.Tol != 0 {
			if math.Abs(y-x) < r.Tol { // want `iteration may never end: its only exits are float tests \(math.Abs\(y-x\) < r.Tol\)`
				return y
			}
		}
		x = y
	}
}

// tighten halves its tolerance each pass: scaling takes tol to 0 within
// about 1075 halvings (float64 subnormals end at 2^-1074), and the test
// then needs |y-x| < 0, which nothing passes; a tolerance scaled toward 0
// is no reason for the loop to end.
func tighten(next func(float64) float64, x float64) float64 {
	tol := 1e-3
	for {
		y := next(x)
		if math.Abs(y-x) < tol { // want `iteration may never end: its only exits are float tests \(math.Abs\(y-x\) < tol\)`
			return y
		}
		x, tol = y, tol/2
	}
}

// OutwardFrom doubles a probe offset from the spacing of floats at x until
// the gauge turns positive: at x = 0 the spacing is Nextafter(0, 0) - 0 =
// 0, which doubling keeps at 0, and the loop never ends.
func OutwardFrom(gauge func(float64) float64, x float64) float64 {
	d := math.Abs(math.Nextafter(x, 2*x) - x)
	for gauge(x+d) <= 0 { // want `loop scales d each pass and ends only on float tests, but d can start at 0 \(math.Abs\(math.Nextafter\(x, 2\*x\) - x\)\), which no scaling moves`
		d *= 2
	}
	return x + d
}

// spreadClosed divides a closed span by a count and scans it to x <= hi:
// for hi == lo the loop is entered and the step is 0, so x never moves.
func spreadClosed(lo, hi float64, n int, mark func(float64)) {
	dx := (hi - lo) / float64(n)
	for x := lo; x <= hi; x += dx { // want `loop advances x by the computed step dx and ends only on float tests: when the step rounds to 0`
		mark(x)
	}
}

// gridOf returns a span and the step that divides it.
func gridOf(w []float64, n int) (lo, hi, step float64) {
	lo, hi = w[0], w[len(w)-1]
	step = (hi - lo) / float64(n)
	return lo, hi, step
}

// scanGrid takes the step from the package's own function: the same
// closed span of width 0 stops it.
func scanGrid(w []float64, n int, mark func(float64)) {
	lo, hi, step := gridOf(w, n)
	for x := lo; x <= hi; x += step { // want `loop advances x by the computed step step`
		mark(x)
	}
}

// trackBearing is written with for true, as code ported from C often is:
// the condition never fails, so the loop is as unbounded as for { }.
func trackBearing(y0, d float64) float64 {
	y := y0
	for true {
		c := y
		y = y0 + d*math.Sin(c)
		if math.Abs(y-c) <= 5e-14 { // want `iteration may never end: its only exits are float tests \(math.Abs\(y-c\) <= 5e-14\)`
			break
		}
	}
	return y
}

// compare is a three-way comparison within a relative tolerance: 0 when
// x and y agree to rel of the larger.
func compare(x, y, rel float64) int {
	d := x - y
	scale := rel * math.Max(math.Abs(x), math.Abs(y))
	switch {
	case d > scale:
		return 1
	case d < -scale:
		return -1
	}
	return 0
}

// settleLevel repeats a damped map until two passes compare equal through
// the comparator: its zero is a float test, and nothing caps the passes.
func settleLevel(y float64) float64 {
	p, prev := 1.0, 0.0
	for ok := true; ok; ok = compare(prev, p, 1e-12) != 0 { // want `iteration may never end: its only exits are float tests \(ok\)`
		prev = p
		p = y * math.Cos(p)
	}
	return p
}

// Bearing turns a mathematical angle (counter-clockwise from east) into a
// compass bearing (clockwise from north). The value entering the loop is
// the caller's angle moved by a constant, as large as the caller makes it:
// from 2^56 ≈ 7.21e16 on, adding 2π is absorbed and the loop never ends.
func Bearing(theta float64) float64 {
	b := math.Pi/2 - theta
	for {
		if b >= 0 { // want `range reduction by repeated addition of 2 \* math.Pi \(6.283185307179586\) takes \|b\|/6.28 passes and never ends once \|b\| >= 7.21e\+16`
			break
		}
		b += 2 * math.Pi
	}
	return b
}

// nearZero is a tolerance helper: |v| within the given tolerance, 1e-8 by
// default.
func nearZero(v float64, tol ...float64) bool {
	t := 1e-8
	if len(tol) > 0 {
		t = tol[0]
	}
	return math.Abs(v) <= t
}

// Expand writes x as a continued fraction. Its only exit asks a helper
// whether the fractional part is negligible; for most x the tail is
// rounding noise that never falls below 1e-8, and a NaN never does.
func Expand(x float64) []int {
	var terms []int
	r := x
	for {
		a, frac := math.Modf(r)
		terms = append(terms, int(a))
		if nearZero(frac) { // want `iteration may never end: its only exits are float tests \(nearZero\(frac\)\) and nothing caps the passes`
			break
		}
		r = 1 / frac
	}
	return terms
}

// invGolden is the golden-section factor, (√5 - 1)/2 ≈ 0.618.
var invGolden = (math.Sqrt(5) - 1) / 2

// Brightest searches a lamp's dimmer curve for its peak by golden
// section, tracking the bracket's width h analytically. A caller asking
// for full precision passes tol = 0: h shrinks to 4.9e-324, where
// 0.618·h rounds back to h (IEEE 754-2019 round to nearest), and
// h < 0 never holds.
func Brightest(glow func(float64) float64, lo, hi, tol float64) float64 {
	h := hi - lo
	c, d := lo+(1-invGolden)*h, lo+invGolden*h
	for {
		if h < tol { // want `loop scales h by a positive factor each pass and ends only when h < tol: a positive h stays positive \(it stops at 4.9e-324, where the product rounds back to it\), so the test never holds when a caller gives tol = 0, nor when h starts infinite or NaN, and nothing caps the passes`
			return (lo + hi) / 2
		}
		if glow(c) > glow(d) {
			hi = d
		} else {
			lo = c
		}
		h *= invGolden
		c, d = lo+(1-invGolden)*h, lo+invGolden*h
	}
}

// Settle halves a valve's travel until it is within the caller's
// tolerance, as the loop condition: halving reaches exactly 0, and
// 0 >= 0 keeps the loop going when tol = 0.
func Settle(travel, tol float64) float64 {
	n := 0.0
	for travel >= tol { // want `loop scales travel by a positive factor each pass and ends only when travel < tol: a positive travel stays positive \(it reaches exactly 0\), so the test never holds when a caller gives tol = 0`
		travel /= 2
		n++
	}
	return n
}

// Dullest runs a golden-section search while the width exceeds the
// caller's tolerance: it ends when h <= tol, but a width scaled by 0.618
// stops at 4.9e-324, where the product rounds back to it, never at 0.
func Dullest(glow func(float64) float64, lo, hi, tol float64) float64 {
	h := hi - lo
	for h > tol { // want `loop scales h by a positive factor each pass and ends only when h <= tol: a positive h stays positive \(it stops at 4.9e-324, where the product rounds back to it\), so the test never holds when a caller gives tol = 0`
		if glow(lo+(1-invGolden)*h) < glow(lo+invGolden*h) {
			hi = lo + invGolden*h
		} else {
			lo = hi - invGolden*h
		}
		h *= invGolden
	}
	return (lo + hi) / 2
}
