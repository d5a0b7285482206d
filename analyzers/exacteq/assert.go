package exacteq

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"slices"
	"strings"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/tolerance"
	"roundoff/internal/numeric"
)

// tolerantWords mark an assertion's name as one that takes a tolerance.
var tolerantWords = []string{"Within", "Approx", "Tol", "Eps", "Delta", "Near", "Close", "Almost", "Float"}

// equalityName reports whether name says an exact equality assertion:
// it holds "Equal" and no word of a tolerance.
func equalityName(name string) bool {
	if !strings.Contains(name, "Equal") {
		return false
	}
	for _, w := range tolerantWords {
		if strings.Contains(name, w) {
			return false
		}
	}
	return true
}

// tolerant reports whether a call of callee compares within a tolerance,
// whatever its name says: it passes a third float operand (an equality of
// two values takes two; a third is the tolerance their difference is held
// to), or callee's body, where this package declares it, holds a
// tolerance test (math.Abs(a-b) > eps).
func (c *checker) tolerant(call *ast.CallExpr, callee *ssa.Function) bool {
	floats := 0
	for _, a := range call.Args {
		if provenance.IsFloat(c.pass.TypesInfo.TypeOf(a)) {
			floats++
		}
	}
	if floats > 2 {
		return true
	}
	if callee == nil {
		return false
	}
	fd, ok := callee.Syntax().(*ast.FuncDecl)
	if !ok || fd.Body == nil {
		return false
	}
	found := false
	ast.Inspect(fd.Body, func(n ast.Node) bool {
		if b, ok := n.(*ast.BinaryExpr); ok && !found {
			_, found = tolerance.Recognize(c.pass.TypesInfo, c.decls, b)
		}
		return !found
	})
	return found
}

// helperAssertion reports, in a test file, an equality assertion outside
// testify and the standard library (a helper package's AssertEqual, or a
// call given such a function, as in So(x, ShouldEqual, 2.9)) that compares
// a result computed with rounding by this package exactly with a decimal
// constant the type stores inexactly.
func (c *checker) helperAssertion(cur inspector.Cursor, call *ast.CallExpr, fn *types.Func) {
	name := fn.Name()
	for _, a := range call.Args {
		if n := c.funcName(a); equalityName(n) {
			name = n
		}
	}
	sc := c.callAt(call.Lparen)
	if !equalityName(name) || sc == nil || c.tolerant(call, sc.Common().StaticCallee()) || c.deliberate(cur) || !c.inTest(cur) {
		return
	}
	args := sc.Common().Args
	if fn.Signature().Recv() != nil {
		args = args[1:] // the receiver comes first in SSA
	}
	var lit, got *operand
	for i, a := range call.Args {
		if i >= len(args) || !provenance.IsFloat(c.pass.TypesInfo.TypeOf(a)) {
			continue
		}
		o := &operand{a, args[i]}
		if c.isConst(a) {
			lit = o
		} else {
			got = o
		}
	}
	if lit == nil && got == nil && fn.Signature().Recv() != nil && len(call.Args) == 1 {
		c.equalMethod(call, name, sc.Common().Args)
		return
	}
	if lit == nil || got == nil || c.pinned(cur, call, name, *lit, *got, nil) {
		return
	}
	c.shortDecimal(call, name, *lit, *got)
}

// equalMethod applies shortDecimal to an Equal method of a type holding
// floats by value (a point, an array of coordinates), p.Equal(q), when
// one side is written as a composite literal (or a variable set once
// from one) with an element that is such a decimal: the method compares
// the elements exactly.
func (c *checker) equalMethod(call *ast.CallExpr, name string, args []ssa.Value) {
	sel, ok := ast.Unparen(call.Fun).(*ast.SelectorExpr)
	if !ok || len(args) != 2 || !provenance.HoldsFloat(c.pass.TypesInfo.TypeOf(call.Args[0]), false) {
		return
	}
	sides := []operand{{sel.X, args[0]}, {call.Args[0], args[1]}}
	for i, side := range sides {
		for _, e := range c.literalElems(side.expr) {
			if c.inexactConst(e) {
				c.shortDecimal(call, name, operand{expr: e}, sides[1-i])
				return
			}
		}
	}
}

// inexactConst reports whether e is a float constant that its type
// stores inexactly.
func (c *checker) inexactConst(e ast.Expr) bool {
	t := c.pass.TypesInfo.TypeOf(e)
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, e)
	if !ok || !provenance.IsFloat(t) || v.Kind() == constant.Complex {
		return false
	}
	_, exact := storedValue(v, provenance.FormatOf(t))
	return !exact
}

// literalElems returns the elements of the composite literal e is, or
// that the variable e names was set to once.
func (c *checker) literalElems(e ast.Expr) []ast.Expr {
	if id, ok := ast.Unparen(e).(*ast.Ident); ok {
		if d := c.decls[c.pass.TypesInfo.Uses[id]]; d != nil {
			e = d
		}
	}
	lit, ok := ast.Unparen(e).(*ast.CompositeLit)
	if !ok {
		return nil
	}
	var out []ast.Expr
	for _, el := range lit.Elts {
		if kv, ok := el.(*ast.KeyValueExpr); ok {
			el = kv.Value
		}
		out = append(out, el)
	}
	return out
}

