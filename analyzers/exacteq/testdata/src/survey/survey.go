// Package survey measures stakes on a plot of land.
package survey

import "math"

// Pace is the straight-line distance between two stakes.
func Pace(from, to []float64) float64 {
	dx := from[0] - to[0]
	dy := from[1] - to[1]
	return math.Sqrt(dx*dx + dy*dy)
}
