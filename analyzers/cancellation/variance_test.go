package cancellation_test

import (
	"math"
	"testing"
)

// TestOnePassVariance checks the loss the variance rule quotes: for data
// m±1 the population variance is exactly 1 (a known identity), but
// E[x²]-E[x]² computed in float64 keeps about 16 - log10(m²) digits of it
// (Higham 2002, §1.9, on the one-pass formula) while the sum of squared
// deviations stays exact.
func TestOnePassVariance(t *testing.T) {
	for _, m := range []float64{1e4, 1e6, 1e8} {
		xs := []float64{m - 1, m + 1, m - 1, m + 1}
		var s1, s2 float64
		for _, x := range xs {
			s1 += x
			s2 += x * x
		}
		n := float64(len(xs))
		mean := s1 / n
		onePass := s2/n - mean*mean
		var d2 float64
		for _, x := range xs {
			d2 += (x - mean) * (x - mean)
		}
		if twoPass := d2 / n; twoPass != 1 {
			t.Errorf("m = %g: two-pass variance %v, want exactly 1", m, twoPass)
		}
		// Each term is about m² and carries an absolute error of about
		// u·m², the bound on what the difference can lose.
		bound := 4 * 0x1p-53 * m * m
		if err := math.Abs(onePass - 1); err > bound {
			t.Errorf("m = %g: one-pass error %g beyond the bound %g", m, err, bound)
		}
		if m == 1e8 && onePass == 1 {
			t.Errorf("m = 1e8: one-pass variance exact; the rule's premise fails")
		}
	}
}

// TestNormalTailFix checks the tail fix 1 - 0.5*Erfc(-x) -> 0.5*Erfc(x)
// by the identity erfc(-x) = 2 - erfc(x) (Abramowitz & Stegun 7.1.9,
// from memory): the forms agree to a few ulps where the tail is large, and
// the plain form is 0 where the tail is below u.
func TestNormalTailFix(t *testing.T) {
	for _, x := range []float64{-2, -0.5, 0, 0.5, 1, 2} {
		plain, fixed := 1-0.5*math.Erfc(-x), 0.5*math.Erfc(x)
		if d := math.Abs(plain - fixed); d > 4*0x1p-53 {
			t.Errorf("x = %g: 1-0.5*Erfc(-x) = %v, 0.5*Erfc(x) = %v", x, plain, fixed)
		}
	}
	if plain, fixed := 1-0.5*math.Erfc(-9), 0.5*math.Erfc(9); plain != 0 || fixed <= 0 {
		t.Errorf("x = 9: plain %v (want 0), fixed %v (want > 0)", plain, fixed)
	}
}
