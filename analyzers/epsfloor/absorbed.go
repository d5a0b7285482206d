package epsfloor

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/internal/numeric"
)

// term is one addend of a sum as written, with its sign.
type term struct {
	expr ast.Expr
	neg  bool
}

// absorbed reports an addend c of a float sum that has no effect. Go
// evaluates a constant expression exactly and rounds it once, to its type
// (Go spec, "Constant expressions"), so in a constant sum c has no effect
// when the whole sum rounds to the same value without it. In a sum with
// run-time terms, a constant c below half the spacing at another constant
// term k has no effect either: it is absorbed while the sum stays near k,
// and when the other terms cancel k that closely, their own rounding
// errors (about u·|k|) exceed c (Pi/2 - f(x) + 6.1e-17 in float32).
func (c *checker) absorbed(cur inspector.Cursor, n *ast.BinaryExpr) {
	if n.Op != token.ADD && n.Op != token.SUB {
		return
	}
	tv := c.pass.TypesInfo.Types[n]
	if !provenance.IsFloat(tv.Type) || isComplex(tv.Type) || c.inSum(cur) {
		return
	}
	terms := c.terms(n, false, nil)
	f := provenance.FormatOf(tv.Type)
	if tv.Value != nil {
		if top := c.roundedWhole(cur); top != ast.Expr(n) {
			c.absorbedWithin(n, top, terms, f)
			return
		}
		c.absorbedConstant(cur, n, terms, f)
		return
	}
	if !c.absorbedElement(cur, n, terms, f) {
		c.absorbedMixed(n, terms, f)
	}
}

// absorbedElement reports k ± c, k an element of a local slice of
// constants at an index the source fixes (see elemValue) and c a constant
// below half the spacing at it: the one rounding of the sum gives k back
// (xs[m] - tol/1000 with xs[m] = 3 and tol = 1e-14). It reports whether
// the sum was such.
func (c *checker) absorbedElement(cur inspector.Cursor, n *ast.BinaryExpr, terms []term, f numeric.Format) bool {
	if len(terms) != 2 || terms[0].neg {
		return false
	}
	kv, ok := c.elemValue(cur, terms[0].expr)
	v, okc := c.value(terms[1])
	if !ok || !okc || constant.Sign(v) == 0 {
		return false
	}
	k, d := f.Value(kv), f.Value(v)
	same := k+d == k // the sum as the program rounds it
	if f == numeric.Float32 {
		same = float32(k)+float32(d) == float32(k)
	}
	if k == 0 || d == 0 || !same {
		return false
	}
	c.reportAbsorbed(n, terms[1].expr, fixes.Source(c.pass.Fset, terms[0].expr), k, f, c.nextafterFix(cur, n, terms[0].expr, d > 0, f))
	return true
}

// inSum reports whether cur's node is an operand of a larger sum, which
// judges it whole.
func (c *checker) inSum(cur inspector.Cursor) bool {
	for p := cur.Parent(); ; p = p.Parent() {
		switch b := p.Node().(type) {
		case *ast.ParenExpr:
			continue
		case *ast.BinaryExpr:
			return b.Op == token.ADD || b.Op == token.SUB
		}
		return false
	}
}

// terms flattens the sum e into its addends.
func (c *checker) terms(e ast.Expr, neg bool, acc []term) []term {
	if b, ok := ast.Unparen(e).(*ast.BinaryExpr); ok && (b.Op == token.ADD || b.Op == token.SUB) {
		acc = c.terms(b.X, neg, acc)
		return c.terms(b.Y, neg != (b.Op == token.SUB), acc)
	}
	return append(acc, term{e, neg})
}

// value returns the exact value of a constant term, sign included.
func (c *checker) value(t term) (constant.Value, bool) {
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, t.expr)
	if ok && t.neg {
		v = constant.UnaryOp(token.SUB, v, 0)
	}
	return v, ok && v.Kind() != constant.Complex
}

// absorbedConstant reports the first addend of a constant sum without
// which the sum rounds to the same value.
func (c *checker) absorbedConstant(cur inspector.Cursor, n *ast.BinaryExpr, terms []term, f numeric.Format) {
	vals := make([]constant.Value, len(terms))
	total := constant.MakeInt64(0)
	for i, t := range terms {
		v, ok := c.value(t)
		if !ok {
			return
		}
		vals[i], total = v, constant.BinaryOp(total, token.ADD, v)
	}
	sum := f.Value(total)
	for i, t := range terms {
		rest := f.Value(constant.BinaryOp(total, token.SUB, vals[i]))
		if constant.Sign(vals[i]) == 0 || rest != sum || rest == 0 {
			continue
		}
		var fs []fixes.Fix
		if len(terms) == 2 {
			fs = c.nextafterFix(cur, n, terms[1-i].expr, constant.Sign(vals[i]) > 0, f)
		}
		c.reportAbsorbed(n, t.expr, c.restOf(terms, i), rest, f, fs)
		return
	}
}

// roundedWhole returns the constant expression that holds cur's sum and is
// rounded as a whole: the largest one reached through parentheses, signs
// and arithmetic, whose operands stay exact until it is (Go spec,
// "Constant expressions"); a conversion rounds its operand, and stops the
// climb.
func (c *checker) roundedWhole(cur inspector.Cursor) ast.Expr {
	top := cur.Node().(ast.Expr)
	for p := cur.Parent(); ; p = p.Parent() {
		switch e := p.Node().(type) {
		case *ast.ParenExpr, *ast.UnaryExpr, *ast.BinaryExpr:
			if c.pass.TypesInfo.Types[e.(ast.Expr)].Value == nil {
				return top
			}
			top = e.(ast.Expr)
		default:
			return top
		}
	}
}

