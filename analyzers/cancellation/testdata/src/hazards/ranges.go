package hazards

import "math"

// Ranges that leave the argument free: the form is reported.

// Tail's own callers are outside the package, and nothing bounds s.
func Tail(s float64) float64 {
	return 1 - math.Pow(2, -s) // want `1-math.Pow\(a, b\) with a = 2, b = -s returns 0`
}

// shrink is called once with a value that can be small.
func shrink(s float64) float64 {
	return 1 - math.Pow(3, -s) // want `1-math.Pow\(a, b\) with a = 3, b = -s returns 0`
}

func Shrunk(s float64) float64 {
	if s > 15 {
		return shrink(s)
	}
	return shrink(s / 1e9)
}

// Bend's branch keeps t below 0.5 but not away from 0.
func Bend(t float64) float64 {
	if t < 0.5 {
		return 1 - math.Cos(t) // want `1-math.Cos\(x\) with x = t returns 0`
	}
	return 0
}

// Ramp is reassigned after its test, which then says nothing.
func Ramp(y float64) float64 {
	if y < -4 || y > 10 {
		return 0
	}
	y = y * 1e3
	return math.Log(1 + math.Exp(y)) // want `math.Log\(1\+math.Exp\(y\)\) overflows`
}

// Sag is the log of a cosine of a small zenith offset: log(cos(t)) is
// about -t²/2, and cos(t) rounds to 1 below 1.05e-8.
func Sag(t float64) float64 {
	return -math.Log(math.Cos(t)) / 2 // want `math.Log\(math.Cos\(x\)\) with x = t returns 0`
}

// Mercator divides through a held term: log((1-c)/(1+c)) with c small near
// the equator.
func Mercator(e, sinphi float64) float64 {
	c := e * sinphi
	div := 1 + c
	return math.Log((1 - c) / div) // want `math.Log\(\(1\+x\)/\(1-x\)\) with x = c returns 0`
}

// Krho divides the log of a cosine by the tangent of the same small
// angle: log(cos p)/tan(p) is about -p/2, not small beside t*cb, while
// its rounding error grows as u/p, so the sum does not hide it.
func Krho(p, cb float64) float64 {
	t := math.Tan(p)
	return -2 * (math.Log(math.Cos(p))/t + t*cb) // want `math.Log\(math.Cos\(x\)\) with x = p returns 0`
}

// Tilt handles a tilt below 1e-10 apart, but the logarithm of the cosine
// above it still rounds to 0 up to 1.05e-8: the split leaves the loss
// whole.
func Tilt(beta float64) float64 {
	if math.Abs(beta) < 1e-10 {
		return -0.5
	}
	c := 1 / math.Tan(beta)
	return c * c * math.Log(math.Cos(beta)) // want `math.Log\(math.Cos\(x\)\) with x = beta returns 0`
}

// KrhoLate is Krho with the tangent assigned after its declaration: the
// division reads the value last assigned before it.
func KrhoLate(p, cb float64) float64 {
	var t float64
	t = math.Tan(p)
	return -2 * (math.Log(math.Cos(p))/t + t*cb) // want `math.Log\(math.Cos\(x\)\) with x = p returns 0`
}
