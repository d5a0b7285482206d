package hazards

import "math"

func decibelGain(x float64) float64 {
	return 10 * math.Log10(1+x) // want `math.Log10\(1\+x\) returns 0 for \|x\| below 5.55e-17.*use math.Log1p\(x\)/math.Ln10`
}

func doublings(r float64) float64 {
	return math.Log2(1 - r) // want `math.Log2\(1-x\) with x = r returns 0.*use math.Log1p\(-x\)/math.Ln2`
}

func decayStored(t, tau float64) float64 {
	decay := math.Exp(-t / tau)
	return 1 - decay // want `1-math.Exp\(x\) with x = -t / tau returns 0`
}

func defaultRisk(rate, years float64) float64 {
	return 1 - math.Pow(1-rate, years) // want `1-math.Pow\(a, b\) with a = 1 - rate, b = years returns 0 when \|b·ln a\| is below 5.55e-17.*use -math.Expm1\(b\*math.Log\(a\)\)`
}

func growth(base, t float64) float64 {
	return math.Pow(base, t) - 1 // want `math.Pow\(a, b\)-1 with a = base, b = t`
}

func inverseSinh(x float64) float64 {
	return math.Log(x + math.Sqrt(x*x+1)) // want `math.Log\(x \+ math.Sqrt\(x\*x\+1\)\) cancels for negative x: about 2u·x² relative error, every digit lost from x ≈ -6.71e\+07 and -Inf from x ≈ -1.34e\+08.*use math.Asinh\(x\)`
}

func smallerRoot(b, c float64) float64 {
	disc := b*b - c
	return -b + math.Sqrt(disc) // want `u ± math.Sqrt\(u\*u\+c\) with u = b, c = -c cancels for the sign of u that makes the terms subtract`
}

func excess(r, k float64) float64 {
	return math.Sqrt(r*r+k) - r // want `u ± math.Sqrt\(u\*u\+c\) with u = r, c = k cancels`
}

func turnAngle(ax, ay, bx, by float64) float64 {
	return math.Acos((ax*bx + ay*by) / (math.Hypot(ax, ay) * math.Hypot(bx, by))) // want `math.Acos\(x\) loses half the digits where x is near ±1 \(angles near 0 and π\): one rounding in x becomes an angle error of about sqrt\(2u\) ≈ 1.49e-08 rad`
}

func clampedAngle(ux, uy, vx, vy float64) float64 {
	c := math.Max(-1, math.Min(1, (ux*vx+uy*vy)/math.Sqrt((ux*ux+uy*uy)*(vx*vx+vy*vy))))
	return math.Acos(c) // want `math.Acos\(x\) with x = c loses half the digits`
}

func greatCircle(lat1, lat2, dlon float64) float64 {
	return math.Acos(math.Sin(lat1)*math.Sin(lat2) + math.Cos(lat1)*math.Cos(lat2)*math.Cos(dlon)) // want `math.Acos\(x\) loses half the digits where x is near ±1`
}

func cosineDistance(a, b []float64) float64 {
	var dot, na, nb float64
	for i := range a {
		dot += a[i] * b[i]
		na += a[i] * a[i]
		nb += b[i] * b[i]
	}
	similarity := dot / (math.Sqrt(na) * math.Sqrt(nb))
	return 1 - similarity // want `1 - c with c = dot / \(math.Sqrt\(na\) \* math.Sqrt\(nb\)\), a cosine computed as a ratio over norms, returns 0 for angles below about 1.49e-08 rad`
}

func binomialLogLikelihood(k, n int, p float64) float64 {
	return float64(k)*math.Log(p) + float64(n-k)*math.Log(1-p) // want `math.Log\(1-x\) with x = p returns 0`
}

func weighted(mu, p float64) float64 {
	return mu + 1e4*math.Log(1-p) // want `math.Log\(1-x\) with x = p`
}

func sineFromCosine(c float64) float64 {
	return math.Sqrt(1 - c*c) // want `a\*a - b\*b with a = 1, b = c loses about log10\(a²/\|a²-b²\|\) digits where \|a\| and \|b\| are close.*use \(a-b\)\*\(a\+b\)`
}

// A radicand near tangency: the root turns the absolute error u·r² into
// sqrt(u)·r, half the digits of the offset.
func chordHalf(r, d float64) float64 {
	off := r*r - d*d // want `a\*a - b\*b with a = r, b = d loses`
	if off < 0 {
		return 0
	}
	return math.Sqrt(off)
}

