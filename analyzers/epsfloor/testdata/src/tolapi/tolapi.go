// Package tolapi offers a solver whose tolerance is a parameter and a field.
package tolapi

import "math"

// Settings configures Refine.
type Settings struct {
	RelTol float64 // want RelTol:"a relative tolerance of float64 in Refine"
}

// Refine reports whether a and b agree to the settings' tolerance.
func Refine(s Settings, a, b float64) bool {
	return math.Abs(a-b) <= s.RelTol*math.Abs(b)
}

// Agree reports whether a and b agree to within tol, absolutely.
func Agree(a, b, tol float64) bool { // want Agree:"parameter 2 is an absolute tolerance of float64 in Agree"
	return math.Abs(a-b) < tol
}

// Close passes its tolerance on to Agree.
func Close(a, b, eps float64) bool { // want Close:"parameter 2 is an absolute tolerance of float64 in Agree"
	return Agree(a, b, eps)
}

// Either passes when either test does: its atol cannot make it exact, so
// it is not learned as a tolerance.
func Either(a, b, atol, rtol float64) bool { // want Either:"parameter 3 is a relative tolerance"
	return Agree(a, b, atol) || math.Abs(a-b) <= rtol*math.Abs(b)
}

// Match reports whether a and b agree to within tol, and takes a
// tolerance of 0 as exact equality.
func Match(a, b, tol float64) bool { // want Match:"parameter 2 is an absolute tolerance of float64 in Match"
	if tol == 0 {
		return a == b
	}
	return math.Abs(a-b) < tol
}

// Kiln fits the parabola of a kiln's temperature through three readings;
// Pivot is the smallest denominator it accepts.
type Kiln struct {
	Pivot float64 // want Pivot:"a threshold of float64 on math.Abs\\(den\\) < k.Pivot, of degree 3 in the data, in Curvature, tested at tolapi.go:59"
}

// NewKiln returns a Kiln with its default pivot, which fails for readings
// spaced by more than 1.65 (a cube of spacings, 1e-15/eps = 4.5).
func NewKiln() *Kiln {
	k := new(Kiln)
	k.Pivot = 1e-15 // want `1e-15, assigned to field Pivot \(a threshold of float64 on math.Abs\(den\) < k.Pivot, of degree 3 in the data, in Curvature, tested at tolapi.go:59\), is below its rounding error eps·s\^3 \(eps = 2.22e-16\) once the data reach s = 1.7, under the 1e\+03 assumed for data of unknown size; scale it with the size of the terms the quantity is computed from \(it grows as s\^3\)`
	return k
}

// Curvature returns the leading coefficient of the parabola through
// (t0, y0), (t1, y1), (t2, y2).
func (k *Kiln) Curvature(t0, y0, t1, y1, t2, y2 float64) (float64, bool) {
	den := (t0 - t1) * (t1 - t2) * (t2 - t0)
	if math.Abs(den) < k.Pivot {
		return 0, false
	}
	return -((t1-t2)*y0 + (t2-t0)*y1 + (t0-t1)*y2) / den, true
}

// Collinear reports whether three survey stakes lie on one line, to
// within tol on twice the area of their triangle.
func Collinear(ax, ay, bx, by, cx, cy, tol float64) bool { // want Collinear:"parameter 6 is an absolute tolerance of float64 on math.Abs\\(cross\\) < tol, of degree 2 in the data, in Collinear, tested at tolapi.go:69"
	cross := (bx-ax)*(cy-ay) - (by-ay)*(cx-ax)
	return math.Abs(cross) < tol
}

// Settled reports whether a bracket [lo, hi] of a stake's position is
// narrower than tol: a difference of values read as given, exact when
// they are close (Sterbenz), so no constant given to tol is judged.
func Settled(lo, hi, tol float64) bool {
	return hi-lo < tol
}

// Degenerate reports whether two corners of a float32 mesh triangle
// coincide to within tol: the same test of three pairs, each exact when
// tol is, so tol is learnt through the || as through one call.
func Degenerate(a, b, c [2]float32, tol float32) bool { // want Degenerate:"parameter 3 is an absolute tolerance of float32 in within"
	return within(a, b, tol) || within(b, c, tol) || within(c, a, tol)
}

func within(p, q [2]float32, tol float32) bool { // want within:"parameter 2 is an absolute tolerance of float32 in within"
	return abs32(p[0]-q[0]) <= tol && abs32(p[1]-q[1]) <= tol
}

func abs32(x float32) float32 {
	if x < 0 {
		return -x
	}
	return x
}
