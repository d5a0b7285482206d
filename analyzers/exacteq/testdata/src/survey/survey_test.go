package survey

import "testing"

// Whole coordinates: every product is an integer below 2^53, held in full, so
// fused or not, the sum rounds the same and Sqrt is correctly rounded.
func TestPaceWhole(t *testing.T) {
	for _, tc := range []struct {
		from, to []float64
		want     float64
	}{
		{[]float64{-40, 7}, []float64{3, 12}, 43.289721643826724},
		{[]float64{0, 0}, []float64{1, 1}, 1.4142135623730951},
		{[]float64{5, 5}, []float64{-5, -5}, 14.142135623730951},
		{[]float64{120, -33}, []float64{7, 8}, 120.20815280171308},
		{[]float64{2, 9}, []float64{11, 4}, 10.295630140987},
		{[]float64{-600, 250}, []float64{13, -77}, 694.764708372554},
		{[]float64{1, 2}, []float64{3, 5}, 3.605551275463989},
		{[]float64{17, 0}, []float64{0, 19}, 25.495097567963924},
		{[]float64{-3, -3}, []float64{8, 21}, 26.40075756488817},
		{[]float64{900, 901}, []float64{1, 2}, 1271.3779925734125},
		{[]float64{44, -8}, []float64{31, 6}, 19.1049731745428},
		{[]float64{7, 7}, []float64{-70, 70}, 99.48869282486326},
	} {
		if got := Pace(tc.from, tc.to); got != tc.want {
			t.Errorf("case %v: got %v", tc, got) // printing a case only reads it
		}
	}
}

// Decimal coordinates: dx*dx is inexact, and fusing it with the addition
// gives 1.0770329614269007 instead.
func TestPaceDecimal(t *testing.T) {
	for _, tc := range []struct {
		from, to []float64
		want     float64
	}{
		{[]float64{0.4, 1}, []float64{0, 0}, 1.077032961426901},
	} {
		if got := Pace(tc.from, tc.to); got != tc.want { // want `exact != pins a computed result to 1.077032961426901`
			t.Errorf("got %v", got)
		}
	}
}

// Whole, but dx*dx = 10000001400000049 needs 54 bits: it rounds.
func TestPaceWide(t *testing.T) {
	got := Pace([]float64{100000007, 12345}, []float64{0, 0})
	if got != 1.0000000776199506e+08 { // want `exact != pins a computed result to 1.0000000776199506e\+08`
		t.Errorf("got %v", got)
	}
}

// The table's coordinates are scaled by 1.1 before the call: what the
// call gets is no longer what the table says.
func TestPaceStretched(t *testing.T) {
	from := []float64{-40, 7}
	Stretch(from, 1.1)
	if got := Pace(from, []float64{3, 12}); got != 47.196292227250225 { // want `exact != pins a computed result to 47.196292227250225`
		t.Errorf("got %v", got)
	}
}

// The table's slices are scaled through the copy of each case: the table
// no longer holds what its literal says.
func TestPaceScaledCases(t *testing.T) {
	cases := []struct {
		from, to []float64
		want     float64
	}{
		{[]float64{-40, 7}, []float64{3, 12}, 47.196292227250225},
	}
	for _, tc := range cases {
		tc.from[0] *= 1.1
		tc.from[1] *= 1.1
		if got := Pace(tc.from, tc.to); got != tc.want { // want `exact != pins a computed result to 47.196292227250225`
			t.Errorf("got %v", got)
		}
	}
}

// A copy of the first case shares its slices, and Stretch writes through
// them.
func TestPaceAliased(t *testing.T) {
	cases := []struct {
		from, to []float64
		want     float64
	}{
		{[]float64{-40, 7}, []float64{3, 12}, 47.196292227250225},
	}
	kept := cases[0]
	Stretch(kept.from, 1.1)
	for _, tc := range cases {
		if got := Pace(tc.from, tc.to); got != tc.want { // want `exact != pins a computed result to 47.196292227250225`
			t.Errorf("got %v", got)
		}
	}
}

