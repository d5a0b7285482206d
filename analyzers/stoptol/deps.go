package stoptol

import (
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"maps"
	"math"
	"slices"

	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/tolerance"
)

// deps holds the assignments of one loop: what each variable, field or
// slice is computed from.
type deps struct {
	info    *types.Info
	files   []*ast.File    // the package's files, where the functions it calls are read
	pkg     *types.Package // the package
	l       *loop
	tests   []exitTest                  // the float exit tests
	effects bool                        // the loop calls functions for their effects
	from    map[*types.Var][]*types.Var // what the assignments to v read
	rhs     map[*types.Var][]ast.Expr   // the assigned expressions (x += s records s)
	tokens  map[*types.Var][]token.Token
	memo    map[*types.Var]bool
	onStack map[*types.Var]bool
	inFlag  map[*types.Var]bool // flags being read, for flags that read themselves
}

func newDeps(info *types.Info, files []*ast.File, pkg *types.Package, l *loop) *deps {
	d := &deps{info: info, files: files, pkg: pkg, l: l, from: map[*types.Var][]*types.Var{}, rhs: map[*types.Var][]ast.Expr{}, tokens: map[*types.Var][]token.Token{}, memo: map[*types.Var]bool{}, onStack: map[*types.Var]bool{}, inFlag: map[*types.Var]bool{}}
	for _, n := range []ast.Node{l.stmt.Cond, l.stmt.Post, l.stmt.Body} {
		if n != nil {
			ast.Inspect(n, d.record)
		}
	}
	d.recordCalls()
	return d
}

// record notes an assignment.
func (d *deps) record(n ast.Node) bool {
	switch n := n.(type) {
	case *ast.AssignStmt:
		for i, lhs := range n.Lhs {
			v := subjectOf(d.info, lhs)
			if v == nil {
				continue
			}
			rhs := n.Rhs
			if len(n.Lhs) == len(n.Rhs) {
				rhs = n.Rhs[i : i+1]
			}
			for _, r := range rhs {
				d.add(v, n.Tok, r)
			}
		}
	case *ast.ExprStmt:
		if call, ok := n.X.(*ast.CallExpr); ok && !d.info.Types[call.Fun].IsType() && !d.l.isPass(call) {
			d.effects = true
		}
	case *ast.IncDecStmt:
		if v := subjectOf(d.info, n.X); v != nil {
			d.from[v] = append(d.from[v], v)
			d.rhs[v], d.tokens[v] = append(d.rhs[v], nil), append(d.tokens[v], n.Tok)
		}
	}
	return true
}

// add notes the assignment v tok r.
func (d *deps) add(v *types.Var, tok token.Token, r ast.Expr) {
	d.rhs[v], d.tokens[v] = append(d.rhs[v], r), append(d.tokens[v], tok)
	d.from[v] = append(d.from[v], d.reads(r)...)
	if tok != token.ASSIGN && tok != token.DEFINE {
		d.from[v] = append(d.from[v], v) // x op= e reads x
	}
}

// reads returns the variables and fields e reads, except through a
// slice expression: s = s[1:] consumes data, it computes nothing.
func (d *deps) reads(e ast.Expr) []*types.Var {
	var out []*types.Var
	ast.Inspect(e, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.SliceExpr:
			return false
		case *ast.Ident:
			if v, ok := d.info.Uses[n].(*types.Var); ok {
				out = append(out, v)
			}
		case *ast.SelectorExpr:
			if f := tolerance.FieldOf(d.info, n); f != nil {
				out = append(out, f)
			}
		}
		return true
	})
	return out
}

// carried reports whether v's value depends on the previous pass: v lies
// on, or reads from, a cycle of assignments within the loop.
func (d *deps) carried(v *types.Var) bool {
	if c, ok := d.memo[v]; ok {
		return c
	}
	if !carriesFloats(v.Type()) {
		return false // an integer counter moves exactly; a pointer walks data
	}
	if d.onStack[v] {
		return true // a cycle
	}
	d.onStack[v] = true
	c := false
	for _, w := range d.from[v] {
		if d.carried(w) {
			c = true
			break
		}
	}
	delete(d.onStack, v)
	d.memo[v] = c
	return c
}

