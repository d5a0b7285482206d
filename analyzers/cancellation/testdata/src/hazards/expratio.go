package hazards

import "math"

// The logistic density through e = exp(-z): for z below -709.78 both e
// and (1+e)² overflow.
func logisticDensity(x, mu, s float64) float64 {
	e := math.Exp(-(x - mu) / s)
	return e / (s * (1 + e) * (1 + e)) // want `e/\(…\(1\+e\)…\) with e = math.Exp\(-\(x - mu\) / s\) is \+Inf/\+Inf = NaN once the exponent exceeds 709.783`
}
