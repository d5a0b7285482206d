package cancellation

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"maps"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/consume"
	"roundoff/analyzers/internal/fixes"
)

// pair names the two data series whose products a second moment sums
// (sorted texts of the factors; x and x for a sum of squares).
type pair [2]string

// residual reports a difference whose second term is r² times its first,
// r the correlation of two data series x and y: Syy - Sxy²/Sxx, Syy -
// slope·Sxy with slope = Sxy/Sxx, Sxx·Syy - Sxy², 1 - Sxy²/(Sxx·Syy),
// where Sxx, Syy and Sxy are second moments (accumulated sums of
// products, centred or not, or one-pass variances and covariances built
// from them). By Cauchy–Schwarz Sxy² ≤ Sxx·Syy, so the difference is
// Syy·(1 - r²) ≥ 0, the residual sum of squares of the least-squares
// line: as the fit improves both terms approach each other and the
// difference keeps only the rounding of the terms, about log10(1/(1-r²))
// digits fewer, and on an exact line it may come out negative. Summing
// the squared residuals of the fitted line has no such loss. Consumers
// that need only absolute accuracy are left alone. It reports whether n
// had the form.
func (c *checker) residual(cur inspector.Cursor, n *ast.BinaryExpr) bool {
	a, oka := c.monomial(n.X, 6)
	b, okb := c.monomial(n.Y, 6)
	if !oka || !okb {
		return false
	}
	x, y, ok := correlation(a, b)
	if !ok {
		return false
	}
	if consume.Of(c.pass.TypesInfo, cur, 2) == consume.Absolute {
		return true
	}
	c.pass.Report(analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catResidual,
		Message: fmt.Sprintf("%s - %s subtracts r² times the first term from it, r the correlation of %s and %s (Cauchy–Schwarz): the difference, the residual of the least-squares fit, loses about log10(1/(1-r²)) digits as the fit improves (u = %.3g) and can come out negative on an exact line; sum the squared residuals of the fitted line instead",
			fixes.Source(c.pass.Fset, ast.Unparen(n.X)), fixes.Source(c.pass.Fset, ast.Unparen(n.Y)), x, y, unitRoundoff),
	})
	return true
}

// correlation reports whether b/a, as exponents of second moments, is
// Sxy²/(Sxx·Syy) for two different series x and y, which it returns.
func correlation(a, b map[pair]int) (string, string, bool) {
	r := maps.Clone(b)
	for k, v := range a {
		r[k] -= v
	}
	maps.DeleteFunc(r, func(_ pair, v int) bool { return v == 0 })
	if len(r) != 3 {
		return "", "", false
	}
	for p, v := range r {
		x, y := p[0], p[1]
		if v == 2 && x != y && r[pair{x, x}] == -1 && r[pair{y, y}] == -1 {
			return x, y, true
		}
	}
	return "", "", false
}

// monomial reads e, through variables, as a product of integer powers of
// second moments; the constant 1 is the empty product.
func (c *checker) monomial(e ast.Expr, depth int) (map[pair]int, bool) {
	if depth == 0 {
		return nil, false
	}
	if p, ok := c.moment(e); ok {
		return map[pair]int{p: 1}, true
	}
	if c.isOne(e) {
		return map[pair]int{}, true
	}
	e, _ = c.through(e)
	switch e := e.(type) {
	case *ast.BinaryExpr:
		if e.Op != token.MUL && e.Op != token.QUO {
			return nil, false
		}
		x, okx := c.monomial(e.X, depth-1)
		y, oky := c.monomial(e.Y, depth-1)
		if !okx || !oky {
			return nil, false
		}
		sign := 1
		if e.Op == token.QUO {
			sign = -1
		}
		for k, v := range y {
			x[k] += sign * v
		}
		return x, true
	case *ast.CallExpr:
		if c.mathFunc2(e) != "Pow" {
			return nil, false
		}
		exp, ok := constant.Int64Val(constant.ToInt(c.pass.TypesInfo.Types[e.Args[1]].Value))
		if !ok {
			return nil, false
		}
		x, ok := c.monomial(e.Args[0], depth-1)
		for k := range x {
			x[k] *= int(exp)
		}
		return x, ok
	}
	return nil, false
}

// moment returns the series whose second moment e is, through variables:
// a variable or field that accumulates products (sxy += x*y, s += dx*dx),
// or a one-pass variance or covariance built from one.
func (c *checker) moment(e ast.Expr) (pair, bool) {
	e, _ = c.through(e)
	if n, ok := e.(*ast.BinaryExpr); ok && n.Op == token.SUB {
		s, ok := c.varianceOf(n)
		if !ok {
			s, ok = c.covarianceOf(n)
		}
		if !ok {
			return pair{}, false
		}
		e = s
	}
	obj := c.target(c.accessed(e))
	p, ok := c.updates().factors[obj]
	return p, ok && p != pair{}
}
