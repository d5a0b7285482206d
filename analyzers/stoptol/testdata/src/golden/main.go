// Command golden minimizes f(x) = 1 + (x/xs - 1)² by golden-section search
// for minimizers xs = 1, 1e6 and 1e9, and prints the iterations used (500
// is the harness's cap) and the relative error |x-xs|/xs, so a test can run
// it before and after roundoff's fix.
package main

import (
	"fmt"
	"math"
)

const invPhi = 0.6180339887498949 // (sqrt(5)-1)/2

func minimize(f func(float64) float64, a, b float64) (float64, int) {
	iters := 0
	for ; iters < 500; iters++ {
		c, d := b-invPhi*(b-a), a+invPhi*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if math.Abs(b-a) < 1e-12 { // want `absolute x-tolerance 1e-12 in this minimization`
			break
		}
	}
	return (a + b) / 2, iters
}

func main() {
	for _, xs := range []float64{1, 1e6, 1e9} {
		f := func(x float64) float64 { u := x/xs - 1; return 1 + u*u }
		x, iters := minimize(f, 0.5*xs, 2*xs)
		fmt.Println(xs, iters, math.Abs(x-xs)/xs)
	}
}
