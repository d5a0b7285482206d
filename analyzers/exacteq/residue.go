package exacteq

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"strings"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/degree"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
)

// residue reports a zero test of a difference of computed values, such as
// the cross product x1*y2 - x2*y1 == 0 that decides collinearity, or a
// residual a*x + b*y + c with c itself such a difference. A difference is
// zero exactly when its operands are the same float (Sterbenz: the
// subtraction of close floats is exact, so a-b == 0 iff a == b), so the
// test is an exact comparison of two computed values: inputs that make
// them equal in exact arithmetic (collinear points, a point on the line)
// usually leave a residue of a few ulps of the terms. It reports whether
// the comparison was such a zero test. A zero test of a value the
// function then divides by, whose zero branch only records a constant
// answer (no intersection, 0) or reports the case as an error, is a
// division guard: zero is the one
// divisor that gives Inf or NaN, and a residue of a few ulps in its place
// gives a finite quotient of large magnitude, which the code goes on to
// judge (a ratio far outside [0, 1] for near-parallel segments), so the
// test decides nothing by itself. A zero branch that does other work (a
// collinear case) stays a hazard: a residue skips it.
func (c *checker) residue(cur inspector.Cursor, n *ast.BinaryExpr, op token.Token, x, y operand) bool {
	other := x
	if !c.isZero(y) {
		if !c.isZero(x) {
			return false
		}
		other = y
	}
	t := c.pass.TypesInfo.TypeOf(other.expr)
	f := provenance.FormatOf(t)
	if n != nil && c.spread(other.val, 6) {
		fixes.Report(c.pass, analysis.Diagnostic{
			Pos: n.Pos(), End: n.End(), Category: catResidue,
			Message: fmt.Sprintf("exact %s 0 on %s, a spread of data about their computed mean: for constant data the mean is off by rounding (a third of 0.1+0.1+0.1 is 0.10000000000000002), so the spread is a few ulps of the data (%.3g relative each), not 0, and the test misses the case it is meant to catch; test whether every value equals the first, or compare the spread with a tolerance scaled by the mean",
				op, fixes.Source(c.pass.Fset, other.expr), f.U),
		})
		return true
	}
	if n == nil || !c.cancels(other.val, 4) || divides(other.val) && (c.constantBranch(cur, n, op) || op == token.NEQ && c.asserted(cur)) {
		return true
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catResidue,
		Message: fmt.Sprintf("exact %s 0 on %s, a difference of computed %s values: it is 0 only when both terms round to the same float, so inputs that make it 0 in exact arithmetic (collinear points, a point on a line) usually leave a residue of a few ulps of the terms (%.3g relative each); compare its magnitude with a tolerance scaled by the terms",
			op, fixes.Source(c.pass.Fset, other.expr), typeName(t), f.U),
	})
	return true
}

// divides reports whether v is the divisor of a float division.
func divides(v ssa.Value) bool {
	for _, r := range *v.Referrers() {
		if q, ok := r.(*ssa.BinOp); ok && q.Op == token.QUO && q.Y == v && provenance.IsFloat(q.Type()) {
			return true
		}
	}
	return false
}

// constantBranch reports whether n is the condition of an if statement
// whose branch taken on zero (the body for ==, the else for !=) computes
// no answer of its own: it only assigns or returns inert values (see
// inert), or panics.
func (c *checker) constantBranch(cur inspector.Cursor, n *ast.BinaryExpr, op token.Token) bool {
	ifs, ok := cur.Parent().Node().(*ast.IfStmt)
	if !ok || ifs.Cond != n {
		return false
	}
	branch, ok := ifs.Body, true
	if op == token.NEQ {
		branch, ok = ifs.Else.(*ast.BlockStmt)
	}
	if !ok {
		return false
	}
	for _, st := range branch.List {
		var vals []ast.Expr
		switch st := st.(type) {
		case *ast.AssignStmt:
			vals = st.Rhs
		case *ast.ReturnStmt:
			vals = st.Results
		case *ast.ExprStmt:
			vals = []ast.Expr{st.X}
		default:
			return false
		}
		for _, v := range vals {
			if !c.inert(v) {
				return false
			}
		}
	}
	return true
}

