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
	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"

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
func (c *checker) splitReduction(cur inspector.Cursor, n *ast.BinaryExpr) {
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
	t := c.pass.TypesInfo.TypeOf(n)
	if t == nil {
		return // ill-typed
	}
	b, ok := t.Underlying().(*types.Basic)
	if !ok || b.Kind() != types.Float32 && b.Kind() != types.Float64 {
		return
	}
	prec, sig := 53, significantBits64(a)
	if b.Kind() == types.Float32 {
		prec, sig = 24, significantBits32(float32(a))
	}
	reach := math.Ldexp(math.Abs(a), prec-sig) // y*A is exact for x below about this
	cond, bound, guarded := c.reductionGuard(cur, lead.X)
	switch {
	case guarded && bound <= reach:
		return // the guard keeps y within the exact range
	case !guarded && prec-sig >= minExactBits:
		return
	case guarded:
		fixes.Report(c.pass, analysis.Diagnostic{
			Pos: cond.Pos(), End: cond.End(), Category: catSplit,
			Message: fmt.Sprintf("%s sends arguments up to %.3g to the range reduction x - y*A - y*B below, which is exact in %s only for x below about %.3g (A = %.9g has %d significant bits); lower the bound or split A shorter",
				fixes.Source(c.pass.Fset, cond), bound, b.Name(), reach, a, sig),
		})
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: lead.Pos(), End: lead.End(), Category: catSplit,
		Message: fmt.Sprintf("range reduction x - y*A - y*B%s in %s: A = %.9g has %d significant bits there, so y*A is exact only for |y| < %d and beyond its rounding (up to u·|y·A|) survives the cancellation; split A so that its leading part has at most %d - bits(y) significant bits",
			binding("y", y), b.Name(), a, sig, 1<<(prec-sig), prec),
	})
}

// reductionGuard returns the comparison of an enclosing if statement that
// lets only x below a constant bound reach cur (x < T in the body, x >= T
// in the else branch), and the bound.
func (c *checker) reductionGuard(cur inspector.Cursor, x ast.Expr) (*ast.BinaryExpr, float64, bool) {
	for ; ; cur = cur.Parent() {
		switch p := cur.Parent().Node().(type) {
		case nil, *ast.FuncDecl, *ast.FuncLit:
			return nil, 0, false
		case *ast.IfStmt:
			cond, ok := ast.Unparen(p.Cond).(*ast.BinaryExpr)
			if !ok || !same(cond.X, x) || c.pass.TypesInfo.Types[cond.Y].Value == nil {
				continue
			}
			v := c.pass.TypesInfo.Types[cond.Y].Value
			op := cond.Op
			switch cur.ParentEdgeKind() {
			case edge.IfStmt_Else:
				op = invert(op)
			case edge.IfStmt_Body:
			default:
				continue
			}
			if op == token.LSS || op == token.LEQ {
				t, _ := constant.Float64Val(constant.ToFloat(v))
				return cond, t, true
			}
		}
	}
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
