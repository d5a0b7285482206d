package span

import (
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"

	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/absval"
	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/tolerance"
)

// Interval is a closed range of real values [Lo, Hi], an end of which may
// be infinite, less the values strictly between -Away and Away: the
// else branch of if math.Abs(x) < 0.05 knows x on both sides of 0.
type Interval struct{ Lo, Hi, Away float64 }

// all is the interval that says nothing.
var all = Interval{Lo: math.Inf(-1), Hi: math.Inf(1)}

// point is the interval of one value.
func point(f float64) Interval { return Interval{f, f, math.Abs(f)} }

// Magnitude returns the smallest and the largest |x| for x in r.
func (r Interval) Magnitude() (lo, hi float64) {
	hi = math.Max(math.Abs(r.Lo), math.Abs(r.Hi))
	if r.Lo > 0 || r.Hi < 0 {
		lo = math.Min(math.Abs(r.Lo), math.Abs(r.Hi))
	}
	return math.Max(lo, r.Away), hi
}

// Known reports whether r says anything.
func (r Interval) Known() bool {
	return !math.IsInf(r.Lo, -1) || !math.IsInf(r.Hi, 1) || r.Away > 0
}

func (r Interval) meet(s Interval) Interval {
	m := Interval{math.Max(r.Lo, s.Lo), math.Min(r.Hi, s.Hi), math.Max(r.Away, s.Away)}
	m.Away, _ = m.Magnitude()
	return m
}

func (r Interval) join(s Interval) Interval {
	return Interval{math.Min(r.Lo, s.Lo), math.Max(r.Hi, s.Hi), math.Min(r.Away, s.Away)}
}

// spread returns [lo, hi] with the smallest magnitude it holds as Away.
func spread(lo, hi float64) Interval {
	r := Interval{Lo: lo, Hi: hi}
	r.Away, _ = r.Magnitude()
	return r
}

// Reader bounds expressions of one package. Its zero value is not usable:
// use New.
type Reader struct {
	info  *types.Info
	insp  *inspector.Inspector
	decls map[types.Object]ast.Expr
	abs   *absval.Known

	changed map[types.Object]bool              // parameters assigned in their function, by scan
	sites   map[*types.Func][]inspector.Cursor // calls of the package's functions, by scan
	escapes map[*types.Func]bool               // functions used other than by a direct call
	owners  map[*types.Var]paramOf             // parameters of the package's functions without receiver
	params  map[*types.Var]Interval            // parameter ranges from all calls, by fromCalls
	busy    map[*types.Var]bool
}

// New returns a Reader for the package whose syntax insp walks; decls are
// its never-reassigned variables (constval.Decls) and abs its absolute-value
// functions.
func New(info *types.Info, insp *inspector.Inspector, decls map[types.Object]ast.Expr, abs *absval.Known) *Reader {
	return &Reader{info: info, insp: insp, decls: decls, abs: abs, params: map[*types.Var]Interval{}, busy: map[*types.Var]bool{}}
}

// maxDepth bounds the expressions and calls read for one question.
const maxDepth = 8

// Of bounds e by construction: constants, functions of bounded range,
// never-reassigned variables through their values, and arithmetic on
// those. It reports false when it knows nothing.
func (r *Reader) Of(e ast.Expr) (Interval, bool) {
	v := r.eval(inspector.Cursor{}, e, maxDepth)
	return v, v.Known()
}

// At bounds e where it is evaluated, at cur: also by the conditions
// under which cur runs (see conditions) on variables that are never
// reassigned, and, for a parameter of an unexported function used only by
// direct calls, by the arguments of all of them, each read where it is
// passed.
func (r *Reader) At(cur inspector.Cursor, e ast.Expr) (Interval, bool) {
	v := r.eval(cur, e, maxDepth)
	return v, v.Known()
}

// eval bounds e at cur (a zero cursor: by construction only).
func (r *Reader) eval(cur inspector.Cursor, e ast.Expr, depth int) Interval {
	e = ast.Unparen(e)
	if tv := r.info.Types[e]; tv.Value != nil {
		if tv.Value.Kind() != constant.Int && tv.Value.Kind() != constant.Float {
			return all
		}
		f, _ := constant.Float64Val(constant.ToFloat(tv.Value))
		return point(f)
	}
	if depth == 0 {
		return all
	}
	switch e := e.(type) {
	case *ast.Ident:
		return r.ident(cur, e, depth)
	case *ast.CallExpr:
		return r.call(cur, e, depth)
	case *ast.UnaryExpr:
		if e.Op == token.SUB {
			x := r.eval(cur, e.X, depth-1)
			return Interval{-x.Hi, -x.Lo, x.Away}
		}
	case *ast.BinaryExpr:
		if fractionalPart(r.info, r.decls, e) {
			return Interval{Lo: 0, Hi: 1}
		}
		if e.Op == token.MUL && square(e) {
			lo, hi := r.eval(cur, e.X, depth-1).Magnitude()
			return spread(lo*lo, hi*hi) // a square: both factors are the same value
		}
		return arith(e.Op, r.eval(cur, e.X, depth-1), r.eval(cur, e.Y, depth-1))
	}
	return all
}

