package cancellation

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/fixes"
)

// sums examines the sum at cur, where it is the top of a float64 sum of
// terms (not itself a term of a larger one), for differences of Gamma
// and log-Gamma values.
func (c *checker) sums(cur inspector.Cursor, n *ast.BinaryExpr) {
	if p, ok := cur.Parent().Node().(*ast.BinaryExpr); ok && (p.Op == token.ADD || p.Op == token.SUB) {
		return // not the top of the sum
	}
	if !isFloat64(c.pass.TypesInfo.TypeOf(n)) {
		return
	}
	gamma, lgamma := c.usesMath("Gamma"), c.usesMath("Lgamma")
	if !gamma && !lgamma {
		return // prefilter: neither function in the package
	}
	terms := c.addTerms(n, 1, nil)
	if gamma {
		c.gammaMoments(n, terms)
	}
	if lgamma {
		c.lgammaRatio(n, terms, c.laterTerms(cur))
	}
}

// gammaMoments reports a sum of at least two terms, of both signs, each a
// constant times a product of powers of math.Gamma(1 + c/v) with one and
// the same v (directly or through what the package's own functions return):
// the raw moments of a distribution with shape v, such as the variance
// Γ(1+2/v) - Γ(1+1/v)². Every factor tends to Γ(1) = 1 as v grows, so
// every term is about its coefficient and carries a rounding of that
// size, while the sum, a central moment, shrinks like a power of 1/v
// ((π²/6)/v² for the variance): about 2·log10(v) digits go (8 at
// v = 1e4) and from v ≈ 1e8 none are left.
func (c *checker) gammaMoments(n *ast.BinaryExpr, terms []signedTerm) {
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

// lgammaRatio reports a sum in which math.Lgamma(x) and math.Lgamma(y)
// (values stored by v, _ := math.Lgamma(·)) enter with opposite signs
// and x and y share a term that is not a constant (n+1 and n-k+1, (v+1)/2
// and v/2): the log of the ratio Γ(x)/Γ(y). Each value is about x·ln x
// and rounded at that size, while their difference is about (x-y)·ln x,
// so about log10(x/|x-y|) digits are lost, and the absolute error
// u·x·ln x, which the exponential of the log-ratio turns into a relative
// one, is 1.5e-9 at x = 1e6 and 3e-3 at 1e12.
func (c *checker) lgammaRatio(n *ast.BinaryExpr, terms, later []signedTerm) {
	for _, p := range terms {
		x, ok := c.lgammaArg(p.e)
		if !ok || p.sign < 0 {
			continue
		}
		for _, q := range terms {
			y, ok := c.lgammaArg(q.e)
			if !ok || q.sign > 0 {
				continue
			}
			if common := c.sharedTerm(x, y); common != nil && !c.termScaledBy(terms, common) && !c.termScaledBy(later, common) {
				fixes.Report(c.pass, analysis.Diagnostic{
					Pos: n.Pos(), End: n.End(), Category: catGammaRatio,
					Message: fmt.Sprintf("math.Lgamma(x) - math.Lgamma(y)%s, arguments with a common part: each value is about x·ln x and rounded at that size (u = %.3g), while the difference, the log of Γ(x)/Γ(y), is about (x-y)·ln x, so about log10(x/|x-y|) digits go and the absolute error reaches %.2g at x = 1e6 and %.2g at 1e12; for large x sum the log terms of the ratio or use Stirling's series for the difference",
						binding("xy", x, y), unitRoundoff, unitRoundoff*1e6*math.Log(1e6), unitRoundoff*1e12*math.Log(1e12)),
				})
				return
			}
		}
	}
}

// lgammaArg returns x where e names a variable whose only assignment is
// v, _ := math.Lgamma(x) (or v, sign = ...).
func (c *checker) lgammaArg(e ast.Expr) (ast.Expr, bool) {
	id, ok := ast.Unparen(e).(*ast.Ident)
	if !ok {
		return nil, false
	}
	if c.lgammas == nil {
		c.lgammas = c.scanLgammas()
	}
	x := c.lgammas[c.pass.TypesInfo.Uses[id]]
	return x, x != nil
}

// scanLgammas maps each variable assigned once, by v, s := math.Lgamma(x),
// to x.
func (c *checker) scanLgammas() map[types.Object]ast.Expr {
	m := make(map[types.Object]ast.Expr)
	assigned := make(map[types.Object]int)
	for _, f := range c.pass.Files {
		ast.Inspect(f, func(n ast.Node) bool {
			as, ok := n.(*ast.AssignStmt)
			if !ok {
				return true
			}
			for _, lhs := range as.Lhs {
				if id, ok := lhs.(*ast.Ident); ok {
					assigned[c.pass.TypesInfo.ObjectOf(id)]++
				}
			}
			if len(as.Lhs) == 2 && len(as.Rhs) == 1 {
				call, ok := ast.Unparen(as.Rhs[0]).(*ast.CallExpr)
				if id, isIdent := as.Lhs[0].(*ast.Ident); ok && isIdent && c.mathFunc(call) == "Lgamma" {
					m[c.pass.TypesInfo.ObjectOf(id)] = call.Args[0]
				}
			}
			return true
		})
	}
	for obj := range m {
		if assigned[obj] != 1 {
			delete(m, obj)
		}
	}
	return m
}

// sharedTerm returns a term, not a constant, that the sums x and y
// (through never-reassigned variables, and over one constant divisor they
// share) have in common with the same sign, or nil.
func (c *checker) sharedTerm(x, y ast.Expr) ast.Expr {
	x, _ = c.through(x)
	y, _ = c.through(y)
	qx, okx := x.(*ast.BinaryExpr)
	qy, oky := y.(*ast.BinaryExpr)
	if okx && oky && qx.Op == token.QUO && qy.Op == token.QUO && c.isConst(qx.Y) && same(qx.Y, qy.Y) {
		x, _ = c.through(qx.X)
		y, _ = c.through(qy.X)
	}
	for _, a := range c.addTerms(x, 1, nil) {
		for _, b := range c.addTerms(y, 1, nil) {
			ta, _ := c.through(a.e)
			tb, _ := c.through(b.e)
			if a.sign == b.sign && !c.isConst(ta) && same(ta, tb) {
				return a.e
			}
		}
	}
	return nil
}

// termScaledBy reports whether a term of the sum is a product with a
// coefficient (a factor other than a call) that contains v: such a term
// (((v+1)/2)·log(1+z²/v) in a log-density) already carries an absolute
// error of about u·|v|, so the sum is no more accurate than that, and the
// log-gamma difference adds only a factor ln v to it.
func (c *checker) termScaledBy(terms []signedTerm, v ast.Expr) bool {
	for _, t := range terms {
		e, _ := c.through(t.e)
		if m, ok := e.(*ast.BinaryExpr); ok && m.Op == token.MUL && c.coefficientHas(m, v) {
			return true
		}
	}
	return false
}

// coefficientHas reports whether a factor of the product e that is not a
// call contains v.
func (c *checker) coefficientHas(e ast.Expr, v ast.Expr) bool {
	switch e := ast.Unparen(e).(type) {
	case *ast.BinaryExpr:
		if e.Op == token.MUL {
			return c.coefficientHas(e.X, v) || c.coefficientHas(e.Y, v)
		}
	case *ast.CallExpr:
		return false
	}
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		x, isExpr := n.(ast.Expr)
		found = found || isExpr && same(x, v)
		return !found
	})
	return found
}

