package cancellation

import (
	"go/ast"
	"go/token"
	"go/types"
	"slices"
	"strings"

	"golang.org/x/tools/go/types/typeutil"
)

// dot is a dot product p·q read from the source: kind names the product
// (the method computing it, or the fields multiplied pairwise), p and q
// the two vectors, in source order.
type dot struct {
	kind, p, q string
}

// quadric reports whether u ± math.Sqrt(u*u - k·a·c) is a ray meeting a
// quadric: c = o·o - w (o·o a sum of squares, w anything), u = k'·d·o and
// a = d·d (or left out, a unit d), all in one dot product over the same
// fields. By Cauchy–Schwarz (d·o)² ≤ (d·d)(o·o), so u²/a is at most the
// size of o·o, the larger term of c: c, a difference, is already off by
// about u·o·o (u the unit roundoff) whichever way the roots are formed,
// and the near root t ≈ -c/(2u) carries that error through c. The
// cancellation in -u + √(u² - a·c) adds an error of the same order, so
// the stable form gains at most a small factor.
func (c *checker) quadric(u, root ast.Expr) bool {
	b, ok := c.readDot(u)
	if !ok || b.p == b.q {
		return false
	}
	factors := c.factors(root)
	for i, f := range factors {
		e, _ := c.through(f)
		diff, ok := e.(*ast.BinaryExpr)
		if !ok || diff.Op != token.SUB {
			continue
		}
		o, ok := c.readDot(diff.X)
		if !ok || o.kind != b.kind || o.p != o.q || o.p != b.p && o.p != b.q {
			continue
		}
		d := b.p
		if d == o.p {
			d = b.q
		}
		rest := slices.Delete(slices.Clone(factors), i, i+1)
		if len(rest) == 0 {
			return true // t² + 2(d·o)t + c: a unit direction
		}
		a, ok := c.readDot(rest[0])
		return len(rest) == 1 && ok && a.kind == b.kind && a.p == d && a.q == d
	}
	return false
}

// factors returns the factors of a product that are not constants.
func (c *checker) factors(e ast.Expr) []ast.Expr {
	e = ast.Unparen(e)
	if c.isConst(e) {
		return nil
	}
	if m, ok := e.(*ast.BinaryExpr); ok && m.Op == token.MUL {
		return append(c.factors(m.X), c.factors(m.Y)...)
	}
	return []ast.Expr{e}
}

// readDot reads e, through variables and constant factors, as a dot
// product: a call p.M(q) of a method of the package, or Dot(p, q) of a
// function of it, that returns a sum of products, or a sum of products p.F*q.F of the same fields (each term
// perhaps scaled by a constant).
func (c *checker) readDot(e ast.Expr) (dot, bool) {
	e, _ = c.through(e)
	fs := c.factors(e)
	if len(fs) != 1 {
		return dot{}, false
	}
	e = fs[0]
	if call, ok := e.(*ast.CallExpr); ok {
		fn, isFunc := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func)
		if !isFunc || !c.productSum(c.returned(call)) {
			return dot{}, false
		}
		sel, isSel := call.Fun.(*ast.SelectorExpr)
		switch {
		case fn.Signature().Recv() != nil && isSel && len(call.Args) == 1:
			return dot{fn.FullName(), types.ExprString(sel.X), types.ExprString(call.Args[0])}, true
		case fn.Signature().Recv() == nil && len(call.Args) == 2:
			return dot{fn.FullName(), types.ExprString(call.Args[0]), types.ExprString(call.Args[1])}, true
		}
		return dot{}, false
	}
	var fields []string
	var p, q string
	for _, t := range c.sumTerms(e) {
		pair := c.factors(t)
		if len(pair) != 2 {
			return dot{}, false
		}
		x, okx := ast.Unparen(pair[0]).(*ast.SelectorExpr)
		y, oky := ast.Unparen(pair[1]).(*ast.SelectorExpr)
		if !okx || !oky || x.Sel.Name != y.Sel.Name {
			return dot{}, false
		}
		tp, tq := types.ExprString(x.X), types.ExprString(y.X)
		if tp > tq {
			tp, tq = tq, tp // d.X*o.X and o.Y*d.Y are terms of one product
		}
		if p == "" {
			p, q = tp, tq
		}
		if tp != p || tq != q {
			return dot{}, false
		}
		fields = append(fields, x.Sel.Name)
	}
	slices.Sort(fields)
	return dot{"fields " + strings.Join(fields, ","), p, q}, len(fields) > 1
}

// sumTerms returns the terms of e when all enter a sum with a plus sign
// (a difference is no dot product of a definite form), else nil.
func (c *checker) sumTerms(e ast.Expr) []ast.Expr {
	var out []ast.Expr
	for _, t := range c.addTerms(e, 1, nil) {
		if t.sign < 0 {
			return nil
		}
		out = append(out, t.e)
	}
	return out
}

// productSum reports whether e is a sum of products.
func (c *checker) productSum(e ast.Expr) bool {
	if e == nil {
		return false
	}
	ts := c.sumTerms(e)
	if len(ts) == 0 {
		return false
	}
	for _, t := range ts {
		if len(c.factors(t)) != 2 {
			return false
		}
	}
	return true
}
