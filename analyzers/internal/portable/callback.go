package portable

import (
	"go/token"
	"go/types"
	"slices"

	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/provenance"
)

// Callbacks. A function that hands the values it computes to a function
// it is given (g.Rank(0.85, tol, func(id int, r float64) { got[id] = r }))
// computes them out of the closure's sight but not out of the package's:
// the closure's parameters hold what the function passes at its calls of
// that parameter, directly or through wrappers, and a cause there is a
// cause of what the closure stores. A map is searched through the values
// it is updated with, also where a closure that captures it updates it.

// CallbackCauseFact marks a function that passes a value showing a cause
// to a function it is given; Params lists the indices of those parameters
// (the receiver first, for a method).
type CallbackCauseFact struct{ Params []int }

// AFact marks CallbackCauseFact as an analysis fact.
func (*CallbackCauseFact) AFact() {}

func (*CallbackCauseFact) String() string { return "callback cause" }

// passed reports whether what a closure's callers pass as its parameter p
// shows a cause.
func (s *sighting) passed(p *ssa.Parameter, depth int) bool {
	fn := p.Parent()
	i := slices.Index(fn.Params, p)
	if fn.Parent() == nil || i < 0 || fn.Referrers() == nil {
		return false // a declared function's parameters are its callers' inputs
	}
	for _, r := range *fn.Referrers() {
		f := ssa.Value(fn)
		if mc, ok := r.(*ssa.MakeClosure); ok && mc.Fn == fn {
			f = mc
		}
		if s.handed(f, i, depth) {
			return true
		}
	}
	return false
}

// handed reports whether function value f, where it is called, or in the
// functions of this package it is handed to, is passed as argument i a
// value that shows a cause; of a function of another package, its fact
// tells. Each f and i is searched once.
func (s *sighting) handed(f ssa.Value, i, depth int) bool {
	if depth <= 0 || f.Referrers() == nil {
		return false
	}
	key := handedKey{f, i}
	c, done := s.j.handed[key]
	if !done {
		s.j.handed[key] = false // a callback handed around a cycle is searched by the rest
		c = s.handedOnce(f, i, depth)
		s.j.handed[key] = c
	}
	return c
}

// handedKey names a function value and the index of one of its parameters.
type handedKey struct {
	f ssa.Value
	i int
}

func (s *sighting) handedOnce(f ssa.Value, i, depth int) bool {
	for _, r := range *f.Referrers() {
		call, ok := r.(ssa.CallInstruction)
		if !ok {
			continue
		}
		c := call.Common()
		if c.Value == f && !c.IsInvoke() {
			if i < len(c.Args) && s.value(c.Args[i], depth-1) {
				return true
			}
			continue
		}
		if k := slices.Index(c.Args, f); k >= 0 && s.callsBack(c, k, i, depth-1) {
			return true
		}
	}
	return false
}

// callsBack reports whether the static callee of c, given a function as
// argument k, passes it a value that shows a cause (as argument i, for a
// callee read here).
func (s *sighting) callsBack(c *ssa.CallCommon, k, i, depth int) bool {
	fn := c.StaticCallee()
	if fn == nil {
		return false // out of sight
	}
	if fn.Origin() != nil {
		fn = fn.Origin()
	}
	if fn.Package() != nil && fn.Package().Pkg == s.j.pass.Pkg {
		return fn.Blocks != nil && k < len(fn.Params) && s.handed(fn.Params[k], i, depth)
	}
	var fact CallbackCauseFact
	obj := fn.Object()
	return obj != nil && s.j.pass.ImportObjectFact(obj, &fact) && slices.Contains(fact.Params, k)
}

// callbackCauses lists the parameters of fn, functions taking floats, that
// fn passes a value showing a cause.
func (j *Judge) callbackCauses(fn *ssa.Function) []int {
	var out []int
	for k, p := range fn.Params {
		sig, ok := p.Type().Underlying().(*types.Signature)
		if !ok {
			continue
		}
		s := &sighting{j, map[ssa.Value]bool{}}
		for i := range sig.Params().Len() {
			if provenance.HoldsFloat(sig.Params().At(i).Type(), true) && s.handed(p, i, maxDepth) {
				out = append(out, k)
				break
			}
		}
	}
	return out
}

// mapped reports whether a map is updated with a float that shows a
// cause, itself or through a closure that captures it.
func (s *sighting) mapped(m ssa.Value, depth int) bool {
	if depth <= 0 || m.Referrers() == nil {
		return false
	}
	for _, r := range *m.Referrers() {
		switch r := r.(type) {
		case *ssa.MapUpdate:
			if r.Map == m && provenance.HoldsFloat(r.Value.Type(), false) && s.value(r.Value, depth-1) {
				return true
			}
		case *ssa.MakeClosure:
			if fv := captured(r, m); fv != nil && s.mapped(fv, depth-1) {
				return true
			}
		}
	}
	return false
}

// captured returns the free variable through which closure mc sees v.
func captured(mc *ssa.MakeClosure, v ssa.Value) *ssa.FreeVar {
	i := slices.Index(mc.Bindings, v)
	if i < 0 {
		return nil
	}
	return mc.Fn.(*ssa.Function).FreeVars[i]
}

// isMap reports whether t is a map type.
func isMap(t types.Type) bool {
	_, ok := t.Underlying().(*types.Map)
	return ok
}

// loadedMap reports whether r loads a map from an address.
func loadedMap(r ssa.Instruction) (*ssa.UnOp, bool) {
	u, ok := r.(*ssa.UnOp)
	return u, ok && u.Op == token.MUL && isMap(u.Type())
}

// appended returns the call of the builtin append that v is.
func appended(v ssa.Value) (*ssa.CallCommon, bool) {
	call, ok := v.(*ssa.Call)
	if !ok {
		return nil, false
	}
	b, ok := call.Common().Value.(*ssa.Builtin)
	return call.Common(), ok && b.Name() == "append"
}
