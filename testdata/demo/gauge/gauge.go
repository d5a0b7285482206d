// Package gauge turns the stage readings of the Quillmere Brook river gauge
// into discharge and checks the intake's water accounts.
//
// Quillmere Brook is the fictional micro-hydro cooperative of roundoff's
// demo. Comments starting "planted" mark a floating-point hazard put there on
// purpose, with the analyzer that should report it; comments starting
// "idiom" mark an exact comparison that is right and must stay silent.
package gauge

import "math"

// Sample is one reading of the gauge logger.
type Sample struct {
	T     float64 // seconds since the start of the log
	Stage float64 // water level above the gauge datum, m; NaN when the float sensor drops out
}

// Rating is the weir's stage–discharge relation Q = C·(h − H0)^B.
type Rating struct {
	C, H0, B float64
}

// Discharge returns the flow at stage h, m³/s.
func (r Rating) Discharge(h float64) float64 {
	d := h - r.H0
	if d <= 0 {
		return 0 // the brook is below the weir crest
	}
	return r.C * math.Pow(d, r.B)
}

// Missing reports whether the logger lost a sample.
func Missing(s Sample) bool {
	return s.Stage == math.NaN() // planted (exacteq, nan): always false, so lost samples pass as readings
}

// dropout reports whether the float sensor returned NaN.
func dropout(s Sample) bool {
	return s.Stage != s.Stage // idiom: x != x holds exactly when x is NaN
}

// Volume integrates the flow over the log by the trapezoid rule, m³,
// skipping intervals that touch a dropout.
func (r Rating) Volume(log []Sample) float64 {
	v := 0.0
	for i := 1; i < len(log); i++ {
		if dropout(log[i]) || dropout(log[i-1]) {
			continue
		}
		dt := log[i].T - log[i-1].T
		v += dt * (r.Discharge(log[i].Stage) + r.Discharge(log[i-1].Stage)) / 2
	}
	return v
}

// MeanFlow returns the mean discharge over the log, m³/s.
func (r Rating) MeanFlow(log []Sample) float64 {
	if len(log) < 2 {
		return 0
	}
	span := log[len(log)-1].T - log[0].T
	if span == 0 { // idiom: a test for exact zero before dividing
		return 0
	}
	return r.Volume(log) / span
}

// Split is how the intake shares the brook out, m³/s.
type Split struct {
	Turbine, FishPass, Spill float64
}

// AtLicenceMinimum reports whether the fish pass and the spillway get exactly
// the 30% residual flow of the cooperative's abstraction licence, so that the
// controller may not open the turbine gate any further.
func AtLicenceMinimum(s Split) bool {
	total := s.Turbine + s.FishPass + s.Spill
	residual := s.FishPass/total + s.Spill/total
	return residual == 0.3 // planted (exacteq, literal): 0.3 has no float64; with flows 1.4, 0.4, 0.2 the shares sum to 0.30000000000000004
}

// Balance is the water account of one logging day at the intake, m³.
type Balance struct {
	In, Out float64
}

// RatingChanged reports whether revising the weir's rating changes the day's
// water account, so that the day must be booked again.
func RatingChanged(up, down []Sample, before, after Rating, turbined float64) bool {
	old := Balance{In: before.Volume(up), Out: before.Volume(down) + turbined}
	rev := Balance{In: after.Volume(up), Out: after.Volume(down) + turbined}
	return old != rev // planted (exacteq, aggregate): != compares computed volumes bit for bit
}
