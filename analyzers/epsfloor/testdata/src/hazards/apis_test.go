package hazards

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/gonum/floats"
	"gonum.org/v1/gonum/floats/scalar"
)

func TestAPIs(t *testing.T) {
	x := math.Cbrt(0.027)                            // 0.3, by a math function that is not correctly rounded
	_ = scalar.EqualWithinRel(x, 0.3, 1e-18)         // want `1e-18, passed to scalar.EqualWithinRel \(a relative tolerance of float64 in [A-Za-z]+\), is below the unit roundoff`
	_ = scalar.EqualWithinAbs(1, x, 1e-17)           // want `1e-17, passed to scalar.EqualWithinAbs \(an absolute tolerance of float64 in [A-Za-z]+\), is below half the spacing of float64 values at 1`
	_ = floats.EqualApprox([]float64{x}, nil, 1e-20) // want `1e-20, passed to floats.EqualApprox \(a relative tolerance of float64 in [A-Za-z]+\)`
	assert.InDelta(t, 100.0, x, 1e-15)               // want `1e-15, passed to assert.InDelta \(an absolute tolerance of float64 in [A-Za-z]+\), is below half the spacing of float64 values at 100 \(7.11e-15\)`
	assert.InEpsilon(t, 0.3, x, 1e-17)               // want `1e-17, passed to assert.InEpsilon \(a relative tolerance of float64 in [A-Za-z]+\)`
	require.InDelta(t, x, 0.3, 1e-20)                // want `1e-20, passed to require.InDelta \(an absolute tolerance of float64 in [A-Za-z]+\), is below half the spacing of float64 values at 0.3 \(2.78e-17\)`
	a := assert.New(t)
	a.InEpsilon(0.3, x, 1e-18) // want `1e-18, passed to assert.InEpsilon \(a relative tolerance of float64 in [A-Za-z]+\)`
}

// A table of expected values of size up to 1598.6, where float64 values
// are 2.3e-13 apart: an absolute 1e-14 passes only on exact equality there.
var moments = []struct{ order, want float64 }{
	{2, 37.7},
	{3, 1598.6},
}

func TestMoments(t *testing.T) {
	for _, m := range moments {
		got := math.Exp(math.Log(m.want)) // through math functions not correctly rounded
		if math.Abs(got-m.want) > 1e-14 { // want `absolute tolerance 1e-14 is below half the spacing of float64 values at 1598.6 \(1.14e-13\): the test passes only on exact equality`
			t.Fail()
		}
	}
}

// faulty marks readings the parser must refuse.
const faulty = math.MaxFloat32

var gauges = []struct {
	text string
	deg  float64
}{
	{"12d30m", 12.5},
	{"bogus", faulty},
}

func parseGauge(s string) float64 { return math.Cbrt(float64(len(s))) }

// Nothing sends the sentinel rows elsewhere: at 3.4e38 float64 values are
// 4.2e22 apart, and 1e-9 is exact equality there.
func TestGauges(t *testing.T) {
	for _, r := range gauges {
		assert.InDelta(t, r.deg, parseGauge(r.text), 1e-9) // want `1e-9, passed to assert.InDelta \(an absolute tolerance of float64 in [A-Za-z]+\), is below half the spacing of float64 values at 3.40282`
	}
}

func scale(dst []float64, k float64) {
	for i := range dst {
		dst[i] *= math.Cbrt(k)
	}
}

func checkAll(t *testing.T, got, want []float64, tol float64) { // want checkAll:"parameter 3 is an absolute tolerance of float64 in checkAll"
	for i := range got {
		if math.Abs(got[i]-want[i]) > tol {
			t.Errorf("element %d: got %v, want %v", i, got[i], want[i])
		}
	}
}

// The call that fills the slice computes what it stores from its inputs
// through a cube root, which is not correctly rounded: the check stays
// reported.
func TestScaled(t *testing.T) {
	v := []float64{1, 2}
	scale(v, 8)
	checkAll(t, v, []float64{2, 4}, 1e-17) // want `1e-17, passed as tol to checkAll`
}
