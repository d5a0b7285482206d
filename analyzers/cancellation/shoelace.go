package cancellation

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/fixes"
)

// shoelace reports s += (x1+x0)*(y1-y0) and s += x0*y1 - x1*y0 inside a
// loop, where x0, x1 (and y0, y1) are the same coordinate of two points
// (p0.X and p1.X, r[i][0] and r[i+1][0]) taken as they are: the shoelace
// area of a ring. Each term is about |x|·|Δy| (|x|·|y| for the cross
// form) with a rounding of that size, while the sum is twice the area,
// about L² for a ring of size L; a ring at distance X from the origin
// keeps only about log10(L/(u·X)) digits (log10(L²/(u·X²)) for the cross
// form), while coordinates taken relative to the ring's first vertex keep
// them all.
func (c *checker) shoelace(cur inspector.Cursor, as *ast.AssignStmt) {
	if as.Tok != token.ADD_ASSIGN || len(as.Rhs) != 1 || !isFloat64(c.pass.TypesInfo.TypeOf(as.Rhs[0])) || !inLoop(cur) {
		return
	}
	e, ok := ast.Unparen(as.Rhs[0]).(*ast.BinaryExpr)
	if !ok {
		return
	}
	form := ""
	switch {
	case e.Op == token.MUL && c.pair(e.X, token.ADD) && c.pair(e.Y, token.SUB):
		form = "(x1+x0)*(y1-y0)"
	case e.Op == token.SUB && c.crossTerms(e):
		form = "x0*y1 - x1*y0"
	default:
		return
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: as.Pos(), End: as.End(), Category: catSquares,
		Message: fmt.Sprintf("shoelace sum of %s on raw coordinates: each term carries a rounding of its size, |x|·|Δy| or |x|·|y| (u = %.3g), while the sum is twice the area, so a ring of size L at distance X from the origin keeps only about log10(L/(u·X)) digits; subtract the first vertex from every coordinate first",
			form, unitRoundoff),
	})
}

// inLoop reports whether the statement at cur runs in a loop of its
// function.
func inLoop(cur inspector.Cursor) bool {
	for p := range cur.Enclosing((*ast.ForStmt)(nil), (*ast.RangeStmt)(nil), (*ast.FuncDecl)(nil), (*ast.FuncLit)(nil)) {
		switch p.Node().(type) {
		case *ast.ForStmt, *ast.RangeStmt:
			return true
		}
		return false
	}
	return false
}

// pair reports whether e is a op b with a and b the same coordinate of two
// different points.
func (c *checker) pair(e ast.Expr, op token.Token) bool {
	b, ok := ast.Unparen(e).(*ast.BinaryExpr)
	return ok && b.Op == op && c.sameCoordinate(b.X, b.Y)
}

// crossTerms reports whether e is x0*y1 - x1*y0 with x0, x1 one
// coordinate and y0, y1 another of the same two points.
func (c *checker) crossTerms(e *ast.BinaryExpr) bool {
	l, okl := ast.Unparen(e.X).(*ast.BinaryExpr)
	r, okr := ast.Unparen(e.Y).(*ast.BinaryExpr)
	if !okl || !okr || l.Op != token.MUL || r.Op != token.MUL {
		return false
	}
	return c.sameCoordinate(l.X, r.X) && c.sameCoordinate(l.Y, r.Y) &&
		same(c.point(l.X), c.point(r.Y)) && same(c.point(l.Y), c.point(r.X))
}

// sameCoordinate reports whether a and b name the same coordinate (a field
// or a constant index) of two points written differently.
func (c *checker) sameCoordinate(a, b ast.Expr) bool {
	ka, kb := c.coordinate(a), c.coordinate(b)
	return ka != "" && ka == kb && !same(c.point(a), c.point(b))
}

// coordinate returns the field name or constant index e selects, or "".
func (c *checker) coordinate(e ast.Expr) string {
	switch e := ast.Unparen(e).(type) {
	case *ast.SelectorExpr:
		if s := c.pass.TypesInfo.Selections[e]; s != nil && isFloat64(s.Type()) {
			return "." + e.Sel.Name
		}
	case *ast.IndexExpr:
		if v := c.pass.TypesInfo.Types[e.Index].Value; v != nil && v.Kind() == constant.Int && isFloat64(c.pass.TypesInfo.TypeOf(e)) {
			return "[" + v.ExactString() + "]"
		}
	}
	return ""
}

// point returns the expression of the point whose coordinate e selects.
func (c *checker) point(e ast.Expr) ast.Expr {
	switch e := ast.Unparen(e).(type) {
	case *ast.SelectorExpr:
		return e.X
	case *ast.IndexExpr:
		return e.X
	}
	return e
}
