package hazards

import "math"

// The slope of the cosine between two nearby latitudes: the numerator is
// the difference of two values within a rounding of each other.
func coneSlope(lat1, lat2 float64) float64 {
	return (math.Cos(lat1) - math.Cos(lat2)) / (lat2 - lat1) // want `\(f\(a\)-f\(b\)\)/\(a-b\) for f = math.Cos with a = lat1, b = lat2 \(or its reciprocal\) is a divided difference.*0/0.*use -2\*math.Sin\(\(a\+b\)/2\)\*math.Sin\(\(a-b\)/2\)/\(a-b\)`
}

func meanGrowth(t0, t1 float64) float64 {
	return (math.Exp(t1) - math.Exp(t0)) / (t1 - t0) // want `for f = math.Exp with a = t1, b = t0 \(or its reciprocal\) is a divided difference.*use math.Exp\(b\)\*math.Expm1\(a-b\)/\(a-b\)`
}

func logMean(p, q float64) float64 {
	return (p - q) / (math.Log(p) - math.Log(q)) // want `for f = math.Log with a = p, b = q \(or its reciprocal\) is a divided difference.*use math.Log1p\(\(a-b\)/b\)/\(a-b\)`
}

func wrappedSlope(p, q float64) float64 {
	return (sine(p) - sine(q)) / (p - q) // want `for f = math.Sin with a = p, b = q \(or its reciprocal\) is a divided difference`
}
