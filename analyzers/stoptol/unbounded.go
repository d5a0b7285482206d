package stoptol

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"maps"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/tolerance"
	"roundoff/internal/numeric"
)

// Categories of loops that nothing bounds.
const (
	catStall     = "stall"
	catReduction = "reduction"
)

// unbounded judges a loop with no iteration cap whose every exit is a
// float test, when what it tests is carried from pass to pass by float
// work: nothing but the floats then ends it. It reports, in turn, a range
// reduction by repeated addition, a point advanced by a computed step that
// can round to zero, and any other such iteration. It leaves alone, each
// for a reason in the package doc: bisection until no float is left,
// values scaled each pass (they reach 0 or ±Inf), series whose test reads
// the term, fresh draws (sampling, polling), values carried only by integer
// counters or by walking data, and scans by a given step.
func (c *checker) unbounded(l *loop) {
	if l.capped || l.other || len(l.exits) == 0 {
		return
	}
	d := newDeps(c.pass.TypesInfo, l)
	for i, e := range l.exits {
		switch {
		case d.errorTest(e):
			continue // a failure exit bounds nothing
		case !d.floatTest(e):
			return // an exit on something else: data, a state flag
		}
		d.tests = append(d.tests, exitTest{e, i == 0 && l.stmt.Cond != nil})
	}
	if len(d.tests) == 0 || d.noFloatLeft() {
		return // no float test, or bisection until no float is left between the ends
	}
	nanRuns := d.nanRuns()
	geo := tolerance.Geometric(c.pass.TypesInfo, l.stmt.Cond, l.stmt.Post, l.stmt.Body)
	tested := d.tested()
	carried := d.effects && d.readsState()
	series := false
	for v := range tested {
		if _, ok := geo[v]; ok || !nanRuns && (d.scaled(v) || d.series(v)) || !d.effects && d.fresh(v, 4) {
			return // it reaches 0 or ±Inf, it is a term and NaN ends the loop, or it is drawn anew
		}
		carried = carried || d.carried(v)
		series = series || d.series(v)
	}
	if !carried {
		return // the tests read values the loop does not carry from pass to pass
	}
	if series {
		c.reportLoop(d, catNoCap, fmt.Sprintf("series may never end: its only exits test the term (%s) and nothing caps the passes, so a NaN term, for which the test is false, or a sum that stalls keeps it running; add an iteration limit",
			fixes.Source(c.pass.Fset, d.tests[0].e)))
		return
	}
	for _, v := range d.near(tested) {
		if step, ok := d.additive(v); ok {
			c.stepped(l, d, v, step)
			return
		}
	}
	nan := ""
	if nanRuns {
		nan = ", and so does a NaN, which fails every ordered comparison"
	}
	c.reportLoop(d, catNoCap, fmt.Sprintf("iteration may never end: its only exits are float tests (%s) and nothing caps the passes, so an iteration that stalls, oscillates or diverges keeps it running%s; add an iteration limit",
		fixes.Source(c.pass.Fset, d.tests[0].e), nan))
}

// exitTest is a float test that ends a loop.
type exitTest struct {
	e    ast.Expr
	cond bool // the loop condition, which ends the loop when it fails
}

// reportLoop reports a loop at its first float exit test, naming the
// loop as the related place, and any other places given.
func (c *checker) reportLoop(d *deps, cat, msg string, related ...analysis.RelatedInformation) {
	exit, stmt := d.tests[0].e, d.l.stmt
	if c.pass.Fset.Position(exit.Pos()).Line != c.pass.Fset.Position(stmt.For).Line {
		related = append([]analysis.RelatedInformation{{Pos: stmt.For, End: stmt.For + 3, Message: "the loop it ends"}}, related...)
	}
	fixes.Report(c.pass, analysis.Diagnostic{Pos: exit.Pos(), End: exit.End(), Category: cat, Message: msg, Related: related})
}

// nanRuns reports whether a NaN in the tested values keeps the loop
// running: every exit test is false for NaN operands (the loop condition
// true).
func (d *deps) nanRuns() bool {
	for _, t := range d.tests {
		holds, known := d.onNaN(t.e)
		if !known || holds != t.cond {
			return false
		}
	}
	return true
}

// errorTest reports whether e compares an error (err != nil): an exit on
// failure, which does not bound the passes.
func (d *deps) errorTest(e ast.Expr) bool {
	b, ok := ast.Unparen(e).(*ast.BinaryExpr)
	if !ok || b.Op != token.EQL && b.Op != token.NEQ {
		return false
	}
	errType := types.Universe.Lookup("error").Type()
	return types.Identical(d.info.TypeOf(b.X), errType) || types.Identical(d.info.TypeOf(b.Y), errType)
}

// readsState reports whether an exit test reads a call's result, a slice
// element or a value behind a pointer: state that calls made for their
// effects (v.MulVec(m, w), floats.SubTo(r, a, b)) change unseen.
func (d *deps) readsState() bool {
	found := false
	for _, t := range d.tests {
		ast.Inspect(t.e, func(n ast.Node) bool {
			switch n := n.(type) {
			case *ast.CallExpr:
				found = found || !d.info.Types[n.Fun].IsType()
			case *ast.IndexExpr, *ast.StarExpr:
				found = true
			case *ast.SelectorExpr:
				found = found || tolerance.FieldOf(d.info, n) != nil
			}
			return !found
		})
	}
	return found
}

