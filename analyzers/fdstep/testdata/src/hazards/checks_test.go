package hazards

import (
	"math"
	"testing"
)

func centralCheck(f func(float64) float64, x, h float64) float64 { // want centralCheck:"fdstep\\(central step of centralCheck\\)"
	return (f(x+h) - f(x-h)) / (2 * h)
}

// A check whose step is far below the optimum: its own rounding error,
// about 2·eps/1e-9 ≈ 4.4e-7 at x = 2 for f of unit size (eps·e²/1e-9 ≈
// 1.6e-6 here), is within a factor 10 of the tolerance it is held to.
func TestFragileCheck(t *testing.T) {
	if d := centralCheck(math.Exp, 2, 1e-9); math.Abs(d-math.Exp(2)) > 1e-6 { // want `fixed central-difference step 1e-09 \(passed as h to centralCheck\) is too small for its check: its expected error ~4.4e-07 is within a factor 10 of the tolerance 1e-06 it is checked against`
		t.Error(d)
	}
}

// A step only 50 times from the optimum error (eps/1e-7 ≈ 2.2e-9 against
// ~4.3e-11), which alone is not reported, held to a tolerance below its
// error: the check passes or fails with the last bits; at the optimum
// step it would have 2.3 digits to spare.
func TestTightCheck(t *testing.T) {
	const step = 1e-7
	for _, x := range []float64{0.3, 0.6} {
		slope := (math.Sin(x+step) - math.Sin(x-step)) / (2 * step) // want `fixed central-difference step step = 1e-07 is too small for its check: its expected error ~2.2e-09 exceeds the tolerance 1e-10 it is checked against, where h = eps\^\(1/3\)·max\(1,\|x\|\) ≈ 6.06e-06·max\(1,\|x\|\) errs by ~4.3e-11`
		if math.Abs(slope-math.Cos(x)) > 1e-10 {
			t.Error(slope)
		}
	}
}

// closeTo is a test helper holding got to want within atol + rtol·|want|.
func closeTo(t *testing.T, got, want, atol, rtol float64) {
	t.Helper()
	if math.Abs(got-want) > atol+rtol*math.Abs(want) {
		t.Errorf("got %v, want %v", got, want)
	}
}

// A forward step of 1e-11 errs by about 2·eps·2/1e-11 ≈ 8.9e-5 at x = 2, above the
// mixed tolerance 1e-6 + 1e-6·|f'| the helper applies (2e-6 at unit size).
func TestHelperCheck(t *testing.T) {
	x := 2.0
	d := (math.Log(x+1e-11) - math.Log(x)) / 1e-11 // want `fixed forward-difference step 1e-11 is too small for its check: its expected error ~8.9e-05 exceeds the tolerance 2e-06 it is checked against`
	closeTo(t, d, 0.5, 1e-6, 1e-6)
}

// A relative check: |d-f'|/|f'| < 1e-7 against a central step of 1e-9 at
// x = 4 (expected error ~eps·4/1e-9 ≈ 8.9e-7).
func TestRelativeCheck(t *testing.T) {
	want := 0.25
	if d := centralCheck(math.Sqrt, 4, 1e-9); math.Abs(d-want)/math.Abs(want) > 1e-7 { // want `fixed central-difference step 1e-09 \(passed as h to centralCheck\) is too small for its check: its expected error ~8.9e-07 exceeds the tolerance 1e-07`
		t.Error(d)
	}
}