// shuffled reports whether every cycle of assignments that v lies on or
// reads from is made of plain copies (xA, xB, xC = xB, xC, xA): the loop
// only rearranges a fixed set of values, and what it tests is worked out
// afresh from them, so it visits finitely many states and rounding can
// make none of them stall or drift.
func (d *deps) shuffled(v *types.Var) bool {
	seen := map[*types.Var]bool{}
	var reach func(w *types.Var)
	reach = func(w *types.Var) {
		for _, u := range d.from[w] {
			if !seen[u] {
				seen[u] = true
				reach(u)
			}
		}
	}
	reach(v)
	for w := range seen {
		if d.onCycle(w) && !d.copies(w) {
			return false
		}
	}
	return len(seen) > 0
}

// onCycle reports whether w's assignments in the loop read w back.
func (d *deps) onCycle(w *types.Var) bool {
	seen := map[*types.Var]bool{}
	var reaches func(u *types.Var) bool
	reaches = func(u *types.Var) bool {
		for _, x := range d.from[u] {
			if x == w {
				return true
			}
			if !seen[x] {
				seen[x] = true
				if reaches(x) {
					return true
				}
			}
		}
		return false
	}
	return reaches(w)
}

// copies reports whether every assignment to w in the loop copies another
// variable as it is.
func (d *deps) copies(w *types.Var) bool {
	for i, r := range d.rhs[w] {
		if tok := d.tokens[w][i]; tok != token.ASSIGN && tok != token.DEFINE || tolerance.VarOf(d.info, r) == nil {
			return false
		}
		if _, ok := ast.Unparen(r).(*ast.Ident); !ok {
			return false
		}
	}
	return len(d.rhs[w]) > 0
}

// tested returns the variables and fields the exits read, through the
// flags that hold tests.
func (d *deps) tested() map[*types.Var]bool {
	out := make(map[*types.Var]bool)
	var visit func(ast.Node) bool
	visit = func(n ast.Node) bool {
		if e, ok := n.(ast.Expr); ok {
			for _, v := range d.reads(e) {
				if !out[v] {
					out[v] = true
					for _, f := range d.l.flags[v] {
						ast.Inspect(f, visit)
					}
				}
			}
		}
		return false
	}
	for _, t := range d.tests {
		visit(t.e)
	}
	return out
}

// floatTest reports whether e is a test on floats: an ordered or equality
// comparison of floats, a call returning bool from at least two float
// operands, the receiver included (an approximate-equality helper:
// near(a, b), p.Near(q), small(d, tol)), a flag holding such tests, and
// their negations and combinations.
func (d *deps) floatTest(e ast.Expr) bool {
	switch e := ast.Unparen(e).(type) {
	case *ast.UnaryExpr:
		return e.Op == token.NOT && d.floatTest(e.X)
	case *ast.BinaryExpr:
		switch e.Op {
		case token.LAND, token.LOR:
			return d.floatTest(e.X) && d.floatTest(e.Y)
		case token.EQL, token.NEQ:
			if isBoolType(d.info.TypeOf(e.X)) { // (a < b) != up
				return d.floatTest(e.X) || d.floatTest(e.Y)
			}
			if tolerance.Comparator(d.info, e) {
				return true
			}
		}
		return provenance.IsFloat(d.info.TypeOf(e.X)) && provenance.IsFloat(d.info.TypeOf(e.Y))
	case *ast.CallExpr:
		return isBoolType(d.info.TypeOf(e)) && (tolerance.CountOperands(d.info, e, holdsFloats) >= 2 || floatPredicate(d.info, e)) // two values, or a value and a threshold: a state machine's step (for d.Step()) is no float test
	case *ast.Ident:
		v := tolerance.VarOf(d.info, e)
		if fs := d.l.flags[v]; v != nil && len(fs) > 0 {
			if d.inFlag[v] {
				return true // done = done || …: the rest of the test decides
			}
			d.inFlag[v] = true
			defer delete(d.inFlag, v)
			for _, f := range fs {
				if !d.floatTest(f) {
					return false
				}
			}
			return true
		}
	}
	return false
}

