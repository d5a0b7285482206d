package hazards

import "math"

func secant(x float64) float64 { return 1 / math.Cos(x) }

// ringScale divides two logarithms of ratios of one function at two
// latitudes: both tend to log 1 = 0 as the latitudes meet.
func ringScale(lat1, lat2 float64) float64 {
	return math.Log(math.Cos(lat1)*secant(lat2)) / math.Log(math.Tan(lat2)/math.Tan(lat1)) // want `math.Log of f\(a\)/f\(b\) for f = math.Tan with a = lat2, b = lat1, consumed where its relative accuracy matters`
}

// defectLikelihood is the log-likelihood of k defective parts in a batch
// of size batch with defect rate q.
func defectLikelihood(k, batch, q float64) float64 {
	return k*math.Log(q) + (batch-k)*math.Log(1-q) // want `math.Log\(1-x\) with x = q returns 0 for \|x\| below 5.55e-17`
}
