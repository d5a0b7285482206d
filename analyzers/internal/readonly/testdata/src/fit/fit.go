// Package fit uses the kiln spline library of package knots.
package fit

import "knots"

// Window reads its hours through another package's read-only parameter.
func Window(hours []float64) bool { // want Window:`reads only \[0\]`
	return knots.Rising(hours)
}

// Nudge hands them to another package's function that stores into them.
func Nudge(hours []float64) {
	knots.Shift(hours, 1)
}
