package hazards

import "math"

// move2 stores c and d through a and b, as code ported from C shifts the
// points of a search with a helper.
func move2(a, b *float64, c, d float64) {
	*a = c
	*b = d
}

// goldenShift is a golden-section minimization whose best point and its
// value move through move2: the loop still compares function values
// (fu < fx, fx set only by the helper), so the relative tolerance 1e-12, below
// sqrt(eps), is asked of a minimization (Brent 1973, ch. 5).
func goldenShift(f func(float64) float64, a, b float64) float64 {
	const golden = 0.3819660112501051
	var x, fx, u, fu float64
	x0 := a + golden*(b-a)
	move2(&x, &fx, x0, f(x0))
	for it := 0; it < 500; it++ {
		xm := 0.5 * (a + b)
		tol1 := 1e-12*math.Abs(x) + 1e-30
		if math.Abs(x-xm) <= 2*tol1-0.5*(b-a) { // want `relative x-tolerance 1e-12 in this minimization`
			break
		}
		if x >= xm {
			u = x + golden*(a-x)
		} else {
			u = x + golden*(b-x)
		}
		fu = f(u)
		if fu < fx {
			if u >= x {
				a = x
			} else {
				b = x
			}
			move2(&x, &fx, u, fu)
		} else if u < x {
			a = u
		} else {
			b = u
		}
	}
	return x
}
