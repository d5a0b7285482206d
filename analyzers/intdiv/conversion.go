package intdiv

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"regexp"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
)

// convertedQuotient reports T(a/b), a conversion of a truncated integer
// quotient to a float type, when the fraction looks wanted.
func convertedQuotient(pass *analysis.Pass, cur inspector.Cursor, n *ast.BinaryExpr) {
	conv, ok := conversion(pass, cur)
	if !ok || !isInteger(pass.TypesInfo.TypeOf(n)) || isDuration(pass.TypesInfo.TypeOf(n)) {
		return // not converted to a float, or a count of whole time units
	}
	if loopCounter(pass, cur, n.X) {
		return // a loop's counter divided: i/width numbers the rows of a grid, i/2 the pairs
	}
	if isConst(pass, n.Y) && !accumulated(pass, cur, n.X) {
		return // a constant divisor: halving a count, pairs, whole units
	}
	if multipleOf(n.X, n.Y) || roundsOnPurpose(n.X, n.Y) || floorComment(pass, conv) || floored(pass, cur, conv) {
		return // exact by construction, a rounding or ceiling division, or a documented or stated floor
	}
	t := fixes.Source(pass.Fset, conv.Fun)
	divisor := t + "(" + fixes.Source(pass.Fset, n.Y) + ")"
	if isConst(pass, n.Y) {
		divisor = fixes.Operand(pass.Fset, n.Y, token.MUL.Precedence()+1) // an untyped constant converts itself
	}
	text := t + "(" + fixes.Source(pass.Fset, n.X) + ")/" + divisor
	if bindsTighter(cur, conv) {
		text = "(" + text + ")"
	}
	fixes.Report(pass, analysis.Diagnostic{
		Pos: conv.Pos(), End: conv.End(), Category: catConversion,
		Message: fmt.Sprintf("%s converts an integer quotient that Go has already rounded toward zero: the fraction (up to 1, all of the value when |%s| < |%s|) is lost; divide in %s: %s",
			fixes.Source(pass.Fset, conv), types.ExprString(n.X), types.ExprString(n.Y), t, text),
	}, fixes.Judgement("Divide in "+t, fixes.Replace(conv, text)))
}

// bindsTighter reports whether the conversion conv, found from the
// quotient at cur, is an operand of an operator that binds at least as
// tightly as / on its right, so a quotient put in its place needs
// parentheses.
func bindsTighter(cur inspector.Cursor, conv *ast.CallExpr) bool {
	for cur.Node() != conv {
		cur = cur.Parent()
	}
	switch p := cur.Parent().Node().(type) {
	case *ast.BinaryExpr:
		return p.Op.Precedence() >= token.MUL.Precedence() && p.Y == ast.Expr(conv)
	case *ast.UnaryExpr:
		return true
	}
	return false
}

// conversion returns the conversion to a float type whose only argument
// is the expression at cur, parentheses aside.
func conversion(pass *analysis.Pass, cur inspector.Cursor) (*ast.CallExpr, bool) {
	for cur.ParentEdgeKind() == edge.ParenExpr_X {
		cur = cur.Parent()
	}
	call, ok := cur.Parent().Node().(*ast.CallExpr)
	if !ok || cur.ParentEdgeKind() != edge.CallExpr_Args || len(call.Args) != 1 {
		return nil, false
	}
	tv := pass.TypesInfo.Types[call.Fun]
	return call, tv.IsType() && isFloat(tv.Type)
}

func isConst(pass *analysis.Pass, e ast.Expr) bool {
	return pass.TypesInfo.Types[e].Value != nil
}

// isDuration reports whether t is time.Duration.
func isDuration(t types.Type) bool {
	named, ok := t.(*types.Named)
	return ok && named.Obj().Pkg() != nil && named.Obj().Pkg().Path() == "time" && named.Obj().Name() == "Duration"
}

// multipleOf reports whether the dividend is written as a product with the
// divisor as a factor, so the division is exact.
func multipleOf(x, y ast.Expr) bool {
	m, ok := ast.Unparen(x).(*ast.BinaryExpr)
	if !ok || m.Op != token.MUL {
		return false
	}
	ys := types.ExprString(ast.Unparen(y))
	return types.ExprString(ast.Unparen(m.X)) == ys || types.ExprString(ast.Unparen(m.Y)) == ys || multipleOf(m.X, y) || multipleOf(m.Y, y)
}

