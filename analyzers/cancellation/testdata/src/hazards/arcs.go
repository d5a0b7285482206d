package hazards

import "math"

func arcCos(x float64) float64 { return math.Acos(x) }
func sine(x float64) float64   { return math.Sin(x) }
func cosine(x float64) float64 { return math.Cos(x) }

// The spherical law of cosines through the package's own wrappers: near
// the centre the argument is within a rounding of 1.
func centralAngle(lat0, lat1, dlon float64) float64 {
	return arcCos(sine(lat0)*sine(lat1) + cosine(lat0)*cosine(lat1)*cosine(dlon)) // want `math.Acos\(x\) loses half the digits where x is near ±1`
}

// The clamp reassigns the cosine before the arc: the value reaching
// math.Acos is still a dot product over norms.
func sweepAngle(ux, uy, vx, vy float64) float64 {
	c := (ux*vx + uy*vy) / math.Sqrt((ux*ux+uy*uy)*(vx*vx+vy*vy))
	c = math.Min(1, math.Max(-1, c))
	return math.Acos(c) // want `math.Acos\(x\) with x = c loses half the digits`
}
