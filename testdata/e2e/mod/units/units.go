// Package units converts kiln readings; it compares floats only in ways
// that are exact on purpose, so roundoff finds nothing here.
package units

// Celsius converts degrees Fahrenheit to degrees Celsius.
func Celsius(f float64) float64 { return (f - 32) * 5 / 9 }

// Blend mixes two readings with weight alpha on the first.
func Blend(a, b, alpha float64) float64 {
	if alpha == 1 {
		return a
	}
	return alpha*a + (1-alpha)*b
}

// Rate returns degrees per hour, or 0 for an empty interval.
func Rate(rise, hours float64) float64 {
	if hours == 0 {
		return 0
	}
	return rise / hours
}
