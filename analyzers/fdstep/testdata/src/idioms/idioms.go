// Package idioms holds difference quotients and look-alikes that fdstep
// must leave alone. Each function says why.
package idioms

import (
	"math"
	"math/cmplx"
)

// The step scaled by max(1,|x|): computed from x, not fixed.
func scaledMax(f func(float64) float64, x float64) float64 {
	h := 1.4901161193847656e-08 * math.Max(1, math.Abs(x))
	return (f(x+h) - f(x)) / h
}

// The step scaled by 1+|x|.
func scaledOnePlus(f func(float64) float64, x float64) float64 {
	h := 6e-6 * (1 + math.Abs(x))
	return (f(x+h) - f(x-h)) / (2 * h)
}

// The recommended form: scaled, then made exactly representable
// (Numerical Recipes 3rd ed. §5.7).
func scaledRepresentable(f func(float64) float64, x float64) float64 {
	h := math.Sqrt(0x1p-52) * math.Max(1, math.Abs(x))
	h = (x + h) - x
	return (f(x+h) - f(x)) / h
}

// A step from a helper that scales it.
func stepFor(x float64) float64 { return 1e-8 * math.Max(1, math.Abs(x)) }

func helperStep(f func(float64) float64, x float64) float64 {
	h := stepFor(x)
	return (f(x+h) - f(x)) / h
}

// Per-component steps scaled in a gradient loop.
func gradScaled(f func([]float64) float64, x []float64) []float64 {
	g := make([]float64, len(x))
	f0 := f(x)
	for i := range x {
		xi := x[i]
		h := 1e-8 * math.Max(1, math.Abs(xi))
		x[i] = xi + h
		g[i] = (f(x) - f0) / h
		x[i] = xi
	}
	return g
}

// Per-component steps read from a slice the caller chose.
func gradSteps(f func([]float64) float64, x, steps []float64) []float64 {
	g := make([]float64, len(x))
	f0 := f(x)
	for i := range x {
		xi := x[i]
		x[i] = xi + steps[i]
		g[i] = (f(x) - f0) / steps[i]
		x[i] = xi
	}
	return g
}

// Sampled data on a grid: dx is the spacing of the data, not a chosen step.
func gridCentral(u []float64, dx float64, i int) float64 {
	return (u[i+1] - u[i-1]) / (2 * dx)
}

// A grid with a constant spacing.
func gridConst(u []float64) []float64 {
	const dx = 1e-3
	d := make([]float64, len(u))
	for i := 1; i+1 < len(u); i++ {
		d[i] = (u[i+1] - u[i-1]) / (2 * dx)
	}
	return d
}

// A second difference of grid data.
func gridSecond(u []float64, i int) float64 {
	const dx = 1e-4
	return (u[i+1] - 2*u[i] + u[i-1]) / (dx * dx)
}

// A complex-step derivative: no subtraction, so a tiny step is right
// (Squire & Trapp 1998).
func complexStep(f func(complex128) complex128, x float64) float64 {
	const h = 1e-20
	return imag(f(complex(x, h))) / h
}

// A measured time series, differenced sample by sample.
func velocity(pos []float64, dt float64) []float64 {
	v := make([]float64, len(pos)-1)
	for i := range v {
		v[i] = (pos[i+1] - pos[i]) / dt
	}
	return v
}

// A series sampled every millisecond, differenced by index.
func rate(sample func(int) float64, n int) float64 {
	const dt = 1e-3
	return (sample(n+1) - sample(n-1)) / (2 * dt)
}

// A time march: t moves by dt, so dt is the grid's spacing.
func march(pos func(float64) float64, t0, t1 float64) float64 {
	const dt = 1e-3
	peak := 0.0
	for t := t0; t < t1; t += dt {
		peak = math.Max(peak, (pos(t+dt)-pos(t))/dt)
	}
	return peak
}

// Grid points computed from the spacing: x = x0 + i·dx.
func gridPoints(f func(float64) float64, x0 float64, n int) []float64 {
	const dx = 1e-4
	d := make([]float64, n)
	for i := range d {
		x := x0 + float64(i)*dx
		d[i] = (f(x+dx) - f(x)) / dx
	}
	return d
}

// A discrete difference with a unit step: a difference, not a derivative.
func unitDifference(f func(float64) float64, x float64) float64 {
	return (f(x+1) - f(x)) / 1
}

