package hazards

import "math"

func secant(x float64) float64 { return 1 / math.Cos(x) }

// ringScale divides two logarithms of ratios of one function at two
// latitudes: both tend to log 1 = 0 as the latitudes meet.
func ringScale(lat1, lat2 float64) float64 {
	return math.Log(math.Cos(lat1)*secant(lat2)) / math.Log(math.Tan(lat2)/math.Tan(lat1)) // want `math.Log of f\(a\)/f\(b\) for f = math.Tan with a = lat2, b = lat1, consumed where its relative accuracy matters`
}
