package constval

import (
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
)

// Table returns the cases a range loop walks when it ranges over a
// composite literal, written in place or held by a variable assigned once
// (for _, tc := range []struct{...}{...}), with the object of its value
// variable, tc.
func Table(info *types.Info, decls map[types.Object]ast.Expr, rs *ast.RangeStmt) (row types.Object, cases []ast.Expr, ok bool) {
	id, ok := rs.Value.(*ast.Ident)
	if !ok || info.Defs[id] == nil {
		return nil, nil, false
	}
	lit, ok := literal(info, decls, rs.X, 4)
	if !ok {
		return nil, nil, false
	}
	return info.Defs[id], lit.Elts, true
}

// literal returns the composite literal e is, or the one a variable
// assigned once holds.
func literal(info *types.Info, decls map[types.Object]ast.Expr, e ast.Expr, depth int) (*ast.CompositeLit, bool) {
	switch x := ast.Unparen(e).(type) {
	case *ast.CompositeLit:
		return x, true
	case *ast.UnaryExpr:
		if x.Op == token.AND {
			return literal(info, decls, x.X, depth)
		}
	case *ast.Ident:
		if init, ok := decls[info.Uses[x]]; ok && depth > 0 {
			return literal(info, decls, init, depth-1)
		}
	}
	return nil, false
}

// InRow returns the exact value of e in one case of a table: the case, a
// composite literal, gives the fields the loop variable row selects, and
// e may read constants, those fields, elements at constant indices of
// slices given in them, and variables assigned once from any of these,
// combined by + - * / and numeric conversions. The value is what exact
// arithmetic gives; the program's floats differ from it by rounding only.
func InRow(info *types.Info, decls map[types.Object]ast.Expr, e ast.Expr, row types.Object, c ast.Expr) (constant.Value, bool) {
	r := rowEval{info, decls, row, c}
	return r.value(e, 12)
}

type rowEval struct {
	info  *types.Info
	decls map[types.Object]ast.Expr
	row   types.Object
	c     ast.Expr
}

func (r rowEval) value(e ast.Expr, depth int) (constant.Value, bool) {
	if depth == 0 {
		return nil, false
	}
	if v, ok := Exact(r.info, r.decls, e); ok {
		return v, v.Kind() != constant.Complex
	}
	switch x := ast.Unparen(e).(type) {
	case *ast.Ident:
		if init, ok := r.decls[r.info.Uses[x]]; ok {
			return r.value(init, depth-1)
		}
	case *ast.SelectorExpr, *ast.IndexExpr:
		if elt, ok := r.element(x, 6); ok {
			return r.value(elt, depth-1)
		}
	case *ast.UnaryExpr:
		if v, ok := r.value(x.X, depth-1); ok && (x.Op == token.SUB || x.Op == token.ADD) {
			return constant.UnaryOp(x.Op, v, 0), true
		}
	case *ast.BinaryExpr:
		a, ok := r.value(x.X, depth-1)
		b, ok2 := r.value(x.Y, depth-1)
		if !ok || !ok2 || !isArith(x.Op) || x.Op == token.REM || x.Op == token.QUO && constant.Sign(b) == 0 {
			return nil, false
		}
		return constant.BinaryOp(constant.ToFloat(a), x.Op, constant.ToFloat(b)), true
	case *ast.CallExpr:
		if tv, ok := r.info.Types[x.Fun]; ok && tv.IsType() && len(x.Args) == 1 && isNumeric(tv.Type) {
			return r.value(x.Args[0], depth-1)
		}
	}
	return nil, false
}

// element returns the expression the case gives to row.f (a field of the
// loop variable) or to s[i] (an element at a constant index of a slice so
// given), following variables assigned once.
func (r rowEval) element(e ast.Expr, depth int) (ast.Expr, bool) {
	if depth == 0 {
		return nil, false
	}
	switch x := ast.Unparen(e).(type) {
	case *ast.Ident:
		if r.info.Uses[x] == r.row {
			return r.c, true
		}
		if init, ok := r.decls[r.info.Uses[x]]; ok {
			return r.element(init, depth-1)
		}
	case *ast.SelectorExpr:
		sel, ok := r.info.Selections[x]
		if !ok || sel.Kind() != types.FieldVal {
			return nil, false
		}
		base, ok := r.element(x.X, depth-1)
		if !ok {
			return nil, false
		}
		return fieldIn(r.info, base, sel.Obj())
	case *ast.IndexExpr:
		i, ok := Exact(r.info, r.decls, x.Index)
		base, ok2 := r.element(x.X, depth-1)
		lit, ok3 := ast.Unparen(base).(*ast.CompositeLit)
		if !ok || !ok2 || !ok3 || i.Kind() != constant.Int {
			return nil, false
		}
		n, exact := constant.Int64Val(i)
		if !exact || n < 0 || n >= int64(len(lit.Elts)) {
			return nil, false
		}
		if _, keyed := lit.Elts[n].(*ast.KeyValueExpr); keyed {
			return nil, false
		}
		return lit.Elts[n], true
	}
	return nil, false
}

// fieldIn returns the value a struct literal gives field, by key or by
// position.
func fieldIn(info *types.Info, base ast.Expr, field types.Object) (ast.Expr, bool) {
	if u, ok := ast.Unparen(base).(*ast.UnaryExpr); ok && u.Op == token.AND {
		base = u.X
	}
	lit, ok := ast.Unparen(base).(*ast.CompositeLit)
	st, isStruct := structOf(info.TypeOf(lit))
	if !ok || !isStruct {
		return nil, false
	}
	keyed := false
	for i, elt := range lit.Elts {
		if kv, ok := elt.(*ast.KeyValueExpr); ok {
			keyed = true
			if id, ok := kv.Key.(*ast.Ident); ok && info.Uses[id] == field {
				return kv.Value, true
			}
		} else if i < st.NumFields() && st.Field(i) == field {
			return elt, true
		}
	}
	if keyed && isNumeric(field.Type()) {
		return &ast.BasicLit{Kind: token.INT, Value: "0"}, true // a field left out is zero
	}
	return nil, false
}
