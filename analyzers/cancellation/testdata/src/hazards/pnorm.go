package hazards

import "math"

// A p-norm without scaling: for p = 10 a component of 1e31 already
// overflows its power.
func pNorm(v []float64, p float64) float64 {
	var s float64
	for _, x := range v {
		s += math.Pow(math.Abs(x), p) // want `math.Pow\(x, p\) summed for the root math.Pow\(s, 1/p\) overflows to \+Inf once a term's base exceeds MaxFloat64\^\(1/p\) \(5.64e\+102 for p = 3, 6.69e\+30 for p = 10\)`
	}
	return math.Pow(s, 1/p)
}