// absorbedWithin reports the first addend of the constant sum n without
// which top, the constant expression that holds n and is rounded once,
// has the same value.
func (c *checker) absorbedWithin(n *ast.BinaryExpr, top ast.Expr, terms []term, f numeric.Format) {
	whole, ok := constval.Exact(c.pass.TypesInfo, c.decls, top)
	if !ok || whole.Kind() == constant.Complex {
		return
	}
	for _, t := range terms {
		if v, ok := c.value(t); !ok || constant.Sign(v) == 0 {
			continue
		}
		without, ok := c.evalWithout(top, t.expr)
		if !ok || without.Kind() == constant.Complex || constant.Compare(without, token.EQL, whole) || f.Value(without) != f.Value(whole) || f.Value(whole) == 0 {
			continue // no effect even exactly (a factor of 0), or an effect on the rounded value
		}
		fixes.Report(c.pass, analysis.Diagnostic{
			Pos: n.Pos(), End: n.End(), Category: catAbsorbed,
			Message: fmt.Sprintf("%s has no effect on %s: the constant is evaluated exactly and rounded once to %s, to %s, the value it has without %s; use math.Nextafter for a neighbouring value",
				fixes.Source(c.pass.Fset, t.expr), fixes.Source(c.pass.Fset, top), f.Name, numeric.Short(f.Value(whole)), fixes.Source(c.pass.Fset, t.expr)),
		})
		return
	}
}

// evalWithout evaluates the constant expression e exactly with the
// addend drop taken as 0.
func (c *checker) evalWithout(e, drop ast.Expr) (constant.Value, bool) {
	if e == drop {
		return constant.MakeInt64(0), true
	}
	switch x := e.(type) {
	case *ast.ParenExpr:
		return c.evalWithout(x.X, drop)
	case *ast.UnaryExpr:
		v, ok := c.evalWithout(x.X, drop)
		if !ok || x.Op != token.SUB && x.Op != token.ADD {
			return nil, false
		}
		return constant.UnaryOp(x.Op, v, 0), true
	case *ast.BinaryExpr:
		a, oka := c.evalWithout(x.X, drop)
		b, okb := c.evalWithout(x.Y, drop)
		switch {
		case !oka || !okb:
			return nil, false
		case x.Op == token.QUO && (constant.Sign(b) == 0 || a.Kind() == constant.Int && b.Kind() == constant.Int):
			return nil, false // a division by zero, or one of integers, which Go truncates
		case x.Op == token.QUO:
			return constant.BinaryOp(constant.ToFloat(a), token.QUO, constant.ToFloat(b)), true
		case x.Op == token.ADD || x.Op == token.SUB || x.Op == token.MUL:
			return constant.BinaryOp(a, x.Op, b), true
		}
		return nil, false
	}
	return constval.Exact(c.pass.TypesInfo, c.decls, e)
}

// absorbedMixed reports a constant addend below half the spacing at another
// constant addend of a sum with run-time terms.
func (c *checker) absorbedMixed(n *ast.BinaryExpr, terms []term, f numeric.Format) {
	var consts []int
	for i, t := range terms {
		if _, ok := c.value(t); ok {
			consts = append(consts, i)
		} else if !c.rounded(t.expr) {
			return // a variable can cancel k exactly (1 - p is exact for p near 1), leaving c alone
		}
	}
	for _, i := range consts {
		vi, _ := c.value(terms[i])
		for _, j := range consts {
			vj, _ := c.value(terms[j])
			small, big := math.Abs(f.Value(vi)), math.Abs(f.Value(vj))
			if i != j && small > 0 && big > 0 && small < f.Spacing(big)/2 {
				fixes.Report(c.pass, analysis.Diagnostic{
					Pos: n.Pos(), End: n.End(), Category: catAbsorbed,
					Message: fmt.Sprintf("%s has no effect next to %s: it is below half the spacing of %s values there (%.3g), so it is absorbed while the sum stays near %s, and below the other terms' rounding errors (about %.2g) when they cancel it; drop it, or compute in a wider type",
						fixes.Source(c.pass.Fset, terms[i].expr), fixes.Source(c.pass.Fset, terms[j].expr), f.Name, f.Spacing(big)/2, numeric.Short(big), f.U*big),
				})
				return
			}
		}
	}
}

// rounded reports whether e is a value that carries rounding error: a call
// (not a conversion), a product or a quotient.
func (c *checker) rounded(e ast.Expr) bool {
	switch e := ast.Unparen(e).(type) {
	case *ast.CallExpr:
		tv, ok := c.pass.TypesInfo.Types[e.Fun]
		return !ok || !tv.IsType()
	case *ast.BinaryExpr:
		return e.Op == token.MUL || e.Op == token.QUO
	}
	return false
}

// restOf names the sum without addend i: the other addend of a pair, or
// "the rest of the sum".
func (c *checker) restOf(terms []term, i int) string {
	if len(terms) == 2 {
		return fixes.Source(c.pass.Fset, terms[1-i].expr)
	}
	return "the rest of the sum"
}

// reportAbsorbed reports that addend has no effect on k, whose value is kv.
func (c *checker) reportAbsorbed(n *ast.BinaryExpr, addend ast.Expr, k string, kv float64, f numeric.Format, fs []fixes.Fix) {
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catAbsorbed,
		Message: fmt.Sprintf("%s has no effect on %s: it is below half the spacing of %s values there (%.3g), so the sum rounds back to exactly %s; use math.Nextafter for the neighbouring value",
			fixes.Source(c.pass.Fset, addend), k, f.Name, f.Spacing(kv)/2, numeric.Short(kv)),
	}, fs...)
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
