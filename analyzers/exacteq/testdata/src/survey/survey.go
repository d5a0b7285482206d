// Package survey measures stakes, lots and trenches on a plot of land.
package survey

import "math"

// Pace is the straight-line distance between two stakes.
func Pace(from, to []float64) float64 {
	dx := from[0] - to[0]
	dy := from[1] - to[1]
	return math.Sqrt(dx*dx + dy*dy)
}

// Pace32 is Pace in float32, for stakes given as arrays.
func Pace32(from, to [2]float32) float32 {
	dx := from[0] - to[0]
	dy := from[1] - to[1]
	return float32(math.Sqrt(float64(dx*dx + dy*dy)))
}

// Lot describes a rectangular lot by its corners.
type Lot struct {
	West, East float64
	Depth      float64
}

// Share is the squared half-width of a lot plus a seventh of its west
// edge: the half-width is a quotient by a power of two.
func Share(l Lot) float64 {
	half := (l.East - l.West) / 2
	return half*half + l.West/7
}

// Spoil is the volume of earth dug from a cubic pit, spread over seven
// trucks.
func Spoil(edge float64) float64 {
	return math.Pow(edge, 3) / 7
}

// Stretch scales the coordinates of a stake in place.
func Stretch(xs []float64, k float64) {
	for i := range xs {
		xs[i] *= k
	}
}

// Settle lowers each coordinate of a stake to a third of itself, lifts it
// by k*k + 1, and returns the lift.
func Settle(xs []float64, k float64) float64 {
	for i := range xs {
		xs[i] = xs[i]/3 + k*k + 1
	}
	return k*k + 1
}
