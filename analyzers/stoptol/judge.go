package stoptol

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"math"
	"regexp"
	"strconv"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/tolerance"
	"roundoff/internal/numeric"
)

// verdict is what is wrong with a tolerance of a given use, if anything.
type verdict int

const (
	fine     verdict = iota
	tight            // tighter than the method can locate x
	unscaled         // absolute, and below sqrt(eps): fails once |x| is large
	floor            // below what any float resolves: epsfloor's to report
)

// judge classifies a constant tolerance tol of use u. A difference of two
// x values (not a step) below the format's resolution is epsfloor's.
func judge(u use, tol float64) verdict {
	f := u.format()
	kind := map[bool]tolerance.Kind{false: tolerance.Absolute, true: tolerance.Relative}[u.Relative]
	switch {
	case !(tol > 0) || tol <= tolerance.UnderflowGuard:
		return fine
	case !u.Step && tolerance.Judge(kind, tol, f, 0) != tolerance.Resolvable:
		return floor
	case u.Class == minimize && tol < u.floor():
		return tight
	case u.Class.locatesToUlps() && u.Relative && u.Step && tol < f.U:
		return tight
	case u.Class.locatesToUlps() && !u.Relative && tol < f.SqrtEps():
		return unscaled
	}
	return fine
}

// explain says why tolerance tol of use u fails, for a message.
func explain(v verdict, u use, tol float64) string {
	f := u.format()
	switch {
	case v == tight && u.Class == minimize && u.Noise > 0:
		return fmt.Sprintf("comparing values of a function accurate only to %.3g relative locates a minimum only to about sqrt(%.3g)·max(1,|x|) = %.3g·max(1,|x|) (Gill, Murray & Wright 1981), so the test wastes iterations or never passes; use at least %s",
			u.Noise, u.Noise, u.floor(), u.floorLit())
	case v == tight && u.Class == minimize:
		return fmt.Sprintf("comparing function values locates a minimum only to about sqrt(eps)·max(1,|x|) = %.3g·max(1,|x|) in %s (Brent 1973), so the test wastes iterations or never passes; use at least %s",
			f.SqrtEps(), f.Name, u.floorLit())
	case v == tight:
		return fmt.Sprintf("a step below the unit roundoff of %s (%.3g) relative to |x| cannot be resolved, so the test passes only for a zero step; use a few ulps, such as %s", f.Name, f.U, f.FewUlpsLiteral())
	}
	return fmt.Sprintf("it ignores |x|: from |x| = %.3g on, adjacent %s values are more than %.3g apart and the test can never pass; scale it with |x|",
		f.SpacingAbove(tol), f.Name, tol)
}

// loop judges the stopping tests of one loop.
func (c *checker) loop(cur inspector.Cursor, l *loop) {
	allX, risky := len(l.exits) > 0, false
	for _, e := range l.exits {
		tests := c.xtests(e, l)
		if len(tests) == 0 {
			allX = false
		}
		for _, t := range tests {
			if c.test(cur, t, l) && !c.onShrunk(t, l) {
				risky = true
			}
		}
	}
	if allX && !l.other && !l.capped && risky {
		fixes.Report(c.pass, analysis.Diagnostic{
			Pos: l.stmt.For, End: l.stmt.For + 3, Category: catNoCap,
			Message: fmt.Sprintf("%s may not terminate: its only exits are tolerance tests on x, which cannot pass when the tolerance is below the spacing of floats near x (%.3g·|x| in float64), and %s; add an iteration limit", l.class, numeric.Float64.Eps, c.uncapped(l, "iterations")),
		})
	} else {
		c.unbounded(l)
	}
	c.backtrack(l)
}

// xtests returns the tolerance tests on x quantities within an exit
// condition: differences of x variables, steps, and their relative forms.
// A flag holding a test (for !converged) is read as the tests it holds.
func (c *checker) xtests(cond ast.Expr, l *loop) []tolerance.Test {
	r := c.reader(l)
	var out []tolerance.Test
	seen := make(map[*types.Var]bool)
	var visit func(ast.Node) bool
	visit = func(n ast.Node) bool {
		if id, ok := n.(*ast.Ident); ok && !seen[tolerance.VarOf(c.pass.TypesInfo, id)] {
			v := tolerance.VarOf(c.pass.TypesInfo, id)
			seen[v] = true
			for _, e := range l.flags[v] {
				ast.Inspect(e, visit)
			}
		}
		b, ok := n.(*ast.BinaryExpr)
		if !ok {
			return !isFuncLit(n)
		}
		t, ok := r.Recognize(b)
		if ok && c.onX(t, l, r.Widths) {
			out = append(out, t)
			return false
		}
		return true
	}
	ast.Inspect(cond, visit)
	return out
}

