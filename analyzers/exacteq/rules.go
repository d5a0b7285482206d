package exacteq

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/internal/numeric"
)

// nan reports a comparison with math.NaN(), which is always false (==) or
// always true (!=): NaN is unordered with every value, itself included
// (IEEE 754-2019 §5.11).
func (c *checker) nan(cur inspector.Cursor, n *ast.BinaryExpr, x, y operand) bool {
	other := x
	switch {
	case c.isNaNCall(y.expr):
	case c.isNaNCall(x.expr):
		other = y
	default:
		return false
	}
	always := map[token.Token]string{token.EQL: "false", token.NEQ: "true"}[n.Op]
	d := analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catNaN,
		Message: fmt.Sprintf("comparison with math.NaN() is always %s: NaN is unequal to every value, itself included; test with math.IsNaN", always),
	}
	name, edits, ok := c.importMath(cur, n.Pos())
	if !ok || !provenance.IsFloat(c.pass.TypesInfo.TypeOf(other.expr)) || isComplex(c.pass.TypesInfo.TypeOf(other.expr)) {
		fixes.Report(c.pass, d)
		return true
	}
	arg := fixes.Source(c.pass.Fset, other.expr)
	if !types.Identical(c.pass.TypesInfo.TypeOf(other.expr), types.Typ[types.Float64]) {
		arg = "float64(" + arg + ")"
	}
	text := name + ".IsNaN(" + arg + ")"
	if n.Op == token.NEQ {
		text = "!" + text
	}
	fixes.Report(c.pass, d, fixes.Safe("Replace with "+text, append(edits, fixes.Replace(n, text))...))
	return true
}

// isNaNCall reports whether e is a call of math.NaN, or of a function of
// this package without parameters whose body only returns one
// (func NaN() float32 { return float32(math.NaN()) }).
func (c *checker) isNaNCall(e ast.Expr) bool { return c.nanCall(e, true) }

// nanCall is isNaNCall, following a wrapper's body when wrapper is set.
func (c *checker) nanCall(e ast.Expr, wrapper bool) bool {
	call, ok := ast.Unparen(e).(*ast.CallExpr)
	if !ok {
		return false
	}
	if c.pass.TypesInfo.Types[call.Fun].IsType() && len(call.Args) == 1 {
		return c.nanCall(call.Args[0], wrapper) // float32(math.NaN())
	}
	if provenance.MathCallee(c.pass.TypesInfo, call) == "NaN" {
		return true
	}
	sc := c.callAt(call.Lparen)
	if !wrapper || !ok || len(call.Args) != 0 || sc == nil || sc.Common().StaticCallee() == nil {
		return false
	}
	fd, isDecl := sc.Common().StaticCallee().Syntax().(*ast.FuncDecl)
	if !isDecl || fd.Body == nil || len(fd.Body.List) != 1 {
		return false
	}
	ret, isRet := fd.Body.List[0].(*ast.ReturnStmt)
	return isRet && len(ret.Results) == 1 && c.nanCall(ret.Results[0], false)
}

func isComplex(t types.Type) bool {
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&types.IsComplex != 0
}

// rtol returns the relative tolerance the fixes use for format f: 1e-9 for
// float64 (about 4.5e6 ulps: nine significant digits, common practice) and
// 1e-5 for float32 (about 84 ulps).
func rtol(f numeric.Format) string {
	if f == numeric.Float32 {
		return "1e-5"
	}
	return "1e-9"
}

// reportComputed reports the exact comparison of two computed values; field
// is set when y is a load of a field that holds computed values.
func (c *checker) reportComputed(cur inspector.Cursor, n *ast.BinaryExpr, op token.Token, x, y operand, field *types.Var) {
	t := c.pass.TypesInfo.TypeOf(x.expr)
	f := provenance.FormatOf(t)
	node := ast.Node(n)
	if n == nil {
		node = y.expr
	}
	what := fmt.Sprintf("two computed %s values", typeName(t))
	if field != nil {
		what = fmt.Sprintf("a computed %s value and field %s, which this package fills with computed values", typeName(t), field.Name())
	}
	d := analysis.Diagnostic{
		Pos: node.Pos(), End: node.End(), Category: catComputed,
		Message: fmt.Sprintf("exact %s between %s: each carries rounding error (up to %.3g relative per operation, more where fused multiply-add differs by platform); compare within a tolerance such as %s relative",
			op, what, f.U, rtol(f)),
	}
	fixes.Report(c.pass, d, c.toleranceFix(cur, n, x, y, t)...)
}

// literal reports a computed value x compared with a constant y that its
// type cannot represent exactly.
func (c *checker) literal(cur inspector.Cursor, n *ast.BinaryExpr, op token.Token, x, y operand) {
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, y.expr)
	if !ok || v.Kind() == constant.Complex || landsOn(x.val, y.val) {
		return // not a constant, complex (only real literals are judged), or an absorption test
	}
	t := c.pass.TypesInfo.TypeOf(x.expr)
	f := provenance.FormatOf(t)
	stored, exact := storedValue(v, f)
	if exact {
		return // the constant is stored exactly: a deliberate target value
	}
	node := ast.Node(n)
	if n == nil {
		node = y.expr
	}
	d := analysis.Diagnostic{
		Pos: node.Pos(), End: node.End(), Category: catLiteral,
		Message: fmt.Sprintf("exact %s between a computed %s value and %s, which %s stores as %s: one rounding error (ulp %.3g there) makes the test fail; compare within a tolerance such as %s relative",
			op, typeName(t), fixes.Source(c.pass.Fset, y.expr), f.Name, numeric.Decimal(stored, 34), f.Spacing(stored), rtol(f)),
	}
	fixes.Report(c.pass, d, c.toleranceFix(cur, n, x, y, t)...)
}

