package turbine

import "math"

// Penstock is the pipe from the head pond to the turbine.
type Penstock struct {
	Length, Diameter, Roughness float64 // m
}

// Friction returns the Darcy friction factor at Reynolds number re from the
// Colebrook–White equation, iterating on x = 1/√f.
func (p Penstock) Friction(re float64) float64 {
	x := 8.0
	for range 50 {
		next := -2 * math.Log10(p.Roughness/(3.7*p.Diameter)+2.51*x/re)
		if math.Abs(next-x) <= 1e-20*math.Abs(next) { // planted (epsfloor): 1e-20 relative is below float64's unit roundoff 1.1e-16; only next == x passes
			return 1 / (next * next)
		}
		x = next
	}
	return 1 / (x * x)
}

// Flow returns the flow, m³/s, that the gross head h, m, drives through the
// penstock and a wide-open turbine, by Newton's method on
// r(q) = k·q² − h with k the pipe's loss and velocity-head coefficient.
func (p Penstock) Flow(h float64) float64 {
	area := math.Pi * p.Diameter * p.Diameter / 4
	k := (0.018*p.Length/p.Diameter + 1) / (2 * grav * area * area)
	q := 1.0
	for range 100 {
		r := k*q*q - h
		if math.Abs(r) < math.SmallestNonzeroFloat64 { // planted (epsfloor): 4.9e-324 is no tolerance; only r == 0 passes
			break
		}
		q -= r / (2 * k * q)
	}
	return q
}
