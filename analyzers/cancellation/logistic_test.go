package cancellation_test

import (
	"math"
	"math/big"
	"testing"

	"github.com/stretchr/testify/assert"
)

// TestLogisticLoss checks the premise and the remedy of the logistic
// rule: log(1-σ(z)) = -log(1+e^z) and log σ(z) = -log(1+e^-z) (algebra,
// common practice). Where σ(z) is far from 0 and 1 (|z| ≤ 1) the plain and
// softplus forms agree within 1e-15; at z = 40 the plain log(1-σ(z)) is -Inf
// (σ(40) rounds to 1) and at z = -800 the plain log σ(z) is -Inf (e^800
// overflows), while the softplus forms give about -40 and -800.
func TestLogisticLoss(t *testing.T) {
	sigma := func(z float64) float64 { return 1 / (1 + math.Exp(-z)) }
	softplus := func(y float64) float64 { return math.Max(y, 0) + math.Log1p(math.Exp(-math.Abs(y))) }
	for _, z := range []float64{-1, -0.5, 0.5, 1} {
		assert.InDelta(t, math.Log(1-sigma(z)), -softplus(z), 1e-15, "z = %g", z)
		assert.InDelta(t, math.Log(sigma(z)), -softplus(-z), 1e-15, "z = %g", z)
	}
	assert.True(t, math.IsInf(math.Log(1-sigma(40)), -1), "plain log(1-σ(40))")
	assert.InDelta(t, -40, -softplus(40), 1e-15*40, "softplus form at z = 40")
	assert.True(t, math.IsInf(math.Log(sigma(-800)), -1), "plain log σ(-800)")
	assert.InDelta(t, -800, -softplus(800), 1e-15*800, "softplus form at z = -800")
}

// TestScaledLogistic checks the premise and the remedy of the doubled
// logistic rule: 2σ(z) - 1 = tanh(z/2) = expm1(z)/(expm1(z)+2) (algebra,
// common practice; the reference from expm1Ref, math/big). At z = 1e-16
// the plain form is 0 (1+e^-z rounds to 2); at z = 1e-8 it keeps about 8
// digits; math.Tanh(z/2) is within 2 ulps of the reference at both.
func TestScaledLogistic(t *testing.T) {
	plain := func(z float64) float64 { return 2/(1+math.Exp(-z)) - 1 }
	ref := func(z float64) *big.Float {
		e := expm1Ref(bf(z))
		return newF().Quo(e, newF().Add(e, big.NewFloat(2)))
	}
	assert.Equal(t, 0.0, plain(1e-16))
	for _, z := range []float64{1e-16, 1e-8, 0.5} {
		assert.LessOrEqual(t, ulps(math.Tanh(z/2), ref(z)), 2.0, "tanh at z = %g", z)
	}
	rel := math.Abs(plain(1e-8)/f64(ref(1e-8)) - 1)
	assert.Greater(t, rel, 1e-10, "the plain form loses about half its digits at z = 1e-8")
	assert.Less(t, rel, 1e-7)
}
