package gauge

import "testing"

func TestSmoother(t *testing.T) {
	s := NewSlow()
	s.Feed(3.3)
	s.Feed(7.1)
	if l := s.Level(); l != 0.5304999999999999 { // want `pins a computed result`
		t.Error(l)
	}
	o := Opaque(NewSlow)
	o.Feed(3.3)
	if l := o.Level(); l != 0.16499999999999998 { // the type is out of sight
		t.Error(l)
	}
}

func TestTally(t *testing.T) {
	var ta Tally
	ta.Add(0.1)
	ta.Add(0.2)
	ta.Count()
	ta.Count()
	ta.Count()
	if m := ta.Mean(); m != 0.10000000000000002 { // correctly rounded steps: the same bits everywhere
		t.Error(m)
	}
}

func TestSpread(t *testing.T) {
	var s Spread
	for _, x := range []float64{0.1, 0.7, 1.3} {
		s.Add(x)
	}
	if v := s.Variance(); v != 0.36000000000000004 { // want `pins a computed result`
		t.Error(v)
	}
}

// The message quotes the digits; it is printed from the value, not parsed
// into it.
func TestQuoted(t *testing.T) {
	var s Spread
	s.Add(0.2)
	s.Add(0.9)
	if v := s.Variance(); v != 0.24499999999999997 { // want `pins a computed result`
		t.Errorf("variance %v, want 0.24499999999999997", v)
	}
}