// A step above 1e-2 whose truncation error, h²/6 ≈ 4e-4, keeps three
// digits: a smoothing scale, not a derivative at the limit.
func smoothed(f func(float64) float64, x float64) float64 {
	const w = 0.05
	return (f(x+w) - f(x-w)) / (2 * w)
}

// Different functions: not a difference quotient of one function.
func twoFunctions(f, g func(float64) float64, x float64) float64 {
	const h = 1e-8
	return (f(x+h) - g(x)) / h
}

// Different receivers.
type model struct{ k float64 }

func (m model) eval(x float64) float64 { return m.k * x }

func twoModels(a, b model, x float64) float64 {
	const h = 1e-8
	return (a.eval(x+h) - b.eval(x)) / h
}

// The denominator does not match the scheme: not recognised.
func mismatched(f func(float64) float64, x float64) float64 {
	const h = 1e-8
	return (f(x+h) - f(x-h)) / h
}

// A secant slope through two given points.
func secant(f func(float64) float64, x0, x1 float64) float64 {
	return (f(x1) - f(x0)) / (x1 - x0)
}

// A five-point stencil with its step scaled to x at eps^(1/5).
func fivePoint(f func(float64) float64, x float64) float64 {
	h := math.Pow(0x1p-52, 0.2) * math.Max(1, math.Abs(x))
	return (f(x-2*h) - 8*f(x-h) + 8*f(x+h) - f(x+2*h)) / (12 * h)
}

// A one-sided three-point stencil: not one of the recognised schemes.
func oneSided(f func(float64) float64, x float64) float64 {
	const h = 1e-3
	return (-3*f(x) + 4*f(x+h) - f(x+2*h)) / (2 * h)
}

// x fixed at 1: no scaling needed, and sqrt(eps) is the right size there.
func atOne(f func(float64) float64) float64 {
	const h = 1.5e-8
	x := 1.0
	return (f(x+h) - f(x)) / h
}

// x fixed at 2, a central step near eps^(1/3).
func atTwo(f func(float64) float64) float64 {
	x, h := 2.0, 6e-6
	return (f(x+h) - f(x-h)) / (2 * h)
}

// A complex function: the step is in the complex plane.
func complexForward(f func(complex128) complex128, z complex128) complex128 {
	const h = 1e-8
	return (f(z+h) - f(z)) / h
}

// An integer argument: a difference of a sequence.
func sequence(a func(int) float64, n int) float64 {
	return (a(n+1) - a(n)) / 1e-3
}

// A user-chosen step with a default scaled to x.
type options struct{ step float64 }

func withDefault(f func(float64) float64, x float64, o *options) float64 {
	h := o.step
	if h == 0 {
		h = 1.5e-8 * math.Max(1, math.Abs(x))
	}
	return (f(x+h) - f(x)) / h
}

// A step parameter whose callers all scale it.
func deriv(f func(float64) float64, x, h float64) float64 { // want deriv:"fdstep\\(forward step of deriv\\)"
	return (f(x+h) - f(x)) / h
}

func callScaled(f func(float64) float64, x float64) float64 {
	return deriv(f, x, 1e-8*math.Max(1, math.Abs(x)))
}

// A step reassigned in a loop: a sequence of steps, as in Richardson
// extrapolation, not one fixed step.
func richardson(f func(float64) float64, x float64) float64 {
	h, best := 0.1, 0.0
	for range 5 {
		best = (f(x+h) - f(x-h)) / (2 * h)
		h /= 2
	}
	return best
}

// A perturbation of a different slice than the one evaluated.
func unrelated(f func([]float64) float64, x, y []float64) float64 {
	const h = 1e-8
	y[0] += h
	return (f(x) - f(x)) / h
}

// Evaluations at points perturbed by different steps.
func twoSteps(f func(float64) float64, x float64) float64 {
	return (f(x+1e-8) - f(x-2e-8)) / 3e-8
}

// The absolute value of a complex difference: not a real quotient.
func modulus(f func(complex128) complex128, z complex128) float64 {
	const h = 1e-6
	return cmplx.Abs(f(z+h)-f(z)) / h
}

// A helper whose step a test chooses (see idioms_test.go): the constant is
// passed from a test file, where the step is deliberate.
func slope(f func(float64) float64, x, h float64) float64 { // want slope:"fdstep\\(central step of slope\\)"
	return (f(x+h) - f(x-h)) / (2 * h)
}
