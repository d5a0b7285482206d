package cancellation

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/fixes"
)

// bigProducts reports z.Sub(x, y) and z.Add(x, y) on math/big Floats
// whose operands x and y were last set by Mul, in a function that never
// calls SetPrec: a zero Float takes the precision of its operands, 53
// bits from SetFloat64 or big.NewFloat, so the products are rounded to 53
// bits exactly as float64 products are, and their difference cancels as
// in float64 (an exact product of two float64 values needs 106 bits).
func (c *checker) bigProducts(cur inspector.Cursor, call *ast.CallExpr) {
	sel, ok := call.Fun.(*ast.SelectorExpr)
	if !ok || len(call.Args) != 2 || !c.bigFloatMethod(call, "Sub", "Add") {
		return
	}
	if _, plain := ast.Unparen(sel.X).(*ast.Ident); !plain {
		return // inside a chain: its operands are the chain's intermediate values
	}
	fn, ok := enclosingFunc(cur)
	if !ok || !c.product(fn, call.Args[0], call.Pos()) || !c.product(fn, call.Args[1], call.Pos()) {
		return
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catBigFloat,
		Message: fmt.Sprintf("%s.%s of big.Float products in a function that never calls SetPrec: a zero big.Float takes its operands' precision, 53 bits from SetFloat64 or big.NewFloat, so the products round as float64 ones do and the difference cancels as in float64; give the operands SetPrec(106) or more (an exact product of two float64 values)",
			types.ExprString(sel.X), sel.Sel.Name),
	})
}

// product reports whether the big.Float that x names was last set, before
// pos, by a method chain ending in Mul, in the function at fn, which
// starts its values from float64 (SetFloat64, big.NewFloat) and never
// calls SetPrec.
func (c *checker) product(fn inspector.Cursor, x ast.Expr, pos token.Pos) bool {
	v := c.chainRoot(x)
	if v == nil {
		return false
	}
	last, fromFloat64 := "", false
	for cur := range fn.Preorder((*ast.CallExpr)(nil)) {
		call := cur.Node().(*ast.CallExpr)
		switch {
		case c.bigFloatMethod(call, "SetPrec"):
			return false // a precision is chosen
		case c.bigFloatMethod(call, "SetFloat64"):
			fromFloat64 = true
		case !c.bigFloatMethod(call):
			f, ok := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func)
			fromFloat64 = fromFloat64 || ok && f.Pkg() != nil && f.Pkg().Path() == "math/big" && f.Name() == "NewFloat"
			continue
		}
		if _, inChain := cur.Parent().Node().(*ast.SelectorExpr); !inChain && call.End() < pos && c.chainRoot(call) == v {
			last = call.Fun.(*ast.SelectorExpr).Sel.Name // the outermost call of a chain on v
		}
	}
	return fromFloat64 && last == "Mul"
}

// bigFloatMethod reports whether call calls one of the named methods of
// math/big's Float, or any of them when no name is given.
func (c *checker) bigFloatMethod(call *ast.CallExpr, names ...string) bool {
	f, ok := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func)
	if !ok || f.Pkg() == nil || f.Pkg().Path() != "math/big" {
		return false
	}
	recv := f.Signature().Recv()
	if recv == nil || types.TypeString(recv.Type(), nil) != "*math/big.Float" {
		return false
	}
	return len(names) == 0 || slices.Contains(names, f.Name())
}

// chainRoot returns the variable at the root of a method chain or an
// address: x for x.SetFloat64(a).Sub(...).Mul(...), &x, or x.
func (c *checker) chainRoot(e ast.Expr) types.Object {
	for {
		switch x := ast.Unparen(e).(type) {
		case *ast.UnaryExpr:
			if x.Op != token.AND {
				return nil
			}
			e = x.X
		case *ast.CallExpr:
			sel, ok := x.Fun.(*ast.SelectorExpr)
			if !ok {
				return nil
			}
			e = sel.X
		case *ast.Ident:
			return c.pass.TypesInfo.Uses[x]
		default:
			return nil
		}
	}
}
