package consume_test

import (
	"go/ast"
	"go/importer"
	"go/parser"
	"go/token"
	"go/types"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/consume"
)

// Each function computes d := p*p - q*q (the value asked about is the
// first subtraction in the function) and consumes it one way.
const src = `package p

import "math"

func root(p, q float64) float64    { return math.Sqrt(p*p - q*q) }
func divisor(p, q float64) float64 { return 1 / (2 * (p*p - q*q)) }
func sign(p, q float64) bool       { return p*p-q*q < 0 }
func term(p, q, r float64) float64 { return r + 3*(p*p-q*q) }
func flat(p, q float64) float64    { return math.Cos(p*p - q*q) }
func odd(p, q float64) float64     { return math.Log(math.Sin(p*p - q*q)) }
func level(p, q float64) bool      { return math.Abs(p*p-q*q) > 4 }
func returned(p, q float64) float64 { return p*p - q*q }

func viaVar(p, q, r float64) float64 {
	d := p*p - q*q
	r += d
	return r * math.Exp(d)
}

func reused(p, q, w float64) float64 {
	d := p*p - q*q
	w += d
	d = w
	return 1 / d // reached by the second assignment only
}
`

func TestOf(t *testing.T) {
	fset := token.NewFileSet()
	f, err := parser.ParseFile(fset, "p.go", src, 0)
	require.NoError(t, err)
	info := &types.Info{Types: map[ast.Expr]types.TypeAndValue{}, Uses: map[*ast.Ident]types.Object{}, Defs: map[*ast.Ident]types.Object{}}
	_, err = (&types.Config{Importer: importer.Default()}).Check("p", fset, []*ast.File{f}, info)
	require.NoError(t, err)
	root := inspector.New([]*ast.File{f}).Root()

	want := map[string]consume.Use{
		"root": consume.Relative, "divisor": consume.Relative, "sign": consume.Relative,
		"term": consume.Absolute, "flat": consume.Absolute, "odd": consume.Relative,
		"level": consume.Absolute, "returned": consume.Unknown,
		"viaVar": consume.Absolute, "reused": consume.Absolute,
	}
	for fn := range root.Preorder((*ast.FuncDecl)(nil)) {
		name := fn.Node().(*ast.FuncDecl).Name.Name
		for sub := range fn.Preorder((*ast.BinaryExpr)(nil)) {
			if b := sub.Node().(*ast.BinaryExpr); b.Op == token.SUB && strings.Contains(types.ExprString(b), "p*p") {
				assert.Equal(t, want[name], consume.Of(info, sub, 2), name)
				assert.Equal(t, name == "level", consume.Threshold(info, sub), name) // only level meets a nonzero constant
				break
			}
		}
	}
}

// TestReaching checks the value last assigned before a use; that a loop
// which assigns the variable, an if's init statement that does, or a
// closure that does, stops the search; and that a loop which leaves it
// alone does not (common practice: reaching definitions over
// straight-line code).
func TestReaching(t *testing.T) {
	const code = `package p

func f(a, b float64, n int) float64 {
	k := a
	k = b * 2
	use(k)
	for i := 0; i < n; i++ {
		use(k)
		k = a
	}
	return k
}

func g(a float64, n int) {
	w := a + 1
	for i := 0; i < n; i++ {
		use(w)
	}
	if w = a; n > 0 {
		use(w)
	}
}

func h(a float64, do func(func())) {
	m := a * 3
	do(func() { m = 0 })
	use(m)
}

func use(float64) {}
`
	fset := token.NewFileSet()
	f, err := parser.ParseFile(fset, "p.go", code, 0)
	require.NoError(t, err)
	info := &types.Info{Uses: map[*ast.Ident]types.Object{}, Defs: map[*ast.Ident]types.Object{}}
	_, err = (&types.Config{}).Check("p", fset, []*ast.File{f}, info)
	require.NoError(t, err)
	var got []string
	for call := range inspector.New([]*ast.File{f}).Root().Preorder((*ast.CallExpr)(nil)) {
		arg, isIdent := call.Node().(*ast.CallExpr).Args[0].(*ast.Ident)
		if !isIdent {
			continue // do(func() {...})
		}
		rhs, ok := consume.Reaching(info, call, info.Uses[arg].(*types.Var))
		if ok {
			got = append(got, types.ExprString(rhs.Node().(ast.Expr)))
		} else {
			got = append(got, "-")
		}
	}
	assert.Equal(t, []string{"b * 2", "-", "a + 1", "-", "-"}, got)
}
