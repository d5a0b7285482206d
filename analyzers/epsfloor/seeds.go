package epsfloor

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/degree"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/internal/numeric"
)

// seed judges a tiny positive constant assigned to a local float variable
// by what the function then does with the variable:
//
//   - as a floor that later divides (the modified Lentz method's
//     if d == 0 { d = tiny }; d = 1/d), a constant whose reciprocal
//     overflows turns the next quotient into +Inf: 1/4.9e-324 is far
//     beyond the largest float64, 1.8e308;
//   - as the start of a running maximum (if x > m { m = x }, or
//     m = math.Max(m, x)), math.SmallestNonzeroFloat64 is the smallest
//     positive value, not the most negative, so the maximum of values that
//     are all ≤ 0 comes out as 4.9e-324.
func (c *checker) seed(cur inspector.Cursor, as *ast.AssignStmt) {
	if len(as.Lhs) != len(as.Rhs) || as.Tok != token.ASSIGN && as.Tok != token.DEFINE {
		return
	}
	for i, l := range as.Lhs {
		id, ok := l.(*ast.Ident)
		v, _ := c.pass.TypesInfo.ObjectOf(id).(*types.Var)
		if !ok || v == nil || !provenance.IsFloat(v.Type()) || isComplex(v.Type()) {
			continue
		}
		val, ok := constval.Exact(c.pass.TypesInfo, c.decls, as.Rhs[i])
		f := provenance.FormatOf(v.Type())
		x := f.Value(val)
		if !ok || !(x > 0) {
			continue
		}
		body := innermostFunc(cur)
		switch {
		case x < 1/maxOf(f) && divides(c.pass.TypesInfo, body, v):
			c.reportFloor(as.Rhs[i], id.Name, x, f)
		case x == f.Smallest && runningMax(c.pass.TypesInfo, body, v):
			c.reportMaxSeed(cur, as.Rhs[i], id.Name, f)
		}
	}
}

// maxOf returns the largest finite value of format f.
func maxOf(f numeric.Format) float64 {
	if f == numeric.Float32 {
		return math.MaxFloat32
	}
	return math.MaxFloat64
}

// reportFloor reports a floor whose reciprocal overflows.
func (c *checker) reportFloor(val ast.Expr, name string, x float64, f numeric.Format) {
	// The smallest normal divided by eps: 2^-1022/2^-52 = 2^-970 (float64),
	// 2^-126/2^-23 = 2^-103 (float32), the floor Numerical Recipes 3rd ed.
	// §5.2 uses for the modified Lentz method (from memory).
	floor := map[numeric.Format]string{numeric.Float64: "0x1p-970", numeric.Float32: "0x1p-103"}[f]
	src := fixes.Source(c.pass.Fset, val)
	d := analysis.Diagnostic{
		Pos: val.Pos(), End: val.End(), Category: catSubnormal,
		Message: fmt.Sprintf("%s floors %s, which then divides: 1/%.2g overflows to +Inf (the largest %s is %.2g), so the next quotient is Inf and what follows it Inf or NaN; use a floor whose reciprocal is finite, such as %s (%.2g, the smallest normal %[4]s over eps)",
			numeric.WithValue(src, x), name, x, f.Name, maxOf(f), floor, floatOf(floor)),
		Related: c.declaredAt(val),
	}
	if d.Related != nil {
		fixes.Report(c.pass, d) // the value is set elsewhere, and may floor other variables too
		return
	}
	fixes.Report(c.pass, d, fixes.Judgement("Floor at "+floor, fixes.Replace(val, floor)))
}

// floatOf returns the value of a hexadecimal float literal.
func floatOf(lit string) float64 {
	var e int
	fmt.Sscanf(lit, "0x1p%d", &e)
	return math.Ldexp(1, e)
}

// reportMaxSeed reports a running maximum started at the smallest positive
// float.
func (c *checker) reportMaxSeed(cur inspector.Cursor, val ast.Expr, name string, f numeric.Format) {
	d := analysis.Diagnostic{
		Pos: val.Pos(), End: val.End(), Category: catSubnormal,
		Message: fmt.Sprintf("%s starts the running maximum %s at %.2g, the smallest positive %s, not the most negative: when every value is ≤ 0 the maximum comes out as %.2[3]g; start at math.Inf(-1) or -math.MaxFloat64",
			fixes.Source(c.pass.Fset, val), name, f.Smallest, f.Name),
	}
	name, edits, ok := fixes.Import(c.pass.TypesInfo, fileOf(cur), val.Pos(), "math")
	if !ok {
		fixes.Report(c.pass, d)
		return
	}
	text := name + ".Inf(-1)"
	if f == numeric.Float32 {
		text = "float32(" + text + ")"
	}
	fixes.Report(c.pass, d, fixes.Judgement("Start at "+text, append(edits, fixes.Replace(val, text))...))
}

