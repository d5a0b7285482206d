package stoptol

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/passes/inspect"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/span"
	"roundoff/analyzers/internal/tolerance"
)

// zeroTolerance reports a loop that scales v by positive factors each
// pass and ends only when v < tol, tol a parameter (or a field of one)
// that the function takes as the caller gives it: a positive v stays
// positive under such scaling, or reaches exactly 0, and never falls
// below 0, so the loop never ends when a caller passes tol = 0 (a
// common way of asking for full precision). A factor between 1/2 and 1
// stops v at a subnormal value, where the product rounds back to v
// (0.618 stops at 4.9e-324), so v <= tol never holds for tol = 0
// either. It reports whether the loop was such.
func (c *checker) zeroTolerance(d *deps, v *types.Var) bool {
	tol, exit, strict := c.below(d, v)
	if tol == nil || !c.positiveFactors(d, v) {
		return false
	}
	floor, op := "reaches exactly 0", "<"
	m, ok := c.onlyFactor(d, v)
	stalls := ok && m > 0.5 && m < 1
	if stalls {
		floor = fmt.Sprintf("stops at %.2g, where the product rounds back to it", stall(m))
	}
	if !strict {
		if !stalls {
			return false // v reaches 0, where v <= 0 holds
		}
		op = "<="
	}
	at := tol.Pos()
	if p := c.paramOf(tol); p != nil {
		at = p.Pos()
	}
	t := fixes.Source(c.pass.Fset, tol)
	c.reportLoopAt(d, exit, catNoCap, fmt.Sprintf("loop scales %s by a positive factor each pass and ends only when %s %s %s: a positive %s stays positive (it %s), so the test never holds when a caller gives %s = 0, nor when %s starts infinite or NaN, and %s; add an iteration limit",
		v.Name(), v.Name(), op, t, v.Name(), floor, t, v.Name(), c.uncapped(d.l, "passes")),
		analysis.RelatedInformation{Pos: at, End: at, Message: "the tolerance the caller gives"})
	return true
}

// stall returns where repeated scaling by m in (1/2, 1) stops in
// float64, starting from 1: the first value the product rounds back to.
func stall(m float64) float64 {
	h := 1.0
	for range 1 << 20 {
		next := h * m
		if next == h || next == 0 {
			return next
		}
		h = next
	}
	return h
}

// below returns the tolerance tol and the exit test when every exit of
// the loop holds exactly when v < tol, or every one when v <= tol (an if
// v < tol that leaves, a loop condition v >= tol or v > tol), with tol
// taken as the caller gives it (see asGiven), and whether the tests are
// strict: another exit, such as v > 0 as the loop condition, may end the
// loop where v reaches 0.
func (c *checker) below(d *deps, v *types.Var) (tol, exit ast.Expr, strict bool) {
	for i, t := range d.tests {
		b, ok := ast.Unparen(t.e).(*ast.BinaryExpr)
		if !ok {
			return nil, nil, false
		}
		small, large, lt := b.X, b.Y, false
		switch {
		case !t.cond && b.Op == token.LSS, t.cond && b.Op == token.GEQ:
			lt = true
		case !t.cond && b.Op == token.LEQ, t.cond && b.Op == token.GTR:
		case !t.cond && b.Op == token.GTR, t.cond && b.Op == token.LEQ:
			small, large, lt = b.Y, b.X, true
		case !t.cond && b.Op == token.GEQ, t.cond && b.Op == token.LSS:
			small, large = b.Y, b.X
		default:
			return nil, nil, false
		}
		if tolerance.VarOf(c.pass.TypesInfo, small) != v || !c.asGiven(d.l, large) || i > 0 && lt != strict {
			return nil, nil, false
		}
		if i == 0 {
			tol, exit, strict = large, t.e, lt
		}
	}
	return tol, exit, strict
}

