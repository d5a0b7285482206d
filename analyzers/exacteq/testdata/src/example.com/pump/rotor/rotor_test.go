package rotor_test

import (
	"testing"

	"example.com/pump"
	"example.com/pump/rotor"
)

// The helpers call Head on the curve the test hands them: for a
// Quadratic that method shows a fusable product, so the pins are
// reported, also through the second helper; for a Scaled curve every step
// is correctly rounded, and for a curve of unknown type nothing is known.
func TestHead(t *testing.T) {
	c := rotor.Quadratic{H0: 31.7, K: 0.0137}
	if got := pump.At(c, 2.9); got != 31.584782999999998 { // want `exact != pins a computed result to 31.584782999999998`
		t.Fail()
	}
	if got := pump.Sweep(c, []float64{2.9}); got[0] != 31.584782999999998 { // want `exact != pins a computed result to 31.584782999999998`
		t.Fail()
	}
	if got := pump.At(rotor.Scaled{H0: 31.7}, 2.9); got != 10.931034482758621 {
		t.Fail()
	}
	unknown(t, c)
}

// unknown pins a curve whose type its caller decides.
func unknown(t *testing.T, c pump.Curve) {
	if got := pump.At(c, 2.9); got != 31.584782999999998 {
		t.Fail()
	}
}
