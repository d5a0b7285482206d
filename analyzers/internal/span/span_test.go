package span_test

import (
	"go/ast"
	"go/importer"
	"go/parser"
	"go/token"
	"go/types"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/span"
)

// src holds the cases: each call of probe asks for the range of its
// argument where it is passed. The ranges are those of interval
// arithmetic on the conditions written (common practice).
const src = `package p

import "math"

func probe(x float64) {}

func branches(x, y float64, n int) {
	if x < -5 {
		return
	} else if x < 10 {
		probe(x) // [-5, 10]
	}
	if math.Abs(y) < 0.5 {
		probe(y) // [-0.5, 0.5]
	} else {
		probe(y) // |y| >= 0.5: away from 0 by 0.5 on both sides
	}
	if y*y < 0.0025 {
		probe(y) // [-0.05, 0.05]
	} else if y < 1 {
		probe(y) // below 1, away from 0 by 0.05
	}
	switch {
	case n < 0:
	case n < 4:
		probe(float64(n)) // [0, 4]
	}
	if !(x > 1 && x < 3) {
		return
	}
	probe(1 - x) // [-2, 0]
}

func moved(x float64) {
	if x < 1 {
		return
	}
	x = -x
	probe(x) // nothing: x changes after the test
}

func calls(s float64) {
	if s <= 5 {
		return
	} else if s < 15 {
		return
	}
	tail(s)
	tail(2 * s)
}

func tail(s float64) {
	probe(math.Pow(2, -s)) // [0, 2^-15]
}

func Exported(s float64) {
	probe(s) // nothing: callers elsewhere
	if s > 2 {
		probe(s) // [2, +Inf]
		probe(1 / s) // [0, 0.5]
	}
}

func passed(s float64) {
	probe(s) // nothing: the function is also a value
}

var f = passed

func built(t float64) {
	u := math.Sin(t)
	probe(3 + u*u) // [3, 4]
	probe(t - math.Floor(t)) // [0, 1]
}

func ratio(x, nu float64) {
	if x <= 0 || nu <= 0 {
		return
	}
	z := x / nu
	probe(z) // [0, +Inf]: a quotient of positives
}

func through(n int) {
	switch {
	case n < 0:
		fallthrough
	case n < 4:
		probe(float64(n)) // nothing: entered from the case before too
	}
}

func gone(x float64) {
	if x < 0 {
		goto out
	}
	probe(x) // nothing: a goto may land past the test
out:
}
`

// TestRanges checks each probe's range against the interval worked out by
// hand from the conditions in src.
func TestRanges(t *testing.T) {
	inf := math.Inf(1)
	want := []span.Interval{
		{Lo: -5, Hi: 10}, {Lo: -0.5, Hi: 0.5}, {Lo: -inf, Hi: inf, Away: 0.5},
		{Lo: -0.05, Hi: 0.05}, {Lo: -inf, Hi: 1, Away: 0.05},
		{Lo: 0, Hi: 4}, {Lo: -2, Hi: 0},
		{Lo: -inf, Hi: inf},
		{Lo: 0, Hi: math.Pow(2, -15)},
		{Lo: -inf, Hi: inf}, {Lo: 2, Hi: inf, Away: 2}, {Lo: 0, Hi: 0.5}, {Lo: -inf, Hi: inf},
		{Lo: 3, Hi: 4, Away: 3}, {Lo: 0, Hi: 1},
		{Lo: 0, Hi: inf},
		{Lo: -inf, Hi: inf},
		{Lo: -inf, Hi: inf},
	}
	fset := token.NewFileSet()
	f, err := parser.ParseFile(fset, "src.go", src, 0)
	require.NoError(t, err)
	info := &types.Info{Types: map[ast.Expr]types.TypeAndValue{}, Defs: map[*ast.Ident]types.Object{}, Uses: map[*ast.Ident]types.Object{}, Selections: map[*ast.SelectorExpr]*types.Selection{}}
	_, err = (&types.Config{Importer: importer.ForCompiler(fset, "source", nil)}).Check("p", fset, []*ast.File{f}, info)
	require.NoError(t, err)
	insp := inspector.New([]*ast.File{f})
	r := span.New(info, insp, constval.Decls(info, inspector.New([]*ast.File{f})), nil)
	i := 0
	for cur := range insp.Root().Preorder((*ast.CallExpr)(nil)) {
		call := cur.Node().(*ast.CallExpr)
		if id, ok := call.Fun.(*ast.Ident); !ok || id.Name != "probe" {
			continue
		}
		require.Less(t, i, len(want))
		got, _ := r.At(cur, call.Args[0])
		assert.Equal(t, want[i], got, "probe at %v", fset.Position(call.Pos()))
		i++
	}
	assert.Equal(t, len(want), i)
}
