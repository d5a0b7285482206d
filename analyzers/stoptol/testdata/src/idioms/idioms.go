// Package idioms holds stopping tests that are right and must not be
// reported.
package idioms

import "math"

const invPhi = 0.6180339887498949

const sqrtEps = 0x1p-26

func goldenSqrtEps(f func(float64) float64, a, b float64) float64 {
	for i := 0; i < 200; i++ {
		c, d := b-invPhi*(b-a), a+invPhi*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if b-a < sqrtEps*(1+math.Abs(a)) { // scaled, and at sqrt(eps)
			break
		}
	}
	return a
}

func goldenLoose(f func(float64) float64, a, b float64) float64 {
	for i := 0; i < 200; i++ {
		c, d := b-invPhi*(b-a), a+invPhi*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if math.Abs(b-a) < 1e-6 { // above sqrt(eps), with a cap
			break
		}
	}
	return a
}

func goldenBrentTol(f func(float64) float64, a, b, t float64) float64 {
	for i := 0; i < 200; i++ {
		c, d := b-invPhi*(b-a), a+invPhi*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		x := (a + b) / 2
		tol := sqrtEps*math.Abs(x) + t/3 // Brent's mixed tolerance
		if b-a <= 2*tol {
			break
		}
	}
	return a
}

func goldenRelSqrt(f func(float64) float64, a, b float64) float64 {
	for i := 0; i < 200; i++ {
		c, d := b-invPhi*(b-a), a+invPhi*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if math.Abs(b-a) <= 2e-8*math.Abs(b) { // relative, above sqrt(eps)
			break
		}
	}
	return a
}

func bisectFewEps(f func(float64) float64, a, b float64) float64 {
	for i := 0; i < 100; i++ {
		m := a + (b-a)/2
		if f(a)*f(m) <= 0 {
			b = m
		} else {
			a = m
		}
		if b-a <= 4*0x1p-52*math.Abs(m) { // a few eps relative to |x|: bisection gets there
			break
		}
	}
	return a
}

func bisectUntilEndsMeet(f func(float64) float64, a, b float64) float64 {
	for {
		m := a + (b-a)/2
		if m == a || m == b { // the same stop written with ==: m lands on an end
			return m
		}
		if f(a)*f(m) <= 0 {
			b = m
		} else {
			a = m
		}
	}
}

func bisectNoFloatLeft(f func(float64) float64, a, b float64) float64 {
	for {
		m := a + (b-a)/2
		if m <= a || m >= b { // no float left between: always stops
			return m
		}
		if f(a)*f(m) <= 0 {
			b = m
		} else {
			a = m
		}
	}
}

func bisectSane(f func(float64) float64, a, b float64) float64 {
	for i := 0; i < 100; i++ {
		m := a + (b-a)/2
		if f(a)*f(m) <= 0 {
			b = m
		} else {
			a = m
		}
		if b-a < 1e-6 { // absolute but above sqrt(eps), with a cap
			break
		}
	}
	return a
}

func bisectScaled(f func(float64) float64, a, b, tol float64) float64 { // want bisectScaled:"parameter 3 is a relative x-tolerance of a root finding in bisectScaled"
	for i := 0; i < 100; i++ {
		m := a + (b-a)/2
		if f(a)*f(m) <= 0 {
			b = m
		} else {
			a = m
		}
		if b-a < tol*(1+math.Abs(m)) { // scaled by |x|
			break
		}
	}
	return a
}

func brentZeroTol(f func(float64) float64, a, b, t float64) float64 {
	fa, fb := f(a), f(b)
	c, fc := a, fa
	for i := 0; i < 100; i++ {
		if fb*fc > 0 {
			c, fc = a, fa
		}
		if math.Abs(fc) < math.Abs(fb) {
			a, b, c = b, c, b
			fa, fb, fc = fb, fc, fb
		}
		tol := 2*0x1p-52*math.Abs(b) + t/2 // Brent's zero tolerance
		m := (c - b) / 2
		if math.Abs(m) <= tol || fb == 0 {
			return b
		}
		a, fa = b, fb
		b += m
		fb = f(b)
	}
	return b
}

func newtonSane(f, df func(float64) float64, x float64) float64 {
	for i := 0; i < 50; i++ {
		dx := f(x) / df(x)
		x -= dx
		if math.Abs(dx) <= 1e-15*math.Abs(x) { // relative, a few eps: Newton gets there
			break
		}
	}
	return x
}

func newtonResidual(f, df func(float64) float64, x float64) float64 {
	for i := 0; i < 50; i++ {
		fx := f(x)
		if math.Abs(fx) < 1e-14 { // a residual, not x: epsfloor's if anyone's
			break
		}
		x -= fx / df(x)
	}
	return x
}

func seriesSum(x float64) float64 {
	sum, term := 1.0, 1.0
	for n := 1; n < 100; n++ {
		term *= x / float64(n)
		sum += term
		if math.Abs(term) < 1e-16*math.Abs(sum) { // series convergence, not x
			break
		}
	}
	return sum
}

func unknownLoop(xs []float64) float64 {
	prev, cur := 0.0, 1.0
	for i := 0; i < 10; i++ {
		prev, cur = cur, (cur+xs[i%len(xs)])/2
		if math.Abs(cur-prev) < 1e-12 { // neither a minimization nor a root finding
			break
		}
	}
	return cur
}

