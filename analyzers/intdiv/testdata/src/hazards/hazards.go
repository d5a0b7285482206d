// Package hazards holds integer divisions whose truncated quotient is used
// as a float.
package hazards

import "math"

type stats struct{ hits, total int }

func mean(xs []int) float64 {
	sum := 0
	for _, x := range xs {
		sum += x
	}
	return float64(sum / len(xs)) // want `float64\(sum / len\(xs\)\) converts an integer quotient that Go has already rounded toward zero: the fraction \(up to 1, all of the value when \|sum\| < \|len\(xs\)\|\) is lost; divide in float64: float64\(sum\)/float64\(len\(xs\)\)`
}

func ratio(a, b int) float64 {
	return float64(a / b) // want `float64\(a / b\) converts an integer quotient`
}

func fraction(s stats) float64 {
	return float64(s.hits/s.total) * 100 // want `float64\(s.hits / s.total\) converts`
}

func progress(done, n int) float32 {
	return float32(done / n) // want `float32\(done / n\) converts.*divide in float32: float32\(done\)/float32\(n\)`
}

func grid(i, n int, width float64) float64 {
	return width * float64(i/n) // want `float64\(i / n\) converts`
}

func parenthesised(a, b int64) float64 {
	return float64((a / b)) // want `float64\(\(a / b\)\) converts`
}

func unsigned(a, b uint32) float64 {
	return math.Sqrt(float64(a / b)) // want `float64\(a / b\) converts`
}

type celsius float64

func namedFloat(total, count int) celsius {
	return celsius(total / count) // want `celsius\(total / count\) converts.*divide in celsius`
}

func countedMean(xs []float64) float64 {
	n := 0
	for _, x := range xs {
		if x > 0 {
			n++
		}
	}
	return float64(n / 4) // want `float64\(n / 4\) converts`
}

func average(vals []int) float64 {
	total := 0
	for i := 0; i < len(vals); i++ {
		total += vals[i]
	}
	return float64(total / 3) // want `float64\(total / 3\) converts`
}

func half(x float64) float64 {
	return 1 / 2 * x // want `1 / 2 divides untyped integer constants and is 0, not 0.5, in this float64 expression; write 0.5`
}

func cubeRoot(x float64) float64 {
	return math.Pow(x, 1/3) // want `1 / 3 divides untyped integer constants and is 0, not 0.333333, in this float64 expression; write 1.0/3`
}

func threeQuarters(x float64) float64 {
	return x * (3 / 4) // want `3 / 4 divides untyped integer constants and is 0, not 0.75.*write 0.75`
}

var weight float64 = 2 / 3 // want `2 / 3 divides untyped integer constants and is 0, not 0.666667`

func sevenHalves() float32 {
	return 7 / 2 // want `7 / 2 divides untyped integer constants and is 3, not 3.5, in this float32 expression; write 3.5`
}

func negative(x float64) float64 {
	return -1 / 8 * x // want `-1 / 8 divides untyped integer constants and is 0, not -0.125.*write -0.125`
}

func argument(x float64) float64 {
	return math.Exp(-x * 1 / 2 * (5 / 3)) // want `5 / 3 divides untyped integer constants and is 1, not 1.66667`
}

func converted() float64 {
	return float64(1 / 3) // want `1 / 3 divides untyped integer constants and is 0`
}

func inClosure(xs []int) []float64 {
	f := func(a, b int) float64 {
		return float64(a / b) // want `float64\(a / b\) converts`
	}
	out := make([]float64, len(xs))
	for i, x := range xs {
		out[i] = f(x, len(xs))
	}
	return out
}

func assigned(a, b int) {
	var f float64
	f = float64(a / b) // want `float64\(a / b\) converts`
	_ = f
}

const halfWeight = 1 / 2 // want `1 / 2 divides untyped integer constants and is 0, not 0.5, in this float64 expression; write 0.5`

func halved(x float64) float64 {
	return halfWeight * x
}

// monthly is a yearly rate of three quarters spread over twelve months:
// 3/4 is 0, so the chain is 0.
const monthly = 3 / 4 / 12 // want `3 / 4 divides untyped integer constants and is 0, not 0.75`

func interest(balance float64) float64 {
	return balance * monthly
}

const (
	frameWidth  = 1920
	frameHeight = 1080
)

func aspectRatio() float64 {
	return frameWidth / frameHeight // want `frameWidth / frameHeight divides untyped integer constants and is 1, not 1.77778.*write frameWidth\*1.0/frameHeight`
}

// cells is used both as an array length and as a float: a float value
// would not compile as the length, so no fix is offered.
const cells = 10 / 4 // want `10 / 4 divides untyped integer constants and is 2, not 2.5`

var counts [cells]int

func cellWidth(w float64) float64 {
	return w / cells
}

// through another constant: quarter is declared from a truncated quotient
// and used as a float.
const (
	third   = 1 / 3 // want `1 / 3 divides untyped integer constants and is 0`
	quarter = third * 3
)

func scaled(x float64) float64 { return quarter * x }