// onNaN evaluates e with NaN in every float comparison: ordered and ==
// comparisons are false, != is true. known is false where the value
// depends on something else.
func (d *deps) onNaN(e ast.Expr) (holds, known bool) {
	switch e := ast.Unparen(e).(type) {
	case *ast.UnaryExpr:
		h, k := d.onNaN(e.X)
		return !h, k && e.Op == token.NOT
	case *ast.BinaryExpr:
		switch e.Op {
		case token.LAND, token.LOR:
			x, kx := d.onNaN(e.X)
			y, ky := d.onNaN(e.Y)
			if e.Op == token.LAND {
				return x && y, kx && ky || kx && !x || ky && !y
			}
			return x || y, kx && ky || kx && x || ky && y
		}
		if provenance.IsFloat(d.info.TypeOf(e.X)) {
			return e.Op == token.NEQ, true
		}
	case *ast.Ident:
		v := tolerance.VarOf(d.info, e)
		if fs := d.l.flags[v]; len(fs) == 1 && !d.inFlag[v] {
			d.inFlag[v] = true
			defer delete(d.inFlag, v)
			return d.onNaN(fs[0])
		}
	}
	return false, false
}

// additive returns the step s when every assignment to v in the loop is
// v += s, v -= s or v = v ± s.
// x++ and x-- give a nil step, a constant 1.
func (d *deps) additive(v *types.Var) (ast.Expr, bool) {
	var step ast.Expr
	for i, r := range d.rhs[v] {
		tok := d.tokens[v][i]
		if tok == token.INC || tok == token.DEC {
			continue
		}
		s, ok := d.stepIn(v, tok, r)
		if !ok {
			return nil, false
		}
		step = s
	}
	return step, len(d.rhs[v]) > 0
}

// doubling reports whether every update of v moves it away from a value b
// the loop does not change, by v's own distance to b (v -= b - v,
// v += v - b, v = v - (b - v)): the distance doubles each pass, so a step
// that is not 0 on entry never falls below the spacing of v, and v
// overflows to an infinity within about 2100 passes.
func (d *deps) doubling(v *types.Var) bool {
	updates := 0
	for i, r := range d.rhs[v] {
		if r.Pos() < d.l.stmt.Pos() || r.End() > d.l.stmt.End() {
			continue // set before the loop (a bracket widened once)
		}
		updates++
		tok := d.tokens[v][i]
		step, ok := d.stepIn(v, tok, r)
		diff, isDiff := ast.Unparen(step).(*ast.BinaryExpr)
		if !ok || !isDiff || diff.Op != token.SUB {
			return false
		}
		sub := tok == token.SUB_ASSIGN
		if outer, isBin := ast.Unparen(r).(*ast.BinaryExpr); tok == token.ASSIGN && isBin {
			sub = outer.Op == token.SUB
		}
		other := diff.X // v -= b - v
		if !sub {
			other = diff.Y // v += v - b
		}
		if self := map[bool]ast.Expr{true: diff.Y, false: diff.X}[sub]; subjectOf(d.info, self) != v {
			return false
		}
		for _, w := range d.reads(other) {
			if w == v || len(assignments(d.info, d.l.stmt, w)) > 0 {
				return false
			}
		}
	}
	return updates > 0
}

func (d *deps) stepIn(v *types.Var, tok token.Token, rhs ast.Expr) (ast.Expr, bool) {
	switch tok {
	case token.ADD_ASSIGN, token.SUB_ASSIGN:
		return rhs, true
	case token.ASSIGN:
		b, ok := ast.Unparen(rhs).(*ast.BinaryExpr)
		if ok && (b.Op == token.ADD || b.Op == token.SUB) && subjectOf(d.info, b.X) == v {
			return b.Y, true
		}
		if ok && b.Op == token.ADD && subjectOf(d.info, b.Y) == v {
			return b.X, true
		}
	}
	return nil, false
}

