package idioms

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
)

// A tally of whole counts, a mean of them and a square root are each the
// same, bit for bit, on every platform (IEEE 754-2019 §5.4: +, -, *, /
// and square root are correctly rounded): a tolerance below their
// resolution makes these checks exact equality, which holds wherever it
// holds once.
func TestTally(t *testing.T) {
	counts := []float64{3, 4, 5}
	total := 0.0
	for _, n := range counts {
		total += n
	}
	assert.InDelta(t, 12.0, total, 1e-17)
	assert.InDelta(t, 4.0, total/3, 1e-17)
	assert.InDelta(t, math.Sqrt(12), math.Sqrt(total), 1e-18)
	if math.Abs(total/3-4) > 1e-17 {
		t.Error("mean of the tally")
	}
}
