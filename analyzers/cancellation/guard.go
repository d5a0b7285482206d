package cancellation

import (
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"

	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/span"
)

// A bound reports whether condition cond, or its negation when negated,
// tells something about the range of x that makes a report moot.
type bound func(cond ast.Expr, negated bool, x ast.Expr) bool

// guarded reports whether the code at cur runs only where an enclosing
// condition satisfies ok for x (span.Conditions: the branches of an if,
// the case of a tagless switch, the statements after an if chain every
// branch of which leaves the block).
func (c *checker) guarded(cur inspector.Cursor, x ast.Expr, ok bound) bool {
	for cond, holds := range span.Conditions(cur) {
		if ok(cond, !holds, x) {
			return true
		}
	}
	return false
}

// awayBy returns the bound for the small-argument rules: cond (or its
// negation) keeps x at least least from zero, as x < -0.5 || x > 0.5 or
// the negation of math.Abs(x) < 1e-5 do for least = 1.05e-8, or above a
// threshold held in a variable (|x| > t: the author split the range). A
// constant factor or a sign of x is looked through.
func (c *checker) awayBy(least float64) bound {
	return func(cond ast.Expr, negated bool, x ast.Expr) bool {
		return c.clauses(cond, negated, c.core(x), func(e *ast.BinaryExpr, negated bool, x ast.Expr) bool {
			return c.comparisonAway(e, negated, x, least)
		})
	}
}

// clauses reads cond, negated when asked, as a combination of comparisons
// with && and || (and !), and reports whether it guarantees what leaf says
// of each comparison it must hold: all of a disjunction's, one of a
// conjunction's.
func (c *checker) clauses(cond ast.Expr, negated bool, x ast.Expr, leaf func(e *ast.BinaryExpr, negated bool, x ast.Expr) bool) bool {
	switch e := ast.Unparen(cond).(type) {
	case *ast.UnaryExpr:
		return e.Op == token.NOT && c.clauses(e.X, !negated, x, leaf)
	case *ast.BinaryExpr:
		switch {
		case e.Op == token.LOR && !negated, e.Op == token.LAND && negated:
			return c.clauses(e.X, negated, x, leaf) && c.clauses(e.Y, negated, x, leaf)
		case e.Op == token.LAND, e.Op == token.LOR:
			return c.clauses(e.X, negated, x, leaf) || c.clauses(e.Y, negated, x, leaf)
		}
		return leaf(e, negated, x)
	}
	return false
}

// oriented reads the comparison e (negated when asked) as x op rhs or
// |x| op rhs (abs), x on the left, and reports whether x is its subject.
func (c *checker) oriented(e *ast.BinaryExpr, negated bool, x ast.Expr) (op token.Token, abs bool, rhs ast.Expr, ok bool) {
	op, lhs, rhs := e.Op, e.X, e.Y
	if !c.mentions(lhs, x) {
		op, lhs, rhs = mirror(op), e.Y, e.X
	}
	if negated {
		op = invert(op)
	}
	abs, ok = c.form(lhs, x)
	return op, abs, rhs, ok
}

// comparisonAway reports whether the comparison e (negated when asked)
// keeps x at least least from zero.
func (c *checker) comparisonAway(e *ast.BinaryExpr, negated bool, x ast.Expr, least float64) bool {
	op, abs, rhs, ok := c.oriented(e, negated, x)
	if !ok {
		return false
	}
	v := c.pass.TypesInfo.Types[rhs].Value
	if v == nil {
		// |x| > t with a variable threshold still means the author split the range.
		return abs && (op == token.GTR || op == token.GEQ)
	}
	if v.Kind() != constant.Int && v.Kind() != constant.Float {
		return false
	}
	k, _ := constant.Float64Val(constant.ToFloat(v))
	switch op {
	case token.GTR, token.GEQ:
		return k >= least && k > 0
	case token.LSS, token.LEQ:
		return k <= -least && k < 0 && !abs
	}
	return false
}

// awayFromOne is the bound for 1 - x*x and x*x - 1: cond keeps x above
// sqrt(100/99) ≈ 1.005 (or below its negation), or |x| below sqrt(0.99) ≈
// 0.995 (x > 2 before math.Sqrt(x*x-1)), so a²/|a²-b²| stays within
// boundedLoss and at most two digits go.
func (c *checker) awayFromOne(cond ast.Expr, negated bool, x ast.Expr) bool {
	return c.clauses(cond, negated, x, c.comparisonAwayFromOne)
}

// comparisonAwayFromOne reports whether the comparison e (negated when
// asked) keeps x away from ±1 (see awayFromOne).
func (c *checker) comparisonAwayFromOne(e *ast.BinaryExpr, negated bool, x ast.Expr) bool {
	op, abs, rhs, ok := c.oriented(e, negated, x)
	v := c.pass.TypesInfo.Types[rhs].Value
	if !ok || v == nil || v.Kind() != constant.Int && v.Kind() != constant.Float {
		return false
	}
	k, _ := constant.Float64Val(constant.ToFloat(v))
	switch op {
	case token.GTR, token.GEQ:
		return k >= oneOutside
	case token.LSS, token.LEQ:
		return abs && k >= 0 && k <= oneInside || k <= -oneOutside
	}
	return false
}

