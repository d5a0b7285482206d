package idioms

import (
	"math"
	"math/cmplx"
)

func smallWeight(mu, p float64) float64 {
	return mu + 2*math.Log(1-p) // a modest coefficient in a sum: the sum's own rounding hides the loss
}

func log10Shifted(x float64) float64 {
	return math.Log10(2+x) + math.Log2(x-1) // nothing small is added to 1
}

func square(x float64) float64 {
	return 1 - math.Pow(x, 2) // a constant exponent: a difference of squares, not a power near 1
}

func mersenne(n int) float64 {
	return math.Pow(2, float64(n)) - 1 // 2^n with n whole is 1 or at least 2
}

// gainRatio converts a whole number of decibels to a power ratio less 1:
// q/10 is 0, where the power is exactly 1, or at least 0.1, where
// 10^0.1 - 1 loses under half a digit (|b·ln a| >= 0.23).
func gainRatio(q int) float64 {
	return math.Pow(10, float64(q)/10) - 1
}

func asinhOfMagnitude(v float64) float64 {
	x := math.Abs(v)
	return math.Log(x + math.Sqrt(x*x+1)) // x ≥ 0: the terms add
}

func positiveRoot(u, c float64) float64 {
	if u > 0 {
		return u + math.Sqrt(u*u+c) // the sign of u is checked: the terms add
	}
	return c / (math.Sqrt(u*u+c) - u)
}

func givenCosine(c float64) float64 {
	return math.Acos(c) // the argument is computed elsewhere, by the caller
}

func segments(r, tol float64) int {
	return int(math.Ceil(math.Pi / math.Acos(1-tol/r))) // the angle only counts segments
}

func trigLength(a, b float64) float64 {
	return math.Sqrt(math.Cos(a)*math.Cos(a) + math.Sin(b)*math.Sin(b)) // bounded by 1: math.Hypot would only cost accuracy
}

func unitLength(x, y float64) float64 {
	ux := x / math.Hypot(x, y)
	uy := y / math.Hypot(x, y)
	return math.Sqrt(ux*ux + uy*uy) // components of a unit vector
}

func chord(lat, lon float64) float64 {
	cx := math.Cos(lat) * math.Cos(lon)
	cy := math.Cos(lat) * math.Sin(lon)
	return math.Sqrt((cx+1)*(cx+1) + cy*cy) // sums and products of cosines stay below 2
}

func ratioComplement(a, b float64) float64 {
	return 1 - a/b // not a ratio over norms
}

func wholeSquares(n int) float64 {
	return float64(n)*float64(n) - 1 // whole numbers: the squares are exact below 2^53
}

func knownSquares() float64 {
	return 1 - 0.5*0.5 // constants
}

type tabulated struct{ q []float64 }

func (t tabulated) Quantile(p float64) float64 { return t.q[int(p*float64(len(t.q)-1))] }

func (t tabulated) reflected(p float64) float64 {
	return 1 - t.Quantile(p) // not a probability near 1
}

func oddsRatio(p, q float64) float64 {
	return math.Log((1 + p) / (1 - q)) // two different values: not an inverse hyperbolic tangent
}

// magnitude is the package's own absolute value.
func magnitude(v float64) float64 {
	if v < 0 {
		return -v
	}
	return v
}

func asinhOwnAbs(v float64) float64 {
	x := magnitude(v)
	return math.Log(x + math.Sqrt(x*x+1)) // x ≥ 0 by the package's own absolute value
}

func splitRangeOwnAbs(x float64) float64 {
	if magnitude(x) > 1e-3 {
		return math.Log(1 + x) // the author split the range with its own absolute value
	}
	return x - x*x/2
}

type vertex struct{ X, Y float64 }

// Squares of data: coordinates and their differences reach 1.34e154 only
// if the data do; math.Hypot would cost accuracy for nothing.
func segmentLength(a, b vertex) float64 {
	dx, dy := b.X-a.X, b.Y-a.Y
	return math.Sqrt(dx*dx + dy*dy)
}

func planeNorm(x, y float64) float64 {
	return math.Sqrt(x*x + y*y)
}

func sineFromComputedCosine(z, r float64) float64 {
	c := z / r
	return math.Sqrt(1 - c*c) // c carries its own rounding: 1-c*c inherits 2u from it however it is formed
}

func tanhDerivative(x float64) float64 {
	t := math.Tanh(x)
	return 1 - t*t // the same for a computed tanh
}