func isFuncLit(n ast.Node) bool { _, ok := n.(*ast.FuncLit); return ok }

// onX reports whether a test measures x: a difference of two things the
// loop updates (a bracket, successive iterates, two elements of a slice of
// points) or a step added to one, or a width shrunk each pass.
func (c *checker) onX(t tolerance.Test, l *loop, widths map[*types.Var]bool) bool {
	info := c.pass.TypesInfo
	switch t.Kind {
	case tolerance.Absolute, tolerance.Relative:
		a, b := subjectOf(info, t.A), subjectOf(info, t.B)
		return a != nil && b != nil && (a != b || isIndex(t.A) && isIndex(t.B)) && l.xvars[a] && l.xvars[b]
	case tolerance.Magnitude, tolerance.RelativeMagnitude:
		s := tolerance.VarOf(info, t.A)
		return s != nil && (l.steps[s] || widths[s])
	}
	return false
}

// onShrunk reports whether t tests a quantity the loop shrinks by a
// constant factor: it falls below any positive tolerance after finitely
// many passes, so the test ends the loop even when it is too tight.
func (c *checker) onShrunk(t tolerance.Test, l *loop) bool {
	v := tolerance.VarOf(c.pass.TypesInfo, t.A)
	return t.Kind == tolerance.Magnitude && v != nil && l.shrunk[v]
}

func isIndex(e ast.Expr) bool { _, ok := ast.Unparen(e).(*ast.IndexExpr); return ok }

// test judges one stopping test, reporting a constant tolerance that is
// too tight and learning a parameter or field one. It reports whether the
// test puts termination at risk: a tolerance too tight for some |x|, or
// one a caller chooses.
func (c *checker) test(cur inspector.Cursor, t tolerance.Test, l *loop) bool {
	f := provenance.FormatOf(c.pass.TypesInfo.TypeOf(t.A))
	u := use{
		Class:    l.class,
		Relative: t.Kind == tolerance.Relative || t.Kind == tolerance.RelativeMagnitude,
		Step:     t.Kind == tolerance.Magnitude || t.Kind == tolerance.RelativeMagnitude,
		Float32:  f == numeric.Float32,
		Noise:    l.noise,
		Where:    enclosingName(cur),
	}
	src := c.resolve(cur, t.Tol, u, t.Cmp)
	if !src.constant {
		return src.learned
	}
	tol := src.value / t.Factor // (b-a)/2 < tol holds when |b-a| < 2·tol
	v := judge(u, tol)
	switch v {
	case fine:
		return false
	case floor:
		return true // epsfloor reports the test itself
	}
	cat := map[verdict]string{tight: catTight, unscaled: catUnscaled}[v]
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: t.Cmp.Pos(), End: t.Cmp.End(), Category: cat,
		Message: fmt.Sprintf("%s %s: %s", describe(u, fixes.Source(c.pass.Fset, t.Tol), src.value), "in this "+l.class.String(), explain(v, u, tol)),
	}, c.scaledFix(cur, t, u, v)...)
	return true
}

// describe names a tolerance for a message.
func describe(u use, src string, tol float64) string {
	if _, err := strconv.ParseFloat(src, 64); err != nil {
		src += " (" + numeric.Short(tol) + ")"
	}
	kind := map[bool]string{false: "absolute", true: "relative"}[u.Relative]
	what := map[bool]string{false: "x-tolerance", true: "step tolerance"}[u.Step]
	return kind + " " + what + " " + src
}

