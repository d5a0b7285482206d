// Package require is a stub of the assertion library's API used in tests.
package require

import "github.com/stretchr/testify/assert"

func Equal(t assert.TestingT, expected, actual any, msgAndArgs ...any) {}
func InEpsilon(t assert.TestingT, expected, actual any, epsilon float64, msgAndArgs ...any) {
}
