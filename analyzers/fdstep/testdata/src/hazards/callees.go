package hazards

// Model is evaluated through its methods.
type Model struct{ k float64 }

// Eval evaluates the model.
func (m *Model) Eval(x float64) float64 { return m.k * x * x }

// Curve is a function of one variable.
type Curve interface{ At(x float64) float64 }

// Problem holds its objective in a field.
type Problem struct{ F func(float64) float64 }

// A method.
func method(m *Model, x float64) float64 {
	return (m.Eval(x+h) - m.Eval(x)) / h // want `fixed forward-difference step h = 1e-08`
}

// An interface method.
func iface(c Curve, x float64) float64 {
	return (c.At(x+1e-5) - c.At(x-1e-5)) / 2e-5 // want `fixed central-difference step 1e-05`
}

// A func-typed field.
func field(p *Problem, x float64) float64 {
	return (p.F(x+h) - p.F(x)) / h // want `fixed forward-difference step h = 1e-08`
}

// A closure.
func closure(a, x float64) float64 {
	g := func(t float64) float64 { return a * t * t }
	return (g(x+h) - g(x)) / h // want `fixed forward-difference step h = 1e-08`
}

// A package function.
func cube(x float64) float64 { return x * x * x }

func plain(x float64) float64 {
	return (cube(x+h) - cube(x)) / h // want `fixed forward-difference step h = 1e-08`
}

// The step captured by a closure.
func captured(f func(float64) float64) func(float64) float64 {
	step := 1e-5
	return func(x float64) float64 {
		return (f(x+step) - f(x-step)) / (2 * step) // want `fixed central-difference step step = 1e-05`
	}
}
