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

// A test's fixture stores a heading as it likes (3-4-5, of length 5):
// the package's own stores decide whether heading is a direction, so
// Perpendicular stays silent in the test build too.
func TestPerpendicular(t *testing.T) {
	if Perpendicular(beam{heading: station{3, 4}}, beam{heading: station{-4, 3}}) != true {
		t.Error("3-4-5 headings at a right angle")
	}
}