// ident bounds a variable: by its value if it is never reassigned, by the
// calls of its function if it is such a parameter, and by the conditions
// at cur.
func (r *Reader) ident(cur inspector.Cursor, id *ast.Ident, depth int) Interval {
	v, ok := r.info.Uses[id].(*types.Var)
	if !ok || r.busy[v] {
		return all
	}
	r.busy[v] = true
	defer delete(r.busy, v)
	got := all
	if init := r.decls[v]; init != nil {
		got = r.eval(cur, init, depth-1) // its variables keep their values, so cur's conditions hold for them
	} else if p, fixed, called := r.param(v); !fixed {
		return all // assigned more than once: a condition may predate its value
	} else if called {
		got = r.fromCalls(v, p, depth-1)
	}
	if cur.Valid() {
		got = got.meet(r.guards(cur, v, depth-1))
	}
	return got
}

// call bounds conversions and math functions of known range.
func (r *Reader) call(cur inspector.Cursor, call *ast.CallExpr, depth int) Interval {
	if tv := r.info.Types[call.Fun]; tv.IsType() && len(call.Args) == 1 {
		return r.eval(cur, call.Args[0], depth-1)
	}
	if x, ok := r.abs.Arg(r.info, r.decls, call); ok {
		return spread(r.eval(cur, x, depth-1).Magnitude())
	}
	fn, ok := typeutil.Callee(r.info, call).(*types.Func)
	if !ok || fn.Pkg() == nil || fn.Pkg().Path() != "math" {
		return all
	}
	args := make([]Interval, len(call.Args))
	for i, a := range call.Args {
		args[i] = r.eval(cur, a, depth-1)
	}
	return mathRange(fn.Name(), args, r.info, call)
}

// mathRange returns the range of a math function's result from its
// arguments' ranges: bounded functions, and monotone ones.
func mathRange(name string, args []Interval, info *types.Info, call *ast.CallExpr) Interval {
	switch name {
	case "Sin", "Cos", "Tanh", "Erf":
		return Interval{Lo: -1, Hi: 1}
	case "Erfc":
		return Interval{Lo: 0, Hi: 2}
	case "Atan":
		return Interval{Lo: -math.Pi / 2, Hi: math.Pi / 2}
	case "Sqrt":
		if args[0].Hi < 0 {
			return all
		}
		return spread(math.Sqrt(math.Max(args[0].Lo, 0)), math.Sqrt(args[0].Hi))
	case "Exp":
		return spread(math.Exp(args[0].Lo), math.Exp(args[0].Hi))
	case "Log":
		if args[0].Lo <= 0 {
			return all
		}
		return spread(math.Log(args[0].Lo), math.Log(args[0].Hi))
	case "Pow":
		if tv := info.Types[call.Args[0]]; tv.Value != nil && args[0].Lo > 0 {
			return powRange(args[0].Lo, args[1])
		}
	}
	return all
}

// powRange returns the range of a^b for a constant a > 0: monotone in b.
func powRange(a float64, b Interval) Interval {
	x, y := math.Pow(a, b.Lo), math.Pow(a, b.Hi)
	return spread(math.Min(x, y), math.Max(x, y))
}

// arith returns the range of x op y.
func arith(op token.Token, x, y Interval) Interval {
	xlo, xhi := x.Magnitude()
	ylo, yhi := y.Magnitude()
	switch op {
	case token.ADD:
		return spread(x.Lo+y.Lo, x.Hi+y.Hi)
	case token.SUB:
		return spread(x.Lo-y.Hi, x.Hi-y.Lo)
	case token.MUL:
		r := hull(mul(x.Lo, y.Lo), mul(x.Lo, y.Hi), mul(x.Hi, y.Lo), mul(x.Hi, y.Hi))
		r.Away = math.Max(r.Away, xlo*ylo) // |x·y| ≥ |x|·|y| at their smallest
		return r
	case token.QUO:
		r := signs(x, y) // a divisor that may be 0 still leaves the sign
		if y.Lo > 0 || y.Hi < 0 {
			r = hull(x.Lo/y.Lo, x.Lo/y.Hi, x.Hi/y.Lo, x.Hi/y.Hi)
		}
		if ylo > 0 && !math.IsInf(yhi, 1) {
			r.Away = math.Max(r.Away, xlo/yhi)
		}
		if ylo > 0 {
			r = r.meet(Interval{Lo: -xhi / ylo, Hi: xhi / ylo}) // |x/y| ≤ max|x| / min|y|
		}
		return r
	}
	return all
}

