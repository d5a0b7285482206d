// Package shapes holds vector functions of the kinds vecshape learns,
// named so that only their bodies can tell.
package shapes

import "math"

// P is a point or vector of the plane.
type P struct{ X, Y float64 }

func Mix(p, q P) float64 { return p.X*q.X + p.Y*q.Y } // want Mix:"dot product of inputs 0, 1"

func (p P) Reach() float64 { return math.Hypot(p.X, p.Y) } // want Reach:"length of inputs 0, 0"

func (p P) Heading() P { // want Heading:"direction of inputs 0, 0"
	l := math.Sqrt(Mix(p, p))
	return P{p.X / l, p.Y / l}
}

func Spread(p, q P) float64 { // want Spread:"cosine of inputs 0, 1"
	return Mix(p, q) / (p.Reach() * q.Reach())
}

// Neither a dot product (a component missing) nor a length (no root).
func Half(p, q P) float64 { return p.X * q.X }

func Square(p P) float64 { return Mix(p, p) } // want Square:"dot product of inputs 0, 0"

// Scaled by a factor that is not its length: not a direction.
func (p P) Double() P { return P{2 * p.X, 2 * p.Y} }

// Recursion ends the reading without a shape.
func Loop(p, q P) float64 { return Loop(q, p) }

func (p P) Turn(q P) float64 { return p.X*q.Y - p.Y*q.X } // want Turn:"cross product of inputs 0, 1"

// The same components in both products: no cross product.
func Skew(p, q P) float64 { return p.X*q.Y - p.X*q.Y }
