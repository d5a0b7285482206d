// Package check is a small assertion helper of a test suite.
package check

import "testing"

// AssertEqual fails t unless want and got are equal.
func AssertEqual(t testing.TB, want, got any) {
	if want != got {
		t.Errorf("want %v, got %v", want, got)
	}
}

// AssertEqualWithin fails t unless want and got differ by at most tol.
func AssertEqualWithin(t testing.TB, want, got, tol float64) {
	if d := want - got; d > tol || -d > tol {
		t.Errorf("want %v, got %v", want, got)
	}
}

// ShouldEqual says why actual differs from the expected value, or "".
var ShouldEqual = func(actual any, expected ...any) string {
	if actual != expected[0] {
		return "differs"
	}
	return ""
}

// So applies an assertion.
func So(actual any, assert func(any, ...any) string, expected ...any) string {
	return assert(actual, expected...)
}

// Hub is a point on the rotor plane.
type Hub [2]float64

// Equal reports whether two hubs coincide, comparing coordinates exactly.
func (h Hub) Equal(o Hub) bool { return h[0] == o[0] && h[1] == o[1] }

// FairlyEqual reports whether a and b differ by at most slack: a
// tolerance passed as a third operand, whatever the name says.
func FairlyEqual(a, b, slack float64) bool { return a-b <= slack && b-a <= slack }
