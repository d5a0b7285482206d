// Package gauge converts invented sensor readings.
package gauge

import "math"

// Scale converts a raw reading.
func Scale(raw float64) float64 { return raw*0.1 + 0.2 }

// Offset returns the calibration offset.
func Offset(a, b float64) float64 { return a - b }

// Droop returns the relative sag of a membrane at load w.
func Droop(w float64) float64 { return w*w*0.75 + w/3 }

// Pair is a reading and its uncertainty.
type Pair struct{ Value, Spread float64 }

// Read returns the reading for raw with its spread.
func Read(raw float64) Pair { return Pair{Scale(raw), raw / 30} }

// Ln3 is the natural logarithm of 3 in float32.
const Ln3 = float32(1.09861228866810969139524523692252570464749055782274945173469433)

// Log32 returns the natural logarithm of x in float32.
func Log32(x float32) float32 { return float32(math.Log(float64(x))) }

// Turns converts a quarter-turn count to turns, without arithmetic.
func Turns(q float64) float64 { return q }

// Third returns a third of x + 1: one addition and one division, each
// correctly rounded, nothing to fuse.
func Third(x float64) float64 { return (x + 1) / 3 }

// Tint is a colour in an invented perceptual space.
type Tint struct{ L, C float64 }

// ToTint converts a reflectance to a tint through a cube root.
func ToTint(r float64) Tint { return Tint{L: math.Pow(r, 1.0/3), C: r / 7} }

// Halve divides x by 2, n times, recursively.
func Halve(x float64, n int) float64 {
	if n == 0 {
		return x
	}
	return Halve(x, n-1) / 2
}

// Blend mixes two readings with weight w; each product is rounded by its
// explicit conversion before the sum, so nothing can fuse.
func Blend(a, b, w float64) float64 { return float64(w*a) + float64((1-w)*b) }
