// Command runfix prints the outcome of three exact comparisons, so a test
// can run it before and after roundoff's fixes.
package main

import (
	"fmt"
	"math"
)

func main() {
	a, b := 0.1, 0.2
	sum := a + b
	fmt.Println("sum equals 0.3:", sum == 0.3) // want `exact == between a computed float64 value and 0.3`

	reading := math.Sqrt(-1)
	fmt.Println("reading is NaN:", reading == math.NaN()) // want `comparison with math.NaN\(\) is always false`

	steps := 0
	for x := 0.0; x != 1; x += 0.1 { // want `float loop variable x goes from 0 in steps of 0.1 and never equals 1`
		steps++
		if steps == 1000 {
			break // the unfixed loop never reaches 1 exactly
		}
	}
	fmt.Println("steps:", steps)
}
