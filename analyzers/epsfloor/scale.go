package epsfloor

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"
	"path/filepath"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/degree"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/tolerance"
	"roundoff/analyzers/internal/vecshape"
	"roundoff/internal/config"
	"roundoff/internal/numeric"
)

// DefaultDataSize is the size roundoff assumes for data of unknown size:
// the SI habit of choosing the unit prefix that keeps a value below 1000
// (BIPM SI Brochure, 9th ed. 2019, §3, from memory) makes 1e3 the size
// that ordinary data reach in whatever unit a caller picks.
const DefaultDataSize = 1e3

// helper is a predicate of this package that tests two of its parameters
// against an absolute tolerance: its callers' arguments are the data.
type helper struct {
	a, b int // parameter indices
	tol  float64
	f    numeric.Format
	at   token.Pos
}

// scaleTest is an absolute tolerance test on a quantity q, a difference
// a-b (b may be nil when q is a cancelling product) whose size is not known.
type scaleTest struct {
	node ast.Node
	a, b ast.Expr
	tol  float64
	f    numeric.Format
	test *tolerance.Test // the recognised test, for a fix; nil for a bare one
}

// atScale judges t at the data size of the package: the rounding error of
// a quantity of degree d in the data is about eps·s^d at data size s, so
// an absolute tolerance tol stops passing anything but equality once the
// data reach (tol/eps)^(1/d). A predicate that compares two of its own
// parameters is learnt as a helper, judged at its calls instead.
func (c *checker) atScale(cur inspector.Cursor, t scaleTest) {
	if provenance.InTestFile(c.pass.Fset, t.node.Pos()) {
		return // a test fixes its own data: only a known size says anything
	}
	if t.tol <= tolerance.UnderflowGuard {
		return // an underflow guard, not a tolerance
	}
	fd := enclosingDecl(cur)
	if fd == nil {
		return
	}
	if c.learnHelper(cur, fd, t) {
		return
	}
	_, eps := t.f.EpsMultiple(t.tol)
	if !eps && !c.rounds(fd, t.a, t.b) {
		return // values read as given: their difference is exact when they are close
	}
	g, sum, ok := c.gradeOf(fd, t.a, t.b)
	if !ok {
		return // unknown, or of a size fixed by constants
	}
	size, declared := dataSize(c.pass.Pkg.Path())
	why := scaleWhy(t.tol, t.f, g, size, declared)
	if why == "" {
		return
	}
	var fs []fixes.Fix
	if t.test != nil && t.test.Kind == tolerance.Absolute && t.test.Factor == 1 && !g.summed {
		fs = c.relativeFix(cur, *t.test, t.f, true) // a few ulps of the result do not cover n terms' rounding
	}
	remedy := fmt.Sprintf("make it relative to the compared values, such as tol + %s·max(|a|,|b|)", t.f.FewUlpsLiteral())
	if g.summed || t.test == nil || t.test.Kind != tolerance.Absolute {
		remedy = g.remedy()
	}
	d := analysis.Diagnostic{
		Pos: t.node.Pos(), End: t.node.End(), Category: catScale,
		Message: fmt.Sprintf("absolute tolerance %.3g on %s, %s, %s; %s",
			t.tol, fixes.Source(c.pass.Fset, quantity(t)), g, why, remedy),
	}
	if sum != nil {
		d.Related = []analysis.RelatedInformation{{Pos: sum.Pos(), End: sum.End(), Message: "the running sum"}}
	}
	fixes.Report(c.pass, d, fs...)
}

// rounds reports whether a or b (b may be nil) carries a rounding error
// of its own (see degree.Reader.Rounds).
func (c *checker) rounds(fd *ast.FuncDecl, a, b ast.Expr) bool {
	return c.degrees().Rounds(fd, a) || b != nil && c.degrees().Rounds(fd, b)
}

// grade is what the data size judges a quantity by: its degree in the
// data, and whether it reads a running sum over a loop of the data's
// length, whose rounding grows with the number of terms as well (see
// degree.Reader.Summed).
type grade struct {
	d      float64
	summed bool
}

func (g grade) String() string {
	s := "of degree " + numeric.Short(g.d) + " in the data"
	if g.summed {
		s += ", a running sum over the data"
	}
	return s
}

