package stoptol

import (
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"
	"slices"
	"strings"

	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/tolerance"
)

// class is what a loop does, as far as its stopping test is concerned.
type class int

const (
	unknown    class = iota
	minimize         // derivative-free minimization: compares function values
	root             // root finding or derivative-based search: sign tests, quotient steps
	fixedPoint       // x = g(x) repeated: converges to a few ulps of x, as root finders do
)

func (c class) String() string {
	return [...]string{"loop", "minimization", "root finding", "fixed-point iteration"}[c]
}

// locatesToUlps reports whether the class locates x to a few ulps.
func (c class) locatesToUlps() bool {
	return c == root || c == fixedPoint
}

// function holds what stoptol learns about a function body once.
type function struct {
	body   ast.Node
	decl   *ast.FuncDecl             // nil for a function literal
	fvals  map[*types.Var]bool       // variables holding function values
	flags  map[*types.Var][]ast.Expr // booleans holding tests (tolerance.Flags)
	movers map[*types.Func][][2]int  // the package's helpers that store through pointers (tolerance.Movers)
}

// loop holds what stoptol learns about one for statement.
type loop struct {
	*function
	stmt    *ast.ForStmt          // for a recursion, for { body } standing for its function
	rec     *recursion            // the recursion read, or nil for a loop
	exits   []ast.Expr            // conditions that end the loop when they hold (or, for the loop condition, fail)
	other   bool                  // some exit is not a condition stoptol reads (unconditional, labelled, in an else branch)
	capped  bool                  // an integer comparison bounds the iterations
	capOff  ast.Expr              // a loop-invariant operand of the loop condition's || that keeps it true: the cap beside it is off
	changed map[types.Object]bool // variables the body or post statement changes (see changedIn)
	class   class
	xvars   map[*types.Var]bool // float variables assigned in the loop, function values excepted
	steps   map[*types.Var]bool // variables added to or subtracted from an x variable
	stepped map[*types.Var]bool // the variables they are added to
	shrunk  map[*types.Var]bool // variables scaled down by a constant factor below 1
	noise   float64             // the objective's declared relative accuracy, or 0
}

// readLoop collects the exits, the cap, the variables and the class of a
// for statement of function fn, or of recursion rec read as one.
func readLoop(info *types.Info, stmt *ast.ForStmt, fn *function, rec *recursion) *loop {
	l := &loop{function: fn, stmt: stmt, rec: rec, xvars: map[*types.Var]bool{}, steps: map[*types.Var]bool{}, stepped: map[*types.Var]bool{}}
	l.changed = changedIn(info, stmt.Post, stmt.Body)
	l.capOff = l.invariantOr(info)
	if tv := info.Types[stmt.Cond]; stmt.Cond != nil && l.capOff == nil && !(tv.Value != nil && constant.BoolVal(tv.Value)) {
		l.exits = append(l.exits, stmt.Cond) // for true { ... } is for { ... }: a condition that never fails ends nothing
	}
	l.walk(info, stmt.Body, nil)
	l.shrunk = tolerance.Shrunk(info, stmt.Cond, stmt.Post, stmt.Body)
	for _, n := range []ast.Node{stmt.Cond, stmt.Post, stmt.Body} {
		if n != nil {
			l.scan(info, n)
		}
	}
	for _, e := range l.exits {
		if hasIntComparison(info, e) && (rec == nil || !rec.decided(info, e)) || l.hasCounterComparison(info, e) {
			l.capped = true
		}
	}
	l.class = l.classify(info)
	return l
}

// walk finds the break and return statements that leave the loop, with the
// conditions of the if statements around them.
func (l *loop) walk(info *types.Info, n ast.Node, conds []ast.Expr) {
	ast.Inspect(n, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.FuncLit:
			return false
		case *ast.BlockStmt:
			l.walkBlock(info, n, conds)
			return false
		case *ast.ForStmt, *ast.RangeStmt, *ast.SwitchStmt, *ast.TypeSwitchStmt, *ast.SelectStmt:
			l.walkInner(n)
			return false
		case *ast.IfStmt:
			l.walk(info, n.Body, append(conds[:len(conds):len(conds)], n.Cond))
			if n.Else != nil {
				l.walkElse(info, n.Else, conds)
			}
			return false
		case *ast.ReturnStmt, *ast.ExprStmt, *ast.BranchStmt:
			switch {
			case l.leaves(n.(ast.Stmt)):
				l.exit(info, conds) // a panic too: if n > maxIter { panic(...) } is a cap
			case isJump(n):
				l.other = true
			}
		}
		return true
	})
}

