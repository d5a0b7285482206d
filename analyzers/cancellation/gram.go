package cancellation

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/consume"
	"roundoff/analyzers/internal/fixes"
)

// gram reports a*c - b*b where a = dot(u, u), c = dot(v, v) and
// b = dot(u, v) are calls of one dot-product function (directly or
// through variables), unless the consumer needs only absolute accuracy:
// by Lagrange's identity the difference is |u×v|² = |u|²|v|²·sin²θ, so
// for nearly parallel vectors both products are about |u|²|v|² and the
// difference keeps only about log10(sin²θ/u) digits, while the squared
// norm of the cross product keeps them all. It reports whether n had the
// form.
func (c *checker) gram(cur inspector.Cursor, n *ast.BinaryExpr) bool {
	prod, ok := ast.Unparen(n.X).(*ast.BinaryExpr)
	b, isSquare := c.square(n.Y)
	if !ok || prod.Op != token.MUL || !isSquare {
		return false
	}
	fa, u, oka := c.selfDot(prod.X)
	fc, v, okc := c.selfDot(prod.Y)
	if !oka || !okc || fa != fc || !c.crossDot(b, fa, u, v) {
		return false
	}
	if consume.Of(c.pass.TypesInfo, cur, 2) == consume.Absolute {
		return true
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catSquares,
		Message: fmt.Sprintf("a*c - b*b%s, where a = |u|², c = |v|², b = u·v, is |u×v|² = |u|²|v|²·sin²θ (Lagrange's identity): for nearly parallel vectors it keeps only about log10(sin²θ/u) digits (u = %.3g) and may come out negative; use the squared norm of the cross product",
			binding("acb", prod.X, prod.Y, b), unitRoundoff),
	})
	return true
}

// selfDot reads e, through variables, as a call f(u..., u...) whose
// second half of arguments repeats the first: the dot product of a vector
// with itself.
func (c *checker) selfDot(e ast.Expr) (types.Object, []ast.Expr, bool) {
	call, ok := c.dotCall(e)
	if !ok {
		return nil, nil, false
	}
	h := len(call.Args) / 2
	for i := range h {
		if !same(call.Args[i], call.Args[h+i]) {
			return nil, nil, false
		}
	}
	return typeutil.Callee(c.pass.TypesInfo, call), call.Args[:h], true
}

// crossDot reports whether e, through variables, is fn(u..., v...) or
// fn(v..., u...).
func (c *checker) crossDot(e ast.Expr, fn types.Object, u, v []ast.Expr) bool {
	call, ok := c.dotCall(e)
	if !ok || typeutil.Callee(c.pass.TypesInfo, call) != fn {
		return false
	}
	h := len(call.Args) / 2
	sameAll := func(xs, ys []ast.Expr) bool {
		return slices.EqualFunc(xs, ys, func(x, y ast.Expr) bool { return same(x, y) })
	}
	first, second := call.Args[:h], call.Args[h:]
	return sameAll(first, u) && sameAll(second, v) || sameAll(first, v) && sameAll(second, u)
}

// dotCall returns the call e stands for, through variables, when it calls
// a function or method with an even number of arguments and a float
// result.
func (c *checker) dotCall(e ast.Expr) (*ast.CallExpr, bool) {
	e, _ = c.through(e)
	call, ok := e.(*ast.CallExpr)
	if !ok || len(call.Args) == 0 || len(call.Args)%2 != 0 || typeutil.Callee(c.pass.TypesInfo, call) == nil {
		return nil, false
	}
	return call, isFloat64(c.pass.TypesInfo.TypeOf(call))
}
