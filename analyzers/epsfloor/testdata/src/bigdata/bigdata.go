// Package bigdata declares, in the configuration, data up to 1e6: a
// tolerance of 1e-11 on a difference of averaged readings (degree 1)
// breaks at 4.5e4, below it.
package bigdata

import "math"

func Same(a, b, c float64) bool {
	d := (a+b)/2 - c
	if math.Abs(d) < 1e-11 { // want `absolute tolerance 1e-11 on .*, of degree 1 in the data, .* once the data reach s = 4.5e\+04, under the data size 1e\+06 that roundoff.yaml declares`
		return true
	}
	return false
}
