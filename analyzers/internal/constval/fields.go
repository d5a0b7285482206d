package constval

import (
	"go/ast"
	"go/types"
)

// Fields maps each struct field to the values that the composite literals
// of files give it, by key or by position: the expected values of a table
// of test cases, read back through tc.want.
func Fields(info *types.Info, files []*ast.File) map[types.Object][]ast.Expr {
	vals := make(map[types.Object][]ast.Expr)
	for _, f := range files {
		ast.Inspect(f, func(n ast.Node) bool {
			lit, ok := n.(*ast.CompositeLit)
			if !ok {
				return true
			}
			st, isStruct := structOf(info.TypeOf(lit))
			for i, elt := range lit.Elts {
				if kv, ok := elt.(*ast.KeyValueExpr); ok {
					if id, ok := kv.Key.(*ast.Ident); ok && isStruct {
						if field := info.Uses[id]; field != nil {
							vals[field] = append(vals[field], kv.Value)
						}
					}
				} else if isStruct && i < st.NumFields() {
					vals[st.Field(i)] = append(vals[st.Field(i)], elt)
				}
			}
			return true
		})
	}
	return vals
}

// structOf returns the struct type t is or points to.
func structOf(t types.Type) (*types.Struct, bool) {
	if t == nil {
		return nil, false
	}
	if p, ok := t.Underlying().(*types.Pointer); ok {
		t = p.Elem()
	}
	st, ok := t.Underlying().(*types.Struct)
	return st, ok
}
