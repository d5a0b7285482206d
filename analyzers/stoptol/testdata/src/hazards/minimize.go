// Package hazards holds stopping tests that the method cannot meet.
package hazards

import "math"

const invPhi = 0.6180339887498949

// goldenAbs is a golden-section search with an absolute tolerance below sqrt(eps).
func goldenAbs(f func(float64) float64, a, b float64) float64 {
	for i := 0; i < 200; i++ {
		c := b - invPhi*(b-a)
		d := a + invPhi*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if math.Abs(b-a) < 1e-12 { // want `absolute x-tolerance 1e-12 in this minimization: comparing function values locates a minimum only to about sqrt\(eps\)·max\(1,\|x\|\) = 1.49e-08·max\(1,\|x\|\) in float64 \(Brent 1973\)`
			break
		}
	}
	return (a + b) / 2
}

// goldenCond stops in the loop condition, on a bare width.
func goldenCond(f func(float64) float64, a, b float64) float64 {
	for n := 0; b-a > 1e-10 && n < 500; n++ { // want `absolute x-tolerance 1e-10 in this minimization`
		c := b - invPhi*(b-a)
		d := a + invPhi*(b-a)
		fc, fd := f(c), f(d)
		if fc < fd {
			b = d
		} else {
			a = c
		}
	}
	return (a + b) / 2
}

const xtol = 1e-11

// goldenNamed takes its tolerance from a named constant.
func goldenNamed(f func(float64) float64, a, b float64) float64 {
	for i := 0; i < 100; i++ {
		c, d := b-invPhi*(b-a), a+invPhi*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if b-a < xtol { // want `absolute x-tolerance xtol \(1e-11\) in this minimization`
			return a
		}
	}
	return a
}

// goldenRel uses a relative tolerance below sqrt(eps).
func goldenRel(f func(float64) float64, a, b float64) float64 {
	for i := 0; i < 100; i++ {
		c, d := b-invPhi*(b-a), a+invPhi*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if math.Abs(b-a) <= 1e-12*math.Abs(b) { // want `relative x-tolerance 1e-12 in this minimization`
			break
		}
	}
	return a
}

// parabolic steps by parabolic interpolation, comparing function values.
func parabolic(f func(float64) float64, x0, x1, x2 float64) float64 {
	f0, f1, f2 := f(x0), f(x1), f(x2)
	for i := 0; i < 50; i++ {
		num := (x1-x0)*(x1-x0)*(f1-f2) - (x1-x2)*(x1-x2)*(f1-f0)
		den := (x1-x0)*(f1-f2) - (x1-x2)*(f1-f0)
		step := 0.5 * num / den
		xn := x1 - step
		fn := f(xn)
		if fn < f1 {
			x0, x2 = x1, x0
			f0, f2 = f1, f0
			x1, f1 = xn, fn
		}
		if math.Abs(step) < 1e-13 { // want `absolute step tolerance 1e-13 in this minimization`
			break
		}
	}
	return x1
}

// float32 minimization: sqrt(eps) of float32 is 3.45e-4.
func golden32(f func(float32) float32, a, b float32) float32 {
	for i := 0; i < 60; i++ {
		c, d := b-0.618*(b-a), a+0.618*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if b-a < 1e-6 { // want `absolute x-tolerance 1e-6 in this minimization: comparing function values locates a minimum only to about sqrt\(eps\)·max\(1,\|x\|\) = 0.000345·max\(1,\|x\|\) in float32`
			break
		}
	}
	return a
}
