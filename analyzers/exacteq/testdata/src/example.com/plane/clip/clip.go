// Package clip tests segments of package plane against each other: the
// cross product comes from another package, known by its shape.
package clip

import "example.com/plane"

// Collinear decides on an exact zero of a cross product: three points on
// a line with decimal coordinates usually leave a residue of a few ulps.
func Collinear(a, b, c plane.V) bool {
	return b.Sub(a).Turn(c.Sub(a)) == 0 // want `exact == 0 on b.Sub\(a\).Turn\(c.Sub\(a\)\), a difference of computed float64 values`
}

// Crossing guards a division with the zero test: only an exact zero would
// divide by zero, and a residue gives a large but finite parameter that
// the caller checks against [0, 1].
func Crossing(p, r, q, s plane.V) (float64, bool) {
	k := r.Turn(s)
	if k == 0 {
		return 0, false
	}
	return q.Sub(p).Turn(s) / k, true
}

// Square tests a dot product, which exacteq does not read as a
// difference: a perpendicularity test of data is the caller's to judge.
func Square(a, b plane.V) bool {
	return plane.Inner(a, b) == 0
}
