// Package spacevec is a small vector library for the tests: its functions
// are read by their bodies, across the package boundary, whatever their
// names.
package spacevec

import "math"

// V is a vector of three lengths.
type V struct{ X, Y, Z float64 }

// Inner is the dot product of p and q.
func Inner(p, q V) float64 { return p.X*q.X + p.Y*q.Y + p.Z*q.Z }

// Size is the length of p.
func Size(p V) float64 { return math.Sqrt(Inner(p, p)) }

// Along is p scaled to length 1.
func Along(p V) V {
	l := Size(p)
	return V{p.X / l, p.Y / l, p.Z / l}
}

// Between is the cosine of the angle between p and q.
func Between(p, q V) float64 { return Inner(p, q) / (Size(p) * Size(q)) }

// Dot is the dot product of v and w, as a method.
func (v V) Dot(w V) float64 { return v.X*w.X + v.Y*w.Y + v.Z*w.Z }

// Spread is the sum of the components, which is none of the shapes.
func Spread(p V) float64 { return p.X + p.Y + p.Z }