// walkBlock walks the statements of a block in order. An exit that stands
// unguarded after an if chain every branch of which leaves the pass, one
// of them by an exit of its own (if |f(m)| < eps { return m } else if ...
// { return rec(...) }; return math.Inf(1)), runs only where no condition
// of the chain held: it is a further exit, guarded by their negations. A
// chain whose branches only pass on (a reflection, if x < 0 { return
// f(-x) }, whose call leaves the guard's domain) is not read so.
func (l *loop) walkBlock(info *types.Info, b *ast.BlockStmt, conds []ast.Expr) {
	var negs []ast.Expr
	for _, st := range b.List {
		if len(conds) == 0 && len(negs) > 0 && l.leaves(st) {
			l.exit(info, negs)
			continue
		}
		l.walk(info, st, conds)
		if ifs, ok := st.(*ast.IfStmt); ok {
			if more, ok := l.chainLeaves(ifs); ok {
				negs = append(negs, more...)
			}
		}
	}
}

// isJump reports whether n is a goto or a labelled break, which leave the
// loop by a way stoptol does not read.
func isJump(n ast.Node) bool {
	b, ok := n.(*ast.BranchStmt)
	return ok && (b.Tok == token.GOTO || b.Label != nil && b.Tok == token.BREAK)
}

// leaves reports whether st is itself an exit of the loop: a return that
// ends it, a panic, or an unlabelled break.
func (l *loop) leaves(st ast.Stmt) bool {
	switch s := st.(type) {
	case *ast.ReturnStmt:
		return l.ends(s)
	case *ast.BranchStmt:
		return s.Tok == token.BREAK && s.Label == nil
	case *ast.ExprStmt:
		call, ok := s.X.(*ast.CallExpr)
		return ok && isPanic(call)
	}
	return false
}

// chainLeaves returns the negations of the conditions of an if chain
// (if a {...} else if b {...}) with no final else, when every branch
// leaves the pass and one of them is an exit.
func (l *loop) chainLeaves(ifs *ast.IfStmt) ([]ast.Expr, bool) {
	var negs []ast.Expr
	exit := false
	for {
		if ifs.Init != nil || !tolerance.Leaves(ifs.Body, true) {
			return nil, false
		}
		exit = exit || l.leaves(ifs.Body.List[len(ifs.Body.List)-1])
		negs = append(negs, &ast.UnaryExpr{OpPos: ifs.Cond.Pos(), Op: token.NOT, X: &ast.ParenExpr{Lparen: ifs.Cond.Pos(), X: ifs.Cond, Rparen: ifs.Cond.End()}})
		switch e := ifs.Else.(type) {
		case nil:
			return negs, exit
		case *ast.IfStmt:
			ifs = e
		default:
			return nil, false
		}
	}
}

// isPanic reports whether call is of the builtin panic.
func isPanic(call *ast.CallExpr) bool {
	id, ok := ast.Unparen(call.Fun).(*ast.Ident)
	return ok && id.Name == "panic" && id.Obj == nil
}

// walkInner looks into a nested loop or switch, where an unlabelled break
// leaves only that statement but a return leaves this loop too, by a test
// stoptol does not read.
func (l *loop) walkInner(n ast.Node) {
	ast.Inspect(n, func(m ast.Node) bool {
		switch m := m.(type) {
		case *ast.FuncLit:
			return false
		case *ast.ReturnStmt:
			l.other = l.other || l.ends(m)
		}
		return true
	})
}

