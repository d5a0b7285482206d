package hazards

import (
	"errors"
	"math"
)

// station is a survey mark; any finite coordinate is accepted.
type station struct {
	east, north, up float64
}

func (s station) check() error {
	if math.IsInf(s.east, 0) || math.IsInf(s.north, 0) || math.IsNaN(s.east) || math.IsNaN(s.north) {
		return errors.New("station: coordinates must be finite")
	}
	return nil
}

func larger(a, b float64) float64 {
	if a > b {
		return a
	}
	return b
}

func baseline(a, b station) float64 {
	de, dn := b.east-a.east, b.north-a.north
	return math.Sqrt(de*de + dn*dn) // want `math.Sqrt\(x\*x\+y\*y\) with x = de, y = dn overflows to \+Inf once \|x\| or \|y\| exceeds 1.34e\+154`
}

func gap(a, b station) float64 {
	de := larger(0, b.east-a.east)
	dn := larger(0, b.north-a.north)
	return math.Sqrt(de*de + dn*dn) // want `math.Sqrt\(x\*x\+y\*y\) with x = de, y = dn overflows`
}

// slant: east and north are validated only as finite, so the three-term
// root is reported though up is not.
func slant(a, b station) (float64, float64) {
	de, dn, du := b.east-a.east, b.north-a.north, b.up-a.up
	flat := math.Hypot(de, dn)
	_ = math.Hypot(flat, du)
	return flat, math.Sqrt(de*de + dn*dn + du*du) // want `math.Sqrt\(x\*x\+y\*y\+z\*z\) with x = de, y = dn, z = du overflows to \+Inf once \|x\|, \|y\| or \|z\| exceeds 1.34e\+154`
}

func (s station) dot(o station) float64 {
	return s.east*o.east + s.north*o.north
}

func (s station) normSq() float64 {
	return s.dot(s)
}

func (s station) norm() float64 {
	return math.Sqrt(s.normSq()) // want `math.Sqrt of a vector's dot product with itself \(fields east, north, which the package takes as unbounded\) overflows`
}

// bend uses the squared length in a product too, which overflows
// before the root's squares: not reported.
func bend(s station) float64 {
	q := s.dot(s)
	return q*q + math.Sqrt(q)
}

// pixel's fields are passed to math.Hypot below, but never validated only
// as finite: Hypot says nothing of their range, and the root of their
// squares is left alone.
type pixel struct{ u, v float64 }

func pixelGap(a, b pixel) (float64, float64) {
	du, dv := b.u-a.u, b.v-a.v
	return math.Hypot(du, dv), math.Sqrt(du*du + dv*dv)
}
