// Package fdlib differentiates with steps its callers choose.
package fdlib

// Settings configures Derivative.
type Settings struct {
	Step float64 // want Step:"fdstep\\(central step of Derivative\\)"
	Iter int
}

// Derivative estimates f'(x) by central differences with s.Step.
func Derivative(f func(float64) float64, x float64, s Settings) float64 {
	return (f(x+s.Step) - f(x-s.Step)) / (2 * s.Step)
}

// Forward estimates f'(x) by a forward difference with step h.
func Forward(f func(float64) float64, x, h float64) float64 { // want Forward:"fdstep\\(forward step of Forward\\)"
	return (f(x+h) - f(x)) / h
}

// Curvature estimates f”(x) with step h.
func Curvature(f func(float64) float64, x, h float64) float64 { // want Curvature:"fdstep\\(second step of Curvature\\)"
	return (f(x+h) - 2*f(x) + f(x-h)) / (h * h)
}
