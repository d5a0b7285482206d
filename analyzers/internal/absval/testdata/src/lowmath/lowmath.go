// Package lowmath is a float32 math library of the kind absval must
// recognise by meaning: its Abs clears the sign bit through its own bit
// helpers.
package lowmath

import "math"

const signBit = 1 << 31

// Float32bits and Float32frombits reinterpret, as math's do.
func Float32bits(f float32) uint32 { return math.Float32bits(f) }

func Float32frombits(b uint32) float32 { return math.Float32frombits(b) }

func Abs(x float32) float32 { // want Abs:"absolute value"
	return Float32frombits(Float32bits(x) &^ signBit)
}

func Mag(x float32) float32 { // want Mag:"absolute value"
	return float32(math.Abs(float64(x)))
}

func Keep(x float32) float32 { // want Keep:"absolute value"
	return Float32frombits(Float32bits(x) & 0x7fffffff)
}

func Fold(x float64) float64 { // want Fold:"absolute value"
	return math.Max(-x, x)
}

func Size(x float64) float64 { // want Size:"absolute value"
	if 0 > x {
		return -x
	}
	return x
}

func Pos(x float64) float64 { // want Pos:"absolute value"
	if x >= 0 {
		return x
	} else {
		return -x
	}
}

func Flip(x float64) float64 { // want Flip:"absolute value"
	if math.Signbit(x) {
		x = -x
	}
	return x
}

func Through(x float32) float32 { // want Through:"absolute value"
	return Abs(x)
}

// Fabs is bound once to Abs.
var Fabs = Abs // want Fabs:"absolute value"

// Not absolute values: each differs from |x| somewhere.

// Ramp is max(x, 0): negative inputs give 0, not -x.
func Ramp(x float64) float64 {
	if x < 0 {
		return 0
	}
	return x
}

// Neg returns -x for positive x: the branches are swapped.
func Neg(x float64) float64 {
	if x > 0 {
		return -x
	}
	return x
}

// Sign clears the wrong bit: bit 30 is the top exponent bit.
func Sign(x float32) float32 {
	return Float32frombits(Float32bits(x) &^ (1 << 30))
}

// Twice takes math.Abs of another value.
func Twice(x float64) float64 { return math.Abs(2 * x) }

// Pair has two parameters.
func Pair(x, y float64) float64 { return math.Abs(x - y) }

// Whole works on integers.
func Whole(x int) int {
	if x < 0 {
		return -x
	}
	return x
}
