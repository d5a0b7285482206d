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

// A derivative check whose step is far below the optimum, yet adequate for
// the check: a central step of 1e-8 errs by about eps/1e-8 ≈ 2.2e-8, 45
// times below the tolerance 1e-6 (Numerical Recipes 3rd ed. §5.7).
func TestAdequateStep(t *testing.T) {
	const h = 1e-8
	for _, x := range []float64{0.5, 1, 1.5} {
		want := math.Cos(x)
		got := slope(math.Sin, x, h)
		if math.Abs(got-want) > 1e-6 {
			t.Errorf("x=%g: %g against %g", x, got, want)
		}
	}
}

// The same through a test helper and a mixed tolerance 1e-4 + 1e-4·|want|
// (2e-4 at unit size): a forward step of 1e-10 errs by about
// 2·eps/1e-10 ≈ 4.4e-6, 120 times the error at the optimum, yet 45 times
// below the tolerance.
func TestHelperTolerance(t *testing.T) {
	for _, x := range []float64{1, 2} {
		d := (math.Exp(x+1e-10) - math.Exp(x)) / 1e-10
		within(t, d, math.Exp(x), 1e-4, 1e-4)
	}
}

// within holds got to want within atol + rtol·|want|. Its first test
// accepts values closer than the smallest float, an underflow guard that
// is no tolerance (constants below 2^-511 never are).
func within(t *testing.T, got, want, atol, rtol float64) {
	t.Helper()
	if math.Abs(got-want) <= math.SmallestNonzeroFloat64 {
		return
	}
	if math.Abs(got-want) > atol+rtol*math.Abs(want) {
		t.Errorf("got %v, want %v", got, want)
	}
}

// A guard against a vanishing derivative is no derivative check: |d| <
// 1e-12 asks whether the slope is flat, not how close d is to a reference,
// so the forward step of 1e-9 (error ~4.4e-7, 12 times the optimum's) is
// not weighed against 1e-12.
func TestFlatGuard(t *testing.T) {
	for _, x := range []float64{0.5, 2} {
		d := (math.Log(x+1e-9) - math.Log(x)) / 1e-9
		if math.Abs(d) < 1e-12 {
			t.Skip("flat")
		}
	}
}
