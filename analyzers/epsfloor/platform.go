package epsfloor

import (
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/lazyssa"
	"roundoff/analyzers/internal/portable"
	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/tolerance"
)

// sameEverywhere reports whether n, a call in a test file that passes tol
// as a tolerance below the resolution of the values it compares, shows
// no reason for those values to differ between platforms (package
// portable: a product a platform may fuse into an add, a math function
// that is not correctly rounded, in the values compared, in the calls
// that fill a slice before it is compared, or in the check itself when it
// is the project's own helper, which may compute what it compares). Such a
// tolerance makes the check exact equality, which holds everywhere it
// holds once when nothing in sight can change the bits: the test pins
// nothing another platform could change, the standard exacteq holds
// pinned results to. Where sight is lost (an interface, a function value,
// cgo) before any reason shows, nothing is claimed.
func (c *checker) sameEverywhere(n ast.Node, tol ast.Expr) bool {
	call, ok := n.(*ast.CallExpr)
	if !ok || !provenance.InTestFile(c.pass.Fset, call.Pos()) {
		return false
	}
	sc, ok := c.pass.ResultOf[lazyssa.Analyzer].(*lazyssa.Lazy).At(call.Lparen).(*ssa.Call)
	if !ok {
		return false
	}
	args := sc.Common().Args
	if sc.Common().Signature().Recv() != nil && len(args) > len(call.Args) {
		args = args[1:] // the receiver comes first in SSA
	}
	var compared []ssa.Value
	for i, a := range call.Args {
		if a != tol && i < len(args) && provenance.HoldsFloat(c.pass.TypesInfo.TypeOf(a), true) {
			compared = append(compared, args[i])
		}
	}
	if len(compared) == 0 {
		return false
	}
	if fn, ok := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func); !ok || len(apiParams(fn)) == 0 {
		if portable.Of(c.pass).InputCause(sc.Common()) {
			return false // the helper computes what it compares
		}
	}
	return c.portable(compared...)
}

// differenceSameEverywhere is sameEverywhere for a test |a-b| < tol in a
// test file: the operands of the subtraction a-b, where it is written.
func (c *checker) differenceSameEverywhere(cur inspector.Cursor, t tolerance.Test) bool {
	fd := enclosingDecl(cur)
	if fd == nil || t.B == nil || !provenance.InTestFile(c.pass.Fset, t.Cmp.Pos()) {
		return false
	}
	var sub *ast.BinaryExpr
	ast.Inspect(fd, func(n ast.Node) bool {
		if b, ok := n.(*ast.BinaryExpr); ok && b.Op == token.SUB && b.X == t.A && b.Y == t.B {
			sub = b
		}
		return sub == nil
	})
	if sub == nil {
		return false
	}
	bin, ok := c.pass.ResultOf[lazyssa.Analyzer].(*lazyssa.Lazy).At(sub.OpPos).(*ssa.BinOp)
	return ok && c.portable(bin.X, bin.Y)
}

// portable reports whether every value is a constant or computed the same
// way on every platform, as package portable judges it. A slice or other
// reference is judged by the causes in sight only (Judge.Cause, which
// follows the calls that fill it): Judge.Value takes what a call stores
// through a reference as an input.
func (c *checker) portable(vals ...ssa.Value) bool {
	judge := portable.Of(c.pass)
	for _, v := range vals {
		if _, isConst := v.(*ssa.Const); isConst {
			continue
		}
		if judge.Cause(v) && (!provenance.IsFloat(v.Type()) || !judge.Value(v) && !judge.OnInputs(v)) {
			return false
		}
	}
	return true
}
