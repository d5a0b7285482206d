// Package tolclient passes constants to tolapi from another package.
package tolclient

import "tolapi"

func use(a, b float64) bool {
	s := tolapi.Settings{RelTol: 1e-20}                        // want `1e-20, set as field RelTol \(a relative tolerance of float64 in Refine, tested at tolapi\.go:13\), is below the unit roundoff of float64`
	return tolapi.Refine(s, a, b) && tolapi.Agree(a, b, 1e-25) // want `1e-25, passed as tol to Agree \(an absolute tolerance of float64 in [A-Za-z]+, tested at \w+\.go:\d+\), is below float64 epsilon`
}

func sane(a, b float64) bool {
	return tolapi.Agree(a, b, 1e-9) && tolapi.Refine(tolapi.Settings{RelTol: 1e-12}, a, b)
}

// near wraps a wrapper: its tolerance reaches Agree through tolapi.Close.
func near(a, b, slack float64) bool { // want near:"parameter 2 is an absolute tolerance of float64 in Agree"
	return tolapi.Close(a, b, slack)
}

func useNear(a, b float64) bool {
	return near(a, b, 1e-30) // want `1e-30, passed as slack to near \(an absolute tolerance of float64 in Agree, tested at tolapi\.go:18\), is below float64 epsilon`
}

// same asks for exact agreement with a tolerance of 0: Agree's test is
// strict, |a-b| < tol, which no pair passes at 0, equal ones included,
// here through the wrapper near and tolapi.Close. Refine's test, <=,
// holds at 0 for equal values, and Match takes 0 apart.
func same(a, b float64) bool {
	return near(a, b, 0) || // want `0, passed as slack to near \(an absolute tolerance of float64 in Agree, tested at tolapi\.go:18\), makes a strict test, a difference below the tolerance, that no pair of values passes, equal ones included \(\|a-b\| < 0 is always false\)`
		tolapi.Refine(tolapi.Settings{RelTol: 0}, a, b) ||
		tolapi.Match(a, b, 0)
}

// survey passes thresholds to tolapi's fits of its own readings.
func survey(t, y [3]float64, ax, ay, bx, by, cx, cy float64) bool {
	k := tolapi.NewKiln()
	k.Pivot = 1e-14 // want `1e-14, assigned to field Pivot \(a threshold of float64 on .* tested at tolapi.go:59\), is below its rounding error eps·s\^3 \(eps = 2.22e-16\) once the data reach s = 3.6`
	_, ok := k.Curvature(t[0], y[0], t[1], y[1], t[2], y[2])
	return ok &&
		tolapi.Collinear(ax, ay, bx, by, cx, cy, 1e-12) && // want `1e-12, passed as tol to Collinear \(an absolute tolerance of float64 on math.Abs\(cross\) < tol, of degree 2 in the data, in Collinear, tested at tolapi.go:69\), is below its rounding error eps·s\^2 \(eps = 2.22e-16\) once the data reach s = 67`
		tolapi.Collinear(ax, ay, bx, by, cx, cy, 1e-6) && // 6.7e4: above the data size
		tolapi.Collinear(ax, ay, bx, by, cx, cy, 1e-20) && // want `1e-20, passed as tol to Collinear \(an absolute tolerance .*\), is below float64 epsilon`
		tolapi.Settled(ax, bx, 1e-15) // a difference of two readings: exact when they are close
}

// kilnFloor keeps the kiln's fit off a zero denominator only: a threshold
// below eps asks whether the quantity vanished, not whether it is noise.
func kilnFloor() *tolapi.Kiln {
	k := tolapi.NewKiln()
	k.Pivot = 1e-20
	return k
}

// mesh asks whether a float32 triangle is degenerate to within 1e-12,
// below the spacing of float32 values near 1 (1.19e-7).
func mesh(a, b, c [2]float32) bool {
	return tolapi.Degenerate(a, b, c, 1e-12) // want `1e-12, passed as tol to Degenerate \(an absolute tolerance of float32 in within, tested at tolapi.go:\d+\), is below float32 epsilon`
}