// gradeOf reads the grade of the difference a-b (b nil: of a) in fd and
// the statement adding to its running sum, if any; ok when both degrees
// are known and the data size bears on it: a degree above 0, or 0 with a
// running sum, whose count is data.
func (c *checker) gradeOf(fd *ast.FuncDecl, a, b ast.Expr) (g grade, sum ast.Node, ok bool) {
	g.d = math.Inf(-1)
	for _, e := range []ast.Expr{a, b} {
		if e == nil {
			continue
		}
		d, ok := c.degrees().Of(fd, e)
		if !ok {
			return g, nil, false
		}
		g.d = max(g.d, d)
		if sum == nil {
			sum, g.summed = c.degrees().Summed(fd, e)
		}
	}
	return g, sum, g.d > 0 || g.d == 0 && g.summed
}

// scaleWhy judges an absolute tolerance tol on a quantity of grade g at
// the data size (declared by roundoff.yaml or not): it returns why the
// tolerance fails there, or "" when it holds. The rounding error of a
// quantity of degree d is about eps·s^d at data size s, and √n times that
// for a running sum of n terms (Higham 2002, §2.8, from memory), with n
// the data size too. A quantity of degree below 2 may be a pure number (an
// angle, a fraction), whose size is the author's to state, unless the
// tolerance is a whole multiple of eps, a relative precision at magnitude
// 1: only its count of terms, if it is a sum, is then data.
func scaleWhy(tol float64, f numeric.Format, g grade, size float64, declared bool) string {
	k, eps := f.EpsMultiple(tol)
	pure := g.d < 2 && !declared && !eps
	power := g.d
	if pure {
		power = 0
	}
	if g.summed {
		power += 0.5
	}
	if power <= 0 {
		return ""
	}
	breaks := math.Pow(tol/f.Eps, 1/power)
	if breaks >= size {
		return ""
	}
	var why string
	switch {
	case g.summed && pure:
		why = fmt.Sprintf("is below the rounding error of a sum of n terms, about √n·eps (eps = %.3g), once the sum has n = %.2g terms", f.Eps, breaks)
	case g.summed:
		why = fmt.Sprintf("is below the rounding error of a sum of n terms of size s^%s, about √n·eps·s^%[1]s (eps = %.3[2]g), once n and s reach %.2[3]g", numeric.Short(g.d), f.Eps, breaks)
	case eps:
		why = fmt.Sprintf("is %s·eps (eps = %.3g), a relative precision used as an absolute one: %[1]s ulps at magnitude 1, less than one once the data exceed s = %.2[3]g", numeric.Short(k), f.Eps, breaks)
	default:
		why = fmt.Sprintf("is below its rounding error eps·s^%s (eps = %.3g) once the data reach s = %.2g", numeric.Short(g.d), f.Eps, breaks)
	}
	if declared {
		return fmt.Sprintf("%s, under the data size %.2g that roundoff.yaml declares", why, size)
	}
	return fmt.Sprintf("%s, under the %.2g assumed for data of unknown size", why, size)
}

// scaleUse completes u for an absolute test |a-b| < tol or a threshold
// |x| < tol (or x < tol) whose tolerance is no constant but a parameter or
// field: when the compared quantity is computed in a file that is not a
// test, cancels and has a known positive degree, the constants given to
// that tolerance are judged at the data size as a constant written in the
// test would be (see atScale, scaleSite). It reports whether the
// quantity is such.
func (c *checker) scaleUse(decl *ast.FuncDecl, t tolerance.Test, u *use) bool {
	if decl == nil || t.Factor != 1 || provenance.InTestFile(c.pass.Fset, t.Cmp.Pos()) {
		return false
	}
	deg := c.degrees()
	a, b := t.A, t.B
	switch t.Kind {
	case tolerance.Absolute:
	case tolerance.Magnitude:
		if !deg.Cancels(decl, t.A) {
			return false
		}
		a, b = c.operands(t.A)
	default:
		return false
	}
	g, _, ok := c.gradeOf(decl, a, b)
	if !ok || !c.rounds(decl, a, b) {
		return false // unknown, of a size fixed by constants, or values read as given, whose difference is exact when they are close
	}
	u.Degree, u.Summed, u.Quantity = g.d, g.summed, fixes.Source(c.pass.Fset, t.Cmp)
	u.Size, u.Declared = dataSize(c.pass.Pkg.Path())
	return true
}

