// Package rotor holds two head curves.
package rotor

// Quadratic is the head h0 - k·q², a product subtracted from a value:
// fusable.
type Quadratic struct{ H0, K float64 }

// Head returns the head at flow q.
func (c Quadratic) Head(q float64) float64 { return c.H0 - c.K*q*q }

// Scaled is the head h0/q, one correctly rounded division.
type Scaled struct{ H0 float64 }

// Head returns the head at flow q.
func (c Scaled) Head(q float64) float64 { return c.H0 / q }