// signs returns what the signs of x and y alone say of x/y: a quotient of
// two values of known sign has the sign of their product, whatever their
// sizes (0/0 is NaN, left aside).
func signs(x, y Interval) Interval {
	switch {
	case x.Lo >= 0 && y.Lo >= 0, x.Hi <= 0 && y.Hi <= 0:
		return Interval{Lo: 0, Hi: math.Inf(1)}
	case x.Lo >= 0 && y.Hi <= 0, x.Hi <= 0 && y.Lo >= 0:
		return Interval{Lo: math.Inf(-1), Hi: 0}
	}
	return all
}

// mul multiplies two ends, 0·∞ being 0: a factor that is 0 at that end
// makes the product 0 there whatever the other.
func mul(a, b float64) float64 {
	if a == 0 || b == 0 {
		return 0
	}
	return a * b
}

// hull returns the smallest interval holding the values; an undefined
// end (∞/∞) leaves nothing known.
func hull(vs ...float64) Interval {
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, v := range vs {
		if math.IsNaN(v) {
			return all
		}
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	return spread(lo, hi)
}

// square reports whether the product m multiplies a value by itself: the
// same expression twice, with no call in it that could give another value.
func square(m *ast.BinaryExpr) bool {
	calls := false
	ast.Inspect(m.X, func(n ast.Node) bool {
		_, isCall := n.(*ast.CallExpr)
		calls = calls || isCall
		return !calls
	})
	return !calls && types.ExprString(ast.Unparen(m.X)) == types.ExprString(ast.Unparen(m.Y))
}

// fractionalPart reports whether d is x - math.Floor(x), the floor perhaps
// stored in a never-reassigned variable first.
func fractionalPart(info *types.Info, decls map[types.Object]ast.Expr, d *ast.BinaryExpr) bool {
	y := ast.Unparen(d.Y)
	if id, ok := y.(*ast.Ident); ok && decls[info.Uses[id]] != nil {
		y = ast.Unparen(decls[info.Uses[id]])
	}
	call, ok := y.(*ast.CallExpr)
	if d.Op != token.SUB || !ok || len(call.Args) != 1 {
		return false
	}
	return provenance.MathCallee(info, call) == "Floor" &&
		types.ExprString(ast.Unparen(call.Args[0])) == types.ExprString(ast.Unparen(d.X))
}

// guards bounds the never-reassigned variable v by the conditions under
// which cur runs.
func (r *Reader) guards(cur inspector.Cursor, v *types.Var, depth int) Interval {
	got := all
	for cond, holds := range Conditions(cur) {
		got = got.meet(r.constrain(cond, holds, v, depth))
	}
	return got
}

// Conditions yields the conditions that hold (or fail, holds false) where
// cur runs: those of the ifs and else branches around it, of the case of
// a tagless switch it is in (and the failed cases before it), and those
// of if chains earlier in an enclosing block every branch of which
// leaves it. A function literal's body sees the conditions around it: the
// variables read never change, so what held where it was made holds
// whenever it runs.
func Conditions(cur inspector.Cursor) func(yield func(ast.Expr, bool) bool) {
	return func(yield func(ast.Expr, bool) bool) {
		for ; cur.Parent().Node() != nil; cur = cur.Parent() {
			switch p := cur.Parent().Node().(type) {
			case *ast.FuncDecl:
				return
			case *ast.IfStmt:
				switch cur.ParentEdgeKind() {
				case edge.IfStmt_Body:
					if !yield(p.Cond, true) {
						return
					}
				case edge.IfStmt_Else:
					if !yield(p.Cond, false) {
						return
					}
				}
			case *ast.CaseClause:
				if cur.ParentEdgeKind() == edge.CaseClause_Body && !caseConditions(cur.Parent(), yield) {
					return
				}
			case *ast.BlockStmt:
				if !exits(p.List[:max(cur.ParentEdgeIndex(), 0)], yield) {
					return
				}
			}
		}
	}
}

// caseConditions yields the condition of a one-expression case of a
// tagless switch, and the failed conditions of the cases before it.
func caseConditions(clause inspector.Cursor, yield func(ast.Expr, bool) bool) bool {
	sw, ok := clause.Parent().Parent().Node().(*ast.SwitchStmt)
	if !ok || sw.Tag != nil || sw.Init != nil {
		return true
	}
	var conds []ast.Expr
	for _, s := range sw.Body.List {
		cc := s.(*ast.CaseClause)
		if len(cc.List) != 1 {
			return true // a default, or a list of cases
		}
		if cc == clause.Node() {
			for _, c := range conds {
				if !yield(c, false) {
					return false
				}
			}
			return yield(cc.List[0], true)
		}
		if n := len(cc.Body); n > 0 {
			if b, ok := cc.Body[n-1].(*ast.BranchStmt); ok && b.Tok == token.FALLTHROUGH {
				return true // the next case may be entered from this one, whose test held
			}
		}
		conds = append(conds, cc.List[0])
	}
	return true
}

// exits yields the failed conditions of the if chains among stmts (if a
// {...} else if b {...}, no final else) every branch of which leaves the
// block: past such a chain none of its conditions held.
func exits(stmts []ast.Stmt, yield func(ast.Expr, bool) bool) bool {
	for _, s := range stmts {
		var conds []ast.Expr
		for ifs, isIf := s.(*ast.IfStmt); isIf && ifs.Init == nil && tolerance.Leaves(ifs.Body, true); ifs, isIf = ifs.Else.(*ast.IfStmt) {
			conds = append(conds, ifs.Cond)
			if ifs.Else != nil {
				continue
			}
			for _, c := range conds {
				if !yield(c, false) {
					return false
				}
			}
			break
		}
	}
	return true
}

// constrain bounds v where cond holds (or fails): comparisons of v or |v|
// with values of known range, combined by &&, || and !. NaN, for which
// every comparison fails, is left aside: it carries no digits to lose.
func (r *Reader) constrain(cond ast.Expr, holds bool, v *types.Var, depth int) Interval {
	switch e := ast.Unparen(cond).(type) {
	case *ast.UnaryExpr:
		if e.Op == token.NOT {
			return r.constrain(e.X, !holds, v, depth)
		}
	case *ast.BinaryExpr:
		switch {
		case e.Op == token.LAND && holds, e.Op == token.LOR && !holds:
			return r.constrain(e.X, holds, v, depth).meet(r.constrain(e.Y, holds, v, depth))
		case e.Op == token.LAND, e.Op == token.LOR:
			return r.constrain(e.X, holds, v, depth).join(r.constrain(e.Y, holds, v, depth))
		}
		return r.compare(e, holds, v, depth)
	}
	return all
}

// compare bounds v by the comparison e, or by its failure.
func (r *Reader) compare(e *ast.BinaryExpr, holds bool, v *types.Var, depth int) Interval {
	op, lhs, rhs := e.Op, e.X, e.Y
	abs, sq, ok := r.form(lhs, v)
	if !ok {
		op, lhs, rhs = mirror[op], e.Y, e.X
		if abs, sq, ok = r.form(lhs, v); !ok {
			return all
		}
	}
	if !holds {
		op = invert[op]
	}
	k := r.eval(inspector.Cursor{}, rhs, depth)
	if sq {
		k = Interval{Lo: math.Sqrt(math.Max(k.Lo, 0)), Hi: math.Sqrt(math.Max(k.Hi, 0))} // v*v < k: |v| < sqrt(k)
	}
	var got Interval
	switch op {
	case token.LSS, token.LEQ:
		got = Interval{Lo: math.Inf(-1), Hi: k.Hi}
	case token.GTR, token.GEQ:
		got = Interval{Lo: k.Lo, Hi: math.Inf(1)}
	case token.EQL:
		got = k
	default:
		return all
	}
	if abs {
		return Interval{-got.Hi, got.Hi, math.Max(got.Lo, 0)} // |v| above a bound: v on either side of 0
	}
	return spread(got.Lo, got.Hi)
}

// form reports whether e is v, |v| (abs) or v*v (abs and sq).
func (r *Reader) form(e ast.Expr, v *types.Var) (abs, sq, ok bool) {
	e = ast.Unparen(e)
	if m, isMul := e.(*ast.BinaryExpr); isMul && m.Op == token.MUL && square(m) {
		e, abs, sq = ast.Unparen(m.X), true, true
	}
	if call, isCall := e.(*ast.CallExpr); isCall {
		if x, isAbs := r.abs.Arg(r.info, r.decls, call); isAbs {
			e, abs = ast.Unparen(x), true
		} else if tv := r.info.Types[call.Fun]; tv.IsType() && len(call.Args) == 1 {
			e = ast.Unparen(call.Args[0]) // float64(n)
		}
	}
	id, isIdent := e.(*ast.Ident)
	return abs, sq, isIdent && r.info.Uses[id] == v
}

// mirror returns the operator that holds with the operands swapped.
var mirror = map[token.Token]token.Token{token.LSS: token.GTR, token.GTR: token.LSS, token.LEQ: token.GEQ, token.GEQ: token.LEQ, token.EQL: token.EQL, token.NEQ: token.NEQ}

// invert returns the operator that holds when op fails (NaN aside).
var invert = map[token.Token]token.Token{token.LSS: token.GEQ, token.GEQ: token.LSS, token.GTR: token.LEQ, token.LEQ: token.GTR, token.EQL: token.NEQ, token.NEQ: token.EQL}
