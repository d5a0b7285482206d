package portable

import (
	"go/constant"
	"go/token"
	"strings"

	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/provenance"
)

// The causes. A value that is not shown portable is either one whose
// computation holds a visible reason to differ between platforms, or one
// whose computation leaves sight (an interface method, a function value, a
// function without a body or of a package not read) before any such
// reason shows. The reasons are the two of the package documentation: a
// product added to or subtracted from another value, which Go may fuse
// into one rounding (IEEE 754-2019 §5.4.1), and a math function that is
// not correctly rounded. Every other step seen (+ - * /, square root, a
// conversion between float formats, IEEE 754-2019 §5.4.2) is correctly
// rounded and gives the same bits everywhere from the same operands.
// Where sight is lost and no reason showed, nothing is known, and nothing
// is claimed.

// Cause reports whether the computation of v shows a reason its last bits
// may differ between platforms: a fusable product or a math function that
// is not correctly rounded, in v's own function or in the functions it
// calls (of this package read, of another package by fact).
func (j *Judge) Cause(v ssa.Value) bool {
	j.mu.Lock()
	defer j.mu.Unlock()
	return (&sighting{j, map[ssa.Value]bool{}}).value(v, maxDepth)
}

// CauseFact marks a function whose float results, or, for other results,
// whose float computations, show a cause.
type CauseFact struct{}

// AFact marks CauseFact as an analysis fact.
func (*CauseFact) AFact() {}

func (*CauseFact) String() string { return "cause" }

// sighting is one search for a cause; seen holds the values searched or in
// progress (a value around a loop is searched once).
type sighting struct {
	j    *Judge
	seen map[ssa.Value]bool
}

// causedBody reports whether fn's results show a cause, read once.
func (j *Judge) causedBody(fn *ssa.Function) bool {
	c, done := j.causes[fn]
	if !done {
		j.causes[fn] = false // a recursive call is searched by the rest of the body
		c = (&sighting{j, map[ssa.Value]bool{}}).body(fn, maxDepth)
		j.causes[fn] = c
	}
	return c
}

func (s *sighting) value(v ssa.Value, depth int) bool {
	v = provenance.Strip(v)
	return memo(s.seen, v, false, func() bool { return depth > 0 && s.step(v, depth) })
}

// step searches v's operation and operands.
func (s *sighting) step(v ssa.Value, depth int) bool {
	if s.storedCause(v, depth) {
		return true
	}
	switch v := v.(type) {
	case *ssa.Alloc:
		return s.stored(v, depth) || s.j.filled(v, depth)
	case *ssa.MakeSlice:
		return s.j.filled(v, depth)
	case *ssa.MakeMap:
		return s.mapped(v, depth)
	case *ssa.Parameter:
		return s.passed(v, depth)
	case *ssa.BinOp:
		fusable := s.j.walk(nil).fusable
		if (v.Op == token.ADD || v.Op == token.SUB) && provenance.IsFloat(v.Type()) && (fusable(v.X) || fusable(v.Y)) {
			return true
		}
	case *ssa.Call:
		return s.call(v.Common(), depth-1) || s.args(v.Common(), depth-1) || !provenance.IsFloat(v.Type()) && s.j.filled(v, depth)
	}
	instr, ok := v.(ssa.Instruction)
	if !ok {
		return false // a constant, parameter, global: an input
	}
	for _, op := range instr.Operands(nil) {
		if *op != nil && s.value(*op, depth-1) {
			return true
		}
	}
	return false
}

// args searches the arguments of a call that hold floats, by value or
// through slices and pointers, and the bits math.Float64frombits reads:
// an interface or a map given to the callee leads to floats read by
// methods or lookups out of sight.
func (s *sighting) args(call *ssa.CallCommon, depth int) bool {
	bits := provenance.MathRounding(call) == provenance.Exact && strings.HasSuffix(call.StaticCallee().Name(), "frombits")
	for _, a := range call.Args {
		if (bits || provenance.HoldsFloat(a.Type(), true)) && s.value(a, depth) {
			return true
		}
	}
	return false
}

// stored searches the floats stored into a local variable, its fields and
// elements; what holds no float by value (a slice of nodes) is no result.
func (s *sighting) stored(addr ssa.Value, depth int) bool {
	for _, r := range *addr.Referrers() {
		switch r := r.(type) {
		case *ssa.Store:
			if r.Addr == addr && provenance.HoldsFloat(r.Val.Type(), false) && s.value(r.Val, depth-1) {
				return true
			}
			if c, ok := appended(r.Val); ok && r.Addr == addr && s.args(c, depth-1) {
				return true // floats appended to the slice the variable holds
			}
		case *ssa.FieldAddr, *ssa.IndexAddr, *ssa.Slice:
			if s.stored(r.(ssa.Value), depth-1) {
				return true
			}
		case *ssa.UnOp:
			if m, ok := loadedMap(r); ok && s.mapped(m, depth-1) {
				return true // a map held in the variable, updated after a load
			}
		case *ssa.MakeClosure:
			if fv := captured(r, addr); fv != nil && s.stored(fv, depth-1) {
				return true
			}
		}
	}
	return false
}

// call reports whether the function a call names shows a cause: a math
// function not correctly rounded, a function of this package whose body
// shows one, one of another package with the fact.
func (s *sighting) call(call *ssa.CallCommon, depth int) bool {
	switch provenance.MathRounding(call) {
	case provenance.Exact:
		return false
	case provenance.Rounds:
		return Libm(call) && !wholePow(call)
	}
	if depth <= 0 {
		return false
	}
	if call.IsInvoke() {
		return s.method(call.Value, call.Method.Name(), depth) // known where the value's type is
	}
	fn := call.StaticCallee()
	if fn == nil {
		return false // a function value: out of sight
	}
	if fn.Origin() != nil {
		fn = fn.Origin()
	}
	if fn.Package() != nil && fn.Package().Pkg == s.j.pass.Pkg {
		if fn.Blocks != nil && s.j.causedBody(fn) {
			return true
		}
	} else if obj := fn.Object(); obj != nil && s.j.pass.ImportObjectFact(obj, new(CauseFact)) {
		return true
	}
	return s.dispatched(call, s.j.calleeInvokes(call), depth)
}

// wholePow reports whether call is math.Pow(x, n) with a whole constant n.
// Go's Pow is pure Go on every architecture (haveArchPow is false in
// math/stubs.go and math/arith_s390x.go, Go 1.26), and for a whole n
// (math/pow.go) multiplies successive squarings of x's significand,
// doubles, and divides 1 by the product when n < 0, each correctly
// rounded. The one sum, a square r = x1*x1 doubled as r + r where it falls
// below 1/2, gives the same bits fused: r + x1·x1 = 2r + e with |e| at
// most half an ulp of r, less than half the spacing at 2r in [1/2, 1), so
// it rounds to 2r. The bits are the same on every platform.
func wholePow(call *ssa.CallCommon) bool {
	if call.StaticCallee().Name() != "Pow" || len(call.Args) != 2 {
		return false
	}
	c, ok := provenance.Strip(call.Args[1]).(*ssa.Const)
	if !ok || c.Value == nil {
		return false
	}
	_, whole := constant.Int64Val(constant.ToInt(c.Value))
	return whole
}

// body searches fn's float results, or, where a result is not a float,
// every float fn computes and every call it makes.
func (s *sighting) body(fn *ssa.Function, depth int) bool {
	return someFloat(fn,
		func(v ssa.Value) bool { return s.value(v, depth) },
		func(c *ssa.CallCommon) bool { return s.call(c, depth-1) })
}
