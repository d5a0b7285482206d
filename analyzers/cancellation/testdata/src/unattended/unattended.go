// Package unattended holds one hazard with a safe fix and two whose fixes
// need review; under go fix only the first is applied.
package unattended

import "math"

func both(x, a, b float64) (float64, float64, float64) {
	return math.Log(1 + x), math.Log(math.Exp(a) + math.Exp(b)), math.Sqrt(a*a + b*b) // want `math.Log\(1\+x\) returns 0` `math.Log\(math.Exp\(a\)\+math.Exp\(b\)\) overflows` `math.Sqrt\(x\*x\+y\*y\) with x = a, y = b overflows`
}