// site reports a constant val reaching a stopping tolerance of use u.
// The finding stands at the test, naming the constant, when the test is
// given (a default set in the testing function); otherwise at the
// constant, naming the test when this package holds it.
//
// A constant written in a test file is left alone: a test case's
// tolerance runs on the one problem of that case, whose scale its author
// knows, and running the test settles whether it is met.
func (c *checker) site(val ast.Expr, u use, how string, test ast.Node) {
	tv, ok := c.pass.TypesInfo.Types[val]
	if !ok || tv.Value == nil || provenance.InTestFile(c.pass.Fset, val.Pos()) {
		return
	}
	at, related := ast.Node(val), []analysis.RelatedInformation(nil)
	if test != nil {
		at, related = test, []analysis.RelatedInformation{{Pos: val.Pos(), End: val.End(), Message: "the tolerance is set here"}}
	} else if t, ok := c.tests[u]; ok {
		related = []analysis.RelatedInformation{{Pos: t.Pos(), End: t.End(), Message: "the test it sets"}}
	}
	tol := u.format().Value(tv.Value)
	if u.Grad {
		if tol > 0 && tol < u.format().SqrtEps() && tol > tolerance.UnderflowGuard {
			c.reportGrad(at, fmt.Sprintf("%s, %s (%s),", numeric.WithValue(fixes.Source(c.pass.Fset, val), tol), how, u), related...)
		}
		return
	}
	v := judge(u, tol)
	if v == fine || v == floor {
		return
	}
	cat := map[verdict]string{tight: catTight, unscaled: catUnscaled}[v]
	d := analysis.Diagnostic{
		Pos: at.Pos(), End: at.End(), Category: cat, Related: related,
		Message: fmt.Sprintf("%s, %s (%s), is too tight: %s", numeric.WithValue(fixes.Source(c.pass.Fset, val), tol), how, u, explain(v, u, tol)),
	}
	var fs []fixes.Fix
	if v == tight && u.Class == minimize {
		fs = append(fs, fixes.Judgement("Use the attainable precision: "+u.floorLit(), fixes.Replace(val, u.floorLit())))
	}
	fixes.Report(c.pass, d, fs...)
}

// floor returns the relative precision to which a minimization of the use's
// objective can locate x: sqrt of its noise level, or of eps.
func (u use) floor() float64 {
	if u.Noise > 0 {
		return math.Sqrt(u.Noise)
	}
	return u.format().SqrtEps()
}

// floorLit writes floor for a fix: sqrt(eps) exactly, or the noise floor
// rounded to three digits.
func (u use) floorLit() string {
	if u.Noise > 0 {
		return strconv.FormatFloat(u.floor(), 'g', 3, 64)
	}
	return u.format().SqrtEpsLiteral()
}

// scaledFix returns the fix for a too-tight or unscaled test on a
// difference written in the comparison: in a minimization the test becomes
// |b-a| <= 2*(sqrt(eps)*|b| + tol), in a root finding tol + 4ulps·|b|.
// A tight relative tolerance is raised to the format's floor instead.
func (c *checker) scaledFix(cur inspector.Cursor, t tolerance.Test, u use, v verdict) []fixes.Fix {
	f := u.format()
	if u.Relative {
		lit := u.floorLit()
		if u.Class.locatesToUlps() {
			lit = f.FewUlpsLiteral()
		}
		return []fixes.Fix{fixes.Judgement("Use "+lit, fixes.Replace(t.Tol, lit))}
	}
	if t.Kind != tolerance.Absolute || t.TwoSided || !within(t.B, t.Cmp) || !fixes.Pure(c.pass.TypesInfo, t.B) ||
		!types.Identical(c.pass.TypesInfo.TypeOf(t.B), types.Typ[types.Float64]) {
		return nil
	}
	name, edits, ok := fixes.Import(c.pass.TypesInfo, fileOf(cur), t.Cmp.Pos(), "math")
	if !ok {
		return nil
	}
	tol, b := fixes.Operand(c.pass.Fset, t.Tol, token.ADD.Precedence()), fixes.Source(c.pass.Fset, t.B)
	text := fmt.Sprintf("2*(%[1]s*%[2]s.Abs(%[3]s) + %[4]s)", u.floorLit(), name, b, tol)
	msg := "Scale by |x| with the attainable precision: "
	if v == unscaled {
		text = fmt.Sprintf("%[1]s + %[2]s*%[3]s.Abs(%[4]s)", tol, f.FewUlpsLiteral(), name, b)
		msg = "Add 4 ulps of |x|: "
	}
	return []fixes.Fix{fixes.Judgement(msg+text, append(edits, fixes.Replace(t.Tol, text))...)}
}