// stepped judges a loop whose test reads x, advanced by x += step each
// pass (step nil for x++): a range reduction when the loop does nothing
// else, a stall when the step is computed by a formula that can round to
// zero; a scan by a given step otherwise.
func (c *checker) stepped(l *loop, d *deps, x *types.Var, step ast.Expr) {
	f := provenance.FormatOf(x.Type())
	h, isConst := 1.0, step == nil
	if tv := c.pass.TypesInfo.Types[step]; tv.Value != nil {
		h, isConst = f.Value(tv.Value), true
	}
	if isConst && h != 0 && d.onlyAdvances(x) && !d.constStart(x) {
		what := numeric.Short(h)
		if step != nil {
			what = numeric.WithValue(fixes.Source(c.pass.Fset, step), h)
		}
		c.reportLoop(d, catReduction, fmt.Sprintf("range reduction by repeated addition of %s takes |%s|/%.3g passes and never ends once |%s| >= %.3g, where adding %.3g is absorbed; use math.Mod or math.Remainder",
			what, x.Name(), abs(h), x.Name(), f.AbsorbingMagnitude(h), abs(h)))
		return
	}
	if isConst || !d.canVanish(step, 4) {
		return // a scan: the caller chose the step and the bounds
	}
	c.reportLoop(d, catStall, fmt.Sprintf("loop advances %s by the computed step %s and ends only on float tests: when the step rounds to 0, is NaN, or is below half the spacing of %s (%.3g·|%s| in %s), %s stops moving and nothing caps the passes; add an iteration limit",
		x.Name(), fixes.Source(c.pass.Fset, step), x.Name(), f.U, x.Name(), f.Name, x.Name()), d.stepSource(step)...)
}

// stepSource names where a step variable is computed, when it is a
// variable assigned outside the loop.
func (d *deps) stepSource(step ast.Expr) []analysis.RelatedInformation {
	for _, v := range d.reads(step) {
		for _, r := range assignments(d.info, d.l.body, v) {
			if r.Pos() < d.l.stmt.Pos() && d.canVanish(r, 4) {
				return []analysis.RelatedInformation{{Pos: r.Pos(), End: r.End(), Message: "the step is computed here and can round to 0"}}
			}
		}
	}
	return nil
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}

// deps holds the assignments of one loop: what each variable, field or
// slice is computed from.
type deps struct {
	info    *types.Info
	l       *loop
	tests   []exitTest                  // the float exit tests
	effects bool                        // the loop calls functions for their effects
	from    map[*types.Var][]*types.Var // what the assignments to v read
	rhs     map[*types.Var][]ast.Expr   // the assigned expressions (x += s records s)
	tokens  map[*types.Var][]token.Token
	memo    map[*types.Var]bool
	onStack map[*types.Var]bool
}

