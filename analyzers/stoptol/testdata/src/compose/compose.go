// Package compose passes tolerances through wrappers, fields, slices and
// test tables before they reach a stopping test.
package compose

import "math"

// refine is a golden-section search; its tolerance is absolute.
func refine(f func(float64) float64, a, b, tol float64) float64 { // want refine:"parameter 3 is an absolute x-tolerance of a minimization in refine"
	const g = 0.6180339887498949
	for i := 0; i < 300; i++ {
		c, d := b-g*(b-a), a+g*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if math.Abs(b-a) < tol {
			break
		}
	}
	return (a + b) / 2
}

// around wraps refine; near wraps around: wrappers of wrappers.
func around(f func(float64) float64, x, width, tol float64) float64 { // want around:"parameter 3 is an absolute x-tolerance of a minimization in refine"
	return refine(f, x-width, x+width, tol)
}

func near(f func(float64) float64, x, tol float64) float64 { // want near:"parameter 2 is an absolute x-tolerance of a minimization in refine"
	if tol == 0 {
		tol = 1e-13 // want `1e-13, given as the default of tol, passed as tol to around \(an absolute x-tolerance of a minimization in refine\), is too tight`
	}
	return around(f, x, 1, tol)
}

func useNear(f func(float64) float64) float64 {
	return near(f, 2, 1e-12) // want `1e-12, passed as tol to near \(an absolute x-tolerance of a minimization in refine\), is too tight`
}

// Options hands its tolerance on to refine.
type Options struct {
	Tol float64 // want Tol:"an absolute x-tolerance of a minimization in refine"
}

func (o Options) solve(f func(float64) float64) float64 {
	return refine(f, 0, 1, o.Tol)
}

var strict = Options{Tol: 1e-14} // want `1e-14, set as field Tol \(an absolute x-tolerance of a minimization in refine\), is too tight`

// sweep takes its tolerances from a slice filled with one value.
func sweep(f func(float64) float64) []float64 {
	tols := make([]float64, 3)
	for i := range tols {
		tols[i] = 1e-15 // want `1e-15, stored in tols\[i\], passed as tol to refine \(an absolute x-tolerance of a minimization in refine\), is too tight`
	}
	var out []float64
	for i := range tols {
		out = append(out, refine(f, 0, 1, tols[i]))
	}
	for _, t := range []float64{1e-4, 1e-3} {
		out = append(out, refine(f, 0, 1, t)) // loose tolerances: above sqrt(eps)
	}
	return out
}
