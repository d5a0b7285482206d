package epsfloor

import (
	"go/ast"
	"go/token"

	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"

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
// could change.
func (c *checker) sameEverywhere(n ast.Node, tol ast.Expr) bool {
	call, ok := n.(*ast.CallExpr)
	if !ok || !provenance.InTestFile(c.pass.Fset, call.Pos()) {
		return false
	}
	sc, ok := c.ssaAt(call.Lparen).(*ssa.Call)
	if !ok {
		return false
	}
	args := sc.Common().Args
	if sc.Common().Signature().Recv() != nil && len(args) > len(call.Args) {
		args = args[1:] // the receiver comes first in SSA
	}
	var compared []ssa.Value
	for i, a := range call.Args {
		if a != tol && i < len(args) && provenance.HoldsFloat(c.pass.TypesInfo.TypeOf(a), false) {
			compared = append(compared, args[i])
		}
	}
	return len(compared) > 0 && c.portable(compared...)
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
	bin, ok := c.ssaAt(sub.OpPos).(*ssa.BinOp)
	return ok && c.portable(bin.X, bin.Y)
}

// portable reports whether every value is a constant or computed the same
// way on every platform, as package portable judges it.
func (c *checker) portable(vals ...ssa.Value) bool {
	judge := portable.Of(c.pass)
	for _, v := range vals {
		if _, isConst := v.(*ssa.Const); !isConst && !judge.Value(v) && !judge.OnInputs(v) && judge.Cause(v) {
			return false
		}
	}
	return true
}

// ssaAt returns the SSA call or binary operation at pos (a call's left
// parenthesis, an operator), indexing the package's on first use.
func (c *checker) ssaAt(pos token.Pos) ssa.Instruction {
	if c.instrs == nil {
		c.instrs = map[token.Pos]ssa.Instruction{}
		for _, fn := range c.pass.ResultOf[lazyssa.Analyzer].(*lazyssa.Lazy).SSA().SrcFuncs {
			for _, b := range fn.Blocks {
				for _, instr := range b.Instrs {
					switch instr.(type) {
					case *ssa.Call, *ssa.BinOp:
						if instr.Pos().IsValid() {
							c.instrs[instr.Pos()] = instr
						}
					}
				}
			}
		}
	}
	return c.instrs[pos]
}
