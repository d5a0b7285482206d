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

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/internal/numeric"
)

// stepless reports math.Nextafter(x, y) and math.Nextafter32(x, y) whose
// direction y is x itself (the same constant value, or the same variable):
// IEEE 754-2019 §5.3.1 nextUp and nextDown step toward a direction, and
// Nextafter returns x unchanged when y == x, so Nextafter(1, 1) - 1 is 0,
// not eps, and a tolerance built that way makes its test exact equality.
// It reports too a direction written as x plus a constant, Nextafter(x,
// x+1): x+c rounds to x once |x| reaches 2^53·|c| (2^24·|c| in float32),
// and there the step is 0. fn is the function called, or nil.
func (c *checker) stepless(cur inspector.Cursor, call *ast.CallExpr, fn *types.Func) {
	if fn == nil || fn.Pkg() == nil || fn.Pkg().Path() != "math" || fn.Name() != "Nextafter" && fn.Name() != "Nextafter32" || len(call.Args) != 2 {
		return
	}
	x, y := call.Args[0], call.Args[1]
	vx, okx := constval.Exact(c.pass.TypesInfo, c.decls, x)
	vy, oky := constval.Exact(c.pass.TypesInfo, c.decls, y)
	if okx && oky && constant.Compare(vx, token.EQL, vy) || sameValue(c.pass.TypesInfo, x, y) {
		c.pass.Report(analysis.Diagnostic{
			Pos: call.Pos(), End: call.End(), Category: catAbsorbed,
			Message: fmt.Sprintf("math.%s(%s, %s) steps toward its own value and returns it unchanged, so no neighbouring float is reached (Nextafter(1, 1) - 1 is 0, not eps = 2^-52); give the direction, such as math.Inf(1) or 2",
				fn.Name(), types.ExprString(x), types.ExprString(y)),
		})
		return
	}
	c.offsetDirection(cur, fn, x, y)
}

// offsetDirection reports Nextafter(x, x+c) and Nextafter(x, x-c), c a
// constant: the direction rounds to x itself once |x| reaches 2^53·|c|
// (2^24·|c| in float32), where Nextafter then returns x. math.Inf(±1)
// gives the same step wherever x+c differs from x and the step the call
// was written for where it does not, so the fix is unattended. A test
// file supplies its own data, whose size it shows: there nothing is said.
func (c *checker) offsetDirection(cur inspector.Cursor, fn *types.Func, x, y ast.Expr) {
	d, ok := ast.Unparen(y).(*ast.BinaryExpr)
	if !ok || d.Op != token.ADD && d.Op != token.SUB || provenance.InTestFile(c.pass.Fset, y.Pos()) {
		return // a test fixes its own data, which reach 2^53 only where it shows them
	}
	off := d.Y
	if !sameValue(c.pass.TypesInfo, x, d.X) {
		if d.Op != token.ADD || !sameValue(c.pass.TypesInfo, x, d.Y) {
			return
		}
		off = d.X
	}
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, off)
	if !ok || constant.Sign(v) == 0 {
		return
	}
	k, _ := constant.Float64Val(constant.ToFloat(v))
	up := k > 0 == (d.Op == token.ADD)
	bits := 53
	if fn.Name() == "Nextafter32" {
		bits = 24
	}
	dir := map[bool]string{true: "1", false: "-1"}[up]
	d0 := analysis.Diagnostic{
		Pos: y.Pos(), End: y.End(), Category: catAbsorbed,
		Message: fmt.Sprintf("math.%[1]s(%[2]s, %[3]s) steps toward %[2]s itself once |%[2]s| reaches %.3[4]g (2^%[5]d·%[6]s): %[3]s rounds to %[2]s there, and the call returns %[2]s, a step of 0; give the direction math.Inf(%[7]s)",
			fn.Name(), fixes.Source(c.pass.Fset, x), fixes.Source(c.pass.Fset, y), math.Ldexp(math.Abs(k), bits), bits, numeric.Short(math.Abs(k)), dir),
	}
	name, edits, ok := fixes.Import(c.pass.TypesInfo, fileOf(cur), y.Pos(), "math")
	if !ok {
		fixes.Report(c.pass, d0)
		return
	}
	text := name + ".Inf(" + dir + ")"
	if fn.Name() == "Nextafter32" {
		text = "float32(" + text + ")"
	}
	fixes.Report(c.pass, d0, fixes.Safe("Step toward "+text, append(edits, fixes.Replace(y, text))...))
}

// sameValue reports whether x and y are the same side-effect-free
// expression.
func sameValue(info *types.Info, x, y ast.Expr) bool {
	return fixes.Pure(info, x) && types.ExprString(ast.Unparen(x)) == types.ExprString(ast.Unparen(y))
}
