// Package generic holds exact comparisons over type parameters.
package generic

// Float is a type set of floats only.
type Float interface{ ~float32 | ~float64 }

func sumEq[T Float](a, b, c T) bool {
	return a+b == c*c // want `exact == between two computed T values: each carries rounding error \(up to 5.96e-08 relative per operation`
}

func literal64[T ~float64](a, b T) bool {
	return a/b == 0.1 // want `computed T value and 0.1, which float64 stores as 0.1000000000000000055511151231257827\.\.\.`
}

func mixed[T ~int | ~float64](a, b T) bool {
	return a+b == a*b // the type set admits int: not judged as float
}

func param[T Float](a, b T) bool {
	return a == b // parameters only: copied values compare exactly by design
}