func reassignedRatio(a, b, c float64) float64 {
	r := a / b
	if r > 2 {
		r = b / c
	}
	return 1 - r*r // every value of r is computed: its own rounding dominates
}

func elevation(z, r float64) float64 {
	return math.Asin(z / r) // near ±π/2 the problem itself is ill-conditioned in z and r: asin adds nothing worse
}

func startAngle(theta float64, n int) float64 {
	return math.Acos(theta / math.Sqrt(2*float64(n)+1)) // not a cosine over norms: a scaled guess
}

func ratioPower(x, lambda, k float64) float64 {
	return math.Pow(x/lambda, k) - 1 // the computed base carries its own rounding, which Expm1 would inherit
}

// A window's weights: the angle is a fraction of a turn by counts.
func hannWeights(w []float64) {
	k := 2 * math.Pi / float64(len(w)-1)
	for i := range w {
		w[i] = 0.5 * (1 - math.Cos(k*float64(i)))
	}
}

// Already shifted by the larger log-probability.
func logAddShifted(la, lb float64) float64 {
	m := math.Max(la, lb)
	return math.Log(math.Exp(la-m)+math.Exp(lb-m)) + m
}

// deviationSpread accumulates squared deviations (the two-pass form):
// subtracting the squared mean deviation, which is near 0, is the
// corrected two-pass formula and cancels nothing (common practice).
func deviationSpread(xs []float64, m float64) float64 {
	var d1, d2 float64
	for _, x := range xs {
		dx := x - m
		d1 += dx
		d2 += dx * dx
	}
	n := float64(len(xs))
	return (d2 - d1*d1/n) / (n - 1)
}

// stepper corrects a moving average for its zero start.
type stepper struct {
	decay, avg float64
	step       float64
}

func (s *stepper) update(g float64) float64 {
	s.step++
	s.avg = s.decay*s.avg + (1-s.decay)*g
	// A whole exponent n >= 1 keeps 1-decay^n at least 1-decay: the power
	// loses no more than the parameter's own rounding.
	return s.avg / (1 - math.Pow(s.decay, s.step))
}

// A lower tail of a value never negative: 1 + erf(x) lies in [1, 2) and
// cancels nothing.
func aboveMedian(d float64) float64 {
	return 0.5 * (1 + math.Erf(math.Abs(d)))
}

// upperDirect forms the tail itself: 0.5*math.Erfc(z) is small where z is
// large, so 1 minus it is near 1 and cancels nothing there.
func upperDirect(z float64) float64 {
	return 1 - 0.5*math.Erfc(z)
}

// A difference of squares used linearly is backward stable: its absolute
// error u·(a²+b²) is what the inputs' own rounding would cause, and the
// sums it joins carry roundings of that size already.
func ridgeValley(p, q float64) float64 {
	bend := 3.5 - p*(1-q*q) // scaled and added to a constant of the same size
	return bend * bend
}

func slopeTerms(p, q float64) float64 {
	g := 1 - q*q
	return 2*p*g + g*q // every use of g is a term of a sum
}

func rippleObjective(p, q float64) float64 {
	s := math.Sin(p*p - q*q) // the sine keeps the relative error, the sum below absorbs it
	return 0.5 + (s*s-0.5)/(1+p*p+q*q)
}

func flatRipple(p, q float64) float64 {
	return math.Cos(p*p - q*q) // cos is flat at 0: an absolute error passes on as one
}

func saddleHeight(p, q float64) float64 {
	return p*p - q*q // returned: the caller's use is not seen, and the value is as good as its data
}

func lensCentre(r0, r1, dist float64) float64 {
	k := r0*r0 - r1*r1 // the centre offset moves linearly with k
	return 0.5 * (dist + k/dist)
}

func aboveLevel(p, q float64) bool {
	return p*p-q*q > 4 // a threshold at the scale of the squares
}

// The sign of u is known from the value last assigned to it: a modulus,
// or a sum and quotient of non-negative values, so u + sqrt(u²-1) adds.
func growthRatio(re, im, step float64) float64 {
	m := math.Hypot(re, im)
	k := 0.0
	k = (float64(len("ab")) + step*step) / m
	return k + math.Sqrt(k*k-1)
}

func spread(re, im float64) float64 {
	var k float64
	k = cmplx.Abs(complex(re, im))
	return k + math.Sqrt(k*k-1)
}

func arcCosine(x float64) float64 { return math.Acos(x) }

