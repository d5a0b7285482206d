// Package uses calls model's functions from another package.
package uses

import "model"

func run(x float64) float64 {
	return model.Simulate(x) + // want `noise 1e-06`
		model.Exact(x) + // want `noise 0.0001`
		model.Plain(x)
}
