package estimate_test

import (
	"math"
	"slices"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"roundoff/cmd/roundoff/internal/noise/estimate"
)

// integrate solves y' = rhs(t, y), y(0) = y0, to time end with the
// Bogacki–Shampine 3(2) embedded Runge–Kutta pair (Bogacki & Shampine
// 1989; coefficients from memory, checked by the convergence test below)
// and the standard step control h·min(5, max(0.2, 0.9·(tol/err)^(1/3)))
// (Hairer, Nørsett & Wanner, Solving ODEs I, §II.4).
func integrate(rhs func(t, y float64) float64, y0, end, tol float64) float64 {
	t, y, h := 0.0, y0, 0.01
	for t < end {
		h = min(h, end-t)
		k1 := rhs(t, y)
		k2 := rhs(t+h/2, y+h/2*k1)
		k3 := rhs(t+3*h/4, y+3*h/4*k2)
		next := y + h*(2*k1+3*k2+4*k3)/9
		k4 := rhs(t+h, next)
		err := math.Abs(next - (y + h*(7*k1/24+k2/4+k3/3+k4/8)))
		fac := 0.9 * math.Cbrt(tol/max(err, 1e-300))
		if err > tol {
			h *= max(0.2, fac)
			continue
		}
		t, y = t+h, next
		h *= min(5, fac)
	}
	return y
}

// The model of the test is stiff: y' = −a·(y − cos t), y(0) = 1, with
// a = 100·x, integrated to T = 20 + x. An explicit pair keeps its step
// near the stability limit there, and the accepted and rejected steps
// follow an erratic pattern (Hairer & Wanner, Solving ODEs II, §IV.2), so
// the result carries noise of the order of the tolerance, as simulations
// run with explicit codes do. The solution is
// y(T) = c·(cos T + sin T/a) + (1−c)·e^(−aT), c = a²/(a²+1).
func model(tol float64) func(float64) float64 {
	return func(x float64) float64 {
		return integrate(func(t, y float64) float64 { return -100 * x * (y - math.Cos(t)) }, 1, 20+x, tol)
	}
}

func exact(x float64) float64 {
	a, t := 100*x, 20+x
	c := a * a / (a*a + 1)
	return c*(math.Cos(t)+math.Sin(t)/a) + (1-c)*math.Exp(-a*t)
}

// exactDerivative differentiates exact by the fourth-order central
// difference at h = 1e-4, whose error (about h⁴·|f⁽⁵⁾|/30 + eps/h ≈ 1e-12
// here) is far below every error this test compares (Numerical Recipes
// 3rd ed. §5.7).
func exactDerivative(x float64) float64 {
	const h = 1e-4
	return (8*(exact(x+h)-exact(x-h)) - (exact(x+2*h) - exact(x-2*h))) / (12 * h)
}

// The integrator converges: a tolerance 1000 times tighter gives an error
// at least 100 times smaller (Hairer, Nørsett & Wanner, Solving ODEs I,
// §II.4: the global error of tolerance-controlled steps is roughly
// proportional to the tolerance).
func TestIntegratorConverges(t *testing.T) {
	x := 1.5
	e1 := math.Abs(model(1e-5)(x) - exact(x))
	e2 := math.Abs(model(1e-8)(x) - exact(x))
	t.Logf("errors %.3g at tol 1e-5, %.3g at 1e-8", e1, e2)
	assert.Less(t, e1, 1e-3)
	assert.Less(t, e2, e1/100)
}

// An adaptive integrator run to a tolerance τ is a noisy function: its
// measured relative noise falls with τ, the recommended forward step
// follows sqrt(noise) (Moré & Wild 2012: h = 8^(1/4)·sqrt(noise/|f”|),
// with f” a property of the model) and lies within a factor 10 of the
// step where the forward-difference error, measured against the exact
// derivative, is least.
func TestAdaptiveIntegrator(t *testing.T) {
	if testing.Short() {
		t.Skip("about 20 s of integrations")
	}
	for _, x := range []float64{1.5, 2.2} {
		var noises, ratios []float64
		for _, tol := range []float64{1e-4, 1e-6, 1e-8} {
			f := model(tol)
			r := analyze(t, f, x)
			require.True(t, r.Forward.Measured, "x=%g τ=%g", x, tol)
			rel := r.Noise / math.Abs(r.F0)
			least := measuredMinimum(f, x)
			t.Logf("x=%g τ=%g: relative noise %.3g, h_f %.3g, least error at h=%.3g", x, tol, rel, r.Forward.H, least)
			assert.True(t, r.Forward.H > least/10 && r.Forward.H < 10*least, "x=%g τ=%g: step %g, least error at %g", x, tol, r.Forward.H, least)
			noises = append(noises, rel)
			ratios = append(ratios, r.Forward.H/math.Sqrt(r.Noise))
		}
		assert.True(t, noises[0] > noises[1] && noises[1] > noises[2], "x=%g: noise falls with τ: %v", x, noises)
		assert.Less(t, slices.Max(ratios)/slices.Min(ratios), 3.0, "x=%g: h_f/sqrt(noise): %v", x, ratios)
	}
}

// measuredMinimum returns the step, on a grid of 10 to a decade, where the
// forward difference of f is closest to the exact derivative in the root
// mean square over 8 points near x: the error the noise model predicts is
// such a mean, and one point alone can be lucky.
func measuredMinimum(f func(float64) float64, x float64) float64 {
	best, arg := math.Inf(1), 0.0
	for _, h := range estimate.Steps(1, 10) {
		s := 0.0
		for i := range 8 {
			xi := x + 0.01*float64(i)
			e := (f(xi+h)-f(xi))/h - exactDerivative(xi)
			s += e * e
		}
		if s < best {
			best, arg = s, h
		}
	}
	return arg
}
