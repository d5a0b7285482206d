// Package farm builds on hub.
package farm

import "example.com/hub"

// Area calls a portable function of another package.
func Area(x, y float64) float64 { // want Area:"portable"
	r := hub.Radius(x, y)
	return r / 2
}

// Sweep calls a function of another package that may fuse.
func Sweep(x, y float64) float64 { // want Sweep:"^cause$" Sweep:"input cause"
	return hub.Reach(x, y, 1) / 2
}

// Pitch calls through a function value: unknown.
func Pitch(f func(float64) float64, x float64) float64 {
	return f(x) / 2
}

// Tip scales the longest spoke: portable through an int-valued helper of
// another package.
func Tip(ws []float64) float64 { // want Tip:"portable"
	return ws[hub.Longest(ws)] / 2
}
