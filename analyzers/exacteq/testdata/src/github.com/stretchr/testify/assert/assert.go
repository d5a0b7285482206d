// Package assert is a stub of the assertion library's API used in tests.
package assert

// TestingT is the subset of *testing.T the assertions need.
type TestingT interface {
	Errorf(format string, args ...any)
}

func Equal(t TestingT, expected, actual any, msgAndArgs ...any) bool        { return true }
func Equalf(t TestingT, expected, actual any, msg string, args ...any) bool { return true }
func NotEqual(t TestingT, expected, actual any, msgAndArgs ...any) bool     { return true }
func InEpsilon(t TestingT, expected, actual any, epsilon float64, msgAndArgs ...any) bool {
	return true
}
func InEpsilonf(t TestingT, expected, actual any, epsilon float64, msg string, args ...any) bool {
	return true
}

// Assertions binds a TestingT.
type Assertions struct{ t TestingT }

func New(t TestingT) *Assertions { return &Assertions{t} }

func (a *Assertions) Equal(expected, actual any, msgAndArgs ...any) bool { return true }
func (a *Assertions) InEpsilon(expected, actual any, epsilon float64, msgAndArgs ...any) bool {
	return true
}
