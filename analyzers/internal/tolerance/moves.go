package tolerance

import (
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/provenance"
)

// Movers returns the functions of the package whose body only stores
// float parameters through float pointer parameters (*a = d; *b = e), as
// code ported from C shifts points with a helper (mov3(&a, &b, &c, d, e,
// f)), with the parameter indices of each store: pointer, value.
func Movers(info *types.Info, files []*ast.File) map[*types.Func][][2]int {
	out := make(map[*types.Func][][2]int)
	for _, f := range files {
		for _, d := range f.Decls {
			fd, ok := d.(*ast.FuncDecl)
			if !ok || fd.Body == nil || fd.Recv != nil || len(fd.Body.List) == 0 {
				continue
			}
			fn, _ := info.Defs[fd.Name].(*types.Func)
			var stores [][2]int
			for _, st := range fd.Body.List {
				p, v, ok := store(info, fn, st)
				if !ok {
					stores = nil
					break
				}
				stores = append(stores, [2]int{p, v})
			}
			if fn != nil && stores != nil {
				out[fn] = stores
			}
		}
	}
	return out
}

// store reads st as *p = v with p a float pointer parameter of fn and v a
// float parameter, returning their indices.
func store(info *types.Info, fn *types.Func, st ast.Stmt) (int, int, bool) {
	as, ok := st.(*ast.AssignStmt)
	if !ok || as.Tok != token.ASSIGN || len(as.Lhs) != 1 || len(as.Rhs) != 1 || fn == nil {
		return 0, 0, false
	}
	star, ok := as.Lhs[0].(*ast.StarExpr)
	if !ok {
		return 0, 0, false
	}
	index := func(e ast.Expr) int {
		v := VarOf(info, e)
		for i := range fn.Signature().Params().Len() {
			if fn.Signature().Params().At(i) == v {
				return i
			}
		}
		return -1
	}
	p, v := index(star.X), index(as.Rhs[0])
	return p, v, p >= 0 && v >= 0 && provenance.IsFloat(info.TypeOf(as.Rhs[0])) && provenance.IsFloat(info.TypeOf(star))
}

// Moved returns the assignments a call of a mover makes: the variable
// behind each pointer argument (&x) and the argument stored there.
func Moved(info *types.Info, movers map[*types.Func][][2]int, call *ast.CallExpr) [][2]ast.Expr {
	fn, _ := typeutil.Callee(info, call).(*types.Func)
	var out [][2]ast.Expr
	for _, m := range movers[fn] {
		if m[0] >= len(call.Args) || m[1] >= len(call.Args) {
			return nil
		}
		if addr, ok := ast.Unparen(call.Args[m[0]]).(*ast.UnaryExpr); ok && addr.Op == token.AND {
			out = append(out, [2]ast.Expr{addr.X, call.Args[m[1]]})
		}
	}
	return out
}