// innermostFunc returns the function declaration or literal around cur.
func innermostFunc(cur inspector.Cursor) ast.Node {
	for fn := range cur.Enclosing((*ast.FuncDecl)(nil), (*ast.FuncLit)(nil)) {
		return fn.Node()
	}
	return nil
}

// isVar reports whether e names v.
func isVar(info *types.Info, e ast.Expr, v *types.Var) bool {
	id, ok := ast.Unparen(e).(*ast.Ident)
	return ok && info.Uses[id] == v
}

// divides reports whether v is a divisor somewhere in body.
func divides(info *types.Info, body ast.Node, v *types.Var) bool {
	found := false
	ast.Inspect(body, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.BinaryExpr:
			found = found || n.Op == token.QUO && isVar(info, n.Y, v)
		case *ast.AssignStmt:
			found = found || n.Tok == token.QUO_ASSIGN && len(n.Rhs) == 1 && isVar(info, n.Rhs[0], v)
		}
		return !found
	})
	return found
}

// runningMax reports whether body keeps a running maximum in v of values
// that may be negative: if x > v { v = x } (or v < x), or
// v = math.Max(v, x), where x is not non-negative by construction (a
// maximum of squares or magnitudes floored at the smallest positive value
// stays positive on purpose).
func runningMax(info *types.Info, body ast.Node, v *types.Var) bool {
	found := false
	ast.Inspect(body, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.IfStmt:
			if x := greater(info, n.Cond, v); x != nil && !degree.NonNegative(info, x) && assignsFrom(info, n.Body, v, x) {
				found = true
			}
		case *ast.AssignStmt:
			if len(n.Lhs) == 1 && len(n.Rhs) == 1 && isVar(info, n.Lhs[0], v) {
				call, ok := n.Rhs[0].(*ast.CallExpr)
				if !ok {
					return true
				}
				fn, _ := typeutil.Callee(info, call).(*types.Func)
				found = fn != nil && fn.Pkg() != nil && fn.Pkg().Path() == "math" && fn.Name() == "Max" &&
					len(call.Args) == 2 && (isVar(info, call.Args[0], v) && !degree.NonNegative(info, call.Args[1]) || isVar(info, call.Args[1], v) && !degree.NonNegative(info, call.Args[0]))
			}
		}
		return !found
	})
	return found
}

// greater returns x when cond is x > v, x >= v, v < x or v <= x.
func greater(info *types.Info, cond ast.Expr, v *types.Var) ast.Expr {
	b, ok := ast.Unparen(cond).(*ast.BinaryExpr)
	if !ok {
		return nil
	}
	switch {
	case (b.Op == token.GTR || b.Op == token.GEQ) && isVar(info, b.Y, v):
		return b.X
	case (b.Op == token.LSS || b.Op == token.LEQ) && isVar(info, b.X, v):
		return b.Y
	}
	return nil
}

// assignsFrom reports whether block assigns x (as written) to v.
func assignsFrom(info *types.Info, block *ast.BlockStmt, v *types.Var, x ast.Expr) bool {
	for _, s := range block.List {
		as, ok := s.(*ast.AssignStmt)
		if ok && len(as.Lhs) == 1 && len(as.Rhs) == 1 && isVar(info, as.Lhs[0], v) && types.ExprString(as.Rhs[0]) == types.ExprString(x) {
			return true
		}
	}
	return false
}

