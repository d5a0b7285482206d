// Package single is a float32 math library whose Abs clears the sign bit
// through its own reinterpretation helpers.
package single

import "math"

func bits(f float32) uint32 { return math.Float32bits(f) }

func frombits(b uint32) float32 { return math.Float32frombits(b) }

// Abs returns |x|.
func Abs(x float32) float32 { return frombits(bits(x) &^ (1 << 31)) }
