package hazards

import (
	"math"
	"testing"
)

func centralCheck(f func(float64) float64, x, h float64) float64 { // want centralCheck:"fdstep\\(central step of centralCheck\\)"
	return (f(x+h) - f(x-h)) / (2 * h)
}

// A check whose step is far below the optimum: its own rounding error,
// about eps·e²/1e-9 ≈ 1.6e-6, exceeds the tolerance it is held to.
func TestFragileCheck(t *testing.T) {
	if d := centralCheck(math.Exp, 2, 1e-9); math.Abs(d-math.Exp(2)) > 1e-6 { // want `fixed central-difference step 1e-09 \(passed as h to centralCheck\) is too small`
		t.Error(d)
	}
}
