package exacteq

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"
	"math/big"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/internal/numeric"
)

// orderedLoop reports a for loop over a float variable with an ordered
// condition (x <= b, x < b, x > b, x >= b), a constant start, a constant
// bound and a step of one or more constant values (dl := 0.05; if many {
// dl = 0.01 }), whose count of passes in the variable's format differs from
// the count exact arithmetic on the decimals as written gives: twenty
// additions of 0.05 to 0 give 1.0000000000000002, so x <= 1 skips the pass
// at 1, and ten of 0.1 give 0.9999999999999999, so x < 1 runs an eleventh.
// Loops whose counts agree, whatever their last value, are left alone.
func (c *checker) orderedLoop(cur inspector.Cursor, n *ast.BinaryExpr) {
	loop, ok := inForCond(cur)
	if !ok || loop.Init == nil || loop.Post == nil {
		return
	}
	x, b, op := n.X, n.Y, n.Op
	if !c.isLoopVar(loop, x) {
		x, b, op = n.Y, n.X, flip(n.Op)
		if !c.isLoopVar(loop, x) {
			return
		}
	}
	t := c.pass.TypesInfo.TypeOf(x)
	if !provenance.IsFloat(t) || isComplex(t) {
		return
	}
	start, ok1 := c.initValue(loop.Init, x)
	bound, ok2 := constval.Exact(c.pass.TypesInfo, c.decls, b)
	stepExpr, add, ok3 := postStep(c.pass.TypesInfo, loop.Post, x)
	if !ok1 || !ok2 || !ok3 {
		return
	}
	f := provenance.FormatOf(t)
	for _, step := range c.constantsOf(cur, stepExpr) {
		if !add {
			step = constant.UnaryOp(token.SUB, step, 0)
		}
		inFloat, ok1 := floatCount(start, step, bound, op, f)
		exact, ok2 := exactCount(start, step, bound, op)
		if ok1 && ok2 && inFloat < exact {
			c.reportCount(n, x, start, step, bound, f, inFloat, exact)
			return
		}
	}
}

// reportCount reports a loop that runs inFloat times where exact
// arithmetic runs it exact times.
func (c *checker) reportCount(n *ast.BinaryExpr, x ast.Expr, start, step, bound constant.Value, f numeric.Format, inFloat, exact int) {
	last := f.Value(start)
	s := f.Value(step)
	for range min(inFloat, exact) {
		last = round(f, last+s)
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catLoop,
		Message: fmt.Sprintf("float loop variable %s goes from %s in steps of %s and the test %s passes %d times, where exact arithmetic passes %d: the accumulated value %s is off by rounding; count with an integer and derive %[1]s from it",
			fixes.Source(c.pass.Fset, x), decimal(start), decimal(step), fixes.Source(c.pass.Fset, n), inFloat, exact, numeric.Short(last)),
	})
}

// decimal prints a constant as a short decimal.
func decimal(v constant.Value) string {
	f, _ := constant.Float64Val(v)
	return numeric.Short(f)
}

// isLoopVar reports whether e names a variable the loop's post statement
// steps and its body does not assign.
func (c *checker) isLoopVar(loop *ast.ForStmt, e ast.Expr) bool {
	id, ok := ast.Unparen(e).(*ast.Ident)
	if !ok {
		return false
	}
	v := c.pass.TypesInfo.Uses[id]
	if _, _, ok := postStep(c.pass.TypesInfo, loop.Post, id); !ok || v == nil {
		return false
	}
	found := false
	ast.Inspect(loop.Body, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.AssignStmt:
			for _, l := range n.Lhs {
				if lid, ok := l.(*ast.Ident); ok && c.pass.TypesInfo.ObjectOf(lid) == v {
					found = true
				}
			}
		case *ast.IncDecStmt:
			if lid, ok := n.X.(*ast.Ident); ok && c.pass.TypesInfo.ObjectOf(lid) == v {
				found = true
			}
		case *ast.UnaryExpr:
			if lid, ok := n.X.(*ast.Ident); ok && n.Op == token.AND && c.pass.TypesInfo.ObjectOf(lid) == v {
				found = true
			}
		}
		return !found
	})
	return !found
}

