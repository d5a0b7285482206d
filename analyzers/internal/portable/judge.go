package portable

import (
	"go/ast"
	"go/token"

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
	return j.value(v, map[ssa.Value]bool{}, maxDepth)
}

// Body reports whether a function of this package computes its results
// portably: its float results traced back, or, when a result is not a
// float (a struct, a slice filled in place), every float it computes and
// every call it makes.
func (j *Judge) Body(fn *ssa.Function) bool {
	ok, done := j.bodies[fn]
	if !done {
		j.bodies[fn] = true // a recursive call is judged by the rest of the body
		ok = j.body(fn, map[ssa.Value]bool{}, maxDepth)
		j.bodies[fn] = ok
	}
	return ok
}

func (j *Judge) value(v ssa.Value, seen map[ssa.Value]bool, depth int) bool {
	v = provenance.Strip(v)
	if ok, done := seen[v]; done {
		return ok // known, or in progress around a loop (assumed portable until shown otherwise)
	}
	seen[v] = true
	ok := depth > 0 && j.step(v, seen, depth)
	seen[v] = ok
	return ok
}

// step judges v by its operation and operands.
func (j *Judge) step(v ssa.Value, seen map[ssa.Value]bool, depth int) bool {
	switch v := v.(type) {
	case *ssa.Const, *ssa.Parameter, *ssa.FreeVar, *ssa.Global:
		return true
	case *ssa.Alloc:
		return j.filled(v, seen, depth)
	case *ssa.UnOp, *ssa.Field, *ssa.Index, *ssa.FieldAddr, *ssa.IndexAddr, *ssa.Slice, *ssa.Convert, *ssa.ChangeType, *ssa.MakeInterface, *ssa.Extract:
		for _, op := range v.(ssa.Instruction).Operands(nil) {
			if *op != nil && !j.value(*op, seen, depth-1) {
				return false
			}
		}
		return true
	case *ssa.BinOp:
		if (v.Op == token.ADD || v.Op == token.SUB) && provenance.IsFloat(v.Type()) && (j.fusable(v.X) || j.fusable(v.Y)) {
			return false // x*y ± z may be fused
		}
		return j.value(v.X, seen, depth-1) && j.value(v.Y, seen, depth-1)
	case *ssa.Phi:
		for _, e := range v.Edges {
			if !j.value(e, seen, depth-1) {
				return false
			}
		}
		return true
	case *ssa.Call:
		return j.call(v.Common(), seen, depth-1)
	}
	return false
}

// filled reports whether every float stored into a local variable, its
// fields and elements, is portable. References stored there (pointers,
// slices, interfaces) lead to data made elsewhere, and what calls given
// its address do is not followed: both are judged as inputs are, like
// parameters.
func (j *Judge) filled(addr ssa.Value, seen map[ssa.Value]bool, depth int) bool {
	if depth <= 0 {
		return false
	}
	for _, r := range *addr.Referrers() {
		switch r := r.(type) {
		case *ssa.Store:
			if r.Addr == addr && provenance.HoldsFloat(r.Val.Type(), false) && !j.value(r.Val, seen, depth) {
				return false
			}
		case *ssa.FieldAddr, *ssa.IndexAddr, *ssa.Slice:
			if !j.filled(r.(ssa.Value), seen, depth) {
				return false
			}
		}
	}
	return true
}

func (j *Judge) body(fn *ssa.Function, seen map[ssa.Value]bool, depth int) bool {
	for _, b := range fn.Blocks {
		ret, ok := b.Instrs[len(b.Instrs)-1].(*ssa.Return)
		if !ok {
			continue
		}
		for _, r := range ret.Results {
			if !provenance.IsFloat(r.Type()) {
				return j.everyFloat(fn, seen, depth)
			}
			if !j.value(r, seen, depth) {
				return false
			}
		}
	}
	return true
}

// everyFloat reports whether every float fn computes, and every call it
// makes (builtins aside), is portable.
func (j *Judge) everyFloat(fn *ssa.Function, seen map[ssa.Value]bool, depth int) bool {
	for _, b := range fn.Blocks {
		for _, instr := range b.Instrs {
			if call, ok := instr.(ssa.CallInstruction); ok {
				if _, builtin := call.Common().Value.(*ssa.Builtin); !builtin && !j.call(call.Common(), seen, depth-1) {
					return false
				}
			}
			if v, ok := instr.(ssa.Value); ok && provenance.IsFloat(v.Type()) && !j.value(v, seen, depth) {
				return false
			}
		}
	}
	return true
}

// call reports whether a call computes the same bits everywhere: an exact
// or correctly rounded math function, a function of this package whose
// body is portable, or one of another package with the fact; and its
// arguments are portable.
func (j *Judge) call(call *ssa.CallCommon, seen map[ssa.Value]bool, depth int) bool {
	if depth <= 0 || !j.callee(call) {
		return false
	}
	for _, a := range call.Args {
		if !j.value(a, seen, depth) {
			return false
		}
	}
	return true
}

// callee reports whether the function a call names is portable. The
// builtins (len, min, max, real, complex...) do not round.
func (j *Judge) callee(call *ssa.CallCommon) bool {
	if _, ok := call.Value.(*ssa.Builtin); ok {
		return true
	}
	switch provenance.MathRounding(call) {
	case provenance.Exact:
		return true
	case provenance.Rounds:
		return correctlyRounded[call.StaticCallee().Name()]
	}
	fn := call.StaticCallee()
	if fn == nil {
		return false // an interface method or a function value: unknown
	}
	if fn.Origin() != nil {
		fn = fn.Origin()
	}
	if fn.Package() != nil && fn.Package().Pkg == j.pass.Pkg {
		return fn.Blocks != nil && j.Body(fn)
	}
	obj := fn.Object()
	return obj != nil && j.pass.ImportObjectFact(obj, new(Fact))
}

// fusable reports whether v is a float product not wrapped in an explicit
// float conversion, which the Go spec says rounds it ("Arithmetic
// operators": an explicit floating-point type conversion rounds to the
// precision of the target type, preventing fusion).
func (j *Judge) fusable(v ssa.Value) bool {
	b, ok := provenance.Strip(v).(*ssa.BinOp)
	return ok && b.Op == token.MUL && provenance.IsFloat(b.Type()) && !j.convertedProducts()[b.Pos()]
}

// convertedProducts returns, by operator position, the products of the
// package written as the argument of an explicit float conversion, found
// once.
func (j *Judge) convertedProducts() map[token.Pos]bool {
	if j.converted != nil {
		return j.converted
	}
	j.converted = map[token.Pos]bool{}
	for _, f := range j.pass.Files {
		ast.Inspect(f, func(n ast.Node) bool {
			call, ok := n.(*ast.CallExpr)
			if !ok || len(call.Args) != 1 {
				return true
			}
			if tv, ok := j.pass.TypesInfo.Types[call.Fun]; !ok || !tv.IsType() || !provenance.IsFloat(tv.Type) {
				return true
			}
			if b, ok := ast.Unparen(call.Args[0]).(*ast.BinaryExpr); ok && b.Op == token.MUL {
				j.converted[b.OpPos] = true
			}
			return true
		})
	}
	return j.converted
}
