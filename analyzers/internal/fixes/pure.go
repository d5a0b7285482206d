package fixes

import (
	"go/ast"
	"go/token"
	"go/types"
	"slices"

	"golang.org/x/tools/go/types/typeutil"
)

// Pure reports whether e can be evaluated twice, or once more at another
// place, without a visible effect: names, field selections, indexing of
// arrays and slices, constants, arithmetic, conversions, and calls of math
// functions on such operands.
func Pure(info *types.Info, e ast.Expr) bool {
	switch e := ast.Unparen(e).(type) {
	case *ast.Ident, *ast.BasicLit:
		return true
	case *ast.SelectorExpr:
		if sel, ok := info.Selections[e]; ok {
			return sel.Kind() == types.FieldVal && Pure(info, e.X)
		}
		return true // a qualified identifier
	case *ast.IndexExpr:
		_, isMap := info.TypeOf(e.X).Underlying().(*types.Map)
		return !isMap && Pure(info, e.X) && Pure(info, e.Index)
	case *ast.UnaryExpr:
		return (e.Op == token.SUB || e.Op == token.ADD) && Pure(info, e.X)
	case *ast.BinaryExpr:
		return Pure(info, e.X) && Pure(info, e.Y)
	case *ast.CallExpr:
		if tv := info.Types[e.Fun]; tv.IsType() {
			return len(e.Args) == 1 && Pure(info, e.Args[0]) // conversion
		}
		fn, ok := typeutil.Callee(info, e).(*types.Func)
		return ok && fn.Pkg() != nil && fn.Pkg().Path() == "math" &&
			!slices.ContainsFunc(e.Args, func(a ast.Expr) bool { return !Pure(info, a) })
	}
	return false
}
