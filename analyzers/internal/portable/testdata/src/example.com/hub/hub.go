// Package hub computes rotor hub quantities.
package hub

import "math"

// Radius is a square root of a sum of squares whose products are each
// rounded by an explicit conversion first: nothing can fuse.
func Radius(x, y float64) float64 { // want Radius:"portable"
	return math.Sqrt(float64(x*x) + float64(y*y))
}

// Reach adds a product: it may fuse into one rounding.
func Reach(x, y, r float64) float64 {
	return x*y + r
}

// Tilt goes through Atan2, which is not correctly rounded.
func Tilt(x, y float64) float64 {
	return math.Atan2(y, x)
}

// Spokes divides before adding, and counts with a builtin.
func Spokes(ws []float64) float64 { // want Spokes:"portable"
	s := 0.0
	for _, w := range ws {
		s += w * 2 / 3
	}
	return s / float64(len(ws))
}

// Count has no float result, so no fact.
func Count(ws []float64) int { return len(ws) }
