package constval_test

import (
	"go/ast"
	"go/constant"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/constval"
)

const rowsSrc = `package p

type tc struct {
	mu, k float64
	x     []float64
	n     int
}

var cases = []tc{
	{mu: 2, k: 0.1, x: []float64{3, 1}},
	{3, -0.5, []float64{10, 0.25}, 4},
	{mu: 1, x: []float64{0, 0}},
}

func use(f func(float64) float64) float64 {
	s := 0.0
	for _, c := range cases {
		k := c.k
		want := c.mu + k*(c.x[0]-c.x[1])/float64(c.n+2)
		s += want
		s += f(c.mu)
	}
	return s
}
`

// TestInRow evaluates, case by case, an expected value computed from the
// case's fields, slice elements and a local copy, against the exact
// rational arithmetic of the Go spec ("Constant expressions"): a field
// left out of a keyed literal is zero, and a call is not evaluated.
func TestInRow(t *testing.T) {
	_, info, files := build(t, rowsSrc)
	decls := constval.Decls(info, inspector.New(files))
	var rs *ast.RangeStmt
	var want, call ast.Expr
	ast.Inspect(files[0], func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.RangeStmt:
			rs = n
		case *ast.AssignStmt:
			if id, ok := n.Lhs[0].(*ast.Ident); ok && id.Name == "want" {
				want = n.Rhs[0]
			}
		case *ast.CallExpr:
			if id, ok := n.Fun.(*ast.Ident); ok && id.Name == "f" {
				call = n
			}
		}
		return true
	})
	require.NotNil(t, rs)
	row, cs, ok := constval.Table(info, decls, rs)
	require.True(t, ok)
	require.Len(t, cs, 3)
	// 2 + 0.1*(3-1)/2 = 2.1; 3 - 0.5*(10-0.25)/6 = 2.1875; 1 + 0*(0-0)/2 = 1.
	for i, w := range []constant.Value{rat(21, 10), rat(35, 16), rat(1, 1)} {
		got, ok := constval.InRow(info, decls, want, row, cs[i])
		require.True(t, ok, "case %d", i)
		exactEq(t, w, got, "case")
	}
	_, ok = constval.InRow(info, decls, call, row, cs[0])
	assert.False(t, ok, "a call is not evaluated")
}
