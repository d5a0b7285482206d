package cancellation

import (
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/types/typeutil"
)

// dotPairs reads call as a call of the package's own dot-product
// function, one that returns a sum of products of its parameters (func dot3(x0, y0, z0, x1, y1, z1 float64) float64 { return
// x0*x1 + y0*y1 + z0*z1 }), and returns the pairs of arguments multiplied.
func (c *checker) dotPairs(call *ast.CallExpr) ([][2]ast.Expr, bool) {
	body := c.returned(call)
	if body == nil {
		return nil, false
	}
	sig := typeutil.Callee(c.pass.TypesInfo, call).Type().(*types.Signature)
	if sig.Recv() != nil || sig.Variadic() || sig.Params().Len() != len(call.Args) {
		return nil, false
	}
	index := make(map[types.Object]int)
	for i := range sig.Params().Len() {
		index[sig.Params().At(i)] = i
	}
	arg := func(e ast.Expr) (ast.Expr, bool) {
		id, ok := ast.Unparen(e).(*ast.Ident)
		if !ok {
			return nil, false
		}
		i, ok := index[c.pass.TypesInfo.Uses[id]]
		if !ok {
			return nil, false
		}
		return call.Args[i], true
	}
	var pairs [][2]ast.Expr
	for _, t := range c.addTerms(body, 1, nil) {
		m, ok := ast.Unparen(t.e).(*ast.BinaryExpr)
		if !ok || m.Op != token.MUL || t.sign < 0 {
			return nil, false
		}
		x, okx := arg(m.X)
		y, oky := arg(m.Y)
		if !okx || !oky {
			return nil, false
		}
		pairs = append(pairs, [2]ast.Expr{x, y})
	}
	return pairs, len(pairs) > 1
}

// dotSquare reads call as a dot product (dotPairs) one of whose pairs is
// u with itself, and returns the sum of the other pairs, those with a
// constant 0 left out.
func (c *checker) dotSquare(call *ast.CallExpr, u ast.Expr) (ast.Expr, bool) {
	pairs, ok := c.dotPairs(call)
	if !ok {
		return nil, false
	}
	var rest ast.Expr
	found := false
	for _, p := range pairs {
		switch {
		case !found && same(p[0], u) && same(p[1], u):
			found = true
		case c.isZero(p[0]) || c.isZero(p[1]):
		case rest == nil:
			rest = &ast.BinaryExpr{X: p[0], Op: token.MUL, Y: p[1]}
		default:
			rest = &ast.BinaryExpr{X: rest, Op: token.ADD, Y: &ast.BinaryExpr{X: p[0], Op: token.MUL, Y: p[1]}}
		}
	}
	return rest, found && rest != nil
}
