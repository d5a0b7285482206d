package exacteq

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/types"
	"strings"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/internal/numeric"
)

// testifyEqual maps testify's exact-equality assertions to the tolerance
// assertion that replaces them ("" where testify has none).
var testifyEqual = map[string]string{
	"Equal": "InEpsilon", "Equalf": "InEpsilonf",
	"EqualValues": "InEpsilon", "EqualValuesf": "InEpsilonf",
	"Exactly": "InEpsilon", "Exactlyf": "InEpsilonf",
	"NotEqual": "", "NotEqualf": "", "NotEqualValues": "", "NotEqualValuesf": "",
}

// testifyCall reports testify's Equal-style assertions that compare floats
// exactly under the same rules as ==.
func (c *checker) testifyCall(cur inspector.Cursor, call *ast.CallExpr) {
	fn, ok := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func)
	if !ok || fn.Pkg() == nil {
		return
	}
	deep := deepEqual[fn.Pkg().Path()+"."+fn.Name()]
	if c.gocheckCall(cur, call, fn) {
		return
	}
	if !deep && !isTestify(fn.Pkg().Path()) {
		if !provenance.InStd(c.pass.Fset, fn.Pos(), fn.Pkg()) {
			c.helperAssertion(cur, call, fn)
		}
		return
	}
	if c.deliberate(cur) {
		return
	}
	if deep && len(call.Args) >= 2 {
		if sc := c.callAt(call.Lparen); sc != nil && len(sc.Common().Args) >= 2 {
			args := sc.Common().Args
			c.pinned(cur, call, fn.Pkg().Name()+"."+fn.Name(), operand{call.Args[0], args[0]}, operand{call.Args[1], args[1]}, nil)
		}
		return
	}
	replacement, ok := testifyEqual[fn.Name()]
	if !ok {
		return
	}
	first, recv := 1, 0 // assert.Equal(t, expected, actual)
	if fn.Signature().Recv() != nil {
		first, recv = 0, 1 // a.Equal(expected, actual); SSA passes a first
	}
	sc := c.callAt(call.Lparen)
	if sc == nil || len(call.Args) < first+2 || len(sc.Common().Args) < recv+first+2 {
		return
	}
	args := sc.Common().Args[recv+first:]
	exp, act := operand{call.Args[first], args[0]}, operand{call.Args[first+1], args[1]}
	t := c.pass.TypesInfo.TypeOf(act.expr)
	fix := func() []fixes.Fix { return c.inEpsilonFix(call, exp, first, replacement, provenance.FormatOf(t)) }
	if replacement != "" && c.pinned(cur, call, fn.Pkg().Name()+"."+fn.Name(), exp, act, fix) {
		return
	}
	if !provenance.IsFloat(t) || !provenance.IsFloat(c.pass.TypesInfo.TypeOf(exp.expr)) || c.exempt(exp) || c.exempt(act) {
		return
	}
	why := c.testifyHazard(exp, act, provenance.FormatOf(t))
	if why == "" {
		return
	}
	d := analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catTestify,
		Message: fmt.Sprintf("%s.%s compares %s values exactly, but %s; %s",
			fn.Pkg().Name(), fn.Name(), typeName(t), why, remedy(replacement, rtol(provenance.FormatOf(t)))),
	}
	var fs []fixes.Fix
	if !fixes.SaysExact(c.pass.Fset, fileOf(cur), cur) {
		fs = c.inEpsilonFix(call, exp, first, replacement, provenance.FormatOf(t))
	}
	fixes.Report(c.pass, d, fs...)
}

// deepEqual lists the functions outside testify that compare values, floats
// included, exactly.
var deepEqual = map[string]bool{"reflect.DeepEqual": true, "github.com/google/go-cmp/cmp.Equal": true}

func isTestify(path string) bool {
	return strings.HasSuffix(path, "github.com/stretchr/testify/assert") || strings.HasSuffix(path, "github.com/stretchr/testify/require")
}

