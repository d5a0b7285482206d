package stoptol

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"slices"
	"strings"

	"golang.org/x/tools/go/analysis"

	"roundoff/analyzers/internal/constval"
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
// counters or by walking data, and scans by a given step. A recursion
// read as a loop is judged the same way and reported as a recursion.
func (c *checker) unbounded(l *loop) {
	if l.capped || l.other || len(l.exits) == 0 || l.once() || provenance.InTestFile(c.pass.Fset, l.stmt.Pos()) {
		return // a test runs its loops on the fixed inputs it was written for: one that never ended would hang it
	}
	d := newDeps(c.pass.TypesInfo, c.pass.Files, c.pass.Pkg, l)
	for _, e := range l.exits {
		switch {
		case d.errorTest(e), l.rec != nil && l.rec.decided(c.pass.TypesInfo, e):
			continue // a failure exit bounds nothing, nor does one decided on entry
		case !d.floatTest(e):
			return // an exit on something else: data, a state flag
		}
		d.tests = append(d.tests, exitTest{e, e == l.stmt.Cond})
	}
	if len(d.tests) == 0 || d.noFloatLeft() {
		return // no float test, or bisection until no float is left between the ends
	}
	nanRuns := d.nanRuns()
	tested := d.tested()
	carried := d.effects && d.readsState()
	series := false
	for v := range tested {
		if r := d.vanishingStart(v); r != nil && d.grows(v) && !d.bounds(v) {
			c.reportLoop(d, catStall, fmt.Sprintf("loop scales %s each pass and ends only on float tests, but %s can start at 0 (%s), which no scaling moves: the tests then never change and %s; start it away from 0, or add an iteration limit",
				v.Name(), v.Name(), fixes.Source(c.pass.Fset, r), c.uncapped(l, "passes")),
				analysis.RelatedInformation{Pos: r.Pos(), End: r.End(), Message: "the scaled value starts here and can be 0"})
			return
		}
		scaled := !d.recedes(v) && (d.scaled(v, true) || !nanRuns && d.scaled(v, false))
		if scaled && c.zeroTolerance(d, v) {
			return
		}
		switch {
		case scaled, !nanRuns && d.series(v):
			return // it reaches 0 or ±Inf, or it is a term and NaN ends the loop
		case !d.effects && d.fresh(v, 4), d.counted(v):
			return // it is drawn anew, or read at a new integer each pass
		}
		carried = carried || d.carried(v) && !d.shuffled(v)
		series = series || d.series(v)
	}
	if !carried {
		return // the tests read values the loop does not carry from pass to pass
	}
	if l.rec != nil {
		c.reportRecursion(d, nanRuns)
		return
	}
	if series {
		c.reportLoop(d, catNoCap, fmt.Sprintf("series may never end: its only exits test the term (%s) and %s, so a NaN term, for which the test is false, or a sum that stalls keeps it running; add an iteration limit",
			c.exitText(d.tests[0].e), c.uncapped(l, "passes")))
		return
	}
	for _, v := range d.near(tested) {
		if step, ok := d.additive(v); ok {
			c.stepped(l, d, v, step)
			return
		}
	}
	if !nanRuns && c.sweep(d, tested) {
		return // a sweep by fractions of what is left, reported where a fraction can be 0
	}
	c.reportLoop(d, catNoCap, fmt.Sprintf("iteration may never end: its only exits are float tests (%s) and %s, so an iteration that stalls, oscillates or diverges keeps it running%s; add an iteration limit",
		c.exitText(d.tests[0].e), c.uncapped(l, "passes"), nanClause(nanRuns)))
}

// once reports whether the loop's body leaves on its first pass by every
// path: it ends in an unguarded break, return or panic, and no continue
// goes back to the top (a for { ...; break } block written for its
// breaks). It is no iteration.
func (l *loop) once() bool {
	list := l.stmt.Body.List
	return l.rec == nil && len(list) > 0 && l.leaves(list[len(list)-1]) && !hasContinue(l.stmt.Body)
}

// nanClause says, for a message, that a NaN keeps the loop or recursion
// going when it does.
func nanClause(nanRuns bool) string {
	if nanRuns {
		return ", and so does a NaN, which fails every ordered comparison"
	}
	return ""
}

// uncapped says, for a message, that nothing caps the loop's passes (or
// what), or that the cap of its condition is off where an operand beside
// it holds.
func (c *checker) uncapped(l *loop, what string) string {
	if l.capOff != nil {
		return "its cap is off when " + fixes.Source(c.pass.Fset, l.capOff) + " (" + fixes.Source(c.pass.Fset, l.stmt.Cond) + " then never fails)"
	}
	return "nothing caps the " + what
}

// exitText writes an exit test for a message, with the value of a named
// constant it compares with: d < tol, tol = 1e-09.
func (c *checker) exitText(e ast.Expr) string {
	text := fixes.Source(c.pass.Fset, e)
	b, ok := ast.Unparen(e).(*ast.BinaryExpr)
	if !ok {
		return text
	}
	for _, side := range []ast.Expr{b.Y, b.X} {
		v, ok := constval.Exact(c.pass.TypesInfo, c.decls, side)
		if _, lit := ast.Unparen(side).(*ast.BasicLit); ok && !lit && provenance.IsFloat(c.pass.TypesInfo.TypeOf(side)) {
			return text + ", " + fixes.Source(c.pass.Fset, side) + " = " + numeric.Short(provenance.FormatOf(c.pass.TypesInfo.TypeOf(side)).Value(v))
		}
	}
	return text
}

