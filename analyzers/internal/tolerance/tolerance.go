// Package tolerance recognises tolerance tests in the syntax: an ordered
// comparison of a measure of progress or closeness with a tolerance,
// possibly scaled (tol*math.Abs(b)). A measure is |a-b| with the absolute
// value taken by any route (package absval), its relative forms, |x|, a
// width scaled by a constant ((b-a)/2, 0.5*|b-a|), and, where the caller
// knows them to be widths, a bare difference hi-lo or a variable that
// shrinks each pass. Local variables assigned once are followed, so
// d := math.Abs(a-b); if d < tol is seen whole, and a difference bounded
// from both sides, -tol < a-b && a-b < tol, is |a-b| < tol. epsfloor and stoptol share
// it, so both read a test the same way.
package tolerance

import (
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"

	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/absval"
	"roundoff/analyzers/internal/constval"
	"roundoff/internal/numeric"
)

// Kind says what a tolerance test measures.
type Kind int

// The kinds of test.
const (
	Absolute          Kind = iota + 1 // |a-b| against tol
	Relative                          // |a-b| against tol·scale, or |a-b|/scale against tol
	Magnitude                         // |x| against tol
	RelativeMagnitude                 // |x| against tol·scale, or |x|/scale against tol
)

func (k Kind) String() string {
	return [...]string{"unknown", "absolute", "relative", "magnitude", "relative magnitude"}[k]
}

// Test is a recognised tolerance test.
type Test struct {
	Cmp   *ast.BinaryExpr
	Kind  Kind
	A, B  ast.Expr // the operands of the difference; for Magnitude, A is x and B is nil
	Tol   ast.Expr // the tolerance coefficient as written: a constant, a name or a field
	Scale ast.Expr // the scale of a relative test, nil otherwise
	Floor ast.Expr // the absolute part of a mixed test (Reader.Mixed), nil otherwise
	// Factor is the constant the measure is multiplied by: 0.5 for
	// (b-a)/2 < tol, which holds when |b-a| < tol/Factor. Recognize sets
	// it, 1 when there is none.
	Factor float64
	// TwoSided marks -tol < a-b && a-b < tol, read as |a-b| < tol: Cmp is
	// then the && and Tol the upper bound, one of two places tol is written.
	TwoSided bool
}

// Reader reads tolerance tests in one package.
type Reader struct {
	Info  *types.Info
	Decls map[types.Object]ast.Expr // variables assigned once (constval.Decls)
	Abs   *absval.Known             // absolute values beyond math.Abs; nil for math.Abs only
	// Widths, when set, holds variables known to be non-negative widths
	// (see Shrunk): a bare w < tol is then a magnitude test on w.
	Widths map[*types.Var]bool
	// Ordered, when set, reports whether a bare difference hi-lo is known
	// to be non-negative (see Ordered): it is then read as a width |hi-lo|.
	Ordered func(hi, lo ast.Expr) bool
	// Mixed, when set, reads a sum atol + rtol·scale as a relative test
	// with Tol rtol and Floor atol.
	Mixed bool
	// Later, when set, gives the values of locals declared with no value
	// and assigned once (constval.SetOnce), followed like Decls.
	Later func(types.Object) (ast.Expr, bool)
}

// Recognize reads cmp, an ordered comparison, as a tolerance test, with
// math.Abs as the only absolute value. decls maps variables assigned once
// to their initialisers (constval.Decls).
func Recognize(info *types.Info, decls map[types.Object]ast.Expr, cmp *ast.BinaryExpr) (Test, bool) {
	return Reader{Info: info, Decls: decls}.Recognize(cmp)
}

// Recognize reads cmp, an ordered comparison or a two-sided one (a-b >
// -tol && a-b < tol), as a tolerance test.
func (r Reader) Recognize(cmp *ast.BinaryExpr) (Test, bool) {
	switch cmp.Op {
	case token.LSS, token.LEQ, token.GTR, token.GEQ:
	case token.LAND:
		return r.twoSided(cmp)
	default:
		return Test{}, false
	}
	for _, sides := range [][2]ast.Expr{{cmp.X, cmp.Y}, {cmp.Y, cmp.X}} {
		if t, ok := r.test(sides[0], sides[1]); ok {
			t.Cmp = cmp
			return t, true
		}
	}
	return Test{}, false
}

// bound is one side of a two-sided test: m < t when upper, else m > t.
type bound struct {
	m, t  ast.Expr
	upper bool
}

// bounds reads an ordered comparison both ways round: x < y bounds x
// from above and y from below.
func bounds(e ast.Expr) []bound {
	c, ok := ast.Unparen(e).(*ast.BinaryExpr)
	if !ok {
		return nil
	}
	switch c.Op {
	case token.LSS, token.LEQ:
		return []bound{{c.X, c.Y, true}, {c.Y, c.X, false}}
	case token.GTR, token.GEQ:
		return []bound{{c.X, c.Y, false}, {c.Y, c.X, true}}
	}
	return nil
}

