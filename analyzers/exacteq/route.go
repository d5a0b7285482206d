package exacteq

import (
	"fmt"
	"go/ast"
	"go/token"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/portable"
	"roundoff/analyzers/internal/provenance"
	"roundoff/internal/numeric"
)

// secondRoute reports, in a test, an exact comparison of a result the
// code under test computes with an expected value that only exact
// arithmetic makes equal to it:
//
//   - exact zero, where the function returns a difference of terms one of
//     which passes through a math function that is not correctly rounded
//     (lat = 2*atan(exp(y))*(180/π) - 90 at y = 0): the library gives such
//     a function to about an ulp, differently between platforms and Go
//     versions, and fused multiply-add changes the rounding, so the terms
//     cancel exactly only by luck;
//   - a value the test computes itself, with rounding, by another formula
//     (math.Sqrt(2)*c against the function's math.Sqrt(2*c*c), -math.Log(4)
//     against x - 2*math.Log(math.Exp(x)+1) at 0): two formulas equal in
//     exact arithmetic round differently, so the test passes for the
//     inputs tried and fails for others. The same formula on both sides
//     gives the same bits and is left alone.
//
// It reports whether it reported.
func (c *checker) secondRoute(cur inspector.Cursor, n *ast.BinaryExpr, op token.Token, x, y operand) bool {
	if !c.inTest(cur) {
		return false
	}
	for _, pair := range [][2]operand{{x, y}, {y, x}} {
		got, want := pair[0], pair[1]
		fn, rets := c.underTest(got.val)
		switch {
		case fn == nil:
		case c.isZero(want):
			if term, ok := libmDifference(rets); ok {
				c.reportZeroRoute(n, op, got, fn, term)
				return true
			}
		case c.track.Computed(want.val) && !c.exempt(want) && c.otherFormula(want.val, rets):
			f := provenance.FormatOf(c.pass.TypesInfo.TypeOf(got.expr))
			fixes.Report(c.pass, analysis.Diagnostic{
				Pos: n.Pos(), End: n.End(), Category: catRoute,
				Message: fmt.Sprintf("exact %s between the result of %s and %s, which the test computes by another formula: formulas equal in exact arithmetic round differently (up to %.3g relative per operation), so the test holds only for the inputs where both roundings agree; compare within a tolerance such as %s relative",
					op, fn.Name(), fixes.Source(c.pass.Fset, want.expr), f.U, rtol(f)),
			})
			return true
		}
	}
	return false
}

// underTest returns the function of this package, outside the test
// files, whose computed result v is, with the values it returns there on
// every path; nil if v is no such result.
func (c *checker) underTest(v ssa.Value) (*ssa.Function, []ssa.Value) {
	var call *ssa.Call
	index := 0
	switch x := provenance.Strip(v).(type) {
	case *ssa.Call:
		call = x
	case *ssa.Extract:
		call, _ = x.Tuple.(*ssa.Call)
		index = x.Index
	}
	if call == nil {
		return nil, nil
	}
	fn := call.Common().StaticCallee()
	if fn == nil || fn.Blocks == nil || fn.Package() == nil || fn.Package().Pkg != c.pass.Pkg ||
		provenance.InTestFile(c.pass.Fset, fn.Pos()) || !c.track.Returns(fn)[index] {
		return nil, nil
	}
	return fn, returned(fn, index)
}

// returned lists the values fn returns as its result i.
func returned(fn *ssa.Function, i int) []ssa.Value {
	var out []ssa.Value
	for ret := range provenance.Returns(fn) {
		out = append(out, ret.Results[i])
	}
	return out
}

// libmDifference reports whether every value in rets is a sum or
// difference of two terms, neither exact zero, one of which passes
// through a math function that is not correctly rounded; it returns the
// other term when that is a constant (nil otherwise).
func libmDifference(rets []ssa.Value) (*ssa.Const, bool) {
	var term *ssa.Const
	for _, r := range rets {
		b, ok := provenance.Strip(r).(*ssa.BinOp)
		if !ok || b.Op != token.ADD && b.Op != token.SUB || zeroConst(b.X) || zeroConst(b.Y) {
			return nil, false
		}
		switch {
		case reachesLibm(b.X, 6):
			term, _ = provenance.Strip(b.Y).(*ssa.Const)
		case reachesLibm(b.Y, 6):
			term, _ = provenance.Strip(b.X).(*ssa.Const)
		default:
			return nil, false
		}
	}
	return term, len(rets) > 0
}

// zeroConst reports whether v is the constant 0.
func zeroConst(v ssa.Value) bool {
	k, ok := provenance.Strip(v).(*ssa.Const)
	return ok && k.Value != nil && k.Value.String() == "0"
}

