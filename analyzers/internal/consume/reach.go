package consume

import (
	"go/ast"
	"go/token"
	"go/types"
	"iter"

	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/constval"
)

// Reached returns the uses of the local variable v that the assignment
// statement at stmt may reach: those in the statements after it, up to
// one that assigns v again in the same block, then in the statements
// after each enclosing one, and all of an enclosing loop, whose next
// iteration reaches back. It is a syntactic over-approximation (a branch
// that leaves, a goto, are not followed), which suits a question that
// any one use can answer.
func Reached(info *types.Info, stmt inspector.Cursor, v *types.Var) iter.Seq[inspector.Cursor] {
	return func(yield func(inspector.Cursor) bool) {
		for cur := stmt; ; cur = cur.Parent() {
			switch cur.Parent().Node().(type) {
			case nil, *ast.FuncDecl, *ast.FuncLit:
				return
			case *ast.ForStmt, *ast.RangeStmt:
				if !usesIn(info, cur.Parent(), v, yield) {
					return // the next iteration reaches back into the whole loop
				}
			case *ast.IfStmt, *ast.SwitchStmt:
				if (cur.ParentEdgeKind() == edge.IfStmt_Init || cur.ParentEdgeKind() == edge.SwitchStmt_Init) && !usesIn(info, cur.Parent(), v, yield) {
					return // an init statement reaches its whole statement
				}
			}
			if !isStmtList(cur.ParentEdgeKind()) {
				continue
			}
			for s, ok := cur.NextSibling(); ok; s, ok = s.NextSibling() {
				if !usesIn(info, s, v, yield) {
					return
				}
				if rhs, assigns := assignment(info, s, v); assigns && rhs.Valid() {
					return // assigned again: later uses see the new value
				}
			}
		}
	}
}

// usesIn yields the uses of v within the node at cur (not the places it
// is assigned), and reports whether to go on.
func usesIn(info *types.Info, cur inspector.Cursor, v *types.Var, yield func(inspector.Cursor) bool) bool {
	for id := range cur.Preorder((*ast.Ident)(nil)) {
		if info.Uses[id.Node().(*ast.Ident)] != v {
			continue
		}
		if as, ok := id.Parent().Node().(*ast.AssignStmt); ok && id.ParentEdgeKind() == edge.AssignStmt_Lhs && (as.Tok == token.ASSIGN || as.Tok == token.DEFINE) {
			continue
		}
		if !yield(id) {
			return false
		}
	}
	return true
}

// Reaching returns the value last assigned to the local variable v before
// the code at cur in straight-line code: the nearest statement before it,
// in its block or an enclosing one, that assigns v, when that is a single
// assignment (v = e, v := e, var v = e). It gives up where something else
// may have set v last: a loop around cur that assigns v (its previous
// pass), the init statement of an if or switch around cur that assigns
// it, a label (a jump may arrive), a statement that assigns v in a nested
// block, and a v whose address is taken or that a closure assigns.
func Reaching(info *types.Info, cur inspector.Cursor, v *types.Var) (inspector.Cursor, bool) {
	if escapes(info, cur, v) {
		return inspector.Cursor{}, false
	}
	for ; ; cur = cur.Parent() {
		switch p := cur.Parent().Node().(type) {
		case nil, *ast.FuncDecl, *ast.FuncLit, *ast.LabeledStmt:
			return inspector.Cursor{}, false
		case *ast.ForStmt, *ast.RangeStmt:
			if assignsWithin(info, p, v) {
				return inspector.Cursor{}, false
			}
		case *ast.IfStmt:
			if p.Init != nil && assignsWithin(info, p.Init, v) {
				return inspector.Cursor{}, false
			}
		case *ast.SwitchStmt:
			if p.Init != nil && assignsWithin(info, p.Init, v) {
				return inspector.Cursor{}, false
			}
		case *ast.TypeSwitchStmt:
			if p.Init != nil && assignsWithin(info, p.Init, v) {
				return inspector.Cursor{}, false
			}
		}
		if !isStmtList(cur.ParentEdgeKind()) {
			continue
		}
		for s, ok := cur.PrevSibling(); ok; s, ok = s.PrevSibling() {
			if _, isLabel := s.Node().(*ast.LabeledStmt); isLabel {
				return inspector.Cursor{}, false
			}
			if rhs, assigns := assignment(info, s, v); assigns {
				return rhs, rhs.Valid()
			}
		}
	}
}

