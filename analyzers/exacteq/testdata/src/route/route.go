// Package route computes quantities of a weir that tests check against
// a second route of their own.
package route

import "math"

// Weir is a sharp-crested weir.
type Weir struct {
	Width, Coeff float64
}

// Spread returns the spread of the nappe, sqrt(2*w*w).
func (w Weir) Spread() float64 { return math.Sqrt(w.Area()) }

// Area returns 2*w*w, or +Inf for a weir of no coefficient.
func (w Weir) Area() float64 {
	if w.Coeff == 0 {
		return math.Inf(1)
	}
	return 2 * w.Width * w.Width
}

// LogHead returns the log of a head ratio, 0 in exact arithmetic at h = 0.
func LogHead(h float64) float64 {
	return h - 2*math.Log(math.Exp(h)+1) + 2*math.Ln2
}

// Angle returns the elevation angle of a stretched coordinate, in
// degrees: 0 at y = 0 in exact arithmetic.
func Angle(y float64) (float64, float64) {
	lon := y/16*360 - 180
	return lon, 2*math.Atan(math.Exp(y))*(180/math.Pi) - 90
}

// Shift returns the coordinate moved back by a half span, exact for dyadic
// inputs and with no math function.
func Shift(y float64) float64 {
	return y*0.5 - 8
}