// asserted reports whether the test at cur is an argument of an assertion:
// a function of this package that panics when that argument is false (if
// !ok { panic(...) }) or ignores it (a release build's empty stub). The
// zero case then ends the program or passes unseen, as a zero branch that
// panics does, and computes no answer of its own.
func (c *checker) asserted(cur inspector.Cursor) bool {
	call, ok := cur.Parent().Node().(*ast.CallExpr)
	if !ok || cur.ParentEdgeKind() != edge.CallExpr_Args {
		return false
	}
	decl, fn := provenance.CalleeDecl(c.pass.TypesInfo, c.pass.Files, c.pass.Pkg, call)
	i := cur.ParentEdgeIndex()
	if decl == nil || decl.Body == nil || i >= fn.Signature().Params().Len() {
		return false
	}
	p := fn.Signature().Params().At(i)
	body := decl.Body.List
	if len(body) == 0 || p.Name() == "_" {
		return true
	}
	ifs, ok := body[0].(*ast.IfStmt)
	if len(body) != 1 || !ok || ifs.Init != nil || ifs.Else != nil || len(ifs.Body.List) != 1 {
		return false
	}
	not, ok := ast.Unparen(ifs.Cond).(*ast.UnaryExpr)
	id, isID := ast.Unparen(not.X).(*ast.Ident)
	stop, isCall := ifs.Body.List[0].(*ast.ExprStmt)
	return ok && not.Op == token.NOT && isID && c.pass.TypesInfo.Uses[id] == p && isCall && c.stops(stop.X)
}

// stops reports whether e is a call of panic or of log's Fatal and Panic
// functions.
func (c *checker) stops(e ast.Expr) bool {
	call, ok := ast.Unparen(e).(*ast.CallExpr)
	if !ok {
		return false
	}
	switch fn := typeutil.Callee(c.pass.TypesInfo, call).(type) {
	case *types.Builtin:
		return fn.Name() == "panic"
	case *types.Func:
		return fn.Pkg() != nil && fn.Pkg().Path() == "log" && (strings.HasPrefix(fn.Name(), "Fatal") || strings.HasPrefix(fn.Name(), "Panic"))
	}
	return false
}

// inert reports whether e, assigned or returned in a zero branch, is no
// answer computed for that case: a constant, nil, a literal of constants,
// the address of a package variable (&Zero), or an error made to report
// the case (errors.New, fmt.Errorf, panic) to a caller that handles it.
func (c *checker) inert(e ast.Expr) bool {
	info := c.pass.TypesInfo
	switch e := ast.Unparen(e).(type) {
	case *ast.Ident:
		if _, ok := info.Uses[e].(*types.Nil); ok {
			return true
		}
	case *ast.UnaryExpr:
		id, ok := ast.Unparen(e.X).(*ast.Ident)
		v, isVar := info.Uses[id].(*types.Var)
		return e.Op == token.AND && ok && isVar && v.Parent() == v.Pkg().Scope()
	case *ast.CompositeLit:
		for _, elt := range e.Elts {
			if kv, ok := elt.(*ast.KeyValueExpr); ok {
				elt = kv.Value
			}
			if !c.inert(elt) {
				return false
			}
		}
		return true
	case *ast.CallExpr:
		if b, ok := typeutil.Callee(info, e).(*types.Builtin); ok {
			return b.Name() == "panic"
		}
		fn, ok := typeutil.Callee(info, e).(*types.Func)
		return ok && fn.Pkg() != nil && (fn.Pkg().Path() == "errors" && fn.Name() == "New" || fn.Pkg().Path() == "fmt" && fn.Name() == "Errorf")
	}
	return c.isConst(e)
}

// isZero reports whether o is the constant zero.
func (c *checker) isZero(o operand) bool {
	tv, ok := c.pass.TypesInfo.Types[o.expr]
	return ok && tv.Value != nil && tv.Value.String() == "0"
}

