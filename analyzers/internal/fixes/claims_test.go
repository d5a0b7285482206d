package fixes_test

import (
	"go/ast"
	"go/parser"
	"go/token"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/fixes"
)

// TestSaysExact checks which text around a comparison says it is exact:
// the statement's strings, comments on its lines and the line above, and,
// for FuncSaysExact, the whole function. The reference is the source text
// itself (common practice: words a reader takes as a claim of exactness).
func TestSaysExact(t *testing.T) {
	src := `package p

func a(x, y float64) bool {
	// The ledger balances exactly.
	return x == y
}

func b(x, y float64) bool {
	if x != y {
		panic("want bit-for-bit equality")
	}
	return true
}

// c checks the exactness of halving.
func c(x, y float64) bool {
	z := x
	return z == y // want "nothing"
}

func d(x, y float64) bool {
	// Exactly one branch runs.

	z := x
	return z == y
}
`
	fset := token.NewFileSet()
	file, err := parser.ParseFile(fset, "p.go", src, parser.ParseComments)
	require.NoError(t, err)
	root := inspector.New([]*ast.File{file}).Root()
	var stmt, fn []bool
	for cur := range root.Preorder((*ast.BinaryExpr)(nil)) {
		stmt = append(stmt, fixes.SaysExact(fset, file, cur))
		fn = append(fn, fixes.FuncSaysExact(fset, file, cur))
	}
	assert.Equal(t, []bool{true, true, false, false}, stmt, "the comment above, the message, nothing near, a comment two lines up")
	assert.Equal(t, []bool{true, true, true, true}, fn, "every function mentions exactness somewhere")
}
