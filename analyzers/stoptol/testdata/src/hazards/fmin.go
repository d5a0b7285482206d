package hazards

import "math"

// A minimizer in the form of Brent's fmin (Brent 1973, ch. 5), its
// variables declared first as code ported from C does: the stopping test
// |x - xm| <= tol2 - (b-a)/2 with tol1 = rel·|x| + floor and tol2 = 2·tol1
// asks for x to a relative 1e-10, which comparing function values cannot
// give (it locates x to about sqrt(eps)·max(1,|x|)).
func fmin(f func(float64) float64, a, b float64) float64 {
	const golden = 0.3819660112501051
	var x, w, v, fx, fw, fv, d, e, xm, tol1, tol2, u, fu float64
	x = a + golden*(b-a)
	w, v = x, x
	fx = f(x)
	fw, fv = fx, fx
	for it := 0; it < 200; it++ {
		xm = 0.5 * (a + b)
		tol1 = 1e-10*math.Abs(x) + 1e-20
		tol2 = 2 * tol1
		if math.Abs(x-xm) <= tol2-0.5*(b-a) { // want `relative x-tolerance 1e-10 in this minimization: comparing function values locates a minimum only to about sqrt\(eps\)·max\(1,\|x\|\) = 1.49e-08·max\(1,\|x\|\)`
			break
		}
		if x >= xm {
			e = a - x
		} else {
			e = b - x
		}
		d = golden * e
		u = x + d
		fu = f(u)
		if fu <= fx {
			if u >= x {
				a = x
			} else {
				b = x
			}
			v, fv = w, fw
			w, fw = x, fx
			x, fx = u, fu
		} else {
			if u < x {
				a = u
			} else {
				b = u
			}
			if fu <= fw || w == x {
				v, fv = w, fw
				w, fw = u, fu
			} else if fu <= fv || v == x || v == w {
				v, fv = u, fu
			}
		}
	}
	_ = fv
	return x
}