// cancels reports whether v is a difference of two computed values, a sum
// or difference with such a difference among its operands, or the result
// of a package function that returns one on every path. A difference that
// subtracts an integral multiple (k := math.Floor(x/y); x - k*y) is a
// remainder reduction, exact where exact sign algorithms use it, and does
// not count.
func (c *checker) cancels(v ssa.Value, depth int) bool {
	if depth == 0 {
		return false
	}
	switch v := provenance.Strip(v).(type) {
	case *ssa.BinOp:
		if v.Op != token.ADD && v.Op != token.SUB || integral(v.X) || integral(v.Y) {
			return false
		}
		if v.Op == token.SUB && c.track.Computed(v.X) && c.track.Computed(v.Y) {
			return !recurrent(v)
		}
		return c.cancels(v.X, depth-1) || c.cancels(v.Y, depth-1)
	case *ssa.Call:
		if fn := v.Common().StaticCallee(); fn != nil && fn.Pkg != nil && fn.Pkg.Pkg.Path() == "math" && fn.Name() == "Abs" {
			return c.cancels(v.Common().Args[0], depth-1) // |d| == 0 exactly when d == 0
		}
		return c.returnsCancelling(v.Common(), depth-1)
	case *ssa.Phi:
		// A sum accumulated over a loop (s += t, a signed area summed
		// edge by edge) cancels where a term does, or where its terms
		// take either sign (see eitherSign).
		for _, e := range v.Edges {
			b, ok := provenance.Strip(e).(*ssa.BinOp)
			if !ok || b.Op != token.ADD && b.Op != token.SUB {
				continue
			}
			if t := accumulated(b, v); t != nil && (c.cancels(t, depth-1) || c.eitherSign(b)) {
				return true
			}
		}
	}
	return false
}

// accumulated returns the term t of b = acc + t (or acc - t, t + acc),
// or nil when acc is not an operand.
func accumulated(b *ssa.BinOp, acc ssa.Value) ssa.Value {
	switch {
	case provenance.Strip(b.X) == acc:
		return b.Y
	case provenance.Strip(b.Y) == acc && b.Op == token.ADD:
		return b.X
	}
	return nil
}

// recurrent reports whether v feeds a merge, as a term of a recurrence
// does (the numerators and denominators of a continued fraction, carried
// to the next pass): its zero is no predicate on the inputs, and a residue
// there only scales the next term.
func recurrent(v ssa.Value) bool {
	for _, r := range *v.Referrers() {
		if _, ok := r.(*ssa.Phi); ok {
			return true
		}
	}
	return false
}

// integral reports whether v is, or is a product with, the result of a
// math function that returns a whole number.
func integral(v ssa.Value) bool {
	v = provenance.Strip(v)
	if b, ok := v.(*ssa.BinOp); ok && b.Op == token.MUL {
		return integral(b.X) || integral(b.Y)
	}
	call, ok := v.(*ssa.Call)
	if !ok {
		return false
	}
	fn := call.Common().StaticCallee()
	return fn != nil && fn.Pkg != nil && fn.Pkg.Pkg.Path() == "math" && wholeMath[fn.Name()]
}

// wholeMath are the math functions whose results are whole numbers.
var wholeMath = map[string]bool{"Floor": true, "Ceil": true, "Trunc": true, "Round": true, "RoundToEven": true}

// returnsCancelling reports whether the callee, a function of this package
// with one result, returns a cancelling difference on every path, or is a
// function of another package that returns the cross product of two plane
// vectors (package vecshape).
func (c *checker) returnsCancelling(call *ssa.CallCommon, depth int) bool {
	fn := call.StaticCallee()
	if fn == nil || fn.Signature.Results().Len() != 1 {
		return false
	}
	if obj, ok := fn.Object().(*types.Func); ok && obj.Pkg() != c.pass.Pkg {
		s, ok := c.shapes(obj)
		return ok && s.Shape == degree.Cross
	}
	return c.everyReturn(call, 0, false, func(v ssa.Value) bool { return c.cancels(v, depth) })
}

// everyReturn reports whether the function call names, of this package,
// returns as its result i a value for which ok holds on every path, the
// paths returning a constant, NaN or an infinity aside when special is
// set (the answers for empty or invalid data).
func (c *checker) everyReturn(call *ssa.CallCommon, i int, special bool, ok func(ssa.Value) bool) bool {
	fn := call.StaticCallee()
	if fn == nil || fn.Blocks == nil || fn.Package() == nil || fn.Package().Pkg != c.pass.Pkg {
		return false
	}
	seen := false
	for ret := range provenance.Returns(fn) {
		if i >= len(ret.Results) || special && isSpecial(ret.Results[i]) {
			continue
		}
		if !ok(ret.Results[i]) {
			return false
		}
		seen = true
	}
	return seen
}

