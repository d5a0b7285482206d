package cancellation

import (
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/types/typeutil"
)

// unboundedData reports whether e, directly or through never-reassigned
// variables, sums, differences, signs and calls that return one of their
// arguments (math.Max, math.Min, the package's own max and min), is made
// of fields the package declares unbounded (unboundedFields): fields it
// rejects only when infinite or NaN.
// The package has then said that every finite value is in range, so
// coordinates beyond 1.34e154, or below 1.49e-154, are its inputs too.
func (c *checker) unboundedData(e ast.Expr, depth int) bool {
	e, _ = c.through(e)
	if depth == 0 {
		return false
	}
	switch e := e.(type) {
	case *ast.SelectorExpr:
		if c.unbounded == nil {
			c.unbounded = c.unboundedFields()
		}
		sel := c.pass.TypesInfo.Selections[e]
		return sel != nil && sel.Kind() == types.FieldVal && c.unbounded[sel.Obj()]
	case *ast.UnaryExpr:
		return e.Op == token.SUB && c.unboundedData(e.X, depth-1)
	case *ast.BinaryExpr:
		return (e.Op == token.SUB || e.Op == token.ADD) && (c.unboundedData(e.X, depth-1) || c.unboundedData(e.Y, depth-1))
	case *ast.CallExpr:
		if !c.passesArgument(e) {
			return false
		}
		for _, a := range e.Args {
			if c.unboundedData(a, depth-1) {
				return true
			}
		}
	}
	return false
}

// passesArgument reports whether call returns one of its arguments:
// math.Max or math.Min, or a function of the package every return of
// which returns one of its parameters.
func (c *checker) passesArgument(call *ast.CallExpr) bool {
	if name := c.mathFunc2(call); name == "Max" || name == "Min" {
		return true
	}
	fn, ok := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func)
	if !ok || fn.Pkg() != c.pass.Pkg {
		return false
	}
	if c.selectors == nil {
		c.selectors = c.selectorFuncs()
	}
	return c.selectors[fn]
}

// selectorFuncs returns the functions of the package whose every return
// statement returns one of their parameters (a max or min written out).
func (c *checker) selectorFuncs() map[*types.Func]bool {
	m := make(map[*types.Func]bool)
	for _, f := range c.pass.Files {
		for _, d := range f.Decls {
			fd, ok := d.(*ast.FuncDecl)
			if !ok || fd.Body == nil || fd.Recv != nil {
				continue
			}
			params := make(map[types.Object]bool)
			for _, field := range fd.Type.Params.List {
				for _, name := range field.Names {
					params[c.pass.TypesInfo.Defs[name]] = true
				}
			}
			returns, all := 0, true
			ast.Inspect(fd.Body, func(n ast.Node) bool {
				if _, isLit := n.(*ast.FuncLit); isLit {
					return false
				}
				if ret, ok := n.(*ast.ReturnStmt); ok {
					id, isIdent := ast.Unparen(firstResult(ret)).(*ast.Ident)
					all = all && len(ret.Results) == 1 && isIdent && params[c.pass.TypesInfo.Uses[id]]
					returns++
				}
				return all
			})
			if all && returns > 0 {
				m[c.pass.TypesInfo.Defs[fd.Name].(*types.Func)] = true
			}
		}
	}
	return m
}

// firstResult returns the first result of ret, or nil.
func firstResult(ret *ast.ReturnStmt) ast.Expr {
	if len(ret.Results) == 0 {
		return nil
	}
	return ret.Results[0]
}

// unboundedFields returns the float fields that the package tests with
// math.IsInf: a validation that rejects only non-finite values accepts
// every finite one. (A field merely passed to math.Hypot elsewhere says
// nothing of its range: Hypot is also written for accuracy or habit.)
func (c *checker) unboundedFields() map[types.Object]bool {
	m := make(map[types.Object]bool)
	for _, f := range c.pass.Files {
		ast.Inspect(f, func(n ast.Node) bool {
			call, ok := n.(*ast.CallExpr)
			if !ok || c.mathFunc2(call) != "IsInf" {
				return true
			}
			arg, _ := c.through(call.Args[0])
			if sel, isSel := arg.(*ast.SelectorExpr); isSel {
				if s := c.pass.TypesInfo.Selections[sel]; s != nil && s.Kind() == types.FieldVal && isFloat64(s.Obj().Type()) {
					m[s.Obj()] = true
				}
			}
			return true
		})
	}
	return m
}

// selfDotFields reads e, through never-reassigned variables and what the
// package's functions return (returned), as v.Dot(v) for a method whose
// value is a sum of products of the same fields of its receiver and its
// parameter (w.X*o.X + w.Y*o.Y), and returns those fields.
func (c *checker) selfDotFields(e ast.Expr, depth int) ([]types.Object, bool) {
	e, _ = c.through(e)
	call, ok := e.(*ast.CallExpr)
	if !ok || depth == 0 {
		return nil, false
	}
	if sel, isSel := ast.Unparen(call.Fun).(*ast.SelectorExpr); isSel && len(call.Args) == 1 && same(sel.X, call.Args[0]) {
		if fields, ok := c.fieldProducts(call); ok {
			return fields, true
		}
	}
	body := c.returned(call)
	if body == nil {
		return nil, false
	}
	return c.selfDotFields(body, depth-1)
}

// fieldProducts reads the method that call calls as one returning a sum
// of products r.F*p.F of the same field F of its receiver r and its one
// parameter p, and returns the fields.
func (c *checker) fieldProducts(call *ast.CallExpr) ([]types.Object, bool) {
	body := c.returned(call)
	fn, _ := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func)
	if body == nil || fn == nil {
		return nil, false
	}
	sig := fn.Type().(*types.Signature)
	if sig.Recv() == nil || sig.Params().Len() != 1 {
		return nil, false
	}
	recv, param := sig.Recv(), sig.Params().At(0)
	field := func(e ast.Expr, v *types.Var) types.Object {
		sel, ok := ast.Unparen(e).(*ast.SelectorExpr)
		if !ok {
			return nil
		}
		id, ok := ast.Unparen(sel.X).(*ast.Ident)
		s := c.pass.TypesInfo.Selections[sel]
		if !ok || c.pass.TypesInfo.Uses[id] != v || s == nil || s.Kind() != types.FieldVal {
			return nil
		}
		return s.Obj()
	}
	var fields []types.Object
	for _, t := range c.addTerms(body, 1, nil) {
		m, ok := ast.Unparen(t.e).(*ast.BinaryExpr)
		if !ok || m.Op != token.MUL || t.sign < 0 {
			return nil, false
		}
		f := field(m.X, recv)
		if f == nil || f != field(m.Y, param) {
			return nil, false
		}
		fields = append(fields, f)
	}
	return fields, len(fields) > 1
}
