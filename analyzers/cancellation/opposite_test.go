package cancellation_test

import (
	"math"
	"math/big"
	"testing"

	"github.com/stretchr/testify/assert"
)

// onePlusCosRef returns 1 + cos θ for the angle θ between the float64
// vectors a and b: 1 + a·b/(|a||b|), worked out at prec bits (math/big;
// the cosine of the angle between vectors, common practice).
func onePlusCosRef(a, b [3]float64) *big.Float {
	dot, na, nb := newF(), newF(), newF()
	for i := range a {
		dot.Add(dot, newF().Mul(bf(a[i]), bf(b[i])))
		na.Add(na, newF().Mul(bf(a[i]), bf(a[i])))
		nb.Add(nb, newF().Mul(bf(b[i]), bf(b[i])))
	}
	den := newF().Mul(newF().Sqrt(na), newF().Sqrt(nb))
	return newF().Add(bf(1), newF().Quo(dot, den))
}

// TestOppositeDirections checks the message of the 1 + c finding: for
// directions a and b nearly opposite (θ = π - δ), 1 + a·b loses about
// 2·log10(1/δ) digits and is 0 from δ ≈ sqrt(2u) ≈ 1.49e-8 on, while
// |a+b|²/2 keeps nearly all, a+b being exact there (Sterbenz's lemma,
// Goldberg 1991 Thm 11; Higham 2002 §2.5): what it misses is the
// lengths' own rounding, about u² against (π-θ)²/2, 25 ulps at δ = 1e-9.
func TestOppositeDirections(t *testing.T) {
	for _, delta := range []float64{1e-3, 1e-5, 1e-7, 1e-9} {
		for _, tilt := range []float64{0.3, 1.1, 2.5} {
			// unit vectors at tilt from the z axis, the second turned by π - δ about it
			a := [3]float64{math.Sin(tilt), 0, math.Cos(tilt)}
			b := [3]float64{-math.Sin(tilt - delta), 0, -math.Cos(tilt - delta)}
			want := onePlusCosRef(a, b)
			naive := 1 + (a[0]*b[0] + a[1]*b[1] + a[2]*b[2])
			s := [3]float64{a[0] + b[0], a[1] + b[1], a[2] + b[2]}
			stable := (s[0]*s[0] + s[1]*s[1] + s[2]*s[2]) / 2
			assert.Less(t, math.Abs(stable-f64(want))/f64(want), 1e-13, "|a+b|²/2 at δ = %g", delta)
			rel := math.Abs(naive-f64(want)) / f64(want)
			if delta < 1.49e-8 {
				assert.Greater(t, rel, 0.5, "1 + a·b at δ = %g: nothing left", delta)
			} else {
				assert.Greater(t, rel*delta*delta, 1e-19, "1 + a·b at δ = %g loses about 2·log10(1/δ) digits", delta)
			}
		}
	}
}