// canVanish reports whether a step can round to zero for finite inputs:
// a sum or difference (its terms may cancel), a function with a zero at a
// representable point (acos(1), log(1), sin(0), a remainder), a product
// with such a factor, a quotient with such a numerator, or a function of
// such a value; followed through the variables of the function. A
// constant, a parameter, a value loaded from data, or a span divided by a
// count is the caller's step.
func (d *deps) canVanish(e ast.Expr, depth int, closed bool) bool {
	if depth == 0 || e == nil {
		return false
	}
	e = ast.Unparen(e)
	if tv := d.info.Types[e]; tv.Value != nil || !provenance.IsFloat(tv.Type) {
		return false
	}
	switch e := e.(type) {
	case *ast.Ident:
		v := tolerance.VarOf(d.info, e)
		for _, r := range append(d.valuesOf(v), d.rhs[v]...) {
			if tolerance.VarOf(d.info, r) != v && d.canVanish(r, depth-1, closed) {
				return true
			}
		}
	case *ast.UnaryExpr:
		return d.canVanish(e.X, depth, closed)
	case *ast.BinaryExpr:
		switch e.Op {
		case token.ADD, token.SUB:
			return true
		case token.MUL:
			return d.canVanish(e.X, depth, closed) || d.canVanish(e.Y, depth, closed)
		case token.QUO:
			if q, ok := ast.Unparen(e.X).(*ast.BinaryExpr); ok && q.Op == token.SUB && d.info.Types[e.Y].Value == nil && !closed {
				return false // (hi-lo)/n: zero only for an empty span, which a scan to x < hi does not enter
			}
			return d.canVanish(e.X, depth, closed)
		}
	case *ast.CallExpr:
		if d.info.Types[e.Fun].IsType() {
			return len(e.Args) == 1 && d.canVanish(e.Args[0], depth, closed)
		}
		if name := provenance.MathCallee(d.info, e); name != "" {
			if f, ok := vanishing[name]; ok {
				return !d.constantNonZero(f, e.Args)
			}
		}
		for _, a := range e.Args {
			if d.canVanish(a, depth-1, closed) {
				return true
			}
		}
	}
	return false
}

// valuesOf returns the expressions assigned to v in the function that
// declares it; for v := f(...) among several results of a function of the
// package with one return statement, the result f returns there.
func (d *deps) valuesOf(v *types.Var) []ast.Expr {
	body := d.l.body
	if fd := d.declaring(v.Pos()); fd != nil {
		body = fd.Body
	}
	out := assignments(d.info, body, v)
	ast.Inspect(body, func(n ast.Node) bool {
		as, ok := n.(*ast.AssignStmt)
		if !ok || len(as.Rhs) != 1 || len(as.Lhs) < 2 {
			return true
		}
		call, isCall := ast.Unparen(as.Rhs[0]).(*ast.CallExpr)
		for i, lhs := range as.Lhs {
			if isCall && tolerance.VarOf(d.info, lhs) == v {
				if r := d.soleResult(call, i); r != nil {
					out = append(out, r)
				}
			}
		}
		return true
	})
	return out
}

// soleResult returns result i of the one return statement of the
// package's function that call calls, or nil.
func (d *deps) soleResult(call *ast.CallExpr, i int) ast.Expr {
	fd, _ := provenance.CalleeDecl(d.info, d.files, d.pkg, call)
	if fd == nil || fd.Body == nil {
		return nil
	}
	var rets []*ast.ReturnStmt
	ast.Inspect(fd.Body, func(n ast.Node) bool {
		if r, ok := n.(*ast.ReturnStmt); ok {
			rets = append(rets, r)
		}
		_, lit := n.(*ast.FuncLit)
		return !lit
	})
	if len(rets) != 1 || i >= len(rets[0].Results) {
		return nil
	}
	return rets[0].Results[i]
}

// declaring returns the function declaration of the package around pos.
func (d *deps) declaring(pos token.Pos) *ast.FuncDecl {
	for _, f := range d.files {
		if f.FileStart <= pos && pos < f.FileEnd {
			for _, decl := range f.Decls {
				if fd, ok := decl.(*ast.FuncDecl); ok && fd.Pos() <= pos && pos < fd.End() {
					return fd
				}
			}
		}
	}
	return nil
}

// vanishing lists math functions that return 0 at a float argument
// other than 0 itself, or whose result can be 0 for arguments that are
// not, with the function itself to evaluate at constant arguments.
var vanishing = map[string]func(...float64) float64{
	"Acos": one(math.Acos), "Log": one(math.Log), "Log2": one(math.Log2), "Log10": one(math.Log10),
	"Sin": one(math.Sin), "Tan": one(math.Tan), "Floor": one(math.Floor), "Trunc": one(math.Trunc), "Round": one(math.Round),
	"Mod":       func(x ...float64) float64 { return math.Mod(x[0], x[1]) },
	"Remainder": func(x ...float64) float64 { return math.Remainder(x[0], x[1]) },
}

