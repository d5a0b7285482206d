// Package idioms holds look-alikes that lose nothing, and code already in
// the accurate form; none may be reported.
package idioms

import (
	"math"
	"math/rand/v2"
)

func accurate(x, y, a, b float64) float64 {
	s := math.Log1p(x) + math.Expm1(y)                         // already the accurate forms
	s += 2 * math.Sin(x/2) * math.Sin(x/2)                     // already the sine form
	s += math.Hypot(x, y)                                      // already scaled
	s += math.Max(a, b) + math.Log1p(math.Exp(-math.Abs(a-b))) // shifted log-sum-exp
	return s
}

func logTwoPlus(x float64) float64 {
	return math.Log(2 + x) // 2+x keeps the digits of a small x
}

func logMinusOne(x float64) float64 {
	return math.Log(x - 1) // x-1 is exact near 1 (Sterbenz); no 1 is added to a small value
}

func expMinusTwo(x float64) float64 {
	return math.Exp(x) - 2 // exp(x) - 2 cancels only near x = ln 2, where Expm1 does not help
}

func wholeNumbers(n, k int) float64 {
	a := math.Log(1 + float64(n)) // a converted integer is 0 or at least 1: no digit is lost
	b := math.Exp(float64(k)) - 1 // likewise
	c := 1 - math.Cos(float64(n))
	return a * b * c
}

func constants() float64 {
	return math.Log(1+0.5) * (1 - math.Cos(math.Pi/3)) // constant arguments: known not small
}

func expm1Guarded(x float64) float64 {
	if x < -0.5 || x > 0.5 { // the branch keeps |x| above 0.5: at most about a bit is lost
		return math.Exp(x) - 1
	}
	return x * (1 + x/2)
}

func cosm1Guarded(x float64) float64 {
	const quarter = math.Pi / 4
	if x < -quarter || x > quarter {
		return math.Cos(x) - 1 // |x| > π/4
	}
	return -x * x / 2
}

func log1pEarlyExit(x float64) float64 {
	if math.Abs(x) < 1e-5 {
		return x - x*x/2 // small x handled by a series
	}
	return math.Log(1 + x) // |x| >= 1e-5 here
}

func negativeBranch(x float64) float64 {
	switch {
	case x < -1:
		return math.Log(1 - x) // 1-x > 2: nothing lost
	case x > 1:
		return math.Log(1 + x)
	}
	return 0
}

func guardedElse(x, tiny float64) float64 {
	if math.Abs(x) <= tiny {
		return 0
	} else {
		return 1 - math.Cos(x) // the else branch has |x| > tiny
	}
}

func notSmall(x float64) float64 {
	if !(math.Abs(x) < 0.25) {
		return math.Log(1 + x)
	}
	return x
}

func addedToLarger(mu, scale, p float64) float64 {
	return mu + scale*math.Log(1-p) // the absolute error of a small term added to mu is what counts
}

// A term of a sum divided by something other than a factor of its small
// argument stays small, and the sum hides its relative error.
func spreadTerm(mu, a, m, n float64) float64 {
	return mu + math.Log(1+a*m)/n
}

func logLikelihood(ps []float64, base float64) float64 {
	ll := base
	for _, p := range ps {
		ll += math.Log(1 - p) // accumulated into a sum
	}
	return ll
}

func termVariable(lab, x, beta float64) float64 {
	var l1mx float64
	if beta != 1 {
		l1mx = (beta - 1) * math.Log(1-x) // l1mx is only ever a term of a sum
	}
	return lab + l1mx
}

func draws(src rand.Source) float64 {
	e := -math.Log(1 - rand.Float64()) // a v2 draw is a multiple of 2^-53: 1-u is exact
	var r func() float64
	if src == nil {
		r = rand.Float64
	} else {
		r = rand.New(src).Float64
	}
	return e * math.Log(1-r()) // r is only ever a Float64 draw
}

func threeSquares(x, y, z float64) float64 {
	return math.Sqrt(x*x + y*y + z*z) // three terms: not a Hypot
}

func notSquares(x, y, z float64) float64 {
	return math.Sqrt(x*x + y*z) // y*z is not a square
}

func integerSquares(i, j int) float64 {
	return math.Sqrt(float64(i)*float64(i) + float64(j)*float64(j)) // whole numbers below 2^63 cannot overflow when squared
}

func scaledRotation(a, b float64) float64 {
	s := math.Abs(a) + math.Abs(b)
	as := a / s
	bs := b / s
	return s * math.Sqrt(as*as+bs*bs) // scaled first
}

func rangeChecked(f, g, lo, hi float64) float64 {
	f1 := math.Abs(f)
	if lo < f1 && f1 < hi && lo < math.Abs(g) && math.Abs(g) < hi {
		return math.Sqrt(f*f + g*g) // the code checked the range
	}
	return math.Hypot(f, g)
}

func overflowsEarlier(x, y float64) float64 {
	return math.Exp(math.Abs(1 - math.Sqrt(x*x+y*y)/math.Pi)) // exp overflows at 709.78, long before the squares
}

func powers(x float64) float64 {
	return math.Pow(x, 0.5) + math.Pow(x, 2) // math.Pow computes these exactly as Sqrt and x*x do
}

func product(a, b float64) float64 {
	return math.Log(math.Exp(a) * math.Exp(b)) // a product, not a sum
}

func constantLogSumExp() float64 {
	return math.Log(math.Exp(1) + math.Exp(2)) // constant arguments: the range is known
}

