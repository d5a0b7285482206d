package exacteq

import (
	"go/token"

	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/provenance"
)

// spread reports whether v is a spread of data about their computed mean:
// a sum of squared deviations (s += (x-m)*(x-m)) accumulated over a loop,
// that sum divided or scaled (a variance), or its square root (a standard
// deviation), directly or as the result of a function of this package.
// For constant data c the computed mean is off from c by rounding unless
// every partial sum is exact (0.1+0.1+0.1 is 0.30000000000000004, a third
// of it 0.10000000000000002), so the deviations, and the spread, are a
// few ulps of c and rarely 0: a test spread == 0 misses the constant data
// it is meant to catch, and dividing by the residue gives deviations of
// order 1 instead of 0.
func (c *checker) spread(v ssa.Value, depth int) bool {
	if depth == 0 {
		return false
	}
	switch v := provenance.Strip(v).(type) {
	case *ssa.Call:
		if fn := v.Common().StaticCallee(); fn != nil && fn.Pkg != nil && fn.Pkg.Pkg.Path() == "math" {
			return fn.Name() == "Sqrt" && c.spread(v.Common().Args[0], depth-1)
		}
		return c.everyReturn(v.Common(), 0, true, func(r ssa.Value) bool { return c.spread(r, depth-1) })
	case *ssa.Extract:
		call, ok := v.Tuple.(*ssa.Call)
		return ok && c.everyReturn(call.Common(), v.Index, true, func(r ssa.Value) bool { return c.spread(r, depth-1) })
	case *ssa.BinOp:
		return (v.Op == token.QUO || v.Op == token.MUL) && c.spread(v.X, depth-1) ||
			v.Op == token.MUL && c.spread(v.Y, depth-1)
	case *ssa.Phi:
		for _, e := range v.Edges {
			if b, ok := provenance.Strip(e).(*ssa.BinOp); ok && b.Op == token.ADD {
				if t := accumulated(b, v); t != nil && c.squaredDeviation(t) {
					return true
				}
			}
		}
	}
	return false
}

// squaredDeviation reports whether t is (x-m)*(x-m), the two factors the
// same difference (one value, or two with the same operands) of a value
// and a computed mean.
func (c *checker) squaredDeviation(t ssa.Value) bool {
	m, ok := provenance.Strip(t).(*ssa.BinOp)
	if !ok || m.Op != token.MUL {
		return false
	}
	a, oka := provenance.Strip(m.X).(*ssa.BinOp)
	b, okb := provenance.Strip(m.Y).(*ssa.BinOp)
	return oka && okb && a.Op == token.SUB && b.Op == token.SUB &&
		a.X == b.X && a.Y == b.Y && c.track.Computed(a.Y)
}

// isSpecial reports whether v is a constant or math.NaN() or math.Inf(s),
// the answers a function gives for empty or invalid data.
func isSpecial(v ssa.Value) bool {
	switch v := provenance.Strip(v).(type) {
	case *ssa.Const:
		return true
	case *ssa.Call:
		fn := v.Common().StaticCallee()
		return fn != nil && fn.Pkg != nil && fn.Pkg.Pkg.Path() == "math" && (fn.Name() == "NaN" || fn.Name() == "Inf")
	}
	return false
}
