package exacteq

import (
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/provenance"
)

// zeroPartner reports whether x == y is joined by && to an exact zero test
// of x or y (x != y by || to one of x != 0): under y == 0, x == y holds
// exactly when x == 0, so the pair asks whether both are zero, a test
// rounding cannot mislead (b != a || a != 0 before math.Atan2(b, a)).
func (c *checker) zeroPartner(cur inspector.Cursor, n *ast.BinaryExpr) bool {
	join := map[token.Token]token.Token{token.EQL: token.LAND, token.NEQ: token.LOR}[n.Op]
	found := false
	ast.Inspect(chainTop(cur, join), func(m ast.Node) bool {
		b, ok := m.(*ast.BinaryExpr)
		switch {
		case found || !ok:
			return false
		case b.Op == join:
			return true
		case b != n && b.Op == n.Op:
			found = c.zeroTestOf(b, n.X) || c.zeroTestOf(b, n.Y)
		}
		return false
	})
	return found
}

// chainTop returns the outermost expression of the chain of join
// operations (and parentheses) around cur.
func chainTop(cur inspector.Cursor, join token.Token) ast.Node {
	for {
		switch cur.ParentEdgeKind() {
		case edge.ParenExpr_X:
		case edge.BinaryExpr_X, edge.BinaryExpr_Y:
			if cur.Parent().Node().(*ast.BinaryExpr).Op != join {
				return cur.Node()
			}
		default:
			return cur.Node()
		}
		cur = cur.Parent()
	}
}

// zeroTestOf reports whether b compares e with exact zero.
func (c *checker) zeroTestOf(b *ast.BinaryExpr, e ast.Expr) bool {
	for _, pair := range [][2]ast.Expr{{b.X, b.Y}, {b.Y, b.X}} {
		if sameExpr(pair[0], e) && c.isZero(operand{expr: pair[1]}) {
			return true
		}
	}
	return false
}

// sameExpr reports whether a and b are written alike.
func sameExpr(a, b ast.Expr) bool {
	return types.ExprString(ast.Unparen(a)) == types.ExprString(ast.Unparen(b))
}

// tieBreak reports whether x == y decides a tie in an ordering: in a
// lexicographic choice x < y || x == y && k (or with >), in a three-way
// comparator (a function of two values of one type, or a method and a
// value of its receiver's type, returning an int) whose branch on the
// equality returns 0, or where the equality swaps in secondary keys
// before the two are ordered (see rekeyed). A tie missed by an ulp then orders the two
// values by the primary key, whose values differ by that ulp: a
// consistent order, which departs from exact arithmetic only between
// values that agree to rounding.
func (c *checker) tieBreak(cur inspector.Cursor, n *ast.BinaryExpr) bool {
	return n.Op == token.EQL && (c.lexicographic(cur, n) || c.comparatorTie(cur) || rekeyed(cur, n))
}

// rekeyed reports whether x == y is the condition of an if statement whose
// body gives x and y new values (secondary keys) before the statement
// after it orders them (if y < x): if x == y { x, y = p(a), p(b) }.
func rekeyed(cur inspector.Cursor, n *ast.BinaryExpr) bool {
	ifs, ok := cur.Parent().Node().(*ast.IfStmt)
	if !ok || cur.ParentEdgeKind() != edge.IfStmt_Cond || ifs.Init != nil || ifs.Else != nil {
		return false
	}
	set := map[string]bool{}
	for _, st := range ifs.Body.List {
		if as, ok := st.(*ast.AssignStmt); ok && as.Tok == token.ASSIGN {
			for _, l := range as.Lhs {
				set[types.ExprString(l)] = true
			}
		}
	}
	next, ok := cur.Parent().NextSibling()
	if !ok || !set[types.ExprString(ast.Unparen(n.X))] || !set[types.ExprString(ast.Unparen(n.Y))] {
		return false
	}
	after, ok := next.Node().(*ast.IfStmt)
	if !ok {
		return false
	}
	ord, ok := ast.Unparen(after.Cond).(*ast.BinaryExpr)
	return ok && provenance.Ordered(ord.Op) && (sameExpr(ord.X, n.X) && sameExpr(ord.Y, n.Y) || sameExpr(ord.X, n.Y) && sameExpr(ord.Y, n.X))
}

