package epsfloor

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/readonly"
	"roundoff/analyzers/internal/span"
	"roundoff/analyzers/internal/tolerance"
	"roundoff/internal/numeric"
)

// constantTol judges a tolerance test whose tolerance is a constant tol.
func (c *checker) constantTol(cur inspector.Cursor, t tolerance.Test, f numeric.Format, tol float64) {
	if t.Kind == tolerance.Magnitude {
		c.iterate(cur, t, f, tol)
		c.cancelled(cur, t.A, tol/t.Factor, f, t.Cmp)
		return
	}
	mag := c.magnitude(cur, t, f)
	desc := describe(t.Kind, fixes.Source(c.pass.Fset, t.Tol), tol)
	scaled := t.Factor > 0 && t.Factor != 1
	if scaled {
		// |a-b|·k < tol holds when |a-b| < tol/k: judge what the difference meets.
		tol /= t.Factor
		desc += fmt.Sprintf(" on the difference times %.3g, %.3g on the difference itself,", t.Factor, tol)
	}
	res := judge(t.Kind, tol, f, mag)
	if res == tolerance.Resolvable && t.Kind == tolerance.Absolute && mag == 0 {
		c.atScale(cur, scaleTest{node: t.Cmp, a: t.A, b: t.B, tol: tol, f: f, test: &t})
		return
	}
	if res == tolerance.Resolvable || t.Kind == tolerance.Absolute && c.differenceSameEverywhere(cur, t) {
		return
	}
	var fix []fixes.Fix
	if !scaled {
		fix = c.tolFix(cur, t, res, f) // a new tolerance would have to undo the factor
	}
	d := analysis.Diagnostic{
		Pos: t.Cmp.Pos(), End: t.Cmp.End(),
		Category: category(res),
		Message:  desc + " " + explain(res, tol, f, mag),
		Related:  c.declaredAt(t.Tol),
	}
	fixes.Report(c.pass, d, fix...)
}

// vanished reports a tolerance of a difference that is positive as
// written but rounds to 0 in format f (1e-6*math.SmallestNonzeroFloat64
// is 4.9e-330, below half the smallest positive float64): the strict test
// |a-b| < 0 holds for no values, equal ones included, and |a-b| <= 0 is
// exact equality. It reports whether the tolerance was such.
func (c *checker) vanished(t tolerance.Test, f numeric.Format, v constant.Value, known bool) bool {
	if m, ok := ast.Unparen(t.Tol).(*ast.BinaryExpr); ok && (m.Op == token.MUL || m.Op == token.QUO) {
		x, okx := constval.Exact(c.pass.TypesInfo, c.decls, m.X)
		y, oky := constval.Exact(c.pass.TypesInfo, c.decls, m.Y)
		if okx && oky && x.Kind() != constant.Complex && y.Kind() != constant.Complex && (m.Op == token.MUL || constant.Sign(y) != 0) {
			v, known = constant.BinaryOp(x, m.Op, y), true // as written: of variables holding constants, it rounds once, at run time
		}
	}
	if !known || t.Kind != tolerance.Absolute && t.Kind != tolerance.Relative || v.Kind() == constant.Complex || constant.Sign(v) <= 0 || f.Value(v) != 0 {
		return false
	}
	what := "so the test holds for no pair of values, equal ones included (|a-b| < 0 is always false)"
	if !strictTest(t) {
		what = "so the test is exact equality"
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: t.Cmp.Pos(), End: t.Cmp.End(), Category: catEmpty,
		Message: fmt.Sprintf("tolerance %s is %s as written but rounds to 0 in %s, being at most half its smallest positive value (%.2g), %s; use a tolerance the type holds, such as %s relative",
			fixes.Source(c.pass.Fset, t.Tol), constant.ToFloat(v), f.Name, f.Smallest, what, f.FewUlpsLiteral()),
		Related: c.declaredAt(t.Tol),
	})
	return true
}

