package route

import (
	"math"
	"testing"
)

func TestSpread(t *testing.T) {
	w := Weir{Width: 1.5, Coeff: 0.6}
	if got, want := w.Spread(), math.Sqrt(2)*w.Width; got != want { // want `exact != between the result of Spread and want, which the test computes by another formula`
		t.Fail()
	}
	// The same formula as the code's: the same roundings, the same bits.
	if got, want := w.Area(), 2*w.Width*w.Width; got != want {
		t.Fail()
	}
}

func TestLogHead(t *testing.T) {
	if got := LogHead(0.5); got != 0.5-2*math.Log(math.Exp(0.5)+1)+2*math.Ln2 {
		t.Fail() // the same formula written out
	}
	if got := LogHead(1); got == 1-math.Log(4) { // want `exact == between the result of LogHead and 1 - math.Log\(4\)`
		t.Fail()
	}
}

func TestAngle(t *testing.T) {
	lon, lat := Angle(0)
	if lat != 0 { // want `exact != 0 on the result of Angle, a difference of terms equal in exact arithmetic here, one computed through a math function that is not correctly rounded: .* one ulp of 90 \(1.42e-14\)`
		t.Fail()
	}
	// lon is y/16*360 - 180 with no math function: no rounding for dyadic y.
	if lon != -180 {
		t.Fail()
	}
	if Shift(16) != 0 {
		t.Fail() // 16*0.5 - 8 rounds nowhere
	}
}