// scaleSite judges a constant val at least eps given, as how says, to a
// tolerance of use u (see scaleUse) at the data size of the package that
// tests it. A test file supplies its own data, whose size it fixes: its
// constants are left alone.
func (c *checker) scaleSite(val ast.Expr, u use, how string) {
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, val)
	if !ok || provenance.InTestFile(c.pass.Fset, val.Pos()) {
		return
	}
	f := u.format()
	tol := f.Value(v)
	why := scaleWhy(tol, f, grade{u.Degree, u.Summed}, u.Size, u.Declared)
	if why == "" {
		return
	}
	g := grade{u.Degree, u.Summed}
	d := analysis.Diagnostic{
		Pos: val.Pos(), End: val.End(), Category: catScale,
		Message: fmt.Sprintf("%s, %s (%s), %s; %s", numeric.WithValue(fixes.Source(c.pass.Fset, val), tol), how, u, why, g.remedy()),
	}
	if pos, ok := c.tested[u.key()]; ok {
		d.Related = []analysis.RelatedInformation{{Pos: pos, End: pos, Message: "the tolerance test"}}
	}
	fixes.Report(c.pass, d)
}

// remedy says how a tolerance on a quantity of grade g should grow.
func (g grade) remedy() string {
	if g.summed {
		return "make it grow with the sum, such as tol + √n·eps·Σ|x_i| over its n terms x_i"
	}
	return fmt.Sprintf("scale it with the size of the terms the quantity is computed from (it grows as s^%s)", numeric.Short(g.d))
}

// degrees returns the package's degree reader, made on first use: only
// functions holding a tolerance test of unknown size read degrees.
func (c *checker) degrees() *degree.Reader {
	if c.deg == nil {
		c.deg = degree.New(c.pass.Fset, c.pass.TypesInfo, c.pass.Files)
		c.deg.Import(vecshape.Of(c.pass))
	}
	return c.deg
}

// quantity returns the tested expression, for messages.
func quantity(t scaleTest) ast.Node {
	if t.test != nil {
		return t.test.Cmp
	}
	return t.node
}

// dataSize returns the data size for the package at path and whether
// roundoff.yaml declares it; else DefaultDataSize.
func dataSize(path string) (float64, bool) {
	if s, ok := config.Size(path); ok {
		return s, true
	}
	return DefaultDataSize, false
}

// learnHelper reports whether t sits in a predicate (one bool result)
// that returns it and compares values computed from its parameters alone
// (a, float64(a), p.x, xs[i], their sums, differences and remainders,
// accessors such as i.Length()): a comparison helper, whose data are its
// callers'. When the two values are parameters themselves it records fd,
// so that its calls are judged with their arguments.
func (c *checker) learnHelper(cur inspector.Cursor, fd *ast.FuncDecl, t scaleTest) bool {
	info := c.pass.TypesInfo
	res := fd.Type.Results
	if res == nil || res.NumFields() != 1 || !types.Identical(info.TypeOf(res.List[0].Type), types.Typ[types.Bool]) || !returned(cur) {
		return false
	}
	if !c.fromParams(t.a, 0) || t.b != nil && !c.fromParams(t.b, 0) {
		return false
	}
	fn, _ := info.Defs[fd.Name].(*types.Func)
	ia, oka := paramIndex(info, fn, t.a)
	ib, okb := paramIndex(info, fn, t.b)
	if oka && okb {
		if c.helpers == nil {
			c.helpers = map[*types.Func]helper{}
		}
		c.helpers[fn] = helper{ia, ib, t.tol, t.f, t.node.Pos()}
	}
	return true
}