func one(f func(float64) float64) func(...float64) float64 {
	return func(x ...float64) float64 { return f(x[0]) }
}

// constantNonZero reports whether every argument is a constant and f of
// them is not 0: math.Sin(60*math.Pi/180) is a fixed 0.866.
func (d *deps) constantNonZero(f func(...float64) float64, args []ast.Expr) bool {
	xs := make([]float64, len(args))
	for i, a := range args {
		v := d.info.Types[a].Value
		if v == nil {
			return false
		}
		xs[i], _ = constant.Float64Val(constant.ToFloat(v))
	}
	return f(xs...) != 0
}

// scaled reports whether the loop only ever multiplies or divides v by
// something (v *= r, v = v*a*b, v /= b), by factors the loop does not
// change when invariant: a scaling, which reaches 0 or ±Inf unless the
// factor is exactly 1; or else a term of a series, where a value computed
// from such a v in the loop counts too.
func (d *deps) scaled(v *types.Var, invariant bool) bool {
	if d.scaledOnly(v, invariant) {
		return true
	}
	if invariant {
		return false
	}
	for _, w := range d.from[v] {
		if w != v && d.scaledOnly(w, invariant) {
			return true
		}
	}
	return false
}

func (d *deps) scaledOnly(v *types.Var, invariant bool) bool {
	if len(d.rhs[v]) == 0 {
		return false
	}
	for i, r := range d.rhs[v] {
		switch d.tokens[v][i] {
		case token.MUL_ASSIGN, token.QUO_ASSIGN:
		case token.ASSIGN:
			if !d.factorOf(r, v) {
				return false
			}
		default:
			return false
		}
		if invariant && slices.ContainsFunc(d.reads(r), func(w *types.Var) bool { return w != v && len(d.rhs[w]) > 0 }) {
			return false // a factor the loop changes
		}
	}
	return true
}

// recedes reports whether v is scaled by constant factors that all shrink
// it (|c| < 1) and the exits read it only on the side that must be the
// larger for them to hold (a tolerance halved at each level of a
// recursion: |S2-S| <= 15*tol), or by factors that all grow it and they
// read it only on the smaller side: as v tends to 0 or ±Inf the exits
// move out of reach instead of passing.
func (d *deps) recedes(v *types.Var) bool {
	shrinks, grows := false, false
	for i, r := range d.rhs[v] {
		c, ok := d.factor(d.tokens[v][i], r, v)
		if !ok || math.Abs(c) == 1 {
			return false
		}
		shrinks, grows = shrinks || math.Abs(c) < 1, grows || math.Abs(c) > 1
	}
	var small, large bool
	for _, t := range d.tests {
		d.sides(t.e, !t.cond, v, &small, &large)
	}
	return shrinks && !grows && large && !small || grows && !shrinks && small && !large
}

// grows reports whether the loop only scales v by constant factors above
// 1 in magnitude (eps *= 2): a search outward that reaches ±Inf within
// about 2100 passes from any start but 0.
func (d *deps) grows(v *types.Var) bool {
	for i, r := range d.rhs[v] {
		if c, ok := d.factor(d.tokens[v][i], r, v); !ok || math.Abs(c) <= 1 {
			return false
		}
	}
	return len(d.rhs[v]) > 0
}

// bounds reports whether an exit test compares v itself, or a function of
// v alone such as its absolute value, with a constant (d != 0, d > 1e-300): such a test decides at 0
// by itself, as the caller of a rescaling loop arranges, while a test of
// what v feeds (f(x+d) <= 0) stays as it was when v stays at 0.
func (d *deps) bounds(v *types.Var) bool {
	found := false
	for _, t := range d.tests {
		ast.Inspect(t.e, func(n ast.Node) bool {
			b, ok := n.(*ast.BinaryExpr)
			if ok && (provenance.Ordered(b.Op) || b.Op == token.EQL || b.Op == token.NEQ) {
				for _, pair := range [][2]ast.Expr{{b.X, b.Y}, {b.Y, b.X}} {
					x := ast.Unparen(pair[0])
					if call, ok := x.(*ast.CallExpr); ok && len(call.Args) == 1 {
						x = call.Args[0] // math.Abs(d), a function of d alone
					}
					found = found || subjectOf(d.info, x) == v && d.info.Types[pair[1]].Value != nil
				}
			}
			return !found
		})
	}
	return found
}

