// Package heatcheck holds the test support of a kiln's heat model: a
// table type for cases and a comparison helper, in a file that imports
// testing, whose tables the package's tests fill.
package heatcheck

import (
	"math"
	"testing"
)

// Energy returns the heat in joules taken up by mass kilograms of clay
// warmed by rise kelvins.
func Energy(mass, rise float64) float64 { return mass * 880 * rise * math.Exp(-rise/5000) }

// Case is one row of a table: a mass, a rise and the expected energy.
type Case struct {
	mass, rise, joules float64
}

// Standard is the case every test of the model runs.
var Standard = []Case{{mass: 30, rise: 500, joules: 11943549.02}}

// close compares two energies to a picojoule.
func close(a, b float64) bool { return math.Abs(a-b) < 1e-12 }

// Check runs a table of cases. Their expected energies, set here and by
// the tests, reach 1.19e7 J, where floats are 1.86e-9 apart: the helper's 1e-12 asks
// for exact equality of a value computed through math.Exp.
func Check(t *testing.T, cases []Case) {
	for _, c := range cases {
		if got := Energy(c.mass, c.rise); !close(got, c.joules) { // want `close compares within the absolute tolerance 1e-12 \(heatcheck.go:24\), which is below half the spacing of float64 values at 1.194354902e\+07 \(9.31e-10\): the test passes only on exact equality`
			t.Errorf("Energy(%g, %g) = %g, want %g", c.mass, c.rise, got, c.joules)
		}
	}
}
