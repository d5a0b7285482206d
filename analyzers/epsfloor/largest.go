package epsfloor

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/degree"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
)

// aboveLargest reports x > m (or m < x, or >=) where m is the largest
// finite value of x's format: no finite value exceeds it (IEEE 754-2019:
// (2-2^-52)·2^1023 ≈ 1.8e308 for binary64), so the test is x == +Inf, and
// an overflow of a negative value, -Inf, passes it unseen. It is left
// alone when x is non-negative by construction or the same condition also
// tests the other side (|| x < -m, as an IsInf written with comparisons
// does). It reports whether it reported.
func (c *checker) aboveLargest(cur inspector.Cursor, n *ast.BinaryExpr) bool {
	x, _, v, f, ok := c.boundTest(n, token.GTR)
	if !ok || v != maxOf(f) || degree.NonNegative(c.pass.TypesInfo, c.followed(x)) || c.testsBelow(cur, x, -maxOf(f)) {
		return false
	}
	t := c.pass.TypesInfo.TypeOf(x)
	d := analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catOverflow,
		Message: fmt.Sprintf("%s holds only for %s = +Inf: no finite %s exceeds %.2g, so an overflow of a negative value (-Inf) passes unseen; test math.IsInf(%[2]s, 0)",
			fixes.Source(c.pass.Fset, n), fixes.Source(c.pass.Fset, x), f.Name, maxOf(f)),
	}
	var fs []fixes.Fix
	if name, edits, ok := fixes.Import(c.pass.TypesInfo, fileOf(cur), n.Pos(), "math"); ok && n.Op != token.GEQ && n.Op != token.LEQ && types.Identical(t, types.Typ[types.Float64]) {
		text := fmt.Sprintf("%s.IsInf(%s, 0)", name, fixes.Source(c.pass.Fset, x))
		fs = append(fs, fixes.Judgement("Test both infinities: "+text, append(edits, fixes.Replace(n, text))...))
	}
	fixes.Report(c.pass, d, fs...)
	return true
}

// followed returns the initialiser of a variable assigned once, else e.
func (c *checker) followed(e ast.Expr) ast.Expr {
	if id, ok := ast.Unparen(e).(*ast.Ident); ok {
		if init, ok := c.decls[c.pass.TypesInfo.Uses[id]]; ok {
			return init
		}
	}
	return e
}

// testsBelow reports whether the condition (|| and && of tests) around cur
// also compares x (as written) with the constant low, the other side.
func (c *checker) testsBelow(cur inspector.Cursor, x ast.Expr, low float64) bool {
	top := cur
	for p := cur.Parent(); ; p = p.Parent() {
		if b, ok := p.Node().(*ast.BinaryExpr); ok && (b.Op == token.LOR || b.Op == token.LAND) {
			top = p
		} else if _, ok := p.Node().(*ast.ParenExpr); !ok {
			break
		}
	}
	found := false
	ast.Inspect(top.Node(), func(n ast.Node) bool {
		b, ok := n.(*ast.BinaryExpr)
		if !ok || found {
			return !found
		}
		for _, s := range [][2]ast.Expr{{b.X, b.Y}, {b.Y, b.X}} {
			v, ok := constval.Exact(c.pass.TypesInfo, c.decls, s[1])
			found = found || ok && types.ExprString(s[0]) == types.ExprString(x) && provenance.FormatOf(c.pass.TypesInfo.TypeOf(x)).Value(v) == low
		}
		return !found
	})
	return found
}
