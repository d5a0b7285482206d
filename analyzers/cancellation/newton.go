package cancellation

import (
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/provenance"
)

// newtonSlope reports whether the value at cur is only the slope of a
// Newton update of a variable that x mentions: the divisor of f/d, where
// the quotient (directly or through a variable) is subtracted from or
// added to that variable (t -= f/d, t = t - step), also through a
// variable holding d; the step may also be compared in a stopping test
// (math.Abs(step) < tol), which a relative error in it moves by at most
// an iteration. The iteration stops where f vanishes, a point the
// slope does not move: a relative error in d changes only the length of
// each step, so the loss slows convergence (quadratic to linear at worst)
// but does not reach the root. Where d itself vanishes the root is
// multiple and ill-conditioned whatever the slope's accuracy.
func (c *checker) newtonSlope(cur inspector.Cursor, x ast.Expr) bool {
	fn, ok := enclosingFunc(cur)
	if !ok {
		return false
	}
	divisors := c.valueSites(fn, cur)
	if len(divisors) == 0 {
		return false
	}
	for _, d := range divisors {
		q := d.Parent()
		if d.ParentEdgeKind() != edge.BinaryExpr_Y || q.Node().(*ast.BinaryExpr).Op != token.QUO {
			return false // used other than as a divisor
		}
		updated := false
		for _, s := range c.valueSites(fn, q) {
			switch {
			case c.stepOf(s, x):
				updated = true
			case !c.stopTest(s):
				return false
			}
		}
		if !updated {
			return false
		}
	}
	return true
}

// valueSites returns the places where the value at cur is used: cur
// itself (parentheses aside), or, when it is assigned to a variable by
// v := e or v = e, every use of v in the function fn; nil where the value
// is stored otherwise or the variable is assigned again.
func (c *checker) valueSites(fn, cur inspector.Cursor) []inspector.Cursor {
	for {
		if _, isParen := cur.Parent().Node().(*ast.ParenExpr); !isParen {
			break
		}
		cur = cur.Parent()
	}
	as, ok := cur.Parent().Node().(*ast.AssignStmt)
	if !ok {
		return []inspector.Cursor{cur}
	}
	id, isIdent := as.Lhs[0].(*ast.Ident)
	if len(as.Lhs) != 1 || !isIdent || as.Tok != token.DEFINE && as.Tok != token.ASSIGN {
		return nil
	}
	v := c.pass.TypesInfo.ObjectOf(id)
	var sites []inspector.Cursor
	for u := range fn.Preorder((*ast.Ident)(nil)) {
		if c.pass.TypesInfo.Uses[u.Node().(*ast.Ident)] != v || u.Node() == id {
			continue
		}
		if u.ParentEdgeKind() == edge.AssignStmt_Lhs {
			return nil // assigned again
		}
		sites = append(sites, u)
	}
	return sites
}

// stepOf reports whether the value at cur is the step of an update of a
// variable t that x mentions: t -= step, t += step, or t = t - step.
func (c *checker) stepOf(cur inspector.Cursor, x ast.Expr) bool {
	for {
		if _, isParen := cur.Parent().Node().(*ast.ParenExpr); !isParen {
			break
		}
		cur = cur.Parent()
	}
	var target ast.Expr
	switch p := cur.Parent().Node().(type) {
	case *ast.AssignStmt:
		if (p.Tok == token.SUB_ASSIGN || p.Tok == token.ADD_ASSIGN) && len(p.Lhs) == 1 && cur.ParentEdgeKind() == edge.AssignStmt_Rhs {
			target = p.Lhs[0]
		}
	case *ast.BinaryExpr:
		as, ok := cur.Parent().Parent().Node().(*ast.AssignStmt)
		if ok && (p.Op == token.SUB || p.Op == token.ADD) && p.Y == cur.Node() && len(as.Lhs) == 1 && same(as.Lhs[0], p.X) {
			target = p.X
		}
	}
	id, ok := target.(*ast.Ident)
	if !ok {
		return false
	}
	t := c.pass.TypesInfo.ObjectOf(id)
	found := false
	ast.Inspect(x, func(n ast.Node) bool {
		if m, isIdent := n.(*ast.Ident); isIdent && c.pass.TypesInfo.Uses[m] == t {
			found = true
		}
		return !found
	})
	return found && isVar(t)
}

// stopTest reports whether the value at cur, or its absolute value, is an
// operand of an order comparison.
func (c *checker) stopTest(cur inspector.Cursor) bool {
	if call, ok := cur.Parent().Node().(*ast.CallExpr); ok {
		if _, isAbs := c.absArg(call); !isAbs {
			return false
		}
		cur = cur.Parent()
	}
	b, ok := cur.Parent().Node().(*ast.BinaryExpr)
	return ok && provenance.Ordered(b.Op)
}

// isVar reports whether obj is a variable.
func isVar(obj types.Object) bool {
	_, ok := obj.(*types.Var)
	return ok
}
