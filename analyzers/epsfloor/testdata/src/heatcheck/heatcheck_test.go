package heatcheck

import (
	"math"
	"testing"
)

func TestEnergy(t *testing.T) {
	Check(t, append(Standard, Case{mass: 2, rise: 400, joules: 649984.52}))
}

// TestSmall compares energies of a gram: below 1 J floats are at most
// 1.1e-16 apart, so 1e-12 is a tolerance there.
func TestSmall(t *testing.T) {
	if !close(Energy(0.001, 1), 0.8798240) {
		t.Error("gram")
	}
}

// TestDoubled compares a product of two constants with a constant: one
// correctly rounded operation, computed alike on every platform, so the
// exact comparison the tolerance amounts to holds wherever it holds once.
func TestDoubled(t *testing.T) {
	const half = 6e6
	if !close(2*half, 1.2e7) {
		t.Error("doubled")
	}
}

// TestCooling compares a value computed through math.Exp, which is not
// correctly rounded everywhere, with a constant of 4e6.
func TestCooling(t *testing.T) {
	if !close(4e6*math.Exp(-1e-3), 3996001.9993) { // want `close compares within the absolute tolerance 1e-12 \(heatcheck.go:24\), which is below half the spacing of float64 values at 3.9960019993e\+06 \(2.33e-10\)`
		t.Error("cooling")
	}
}

// expectNear fails t unless got is within tol of want.
func expectNear(t *testing.T, name string, got, want, tol float64) { // want expectNear:"parameter 4 is an absolute tolerance of float64 in expectNear, tested at heatcheck_test.go:40"
	if math.Abs(got-want) > tol {
		t.Errorf("%s = %g, want %g", name, got, want)
	}
}

// expectClose hands its values and tolerance on to expectNear.
func expectClose(t *testing.T, got, want, tol float64) { // want expectClose:"parameter 3 is an absolute tolerance of float64 in expectNear, tested at heatcheck_test.go:40"
	expectNear(t, "energy", got, want, tol)
}

// TestPins passes tolerances with the expected values beside them, which
// give the size of what is compared: 1e-9 at 1.19e7 and 1e-11 at 6.5e5
// are below the spacing there (1.86e-9 and 1.16e-10), 1e-6 is not.
func TestPins(t *testing.T) {
	expectNear(t, "standard", Energy(30, 500), 11943549.02, 1e-9) // want `1e-9, passed as tol to expectNear \(an absolute tolerance of float64 in expectNear, tested at heatcheck_test.go:\d+\), is below the spacing of float64 values just under 1.194354902e\+07 \(1.86e-09\)`
	expectClose(t, Energy(2, 400), 649984.52, 1e-11)              // want `1e-11, passed as tol to expectClose \(an absolute tolerance of float64 in expectNear, tested at heatcheck_test.go:\d+\), is below half the spacing of float64 values at 649984.52`
	expectNear(t, "loose", Energy(30, 500), 11943549.02, 1e-6)
}

// TestTable walks parallel slices of constants: the largest expected
// energy, 1.19e7, sizes what expectNear compares.
func TestTable(t *testing.T) {
	masses := []float64{2, 30}
	joules := []float64{649984.52, 11943549.02}
	for i := range masses {
		expectNear(t, "table", Energy(masses[i], 500), joules[i], 1e-9) // want `1e-9, passed as tol to expectNear .*, is below the spacing of float64 values just under 1.194354902e\+07`
	}
}

// TestRescaled stores into its slice of expected values before the
// checks: what the elements hold there is not the literal's.
func TestRescaled(t *testing.T) {
	joules := []float64{6.4998452e8, 1.194354902e10}
	joules[0] /= 1000
	for i := range joules {
		expectNear(t, "rescaled", Energy(2, 400), -joules[i], 1e-9)
	}
}

// reference holds expected energies that another function may change.
var reference = []float64{6.4998452e8, 1.194354902e10}

// TestShared reads a package variable: its elements are what the last
// change left, not the literal's.
func TestShared(t *testing.T) {
	for i := range reference {
		expectNear(t, "shared", Energy(2, 400), reference[i], 1e-9)
	}
}
