// Command runfix prints the values of four truncating divisions, so a
// test can run it before and after roundoff's fixes.
package main

import (
	"fmt"
	"math"
)

// The frame of an invented camera, in pixels.
const (
	frameW = 16
	frameH = 9
)

func main() {
	readings := []int{1, 2, 4}
	sum := 0
	for _, r := range readings {
		sum += r
	}
	x := 3.0
	fmt.Printf("mean %.17g\n", float64(sum/len(readings))) // want `float64\(sum / len\(readings\)\) converts`
	fmt.Printf("half %.17g\n", 1/2*x)                      // want `1 / 2 divides untyped integer constants and is 0`
	fmt.Printf("cbrt %.17g\n", math.Pow(27, 1/3))          // want `1 / 3 divides untyped integer constants and is 0`
	fmt.Printf("aspect %.17g\n", float64(frameW/frameH))   // want `frameW / frameH divides untyped integer constants and is 1`
}
