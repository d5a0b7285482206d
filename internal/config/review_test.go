package config_test

import (
	"testing"

	"github.com/stretchr/testify/assert"

	"roundoff/internal/config"
)

// The directive follows the Go convention for tool directives
// (//tool:name, no space after the slashes; go/ast's isDirective).
func TestParseReview(t *testing.T) {
	for _, c := range []struct {
		text   string
		names  []string
		reason string
		ok     bool
	}{
		{"//roundoff:reviewed exacteq set from a table", []string{"exacteq"}, "set from a table", true},
		{"//roundoff:reviewed exacteq,epsfloor  both judged\t", []string{"exacteq", "epsfloor"}, "both judged", true},
		{"//roundoff:reviewed\texacteq", []string{"exacteq"}, "", true},
		{"//roundoff:reviewed", nil, "", true},
		{"//roundoff:reviewed   ", nil, "", true},
		{"//roundoff:reviewedness exacteq x", nil, "", false},
		{"// roundoff:reviewed exacteq x", nil, "", false},
		{"/*roundoff:reviewed exacteq x*/", nil, "", false},
		{"//go:generate stringer", nil, "", false},
	} {
		names, reason, ok := config.ParseReview(c.text)
		assert.Equal(t, c.ok, ok, c.text)
		assert.Equal(t, c.names, names, c.text)
		assert.Equal(t, c.reason, reason, c.text)
	}
}
