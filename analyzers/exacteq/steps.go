package exacteq

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
)

// The number of points of a range. int((end-start)/step) + 1 counts the
// points start, start+step, ... up to end, and a range is most often
// given as a whole number of steps (0 to 0.3 by 0.1). The quotient of the
// rounded decimals is then within an ulp of the count of steps, on either
// side: (0.3-0)/0.1 is 2.9999999999999996, and the range gets 3 points,
// not 4. The same count truncated and used as the length of a slice or
// the bound of a loop that builds the points has the same fault. A bin
// index, int((x-lo)/w) used to index a histogram, is not a count of
// points: a sample on a bin edge goes to one side or the other by a
// rounding, which no binning rule can avoid.

// rangeCount reports, in the package's source, a truncation of a
// quotient of floats that counts the steps of a range: plus a whole
// constant, or held in a variable that sizes a slice or bounds a loop. A
// quotient of a single value, x/w + 1, may as well be the next line of a
// grid past a position x, and counts only where it sizes or bounds.
func (c *checker) rangeCount(cur inspector.Cursor, call *ast.CallExpr) {
	span, ok := truncatesQuotient(c.pass.TypesInfo, call)
	if !ok {
		return
	}
	how, points, ok := countUse(c.pass, cur, call)
	if !ok || points && !span {
		return
	}
	example := "a range from 0 to 0.3 by 0.1 counts 2 steps, not 3"
	if points {
		example = "a range from 0 to 0.3 by 0.1 gets 3 points, not 4"
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catSteps,
		Message: fmt.Sprintf("%s truncates a quotient of floats that %s: where the range holds a whole number of steps, the quotient lands within an ulp of it, on either side ((0.3-0)/0.1 is 2.9999999999999996, so %s); round it when the steps are meant to be whole, or add a few ulps of the operands (4*0x1p-52*(|start|+|end|)/step) before truncating",
			fixes.Source(c.pass.Fset, call), how, example),
	})
}

// truncatesQuotient reports whether call truncates toward zero or down
// (int, math.Floor, math.Trunc) a quotient of floats by a step: of a span
// (end-start)/step, the difference of two values that are not constants
// (span true), or of a single value held in a variable or field, end/step;
// none drawn at random. A shifted value, (λ+180)/6, is a position on a
// grid, not a span between two ends.
func truncatesQuotient(info *types.Info, call *ast.CallExpr) (span, ok bool) {
	up, ok := truncation(info, call)
	if !ok || up {
		return false, false
	}
	q, ok := ast.Unparen(call.Args[0]).(*ast.BinaryExpr)
	if !ok || q.Op != token.QUO || !provenance.IsFloat(info.TypeOf(q.Y)) || drawn(info, q) {
		return false, false
	}
	switch x := ast.Unparen(q.X).(type) {
	case *ast.BinaryExpr:
		return true, x.Op == token.SUB && provenance.IsFloat(info.TypeOf(x)) && info.Types[x.X].Value == nil && info.Types[x.Y].Value == nil
	case *ast.Ident, *ast.SelectorExpr:
		return false, provenance.IsFloat(info.TypeOf(x)) && info.Types[x].Value == nil
	}
	return false, false
}

// countUse reports how the truncation call at cur counts points or steps:
// a whole constant added to it (points), or a variable it is assigned to
// that gives the length of a slice or bounds a loop (steps).
func countUse(pass *analysis.Pass, cur inspector.Cursor, call *ast.CallExpr) (how string, points, ok bool) {
	info := pass.TypesInfo
	child := ast.Node(call)
	for cur = cur.Parent(); ; cur = cur.Parent() {
		if _, paren := cur.Node().(*ast.ParenExpr); !paren && !isConversion(info, cur.Node()) {
			break // int(math.Floor(q)) is used where the conversion is
		}
		child = cur.Node()
	}
	switch p := cur.Node().(type) {
	case *ast.BinaryExpr:
		other := p.X
		if p.X == child {
			other = p.Y
		}
		if v, isConst := constFloat(info, other); p.Op == token.ADD && isConst && v >= 1 && v == float64(int(v)) {
			return "counts the points of a range (the steps plus " + fixes.Source(pass.Fset, other) + ")", true, true
		}
	case *ast.AssignStmt:
		if len(p.Lhs) != 1 || len(p.Rhs) != 1 {
			return "", false, false
		}
		id, isIdent := p.Lhs[0].(*ast.Ident)
		fd := enclosingFunc(cur)
		if !isIdent || info.ObjectOf(id) == nil || fd == nil {
			return "", false, false
		}
		how = sizes(info, fd, info.ObjectOf(id))
		return how, false, how != ""
	}
	return "", false, false
}

// sizes tells how fn uses obj as a count: the length of a slice it makes
// or the bound of a loop.
func sizes(info *types.Info, fn ast.Node, obj types.Object) string {
	how := ""
	ast.Inspect(fn, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.CallExpr:
			if b, ok := n.Fun.(*ast.Ident); ok && b.Name == "make" && len(n.Args) >= 2 && isUse(info, n.Args[1], obj) {
				how = "sizes the slice made with " + obj.Name() + " elements"
			}
		case *ast.ForStmt:
			if b, ok := n.Cond.(*ast.BinaryExpr); ok && (b.Op == token.LSS || b.Op == token.LEQ) && isUse(info, b.Y, obj) {
				how = "bounds the loop over " + obj.Name() + " steps"
			}
		}
		return how == ""
	})
	return how
}

// isUse reports whether e is the variable obj.
func isUse(info *types.Info, e ast.Expr, obj types.Object) bool {
	id, ok := ast.Unparen(e).(*ast.Ident)
	return ok && info.Uses[id] == obj
}

// isConversion reports whether n converts one value to an integer type.
func isConversion(info *types.Info, n ast.Node) bool {
	call, ok := n.(*ast.CallExpr)
	return ok && len(call.Args) == 1 && info.Types[call.Fun].IsType() && isInteger(info.Types[call.Fun].Type)
}