// lexicographic reports whether n is the tie clause of x < y || x == y && k.
func (c *checker) lexicographic(cur inspector.Cursor, n *ast.BinaryExpr) bool {
	for cur.ParentEdgeKind() == edge.ParenExpr_X || cur.ParentEdgeKind() == edge.BinaryExpr_X && cur.Parent().Node().(*ast.BinaryExpr).Op == token.LAND {
		cur = cur.Parent()
	}
	or, ok := cur.Parent().Node().(*ast.BinaryExpr)
	if !ok || or.Op != token.LOR || cur.ParentEdgeKind() != edge.BinaryExpr_Y && cur.ParentEdgeKind() != edge.BinaryExpr_X {
		return false
	}
	other := or.X
	if cur.ParentEdgeKind() == edge.BinaryExpr_X {
		other = or.Y
	}
	ord, ok := ast.Unparen(other).(*ast.BinaryExpr)
	if !ok || ord.Op != token.LSS && ord.Op != token.GTR {
		return false
	}
	return sameExpr(ord.X, n.X) && sameExpr(ord.Y, n.Y) || sameExpr(ord.X, n.Y) && sameExpr(ord.Y, n.X)
}

// comparatorTie reports whether cur is the condition (or a conjunct of
// it) of an if statement in a three-way comparator whose body returns 0.
func (c *checker) comparatorTie(cur inspector.Cursor) bool {
	for cur.ParentEdgeKind() == edge.ParenExpr_X || (cur.ParentEdgeKind() == edge.BinaryExpr_X || cur.ParentEdgeKind() == edge.BinaryExpr_Y) && cur.Parent().Node().(*ast.BinaryExpr).Op == token.LAND {
		cur = cur.Parent()
	}
	ifs, ok := cur.Parent().Node().(*ast.IfStmt)
	if !ok || cur.ParentEdgeKind() != edge.IfStmt_Cond || len(ifs.Body.List) != 1 {
		return false
	}
	ret, ok := ifs.Body.List[0].(*ast.ReturnStmt)
	if !ok || len(ret.Results) != 1 || !c.isZero(operand{expr: ret.Results[0]}) {
		return false
	}
	for fn := range cur.Enclosing((*ast.FuncDecl)(nil), (*ast.FuncLit)(nil)) {
		return threeWay(c.pass.TypesInfo, fn.Node())
	}
	return false
}

// threeWay reports whether fn compares two values of one type and returns
// an int: func(a, b T) int, or func (a T) m(b T) int.
func threeWay(info *types.Info, fn ast.Node) bool {
	var sig *types.Signature
	switch fn := fn.(type) {
	case *ast.FuncDecl:
		f, _ := info.Defs[fn.Name].(*types.Func)
		if f == nil {
			return false
		}
		sig = f.Signature()
	case *ast.FuncLit:
		sig, _ = info.TypeOf(fn).(*types.Signature)
	}
	if sig == nil || sig.Results().Len() != 1 || !types.Identical(sig.Results().At(0).Type(), types.Typ[types.Int]) {
		return false
	}
	var ts []types.Type
	if r := sig.Recv(); r != nil {
		ts = append(ts, r.Type())
	}
	for p := range sig.Params().Variables() {
		ts = append(ts, p.Type())
	}
	return len(ts) == 2 && types.Identical(deref(ts[0]), deref(ts[1]))
}

// deref returns the element type of a pointer, or t.
func deref(t types.Type) types.Type {
	if p, ok := t.Underlying().(*types.Pointer); ok {
		return p.Elem()
	}
	return t
}
