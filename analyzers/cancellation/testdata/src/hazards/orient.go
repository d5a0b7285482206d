package hazards

import (
	"math"

	"spacevec"
)

// Rotations and angles between vectors whose functions live in another
// package: their shapes (direction, dot product, cosine) cross as facts.

// alignFactor is the 1/(1 + a·b) of the rotation taking a to b: a and b
// nearly opposite leave 1 + cos θ ≈ (π-θ)²/2 to cancellation.
func alignFactor(a, b spacevec.V) float64 {
	a, b = spacevec.Along(a), spacevec.Along(b)
	return 1 / (1 + spacevec.Inner(a, b)) // want `1 \+ c with c = spacevec.Inner\(a, b\), the cosine of the angle between two vectors, returns 0 for angles within about 1.49e-08 rad of π`
}

// alignMethod is the same through a method, the directions held in
// fresh variables.
func alignMethod(p, q spacevec.V) float64 {
	u, w := spacevec.Along(p), spacevec.Along(q)
	return 1 / (u.Dot(w) + 1) // want `1 \+ c with c = u.Dot\(w\), the cosine`
}

// nearGap is 1 - cos θ of two directions.
func nearGap(p, q spacevec.V) float64 {
	u := spacevec.Along(p)
	w := spacevec.Along(q)
	return 1 / (1 - u.Dot(w)) // want `1 - c with c = u.Dot\(w\), the cosine of the angle between two vectors, returns 0 for angles below about 1.49e-08 rad`
}

// angleOf takes the arc cosine of another package's cosine.
func angleOf(p, q spacevec.V) float64 {
	return math.Acos(spacevec.Between(p, q)) // want `math.Acos\(x\) with x = spacevec.Between\(p, q\) loses half the digits where x is near ±1`
}

// alignRatio writes the cosine out: a dot product over the lengths.
func alignRatio(a, b spacevec.V) float64 {
	cos := (a.X*b.X + a.Y*b.Y + a.Z*b.Z) / (spacevec.Size(a) * spacevec.Size(b))
	return 1 + cos // want `1 \+ c with c = cos, the cosine`
}
