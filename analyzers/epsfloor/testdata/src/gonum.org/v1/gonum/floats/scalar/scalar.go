// Package scalar is a stub of the reference library's scalar comparisons.
package scalar

func EqualWithinAbs(a, b, tol float64) bool                 { return a == b }
func EqualWithinRel(a, b, tol float64) bool                 { return a == b }
func EqualWithinAbsOrRel(a, b, absTol, relTol float64) bool { return a == b }
