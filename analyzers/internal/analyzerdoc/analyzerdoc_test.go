package analyzerdoc_test

import (
	"go/parser"
	"go/token"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"roundoff/analyzers/internal/analyzerdoc"
)

const src = `// Package p does one thing.
//
// # Analyzer thing
//
// thing: find the thing
//
// The full explanation, with a trailing space 
// and an example:
//
//	x := 1 // indented by a tab
//
//
// After two empty lines.
//
// # Other
//
// Not part of it.
package p
`

func TestExtract(t *testing.T) {
	// The reference is go/ast's CommentGroup.Text of the package comment,
	// cut at the headings as the doc comment syntax reads them (common
	// practice: go doc's "# Heading" lines).
	f, err := parser.ParseFile(token.NewFileSet(), "doc.go", src, parser.ParseComments|parser.PackageClauseOnly)
	require.NoError(t, err)
	text := f.Doc.Text()
	start := strings.Index(text, "thing: ") + len("thing: ")
	want := strings.TrimSpace(text[start:strings.Index(text, "\n# Other")])
	assert.Equal(t, want, analyzerdoc.Extract(src, "thing"))
	assert.Equal(t, "find the thing\n\nThe full explanation, with a trailing space\nand an example:\n\n\tx := 1 // indented by a tab\n\nAfter two empty lines.", analyzerdoc.Extract(src, "thing"))
	assert.Panics(t, func() { analyzerdoc.Extract(src, "other") }, "a missing section is the analyzer's own mistake")
	assert.Panics(t, func() { analyzerdoc.Extract("package p\n", "thing") })
}
