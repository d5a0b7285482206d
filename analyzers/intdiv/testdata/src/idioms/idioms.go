// Package idioms holds integer divisions that are meant to truncate, and
// float divisions; none may be reported.
package idioms

import (
	"math"
	"time"
)

const size = 7

func middle(xs []float64) float64 {
	return xs[len(xs)/2] // index arithmetic stays integer
}

func blocks(n, b int) int {
	return n / b // a floor stored in an int
}

func storedFirst(total, per int) float64 {
	pages := total / per // a deliberate floor, stored in an int first
	return float64(pages) * 1.5
}

func pairs(n int) float64 {
	return float64(n * (n - 1) / 2) // the number of pairs: a count by design
}

func halfCount(n int) float64 {
	return float64(n / 2) // halving a count by a constant
}

func centre(h float64) float64 {
	return float64(size/2) * h // the centre index of a grid, times the spacing
}

func floatDivision(a, b int) float64 {
	return float64(a) / float64(b) // already divides in float64
}

func floatOperands(a, b float64) float64 {
	return a / b // float division
}

func multiple(k, n int) float64 {
	return float64(k * n / n) // the dividend is a multiple of the divisor
}

func documented(w, cell int) float64 {
	// floor: only whole cells are drawn
	return float64(w / cell)
}

func sameLine(w, cell int) float64 {
	return float64(w / cell) // whole cells only
}

func durations(d time.Duration, n int) float64 {
	return float64(d / time.Duration(n)) // nanosecond counts: under 1 ns is lost
}

func milliseconds(d time.Duration) float64 {
	return float64(d / time.Millisecond) // whole milliseconds, a constant unit
}

func exactConstant() float64 {
	return 20 * 20 / 2 // exact: 200
}

func floatConstant(x float64) float64 {
	return 1.0 / 2 * x // a float constant division: 0.5
}

func namedConstant(h float64) float64 {
	return size / 2 * h // a named constant: the integer meaning may be the point
}

func integerContext() int {
	return 7 / 2 // an int result: 3 is meant
}

func power(x float64) float64 {
	return math.Pow(x, 1.0/3) // already a float exponent
}

func shifted(a, b int) float64 {
	return float64(a/b + 1) // the quotient is not converted alone
}

func rounded(a, b int) float64 {
	return float64((a + b/2) / b) // rounds to nearest on purpose: the dividend adds half the divisor
}

func ceiling(a, b int) float64 {
	return float64((a + b - 1) / b) // ceiling division on purpose
}

func rescaled(x, n int) float64 {
	return float64(x / 10 * 10) // truncation to tens, multiplied back
}

func runeDivision(r rune) float64 {
	return float64(r / 16) // a constant divisor on a code point
}

// mid is the middle index of the grid, used only as an integer.
const mid = 9 / 2

func middleCell(cells []float64) float64 { return cells[mid] }

// integerOnly is truncated on purpose and never used as a float.
const integerOnly = 7 / 3

func repeat() []int { return make([]int, integerOnly) }

func floored(a, b int) float64 {
	return math.Floor(float64(a / b)) // Floor of a whole number: the whole number is meant
}

func truncated(a, b int) float64 {
	return math.Trunc((float64(a / b))) // Trunc says the same
}

// lattice places points on a side×side grid: i/side numbers the rows.
func lattice(side int) [][2]float64 {
	var pts [][2]float64
	for i := 0; i < side*side; i++ {
		pts = append(pts, [2]float64{float64(i % side), float64(i / side)})
	}
	return pts
}

// pairs of a range: k/2 numbers the pairs of consecutive items.
func pairIndex(xs []float64) []float32 {
	out := make([]float32, len(xs))
	for k := range xs {
		out[k] = float32(k / 2)
	}
	return out
}
