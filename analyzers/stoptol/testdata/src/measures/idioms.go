package measures

import "math"

// ramp is not an absolute value (it is 0 for negative v): a test on it
// is not read as one.
func ramp(v float64) float64 {
	if v < 0 {
		return 0
	}
	return v
}

func bisectRamp(f func(float64) float64, lo, hi float64) float64 {
	for i := 0; i < 100; i++ {
		mid := lo + (hi-lo)/2
		if f(lo)*f(mid) <= 0 {
			hi = mid
		} else {
			lo = mid
		}
		if ramp(hi-lo) < 1e-11 { // not a measure: ramp is not |x|
			break
		}
	}
	return lo
}

// newtonSigned compares successive Newton iterates without an absolute
// value: x1-x0 is a signed step, not a width, and is not read as one.
func newtonSigned(f, df func(float64) float64, x0 float64) float64 {
	x1 := x0
	for i := 0; i < 50; i++ {
		x0, x1 = x1, x1-f(x1)/df(x1)
		if x1-x0 < 1e-13 { // a signed difference: not a measure of progress
			break
		}
	}
	return x1
}

// backtrackMultiplier shrinks a step multiplier that starts at 1: it is
// relative to the direction d, not a length in x, so its floor is no
// x-tolerance.
func backtrackMultiplier(f func(float64) float64, x, d float64) float64 {
	t := 1.0
	for i := 0; i < 60; i++ {
		if f(x+t*d) < f(x) {
			return t
		}
		t *= 0.5
		if t < 1e-12 { // a multiplier, not a width
			break
		}
	}
	return 0
}

// goldenLoose tracks the width to a tolerance the method can meet.
func goldenLoose(f func(float64) float64, a, b float64) float64 {
	const g = 0.6180339887498949
	for w := b - a; w > 1e-6; w *= g { // at or above sqrt(eps)
		c, d := b-w, a+w
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
	}
	return math.Min(a, b)
}
