package cancellation_test

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
)

// erfcAsymptotic is erfc(x) for large x by the asymptotic series
// e^(-x²)/(x√π)·Σ (-1)^k (2k-1)!!/(2x²)^k (Abramowitz & Stegun 7.1.23),
// summed while the terms fall; at x = 5 the first omitted term, the
// truncation error bound, is below 1e-10 relative.
func erfcAsymptotic(x float64) float64 {
	sum, term := 1.0, 1.0
	for k := 1; ; k++ {
		next := -term * float64(2*k-1) / (2 * x * x)
		if math.Abs(next) >= math.Abs(term) {
			break
		}
		term = next
		sum += term
	}
	return math.Exp(-x*x) / (x * math.Sqrt(math.Pi)) * sum
}

// TestLowerTail checks the numbers of the lower-tail rule against the
// asymptotic series: math.Erfc(5) agrees with it to 1e-9, while
// 1 + math.Erf(-5) is off by about 1.5e-5 relative (erfLossAt5); and
// 1 + math.Erf(x) is 0 just below -5.92 (lowestErf), where erfc(-x) is
// still about 5e-17.
func TestLowerTail(t *testing.T) {
	ref := erfcAsymptotic(5)
	assert.InEpsilon(t, ref, math.Erfc(5), 1e-9, "math.Erfc(5)")
	loss := math.Abs(1+math.Erf(-5)-ref) / ref
	assert.InDelta(t, 1.5e-5, loss, 0.05e-5, "relative error of 1 + math.Erf(-5)")
	assert.Zero(t, 1+math.Erf(-5.93), "1 + math.Erf(-5.93)")
	assert.NotZero(t, 1+math.Erf(-5.91), "1 + math.Erf(-5.91)")
	assert.InEpsilon(t, erfcAsymptotic(5.93), math.Erfc(5.93), 1e-9, "math.Erfc(5.93)")
}

// TestLowerTailFix checks the fix's form 0.5*math.Erfc(-x) against the
// form it replaces, 0.5*(1 + math.Erf(x)): within a few ulps where the
// lower tail is not small (erfc(-x) = 1 + erf(x), algebra), and against
// the asymptotic series (Abramowitz & Stegun 7.1.23) at x = -9, where
// the plain form is 0.
func TestLowerTailFix(t *testing.T) {
	for _, x := range []float64{-2, -0.5, 0, 0.5, 1, 2} {
		plain, fixed := 0.5*(1+math.Erf(x)), 0.5*math.Erfc(-x)
		assert.InDelta(t, plain, fixed, 4*0x1p-53, "x = %g", x)
	}
	assert.Zero(t, 0.5*(1+math.Erf(-9)), "plain form at x = -9")
	assert.InEpsilon(t, 0.5*erfcAsymptotic(9), 0.5*math.Erfc(9), 1e-9, "fixed form at x = -9")
}
