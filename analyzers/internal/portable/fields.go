package portable

import (
	"go/token"
	"go/types"
	"strings"

	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/lazyssa"
	"roundoff/analyzers/internal/provenance"
)

// State. A method that returns a field (s.Mean() returning s.mean, or its
// bits read back by atomic.LoadUint64 and math.Float64frombits) returns
// whatever the package last stored there: the value a test compares was
// computed by the methods it called first (Add, Tick), not by the getter.
// So a read of a field of a struct this package declares, through a
// pointer, is judged by the values the package stores into that field:
// portable when every one is, with a cause when one shows a cause. A
// field no function stores into holds what the caller put there, an
// input. An interface value made in
// sight (a constructor that returns &T{} behind an interface, directly or
// through another constructor of the package) has the concrete types it
// is made from, whose methods are then known.

// readField returns the field of a struct of this package that v reads
// through a pointer: a load of the field's address or an atomic load of it
// (atomic.LoadUint64(&s.bits)) of a pointer the function is given; else
// nil. A field of a struct value, or of a variable of the function, holds
// what the function put there, which the search follows; only through a
// pointer given to it can a method called in between change it.
func (j *Judge) readField(v ssa.Value) *types.Var {
	var addr ssa.Value
	switch v := v.(type) {
	case *ssa.UnOp:
		if v.Op == token.MUL {
			addr = v.X
		}
	case *ssa.Call:
		if atomicCall(v.Common(), "Load") {
			addr = v.Common().Args[0]
		}
	}
	if fa, ok := addr.(*ssa.FieldAddr); ok {
		if _, local := fa.X.(*ssa.Alloc); !local {
			return j.fieldAt(fa)
		}
	}
	return nil
}

// fieldAt returns the field of a struct of this package whose address addr
// is, else nil.
func (j *Judge) fieldAt(addr ssa.Value) *types.Var {
	fa, ok := addr.(*ssa.FieldAddr)
	if !ok {
		return nil
	}
	p, ok := fa.X.Type().Underlying().(*types.Pointer)
	if !ok {
		return nil
	}
	return j.own(structOf(p.Elem()), fa.Field)
}

// own returns field i of s when s is declared in this package.
func (j *Judge) own(s *types.Struct, i int) *types.Var {
	if s == nil || i >= s.NumFields() || s.Field(i).Pkg() != j.pass.Pkg {
		return nil
	}
	return s.Field(i)
}

func structOf(t types.Type) *types.Struct {
	s, _ := t.Underlying().(*types.Struct)
	return s
}

// atomicCall reports whether c calls a sync/atomic function whose name
// starts with op (LoadUint64, StoreUint64, SwapUint64...).
func atomicCall(c *ssa.CallCommon, op string) bool {
	fn := c.StaticCallee()
	return fn != nil && fn.Pkg != nil && fn.Pkg.Pkg.Path() == "sync/atomic" && fn.Signature.Recv() == nil && strings.HasPrefix(fn.Name(), op) && len(c.Args) > 0
}

// stores returns the values the package stores into field f: by
// assignment (also in a composite literal) or by an atomic store or swap.
// The index is built once.
func (j *Judge) stores(f *types.Var) []ssa.Value {
	if j.stored == nil {
		j.stored = map[*types.Var][]ssa.Value{}
		for _, fn := range j.pass.ResultOf[lazyssa.Analyzer].(*lazyssa.Lazy).SSA().SrcFuncs {
			for _, b := range fn.Blocks {
				for _, instr := range b.Instrs {
					j.indexStore(instr)
				}
			}
		}
	}
	return j.stored[f]
}

// indexStore records the value instr stores into a field of this package.
func (j *Judge) indexStore(instr ssa.Instruction) {
	var addr, val ssa.Value
	switch instr := instr.(type) {
	case *ssa.Store:
		addr, val = instr.Addr, instr.Val
	case *ssa.Call:
		c := instr.Common()
		if (atomicCall(c, "Store") || atomicCall(c, "Swap")) && len(c.Args) == 2 {
			addr, val = c.Args[0], c.Args[1]
		}
	}
	if f := j.fieldAt(addr); f != nil {
		j.stored[f] = append(j.stored[f], val)
	}
}

// concrete returns the concrete types the interface value v can hold when
// every way it is made is in sight: a conversion of a concrete value, a
// merge of such values, or the result of a function of this package every
// return of which is one; else nil.
func (j *Judge) concrete(v ssa.Value, depth int) []types.Type {
	if depth <= 0 {
		return nil
	}
	switch x := v.(type) {
	case *ssa.MakeInterface:
		return []types.Type{x.X.Type()}
	case *ssa.ChangeType:
		return j.concrete(x.X, depth-1)
	case *ssa.Phi:
		var out []types.Type
		for _, e := range x.Edges {
			ts := j.concrete(e, depth-1)
			if ts == nil {
				return nil
			}
			out = append(out, ts...)
		}
		return out
	case *ssa.Call:
		fn := x.Common().StaticCallee()
		if fn == nil || fn.Blocks == nil || fn.Package() == nil || fn.Package().Pkg != j.pass.Pkg || fn.Signature.Results().Len() != 1 {
			return nil
		}
		var out []types.Type
		for ret := range provenance.Returns(fn) {
			ts := j.concrete(ret.Results[0], depth-1)
			if ts == nil {
				return nil
			}
			out = append(out, ts...)
		}
		return out
	}
	return nil
}

// storedPortable reports whether every value the package stores into the
// field v reads is portable (true when v reads no field of this package).
func (w *walk) storedPortable(v ssa.Value, depth int) bool {
	if f := w.j.readField(v); f != nil {
		for _, s := range w.j.stores(f) {
			if !w.value(s, depth-1) {
				return false
			}
		}
	}
	return true
}

// storedCause reports whether a value the package stores into the field v
// reads shows a cause.
func (s *sighting) storedCause(v ssa.Value, depth int) bool {
	if f := s.j.readField(v); f != nil {
		for _, st := range s.j.stores(f) {
			if s.value(st, depth-1) {
				return true
			}
		}
	}
	return false
}
