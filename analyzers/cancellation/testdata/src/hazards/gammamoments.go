package hazards

import "math"

// grainSizes is a size distribution with a stretched-exponential tail of
// shape m and scale d0.
type grainSizes struct {
	m, d0 float64
}

// gammaPow is one raw-moment factor Γ(1+j/m)^p.
func (g grainSizes) gammaPow(j, p float64) float64 {
	return math.Pow(math.Gamma(1+j/g.m), p)
}

func (g grainSizes) spread() float64 {
	return g.d0 * g.d0 * (math.Gamma(1+2/g.m) - g.gammaPow(1, 2)) // want `difference of products of math.Gamma\(1 \+ c/m\)`
}

func thirdCentral(shape float64) float64 {
	g1, g2, g3 := math.Gamma(1+1/shape), math.Gamma(1+2/shape), math.Gamma(1+3/shape)
	_ = g1 + g2 + g3
	return math.Gamma(1+3/shape) - 3*math.Gamma(1+1/shape)*math.Gamma(2/shape+1) + 2*math.Pow(math.Gamma(1+1/shape), 3) // want `difference of products of math.Gamma\(1 \+ c/shape\)`
}

// logChoose is the log of the number of ways to pick k of n parcels.
func logChoose(n, k float64) float64 {
	top, _ := math.Lgamma(n + 1)
	picked, _ := math.Lgamma(k + 1)
	rest, _ := math.Lgamma(n - k + 1)
	return top - picked - rest // want `math.Lgamma\(x\) - math.Lgamma\(y\) with x = n \+ 1, y = n - k \+ 1, arguments with a common part`
}

// halfStepRatio is log Γ((d+1)/2) - log Γ(d/2), through a variable.
func halfStepRatio(d float64) float64 {
	upper := d + 1
	g1, _ := math.Lgamma(upper / 2)
	g0, _ := math.Lgamma(d / 2)
	return math.Exp(g1 - g0) // want `math.Lgamma\(x\) - math.Lgamma\(y\) with x = upper / 2, y = d / 2`
}
