package provenance

import (
	"go/token"
	"go/types"

	"golang.org/x/tools/go/ssa"
)

// StoredField returns the struct field v is loaded from (directly, or as
// an element of a slice or array held in it) when this package stores
// computed floats into that field: running path lengths kept in a distance
// table, costs cached on graph nodes. Such a load carries the rounding
// error of what was stored. It returns nil for anything else.
//
// In _test.go files it always returns nil: a test reading what the code
// under test stored, to compare with its own computation, does so on
// purpose.
func (t *Tracker) StoredField(v ssa.Value) *types.Var {
	v = Strip(v)
	field := loadedField(v)
	if field == nil {
		return nil
	}
	if instr, ok := v.(ssa.Instruction); ok && inTestFile(instr.Parent()) {
		return nil
	}
	if t.fields == nil {
		t.scanStores()
	}
	if !t.fields[field] {
		return nil
	}
	return field
}

// StoredInto reports whether v itself is stored into field: a cache that
// compares a key with the one it keeps does so exactly on purpose.
func StoredInto(v ssa.Value, field *types.Var) bool {
	refs := Strip(v).Referrers()
	if refs == nil {
		return false
	}
	for _, r := range *refs {
		if st, ok := r.(*ssa.Store); ok && addrField(st.Addr) == field {
			return true
		}
	}
	return false
}

// loadedField returns the struct field a load reads, directly or through
// one level of slice or array indexing, or nil.
func loadedField(v ssa.Value) *types.Var {
	switch v := v.(type) {
	case *ssa.UnOp:
		if v.Op == token.MUL {
			return addrField(v.X)
		}
	case *ssa.Field:
		return fieldOf(v.X.Type(), v.Field)
	case *ssa.Index:
		return loadedField(Strip(v.X))
	}
	return nil
}

// addrField returns the field an address points into: &s.f or &s.f[i].
func addrField(addr ssa.Value) *types.Var {
	switch a := addr.(type) {
	case *ssa.FieldAddr:
		return fieldOf(a.X.Type(), a.Field)
	case *ssa.IndexAddr:
		if f := addrField(a.X); f != nil {
			return f // an array field indexed in place
		}
		return loadedField(Strip(a.X)) // a slice loaded from a field
	}
	return nil
}

// fieldOf returns field i of the struct type t or of the struct t points to.
func fieldOf(t types.Type, i int) *types.Var {
	if p, ok := t.Underlying().(*types.Pointer); ok {
		t = p.Elem()
	}
	if s, ok := t.Underlying().(*types.Struct); ok && i < s.NumFields() {
		return s.Field(i)
	}
	return nil
}

// scanStores walks the package once, recording the fields that receive a
// computed float, directly or through a parameter of a package function
// called with a computed argument.
func (t *Tracker) scanStores() {
	t.fields = make(map[*types.Var]bool)
	callers := make(map[*ssa.Function][]*ssa.CallCommon)
	var stores []*ssa.Store
	for _, fn := range t.funcs {
		for _, b := range fn.Blocks {
			for _, instr := range b.Instrs {
				switch instr := instr.(type) {
				case *ssa.Store:
					if IsFloat(instr.Val.Type()) && addrField(instr.Addr) != nil {
						stores = append(stores, instr)
					}
				case ssa.CallInstruction:
					if callee := instr.Common().StaticCallee(); callee != nil && callee.Package() == t.pkg {
						callers[callee] = append(callers[callee], instr.Common())
					}
				}
			}
		}
	}
	for _, st := range stores {
		if t.carries(st.Val, callers) {
			t.fields[addrField(st.Addr)] = true
		}
	}
}

// carries reports whether a stored value carries rounding error: it is
// computed, a parameter filled with a computed argument, or a selection
// (math.Min, Max, Abs) among such values.
func (t *Tracker) carries(v ssa.Value, callers map[*ssa.Function][]*ssa.CallCommon) bool {
	v = Strip(v)
	if t.Computed(v) || paramComputed(t, v, callers) {
		return true
	}
	call, ok := v.(*ssa.Call)
	if !ok || MathRounding(call.Common()) != Exact || !selections[call.Common().StaticCallee().Name()] {
		return false
	}
	for _, a := range call.Common().Args {
		if t.Computed(a) || paramComputed(t, Strip(a), callers) {
			return true
		}
	}
	return false
}

// selections are the exact math functions that return one of their
// arguments, or its magnitude.
var selections = map[string]bool{"Min": true, "Max": true, "Abs": true}

// paramComputed reports whether v is a parameter that some call in the
// package fills with a computed value.
func paramComputed(t *Tracker, v ssa.Value, callers map[*ssa.Function][]*ssa.CallCommon) bool {
	p, ok := v.(*ssa.Parameter)
	if !ok {
		return false
	}
	fn := p.Parent()
	i := 0
	for i < len(fn.Params) && fn.Params[i] != p {
		i++
	}
	for _, c := range callers[fn] {
		args := c.Args
		if c.IsInvoke() {
			continue
		}
		if i < len(args) && t.Computed(args[i]) {
			return true
		}
	}
	return false
}