// reachesLibm reports whether v is computed, within depth arithmetic
// steps, from a math function that is not correctly rounded.
func reachesLibm(v ssa.Value, depth int) bool {
	if depth == 0 {
		return false
	}
	switch x := provenance.Strip(v).(type) {
	case *ssa.BinOp:
		return reachesLibm(x.X, depth-1) || reachesLibm(x.Y, depth-1)
	case *ssa.UnOp:
		return x.Op == token.SUB && reachesLibm(x.X, depth-1)
	case *ssa.Call:
		return portable.Libm(x.Common())
	}
	return false
}

// reportZeroRoute reports an exact zero expected of a difference whose
// terms pass through a math function that is not correctly rounded.
func (c *checker) reportZeroRoute(n *ast.BinaryExpr, op token.Token, got operand, fn *ssa.Function, term *ssa.Const) {
	f := provenance.FormatOf(c.pass.TypesInfo.TypeOf(got.expr))
	residue := "a residue of an ulp of the terms"
	if term != nil {
		if v, ok := constval.Float(term, c.globals); ok {
			residue = fmt.Sprintf("a residue of one ulp of %s (%.3g)", numeric.Decimal(v, 17), f.Spacing(v))
		}
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catRoute,
		Message: fmt.Sprintf("exact %s 0 on the result of %s, a difference of terms equal in exact arithmetic here, one computed through a math function that is not correctly rounded: its last bit varies between platforms, Go versions and fused multiply-add, so the test can see %s instead of 0; compare its magnitude with a tolerance scaled by the terms",
			op, fn.Name(), residue),
	})
}

// otherFormula reports whether the test's value want is written as a
// formula none of the returned values rets is written as (see
// formulas), when all of them can be written.
func (c *checker) otherFormula(want ssa.Value, rets []ssa.Value) bool {
	w := formulas(want, 8, 0)
	if len(w) != 1 {
		return false // not written out, or ambiguous
	}
	for _, r := range rets {
		fs := formulas(r, 8, 2)
		if len(fs) == 0 || slices.Contains(fs, w[0]) {
			return false
		}
	}
	return true
}

// formulas writes v's computation with every input (constant, parameter,
// load, conversion of an integer) as x: operators and math function
// names. A call of a package function is written as each formula it
// returns, up to inline levels deep; nil when v holds anything else.
func formulas(v ssa.Value, depth, inline int) []string {
	if depth == 0 {
		return nil
	}
	switch x := provenance.Strip(v).(type) {
	case *ssa.Const, *ssa.Parameter, *ssa.FreeVar, *ssa.Field, *ssa.Index, *ssa.Convert:
		return []string{"x"}
	case *ssa.UnOp:
		if x.Op == token.MUL {
			return []string{"x"}
		}
		return wrap("-(", formulas(x.X, depth-1, inline), ")")
	case *ssa.BinOp:
		return wrap("(", combine(formulas(x.X, depth-1, inline), " "+x.Op.String()+" ", formulas(x.Y, depth-1, inline)), ")")
	case *ssa.Call:
		return callFormulas(x.Common(), depth, inline)
	}
	return nil
}

// callFormulas writes a call: a math function by name and arguments, a
// package function by what it returns.
func callFormulas(call *ssa.CallCommon, depth, inline int) []string {
	if provenance.MathRounding(call) != provenance.NotMath {
		out := []string{call.StaticCallee().Name() + "("}
		for i, a := range call.Args {
			sep := ""
			if i > 0 {
				sep = ", "
			}
			out = combine(out, sep, formulas(a, depth-1, inline))
		}
		return wrap("", out, ")")
	}
	fn := call.StaticCallee()
	if inline == 0 || fn == nil || fn.Blocks == nil || fn.Signature.Results().Len() != 1 {
		return nil
	}
	var out []string
	for _, r := range returned(fn, 0) {
		fs := formulas(r, depth-1, inline-1)
		if fs == nil {
			return nil
		}
		out = append(out, fs...)
	}
	return out
}

// combine joins every formula of a with every one of b around sep, at
// most 16.
func combine(a []string, sep string, b []string) []string {
	var out []string
	for _, l := range a {
		for _, r := range b {
			if len(out) < 16 {
				out = append(out, l+sep+r)
			}
		}
	}
	return out
}

// wrap puts pre and post around every formula of fs.
func wrap(pre string, fs []string, post string) []string {
	var out []string
	for _, f := range fs {
		out = append(out, pre+f+post)
	}
	return out
}
