// Package tolapi offers a solver whose tolerance is a parameter and a field.
package tolapi

import "math"

// Settings configures Refine.
type Settings struct {
	RelTol float64 // want RelTol:"a relative tolerance of float64 in Refine"
}

// Refine reports whether a and b agree to the settings' tolerance.
func Refine(s Settings, a, b float64) bool {
	return math.Abs(a-b) <= s.RelTol*math.Abs(b)
}

// Agree reports whether a and b agree to within tol, absolutely.
func Agree(a, b, tol float64) bool { // want Agree:"parameter 2 is an absolute tolerance of float64 in Agree"
	return math.Abs(a-b) < tol
}

// Close passes its tolerance on to Agree.
func Close(a, b, eps float64) bool { // want Close:"parameter 2 is an absolute tolerance of float64 in Agree"
	return Agree(a, b, eps)
}

// Either passes when either test does: its atol cannot make it exact, so
// it is not learned as a tolerance.
func Either(a, b, atol, rtol float64) bool { // want Either:"parameter 3 is a relative tolerance"
	return Agree(a, b, atol) || math.Abs(a-b) <= rtol*math.Abs(b)
}

// Match reports whether a and b agree to within tol, and takes a
// tolerance of 0 as exact equality.
func Match(a, b, tol float64) bool { // want Match:"parameter 2 is an absolute tolerance of float64 in Match"
	if tol == 0 {
		return a == b
	}
	return math.Abs(a-b) < tol
}
