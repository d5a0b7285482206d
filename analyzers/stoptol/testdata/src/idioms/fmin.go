package idioms

import "math"

// Brent's fmin as Brent 1973 (ch. 5) writes its test: the relative part of
// tol1 is sqrt(eps), what comparing function values can resolve, and the
// caller's absolute tol only floors it near 0. Nothing to report.
func fminAttainable(f func(float64) float64, a, b, tol float64) float64 {
	const golden = 0.3819660112501051
	sqrtEps := math.Sqrt(0x1p-52)
	var x, fx, xm, u, fu float64
	x = a + golden*(b-a)
	fx = f(x)
	for it := 0; it < 200; it++ {
		xm = 0.5 * (a + b)
		tol1 := sqrtEps*math.Abs(x) + tol/3
		tol2 := 2 * tol1
		if math.Abs(x-xm) <= tol2-0.5*(b-a) {
			break
		}
		if x >= xm {
			u = x + golden*(a-x)
		} else {
			u = x + golden*(b-x)
		}
		fu = f(u)
		if fu <= fx {
			if u >= x {
				a = x
			} else {
				b = x
			}
			x, fx = u, fu
		} else if u < x {
			a = u
		} else {
			b = u
		}
	}
	return x
}

// A zero finder's mixed test, 2·eps·|b| + tol/2 (Brent's zeroin): sign
// changes locate a root to a few ulps, and the relative part scales with
// |b|. Nothing to report.
func zeroinTest(f func(float64) float64, a, b, tol float64) float64 {
	fa, fb := f(a), f(b)
	for it := 0; it < 200; it++ {
		m := 0.5 * (a + b)
		tol1 := 2*0x1p-52*math.Abs(b) + 0.5*tol
		if math.Abs(b-m) <= tol1 {
			return b
		}
		fm := f(m)
		if (fm < 0) == (fa < 0) {
			a, fa = m, fm
		} else {
			b, fb = m, fm
		}
	}
	_ = fb
	return b
}
