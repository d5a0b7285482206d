package hazards

import "math"

// Shares of a set of bids by their scores (a softmax): a score above
// 709.78 makes its exponential and the total +Inf, and its share NaN.
func bidShares(scores []float64) []float64 {
	shares := make([]float64, len(scores))
	total := 0.0
	for i, s := range scores {
		shares[i] = math.Exp(s)
		total += shares[i]
	}
	for i := range shares {
		shares[i] /= total // want `share of a sum of exponentials: math.Exp\(s\) and total overflow to \+Inf once the exponent exceeds 709.783`
	}
	return shares
}

// One share computed on the fly from a sum of exponentials.
func firstShare(w []float64) float64 {
	z := 0.0
	for _, v := range w {
		z += math.Exp(v)
	}
	return math.Exp(w[0]) / z // want `share of a sum of exponentials: math.Exp\(v\) and z overflow`
}

// A log-partition function summed without a shift: +Inf from an energy
// of 709.78 on, -Inf when every energy is below -745.13.
func logPartition(energies []float64) float64 {
	z := 0.0
	for _, e := range energies {
		z += math.Exp(e)
	}
	return math.Log(z) // want `log of a sum of exponentials: math.Log\(z\) summing math.Exp\(e\) is \+Inf once the exponent exceeds 709.783 and -Inf once every exponent is below -745.133`
}