// initValue returns the constant the loop's init statement gives x.
func (c *checker) initValue(init ast.Stmt, x ast.Expr) (constant.Value, bool) {
	as, ok := init.(*ast.AssignStmt)
	if !ok || len(as.Lhs) != len(as.Rhs) {
		return nil, false
	}
	for i, l := range as.Lhs {
		if sameVar(c.pass.TypesInfo, l, x) {
			return constval.Exact(c.pass.TypesInfo, c.decls, as.Rhs[i])
		}
	}
	return nil, false
}

// constantsOf returns the exact values of e: its own when it is constant,
// or every constant a local variable is assigned in the enclosing function
// when all its assignments are constants; none otherwise.
func (c *checker) constantsOf(cur inspector.Cursor, e ast.Expr) []constant.Value {
	if v, ok := constval.Exact(c.pass.TypesInfo, c.decls, e); ok {
		return []constant.Value{v}
	}
	id, ok := ast.Unparen(e).(*ast.Ident)
	fn := enclosingFunc(cur)
	if !ok || fn == nil {
		return nil
	}
	v, _ := c.pass.TypesInfo.Uses[id].(*types.Var)
	var vals []constant.Value
	ok = v != nil && v.Parent() != nil && v.Parent() != v.Pkg().Scope()
	ast.Inspect(fn, func(n ast.Node) bool {
		as, isAssign := n.(*ast.AssignStmt)
		if !ok || !isAssign {
			return ok
		}
		for i, l := range as.Lhs {
			lid, isID := l.(*ast.Ident)
			if !isID || c.pass.TypesInfo.ObjectOf(lid) != v {
				continue
			}
			if as.Tok != token.ASSIGN && as.Tok != token.DEFINE {
				ok = false
				break
			}
			if call, isCall := ast.Unparen(as.Rhs[0]).(*ast.CallExpr); isCall && len(as.Rhs) == 1 {
				got := c.resultConstants(call, i) // dl, dab := g.Granularity()
				ok = len(got) > 0
				vals = append(vals, got...)
				continue
			}
			val, isConst := constval.Exact(c.pass.TypesInfo, c.decls, as.Rhs[min(i, len(as.Rhs)-1)])
			ok = isConst && len(as.Lhs) == len(as.Rhs)
			vals = append(vals, val)
		}
		return ok
	})
	if !ok {
		return nil
	}
	return vals
}

// flip mirrors an ordered comparison: b < x is x > b.
func flip(op token.Token) token.Token {
	return map[token.Token]token.Token{token.LSS: token.GTR, token.GTR: token.LSS, token.LEQ: token.GEQ, token.GEQ: token.LEQ}[op]
}

// holds evaluates x op b for an ordered op on a comparison result.
func holds(cmp int, op token.Token) bool {
	switch op {
	case token.LSS:
		return cmp < 0
	case token.LEQ:
		return cmp <= 0
	case token.GTR:
		return cmp > 0
	}
	return cmp >= 0
}

// floatCount runs the loop in format f and counts the passes, up to
// maxSteps.
func floatCount(start, step, bound constant.Value, op token.Token, f numeric.Format) (int, bool) {
	x, s, b := f.Value(start), f.Value(step), f.Value(bound)
	if s == 0 || math.IsNaN(s) || math.IsInf(s, 0) {
		return 0, false
	}
	for n := range maxSteps {
		cmp := 0
		if x < b {
			cmp = -1
		} else if x > b {
			cmp = 1
		}
		if !holds(cmp, op) {
			return n, true
		}
		x = round(f, x+s)
	}
	return 0, false
}

// round rounds v to format f.
func round(f numeric.Format, v float64) float64 {
	if f == numeric.Float32 {
		return float64(float32(v))
	}
	return v
}

