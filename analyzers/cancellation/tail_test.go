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
