// Package fd stands in for gonum's diff/fd in these tests: the shape of
// its API (settings that may leave the step to the formula) and the Step
// of its formulas, without its stencils.
package fd

// Formula is a finite-difference formula with its default step.
type Formula struct {
	Derivative int
	Step       float64
}

// The formulas and their default steps.
var (
	Forward    = Formula{Derivative: 1, Step: 2e-8}
	Central    = Formula{Derivative: 1, Step: 6e-6}
	Central2nd = Formula{Derivative: 2, Step: 1e-4}
)

// Settings choose the formula and the step; zero values leave them to
// the function.
type Settings struct {
	Formula    Formula
	Step       float64
	Concurrent bool
}

// JacobianSettings are Settings for Jacobian.
type JacobianSettings struct {
	Formula    Formula
	Step       float64
	Concurrent bool
}

// Derivative stands for the derivative of f at x.
func Derivative(f func(float64) float64, x float64, settings *Settings) float64 { return 0 }

// Gradient stands for the gradient of f at x.
func Gradient(dst []float64, f func([]float64) float64, x []float64, settings *Settings) []float64 {
	return dst
}

// Jacobian stands for the Jacobian of f at x.
func Jacobian(dst [][]float64, f func(y, x []float64), x []float64, settings *JacobianSettings) {}