// exactCount counts the passes of the loop in exact rational arithmetic:
// the number of k ≥ 0 for which start + k·step op bound holds, when the
// step moves towards the bound (else no count).
func exactCount(start, step, bound constant.Value, op token.Token) (int, bool) {
	x0, s, b := rat(start), rat(step), rat(bound)
	if x0 == nil || s == nil || b == nil || s.Sign() == 0 {
		return 0, false
	}
	up := op == token.LSS || op == token.LEQ
	if up != (s.Sign() > 0) {
		return 0, false // the step leads away from the bound: no count to compare
	}
	q := new(big.Rat).Quo(new(big.Rat).Sub(b, x0), s) // passes needed to reach b
	if q.Sign() < 0 || !holds(x0.Cmp(b), op) {
		return 0, true
	}
	fl := new(big.Int).Quo(q.Num(), q.Denom()) // floor, q ≥ 0
	n := fl.Int64() + 1                        // k = 0..floor(q) reach at most b
	if q.IsInt() && (op == token.LSS || op == token.GTR) {
		n-- // the pass at b itself fails a strict test
	}
	if !fl.IsInt64() || n > maxSteps {
		return 0, false
	}
	return int(n), true
}

// rat returns v as a rational number, or nil.
func rat(v constant.Value) *big.Rat {
	r, ok := new(big.Rat).SetString(constant.ToFloat(v).ExactString())
	if !ok {
		return nil
	}
	return r
}

// resultConstants returns the constants that result i of call can be: a
// function of this package, or every method of that name of the
// package's types that implement the interface a call goes through, each
// returning a constant there on every path (a generator whose
// Granularity returns 0.05, 0.1). It returns nil when any can return
// something else, or when no body is in sight.
func (c *checker) resultConstants(call *ast.CallExpr, i int) []constant.Value {
	info := c.pass.TypesInfo
	var impls []*types.Func
	switch fn := typeutil.Callee(info, call).(type) {
	case *types.Func:
		sig := fn.Signature()
		if recv := sig.Recv(); recv != nil && types.IsInterface(recv.Type()) {
			iface := recv.Type().Underlying().(*types.Interface)
			for _, name := range c.pass.Pkg.Scope().Names() {
				tn, ok := c.pass.Pkg.Scope().Lookup(name).(*types.TypeName)
				if !ok || types.IsInterface(tn.Type()) {
					continue
				}
				for _, t := range []types.Type{tn.Type(), types.NewPointer(tn.Type())} {
					if types.Implements(t, iface) {
						if m, _, _ := types.LookupFieldOrMethod(t, true, c.pass.Pkg, fn.Name()); m != nil {
							impls = append(impls, m.(*types.Func))
						}
						break
					}
				}
			}
		} else if fn.Pkg() == c.pass.Pkg {
			impls = []*types.Func{fn}
		}
	}
	var vals []constant.Value
	for _, fn := range impls {
		got := c.returnsConstant(fn, i)
		if got == nil {
			return nil
		}
		vals = append(vals, got...)
	}
	return vals
}

// returnsConstant returns the constants fn, declared in this package,
// returns as result i, or nil unless every return gives one.
func (c *checker) returnsConstant(fn *types.Func, i int) []constant.Value {
	for _, f := range c.pass.Files {
		for _, d := range f.Decls {
			fd, ok := d.(*ast.FuncDecl)
			if !ok || fd.Body == nil || c.pass.TypesInfo.Defs[fd.Name] != fn {
				continue
			}
			var vals []constant.Value
			all := true
			ast.Inspect(fd.Body, func(n ast.Node) bool {
				if _, lit := n.(*ast.FuncLit); lit {
					return false
				}
				ret, ok := n.(*ast.ReturnStmt)
				if !ok || !all {
					return all
				}
				v, isConst := constant.Value(nil), false
				if i < len(ret.Results) {
					v, isConst = constval.Exact(c.pass.TypesInfo, c.decls, ret.Results[i])
				}
				all = all && isConst
				vals = append(vals, v)
				return false
			})
			if !all || len(vals) == 0 {
				return nil
			}
			return vals
		}
	}
	return nil
}
