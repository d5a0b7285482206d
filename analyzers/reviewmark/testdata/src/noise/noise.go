// Package noise holds noise directives, right and wrong.
package noise

// simulate runs a model good to six digits.
//
//roundoff:noise 1e-6
func simulate(x float64) float64 { return x * x }

// measure has a level that is not a relative accuracy.
//
//roundoff:noise 2 // want `//roundoff:noise 2: not a relative accuracy between the unit roundoff of float64 \(1.11e-16\) and 1, such as 1e-6, so it declares nothing`
func measure(x float64) float64 { return x }

// exact claims more accuracy than any computed float64 has (IEEE 754-2019
// binary64 unit roundoff 2^-53 ≈ 1.11e-16).
//
//roundoff:noise 1e-17 // want `//roundoff:noise 1e-17: below the unit roundoff of float64 \(1.11e-16\): no computed float64 value is that accurate, so it declares nothing`
func exact(x float64) float64 { return x }

// solve forgets the level.
//
//roundoff:noise // want `//roundoff:noise takes a relative accuracy, such as //roundoff:noise 1e-6, so it declares nothing`
func solve(x float64) float64 { return x }

func misplaced(x float64) float64 {
	//roundoff:noise 1e-3 // want `//roundoff:noise declares a function's noise level only in its doc comment; here it declares nothing`
	return simulate(x) + measure(x) + solve(x) + exact(x)
}
