// Package portable defines an infrastructure Analyzer that learns which
// functions compute their floating-point results the same way, bit for
// bit, on every platform, and carries that knowledge across packages as a
// fact.
//
// IEEE 754-2019 §4.3 and §5.4 fix the results of +, -, *, / and square
// root: each is the exact result correctly rounded, the same everywhere.
// Two things make a result differ between platforms. The Go specification
// ("Arithmetic operators") lets an implementation fuse x*y + z into one
// rounding, even across statements, unless an explicit conversion
// float64(x*y) rounds the product first; arm64, ppc64le, s390x, riscv64
// and amd64 at GOAMD64=v3 do fuse. And the math library's other functions
// (Sin, Exp, Log, Pow, Hypot...) are not correctly rounded: assembly
// kernels on some architectures and fused operations in the pure-Go ones
// may change their last bits. A value is portable when it is built from
// constants, parameters and loads by + - * / on operands none of which is
// a product added to or subtracted from another value (a product divided
// before it is added cannot fuse, and a product by a constant power of two
// is exact, so fusing it changes nothing), by math.Sqrt and the exact math
// functions (Abs, Floor, Trunc, Mod, Copysign...), and by calls of
// functions that are themselves portable; a call through an interface or
// a function value is unknown, hence not portable. Where a caller hands a
// function a value of a concrete type in place of an interface parameter,
// the methods it invokes on that parameter (directly or through functions
// it passes the parameter to; DispatchFact across packages) are known,
// and a cause in them is a cause of the call (dispatch.go). A closure's
// parameters hold what its callers pass them: where a function of the
// package is handed the closure and calls it, directly or through
// wrappers, those values are searched (CallbackCauseFact across
// packages), and a map or slice the closure fills (m[k] = v, s =
// append(s, v)) holds them (callback.go). A field read
// through a pointer is judged by what the package stores into it, and an
// interface value a constructor of the package makes has the concrete
// types it is made from (fields.go).
//
// Judge.OnInputs reads a value further, on the inputs its function gives
// the calls it makes (exact.go): a product added to another value is
// portable when its operands, as the call site gives them, make it exact,
// since fusedMultiplyAdd rounds x*y + z once (IEEE 754-2019 §5.4.1) and
// for an exact x*y that is the rounding of the separate addition; and
// math.Pow of such a value to a whole constant power is portable when its
// result is representable.
//
// Judge.Cause tells the values that are not portable apart (cause.go):
// those whose computation shows a fusable product or a math function that
// is not correctly rounded, and those that leave sight (an interface
// method, a function value) before any such cause shows. Functions whose
// results show a cause carry CauseFact across packages. Judge.InputCause
// asks the same of what a function computes from its arguments (a check
// helper), and InputCauseFact carries that across packages; a call that
// stores such a value through a slice or pointer it is given fills it
// (FillCauseFact), and what it fills shows that cause (inputs.go).
//
// The per-package work is done only where a package declares a function
// with float results, and never for the standard library, whose math
// functions are judged from a table.
package portable

import (
	"go/ast"
	"go/token"
	"go/types"
	"reflect"
	"sync"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/passes/inspect"
	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/lazyssa"
	"roundoff/analyzers/internal/provenance"
)

// Analyzer learns the portable functions of a package.
var Analyzer = &analysis.Analyzer{
	Name:       "portable",
	Doc:        "portable: learn which functions compute their float results the same way on every platform",
	Requires:   []*analysis.Analyzer{inspect.Analyzer, lazyssa.Analyzer},
	Run:        run,
	ResultType: reflect.TypeFor[*Judge](),
	FactTypes:  []analysis.Fact{new(Fact), new(CauseFact), new(DispatchFact), new(InputCauseFact), new(FillCauseFact), new(CallbackCauseFact)},
}

// Fact marks a function whose float results are portable.
type Fact struct{}

// AFact marks Fact as an analysis fact.
func (*Fact) AFact() {}

func (*Fact) String() string { return "portable" }

// Judge decides whether values of one package are portable.
type Judge struct {
	mu         sync.Mutex // analyzers that require this one may ask from several goroutines at once
	pass       *analysis.Pass
	converted  map[token.Pos]bool // products written inside float64(...), by operator position
	bodies     map[*ssa.Function]bool
	causes     map[*ssa.Function]bool // functions searched for a cause
	fromParams map[*ssa.Function]bool // functions searched for a cause in what they compute from their parameters (inputs.go)
	fillers    map[*ssa.Function]bool // functions searched for a cause in what they store through their parameters (inputs.go)
	invokes    map[*ssa.Function][]Invoked
	handed     map[handedKey]bool         // function values searched for a cause in what they are passed (callback.go)
	stored     map[*types.Var][]ssa.Value // values stored into the package's fields (fields.go)
}

