// Package assert is a stub of the assertion library's API used in tests.
package assert

// TestingT is the subset of *testing.T the assertions need.
type TestingT interface {
	Errorf(format string, args ...any)
}

func InDelta(t TestingT, expected, actual any, delta float64, msgAndArgs ...any) bool { return true }
func InDeltaSlice(t TestingT, expected, actual any, delta float64, msgAndArgs ...any) bool {
	return true
}
func InEpsilon(t TestingT, expected, actual any, epsilon float64, msgAndArgs ...any) bool {
	return true
}

// Assertions binds a TestingT.
type Assertions struct{ t TestingT }

func New(t TestingT) *Assertions { return &Assertions{t} }

func (a *Assertions) InEpsilon(expected, actual any, epsilon float64, msgAndArgs ...any) bool {
	return true
}
