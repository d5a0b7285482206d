package epsfloor

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
)

// stepless reports math.Nextafter(x, y) and math.Nextafter32(x, y) whose
// direction y is x itself (the same constant value, or the same variable):
// IEEE 754-2019 §5.3.1 nextUp and nextDown step toward a direction, and
// Nextafter returns x unchanged when y == x, so Nextafter(1, 1) - 1 is 0,
// not eps, and a tolerance built that way makes its test exact equality.
func (c *checker) stepless(call *ast.CallExpr) {
	fn, ok := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func)
	if !ok || fn.Pkg() == nil || fn.Pkg().Path() != "math" || fn.Name() != "Nextafter" && fn.Name() != "Nextafter32" || len(call.Args) != 2 {
		return
	}
	x, y := call.Args[0], call.Args[1]
	vx, okx := constval.Exact(c.pass.TypesInfo, c.decls, x)
	vy, oky := constval.Exact(c.pass.TypesInfo, c.decls, y)
	same := okx && oky && constant.Compare(vx, token.EQL, vy) ||
		fixes.Pure(c.pass.TypesInfo, x) && types.ExprString(ast.Unparen(x)) == types.ExprString(ast.Unparen(y))
	if !same {
		return
	}
	c.pass.Report(analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catAbsorbed,
		Message: fmt.Sprintf("math.%s(%s, %s) steps toward its own value and returns it unchanged, so no neighbouring float is reached (Nextafter(1, 1) - 1 is 0, not eps = 2^-52); give the direction, such as math.Inf(1) or 2",
			fn.Name(), types.ExprString(x), types.ExprString(y)),
	})
}