// walkElse treats exits in an else branch as exits stoptol does not read.
func (l *loop) walkElse(info *types.Info, n ast.Node, conds []ast.Expr) {
	before := len(l.exits)
	l.walk(info, n, conds)
	if len(l.exits) > before {
		l.exits = l.exits[:before]
		l.other = true
	}
}

// exit records an exit guarded by conds; an unguarded one is not a test.
// A guard the loop does not change beside others (if o.Tol != 0 { if d <
// o.Tol { break } }) selects the exit and ends nothing itself: the others
// are the exit.
func (l *loop) exit(info *types.Info, conds []ast.Expr) {
	if len(conds) == 0 {
		l.other = true
		return
	}
	var varying []ast.Expr
	for _, c := range conds {
		if !l.invariant(info, c) {
			varying = append(varying, c)
		}
	}
	if len(varying) == 0 {
		varying = conds
	}
	l.exits = append(l.exits, varying...)
}

// scan records the variables the loop assigns: function values, x
// variables, steps and shrinking factors.
func (l *loop) scan(info *types.Info, n ast.Node) {
	ast.Inspect(n, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.FuncLit:
			return false
		case *ast.AssignStmt:
			for i, lhs := range n.Lhs {
				v := subjectOf(info, lhs)
				if v == nil || !provenance.IsFloat(info.TypeOf(lhs)) {
					continue
				}
				var rhs ast.Expr
				if len(n.Rhs) == len(n.Lhs) {
					rhs = n.Rhs[i]
				}
				l.assigned(info, v, n.Tok, rhs)
			}
		case *ast.IncDecStmt:
			if v := tolerance.VarOf(info, n.X); v != nil {
				l.xvars[v] = true
			}
		case *ast.CallExpr:
			for _, p := range tolerance.Moved(info, l.movers, n) {
				if v := subjectOf(info, p[0]); v != nil {
					l.assigned(info, v, token.ASSIGN, p[1])
				}
			}
		}
		return true
	})
	for v := range l.xvars {
		if l.fvals[v] {
			delete(l.xvars, v)
		}
	}
}

// assigned classifies one assignment v tok rhs.
func (l *loop) assigned(info *types.Info, v *types.Var, tok token.Token, rhs ast.Expr) {
	s, x := stepOf(info, tok, rhs, v)
	if s != nil {
		l.steps[s] = true
	}
	if x != nil {
		l.stepped[x] = true
	}
	if tok == token.DEFINE && rhs != nil && isSubOf(info, rhs) {
		return // a difference defined in the loop (dx := x1 - x0) is a measure, not an x
	}
	l.xvars[v] = true
}

// isSubOf reports whether e is a difference of two variables or elements;
// x - f(x)/df(x) is a new point, not such a difference.
func isSubOf(info *types.Info, e ast.Expr) bool {
	b, ok := ast.Unparen(e).(*ast.BinaryExpr)
	return ok && b.Op == token.SUB && subjectOf(info, b.X) != nil && subjectOf(info, b.Y) != nil
}

// stepOf returns the step variable s and the point x in x += s, x -= s,
// or y := x ± s (a new point); s is nil when the step is not a variable.
func stepOf(info *types.Info, tok token.Token, rhs ast.Expr, v *types.Var) (s, x *types.Var) {
	switch tok {
	case token.ADD_ASSIGN, token.SUB_ASSIGN:
		return tolerance.VarOf(info, rhs), v
	case token.ASSIGN, token.DEFINE:
		if b, ok := ast.Unparen(rhs).(*ast.BinaryExpr); ok && (b.Op == token.ADD || b.Op == token.SUB) && tolerance.VarOf(info, b.X) != nil {
			return tolerance.VarOf(info, b.Y), tolerance.VarOf(info, b.X)
		}
	}
	return nil, nil
}

