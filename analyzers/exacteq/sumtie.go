package exacteq

import (
	"fmt"
	"go/ast"
	"go/token"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
)

// sumTie reports an equality test (x == y, or x-y == 0) chained by else
// to an ordered test of the same pair (if x < y {...} else if x == y
// {...}) when one of them is a fresh sum of two variable terms: the
// candidate cost of a relaxation against the best found so far. Sums
// equal in exact arithmetic but added in another order (0.1+0.2 against
// 0.3, a path a-b-c against a-c) differ by an ulp, so a tie lands in the
// ordered branch or in neither, and the tie branch's own work (recording
// an equally good alternative) is skipped. It reports whether it
// reported.
func (c *checker) sumTie(cur inspector.Cursor, n *ast.BinaryExpr, op token.Token, x, y operand) bool {
	a, b, diff := x, y, false
	if c.isZero(y) || c.isZero(x) {
		d, ok := differenceOf(x, y, c.isZero(y))
		if !ok {
			return false
		}
		a, b, diff = d[0], d[1], true
	}
	if !freshSum(a.val) && !freshSum(b.val) || !c.orderedSibling(cur, a.expr, b.expr) {
		return false
	}
	t := c.pass.TypesInfo.TypeOf(a.expr)
	f := provenance.FormatOf(t)
	d := analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catTie,
		Message: fmt.Sprintf("exact %s decides a tie of %s and %s next to an ordered test of the same pair: sums equal in exact arithmetic but added in another order differ by an ulp (0.1+0.2 is 0.30000000000000004), so the tie falls to the ordered branch or to neither; compare within a tolerance such as %s relative",
			op, fixes.Source(c.pass.Fset, a.expr), fixes.Source(c.pass.Fset, b.expr), rtol(f)),
	}
	var fs []fixes.Fix
	if !diff {
		fs = c.toleranceFix(cur, n, x, y, t)
	}
	fixes.Report(c.pass, d, fs...)
	return true
}

// differenceOf returns the operands of the difference that the zero test
// x == 0 (xZero false: 0 == y) compares with zero.
func differenceOf(x, y operand, yZero bool) ([2]operand, bool) {
	o := x
	if !yZero {
		o = y
	}
	e, ok := ast.Unparen(o.expr).(*ast.BinaryExpr)
	v, ok2 := provenance.Strip(o.val).(*ssa.BinOp)
	if !ok || !ok2 || e.Op != token.SUB || v.Op != token.SUB {
		return [2]operand{}, false
	}
	return [2]operand{{e.X, v.X}, {e.Y, v.Y}}, true
}

// freshSum reports whether v is a float sum of two terms neither of which
// is a constant: a cost built along one path (d[u] + w), not a counter
// stepped by a constant.
func freshSum(v ssa.Value) bool {
	b, ok := provenance.Strip(v).(*ssa.BinOp)
	if !ok || b.Op != token.ADD || !provenance.IsFloat(b.Type()) {
		return false
	}
	_, cx := provenance.Strip(b.X).(*ssa.Const)
	_, cy := provenance.Strip(b.Y).(*ssa.Const)
	return !cx && !cy
}

// orderedSibling reports whether the if statement whose condition is cur
// follows else of, or is followed by else with, an if statement whose
// condition is a strict ordered comparison of a and b.
func (c *checker) orderedSibling(cur inspector.Cursor, a, b ast.Expr) bool {
	if cur.ParentEdgeKind() != edge.IfStmt_Cond {
		return false
	}
	ifs := cur.Parent()
	var near []ast.Expr
	if ifs.ParentEdgeKind() == edge.IfStmt_Else {
		near = append(near, ifs.Parent().Node().(*ast.IfStmt).Cond)
	}
	if next, ok := ifs.Node().(*ast.IfStmt).Else.(*ast.IfStmt); ok {
		near = append(near, next.Cond)
	}
	for _, e := range near {
		o, ok := ast.Unparen(e).(*ast.BinaryExpr)
		if ok && (o.Op == token.LSS || o.Op == token.GTR) &&
			(sameExpr(o.X, a) && sameExpr(o.Y, b) || sameExpr(o.X, b) && sameExpr(o.Y, a)) {
			return true
		}
	}
	return false
}
