package cancellation

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/consume"
	"roundoff/analyzers/internal/fixes"
)

// accumulation records, once per package, how variables and fields are
// updated: which accumulate squares of data (s2 += x*x, s2 = k*s2 +
// w*(x*x)) and which only count (it++).
type accumulation struct {
	squares  map[types.Object]bool
	products map[types.Object]bool // accumulate products of two data values (sxy += x*y)
	sums     map[types.Object]bool // accumulate values (sx += x)
	counts   map[types.Object]bool // false once a variable is set otherwise
	factors  map[types.Object]pair // the factors of the products summed (sxy += x*y; zero when they differ)
}

// target returns the variable or field e names.
func (c *checker) target(e ast.Expr) types.Object {
	switch e := ast.Unparen(e).(type) {
	case *ast.Ident:
		return c.pass.TypesInfo.ObjectOf(e)
	case *ast.SelectorExpr:
		return c.pass.TypesInfo.ObjectOf(e.Sel)
	}
	return nil
}

// updates scans the package's assignments the first time it is needed.
func (c *checker) updates() *accumulation {
	if c.acc != nil {
		return c.acc
	}
	c.acc = &accumulation{squares: map[types.Object]bool{}, products: map[types.Object]bool{}, sums: map[types.Object]bool{}, counts: map[types.Object]bool{}, factors: map[types.Object]pair{}}
	inPlace := map[types.Object]bool{} // t *= t
	for cur := range c.insp.Root().Preorder((*ast.AssignStmt)(nil), (*ast.IncDecStmt)(nil)) {
		if s, ok := cur.Node().(*ast.AssignStmt); ok && s.Tok == token.MUL_ASSIGN && len(s.Lhs) == 1 && same(s.Lhs[0], s.Rhs[0]) {
			inPlace[c.target(s.Lhs[0])] = true
		}
	}
	for cur := range c.insp.Root().Preorder((*ast.AssignStmt)(nil), (*ast.IncDecStmt)(nil)) {
		switch s := cur.Node().(type) {
		case *ast.IncDecStmt:
			if obj := c.target(s.X); obj != nil {
				if _, seen := c.acc.counts[obj]; !seen {
					c.acc.counts[obj] = true
				}
			}
		case *ast.AssignStmt:
			for i, lhs := range s.Lhs {
				obj := c.target(lhs)
				if obj == nil || len(s.Rhs) != len(s.Lhs) {
					continue
				}
				if !c.wholeConst(s.Rhs[i]) && !c.wholeNumber(s.Rhs[i]) {
					c.acc.counts[obj] = false
				}
				if s.Tok == token.ADD_ASSIGN && c.squareTerm(cur, s.Rhs[i], inPlace) ||
					s.Tok == token.ASSIGN && c.recurrence(cur, s.Rhs[i], obj, inPlace) {
					c.acc.squares[obj] = true
				}
				if s.Tok == token.ADD_ASSIGN {
					c.noteFactors(obj, s.Rhs[i])
				}
				if s.Tok == token.ADD_ASSIGN && !c.isConst(s.Rhs[i]) {
					c.acc.sums[obj] = true
					if c.crossTerm(cur, s.Rhs[i]) {
						c.acc.products[obj] = true
					}
				}
			}
		}
	}
	return c.acc
}

// noteFactors records the two factors of a product e added into obj, by
// their text in sorted order; an accumulator that sums anything else, or
// products of other factors elsewhere, gets the zero pair.
func (c *checker) noteFactors(obj types.Object, e ast.Expr) {
	var p pair
	if m, ok := ast.Unparen(e).(*ast.BinaryExpr); ok && m.Op == token.MUL && !c.isConst(m.X) && !c.isConst(m.Y) &&
		fixes.Pure(c.pass.TypesInfo, m.X) && fixes.Pure(c.pass.TypesInfo, m.Y) {
		p = pair{fixes.Source(c.pass.Fset, ast.Unparen(m.X)), fixes.Source(c.pass.Fset, ast.Unparen(m.Y))}
		slices.Sort(p[:])
	}
	if old, seen := c.acc.factors[obj]; seen && old != p {
		p = pair{}
	}
	c.acc.factors[obj] = p
}