// judge is tolerance.Judge with an absolute tolerance at a known magnitude
// mag held to the gap between mag and the next float toward zero, not to
// half the spacing: two floats near mag are both multiples of that gap, so
// their difference is 0 or at least the gap (exact by Sterbenz, Goldberg
// 1991 Thm 11), and a smaller tolerance passes only on exact equality.
func judge(kind tolerance.Kind, tol float64, f numeric.Format, mag float64) tolerance.Resolution {
	res := tolerance.Judge(kind, tol, f, mag)
	if res == tolerance.Resolvable && kind == tolerance.Absolute && mag > 0 && tol < gapBelow(f, mag) {
		return tolerance.BelowSpacing
	}
	return res
}

// gapBelow returns the distance from |m| to the next value of format f
// toward zero.
func gapBelow(f numeric.Format, m float64) float64 {
	m = math.Abs(m)
	if f == numeric.Float32 {
		return float64(float32(m) - math.Nextafter32(float32(m), 0))
	}
	return m - math.Nextafter(m, 0)
}

// magnitude returns the size of the compared values at cur when an operand
// is a constant, read from a table of constants or a variable last given a
// constant, else 0.
func (c *checker) magnitude(cur inspector.Cursor, t tolerance.Test, f numeric.Format) float64 {
	for _, e := range []ast.Expr{t.A, t.B} {
		if m := c.sizeOf(cur, e, f); m > 0 {
			return m
		}
	}
	return 0
}

// sizeOf returns |e| at cur when e is a constant or a local variable last
// given a constant (see assignedBefore); the largest |e| over the cases of
// a table that a range loop around cur walks, when e can be evaluated in
// each from the case's constants (trueMean := tc.mu + tc.k*tc.x); or the
// largest magnitude among the constants the package's composite literals
// give the field e reads, when that field is declared in a test (the
// expected values of a table of test cases, tc.want); else 0.
func (c *checker) sizeOf(cur inspector.Cursor, e ast.Expr, f numeric.Format) float64 {
	if v, ok := constval.Exact(c.pass.TypesInfo, c.decls, e); ok {
		return math.Abs(f.Value(v))
	}
	if v, ok := c.assignedBefore(cur, e); ok {
		return math.Abs(f.Value(v))
	}
	if m := c.rowSize(cur, e, f); m > 0 {
		return m
	}
	if m := c.elemSize(cur, e, f); m > 0 {
		return m
	}
	field := tolerance.FieldOf(c.pass.TypesInfo, e)
	if field == nil || !c.testCode(field.Pos()) {
		return 0 // only a test's own table of cases says what values reach the test
	}
	if c.fields == nil {
		c.fields = constval.Fields(c.pass.TypesInfo, c.pass.Files)
	}
	size := 0.0
	skip := c.excluded(cur, e)
	for _, val := range c.fields[field] {
		if v, ok := constval.Exact(c.pass.TypesInfo, c.decls, val); ok && v.Kind() != constant.Complex && !skip(v) {
			size = max(size, math.Abs(f.Value(v)))
		}
	}
	return size
}

// testCode reports whether pos lies in a test file or in test support
// code: a file of the package that imports testing, whose tables of cases
// are the tests'.
func (c *checker) testCode(pos token.Pos) bool {
	if provenance.InTestFile(c.pass.Fset, pos) {
		return true
	}
	for _, f := range c.pass.Files {
		if f.FileStart <= pos && pos < f.FileEnd {
			return slices.ContainsFunc(f.Imports, func(s *ast.ImportSpec) bool { return s.Path.Value == `"testing"` })
		}
	}
	return false
}

