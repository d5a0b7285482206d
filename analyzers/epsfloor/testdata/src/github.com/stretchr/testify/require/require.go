// Package require is a stub of the assertion library's API used in tests.
package require

import "github.com/stretchr/testify/assert"

func InDelta(t assert.TestingT, expected, actual any, delta float64, msgAndArgs ...any) {}
