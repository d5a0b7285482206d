package hazards

import (
	"math"
	"testing"
)

// sameDigits compares two readings to a number of decimals by
// truncation: 1.4999999999999998, one rounding below 1.5, truncates to
// 1499999 at six digits, where 1.5 gives 1500000.
func sameDigits(l, r float64, digits int) bool {
	d := math.Pow(10, float64(digits))
	lv := int(l * d)
	rv := int(r * d)
	return lv == rv // want `lv == rv compares l and r truncated to a grid of step 1/d`
}

// roundDigits rounds instead: grid points sit in the middle of their
// cells, and a rounding either way keeps them there.
func roundDigits(l, r float64, digits int) bool {
	d := math.Pow(10, float64(digits))
	return math.Round(l*d) == math.Round(r*d)
}

func TestMeanReading(t *testing.T) {
	got := (0.1 + 0.2 + 1.2) / 1.0
	if !sameDigits(got, 1.5, 6) || !roundDigits(got, 1.5, 6) {
		t.Fail()
	}
}
