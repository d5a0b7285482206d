package fdstep

import (
	"go/token"
	"go/types"
	"slices"

	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/provenance"
)

// vectorOffsets classifies evaluations of a function of a slice, as in a
// gradient or Jacobian loop, by the element store in effect at each call:
// x[i] = xi + h or x[i] += h (+1), x[i] = xi - h (-1), a restore or no
// store (0). The slices must be one slice, or copies of one another.
func (c *checker) vectorOffsets(q *quotient) bool {
	pos, ok := varying(q.evals)
	if !ok {
		return false
	}
	if pos >= 0 {
		return c.vectorAt(q, pos)
	}
	for i := range q.evals[0].call.Common().Args {
		if c.vectorAt(q, i) {
			return true
		}
	}
	return false
}

// vectorAt classifies the evaluations by their slice argument at pos.
func (c *checker) vectorAt(q *quotient, pos int) bool {
	var h, index ssa.Value
	var bumps []bump
	first := q.evals[0].call.Common().Args[pos]
	for i, e := range q.evals {
		s := e.call.Common().Args[pos]
		if !isRealSlice(s.Type()) || !c.related(first, s) {
			return false
		}
		st := lastElemStore(e.call, s)
		k, step, bp := perturbation(st)
		if k != 0 {
			addr := st.Addr.(*ssa.IndexAddr)
			if h != nil && (!c.sameStep(h, step) || !same(index, addr.Index)) {
				return false
			}
			h, index = step, addr.Index
			bumps = append(bumps, bp)
		}
		q.evals[i].offset = k
	}
	if h == nil {
		return false
	}
	q.h, q.bumps, q.vector = h, bumps, true
	q.x = bumps[0].op.X
	if bumps[0].stepX {
		q.x = bumps[0].op.Y
	}
	return true
}

// related reports whether two slices are one, or one a copy of the other,
// or both copies of a third.
func (c *checker) related(a, b ssa.Value) bool {
	return a == b || c.copies[a] == b || c.copies[b] == a || c.copies[a] != nil && c.copies[a] == c.copies[b]
}

// lastElemStore returns the store into an element of slice s that is in
// effect at call: the last one before it in its block or in the chain of
// blocks with a single predecessor. It returns nil when there is none, or
// when s was overwritten by copy since.
func lastElemStore(call *ssa.Call, s ssa.Value) *ssa.Store {
	b := call.Block()
	i := slices.Index(b.Instrs, ssa.Instruction(call))
	for range 4 {
		for j := i - 1; j >= 0; j-- {
			switch in := b.Instrs[j].(type) {
			case *ssa.Store:
				if ia, ok := in.Addr.(*ssa.IndexAddr); ok && ia.X == s {
					return in
				}
			case *ssa.Call:
				if bi, ok := in.Common().Value.(*ssa.Builtin); ok && bi.Name() == "copy" && in.Common().Args[0] == s {
					return nil // a fresh copy: no element perturbed
				}
			}
		}
		if len(b.Preds) != 1 {
			return nil // the start of the function, or a merge
		}
		b = b.Preds[0]
		i = len(b.Instrs)
	}
	return nil
}

// perturbation returns k, h and the bump when st stores x + k·h into an
// element, x being a load of the same element (of this slice or the one
// it copies); k is 0 for a restore or no store.
func perturbation(st *ssa.Store) (int, ssa.Value, bump) {
	if st == nil {
		return 0, nil, bump{}
	}
	index := st.Addr.(*ssa.IndexAddr).Index
	b, ok := provenance.Strip(st.Val).(*ssa.BinOp)
	switch {
	case !ok:
	case b.Op == token.ADD && elementLoad(b.X, index):
		return 1, b.Y, bump{op: b}
	case b.Op == token.ADD && elementLoad(b.Y, index):
		return 1, b.X, bump{op: b, stepX: true}
	case b.Op == token.SUB && elementLoad(b.X, index):
		return -1, b.Y, bump{op: b}
	}
	return 0, nil, bump{}
}

// elementLoad reports whether v loads element index of some slice.
func elementLoad(v ssa.Value, index ssa.Value) bool {
	load, ok := provenance.Strip(v).(*ssa.UnOp)
	if !ok || load.Op != token.MUL {
		return false
	}
	ia, ok := load.X.(*ssa.IndexAddr)
	return ok && same(ia.Index, index)
}

// isRealSlice reports whether t is a slice of floats.
func isRealSlice(t types.Type) bool {
	s, ok := t.Underlying().(*types.Slice)
	return ok && isReal(s.Elem())
}
