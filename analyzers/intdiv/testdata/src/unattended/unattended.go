// Package unattended holds one hazard with a safe fix and one whose fix
// needs review; under go fix only the first is applied.
package unattended

func both(a, b int, x float64) (float64, float64) {
	return float64(a / b), 1 / 2 * x // want `float64\(a / b\) converts` `1 / 2 divides untyped integer constants`
}