func TestPace32(t *testing.T) {
	if got := Pace32([2]float32{-40, 7}, [2]float32{3, 12}); got != 43.289722 {
		t.Errorf("got %v", got)
	}
	// 5001*5001 = 25010001 needs 25 bits: float32 rounds it.
	if got := Pace32([2]float32{5001, 13}, [2]float32{0, 0}); got != 5001.0166 { // want `exact != pins a computed result to 5001.0166`
		t.Errorf("got %v", got)
	}
}

func TestShare(t *testing.T) {
	if got := Share(Lot{West: 3, East: 4, Depth: 20}); got != 0.6785714285714286 {
		t.Errorf("got %v", got)
	}
	if got := Share(Lot{West: 0.3, East: 0.4}); got != 0.04535714285714286 { // want `exact != pins a computed result to 0.04535714285714286`
		t.Errorf("got %v", got)
	}
}

func TestSpoil(t *testing.T) {
	if got := Spoil(6); got != 30.857142857142858 {
		t.Errorf("got %v", got)
	}
	if got := Spoil(0.3); got != 0.003857142857142857 { // 0.3^3 rounds, but Pow to a whole power rounds the same way everywhere: no cause
		t.Errorf("got %v", got)
	}
}

// Stake is a stake's coordinates.
type Stake []float64

// A case printed on failure is only read by t.Errorf.
func TestPaceNamed(t *testing.T) {
	const unit = 1.4142135623730951
	for i, tc := range []struct {
		from, to Stake
		want     float64
	}{
		{from: Stake{0, 0}, to: Stake{1, 1}, want: unit},
		{from: Stake{-40, 7}, to: Stake{3, 12}, want: 43.289721643826724},
	} {
		got := Pace(tc.from, tc.to)
		if got != tc.want {
			t.Errorf("case %d: want %v, got %v (%v)", i+1, tc.want, got, tc)
		}
	}
}

// Subtests read the case through the closure's captured variable.
func TestPaceSubtests(t *testing.T) {
	for _, tc := range []struct {
		name     string
		from, to []float64
		want     float64
	}{
		{"whole", []float64{-40, 7}, []float64{3, 12}, 43.289721643826724},
	} {
		t.Run(tc.name, func(t *testing.T) {
			if got := Pace(tc.from, tc.to); got != tc.want {
				t.Errorf("got %v", got)
			}
		})
	}
	for _, tc := range []struct {
		name     string
		from, to []float64
		want     float64
	}{
		{"decimal", []float64{0.4, 1}, []float64{0, 0}, 1.077032961426901},
	} {
		t.Run(tc.name, func(t *testing.T) {
			if got := Pace(tc.from, tc.to); got != tc.want { // want `exact != pins a computed result to 1.077032961426901`
				t.Errorf("got %v", got)
			}
		})
	}
}

// A second closure over the same case may write through its slices.
func TestPaceTwoClosures(t *testing.T) {
	for _, tc := range []struct {
		from, to []float64
		want     float64
	}{
		{[]float64{-40, 7}, []float64{3, 12}, 47.196292227250225},
	} {
		stretch := func() { Stretch(tc.from, 1.1) }
		stretch()
		t.Run("stretched", func(t *testing.T) {
			if got := Pace(tc.from, tc.to); got != tc.want { // want `exact != pins a computed result to 47.196292227250225`
				t.Errorf("got %v", got)
			}
		})
	}
}

// Settle is read for its lift (k*k + 1 is whole at k = 2), and what it
// stores through the stake, thirds, is read with it: the stake is no
// longer whole.
func TestPaceSettled(t *testing.T) {
	from := []float64{-40, 7}
	lift := Settle(from, 2)
	if got := lift + Pace(from, []float64{3, 12}); got != 17.256517540566826 { // want `exact != pins a computed result to 17.256517540566826`
		t.Errorf("got %v", got)
	}
}

// The expected value held in a variable that the table then names.
func TestPaceHeld(t *testing.T) {
	far := 43.88496325622251
	for _, tc := range []struct {
		from, to Stake
		want     float64
	}{
		{from: Stake{-40.3, 7.1}, to: Stake{3.2, 12.9}, want: far},
	} {
		if got := Pace(tc.from, tc.to); got != tc.want { // want `pins a computed result to 43.88496325622251`
			t.Errorf("want %v, got %v", tc.want, got)
		}
	}
}