// twoSided reads -tol < a-b && a-b < tol (in any order and orientation)
// as |a-b| < tol: both sides bound one difference, by a tolerance and its
// negation.
func (r Reader) twoSided(and *ast.BinaryExpr) (Test, bool) {
	for _, x := range bounds(and.X) {
		for _, y := range bounds(and.Y) {
			hi, lo := x, y
			if !hi.upper {
				hi, lo = y, x
			}
			if !hi.upper || lo.upper || types.ExprString(ast.Unparen(hi.m)) != types.ExprString(ast.Unparen(lo.m)) || !r.negation(lo.t, hi.t) {
				continue
			}
			if d, ok := r.follow(hi.m).(*ast.BinaryExpr); ok && d.Op == token.SUB {
				return Test{Cmp: and, Kind: Absolute, A: d.X, B: d.Y, Tol: hi.t, Factor: 1, TwoSided: true}, true
			}
		}
	}
	return Test{}, false
}

// InTwoSided reports whether the comparison at cur is one side of a
// two-sided test, which is read whole at its &&.
func (r Reader) InTwoSided(cur inspector.Cursor) bool {
	for p := cur.Parent(); ; p = p.Parent() {
		switch n := p.Node().(type) {
		case *ast.ParenExpr:
			continue
		case *ast.BinaryExpr:
			if n.Op != token.LAND {
				return false
			}
			_, ok := r.twoSided(n)
			return ok
		}
		return false
	}
}

// negation reports whether neg is -t, written so or as constants.
func (r Reader) negation(neg, t ast.Expr) bool {
	if u, ok := ast.Unparen(neg).(*ast.UnaryExpr); ok && u.Op == token.SUB && types.ExprString(ast.Unparen(u.X)) == types.ExprString(ast.Unparen(t)) {
		return true
	}
	a, b := r.Info.Types[neg].Value, r.Info.Types[t].Value
	return a != nil && b != nil && constant.Compare(constant.UnaryOp(token.SUB, a, 0), token.EQL, b) && constant.Sign(b) > 0
}

// test reads m as a measure and tol as its tolerance.
func (r Reader) test(m, tol ast.Expr) (Test, bool) {
	t, ok := r.measure(m)
	if !ok {
		return Test{}, false
	}
	tol = r.bare(tol, &t)
	var coef, scale ast.Expr
	if r.Mixed {
		t.Floor, coef, scale = r.mixed(tol)
	}
	if coef == nil {
		coef, scale = r.split(tol)
	}
	if coef == nil {
		return Test{}, false
	}
	if scale != nil {
		switch t.Kind {
		case Absolute:
			t.Kind, t.Scale = Relative, scale
		case Magnitude:
			t.Kind, t.Scale = RelativeMagnitude, scale
		default:
			return Test{}, false // a scaled tolerance on a relative measure: not a shape we judge
		}
	}
	t.Tol = coef
	return t, true
}

// bare reads a tolerance written k·T with T a sum, a mixed tolerance
// (m < 2*tol1, tol1 = rtol*|x| + atol, holds when m/2 < tol1: t's Factor
// takes 1/k), or T - w with w a constant multiple of a known width
// (Brent's |x-xm| <= tol2 - (b-a)/2 holds only where |x-xm| and the
// half-width together stay within tol2), and returns T.
func (r Reader) bare(tol ast.Expr, t *Test) ast.Expr {
	for range 4 {
		x := r.follow(tol)
		if y, k, ok := r.constScaled(x); ok {
			if _, coef, _ := r.mixed(y); coef != nil {
				tol, t.Factor = y, t.Factor/k
				continue
			}
		}
		d, ok := x.(*ast.BinaryExpr)
		if !ok || d.Op != token.SUB || !r.width(d.Y) {
			return tol
		}
		tol = d.X
	}
	return tol
}

// width reports whether e is a known width or a difference of two
// variables, possibly times a positive constant. Subtracted from a
// tolerance, k·(b-a) is the half-width of Brent's test, whose bracket
// keeps b above a; the order is not checked, since a test shaped so is
// that test (the bracket's order comes from comparisons of f that
// Ordered cannot follow through Brent's steps).
func (r Reader) width(e ast.Expr) bool {
	e = r.follow(e)
	if x, _, ok := r.constScaled(e); ok {
		e = r.follow(x)
	}
	if d, ok := e.(*ast.BinaryExpr); ok && d.Op == token.SUB {
		return VarOf(r.Info, d.X) != nil && VarOf(r.Info, d.Y) != nil
	}
	id, ok := e.(*ast.Ident)
	return ok && r.Widths[r.varOf(id)]
}

