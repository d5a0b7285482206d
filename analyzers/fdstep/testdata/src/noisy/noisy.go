// Package noisy differentiates a function that carries only six digits.
package noisy

import "math"

// simulate runs a model whose results are good to about 1e-6 relative.
//
//roundoff:noise 1e-6
func simulate(x float64) float64 { return x * x }

// exact is the same function, computed to machine precision.
func exact(x float64) float64 { return x * x }

func slopeNoisy(x float64) float64 {
	h := math.Sqrt(0x1p-52) * math.Max(1, math.Abs(x))
	return (simulate(x+h) - simulate(x)) / h // want `forward-difference step 1.4901161193847656e-08·max\(1,\|x\|\) is too small: expected error ~1.3e\+02 at this step against ~0.0025 at h = sqrt\(eps\)·max\(1,\|x\|\) ≈ 0.001·max\(1,\|x\|\) with eps the function's declared noise 1e-06`
}

func slopeExact(x float64) float64 {
	h := math.Sqrt(0x1p-52) * math.Max(1, math.Abs(x))
	return (exact(x+h) - exact(x)) / h // the machine-precision step suits a clean function
}

func slopeNoisyScaled(x float64) float64 {
	h := math.Sqrt(1e-6) * math.Max(1, math.Abs(x))
	h = (x + h) - x
	return (simulate(x+h) - simulate(x)) / h // the step for the declared noise
}
