package hazards

import "math"

// bisect uses an absolute tolerance below sqrt(eps) that ignores |x|.
func bisect(f func(float64) float64, a, b float64) float64 {
	fa := f(a)
	for i := 0; i < 200; i++ {
		m := a + (b-a)/2
		fm := f(m)
		if fa*fm <= 0 {
			b = m
		} else {
			a, fa = m, fm
		}
		if b-a < 1e-10 { // want `absolute x-tolerance 1e-10 in this root finding: it ignores \|x\|: from \|x\| = 5.24e\+05 on, adjacent float64 values are more than 1e-10 apart and the test can never pass; scale it with \|x\|`
			break
		}
	}
	return a
}

// bisectSignbit tells signs apart with math.Signbit.
func bisectSignbit(f func(float64) float64, a, b float64) float64 {
	for i := 0; i < 100; i++ {
		m := a + (b-a)/2
		if math.Signbit(f(m)) == math.Signbit(f(a)) {
			a = m
		} else {
			b = m
		}
		if math.Abs(b-a) < 1e-12 { // want `absolute x-tolerance 1e-12 in this root finding: it ignores \|x\|: from \|x\| = 8.19e\+03 on`
			break
		}
	}
	return a
}

// newton stops on an absolute step.
func newton(f, df func(float64) float64, x float64) float64 {
	for i := 0; i < 50; i++ {
		dx := f(x) / df(x)
		x -= dx
		if math.Abs(dx) < 1e-14 { // want `absolute step tolerance 1e-14 in this root finding: it ignores \|x\|`
			break
		}
	}
	return x
}

// newtonRel stops on a relative step below the unit roundoff.
func newtonRel(f, df func(float64) float64, x float64) float64 {
	for i := 0; i < 50; i++ {
		dx := f(x) / df(x)
		x -= dx
		if math.Abs(dx) < 1e-17*math.Abs(x) { // want `relative step tolerance 1e-17 in this root finding: a step below the unit roundoff of float64 \(1.11e-16\) relative to \|x\| cannot be resolved`
			break
		}
	}
	return x
}

// secant compares successive iterates.
func secant(f func(float64) float64, x0, x1 float64) float64 {
	f0, f1 := f(x0), f(x1)
	for i := 0; i < 100; i++ {
		x2 := x1 - f1*(x1-x0)/(f1-f0)
		x0, f0 = x1, f1
		x1, f1 = x2, f(x2)
		if math.Abs(x1-x0) < 1e-13 { // want `absolute x-tolerance 1e-13 in this root finding`
			break
		}
	}
	return x1
}

// signProduct uses a sign comparison of two tests.
func signProduct(f func(float64) float64, lo, hi float64) float64 {
	for i := 0; i < 80; i++ {
		mid := lo + (hi-lo)/2
		if (f(mid) > 0) == (f(lo) > 0) {
			lo = mid
		} else {
			hi = mid
		}
		if hi-lo <= 1e-9 { // want `absolute x-tolerance 1e-9 in this root finding: it ignores \|x\|: from \|x\| = 8.39e\+06 on`
			return mid
		}
	}
	return lo
}
