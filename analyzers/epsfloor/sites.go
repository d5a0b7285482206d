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
	"roundoff/analyzers/internal/tolerance"
	"roundoff/internal/numeric"
)

// apiParam describes a tolerance parameter of a well-known API.
type apiParam struct {
	index  int            // argument index, receiver excluded
	kind   tolerance.Kind // Absolute or Relative
	values [2]int         // indices of the compared values, whose constant size tells the magnitude
}

// apis lists the tolerance parameters of well-known APIs, keyed by package
// path and function (or method) name. Zero means exact comparison on
// purpose in all of them and is never reported. Add entries here.
var apis = map[string][]apiParam{
	"gonum.org/v1/gonum/floats/scalar.EqualWithinAbs": {{2, tolerance.Absolute, [2]int{0, 1}}},
	"gonum.org/v1/gonum/floats/scalar.EqualWithinRel": {{2, tolerance.Relative, [2]int{1, 2}}},
	// EqualWithinAbsOrRel and EqualApprox pass when either test does: only
	// the relative part can make them exact, and only with a tiny absolute part.
	"gonum.org/v1/gonum/floats.EqualApprox":              {{2, tolerance.Relative, [2]int{1, 2}}},
	"github.com/stretchr/testify/assert.InDelta":         {{3, tolerance.Absolute, [2]int{1, 2}}},
	"github.com/stretchr/testify/assert.InDeltaf":        {{3, tolerance.Absolute, [2]int{1, 2}}},
	"github.com/stretchr/testify/assert.InDeltaSlice":    {{3, tolerance.Absolute, [2]int{1, 2}}},
	"github.com/stretchr/testify/assert.InDeltaSlicef":   {{3, tolerance.Absolute, [2]int{1, 2}}},
	"github.com/stretchr/testify/assert.InEpsilon":       {{3, tolerance.Relative, [2]int{1, 2}}},
	"github.com/stretchr/testify/assert.InEpsilonf":      {{3, tolerance.Relative, [2]int{1, 2}}},
	"github.com/stretchr/testify/assert.InEpsilonSlice":  {{3, tolerance.Relative, [2]int{1, 2}}},
	"github.com/stretchr/testify/assert.InEpsilonSlicef": {{3, tolerance.Relative, [2]int{1, 2}}},
}

// apiParams returns the table entries for fn; testify's require package
// mirrors assert, and methods on *assert.Assertions drop the leading t.
func apiParams(fn *types.Func) []apiParam {
	if fn.Pkg() == nil {
		return nil
	}
	path := fn.Pkg().Path()
	if path == "github.com/stretchr/testify/require" {
		path = "github.com/stretchr/testify/assert"
	}
	ps := apis[path+"."+fn.Name()]
	if fn.Signature().Recv() == nil || len(ps) == 0 {
		return ps
	}
	shifted := make([]apiParam, len(ps))
	for i, p := range ps {
		shifted[i] = apiParam{p.index - 1, p.kind, [2]int{p.values[0] - 1, p.values[1] - 1}}
	}
	return shifted
}

// call reports constant tolerances passed to a well-known API at cur; fn
// is the function called, or nil.
func (c *checker) call(cur inspector.Cursor, call *ast.CallExpr, fn *types.Func) {
	if fn == nil {
		return
	}
	for _, p := range apiParams(fn) {
		if p.index < len(call.Args) {
			u := use{Kind: p.kind, Where: fn.Name()}
			c.site(call.Args[p.index], u, c.apiMagnitude(cur, call, p), fmt.Sprintf("passed to %s.%s", fn.Pkg().Name(), fn.Name()), call)
		}
	}
}

// apiMagnitude returns the size of a compared value of an API call that is
// a constant, or 0.
func (c *checker) apiMagnitude(cur inspector.Cursor, call *ast.CallExpr, p apiParam) float64 {
	for _, i := range p.values {
		if i < len(call.Args) {
			if m := c.sizeOf(cur, call.Args[i], numeric.Float64); m > 0 {
				return m
			}
		}
	}
	return 0
}

