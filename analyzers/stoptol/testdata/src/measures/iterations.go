package measures

import "math"

// Iterations in other algebraic forms.

// heronCapped is Newton's method for sqrt(a) rearranged (Heron's rule):
// it converges to a few ulps of x, so an absolute 1e-12 fails from
// |x| = 2^13 on, where float64 values are 1.8e-12 apart.
func heronCapped(a float64) float64 {
	x := a
	for i := 0; i < 60; i++ {
		next := (x + a/x) / 2
		if math.Abs(next-x) < 1e-12 { // want `absolute x-tolerance 1e-12 in this fixed-point iteration: it ignores \|x\|: from \|x\| = 8.19e\+03 on`
			return next
		}
		x = next
	}
	return x
}

// corrector applies the trapezoidal corrector until it settles: a
// fixed-point iteration in y.
func corrector(f func(float64) float64, y0, h float64) float64 {
	y := y0 + h*f(y0)
	for i := 0; i < 30; i++ {
		yc := y0 + h/2*(f(y0)+f(y))
		if math.Abs(yc-y) < 1e-14 { // want `absolute x-tolerance 1e-14 in this fixed-point iteration`
			return yc
		}
		y = yc
	}
	return y
}

// vertexSearch steps to the vertex of the parabola through three points:
// a minimization, which locates x only to sqrt(eps) relative.
func vertexSearch(f func(float64) float64, a, b, c float64) float64 {
	fa, fb, fc := f(a), f(b), f(c)
	for i := 0; i < 40; i++ {
		p, q := (b-a)*(fb-fc), (b-c)*(fb-fa)
		x := b - ((b-a)*p-(b-c)*q)/(2*(p-q))
		a, b, c = b, c, x
		fa, fb, fc = fb, fc, f(x)
		if math.Abs(c-b) < 1e-12 { // want `absolute x-tolerance 1e-12 in this minimization`
			break
		}
	}
	return c
}

// heronScaled stops relative to |x| at a few ulps: attainable.
func heronScaled(a float64) float64 {
	x := a
	for i := 0; i < 60; i++ {
		next := (x + a/x) / 2
		if math.Abs(next-x) <= 4*0x1p-52*math.Abs(next) { // a few ulps of x: a fixed point gets there
			return next
		}
		x = next
	}
	return x
}

// average folds data into a running mean: linear in x, not an iteration
// that converges to a point.
func average(xs []float64) float64 {
	m := xs[0]
	for i := 1; i < len(xs); i++ {
		prev := m
		m = (m + xs[i]) / 2
		if math.Abs(m-prev) < 1e-12 { // not a fixed-point iteration
			break
		}
	}
	return m
}
