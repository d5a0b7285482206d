// Package optclient calls optapi from another package.
package optclient

import "optapi"

func use(f func(float64) float64) float64 {
	x := optapi.Minimize(f, 0, 1, optapi.Options{XTol: 1e-12}) // want `1e-12, set as field XTol \(an absolute x-tolerance of a minimization in Minimize\), is too tight`
	return x + optapi.Root(f, 0, 1, 1e-11)                     // want `1e-11, passed as tol to Root \(an absolute x-tolerance of a root finding in Root\), is too tight: it ignores \|x\|: from \|x\| = 6.55e\+04 on`
}

func sane(f func(float64) float64) float64 {
	return optapi.Minimize(f, 0, 1, optapi.Options{XTol: 1e-6}) + optapi.Root(f, 0, 1, 1e-6)
}
