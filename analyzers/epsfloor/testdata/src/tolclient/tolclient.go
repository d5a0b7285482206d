// Package tolclient passes constants to tolapi from another package.
package tolclient

import "tolapi"

func use(a, b float64) bool {
	s := tolapi.Settings{RelTol: 1e-20}                        // want `1e-20, set as field RelTol, which Refine uses as a relative tolerance, is below the unit roundoff of float64`
	return tolapi.Refine(s, a, b) && tolapi.Agree(a, b, 1e-25) // want `1e-25, passed as tol to Agree, which uses it as an absolute tolerance, is below float64 epsilon`
}

func sane(a, b float64) bool {
	return tolapi.Agree(a, b, 1e-9) && tolapi.Refine(tolapi.Settings{RelTol: 1e-12}, a, b)
}
