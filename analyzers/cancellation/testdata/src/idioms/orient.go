package idioms

import (
	"math"

	"spacevec"
)

// A dot product of vectors that are not directions has the size of the
// data, not a cosine's: 1 + p·q cancels only where p·q is near -1, which
// nothing here makes likely (common practice: only unit vectors bound it).
func weightedSum(p, q spacevec.V) float64 {
	return 1 + spacevec.Inner(p, q)
}

// Neither is a sum of components a cosine.
func shifted(p spacevec.V) float64 {
	return 1 + spacevec.Spread(spacevec.Along(p))
}

// A cosine only added into a running total is a term of a sum: its
// rounding is the sum's, not a difference's.
func totalAgreement(ps, qs []spacevec.V) float64 {
	s := 0.0
	for i := range ps {
		s += 1 + spacevec.Between(ps[i], qs[i])
	}
	return s
}

// A ratio over a root that is no cosine: 1 + x²/√(20+x²) has no
// difference of near values (a colour-difference weight).
func weight(l float64) float64 {
	return 1 + (0.015*(l-50)*(l-50))/math.Sqrt(20+(l-50)*(l-50))
}

// filletCorner: the arc cosine of a bare dot product, of directions too, is left alone
// (docs/cancellation.md): the angles it measures are a shape's corners,
// where it keeps its digits away from 0 and π.
func filletCorner(p, q spacevec.V) float64 {
	u, w := spacevec.Along(p), spacevec.Along(q)
	return math.Acos(u.Dot(w))
}

// Nearly opposite directions handled by themselves first: after the
// guard, 1 + c is at least 0.001, and at most three digits go.
func halfTurnGuarded(p, q spacevec.V) float64 {
	u, w := spacevec.Along(p), spacevec.Along(q)
	c := spacevec.Inner(u, w)
	if c < -1+0.001 {
		return 0
	}
	return math.Sqrt(2 * (1 + c))
}