func lorentz(v float64) float64 {
	return 1 / (v*v - 1) // want `a\*a - b\*b with a = v, b = 1 loses`
}

func upperNormal(z float64) float64 {
	return 0.5 * (1 - math.Erf(z/math.Sqrt2)) // want `1 - math.Erf\(z / math.Sqrt2\) returns 0 where the probability rounds to 1 \(upper tails below 1.11e-16\).*use math.Erfc\(x\)`
}

func lowerNormal(x, mu, sigma float64) float64 {
	z := (x - mu) / (sigma * math.Sqrt2)
	return 0.5 * (1 + math.Erf(z)) // want `1 \+ math.Erf\(z\) returns 0 where math.Erf\(x\) rounds to -1 \(x below -5.92\).*use math.Erfc\(-x\)`
}

func lowerNormalSplit(z float64) float64 {
	return 0.5 + 0.5*math.Erf(z) // want `0.5 \+ 0.5\*math.Erf\(z\) returns 0 where math.Erf\(x\) rounds to -1.*use 0.5 \* math.Erfc\(-x\)`
}

type logisticLaw struct{ mu, s float64 }

func (d logisticLaw) CDF(x float64) float64 { return 1 / (1 + math.Exp(-(x-d.mu)/d.s)) }

func (d logisticLaw) Survival(x float64) float64 {
	return 1 - d.CDF(x) // want `1 - d.CDF\(x\) returns 0 where the probability rounds to 1.*use a complementary function`
}

func mercatorY(s float64) float64 {
	return 0.5 * math.Log((1+s)/(1-s)) // want `math.Log\(\(1\+x\)/\(1-x\)\) with x = s returns 0 for \|x\| below 5.55e-17.*use 2\*math.Atanh\(x\)`
}

func logisticLogDensity(z float64) float64 {
	return z - 2*math.Log(math.Exp(z)+1) // want `math.Log\(1\+math.Exp\(y\)\) with y = z overflows`
}

// An input negated in place stays an input (and its self-reference does
// not send the analysis round in circles).
func flipped(x float64) float64 {
	x = -x
	return 1 / (1 - x*x) // want `a\*a - b\*b with a = 1, b = x loses`
}

func exceedance(level, mu, sd float64) float64 {
	return 1 - 0.5*math.Erfc(-(level-mu)/(sd*math.Sqrt2)) // want `1 - 0.5 \* math.Erfc\(-\(level-mu\)/\(sd\*math.Sqrt2\)\) returns 0 where the probability rounds to 1.*use 0.5\*math.Erfc\(x\)`
}

func exceedanceStored(z float64) float64 {
	below := 0.5 * math.Erfc(-z)
	return 1 - below // want `1 - below returns 0 where the probability rounds to 1`
}

func twoSided(z float64) float64 {
	return 2 - 2*cdf(z) // want `2 - 2 \* cdf\(z\) returns 0 where the probability rounds to 1`
}

func cdf(z float64) float64 { return 0.5 * math.Erfc(-z/math.Sqrt2) }

// A difference of squares whose variable is reused: the use the
// assignment reaches is a divisor.
func reusedSlot(p, q, w float64) float64 {
	t := p + q
	t = p*p - q*q // want `a\*a - b\*b with a = p, b = q loses`
	w /= t
	t = w * w
	return math.Sqrt(t)
}

// A sign decided on the difference: near |p| = |q| the rounding picks it.
func outside(p, q float64) bool {
	return p*p-q*q < 0 // want `a\*a - b\*b with a = p, b = q loses`
}

// The value last assigned may be negative: the terms subtract for it.
func recurrenceRoot(p, q float64) float64 {
	k := math.Abs(p)
	k = p - q
	return k + math.Sqrt(k*k+1) // want `u ± math.Sqrt\(u\*u\+c\) with u = k, c = 1 cancels`
}

// The inverse hyperbolic cosine's radical on a value of either sign: the
// constant is subtracted, and the message says so.
func coshRoot(p float64) float64 {
	return p + math.Sqrt(p*p-1) // want `u ± math.Sqrt\(u\*u\+c\) with u = p, c = -1 cancels` `a\*a - b\*b with a = p, b = 1 loses`
}

// The field also takes a value from the caller, which may be tiny.
type bendGauge struct {
	angle, sag float64
}

