// Command runfix prints whether values 0 to 3 ulps apart pass two tolerance
// tests, near 1 and near 1e6, and whether a product overflows, so a test
// can run it before and after roundoff's fixes.
package main

import (
	"fmt"
	"math"
)

func relClose(a, b float64) bool {
	return math.Abs(a-b) <= 1e-18*math.Abs(b) // want `relative tolerance 1e-18 is below the unit roundoff`
}

func absClose(a, b float64) bool {
	return math.Abs(a-b) < 1e-20 // want `absolute tolerance 1e-20 is below float64 epsilon`
}

// overflows tells whether x scaled by 1e300 leaves the finite range.
func overflows(x float64) bool {
	s := x * 1e300
	return s > math.MaxFloat64 // want `s > math.MaxFloat64 holds only for s = \+Inf`
}

func main() {
	for _, b := range []float64{1, 1e6} {
		a := b
		for k := 0; k < 4; k++ {
			fmt.Println(b, k, relClose(a, b), absClose(a, b))
			a = math.Nextafter(a, math.Inf(1))
		}
	}
	for _, x := range []float64{1, 2e10, -2e10} {
		fmt.Println("overflow", x, overflows(x))
	}
}