// wholeOf reports whether w is the whole part of x, a product or quotient:
// math.Floor, Ceil, Trunc, Round or RoundToEven of x, or x converted to an
// integer type and back.
func wholeOf(w, x ssa.Value) bool {
	x = provenance.Strip(x)
	if b, ok := x.(*ssa.BinOp); !ok || b.Op != token.MUL && b.Op != token.QUO {
		return false
	}
	switch w := provenance.Strip(w).(type) {
	case *ssa.Call:
		return integral(w) && len(w.Call.Args) == 1 && provenance.Strip(w.Call.Args[0]) == x
	case *ssa.Convert:
		in, ok := w.X.(*ssa.Convert)
		return ok && isInteger(in.Type()) && provenance.Strip(in.X) == x
	}
	return false
}

// isInteger reports whether t is an integer type.
func isInteger(t types.Type) bool {
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&types.IsInteger != 0
}

// reportWhole reports a computed value tested against its own whole part.
func (c *checker) reportWhole(n *ast.BinaryExpr, op token.Token, x, y operand) {
	if n == nil {
		return
	}
	v := x
	if !c.track.Computed(x.val) {
		v = y
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catWhole,
		Message: fmt.Sprintf("exact %s tests whether the computed value %s is a whole number: a value whole in exact arithmetic can come out an ulp below or above (0.29*100 is 28.999999999999996), and the test then misses it; compare with the nearest whole number within a tolerance",
			op, fixes.Source(c.pass.Fset, v.expr)),
	})
}

// fraction reports whether v is the fractional part of a product or
// quotient, x - W(x) with W(x) its whole part (wholeOf), or the remainder
// math.Mod(x, y) of a product or quotient (not a scaling by a power of
// two, which is exact) or of a sum of steps carried around a loop: a
// multiple of y in exact arithmetic lands an ulp off. A sum or difference
// of values as given (2b - 4a + 1 of whole parameters) is left out: it is
// exact wherever its operands are whole or close (Sterbenz).
func (c *checker) fraction(v ssa.Value) bool {
	switch v := provenance.Strip(v).(type) {
	case *ssa.BinOp:
		return v.Op == token.SUB && wholeOf(v.Y, v.X)
	case *ssa.Call:
		fn := v.Call.StaticCallee()
		if fn == nil || fn.Pkg == nil || fn.Pkg.Pkg.Path() != "math" || fn.Name() != "Mod" || len(v.Call.Args) != 2 {
			return false
		}
		switch x := provenance.Strip(v.Call.Args[0]).(type) {
		case *ssa.BinOp:
			return (x.Op == token.MUL || x.Op == token.QUO) && provenance.IsFloat(x.Type()) && !provenance.ExactScaling(x)
		case *ssa.Phi:
			return loopSum(x)
		}
	}
	return false
}

// loopSum reports whether phi is a sum carried around a loop (t +=
// dt), or the merge after the loop of such a sum with its start.
func loopSum(phi *ssa.Phi) bool {
	if _, stepped := provenance.LoopStep(phi); stepped {
		return true
	}
	for _, e := range phi.Edges {
		b, ok := provenance.Strip(e).(*ssa.BinOp)
		if !ok {
			continue
		}
		for _, op := range []ssa.Value{b.X, b.Y} {
			if inner, ok := provenance.Strip(op).(*ssa.Phi); ok && inner != phi {
				if _, stepped := provenance.LoopStep(inner); stepped {
					return true
				}
			}
		}
	}
	return false
}

// isConstVal reports whether v is a constant.
func isConstVal(v ssa.Value) bool {
	_, ok := provenance.Strip(v).(*ssa.Const)
	return ok
}

// reportFraction reports the fractional part of a computed value tested
// exactly against a constant.
func (c *checker) reportFraction(n *ast.BinaryExpr, op token.Token, x, y operand) {
	if n == nil {
		return
	}
	v, k := x, y
	if !c.fraction(x.val) {
		v, k = y, x
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catWhole,
		Message: fmt.Sprintf("exact %s tests the fractional part or remainder %s of a computed value against %s: a value at that fraction in exact arithmetic can come out an ulp below or above (0.29*50 is 14.499999999999998, fraction 0.4999999999999982), and the test then misses it; compare within a tolerance",
			op, fixes.Source(c.pass.Fset, v.expr), fixes.Source(c.pass.Fset, k.expr)),
	})
}
