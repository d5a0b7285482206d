// Package measures holds stopping tests whose measure of progress is not
// written as math.Abs(b-a): absolute values by other routes, scaled and
// tracked widths, differences of slice elements, tests kept in a flag.
package measures

import (
	"math"

	sm "single"
)

// magnitude is this package's own absolute value.
func magnitude(v float64) float64 {
	if v < 0 {
		return -v
	}
	return v
}

// bisectHelper measures the bracket with its own absolute value.
func bisectHelper(f func(float64) float64, lo, hi float64) float64 {
	for i := 0; i < 100; i++ {
		mid := lo + (hi-lo)/2
		if f(lo)*f(mid) <= 0 {
			hi = mid
		} else {
			lo = mid
		}
		if magnitude(hi-lo) < 1e-11 { // want `absolute x-tolerance 1e-11 in this root finding: it ignores \|x\|: from \|x\| = 6.55e\+04 on`
			break
		}
	}
	return lo
}

// bisectHalf stops on the half-width of the bracket: (hi-lo)/2 < 1e-11
// holds when hi-lo < 2e-11.
func bisectHalf(f func(float64) float64, lo, hi float64) float64 {
	for i := 0; i < 100; i++ {
		mid := 0.5 * (lo + hi)
		if f(lo)*f(mid) <= 0 {
			hi = mid
		} else {
			lo = mid
		}
		if (hi-lo)/2 < 1e-11 { // want `from \|x\| = 1.31e\+05 on, adjacent float64 values are more than 2e-11 apart`
			break
		}
	}
	return lo
}

// goldenSingle is a float32 golden-section search measured with the Abs
// of a float32 math library imported under another name.
func goldenSingle(f func(float32) float32, a, b float32) float32 {
	const g = 0.618034
	for i := 0; i < 200; i++ {
		c, d := b-g*(b-a), a+g*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if sm.Abs(b-a) < 1e-6 { // want `absolute x-tolerance 1e-6 in this minimization: comparing function values locates a minimum only to about sqrt\(eps\)·max\(1,\|x\|\) = 0.000345·max\(1,\|x\|\) in float32`
			break
		}
	}
	return (a + b) / 2
}

// goldenTracked tracks the width analytically: it shrinks by the golden
// ratio each pass, so the loop ends, but the last passes buy nothing.
func goldenTracked(f func(float64) float64, a, b float64) float64 {
	const g = 0.6180339887498949
	w := b - a
	for w > 1e-12 { // want `absolute step tolerance 1e-12 in this minimization`
		w *= g
		c, d := b-w, a+w
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
	}
	return (a + b) / 2
}

// heronFlag keeps its stopping test in a flag, with nothing else to end
// the loop: a NaN start never converges.
func heronFlag(f, df func(float64) float64, x float64) float64 {
	converged := false
	for !converged { // want `root finding may not terminate`
		next := x - f(x)/df(x)
		converged = math.Abs(next-x) < 1e-13 // want `absolute x-tolerance 1e-13 in this root finding`
		x = next
	}
	return x
}

// simplexEnds compares the ends of a sorted slice of points.
func simplexEnds(f func(float64) float64, pts []float64) float64 {
	for i := 0; i < 500; i++ {
		if f(pts[0]) < f(pts[2]) {
			pts[2] = (pts[0] + pts[2]) / 2
		} else {
			pts[0] = (pts[0] + pts[2]) / 2
		}
		if math.Abs(pts[2]-pts[0]) < 1e-12 { // want `absolute x-tolerance 1e-12 in this minimization`
			break
		}
	}
	return pts[0]
}

// brentLike keeps the half-width of its bracket in a variable, as Brent's
// zero finder does, and stops on it with an absolute tolerance.
func brentLike(f func(float64) float64, b, c float64) float64 {
	fb, fc := f(b), f(c)
	for i := 0; i < 100; i++ {
		if (fb > 0) == (fc > 0) {
			return b
		}
		half := 0.5 * (c - b)
		if math.Abs(half) <= 1e-12 || fb == 0 { // want `absolute x-tolerance 1e-12 in this root finding: it ignores \|x\|: from \|x\| = 1.64e\+04 on, adjacent float64 values are more than 2e-12 apart`
			return b
		}
		b, c = b+half, b
		fb, fc = f(b), fb
	}
	return b
}
