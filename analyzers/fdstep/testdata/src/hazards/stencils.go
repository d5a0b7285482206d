package hazards

// Five-point first derivative with a fixed step: fourth order, optimal
// near eps^(1/5) ≈ 7.4e-4 relative to max(1,|x|).
func fivePointFixed(f func(float64) float64, x float64) float64 {
	const s = 1e-3
	return (f(x-2*s) - 8*f(x-s) + 8*f(x+s) - f(x+2*s)) / (12 * s) // want `fixed five-point-difference step 0.001 does not scale with x: x\+h rounds to x for \|x\| ≥ 1.76e\+13 in float64, where the difference vanishes; use h = eps\^\(1/5\)·max\(1,\|x\|\) ≈ 0.00074·max\(1,\|x\|\)`
}

// Five-point second derivative with a step far below its optimum
// eps^(1/6) ≈ 2.5e-3: 16·eps/(3h²) ≈ 1.2e-7 against ~2e-10.
func fivePointSecond(f func(float64) float64, x float64) float64 {
	const s = 1e-4
	return (-f(x+2*s) + 16*f(x+s) - 30*f(x) + 16*f(x-s) - f(x-2*s)) / (12 * s * s) // want `fixed five-point second-difference step 0.0001 is too small: expected error ~1.2e-07 at this step against ~2e-10 at h = eps\^\(1/6\)·max\(1,\|x\|\) ≈ 0.00246·max\(1,\|x\|\)`
}

// A forward step of 0.1: truncation error h/2 ≈ 0.05 for unit derivatives.
func coarseForward(f func(float64) float64, x float64) float64 {
	return (f(x+0.1) - f(x)) / 0.1 // want `fixed forward-difference step 0.1 is too large for a derivative: truncation error ~0.05 at this step for f and its derivatives of unit size, against ~3.7e-08 at h = sqrt\(eps\)·max\(1,\|x\|\) ≈ 1.49e-08·max\(1,\|x\|\) \(float64\)`
}

// A central step of 0.1: truncation error h²/6 ≈ 1.7e-3.
func coarseCentral(f func(float64) float64, x float64) float64 {
	const w = 0.1
	return (f(x+w) - f(x-w)) / (2 * w) // want `fixed central-difference step w = 0.1 is too large for a derivative: truncation error ~0.0017`
}

// A central difference with the step written as a multiple, 3*s.
func tripled(f func(float64) float64, x float64) float64 {
	const s = 1e-6
	return (f(x+3*s) - f(x-3*s)) / (6 * s) // want `fixed central-difference step 3e-06 does not scale with x`
}

// A chosen step with a fixed default: the default is a fixed step.
type config struct{ Step float64 } // want Step:"fdstep\\(central step of defaulted\\)"

func defaulted(f func(float64) float64, x float64, cfg config) float64 {
	h := cfg.Step
	if h == 0 {
		h = 1e-8
	}
	return (f(x+h) - f(x-h)) / (2 * h) // want `fixed default central-difference step 1e-08 is too small: expected error ~2.2e-08 at this step against ~4.3e-11`
}
