package hazards

import "math"

// A stencil given as a table of offsets and weights, with its own step.
type tableTap struct{ Offset, Weight float64 }

type tableRule struct {
	Taps  []tableTap
	Order int
	Step  float64
}

var centralRule = tableRule{Taps: []tableTap{{-1, -0.5}, {1, 0.5}}, Order: 1, Step: 1e-6}

// applyTable takes the rule's step unless the caller gives one.
func applyTable(f func(float64) float64, x float64, r tableRule, step float64) float64 {
	h := r.Step
	if step != 0 {
		h = step
	}
	var sum float64
	for _, t := range r.Taps {
		sum += t.Weight * f(x+h*t.Offset) // want `fixed stencil step 1e-06 does not scale with x: x\+h rounds to x for \|x\| ≥ 1.72e\+10 in float64, where the difference vanishes; scale it as r·max\(1,\|x\|\)`
	}
	return sum / math.Pow(h, float64(r.Order))
}

// tableGradient perturbs one element of a copy per tap.
func tableGradient(f func([]float64) float64, x []float64, r tableRule) []float64 {
	g := make([]float64, len(x))
	xc := make([]float64, len(x))
	for i := range x {
		for _, t := range r.Taps {
			copy(xc, x)
			xc[i] += t.Offset * r.Step // want `fixed stencil step 1e-06 does not scale with x`
			g[i] += t.Weight * f(xc)
		}
		g[i] /= r.Step
	}
	return g
}

func useTable(x float64) float64 { return applyTable(math.Exp, x, centralRule, 0) }