// recurrence reports whether e is a sum with a term that mentions obj and
// a term with a square of data: s2 = k*s2 + w*(x*x).
func (c *checker) recurrence(cur inspector.Cursor, e ast.Expr, obj types.Object, inPlace map[types.Object]bool) bool {
	sum, ok := ast.Unparen(e).(*ast.BinaryExpr)
	if !ok || sum.Op != token.ADD {
		return false
	}
	mentions := func(t ast.Expr) bool {
		found := false
		ast.Inspect(t, func(n ast.Node) bool {
			if id, ok := n.(*ast.Ident); ok && c.pass.TypesInfo.ObjectOf(id) == obj {
				found = true
			}
			return !found
		})
		return found
	}
	return mentions(sum.X) && c.squareTerm(cur, sum.Y, inPlace) || mentions(sum.Y) && c.squareTerm(cur, sum.X, inPlace)
}

// squareTerm reports whether e is a square of a value that is not a
// deviation, possibly weighted: x*x, w*(x*x), or a variable squared in
// place (t *= t), or a product with the same factor twice (w*x*x). A squared deviation (x-m)*(x-m) is the two-pass form,
// which is accurate.
func (c *checker) squareTerm(cur inspector.Cursor, e ast.Expr, inPlace map[types.Object]bool) bool {
	if x, ok := c.square(e); ok {
		return !c.centred(cur, x, 6)
	}
	switch e := ast.Unparen(e).(type) {
	case *ast.BinaryExpr:
		return e.Op == token.MUL && (c.squareTerm(cur, e.X, inPlace) || c.squareTerm(cur, e.Y, inPlace) || c.repeatedFactor(cur, e))
	case *ast.Ident:
		return inPlace[c.target(e)]
	}
	return false
}

// repeatedFactor reports whether the product e has the same
// side-effect-free value, not a deviation, among its factors twice:
// w*x*x, parsed (w*x)*x.
func (c *checker) repeatedFactor(cur inspector.Cursor, e *ast.BinaryExpr) bool {
	factors := factorsOf(e)
	for i, f := range factors {
		for _, g := range factors[i+1:] {
			if same(f, g) && fixes.Pure(c.pass.TypesInfo, f) && !c.isConst(f) && !c.centred(cur, f, 6) {
				return true
			}
		}
	}
	return false
}

// centred reports whether x, as it reaches the statement at cur, is a
// deviation (a - m), also scaled (a - m)/s, through variables and the
// package's own functions (x = normalize(x) returning (x - mean)/sd): data
// centred before squaring hold no mean² to cancel.
func (c *checker) centred(cur inspector.Cursor, x ast.Expr, depth int) bool {
	if depth == 0 {
		return false
	}
	d, _ := c.through(x)
	switch d := ast.Unparen(d).(type) {
	case *ast.BinaryExpr:
		return d.Op == token.SUB || (d.Op == token.QUO || d.Op == token.MUL) && c.centred(cur, d.X, depth-1)
	case *ast.Ident:
		if v, ok := c.pass.TypesInfo.Uses[d].(*types.Var); ok {
			if rhs, ok := consume.Reaching(c.pass.TypesInfo, cur, v); ok {
				return c.centred(rhs, rhs.Node().(ast.Expr), depth-1)
			}
		}
	case *ast.CallExpr:
		if r := c.returned(d); r != nil {
			return c.centred(cur, r, depth-1)
		}
	}
	return false
}