// site reports a constant val that reaches a tolerance of the given use
// in n, the call or literal that gives it (nil: a default), whose other
// arguments or fields are among them the compared values, of size mag
// where the source fixes it (else 0). A tolerance of a quantity whose
// size grows with the data is judged at the data size where nothing
// fixes the size (see scaleSite).
func (c *checker) site(val ast.Expr, u use, mag float64, how string, n ast.Node) {
	if u.scaled() && mag == 0 {
		if v, ok := constval.Exact(c.pass.TypesInfo, c.decls, val); ok && u.format().Value(v) >= u.format().Eps {
			c.scaleSite(val, u, how)
			return
		}
		if u.Kind == tolerance.Magnitude {
			return // below eps, a threshold asks whether the quantity vanished (see cancelled)
		}
	}
	beside := besideOf(n)
	kind := u.Kind
	if coef, w, ok := c.coefficientOf(val, beside); ok && kind == tolerance.Absolute {
		val, kind, mag = coef, tolerance.Relative, 0
		how = "the coefficient of " + fixes.Source(c.pass.Fset, w) + " in a tolerance " + how
	}
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, val)
	if !ok {
		return
	}
	if u.Strict && constant.Sign(v) == 0 {
		c.neverHolds(val, u, how)
		return
	}
	f := u.format()
	tol := f.Value(v)
	res := judge(kind, tol, f, mag)
	if res == tolerance.Resolvable || (res == tolerance.BelowEpsilon || res == tolerance.BelowSpacing) && c.sameEverywhere(n, val) {
		return
	}
	src := fixes.Source(c.pass.Fset, val)
	d := analysis.Diagnostic{
		Pos: val.Pos(), End: val.End(), Category: category(res),
		Message: fmt.Sprintf("%s, %s (%s), %s", numeric.WithValue(src, tol), how, u, explain(res, tol, f, mag)),
	}
	if pos, ok := c.tested[u.key()]; ok {
		d.Related = []analysis.RelatedInformation{{Pos: pos, End: pos, Message: "the tolerance test"}}
	}
	var fs []fixes.Fix
	switch res {
	case tolerance.BelowRoundoff:
		fs = append(fs, fixes.Judgement("Use 4 ulps as the relative tolerance: "+f.FewUlpsLiteral(), fixes.Replace(val, f.FewUlpsLiteral())))
	case tolerance.Subnormal:
		fs = append(fs, fixes.Judgement("Use "+f.Name+" epsilon: "+f.EpsLiteral(), fixes.Replace(val, f.EpsLiteral())))
	}
	fixes.Report(c.pass, d, fs...)
}

// neverHolds reports a zero given to a strict tolerance test: it holds
// for no values, equal ones included.
func (c *checker) neverHolds(val ast.Expr, u use, how string) {
	d := analysis.Diagnostic{
		Pos: val.Pos(), End: val.End(), Category: catEmpty,
		Message: fmt.Sprintf("%s, %s (%s), makes a strict test, a difference below the tolerance, that no pair of values passes, equal ones included (|a-b| < 0 is always false); use a positive tolerance, or test a tolerance of 0 as exact equality (<=)",
			fixes.Source(c.pass.Fset, val), how, u),
	}
	if pos, ok := c.tested[u.key()]; ok {
		d.Related = []analysis.RelatedInformation{{Pos: pos, End: pos, Message: "the tolerance test"}}
	}
	fixes.Report(c.pass, d)
}

// coefficientOf reads a tolerance val written as k*w (or w*k), with k a
// constant and w one of the values given beside it (the expected value of
// the same case, or another argument of the same call): the absolute
// tolerance k·w is then relative to w, so k is what the float type must
// resolve. 1e-14*want is as fine for want = 5e-21 as for want = 1, though
// the product, 5e-35, is far below eps.
func (c *checker) coefficientOf(val ast.Expr, beside []ast.Expr) (k, w ast.Expr, ok bool) {
	m, ok := ast.Unparen(val).(*ast.BinaryExpr)
	if !ok || m.Op != token.MUL {
		return nil, nil, false
	}
	for _, kw := range [][2]ast.Expr{{m.X, m.Y}, {m.Y, m.X}} {
		if _, ok := constval.Exact(c.pass.TypesInfo, c.decls, kw[0]); !ok {
			continue
		}
		for _, b := range beside {
			if b != val && c.same(kw[1], b) {
				return kw[0], kw[1], true
			}
		}
	}
	return nil, nil, false
}

// same reports whether a and b are written alike or are equal nonzero
// constants.
func (c *checker) same(a, b ast.Expr) bool {
	if types.ExprString(ast.Unparen(a)) == types.ExprString(ast.Unparen(b)) {
		return true
	}
	va, ok := constval.Exact(c.pass.TypesInfo, c.decls, a)
	vb, ok2 := constval.Exact(c.pass.TypesInfo, c.decls, b)
	return ok && ok2 && constant.Sign(va) != 0 && constant.Compare(va, token.EQL, vb)
}

// besideOf returns the values given together in a call (its arguments) or
// a composite literal (its elements), else nil.
func besideOf(n ast.Node) []ast.Expr {
	switch n := n.(type) {
	case *ast.CallExpr:
		return n.Args
	case *ast.CompositeLit:
		vals := make([]ast.Expr, len(n.Elts))
		for i, e := range n.Elts {
			if kv, ok := e.(*ast.KeyValueExpr); ok {
				e = kv.Value
			}
			vals[i] = e
		}
		return vals
	}
	return nil
}
