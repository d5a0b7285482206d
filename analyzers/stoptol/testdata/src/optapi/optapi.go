// Package optapi offers a golden-section minimizer configured by a field
// and a parameter.
package optapi

// Options configures Minimize.
type Options struct {
	XTol float64 // want XTol:"an absolute x-tolerance of a minimization in Minimize"
}

// Minimize searches [a, b] for a minimum of f to within o.XTol.
func Minimize(f func(float64) float64, a, b float64, o Options) float64 {
	for i := 0; i < 200; i++ {
		c, d := b-0.618*(b-a), a+0.618*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if b-a < o.XTol {
			break
		}
	}
	return a
}

// Root bisects [a, b] for a zero of f to within tol.
func Root(f func(float64) float64, a, b, tol float64) float64 { // want Root:"parameter 3 is an absolute x-tolerance of a root finding in Root"
	for i := 0; i < 200; i++ {
		m := a + (b-a)/2
		if f(a)*f(m) <= 0 {
			b = m
		} else {
			a = m
		}
		if b-a < tol {
			break
		}
	}
	return a
}
