// Package firing has a type error: the end-to-end tests check that roundoff
// reports it as an error rather than as findings.
package firing

// Peak is the top temperature of a firing, in degrees Celsius.
var Peak float64 = "hot"

// Above reports whether t is over the peak.
func Above(t float64) bool { return t > Peak }
