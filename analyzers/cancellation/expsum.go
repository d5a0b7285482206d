package cancellation

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/fixes"
)

// expShare reports x/s (or x /= s) where s sums math.Exp(y) over a loop
// and x is one of those exponentials: a softmax share. Once a y exceeds
// 709.78 its exponential and s overflow to +Inf and the share is
// +Inf/+Inf = NaN (the others 0), though every share lies in [0, 1];
// subtracting the largest y before exponentiating keeps every term at
// most 1 and s at least 1. An exponent already shifted (y - m with m not
// a constant), not positive (-|z|) or constant is left alone, as is a
// share under a condition that checks s (math.IsInf(s, 1)).
func (c *checker) expShare(cur inspector.Cursor, x, s ast.Expr, at ast.Node) {
	if _, isIdent := ast.Unparen(s).(*ast.Ident); !isIdent || !c.usesMath("Exp") {
		return // a sum is held in a variable, and needs math.Exp
	}
	fn, ok := enclosingFunc(cur)
	if !ok {
		return
	}
	exp := c.expSummed(fn, s)
	if exp == nil || c.expValue(fn, x) == nil || c.guarded(cur, s, c.overflowChecked) {
		return
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: at.Pos(), End: at.End(), Category: catLogSumExp,
		Message: fmt.Sprintf("share of a sum of exponentials: %s and %s overflow to +Inf once the exponent exceeds %.6g and are 0 once every exponent is below %.6g, so the share is NaN (∞/∞ or 0/0) though it lies in [0, 1]; subtract the largest exponent before exponentiating (math.Exp(y - max))",
			types.ExprString(exp), types.ExprString(ast.Unparen(s)), expOverflow, expUnderflows),
		Related: []analysis.RelatedInformation{{Pos: exp.Pos(), End: exp.End(), Message: "the exponential summed"}},
	})
}

// logExpSum reports math.Log(s) where s sums math.Exp(y) over a loop (a
// log-sum-exp): +Inf once a y exceeds 709.78 and -Inf once every y is
// below -745.13, though the result is finite, about max y; m + log(Σ
// exp(y - m)) with m the largest y keeps it finite.
func (c *checker) logExpSum(cur inspector.Cursor, call *ast.CallExpr) {
	if _, isIdent := ast.Unparen(call.Args[0]).(*ast.Ident); !isIdent || !c.usesMath("Exp") {
		return
	}
	fn, ok := enclosingFunc(cur)
	if !ok {
		return
	}
	exp := c.expSummed(fn, call.Args[0])
	if exp == nil || c.guarded(cur, call.Args[0], c.overflowChecked) {
		return
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catLogSumExp,
		Message: fmt.Sprintf("log of a sum of exponentials: math.Log(%s) summing %s is +Inf once the exponent exceeds %.6g and -Inf once every exponent is below %.6g, though the result is about the largest exponent; add the largest exponent m back after summing math.Exp(y - m)",
			types.ExprString(ast.Unparen(call.Args[0])), types.ExprString(exp), expOverflow, expUnderflows),
		Related: []analysis.RelatedInformation{{Pos: exp.Pos(), End: exp.End(), Message: "the exponential summed"}},
	})
}

// expSummed returns the unshifted math.Exp call that the local variable s
// accumulates in a loop of fn (s += math.Exp(y), or s += e where e holds
// one), or nil.
func (c *checker) expSummed(fn inspector.Cursor, s ast.Expr) *ast.CallExpr {
	id, ok := ast.Unparen(s).(*ast.Ident)
	obj, isVar := c.pass.TypesInfo.Uses[id].(*types.Var)
	if !ok || !isVar || obj.Parent() == obj.Pkg().Scope() {
		return nil
	}
	for a := range fn.Preorder((*ast.AssignStmt)(nil)) {
		as := a.Node().(*ast.AssignStmt)
		if as.Tok != token.ADD_ASSIGN || len(as.Lhs) != 1 || c.target(as.Lhs[0]) != obj || !inLoop(a) {
			continue
		}
		if exp := c.expValue(fn, as.Rhs[0]); exp != nil {
			return exp
		}
	}
	return nil
}

// expValue returns the unshifted math.Exp call e is, or that fn stores
// into the variable or slice e reads (e := math.Exp(y); out[i] =
// math.Exp(y)), or nil.
func (c *checker) expValue(fn inspector.Cursor, e ast.Expr) *ast.CallExpr {
	e = ast.Unparen(e)
	if ix, ok := e.(*ast.IndexExpr); ok {
		e = ast.Unparen(ix.X)
	}
	if call, ok := e.(*ast.CallExpr); ok {
		return c.unshiftedExp(fn, call)
	}
	obj := c.target(e)
	if obj == nil {
		return nil
	}
	for a := range fn.Preorder((*ast.AssignStmt)(nil)) {
		as := a.Node().(*ast.AssignStmt)
		if len(as.Lhs) != len(as.Rhs) || as.Tok != token.ASSIGN && as.Tok != token.DEFINE {
			continue
		}
		for i, l := range as.Lhs {
			if ix, ok := ast.Unparen(l).(*ast.IndexExpr); ok {
				l = ix.X
			}
			if c.target(l) != obj {
				continue
			}
			if call, ok := ast.Unparen(as.Rhs[i]).(*ast.CallExpr); ok {
				if exp := c.unshiftedExp(fn, call); exp != nil {
					return exp
				}
			}
		}
	}
	return nil
}

// unshiftedExp returns call when it is math.Exp(y) with y neither
// constant, nor shifted by a value (y - m), nor known not to be positive.
func (c *checker) unshiftedExp(fn inspector.Cursor, call *ast.CallExpr) *ast.CallExpr {
	if c.mathFunc(call) != "Exp" || c.isConst(call.Args[0]) {
		return nil
	}
	y, _ := c.through(call.Args[0])
	if c.shiftedBefore(fn, y, call.Pos()) {
		return nil
	}
	switch y := ast.Unparen(y).(type) {
	case *ast.BinaryExpr:
		if y.Op == token.SUB && !c.isConst(y.Y) {
			return nil // shifted, as by the largest exponent
		}
	case *ast.UnaryExpr:
		at, found := fn.FindNode(call)
		if found && y.Op == token.SUB && c.nonNegative(at, y.X, 3) {
			return nil // e^-|z| is at most 1
		}
	}
	return call
}

// shiftedBefore reports whether fn, before pos, shifts in place the
// variable or slice y reads by a value (y -= m, lp[i] -= m), as by the
// largest exponent.
func (c *checker) shiftedBefore(fn inspector.Cursor, y ast.Expr, pos token.Pos) bool {
	base := ast.Unparen(y)
	if ix, ok := base.(*ast.IndexExpr); ok {
		base = ast.Unparen(ix.X)
	}
	obj := c.target(base)
	if obj == nil {
		return false
	}
	for a := range fn.Preorder((*ast.AssignStmt)(nil)) {
		as := a.Node().(*ast.AssignStmt)
		if as.Pos() >= pos || as.Tok != token.SUB_ASSIGN || len(as.Lhs) != 1 || c.isConst(as.Rhs[0]) {
			continue
		}
		l := ast.Unparen(as.Lhs[0])
		if ix, ok := l.(*ast.IndexExpr); ok {
			l = ast.Unparen(ix.X)
		}
		if c.target(l) == obj {
			return true
		}
	}
	return false
}
