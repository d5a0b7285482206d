package hazards

type vertex struct{ X, Y float64 }

// A parcel of a few metres at UTM eastings near 5e6: each term is about
// 1e7·Δy with a rounding of 1e-9·Δy, against an area of a few m².
func parcelArea(ring []vertex) float64 {
	s := 0.0
	for i := 1; i < len(ring); i++ {
		p, q := ring[i-1], ring[i]
		s += (q.X + p.X) * (q.Y - p.Y) // want `shoelace sum of \(x1\+x0\)\*\(y1-y0\) on raw coordinates`
	}
	return s / 2
}

func crossArea(ring [][2]float64) float64 {
	s := 0.0
	for i := 0; i+1 < len(ring); i++ {
		s += ring[i][0]*ring[i+1][1] - ring[i+1][0]*ring[i][1] // want `shoelace sum of x0\*y1 - x1\*y0 on raw coordinates`
	}
	return s / 2
}
