// Package model declares noisy functions.
package model

// Simulate integrates a model to six digits.
//
//roundoff:noise 1e-6
func Simulate(x float64) float64 { return x } // want Simulate:"noise 1e-06"

// Exact has no directive; the test's configuration declares it.
func Exact(x float64) float64 { return x } // want Exact:"noise 0.0001"

// Plain is exact and declared nowhere.
func Plain(x float64) float64 { return x }
