package span

import (
	"go/ast"
	"go/token"
	"go/types"
	"math"

	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/constval"
)

// paramOf is a parameter's function and position.
type paramOf struct {
	fn *types.Func
	i  int
}

// param reports whether v is parameter i of a function of the package
// (no receiver) that never assigns it, and whether its values are known
// to be the arguments of the package's calls: the function is not
// exported, not variadic, and used only by direct calls.
func (r *Reader) param(v *types.Var) (p paramOf, fixed, called bool) {
	r.scan()
	p, ok := r.owners[v]
	if !ok || r.changed[v] {
		return paramOf{}, false, false
	}
	return p, true, !p.fn.Exported() && !p.fn.Signature().Variadic() && !r.escapes[p.fn]
}

// fromCalls bounds parameter p, v, by the join of its arguments at every
// call of its function, each bounded where it is passed.
func (r *Reader) fromCalls(v *types.Var, p paramOf, depth int) Interval {
	if got, ok := r.params[v]; ok {
		return got
	}
	got := Interval{Lo: math.Inf(1), Hi: math.Inf(-1), Away: math.Inf(1)} // empty until a call is read
	for _, site := range r.sites[p.fn] {
		call := site.Node().(*ast.CallExpr)
		if len(call.Args) != p.fn.Signature().Params().Len() {
			return all // f(g()): the results of another call
		}
		got = got.join(r.eval(site, call.Args[p.i], depth))
	}
	if got.Lo > got.Hi {
		got = all // never called
	}
	r.params[v] = got // a reading cut short is wider, never wrong
	return got
}

// scan finds, once, the parameters the package assigns and the direct
// calls of its functions, and the functions used any other way.
func (r *Reader) scan() {
	if r.sites != nil {
		return
	}
	r.changed, r.sites, r.escapes, r.owners = map[types.Object]bool{}, map[*types.Func][]inspector.Cursor{}, map[*types.Func]bool{}, map[*types.Var]paramOf{}
	calls := map[*ast.Ident]bool{}
	for cur := range r.insp.Root().Preorder((*ast.FuncDecl)(nil), (*ast.CallExpr)(nil), (*ast.AssignStmt)(nil), (*ast.IncDecStmt)(nil), (*ast.UnaryExpr)(nil), (*ast.RangeStmt)(nil), (*ast.SelectorExpr)(nil)) {
		switch n := cur.Node().(type) {
		case *ast.FuncDecl:
			if fn, ok := r.info.Defs[n.Name].(*types.Func); ok && n.Recv == nil {
				for i := range fn.Signature().Params().Len() {
					r.owners[fn.Signature().Params().At(i)] = paramOf{fn, i}
				}
			}
		case *ast.CallExpr:
			if id, ok := ast.Unparen(n.Fun).(*ast.Ident); ok {
				if fn, ok := typeutil.Callee(r.info, n).(*types.Func); ok && fn.Pkg() != nil {
					r.sites[fn] = append(r.sites[fn], cur)
					calls[id] = true
				}
			}
		case *ast.AssignStmt:
			for _, l := range n.Lhs {
				r.mark(l)
			}
		case *ast.IncDecStmt:
			r.mark(n.X)
		case *ast.UnaryExpr:
			if n.Op == token.AND {
				r.mark(n.X)
			}
		case *ast.RangeStmt:
			r.mark(n.Key)
			r.mark(n.Value)
		case *ast.SelectorExpr:
			if constval.PointerMethod(r.info, n) {
				r.mark(n.X)
			}
		}
	}
	for id, obj := range r.info.Uses {
		if fn, ok := obj.(*types.Func); ok && !calls[id] {
			r.escapes[fn] = true // a function value, which may be called with anything
		}
	}
}

// mark notes that the variable e names, if any, changes.
func (r *Reader) mark(e ast.Expr) {
	if id, ok := ast.Unparen(e).(*ast.Ident); ok {
		if obj := r.info.Uses[id]; obj != nil {
			r.changed[obj] = true
		}
	}
}
