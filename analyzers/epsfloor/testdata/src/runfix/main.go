// Command runfix prints whether values 0 to 3 ulps apart pass two tolerance
// tests, near 1 and near 1e6, so a test can run it before and after
// roundoff's fixes.
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

func main() {
	for _, b := range []float64{1, 1e6} {
		a := b
		for k := 0; k < 4; k++ {
			fmt.Println(b, k, relClose(a, b), absClose(a, b))
			a = math.Nextafter(a, math.Inf(1))
		}
	}
}
