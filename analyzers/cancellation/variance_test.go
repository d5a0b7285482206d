package cancellation_test

import (
	"math"
	"math/big"
	"slices"
	"testing"
)

// TestOnePassVariance checks the loss the variance rule quotes: for data
// m±1 the population variance is exactly 1 (a known identity), but
// E[x²]-E[x]² computed in float64 keeps about 16 - log10(m²) digits of it
// (Higham 2002, §1.9, on the one-pass formula) while the sum of squared
// deviations stays exact.
func TestOnePassVariance(t *testing.T) {
	for _, m := range []float64{1e4, 1e6, 1e8} {
		xs := []float64{m - 1, m + 1, m - 1, m + 1}
		var s1, s2 float64
		for _, x := range xs {
			s1 += x
			s2 += x * x
		}
		n := float64(len(xs))
		mean := s1 / n
		onePass := s2/n - mean*mean
		var d2 float64
		for _, x := range xs {
			d2 += (x - mean) * (x - mean)
		}
		if twoPass := d2 / n; twoPass != 1 {
			t.Errorf("m = %g: two-pass variance %v, want exactly 1", m, twoPass)
		}
		// Each term is about m² and carries an absolute error of about
		// u·m², the bound on what the difference can lose.
		bound := 4 * 0x1p-53 * m * m
		if err := math.Abs(onePass - 1); err > bound {
			t.Errorf("m = %g: one-pass error %g beyond the bound %g", m, err, bound)
		}
		if m == 1e8 && onePass == 1 {
			t.Errorf("m = 1e8: one-pass variance exact; the rule's premise fails")
		}
	}
}

// TestNormalTailFix checks the tail fix 1 - 0.5*Erfc(-x) -> 0.5*Erfc(x)
// by the identity erfc(-x) = 2 - erfc(x) (Abramowitz & Stegun 7.1.9,
// from memory): the forms agree to a few ulps where the tail is large, and
// the plain form is 0 where the tail is below u.
func TestNormalTailFix(t *testing.T) {
	for _, x := range []float64{-2, -0.5, 0, 0.5, 1, 2} {
		plain, fixed := 1-0.5*math.Erfc(-x), 0.5*math.Erfc(x)
		if d := math.Abs(plain - fixed); d > 4*0x1p-53 {
			t.Errorf("x = %g: 1-0.5*Erfc(-x) = %v, 0.5*Erfc(x) = %v", x, plain, fixed)
		}
	}
	if plain, fixed := 1-0.5*math.Erfc(-9), 0.5*math.Erfc(9); plain != 0 || fixed <= 0 {
		t.Errorf("x = 9: plain %v (want 0), fixed %v (want > 0)", plain, fixed)
	}
}

// TestFitResidual checks the premise of the residual rule on data lying
// on the line y = 3x + 0.1 up to the rounding of y, far from the origin.
// With centred moments (two passes), Syy - Sxy²/Sxx equals the residual
// sum of squares in exact arithmetic (Cauchy–Schwarz makes it ≥ 0); in
// float64 it keeps only the rounding of its terms, an error of the order
// u·Syy, and comes out negative on some data sets, while the squared
// residuals of the fitted line, summed in a second pass, stay within a
// rounding of each residual (Higham 2002, §3.1, bounds of that kind). The
// exact residual sum comes from math/big at 400 bits.
func TestFitResidual(t *testing.T) {
	const u = 0x1p-53
	negative := 0
	for k := range 200 {
		m := 1e3 * float64(k+1)
		var xs, ys []float64
		for i := range 10 {
			x := m + 0.7*float64(i*i)
			xs, ys = append(xs, x), append(ys, 3*x+0.1)
		}
		sxx, sxy, syy, mx, my := centred(xs, ys)
		formula := syy - sxy*sxy/sxx
		exact, spread := exactResidual(xs, ys)
		if err := math.Abs(formula - exact); err > 8*u*syy {
			t.Errorf("m = %g: Syy - Sxy²/Sxx off by %g, beyond 8u·Syy = %g", m, err, 8*u*syy)
		}
		if formula < 0 {
			negative++
		}
		b := sxy / sxx
		a := my - b*mx
		var sse float64
		for i := range xs {
			r := ys[i] - a - b*xs[i]
			sse += r * r
		}
		// Each residual is within 8u·max|y| of the exact one, whose sizes
		// sum to spread.
		d := 8 * u * slices.Max(ys)
		if bound := float64(len(xs))*d*d + 2*d*spread; math.Abs(sse-exact) > bound {
			t.Errorf("m = %g: second-pass residual sum off by %g, beyond %g", m, math.Abs(sse-exact), bound)
		}
	}
	if negative == 0 {
		t.Errorf("Syy - Sxy²/Sxx never negative on an exact line: the rule's premise fails")
	}
}

// centred returns the two-pass second moments of xs and ys and their means.
func centred(xs, ys []float64) (sxx, sxy, syy, mx, my float64) {
	for i := range xs {
		mx += xs[i]
		my += ys[i]
	}
	mx /= float64(len(xs))
	my /= float64(len(ys))
	for i := range xs {
		dx, dy := xs[i]-mx, ys[i]-my
		sxx += dx * dx
		sxy += dx * dy
		syy += dy * dy
	}
	return sxx, sxy, syy, mx, my
}

// exactResidual returns the residual sum of squares of the least-squares
// line through the float64 data, and the sum of the absolute residuals,
// computed in math/big at 400 bits.
func exactResidual(xs, ys []float64) (sse, spread float64) {
	f := func(v float64) *big.Float { return new(big.Float).SetPrec(400).SetFloat64(v) }
	n := f(float64(len(xs)))
	mx, my := f(0), f(0)
	for i := range xs {
		mx.Add(mx, f(xs[i]))
		my.Add(my, f(ys[i]))
	}
	mx.Quo(mx, n)
	my.Quo(my, n)
	sxx, sxy := f(0), f(0)
	for i := range xs {
		dx, dy := f(xs[i]), f(ys[i])
		dx.Sub(dx, mx)
		dy.Sub(dy, my)
		sxy.Add(sxy, new(big.Float).Mul(dx, dy))
		sxx.Add(sxx, new(big.Float).Mul(dx, dx))
	}
	b := new(big.Float).Quo(sxy, sxx)
	a := new(big.Float).Sub(my, new(big.Float).Mul(b, mx))
	total, abs := f(0), f(0)
	for i := range xs {
		r := f(ys[i])
		r.Sub(r, a)
		r.Sub(r, new(big.Float).Mul(b, f(xs[i])))
		total.Add(total, new(big.Float).Mul(r, r))
		abs.Add(abs, new(big.Float).Abs(r))
	}
	sse, _ = total.Float64()
	spread, _ = abs.Float64()
	return sse, spread
}
