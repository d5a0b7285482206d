// Command newton solves k·q² = h for the flow q through an invented
// irrigation siphon by Newton's method, for 1000 loss coefficients k and
// the heads h = 20 and 80 m, and prints for each head how many solves never
// passed the residual test within the iteration cap and the most iterations
// a passing solve took, so a test can run it before and after roundoff's
// fix.
package main

import (
	"fmt"
	"math"
)

const maxIter = 100

// siphonFlow returns the flow q with k·q² = h and the iterations used.
func siphonFlow(k, h float64) (float64, int) {
	q := 1.0
	for i := range maxIter {
		r := k*q*q - h
		if math.Abs(r) < math.SmallestNonzeroFloat64 { // want `math.SmallestNonzeroFloat64 \(5e-324\) is the smallest positive float64`
			return q, i
		}
		q -= r / (2 * k * q)
	}
	return q, maxIter
}

func main() {
	for _, h := range []float64{20, 80} {
		capped, most := 0, 0
		for i := range 1000 {
			k := 5 + float64(i)*0.005 // s²/m⁵
			if _, n := siphonFlow(k, h); n == maxIter {
				capped++
			} else {
				most = max(most, n)
			}
		}
		fmt.Printf("capped-%g %d\nmost-%g %d\n", h, capped, h, most)
	}
}