// A wrapper of math.Acos of a value that is not a cosine from a dot
// product or the law of cosines stays silent, as math.Acos does.
func wrappedArc(r, h float64) float64 {
	return arcCosine(h / r)
}

// Divided differences over other spans, or of constants, lose nothing to
// this rule's concern.
func chordSlope(p, q, h float64) float64 {
	return (math.Cos(p)-math.Cos(q))/h + (math.Sin(1)-math.Sin(2))/(1-2)
}

// A field every assignment of which is a quarter turn over a count: the
// angle is 0 or at least π/(2n), and cos rounds to 1 only past 10^8
// segments.
type arcMesher struct {
	step, sag float64
}

func newArcMesher(segments int, radius float64) *arcMesher {
	m := &arcMesher{}
	m.step = math.Pi / 2 / float64(segments)
	m.sag = radius * (1 - math.Cos(m.step/2))
	return m
}

// The complement of a share used as a blend weight in a sum: only its
// absolute error, a rounding of 1, reaches the result.
func blend(lo, hi, wLo, wHi float64) float64 {
	f := wLo / (wLo + wHi)
	return lo*f + hi*(1-f)
}

// Offsets that do not cancel, or whose absolute error a sum absorbs.
func upperQuantile(mu, b, q float64) float64 {
	return mu - b*math.Log(1-2*(q-0.5)) // 1 - 2(q - 0.5) is 2 - 2q: for q ≥ 0.5, q - 0.5 is exact (Sterbenz)
}

func recentre(q, s float64) float64 {
	return s + (1 + 2*(q-0.5)) // a term of a sum of unit size: the rounding of q - 0.5 is one of the sum's
}

// Splits whose leading part leaves room for the multiplier: the same
// constants in float64 (30 bits for y), and a float32 split with a short
// leading part (0.78515625 has 8 significant bits, 16 left for y).
func octant64(x float64) float64 {
	y := math.Floor(x * (4 / math.Pi))
	return ((x - y*7.85398125648498535156e-1) - y*3.77489470793079817668e-8) - y*2.69515142907905952645e-15
}

func octant32(x float32) float32 {
	y := float32(int(x * (4 / math.Pi)))
	return (x - y*0.78515625) - y*2.4187564849853515625e-4
}

func pairDot(p0, p1, q0, q1 [2]float64) float64 {
	return (p1[0]-p0[0])*(q1[0]-q0[0]) + (p1[1]-p0[1])*(q1[1]-q0[1])
}

// A Gram determinant that only joins a sum: its absolute error is of the
// size of the sum's roundings.
func spreadScore(a0, a1, b0, b1 [2]float64) float64 {
	uu := pairDot(a0, a1, a0, a1)
	vv := pairDot(b0, b1, b0, b1)
	uv := pairDot(a0, a1, b0, b1)
	return uu + vv + (uu*vv - uv*uv)
}

// The complement of a share used in a recurrence of weights: the code
// does not show whether |b| can be small against |a| (here a count
// against a fraction), and the consumer is a product, not a root.
func weightStep(frac, count, w float64) float64 {
	ak := 1 - 2*frac/(count+2*frac)
	return w * ak
}

// A long float32 split under a guard that keeps y within its exact range
// (y < 2 for x below 1.5).
func nearOctant(x float32) float32 {
	if x < 1.5 {
		y := float32(int(x * (4 / math.Pi)))
		return (x - y*7.85398125648498535156e-1) - y*3.77489470793079817668e-8
	}
	return x
}

// A log-likelihood ratio joins a sum: only the absolute error of its
// logarithms, a rounding each, reaches the result.
func logLikelihoodRatio(p, q, prior float64) float64 {
	return prior + (math.Log(p) - math.Log(q))
}

// A p-norm scaled by the largest magnitude: every power is at most 1.
func scaledNorm(v []float64, p float64) float64 {
	big := 0.0
	for _, x := range v {
		big = math.Max(big, math.Abs(x))
	}
	if big == 0 {
		return 0
	}
	var s float64
	for _, x := range v {
		s += math.Pow(math.Abs(x)/big, p)
	}
	return big * math.Pow(s, 1/p)
}

// The symmetric form: the exponential of -|z| never overflows.
func stableDensity(x, mu, s float64) float64 {
	e := math.Exp(-math.Abs((x - mu) / s))
	return e / (s * (1 + e) * (1 + e))
}

type corner struct{ X, Y float64 }

