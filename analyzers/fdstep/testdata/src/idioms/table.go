package idioms

import "math"

type weightedTap struct{ Offset, Weight float64 }

type stencilRule struct {
	Taps []weightedTap
	Step float64
}

var forwardRule = stencilRule{Taps: []weightedTap{{0, -1}, {1, 1}}, Step: 1.5e-8}

// The rule's step scaled to x: not fixed.
func scaledTable(f func(float64) float64, x float64, r stencilRule) float64 {
	h := r.Step * math.Max(1, math.Abs(x))
	var sum float64
	for _, t := range r.Taps {
		sum += t.Weight * f(x+h*t.Offset)
	}
	return sum / h
}

// A quadrature rule: nodes from a table, but the sum is multiplied by the
// half-width, not divided by it; no derivative is taken.
func gaussRule(f func(float64) float64, a, b float64, nodes, weights []float64) float64 {
	mid, half := (a+b)/2, (b-a)/2
	var sum float64
	for i, t := range nodes {
		sum += weights[i] * f(mid+half*t)
	}
	return sum * half
}

func useRules(x float64) float64 {
	return scaledTable(math.Sin, x, forwardRule) + gaussRule(math.Sin, 0, 1, []float64{0}, []float64{2})
}
