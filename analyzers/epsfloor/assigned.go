package epsfloor

import (
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/constval"
)

// assignedBefore returns the constant a local variable e holds at cur:
// the value of its last assignment before cur in straight-line code of the
// same function, when that assignment gives it a constant (truth =
// -1000.548 before a test of truth; the value is then exact, not a guess).
// Loops around cur that assign the variable, other assignments in between,
// closures that assign it and its address taken all make the value unknown.
func (c *checker) assignedBefore(cur inspector.Cursor, e ast.Expr) (constant.Value, bool) {
	info := c.pass.TypesInfo
	id, ok := ast.Unparen(e).(*ast.Ident)
	if !ok {
		return nil, false
	}
	v, _ := info.Uses[id].(*types.Var)
	if v == nil || v.Pkg() == nil || v.Parent() == v.Pkg().Scope() || escapes(info, innermostFunc(cur), v) {
		return nil, false
	}
	vars := map[types.Object]bool{v: true}
	for ; cur.Valid(); cur = cur.Parent() {
		switch n := cur.Node().(type) {
		case *ast.FuncDecl, *ast.FuncLit, *ast.CaseClause, *ast.CommClause:
			return nil, false // the function's start, or a branch whose earlier statements are not scanned
		case *ast.ForStmt, *ast.RangeStmt, *ast.IfStmt, *ast.SwitchStmt, *ast.TypeSwitchStmt:
			if h := headerOf(n); h != nil && assigns(info, h, vars) {
				return nil, false
			}
		}
		k, i := cur.ParentEdge()
		if k != edge.BlockStmt_List {
			continue
		}
		list := cur.Parent().Node().(*ast.BlockStmt).List
		for j := i - 1; j >= 0; j-- {
			if assigns(info, list[j], vars) {
				return c.constantGiven(list[j], v)
			}
		}
	}
	return nil, false
}

// headerOf returns what of a compound statement runs around its body on
// every pass: a loop whole (its body runs again after cur), or the init
// statement of an if or switch.
func headerOf(n ast.Node) ast.Stmt {
	switch n := n.(type) {
	case *ast.ForStmt, *ast.RangeStmt:
		return n.(ast.Stmt)
	case *ast.IfStmt:
		return n.Init
	case *ast.SwitchStmt:
		return n.Init
	case *ast.TypeSwitchStmt:
		return n.Init
	}
	return nil
}

// constantGiven returns the constant that statement s gives v, when s is
// a plain assignment or declaration of v with a constant.
func (c *checker) constantGiven(s ast.Stmt, v *types.Var) (constant.Value, bool) {
	var lhs []*ast.Ident
	var rhs []ast.Expr
	switch s := s.(type) {
	case *ast.AssignStmt:
		if s.Tok != token.ASSIGN && s.Tok != token.DEFINE {
			return nil, false
		}
		for _, l := range s.Lhs {
			id, _ := l.(*ast.Ident)
			lhs = append(lhs, id)
		}
		rhs = s.Rhs
	case *ast.DeclStmt:
		gen, ok := s.Decl.(*ast.GenDecl)
		if !ok || len(gen.Specs) != 1 {
			return nil, false
		}
		spec, ok := gen.Specs[0].(*ast.ValueSpec)
		if !ok {
			return nil, false
		}
		lhs, rhs = spec.Names, spec.Values
	}
	if len(lhs) != len(rhs) {
		return nil, false
	}
	for i, id := range lhs {
		if id != nil && c.pass.TypesInfo.ObjectOf(id) == v {
			val, ok := constval.Exact(c.pass.TypesInfo, c.decls, rhs[i])
			return val, ok && val.Kind() != constant.Complex
		}
	}
	return nil, false
}

// escapes reports whether body takes v's address (explicitly, or by
// calling a pointer method on it) or assigns v inside a function literal,
// any of which can change v between statements that do not assign it.
func escapes(info *types.Info, body ast.Node, v *types.Var) bool {
	vars := map[types.Object]bool{v: true}
	found := false
	ast.Inspect(body, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.FuncLit:
			found = found || n != body && assigns(info, n.Body, vars)
		case *ast.UnaryExpr:
			found = found || n.Op == token.AND && isVar(info, n.X, v)
		case *ast.SelectorExpr:
			found = found || isVar(info, n.X, v) && constval.PointerMethod(info, n) // v.Grow() takes &v
		}
		return !found
	})
	return found
}