// usesMath reports whether the package calls the math function name. The
// set is gathered in one pass over the package's uses, and only where it
// imports math.
func (c *checker) usesMath(name string) bool {
	if c.used == nil {
		c.used = make(map[string]bool)
		if slices.ContainsFunc(c.pass.Pkg.Imports(), func(p *types.Package) bool { return p.Path() == "math" }) {
			for _, obj := range c.pass.TypesInfo.Uses {
				if fn, ok := obj.(*types.Func); ok && fn.Pkg() != nil && fn.Pkg().Path() == "math" {
					c.used[fn.Name()] = true
				}
			}
		}
	}
	return c.used[name]
}

// laterTerms returns the terms of the sums that the value of the sum at
// cur joins through the variable it is assigned to (t1 := a - b; return
// t1 - k*c gives t1 and k*c), or nil.
func (c *checker) laterTerms(cur inspector.Cursor) []signedTerm {
	fn, ok := enclosingFunc(cur)
	if _, isAssign := cur.Parent().Node().(*ast.AssignStmt); !ok || !isAssign {
		return nil
	}
	var terms []signedTerm
	for _, use := range c.valueSites(fn, cur) {
		if top := sumTop(use); top != use {
			terms = c.addTerms(top.Node().(ast.Expr), 1, terms)
		}
	}
	return terms
}