// The shoelace relative to the first vertex: the terms are of the ring's
// own size, and their roundings of the area's.
func localArea(ring []corner) float64 {
	s := 0.0
	o := ring[0]
	for i := 1; i < len(ring); i++ {
		p, q := ring[i-1], ring[i]
		s += (q.X - o.X + p.X - o.X) * (q.Y - p.Y)
	}
	return s / 2
}

// A window sum in a local variable lives for one call, and a field only
// ever added to removes nothing.
func windowSums(xs []float64, k int) []float64 {
	out := make([]float64, 0, len(xs))
	s := 0.0
	for i, x := range xs {
		s += x
		if i >= k {
			s -= xs[i-k]
		}
		out = append(out, s)
	}
	return out
}

type tally struct{ total float64 }

func (t *tally) redo(xs []float64) {
	t.total = 0
	for _, x := range xs {
		t.total += x
	}
}

func pairSum(a1, a2, b1, b2 float64) float64 {
	return a1*b1 + a2*b2
}

// farRoot adds the root to |h|: the terms never subtract.
func farRoot(h, a, k float64) float64 {
	m := math.Abs(h)
	return (m + math.Sqrt(pairSum(m, a, m, -k))) / a
}

// knot inverts a fixed cubic on the fractional part of x: u stays in
// [0.5, 1.5] and c is 2, so u²/c is at most 1.125 and the root loses at
// most a bit.
func knot(x float64) float64 {
	const k = 0.5
	whole := math.Floor(x)
	u := k + (x - whole)
	return u - math.Sqrt(u*u+2*k*2)
}

// The number of golden-section steps that shrink a bracket to tol: the
// ratio is fixed by construction at 0.382, far from 0, so 1 - ratio
// loses nothing.
func goldenSteps(width, tol float64) int {
	ratio := (3 - math.Sqrt(5)) / 2
	return int(math.Ceil(math.Log(tol/width) / math.Log(1-ratio)))
}

// modulus is the length of a complex number: never negative.
func modulus(re, im float64) float64 { return math.Hypot(re, im) }

// A radical on a value that is never negative, through the package's own
// modulus and a chain of assignments: u + sqrt(u*u-1) adds two terms of
// one sign, so nothing cancels.
func growthRate(re, im float64) float64 {
	az := modulus(re, im)
	whole := int(az)
	at := float64(whole) + 1
	ratio := 1 / az
	k := (at + 1) * ratio
	return k + math.Sqrt(k*k-1)
}

// A log-partition whose scores are shifted in place by the largest before
// the exponentials are taken: each is at most 1 and their sum at least 1.
func shiftedInPlace(scores []float64) float64 {
	top := math.Inf(-1)
	for _, s := range scores {
		top = math.Max(top, s)
	}
	weights := make([]float64, len(scores))
	for i := range scores {
		scores[i] -= top
		weights[i] = math.Exp(scores[i])
	}
	total := 0.0
	for _, w := range weights {
		total += w
	}
	return top + math.Log(total)
}

// Shares and a log-partition computed with the largest score subtracted
// first: every exponential is at most 1 and the total at least 1, so
// nothing overflows and the log is finite (the shifted log-sum-exp,
// common practice; log Σe^y = m + log Σe^(y-m) holds exactly).
func shiftedShares(scores []float64) ([]float64, float64) {
	top := math.Inf(-1)
	for _, s := range scores {
		top = math.Max(top, s)
	}
	shares := make([]float64, len(scores))
	total := 0.0
	for i, s := range scores {
		shares[i] = math.Exp(s - top)
		total += shares[i]
	}
	for i := range shares {
		shares[i] /= total
	}
	return shares, top + math.Log(total)
}

// Weights of non-positive exponents, e^-|d| at most 1: their sum is at
// most the count, so it cannot overflow.
func decayWeights(ds []float64) float64 {
	w := 0.0
	for _, d := range ds {
		w += math.Exp(-math.Abs(d))
	}
	return math.Exp(-math.Abs(ds[0])) / w
}

// A logistic weight whose exponential is checked for overflow first: the
// quotient is reached only while e is finite.
func guardedLogistic(y float64) float64 {
	e := math.Exp(y)
	if math.IsInf(e, 1) {
		return 1
	}
	return e / (1 + e)
}

// A softmax share under a check of the total: the division runs only
// while the total is finite.
func checkedShare(w []float64) float64 {
	z := 0.0
	for _, v := range w {
		z += math.Exp(v)
	}
	if math.IsInf(z, 1) {
		return math.NaN()
	}
	return math.Exp(w[0]) / z
}

