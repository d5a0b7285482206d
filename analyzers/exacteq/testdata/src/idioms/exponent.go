package idioms

import (
	"math"
	"math/rand"
)

// gap draws a geometric variate, the number of failures before a
// success of probability p: a continuous draw is an exact power of the
// base with probability 0, and the floor is the variate's definition.
func gap(p float64) float64 {
	return math.Floor(math.Log(rand.Float64()) / math.Log(1-p))
}

// skip draws the same from a generator given as a function value.
func skip(next func() float64, p float64) int {
	return int(math.Log(1-next()) / math.Log(1-p))
}

// width is the bit width below n: at every power of two an int holds,
// math.Log(n)/math.Ln2 lands at or above the exponent, so truncation
// toward zero gives it (only a ceiling goes wrong there).
func width(n int) int {
	return int(math.Log(float64(n)) / math.Ln2)
}

// octaves takes the exponent from math.Log2, exact at powers of two.
func octaves(n int) float64 {
	return math.Ceil(math.Log2(float64(n)))
}

// scaled splits a computed sum into a mantissa and a decimal exponent:
// the sum, rounded at each step, is an exact power of ten only by
// accident, and an exponent one off still gives mantissa·10^e = sum.
func scaled(terms []float64) (float64, float64) {
	s := 0.0
	for _, t := range terms {
		s += t * t
	}
	e := math.Floor(math.Log(s) / math.Ln10)
	return s / math.Pow(10, e), e
}

// half tells whether a reading as given sits halfway between two whole
// numbers: nothing computed it, so the fraction is exact.
func half(x float64) bool {
	return x-math.Floor(x) == 0.5
}

// turn tells whether a rotation, given in degrees, is a whole number of
// turns: the angle is read as given, and math.Mod is exact (IEEE 754-2019
// §5.3.1 remainder), so the test is exact too.
func turn(shift float64) bool {
	return math.Mod(shift, 360) == 0
}
