package turbine

import (
	"math"
	"testing"

	"example.com/turbine/check"
)

// Results of several rounded steps asserted equal to short decimals:
// reported.
func TestRounded(t *testing.T) {
	check.AssertEqual(t, 0.3, Mean([]float64{0.1, 0.2, 0.6}))       // want `AssertEqual compares the result of Mean, computed in several rounded steps, exactly with 0.3`
	check.So(Shares([]float64{1, 2, 7})[0], check.ShouldEqual, 0.1) // want `ShouldEqual compares the result of Shares, computed in several rounded steps, exactly with 0.1`
}

// Left alone: one correctly rounded division of exact operands lands on
// the double nearest 0.1; a value passed through unrounded; a value the
// type holds exactly; an assertion with a tolerance.
func TestExactEnough(t *testing.T) {
	check.AssertEqual(t, 0.1, Efficiency(1, 10))
	check.AssertEqual(t, 0.7, Label(0.7))
	check.AssertEqual(t, 0.25, Mean([]float64{0.125, 0.375}))
	check.AssertEqualWithin(t, 0.3, Mean([]float64{0.1, 0.2, 0.6}), 1e-12)
}

// The largest float is a sentinel, not a printed result.
func TestSentinel(t *testing.T) {
	check.AssertEqual(t, math.MaxFloat64, Gust(709.78))
	check.AssertEqual(t, true, Gust(0.5) > 0)            // no number: nothing to judge
	check.AssertEqual(t, 0.10517091807564771, Gust(0.1)) // want `AssertEqual pins a computed result to 0.10517091807564771`
}

// A result captured by the closures a test framework nests.
func TestNested(t *testing.T) {
	run := func(f func()) { f() }
	run(func() {
		m := Mean([]float64{0.1, 0.2, 0.6})
		run(func() {
			check.So(m, check.ShouldEqual, 0.3) // want `ShouldEqual compares the result of Mean`
		})
	})
}

// Points compared by their own Equal method hold the same hazard per
// coordinate; a literal the type can hold, or one whose decimal is a
// printed result, is left to the other rules.
func TestHubs(t *testing.T) {
	tips := []check.Hub{{0.1, 0}, {0.2, 1}, {0.6, 2}}
	want := check.Hub{0.3, 1}
	if !Centre(tips).Equal(want) { // want `Equal compares the result of Centre, computed in several rounded steps, exactly with 0.3`
		t.Fail()
	}
	if !(check.Hub{1, 0.3}).Equal(Centre(tips)) { // want `Equal compares the result of Centre, computed in several rounded steps, exactly with 0.3`
		t.Fail()
	}
	if !Centre(tips).Equal(check.Hub{0.5, 1}) {
		t.Fail()
	}
}

// closeEquals is named for equality but holds the difference to a
// tolerance in its body: a tolerance test, left alone.
func closeEquals(a, b float64) bool { return math.Abs(a-b) < 1e-9 }

// plainEquals compares exactly, as its name says.
func plainEquals(a, b float64) bool { return a == b }

// An equality helper is read by what its body does and by the operands it
// takes: a tolerance in the body or a third float operand makes it a
// tolerance test.
func TestHelperMeaning(t *testing.T) {
	if !closeEquals(Mean([]float64{0.1, 0.2, 0.6}), 0.3) {
		t.Fail()
	}
	if !check.FairlyEqual(Mean([]float64{0.1, 0.2, 0.6}), 0.3, 1e-9) {
		t.Fail()
	}
	if !plainEquals(Mean([]float64{0.1, 0.2, 0.6}), 0.3) { // want `plainEquals compares the result of Mean, computed in several rounded steps, exactly with 0.3`
		t.Fail()
	}
}