// fromParams reports whether e is computed from parameters (or the
// receiver) alone: read through conversions, fields, elements, local
// variables given one value, sums, differences, remainders and calls of
// methods with no arguments.
func (c *checker) fromParams(e ast.Expr, depth int) bool {
	info := c.pass.TypesInfo
	if depth > 8 {
		return false
	}
	switch x := ast.Unparen(e).(type) {
	case *ast.CallExpr:
		if len(x.Args) == 1 && info.Types[x.Fun].IsType() {
			return c.fromParams(x.Args[0], depth+1)
		}
		if name := provenance.MathCallee(info, x); name == "Remainder" || name == "Mod" {
			return c.fromParams(x.Args[0], depth+1) && c.fromParams(x.Args[1], depth+1)
		}
		sel, ok := x.Fun.(*ast.SelectorExpr)
		return ok && len(x.Args) == 0 && info.Selections[sel] != nil && c.fromParams(sel.X, depth+1)
	case *ast.SelectorExpr:
		return c.isConst(x) || c.fromParams(x.X, depth+1)
	case *ast.IndexExpr:
		return c.fromParams(x.X, depth+1)
	case *ast.BinaryExpr:
		return c.isConst(x) || (x.Op == token.ADD || x.Op == token.SUB) && c.fromParams(x.X, depth+1) && c.fromParams(x.Y, depth+1)
	case *ast.Ident:
		if c.isConst(x) {
			return true
		}
		v, ok := info.Uses[x].(*types.Var)
		if init, local := c.decls[v]; ok && local {
			return c.fromParams(init, depth+1)
		}
		return ok && (v.Kind() == types.ParamVar || v.Kind() == types.RecvVar)
	}
	return c.isConst(e)
}

// returned reports whether cur lies in a return statement.
func returned(cur inspector.Cursor) bool {
	for range cur.Enclosing((*ast.ReturnStmt)(nil)) {
		return true
	}
	return false
}

// paramIndex returns the index of the parameter of fn that e names,
// through conversions.
func paramIndex(info *types.Info, fn *types.Func, e ast.Expr) (int, bool) {
	if fn == nil || e == nil {
		return 0, false
	}
	for {
		call, ok := ast.Unparen(e).(*ast.CallExpr)
		if !ok || len(call.Args) != 1 || !info.Types[call.Fun].IsType() {
			break
		}
		e = call.Args[0]
	}
	id, ok := ast.Unparen(e).(*ast.Ident)
	if !ok {
		return 0, false
	}
	ps := fn.Signature().Params()
	for i := range ps.Len() {
		if ps.At(i) == info.Uses[id] {
			return i, true
		}
	}
	return 0, false
}

// helperCall judges a call of a helper at cur with the degrees of its
// arguments; fn is the function called, or nil.
func (c *checker) helperCall(cur inspector.Cursor, call *ast.CallExpr, fn *types.Func) {
	h, known := c.helpers[fn]
	if fn == nil || !known || max(h.a, h.b) >= len(call.Args) || call.Ellipsis.IsValid() {
		return
	}
	a, b := call.Args[h.a], call.Args[h.b]
	if mag := max(c.sizeOf(cur, a, h.f), c.sizeOf(cur, b, h.f)); mag > 0 {
		c.helperAtSize(call, h, mag)
		return
	}
	for _, pair := range [][2]ast.Expr{{a, b}, {b, a}} {
		if c.isConst(pair[1]) && !c.isConst(pair[0]) {
			c.cancelled(cur, pair[0], h.tol, h.f, call) // Equal(x, 0): x's own rounding
			return
		}
	}
	c.atScale(cur, scaleTest{node: call, a: a, b: b, tol: h.tol, f: h.f})
}

// helperAtSize judges a call of a helper whose compared values have a
// size the source fixes (a constant, the expected values of a table of
// cases): the helper's tolerance against the gap between floats there, as
// if its test were written at the call (see judge), unless the values are
// computed alike on every platform (see sameEverywhere).
func (c *checker) helperAtSize(call *ast.CallExpr, h helper, mag float64) {
	res := judge(tolerance.Absolute, h.tol, h.f, mag)
	if res == tolerance.Resolvable || c.sameEverywhere(call, nil) {
		return
	}
	posn := c.pass.Fset.Position(h.at)
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: category(res),
		Message: fmt.Sprintf("%s compares within the absolute tolerance %.3g (%s:%d), which %s",
			fixes.Source(c.pass.Fset, call.Fun), h.tol, filepath.Base(posn.Filename), posn.Line, explain(res, h.tol, h.f, mag)),
		Related: []analysis.RelatedInformation{{Pos: h.at, End: h.at, Message: "the tolerance test"}},
	})
}