// FValues returns the float variables of a function body that hold
// function values: assigned a call of the objective, or another such
// variable, also through a mover (see tolerance.Movers).
func FValues(info *types.Info, movers map[*types.Func][][2]int, body ast.Node) map[*types.Var]bool {
	fv := make(map[*types.Var]bool)
	for changed := true; changed; {
		changed = false
		ast.Inspect(body, func(n ast.Node) bool {
			var pairs [][2]ast.Expr
			switch n := n.(type) {
			case *ast.AssignStmt:
				if len(n.Lhs) == len(n.Rhs) && (n.Tok == token.ASSIGN || n.Tok == token.DEFINE) {
					for i := range n.Lhs {
						pairs = append(pairs, [2]ast.Expr{n.Lhs[i], n.Rhs[i]})
					}
				}
			case *ast.CallExpr:
				pairs = tolerance.Moved(info, movers, n)
			}
			for _, p := range pairs {
				v := tolerance.VarOf(info, p[0])
				if v == nil || fv[v] || !provenance.IsFloat(v.Type()) {
					continue
				}
				if r := tolerance.VarOf(info, p[1]); isFValue(info, p[1]) || r != nil && fv[r] {
					fv[v], changed = true, true
				}
			}
			return true
		})
	}
	return fv
}

// subjectOf returns what an assignment to e changes: a variable, a field,
// or the slice, array or field whose element e is (x[i], s.pts[j]).
func subjectOf(info *types.Info, e ast.Expr) *types.Var {
	switch x := ast.Unparen(e).(type) {
	case *ast.IndexExpr:
		return subjectOf(info, x.X)
	case *ast.SelectorExpr:
		return tolerance.FieldOf(info, x)
	}
	return tolerance.VarOf(info, e)
}

// isFValue reports whether e is a call of a function (not of package math,
// not a conversion) taking and returning floats: the objective evaluated.
func isFValue(info *types.Info, e ast.Expr) bool {
	call, ok := ast.Unparen(e).(*ast.CallExpr)
	if !ok || info.Types[call.Fun].IsType() || len(call.Args) == 0 {
		return false
	}
	if fn, ok := typeutil.Callee(info, call).(*types.Func); ok && fn.Pkg() != nil && strings.HasPrefix(fn.Pkg().Path(), "math") {
		return false
	}
	return provenance.IsFloat(info.TypeOf(call))
}

// hasIntComparison reports whether e compares integers: an iteration cap.
func hasIntComparison(info *types.Info, e ast.Expr) bool {
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		if b, ok := n.(*ast.BinaryExpr); ok && provenance.Ordered(b.Op) {
			if t, ok := info.TypeOf(b.X).Underlying().(*types.Basic); ok && t.Info()&types.IsInteger != 0 {
				found = true
			}
		}
		return !found
	})
	return found
}

// invariantOr returns the operand of the loop condition A || B that the
// loop does not change (for i := 0; max == 0 || i < max; i++): where it
// holds the condition never fails, so on that path the loop has no
// condition and the cap beside it caps nothing. It returns nil when there
// is no such operand, or it is a constant.
func (l *loop) invariantOr(info *types.Info) ast.Expr {
	or, ok := ast.Unparen(l.stmt.Cond).(*ast.BinaryExpr)
	if !ok || or.Op != token.LOR {
		return nil
	}
	for _, side := range []ast.Expr{or.X, or.Y} {
		if l.invariant(info, side) {
			return side
		}
	}
	return nil
}

// invariant reports whether e, not a constant, reads nothing the loop
// changes and calls nothing.
func (l *loop) invariant(info *types.Info, e ast.Expr) bool {
	return info.Types[e].Value == nil && !reads(info, e, l.changed)
}

// changedIn returns the variables (roots of fields and elements) that the
// nodes assign, step, take the address of, or hand to a call that may
// change them (a pointer, slice, map, channel or interface argument; the
// receiver of a pointer method).
func changedIn(info *types.Info, nodes ...ast.Node) map[types.Object]bool {
	changed := map[types.Object]bool{}
	for _, n := range nodes {
		if n == nil {
			continue
		}
		ast.Inspect(n, func(n ast.Node) bool {
			switch n := n.(type) {
			case *ast.AssignStmt:
				for _, l := range n.Lhs {
					changed[rootObj(info, l)] = true
				}
			case *ast.IncDecStmt:
				changed[rootObj(info, n.X)] = true
			case *ast.UnaryExpr:
				if n.Op == token.AND {
					changed[rootObj(info, n.X)] = true
				}
			case *ast.CallExpr:
				for _, a := range n.Args {
					if shares(info.TypeOf(a)) {
						changed[rootObj(info, a)] = true // costs(r) may write r's elements
					}
				}
				if sel, ok := ast.Unparen(n.Fun).(*ast.SelectorExpr); ok && (shares(info.TypeOf(sel.X)) || pointerMethod(info, sel)) {
					changed[rootObj(info, sel.X)] = true // s.Step() may change s
				}
			}
			return true
		})
	}
	return changed
}

