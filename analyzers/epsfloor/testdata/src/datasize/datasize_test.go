package datasize

import (
	"math"
	"testing"
)

// A test supplies its own data: the size of a and b is unknown here, but
// fixed by the test, so the data-size rule says nothing.
func closeEnough(t *testing.T, a, b float64) {
	if math.Abs(a-b) > 1e-14 {
		t.Errorf("%g != %g", a, b)
	}
}
