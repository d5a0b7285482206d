package epsfloor

import (
	"go/ast"
	"go/constant"
	"go/types"

	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/consume"
)

// assignedBefore returns the constant a local variable e holds at cur:
// the value of its last assignment before cur in straight-line code
// (consume.Reaching), when that assignment gives it a constant (truth =
// -1000.548 before a test of truth; the value is then exact, not a guess).
func (c *checker) assignedBefore(cur inspector.Cursor, e ast.Expr) (constant.Value, bool) {
	id, ok := ast.Unparen(e).(*ast.Ident)
	if !ok {
		return nil, false
	}
	v, _ := c.pass.TypesInfo.Uses[id].(*types.Var)
	if v == nil || v.Pkg() == nil || v.Parent() == v.Pkg().Scope() {
		return nil, false
	}
	rhs, ok := consume.Reaching(c.pass.TypesInfo, cur, v)
	if !ok {
		return nil, false
	}
	val, ok := constval.Exact(c.pass.TypesInfo, c.decls, rhs.Node().(ast.Expr))
	return val, ok && val.Kind() != constant.Complex
}
