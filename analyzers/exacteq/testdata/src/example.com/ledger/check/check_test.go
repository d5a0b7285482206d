package check

import (
	"testing"

	"example.com/ledger"
)

// Through a wrapper of another package: Forecast's fact says it passes
// its callback a value with a cause.
func TestForecast(t *testing.T) {
	var got []float64
	ledger.Forecast([]ledger.Tank{{2.2, 0.7}}, func(_ int, level float64) {
		got = append(got, level)
	})
	if got[0] != 18.999999999999996 { // want `exact != pins a computed result to 18.999999999999996`
		t.Fatal(got)
	}
}

// Each passes the levels as stored: no fact, nothing computed; left alone.
func TestEach(t *testing.T) {
	var got []float64
	ledger.Each([]ledger.Tank{{18.999999999999996, 0.7}}, func(_ int, level float64) {
		got = append(got, level)
	})
	if got[0] != 18.999999999999996 {
		t.Fatal(got)
	}
}
