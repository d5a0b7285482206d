// Package steps has methods, closures and an initializer, whose SSA
// functions lazyssa must give as buildssa does.
package steps

var scale = 2.0

type grid struct{ h float64 }

func (g grid) slope(f func(float64) float64, x float64) float64 {
	return (f(x+g.h) - f(x)) / g.h
}

func central(f func(float64) float64, x, h float64) float64 {
	half := func(v float64) float64 { return v / 2 }
	return half(f(x+h)-f(x-h)) / h * scale
}

func init() { scale = 1 }
