package hazards

import "math"

// The position of x on a logarithmic axis: the span's logarithms are
// about 21 at 1e9, each rounded to 3.6e-15, while a narrow span's
// logarithm is 1e-10.
func logPosition(lo, hi, x float64) float64 {
	logLo := math.Log(lo)
	return (math.Log(x) - logLo) / (math.Log(hi) - logLo) // want `math.Log\(a\) - math.Log\(b\) with a = hi, b = lo, consumed where its relative accuracy matters.*use math.Log1p\(\(a-b\)/b\)`
}

func octaves(f0, f1 float64) float64 {
	return 1 / (math.Log2(f1) - math.Log2(f0)) // want `math.Log2\(a\) - math.Log2\(b\) with a = f1, b = f0.*use math.Log1p\(\(a-b\)/b\)/math.Ln2`
}
