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
