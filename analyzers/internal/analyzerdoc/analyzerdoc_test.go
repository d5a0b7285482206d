package analyzerdoc_test

import (
	"testing"

	"github.com/stretchr/testify/assert"

	"roundoff/analyzers/internal/analyzerdoc"
)

const src = `// Package p does one thing.
//
// # Analyzer thing
//
// thing: find the thing
//
// The full explanation.
//
// # Other
//
// Not part of it.
package p
`

func TestExtract(t *testing.T) {
	assert.Equal(t, "find the thing\n\nThe full explanation.", analyzerdoc.Extract(src, "thing"))
	assert.Panics(t, func() { analyzerdoc.Extract(src, "other") }, "a missing section is the analyzer's own mistake")
	assert.Panics(t, func() { analyzerdoc.Extract("package p\n", "thing") })
}
