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
	"math"
	"slices"

	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"
)

// Exact returns the exact value of e as the source writes it, when e is a
// constant expression or names a variable that holds one: literals, and
// constants and never-reassigned variables of this package (followed through
// decls, see Decls), keep their decimal value, so 0.1 stays one tenth rather
// than the float64 nearest to it; constants from other packages have only
// the value the type checker kept.
func Exact(info *types.Info, decls map[types.Object]ast.Expr, e ast.Expr) (constant.Value, bool) {
	return exact(info, decls, e, 8)
}

func exact(info *types.Info, decls map[types.Object]ast.Expr, e ast.Expr, depth int) (constant.Value, bool) {
	if depth == 0 {
		return nil, false
	}
	switch e := ast.Unparen(e).(type) {
	case *ast.BasicLit:
		v := constant.MakeFromLiteral(e.Value, e.Kind, 0)
		return v, v.Kind() != constant.Unknown
	case *ast.Ident, *ast.SelectorExpr:
		if init, ok := decls[uses(info, e)]; ok {
			return exact(info, decls, init, depth-1)
		}
	case *ast.UnaryExpr:
		// Fold only what the compiler folds: arithmetic on variables rounds at run time.
		if x, ok := exact(info, decls, e.X, depth-1); ok && isConst(info, e) && (e.Op == token.SUB || e.Op == token.ADD) {
			return constant.UnaryOp(e.Op, x, 0), true
		}
	case *ast.BinaryExpr:
		x, okx := exact(info, decls, e.X, depth-1)
		y, oky := exact(info, decls, e.Y, depth-1)
		if okx && oky && isConst(info, e) && isArith(e.Op) {
			return binary(e.Op, x, y, isInteger(info.TypeOf(e)))
		}
	case *ast.CallExpr:
		if tv, ok := info.Types[e.Fun]; ok && tv.IsType() && len(e.Args) == 1 && isNumeric(tv.Type) {
			return exact(info, decls, e.Args[0], depth-1) // the conversion's rounding is what callers judge
		}
	}
	if tv, ok := info.Types[e]; ok && tv.Value != nil {
		return tv.Value, true
	}
	return nil, false
}

// binary applies an arithmetic operator to two exact constants with Go's
// rules: division of an integer type truncates; division by zero has no
// value.
func binary(op token.Token, x, y constant.Value, integer bool) (constant.Value, bool) {
	if op == token.QUO && constant.Sign(y) == 0 {
		return nil, false
	}
	if op == token.QUO && integer {
		op = token.QUO_ASSIGN // integer division
	}
	return constant.BinaryOp(x, op, y), true
}

// isConst reports whether e is a compile-time constant expression.
func isConst(info *types.Info, e ast.Expr) bool {
	tv, ok := info.Types[e]
	return ok && tv.Value != nil
}

func isNumeric(t types.Type) bool {
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&types.IsNumeric != 0
}

