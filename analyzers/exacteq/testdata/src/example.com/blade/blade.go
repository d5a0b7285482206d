// Package blade computes turbine blade angles, some portably.
package blade

import "math"

const turn = 2 * math.Pi

// Wrap brings an angle into (-π, π] by whole turns: subtractions of a
// constant only, the same bits everywhere.
func Wrap(a float64) float64 {
	for a > math.Pi {
		a -= turn
	}
	for a <= -math.Pi {
		a += turn
	}
	return a
}

// Chord is a square root of a sum of squares: the products may fuse into
// the addition.
func Chord(dx, dy float64) float64 { return math.Sqrt(dx*dx + dy*dy) }

// Pitch goes through Atan, which is not correctly rounded.
func Pitch(rise, run float64) float64 { return math.Atan(rise / run) }

// Share divides a product before adding: nothing can fuse.
func Share(w, k, m float64) float64 { return w - k*k/m + float64(w*k) }

// Span calls a portable function of its own package.
func Span(a, b float64) float64 { return Wrap(b - a) }

// Shaper computes a value by a method unknown here.
type Shaper interface{ Shape(float64) float64 }

// Shaped calls through an interface: unknown, not portable.
func Shaped(s Shaper, x float64) float64 { return s.Shape(x) / 3 }

// Mean adds and divides by the count: len is a builtin, which does not
// round.
func Mean(xs []float64) float64 {
	s := 0.0
	for _, x := range xs {
		s += x
	}
	return s / float64(len(xs))
}