func impureSquares(next func() float64) float64 {
	return math.Sqrt(next()*next() + 1) // next() may differ between calls: not one value squared
}

// Raw-moment terms that only add, or Gamma values of unrelated arguments,
// cancel nothing: the sum is at least as large as its terms.
func secondRawMoment(shape, scale float64) float64 {
	return scale * scale * (math.Gamma(1+2/shape) + math.Gamma(1+1/shape)*math.Gamma(1+1/shape))
}

func gammaGap(a, b float64) float64 {
	return math.Gamma(1+1/a) - math.Gamma(1+1/b) // two shapes: not the moments of one distribution
}

// Log-gamma values of arguments with nothing in common, or in a
// log-density with a term whose coefficient grows with the shared
// parameter (already an absolute error of about u·v), are left alone.
func logGammaTerms(a, b, v, z float64) float64 {
	ga, _ := math.Lgamma(a)
	gb, _ := math.Lgamma(b)
	h1, _ := math.Lgamma((v + 1) / 2)
	h0, _ := math.Lgamma(v / 2)
	return ga - gb + h1 - h0 - ((v+1)/2)*math.Log1p(z*z/v)
}

func reassignedLogGamma(n, k float64) float64 {
	hi, _ := math.Lgamma(n + 1)
	lo, _ := math.Lgamma(n - k + 1)
	if k == 0 {
		lo = hi
	}
	return hi - lo // lo is assigned twice: not read as a log-gamma value
}

// plot is a sample position the package never validates or passes to
// math.Hypot: data of a physical range, squared far from overflow.
type plot struct{ x, y, z float64 }

func spacing(a, b plot) float64 {
	dx, dy, dz := b.x-a.x, b.y-a.y, b.z-a.z
	return math.Sqrt(dx*dx + dy*dy + dz*dz)
}

// nearestOnSegment projects p on the segment a-b: the parameter t is a
// quotient, but the early returns keep it in (0, 1).
func nearestOnSegment(p, a, b plot, den float64) float64 {
	t := ((p.x-a.x)*(b.x-a.x) + (p.y-a.y)*(b.y-a.y)) / den
	if t <= 0 {
		return spacing(p, a)
	}
	if t >= 1 {
		return spacing(p, b)
	}
	qx, qy, qz := a.x+t*(b.x-a.x), a.y+t*(b.y-a.y), a.z+t*(b.z-a.z)
	ex, ey, ez := p.x-qx, p.y-qy, p.z-qz
	return math.Sqrt(ex*ex + ey*ey + ez*ez)
}

// excessGrowth solves e^t - 1 - t = a by Newton's method. The slope
// e^t - 1 loses digits for small t, but it only sets the length of each
// step: the root is where the residual vanishes.
func excessGrowth(a float64) float64 {
	t := math.Sqrt(2 * a)
	for range 30 {
		resid := math.Expm1(t) - t - a
		slope := math.Exp(t) - 1
		step := resid / slope
		t -= step
		if math.Abs(step) < 1e-15*t {
			break
		}
	}
	return t
}

func logDensityParts(v, q float64) float64 {
	h1, _ := math.Lgamma((v + 3) / 2)
	h0, _ := math.Lgamma(v / 2)
	norm := h1 - h0 - 1.5*math.Log(v)
	return norm - ((v+3)/2)*math.Log1p(q/v) // the term's coefficient grows with v as well
}

func (p plot) inner(o plot) float64 {
	return p.x*o.x + p.y*o.y + p.z*o.z
}

// size squares fields the package neither validates nor passes to
// math.Hypot: data of a physical range.
func (p plot) size() float64 {
	return math.Sqrt(p.inner(p))
}

// Logarithms of ratios of two different functions, or added to another
// term, lose nothing that shows.
func mixedRatio(a, b, c float64) float64 {
	return c / math.Log(math.Cos(a)/math.Sin(b))
}

func gainInBels(a, b, offset float64) float64 {
	return offset + math.Log10(math.Sqrt(a)/math.Sqrt(b))
}

// A complement of a plain dot product, or one only returned, is not the
// squared distance of two distributions consumed to relative accuracy.
func overlapOf(h, g []float64) float64 {
	var s float64
	for k := range h {
		s += h[k] * g[k]
	}
	return math.Sqrt(1 - s)
}

func missingMass(h, g []float64) float64 {
	var s float64
	for k := range h {
		s += math.Sqrt(h[k] * g[k])
	}
	return 1 - s
}

func now() float64 { return 2 }

func logOfCalls(t float64) float64 {
	return t / math.Log(now()/now()) // calls of no argument: no point to compare
}

// A failure term is hidden where the rate is kept away from 0, or where
// no success term beside it can vanish.
func sturdyLikelihood(k, batch, q float64) float64 {
	if q > 0.01 {
		return k*math.Log(q) + (batch-k)*math.Log(1-q)
	}
	return k*math.Log(q) + (batch-k)*math.Log1p(-q)
}

func shiftedFailure(mu, s, q float64) float64 {
	return mu + s*math.Log(1-q)
}

// A density's exponents (α-1, β-1) are parameters, not complementary
// counts: the first term vanishes only at α = 1.
func logShape(alpha, beta, t float64) float64 {
	return (alpha-1)*math.Log(t) + (beta-1)*math.Log(1-t)
}

// tilt scales a logistic by 3: 3σ(z) - 1 is near 1/2 at z = 0, where
// nothing cancels.
func tilt(z float64) float64 {
	return 3/(1+math.Exp(-z)) - 1
}
