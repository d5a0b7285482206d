package exacteq

import (
	"fmt"
	"go/token"
	"go/types"
	"strings"

	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/provenance"
)

// recordStore keeps a float value the package stores into a struct field.
func (c *checker) recordStore(st *ssa.Store) {
	if f := provenance.AddrField(st.Addr); f != nil && provenance.IsFloat(st.Val.Type()) {
		c.storedVals[f] = append(c.storedVals[f], st.Val)
	}
}

// sameForm reports whether x is written the way a value the package stores
// into field is (rhs = math.Min(rhs, w + n.g) and later rhs == w + n.g):
// the same additions, subtractions and divisions of the same kinds of
// operands, with no product that could be fused into one rounding at one
// site and not at the other. The same operations on the same operands give
// the same bits (IEEE 754-2019 §4.3), so the test asks whether the field
// was set from these operands: an identity test, which rounding cannot
// mislead.
func (c *checker) sameForm(x ssa.Value, field *types.Var) bool {
	fx := form(x, 6)
	if !strings.HasPrefix(fx, "(") || !strings.Contains(fx, "field") {
		return false // no arithmetic, or no field to anchor the operands
	}
	for _, s := range c.storedVals[field] {
		for _, cand := range selected(s, 3) {
			if form(cand, 6) == fx {
				return true
			}
		}
	}
	return false
}

// selected returns v, or when v is math.Min or math.Max of values, those
// values (the result is one of them, unrounded).
func selected(v ssa.Value, depth int) []ssa.Value {
	call, ok := provenance.Strip(v).(*ssa.Call)
	if !ok || depth == 0 || provenance.MathRounding(call.Common()) != provenance.Exact {
		return []ssa.Value{v}
	}
	if fn := call.Common().StaticCallee(); fn.Name() != "Min" && fn.Name() != "Max" {
		return []ssa.Value{v}
	}
	var out []ssa.Value
	for _, a := range call.Common().Args {
		out = append(out, selected(a, depth-1)...)
	}
	return out
}

// form writes v's computation as a string: operators, constants, the
// fields loaded and "call" for a call's result; "" when v holds a product
// or anything else, which is then never matched.
func form(v ssa.Value, depth int) string {
	if depth == 0 {
		return ""
	}
	v = provenance.Strip(v)
	if f := provenance.LoadedField(v); f != nil {
		return fmt.Sprintf("field%p", f)
	}
	switch x := v.(type) {
	case *ssa.Const:
		return "const " + x.String()
	case *ssa.Call:
		return "call"
	case *ssa.Extract:
		if _, ok := x.Tuple.(*ssa.Call); ok {
			return "call"
		}
	case *ssa.BinOp:
		if x.Op != token.ADD && x.Op != token.SUB && x.Op != token.QUO {
			return ""
		}
		l, r := form(x.X, depth-1), form(x.Y, depth-1)
		if l == "" || r == "" {
			return ""
		}
		return "(" + l + " " + x.Op.String() + " " + r + ")"
	}
	return ""
}
