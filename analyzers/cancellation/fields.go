package cancellation

import (
	"go/ast"
	"go/token"
	"go/types"

	"roundoff/analyzers/internal/constval"
)

// fieldValues returns the values the package gives the field that sel
// selects, by assignment (x.f = e) and in composite literals, and whether
// those are all of them: false for a field of another package, one
// updated in place (x.f += e, x.f++) or whose address is taken.
func (c *checker) fieldValues(sel *ast.SelectorExpr) ([]ast.Expr, bool) {
	s := c.pass.TypesInfo.Selections[sel]
	if s == nil || s.Kind() != types.FieldVal || s.Obj().Pkg() != c.pass.Pkg {
		return nil, false
	}
	if c.fields == nil {
		c.fields = c.scanFields()
	}
	vals, ok := c.fields[s.Obj()]
	return vals, ok && vals != nil
}

// scanFields maps each field of the package to the values assigned to it,
// nil where it is updated other than by plain assignment.
func (c *checker) scanFields() map[types.Object][]ast.Expr {
	m := constval.Fields(c.pass.TypesInfo, c.pass.Files)
	poison := map[types.Object]bool{}
	field := func(e ast.Expr) types.Object {
		sel, ok := ast.Unparen(e).(*ast.SelectorExpr)
		if s := c.pass.TypesInfo.Selections[sel]; ok && s != nil && s.Kind() == types.FieldVal {
			return s.Obj()
		}
		return nil
	}
	for _, f := range c.pass.Files {
		ast.Inspect(f, func(n ast.Node) bool {
			switch n := n.(type) {
			case *ast.AssignStmt:
				for i, lhs := range n.Lhs {
					if obj := field(lhs); obj != nil {
						if (n.Tok == token.ASSIGN || n.Tok == token.DEFINE) && len(n.Lhs) == len(n.Rhs) {
							m[obj] = append(m[obj], n.Rhs[i])
						} else {
							poison[obj] = true
						}
					}
				}
			case *ast.IncDecStmt:
				if obj := field(n.X); obj != nil {
					poison[obj] = true
				}
			case *ast.UnaryExpr:
				if obj := field(n.X); obj != nil && n.Op == token.AND {
					poison[obj] = true
				}
			}
			return true
		})
	}
	for obj := range poison {
		m[obj] = nil
	}
	return m
}
