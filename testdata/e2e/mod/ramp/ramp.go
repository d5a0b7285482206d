// Package ramp plans the firing schedule of a fictional pottery kiln. It
// plants the float hazards the roundoff end-to-end tests expect to find.
package ramp

import (
	"errors"
	"math"
)

// maxSegments caps a schedule so that a runaway plan cannot grow forever.
const maxSegments = 64

// ErrSensor reports a thermocouple reading that is not a number.
var ErrSensor = errors.New("ramp: thermocouple reading is not a number")

// Check rejects a failed thermocouple reading.
func Check(reading float64) error {
	if reading == math.NaN() {
		return ErrSensor
	}
	return nil
}

// Plan splits a ramp from start to peak degrees into tenths of the rise.
func Plan(start, peak float64) []float64 {
	var steps []float64
	for frac := 0.0; frac != 1; frac += 0.1 {
		if len(steps) == maxSegments {
			break
		}
		steps = append(steps, start+frac*(peak-start))
	}
	return steps
}
