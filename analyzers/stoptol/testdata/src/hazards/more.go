package hazards

import "math"

// brentLike mixes parabolic steps and golden sections, comparing f values.
func brentLike(f func(float64) float64, a, b float64) float64 {
	x := a + invPhi*(b-a)
	w, v := x, x
	fx := f(x)
	fw, fv := fx, fx
	for iter := 0; iter < 100; iter++ {
		m := 0.5 * (a + b)
		if math.Abs(x-m) <= 1e-14 { // want `absolute x-tolerance 1e-14 in this minimization`
			break
		}
		u := x + invPhi*(b-x)
		if fw != fv {
			u = x - 0.5*((x-w)*(x-w)*(fx-fv)-(x-v)*(x-v)*(fx-fw))/((x-w)*(fx-fv)-(x-v)*(fx-fw))
		}
		fu := f(u)
		if fu <= fx {
			v, w, x = w, x, u
			fv, fw, fx = fw, fx, fu
		} else if u < x {
			a = u
		} else {
			b = u
		}
		m = 0
	}
	return x
}

// ternary compares f at two interior points.
func ternary(f func(float64) float64, lo, hi float64) float64 {
	for i := 0; i < 300; i++ {
		m1 := lo + (hi-lo)/3
		m2 := hi - (hi-lo)/3
		if f(m1) > f(m2) {
			lo = m1
		} else {
			hi = m2
		}
		if hi-lo < 1e-15 { // want `absolute x-tolerance 1e-15 in this minimization`
			break
		}
	}
	return lo
}

// dichotomous uses a relative tolerance scaled by |a|+|b|.
func dichotomous(f func(float64) float64, a, b float64) float64 {
	for i := 0; i < 100; i++ {
		m := (a + b) / 2
		if f(m-1e-9) < f(m+1e-9) {
			b = m
		} else {
			a = m
		}
		if b-a < 1e-11*(math.Abs(a)+math.Abs(b)) { // want `relative x-tolerance 1e-11 in this minimization`
			break
		}
	}
	return a
}

// bisect32 bisects float32 values with a tolerance below float32's sqrt(eps).
func bisect32(f func(float32) float32, a, b float32) float32 {
	for i := 0; i < 60; i++ {
		m := a + (b-a)/2
		if f(a)*f(m) < 0 {
			b = m
		} else {
			a = m
		}
		if b-a < 1e-5 { // want `absolute x-tolerance 1e-5 in this root finding: it ignores \|x\|: from \|x\| = 128 on, adjacent float32 values are more than 1e-05 apart`
			break
		}
	}
	return a
}

// secantUncapped stops only on the change between iterates.
func secantUncapped(f func(float64) float64, x0, x1 float64) float64 {
	f0, f1 := f(x0), f(x1)
	for math.Abs(x1-x0) > 1e-12 { // want `root finding may not terminate` `absolute x-tolerance 1e-12 in this root finding`
		x2 := x1 - f1*(x1-x0)/(f1-f0)
		x0, f0 = x1, f1
		x1, f1 = x2, f(x2)
	}
	return x1
}

// newtonField takes its step tolerance from settings.
type newtonSettings struct {
	StepTol float64 // want StepTol:"an absolute x-tolerance of a root finding in solve"
}

func (s newtonSettings) solve(f, df func(float64) float64, x float64) float64 {
	for i := 0; i < 40; i++ {
		dx := f(x) / df(x)
		x -= dx
		if math.Abs(dx) < s.StepTol {
			break
		}
	}
	return x
}

var defaultNewton = newtonSettings{StepTol: 1e-13} // want `1e-13, set as field StepTol \(an absolute x-tolerance of a root finding in solve\), is too tight: it ignores \|x\|`