// factor returns the constant c of an assignment v tok r that scales v by
// c: v *= c, v /= c, v = v/2, v = 0.5*v.
func (d *deps) factor(tok token.Token, r ast.Expr, v *types.Var) (float64, bool) {
	switch tok {
	case token.MUL_ASSIGN, token.QUO_ASSIGN:
		c, n, ok := d.scaleIn(r, v)
		if !ok || n != 0 || c == 0 {
			return 0, false
		}
		if tok == token.QUO_ASSIGN {
			c = 1 / c
		}
		return c, true
	case token.ASSIGN:
		c, n, ok := d.scaleIn(r, v)
		return c, ok && n == 1
	}
	return 0, false
}

// scaleIn reads e as c·v^n, a product and quotient of constants and v.
func (d *deps) scaleIn(e ast.Expr, v *types.Var) (c float64, n int, ok bool) {
	e = ast.Unparen(e)
	if tv := d.info.Types[e]; tv.Value != nil {
		c, _ := constant.Float64Val(constant.ToFloat(tv.Value))
		return c, 0, true
	}
	if tolerance.VarOf(d.info, e) == v {
		return 1, 1, true
	}
	b, isBin := e.(*ast.BinaryExpr)
	if !isBin || b.Op != token.MUL && b.Op != token.QUO {
		return 0, 0, false
	}
	cx, nx, okx := d.scaleIn(b.X, v)
	cy, ny, oky := d.scaleIn(b.Y, v)
	if b.Op == token.QUO {
		return cx / cy, nx - ny, okx && oky && cy != 0
	}
	return cx * cy, nx + ny, okx && oky
}

// sides notes on which side of the comparisons in e v stands: small for
// the side that must be the smaller for e to equal holds, large for the
// other; anywhere else (an equality, a call) counts as both.
func (d *deps) sides(e ast.Expr, holds bool, v *types.Var, small, large *bool) {
	in := func(e ast.Expr) bool { return mentionsAny(d.info, e, map[*types.Var]bool{v: true}) }
	switch e := ast.Unparen(e).(type) {
	case *ast.UnaryExpr:
		if e.Op == token.NOT {
			d.sides(e.X, !holds, v, small, large)
			return
		}
	case *ast.BinaryExpr:
		lo, hi := e.X, e.Y
		switch e.Op {
		case token.LAND, token.LOR:
			d.sides(e.X, holds, v, small, large)
			d.sides(e.Y, holds, v, small, large)
			return
		case token.GTR, token.GEQ:
			lo, hi = hi, lo
		}
		if provenance.Ordered(e.Op) {
			if !holds {
				lo, hi = hi, lo
			}
			*small, *large = *small || in(lo), *large || in(hi)
			return
		}
	}
	if in(e) {
		*small, *large = true, true
	}
}

// counted reports whether v is, or is computed in the loop from, an
// integer counter the loop steps: each pass reads it at a new integer,
// so no float stalls it.
func (d *deps) counted(v *types.Var) bool {
	for _, w := range append(d.from[v], v) {
		if b, ok := w.Type().Underlying().(*types.Basic); ok && b.Info()&types.IsInteger != 0 {
			if _, ok := d.additive(w); ok {
				return true
			}
		}
	}
	return false
}

// factorOf reports whether e is a product (or quotient) with v as a
// factor of its numerator.
func (d *deps) factorOf(e ast.Expr, v *types.Var) bool {
	e = ast.Unparen(e)
	if tolerance.VarOf(d.info, e) == v {
		return true
	}
	b, ok := e.(*ast.BinaryExpr)
	switch {
	case !ok:
		return false
	case b.Op == token.MUL:
		return d.factorOf(b.X, v) || d.factorOf(b.Y, v)
	case b.Op == token.QUO:
		return d.factorOf(b.X, v)
	}
	return false
}

// series reports whether v is a term the loop adds to a sum
// (s += v, y = y + q): a test on the term of a series.
func (d *deps) series(v *types.Var) bool {
	if len(d.rhs[v]) == 0 {
		return false // not recomputed in the loop
	}
	for sum, rs := range d.rhs {
		for i, r := range rs {
			if s, ok := d.stepIn(sum, d.tokens[sum][i], r); ok && sum != v && slices.Contains(d.reads(s), v) {
				return true
			}
		}
	}
	return false
}

