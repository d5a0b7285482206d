// Package unattended holds one hazard of each fix kind; under go fix only
// the safe fixes may be applied.
package unattended

import "math"

func all(a, b float64) (bool, bool, int) {
	s := a + b
	n := 0
	for x := 0.0; x != 1; x += 0.1 { // want `float loop variable x goes from 0 in steps of 0.1`
		n++
	}
	return s == 0.3, a == math.NaN(), n // want `computed float64 value and 0.3` `comparison with math.NaN\(\) is always false`
}
