// Package turbine summarises turbine readings.
package turbine

import (
	"math"

	"example.com/turbine/check"
)

// Mean is the average of xs: a sum of roundings, then a division.
func Mean(xs []float64) float64 {
	s := 0.0
	for _, x := range xs {
		s += x
	}
	return s / float64(len(xs))
}

// Shares gives each reading's share of the total.
func Shares(xs []float64) []float64 {
	total := 0.0
	for _, x := range xs {
		total += x
	}
	out := make([]float64, len(xs))
	for i, x := range xs {
		out[i] = x / total
	}
	return out
}

// Efficiency is one division of its arguments.
func Efficiency(out, in float64) float64 { return out / in }

// Label returns a reading as given.
func Label(x float64) float64 { return x }

// Gust goes through Exp, which is not correctly rounded.
func Gust(x float64) float64 { return math.Exp(x) - 1 }

// Centre is the mean position of blade tips: sums, then divisions.
func Centre(tips []check.Hub) check.Hub {
	var c check.Hub
	for _, p := range tips {
		c[0] += p[0]
		c[1] += p[1]
	}
	n := float64(len(tips))
	return check.Hub{c[0] / n, c[1] / n}
}