// roundsOnPurpose reports whether the dividend adds a term built from the
// divisor, as (a + b/2) / b rounds and (a + b - 1) / b takes the ceiling.
func roundsOnPurpose(x, y ast.Expr) bool {
	sum, ok := ast.Unparen(x).(*ast.BinaryExpr)
	if !ok || sum.Op != token.ADD && sum.Op != token.SUB {
		return false
	}
	ys := types.ExprString(ast.Unparen(y))
	found := false
	ast.Inspect(sum.Y, func(n ast.Node) bool {
		if e, ok := n.(ast.Expr); ok && types.ExprString(e) == ys {
			found = true
		}
		return !found
	})
	return found || roundsOnPurpose(sum.X, y)
}

// accumulated reports whether x is a variable that a loop of the enclosing
// function adds to (sum += v, count++): a total, whose quotient by a
// count is a mean.
func accumulated(pass *analysis.Pass, cur inspector.Cursor, x ast.Expr) bool {
	id, ok := ast.Unparen(x).(*ast.Ident)
	obj := pass.TypesInfo.Uses[id]
	if !ok || obj == nil {
		return false
	}
	for fn := range cur.Enclosing((*ast.FuncDecl)(nil), (*ast.FuncLit)(nil)) {
		for s := range fn.Preorder((*ast.AssignStmt)(nil), (*ast.IncDecStmt)(nil)) {
			if addsTo(pass, s.Node(), obj) && inLoop(s) {
				return true
			}
		}
		break
	}
	return false
}

// loopCounter reports whether x is the counter of a loop enclosing cur:
// the variable a for statement's init declares, or a range loop's key.
func loopCounter(pass *analysis.Pass, cur inspector.Cursor, x ast.Expr) bool {
	id, ok := ast.Unparen(x).(*ast.Ident)
	obj := pass.TypesInfo.Uses[id]
	if !ok || obj == nil {
		return false
	}
	for loop := range cur.Enclosing((*ast.ForStmt)(nil), (*ast.RangeStmt)(nil)) {
		var decl ast.Node
		switch l := loop.Node().(type) {
		case *ast.ForStmt:
			decl = l.Init
		case *ast.RangeStmt:
			decl = l.Key
		}
		if decl != nil && within(obj.Pos(), decl) {
			return true
		}
	}
	return false
}

// within reports whether pos lies in n.
func within(pos token.Pos, n ast.Node) bool { return n.Pos() <= pos && pos < n.End() }

// addsTo reports whether statement s is obj += e or obj++.
func addsTo(pass *analysis.Pass, s ast.Node, obj types.Object) bool {
	switch s := s.(type) {
	case *ast.AssignStmt:
		id, ok := s.Lhs[0].(*ast.Ident)
		return ok && s.Tok == token.ADD_ASSIGN && pass.TypesInfo.Uses[id] == obj
	case *ast.IncDecStmt:
		id, ok := s.X.(*ast.Ident)
		return ok && s.Tok == token.INC && pass.TypesInfo.Uses[id] == obj
	}
	return false
}

// inLoop reports whether cur lies in the body of a for or range loop.
func inLoop(cur inspector.Cursor) bool {
	for range cur.Enclosing((*ast.ForStmt)(nil), (*ast.RangeStmt)(nil)) {
		return true
	}
	return false
}

// floored reports whether the conversion conv is the argument of
// math.Floor or math.Trunc: rounding a value the author knows to be whole
// says the whole number is meant (the floor of a whole number is itself).
func floored(pass *analysis.Pass, cur inspector.Cursor, conv *ast.CallExpr) bool {
	for cur.Node() != conv {
		cur = cur.Parent()
	}
	for cur.ParentEdgeKind() == edge.ParenExpr_X {
		cur = cur.Parent()
	}
	call, ok := cur.Parent().Node().(*ast.CallExpr)
	if !ok || cur.ParentEdgeKind() != edge.CallExpr_Args {
		return false
	}
	name := provenance.MathCallee(pass.TypesInfo, call)
	return name == "Floor" || name == "Trunc"
}

// floorWords match a comment that says a truncation is meant.
var floorWords = regexp.MustCompile(`(?i)floor|truncat|integer division|whole|round(ed|s|ing)? down`)

// floorComment reports whether a comment on the line of n or the line
// before says the floor is meant.
func floorComment(pass *analysis.Pass, n ast.Node) bool {
	line := pass.Fset.Position(n.Pos()).Line
	for _, f := range pass.Files {
		if f.FileStart > n.Pos() || n.Pos() > f.FileEnd {
			continue
		}
		for _, g := range f.Comments {
			l := pass.Fset.Position(g.End()).Line
			if (l == line || l == line-1) && floorWords.MatchString(g.Text()) {
				return true
			}
		}
	}
	return false
}