// A share of a panel's area, not a cosine: a function whose result is a
// ratio over something other than a norm is no angle's cosine, and its
// arc is taken where the argument reaches ±1 only by an ill-conditioned
// problem.
type slab struct{ w, h float64 }

func (s slab) fill(used float64) float64 { return used / (s.w * s.h) }

func slabArc(s slab, used float64) float64 { return math.Acos(s.fill(used)) }

// A residual whose consumer needs only absolute accuracy: the Gaussian
// likelihood of a fit, exp(-SSE/2σ²), moves by the absolute error of SSE.
func fitLikelihood(syy, sxy, sxx, s2 float64) float64 {
	return math.Exp(-0.5 * (syy - sxy*sxy/sxx) / s2)
}

// Σx²·Σz² - (Σxy)²: the cross sum pairs other series than the squares,
// so no Cauchy–Schwarz bound ties the two terms together.
func crossedMoments(xs, ys, zs []float64) float64 {
	var sxx, szz, sxy float64
	for i := range xs {
		sxx += xs[i] * xs[i]
		szz += zs[i] * zs[i]
		sxy += xs[i] * ys[i]
	}
	return sxx*szz - sxy*sxy
}

// The residual sum of squares summed from the fitted line in a second
// pass: no difference of near-equal sums.
func fitResidual(xs, ys []float64, a, b float64) float64 {
	var sse float64
	for i := range xs {
		r := ys[i] - a - b*xs[i]
		sse += r * r
	}
	return sse
}

// A least-squares slope on readings standardised first, through the
// package's own function: centred data hold no mean² to cancel, so n·Σx² -
// (Σx)² keeps its digits.
type trend struct{ centre, scale float64 }

func (t trend) standard(v float64) float64 { return (v - t.centre) / t.scale }

func (t trend) slope(xs, ys []float64) float64 {
	var sx, sy, sxx, sxy float64
	for i := range xs {
		x := xs[i]
		x = t.standard(x)
		sx += x
		sy += ys[i]
		sxx += x * x
		sxy += x * ys[i]
	}
	n := float64(len(xs))
	return (n*sxy - sx*sy) / (n*sxx - sx*sx)
}

// A bare dot product is not read as a cosine: whether its vectors are of
// unit length is the caller's, and a plain dot product may be any size.
type frame struct{ p, q float64 }

func (f frame) inner(g frame) float64 { return f.p*g.p + f.q*g.q }

func frameArc(f, g frame) float64 { return math.Acos(f.inner(g)) }

// sonar is a ping's straight path through still water, from origin at
// heading: a buoy is a sphere and a mooring line a vertical cylinder.
type sonar struct{ origin, heading pos3 }

type pos3 struct{ X, Y, Z float64 }

func (p pos3) Dot(q pos3) float64 { return p.X*q.X + p.Y*q.Y + p.Z*q.Z }
func (p pos3) Sub(q pos3) pos3    { return pos3{p.X - q.X, p.Y - q.Y, p.Z - q.Z} }

// echoBuoy meets a sphere: c = o·o - r² is a difference whose error is
// already about u·o·o, and (d·o)² ≤ (d·d)(o·o) (Cauchy–Schwarz) keeps
// b²/4a below o·o, so the near root is as good either way.
func echoBuoy(s sonar, centre pos3, r float64) float64 {
	o := s.origin.Sub(centre)
	a := s.heading.Dot(s.heading)
	b := 2 * s.heading.Dot(o)
	c := o.Dot(o) - r*r
	disc := b*b - 4*a*c
	return (-b + math.Sqrt(disc)) / (2 * a)
}

// echoMooring meets a vertical cylinder, written with fields: the same
// bound holds over the X and Y components.
func echoMooring(s sonar, r float64) float64 {
	o, d := s.origin, s.heading
	a := d.X*d.X + d.Y*d.Y
	b := 2*o.X*d.X + 2*o.Y*d.Y
	c := o.X*o.X + o.Y*o.Y - r*r
	disc := b*b - 4*a*c
	return (-b - math.Sqrt(disc)) / (2 * a)
}

// echoFloat meets a floating sphere through the package's dot function
// rather than a method: the same Cauchy–Schwarz bound holds.
func dot3(p, q pos3) float64 { return p.X*q.X + p.Y*q.Y + p.Z*q.Z }

