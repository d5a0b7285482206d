// Package hub computes rotor hub quantities.
package hub

import "math"

// Radius is a square root of a sum of squares whose products are each
// rounded by an explicit conversion first: nothing can fuse.
func Radius(x, y float64) float64 { // want Radius:"portable"
	return math.Sqrt(float64(x*x) + float64(y*y))
}

// Reach adds a product: it may fuse into one rounding.
func Reach(x, y, r float64) float64 { // want Reach:"^cause$" Reach:"input cause"
	return x*y + r
}

// Tilt goes through Atan2, which is not correctly rounded.
func Tilt(x, y float64) float64 { // want Tilt:"^cause$" Tilt:"input cause"
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

// Longest returns an index: no float result, but its comparisons read
// portable values, so callers that compute floats around it stay portable.
func Longest(ws []float64) int { // want Longest:"portable"
	best := 0
	for i, w := range ws {
		if w*w > ws[best]*ws[best] {
			best = i
		}
	}
	return best
}

// Halves appends quotients: the builtin does not round, and what it
// appends is portable.
func Halves(x float64) []float64 { // want Halves:"portable"
	return append([]float64{}, x/2, x/4)
}

// Bearings fills an array with values from Sin: not portable.
func Bearings(x float64) []float64 { // want Bearings:"^cause$" Bearings:"input cause"
	var b [2]float64
	b[0] = math.Sin(x)
	b[1] = x / 2
	return b[:]
}

// Levels appends a struct holding a value from Atan2: not portable.
func Levels(x, y float64) []struct{ q float64 } { // want Levels:"^cause$" Levels:"input cause"
	var out []struct{ q float64 }
	return append(out, struct{ q float64 }{Tilt(x, y)})
}

// Twice adds a doubled value: a product by a power of two is exact, so a
// fused form rounds the same (IEEE 754-2019 §5.4.1).
func Twice(x, y float64) float64 { // want Twice:"portable"
	return 2*x + y
}

// Cube raises to a whole power: not among the correctly rounded
// functions, hence not portable, yet no cause either, since Go's Pow
// multiplies squarings in pure Go on every architecture (math/pow.go);
// no fact.
func Cube(x float64) float64 {
	return math.Pow(x, 3)
}

// Rescale multiplies the elements it is given by a cube root in place. It
// has no float result, so none is not portable; what it stores is
// computed from its inputs through Cbrt, which is not correctly rounded.
func Rescale(ws []float64, k float64) { // want Rescale:"portable" Rescale:"input cause" Rescale:"fill cause"
	for i := range ws {
		ws[i] *= math.Cbrt(k)
	}
}

// Within compares what it is given: |a-b| is one correctly rounded
// subtraction, and nothing computed from its inputs rounds otherwise.
func Within(a, b, tol float64) bool { // want Within:"portable"
	return math.Abs(a-b) <= tol
}
