// Package constval evaluates floating-point constants the way a reader of
// the source sees them: exactly, from the syntax (so the decimal 0.1 stays
// 0.1 rather than the float64 nearest to it), and through SSA for values
// that are constant without being declared so (a local assigned once, a
// package variable never reassigned, arithmetic of those).
package constval

import (
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/ssa"
)

// Exact returns the exact value of the constant expression e as written:
// literals and constants declared in this package keep their decimal value;
// constants from other packages have only the value the type checker kept.
// decls maps this package's constants to their initialising expressions.
func Exact(info *types.Info, decls map[*types.Const]ast.Expr, e ast.Expr) (constant.Value, bool) {
	tv, ok := info.Types[e]
	if !ok || tv.Value == nil {
		return nil, false // not a constant expression
	}
	switch e := ast.Unparen(e).(type) {
	case *ast.BasicLit:
		v := constant.MakeFromLiteral(e.Value, e.Kind, 0)
		return v, v.Kind() != constant.Unknown
	case *ast.Ident, *ast.SelectorExpr:
		if c, ok := uses(info, e).(*types.Const); ok {
			if init, ok := decls[c]; ok {
				return Exact(info, decls, init)
			}
		}
	case *ast.UnaryExpr:
		if x, ok := Exact(info, decls, e.X); ok {
			return constant.UnaryOp(e.Op, x, 0), true
		}
	case *ast.BinaryExpr:
		x, okx := Exact(info, decls, e.X)
		y, oky := Exact(info, decls, e.Y)
		if okx && oky && isArith(e.Op) {
			if e.Op == token.QUO && constant.Sign(y) == 0 {
				break // typed integer division by zero does not type-check; be safe
			}
			if e.Op == token.QUO && x.Kind() == constant.Int && y.Kind() == constant.Int {
				return constant.BinaryOp(x, token.QUO_ASSIGN, y), true // integer division
			}
			return constant.BinaryOp(x, e.Op, y), true
		}
	case *ast.CallExpr: // conversion T(x): the type checker rounds; keep its value
	}
	return tv.Value, true
}

// uses returns the object an identifier or qualified identifier refers to.
func uses(info *types.Info, e ast.Expr) types.Object {
	switch e := e.(type) {
	case *ast.Ident:
		return info.Uses[e]
	case *ast.SelectorExpr:
		return info.Uses[e.Sel]
	}
	return nil
}

func isArith(op token.Token) bool {
	return op == token.ADD || op == token.SUB || op == token.MUL || op == token.QUO
}

// Decls maps every constant declared in files to its initialising
// expression, following the implicit repetition of const blocks.
func Decls(info *types.Info, files []*ast.File) map[*types.Const]ast.Expr {
	decls := make(map[*types.Const]ast.Expr)
	for _, f := range files {
		for _, d := range f.Decls {
			gen, ok := d.(*ast.GenDecl)
			if !ok || gen.Tok != token.CONST {
				continue
			}
			var last []ast.Expr
			for _, s := range gen.Specs {
				spec := s.(*ast.ValueSpec)
				if len(spec.Values) > 0 {
					last = spec.Values
				}
				for i, name := range spec.Names {
					c, ok := info.Defs[name].(*types.Const)
					if ok && i < len(last) && !usesIota(last[i]) {
						decls[c] = last[i]
					}
				}
			}
		}
	}
	return decls
}

// usesIota reports whether e mentions iota, whose value depends on the spec.
func usesIota(e ast.Expr) bool {
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		if id, ok := n.(*ast.Ident); ok && id.Name == "iota" {
			found = true
		}
		return !found
	})
	return found
}

// Float returns the value of an SSA value that is a float constant in
// disguise: a constant, a conversion or negation of one, arithmetic of
// constants, or a load of a package variable that globals records as never
// reassigned. It works in float64; callers judging float32 round the result.
func Float(v ssa.Value, globals Globals) (float64, bool) {
	switch v := v.(type) {
	case *ssa.Const:
		if v.Value == nil || (v.Value.Kind() != constant.Float && v.Value.Kind() != constant.Int) {
			return 0, false
		}
		f, _ := constant.Float64Val(v.Value)
		return f, true
	case *ssa.Convert:
		return Float(v.X, globals)
	case *ssa.ChangeType:
		return Float(v.X, globals)
	case *ssa.UnOp:
		switch v.Op {
		case token.SUB:
			f, ok := Float(v.X, globals)
			return -f, ok
		case token.MUL:
			if g, ok := v.X.(*ssa.Global); ok {
				f, ok := globals[g]
				return f, ok
			}
		}
	case *ssa.BinOp:
		x, okx := Float(v.X, globals)
		y, oky := Float(v.Y, globals)
		if okx && oky {
			return arith(v.Op, x, y)
		}
	}
	return 0, false
}

func arith(op token.Token, x, y float64) (float64, bool) {
	switch op {
	case token.ADD:
		return x + y, true
	case token.SUB:
		return x - y, true
	case token.MUL:
		return x * y, true
	case token.QUO:
		return x / y, true
	}
	return 0, false
}

// Globals maps each package variable whose only store is a constant
// initialiser to that constant.
type Globals map[*ssa.Global]float64

// FindGlobals scans every function of pkg once and records the package
// variables that are stored exactly once, by the package initialiser, with a
// constant, and never have their address taken for anything but a load.
func FindGlobals(pkg *ssa.Package, funcs []*ssa.Function) Globals {
	stores := make(map[*ssa.Global]int)
	vals := make(Globals)
	escaped := make(map[*ssa.Global]bool)
	visit := func(fn *ssa.Function) {
		for _, b := range fn.Blocks {
			for _, instr := range b.Instrs {
				scanGlobals(fn, pkg, instr, stores, vals, escaped)
			}
		}
	}
	if init := pkg.Func("init"); init != nil {
		visit(init)
	}
	for _, fn := range funcs {
		visit(fn)
	}
	for g := range vals {
		if stores[g] != 1 || escaped[g] {
			delete(vals, g)
		}
	}
	return vals
}

func scanGlobals(fn *ssa.Function, pkg *ssa.Package, instr ssa.Instruction, stores map[*ssa.Global]int, vals Globals, escaped map[*ssa.Global]bool) {
	if st, ok := instr.(*ssa.Store); ok {
		if g, ok := st.Addr.(*ssa.Global); ok && g.Pkg == pkg {
			stores[g]++
			if f, ok := Float(st.Val, nil); ok && fn.Synthetic == "package initializer" {
				vals[g] = f
			} else {
				escaped[g] = true
			}
		}
	}
	var ops []*ssa.Value
	for _, op := range instr.Operands(ops) {
		g, ok := (*op).(*ssa.Global)
		if !ok || g.Pkg != pkg {
			continue
		}
		switch u := instr.(type) {
		case *ssa.UnOp:
			if u.Op == token.MUL {
				continue // a load
			}
		case *ssa.Store:
			if u.Addr == g {
				continue // counted above
			}
		}
		escaped[g] = true
	}
}