// bare reads x < tol (or tol > x, or x > tol, the same test's negation)
// with tol a positive constant and x a cancelling quantity, possibly
// scaled by a constant: a difference of two non-constant values, a
// remainder, or a product of such.
func (c *checker) bare(cur inspector.Cursor, n *ast.BinaryExpr) {
	x, tolE := n.X, n.Y
	switch n.Op {
	case token.GTR, token.GEQ:
		if c.pass.TypesInfo.Types[n.Y].Value == nil {
			x, tolE = n.Y, n.X
		}
	case token.LSS, token.LEQ:
	default:
		return
	}
	if !provenance.IsFloat(c.pass.TypesInfo.TypeOf(x)) {
		return
	}
	f := provenance.FormatOf(c.pass.TypesInfo.TypeOf(x))
	x, k := c.unscaled(x)
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, tolE)
	if !ok && k == 1 {
		c.bareUse(cur, n, x, tolE, f)
	}
	if !ok || v.Kind() != constant.Int && v.Kind() != constant.Float || constant.Sign(v) <= 0 {
		return
	}
	c.cancelled(cur, x, f.Value(v)/k, f, n)
}

// bareUse learns the parameter or field tol of a threshold x < tol on a
// cancelling quantity x (see scaleUse).
func (c *checker) bareUse(cur inspector.Cursor, n *ast.BinaryExpr, x, tol ast.Expr, f numeric.Format) {
	decl := enclosingDecl(cur)
	posn := c.pass.Fset.Position(n.Pos())
	t := tolerance.Test{Cmp: n, Kind: tolerance.Magnitude, A: x, Tol: tol, Factor: 1}
	u := use{Kind: tolerance.Magnitude, Float32: f == numeric.Float32, Where: enclosingName(cur), At: fmt.Sprintf("%s:%d", filepath.Base(posn.Filename), posn.Line)}
	if c.scaleUse(decl, t, &u) {
		c.learn(decl, t, u)
	}
}

// cancelled judges x < tol, or |x| < tol, at the data size when x
// cancels (see degree.Reader.Cancels).
func (c *checker) cancelled(cur inspector.Cursor, x ast.Expr, tol float64, f numeric.Format, n ast.Node) {
	if tol < f.Eps {
		return // a threshold below eps on one value asks whether it vanished (a guard before a division, a domain bound), not whether it is noise
	}
	if fd := enclosingDecl(cur); fd == nil || !c.degrees().Cancels(fd, x) {
		return // a plain threshold: no rounding of its own to drown it
	}
	t := scaleTest{node: n, tol: tol, f: f}
	t.a, t.b = c.operands(x) // a predicate comparing two parameters is then seen as one
	c.atScale(cur, t)
}

// operands returns the two sides of x when it is a difference, also held
// in a variable (r := hi - lo; r < tol), else x and nil.
func (c *checker) operands(x ast.Expr) (a, b ast.Expr) {
	e := x
	if id, ok := ast.Unparen(x).(*ast.Ident); ok && c.decls[c.pass.TypesInfo.Uses[id]] != nil {
		e = c.decls[c.pass.TypesInfo.Uses[id]]
	}
	if d, ok := ast.Unparen(e).(*ast.BinaryExpr); ok && d.Op == token.SUB {
		return d.X, d.Y
	}
	return x, nil
}

// unscaled strips constant factors and divisors from x.
func (c *checker) unscaled(x ast.Expr) (ast.Expr, float64) {
	k := 1.0
	for {
		b, ok := ast.Unparen(x).(*ast.BinaryExpr)
		if !ok || b.Op != token.MUL && b.Op != token.QUO {
			return x, k
		}
		v, ok := constval.Exact(c.pass.TypesInfo, c.decls, b.Y)
		if !ok || v.Kind() != constant.Int && v.Kind() != constant.Float {
			return x, k
		}
		f, _ := constant.Float64Val(v)
		if !(f > 0) || math.IsInf(f, 0) {
			return x, k
		}
		x = b.X
		if b.Op == token.QUO {
			f = 1 / f
		}
		k *= f
	}
}

// enclosingDecl returns the function declaration around cur, or nil.
func enclosingDecl(cur inspector.Cursor) *ast.FuncDecl {
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		return fd.Node().(*ast.FuncDecl)
	}
	return nil
}