// sumTop returns the top of the sum that the expression at cur is a
// term of, through parentheses, + and -: cur itself where it is none.
func sumTop(cur inspector.Cursor) inspector.Cursor {
	for {
		p, isSum := cur.Parent().Node().(*ast.BinaryExpr)
		_, isParen := cur.Parent().Node().(*ast.ParenExpr)
		if !isParen && (!isSum || p.Op != token.ADD && p.Op != token.SUB) {
			return cur
		}
		cur = cur.Parent()
	}
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
// package's own functions that return such a product (returned), depth
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
		if body := c.returned(e); body != nil && depth > 0 {
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

// returned returns the value that the package's own function or method
// that call calls returns, where its one return statement ends its body
// (a one-line function, or a few assignments and a return), or nil.
func (c *checker) returned(call *ast.CallExpr) ast.Expr {
	fn, ok := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func)
	if !ok || fn.Pkg() != c.pass.Pkg {
		return nil
	}
	if c.bodies == nil {
		c.bodies = returnsOf(c.pass)
	}
	return c.bodies[fn]
}

// returnsOf maps each function and method of the package whose body
// holds one return statement, of one value, as its last statement to that
// value; a bare return of a named result set just before it, and nowhere
// else (m = math.Sqrt(s); return), returns that value too.
func returnsOf(pass *analysis.Pass) map[*types.Func]ast.Expr {
	m := make(map[*types.Func]ast.Expr)
	for _, f := range pass.Files {
		for _, d := range f.Decls {
			fd, ok := d.(*ast.FuncDecl)
			if !ok || fd.Body == nil || len(fd.Body.List) == 0 {
				continue
			}
			ret, ok := fd.Body.List[len(fd.Body.List)-1].(*ast.ReturnStmt)
			if !ok || countReturns(fd.Body) != 1 {
				continue
			}
			if len(ret.Results) == 1 {
				m[pass.TypesInfo.Defs[fd.Name].(*types.Func)] = ret.Results[0]
			} else if v, ok := namedResult(pass.TypesInfo, fd); ok {
				m[pass.TypesInfo.Defs[fd.Name].(*types.Func)] = v
			}
		}
	}
	return m
}

// namedResult returns E when fd has one named result r, its body ends
// with r = E and a bare return, and nothing else assigns r or takes its
// address.
func namedResult(info *types.Info, fd *ast.FuncDecl) (ast.Expr, bool) {
	res := fd.Type.Results
	list := fd.Body.List
	if res == nil || len(res.List) != 1 || len(res.List[0].Names) != 1 || len(list) < 2 {
		return nil, false
	}
	r := info.Defs[res.List[0].Names[0]]
	as, ok := list[len(list)-2].(*ast.AssignStmt)
	if !ok || as.Tok != token.ASSIGN || len(as.Lhs) != 1 || len(as.Rhs) != 1 || !isObj(info, as.Lhs[0], r) {
		return nil, false
	}
	uses := 0
	ast.Inspect(fd.Body, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.AssignStmt:
			for _, l := range n.Lhs {
				if isObj(info, l, r) {
					uses++
				}
			}
		case *ast.UnaryExpr:
			if n.Op == token.AND && isObj(info, n.X, r) {
				uses += 2
			}
		case *ast.IncDecStmt:
			if isObj(info, n.X, r) {
				uses += 2
			}
		}
		return true
	})
	return as.Rhs[0], uses == 1
}

// isObj reports whether e names the variable v.
func isObj(info *types.Info, e ast.Expr, v types.Object) bool {
	id, ok := ast.Unparen(e).(*ast.Ident)
	return ok && v != nil && info.Uses[id] == v
}

// countReturns counts the return statements of body, those of function
// literals aside.
func countReturns(body *ast.BlockStmt) int {
	n := 0
	ast.Inspect(body, func(node ast.Node) bool {
		switch node.(type) {
		case *ast.FuncLit:
			return false
		case *ast.ReturnStmt:
			n++
		}
		return true
	})
	return n
}
