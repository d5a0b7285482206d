package user

import (
	"math"

	lm "lowmath"
)

func abs(d float64) float64 {
	if d < 0 {
		d = -d
	}
	return d
}

func calls(a, b float64, x float32) {
	_ = math.Abs(a - b) // want `\|a - b\|`
	_ = lm.Abs(x)       // want `\|x\|`
	_ = lm.Fabs(x)      // want `\|x\|`
	_ = lm.Through(x)   // want `\|x\|`
	_ = lm.Fold(a)      // want `\|a\|`
	_ = abs(b - a)      // want `\|b - a\|`
	f := math.Abs
	_ = f(a) // want `\|a\|`
	g := func(v float64) float64 { return math.Max(v, -v) }
	_ = g(b) // want `\|b\|`
	h := lm.Mag
	_ = h(x) // want `\|x\|`

	// Not absolute values.
	_ = lm.Ramp(a)
	_ = lm.Sign(x)
	_ = lm.Twice(a)
	k := math.Abs
	k = math.Sqrt // reassigned: no longer known
	_ = k(a)
}