// fresh reports whether v is drawn anew each pass: it reads, in the loop,
// a call (not of package math) none of whose arguments or receiver the
// loop assigns, as random draws and polls are.
func (d *deps) fresh(v *types.Var, depth int) bool {
	if depth == 0 {
		return false
	}
	for _, r := range d.rhs[v] {
		if r != nil && d.drawsIn(r) {
			return true
		}
	}
	for _, w := range d.from[v] {
		if w != v && d.fresh(w, depth-1) {
			return true
		}
	}
	return false
}

// drawsIn reports whether e contains such a call.
func (d *deps) drawsIn(e ast.Expr) bool {
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		call, ok := n.(*ast.CallExpr)
		if !ok || found {
			return !found
		}
		if fn, ok := typeutil.Callee(d.info, call).(*types.Func); d.info.Types[call.Fun].IsType() || ok && fn.Pkg() != nil && fn.Pkg().Path() == "math" {
			return true
		}
		for _, v := range d.reads(call) {
			if len(d.rhs[v]) > 0 {
				return true // it reads loop state
			}
		}
		found = provenance.IsFloat(d.info.TypeOf(call))
		return !found
	})
	return found
}

// near returns the tested variables, then the variables they are computed
// from in the loop (rest = end - pos reads pos), each in declaration order.
func (d *deps) near(tested map[*types.Var]bool) []*types.Var {
	byPos := func(a, b *types.Var) int { return int(a.Pos() - b.Pos()) }
	out := slices.SortedFunc(maps.Keys(tested), byPos)
	from := make(map[*types.Var]bool)
	for v := range tested {
		for _, w := range d.from[v] {
			if !tested[w] {
				from[w] = true
			}
		}
	}
	return append(out, slices.SortedFunc(maps.Keys(from), byPos)...)
}

// onlyAdvances reports whether the loop does nothing but advance x and
// test its own exits (if x > 0 { break }).
func (d *deps) onlyAdvances(x *types.Var) bool {
	for _, s := range d.l.stmt.Body.List {
		if d.exitOnly(s) {
			continue
		}
		as, ok := s.(*ast.AssignStmt)
		if !ok || len(as.Lhs) != 1 || tolerance.VarOf(d.info, as.Lhs[0]) != x {
			return false
		}
	}
	return true
}

// exitOnly reports whether s is if e { break } (or return) with e one of
// the loop's float exit tests.
func (d *deps) exitOnly(s ast.Stmt) bool {
	is, ok := s.(*ast.IfStmt)
	if !ok || is.Init != nil || is.Else != nil || len(is.Body.List) != 1 {
		return false
	}
	switch b := is.Body.List[0].(type) {
	case *ast.BranchStmt:
		if b.Tok != token.BREAK || b.Label != nil {
			return false
		}
	case *ast.ReturnStmt:
	default:
		return false
	}
	return slices.ContainsFunc(d.tests, func(t exitTest) bool { return t.e == is.Cond })
}

// noFloatLeft reports whether an exit compares a point m computed from
// the ends a and b of a bracket with one of them, where the loop moves an
// end to m (if m <= a || m >= b): when no float is left between the ends,
// m rounds to one of them, so the test passes after at most about 2100
// halvings in float64.
func (d *deps) noFloatLeft() bool {
	found := false
	for _, t := range d.tests {
		ast.Inspect(t.e, func(n ast.Node) bool {
			b, ok := n.(*ast.BinaryExpr)
			if !ok || !provenance.Ordered(b.Op) && b.Op != token.EQL {
				return !found // m == a tests the same landing on an end as m <= a
			}
			x, y := subjectOf(d.info, b.X), subjectOf(d.info, b.Y)
			found = found || d.interiorEnd(x, y) || d.interiorEnd(y, x)
			return !found
		})
	}
	return found
}

// interiorEnd reports whether m is computed from end and another value,
// and end is moved to m.
func (d *deps) interiorEnd(m, end *types.Var) bool {
	if m == nil || end == nil || m == end || !slices.Contains(d.from[m], end) {
		return false
	}
	other := slices.ContainsFunc(d.from[m], func(v *types.Var) bool { return v != m && v != end })
	moved := slices.ContainsFunc(d.rhs[end], func(r ast.Expr) bool { return tolerance.VarOf(d.info, r) == m })
	return other && moved
}