// elemSize returns |e| when e is an element of a local slice or array of
// constants at an index the source fixes (see elemValue), else the
// largest |element| of such a slice or array that e indexes (zs[i] of zs
// := []float64{360, 720, 6.2e23}), when its function only reads it (see
// readOnly), else 0.
func (c *checker) elemSize(cur inspector.Cursor, e ast.Expr, f numeric.Format) float64 {
	if v, ok := c.elemValue(cur, e); ok {
		return math.Abs(f.Value(v))
	}
	ix, ok := ast.Unparen(e).(*ast.IndexExpr)
	if !ok {
		return 0
	}
	elts, ok := c.constElems(cur, ix.X)
	if !ok {
		return 0
	}
	size := 0.0
	for _, elt := range elts {
		if kv, ok := elt.(*ast.KeyValueExpr); ok {
			elt = kv.Value
		}
		val, ok := constval.Exact(c.pass.TypesInfo, c.decls, elt)
		if !ok || val.Kind() == constant.Complex {
			return 0
		}
		size = max(size, math.Abs(f.Value(val)))
	}
	return size
}

// constElems returns the elements of the slice or array literal that
// initialises x, a local variable its function only reads.
func (c *checker) constElems(cur inspector.Cursor, x ast.Expr) ([]ast.Expr, bool) {
	id, ok := ast.Unparen(x).(*ast.Ident)
	if !ok {
		return nil, false
	}
	v, _ := c.pass.TypesInfo.Uses[id].(*types.Var)
	lit, ok := ast.Unparen(c.decls[v]).(*ast.CompositeLit)
	if v == nil || !ok || !c.readOnly(cur, v) {
		return nil, false
	}
	return lit.Elts, true
}

// elemValue returns the exact value of e when it is an element of a local
// slice or array of constants (see constElems), none of them keyed, at
// an index the source fixes (see index): xs[m] after m := len(xs) - 1.
func (c *checker) elemValue(cur inspector.Cursor, e ast.Expr) (constant.Value, bool) {
	ix, ok := ast.Unparen(e).(*ast.IndexExpr)
	if !ok {
		return nil, false
	}
	elts, ok := c.constElems(cur, ix.X)
	if !ok || slices.ContainsFunc(elts, func(e ast.Expr) bool { _, kv := e.(*ast.KeyValueExpr); return kv }) {
		return nil, false
	}
	k, ok := c.index(cur, ix.Index, 0)
	if !ok || k < 0 || k >= int64(len(elts)) {
		return nil, false
	}
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, elts[k])
	return v, ok && v.Kind() != constant.Complex
}

// index evaluates an integer the source fixes: a constant, the length of
// a local slice of constants (see constElems), a local initialised once
// from such values, and their sums, differences and products.
func (c *checker) index(cur inspector.Cursor, e ast.Expr, depth int) (int64, bool) {
	e = ast.Unparen(e)
	if tv := c.pass.TypesInfo.Types[e]; tv.Value != nil {
		return constant.Int64Val(constant.ToInt(tv.Value))
	}
	if depth > 8 {
		return 0, false
	}
	switch x := e.(type) {
	case *ast.CallExpr:
		if b, ok := typeutil.Callee(c.pass.TypesInfo, x).(*types.Builtin); ok && b.Name() == "len" && len(x.Args) == 1 {
			elts, ok := c.constElems(cur, x.Args[0])
			return int64(len(elts)), ok
		}
	case *ast.BinaryExpr:
		a, oka := c.index(cur, x.X, depth+1)
		b, okb := c.index(cur, x.Y, depth+1)
		switch {
		case !oka || !okb:
		case x.Op == token.ADD:
			return a + b, true
		case x.Op == token.SUB:
			return a - b, true
		case x.Op == token.MUL:
			return a * b, true
		}
	case *ast.Ident:
		if v, ok := c.pass.TypesInfo.Uses[x].(*types.Var); ok && c.decls[v] != nil {
			return c.index(cur, c.decls[v], depth+1)
		}
	}
	return 0, false
}

// readOnly reports whether v is local to the function around cur, which
// only reads it (package readonly: its elements, its length, a range, or
// a parameter that only reads it in turn).
func (c *checker) readOnly(cur inspector.Cursor, v *types.Var) bool {
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		if v.Pos() < fd.Node().Pos() || v.Pos() >= fd.Node().End() {
			return false // a package variable, which other functions may change
		}
		return readonly.Of(c.pass).Only(fd, v)
	}
	return false
}

