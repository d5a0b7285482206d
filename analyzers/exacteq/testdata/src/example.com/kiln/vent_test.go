package kiln

import "testing"

// In the package itself: vent's quotient is correctly rounded and its
// divisor comes from a function value, out of sight; left alone. Soak's
// product is read in its body; reported.
func TestVent(t *testing.T) {
	es := []Element{Coil{W: 1.1}, Coil{W: 2.2}}
	if got := vent(es, func(x float64) float64 { return x + 5 }); got != 0.4714285714285715 {
		t.Fail()
	}
	if got := Soak(es, 0.3); got != 3.6300000000000003 { // want `exact != pins a computed result to 3.6300000000000003`
		t.Fail()
	}
}
