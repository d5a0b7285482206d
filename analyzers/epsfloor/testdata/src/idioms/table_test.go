package idioms

import "testing"

// The inputs of a table of cases are constant sums, rounded once at compile
// time (Go spec, "Constant expressions"): 2 + 1e-70 is exactly 2 on every
// run, and the case passes or fails on that value alone.
func TestGauge(t *testing.T) {
	for _, c := range []struct{ in, want float64 }{
		{in: 2 + 1e-70, want: 2},
		{8 - 1e-60, 8},
	} {
		if c.in != c.want {
			t.Fatal(c.in)
		}
	}
}
