package hazards

import "slices"

// In place, then restored.
func gradInPlace(f func([]float64) float64, x []float64) []float64 {
	g := make([]float64, len(x))
	f0 := f(x)
	for i := range x {
		xi := x[i]
		x[i] = xi + h
		g[i] = (f(x) - f0) / h // want `fixed forward-difference step h = 1e-08 does not scale with x`
		x[i] = xi
	}
	return g
}

// A central gradient in place.
func gradCentral(f func([]float64) float64, x []float64) []float64 {
	const d = 1e-5
	g := make([]float64, len(x))
	for i := range x {
		xi := x[i]
		x[i] = xi + d
		fp := f(x)
		x[i] = xi - d
		fm := f(x)
		x[i] = xi
		g[i] = (fp - fm) / (2 * d) // want `fixed central-difference step d = 1e-05 does not scale with x`
	}
	return g
}

// On a copy.
func gradCopy(f func([]float64) float64, x []float64) []float64 {
	g := make([]float64, len(x))
	xc := make([]float64, len(x))
	f0 := f(x)
	for i := range x {
		copy(xc, x)
		xc[i] += h
		g[i] = (f(xc) - f0) / h // want `fixed forward-difference step h = 1e-08`
	}
	return g
}

// On clones.
func gradClone(f func([]float64) float64, x []float64) []float64 {
	const d = 1e-8
	g := make([]float64, len(x))
	for i := range x {
		xp := slices.Clone(x)
		xm := slices.Clone(x)
		xp[i] += d
		xm[i] -= d
		g[i] = (f(xp) - f(xm)) / (2 * d) // want `fixed central-difference step d = 1e-08 is too small: expected error ~2.2e-08`
	}
	return g
}

// A Jacobian column of a vector function, in place.
func jacobian(f func([]float64) []float64, x []float64, j int) []float64 {
	col := make([]float64, len(x))
	xj := x[j]
	x[j] += h
	fp := f(x)
	x[j] = xj
	f0 := f(x)
	for i := range col {
		col[i] = (fp[i] - f0[i]) / h // want `fixed forward-difference step h = 1e-08`
	}
	return col
}
