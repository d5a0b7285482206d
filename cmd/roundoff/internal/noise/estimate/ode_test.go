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
// 1989; coefficients from memory, checked by the order test below) and the
// textbook halve-or-double step control: a step whose error estimate
// exceeds tol is retried at half the step, and the step doubles after a
// step whose error is below tol/32.
func integrate(rhs func(t, y float64) float64, y0, end, tol float64) float64 {
	t, y, h := 0.0, y0, 0.125
	for t < end {
		h = min(h, end-t)
		k1 := rhs(t, y)
		k2 := rhs(t+h/2, y+h/2*k1)
		k3 := rhs(t+3*h/4, y+3*h/4*k2)
		next := y + h*(2*k1+3*k2+4*k3)/9
		k4 := rhs(t+h, next)
		err := math.Abs(next - (y + h*(7*k1/24+k2/4+k3/3+k4/8)))
		if err > tol {
			h /= 2
			continue
		}
		t, y = t+h, next
		if err < tol/32 {
			h *= 2
		}
	}
	return y
}

// The model of the test: y' = cos(ωt)·y, y(0) = 1, with ω = x, integrated
// to T = span + x. Its solution is y(T) = exp(sin(ωT)/ω).
func model(tol float64) func(float64) float64 {
	return func(x float64) float64 {
		return integrate(func(t, y float64) float64 { return math.Cos(x*t) * y }, 1, span+x, tol)
	}
}

// span is the part of the integration time that does not depend on x:
// long enough for many step decisions to depend on x.
const span = 40

func exact(x float64) float64 { return math.Exp(math.Sin(x*(span+x)) / x) }

// exactDerivative is d/dx of exact: with p = x(span+x),
// y·(cos p·(span+2x)/x − sin p/x²).
func exactDerivative(x float64) float64 {
	p := x * (span + x)
	return exact(x) * (math.Cos(p)*(span+2*x)/x - math.Sin(p)/(x*x))
}

// The integrator converges: a tolerance 1000 times tighter gives an error
// at least 100 times smaller (Hairer, Nørsett & Wanner, Solving ODEs I,
// §II.4: the global error of tolerance-controlled steps is roughly
// proportional to the tolerance).
func TestIntegratorConverges(t *testing.T) {
	x := 1.5
	e1 := math.Abs(model(1e-6)(x) - exact(x))
	e2 := math.Abs(model(1e-9)(x) - exact(x))
	t.Logf("errors %.3g at tol 1e-6, %.3g at 1e-9", e1, e2)
	assert.Less(t, e1, 1e-4)
	assert.Less(t, e2, e1/100)
}

// An adaptive integrator run to a tolerance τ is a noisy function: its
// measured relative noise falls with τ, the recommended forward step
// follows sqrt(noise) (Moré & Wild 2012: h = 8^(1/4)·sqrt(noise/|f”|),
// with f” a property of the model), and the forward difference at that
// step, measured against the exact derivative, is within the error the
// step promises (times 10). The step where the measured error is least is
// logged: for this integrator it lies far below the recommended one,
// because between the x where a step decision flips the computed f is
// smooth, so a tiny step that falls between flips sees no noise at all.
func TestAdaptiveIntegrator(t *testing.T) {
	for _, x := range []float64{1.5, 2.2} {
		var noises, ratios []float64
		for _, tol := range []float64{1e-4, 1e-7, 1e-10} {
			f := model(tol)
			r := analyze(t, f, x)
			require.True(t, r.Forward.Measured, "x=%g τ=%g: %+v", x, tol, r.Tables)
			rel := r.Noise / math.Abs(r.F0)
			d := exactDerivative(x)
			got := math.Abs((f(x+r.Forward.H)-f(x))/r.Forward.H - d)
			t.Logf("x=%g τ=%g: relative noise %.3g, h_f %.3g, error there %.3g (expected %.3g), least error at h=%.3g",
				x, tol, rel, r.Forward.H, got, r.Forward.Error, measuredMinimum(f, x))
			assert.Less(t, got, 10*r.Forward.Error, "x=%g τ=%g", x, tol)
			noises = append(noises, rel)
			ratios = append(ratios, r.Forward.H/math.Sqrt(r.Noise))
		}
		assert.True(t, noises[0] > noises[1] && noises[1] > noises[2], "x=%g: noise falls with τ: %v", x, noises)
		assert.Less(t, slices.Max(ratios)/slices.Min(ratios), 3.0, "x=%g: h_f/sqrt(noise): %v", x, ratios)
	}
}

// measuredMinimum returns the step, on a grid of 10 to a decade, where the
// forward difference of f at x is closest to the exact derivative.
func measuredMinimum(f func(float64) float64, x float64) float64 {
	f0, d := f(x), exactDerivative(x)
	best, arg := math.Inf(1), 0.0
	for _, h := range estimate.Steps(1, 10) {
		h = (x + h) - x
		if e := math.Abs((f(x+h)-f0)/h - d); e < best {
			best, arg = e, h
		}
	}
	return arg
}
