package epsfloor

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/internal/numeric"
)

// absorbed reports a constant k ± c of float type that rounds back to k:
// c is below half the spacing of floats at k and has no effect.
func (c *checker) absorbed(cur inspector.Cursor, n *ast.BinaryExpr) {
	if n.Op != token.ADD && n.Op != token.SUB {
		return
	}
	tv := c.pass.TypesInfo.Types[n]
	if tv.Value == nil || !provenance.IsFloat(tv.Type) || isComplex(tv.Type) {
		return
	}
	x, okx := constval.Exact(c.pass.TypesInfo, c.decls, n.X)
	y, oky := constval.Exact(c.pass.TypesInfo, c.decls, n.Y)
	if !okx || !oky {
		return
	}
	f := provenance.FormatOf(tv.Type)
	sum := f.Value(constant.BinaryOp(x, n.Op, y))
	k, addend, up := n.X, n.Y, n.Op == token.ADD == (constant.Sign(y) > 0)
	switch {
	case constant.Sign(y) != 0 && sum == f.Value(x) && f.Value(x) != 0:
	case n.Op == token.ADD && constant.Sign(x) != 0 && sum == f.Value(y) && f.Value(y) != 0:
		k, addend, up = n.Y, n.X, constant.Sign(x) > 0
	default:
		return
	}
	kv := f.Value(map[ast.Expr]constant.Value{n.X: x, n.Y: y}[k])
	d := analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catAbsorbed,
		Message: fmt.Sprintf("%s has no effect on %s: it is below half the spacing of %s values there (%.3g), so the sum rounds back to exactly %s; use math.Nextafter for the neighbouring value",
			fixes.Source(c.pass.Fset, addend), fixes.Source(c.pass.Fset, k), f.Name, f.Spacing(kv)/2, numeric.Short(kv)),
	}
	fixes.Report(c.pass, d, c.nextafterFix(cur, n, k, up, f)...)
}

func isComplex(t types.Type) bool {
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&types.IsComplex != 0
}

// nextafterFix replaces k ± c by math.Nextafter(k, ±Inf), the neighbour of
// k in the direction of c. A constant declaration cannot call a function,
// so none is offered there.
func (c *checker) nextafterFix(cur inspector.Cursor, n *ast.BinaryExpr, k ast.Expr, up bool, f numeric.Format) []fixes.Fix {
	for gen := range cur.Enclosing((*ast.GenDecl)(nil)) {
		if gen.Node().(*ast.GenDecl).Tok == token.CONST {
			return nil
		}
	}
	if b, ok := types.Unalias(c.pass.TypesInfo.TypeOf(n)).(*types.Basic); !ok || b.Kind() != types.Float64 && b.Kind() != types.Float32 && b.Kind() != types.UntypedFloat {
		return nil // a named type would need a conversion around the call
	}
	name, edits, ok := fixes.Import(c.pass.TypesInfo, fileOf(cur), n.Pos(), "math")
	if !ok {
		return nil
	}
	dir := map[bool]string{true: "1", false: "-1"}[up]
	text := fmt.Sprintf("%[1]s.Nextafter(%[2]s, %[1]s.Inf(%[3]s))", name, fixes.Source(c.pass.Fset, k), dir)
	if f == numeric.Float32 {
		text = fmt.Sprintf("%[1]s.Nextafter32(%[2]s, float32(%[1]s.Inf(%[3]s)))", name, fixes.Source(c.pass.Fset, k), dir)
	}
	return []fixes.Fix{fixes.Judgement("Use the neighbouring value: "+text, append(edits, fixes.Replace(n, text))...)}
}