// within reports whether n lies inside outer.
func within(n, outer ast.Node) bool {
	return n != nil && n.Pos() >= outer.Pos() && n.End() <= outer.End()
}

// fileOf returns the file enclosing cur.
func fileOf(cur inspector.Cursor) *ast.File {
	for f := range cur.Enclosing((*ast.File)(nil)) {
		return f.Node().(*ast.File)
	}
	return nil
}

// gradNorm matches expressions that name a gradient norm.
var gradNorm = regexp.MustCompile(`(?i)grad.*norm|norm.*grad|\bgnorm`)

// gradient reports an absolute threshold on a gradient norm below
// sqrt(eps), which ignores the scale of f.
func (c *checker) gradient(cur inspector.Cursor, n *ast.BinaryExpr) {
	t, ok := tolerance.Recognize(c.pass.TypesInfo, c.decls, n)
	if !ok {
		t, ok = magnitudeTest(n)
	}
	if !ok || t.Kind != tolerance.Magnitude ||
		!gradNorm.MatchString(fixes.Source(c.pass.Fset, t.A)) && !gradNorm.MatchString(fixes.Source(c.pass.Fset, c.followed(t.A))) {
		return
	}
	u := use{Grad: true, Float32: provenance.FormatOf(c.pass.TypesInfo.TypeOf(t.A)) == numeric.Float32, Where: enclosingName(cur)}
	src := c.resolve(cur, t.Tol, u, n)
	if src.constant && src.value > 0 && src.value < u.format().SqrtEps() && src.value > tolerance.UnderflowGuard {
		c.reportGrad(n, "absolute gradient-norm threshold "+numeric.WithValue(fixes.Source(c.pass.Fset, t.Tol), src.value))
	}
}

// magnitudeTest reads norm < tol, where norm is not wrapped in math.Abs
// (a norm is never negative).
func magnitudeTest(n *ast.BinaryExpr) (tolerance.Test, bool) {
	if n.Op != token.LSS && n.Op != token.LEQ {
		return tolerance.Test{}, false
	}
	return tolerance.Test{Cmp: n, Kind: tolerance.Magnitude, A: n.X, Tol: n.Y, Factor: 1}, true
}

// followed looks through a local variable assigned once.
func (c *checker) followed(e ast.Expr) ast.Expr {
	if id, ok := ast.Unparen(e).(*ast.Ident); ok {
		if init, ok := c.decls[c.pass.TypesInfo.Uses[id]]; ok {
			return init
		}
	}
	return e
}

// reportGrad reports a gradient threshold that ignores the scale of f.
func (c *checker) reportGrad(n ast.Node, what string, related ...analysis.RelatedInformation) {
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catFScale, Related: related,
		Message: what + " ignores the scale of f and may stop a minimization too early or never: the gradient at a minimizer found to working precision scales with |f| (when f is of order 1e-14, every gradient is below 1e-12); scale it by 1+|f| (Gill, Murray & Wright 1981)",
	})
}

// backtrack reports a loop that shrinks a step by a constant factor until a
// sufficient-decrease test holds, with no floor on the step and no cap.
func (c *checker) backtrack(l *loop) {
	if l.capped || l.other || len(l.exits) == 0 || len(l.shrunk) == 0 {
		return
	}
	for _, e := range l.exits {
		b, ok := ast.Unparen(e).(*ast.BinaryExpr)
		if !ok || !l.decreaseTest(c.pass.TypesInfo, b) || !mentionsAny(c.pass.TypesInfo, b, l.shrunk) {
			return // another exit, such as a floor on the step
		}
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: l.stmt.For, End: l.stmt.For + 3, Category: catBacktrack,
		Message: "backtracking loop shrinks the step until a sufficient-decrease test holds, with no floor on the step and no iteration cap: when the direction is not a descent direction or rounding hides the decrease, it runs until the step underflows to 0 (about 1075 halvings in float64) and returns a zero step; stop at a minimum step and cap the iterations",
	})
}

// mentionsAny reports whether e refers to one of vars.
func mentionsAny(info *types.Info, e ast.Expr, vars map[*types.Var]bool) bool {
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		if id, ok := n.(*ast.Ident); ok {
			if v, ok := info.Uses[id].(*types.Var); ok && vars[v] {
				found = true
			}
		}
		return !found
	})
	return found
}
