// Package fdclient differentiates a reservoir model through the
// finite-difference package's defaults.
package fdclient

import "gonum.org/v1/gonum/diff/fd"

// slopes leaves formula and step to Gradient: the forward formula's fixed
// step for every level, however deep the reservoir.
func slopes(inflow func([]float64) float64, levels []float64) []float64 {
	return fd.Gradient(nil, inflow, levels, nil) // want `fixed forward-difference step 2e-08 \(the Step of fd.Forward, which fd.Gradient takes when its settings give none\) does not scale with x: x\+h rounds to x for \|x\| ≥ 2.68e\+08`
}

// sensitivity picks the central formula but no step.
func sensitivity(dst [][]float64, model func(y, x []float64), state []float64) {
	fd.Jacobian(dst, model, state, &fd.JacobianSettings{ // want `fixed central-difference step 6e-06 \(the Step of fd.Central, which fd.Jacobian takes when its settings give none\)`
		Formula:    fd.Central,
		Concurrent: true,
	})
}

// At a constant point of unit size the default step is right: left alone.
func unitSlope(head func(float64) float64) float64 {
	return fd.Derivative(head, 1, nil)
}

// Steps the caller gives, and settings built elsewhere, are the caller's.
func scaled(inflow func([]float64) float64, levels []float64, scale float64, s *fd.Settings) {
	fd.Gradient(nil, inflow, levels, &fd.Settings{Step: 1e-6 * scale})
	fd.Gradient(nil, inflow, levels, s)
}
