package hazards

import "math"

// affinity sums the geometric means of two histograms of unit mass.
func affinity(h, g []float64) float64 {
	var s float64
	for k := range h {
		s += math.Sqrt(h[k] * g[k])
	}
	return s
}

func histogramGap(h, g []float64) float64 {
	return math.Sqrt(1 - affinity(h, g)) // want `1 - s with s a sum of math.Sqrt\(p\*q\) with s = affinity\(h, g\)`
}
