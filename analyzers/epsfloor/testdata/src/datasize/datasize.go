// Package datasize surveys plots of land: absolute tolerances on
// quantities whose size is the caller's, judged at the data size 1e3.
package datasize

import (
	"math"
	"strconv"
)

type station struct{ east, north float64 }

func (p station) to(q station) station { return station{q.east - p.east, q.north - p.north} }

func (p station) cross(q station) float64 { return p.east*q.north - p.north*q.east }

func (p station) dot(q station) float64 { return p.east*q.east + p.north*q.north }

// level compares two of its parameters: its callers' arguments are the
// data, so it is judged where it is called, not here.
func level(a, b float64) bool { return math.Abs(a-b) < 1e-11 }

// Collinear tests a cross product of two sides (an area, degree 2): its
// rounding at coordinates of 1e3 is about 2.2e-16·1e6 = 2.2e-10.
func Collinear(a, b, c station) bool {
	return level(a.to(b).cross(a.to(c)), 0) // want `absolute tolerance 1e-11 on level\(a.to\(b\).cross\(a.to\(c\)\), 0\), of degree 2 in the data, is below its rounding error eps·s\^2 \(eps = 2.22e-16\) once the data reach s = 2.1e\+02, under the 1e\+03 assumed`
}

// SameEasting compares coordinates (degree 1): 1e-11 lasts up to 4.5e4,
// and degree 1 is judged only at a declared size.
func SameEasting(a, b station) bool {
	return level(a.east, b.east)
}

// Flat compares a product of two lengths that do not cancel: its
// rounding is relative, 2.2e-16 of itself, so no size breaks the test.
func Flat(width, depth float64) bool {
	return level(width*depth, 0)
}

// DoubleRoot tests a discriminant, degree 2 in the coefficients.
func DoubleRoot(a, b, c float64) bool {
	return math.Abs(b*b-4*a*c) < 1e-12 // want `absolute tolerance 1e-12 on math.Abs\(b\*b-4\*a\*c\) < 1e-12, of degree 2 in the data, .* once the data reach s = 67,`
}

// Steady tests a one-pass spread of readings (degree 2) against a bare
// threshold: a flat series leaves a residue of eps times the sum of
// squares.
func Steady(readings []float64) bool {
	sum, sq := 0.0, 0.0
	for _, r := range readings {
		sum += r
		sq += r * r
	}
	spread := sq - sum*sum/float64(len(readings))
	return spread < 1e-12 // want `absolute tolerance 1e-12 on spread < 1e-12, of degree 2 in the data, a running sum over the data, .* once n and s reach 29,`
}

// Extent guards a division by the range of two readings as given: their
// difference is exact when they are close (Sterbenz), so no rounding
// drowns 1e-14; above 45 the guard becomes an exact zero test.
func Extent(lo, hi float64) float64 {
	if r := hi - lo; r < 1e-14 {
		return 1
	}
	return hi - lo
}

// OnTarget compares a mean power, volts times amperes (computed, degree
// 2), with a target: its rounding, eps·s² for one product, passes 1e-14
// once the readings reach 6.7, and as a sum of n of them, √n·eps·s², once
// n and the readings reach 4.6. A few ulps of the mean added to the
// tolerance would not cover n terms' rounding: no fix is offered.
func OnTarget(volts, amps []float64, target float64) bool {
	sum := 0.0
	for i, v := range volts {
		sum += v * amps[i]
	}
	mean := sum / float64(len(volts))
	if math.Abs(mean-target) < 1e-14 { // want `absolute tolerance 1e-14 on math.Abs\(mean-target\) < 1e-14, of degree 2 in the data, a running sum over the data, .* once n and s reach 4.6,`
		return true
	}
	return false
}

// MeanOnTarget compares a mean of readings (degree 1): the readings may
// be pure numbers, whose size the tolerance states, so at the assumed
// size it is left alone (a declared size judges it: package bigdata).
func MeanOnTarget(readings []float64, target float64) bool {
	sum := 0.0
	for _, r := range readings {
		sum += r
	}
	mean := sum / float64(len(readings))
	return math.Abs(mean-target) < 1e-14
}

// Within compares squared distances with a squared tolerance: both
// sides are of degree 2, so the test is consistent at every size.
func Within(a, b station) bool {
	d := a.to(b)
	return d.dot(d) < 1e-6*1e-6
}