// excluded returns a test of the constants that e cannot hold at cur: an
// enclosing condition says e != k (the else branch of if e == k, a sentinel
// row sent elsewhere), so no case with that value reaches cur.
func (c *checker) excluded(cur inspector.Cursor, e ast.Expr) func(constant.Value) bool {
	var out []constant.Value
	for cond, holds := range span.Conditions(cur) {
		b, ok := ast.Unparen(cond).(*ast.BinaryExpr)
		if !ok || b.Op == token.EQL == holds || b.Op != token.EQL && b.Op != token.NEQ {
			continue
		}
		for _, pair := range [][2]ast.Expr{{b.X, b.Y}, {b.Y, b.X}} {
			if v, ok := constval.Exact(c.pass.TypesInfo, c.decls, pair[1]); ok && types.ExprString(ast.Unparen(pair[0])) == types.ExprString(ast.Unparen(e)) {
				out = append(out, v)
			}
		}
	}
	return func(v constant.Value) bool {
		return slices.ContainsFunc(out, func(k constant.Value) bool { return constant.Compare(v, token.EQL, k) })
	}
}

// rowSize returns the largest |e| over the cases of the table that the
// innermost range loop around cur over a literal walks, when e can be
// evaluated in every case (constval.InRow) and the loop does not change
// the case it holds, else 0.
func (c *checker) rowSize(cur inspector.Cursor, e ast.Expr, f numeric.Format) float64 {
	info := c.pass.TypesInfo
	for r := range cur.Enclosing((*ast.RangeStmt)(nil)) {
		rs := r.Node().(*ast.RangeStmt)
		row, cases, ok := constval.Table(info, c.decls, rs)
		if !ok || setsPart(info, rs.Body, row) {
			continue
		}
		size := 0.0
		skip := c.excluded(cur, e)
		for _, k := range cases {
			v, ok := constval.InRow(info, c.decls, e, row, k)
			if !ok {
				return 0
			}
			if !skip(v) {
				size = max(size, math.Abs(f.Value(v)))
			}
		}
		return size
	}
	return 0
}

func category(res tolerance.Resolution) string {
	switch res {
	case tolerance.BelowRoundoff:
		return catRelative
	case tolerance.Subnormal:
		return catSubnormal
	}
	return catAbsolute
}

// explain writes why a tolerance tol cannot be resolved by format f, to
// follow its description; mag is the known size of the compared values, or 0.
func explain(res tolerance.Resolution, tol float64, f numeric.Format, mag float64) string {
	switch res {
	case tolerance.BelowRoundoff:
		return fmt.Sprintf("is below the unit roundoff of %[1]s (%.3[2]g): two different %[1]s values always differ by more, so the test is exact equality; use a few ulps, such as %[3]s (%.2[4]g)",
			f.Name, f.U, f.FewUlpsLiteral(), 4*f.Eps)
	case tolerance.BelowEpsilon:
		return fmt.Sprintf("is below %s epsilon (%.3g): the test can hold for unequal values only when they are below about %.2g (tol/eps), and is exact equality above; add a relative term",
			f.Name, f.Eps, tol/f.Eps)
	case tolerance.BelowSpacing:
		if gap := gapBelow(f, mag); tol >= f.Spacing(mag)/2 {
			return fmt.Sprintf("is below the spacing of %s values just under %s (%.3g): two different values there differ by at least that much, so the test passes only on exact equality",
				f.Name, numeric.Short(mag), gap)
		}
		return fmt.Sprintf("is below half the spacing of %s values at %s (%.3g): the test passes only on exact equality",
			f.Name, numeric.Short(mag), f.Spacing(mag)/2)
	}
	return fmt.Sprintf("is the smallest positive %[1]s: it says how small a number can be, not how close two can be (%[1]s epsilon is %.3[2]g), so the test is exact equality except among subnormal values",
		f.Name, f.Eps)
}

// describe names a tolerance written as src with value tol.
func describe(kind tolerance.Kind, src string, tol float64) string {
	word := map[tolerance.Kind]string{tolerance.Absolute: "absolute", tolerance.Relative: "relative"}[kind]
	return word + " tolerance " + numeric.WithValue(src, tol)
}

