// Package fduser passes fixed steps to another package's difference
// quotients; fdstep learns of them through facts.
package fduser

import (
	"math"

	"fdlib"
)

func forward(x float64) float64 {
	return fdlib.Forward(math.Sin, x, 1e-8) // want `fixed forward-difference step 1e-08 \(passed as h to Forward\) does not scale with x: x\+h rounds to x for \|x\| ≥ 1.34e\+08`
}

func curvature(x float64) float64 {
	return fdlib.Curvature(math.Sin, x, 1e-6) // want `fixed second-difference step 1e-06 \(passed as h to Curvature\) is too small: expected error ~0.00089 at this step against ~6.1e-08`
}

func settings(x float64) float64 {
	s := fdlib.Settings{Step: 1e-9, Iter: 3} // want `fixed central-difference step 1e-09 \(stored in field Step, read by Derivative\) is too small: expected error ~2.2e-07`
	return fdlib.Derivative(math.Sin, x, s)
}

func scaled(x float64) float64 {
	return fdlib.Forward(math.Sin, x, 1.5e-8*math.Max(1, math.Abs(x))) // scaled: left alone
}

func atUnit() float64 {
	return fdlib.Forward(math.Sin, 1, 1.5e-8) // x is 1 and the step near sqrt(eps): left alone
}