func echoFloat(s sonar, centre pos3, r float64) float64 {
	o := s.origin.Sub(centre)
	c := dot3(o, o) - r*r
	b := dot3(o, s.heading)
	a := dot3(s.heading, s.heading)
	sigma := b*b - a*c
	return -(b + math.Sqrt(sigma)) / a
}

// stationRadius is a survey station's distance from the centre of an
// ellipsoid: the radius of curvature a/sqrt(1 - e2·sin²φ) divides by a
// root that stays within [sqrt(1-e2), sqrt(1+e2)], so it is at most
// a/sqrt(1-e2), and the squares stay as far from overflow as the
// station's height does.
func stationRadius(lat, height float64) float64 {
	const a, e2 = 6378137.0, 0.00669437999014
	s, c := math.Sin(lat), math.Cos(lat)
	n := a / math.Sqrt(1-e2*s*s)
	p := (n + height) * c
	z := (n*(1-e2) + height) * s
	return math.Sqrt(p*p + z*z)
}

// stayCosine keeps the law of cosines as a cosine: a projection, not an
// angle, whose absolute error is a few u.
func stayCosine(a, b, c float64) float64 {
	return a * (a*a + b*b - c*c) / (2 * a * b)
}

// wideBranch takes the root only where x > 2: x²/(x²-1) ≤ 4/3 there, so
// the subtraction costs less than a digit and the factorisation saves
// nothing worth one.
func wideBranch(x float64) float64 {
	switch {
	case x > 2:
		return math.Sqrt(x*x - 1)
	}
	return 0
}

// smallBranch takes 1 - x² only for |x| below 0.5: 1/(1-x²) ≤ 4/3.
func smallBranch(x float64) float64 {
	if math.Abs(x) < 0.5 {
		return 1 / math.Sqrt(1-x*x)
	}
	return 0
}

// centredPair sums products of deviations from means taken first: the
// two-pass co-moment, whose terms are as small as the covariance itself.
func centredPair(xs, ys []float64, mx, my float64) float64 {
	var sxy, sx, sy float64
	for i := range xs {
		dx, dy := xs[i]-mx, ys[i]-my
		sxy += dx * dy
		sx += dx
		sy += dy
	}
	n := float64(len(xs))
	return sxy - sx*sy/n
}

// The log-loss in its softplus form: log σ(z) = -softplus(-z) and
// log(1-σ(z)) = -softplus(z), finite for every z.
func softLoss(label, z float64) float64 {
	sp := func(y float64) float64 { return math.Max(y, 0) + math.Log1p(math.Exp(-math.Abs(y))) }
	return label*sp(-z) + (1-label)*sp(z)
}

// lnOnePlus returns in a chain of branches for |x| < 0.5; past the chain
// |x| ≥ 0.5, where 1 + x is no closer to 1 than 0.5 and the logarithm
// loses nothing.
func lnOnePlus(x float64) float64 {
	if x == 0 {
		return 0
	} else if math.Abs(x) < 0.5 {
		return x - x*x/2 + x*x*x/3
	}
	return math.Log(1 + x)
}

// dampedRest returns for exponents up to 20 in a chain; past it the power
// 2^-s is below 1e-6 and 1 minus it is no difference of near equals.
func dampedRest(s float64) float64 {
	if s < 1 {
		return 0
	} else if s <= 20 {
		return s
	}
	return 1 - math.Pow(2, -s)
}

// lugOffset places a lug on a circle of fixed radius at a fixed height:
// 1.3125² against 0.75², a ratio of 1.5, costs under a fifth of a digit.
func lugOffset() float64 {
	r := 1.3125
	h := 0.75
	return -math.Sqrt(r*r - h*h)
}

// seriesChoice only compares e^y - 1 with a threshold of 0.5: a rounding
// of 1 moves the choice only for values within it of 0.5, where either
// series serves.
func seriesChoice(y float64) int {
	w := math.Exp(y)
	if math.Abs(w-1) > 0.5 {
		return 1
	}
	return 2
}

// cubeGap differs two cubes written as powers: not squares, and no
// factorisation of them is offered.
func cubeGap(a, b float64) float64 {
	return math.Sqrt(math.Pow(a, 3) - math.Pow(b, 3))
}

// heldSine squares a cosine that carries no subtraction of 1.
func heldSine(t float64) float64 {
	h := math.Cos(t)
	return math.Sqrt(2 - h*h)
}
