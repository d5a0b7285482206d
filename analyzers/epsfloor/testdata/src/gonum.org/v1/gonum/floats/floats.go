// Package floats is a stub of the reference library's slice comparisons.
package floats

func EqualApprox(s1, s2 []float64, tol float64) bool { return len(s1) == len(s2) }
