package blade_test

import (
	"reflect"
	"testing"

	"example.com/blade"
)

// Results of portable functions of another package pinned to printed values:
// the same on every platform, left alone.
func TestPortable(t *testing.T) {
	if got := blade.Wrap(7.5); got != 1.2168146928204138 { // subtractions of a constant: portable
		t.Fail()
	}
	if got := blade.Span(0.25, 7.5); got != 0.9668146928204138 { // through a portable helper
		t.Fail()
	}
	if got := blade.Share(3, 2, 7); got != 8.428571428571429 { // the product is divided or rounded before the additions
		t.Fail()
	}
	if got := blade.Mean([]float64{1, 2, 4.5}); got != 2.5 || blade.Mean([]float64{1, 3, 0}) != 4.0/3.0 { // sums and a division by a length
		t.Fail()
	}
}

// Results that may differ between platforms: reported.
func TestPlatformDependent(t *testing.T) {
	if got := blade.Chord(0.3, 0.7); got != 0.7615773105863908 { // want `exact != pins a computed result to 0.7615773105863908`
		t.Fail()
	}
	if got := blade.Pitch(1, 3); got != 0.3217505543966422 { // want `exact != pins a computed result to 0.3217505543966422`
		t.Fail()
	}
}

// Through an interface, with only a correctly rounded division in sight:
// no cause shows, nothing is claimed.
func TestOutOfSight(t *testing.T) {
	if got := blade.Shaped(nil, 1); got != 0.3333333333333333 {
		t.Fail()
	}
}

// Results gathered into a slice are judged by what is appended.
func TestGathered(t *testing.T) {
	var got, halves []float64
	got = append(got, blade.Pitch(1, 3))
	if !reflect.DeepEqual(got, []float64{0.3217505543966422}) { // want `reflect.DeepEqual pins a computed result to 0.3217505543966422`
		t.Fail()
	}
	halves = append(halves, blade.Wrap(7.5))
	if !reflect.DeepEqual(halves, []float64{1.2168146928204138}) { // portable: left alone
		t.Fail()
	}
}