// Mixed has a relative part that grows with the data.
func Mixed(a, b float64) bool {
	return math.Abs(a-b) <= 1e-12+1e-9*math.Abs(b)
}

// Thin compares a parameter with a threshold: it carries no rounding of
// its own to drown the tolerance.
func Thin(width float64) bool {
	return width < 1e-12
}

// Bearing compares angles' sines, of degree 0: their size is fixed.
func Bearing(t, s float64) bool {
	return math.Abs(math.Sin(t)-math.Sin(s)) < 1e-14
}

// Parsed compares a value of unknown degree (from another package).
func Parsed(text string, w float64) bool {
	v, _ := strconv.ParseFloat(text, 64)
	return math.Abs(v-w) < 1e-14
}

// Guarded keeps a cross product away from underflow: a constant at or
// below 2^-511 is a guard, not a tolerance.
func Guarded(a, b station) float64 {
	if d := a.cross(b); math.Abs(d) < 1e-300 {
		return 0
	}
	return 1 / a.cross(b)
}

// sheet maps survey stations onto a drawing: a linear part and an offset.
type sheet [2][3]float64

func (m sheet) place(p station) station {
	return station{m[0][0]*p.east + m[0][1]*p.north + m[0][2], m[1][0]*p.east + m[1][1]*p.north + m[1][2]}
}

// Folds tests the determinant of the linear part. Its entries multiply a
// station and are added to an offset entry, so by dimensional consistency
// they are pure numbers (degree 0): the determinant has no data size.
func Folds(m sheet) bool {
	return level(m[0][0]*m[1][1]-m[0][1]*m[1][0], 0)
}

// Swept tests the cross product of the offset with a station: the
// offsets are data (degree 1), the product an area (degree 2).
func Swept(m sheet, p station) bool {
	return level(station{m[0][2], m[1][2]}.cross(p), 0) // want `absolute tolerance 1e-11 on .*, of degree 2 in the data, .* once the data reach s = 2.1e\+02`
}

func (p station) unit() station {
	n := math.Hypot(p.east, p.north)
	return station{p.east / n, p.north / n}
}

// Offside reassigns its parameter to a unit vector before the test: the
// value that reaches the cross product is a pure direction (degree 0),
// so the product with a station is a length (degree 1), not an area.
func Offside(heading, p station) bool {
	heading = heading.unit()
	return level(heading.cross(p), 0)
}

// windowSpread returns the one-pass spread of the heights in each window
// of w readings, stored element by element into a slice made for them.
// Each pass squares fresh values (h2 := h; h2 *= h2), so the sums of
// squares are of degree 2, and so is their difference with the squared
// mean, which cancels for a flat window.
func windowSpread(heights []float64, w int) []float64 {
	out := make([]float64, len(heights))
	sum, sq := 0.0, 0.0
	for i, h := range heights {
		sum += h
		h2 := h
		h2 *= h2
		sq += h2
		if i >= w {
			gone := heights[i-w]
			sum -= gone
			gone *= gone
			sq -= gone
		}
		n := float64(min(i+1, w))
		out[i] = sq/n - (sum/n)*(sum/n)
	}
	return out
}

// LevelGround reads the spreads from windowSpread: for a flat window
// their residue is eps times the sum of squares, 2.2e-16·1e6 at heights
// of 1e3, far above 1e-13, which holds only below heights of 21, and
// below 12 for windows of as many readings (the sums' √n).
func LevelGround(heights []float64, w int) []bool {
	spreads := windowSpread(heights, w)
	flat := make([]bool, len(spreads))
	for i := range spreads {
		s := spreads[i]
		flat[i] = s < 1e-13 // want `absolute tolerance 1e-13 on s < 1e-13, of degree 2 in the data, a running sum over the data, .* once n and s reach 12,`
	}
	return flat
}

// Compounded squares a growth factor declared before the loop on every
// pass: after k passes it is of degree 2^k, which no fixed degree bounds,
// so the test is left alone.
func Compounded(rate float64, years int) bool {
	g := rate
	for range years {
		g *= g
	}
	return math.Abs(g-rate) < 1e-14
}

// Footprints stores each plot's area, width times depth, element by
// element: a product that does not cancel keeps a relative error, 2.2e-16
// of itself, so a bare threshold on it is a plain size test at any scale.
func Footprints(widths, depths []float64) int {
	areas := make([]float64, len(widths))
	for i := range widths {
		areas[i] = widths[i] * depths[i]
	}
	small := 0
	for _, a := range areas {
		if a < 1e-12 {
			small++
		}
	}
	return small
}

