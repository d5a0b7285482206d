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
