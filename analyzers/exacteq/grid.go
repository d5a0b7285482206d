package exacteq

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"

	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
)

// truncatedScales reads n, in a test file, as int(a*k) == int(b*k) (or
// !=), the conversions perhaps held in variables set once: two floats
// compared to a number of digits by truncating both to a grid of step
// 1/k. It returns the two scaled floats.
func truncatedScales(info *types.Info, decls map[types.Object]ast.Expr, fset *token.FileSet, n *ast.BinaryExpr) (x, y *ast.BinaryExpr, ok bool) {
	if n.Op != token.EQL && n.Op != token.NEQ || !provenance.InTestFile(fset, n.Pos()) {
		return nil, nil, false
	}
	x, okx := truncatedScale(info, decls, n.X)
	y, oky := truncatedScale(info, decls, n.Y)
	return x, y, okx && oky && types.ExprString(ast.Unparen(x.Y)) == types.ExprString(ast.Unparen(y.Y))
}

// truncatedScale reads e as an integer conversion of a float product
// a*k, directly or through a variable set once.
func truncatedScale(info *types.Info, decls map[types.Object]ast.Expr, e ast.Expr) (*ast.BinaryExpr, bool) {
	e = ast.Unparen(e)
	if id, isIdent := e.(*ast.Ident); isIdent && decls[info.Uses[id]] != nil {
		e = ast.Unparen(decls[info.Uses[id]])
	}
	conv, isCall := e.(*ast.CallExpr)
	if !isCall || len(conv.Args) != 1 || !info.Types[conv.Fun].IsType() || !isInteger(info.TypeOf(conv)) {
		return nil, false
	}
	m, isMul := ast.Unparen(conv.Args[0]).(*ast.BinaryExpr)
	if !isMul || m.Op != token.MUL || !provenance.IsFloat(info.TypeOf(m)) || info.Types[m.X].Value != nil {
		return nil, false
	}
	return m, true
}

// truncGrid reports, in a test file, two floats compared to a number of
// digits by truncating both to a grid: conversion to an integer truncates
// toward zero, so a value one rounding below a grid point (1.5 computed as
// 1.4999999999999998) lands a whole step below the value written as 1.5,
// and decimal expected values sit exactly on grid points, where that
// happens. math.Round(a*k) == math.Round(b*k) puts the grid points in
// the middle of their cells; a tolerance on |a-b| states the digits
// directly.
func (c *checker) truncGrid(n *ast.BinaryExpr) {
	x, y, ok := truncatedScales(c.pass.TypesInfo, c.decls, c.pass.Fset, n)
	if !ok {
		return
	}
	src := fixes.Source(c.pass.Fset, x.Y)
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catGrid,
		Message: fmt.Sprintf("%s compares %s and %s truncated to a grid of step 1/%s: a result one rounding below a grid point (1.4999999999999998 for 1.5, ulp 2.2e-16) truncates a whole step lower than the decimal it should equal, and decimal expected values sit on grid points; round instead, math.Round(x*%[4]s), or compare |a-b| within a tolerance",
			fixes.Source(c.pass.Fset, n), fixes.Source(c.pass.Fset, x.X), fixes.Source(c.pass.Fset, y.X), src),
	})
}