// asGiven reports whether e is a parameter of the loop's function, or a
// field of one, that the function neither assigns nor compares with a
// constant (a default for 0, a rejection of values below a floor): the
// loop sees whatever the caller passed, 0 included.
func (c *checker) asGiven(l *loop, e ast.Expr) bool {
	info := c.pass.TypesInfo
	if c.paramOf(e) == nil || l.decl == nil {
		return false
	}
	text := fixes.Source(c.pass.Fset, e)
	same := func(x ast.Expr) bool { return fixes.Source(c.pass.Fset, x) == text }
	given := true
	ast.Inspect(l.decl.Body, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.AssignStmt:
			for _, lhs := range n.Lhs {
				given = given && !same(lhs)
			}
		case *ast.UnaryExpr:
			given = given && !(n.Op == token.AND && same(n.X))
		case *ast.BinaryExpr:
			if same(n.X) && info.Types[n.Y].Value != nil || same(n.Y) && info.Types[n.X].Value != nil {
				given = false
			}
		}
		return given
	})
	return given
}

// paramOf returns the parameter (or receiver) that e is, or whose field
// e reads, or nil.
func (c *checker) paramOf(e ast.Expr) *types.Var {
	if sel, ok := ast.Unparen(e).(*ast.SelectorExpr); ok {
		e = sel.X
	}
	id, _ := ast.Unparen(e).(*ast.Ident)
	p, _ := c.pass.TypesInfo.Uses[id].(*types.Var)
	if p == nil || p.Kind() != types.ParamVar && p.Kind() != types.RecvVar {
		return nil
	}
	return p
}

// positiveFactors reports whether every update of v in the loop scales it
// by factors bounded above 0 (package span): v *= f, v /= f, v = v*f.
func (c *checker) positiveFactors(d *deps, v *types.Var) bool {
	for i, r := range d.rhs[v] {
		fs, ok := factorsBeside(c.pass.TypesInfo, d.tokens[v][i], r, v)
		if !ok {
			return false
		}
		for _, f := range fs {
			if in, ok := c.spans().Of(f.e); !ok || !(in.Lo > 0) {
				return false
			}
		}
	}
	return len(d.rhs[v]) > 0
}

// onlyFactor returns the factor every update of v scales it by (the
// reciprocal of a divisor), written alike in each, when span bounds it to
// a single value.
func (c *checker) onlyFactor(d *deps, v *types.Var) (float64, bool) {
	var first *factor
	for i, r := range d.rhs[v] {
		fs, ok := factorsBeside(c.pass.TypesInfo, d.tokens[v][i], r, v)
		if !ok || len(fs) != 1 || first != nil && (fs[0].div != first.div || fixes.Source(c.pass.Fset, fs[0].e) != fixes.Source(c.pass.Fset, first.e)) {
			return 0, false
		}
		first = &fs[0]
	}
	if first == nil {
		return 0, false
	}
	in, ok := c.spans().Of(first.e)
	if !ok || in.Lo < in.Hi || !(in.Lo > 0) {
		return 0, false
	}
	if first.div {
		return 1 / in.Lo, true
	}
	return in.Lo, true
}

// factor is an operand an update multiplies by, or divides by (div).
type factor struct {
	e   ast.Expr
	div bool
}

// factorsBeside returns the factors an update of v scales it by: f of
// v *= f and v /= f, the other operands of v = v*f*g or v = v/f.
func factorsBeside(info *types.Info, tok token.Token, r ast.Expr, v *types.Var) ([]factor, bool) {
	switch tok {
	case token.MUL_ASSIGN, token.QUO_ASSIGN:
		return []factor{{r, tok == token.QUO_ASSIGN}}, true
	case token.ASSIGN:
		var out []factor
		var walk func(e ast.Expr) bool
		walk = func(e ast.Expr) bool {
			e = ast.Unparen(e)
			if tolerance.VarOf(info, e) == v {
				return true
			}
			b, ok := e.(*ast.BinaryExpr)
			switch {
			case !ok || b.Op != token.MUL && b.Op != token.QUO:
				return false
			case walk(b.X):
				out = append(out, factor{b.Y, b.Op == token.QUO})
				return true
			case b.Op == token.MUL && walk(b.Y):
				out = append(out, factor{b.X, false})
				return true
			}
			return false
		}
		return out, walk(r)
	}
	return nil, false
}

// spans returns the package's interval reader, made on first use.
func (c *checker) spans() *span.Reader {
	if c.span == nil {
		c.span = span.New(c.pass.TypesInfo, c.pass.ResultOf[inspect.Analyzer].(*inspector.Inspector), c.decls, c.abs)
	}
	return c.span
}
