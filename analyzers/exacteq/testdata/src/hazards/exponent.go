package hazards

import "math"

// digits counts the decimal digits of a survey plot's area in square
// metres: at 1000 the quotient is 2.9999999999999996, and the count is 3.
func digits(area float64) int {
	return int(math.Log(area)/math.Log(10) + 1) // want `int\(math.Log\(area\)/math.Log\(10\) \+ 1\) is 3, not 4, at area = 1000 \(10\^3\): the quotient of rounded logarithms is 2.9999999999999996 there, and 8 of the 23 powers of 10 exact in float64 land on the wrong side`
}

// tiers is the number of levels of a ternary sieve over n cells: at 9
// the quotient is 2.0000000000000004, and the ceiling one level too high.
func tiers(n int) float64 {
	return math.Ceil(math.Log(float64(n)) / math.Log(3)) // want `math.Ceil\(math.Log\(float64\(n\)\) / math.Log\(3\)\) is 3, not 2, at float64\(n\) = 9 \(3\^2\)`
}

// rounds is the number of halvings of a bracket of n cells.
func rounds(n int) float64 {
	return math.Ceil(math.Log(float64(n)) * math.Log2E) // want `math.Ceil\(math.Log\(float64\(n\)\) \* math.Log2E\) is 56, not 55, at float64\(n\) = 36028797018963968 \(2\^55\)`
}

// depth takes the number of m-way splits of n cells, the base known only
// at run time.
func depth(n, m int) float64 {
	return math.Ceil(math.Log2(float64(n)) / math.Log2(float64(m))) // want `math.Ceil\(math.Log2\(float64\(n\)\) / math.Log2\(float64\(m\)\)\) takes a whole number from a quotient of rounded logarithms`
}

// median tells whether the q-quantile of n readings falls halfway
// between two of them: at q = 0.29, n = 50 the product is
// 14.499999999999998, and the half is missed.
func median(q float64, n int) bool {
	pos := q * float64(n)
	return pos-math.Floor(pos) == 0.5 // want `exact == tests the fractional part or remainder pos - math.Floor\(pos\) of a computed value against 0.5: a value at that fraction in exact arithmetic can come out an ulp below or above \(0.29\*50 is 14.499999999999998, fraction 0.4999999999999982\)`
}

// onBeat tells whether a clock advanced by steps of dt lands on a beat of
// the period: ten steps of 0.1 make 0.9999999999999999, whose remainder
// by 0.5 is 0.4999999999999999, not 0.
func onBeat(steps int, dt, period float64) bool {
	t := 0.0
	for range steps {
		t += dt
	}
	return math.Mod(t, period) == 0 // want `exact == tests the fractional part or remainder math.Mod\(t, period\) of a computed value against 0`
}