// shares reports whether a value of type t lets a callee change what the
// caller holds: a pointer, slice, map, channel or interface.
func shares(t types.Type) bool {
	if t == nil {
		return false
	}
	switch t.Underlying().(type) {
	case *types.Pointer, *types.Slice, *types.Map, *types.Chan, *types.Interface:
		return true
	}
	return false
}

// pointerMethod reports whether sel calls a method with a pointer
// receiver, which may change the value it is called on.
func pointerMethod(info *types.Info, sel *ast.SelectorExpr) bool {
	s := info.Selections[sel]
	if s == nil || s.Kind() != types.MethodVal {
		return false
	}
	_, ptr := s.Obj().Type().(*types.Signature).Recv().Type().(*types.Pointer)
	return ptr
}

// rootObj returns the variable at the root of x, x.f, x[i], *x.
func rootObj(info *types.Info, e ast.Expr) types.Object {
	for {
		switch x := ast.Unparen(e).(type) {
		case *ast.SelectorExpr:
			e = x.X
		case *ast.IndexExpr:
			e = x.X
		case *ast.StarExpr:
			e = x.X
		case *ast.Ident:
			return info.ObjectOf(x)
		default:
			return nil
		}
	}
}

// reads reports whether e reads a variable in vars, or calls anything
// (a call may read state the loop changes).
func reads(info *types.Info, e ast.Expr, vars map[types.Object]bool) bool {
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.CallExpr:
			found = found || !info.Types[n.Fun].IsType()
		case *ast.Ident:
			found = found || vars[info.ObjectOf(n)]
		}
		return !found
	})
	return found
}

// hasCounterComparison reports whether e compares a float counter with a
// constant: an iteration cap written in floats (z := 1.; z += 1; z > 50).
func (l *loop) hasCounterComparison(info *types.Info, e ast.Expr) bool {
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		if b, ok := n.(*ast.BinaryExpr); ok && provenance.Ordered(b.Op) {
			found = found || l.countsTo(info, b.X, b.Y) || l.countsTo(info, b.Y, b.X)
		}
		return !found
	})
	return found
}

