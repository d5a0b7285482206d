package hazards

import "math"

// uncapped bisection: the tolerance test is the only exit.
func uncapped(f func(float64) float64, a, b float64) float64 {
	fa := f(a)
	for b-a > 1e-11 { // want `root finding may not terminate: its only exits are tolerance tests on x` `absolute x-tolerance 1e-11 in this root finding`
		m := a + (b-a)/2
		if fm := f(m); fa*fm <= 0 {
			b = m
		} else {
			a, fa = m, fm
		}
	}
	return a
}

// uncappedParam bisects to a tolerance its caller chooses, with no cap.
func uncappedParam(f func(float64) float64, a, b, tol float64) float64 { // want uncappedParam:"parameter 3 is an absolute x-tolerance of a root finding in uncappedParam"
	fa := f(a)
	for math.Abs(b-a) > tol { // want `root finding may not terminate`
		m := a + (b-a)/2
		if fm := f(m); fa*fm <= 0 {
			b = m
		} else {
			a, fa = m, fm
		}
	}
	return a
}

func callsUncapped(f func(float64) float64) float64 {
	return uncappedParam(f, 0, 1, 1e-12) // want `1e-12, passed as tol to uncappedParam \(an absolute x-tolerance of a root finding in uncappedParam\), is too tight: it ignores \|x\|`
}

// backtrack shrinks the step until sufficient decrease, with no floor or cap.
func backtrack(f func(float64) float64, x, d, g float64) float64 {
	t := 1.0
	fx := f(x)
	for f(x+t*d) > fx+1e-4*t*g*d { // want `backtracking loop shrinks the step until a sufficient-decrease test holds, with no floor on the step and no iteration cap`
		t *= 0.5
	}
	return t
}

// backtrackBreak leaves by a break on sufficient decrease.
func backtrackBreak(f func(float64) float64, x, d, slope float64) float64 {
	t := 1.0
	fx := f(x)
	for { // want `backtracking loop shrinks the step`
		if f(x+t*d) <= fx+1e-4*t*slope {
			break
		}
		t /= 2
	}
	return t
}
