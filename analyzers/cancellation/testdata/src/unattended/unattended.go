// Package unattended holds hazards with safe fixes and others whose fixes
// need review; under go fix only the safe ones are applied.
package unattended

import "math"

func both(x, a, b float64) (float64, float64, float64) {
	return math.Log(1 + x), math.Log(math.Exp(a) + math.Exp(b)), math.Sqrt(a/x*(a/x) + b*b) // want `math.Log\(1\+x\) returns 0` `math.Log\(math.Exp\(a\)\+math.Exp\(b\)\) overflows` `math.Sqrt\(x\*x\+y\*y\) with x = a / x, y = b overflows`
}

func more(x, r, t float64) (float64, float64, float64) {
	return math.Log(x + math.Sqrt(x*x+1)), math.Log10(1 + x), 1 - math.Pow(r, t) // want `math.Log\(x \+ math.Sqrt` `math.Log10\(1\+x\)` `1-math.Pow\(a, b\)`
}