// shortDecimal reports the exact comparison of a value that a function of
// this package computes with rounding, in more than one step, with a
// decimal constant of fewer digits than a printed result that the type
// stores inexactly: the constant is the exact answer, and the computed
// value lands on the double nearest to it only if the roundings of every
// step happen to; one correctly rounded operation on exact operands
// (Ratio(1, 10) == 0.1) does land there (IEEE 754-2019 §4.3), and is
// left alone.
func (c *checker) shortDecimal(node ast.Node, what string, lit, got operand) {
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, lit.expr)
	if !ok || v.Kind() == constant.Complex {
		return
	}
	f := provenance.FormatOf(c.pass.TypesInfo.TypeOf(lit.expr))
	stored, exact := storedValue(v, f)
	fn := c.roundingSource(got.val)
	if exact || fn == nil || len(shortestDigits(stored, f)) >= printedDigits(f) {
		return
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: node.Pos(), End: node.End(), Category: catTestify,
		Message: fmt.Sprintf("%s compares the result of %s, computed in several rounded steps, exactly with %s, which %s stores as %s: the test passes only while every rounding lands on that double (ulp %.3g); compare within a relative tolerance such as %s",
			what, fn.Name(), fixes.Source(c.pass.Fset, lit.expr), f.Name, numeric.Decimal(stored, 34), f.Spacing(stored), rtol(f)),
	})
}

// funcName returns the name of the function or function variable e
// names, or "".
func (c *checker) funcName(e ast.Expr) string {
	var id *ast.Ident
	switch e := ast.Unparen(e).(type) {
	case *ast.Ident:
		id = e
	case *ast.SelectorExpr:
		id = e.Sel
	default:
		return ""
	}
	obj := c.pass.TypesInfo.Uses[id]
	if obj == nil {
		return ""
	}
	if _, ok := obj.Type().Underlying().(*types.Signature); !ok {
		return ""
	}
	return obj.Name()
}

// roundingSource returns the function of this package whose result v is
// read from (directly, or as an element or field of it) when that
// function computes with rounding in more than one step; nil otherwise.
func (c *checker) roundingSource(v ssa.Value) *ssa.Function {
	for range 8 {
		if h, ok := holder(v); ok {
			v = h
			continue
		}
		switch x := provenance.Strip(v).(type) {
		case *ssa.Extract:
			v = x.Tuple
		case *ssa.FreeVar:
			v = binding(x) // a variable captured by a closure, as test frameworks nest them
		case *ssa.Alloc:
			v = onlyStore(x)
		case *ssa.Call:
			fn := x.Common().StaticCallee()
			if fn == nil || fn.Package() == nil || fn.Package().Pkg != c.pass.Pkg || !roundsRepeatedly(fn, 3) {
				return nil
			}
			return fn
		default:
			return nil
		}
	}
	return nil
}

// binding returns the value the enclosing function binds to a closure's
// free variable, or nil.
func binding(fv *ssa.FreeVar) ssa.Value {
	fn := fv.Parent()
	i := slices.Index(fn.FreeVars, fv)
	if fn.Parent() == nil || i < 0 {
		return nil
	}
	for _, b := range fn.Parent().Blocks {
		for _, instr := range b.Instrs {
			if mc, ok := instr.(*ssa.MakeClosure); ok && mc.Fn == fn {
				return mc.Bindings[i]
			}
		}
	}
	return nil
}

// onlyStore returns the one value stored into a local variable, or nil.
func onlyStore(a *ssa.Alloc) ssa.Value {
	var val ssa.Value
	for _, r := range *a.Referrers() {
		if st, ok := r.(*ssa.Store); ok && st.Addr == a {
			if val != nil {
				return nil // assigned more than once
			}
			val = st.Val
		}
	}
	return val
}

// roundsRepeatedly reports whether fn does float arithmetic that rounds
// (+ - * / or a rounding math function), itself or through the package
// functions it calls, and its float results are not each one operation
// on its parameters and constants.
func roundsRepeatedly(fn *ssa.Function, depth int) bool {
	if fn.Blocks == nil || depth == 0 || oneStep(fn) {
		return false
	}
	for _, b := range fn.Blocks {
		for _, instr := range b.Instrs {
			switch x := instr.(type) {
			case *ssa.BinOp:
				if provenance.IsFloat(x.Type()) && x.Op != token.EQL && x.Op != token.NEQ {
					return true
				}
			case *ssa.Call:
				if provenance.MathRounding(x.Common()) == provenance.Rounds {
					return true
				}
				callee := x.Common().StaticCallee()
				if callee != nil && callee.Package() == fn.Package() && roundsRepeatedly(callee, depth-1) {
					return true
				}
			}
		}
	}
	return false
}

// oneStep reports whether every result fn returns is a float computed by
// one arithmetic operation on parameters and constants.
func oneStep(fn *ssa.Function) bool {
	found := false
	for ret := range provenance.Returns(fn) {
		for _, r := range ret.Results {
			op, ok := provenance.Strip(r).(*ssa.BinOp)
			if !ok || !provenance.IsFloat(op.Type()) || !leaf(op.X) || !leaf(op.Y) {
				return false
			}
			found = true
		}
	}
	return found
}

// leaf reports whether v is a parameter or a constant.
func leaf(v ssa.Value) bool {
	switch provenance.Strip(v).(type) {
	case *ssa.Parameter, *ssa.Const:
		return true
	}
	return false
}