// ulp is machine epsilon worked out by arithmetic (2^-52, IEEE 754-2019
// binary64): a multiple of it states a relative precision.
const ulp = 1.0 / (1 << 52)

// Degenerate asks whether a survey line has no length with a tolerance of
// 100 ulps: that is 100 ulps of a value of size 1, and less than the
// spacing of floats once coordinates exceed 100 (2.2e-14 < ulp(128) =
// 2.8e-14), where it is an exact equality test.
func Degenerate(start, end float64, n int) float64 {
	if end-start < 100*ulp { // want `absolute tolerance 2.22e-14 on end-start < 100\*ulp, of degree 1 in the data, is 100·eps \(eps = 2.22e-16\), a relative precision used as an absolute one: 100 ulps at magnitude 1, less than one once the data exceed s = 1e\+02, under the 1e\+03 assumed`
		return 0
	}
	return (end - start) / float64(n)
}

// OnGrid tests that a stake lies on a grid of the given pitch: the
// remainder has the size of the pitch, so 4 ulps of 1 is no margin there.
func OnGrid(stake, pitch float64) float64 {
	r := math.Mod(stake, pitch)
	if r < 4*ulp { // want `absolute tolerance 8.88e-16 on r < 4\*ulp, of degree 1 in the data, is 4·eps`
		return 0
	}
	return r
}

// SameSlope compares two grades, rise over run (degree 0, a pure number
// whatever the unit of length): 100 ulps of 1 is a relative margin there.
func SameSlope(rise1, run1, rise2, run2 float64) string {
	if math.Abs(rise1/run1-rise2/run2) < 100*ulp {
		return "even"
	}
	return "break"
}

// CloseEnough compares a midpoint with a third coordinate, with a decimal
// tolerance that states an absolute size its author chose (not a multiple
// of eps): at degree 1 it is judged only at a declared data size.
func CloseEnough(a, b, c float64) float64 {
	m := (a + b) / 2
	if math.Abs(m-c) < 2.2e-14 {
		return c
	}
	return m
}

// Stakeless tests a squared distance of three components against a bare
// threshold: a sum of squares never cancels, so its rounding error is
// relative, a few eps of itself, and the test is a plain size test at any
// scale.
func Stakeless(dx, dy, dz float64) float64 {
	sq := dx*dx + dy*dy + dz*dz
	if sq < 1e-14 {
		return 0
	}
	return math.Sqrt(sq)
}

// settle rescales p by the reciprocal of its own length (its name says
// nothing; its body divides p by |p|), leaving the zero vector as it is.
func (p station) settle() station {
	l := math.Sqrt(p.dot(p))
	if l == 0 {
		return p
	}
	inv := 1 / l
	return station{p.east * inv, p.north * inv}
}

// beam is a lamp's light: heading is stored only normalised, so it is a
// direction wherever the package reads it.
type beam struct {
	origin, heading station
}

func castBeam(from, to station) beam { return beam{from, from.to(to).settle()} }

func (b beam) swung(toward station) beam { return beam{origin: b.origin, heading: toward.unit()} }

// Perpendicular tests the cosine of two headings: directions have length
// 1 up to rounding, so their dot product is at most 1 whatever the units
// of the lamps' positions and rounds at about eps, far below 1e-11.
func Perpendicular(a, b beam) bool {
	return level(a.heading.dot(b.heading), 0)
}

// Aside normalises a station into a local direction and its parameter in
// place before the test: both are directions there.
func Aside(along, p station) bool {
	along = along.settle()
	n := p.settle()
	return level(along.cross(n), 0)
}

// shadow is a mark cast on a wall: its lean is stored once as given, a
// difference of stations, so it is data of degree 1 even though another
// store normalises it.
type shadow struct {
	spot, lean station
}

func cast(at, to station) shadow { return shadow{at, at.to(to)} }

func (s shadow) tilted(n station) shadow { return shadow{s.spot, n.settle()} }

// Square tests two leans for a right angle: a dot product of two lengths,
// an area, whose rounding at 1e3 is about 2.2e-16·1e6.
func Square(a, b shadow) bool {
	return level(a.lean.dot(b.lean), 0) // want `absolute tolerance 1e-11 on level\(a.lean.dot\(b.lean\), 0\), of degree 2 in the data, .* once the data reach s = 2.1e\+02`
}

// Parcel is a plot surveyed by its corners, in order.
type Parcel []station

