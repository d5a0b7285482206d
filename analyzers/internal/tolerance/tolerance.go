// Package tolerance recognises tolerance tests in the syntax: an ordered
// comparison of a measure of closeness (|a-b|, |a-b|/|b|, |x|) with a
// tolerance, possibly scaled (tol*math.Abs(b)). Local variables assigned
// once are followed, so d := math.Abs(a-b); if d < tol is seen whole.
// epsfloor and stoptol share it, so both read a test the same way.
package tolerance

import (
	"go/ast"
	"go/token"
	"go/types"
	"math"

	"golang.org/x/tools/go/types/typeutil"

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
}

// Recognize reads cmp, an ordered comparison, as a tolerance test. decls
// maps variables assigned once to their initialisers (constval.Decls).
func Recognize(info *types.Info, decls map[types.Object]ast.Expr, cmp *ast.BinaryExpr) (Test, bool) {
	return recognize(reader{info, decls, false}, cmp)
}

// RecognizeWidth is Recognize that also reads a bare difference b-a as an
// absolute measure, as loop tests on a bracket's width are written
// (for b-a > tol); callers must know the difference is not signed.
func RecognizeWidth(info *types.Info, decls map[types.Object]ast.Expr, cmp *ast.BinaryExpr) (Test, bool) {
	return recognize(reader{info, decls, true}, cmp)
}

func recognize(r reader, cmp *ast.BinaryExpr) (Test, bool) {
	switch cmp.Op {
	case token.LSS, token.LEQ, token.GTR, token.GEQ:
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

type reader struct {
	info  *types.Info
	decls map[types.Object]ast.Expr
	bare  bool // a bare difference is a width
}

// test reads m as a measure and tol as its tolerance.
func (r reader) test(m, tol ast.Expr) (Test, bool) {
	t, ok := r.measure(m)
	if !ok {
		return Test{}, false
	}
	coef, scale := r.split(tol)
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

// measure reads |a-b|, |a-b|/s, |(a-b)/s| or |x|.
func (r reader) measure(e ast.Expr) (Test, bool) {
	e = r.follow(e)
	if q, ok := e.(*ast.BinaryExpr); ok && q.Op == token.QUO {
		t, ok := r.measure(q.X)
		switch {
		case !ok || r.isConst(q.Y):
		case t.Kind == Absolute:
			return Test{Kind: Relative, A: t.A, B: t.B, Scale: q.Y}, true
		case t.Kind == Magnitude:
			return Test{Kind: RelativeMagnitude, A: t.A, Scale: q.Y}, true
		}
		return Test{}, false
	}
	if d, ok := e.(*ast.BinaryExpr); ok && d.Op == token.SUB && r.bare {
		return Test{Kind: Absolute, A: d.X, B: d.Y}, true
	}
	arg, ok := r.absArg(e)
	if !ok {
		return Test{}, false
	}
	if x, ok := r.follow(arg).(*ast.BinaryExpr); ok {
		if x.Op == token.SUB {
			return Test{Kind: Absolute, A: x.X, B: x.Y}, true
		}
		if d, ok := r.follow(x.X).(*ast.BinaryExpr); ok && x.Op == token.QUO && d.Op == token.SUB && !r.isConst(x.Y) {
			return Test{Kind: Relative, A: d.X, B: d.Y, Scale: x.Y}, true
		}
	}
	return Test{Kind: Magnitude, A: arg}, true
}

// absArg returns x when e is math.Abs(x).
func (r reader) absArg(e ast.Expr) (ast.Expr, bool) {
	call, ok := e.(*ast.CallExpr)
	if !ok || len(call.Args) != 1 {
		return nil, false
	}
	fn, ok := typeutil.Callee(r.info, call).(*types.Func)
	if !ok || fn.Pkg() == nil || fn.Pkg().Path() != "math" || fn.Name() != "Abs" {
		return nil, false
	}
	return call.Args[0], true
}

// split reads a tolerance as coef·scale, with coef a constant, a name or a
// field and scale the rest (nil when unscaled). A sum (atol + rtol·s) is a
// mixed test and is not split: coef is nil.
func (r reader) split(e ast.Expr) (coef, scale ast.Expr) {
	e = ast.Unparen(e)
	m, ok := r.follow(e).(*ast.BinaryExpr)
	if !ok || m.Op != token.MUL {
		if r.coefficient(e) {
			return e, nil
		}
		return nil, nil
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

// coefficient reports whether e can carry a tolerance: a constant, a
// variable, or a field selection.
func (r reader) coefficient(e ast.Expr) bool {
	switch e := ast.Unparen(e).(type) {
	case *ast.BasicLit:
		return true
	case *ast.Ident:
		_, isVar := r.info.Uses[e].(*types.Var)
		return isVar || r.isConst(e)
	case *ast.SelectorExpr:
		if sel, ok := r.info.Selections[e]; ok {
			return sel.Kind() == types.FieldVal
		}
		return r.isConst(e) || isPkgVar(r.info, e)
	}
	return r.isConst(e)
}

func isPkgVar(info *types.Info, e *ast.SelectorExpr) bool {
	_, ok := info.Uses[e.Sel].(*types.Var)
	return ok
}

func (r reader) isConst(e ast.Expr) bool {
	tv, ok := r.info.Types[e]
	return ok && tv.Value != nil
}

// follow looks through parentheses, numeric conversions and local
// variables assigned once to a non-constant expression.
func (r reader) follow(e ast.Expr) ast.Expr {
	for range 8 {
		e = ast.Unparen(e)
		switch x := e.(type) {
		case *ast.CallExpr:
			if tv, ok := r.info.Types[x.Fun]; !ok || !tv.IsType() || len(x.Args) != 1 {
				return e
			}
			e = x.Args[0]
		case *ast.Ident:
			init, ok := r.decls[r.info.Uses[x]]
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
