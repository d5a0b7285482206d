package survey

import "testing"

func TestPaceWhole(t *testing.T) {
	for _, tc := range []struct {
		from, to []float64
		want     float64
	}{
		{[]float64{-40, 7}, []float64{3, 12}, 43.289721643826724},
	} {
		if got := Pace(tc.from, tc.to); got != tc.want {
			t.Errorf("got %v", got)
		}
	}
}
