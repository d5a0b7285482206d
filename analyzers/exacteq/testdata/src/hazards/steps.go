package hazards

import "math"

// profile samples a kiln's ramp from lo to hi degrees by step: 0 to 0.3
// by 0.1 is a quotient of 2.9999999999999996, and the ramp loses its end.
func profile(lo, hi, step float64) []float64 {
	n := int((hi-lo)/step) + 1 // want `int\(\(hi - lo\) / step\) truncates a quotient of floats that counts the points of a range \(the steps plus 1\): where the range holds a whole number of steps, the quotient lands within an ulp of it, on either side \(\(0.3-0\)/0.1 is 2.9999999999999996, so a range from 0 to 0.3 by 0.1 gets 3 points, not 4\)`
	pts := make([]float64, n)
	for i := range pts {
		pts[i] = lo + float64(i)*step
	}
	return pts
}

// holds counts the dwell steps between two times and sizes a slice with
// them.
func holds(from, to, dt float64) []float64 {
	n := int(math.Floor((to - from) / dt)) // want `math.Floor\(\(to - from\) / dt\) truncates a quotient of floats that sizes the slice made with n elements`
	return make([]float64, n)
}

// marks counts the tick marks of an axis, floored and converted.
func marks(lo, hi, step float64) int {
	return int(math.Floor((hi-lo)/step)) + 1 // want `math.Floor\(\(hi - lo\) / step\) truncates a quotient of floats that counts the points of a range \(the steps plus 1\)`
}

// shell holds the settings of a radial scan: out to reach by width.
type shell struct{ reach, width float64 }

// shells counts the shells of a scan from the centre: a reach of 2.3 by
// widths of 0.01 is a quotient of 229.99999999999997, and the last shell
// is dropped.
func shells(s shell) []float64 {
	n := int(s.reach / s.width) // want `int\(s.reach / s.width\) truncates a quotient of floats that bounds the loop over n steps`
	out := make([]float64, 0)
	for i := 1; i <= n; i++ {
		out = append(out, float64(i)*s.width)
	}
	return out
}
