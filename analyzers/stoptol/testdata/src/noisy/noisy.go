// Package noisy minimizes an objective that carries only six digits.
package noisy

import "math"

// simulate runs a model whose results are good to about 1e-6 relative.
//
//roundoff:noise 1e-6 the integrator's relative tolerance
func simulate(x float64) float64 { return 1 + (x-2)*(x-2) }

// exact is the same objective, computed to machine precision.
func exact(x float64) float64 { return 1 + (x-2)*(x-2) }

func tuneNoisy(a, b float64) float64 {
	for i := 0; i < 100; i++ {
		c, d := b-0.618*(b-a), a+0.618*(b-a)
		if simulate(c) < simulate(d) {
			b = d
		} else {
			a = c
		}
		if math.Abs(b-a) < 1e-7 { // want `absolute x-tolerance 1e-7 in this minimization: comparing values of a function accurate only to 1e-06 relative locates a minimum only to about sqrt\(1e-06\)·max\(1,\|x\|\) = 0.001·max\(1,\|x\|\) \(Gill, Murray & Wright 1981\)`
			break
		}
	}
	return a
}

func tuneExact(a, b float64) float64 {
	for i := 0; i < 100; i++ {
		c, d := b-0.618*(b-a), a+0.618*(b-a)
		if exact(c) < exact(d) {
			b = d
		} else {
			a = c
		}
		if math.Abs(b-a) < 1e-7 { // the same test on a clean objective is fine
			break
		}
	}
	return a
}
