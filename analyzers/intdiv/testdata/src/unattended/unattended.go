// Package unattended holds two hazards whose fixes change what the program
// computes; under go fix neither is applied.
package unattended

func both(a, b int, x float64) (float64, float64) {
	return float64(a / b), 1 / 2 * x // want `float64\(a / b\) converts` `1 / 2 divides untyped integer constants`
}

// aspect is pinned by a test as 1 (4/3 truncated): replacing it with
// 1.3333333333333333 would turn that test red, so the fix needs review.
var aspect float64 = 4 / 3 // want `4 / 3 divides untyped integer constants and is 1, not 1.33333`