// countsTo reports whether x is a float variable declared in the function
// body outside the loop's body, set only to constants outside the loop and
// stepped only by constants of one sign in the loop (x += c, x -= c, x++,
// x--), at least once by a statement the loop runs every pass, and bound is a constant below 2^52 times the
// smallest such step: x then moves by that step each pass, since half the
// spacing of floats below 2^52·|c| is below |c|, and never holds NaN or
// ±Inf, so it reaches the bound like an integer counter.
func (l *loop) countsTo(info *types.Info, x, bound ast.Expr) bool {
	v := tolerance.VarOf(info, x)
	b := info.Types[bound].Value
	if v == nil || b == nil || !provenance.IsFloat(v.Type()) {
		return false
	}
	if l.rec != nil {
		step, ok := l.rec.counterStep(info, v)
		return ok && countsBelow(b, step)
	}
	if v.Pos() < l.body.Pos() || v.Pos() >= l.body.End() {
		return false
	}
	if v.Pos() >= l.stmt.Body.Pos() && v.Pos() < l.stmt.Body.End() {
		return false // declared afresh each pass
	}
	every := map[ast.Stmt]bool{l.stmt.Post: true}
	if !hasContinue(l.stmt.Body) {
		for _, st := range l.stmt.Body.List {
			every[st] = true
		}
	}
	minStep, ok := math.Inf(1), true
	signs := map[bool]bool{}
	step := func(st ast.Stmt, c float64) {
		if every[st] {
			minStep = min(minStep, math.Abs(c))
		}
		if within(st, l.stmt) {
			signs[c > 0] = true
		}
	}
	ast.Inspect(l.body, func(n ast.Node) bool {
		if !ok {
			return false // settled: not a counter
		}
		switch n := n.(type) {
		case *ast.FuncLit:
			ok = !assigns(info, n, v) // a closure the loop calls could reset it
			return false
		case *ast.UnaryExpr:
			ok = n.Op != token.AND || tolerance.VarOf(info, n.X) != v
		case *ast.RangeStmt:
			ok = tolerance.VarOf(info, n.Key) != v && tolerance.VarOf(info, n.Value) != v
		case *ast.IncDecStmt:
			if tolerance.VarOf(info, n.X) == v {
				step(n, map[token.Token]float64{token.INC: 1, token.DEC: -1}[n.Tok])
			}
		case *ast.ValueSpec:
			for i, name := range n.Names {
				ok = ok && (info.Defs[name] != v || i >= len(n.Values) || info.Types[n.Values[i]].Value != nil)
			}
		case *ast.AssignStmt:
			ok = l.constAssign(info, n, v, step)
		}
		return ok
	})
	return ok && len(signs) == 1 && !math.IsInf(minStep, 1) && countsBelow(b, minStep)
}

// countsBelow reports whether the constant bound lies below 2^52 times
// step, where half the spacing of floats is below the step.
func countsBelow(bound constant.Value, step float64) bool {
	limit, _ := constant.Float64Val(constant.ToFloat(bound))
	return math.Abs(limit) < 0x1p52*step
}

// constAssign reports whether as assigns v, if at all, a constant outside
// the loop or steps it by a nonzero constant; it passes each step to step.
func (l *loop) constAssign(info *types.Info, as *ast.AssignStmt, v *types.Var, step func(ast.Stmt, float64)) bool {
	for i, lhs := range as.Lhs {
		if tolerance.VarOf(info, lhs) != v {
			continue
		}
		if len(as.Lhs) != len(as.Rhs) || info.Types[as.Rhs[i]].Value == nil {
			return false
		}
		c, _ := constant.Float64Val(constant.ToFloat(info.Types[as.Rhs[i]].Value))
		switch {
		case as.Tok == token.ADD_ASSIGN && c != 0:
			step(as, c)
		case as.Tok == token.SUB_ASSIGN && c != 0:
			step(as, -c)
		case as.Tok != token.ASSIGN && as.Tok != token.DEFINE, within(as, l.stmt.Body) || l.stmt.Post != nil && within(as, l.stmt.Post):
			return false // a zero step, a scaling, or a reset in the loop
		}
	}
	return true
}

// assigns reports whether n assigns or steps v.
func assigns(info *types.Info, n ast.Node, v *types.Var) bool {
	found := false
	ast.Inspect(n, func(m ast.Node) bool {
		switch m := m.(type) {
		case *ast.AssignStmt:
			found = found || slices.ContainsFunc(m.Lhs, func(e ast.Expr) bool { return tolerance.VarOf(info, e) == v })
		case *ast.IncDecStmt:
			found = found || tolerance.VarOf(info, m.X) == v
		}
		return !found
	})
	return found
}

// hasContinue reports whether body holds a continue statement, which can
// skip the statements after it.
func hasContinue(body ast.Node) bool {
	found := false
	ast.Inspect(body, func(n ast.Node) bool {
		b, ok := n.(*ast.BranchStmt)
		found = found || ok && b.Tok == token.CONTINUE
		return !found
	})
	return found
}

