package portable

import (
	"go/ast"
	"go/token"

	"golang.org/x/tools/go/analysis/passes/inspect"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/provenance"
)

// maxDepth bounds the operands followed from one value.
const maxDepth = 32

// correctlyRounded lists the rounding math functions whose results IEEE
// 754-2019 fixes bit for bit (§5.4 squareRoot, §5.4.1 fusedMultiplyAdd);
// every other rounding function of math (Sin, Exp, Pow, Atan2...) may
// differ in the last bits between platforms and Go versions.
var correctlyRounded = map[string]bool{"Sqrt": true, "FMA": true}

// Libm reports whether c calls a rounding math function whose result is
// not fixed bit for bit (Sin, Exp, Atan...).
func Libm(c *ssa.CallCommon) bool {
	return provenance.MathRounding(c) == provenance.Rounds && !correctlyRounded[c.StaticCallee().Name()]
}

// Value reports whether v is computed the same way, bit for bit, on every
// platform (see the package documentation).
func (j *Judge) Value(v ssa.Value) bool {
	j.mu.Lock()
	defer j.mu.Unlock()
	return j.walk(nil).value(v, maxDepth)
}

// OnInputs reports whether v, a value of the function being read, is
// computed the same way on every platform from the inputs it is given
// there (see exact.go): a product whose operands make it exact cannot
// change under fusion, and the functions v calls are read on the values
// passed to them. It costs a reading per call, so callers ask it only
// where Value says no.
func (j *Judge) OnInputs(v ssa.Value) bool {
	j.mu.Lock()
	defer j.mu.Unlock()
	return j.walk(&site{shared: &reading{entered: map[ssa.Instruction]*site{}, written: map[*ssa.Alloc]bool{}}}).value(v, maxDepth)
}

// walk is one reading of values: seen holds the values judged or in
// progress, at the inputs known (nil: none).
type walk struct {
	j    *Judge
	seen map[ssa.Value]bool
	at   *site
}

func (j *Judge) walk(at *site) *walk { return &walk{j, map[ssa.Value]bool{}, at} }

// Body reports whether a function of this package computes its results
// portably: its float results traced back, or, when a result is not a
// float (a struct, a slice filled in place), every float it computes and
// every call it makes.
func (j *Judge) Body(fn *ssa.Function) bool {
	ok, done := j.bodies[fn]
	if !done {
		j.bodies[fn] = true // a recursive call is judged by the rest of the body
		ok = j.walk(nil).body(fn, maxDepth)
		j.bodies[fn] = ok
	}
	return ok
}

func (w *walk) value(v ssa.Value, depth int) bool {
	v = provenance.Strip(v)
	return memo(w.seen, v, true, func() bool { return depth > 0 && w.step(v, depth) })
}

// memo returns the verdict on v kept in seen, or, the first time, step's,
// taking v to be assume while step is in progress (around a loop).
func memo(seen map[ssa.Value]bool, v ssa.Value, assume bool, step func() bool) bool {
	if ok, done := seen[v]; done {
		return ok
	}
	seen[v] = assume
	ok := step()
	seen[v] = ok
	return ok
}

// step judges v by its operation and operands.
func (w *walk) step(v ssa.Value, depth int) bool {
	switch v := v.(type) {
	case *ssa.Const, *ssa.FreeVar, *ssa.Global:
		return true
	case *ssa.Parameter:
		return v.Parent().Parent() == nil || !(&sighting{w.j, map[ssa.Value]bool{}}).passed(v, depth) // a closure's, as its callers pass it
	case *ssa.Alloc, *ssa.MakeSlice:
		return w.filled(v, depth)
	case *ssa.UnOp, *ssa.Field, *ssa.Index, *ssa.FieldAddr, *ssa.IndexAddr, *ssa.Slice, *ssa.Convert, *ssa.ChangeType, *ssa.MakeInterface, *ssa.Extract:
		if !w.storedPortable(v, depth) {
			return false
		}
		for _, op := range v.(ssa.Instruction).Operands(nil) {
			if *op != nil && !w.value(*op, depth-1) {
				return false
			}
		}
		return true
	case *ssa.BinOp:
		if (v.Op == token.ADD || v.Op == token.SUB) && provenance.IsFloat(v.Type()) && (w.fusable(v.X) || w.fusable(v.Y)) {
			return false // x*y ± z may be fused
		}
		return w.value(v.X, depth-1) && w.value(v.Y, depth-1)
	case *ssa.Phi:
		for _, e := range v.Edges {
			if !w.value(e, depth-1) {
				return false
			}
		}
		return true
	case *ssa.Call:
		return w.call(v.Common(), depth-1)
	}
	return false
}

// filled reports whether every float stored into a local variable, its
// fields and elements, is portable, and no call given its address that
// returns no float shows a cause in what it computes from what it is
// given (inputs.go: it may store that there). References stored there
// (pointers, slices, interfaces) lead to data made elsewhere, and what
// other calls given its address do is not followed: both are judged as
// inputs are, like parameters.
func (w *walk) filled(addr ssa.Value, depth int) bool {
	if depth <= 0 {
		return false
	}
	for _, r := range *addr.Referrers() {
		switch r := r.(type) {
		case *ssa.Store:
			if r.Addr == addr && provenance.HoldsFloat(r.Val.Type(), false) && !w.value(r.Val, depth) {
				return false
			}
			if c, ok := appended(r.Val); ok && r.Addr == addr && !w.call(c, depth-1) {
				return false // floats appended to the slice the variable holds
			}
		case *ssa.FieldAddr, *ssa.IndexAddr, *ssa.Slice:
			if !w.filled(r.(ssa.Value), depth) {
				return false
			}
		case *ssa.Call:
			if w.j.fills(r.Common(), addr, depth) {
				return false
			}
		case *ssa.UnOp:
			if _, ok := loadedMap(r); ok {
				return false // a map held in the variable: judged as one made in place
			}
		case *ssa.MakeClosure:
			if fv := captured(r, addr); fv != nil && !w.filled(fv, depth-1) {
				return false
			}
		}
	}
	return true
}

