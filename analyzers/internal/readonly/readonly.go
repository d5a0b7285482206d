// Package readonly defines an infrastructure Analyzer that learns which
// float-slice parameters of a function it only reads: it indexes them for
// reading, ranges over them, takes their length, copies or appends from
// them, compares them with nil, formats them, or hands them to a
// parameter that is read-only in turn, and never stores into them, slices
// them, takes their address or keeps them elsewhere (a recursion is not
// followed: it counts as a change). A caller's slice of
// constants handed to such a parameter keeps its values across the call,
// so a test may read its elements as the constants it wrote. Facts carry
// the parameters to importers.
package readonly

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"reflect"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/passes/inspect"
	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/provenance"
)

// Analyzer learns the read-only float-slice parameters of a package.
var Analyzer = &analysis.Analyzer{
	Name:       "readonly",
	Doc:        "readonly: learn which float-slice parameters a function only reads",
	Requires:   []*analysis.Analyzer{inspect.Analyzer},
	Run:        run,
	ResultType: reflect.TypeFor[*Reads](),
	FactTypes:  []analysis.Fact{new(Fact)},
}

// Fact lists the indices of a function's float-slice parameters that it
// only reads.
type Fact struct{ Params []int }

// AFact marks Fact as an analysis fact.
func (*Fact) AFact() {}

func (f *Fact) String() string { return fmt.Sprintf("reads only %v", f.Params) }

// Reads answers whether a variable is only read, in one package.
type Reads struct {
	pass  *analysis.Pass
	funcs map[*types.Func]inspector.Cursor
	memo  map[*types.Var]bool // parameters of the package's functions, false while being read
}

// Of returns the Reads result of pass's package; the pass's analyzer must
// require Analyzer.
func Of(pass *analysis.Pass) *Reads { return pass.ResultOf[Analyzer].(*Reads) }

func run(pass *analysis.Pass) (any, error) {
	r := &Reads{pass: pass, funcs: map[*types.Func]inspector.Cursor{}, memo: map[*types.Var]bool{}}
	insp := pass.ResultOf[inspect.Analyzer].(*inspector.Inspector)
	for cur := range insp.Root().Preorder((*ast.FuncDecl)(nil)) {
		fd := cur.Node().(*ast.FuncDecl)
		if fn, ok := pass.TypesInfo.Defs[fd.Name].(*types.Func); ok && fd.Body != nil {
			r.funcs[fn] = cur
		}
	}
	for fn := range r.funcs {
		var only []int
		params := fn.Signature().Params()
		for i := range params.Len() {
			if floatSlice(params.At(i).Type()) && r.Param(fn, i) {
				only = append(only, i)
			}
		}
		if len(only) > 0 {
			pass.ExportObjectFact(fn, &Fact{Params: only})
		}
	}
	return r, nil
}

// floatSlice reports whether t is a slice of floats.
func floatSlice(t types.Type) bool {
	s, ok := t.Underlying().(*types.Slice)
	return ok && provenance.IsFloat(s.Elem())
}

// Param reports whether fn only reads its i-th parameter.
func (r *Reads) Param(fn *types.Func, i int) bool {
	cur, ok := r.funcs[fn]
	if !ok {
		var f Fact
		if !r.pass.ImportObjectFact(fn, &f) {
			return false
		}
		for _, p := range f.Params {
			if p == i {
				return true
			}
		}
		return false
	}
	params := fn.Signature().Params()
	if i >= params.Len() || !floatSlice(params.At(i).Type()) {
		return false
	}
	v := params.At(i)
	if done, ok := r.memo[v]; ok {
		return done
	}
	r.memo[v] = false // a recursion is not followed: the parameter counts as changed
	r.memo[v] = r.Only(cur, v)
	return r.memo[v]
}

// Only reports whether v is only read inside the node at cur (a function
// of the package).
func (r *Reads) Only(cur inspector.Cursor, v *types.Var) bool {
	for use := range cur.Preorder((*ast.Ident)(nil)) {
		if r.pass.TypesInfo.Uses[use.Node().(*ast.Ident)] == v && !r.reads(use) {
			return false
		}
	}
	return true
}

// reads reports whether the identifier at use is read: for an element
// (not stored into, incremented or addressed), a length, a range, a
// comparison, a copy or append source, a formatted argument, or an
// argument of a read-only parameter.
func (r *Reads) reads(use inspector.Cursor) bool {
	switch k, i := use.ParentEdge(); k {
	case edge.RangeStmt_X, edge.BinaryExpr_X, edge.BinaryExpr_Y:
		return true
	case edge.CallExpr_Args:
		return r.argRead(use.Parent().Node().(*ast.CallExpr), i)
	case edge.IndexExpr_X:
		switch k, _ := use.Parent().ParentEdge(); k {
		case edge.AssignStmt_Lhs, edge.IncDecStmt_X:
			return false
		case edge.UnaryExpr_X:
			return use.Parent().Parent().Node().(*ast.UnaryExpr).Op != token.AND
		}
		return true
	}
	return false
}

// argRead reports whether call only reads its i-th argument: len, cap,
// the source of copy, a slice spread into append, an argument formatted
// by fmt, log or a test's report, or one given to a read-only parameter.
func (r *Reads) argRead(call *ast.CallExpr, i int) bool {
	switch fn := typeutil.Callee(r.pass.TypesInfo, call).(type) {
	case *types.Builtin:
		switch fn.Name() {
		case "len", "cap":
			return true
		case "copy":
			return i == 1
		case "append":
			return i > 0 && call.Ellipsis.IsValid()
		}
	case *types.Func:
		sig := fn.Signature()
		if sig.Variadic() && i >= sig.Params().Len()-1 && !call.Ellipsis.IsValid() {
			return formats(fn)
		}
		return r.Param(fn, i)
	}
	return false
}

// formats reports whether fn is a function of fmt or log, or a method of
// testing's T, B, F or TB, whose variadic arguments it only formats.
func formats(fn *types.Func) bool {
	if fn.Pkg() == nil {
		return false
	}
	switch fn.Pkg().Path() {
	case "fmt", "log":
		return true
	case "testing":
		return fn.Signature().Recv() != nil
	}
	return false
}