func isInteger(t types.Type) bool {
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&types.IsInteger != 0
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

// Decls maps the constants declared in the files of insp, and the
// variables (local or package-level) that are initialised once and never
// assigned again nor have their address taken (explicitly, or by a call
// of a pointer method), to their initialising expressions. Constant
// blocks' implicit repetition is followed; iota-dependent constants are left
// out.
func Decls(info *types.Info, insp *inspector.Inspector) map[types.Object]ast.Expr {
	decls := make(map[types.Object]ast.Expr)
	changed := make(map[types.Object]bool)
	filter := []ast.Node{(*ast.GenDecl)(nil), (*ast.AssignStmt)(nil), (*ast.IncDecStmt)(nil), (*ast.UnaryExpr)(nil), (*ast.SelectorExpr)(nil), (*ast.RangeStmt)(nil)}
	for n := range insp.PreorderSeq(filter...) {
		switch n := n.(type) {
		case *ast.GenDecl:
			if n.Tok == token.CONST || n.Tok == token.VAR {
				valueSpecs(info, n, decls)
			}
		case *ast.AssignStmt:
			assignments(info, n, decls, changed)
		case *ast.IncDecStmt:
			markChanged(info, n.X, changed)
		case *ast.UnaryExpr:
			if n.Op == token.AND {
				markChanged(info, n.X, changed)
			}
		case *ast.SelectorExpr:
			if PointerMethod(info, n) {
				markChanged(info, n.X, changed) // v.M() with M on *T takes &v
			}
		case *ast.RangeStmt:
			markChanged(info, n.Key, changed)
			markChanged(info, n.Value, changed)
		}
	}
	for obj := range changed {
		delete(decls, obj)
	}
	return decls
}

// PointerMethod reports whether sel selects a method with a pointer
// receiver, which, called on an addressable variable, takes its address.
func PointerMethod(info *types.Info, sel *ast.SelectorExpr) bool {
	s, ok := info.Selections[sel]
	if !ok || s.Kind() != types.MethodVal {
		return false
	}
	_, ptr := s.Obj().(*types.Func).Signature().Recv().Type().Underlying().(*types.Pointer)
	return ptr
}

// valueSpecs records the initialisers of a const or var declaration.
func valueSpecs(info *types.Info, gen *ast.GenDecl, decls map[types.Object]ast.Expr) {
	var last []ast.Expr
	for _, s := range gen.Specs {
		spec := s.(*ast.ValueSpec)
		if len(spec.Values) > 0 || gen.Tok == token.VAR {
			last = spec.Values
		}
		if len(last) != len(spec.Names) {
			continue // a multi-value call, or no initialiser
		}
		for i, name := range spec.Names {
			if obj := info.Defs[name]; obj != nil && !usesIota(last[i]) {
				decls[obj] = last[i]
			}
		}
	}
}

// assignments records x := e definitions and marks every other assignment.
func assignments(info *types.Info, as *ast.AssignStmt, decls map[types.Object]ast.Expr, changed map[types.Object]bool) {
	for i, lhs := range as.Lhs {
		id, ok := lhs.(*ast.Ident)
		if ok && as.Tok == token.DEFINE && info.Defs[id] != nil && len(as.Lhs) == len(as.Rhs) {
			decls[info.Defs[id]] = as.Rhs[i]
			continue
		}
		markChanged(info, lhs, changed)
	}
}

// markChanged records that the variable named by e is assigned.
func markChanged(info *types.Info, e ast.Expr, changed map[types.Object]bool) {
	if obj := objectOf(info, e); obj != nil {
		changed[obj] = true
	}
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
	case *ssa.Call:
		return mathCall(v, globals)
	}
	return 0, false
}

// mathFuncs are the math functions Float evaluates on constant arguments,
// as written steps and tolerances use them (math.Sqrt(eps)).
var mathFuncs = map[string]func(args []float64) float64{
	"Sqrt": func(a []float64) float64 { return math.Sqrt(a[0]) },
	"Cbrt": func(a []float64) float64 { return math.Cbrt(a[0]) },
	"Abs":  func(a []float64) float64 { return math.Abs(a[0]) },
	"Pow":  func(a []float64) float64 { return math.Pow(a[0], a[1]) },
	"Inf":  func(a []float64) float64 { return math.Inf(int(a[0])) },
}

// mathCall evaluates a call of a function of mathFuncs whose arguments are
// all constants.
func mathCall(call *ssa.Call, globals Globals) (float64, bool) {
	fn := call.Call.StaticCallee()
	if fn == nil || fn.Pkg == nil || fn.Pkg.Pkg.Path() != "math" || mathFuncs[fn.Name()] == nil {
		return 0, false
	}
	args := make([]float64, len(call.Call.Args))
	for i, a := range call.Call.Args {
		f, ok := Float(a, globals)
		if !ok {
			return 0, false
		}
		args[i] = f
	}
	return mathFuncs[fn.Name()](args), true
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
	var ops []*ssa.Value // reused: one allocation, not one per instruction
	visit := func(fn *ssa.Function) {
		for _, b := range fn.Blocks {
			for _, instr := range b.Instrs {
				ops = scanGlobals(fn, pkg, instr, stores, vals, escaped, ops[:0])
			}
		}
	}
	init := pkg.Func("init")
	if init != nil {
		visit(init)
	}
	if len(vals) == 0 {
		return vals // the initialiser stores no constant: nothing to confirm elsewhere
	}
	for _, fn := range funcs {
		if fn != init { // already visited
			visit(fn)
		}
	}
	for g := range vals {
		if stores[g] != 1 || escaped[g] {
			delete(vals, g)
		}
	}
	return vals
}