func backtrackFloor(f func(float64) float64, x, d, g float64) float64 {
	t := 1.0
	fx := f(x)
	for f(x+t*d) > fx+1e-4*t*g*d {
		t *= 0.5
		if t < 1e-10 { // a floor on the step
			return 0
		}
	}
	return t
}

func backtrackCapped(f func(float64) float64, x, d, g float64) float64 {
	t := 1.0
	fx := f(x)
	for i := 0; i < 40 && f(x+t*d) > fx+1e-4*t*g*d; i++ { // capped
		t *= 0.5
	}
	return t
}

func cappedParam(f func(float64) float64, a, b, tol float64) float64 { // want cappedParam:"parameter 3 is an absolute x-tolerance of a root finding in cappedParam"
	for i := 0; i < 100; i++ {
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

func saneCaller(f func(float64) float64) float64 {
	return cappedParam(f, 0, 1, 1e-6) + cappedParam(f, 0, 1, 0) // a sane tolerance, and zero (exact on purpose)
}

func rangeLoop(f func(float64) float64, a, b float64) float64 {
	for range 60 { // a range over an int is capped by construction
		m := a + (b-a)/2
		if f(a)*f(m) <= 0 {
			b = m
		} else {
			a = m
		}
	}
	return a
}

func otherExit(f func(float64) float64, a, b float64, done func() bool) float64 {
	for b-a > 1e-6 {
		if done() { // another way out: not only the tolerance test
			return a
		}
		m := a + (b-a)/2
		if f(a)*f(m) <= 0 {
			b = m
		} else {
			a = m
		}
	}
	return a
}

func gradientScaled(gnorm, f float64) bool {
	return gnorm < 1e-8*(1+math.Abs(f)) // scaled by |f|
}

func gradientLoose(gnorm float64) bool {
	return gnorm < 1e-6 // loose enough
}

func notGradient(rnorm float64) bool {
	return rnorm < 1e-12 // a residual norm, not a gradient
}

func underflowGuard(f func(float64) float64, a, b float64) float64 {
	for i := 0; i < 100; i++ {
		m := a + (b-a)/2
		if f(a)*f(m) <= 0 {
			b = m
		} else {
			a = m
		}
		if b-a < 0x1p-1022 { // an underflow guard, not a tolerance
			break
		}
	}
	return a
}

func belowEps(f func(float64) float64, a, b float64) float64 {
	for i := 0; i < 100; i++ {
		m := a + (b-a)/2
		if f(a)*f(m) <= 0 {
			b = m
		} else {
			a = m
		}
		if math.Abs(b-a) < 1e-20 { // below eps: epsfloor reports it, stoptol stays silent
			break
		}
	}
	return a
}

func minimizeFloat32Sane(f func(float32) float32, a, b float32) float32 {
	for i := 0; i < 60; i++ {
		c, d := b-0.618*(b-a), a+0.618*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if b-a < 1e-3 { // above float32's sqrt(eps), 3.45e-4
			break
		}
	}
	return a
}

func gridSearch(f func(float64) float64, lo, hi float64) float64 {
	best, bestF := lo, f(lo)
	for x := lo; x <= hi; x += 0.01 { // a scan, not a stopping test
		if fx := f(x); fx < bestF {
			best, bestF = x, fx
		}
	}
	return best
}

func timeLoop(t0, t1, dt float64, step func(float64)) {
	for t := t0; t1-t > 1e-12; t += dt { // integration in time: ends because t grows
		step(t)
	}
}

func coefficient(n float64) float64 { return 1 / (n * n) }

func seriesTight(x float64) float64 {
	res, xfac := 0.0, 1.0
	for n := 1; n < 60; n++ {
		nf := float64(n)
		xfac *= -x
		coeff := coefficient(nf) * xfac / nf // a series term, not a Newton step: it does not involve res
		res += coeff
		if math.Abs(coeff) < 1e-17*math.Abs(res) {
			break
		}
	}
	return res
}

func newtonLoose(f, df func(float64) float64, x float64) float64 {
	for i := 0; i < 30; i++ {
		dx := f(x) / df(x)
		x -= dx
		if math.Abs(dx) < 1e-6 { // absolute but loose, with a cap
			break
		}
	}
	return x
}

func secantScaled(f func(float64) float64, x0, x1 float64) float64 {
	f0, f1 := f(x0), f(x1)
	for i := 0; i < 60; i++ {
		x2 := x1 - f1*(x1-x0)/(f1-f0)
		x0, f0 = x1, f1
		x1, f1 = x2, f(x2)
		if math.Abs(x1-x0) <= 1e-12*(1+math.Abs(x1)) { // relative: Newton-type methods get there
			break
		}
	}
	return x1
}

// A bound with one float inside: passed to a bool helper alone it is a
// record being learned, not a comparison of two values.
type bound struct {
	name  string
	limit float64
}

// spreadBounds learns bounds until nothing changes: the loop ends on a
// set that stops growing, not on a float test, although learn takes a
// value that holds a float.
func spreadBounds(learn func(b bound) bool, bs []bound) {
	for changed := true; changed; {
		changed = false
		for _, b := range bs {
			changed = learn(b) || changed
		}
	}
}