func (g *bendGauge) set(turns int, angle, radius float64) {
	g.angle = math.Pi / float64(turns)
	if angle > 0 {
		g.angle = angle
	}
	g.sag = radius * (1 - math.Cos(g.angle)) // want `1-math.Cos\(x\) with x = g.angle returns 0`
}

func inner3(a1, a2, a3, b1, b2, b3 float64) float64 {
	return a1*b1 + a2*b2 + a3*b3
}

// nearRoot is the smaller root of a·t² - 2·h·t + k with the discriminant
// formed by the package's own dot product.
func nearRoot(h, a, k float64) float64 {
	disc := inner3(h, a, 0, h, -k, 0)
	return (h - math.Sqrt(disc)) / a // want `u ± math.Sqrt\(u\*u\+c\) with u = h, c = a \* -k cancels`
}

// tinyGap has a bounded u but a radicand offset far below u²: u²/c
// reaches 1e12.
func tinyGap(t float64) float64 {
	u := math.Cos(t)
	return u - math.Sqrt(u*u+1e-12) // want `u ± math.Sqrt\(u\*u\+c\) with c = 1e-12 cancels`
}

// logReturn is a rate's log-return with the gross factor named first: the
// variable holds 1+r, rounded before the logarithm sees it (no fix: r may
// have changed since).
func logReturn(r float64) float64 {
	gross := 1 + r
	return math.Log(gross) // want `math.Log\(gross\), gross = 1\+x with x = r, returns 0 for \|x\| below 5.55e-17`
}

// doubled holds 2+r, which loses nothing to 1: log(2+r) is far from 0.
func doubled(r float64) float64 {
	gross := 2 + r
	return math.Log(gross)
}

// beamEdge meets the cone x² + y² = k·z² of a transducer's beam: a =
// dx² + dy² - k·dz² can be near 0 for a path along the cone, so no bound
// ties b²/4a to the terms of c, and the near root loses what the
// cancellation takes.
func beamEdge(ox, oy, oz, dx, dy, dz, k float64) float64 {
	a := dx*dx + dy*dy - k*dz*dz
	b := 2 * (ox*dx + oy*dy - k*oz*dz)
	c := ox*ox + oy*oy - k*oz*oz
	disc := b*b - 4*a*c
	return (-b + math.Sqrt(disc)) / (2 * a) // want `u ± math.Sqrt\(u\*u\+c\) with u = b, c = -4 \* a \* c cancels`
}

// shimOffset: fixed values this close lose about log10(1/2e-7) ≈ 6.7
// digits in the difference of their squares.
func shimOffset() float64 {
	r := 1.0000001
	h := 1.0
	return math.Sqrt(r*r - h*h) // want `a\*a - b\*b with a = r, b = h loses`
}

// coneFactor keeps the square in a variable of its own: 1 - x2 still
// loses about log10(1/|1-x²|) digits near |x| = 1.
func coneFactor(x, mu float64) float64 {
	x2 := x * x
	return math.Pow(0.5*math.Sqrt(1-x2), mu) // want `a\*a - b\*b with a = 1, b = x loses`
}

// millibels converts a whole number of millibels: q/1000 may be 0.001,
// where |b·ln a| is 0.0023 and 10^b - 1 loses more than two digits.
func millibels(q int) float64 {
	return math.Pow(10, float64(q)/1000) - 1 // want `math.Pow\(a, b\)-1 with a = 10, b = float64\(q\) / 1000`
}

// halfChord is the half-chord of a pond of radius r cut by a fence at
// distance d from its centre, the squares written as powers.
func halfChord(r, d float64) float64 {
	return math.Sqrt(math.Pow(r, 2) - math.Pow(d, 2)) // want `a\*a - b\*b with a = r, b = d loses about log10`
}

// sweep recovers the sine of a small sweep angle from its cosine: cos t
// rounds to 1 for |t| below 1.05e-8, where the root comes out 0.
func sweep(t float64) float64 {
	return math.Sqrt(1 - math.Cos(t)*math.Cos(t)) // want `1-math.Cos\(x\)\*math.Cos\(x\) with x = t returns 0 for \|x\| below 1.05e-08, where math.Cos\(x\) rounds to 1.*use math.Sin\(x\)\*math.Sin\(x\)`
}

// sweepHeld does the same through a variable holding the cosine.
func sweepHeld(t float64) float64 {
	h := math.Cos(t)
	return math.Sqrt(1 - h*h) // want `1-math.Cos\(x\)\*math.Cos\(x\) with x = t returns 0`
}
