// Package flow is a fixture of roundoff noise's end-to-end tests: the
// spillway of an invented weir, with functions of every kind the command
// must measure or refuse.
package flow

import "math"

// Crest returns the spillway discharge, m³/s, for a head of h m, as the
// logger reports it: rounded to the millilitre per second.
func Crest(h float64) float64 {
	q := 1.7 * 12 * math.Pow(h, 1.5)
	return math.Round(q*1e6) / 1e6
}

// Smooth is the discharge before rounding.
func Smooth(h float64) float64 { return 1.7 * 12 * math.Pow(h, 1.5) }

// Gate is the gate's discharge coefficient in single precision.
var Gate = func(g float32) float32 { return float32(math.Sqrt(float64(g))) * 0.61 }

// Basin returns the stored volume for the levels of the two basins.
func Basin(levels []float64) float64 { return 300*levels[0] + 40*levels[1]*levels[1] }

// Jammed panics: the gate sensor is missing.
func Jammed(h float64) float64 { panic("gate sensor missing") }

// Stuck never returns.
func Stuck(h float64) float64 {
	for {
	}
}

// Dry returns NaN below the crest.
func Dry(h float64) float64 { return math.Sqrt(h - 5) }

// Level is constant: the weir is full.
func Level(h float64) float64 { return 3 }

// Both takes two heads.
func Both(h, g float64) float64 { return h + g }