// counts reports whether e, directly or through never-reassigned
// variables, is a whole number: an integer conversion, or a float variable
// or field that is only ever incremented or set to whole constants.
func (c *checker) counts(e ast.Expr) bool {
	e, _ = c.through(e)
	if c.wholeNumber(e) {
		return true
	}
	obj := c.target(e)
	return obj != nil && c.updates().counts[obj]
}

// variance reports the one-pass variance E[x²] - E[x]²: s2/n - m*m,
// s2 - s1*s1/n or the weighted W*s2 - s1*s1, with s2 accumulating squares
// of data (also a field read through an accessor, d.SumWX2()). Both terms are about
// mean², so the difference loses about log10(mean²/variance) digits (8 of
// 16 for data near 1e4 with spread 1) and can come out negative; the sum
// of squared deviations from the mean (two passes, or Welford's update)
// keeps them. It reports whether n had that form.
func (c *checker) variance(n *ast.BinaryExpr) bool {
	if _, ok := c.varianceOf(n); !ok {
		return false
	}
	c.onePass(n, "variance %s - %s subtracts two values of about mean² and loses about log10(mean²/variance) digits (a spread of 1 at mean 1e4 leaves 8 of 16; u = %.3g), and can turn negative; accumulate squared deviations from the mean (Welford's update or two passes)")
	return true
}

// varianceOf returns the accumulator of squares s2 when n is a one-pass
// variance built from it.
func (c *checker) varianceOf(n *ast.BinaryExpr) (ast.Expr, bool) {
	sq := ast.Unparen(n.Y)
	if q, ok := sq.(*ast.BinaryExpr); ok && q.Op == token.QUO {
		sq = ast.Unparen(q.X) // s1*s1/n
	}
	if !c.squared(sq) {
		return nil, false
	}
	s2, _ := c.through(n.X)
	if q, ok := s2.(*ast.BinaryExpr); ok && q.Op == token.QUO {
		s2, _ = c.through(q.X) // s2/n
	} else if ok && q.Op == token.MUL {
		// n*s2 or Σw*Σwx², the weighted form Σw·Σwx² - (Σwx)²; not
		// Σx²*Σy², a product of two sums of squares
		x, y := c.accumulatesSquares(q.X), c.accumulatesSquares(q.Y)
		if x == y {
			return nil, false
		}
		s2 = q.X
		if y {
			s2 = q.Y
		}
	}
	return s2, c.accumulatesSquares(s2)
}

// onePass reports the one-pass moment n, a difference, with format
// taking its two terms and the unit roundoff.
func (c *checker) onePass(n *ast.BinaryExpr, format string) {
	c.pass.Report(analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catVariance,
		Message: "one-pass " + fmt.Sprintf(format, fixes.Source(c.pass.Fset, ast.Unparen(n.X)), fixes.Source(c.pass.Fset, ast.Unparen(n.Y)), unitRoundoff),
	})
}

// crossTerm reports whether e is a product of two different values, none
// a deviation from a mean: x*y, the term of a sum of cross products.
func (c *checker) crossTerm(cur inspector.Cursor, e ast.Expr) bool {
	m, ok := ast.Unparen(e).(*ast.BinaryExpr)
	if !ok || m.Op != token.MUL || same(m.X, m.Y) || c.isConst(m.X) || c.isConst(m.Y) {
		return false
	}
	return !c.centred(cur, m.X, 6) && !c.centred(cur, m.Y, 6)
}

// covariance reports the one-pass covariance: sxy - sx*sy/n, n*sxy -
// sx*sy, or sxy/n - mx*my, where sxy accumulates products x*y and sx, sy
// accumulate values (mx, my their quotients by a count). Both terms are
// about n²·mean(x)·mean(y), and the difference n²·cov keeps only about
// log10(|mean(x)·mean(y)/cov|) digits, like the variance it generalises.
func (c *checker) covariance(n *ast.BinaryExpr) bool {
	if _, ok := c.covarianceOf(n); !ok {
		return false
	}
	c.onePass(n, "covariance %s - %s subtracts two values of about mean(x)·mean(y) and loses about log10(|mean(x)·mean(y)/cov|) digits (8 of 16 at means 1e4 with unit spread; u = %.3g); accumulate products of deviations from the means (two passes or a co-moment update)")
	return true
}

