package epsfloor

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/tolerance"
	"roundoff/internal/numeric"
)

// iterate reports |x| < tol below eps where x is the iterate of an
// enclosing loop (updated from itself) rather than its change: the test
// holds only for a root within tol of zero.
func (c *checker) iterate(cur inspector.Cursor, t tolerance.Test, f numeric.Format, tol float64) {
	if tolerance.Judge(tolerance.Absolute, tol, f, 0) != tolerance.BelowEpsilon {
		return // a sane size, or an underflow guard
	}
	id, ok := ast.Unparen(t.A).(*ast.Ident)
	if !ok {
		return
	}
	v, ok := c.pass.TypesInfo.Uses[id].(*types.Var)
	if !ok || !updatedFromItself(c.pass.TypesInfo, cur, v) || floored(c.pass.TypesInfo, cur, v) {
		return
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: t.Cmp.Pos(), End: t.Cmp.End(), Category: catIterate,
		Message: fmt.Sprintf("tolerance %s tests the iterate %s itself, not its change: |%[2]s| < %.3g holds only for a root within %.3g of zero, and below %s epsilon (%.3g) nothing else can pass; test the step between iterates",
			fixes.Source(c.pass.Fset, t.Tol), id.Name, tol, tol, f.Name, f.Eps),
	})
}

// floored reports whether the test at cur is the condition of an if
// statement whose body assigns v (the modified Lentz method's
// if math.Abs(d) < tiny { d = tiny }): it keeps the iterate off zero
// before a division and ends nothing, so it is no convergence test.
func floored(info *types.Info, cur inspector.Cursor, v *types.Var) bool {
	for cur.ParentEdgeKind() == edge.ParenExpr_X {
		cur = cur.Parent()
	}
	ifs, ok := cur.Parent().Node().(*ast.IfStmt)
	if !ok || cur.ParentEdgeKind() != edge.IfStmt_Cond {
		return false
	}
	for _, st := range ifs.Body.List {
		if as, ok := st.(*ast.AssignStmt); ok && slices.ContainsFunc(as.Lhs, func(l ast.Expr) bool {
			id, isID := ast.Unparen(l).(*ast.Ident)
			return isID && info.ObjectOf(id) == v
		}) {
			return true
		}
	}
	return false
}

// updatedFromItself reports whether a loop enclosing cur assigns v from an
// expression that mentions v (x = x - f/df, x -= step).
func updatedFromItself(info *types.Info, cur inspector.Cursor, v *types.Var) bool {
	for loop := range cur.Enclosing((*ast.ForStmt)(nil), (*ast.RangeStmt)(nil)) {
		found := false
		ast.Inspect(loop.Node(), func(n ast.Node) bool {
			as, ok := n.(*ast.AssignStmt)
			if !ok || found {
				return !found
			}
			for i, lhs := range as.Lhs {
				if id, ok := lhs.(*ast.Ident); !ok || info.ObjectOf(id) != v {
					continue
				}
				found = as.Tok != token.ASSIGN && as.Tok != token.DEFINE || i < len(as.Rhs) && mentions(info, as.Rhs[i], v)
			}
			return !found
		})
		if found {
			return true
		}
	}
	return false
}

// mentions reports whether e refers to v.
func mentions(info *types.Info, e ast.Expr, v *types.Var) bool {
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		if id, ok := n.(*ast.Ident); ok && info.Uses[id] == v {
			found = true
		}
		return !found
	})
	return found
}