func (w *walk) body(fn *ssa.Function, depth int) bool {
	return !someFloat(fn,
		func(v ssa.Value) bool { return !w.value(v, depth) },
		func(c *ssa.CallCommon) bool { return !w.call(c, depth-1) })
}

// someFloat reports whether bad holds of one of fn's float results, or,
// when a result is not a float (a struct, a slice filled in place), of one
// of the floats fn computes, or badCall of one of the calls it makes
// (builtins aside).
func someFloat(fn *ssa.Function, bad func(ssa.Value) bool, badCall func(*ssa.CallCommon) bool) bool {
	for ret := range provenance.Returns(fn) {
		for _, r := range ret.Results {
			if !provenance.IsFloat(r.Type()) {
				return someComputed(fn, bad, badCall)
			}
			if bad(r) {
				return true
			}
		}
	}
	return false
}

// someComputed reports whether bad holds of one of the floats fn computes,
// or badCall of one of the calls it makes (builtins aside).
func someComputed(fn *ssa.Function, bad func(ssa.Value) bool, badCall func(*ssa.CallCommon) bool) bool {
	for _, b := range fn.Blocks {
		for _, instr := range b.Instrs {
			if call, ok := instr.(ssa.CallInstruction); ok {
				if _, builtin := call.Common().Value.(*ssa.Builtin); !builtin && badCall(call.Common()) {
					return true
				}
			}
			if v, ok := instr.(ssa.Value); ok && provenance.IsFloat(v.Type()) && bad(v) {
				return true
			}
		}
	}
	return false
}

// call reports whether a call computes the same bits everywhere: an exact
// or correctly rounded math function, a function of this package whose
// body is portable, or one of another package with the fact; and its
// arguments are portable.
func (w *walk) call(call *ssa.CallCommon, depth int) bool {
	if depth <= 0 || !w.callee(call, depth) {
		return false
	}
	for _, a := range call.Args {
		if !w.value(a, depth) {
			return false
		}
	}
	return true
}

// callee reports whether the function a call names is portable. The
// builtins (len, min, max, real, complex...) do not round, and fmt, log
// and testing only format what they are given to print or report it (a
// float parsed back, by fmt's scanning, is correctly rounded, IEEE
// 754-2019 §5.12).
func (w *walk) callee(call *ssa.CallCommon, depth int) bool {
	if _, ok := call.Value.(*ssa.Builtin); ok || readOnly(call) {
		return true
	}
	switch provenance.MathRounding(call) {
	case provenance.Exact:
		return true
	case provenance.Rounds:
		return correctlyRounded[call.StaticCallee().Name()] || w.at.exactPow(call)
	}
	fn := call.StaticCallee()
	if fn == nil {
		return false // an interface method or a function value: unknown
	}
	if fn.Origin() != nil {
		fn = fn.Origin()
	}
	if fn.Package() != nil && fn.Package().Pkg == w.j.pass.Pkg {
		return fn.Blocks != nil && (w.j.Body(fn) || w.at.enter(w.j, call, fn, depth))
	}
	obj := fn.Object()
	return obj != nil && w.j.pass.ImportObjectFact(obj, new(Fact))
}

// fusable reports whether v is a float product not wrapped in an explicit
// float conversion, which the Go spec says rounds it ("Arithmetic
// operators": an explicit floating-point type conversion rounds to the
// precision of the target type, preventing fusion), not a scaling by a
// constant power of two, and not exact on the inputs known:
// fusedMultiplyAdd rounds x*y + z once (IEEE 754-2019 §5.4.1), which for
// an exact product is the rounding of the separate add.
func (w *walk) fusable(v ssa.Value) bool {
	b, ok := provenance.Strip(v).(*ssa.BinOp)
	return ok && b.Op == token.MUL && provenance.IsFloat(b.Type()) && !w.j.convertedProducts()[b.Pos()] && !provenance.ExactScaling(b) && !w.at.exact(b)
}

// convertedProducts returns, by operator position, the products of the
// package written as the argument of an explicit float conversion, found
// once.
func (j *Judge) convertedProducts() map[token.Pos]bool {
	if j.converted != nil {
		return j.converted
	}
	j.converted = map[token.Pos]bool{}
	insp := j.pass.ResultOf[inspect.Analyzer].(*inspector.Inspector)
	for n := range insp.PreorderSeq((*ast.CallExpr)(nil)) {
		call := n.(*ast.CallExpr)
		if len(call.Args) != 1 {
			continue
		}
		if tv, ok := j.pass.TypesInfo.Types[call.Fun]; !ok || !tv.IsType() || !provenance.IsFloat(tv.Type) {
			continue
		}
		if b, ok := ast.Unparen(call.Args[0]).(*ast.BinaryExpr); ok && b.Op == token.MUL {
			j.converted[b.OpPos] = true
		}
	}
	return j.converted
}
