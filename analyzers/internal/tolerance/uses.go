package tolerance

import (
	"fmt"
	"go/ast"
	"go/types"
	"slices"
	"strings"
	"sync"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
)

// ParamsFact records, for one analyzer, the parameters of a function used
// as tolerances, by index; U describes the use.
type ParamsFact[U fmt.Stringer] struct{ Params map[int]U }

// AFact marks ParamsFact as an analysis fact.
func (*ParamsFact[U]) AFact() {}

func (f *ParamsFact[U]) String() string {
	var parts []string
	for i, u := range f.Params {
		parts = append(parts, fmt.Sprintf("parameter %d is %s", i, u))
	}
	slices.Sort(parts)
	return strings.Join(parts, "; ")
}

// FieldFact records, for one analyzer, a struct field used as a tolerance.
type FieldFact[U fmt.Stringer] struct{ Use U }

// AFact marks FieldFact as an analysis fact.
func (*FieldFact[U]) AFact() {}

func (f *FieldFact[U]) String() string { return f.Use.String() }

// Uses holds what one analyzer learns, in one package, about the
// parameters and fields used as its kind of tolerance, and the defaulting
// idioms of the package's functions. The analyzer lists
// new(ParamsFact[U]) and new(FieldFact[U]) among its FactTypes.
type Uses[U fmt.Stringer] struct {
	pass      *analysis.Pass
	params    map[*types.Func]map[int]U
	fields    map[*types.Var]U
	defaulted map[*ast.FuncDecl]map[*types.Var][]ast.Expr
	copies    map[*ast.FuncDecl]map[*types.Var]ast.Expr
	imported  func() bool // whether the pass's facts record a tolerance, read once
}

// NewUses returns an empty Uses for pass.
func NewUses[U fmt.Stringer](pass *analysis.Pass) *Uses[U] {
	return &Uses[U]{pass: pass, params: map[*types.Func]map[int]U{}, fields: map[*types.Var]U{}, defaulted: map[*ast.FuncDecl]map[*types.Var][]ast.Expr{}, copies: map[*ast.FuncDecl]map[*types.Var]ast.Expr{},
		imported: sync.OnceValue(func() bool { return importsTolerance[U](pass) })}
}

// importsTolerance reports whether pass's facts record a tolerance.
func importsTolerance[U fmt.Stringer](pass *analysis.Pass) bool {
	for _, f := range pass.AllObjectFacts() {
		switch f.Fact.(type) {
		case *ParamsFact[U], *FieldFact[U]:
			return true
		}
	}
	return false
}

// Param records parameter i of fn as a tolerance.
func (u *Uses[U]) Param(fn *types.Func, i int, use U) {
	if u.params[fn] == nil {
		u.params[fn] = make(map[int]U)
	}
	u.params[fn][i] = use
}

// Field records a field of this package as a tolerance.
func (u *Uses[U]) Field(field *types.Var, use U) {
	if field.Pkg() == u.pass.Pkg {
		u.fields[field] = use
	}
}

// Forward learns val, handed on as a tolerance of use u, when it names a
// parameter of a function declaration around cur or a field of this
// package; it reports whether that is new.
func (u *Uses[U]) Forward(cur inspector.Cursor, val ast.Expr, use U, known Lookup[U]) bool {
	info := u.pass.TypesInfo
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		val = u.Origin(fd.Node().(*ast.FuncDecl), val) // t := tol, handed on: the parameter is
	}
	if field := FieldOf(info, val); field != nil && field.Pkg() == u.pass.Pkg {
		if _, ok := known.Field(field); !ok {
			u.Field(field, use)
			return true
		}
		return false
	}
	id, ok := ast.Unparen(val).(*ast.Ident)
	if !ok {
		return false
	}
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		if fn, i, ok := ParamOf(info, fd.Node().(*ast.FuncDecl), id); ok {
			if _, seen := known.Params(fn)[i]; !seen {
				u.Param(fn, i, use)
				return true
			}
		}
	}
	return false
}

// Export makes the recorded parameters and fields known to the packages
// importing this one.
func (u *Uses[U]) Export() {
	for fn, ps := range u.params {
		u.pass.ExportObjectFact(fn, &ParamsFact[U]{Params: ps})
	}
	for field, use := range u.fields {
		u.pass.ExportObjectFact(field, &FieldFact[U]{Use: use})
	}
}

// Known reports whether any tolerance is recorded here or known from
// facts: with none, Sites finds nothing, so a walk for sites is skipped.
func (u *Uses[U]) Known() bool {
	return len(u.params) > 0 || len(u.fields) > 0 || u.imported()
}

// Lookup returns the tolerances recorded here, or known from facts.
func (u *Uses[U]) Lookup() Lookup[U] {
	return Lookup[U]{
		Params: func(fn *types.Func) map[int]U {
			if ps, ok := u.params[fn]; ok {
				return ps
			}
			var f ParamsFact[U]
			if u.pass.ImportObjectFact(fn, &f) {
				return f.Params
			}
			return nil
		},
		Field: func(field *types.Var) (U, bool) {
			if use, ok := u.fields[field]; ok {
				return use, true
			}
			var f FieldFact[U]
			ok := u.pass.ImportObjectFact(field, &f)
			return f.Use, ok
		},
	}
}

// DefaultsOf returns the defaulting idioms of a function (see Defaults),
// computed once.
func (u *Uses[U]) DefaultsOf(decl *ast.FuncDecl) map[*types.Var][]ast.Expr {
	d, ok := u.defaulted[decl]
	if !ok {
		d = Defaults(u.pass.TypesInfo, decl.Body)
		u.defaulted[decl] = d
	}
	return d
}

// Origin returns the parameter or field that e, a local variable of decl,
// copies (see Copies), following copies of copies; else e.
func (u *Uses[U]) Origin(decl *ast.FuncDecl, e ast.Expr) ast.Expr {
	c, ok := u.copies[decl]
	if !ok {
		c = Copies(u.pass.TypesInfo, decl.Body)
		u.copies[decl] = c
	}
	for range 4 {
		src, ok := c[VarOf(u.pass.TypesInfo, e)]
		if !ok {
			break
		}
		e = src
	}
	return e
}