// prog returns the SSA program of the package.
func (j *Judge) prog() *ssa.Program {
	return j.pass.ResultOf[lazyssa.Analyzer].(*lazyssa.Lazy).SSA().Pkg.Prog
}

// Of returns the Judge of pass's package; the pass's analyzer must require
// Analyzer.
func Of(pass *analysis.Pass) *Judge { return pass.ResultOf[Analyzer].(*Judge) }

func run(pass *analysis.Pass) (any, error) {
	j := &Judge{pass: pass, bodies: map[*ssa.Function]bool{}, causes: map[*ssa.Function]bool{}, fromParams: map[*ssa.Function]bool{}, fillers: map[*ssa.Function]bool{}, invokes: map[*ssa.Function][]Invoked{}, handed: map[handedKey]bool{}}
	if len(pass.Files) == 0 || provenance.InStd(pass.Fset, pass.Files[0].Pos(), pass.Pkg) || !declaresFloatFunc(pass) {
		return j, nil // nothing to learn: no fact to export
	}
	for _, fn := range pass.ResultOf[lazyssa.Analyzer].(*lazyssa.Lazy).SSA().SrcFuncs {
		obj, ok := fn.Object().(*types.Func)
		if !ok || fn.Blocks == nil || fn.TypeParams().Len() != 0 {
			continue
		}
		switch calls := j.invoked(fn); {
		case j.Body(fn):
			pass.ExportObjectFact(obj, new(Fact))
		case j.causedBody(fn):
			pass.ExportObjectFact(obj, new(CauseFact))
		case len(calls) > 0:
			pass.ExportObjectFact(obj, &DispatchFact{calls})
		}
		if !obj.Exported() {
			continue // read in this package on demand (inputs.go)
		}
		floats, refs := floatParams(fn)
		if floats && j.paramCause(fn, maxDepth) {
			pass.ExportObjectFact(obj, new(InputCauseFact))
		}
		if refs && j.storesCause(fn, maxDepth) {
			pass.ExportObjectFact(obj, new(FillCauseFact))
		}
		if ks := j.callbackCauses(fn); len(ks) > 0 {
			pass.ExportObjectFact(obj, &CallbackCauseFact{ks})
		}
	}
	return j, nil
}

// declaresFloatFunc reports whether the package declares a function or
// method with a float among its results, or one that hands floats to a
// function it is given. A package without one (a checking helper that
// only compares what it is given) builds no SSA: its functions carry no
// fact, and claim nothing.
func declaresFloatFunc(pass *analysis.Pass) bool {
	for _, f := range pass.Files {
		for _, d := range f.Decls {
			fd, ok := d.(*ast.FuncDecl)
			if !ok || fd.Body == nil {
				continue
			}
			if fn, ok := pass.TypesInfo.Defs[fd.Name].(*types.Func); ok && (holdsFloat(fn.Signature().Results()) || floatCallback(fn.Signature())) {
				return true
			}
		}
	}
	return false
}

// floatCallback reports whether sig has a parameter of function type that
// takes floats.
func floatCallback(sig *types.Signature) bool {
	for p := range sig.Params().Variables() {
		if cb, ok := p.Type().Underlying().(*types.Signature); ok && holdsFloat(cb.Params()) {
			return true
		}
	}
	return false
}

// holdsFloat reports whether a tuple has a float, or a struct, array or
// slice of floats, among its members.
func holdsFloat(t *types.Tuple) bool {
	for v := range t.Variables() {
		if provenance.HoldsFloat(v.Type(), true) {
			return true
		}
	}
	return false
}

// floatParams reports whether fn has a parameter (its receiver included)
// holding floats, and one holding them through a reference it could
// store into: without the first nothing it computes comes from floats it
// is given, without the second it fills nothing.
func floatParams(fn *ssa.Function) (floats, refs bool) {
	for _, p := range fn.Params {
		if provenance.HoldsFloat(p.Type(), true) {
			floats = true
			refs = refs || !provenance.HoldsFloat(p.Type(), false)
		}
	}
	return floats, refs
}