// escapes reports whether the function around cur takes v's address
// (explicitly, or by calling a pointer method on it) or assigns v inside a
// function literal, any of which can change v between statements that do
// not assign it.
func escapes(info *types.Info, cur inspector.Cursor, v *types.Var) bool {
	var body ast.Node
	for f := range cur.Enclosing((*ast.FuncDecl)(nil), (*ast.FuncLit)(nil)) {
		body = f.Node()
		break
	}
	if body == nil {
		return true
	}
	is := func(e ast.Expr) bool {
		id, ok := ast.Unparen(e).(*ast.Ident)
		return ok && info.ObjectOf(id) == v
	}
	found := false
	ast.Inspect(body, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.FuncLit:
			found = found || n != body && assignsWithin(info, n.Body, v)
		case *ast.UnaryExpr:
			found = found || n.Op == token.AND && is(n.X)
		case *ast.SelectorExpr:
			found = found || is(n.X) && constval.PointerMethod(info, n) // v.Grow() takes &v
		}
		return !found
	})
	return found
}

// assignment reports whether the statement at s assigns v, and returns
// the value when it does so as a single assignment at its top level.
func assignment(info *types.Info, s inspector.Cursor, v *types.Var) (inspector.Cursor, bool) {
	switch n := s.Node().(type) {
	case *ast.AssignStmt:
		for i, lhs := range n.Lhs {
			if id, ok := lhs.(*ast.Ident); ok && info.ObjectOf(id) == v {
				if (n.Tok == token.ASSIGN || n.Tok == token.DEFINE) && len(n.Lhs) == len(n.Rhs) {
					return s.ChildAt(edge.AssignStmt_Rhs, i), true
				}
				return inspector.Cursor{}, true
			}
		}
	case *ast.DeclStmt:
		if gd, ok := n.Decl.(*ast.GenDecl); ok && len(gd.Specs) == 1 {
			if vs, ok := gd.Specs[0].(*ast.ValueSpec); ok && len(vs.Names) == len(vs.Values) {
				for i, name := range vs.Names {
					if info.Defs[name] == v {
						spec := s.ChildAt(edge.DeclStmt_Decl, -1).ChildAt(edge.GenDecl_Specs, 0)
						return spec.ChildAt(edge.ValueSpec_Values, i), true
					}
				}
			}
		}
	}
	return inspector.Cursor{}, assignsWithin(info, s.Node(), v)
}

// assignsWithin reports whether v is assigned, incremented or has its
// address taken anywhere within n.
func assignsWithin(info *types.Info, n ast.Node, v *types.Var) bool {
	found := false
	is := func(e ast.Expr) bool {
		id, ok := ast.Unparen(e).(*ast.Ident)
		return ok && info.ObjectOf(id) == v
	}
	ast.Inspect(n, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.AssignStmt:
			for _, lhs := range n.Lhs {
				found = found || is(lhs)
			}
		case *ast.IncDecStmt:
			found = found || is(n.X)
		case *ast.UnaryExpr:
			found = found || n.Op == token.AND && is(n.X)
		case *ast.RangeStmt:
			found = found || n.Key != nil && is(n.Key) || n.Value != nil && is(n.Value)
		}
		return !found
	})
	return found
}

// isStmtList reports whether e is an edge to a statement of a list that
// runs in order.
func isStmtList(e edge.Kind) bool {
	return e == edge.BlockStmt_List || e == edge.CaseClause_Body || e == edge.CommClause_Body
}
