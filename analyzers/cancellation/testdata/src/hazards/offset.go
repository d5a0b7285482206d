package hazards

import "math"

// The lower half of a two-sided quantile: 1 + 2*(q - 0.5) is 2*q, but
// q - 0.5 rounds q to within 5.55e-17 first.
func lowerQuantile(mu, b, q float64) float64 {
	return mu + b*math.Log(1+2*(q-0.5)) // want `1 \+ 2\*\(q-0.5\) is 2\*q, but q - 0.5 is rounded first, to within 5.55e-17, which adding the constant back does not undo: where \|q\| is small against 0.5 it keeps only about log10\(\|q\|/1.11e-16\) digits; use 2\*q`
}

func centred(q float64) float64 {
	return 1 / (4*(q-0.25) + 1) // want `4\*\(q-0.25\) \+ 1 is 4\*q, but q - 0.25 is rounded first`
}