// The magnitudes that keep 1 - x² within boundedLoss of x² or of 1:
// x²/(x²-1) ≤ 100 from oneOutside up, 1/(1-x²) ≤ 100 from oneInside down.
var (
	oneOutside = math.Sqrt(float64(boundedLoss) / (boundedLoss - 1))
	oneInside  = math.Sqrt(1 - 1/float64(boundedLoss))
)

// rangeAwayFromOne reports whether x's range at cur (span.Reader.At)
// keeps |x| where awayFromOne's conditions do: above sqrt(100/99) or below
// sqrt(0.99).
func (c *checker) rangeAwayFromOne(cur inspector.Cursor, x ast.Expr) bool {
	r, _ := c.spans.At(cur, x)
	lo, hi := r.Magnitude()
	return lo >= oneOutside || hi <= oneInside
}

// compares is the bound for the overflow rule: cond compares x, or its
// absolute value, with anything, so the code is aware of its range.
func (c *checker) compares(cond ast.Expr, _ bool, x ast.Expr) bool {
	found := false
	ast.Inspect(cond, func(n ast.Node) bool {
		if b, ok := n.(*ast.BinaryExpr); ok && provenance.Ordered(b.Op) {
			found = found || c.mentions(b.X, x) || c.mentions(b.Y, x)
		}
		return !found
	})
	return found
}

// overflowChecked is the bound for the exponential rules: cond compares x
// (see compares) or asks math.IsInf of it, so the code is reached only
// while x is finite. A finite x says nothing of its size, which is why the
// squares' rule does not use it.
func (c *checker) overflowChecked(cond ast.Expr, negated bool, x ast.Expr) bool {
	found := c.compares(cond, negated, x)
	ast.Inspect(cond, func(n ast.Node) bool {
		if call, ok := n.(*ast.CallExpr); ok {
			found = found || provenance.MathCallee(c.pass.TypesInfo, call) == "IsInf" && c.mentions(call.Args[0], x)
		}
		return !found
	})
	return found
}

// mentions reports whether e is x or |x| in one of the forms c.form knows.
func (c *checker) mentions(e, x ast.Expr) bool {
	_, ok := c.form(e, x)
	return ok
}

// form reports whether e stands for x (abs false) or for math.Abs(x) (abs
// true), directly or through a never-reassigned variable holding it.
func (c *checker) form(e, x ast.Expr) (abs, ok bool) {
	for range 4 {
		e = ast.Unparen(e)
		if same(c.core(e), x) {
			return false, true
		}
		if call, isCall := e.(*ast.CallExpr); isCall {
			if arg, isAbs := c.absArg(call); isAbs && same(c.core(arg), x) {
				return true, true
			}
		}
		id, isIdent := e.(*ast.Ident)
		if !isIdent || c.decls[c.pass.TypesInfo.Uses[id]] == nil {
			return false, false
		}
		e = c.decls[c.pass.TypesInfo.Uses[id]]
	}
	return false, false
}

// core strips from x the sign and constant factors that do not move it
// away from zero or towards it: -x, 2*x, x/2 all become x.
func (c *checker) core(x ast.Expr) ast.Expr {
	for {
		switch e := ast.Unparen(x).(type) {
		case *ast.UnaryExpr:
			if e.Op != token.SUB && e.Op != token.ADD {
				return e
			}
			x = e.X
		case *ast.BinaryExpr:
			switch {
			case e.Op == token.MUL && c.isConst(e.X):
				x = e.Y
			case (e.Op == token.MUL || e.Op == token.QUO) && c.isConst(e.Y):
				x = e.X
			default:
				return e
			}
		default:
			return e
		}
	}
}

// scaled reports whether x holds a value divided by a variable scale, as
// in xs := x / s before math.Sqrt(xs*xs + ys*ys): the code has chosen the
// range of the squares.
func (c *checker) scaled(x ast.Expr) bool {
	id, ok := ast.Unparen(x).(*ast.Ident)
	if !ok {
		return false
	}
	q, ok := ast.Unparen(c.decls[c.pass.TypesInfo.Uses[id]]).(*ast.BinaryExpr)
	return ok && q.Op == token.QUO && !c.isConst(q.Y)
}

// mirror returns the operator that holds with the operands swapped.
func mirror(op token.Token) token.Token {
	return map[token.Token]token.Token{token.LSS: token.GTR, token.GTR: token.LSS, token.LEQ: token.GEQ, token.GEQ: token.LEQ}[op]
}

// invert returns the operator that holds when op fails (NaN aside).
func invert(op token.Token) token.Token {
	return map[token.Token]token.Token{token.LSS: token.GEQ, token.GEQ: token.LSS, token.GTR: token.LEQ, token.LEQ: token.GTR}[op]
}

// same reports whether two side-effect-free expressions are written alike.
func same(x, y ast.Expr) bool {
	return types.ExprString(ast.Unparen(x)) == types.ExprString(ast.Unparen(y))
}

func isFloat64(t types.Type) bool {
	b, ok := t.(*types.Basic)
	return ok && b.Kind() == types.Float64
}