// classify tells a root finding from a minimization. Sign tests make a
// root finding even when the loop also compares |f(a)| with |f(b)|, as a
// zero finder does; comparisons of function values make a minimization even
// when it steps by a quotient, as parabolic interpolation does; a quotient
// step alone (Newton, secant) makes a root finding.
func (l *loop) classify(info *types.Info) class {
	sign, decrease, quotient := false, false, false
	for _, n := range []ast.Node{l.stmt.Cond, l.stmt.Post, l.stmt.Body} {
		if n == nil {
			continue
		}
		ast.Inspect(n, func(n ast.Node) bool {
			switch n := n.(type) {
			case *ast.FuncLit:
				return false
			case *ast.BinaryExpr:
				sign = sign || l.signTest(info, n)
				decrease = decrease || l.decreaseTest(info, n) || l.parabolaTerm(info, n)
			case *ast.CallExpr:
				if provenance.MathCallee(info, n) == "Signbit" {
					sign = true
				}
			case *ast.AssignStmt:
				quotient = quotient || l.quotientStep(info, n)
			}
			return true
		})
	}
	switch {
	case sign:
		return root
	case decrease:
		return minimize
	case quotient:
		return root
	case l.replaces(info):
		return fixedPoint
	}
	return unknown
}

// replaces reports whether the loop replaces a float variable by a
// formula of itself that is neither a step added to it nor a scaling of
// it: x = (x + a/x)/2 (Heron's rule, Newton rearranged), x = g(x), a
// corrector applied again, directly or through a temporary defined in the
// loop (next := g(x); x = next).
func (l *loop) replaces(info *types.Info) bool {
	temps := make(map[*types.Var]ast.Expr)
	found := false
	ast.Inspect(l.stmt.Body, func(n ast.Node) bool {
		as, ok := n.(*ast.AssignStmt)
		if !ok || len(as.Lhs) != len(as.Rhs) || found {
			return !found
		}
		for i, lhs := range as.Lhs {
			v, rhs := tolerance.VarOf(info, lhs), as.Rhs[i]
			switch {
			case v == nil || !provenance.IsFloat(v.Type()):
			case as.Tok == token.DEFINE:
				temps[v] = rhs
			case as.Tok == token.ASSIGN:
				if t, ok := temps[tolerance.VarOf(info, rhs)]; ok {
					rhs = t
				}
				found = found || nonlinearIn(info, rhs, v)
			}
		}
		return !found
	})
	return found
}

// nonlinearIn reports whether e divides by v or calls a function of v,
// and is not v ± s: x = (x + a/x)/2, not x = x + h*f(x) nor the running
// average x = (x + d)/2, which is linear in x.
func nonlinearIn(info *types.Info, e ast.Expr, v *types.Var) bool {
	if b, ok := ast.Unparen(e).(*ast.BinaryExpr); ok && (b.Op == token.ADD || b.Op == token.SUB) && (tolerance.VarOf(info, b.X) == v || tolerance.VarOf(info, b.Y) == v) {
		return false
	}
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.BinaryExpr:
			found = found || n.Op == token.QUO && mentionsAny(info, n.Y, map[*types.Var]bool{v: true})
		case *ast.CallExpr:
			found = found || !info.Types[n.Fun].IsType() && mentionsAny(info, n, map[*types.Var]bool{v: true})
		}
		return !found
	})
	return found
}

// parabolaTerm reports whether b multiplies a difference of points by a
// difference of function values, (b-a)*(fb-fc): the building block of the
// vertex of the parabola through three points, x = b - ((b-a)²(fb-fc) -
// (b-c)²(fb-fa)) / 2((b-a)(fb-fc) - (b-c)(fb-fa)), a minimization step
// (Brent 1973, ch. 5). Secant and inverse quadratic steps multiply a
// difference of points by one function value, or differences of function
// values together.
func (l *loop) parabolaTerm(info *types.Info, b *ast.BinaryExpr) bool {
	if b.Op != token.MUL {
		return false
	}
	fdiff := func(e ast.Expr) bool {
		d, ok := ast.Unparen(e).(*ast.BinaryExpr)
		return ok && d.Op == token.SUB && l.fvalue(info, d.X) && l.fvalue(info, d.Y)
	}
	xdiff := func(e ast.Expr) bool {
		d, ok := ast.Unparen(e).(*ast.BinaryExpr)
		return ok && d.Op == token.SUB && !l.fvalue(info, d.X) && !l.fvalue(info, d.Y) && provenance.IsFloat(info.TypeOf(d))
	}
	return fdiff(b.X) && xdiff(b.Y) || xdiff(b.X) && fdiff(b.Y)
}

