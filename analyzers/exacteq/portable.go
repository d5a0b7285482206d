package exacteq

import (
	"go/ast"
	"go/token"

	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/provenance"
)

// correctlyRounded lists the math functions whose results IEEE 754-2019
// fixes bit for bit (§5.4 squareRoot; exact operations such as Abs and
// Floor); every other float function of math (Sin, Exp, Pow, Atan2...) may
// differ in the last bits between platforms and Go versions (assembly
// kernels on some architectures, fused multiply-add in the pure-Go ones).
var correctlyRounded = map[string]bool{"Sqrt": true, "FMA": true}

// portable reports whether v is computed the same way, bit for bit, on
// every platform: from constants, parameters and loads by + - * / on
// operands none of which is a product added to or subtracted from another
// value (x*y + z may be fused into one rounding, Go spec "Arithmetic
// operators"; a product wrapped in an explicit conversion, float64(x*y),
// is rounded before the addition, and cannot fuse), by correctly rounded or exact math functions, and by
// package functions built the same way. A pinned result so computed is
// reproducible, and its exact comparison holds everywhere.
func (c *checker) portable(v ssa.Value) bool {
	return c.portableValue(v, map[ssa.Value]bool{}, 24)
}

func (c *checker) portableValue(v ssa.Value, seen map[ssa.Value]bool, depth int) bool {
	v = provenance.Strip(v)
	if ok, done := seen[v]; done {
		return ok // known, or in progress around a loop (assumed portable until shown otherwise)
	}
	seen[v] = true
	ok := depth > 0 && c.portableStep(v, seen, depth)
	seen[v] = ok
	return ok
}

// portableStep judges v by its operation and operands.
func (c *checker) portableStep(v ssa.Value, seen map[ssa.Value]bool, depth int) bool {
	switch v := v.(type) {
	case *ssa.Const, *ssa.Parameter, *ssa.FreeVar, *ssa.Global, *ssa.Alloc:
		return true
	case *ssa.UnOp, *ssa.Field, *ssa.Index, *ssa.FieldAddr, *ssa.IndexAddr, *ssa.Slice, *ssa.Convert, *ssa.ChangeType, *ssa.MakeInterface, *ssa.Extract:
		for _, op := range v.(ssa.Instruction).Operands(nil) {
			if *op != nil && !c.portableValue(*op, seen, depth-1) {
				return false
			}
		}
		return true
	case *ssa.BinOp:
		if (v.Op == token.ADD || v.Op == token.SUB) && provenance.IsFloat(v.Type()) && (c.fusable(v.X) || c.fusable(v.Y)) {
			return false // x*y ± z may be fused
		}
		return c.portableValue(v.X, seen, depth-1) && c.portableValue(v.Y, seen, depth-1)
	case *ssa.Phi:
		for _, e := range v.Edges {
			if !c.portableValue(e, seen, depth-1) {
				return false
			}
		}
		return true
	case *ssa.Call:
		return c.portableCall(v.Common(), seen, depth-1)
	}
	return false
}

// portableBody reports whether a package function computes its results
// portably: its float results traced back, or, when a result is not a
// float (a struct, a slice filled in place), every float it computes.
func (c *checker) portableBody(fn *ssa.Function, seen map[ssa.Value]bool, depth int) bool {
	for _, b := range fn.Blocks {
		ret, ok := b.Instrs[len(b.Instrs)-1].(*ssa.Return)
		if !ok {
			continue
		}
		for _, r := range ret.Results {
			if !provenance.IsFloat(r.Type()) {
				return c.everyFloatPortable(fn, seen, depth)
			}
			if !c.portableValue(r, seen, depth) {
				return false
			}
		}
	}
	return true
}

// everyFloatPortable reports whether every float fn computes, and every
// call it makes (builtins aside), is portable.
func (c *checker) everyFloatPortable(fn *ssa.Function, seen map[ssa.Value]bool, depth int) bool {
	for _, b := range fn.Blocks {
		for _, instr := range b.Instrs {
			if call, ok := instr.(ssa.CallInstruction); ok {
				if _, builtin := call.Common().Value.(*ssa.Builtin); !builtin && !c.portableCall(call.Common(), seen, depth-1) {
					return false
				}
			}
			if v, ok := instr.(ssa.Value); ok && provenance.IsFloat(v.Type()) && !c.portableValue(v, seen, depth) {
				return false
			}
		}
	}
	return true
}

// fusable reports whether v is a float product not wrapped in an explicit
// float conversion, which the Go spec says rounds it ("Arithmetic
// operators": an explicit floating-point type conversion rounds to the
// precision of the target type, preventing fusion).
func (c *checker) fusable(v ssa.Value) bool {
	b, ok := provenance.Strip(v).(*ssa.BinOp)
	return ok && b.Op == token.MUL && provenance.IsFloat(b.Type()) && !c.convertedProducts()[b.Pos()]
}

// convertedProducts returns, by operator position, the products of the
// package written as the argument of an explicit float conversion,
// found once.
func (c *checker) convertedProducts() map[token.Pos]bool {
	if c.converted != nil {
		return c.converted
	}
	c.converted = map[token.Pos]bool{}
	for _, f := range c.pass.Files {
		ast.Inspect(f, func(n ast.Node) bool {
			call, ok := n.(*ast.CallExpr)
			if !ok || len(call.Args) != 1 {
				return true
			}
			if tv, ok := c.pass.TypesInfo.Types[call.Fun]; !ok || !tv.IsType() || !provenance.IsFloat(tv.Type) {
				return true
			}
			if b, ok := ast.Unparen(call.Args[0]).(*ast.BinaryExpr); ok && b.Op == token.MUL {
				c.converted[b.OpPos] = true
			}
			return true
		})
	}
	return c.converted
}

// portableCall reports whether a call computes the same bits everywhere:
// an exact or correctly rounded math function of portable arguments, or a
// function of this package whose every instruction is portable.
func (c *checker) portableCall(call *ssa.CallCommon, seen map[ssa.Value]bool, depth int) bool {
	if depth <= 0 {
		return false
	}
	args := call.Args
	switch provenance.MathRounding(call) {
	case provenance.Exact:
	case provenance.Rounds:
		if !correctlyRounded[call.StaticCallee().Name()] {
			return false
		}
	default:
		fn := call.StaticCallee()
		if fn == nil || fn.Blocks == nil || fn.Package() == nil || fn.Package().Pkg != c.pass.Pkg {
			return false // unknown: no claim of portability
		}
		ok, done := seen[fn]
		if !done {
			seen[fn] = true // a recursive call is judged by the rest of the body
			ok = c.portableBody(fn, seen, depth)
			seen[fn] = ok
		}
		if !ok {
			return false
		}
	}
	for _, a := range args {
		if !c.portableValue(a, seen, depth) {
			return false
		}
	}
	return true
}
