// Package absval defines an infrastructure Analyzer that learns which
// functions compute an absolute value, by what they do rather than by their
// name: math.Abs; a function of one float parameter returning the same type
// whose body branches and negates (if x < 0 { return -x }), takes
// math.Max(x, -x), clears the sign bit (Float64frombits(Float64bits(x) &^
// (1<<63)), with any float-to-bits helpers of matching width), or calls
// another absolute value (float32(math.Abs(float64(x)))). The float32 Abs of
// a math library, imported under any name, and a package's own abs helper
// are so recognised once, exported as a fact, and known to every importer.
// Variables never reassigned that hold such a function (abs := math.Abs,
// abs := func(x float64) float64 {...}) count too.
//
// Analyzers ask one question, through Known.Arg: is this call an absolute
// value, and of what? The per-package work is a look at the top-level
// declarations whose signature fits: cheap enough to run on every
// dependency.
package absval

import (
	"go/ast"
	"go/token"
	"go/types"
	"reflect"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/provenance"
)

// Analyzer learns the absolute-value functions of a package.
var Analyzer = &analysis.Analyzer{
	Name:       "absval",
	Doc:        "absval: learn which functions compute an absolute value",
	Run:        run,
	ResultType: reflect.TypeFor[*Known](),
	FactTypes:  []analysis.Fact{new(Fact)},
}

// Fact marks a function (or a package variable holding one) that computes
// the absolute value of its float argument.
type Fact struct{}

// AFact marks Fact as an analysis fact.
func (*Fact) AFact() {}

func (*Fact) String() string { return "absolute value" }

// Known holds the absolute-value functions of one package and reads those
// of its imports from facts. A nil *Known knows math.Abs and the variables
// bound to it.
type Known struct {
	pass  *analysis.Pass
	local map[types.Object]bool
}

// Of returns the Known result of pass's package; the pass's analyzer must
// require Analyzer.
func Of(pass *analysis.Pass) *Known { return pass.ResultOf[Analyzer].(*Known) }

func run(pass *analysis.Pass) (any, error) {
	k := &Known{pass: pass, local: make(map[types.Object]bool)}
	var funcs []*ast.FuncDecl
	var vars []*ast.ValueSpec
	for _, f := range pass.Files {
		for _, d := range f.Decls {
			switch d := d.(type) {
			case *ast.FuncDecl:
				if d.Body != nil && oneFloat(pass.TypesInfo.Defs[d.Name]) {
					funcs = append(funcs, d)
				}
			case *ast.GenDecl:
				if d.Tok == token.VAR {
					for _, s := range d.Specs {
						vars = append(vars, s.(*ast.ValueSpec))
					}
				}
			}
		}
	}
	// Helpers calling helpers: repeat until nothing new is learned.
	for changed := true; changed; {
		changed = false
		for _, fd := range funcs {
			obj := pass.TypesInfo.Defs[fd.Name]
			if !k.local[obj] && k.body(pass.TypesInfo, nil, fd.Type, fd.Body) {
				k.local[obj], changed = true, true
			}
		}
	}
	for _, s := range vars {
		for i, name := range s.Names {
			if i < len(s.Values) && k.funcValue(pass.TypesInfo, nil, s.Values[i], 4) {
				k.local[pass.TypesInfo.Defs[name]] = true
			}
		}
	}
	for obj := range k.local {
		pass.ExportObjectFact(obj, new(Fact))
	}
	return k, nil
}

// oneFloat reports whether obj is a function of one float parameter
// returning the same type.
func oneFloat(obj types.Object) bool {
	fn, ok := obj.(*types.Func)
	if !ok {
		return false
	}
	return sigOneFloat(fn.Signature())
}

func sigOneFloat(sig *types.Signature) bool {
	p, r := sig.Params(), sig.Results()
	return p.Len() == 1 && r.Len() == 1 && isReal(p.At(0).Type()) && types.Identical(p.At(0).Type(), r.At(0).Type())
}

// isReal reports whether t is a real floating-point type.
func isReal(t types.Type) bool {
	b, ok := t.Underlying().(*types.Basic)
	if !ok {
		return provenance.IsFloat(t) // a type parameter over floats
	}
	return b.Info()&types.IsFloat != 0
}

// Is reports whether obj, a function or a variable holding one, computes an
// absolute value.
func (k *Known) Is(obj types.Object) bool {
	if isMath(obj, "Abs") {
		return true
	}
	if k == nil || obj == nil {
		return false
	}
	if k.local[obj] {
		return true
	}
	return obj.Pkg() != k.pass.Pkg && k.pass.ImportObjectFact(obj, new(Fact))
}

// Arg returns x when call computes |x|: a call of an absolute-value
// function, or of a variable bound once to one (decls, from constval,
// maps such variables to their initialisers).
func (k *Known) Arg(info *types.Info, decls map[types.Object]ast.Expr, call *ast.CallExpr) (ast.Expr, bool) {
	if len(call.Args) != 1 || !k.funcValue(info, decls, call.Fun, 4) {
		return nil, false
	}
	return call.Args[0], true
}

// funcValue reports whether e denotes an absolute-value function: a name
// of one, a variable bound once to one, or a function literal computing one.
func (k *Known) funcValue(info *types.Info, decls map[types.Object]ast.Expr, e ast.Expr, depth int) bool {
	switch e := ast.Unparen(e).(type) {
	case *ast.FuncLit:
		return sigOneFloat(info.TypeOf(e).(*types.Signature)) && k.body(info, decls, e.Type, e.Body)
	case *ast.IndexExpr: // an instantiation: abs[float64]
		return k.funcValue(info, decls, e.X, depth)
	}
	obj := typeutil.Callee(info, &ast.CallExpr{Fun: e})
	if k.Is(obj) {
		return true
	}
	init, ok := decls[obj]
	return ok && depth > 0 && k.funcValue(info, decls, init, depth-1)
}

// body reports whether a function body of type ft, with one float
// parameter, returns its absolute value.
func (k *Known) body(info *types.Info, decls map[types.Object]ast.Expr, ft *ast.FuncType, body *ast.BlockStmt) bool {
	if len(ft.Params.List) != 1 || len(ft.Params.List[0].Names) != 1 {
		return false
	}
	p := info.Defs[ft.Params.List[0].Names[0]]
	m := matcher{k: k, info: info, decls: decls, p: p}
	return p != nil && m.stmts(body.List)
}