// scanGlobals records what instr does with this package's globals; ops is
// scratch space for its operands, returned for reuse.
func scanGlobals(fn *ssa.Function, pkg *ssa.Package, instr ssa.Instruction, stores map[*ssa.Global]int, vals Globals, escaped map[*ssa.Global]bool, ops []*ssa.Value) []*ssa.Value {
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
	ops = instr.Operands(ops)
	for _, op := range ops {
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
	return ops
}

// SetOnce returns a reader of the local variables of the files of insp
// that are declared with no value (var tol1 float64, as code ported from
// C declares its variables first) and assigned exactly once afterwards,
// by a plain assignment that is a statement of a block: it gives the
// value assigned when every read of the variable lies in that block after
// the assignment, so the zero value is never read and each read sees the
// one assignment's value. Decls leaves such variables out, since they are
// assigned after their declaration. Each variable is read once, from the
// function that declares it.
func SetOnce(info *types.Info, insp *inspector.Inspector) func(types.Object) (ast.Expr, bool) {
	memo := make(map[types.Object]ast.Expr)
	return func(obj types.Object) (ast.Expr, bool) {
		if rhs, ok := memo[obj]; ok {
			return rhs, rhs != nil
		}
		rhs := setOnce(info, insp, obj)
		memo[obj] = rhs
		return rhs, rhs != nil
	}
}

// setOnce returns the value of obj's one assignment (see SetOnce), or nil.
func setOnce(info *types.Info, insp *inspector.Inspector, obj types.Object) ast.Expr {
	v, ok := obj.(*types.Var)
	if !ok || v.Pkg() == nil || v.Parent() == v.Pkg().Scope() || v.IsField() {
		return nil
	}
	decl, ok := insp.Root().FindByPos(v.Pos(), v.Pos())
	if !ok {
		return nil
	}
	if spec, ok := decl.Parent().Node().(*ast.ValueSpec); !ok || len(spec.Values) > 0 {
		return nil // not var x T, or given a value there
	}
	var fn inspector.Cursor
	inFunc := false
	for f := range decl.Enclosing((*ast.FuncDecl)(nil)) {
		fn, inFunc = f, true
	}
	if !inFunc {
		return nil
	}
	var set inspector.Cursor
	changes, plain := 0, false
	var reads []*ast.Ident
	for cur := range fn.Preorder((*ast.AssignStmt)(nil), (*ast.IncDecStmt)(nil), (*ast.UnaryExpr)(nil), (*ast.SelectorExpr)(nil), (*ast.RangeStmt)(nil), (*ast.Ident)(nil)) {
		switch n := cur.Node().(type) {
		case *ast.AssignStmt:
			for _, lhs := range n.Lhs {
				if objectOf(info, lhs) == obj {
					changes++
					if n.Tok == token.ASSIGN && len(n.Lhs) == len(n.Rhs) {
						set, plain = cur, true
					}
				}
			}
		case *ast.IncDecStmt:
			if objectOf(info, n.X) == obj {
				changes += 2
			}
		case *ast.UnaryExpr:
			if n.Op == token.AND && objectOf(info, n.X) == obj {
				changes += 2
			}
		case *ast.SelectorExpr:
			if PointerMethod(info, n) && objectOf(info, n.X) == obj {
				changes += 2
			}
		case *ast.RangeStmt:
			if objectOf(info, n.Key) == obj || objectOf(info, n.Value) == obj {
				changes += 2
			}
		case *ast.Ident:
			if info.Uses[n] == obj {
				reads = append(reads, n)
			}
		}
	}
	if changes != 1 || !plain {
		return nil
	}
	rhs, _ := readAfter(info, set, obj, reads)
	return rhs
}

// objectOf returns the variable e names, or nil.
func objectOf(info *types.Info, e ast.Expr) types.Object {
	id, ok := ast.Unparen(e).(*ast.Ident)
	if !ok {
		return nil
	}
	if obj := info.Uses[id]; obj != nil {
		return obj
	}
	return info.Defs[id]
}

// readAfter returns the value the assignment at cur gives obj when the
// assignment is a statement of a block and every read of obj lies in
// that block after it.
func readAfter(info *types.Info, cur inspector.Cursor, obj types.Object, reads []*ast.Ident) (ast.Expr, bool) {
	as := cur.Node().(*ast.AssignStmt)
	block, ok := cur.Parent().Node().(*ast.BlockStmt)
	if !ok {
		return nil, false
	}
	var rhs ast.Expr
	for i, lhs := range as.Lhs {
		if objectOf(info, lhs) == obj {
			rhs = as.Rhs[i]
		}
	}
	for _, id := range reads {
		if slices.Contains(as.Lhs, ast.Expr(id)) {
			continue // the assignment's own target
		}
		if id.Pos() <= as.End() || id.Pos() >= block.End() {
			return nil, false
		}
	}
	return rhs, rhs != nil
}
