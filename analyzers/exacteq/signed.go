package exacteq

import (
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis/passes/inspect"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/absval"
)

// eitherSign reports whether b, the statement s += t of a sum accumulated
// over a loop, adds terms that the loop itself knows to take either sign:
// beside s it sums their positive or negative part (if t > 0 { pos += t })
// or their absolute values, while s takes every term whatever its sign.
// Such a sum cancels as a difference does: the weights of a stencil that
// sum to 0 as stored (-0.1 around a centre of 0.8) leave a residue of
// 2^-55, not 0. A loop that rejects one sign (if t < 0 { panic(...) })
// keeps one, and its sums are left alone.
func (c *checker) eitherSign(b *ssa.BinOp) bool {
	either, ok := c.signed[b]
	if !ok {
		either = c.readSigns(b)
		c.signed[b] = either
	}
	return either
}

// readSigns is eitherSign, uncached.
func (c *checker) readSigns(b *ssa.BinOp) bool {
	root := c.pass.ResultOf[inspect.Analyzer].(*inspector.Inspector).Root()
	at, ok := root.FindByPos(b.Pos(), b.Pos())
	if !ok {
		return false
	}
	for stmt := range at.Enclosing((*ast.AssignStmt)(nil)) {
		term, ok := added(stmt.Node())
		if !ok || c.underSignTest(stmt, term) {
			return false
		}
		for loop := range stmt.Enclosing((*ast.ForStmt)(nil), (*ast.RangeStmt)(nil)) {
			for other := range loop.Preorder((*ast.AssignStmt)(nil)) {
				t, ok := added(other.Node())
				if ok && other != stmt && (t == term && c.underSignTest(other, term) || c.absOf(other.Node(), term)) {
					return true
				}
			}
			return false
		}
		return false
	}
	return false
}

// added returns the term, as written, of s += t or s -= t.
func added(n ast.Node) (string, bool) {
	as := n.(*ast.AssignStmt)
	if len(as.Rhs) != 1 || as.Tok != token.ADD_ASSIGN && as.Tok != token.SUB_ASSIGN {
		return "", false
	}
	return types.ExprString(ast.Unparen(as.Rhs[0])), true
}

// absOf reports whether the assignment n adds the absolute value of the
// expression written so (mass += math.Abs(t), or through any absolute
// value: see package absval).
func (c *checker) absOf(n ast.Node, written string) bool {
	call, ok := ast.Unparen(n.(*ast.AssignStmt).Rhs[0]).(*ast.CallExpr)
	if !ok {
		return false
	}
	x, ok := absval.Of(c.pass).Arg(c.pass.TypesInfo, c.decls, call)
	return ok && types.ExprString(ast.Unparen(x)) == written
}

// underSignTest reports whether the statement at cur lies in a branch of
// an if whose condition compares the expression written so with 0 by <
// or > (see signTest).
func (c *checker) underSignTest(cur inspector.Cursor, written string) bool {
	for ifc := range cur.Enclosing((*ast.IfStmt)(nil)) {
		found := false
		ast.Inspect(ifc.Node().(*ast.IfStmt).Cond, func(n ast.Node) bool {
			if cmp, ok := n.(*ast.BinaryExpr); ok && !found {
				x, _, ok := c.signTest(cmp)
				found = ok && types.ExprString(ast.Unparen(x)) == written
			}
			return !found
		})
		if found {
			return true
		}
	}
	return false
}
