package ledger

import (
	"reflect"
	"testing"
)

// A map filled by a closure with what Project passes it: t.Level +
// t.Rate*h is a product added to a sum, which a platform may fuse into one
// rounding (IEEE 754-2019 §5.4.1), so the pinned digits can change.
func TestProject(t *testing.T) {
	got := map[int]float64{}
	Project([]Tank{{2.2, 0.7}, {1.1, 0.3}}, 24, func(i int, level float64) {
		got[i] = level
	})
	want := map[int]float64{0: 18.999999999999996, 1: 8.299999999999999}
	if !reflect.DeepEqual(got, want) { // want `reflect.DeepEqual pins a computed result to 18.999999999999996`
		t.Fatal(got)
	}
}

// The levels as stored: nothing is computed, the comparison is exact
// everywhere; left alone.
func TestEach(t *testing.T) {
	got := map[int]float64{}
	Each([]Tank{{18.999999999999996, 0.7}}, func(i int, level float64) {
		got[i] = level
	})
	if !reflect.DeepEqual(got, map[int]float64{0: 18.999999999999996}) {
		t.Fatal(got)
	}
}
