package kiln_test

import (
	"math"
	"testing"

	"example.com/kiln"
)

// Out of sight: the sum goes through an interface method, the quotient
// through a function value, and every step seen is correctly rounded
// (IEEE 754-2019 §4.3), so nothing shows that the bits can change; left
// alone.
func TestOutOfSight(t *testing.T) {
	es := []kiln.Element{kiln.Coil{W: 1.1}, kiln.Coil{W: 2.2}}
	if got := kiln.Load(es); got != 3.3000000000000003 { // a sum of outputs read through Element
		t.Fail()
	}
	rule := func(x float64) float64 { return x + 0.1 }
	if got := kiln.Step(rule, 0.2); got != 0.10000000000000002 { // the rule is a function value
		t.Fail()
	}
}

// A cause in sight: an exponential in the package read (by its fact), a
// product added to a sum out of sight, a sine taken in the test itself;
// reported.
func TestCauseInSight(t *testing.T) {
	if got := kiln.Glow(0.3); got != 1.0012007202880864 { // want `exact != pins a computed result to 1.0012007202880864`
		t.Fail()
	}
	es := []kiln.Element{kiln.Coil{W: 1.1}, kiln.Coil{W: 2.2}}
	if got := kiln.Soak(es, 0.3); got != 3.6300000000000003 { // want `exact != pins a computed result to 3.6300000000000003`
		t.Fail()
	}
	if got := math.Sin(kiln.Load(es)); got != -0.15774569414324865 { // want `exact != pins a computed result to -0.15774569414324865`
		t.Fail()
	}
}

// A slice the test hands to a call that fills it in place: Cool stores
// quotients by an exponential (a cause, read from the fact of what it
// computes from its inputs), Shift correctly rounded sums (none).
func TestFilledInPlace(t *testing.T) {
	rs := []float64{900, 1200}
	kiln.Cool(rs, 0.3)
	if rs[0] != 898.9206477408778 { // want `exact != pins a computed result to 898.9206477408778`
		t.Fail()
	}
	ws := []float64{900, 1200}
	kiln.Shift(ws, 0.1)
	if ws[0] != 900.1 {
		t.Fail()
	}
}
