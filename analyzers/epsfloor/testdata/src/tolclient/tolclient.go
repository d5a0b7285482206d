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
