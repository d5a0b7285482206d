package cancellation

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"
	"math/bits"

	"golang.org/x/tools/go/analysis"

	"roundoff/analyzers/internal/fixes"
)

// minExactBits is the fewest bits a split's multiplier may have before
// its leading product rounds: below 2^8 = 256 the reduction is exact only
// for arguments within a few hundred periods (common practice: float64
// splits leave 30 bits, float32 ones 8 to 12).
const minExactBits = 8

// splitReduction reports the first step of an additive range reduction
// (x - y*A) - y*B, Cody and Waite's split of a constant into a leading
// part A and corrections B, ..., when A has so many significant bits in
// the expression's type that y*A is exact only for |y| below
// 2^minExactBits: the reduction relies on y*A being exact, so that x - y*A
// cancels without error; past that bound y*A rounds by up to u·|y·A|,
// which the cancellation leaves as the whole error of the reduced
// argument (a float64 split computed in float32 is the usual cause).
func (c *checker) splitReduction(n *ast.BinaryExpr) {
	lead, ok := ast.Unparen(n.X).(*ast.BinaryExpr)
	if n.Op != token.SUB || !ok || lead.Op != token.SUB {
		return
	}
	y, _, ok := c.scaledBy(n.Y)
	y0, a, ok0 := c.scaledBy(lead.Y)
	if !ok || !ok0 || !same(y, y0) || c.isConst(y) {
		return
	}
	if inner, isSub := ast.Unparen(lead.X).(*ast.BinaryExpr); isSub && inner.Op == token.SUB {
		if y1, _, ok := c.scaledBy(inner.Y); ok && same(y1, y) {
			return // a later step of the same reduction: reported at its first
		}
	}
	b, ok := c.pass.TypesInfo.TypeOf(n).Underlying().(*types.Basic)
	if !ok || b.Kind() != types.Float32 && b.Kind() != types.Float64 {
		return
	}
	prec, sig := 53, significantBits64(a)
	if b.Kind() == types.Float32 {
		prec, sig = 24, significantBits32(float32(a))
	}
	if prec-sig >= minExactBits {
		return
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: lead.Pos(), End: lead.End(), Category: catSplit,
		Message: fmt.Sprintf("range reduction x - y*A - y*B%s in %s: A = %.9g has %d significant bits there, so y*A is exact only for |y| < %d and beyond its rounding (up to u·|y·A|) survives the cancellation; split A so that its leading part has at most %d - bits(y) significant bits",
			binding("y", y), b.Name(), a, sig, 1<<(prec-sig), prec),
	})
}

// scaledBy reads e as y*A or A*y with A a constant, and returns y and A.
func (c *checker) scaledBy(e ast.Expr) (ast.Expr, float64, bool) {
	m, ok := ast.Unparen(e).(*ast.BinaryExpr)
	if !ok || m.Op != token.MUL {
		return nil, 0, false
	}
	for _, pair := range [2][2]ast.Expr{{m.X, m.Y}, {m.Y, m.X}} {
		if v := c.pass.TypesInfo.Types[pair[1]].Value; v != nil && !c.isConst(pair[0]) {
			f, _ := constant.Float64Val(constant.ToFloat(v))
			return pair[0], f, f != 0 && !math.IsInf(f, 0)
		}
	}
	return nil, 0, false
}

// significantBits64 returns the number of significant bits of a normal
// float64: 53 less the trailing zeros of its significand.
func significantBits64(f float64) int {
	m := math.Float64bits(f)&(1<<52-1) | 1<<52
	return 53 - bits.TrailingZeros64(m)
}

// significantBits32 is significantBits64 for a float32.
func significantBits32(f float32) int {
	m := math.Float32bits(f)&(1<<23-1) | 1<<23
	return 24 - bits.TrailingZeros32(m)
}
