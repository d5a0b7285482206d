// Command runfix prints finite-difference estimates of the first and
// second derivatives of exp, sin and x³ at x = 1e-3, 1, 1e6 and 1e9, so a
// test can run it before and after fdstep's fixes.
package main

import (
	"fmt"
	"math"
)

func forward(f func(float64) float64, x float64) float64 {
	const h = 1e-8
	return (f(x+h) - f(x)) / h // want `fixed forward-difference step h = 1e-08 does not scale with x`
}

func central(f func(float64) float64, x float64) float64 {
	const h = 1e-6
	return (f(x+h) - f(x-h)) / (2 * h) // want `fixed central-difference step h = 1e-06 does not scale with x`
}

func second(f func(float64) float64, x float64) float64 {
	const h = 1e-4
	return (f(x+h) - 2*f(x) + f(x-h)) / (h * h) // want `fixed second-difference step h = 0.0001 does not scale with x`
}

func cube(x float64) float64 { return x * x * x }

func main() {
	fns := []struct {
		name string
		f    func(float64) float64
	}{{"exp", math.Exp}, {"sin", math.Sin}, {"cube", cube}}
	for _, fn := range fns {
		for _, x := range []float64{1e-3, 1, 1e6, 1e9} {
			fmt.Println(fn.name, x, forward(fn.f, x), central(fn.f, x), second(fn.f, x))
		}
	}
}
