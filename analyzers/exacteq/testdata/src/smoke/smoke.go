package smoke

import "math"

func a(x, y float64) bool {
	s := x + y
	if s == 0.3 {
		return true
	}
	if x == math.NaN() {
		return true
	}
	t := x * y
	if s == t {
		return true
	}
	for v := 0.0; v != 1; v += 0.1 {
	}
	for v := 0.0; v != 1; v += 0.25 {
	}
	m := (x + y) / 2
	if m == x || m == y {
		return false
	}
	return x == y
}
