package idioms

import (
	"math"
	"testing"
)

func TestReference(t *testing.T) {
	d := 0.3
	want := math.Sqrt(1 - math.Exp(-d)) // a test's table of cases fixes the arguments
	if want == 0 {
		t.Fatal(want)
	}
}