// constBound reports whether every exit test compares x with a constant,
// as a reduction into a fixed range does (for x < 0, for x >= 2*math.Pi);
// a test against another variable aligns x with it, and how far apart
// they start is the caller's.
func (d *deps) constBound(x *types.Var) bool {
	for _, t := range d.tests {
		b, ok := ast.Unparen(t.e).(*ast.BinaryExpr)
		if !ok {
			return false
		}
		other := b.Y
		if subjectOf(d.info, b.X) != x {
			other = b.X
		}
		if d.info.Types[other].Value == nil {
			return false
		}
	}
	return true
}

// assignments returns the expressions assigned to v in body.
func assignments(info *types.Info, body ast.Node, v *types.Var) []ast.Expr {
	var out []ast.Expr
	ast.Inspect(body, func(n ast.Node) bool {
		if as, ok := n.(*ast.AssignStmt); ok && len(as.Lhs) == len(as.Rhs) {
			for i, lhs := range as.Lhs {
				if tolerance.VarOf(info, lhs) == v {
					out = append(out, as.Rhs[i])
				}
			}
		}
		return true
	})
	return out
}

// carriesFloats reports whether a value of type t can carry float work
// from pass to pass: not an integer, a pointer, an interface, a map, a
// channel or a function; a type parameter does when its terms are floats.
func carriesFloats(t types.Type) bool {
	if _, ok := t.(*types.TypeParam); ok {
		return provenance.IsFloat(t)
	}
	switch u := t.Underlying().(type) {
	case *types.Basic:
		return u.Info()&types.IsInteger == 0
	case *types.Pointer, *types.Interface, *types.Map, *types.Chan, *types.Signature:
		return false
	}
	return true
}

// holdsFloats reports whether t is a float, or a struct or array holding
// floats by value (a point, not a pointer to a solver).
func holdsFloats(t types.Type) bool {
	if t == nil {
		return false
	}
	if provenance.IsFloat(t) {
		return true
	}
	switch u := t.Underlying().(type) {
	case *types.Array:
		return holdsFloats(u.Elem())
	case *types.Struct:
		for i := range u.NumFields() {
			if provenance.IsFloat(u.Field(i).Type()) {
				return true
			}
		}
	}
	return false
}

// floatPredicate reports whether call is a function, not a method, given
// a float value and perhaps tolerances after it (epsilon.IsZero(frac,
// tol...)), floats only, and returning a bool: it can decide only from
// them. math's predicates (IsNaN, IsInf, Signbit) classify a value
// exactly, and a slice first (a gradient) is data whose test is read
// elsewhere.
func floatPredicate(info *types.Info, call *ast.CallExpr) bool {
	fn, ok := typeutil.Callee(info, call).(*types.Func)
	if !ok || fn.Pkg() == nil || fn.Pkg().Path() == "math" {
		return false
	}
	sig := fn.Signature()
	if sig.Recv() != nil || sig.Params().Len() == 0 || !provenance.IsFloat(sig.Params().At(0).Type()) {
		return false
	}
	for p := range sig.Params().Variables() {
		t := p.Type()
		if s, ok := t.Underlying().(*types.Slice); ok {
			t = s.Elem()
		}
		if !provenance.IsFloat(t) {
			return false
		}
	}
	return true
}

func isBoolType(t types.Type) bool {
	b, ok := t.(*types.Basic)
	if !ok && t != nil {
		b, ok = t.Underlying().(*types.Basic)
	}
	return ok && b.Info()&types.IsBoolean != 0
}

// closed reports whether an exit test compares x with <= or >= (a scan
// for x := lo; x <= hi): such a loop enters a span of width 0, where a
// step made from the width is 0.
func (d *deps) closed(x *types.Var) bool {
	found := false
	for _, t := range d.tests {
		ast.Inspect(t.e, func(n ast.Node) bool {
			b, ok := n.(*ast.BinaryExpr)
			found = found || ok && (b.Op == token.LEQ || b.Op == token.GEQ) && (tolerance.VarOf(d.info, b.X) == x || tolerance.VarOf(d.info, b.Y) == x)
			return !found
		})
	}
	return found
}