// testifyHazard explains why an assertion's exact comparison is unreliable,
// or returns "" when it is not.
func (c *checker) testifyHazard(exp, act operand, f numeric.Format) string {
	ce, ca := c.track.Computed(exp.val), c.track.Computed(act.val)
	switch {
	case ce && ca && !derived(exp.val, act.val):
		return "both are computed and carry rounding error"
	case ce || ca:
		lit := exp
		if ce {
			lit = act
		}
		v, ok := constval.Exact(c.pass.TypesInfo, c.decls, lit.expr)
		if !ok || v.Kind() == constant.Complex {
			return ""
		}
		if stored, exact := storedValue(v, f); !exact {
			return fmt.Sprintf("one is computed and %s is stored as %s", fixes.Source(c.pass.Fset, lit.expr), numeric.Decimal(stored, 34))
		}
	}
	return ""
}

// inEpsilonFix rewrites Equal(t, expected, actual, ...) as
// InEpsilon(t, expected, actual, rtol, ...) when expected is a nonzero
// constant (InEpsilon fails on a zero expected value).
func (c *checker) inEpsilonFix(call *ast.CallExpr, exp operand, first int, replacement string, f numeric.Format) []fixes.Fix {
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, exp.expr)
	if replacement == "" || !ok || constant.Sign(v) == 0 {
		return nil
	}
	var sel *ast.Ident
	switch fun := ast.Unparen(call.Fun).(type) {
	case *ast.SelectorExpr:
		sel = fun.Sel
	case *ast.Ident:
		sel = fun
	default:
		return nil
	}
	act := call.Args[first+1]
	return []fixes.Fix{fixes.Judgement("Use "+replacement+" with relative tolerance "+rtol(f),
		fixes.Replace(sel, replacement),
		analysis.TextEdit{Pos: act.End(), End: act.End(), NewText: []byte(", " + rtol(f))})}
}

// remedy says what to assert instead.
func remedy(replacement, tol string) string {
	if replacement == "" {
		return "assert that they differ by more than a relative tolerance such as " + tol
	}
	return "use " + replacement + " with a relative tolerance such as " + tol
}

// gocheckPaths are the import paths of the gocheck suite.
var gocheckPaths = map[string]bool{"gopkg.in/check.v1": true, "github.com/go-check/check": true}

// gocheckCall reads call as gocheck's c.Assert(obtained, check.Equals,
// expected) or c.Check (check.DeepEquals too), perhaps followed by a
// comment (check.Commentf): == and reflect.DeepEqual by another name,
// judged as a pin. It reports whether call is one.
func (c *checker) gocheckCall(cur inspector.Cursor, call *ast.CallExpr, fn *types.Func) bool {
	if !gocheckPaths[fn.Pkg().Path()] || fn.Signature().Recv() == nil || fn.Name() != "Assert" && fn.Name() != "Check" || len(call.Args) < 3 {
		return false
	}
	sel, ok := ast.Unparen(call.Args[1]).(*ast.SelectorExpr)
	if !ok {
		return false
	}
	checker, isVar := c.pass.TypesInfo.Uses[sel.Sel].(*types.Var)
	if !isVar || checker.Pkg() != fn.Pkg() || checker.Name() != "Equals" && checker.Name() != "DeepEquals" {
		return false
	}
	sc := c.callAt(call.Lparen)
	if sc == nil || len(sc.Common().Args) != 4 || c.deliberate(cur) {
		return true
	}
	args := sc.Common().Args // receiver, obtained, checker, the variadic slice
	if want := variadic(args[3], 0); want != nil {
		c.pinned(cur, call, "check."+checker.Name(), operand{call.Args[2], want}, operand{call.Args[0], args[1]}, nil)
	}
	return true
}

// variadic returns the value stored at index i of the slice a call
// builds for its variadic parameter, or nil.
func variadic(v ssa.Value, i int) ssa.Value {
	sl, ok := v.(*ssa.Slice)
	if !ok || sl.X.Referrers() == nil {
		return nil
	}
	for _, r := range *sl.X.Referrers() {
		ia, ok := r.(*ssa.IndexAddr)
		if !ok || ia.Referrers() == nil {
			continue
		}
		if k, ok := ia.Index.(*ssa.Const); !ok || k.Int64() != int64(i) {
			continue
		}
		for _, st := range *ia.Referrers() {
			if st, ok := st.(*ssa.Store); ok && st.Addr == ia {
				return st.Val
			}
		}
	}
	return nil
}
