package cancellation

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/fixes"
)

// gammaMoments reports a sum of at least two terms, of both signs, each a
// constant times a product of powers of math.Gamma(1 + c/v) with one and
// the same v (directly or through the package's own one-line functions):
// the raw moments of a distribution with shape v, such as the variance
// Γ(1+2/v) - Γ(1+1/v)². Every factor tends to Γ(1) = 1 as v grows, so
// every term is about its coefficient and carries a rounding of that
// size, while the sum, a central moment, shrinks like a power of 1/v
// ((π²/6)/v² for the variance): about 2·log10(v) digits go (8 at
// v = 1e4) and from v ≈ 1e8 none are left. The report is made once, at
// the top of the sum.
func (c *checker) gammaMoments(cur inspector.Cursor, n *ast.BinaryExpr) {
	if p, ok := cur.Parent().Node().(*ast.BinaryExpr); ok && (p.Op == token.ADD || p.Op == token.SUB) {
		return // not the top of the sum
	}
	if !isFloat64(c.pass.TypesInfo.TypeOf(n)) || !c.uses("math", "Gamma") {
		return // prefilter: no Gamma in the package
	}
	terms := c.addTerms(n, 1, nil)
	var key types.Object
	signs := 0
	for _, t := range terms {
		k, sign, ok := c.gammaTerm(t.e, 2)
		if !ok || k == nil || key != nil && k != key {
			return
		}
		key, signs = k, signs|1<<((sign*t.sign+1)/2)
	}
	if len(terms) < 2 || signs != 3 {
		return // a sum of like-signed terms adds
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catMoments,
		Message: fmt.Sprintf("difference of products of math.Gamma(1 + c/%s), each within a few c/%[1]s of 1 and rounded at that size (u = %.3g), while the difference shrinks like a power of 1/%[1]s ((π²/6)/%[1]s² for a variance): about 2·log10(%[1]s) digits are lost, all from %[1]s ≈ 1e8; use the series in 1/%[1]s (ln Γ(1+z) = -γz + Σ (-1)^k ζ(k) z^k/k) for large %[1]s",
			key.Name(), unitRoundoff),
	})
}

// uses reports whether the package refers to the function name of the
// package path, remembering the answer.
func (c *checker) uses(path, name string) bool {
	key := path + "." + name
	if used, ok := c.used[key]; ok {
		return used
	}
	if c.used == nil {
		c.used = make(map[string]bool)
	}
	for _, obj := range c.pass.TypesInfo.Uses {
		if fn, ok := obj.(*types.Func); ok && fn.Name() == name && fn.Pkg() != nil && fn.Pkg().Path() == path {
			c.used[key] = true
			return true
		}
	}
	c.used[key] = false
	return false
}

// signedTerm is a term of a sum and the sign it enters with.
type signedTerm struct {
	e    ast.Expr
	sign int
}

// addTerms appends the terms of the sum e, through parentheses, + and -
// and unary signs, each with its sign.
func (c *checker) addTerms(e ast.Expr, sign int, acc []signedTerm) []signedTerm {
	switch e := ast.Unparen(e).(type) {
	case *ast.BinaryExpr:
		if e.Op == token.ADD || e.Op == token.SUB {
			acc = c.addTerms(e.X, sign, acc)
			if e.Op == token.SUB {
				sign = -sign
			}
			return c.addTerms(e.Y, sign, acc)
		}
	case *ast.UnaryExpr:
		if e.Op == token.SUB {
			return c.addTerms(e.X, -sign, acc)
		}
	}
	return append(acc, signedTerm{e, sign})
}

// gammaTerm reads e as a constant times a product of powers of
// math.Gamma(1 + c/v), and returns the object of v (nil where there is no
// Gamma factor) and the sign of the constant. It reads through the
// package's own functions whose body only returns such a product, depth
// calls deep.
func (c *checker) gammaTerm(e ast.Expr, depth int) (key types.Object, sign int, ok bool) {
	e = ast.Unparen(e)
	if v := c.pass.TypesInfo.Types[e].Value; v != nil {
		return nil, constant.Sign(constant.ToFloat(v)), v.Kind() == constant.Int || v.Kind() == constant.Float
	}
	switch e := e.(type) {
	case *ast.UnaryExpr:
		k, s, ok := c.gammaTerm(e.X, depth)
		return k, -s, ok && e.Op == token.SUB
	case *ast.BinaryExpr:
		if e.Op != token.MUL {
			return nil, 0, false
		}
		kx, sx, okx := c.gammaTerm(e.X, depth)
		ky, sy, oky := c.gammaTerm(e.Y, depth)
		if !okx || !oky || kx != nil && ky != nil && kx != ky {
			return nil, 0, false
		}
		if kx == nil {
			kx = ky
		}
		return kx, sx * sy, true
	case *ast.CallExpr:
		if c.mathFunc2(e) == "Pow" {
			k, _, ok := c.gammaTerm(e.Args[0], depth)
			return k, 1, ok && k != nil
		}
		if c.mathFunc(e) == "Gamma" {
			k := c.nearOne(e.Args[0])
			return k, 1, k != nil
		}
		if body := c.oneLiner(e); body != nil && depth > 0 {
			return c.gammaTerm(body, depth-1)
		}
	}
	return nil, 0, false
}

// nearOne returns the object of v where arg is 1 + c/v (or c/v + 1) with v
// a variable or field, or nil.
func (c *checker) nearOne(arg ast.Expr) types.Object {
	s, ok := ast.Unparen(arg).(*ast.BinaryExpr)
	if !ok || s.Op != token.ADD {
		return nil
	}
	q := s.Y
	if !c.isOne(s.X) {
		if !c.isOne(s.Y) {
			return nil
		}
		q = s.X
	}
	d, ok := ast.Unparen(q).(*ast.BinaryExpr)
	if !ok || d.Op != token.QUO || c.isConst(d.Y) {
		return nil
	}
	switch v := ast.Unparen(d.Y).(type) {
	case *ast.Ident:
		return c.pass.TypesInfo.Uses[v]
	case *ast.SelectorExpr:
		if sel := c.pass.TypesInfo.Selections[v]; sel != nil {
			return sel.Obj()
		}
	}
	return nil
}

// oneLiner returns the expression that the package's own function or
// method that call calls only returns, or nil.
func (c *checker) oneLiner(call *ast.CallExpr) ast.Expr {
	fn, ok := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func)
	if !ok || fn.Pkg() != c.pass.Pkg {
		return nil
	}
	if c.bodies == nil {
		c.bodies = oneLinersOf(c.pass)
	}
	return c.bodies[fn]
}

// oneLinersOf maps each function and method of the package whose body is
// a single return of one value to that value.
func oneLinersOf(pass *analysis.Pass) map[*types.Func]ast.Expr {
	m := make(map[*types.Func]ast.Expr)
	for _, f := range pass.Files {
		for _, d := range f.Decls {
			fd, ok := d.(*ast.FuncDecl)
			if !ok || fd.Body == nil || len(fd.Body.List) != 1 {
				continue
			}
			if ret, ok := fd.Body.List[0].(*ast.ReturnStmt); ok && len(ret.Results) == 1 {
				m[pass.TypesInfo.Defs[fd.Name].(*types.Func)] = ret.Results[0]
			}
		}
	}
	return m
}
