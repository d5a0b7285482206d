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
// as a tolerance below the resolution of the values it compares, compares
// only values computed the same way, bit for bit, on every platform
// (package portable: constants, exact arithmetic, single correctly rounded
// operations, no product a platform may fuse, no math function that is
// not correctly rounded). Such a tolerance makes the check exact equality,
// and exact equality of values that cannot differ between platforms holds
// everywhere it holds once; the test pins nothing that another platform
// could change. A well-known check (sites.go) compares what it is given,
// so its arguments are judged; a helper of the project's may compute what
// it compares from them, so the whole call is (Judge.Call). A slice or
// pointer given to the check must hold only what the judge can see.
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
	for _, v := range compared {
		if !provenance.IsFloat(v.Type()) && filledElsewhere(v, sc, 4) {
			return false // what the call stored there is out of sight
		}
	}
	if len(compared) == 0 {
		return false
	}
	if fn, ok := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func); ok && len(apiParams(fn)) > 0 {
		return c.portable(compared...) // a known check compares what it is given
	}
	return portable.Of(c.pass).Call(sc.Common()) // a helper may compute what it compares
}

// filledElsewhere reports whether v, a slice, array, pointer or value
// that holds one, may hold what no judge sees: it is read from a
// variable, a field or a parameter, or it, or a reference the call that
// made it was given, is handed to a call other than except (and other
// than one that only prints), which may store anything through it.
func filledElsewhere(v ssa.Value, except ssa.Instruction, depth int) bool {
	root := provenance.Strip(v)
	if provenance.IsFloat(root.Type()) {
		return false // a number, boxed for an interface parameter
	}
	for {
		if s, ok := root.(*ssa.Slice); ok {
			root = s.X
		} else if e, ok := root.(*ssa.Extract); ok {
			root = e.Tuple // one of several results of a call
		} else {
			break
		}
	}
	switch r := root.(type) {
	case *ssa.Const:
		return false
	case *ssa.MakeSlice, *ssa.Alloc:
		return handedOut(r, except, map[ssa.Value]bool{})
	case *ssa.Call:
		if depth == 0 || handedOut(r, except, map[ssa.Value]bool{}) {
			return true
		}
		for _, a := range r.Common().Args { // m.Col(0): the matrix it reads
			if !provenance.IsFloat(a.Type()) && filledElsewhere(a, r, depth-1) {
				return true
			}
		}
		return false
	}
	return true
}

// handedOut reports whether x, or a view of it, is given to a call other
// than except that may write through it, or stored away.
func handedOut(x ssa.Value, except ssa.Instruction, seen map[ssa.Value]bool) bool {
	if seen[x] || x.Referrers() == nil {
		return false
	}
	seen[x] = true
	for _, r := range *x.Referrers() {
		switch r := r.(type) {
		case *ssa.Call:
			if r != except && !portable.ReadOnly(r) {
				return true
			}
		case *ssa.Go, *ssa.Defer:
			return true
		case *ssa.Store:
			if r.Val == x {
				return true // kept elsewhere, where anything may write through it
			}
		case *ssa.Slice, *ssa.ChangeType, *ssa.Convert, *ssa.MakeInterface:
			if handedOut(r.(ssa.Value), except, seen) {
				return true
			}
		}
	}
	return false
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
