package cancellation

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/consume"
	"roundoff/analyzers/internal/fixes"
)

// pointValue is a math function of one argument at a point: f(a).
type pointValue struct {
	name string
	arg  ast.Expr
}

// logOfRatio reports math.Log(f(a)/f(b)) and math.Log(f(a)*g(b)) with g
// the reciprocal of f (sec of cos, cot of tan), for one math function f
// (also through the package's wrappers) at two arguments that are not
// constants, where the logarithm is consumed to relative accuracy (a
// divisor, as in the cone constant of a conic projection): as a
// approaches b the ratio is within a few roundings of 1, each value
// carrying u·|f|, so the logarithm keeps only about
// log10(|f(a)-f(b)|/(u·|f(b)|)) digits, and a = b gives log 1 = 0, a
// division 0/0 where the limit exists.
func (c *checker) logOfRatio(cur inspector.Cursor, call *ast.CallExpr, name string) {
	arg, _ := c.through(call.Args[0])
	r, ok := arg.(*ast.BinaryExpr)
	if !ok {
		return
	}
	var fa, fb pointValue
	okb := false
	switch r.Op {
	case token.QUO:
		fa, ok = c.pointValueOf(r.X)
		fb, okb = c.pointValueOf(r.Y)
	case token.MUL:
		fa, ok = c.pointValueOf(r.X)
		fb, okb = c.reciprocalOf(r.Y)
		if !ok || !okb {
			fa, ok = c.pointValueOf(r.Y)
			fb, okb = c.reciprocalOf(r.X)
		}
	default:
		return
	}
	ok = ok && okb
	if !ok || fa.name != fb.name || same(fa.arg, fb.arg) || c.isConst(fa.arg) || c.isConst(fb.arg) ||
		consume.Of(c.pass.TypesInfo, cur, 2) != consume.Relative {
		return
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catLog1p,
		Message: fmt.Sprintf("math.%s of f(a)/f(b) for f = math.%s%s, consumed where its relative accuracy matters, keeps only about log10(|f(a)-f(b)|/(u·|f(b)|)) digits as a approaches b (u = %.3g) and is 0 at a = b, where a quotient of it is 0/0 though its limit exists; use math.Log1p((f(a)-f(b))/f(b)) with f(a)-f(b) in a closed form without the subtraction, and the limit where a == b",
			name, fa.name, binding("ab", fa.arg, fb.arg), unitRoundoff),
	})
}

// pointValueOf reads e, through never-reassigned variables, as a call of
// a math function of one argument, or of the package's wrapper of one.
func (c *checker) pointValueOf(e ast.Expr) (pointValue, bool) {
	e, _ = c.through(e)
	call, ok := e.(*ast.CallExpr)
	if !ok {
		return pointValue{}, false
	}
	name := c.mathName(call)
	if name == "" {
		return pointValue{}, false
	}
	return pointValue{name, call.Args[0]}, true
}

// reciprocalOf reads e as 1/f(a), written out or as a call of the
// package's own function that returns 1/f(x) of its one parameter x
// (func sec(x float64) float64 { return 1 / cos(x) }), and returns f(a).
func (c *checker) reciprocalOf(e ast.Expr) (pointValue, bool) {
	e, _ = c.through(e)
	if q, ok := e.(*ast.BinaryExpr); ok && q.Op == token.QUO && c.isOne(q.X) {
		return c.pointValueOf(q.Y)
	}
	call, ok := e.(*ast.CallExpr)
	if !ok || len(call.Args) != 1 {
		return pointValue{}, false
	}
	q, ok := ast.Unparen(c.returned(call)).(*ast.BinaryExpr)
	if !ok || q.Op != token.QUO || !c.isOne(q.X) {
		return pointValue{}, false
	}
	inner, ok := c.pointValueOf(q.Y)
	if !ok || !c.isParam(call, inner.arg) {
		return pointValue{}, false
	}
	return pointValue{inner.name, call.Args[0]}, true
}

// isParam reports whether e names the one parameter of the function that
// call calls.
func (c *checker) isParam(call *ast.CallExpr, e ast.Expr) bool {
	id, ok := ast.Unparen(e).(*ast.Ident)
	fn, isFunc := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func)
	if !ok || !isFunc {
		return false
	}
	params := fn.Type().(*types.Signature).Params()
	return params.Len() == 1 && c.pass.TypesInfo.Uses[id] == params.At(0)
}

// failureTerm reports whether math.Log(1-p) at cur is a term
// (n-k)·math.Log(1-p) of a sum that also holds k·math.Log(p), k not a
// constant: the log-likelihood of k successes and n-k failures. For
// small p the likeliest count is k = 0, where the other term vanishes and
// the sum is n·log(1-p) itself, about -n·p, so the relative error u/p of
// the rounded 1-p is the result's; the sum hides nothing. p must not be a
// constant nor kept away from 0 by an enclosing condition.
func (c *checker) failureTerm(cur inspector.Cursor, name string, p ast.Expr) bool {
	if c.isConst(p) || c.guarded(cur, p, c.awayBy(halfDigits)) {
		return false
	}
	term, ok := cur.Parent().Node().(*ast.BinaryExpr)
	if !ok || term.Op != token.MUL {
		return false
	}
	diff, ok := ast.Unparen(term.X).(*ast.BinaryExpr)
	if term.X == cur.Node() {
		diff, ok = ast.Unparen(term.Y).(*ast.BinaryExpr)
	}
	if !ok || diff.Op != token.SUB || c.isConst(diff.Y) {
		return false // the coefficient is not n - k
	}
	for _, t := range c.addTerms(sumTop(cur.Parent()).Node().(ast.Expr), 1, nil) {
		m, ok := ast.Unparen(t.e).(*ast.BinaryExpr)
		if !ok || m.Op != token.MUL || m == term {
			continue
		}
		for _, pair := range [2][2]ast.Expr{{m.X, m.Y}, {m.Y, m.X}} {
			if call, isCall := ast.Unparen(pair[1]).(*ast.CallExpr); isCall && same(pair[0], diff.Y) &&
				c.mathFunc(call) == name && same(call.Args[0], p) {
				return true
			}
		}
	}
	return false
}
