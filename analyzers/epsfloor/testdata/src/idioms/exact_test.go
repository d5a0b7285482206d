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

// rejected marks readings the parser must refuse; no angle is that large.
const rejected = math.MaxFloat32

var readings = []struct {
	text string
	deg  float64
}{
	{"12d30m", 12.5},
	{"135d", 135},
	{"bogus", rejected},
}

func parseAngle(s string) float64 { return math.Cbrt(float64(len(s))) }

// The sentinel rows go to another branch: the angles that reach the
// tolerance are at most 135 degrees, where float64 values are 2.8e-14
// apart, and 1e-9 is far above that.
func TestReadings(t *testing.T) {
	for _, r := range readings {
		got := parseAngle(r.text)
		if r.deg == rejected {
			continue
		}
		assert.InDelta(t, r.deg, got, 1e-9)
	}
}

func near(t *testing.T, got, want []float64, tol float64) { // want near:"parameter 3 is an absolute tolerance of float64 in near"
	for i := range got {
		if math.Abs(got[i]-want[i]) > tol {
			t.Errorf("element %d: got %v, want %v", i, got[i], want[i])
		}
	}
}

// The project's own helper compares what it is given, whole counts the
// test sets itself: exact equality that holds everywhere.
func TestCounts(t *testing.T) {
	near(t, []float64{3, 4}, []float64{3, 4}, 1e-17)
}

// spread copies whole counts into dst: exact, the same on every platform.
func spread(dst []float64, n int) {
	for i := range dst {
		dst[i] = float64(n + i)
	}
}

// A slice filled by a call whose computations are exact, or by a function
// value out of sight, shows no reason to differ between platforms: the
// check is exact equality, claimed nothing about.
func TestFilled(t *testing.T) {
	v := make([]float64, 2)
	spread(v, 3)
	near(t, v, []float64{3, 4}, 1e-17)
	fill := func(dst []float64) { copy(dst, []float64{5, 6}) }
	w := make([]float64, 2)
	fill(w)
	near(t, w, []float64{5, 6}, 1e-17)
}