// measure reads |a-b|, |a-b|/s, |(a-b)/s|, |x|, a known width, and any of
// them times a constant.
func (r Reader) measure(e ast.Expr) (Test, bool) {
	e = r.follow(e)
	if x, k, ok := r.constScaled(e); ok {
		t, ok := r.measure(x)
		t.Factor *= k
		return t, ok
	}
	if q, ok := e.(*ast.BinaryExpr); ok && q.Op == token.QUO {
		t, ok := r.measure(q.X)
		switch {
		case !ok:
		case t.Kind == Absolute:
			return Test{Kind: Relative, A: t.A, B: t.B, Scale: q.Y, Factor: t.Factor}, true
		case t.Kind == Magnitude:
			return Test{Kind: RelativeMagnitude, A: t.A, Scale: q.Y, Factor: t.Factor}, true
		}
		return Test{}, false
	}
	if d, ok := e.(*ast.BinaryExpr); ok && d.Op == token.SUB && r.Ordered != nil && r.Ordered(d.X, d.Y) {
		return Test{Kind: Absolute, A: d.X, B: d.Y, Factor: 1}, true
	}
	if id, ok := e.(*ast.Ident); ok && r.Widths[r.varOf(id)] {
		return Test{Kind: Magnitude, A: id, Factor: 1}, true
	}
	call, ok := e.(*ast.CallExpr)
	if !ok {
		return Test{}, false
	}
	arg, ok := r.Abs.Arg(r.Info, r.Decls, call)
	if !ok {
		return Test{}, false
	}
	return r.inAbs(arg), true
}

// inAbs reads the argument of an absolute value: a difference, possibly
// scaled by a constant or divided by a scale, or anything else as |x|.
func (r Reader) inAbs(arg ast.Expr) Test {
	x, k := r.follow(arg), 1.0
	for {
		y, f, ok := r.constScaled(x)
		if !ok {
			break
		}
		x, k = r.follow(y), k*f
	}
	if d, ok := x.(*ast.BinaryExpr); ok && d.Op == token.SUB {
		return Test{Kind: Absolute, A: d.X, B: d.Y, Factor: k}
	}
	if q, ok := x.(*ast.BinaryExpr); ok && q.Op == token.QUO {
		if d, ok := r.follow(q.X).(*ast.BinaryExpr); ok && d.Op == token.SUB {
			return Test{Kind: Relative, A: d.X, B: d.Y, Scale: q.Y, Factor: k}
		}
	}
	return Test{Kind: Magnitude, A: arg, Factor: 1}
}

// constScaled reads e as x*k, k*x or x/k with k a positive constant,
// returning x and the factor.
func (r Reader) constScaled(e ast.Expr) (ast.Expr, float64, bool) {
	b, ok := e.(*ast.BinaryExpr)
	if !ok || b.Op != token.MUL && b.Op != token.QUO {
		return nil, 0, false
	}
	if k, ok := r.positive(b.Y); ok {
		if b.Op == token.QUO {
			k = 1 / k
		}
		return b.X, k, true
	}
	if k, ok := r.positive(b.X); ok && b.Op == token.MUL {
		return b.Y, k, true
	}
	return nil, 0, false
}

// positive returns the value of a positive numeric constant.
func (r Reader) positive(e ast.Expr) (float64, bool) {
	tv, ok := r.Info.Types[e]
	if !ok || tv.Value == nil {
		return 0, false
	}
	f, exact := constantFloat(tv)
	return f, exact && f > 0 && !math.IsInf(f, 0)
}

func (r Reader) varOf(id *ast.Ident) *types.Var {
	v, _ := r.Info.Uses[id].(*types.Var)
	return v
}

// split reads a tolerance as coef·scale, with coef a constant, a name or a
// field and scale the rest (nil when unscaled). A sum (atol + rtol·s) is a
// mixed test and is not split: coef is nil.
func (r Reader) split(e ast.Expr) (coef, scale ast.Expr) {
	e = ast.Unparen(e)
	m, ok := r.follow(e).(*ast.BinaryExpr)
	if !ok || m.Op != token.MUL {
		if r.coefficient(e) {
			return e, nil
		}
		return nil, nil
	}
	_, xk := constval.Exact(r.Info, r.Decls, m.X)
	_, yk := constval.Exact(r.Info, r.Decls, m.Y)
	if xk && yk {
		return e, nil // k·c is a constant: an absolute tolerance, however small (1e-6*math.SmallestNonzeroFloat64 is 0 in float64)
	}
	switch {
	case r.coefficient(m.X) && !r.coefficient(m.Y):
		return ast.Unparen(m.X), m.Y
	case r.coefficient(m.Y) && !r.coefficient(m.X):
		return ast.Unparen(m.Y), m.X
	case r.isConst(m.X):
		return ast.Unparen(m.X), m.Y
	}
	return nil, nil
}

