package portable

import (
	"go/token"
	"go/types"
	"slices"

	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/provenance"
)

// What a function computes from what it is given. A check that a test
// hands its values to computes from its arguments; a cause among those
// computations (a sum
// with a product a platform may fuse, a math function that is not
// correctly rounded, with an operand derived from a parameter) can change
// the bits of what it compares or stores between platforms. The search
// follows the parameters forward through the function and through the
// functions of the package it hands them to; a function of another
// package carries the answer as InputCauseFact. Computations on other
// values (a message formatted, a counter of its own) are no such cause,
// and a call out of sight (an interface method, a function value) claims
// nothing.

// InputCauseFact marks a function that shows a cause in what it computes
// from its parameters.
type InputCauseFact struct{}

// AFact marks InputCauseFact as an analysis fact.
func (*InputCauseFact) AFact() {}

func (*InputCauseFact) String() string { return "input cause" }

// InputCause reports whether the function call names shows a cause in
// what it computes from the arguments it is given.
func (j *Judge) InputCause(call *ssa.CallCommon) bool {
	j.mu.Lock()
	defer j.mu.Unlock()
	return j.inputCause(call, maxDepth)
}

func (j *Judge) inputCause(call *ssa.CallCommon, depth int) bool {
	if depth <= 0 || readOnly(call) {
		return false
	}
	if provenance.MathRounding(call) != provenance.NotMath {
		return Libm(call) && !wholePow(call)
	}
	fn := call.StaticCallee()
	if fn == nil {
		return false // out of sight
	}
	if fn.Origin() != nil {
		fn = fn.Origin()
	}
	if fn.Package() != nil && fn.Package().Pkg == j.pass.Pkg {
		return fn.Blocks != nil && j.paramCause(fn, depth)
	}
	obj := fn.Object()
	return obj != nil && j.pass.ImportObjectFact(obj, new(InputCauseFact))
}

// paramCause reports whether fn, a function of this package, shows a
// cause in what it computes from its parameters, searched once.
func (j *Judge) paramCause(fn *ssa.Function, depth int) bool {
	c, done := j.fromParams[fn]
	if !done {
		j.fromParams[fn] = false // a recursive call is searched by the rest of the body
		seen := map[ssa.Value]bool{}
		c = slices.ContainsFunc(fn.Params, func(p *ssa.Parameter) bool { return j.forward(p, seen, depth) })
		j.fromParams[fn] = c
	}
	return c
}

// forward reports whether a value computed from v shows a cause: a float
// sum of a fusable product, or a call that shows one in what it computes
// from its arguments. What v is stored into is followed to its loads.
func (j *Judge) forward(v ssa.Value, seen map[ssa.Value]bool, depth int) bool {
	if seen[v] || v.Referrers() == nil {
		return false
	}
	seen[v] = true
	fusable := j.walk(nil).fusable
	for _, r := range *v.Referrers() {
		switch r := r.(type) {
		case *ssa.BinOp:
			if (r.Op == token.ADD || r.Op == token.SUB) && provenance.IsFloat(r.Type()) && (fusable(r.X) || fusable(r.Y)) {
				return true
			}
		case ssa.CallInstruction:
			if _, builtin := r.Common().Value.(*ssa.Builtin); !builtin && r.Common().Value != v && j.inputCause(r.Common(), depth-1) {
				return true
			}
		case *ssa.Store:
			if r.Val == v && j.forward(r.Addr, seen, depth) {
				return true
			}
		}
		if rv, ok := r.(ssa.Value); ok && j.forward(rv, seen, depth) {
			return true
		}
	}
	return false
}

// filled reports whether ref, a slice or array, or a view of it (a slice
// of it, a conversion), is handed to a call that stores through it a
// value that shows a cause (fills: scale(v, 8) before v is checked). A
// call that only reads what it is given, a check among them, stores
// nothing there, whatever it computes. A struct is not searched so: its
// fields are followed to their stores one by one (fields.go), and a
// method that caches a sum in one field says nothing of another.
func (j *Judge) filled(ref ssa.Value, depth int) bool {
	if depth <= 0 || ref.Referrers() == nil || !elements(ref.Type()) {
		return false
	}
	for _, r := range *ref.Referrers() {
		switch r := r.(type) {
		case *ssa.Call:
			if j.fills(r.Common(), ref, depth) {
				return true
			}
		case *ssa.Slice, *ssa.ChangeType, *ssa.Convert:
			if j.filled(r.(ssa.Value), depth-1) {
				return true
			}
		}
	}
	return false
}

// FillCauseFact marks a function that stores through one of its
// parameters (a slice, a pointer, a field of either) a value that shows a
// cause.
type FillCauseFact struct{}

// AFact marks FillCauseFact as an analysis fact.
func (*FillCauseFact) AFact() {}

func (*FillCauseFact) String() string { return "fill cause" }

// fills reports whether call is given ref and stores a value that shows a
// cause through one of its parameters.
func (j *Judge) fills(call *ssa.CallCommon, ref ssa.Value, depth int) bool {
	if depth <= 0 || readOnly(call) || !slices.Contains(call.Args, ref) {
		return false
	}
	fn := call.StaticCallee()
	if fn == nil {
		return false // out of sight
	}
	if fn.Origin() != nil {
		fn = fn.Origin()
	}
	if fn.Package() != nil && fn.Package().Pkg == j.pass.Pkg {
		return fn.Blocks != nil && j.storesCause(fn, depth-1)
	}
	obj := fn.Object()
	return obj != nil && j.pass.ImportObjectFact(obj, new(FillCauseFact))
}

// storesCause reports whether fn, a function of this package, stores
// through one of its parameters a value that shows a cause, itself or by
// handing the parameter to a call that does; searched once.
func (j *Judge) storesCause(fn *ssa.Function, depth int) bool {
	c, done := j.fillers[fn]
	if done {
		return c
	}
	j.fillers[fn] = false // a recursive call is searched by the rest of the body
	s := &sighting{j, map[ssa.Value]bool{}}
	for _, b := range fn.Blocks {
		for _, instr := range b.Instrs {
			switch in := instr.(type) {
			case *ssa.Store:
				c = provenance.HoldsFloat(in.Val.Type(), false) && fromParam(in.Addr) && s.value(in.Val, depth)
			case *ssa.Call:
				c = slices.ContainsFunc(in.Common().Args, func(a ssa.Value) bool { return fromParam(a) && j.fills(in.Common(), a, depth) })
			}
			if c {
				j.fillers[fn] = true
				return true
			}
		}
	}
	return false
}

// fromParam reports whether addr is reached from a parameter through
// fields, elements, slices and loads (o.data[i] with o a parameter).
func fromParam(addr ssa.Value) bool {
	_, ok := addrRoot(addr, true).(*ssa.Parameter)
	return ok
}

// elements reports whether t is a slice or an array, or a pointer to one.
func elements(t types.Type) bool {
	if p, ok := t.Underlying().(*types.Pointer); ok {
		t = p.Elem()
	}
	switch t.Underlying().(type) {
	case *types.Slice, *types.Array:
		return true
	}
	return false
}