// zeroThreshold reports x < s or x > s (or <=, >=, mirrored) where the
// constant s is positive as written but, in x's format, rounds to 0
// (math.SmallestNonzeroFloat64 squared is 2.4e-647, 0 in float64) or is
// the smallest positive value or a small multiple of it (see
// fewSubnormals): no value other than 0 and a few subnormals lies below it, so for
// x ≥ 0 the test is x == 0 (x > 0 the other way), and a threshold meant
// to catch tiny values catches none but 0. Only a computed x is judged: a
// value read as the caller gave it (a parameter, a field of one) carries
// no residue of this code, and a test of its sign is exact on purpose
// (if phi < math.SmallestNonzeroFloat64 { return 0 } after phi < 0 was
// rejected). It reports whether it reported.
func (c *checker) zeroThreshold(cur inspector.Cursor, n *ast.BinaryExpr) bool {
	for _, dir := range []token.Token{token.LSS, token.GTR} {
		x, s, v, f, ok := c.boundTest(n, dir)
		if !ok {
			continue
		}
		exact, _ := constval.Exact(c.pass.TypesInfo, c.decls, s)
		if exact.Kind() == constant.Complex || constant.Sign(exact) <= 0 || v > fewSubnormals*f.Smallest {
			continue
		}
		if !c.computed(cur, x) {
			return false // a value as the caller gave it: a positivity check is exact on purpose
		}
		as := map[token.Token]string{token.LSS: "x == 0", token.GTR: "x > 0"}[dir]
		what := fmt.Sprintf("is subnormal (%.2g, %.0f times the smallest positive %s): no %[3]s but 0 and that many subnormal values lies below it", v, v/f.Smallest, f.Name)
		switch {
		case v == 0:
			what = fmt.Sprintf("is %s as written but rounds to 0 in %s, being at most half its smallest positive value (%.2g)", constant.ToFloat(exact), f.Name, f.Smallest)
		case v == f.Smallest:
			what = fmt.Sprintf("is the smallest positive %s (%.2g): no %[1]s lies between it and 0", f.Name, f.Smallest)
		}
		fixes.Report(c.pass, analysis.Diagnostic{
			Pos: n.Pos(), End: n.End(), Category: catSubnormal,
			Message: fmt.Sprintf("%s %s, so for x ≥ 0 this is a test for %s; write that if it is meant, or compare with the smallest normal %s, %s (%.2g), to catch subnormal values",
				fixes.Source(c.pass.Fset, s), what, as, f.Name, smallestNormal[f], floatOf(smallestNormal[f])),
		})
		return true
	}
	return false
}

// smallestNormal writes the smallest positive normal value of each format
// exactly (IEEE 754-2019: 2^-1022 for binary64, 2^-126 for binary32).
var smallestNormal = map[numeric.Format]string{numeric.Float64: "0x1p-1022", numeric.Float32: "0x1p-126"}

// isConst reports whether e is a constant expression.
func (c *checker) isConst(e ast.Expr) bool {
	tv, ok := c.pass.TypesInfo.Types[e]
	return ok && tv.Value != nil
}

// boundTest reads n as x < bound (or bound > x, or <=) when dir is
// token.LSS, as x > bound (or bound < x, or >=) when it is token.GTR,
// with x a run-time real float and bound a constant, whose value in x's
// format it returns.
func (c *checker) boundTest(n *ast.BinaryExpr, dir token.Token) (x, bound ast.Expr, v float64, f numeric.Format, ok bool) {
	x, bound = n.X, n.Y
	strict, loose, other, otherLoose := token.LSS, token.LEQ, token.GTR, token.GEQ
	if dir == token.GTR {
		strict, loose, other, otherLoose = other, otherLoose, strict, loose
	}
	switch n.Op {
	case strict, loose:
	case other, otherLoose:
		x, bound = n.Y, n.X
	default:
		return nil, nil, 0, f, false
	}
	t := c.pass.TypesInfo.TypeOf(x)
	if t == nil || !provenance.IsFloat(t) || isComplex(t) || c.isConst(x) {
		return nil, nil, 0, f, false
	}
	val, ok := constval.Exact(c.pass.TypesInfo, c.decls, bound)
	f = provenance.FormatOf(t)
	return x, bound, f.Value(val), f, ok
}

// fewSubnormals bounds the thresholds read as zero tests: below 1024
// times the smallest positive value lie only 0 and 1023 subnormal values.
// A larger tiny constant (1/math.MaxFloat64, 5.6e-309, with 2^50
// subnormal values below it) is an underflow guard.
const fewSubnormals = 1024

// computed reports whether x, at cur, is worked out by the function
// rather than read as its caller gave it (see degree.Reader.Rounds).
func (c *checker) computed(cur inspector.Cursor, x ast.Expr) bool {
	fd := enclosingDecl(cur)
	return fd != nil && c.degrees().Rounds(fd, x)
}
