// Package noise holds noise directives, right and wrong.
package noise

// simulate runs a model good to six digits.
//
//roundoff:noise 1e-6
func simulate(x float64) float64 { return x * x }

// measure has a level that is not a relative accuracy.
//
//roundoff:noise 2 // want `//roundoff:noise 2: the relative accuracy must be a number between 0 and 1, so it declares nothing`
func measure(x float64) float64 { return x }

// solve forgets the level.
//
//roundoff:noise // want `//roundoff:noise takes a relative accuracy, such as //roundoff:noise 1e-6, so it declares nothing`
func solve(x float64) float64 { return x }

func misplaced(x float64) float64 {
	//roundoff:noise 1e-3 // want `//roundoff:noise declares a function's noise level only in its doc comment; here it declares nothing`
	return simulate(x) + measure(x) + solve(x)
}
