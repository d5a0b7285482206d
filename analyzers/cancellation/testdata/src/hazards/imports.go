package hazards

import m "math"

func renamed(x, s float64) float64 {
	r := m.Exp(x) * s
	return m.Log(1+x) * m.Sqrt(r*r+r*r) // want `math.Log\(1\+x\) returns 0` `math.Sqrt\(x\*x\+y\*y\) with x = r, y = r`
}
