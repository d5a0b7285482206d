// Package kiln plans firing schedules; some of its results pass through
// interfaces and function values, whose bodies a caller cannot see.
package kiln

import "math"

// Element is a heating element.
type Element interface{ Watts() float64 }

// Coil is an element of fixed output.
type Coil struct{ W float64 }

// Watts returns the coil's output.
func (c Coil) Watts() float64 { return c.W }

// Load sums the elements' outputs, read through the interface.
func Load(es []Element) float64 {
	s := 0.0
	for _, e := range es {
		s += e.Watts()
	}
	return s
}

// Step applies a ramp rule given as a function value and takes a third.
func Step(rule func(float64) float64, t float64) float64 { return rule(t) / 3 }

// Glow is the radiance ratio at t degrees: an exponential.
func Glow(t float64) float64 { return math.Exp(t / 250) }

// Soak adds a hold of h hours at 1.1 kW to the load: a product added to
// another value.
func Soak(es []Element, h float64) float64 { return Load(es) + h*1.1 }

// vent divides the load by a ramp rule's value: only correctly rounded
// steps are seen, and the rule is out of sight.
func vent(es []Element, rule func(float64) float64) float64 {
	return Load(es) / rule(2)
}

// Cool scales each reading in place by the radiance ratio at t degrees:
// it returns nothing, and what it stores goes through an exponential.
func Cool(rs []float64, t float64) {
	for i := range rs {
		rs[i] /= Glow(t)
	}
}

// Shift adds an offset to each reading in place: one correctly rounded
// sum per element.
func Shift(rs []float64, d float64) {
	for i := range rs {
		rs[i] += d
	}
}
