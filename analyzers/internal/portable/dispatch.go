package portable

import (
	"go/types"
	"slices"

	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/provenance"
)

// Interface methods. A function that takes an interface and calls a
// method on it (an interpolation helper given any Interpolator) computes
// out of sight; but where its caller hands it a value of a known concrete
// type, the method that runs is known, and a cause in it is a cause of
// the call. DispatchFact carries, across packages, which methods a
// function invokes on which of its parameters.

// DispatchFact marks a function that invokes methods on interface
// parameters.
type DispatchFact struct{ Calls []Invoked }

// Invoked is a method invoked on parameter Param (the receiver is
// parameter 0 of a method).
type Invoked struct {
	Param  int
	Method string
}

// AFact marks DispatchFact as an analysis fact.
func (*DispatchFact) AFact() {}

func (*DispatchFact) String() string { return "dispatch" }

// invoked lists the methods fn invokes on its own parameters, directly or
// by passing them to functions that do (of this package, read once; of
// another, by fact).
func (j *Judge) invoked(fn *ssa.Function) []Invoked {
	if calls, done := j.invokes[fn]; done {
		return calls
	}
	j.invokes[fn] = nil // a recursive call adds nothing
	var out []Invoked
	add := func(p ssa.Value, method string) {
		if p, ok := provenance.Strip(p).(*ssa.Parameter); ok {
			if inv := (Invoked{slices.Index(fn.Params, p), method}); inv.Param >= 0 && !slices.Contains(out, inv) {
				out = append(out, inv)
			}
		}
	}
	for _, b := range fn.Blocks {
		for _, instr := range b.Instrs {
			call, ok := instr.(ssa.CallInstruction)
			if !ok {
				continue
			}
			if c := call.Common(); c.IsInvoke() {
				add(c.Value, c.Method.Name())
				continue
			}
			for _, inv := range j.calleeInvokes(call.Common()) {
				if inv.Param < len(call.Common().Args) {
					add(call.Common().Args[inv.Param], inv.Method)
				}
			}
		}
	}
	j.invokes[fn] = out
	return out
}

// calleeInvokes lists the methods a static callee invokes on its
// parameters.
func (j *Judge) calleeInvokes(call *ssa.CallCommon) []Invoked {
	fn := call.StaticCallee()
	if fn == nil {
		return nil
	}
	if fn.Origin() != nil {
		fn = fn.Origin()
	}
	if fn.Package() != nil && fn.Package().Pkg == j.pass.Pkg {
		return j.invoked(fn)
	}
	var d DispatchFact
	if obj := fn.Object(); obj != nil && j.pass.ImportObjectFact(obj, &d) {
		return d.Calls
	}
	return nil
}

// dispatched reports whether a method that call's callee invokes on one
// of its parameters shows a cause for the concrete type call passes there;
// calls lists those methods.
func (s *sighting) dispatched(call *ssa.CallCommon, calls []Invoked, depth int) bool {
	for _, inv := range calls {
		if inv.Param < len(call.Args) && s.method(call.Args[inv.Param], inv.Method, depth) {
			return true
		}
	}
	return false
}

// method reports whether the method name of the concrete type v holds
// shows a cause; an interface value's types are known only where it is
// made in sight (see concrete).
func (s *sighting) method(v ssa.Value, name string, depth int) bool {
	t := provenance.Strip(v).Type()
	if !types.IsInterface(t) {
		return s.methodOf(t, name)
	}
	for _, t := range s.j.concrete(v, depth) {
		if s.methodOf(t, name) {
			return true
		}
	}
	return false
}

// methodOf reports whether the method name of type t shows a cause.
func (s *sighting) methodOf(t types.Type, name string) bool {
	ms := s.j.prog().MethodSets.MethodSet(t)
	sel := ms.Lookup(s.j.pass.Pkg, name)
	if sel == nil {
		sel = ms.Lookup(nil, name)
	}
	if sel == nil {
		return false
	}
	m := sel.Obj().(*types.Func)
	if m.Pkg() == s.j.pass.Pkg {
		fn := s.j.prog().FuncValue(m)
		return fn != nil && fn.Blocks != nil && s.j.causedBody(fn)
	}
	return s.j.pass.ImportObjectFact(m, new(CauseFact))
}
