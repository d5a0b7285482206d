package tolerance

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/types/typeutil"
)

// Lookup tells where an analyzer has learned that a parameter or a field is
// used as a tolerance of its kind (U describes the use).
type Lookup[U any] struct {
	Params func(fn *types.Func) map[int]U // tolerance parameters by index
	Field  func(field *types.Var) (U, bool)
}

// Sites calls visit for every expression in n that sets a known tolerance:
// an argument passed to a tolerance parameter, a value given to a tolerance
// field in a composite literal, a value assigned to a tolerance field (as in
// the defaulting idiom if s.Tol == 0 { s.Tol = c }). how describes the
// place, e.g. "passed as tol to Solve". n is a CallExpr, CompositeLit or
// AssignStmt; other nodes are ignored.
func Sites[U any](info *types.Info, n ast.Node, known Lookup[U], visit func(val ast.Expr, u U, how string)) {
	switch n := n.(type) {
	case *ast.CallExpr:
		fn, ok := typeutil.Callee(info, n).(*types.Func)
		if !ok {
			return
		}
		sig := fn.Signature()
		for i, u := range known.Params(fn.Origin()) {
			if i < len(n.Args) && !(sig.Variadic() && i == sig.Params().Len()-1) {
				visit(n.Args[i], u, fmt.Sprintf("passed as %s to %s", sig.Params().At(i).Name(), fn.Name()))
			}
		}
	case *ast.CompositeLit:
		st, ok := literalStruct(info, n)
		if !ok {
			return
		}
		for i, elt := range n.Elts {
			field, val := st.Field(min(i, st.NumFields()-1)), elt
			if kv, ok := elt.(*ast.KeyValueExpr); ok {
				id, ok := kv.Key.(*ast.Ident)
				if !ok {
					return
				}
				field, _ = info.Uses[id].(*types.Var)
				val = kv.Value
			}
			if field == nil {
				continue
			}
			if u, ok := known.Field(field); ok {
				visit(val, u, "set as field "+field.Name())
			}
		}
	case *ast.AssignStmt:
		if len(n.Lhs) != len(n.Rhs) {
			return
		}
		for i, lhs := range n.Lhs {
			if field := FieldOf(info, lhs); field != nil {
				if u, ok := known.Field(field); ok {
					visit(n.Rhs[i], u, "assigned to field "+field.Name())
				}
			}
		}
	}
}

// literalStruct returns the struct type of a composite literal, looking
// through a pointer for &T{...} elided in a slice of pointers.
func literalStruct(info *types.Info, lit *ast.CompositeLit) (*types.Struct, bool) {
	t := info.TypeOf(lit)
	if p, ok := t.Underlying().(*types.Pointer); ok {
		t = p.Elem()
	}
	st, ok := t.Underlying().(*types.Struct)
	return st, ok
}

// FieldOf returns the struct field that e selects, or nil.
func FieldOf(info *types.Info, e ast.Expr) *types.Var {
	sel, ok := ast.Unparen(e).(*ast.SelectorExpr)
	if !ok {
		return nil
	}
	s, ok := info.Selections[sel]
	if !ok || s.Kind() != types.FieldVal {
		return nil
	}
	v, _ := s.Obj().(*types.Var)
	return v
}

// ParamOf returns the function declared by fd and the index of the
// parameter id names, when it names one.
func ParamOf(info *types.Info, fd *ast.FuncDecl, id *ast.Ident) (*types.Func, int, bool) {
	obj, ok := info.Uses[id].(*types.Var)
	fn, ok2 := info.Defs[fd.Name].(*types.Func)
	if !ok || !ok2 {
		return nil, 0, false
	}
	params := fn.Signature().Params()
	for i := range params.Len() {
		if params.At(i) == obj {
			return fn, i, true
		}
	}
	return nil, 0, false
}

// Defaults returns, for each variable v in body that is given a constant in
// the defaulting idiom if v == 0 { v = c } (or v <= 0), the expressions c.
func Defaults(info *types.Info, body ast.Node) map[*types.Var][]ast.Expr {
	out := make(map[*types.Var][]ast.Expr)
	ast.Inspect(body, func(n ast.Node) bool {
		ifs, ok := n.(*ast.IfStmt)
		if !ok {
			return true
		}
		v := zeroTest(info, ifs.Cond)
		if v == nil {
			return true
		}
		for _, s := range ifs.Body.List {
			as, ok := s.(*ast.AssignStmt)
			if !ok || as.Tok != token.ASSIGN || len(as.Lhs) != 1 || len(as.Rhs) != 1 {
				continue
			}
			if id, ok := as.Lhs[0].(*ast.Ident); ok && info.Uses[id] == v {
				if tv, ok := info.Types[as.Rhs[0]]; ok && tv.Value != nil {
					out[v] = append(out[v], as.Rhs[0])
				}
			}
		}
		return true
	})
	return out
}

// Copies returns, for each local variable of body whose only value that is
// not a constant is one parameter or field (tol := o.Tol, with or without
// a default if tol == 0 { tol = 1e-9 }), that parameter or field: the
// caller's value reaches every test of the copy that no constant replaced.
// A variable changed in any other way (tol *= 10, &tol) is no copy.
func Copies(info *types.Info, body ast.Node) map[*types.Var]ast.Expr {
	vals := make(map[*types.Var][]ast.Expr)
	bad := make(map[*types.Var]bool)
	give := func(l, e ast.Expr) {
		if v := VarOf(info, l); v != nil && info.Types[e].Value == nil {
			vals[v] = append(vals[v], e)
		}
	}
	spoil := func(e ast.Expr) {
		if v := VarOf(info, e); v != nil {
			bad[v] = true
		}
	}
	ast.Inspect(body, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.AssignStmt:
			for i, l := range n.Lhs {
				if len(n.Lhs) == len(n.Rhs) && (n.Tok == token.ASSIGN || n.Tok == token.DEFINE) {
					give(l, n.Rhs[i])
				} else {
					spoil(l)
				}
			}
		case *ast.ValueSpec:
			for i, name := range n.Names {
				if len(n.Values) == len(n.Names) {
					give(name, n.Values[i])
				}
			}
		case *ast.IncDecStmt:
			spoil(n.X)
		case *ast.RangeStmt:
			spoil(n.Key)
			spoil(n.Value)
		case *ast.UnaryExpr:
			if n.Op == token.AND {
				spoil(n.X)
			}
		}
		return true
	})
	out := make(map[*types.Var]ast.Expr)
	for v, es := range vals {
		e := ast.Unparen(es[0])
		if _, isID := e.(*ast.Ident); len(es) == 1 && !bad[v] && (isID || FieldOf(info, e) != nil) {
			out[v] = e
		}
	}
	return out
}

// zeroTest returns v when cond is v == 0 or v <= 0.
func zeroTest(info *types.Info, cond ast.Expr) *types.Var {
	b, ok := ast.Unparen(cond).(*ast.BinaryExpr)
	if !ok || b.Op != token.EQL && b.Op != token.LEQ {
		return nil
	}
	id, ok := ast.Unparen(b.X).(*ast.Ident)
	tv, ok2 := info.Types[b.Y]
	if !ok || !ok2 || tv.Value == nil || tv.Value.String() != "0" {
		return nil
	}
	v, _ := info.Uses[id].(*types.Var)
	return v
}
