package cancellation

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"

	"roundoff/analyzers/internal/fixes"
)

// accumulation records, once per package, how variables and fields are
// updated: which accumulate squares of data (s2 += x*x, s2 = k*s2 +
// w*(x*x)) and which only count (it++).
type accumulation struct {
	squares map[types.Object]bool
	counts  map[types.Object]bool // false once a variable is set otherwise
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
	c.acc = &accumulation{squares: map[types.Object]bool{}, counts: map[types.Object]bool{}}
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
				if s.Tok == token.ADD_ASSIGN && c.squareTerm(s.Rhs[i], inPlace) ||
					s.Tok == token.ASSIGN && c.recurrence(s.Rhs[i], obj, inPlace) {
					c.acc.squares[obj] = true
				}
			}
		}
	}
	return c.acc
}

// recurrence reports whether e is a sum with a term that mentions obj and
// a term with a square of data: s2 = k*s2 + w*(x*x).
func (c *checker) recurrence(e ast.Expr, obj types.Object, inPlace map[types.Object]bool) bool {
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
	return mentions(sum.X) && c.squareTerm(sum.Y, inPlace) || mentions(sum.Y) && c.squareTerm(sum.X, inPlace)
}

// squareTerm reports whether e is a square of a value that is not a
// deviation, possibly weighted: x*x, w*(x*x), or a variable squared in
// place (t *= t). A squared deviation (x-m)*(x-m) is the two-pass form,
// which is accurate.
func (c *checker) squareTerm(e ast.Expr, inPlace map[types.Object]bool) bool {
	if x, ok := c.square(e); ok {
		d, _ := c.through(x)
		b, isDiff := d.(*ast.BinaryExpr)
		return !isDiff || b.Op != token.SUB
	}
	switch e := ast.Unparen(e).(type) {
	case *ast.BinaryExpr:
		return e.Op == token.MUL && (c.squareTerm(e.X, inPlace) || c.squareTerm(e.Y, inPlace))
	case *ast.Ident:
		return inPlace[c.target(e)]
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

// variance reports the one-pass variance E[x²] - E[x]²: s2/n - m*m or
// s2 - s1*s1/n with s2 accumulating squares of data. Both terms are about
// mean², so the difference loses about log10(mean²/variance) digits (8 of
// 16 for data near 1e4 with spread 1) and can come out negative; the sum
// of squared deviations from the mean (two passes, or Welford's update)
// keeps them. It reports whether n had that form.
func (c *checker) variance(n *ast.BinaryExpr) bool {
	sq := ast.Unparen(n.Y)
	if q, ok := sq.(*ast.BinaryExpr); ok && q.Op == token.QUO {
		sq = ast.Unparen(q.X) // s1*s1/n
	}
	if _, ok := c.square(sq); !ok {
		return false
	}
	s2, _ := c.through(n.X)
	if q, ok := s2.(*ast.BinaryExpr); ok && q.Op == token.QUO {
		s2, _ = c.through(q.X) // s2/n
	}
	obj := c.target(s2)
	if obj == nil || !c.updates().squares[obj] {
		return false
	}
	c.pass.Report(analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catVariance,
		Message: fmt.Sprintf("one-pass variance %s - %s subtracts two values of about mean² and loses about log10(mean²/variance) digits (a spread of 1 at mean 1e4 leaves 8 of 16; u = %.3g), and can turn negative; accumulate squared deviations from the mean (Welford's update or two passes)",
			fixes.Source(c.pass.Fset, ast.Unparen(n.X)), fixes.Source(c.pass.Fset, ast.Unparen(n.Y)), unitRoundoff),
	})
	return true
}

// wholeConst reports whether e is a constant with an integer value.
func (c *checker) wholeConst(e ast.Expr) bool {
	v := c.pass.TypesInfo.Types[e].Value
	return v != nil && constant.ToInt(v).Kind() == constant.Int
}
