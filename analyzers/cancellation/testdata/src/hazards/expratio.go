package hazards

import "math"

// The logistic density through e = exp(-z): for z below -709.78 both e
// and (1+e)² overflow.
func logisticDensity(x, mu, s float64) float64 {
	e := math.Exp(-(x - mu) / s)
	return e / (s * (1 + e) * (1 + e)) // want `e/\(…\(1\+e\)…\) with e = math.Exp\(-\(x - mu\) / s\) is ∞/∞ = NaN once the exponent exceeds 709.783`
}

// A hyperbolic tangent written through e = exp(-2x): for x below -354.9, e
// overflows and (1-e)/(1+e) is -Inf/+Inf = NaN, where tanh is -1.
func damping(x float64) float64 {
	return (1 - math.Exp(-2*x)) / (1 + math.Exp(-2*x)) // want `\(1-e\)/\(…\(1\+e\)…\) with e = math.Exp\(-2 \* x\) is ∞/∞ = NaN once the exponent exceeds 709.783` `1-math.Exp\(x\) with x = -2 \* x returns 0`
}
