package hazards

type point3 [3]float64

func dotAlong(p0, p1, q0, q1 point3) float64 {
	s := 0.0
	for i := range p0 {
		s += (p1[i] - p0[i]) * (q1[i] - q0[i])
	}
	return s
}

// The denominator of the closest points of two segments: |u|²|v|² - (u·v)²
// vanishes for parallel segments, and the sign test and the quotients need
// it to relative accuracy.
func closestParameter(a0, a1, b0, b1 point3) float64 {
	uu := dotAlong(a0, a1, a0, a1)
	uv := dotAlong(a0, a1, b0, b1)
	vv := dotAlong(b0, b1, b0, b1)
	det := uu*vv - uv*uv // want `a\*c - b\*b with a = uu, c = vv, b = uv, where a = \|u\|², c = \|v\|², b = u·v, is \|u×v\|²`
	if det <= 0 {
		return 0
	}
	return uv / det
}
