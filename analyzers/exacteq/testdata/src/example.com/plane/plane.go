// Package plane is a small library of plane vectors for the tests.
package plane

// V is a vector of the plane.
type V struct{ X, Y float64 }

// Sub returns v - w.
func (v V) Sub(w V) V { return V{v.X - w.X, v.Y - w.Y} }

// Turn is the cross product of v and w: twice the signed area they span.
func (v V) Turn(w V) float64 { return v.X*w.Y - v.Y*w.X }

// Inner is the dot product of v and w.
func Inner(v, w V) float64 { return v.X*w.X + v.Y*w.Y }
