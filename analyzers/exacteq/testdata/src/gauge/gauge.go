// Package gauge converts invented sensor readings.
package gauge

// Scale converts a raw reading.
func Scale(raw float64) float64 { return raw*0.1 + 0.2 }

// Offset returns the calibration offset.
func Offset(a, b float64) float64 { return a - b }