// exitTest is a float test that ends a loop.
type exitTest struct {
	e    ast.Expr
	cond bool // the loop condition, which ends the loop when it fails
}

// reportLoop reports a loop at its first float exit test, naming the
// loop as the related place, and any other places given.
func (c *checker) reportLoop(d *deps, cat, msg string, related ...analysis.RelatedInformation) {
	c.reportLoopAt(d, d.tests[0].e, cat, msg, related...)
}

// reportLoopAt reports a loop at the exit test given.
func (c *checker) reportLoopAt(d *deps, exit ast.Expr, cat, msg string, related ...analysis.RelatedInformation) {
	stmt := d.l.stmt
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
	if isConst && h != 0 && d.onlyAdvances(x) && d.constBound(x) && c.exportedInput(l, x) {
		what := numeric.Short(h)
		if step != nil {
			what = numeric.WithValue(fixes.Source(c.pass.Fset, step), h)
		}
		c.reportLoop(d, catReduction, fmt.Sprintf("range reduction by repeated addition of %s takes |%s|/%.3g passes and never ends once |%s| >= %.3g, where adding %.3g is absorbed; use math.Mod or math.Remainder",
			what, x.Name(), abs(h), x.Name(), f.AbsorbingMagnitude(h), abs(h)))
		return
	}
	if isConst || !d.canVanish(step, 4, d.closed(x)) {
		return // a scan: the caller chose the step and the bounds
	}
	if d.doubling(x) {
		return // x -= b - x: the step doubles each pass
	}
	c.reportLoop(d, catStall, fmt.Sprintf("loop advances %s by the computed step %s and ends only on float tests: when the step rounds to 0, is NaN, or is below half the spacing of %s (%.3g·|%s| in %s), %s stops moving and %s; add an iteration limit",
		x.Name(), fixes.Source(c.pass.Fset, step), x.Name(), f.U, x.Name(), f.Name, x.Name(), c.uncapped(l, "passes")), d.stepSource(step)...)
}

// vanishingStart returns the value v is given before the loop when it can
// be 0 (a difference, |Nextafter(x, 2x) - x| at x = 0): a scaling keeps 0
// at 0, so a v grown each pass (grows) never reaches ±Inf from there.
func (d *deps) vanishingStart(v *types.Var) ast.Expr {
	for _, r := range assignments(d.info, d.l.body, v) {
		if r.Pos() < d.l.stmt.Pos() && d.canVanish(r, 4, false) {
			return r
		}
	}
	return nil
}

// stepSource names where a step variable is computed, when it is a
// variable assigned outside the loop.
func (d *deps) stepSource(step ast.Expr) []analysis.RelatedInformation {
	for _, v := range d.reads(step) {
		for _, r := range assignments(d.info, d.l.body, v) {
			if r.Pos() < d.l.stmt.Pos() && d.canVanish(r, 4, false) {
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

// exportedInput reports whether x enters the loop holding a parameter of
// the exported function around it, or a value the function moves or
// scales from parameters by constants (a := math.Pi/2 - p): in a package
// any module may import, its callers may pass any float, however large,
// and the value is as large. The callers of an unexported function, or
// of one in an internal package, are the module's own, which stoptol does
// not follow; repeated reduction of a value within a few periods takes a
// pass or two, and a value computed otherwise (an Atan2) may be bounded.
func (c *checker) exportedInput(l *loop, x *types.Var) bool {
	fd := l.decl
	if fd == nil || !fd.Name.IsExported() || slices.Contains(strings.Split(c.pass.Pkg.Path(), "/"), "internal") {
		return false
	}
	if c.isParam(fd, x) {
		return true
	}
	if x.Parent() == nil || !(fd.Body.Pos() <= x.Pos() && x.Pos() < l.stmt.Pos()) {
		return false // not a local declared before the loop
	}
	given := false
	for _, r := range assignments(c.pass.TypesInfo, fd.Body, x) {
		if r.Pos() < l.stmt.Pos() {
			if !c.affine(fd, r) {
				return false
			}
			given = true
		}
	}
	return given
}

// affine reports whether e is a parameter of fd, or parameters moved and
// scaled by constants (c - p, p*k, p/k, p + q, float64(p)).
func (c *checker) affine(fd *ast.FuncDecl, e ast.Expr) bool {
	info := c.pass.TypesInfo
	konst := func(e ast.Expr) bool { return info.Types[e].Value != nil }
	switch e := ast.Unparen(e).(type) {
	case *ast.Ident:
		v, ok := info.Uses[e].(*types.Var)
		return ok && c.isParam(fd, v)
	case *ast.UnaryExpr:
		return (e.Op == token.SUB || e.Op == token.ADD) && c.affine(fd, e.X)
	case *ast.BinaryExpr:
		x, y := c.affine(fd, e.X), c.affine(fd, e.Y)
		switch e.Op {
		case token.ADD, token.SUB:
			return x && (y || konst(e.Y)) || y && konst(e.X)
		case token.MUL:
			return x && konst(e.Y) || y && konst(e.X)
		case token.QUO:
			return x && konst(e.Y)
		}
	case *ast.CallExpr:
		tv := info.Types[e.Fun]
		return tv.IsType() && len(e.Args) == 1 && c.affine(fd, e.Args[0])
	}
	return false
}
