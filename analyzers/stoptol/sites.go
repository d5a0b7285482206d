package stoptol

import (
	"go/ast"
	"go/types"

	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/tolerance"
)

// sites learns the wrappers that hand a tolerance on (a parameter or a
// field passed to a tolerance parameter or stored in a tolerance field),
// until nothing new is learned, so wrappers of wrappers and the fields of
// test tables are known; it exports what it learned and reports the
// constants that reach a tolerance: directly, as a wrapper's default, or
// as the elements of a slice filled with them.
func (c *checker) sites(root inspector.Cursor) {
	if !c.uses.Known() {
		return // nothing to learn, export or report
	}
	info := c.pass.TypesInfo
	known := c.uses.Lookup()
	filter := []ast.Node{(*ast.CallExpr)(nil), (*ast.CompositeLit)(nil), (*ast.AssignStmt)(nil)}
	for changed := true; changed; {
		changed = false
		for cur := range root.Preorder(filter...) {
			tolerance.Sites(info, cur.Node(), known, func(val ast.Expr, u use, _ string) {
				changed = c.uses.Forward(cur, val, u, known) || changed
			})
		}
	}
	c.uses.Export()
	for cur := range root.Preorder(filter...) {
		tolerance.Sites(info, cur.Node(), known, func(val ast.Expr, u use, how string) {
			c.site(val, u, how, nil)
			for _, e := range c.defaults(cur, val) {
				c.site(e, u, "given as the default of "+types.ExprString(val)+", "+how, nil)
			}
			for _, e := range c.fills(cur, val) {
				c.site(e, u, "stored in "+types.ExprString(val)+", "+how, nil)
			}
		})
	}
}

// defaults returns the constants a wrapper gives val, a variable of the
// function around cur, in the defaulting idiom.
func (c *checker) defaults(cur inspector.Cursor, val ast.Expr) []ast.Expr {
	id, ok := ast.Unparen(val).(*ast.Ident)
	if !ok {
		return nil
	}
	v, _ := c.pass.TypesInfo.Uses[id].(*types.Var)
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		return c.uses.DefaultsOf(fd.Node().(*ast.FuncDecl))[v]
	}
	return nil
}

// fills returns the constants a slice is filled with, when val is an
// element of it (tols[i]) or the value ranged over it (for _, tol :=
// range tols): the elements of its literal and the constants stored in it.
func (c *checker) fills(cur inspector.Cursor, val ast.Expr) []ast.Expr {
	info := c.pass.TypesInfo
	var slice types.Object
	switch v := ast.Unparen(val).(type) {
	case *ast.IndexExpr:
		if id, ok := ast.Unparen(v.X).(*ast.Ident); ok {
			slice = info.Uses[id]
		}
	case *ast.Ident:
		slice = c.rangedOver(cur, info.Uses[v])
	}
	if slice == nil {
		return nil
	}
	var out []ast.Expr
	if lit, ok := ast.Unparen(c.decls[slice]).(*ast.CompositeLit); ok {
		out = append(out, lit.Elts...)
	}
	ast.Inspect(enclosingBody(cur), func(n ast.Node) bool {
		if as, ok := n.(*ast.AssignStmt); ok && len(as.Lhs) == len(as.Rhs) {
			for i, lhs := range as.Lhs {
				if ix, ok := ast.Unparen(lhs).(*ast.IndexExpr); ok && tolerance.VarOf(info, ix.X) == slice {
					out = append(out, as.Rhs[i])
				}
			}
		}
		return true
	})
	return out
}

// rangedOver returns the slice that v ranges over, when v is the value of
// a range statement around cur.
func (c *checker) rangedOver(cur inspector.Cursor, v types.Object) types.Object {
	for rs := range cur.Enclosing((*ast.RangeStmt)(nil)) {
		r := rs.Node().(*ast.RangeStmt)
		if id, ok := r.Value.(*ast.Ident); ok && c.pass.TypesInfo.Defs[id] == v && v != nil {
			if x, ok := ast.Unparen(r.X).(*ast.Ident); ok {
				return c.pass.TypesInfo.Uses[x]
			}
		}
	}
	return nil
}