// declaredAt points at the declaration of a named tolerance declared in
// this package, away from the comparison.
func (c *checker) declaredAt(e ast.Expr) []analysis.RelatedInformation {
	id, ok := ast.Unparen(e).(*ast.Ident)
	if !ok {
		return nil
	}
	init, ok := c.decls[c.pass.TypesInfo.Uses[id]]
	if !ok {
		return nil
	}
	return []analysis.RelatedInformation{{Pos: init.Pos(), End: init.End(), Message: id.Name + " is set here"}}
}

// tolFix returns the fix for an unresolvable constant tolerance.
func (c *checker) tolFix(cur inspector.Cursor, t tolerance.Test, res tolerance.Resolution, f numeric.Format) []fixes.Fix {
	switch res {
	case tolerance.BelowRoundoff:
		target := ast.Node(ast.Unparen(t.Tol))
		if id, ok := target.(*ast.Ident); ok {
			if init, ok := c.decls[c.pass.TypesInfo.Uses[id]]; ok {
				target = init // change the named tolerance where it is set
			}
		}
		return []fixes.Fix{fixes.Judgement("Use 4 ulps as the relative tolerance: "+f.FewUlpsLiteral(), fixes.Replace(target, f.FewUlpsLiteral()))}
	case tolerance.Subnormal:
		if t.Kind == tolerance.Absolute {
			return c.relativeFix(cur, t, f, false) // eps would do no better away from 1
		}
		return []fixes.Fix{fixes.Judgement("Use "+f.Name+" epsilon: "+f.EpsLiteral(), fixes.Replace(t.Tol, f.EpsLiteral()))}
	case tolerance.BelowEpsilon, tolerance.BelowSpacing:
		return c.relativeFix(cur, t, f, true)
	}
	return nil
}

// relativeFix makes the test |a-b| < tol relative to the size of the
// compared values: |a-b| < tol + 4ulps·max(|a|,|b|), keeping tol as the
// floor near zero, or, when tol is no floor worth keeping (the smallest
// subnormal), |a-b| < 4ulps·max(|a|,|b|). A residual such as k·q² - h
// rounds at about eps·|h|, so only a tolerance that grows with h can pass
// for every h. It needs a and b repeatable at the comparison (see
// repeatable) and float64, which math.Abs and math.Max take as they are;
// and no text nearby saying the test is meant to be exact.
func (c *checker) relativeFix(cur inspector.Cursor, t tolerance.Test, f numeric.Format, keep bool) []fixes.Fix {
	f64 := types.Typ[types.Float64]
	if !types.Identical(c.pass.TypesInfo.TypeOf(t.A), f64) || !types.Identical(c.pass.TypesInfo.TypeOf(t.B), f64) {
		return nil
	}
	if t.Scale != nil || t.TwoSided || !within(t.Tol, t.Cmp) || !c.repeatable(cur, t) || fixes.SaysExact(c.pass.Fset, fileOf(cur), cur) {
		return nil
	}
	name, edits, ok := fixes.Import(c.pass.TypesInfo, fileOf(cur), t.Cmp.Pos(), "math")
	if !ok {
		return nil
	}
	a, b := fixes.Source(c.pass.Fset, t.A), fixes.Source(c.pass.Fset, t.B)
	text := fmt.Sprintf("%[1]s*%[2]s.Max(%[2]s.Abs(%[3]s), %[2]s.Abs(%[4]s))", f.FewUlpsLiteral(), name, a, b)
	msg := "Test relative to the compared values, 4 ulps: "
	if keep {
		text = fixes.Operand(c.pass.Fset, t.Tol, token.ADD.Precedence()) + " + " + text
		msg = "Add a relative term of 4 ulps: "
	}
	return []fixes.Fix{fixes.Judgement(msg+text, append(edits, fixes.Replace(t.Tol, text))...)}
}

