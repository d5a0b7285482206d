// Package hazards holds expressions that lose digits, or overflow, where
// the math package has an accurate form.
package hazards

import "math"

type point struct{ X, Y float64 }

func f(x float64) float64 { return x }

func logOnePlus(x float64) float64 {
	return math.Log(1 + x) // want `math.Log\(1\+x\) returns 0 for \|x\| below 5.55e-17, where 1\+x rounds to 1.*use math.Log1p\(x\)`
}

func logPlusOne(x float64) float64 {
	return math.Log(x + 1) // want `math.Log\(1\+x\) returns 0`
}

func logOneMinus(p float64) float64 {
	return math.Log(1 - p) // want `math.Log\(1-x\) with x = p returns 0 for \|x\| below 5.55e-17.*use math.Log1p\(-x\)`
}

func logOneMinusProduct(a, b float64) float64 {
	return math.Log(1 - a*b) // want `math.Log\(1-x\) with x = a \* b`
}

func logOneMinusNegative(a float64) float64 {
	return math.Log(1 - -a) // want `math.Log\(1-x\) with x = -a`
}

func logOnePlusSquare(z, nu float64) float64 {
	return math.Log(1 + z*z/nu) // want `math.Log\(1\+x\) with x = z \* z / nu`
}

func softplus(x float64) float64 {
	return math.Log(1 + math.Exp(x)) // want `math.Log\(1\+math.Exp\(y\)\) with y = x overflows to \+Inf for y above 709.783, where the result is about y, and returns 0 for y below -36.7`
}

func logFloatOne(x float64) float64 {
	return math.Log(1.0 + x) // want `math.Log\(1\+x\) returns 0`
}

func exponentialQuantile(p, rate float64) float64 {
	return -math.Log(1-p) / rate // want `math.Log\(1-x\) with x = p`
}

func weakPositive(x float64) float64 {
	if x > 0 { // bounds x away from 0 on no side
		return math.Log(1 + x) // want `math.Log\(1\+x\) returns 0`
	}
	return 0
}

func logStored(p, k float64) float64 {
	l := math.Log(1 - p) // want `math.Log\(1-x\) with x = p`
	return l / k
}

func expMinusOne(x float64) float64 {
	return math.Exp(x) - 1 // want `math.Exp\(x\)-1 returns 0 for \|x\| below 5.55e-17, where math.Exp\(x\) rounds to 1.*use math.Expm1\(x\)`
}

func survival(t, tau float64) float64 {
	return 1 - math.Exp(-t/tau) // want `1-math.Exp\(x\) with x = -t / tau returns 0.*use -math.Expm1\(x\)`
}

func variance(s2, m float64) float64 {
	return (math.Exp(s2) - 1) * m // want `math.Exp\(x\)-1 with x = s2`
}

func spread(s2 float64) float64 {
	return math.Sqrt(math.Exp(s2) - 1) // want `math.Exp\(x\)-1 with x = s2`
}

func versine(theta float64) float64 {
	return 1 - math.Cos(theta) // want `1-math.Cos\(x\) with x = theta returns 0 for \|x\| below 1.05e-08, where math.Cos\(x\) rounds to 1.*use 2\*math.Sin\(x/2\)\*math.Sin\(x/2\)`
}

func cosMinusOne(x float64) float64 {
	return math.Cos(x) - 1 // want `math.Cos\(x\)-1 returns 0.*use -2\*math.Sin\(x/2\)\*math.Sin\(x/2\)`
}

func taper(w, t float64) float64 {
	return 0.5 * (1 - math.Cos(w*t)) // want `1-math.Cos\(x\) with x = w \* t`
}

func taperSum(a, b float64) float64 {
	return 1 - math.Cos(a+b) // want `1-math.Cos\(x\) with x = a \+ b`
}

func versineOfCall(x float64) float64 {
	return 1 - math.Cos(f(x)) // want `1-math.Cos\(x\) with x = f\(x\)`
}

func norm(x, y, s float64) float64 {
	return math.Sqrt(x/s*(x/s) + y*y) // want `math.Sqrt\(x\*x\+y\*y\) with x = x / s overflows to \+Inf once \|x\| or \|y\| exceeds 1.34e\+154 and loses precision below 1.49e-154.*use math.Hypot\(x, y\)`
}

func length(p point, t float64) float64 {
	e := math.Exp(t)
	return math.Sqrt(p.X*e*(p.X*e) + p.Y*p.Y) // want `math.Sqrt\(x\*x\+y\*y\) with x = p.X \* e, y = p.Y`
}

func distance(a, b, c float64) float64 {
	return math.Sqrt((a-b)*(a-b) + math.Pow(c, 3)*math.Pow(c, 3)) // want `with x = a - b, y = math.Pow\(c, 3\) overflows`
}

func logSumExp(a, b float64) float64 {
	return math.Log(math.Exp(a) + math.Exp(b)) // want `math.Log\(math.Exp\(a\)\+math.Exp\(b\)\) overflows to \+Inf once a or b exceeds 709.783 and gives -Inf once both are below -745.133`
}

func logSumExpScaled(u, v float64) float64 {
	return 2 * math.Log(math.Exp(u)+math.Exp(v)) // want `with a = u, b = v overflows`
}

func logSumExpOfCall(a, b float64) float64 {
	return math.Log(math.Exp(f(a)) + math.Exp(b)) // want `with a = f\(a\) overflows`
}

func inClosure(xs []float64) {
	g := func(x float64) float64 {
		return math.Log(1 + x) // want `math.Log\(1\+x\) returns 0`
	}
	for i := range xs {
		xs[i] = g(xs[i])
	}
}

func survivalStored(x float64) float64 {
	q := 1 - math.Exp(-x) // want `1-math.Exp\(x\) with x = -x`
	return q
}

// growthRatio divides by the same slope outside an iteration: its lost
// digits are the result's.
func growthRatio(a, t float64) float64 {
	slope := math.Exp(t) - 1 // want `math.Exp\(x\)-1 with x = t`
	return a / slope
}

// An overdispersed count's log-likelihood term, log(1+a·m)/a: it tends to
// m as the dispersion a shrinks, so it is not small in the sum, while the
// rounding of 1+a·m, divided by a, grows as u/a.
func overdispersed(y, a, m float64) float64 {
	v := y * math.Log(a*m)
	v -= math.Log(1+a*m) / a // want `math.Log\(1\+x\) with x = a \* m returns 0`
	return v
}
