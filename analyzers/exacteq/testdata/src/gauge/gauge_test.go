package gauge

import (
	"encoding/json"
	"math"
	"reflect"
	"strconv"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestExactLiteral(t *testing.T) {
	x := 0.1
	got := x * 3
	if got != 0.3 { // want `exact != between a computed float64 value and 0.3`
		t.Fail()
	}
}

func TestTwoComputed(t *testing.T) {
	a, b := 0.1, 0.2
	if a+b != b*1.5 { // want `exact != between two computed float64 values`
		t.Fail()
	}
}

func TestAssertLiteral(t *testing.T) {
	x, y := 0.1, 0.2
	assert.Equal(t, 0.3, x+y) // want `assert.Equal compares float64 values exactly, but one is computed and 0.3 is stored as 0.2999999999999999888977697537484345\.\.\.; use InEpsilon with a relative tolerance such as 1e-9`
}

func TestAssertfLiteral(t *testing.T) {
	x := 0.7
	assert.Equalf(t, 0.1, x/7, "case %d", 1) // want `assert.Equalf compares float64 values exactly`
}

func TestRequireLiteral(t *testing.T) {
	x := 0.7
	require.Equal(t, 0.1, x/7) // want `require.Equal compares float64 values exactly`
}

func TestMethodForm(t *testing.T) {
	a := assert.New(t)
	s := math.Sqrt(0.02)
	a.Equal(0.1, s*s) // want `assert.Equal compares float64 values exactly`
}

func TestTwoComputedAssert(t *testing.T) {
	x, y := 0.1, 0.2
	assert.Equal(t, x*3, y+0.1) // want `assert.Equal compares float64 values exactly, but both are computed and carry rounding error`
}

func TestNotEqual(t *testing.T) {
	x := 0.3
	assert.NotEqual(t, 0.1, x/3) // want `assert.NotEqual compares float64 values exactly`
}

// The idioms below compare exactly on purpose and must stay silent.

func TestExpectedExact(t *testing.T) {
	assert.Equal(t, 0.5, Scale(3)) // the result of the code under test against a value
	require.Equal(t, 2.0, Offset(3, 1))
	assert.Equal(t, 0.25, 0.5*0.5) // constant expression: folded exactly
}

func TestRoutes(t *testing.T) {
	if Scale(1) != Offset(0.3, 0) { // two routes through the code under test: deliberate
		t.Fail()
	}
	x := 0.1
	assert.Equal(t, Scale(x), Scale(x)) // the same call twice
	y := 3.0 * 2
	assert.Equal(t, 6.0, y)               // representable
	assert.Equal(t, true, Droop(0.3) > 0) // a boolean: no number to judge
}

// Printed results pinned bit for bit: reported.

func TestPinnedLiteral(t *testing.T) {
	if got := Droop(0.3); got != 0.16749999999999998 { // want `exact != pins a computed result to 0.16749999999999998, a printed value of 17 significant digits`
		t.Errorf("Droop(0.3) = %v", got)
	}
	assert.Equal(t, 0.16749999999999998, Droop(0.3)) // want `assert.Equal pins a computed result to 0.16749999999999998`
}

func TestPinnedTable(t *testing.T) {
	cases := []struct{ load, want float64 }{
		{0.3, 0.16749999999999998},
		{0.5, 0.35416666666666663},
	}
	for _, tc := range cases {
		if got := Droop(tc.load); got != tc.want { // want `exact != pins a computed result to 0.16749999999999998`
			t.Errorf("Droop(%v) = %v", tc.load, got)
		}
	}
}

func TestPinnedNamedFromTable(t *testing.T) {
	for _, tc := range []struct{ load, want float64 }{{0.7, 0.6008333333333332}} {
		if got, want := Droop(tc.load), tc.want; got != want { // want `exact != pins a computed result to 0.6008333333333332`
			t.Errorf("Droop(%v) = %v", tc.load, got)
		}
	}
}

func TestPinnedStruct(t *testing.T) {
	want := Pair{Value: 0.23, Spread: 0.023333333333333334}
	if got := Read(0.3); got != want { // want `!= on Pair values pins a computed result to 0.023333333333333334`
		t.Errorf("Read(0.3) = %v", got)
	}
	if !reflect.DeepEqual(Read(0.3), want) { // want `reflect.DeepEqual pins a computed result to 0.023333333333333334`
		t.Fail()
	}
}

// Left alone in tests.

func TestParsedBack(t *testing.T) {
	v, _ := strconv.ParseFloat("0.16749999999999998", 64)
	if v != 0.16749999999999998 { // parsed from the same digits: exact by correct rounding
		t.Fail()
	}
}

func TestDyadicLong(t *testing.T) {
	if Droop(0) != 0.000030517578125 { // 2^-15 has 15 digits but is stored exactly
		t.Fail()
	}
}

// TestHalvingIsExact checks that halving is exact: one correctly rounded
// operation on each side gives the same float.
func TestHalvingIsExact(t *testing.T) {
	a, b := 0.1, 0.7
	if (a+b)/2 != a/2+b/2 { // the test says it checks exactness
		t.Fail()
	}
}

// A value passed through from the inputs, as a vertex kept by a hull.
func TestPassedThrough(t *testing.T) {
	in := []float64{0.16749999999999998, 0.5}
	if in[0]*1 != 0.16749999999999998 { // the same digits are an input
		t.Fail()
	}
}

func TestPinnedConstant(t *testing.T) {
	if got := Log32(3); got != Ln3 { // want `exact != pins a computed result to Ln3 \(1.0986123\), a value of 8 significant digits`
		t.Fail()
	}
}

// The code under test returns its argument: nothing rounds, and a constant
// expression folded once compares exactly.
func TestNothingRounds(t *testing.T) {
	if Turns(math.Pi/4) != 0.7853981633974483 {
		t.Fail()
	}
}

// sagJSON holds a reading as text, outside the test below.
var sagJSON = []byte(`{"Sag": 0.16749999999999998}`)

// A value decoded from text reads back exactly.
func TestDecoded(t *testing.T) {
	var got struct{ Sag float64 }
	if err := json.Unmarshal(sagJSON, &got); err != nil || got.Sag != 0.16749999999999998 {
		t.Fail()
	}
}

// A result computed by correctly rounded operations with nothing to fuse
// is the same bit for bit on every platform, and may be pinned.
func TestPortablePin(t *testing.T) {
	if Third(1) != 0.6666666666666666 {
		t.Fail()
	}
}

// A struct computed through math.Pow, pinned to printed values.
func TestPinnedPow(t *testing.T) {
	got := ToTint(0.3)
	want := Tint{L: 0.6694329500821695, C: 0.04285714285714286}
	if got != want { // want `!= on Tint values pins a computed result to 0.6694329500821695`
		t.Fail()
	}
}

// A recursive package function of divisions only is portable too.
func TestRecursivePin(t *testing.T) {
	if Halve(1.0/3, 1) != 0.16666666666666666 {
		t.Fail()
	}
}

// Products rounded by explicit conversions before they are added cannot be
// fused (Go spec, "Arithmetic operators"): the result is the same
// everywhere, and may be pinned.
func TestConvertedProducts(t *testing.T) {
	if Blend(0.3, 0.7, 1.0/3) != 0.5666666666666667 {
		t.Fail()
	}
}