// repeatable reports whether the operands a and b of the tested difference
// can be written again at the comparison and mean the same values there:
// they are pure and either written in the comparison itself or in the
// initialiser of a variable declared earlier in the same block, with no
// statement in between assigning a variable they read (r := k*q*q - h;
// if math.Abs(r) < tol).
func (c *checker) repeatable(cur inspector.Cursor, t tolerance.Test) bool {
	info := c.pass.TypesInfo
	if !fixes.Pure(info, t.A) || !fixes.Pure(info, t.B) {
		return false
	}
	if within(t.A, t.Cmp) && within(t.B, t.Cmp) {
		return true
	}
	def, ok := cur.Inspector().Root().FindByPos(t.A.Pos(), t.A.End())
	if !ok {
		return false
	}
	block, from, ok := stmtInBlock(def, nil)
	if !ok {
		return false
	}
	_, to, ok := stmtInBlock(cur, block)
	if !ok || to <= from {
		return false
	}
	read := varsIn(info, t.A, t.B)
	for _, s := range block.List[from+1 : to] {
		if assigns(info, s, read) {
			return false
		}
	}
	return true
}

// stmtInBlock returns the block holding the statement around cur and the
// statement's index there; with want set, the first such block that is want.
func stmtInBlock(cur inspector.Cursor, want *ast.BlockStmt) (*ast.BlockStmt, int, bool) {
	for ; cur.Valid(); cur = cur.Parent() {
		if k, i := cur.ParentEdge(); k == edge.BlockStmt_List {
			b := cur.Parent().Node().(*ast.BlockStmt)
			if want == nil || b == want {
				return b, i, true
			}
		}
	}
	return nil, 0, false
}

// varsIn returns the variables the expressions read.
func varsIn(info *types.Info, es ...ast.Expr) map[types.Object]bool {
	vars := make(map[types.Object]bool)
	for _, e := range es {
		ast.Inspect(e, func(n ast.Node) bool {
			if id, ok := n.(*ast.Ident); ok {
				if v, ok := info.Uses[id].(*types.Var); ok {
					vars[v] = true
				}
			}
			return true
		})
	}
	return vars
}

// assigns reports whether statement s may change one of vars: by
// assignment, increment, range or taking its address.
func assigns(info *types.Info, s ast.Stmt, vars map[types.Object]bool) bool {
	found := false
	hit := func(e ast.Expr) {
		if id, ok := ast.Unparen(e).(*ast.Ident); ok && vars[info.ObjectOf(id)] {
			found = true
		}
	}
	ast.Inspect(s, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.AssignStmt:
			for _, l := range n.Lhs {
				hit(l)
			}
		case *ast.IncDecStmt:
			hit(n.X)
		case *ast.RangeStmt:
			hit(n.Key)
			hit(n.Value)
		case *ast.UnaryExpr:
			if n.Op == token.AND {
				hit(n.X)
			}
		}
		return !found
	})
	return found
}

// within reports whether n lies inside outer.
func within(n, outer ast.Node) bool {
	return n.Pos() >= outer.Pos() && n.End() <= outer.End()
}

// fileOf returns the file enclosing cur.
func fileOf(cur inspector.Cursor) *ast.File {
	for f := range cur.Enclosing((*ast.File)(nil)) {
		return f.Node().(*ast.File)
	}
	return nil
}

// setsPart reports whether body assigns to v or to a field or element of
// it (tc.want = ..., tc.n++).
func setsPart(info *types.Info, body ast.Node, v types.Object) bool {
	found := false
	ast.Inspect(body, func(n ast.Node) bool {
		var lhs []ast.Expr
		switch n := n.(type) {
		case *ast.AssignStmt:
			lhs = n.Lhs
		case *ast.IncDecStmt:
			lhs = []ast.Expr{n.X}
		}
		for _, l := range lhs {
			for {
				switch x := ast.Unparen(l).(type) {
				case *ast.SelectorExpr:
					l = x.X
					continue
				case *ast.IndexExpr:
					l = x.X
					continue
				case *ast.Ident:
					found = found || info.ObjectOf(x) == v
				}
				break
			}
		}
		return !found
	})
	return found
}
