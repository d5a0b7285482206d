package idioms

import (
	"math"
	"testing"
)

// A derivative checker: a fixed step at the test's own points, checked
// against the analytic derivative with a tolerance made for that step.
func TestGradientCheck(t *testing.T) {
	energy := func(r float64) float64 { return 1 / r }
	force := func(r float64) float64 { return -1 / (r * r) }
	const h = 1e-6
	for _, r := range []float64{0.5, 1, 2} {
		numeric := (energy(r+h) - energy(r-h)) / (2 * h)
		if math.Abs(numeric-force(r)) > 1e-8 {
			t.Errorf("r=%g: %g against %g", r, numeric, force(r))
		}
	}
}

// A test that pins the value computed for its step, and a helper given a
// step that does not scale with x at the test's own point: deliberate.
func TestPinnedStep(t *testing.T) {
	got := (math.Sin(1+1e-4) - math.Sin(1)) / 1e-4
	if math.Abs(got-0.5402602314186211) > 1e-12 {
		t.Errorf("got %v", got)
	}
	if d := slope(math.Exp, 3, 1e-6); math.Abs(d-math.Exp(3)) > 1e-3 {
		t.Errorf("slope %v", d)
	}
}
