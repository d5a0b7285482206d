package hazards

import "math"

// The complement of t²/(t²+ν) for large t: the quotient is within a
// rounding of 1, and the power raises the relative error to the h-th.
func tailFactor(t, nu, h float64) float64 {
	x := t * t / (t*t + nu)
	return math.Pow(1-x, h) // want `1 - a/\(a\+b\) with a = t \* t, b = nu loses about log10\(\|a\|/\|b\|\) digits.*use b/\(a\+b\)`
}

func survivalOdds(e float64) float64 {
	return 1 / (1 - 1/(1+e)) // want `1 - a/\(a\+b\) with a = 1, b = e loses`
}