// storedValue returns the value format f stores for constant v, and whether
// that is exact.
func storedValue(v constant.Value, f numeric.Format) (float64, bool) {
	if f == numeric.Float32 {
		s, exact := constant.Float32Val(v)
		return float64(s), exact
	}
	return constant.Float64Val(v)
}

// typeName returns t as the message shows it, qualified relative to nothing.
func typeName(t types.Type) string {
	return types.TypeString(t, func(*types.Package) string { return "" })
}

// toleranceFix returns the fix replacing an exact comparison by a relative
// tolerance test, or none when the operands cannot be repeated safely, the
// comparison is a switch case, the values are complex, or the code around
// says the comparison is exact (fixes.SaysExact).
func (c *checker) toleranceFix(cur inspector.Cursor, n *ast.BinaryExpr, x, y operand, t types.Type) []fixes.Fix {
	if n == nil || isComplex(t) || !fixes.Pure(c.pass.TypesInfo, x.expr) || !fixes.Pure(c.pass.TypesInfo, y.expr) ||
		fixes.SaysExact(c.pass.Fset, fileOf(cur), cur) {
		return nil
	}
	name, edits, ok := c.importMath(cur, n.Pos())
	if !ok {
		return nil
	}
	conv := func(s string) string { return s }
	if !types.Identical(t, types.Typ[types.Float64]) {
		conv = func(s string) string { return "float64(" + s + ")" }
	}
	xs, ys := fixes.Source(c.pass.Fset, x.expr), fixes.Source(c.pass.Fset, y.expr)
	sub := token.SUB.Precedence()
	diff := fixes.Operand(c.pass.Fset, x.expr, sub) + " - " + fixes.Operand(c.pass.Fset, y.expr, sub+1)
	rel := map[token.Token]string{token.EQL: " <= ", token.NEQ: " > "}[n.Op]
	scale := fmt.Sprintf("%[1]s.Max(%[1]s.Abs(%[2]s), %[1]s.Abs(%[3]s))", name, conv(xs), conv(ys))
	if v, ok := constval.Exact(c.pass.TypesInfo, c.decls, y.expr); ok && constant.Sign(v) > 0 {
		scale = fixes.Operand(c.pass.Fset, y.expr, token.MUL.Precedence()+1) // a positive constant is its own magnitude
	}
	text := fmt.Sprintf("%s.Abs(%s)%s%s*%s", name, conv(diff), rel, rtol(provenance.FormatOf(t)), scale)
	return []fixes.Fix{fixes.Judgement("Compare within relative tolerance "+rtol(provenance.FormatOf(t)), append(edits, fixes.Replace(n, text))...)}
}

// importMath returns the name for package math at pos and the edits that
// import it if needed.
func (c *checker) importMath(cur inspector.Cursor, pos token.Pos) (string, []analysis.TextEdit, bool) {
	return fixes.Import(c.pass.TypesInfo, fileOf(cur), pos, "math")
}

// aggregate reports == or != on arrays or structs when both operands are
// built from computed floats.
func (c *checker) aggregate(n *ast.BinaryExpr, x, y operand) {
	ax, okx := c.computedAggregate(x.val)
	ay, oky := c.computedAggregate(y.val)
	if !okx || !oky || ax == ay {
		return // not both computed, or a variable against its own earlier value
	}
	t := c.pass.TypesInfo.TypeOf(n.X)
	c.pass.Report(analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catAggr,
		Message: fmt.Sprintf("%s on %s values compares their float elements exactly, and both hold computed floats carrying rounding error; compare the elements within a tolerance", n.Op, typeName(t)),
	})
}

// computedAggregate reports whether v is loaded from a local array or
// struct into which this function stores a computed float, and returns it.
func (c *checker) computedAggregate(v ssa.Value) (*ssa.Alloc, bool) {
	load, ok := provenance.Strip(v).(*ssa.UnOp)
	if !ok || load.Op != token.MUL {
		return nil, false
	}
	alloc, ok := load.X.(*ssa.Alloc)
	return alloc, ok && c.storesComputed(alloc, 3)
}

// storesComputed reports whether a computed float is stored through addr or
// an element or field address derived from it.
func (c *checker) storesComputed(addr ssa.Value, depth int) bool {
	if depth == 0 || addr.Referrers() == nil {
		return false
	}
	for _, r := range *addr.Referrers() {
		switch r := r.(type) {
		case *ssa.Store:
			if r.Addr == addr && provenance.IsFloat(r.Val.Type()) && c.track.Computed(r.Val) {
				return true
			}
		case *ssa.FieldAddr:
			if c.storesComputed(r, depth-1) {
				return true
			}
		case *ssa.IndexAddr:
			if c.storesComputed(r, depth-1) {
				return true
			}
		}
	}
	return false
}