// decreaseTest reports whether b orders two function values, possibly one
// plus a term: fc < fd, f(u) <= fx, f(x+t*d) > fx + c*t*g (sufficient decrease).
func (l *loop) decreaseTest(info *types.Info, b *ast.BinaryExpr) bool {
	if !provenance.Ordered(b.Op) {
		return false
	}
	shifted := func(e ast.Expr) bool {
		s, ok := ast.Unparen(e).(*ast.BinaryExpr)
		return l.fvalue(info, e) || ok && (s.Op == token.ADD || s.Op == token.SUB) && l.fvalue(info, s.X)
	}
	return l.fvalue(info, b.X) && shifted(b.Y) || l.fvalue(info, b.Y) && shifted(b.X)
}

// signTest reports whether b tests the sign of a product of function
// values (fa*fm < 0) or compares two signs ((fa > 0) == (fb > 0)).
func (l *loop) signTest(info *types.Info, b *ast.BinaryExpr) bool {
	if provenance.Ordered(b.Op) && isZero(info, b.Y) {
		if m, ok := ast.Unparen(b.X).(*ast.BinaryExpr); ok && m.Op == token.MUL && l.fvalue(info, m.X) && l.fvalue(info, m.Y) {
			return true
		}
	}
	if b.Op == token.EQL || b.Op == token.NEQ {
		x, ok1 := ast.Unparen(b.X).(*ast.BinaryExpr)
		y, ok2 := ast.Unparen(b.Y).(*ast.BinaryExpr)
		return ok1 && ok2 && provenance.Ordered(x.Op) && provenance.Ordered(y.Op) && isZero(info, x.Y) && isZero(info, y.Y)
	}
	return false
}

// quotientStep reports whether as assigns a quotient whose numerator is a
// function value, or a product with one, at a point the loop steps:
// x -= f(x)/df(x) and dx := f(x)/df(x) (Newton), x2 := x1 -
// f1*(x1-x0)/(f1-f0) (secant). A series term such as c(n)*x^n/n, added to a
// sum, is no such step: its numerator does not involve the sum.
func (l *loop) quotientStep(info *types.Info, as *ast.AssignStmt) bool {
	found := false
	for _, rhs := range as.Rhs {
		ast.Inspect(rhs, func(n ast.Node) bool {
			q, ok := n.(*ast.BinaryExpr)
			if !ok || q.Op != token.QUO {
				return !found
			}
			num := ast.Unparen(q.X)
			fv := l.fvalue(info, num)
			if m, ok := num.(*ast.BinaryExpr); ok && m.Op == token.MUL {
				fv = fv || l.fvalue(info, m.X) || l.fvalue(info, m.Y)
			}
			found = fv && mentionsAny(info, num, l.stepped)
			return !found
		})
	}
	return found
}

// fvalue reports whether e is a function value: a call of the objective or
// a variable the loop assigns one.
func (l *loop) fvalue(info *types.Info, e ast.Expr) bool {
	e = ast.Unparen(e)
	if a, ok := e.(*ast.CallExpr); ok {
		if provenance.MathCallee(info, a) == "Abs" && len(a.Args) == 1 {
			e = ast.Unparen(a.Args[0]) // |f(a)| < |f(b)| compares function values too
		}
	}
	if v := tolerance.VarOf(info, e); v != nil {
		return l.fvals[v]
	}
	return isFValue(info, e)
}

// isZero reports whether e is the numeric constant 0 (a string or
// boolean constant, compared in loops too, is none).
func isZero(info *types.Info, e ast.Expr) bool {
	tv, ok := info.Types[e]
	if !ok || tv.Value == nil {
		return false
	}
	k := tv.Value.Kind()
	return (k == constant.Int || k == constant.Float) && constant.Sign(tv.Value) == 0
}
