package hazards

// deriv takes its step as a parameter: the constants its callers pass are
// judged where they are passed.
func deriv(f func(float64) float64, x, step float64) float64 { // want deriv:"fdstep\\(forward step of deriv\\)"
	return (f(x+step) - f(x)) / step
}

// wrap passes its own parameter on.
func wrap(f func(float64) float64, x, step float64) float64 { // want wrap:"fdstep\\(forward step of wrap\\)"
	return deriv(f, x, step)
}

func useDeriv(f func(float64) float64, x float64) float64 {
	return deriv(f, x, 1e-8) // want `fixed forward-difference step 1e-08 \(passed as step to deriv\) does not scale with x: x\+h rounds to x for \|x\| ≥ 1.34e\+08`
}

func useWrap(f func(float64) float64, x float64) float64 {
	return wrap(f, x, 1e-13) // want `fixed forward-difference step 1e-13 \(passed as step to wrap\) is too small: expected error ~0.0044 at this step`
}

// slope mixes schemes on one parameter; the worst is reported.
func slope(f func(float64) float64, x, step float64, left bool) float64 { // want slope:"fdstep\\(backward step of slope, central step of slope\\)"
	if left {
		return (f(x) - f(x-step)) / step
	}
	return (f(x+step) - f(x-step)) / (2 * step)
}

func useSlope(f func(float64) float64, x float64) float64 {
	return slope(f, x, 1e-9, false) // want `fixed central-difference step 1e-09 \(passed as step to slope\) is too small: expected error ~2.2e-07 at this step against ~4.3e-11`
}

// Settings carries a step in a field.
type Settings struct {
	Step float64 // want Step:"fdstep\\(forward step of Diff\\)"
	Tol  float64
}

// Diff differentiates with the settings' step.
func (s Settings) Diff(f func(float64) float64, x float64) float64 {
	return (f(x+s.Step) - f(x)) / s.Step
}

var defaults = Settings{Step: 1e-6, Tol: 1e-9} // want `fixed forward-difference step 1e-06 \(stored in field Step, read by Diff\) does not scale with x`

func tighten(s *Settings) {
	s.Step = 1e-12 // want `fixed forward-difference step 1e-12 \(stored in field Step, read by Diff\) is too small`
	s.Tol = 1e-12  // not a step
}