// fan sums the doubled areas of the triangles from the first corner: a
// running sum with as many terms as corners.
func (p Parcel) fan() float64 {
	total := 0.0
	for i := 2; i < len(p); i++ {
		total += p[0].to(p[i-1]).cross(p[0].to(p[i]))
	}
	return total
}

// shoelace sums the doubled area around the boundary.
func (p Parcel) shoelace() float64 {
	total := 0.0
	for i := range p {
		total += p[i].cross(p[(i+1)%len(p)])
	}
	return total
}

// Verdict compares the two areas (degree 2): 1e-9 on one product of
// coordinates would last up to 2.1e3, but each area sums n terms, whose
// rounding grows as √n too: with n and s at 1e3 it fails from 4.6e2.
func (p Parcel) Verdict() string {
	if math.Abs(p.fan()-p.shoelace()) > 1e-9 { // want `absolute tolerance 1e-09 on math.Abs\(p.fan\(\)-p.shoelace\(\)\) > 1e-9, of degree 2 in the data, a running sum over the data, is below the rounding error of a sum of n terms of size s\^2, about √n·eps·s\^2 \(eps = 2.22e-16\), once n and s reach 4.6e\+02, under the 1e\+03 assumed`
		return "the areas disagree"
	}
	return ""
}

// Shares checks that the owners' shares of a parcel, fractions of the
// whole (degree 0), add up alike by rows and by columns: each sum rounds
// at about √n·eps, above 1e-15 once it has 20 terms.
func Shares(rows, cols []float64, whole float64) bool {
	byRow, byCol := 0.0, 0.0
	for _, r := range rows {
		byRow += r / whole
	}
	for _, c := range cols {
		byCol += c / whole
	}
	return math.Abs(byRow-byCol) < 1e-15 // want `absolute tolerance 1e-15 on math.Abs\(byRow-byCol\) < 1e-15, of degree 0 in the data, a running sum over the data, is below the rounding error of a sum of n terms, about √n·eps \(eps = 2.22e-16\), once the sum has n = 20 terms`
}

// Corners sums over the three corners of two triangles: a loop whose
// count no data raise, so 1e-9 on the doubled areas lasts up to 2.1e3.
func Corners(t, u [3]station) bool {
	a, b := 0.0, 0.0
	for i := 0; i < 3; i++ {
		a += t[i].cross(t[(i+1)%3])
		b += u[i].cross(u[(i+1)%3])
	}
	return math.Abs(a-b) < 1e-9
}

// Tally compares the shares of a parcel's owners kept in a register with
// those in a list, to within 1e-12: sums of values whose size their author
// states round at about √n·eps, which reaches 1e-12 only past 2e7 terms.
func Tally(register map[string]float64, list []float64) bool {
	var kept, listed float64
	for _, v := range register {
		kept += v
	}
	for i := 0; i < len(list); i++ {
		listed = listed + list[i]
	}
	return math.Abs(kept-listed) < 1e-12
}

// ferry is a timetable's view of its stops: the traffic between two stops
// comes from a function the caller gives, so its values are the caller's
// data, as a parameter's are.
type ferry struct {
	traffic func(a, b int) float64
	total   float64
	pull    float64 // how strongly busy stops attract others: a pure number
}

// Joins tells whether stop a gains by joining a group of stops: the
// traffic summed over the group, less the share its size draws (pull is
// read as data, and the two terms agree only at the lower degree), over
// the total, a pure number (degree 0). Its rounding grows with the
// group, about √n·eps, above 1e-15 once 20 stops add to it.
func (f ferry) Joins(a int, group []int, busy float64) bool {
	var to struct{ in, out float64 }
	for _, b := range group {
		to.in += f.traffic(b, a)
		to.out += f.traffic(a, b)
	}
	gain := (to.in + to.out - f.pull*busy*busy/f.total) / f.total
	return gain > 1e-15 // want `absolute tolerance 1e-15 on gain > 1e-15, of degree 0 in the data, a running sum over the data, is below the rounding error of a sum of n terms, about √n·eps \(eps = 2.22e-16\), once the sum has n = 20 terms`
}

// Worth is Joins with 1e-9: a sum of pure numbers reaches that rounding
// only past 2e13 terms.
func (f ferry) Worth(a int, group []int) bool {
	var to struct{ in float64 }
	for _, b := range group {
		to.in += f.traffic(b, a)
	}
	return to.in/f.total-f.pull > 1e-9
}