func newDeps(info *types.Info, l *loop) *deps {
	d := &deps{info: info, l: l, from: map[*types.Var][]*types.Var{}, rhs: map[*types.Var][]ast.Expr{}, tokens: map[*types.Var][]token.Token{}, memo: map[*types.Var]bool{}, onStack: map[*types.Var]bool{}}
	for _, n := range []ast.Node{l.stmt.Cond, l.stmt.Post, l.stmt.Body} {
		if n != nil {
			ast.Inspect(n, d.record)
		}
	}
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
				d.rhs[v], d.tokens[v] = append(d.rhs[v], r), append(d.tokens[v], n.Tok)
				d.from[v] = append(d.from[v], d.reads(r)...)
			}
			if n.Tok != token.ASSIGN && n.Tok != token.DEFINE {
				d.from[v] = append(d.from[v], v) // x op= e reads x
			}
		}
	case *ast.ExprStmt:
		if call, ok := n.X.(*ast.CallExpr); ok && !d.info.Types[call.Fun].IsType() {
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
// comparison of floats, a call returning bool from float arguments or a
// float receiver (an approximate-equality helper), a flag holding such
// tests, and their negations and combinations.
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
		}
		return provenance.IsFloat(d.info.TypeOf(e.X)) && provenance.IsFloat(d.info.TypeOf(e.Y))
	case *ast.CallExpr:
		if !isBoolType(d.info.TypeOf(e)) {
			return false
		}
		args := e.Args
		if sel, ok := ast.Unparen(e.Fun).(*ast.SelectorExpr); ok && d.info.Selections[sel] != nil {
			args = append([]ast.Expr{sel.X}, args...)
		}
		for _, a := range args {
			if holdsFloats(d.info.TypeOf(a)) {
				return true
			}
		}
	case *ast.Ident:
		v := tolerance.VarOf(d.info, e)
		if fs := d.l.flags[v]; v != nil && len(fs) > 0 {
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
		if fs := d.l.flags[tolerance.VarOf(d.info, e)]; len(fs) == 1 {
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
func (d *deps) canVanish(e ast.Expr, depth int) bool {
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
		for _, r := range append(assignments(d.info, d.l.body, v), d.rhs[v]...) {
			if tolerance.VarOf(d.info, r) != v && d.canVanish(r, depth-1) {
				return true
			}
		}
	case *ast.UnaryExpr:
		return d.canVanish(e.X, depth)
	case *ast.BinaryExpr:
		switch e.Op {
		case token.ADD, token.SUB:
			return true
		case token.MUL:
			return d.canVanish(e.X, depth) || d.canVanish(e.Y, depth)
		case token.QUO:
			if q, ok := ast.Unparen(e.X).(*ast.BinaryExpr); ok && q.Op == token.SUB && d.info.Types[e.Y].Value == nil {
				return false // (hi-lo)/n: zero only for an empty span, which the scan does not enter
			}
			return d.canVanish(e.X, depth)
		}
	case *ast.CallExpr:
		if d.info.Types[e.Fun].IsType() {
			return len(e.Args) == 1 && d.canVanish(e.Args[0], depth)
		}
		if fn, ok := typeutil.Callee(d.info, e).(*types.Func); ok && fn.Pkg() != nil && fn.Pkg().Path() == "math" {
			if vanishing[fn.Name()] {
				return true
			}
		}
		for _, a := range e.Args {
			if d.canVanish(a, depth-1) {
				return true
			}
		}
	}
	return false
}

// vanishing lists math functions that return 0 at a float argument
// other than 0 itself, or whose result can be 0 for arguments that are not.
var vanishing = map[string]bool{"Acos": true, "Log": true, "Log2": true, "Log10": true, "Mod": true, "Remainder": true, "Sin": true, "Tan": true, "Floor": true, "Trunc": true, "Round": true}

// scaled reports whether the loop only ever multiplies or divides v by
// something (v *= r, v = v*a*b, v /= b): a term of a series or a
// scaling, which reaches 0 or ±Inf unless the factor is exactly 1. A
// value computed from such a v in the loop counts too.
func (d *deps) scaled(v *types.Var) bool {
	if d.scaledOnly(v) {
		return true
	}
	for _, w := range d.from[v] {
		if w != v && d.scaledOnly(w) {
			return true
		}
	}
	return false
}

func (d *deps) scaledOnly(v *types.Var) bool {
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
	}
	return true
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

// near returns the tested variables, and the variables they are offsets
// of (rest = end - pos reads pos), in the order they are declared.
func (d *deps) near(tested map[*types.Var]bool) []*types.Var {
	set := maps.Clone(tested)
	for v := range tested {
		for _, r := range d.rhs[v] {
			if b, ok := ast.Unparen(r).(*ast.BinaryExpr); ok && (b.Op == token.ADD || b.Op == token.SUB) {
				for _, w := range []*types.Var{subjectOf(d.info, b.X), subjectOf(d.info, b.Y)} {
					if w != nil {
						set[w] = true
					}
				}
			}
		}
	}
	out := slices.Collect(maps.Keys(set))
	slices.SortFunc(out, func(a, b *types.Var) int { return int(a.Pos() - b.Pos()) })
	return out
}

// onlyAdvances reports whether the loop does nothing but advance x.
func (d *deps) onlyAdvances(x *types.Var) bool {
	for _, s := range d.l.stmt.Body.List {
		as, ok := s.(*ast.AssignStmt)
		if !ok || len(as.Lhs) != 1 || tolerance.VarOf(d.info, as.Lhs[0]) != x {
			return false
		}
	}
	return true
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
			if !ok || !isOrdered(b.Op) {
				return !found
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

// constStart reports whether x starts the loop as a constant
// (for x := 0.0; ...).
func (d *deps) constStart(x *types.Var) bool {
	init, ok := d.l.stmt.Init.(*ast.AssignStmt)
	if !ok || len(init.Lhs) != len(init.Rhs) {
		return false
	}
	for i, lhs := range init.Lhs {
		if tolerance.VarOf(d.info, lhs) == x {
			return d.info.Types[init.Rhs[i]].Value != nil
		}
	}
	return false
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
// channel or a function.
func carriesFloats(t types.Type) bool {
	switch u := t.Underlying().(type) {
	case *types.Basic:
		return u.Info()&types.IsInteger == 0
	case *types.Pointer, *types.Interface, *types.Map, *types.Chan, *types.Signature:
		return false
	}
	return true
}

// holdsFloats reports whether t is a float, or a struct or array of them.
func holdsFloats(t types.Type) bool {
	if t == nil {
		return false
	}
	if provenance.IsFloat(t) {
		return true
	}
	switch u := t.Underlying().(type) {
	case *types.Pointer:
		return holdsFloats(u.Elem())
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

func isBoolType(t types.Type) bool {
	b, ok := t.(*types.Basic)
	if !ok && t != nil {
		b, ok = t.Underlying().(*types.Basic)
	}
	return ok && b.Info()&types.IsBoolean != 0
}
