package hazards

import m "math"

func renamed(x float64) float64 {
	return m.Log(1+x) * m.Sqrt(x*x+x*x) // want `math.Log\(1\+x\) returns 0` `math.Sqrt\(x\*x\+y\*y\) with y = x`
}