// mixed reads a tolerance atol + rtol·scale (in either order) as its
// parts; coef is nil when it is not one.
func (r Reader) mixed(e ast.Expr) (floor, coef, scale ast.Expr) {
	sum, ok := r.follow(e).(*ast.BinaryExpr)
	if !ok || sum.Op != token.ADD {
		return nil, nil, nil
	}
	for _, parts := range [][2]ast.Expr{{sum.X, sum.Y}, {sum.Y, sum.X}} {
		if r.coefficient(parts[0]) {
			if coef, scale := r.split(parts[1]); coef != nil && scale != nil {
				return ast.Unparen(parts[0]), coef, scale
			}
		}
	}
	return nil, nil, nil
}

// coefficient reports whether e can carry a tolerance: a constant, a
// variable, or a field selection.
func (r Reader) coefficient(e ast.Expr) bool {
	switch e := ast.Unparen(e).(type) {
	case *ast.BasicLit:
		return true
	case *ast.Ident:
		_, isVar := r.Info.Uses[e].(*types.Var)
		return isVar || r.isConst(e)
	case *ast.SelectorExpr:
		if sel, ok := r.Info.Selections[e]; ok {
			return sel.Kind() == types.FieldVal
		}
		return r.isConst(e) || isPkgVar(r.Info, e)
	}
	return r.isConst(e)
}

func isPkgVar(info *types.Info, e *ast.SelectorExpr) bool {
	_, ok := info.Uses[e.Sel].(*types.Var)
	return ok
}

func (r Reader) isConst(e ast.Expr) bool {
	tv, ok := r.Info.Types[e]
	return ok && tv.Value != nil
}

// follow looks through parentheses, numeric conversions and local
// variables assigned once to a non-constant expression.
func (r Reader) follow(e ast.Expr) ast.Expr {
	for range 8 {
		e = ast.Unparen(e)
		switch x := e.(type) {
		case *ast.CallExpr:
			if tv, ok := r.Info.Types[x.Fun]; !ok || !tv.IsType() || len(x.Args) != 1 {
				return e
			}
			e = x.Args[0]
		case *ast.Ident:
			init, ok := r.Decls[r.Info.Uses[x]]
			if !ok && r.Later != nil && r.Info.Uses[x] != nil {
				init, ok = r.Later(r.Info.Uses[x])
			}
			if r.isConst(x) || !ok || r.isConst(init) {
				return e
			}
			e = init
		default:
			return e
		}
	}
	return e
}

// Resolution classifies a tolerance against what a float format resolves.
type Resolution int

// The classes of tolerance.
const (
	Resolvable    Resolution = iota // nothing to say
	BelowRoundoff                   // relative tolerance below the unit roundoff u: exact equality in disguise
	BelowEpsilon                    // absolute tolerance below eps: exact equality for values above about tol/eps
	BelowSpacing                    // absolute tolerance below half the spacing at a known magnitude: exact equality there
	Subnormal                       // the smallest positive float used as a tolerance
)

// Judge classifies tolerance tol (positive, as the type stores it) of the
// given kind for values of format f. magnitude is the size of the compared
// values when known (a constant operand), else 0. Constants at or below
// UnderflowGuard other than the smallest subnormal guard against underflow,
// they are not tolerances, and are Resolvable.
func Judge(kind Kind, tol float64, f numeric.Format, magnitude float64) Resolution {
	switch {
	case !(tol > 0) || math.IsInf(tol, 0):
		return Resolvable // zero means exact on purpose; negative or NaN are sentinels
	case tol == f.Smallest:
		if kind == Magnitude {
			return Resolvable // |x| < smallest is x == 0: a zero test
		}
		return Subnormal
	case tol <= UnderflowGuard:
		return Resolvable
	}
	switch kind {
	case Relative:
		if tol < f.U {
			return BelowRoundoff
		}
	case Absolute:
		if magnitude > 0 {
			if tol < f.Spacing(magnitude)/2 {
				return BelowSpacing
			}
			return Resolvable
		}
		if tol < f.Eps {
			return BelowEpsilon
		}
	}
	return Resolvable
}

// UnderflowGuard is 2^-511 ≈ 1.5e-154, the square root of the smallest
// normal float64: constants at or below it are the safe minima, small
// numbers and scaling thresholds of underflow-aware code (LAPACK-style
// safmin ≈ 2.2e-308 and smlnum ≈ 1e-292, sqrt(safmin) in norm scaling),
// never tolerances (common practice).
var UnderflowGuard = math.Sqrt(math.Ldexp(1, -1022))
