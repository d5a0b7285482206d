// Package turbine models Quillmere Brook's crossflow turbine and head pond
// and chooses the gate opening.
//
// Comments starting "planted" mark a hazard put there on purpose, with the
// analyzer that reports it; comments starting "idiom" mark code that is
// right and must stay silent.
package turbine

import "math"

const (
	rho  = 999.7   // density of water at 10 °C, kg/m³
	grav = 9.80665 // standard gravity, m/s²
)

// Efficiency returns the hydraulic efficiency at relative gate opening g in
// [0, 1], from the maker's (fictional) test-bench fit.
func Efficiency(g float64) float64 {
	return math.Max(0, 0.87-0.55*(g-0.7)*(g-0.7))
}

// Power returns the shaft power in W for flow q, m³/s, and head h, m, with
// the guide vane at opening g: the brook sets the flow, the gate only the
// operating point.
func Power(q, h, g float64) float64 {
	return rho * grav * q * h * Efficiency(g)
}

// DisplayTable tabulates the efficiency at every tenth of the gate opening
// for the operator panel.
func DisplayTable() []float64 {
	var t []float64
	for g := 0.0; g != 1; g += 0.1 { // planted (exacteq, loop): ten steps of 0.1 give 0.9999999999999999, never 1
		t = append(t, Efficiency(g))
	}
	return t
}

// QuarterTable tabulates the efficiency at every quarter of the gate opening.
func QuarterTable() []float64 {
	var t []float64
	for g := 0.0; g != 1; g += 0.25 { // idiom: 0.25 is a power of two, every step is exact and the loop lands on 1
		t = append(t, Efficiency(g))
	}
	return t
}

// BestGate finds the gate opening in [0, 1] that gives the most power for
// flow q and head h by golden-section search.
func BestGate(q, h float64) float64 {
	const r = 0.6180339887498949 // (√5 − 1)/2
	loss := func(g float64) float64 { return -Power(q, h, g) }
	a, b := 0.0, 1.0
	c, d := b-r*(b-a), a+r*(b-a)
	fc, fd := loss(c), loss(d)
	for {
		if math.Abs(b-a) < 1e-12 { // planted (stoptol): comparing f values pins g to about sqrt(eps) ≈ 1.5e-8; 1e-12 only burns iterations
			break
		}
		if fc < fd {
			b, d, fd = d, c, fc
			c = b - r*(b-a)
			fc = loss(c)
		} else {
			a, c, fc = c, d, fd
			d = a + r*(b-a)
			fd = loss(d)
		}
	}
	return a + (b-a)/2
}

// Settings tune Ramp; the zero value takes the defaults.
type Settings struct {
	Step float64 // largest change of gate opening per control tick
}

const defaultStep = 0.02

// Ramp returns the gate openings, one per control tick, that take the gate
// from opening from up to opening to without a pressure surge.
func Ramp(from, to float64, s Settings) []float64 {
	if s.Step == 0 { // idiom: an unset field, exactly zero on purpose
		s.Step = defaultStep
	}
	var ticks []float64
	for g := from; g != to; g = math.Min(g+s.Step, to) { // idiom for exacteq: clamped to the bound, the loop lands on it exactly; planted (stoptol): a negative Step, or one below half the spacing of g, never gets there and nothing caps the ticks
		ticks = append(ticks, g)
	}
	return append(ticks, to)
}

// PondEnergy returns the potential energy, J, of the head pond holding v
// litres above the intake: the pond has upright banks, so the water's centre
// of mass sits at half its level.
func PondEnergy(v float64) float64 {
	const area = 6.0e7 // litres per metre of level (60,000 m²)
	level := v / area
	return rho * grav * (v / 1000) * level / 2
}

// MarginalEnergy returns dE/dV of the head pond at v litres, J per litre,
// by a forward difference. The pond holds about 2.4e8 litres.
func MarginalEnergy(v float64) float64 {
	const h = 1e-8 // planted (fdstep): fixed step; from 2^27 ≈ 1.34e8 on, v+h == v and the slope comes out 0
	return (PondEnergy(v+h) - PondEnergy(v)) / h
}
