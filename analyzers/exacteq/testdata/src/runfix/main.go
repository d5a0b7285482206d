// Command runfix prints the outcome of three exact comparisons and of an
// exponent taken from logarithms, so a test can run it before and after
// roundoff's fixes.
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

	n := 1 << 29
	fmt.Println("halvings of 2^29:", math.Ceil(math.Log(float64(n))/math.Ln2)) // want `math.Ceil\(math.Log\(float64\(n\)\) / math.Ln2\) is 30, not 29, at float64\(n\) = 536870912`
}
