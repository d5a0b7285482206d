// Package pond simulates Quillmere Brook's head pond over three days of
// the turbine's daily schedule, to plan how much of the brook to divert.
//
// The simulation integrates the levels with an adaptive step to a
// tolerance of 1e-4 m per step: its results carry about six digits, not
// sixteen.
// Machine-epsilon advice is wrong for it; `roundoff noise` measures the
// level it really has (see docs/noise.md). Comments starting "hazard" mark
// code that such advice makes wrong.
package pond

import "math"

const (
	pondArea = 6.0e4 // surface of the head pond, m²
	foreArea = 40.0  // surface of the forebay between pond and penstock, m²
	channel  = 2.0   // exchange through the short channel: Q = channel·(pond − forebay level), m²/s
	orifice  = 1.9   // penstock intake: Q = orifice·sqrt(forebay level), m^(5/2)/s
	tolLevel = 1e-4  // accuracy asked of the integrator per step, m
	hours    = 72.0  // length of the simulation
)

// levels are the pond's and the forebay's levels, m.
type levels [2]float64

// demand is the turbine's share of full flow at hour t: high by day,
// low at night.
func demand(t float64) float64 { return 0.6 + 0.35*math.Sin(2*math.Pi*(t-9)/24) }

// rate returns d(levels)/dt in m per hour for a diverted flow q, m³/s. The
// forebay is small, so its level follows the pond's within seconds: the
// system is stiff.
func rate(q, t float64, l levels) levels {
	exchange := channel * (l[0] - l[1])
	out := demand(t) * orifice * math.Sqrt(max(l[1], 0))
	return levels{3600 * (q - exchange) / pondArea, 3600 * (exchange - out) / foreArea}
}

// step advances l by h with the Bogacki–Shampine 3(2) pair and returns the
// new levels and the largest component of the error estimate.
func step(q, t, h float64, l levels) (levels, float64) {
	at := func(c float64, k levels) levels { return levels{l[0] + c*h*k[0], l[1] + c*h*k[1]} }
	k1 := rate(q, t, l)
	k2 := rate(q, t+h/2, at(0.5, k1))
	k3 := rate(q, t+3*h/4, at(0.75, k2))
	var next levels
	for i := range l {
		next[i] = l[i] + h*(2*k1[i]+3*k2[i]+4*k3[i])/9
	}
	k4 := rate(q, t+h, next)
	err := 0.0
	for i := range l {
		err = max(err, math.Abs(next[i]-(l[i]+h*(7*k1[i]/24+k2[i]/4+k3[i]/3+k4[i]/8))))
	}
	return next, err
}

// IntakeHead returns the forebay's level at the penstock intake, m, after
// three days when q m³/s of the brook is diverted into the pond, starting
// 2 m deep, with the usual step control h·min(5, max(0.2, 0.9·(tol/err)^(1/3))).
func IntakeHead(q float64) float64 {
	t, h, l := 0.0, 0.01, levels{2, 2}
	for t < hours { // planted (stoptol): nothing floors h; if the error test keeps failing, h shrinks to 0 and t stops moving
		h = min(h, hours-t)
		next, err := step(q, t, h, l)
		fac := 0.9 * math.Cbrt(tolLevel/max(err, 1e-300))
		if err > tolLevel {
			h *= max(0.2, fac)
			continue
		}
		t, l = t+h, next
		h *= min(5, fac)
	}
	return l[1]
}

// HeadPerFlow returns d(IntakeHead)/dq, m per m³/s, for the operator's
// planning sheet.
func HeadPerFlow(q float64) float64 {
	h := 1.4901161193847656e-08 * math.Max(1, math.Abs(q)) // hazard: sqrt(eps)·max(1,|q|), right for a formula good to 16 digits; IntakeHead has about 6, and a quotient over so small a step is off by percents
	return (IntakeHead(q+h) - IntakeHead(q)) / h
}