// covarianceOf returns the accumulator of products sxy when n is a
// one-pass covariance built from it.
func (c *checker) covarianceOf(n *ast.BinaryExpr) (ast.Expr, bool) {
	prod, ok := ast.Unparen(n.Y).(*ast.BinaryExpr)
	if ok && prod.Op == token.QUO {
		prod, ok = ast.Unparen(prod.X).(*ast.BinaryExpr) // sx*sy/n
	}
	if !ok || prod.Op != token.MUL || same(prod.X, prod.Y) || !c.accumulatesSum(prod.X) || !c.accumulatesSum(prod.Y) {
		return nil, false
	}
	sxy, _ := c.through(n.X)
	if q, ok := sxy.(*ast.BinaryExpr); ok && (q.Op == token.QUO || q.Op == token.MUL) {
		sxy = q.X // sxy/n
		if q.Op == token.MUL && c.accumulatesProducts(q.Y) {
			sxy = q.Y // n*sxy
		}
	}
	return sxy, c.accumulatesProducts(sxy)
}

// accumulatesSum reports whether e, through variables, quotients by a
// count and accessors, is a variable or field that accumulates values.
func (c *checker) accumulatesSum(e ast.Expr) bool {
	e, _ = c.through(e)
	if q, ok := ast.Unparen(e).(*ast.BinaryExpr); ok && q.Op == token.QUO {
		e = q.X // the mean sx/n
	}
	obj := c.target(c.accessed(e))
	return obj != nil && c.updates().sums[obj] && !c.updates().squares[obj] && !c.updates().products[obj]
}

// accumulatesProducts reports whether e, through variables and accessors,
// is a variable or field that accumulates cross products of data.
func (c *checker) accumulatesProducts(e ast.Expr) bool {
	obj := c.target(c.accessed(e))
	return obj != nil && c.updates().products[obj] && !c.updates().squares[obj]
}

// accumulatesSquares reports whether e, through variables and accessors, is a
// variable or field that accumulates squares of data.
func (c *checker) accumulatesSquares(e ast.Expr) bool {
	obj := c.target(c.accessed(e))
	return obj != nil && c.updates().squares[obj]
}

// squared reports whether e is x*x of a side-effect-free x, or of the
// same accessor call twice (d.SumWX()*d.SumWX()).
func (c *checker) squared(e ast.Expr) bool {
	if _, ok := c.square(e); ok {
		return true
	}
	m, ok := ast.Unparen(e).(*ast.BinaryExpr)
	return ok && m.Op == token.MUL && same(m.X, m.Y) && c.accessed(m.X) != ast.Unparen(m.X)
}

// accessed returns the field an accessor call reads (d.SumWX2() whose body
// returns d.Stats.SumWX2), through variables; else e.
func (c *checker) accessed(e ast.Expr) ast.Expr {
	e, _ = c.through(e)
	call, ok := ast.Unparen(e).(*ast.CallExpr)
	if !ok || len(call.Args) != 0 {
		return e
	}
	sel, isSel := call.Fun.(*ast.SelectorExpr)
	if r := c.returned(call); r != nil && isSel && fixes.Pure(c.pass.TypesInfo, sel.X) {
		if f, isField := ast.Unparen(r).(*ast.SelectorExpr); isField && c.pass.TypesInfo.Selections[f] != nil && c.pass.TypesInfo.Selections[f].Kind() == types.FieldVal {
			return f
		}
	}
	return e
}

// wholeConst reports whether e is a constant with an integer value.
func (c *checker) wholeConst(e ast.Expr) bool {
	v := c.pass.TypesInfo.Types[e].Value
	return v != nil && constant.ToInt(v).Kind() == constant.Int
}
