package exacteq

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"
	"math/bits"
	"slices"
	"strconv"
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

// printedDigits is the number of significant digits from which a decimal
// constant reads as a printed result: Go prints a float64 in its shortest
// form (strconv 'g', -1), 16 or 17 digits for most values that are not
// short decimals, and a float32 in 8 or 9. Data typed from other sources
// (coordinates to 15 digits) stay below.
func printedDigits(f numeric.Format) int {
	if f == numeric.Float32 {
		return 8
	}
	return 16
}

// pin describes an expected value that pins a printed result.
type pin struct {
	expr   ast.Expr // the constant as written
	value  float64  // the value its type stores
	digits string   // the significant digits of its shortest form
	f      numeric.Format
}

// pinned reports, in a _test.go file, an exact comparison of a value with an
// expected one that holds a printed result: a decimal constant of 16 or
// more significant digits (8 for float32) that the type stores inexactly,
// written in the comparison, in a named constant, or in the table of
// cases the expected value is read from. Such a test pins the last bits of
// a computation, which change with the order of operations and with
// fused multiply-add (Go may fuse x*y+z; arm64, ppc64le, s390x, riscv64
// and amd64 at GOAMD64=v3 do), so it fails on other platforms. A value
// parsed from a string that holds the same digits is a round trip, exact
// by correct rounding (IEEE 754-2019 §5.12), and left alone. It reports
// whether it reported.
func (c *checker) pinned(cur inspector.Cursor, node ast.Node, what string, x, y operand, fix func() []fixes.Fix) bool {
	if !c.inTest(cur) {
		return false
	}
	fn := enclosingFunc(cur)
	for _, pair := range [][2]operand{{x, y}, {y, x}} {
		exp, got := pair[0].expr, pair[1]
		if c.isConst(got.expr) || c.exempt(pair[0]) || c.uncomputed(got.val) || decoded(got.val) || c.judge.Value(got.val) {
			continue
		}
		p, ok := c.printed(exp)
		if !ok || c.roundTrip(fn, p) || c.passedThrough(fn, p) || c.judge.OnInputs(got.val) || !c.judge.Cause(got.val) {
			continue
		}
		var fs []fixes.Fix
		if fix != nil && !fixes.SaysExact(c.pass.Fset, fileOf(cur), cur) {
			fs = fix()
		}
		d := analysis.Diagnostic{
			Pos: node.Pos(), End: node.End(), Category: catPinned,
			Message: fmt.Sprintf("%s pins a computed result to %s, %s of %d significant digits: its last bits can depend on the order of operations, on the math library and on whether the platform fuses multiply-add (arm64, ppc64le, s390x, riscv64, amd64 at GOAMD64=v3), so the test can fail elsewhere; compare within a relative tolerance such as %s",
				what, c.describe(p), c.form(p), len(p.digits), rtol(p.f)),
		}
		if p.expr.Pos() < node.Pos() || p.expr.End() > node.End() {
			d.Related = []analysis.RelatedInformation{{Pos: p.expr.Pos(), End: p.expr.End(), Message: "the printed value"}}
		}
		fixes.Report(c.pass, d, fs...)
		return true
	}
	return false
}

// uncomputed reports whether v is the float result of a function of this
// package that returns no computed value (a conversion, a selection): what
// it returns is exact, and so is its comparison with the value it came
// from.
func (c *checker) uncomputed(v ssa.Value) bool {
	if mi, ok := v.(*ssa.MakeInterface); ok {
		v = mi.X
	}
	call, ok := provenance.Strip(v).(*ssa.Call)
	if !ok || !provenance.IsFloat(call.Type()) {
		return false // only float results are summarised
	}
	fn := call.Common().StaticCallee()
	if fn == nil || fn.Blocks == nil || fn.Package() == nil || fn.Package().Pkg != c.pass.Pkg {
		return false // unknown, or from another package: no claim
	}
	return !slices.Contains(c.track.Returns(fn), true)
}

// decoded reports whether v is read from a variable that a standard-library
// call fills through its address (json.Unmarshal(data, &got)): a value
// decoded from text is correctly rounded from the digits written there
// (IEEE 754-2019 §5.12), and compares exactly with them.
func decoded(v ssa.Value) bool {
	for range 8 {
		if a, ok := provenance.Strip(v).(*ssa.Alloc); ok {
			return filledByStd(a)
		}
		var ok bool
		if v, ok = holder(v); !ok {
			return false
		}
	}
	return false
}

// holder returns the value v is read from: the address a load reads, the
// struct or array a field or element belongs to.
func holder(v ssa.Value) (ssa.Value, bool) {
	switch x := provenance.Strip(v).(type) {
	case *ssa.UnOp:
		return x.X, x.Op == token.MUL
	case *ssa.Field:
		return x.X, true
	case *ssa.FieldAddr:
		return x.X, true
	case *ssa.Index:
		return x.X, true
	case *ssa.IndexAddr:
		return x.X, true
	}
	return nil, false
}

// filledByStd reports whether the address a is passed to a function of
// the standard library.
func filledByStd(a ssa.Value) bool {
	for _, r := range *a.Referrers() {
		switch r := r.(type) {
		case *ssa.MakeInterface:
			if filledByStd(r) {
				return true
			}
		case ssa.CallInstruction:
			fn := r.Common().StaticCallee()
			if fn != nil && fn.Pkg != nil && !strings.Contains(strings.Split(fn.Pkg.Pkg.Path(), "/")[0], ".") {
				return true
			}
		}
	}
	return false
}

// printed finds the long decimal constant that e is, names, or reads from
// a table of cases (a field tt.want whose values the package's composite
// literals give).
func (c *checker) printed(e ast.Expr) (pin, bool) {
	e = ast.Unparen(e)
	if c.isConst(e) {
		return c.printedConst(e)
	}
	var vals []ast.Expr
	switch e := e.(type) {
	case *ast.CompositeLit:
		vals = []ast.Expr{e}
	case *ast.Ident:
		init, ok := c.decls[c.pass.TypesInfo.Uses[e]]
		if sel, isSel := ast.Unparen(init).(*ast.SelectorExpr); ok && isSel {
			return c.printed(sel) // want := tc.want: the table's value
		} else if ok {
			vals = []ast.Expr{init}
		}
	case *ast.SelectorExpr:
		if field := c.pass.TypesInfo.Uses[e.Sel]; field != nil && provenance.InTestFile(c.pass.Fset, field.Pos()) {
			vals = c.fieldValues()[field]
		}
	}
	for _, v := range vals {
		if id, ok := ast.Unparen(v).(*ast.Ident); ok && c.decls[c.pass.TypesInfo.Uses[id]] != nil {
			v = c.decls[c.pass.TypesInfo.Uses[id]] // want: wantResult, a variable given the printed value
		}
		var found pin
		ast.Inspect(v, func(n ast.Node) bool {
			if lit, ok := n.(*ast.BasicLit); ok {
				if p, ok := c.printedConst(lit); ok {
					found = p
				}
			}
			return found.expr == nil
		})
		if found.expr != nil {
			return found, true
		}
	}
	return pin{}, false
}

// printedConst reports whether e is a float constant of a printed
// result's length that its type stores inexactly (or, for a constant whose
// decimals are not in view, that fills the significand): the shortest decimal
// that reads back as the stored value (strconv 'g', -1) has 16 or more
// significant digits (8 for float32). A decimal written long whose value
// is short (0.1000000000000000055) is no printed result, nor is a dyadic
// value such as 2^-15.
func (c *checker) printedConst(e ast.Expr) (pin, bool) {
	t := c.pass.TypesInfo.TypeOf(e)
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, e)
	if !ok || t == nil || !provenance.IsFloat(t) || isComplex(t) || v.Kind() == constant.Complex {
		return pin{}, false
	}
	f := provenance.FormatOf(t)
	stored, exact := storedValue(v, f)
	digits := shortestDigits(stored, f)
	return pin{e, stored, digits, f}, (!exact || fullBits(stored, f)) && len(digits) >= printedDigits(f)
}

// fullBits reports whether x needs more than half the significand bits of
// format f: a value rounded from an irrational or a long quotient, as a
// constant of another package already is (go/types keeps typed constants
// rounded), not a short binary fraction such as 2^-15 or 0.375.
func fullBits(x float64, f numeric.Format) bool {
	if x == 0 || math.IsInf(x, 0) || math.IsNaN(x) {
		return false
	}
	frac, _ := math.Frexp(math.Abs(x))
	mant := uint64(math.Ldexp(frac, 53))
	return 53-bits.TrailingZeros64(mant) > f.Bits/2
}

// form names what the pinned constant is: a printed value where it is
// written as a literal (directly or in its declaration), a value where it
// is an expression such as 8.0 / 3.0 or a constant of another package.
func (c *checker) form(p pin) string {
	e := ast.Unparen(p.expr)
	if id, ok := e.(*ast.Ident); ok {
		if init, ok := c.decls[c.pass.TypesInfo.Uses[id]]; ok {
			e = ast.Unparen(init)
		}
	}
	if u, ok := e.(*ast.UnaryExpr); ok {
		e = ast.Unparen(u.X)
	}
	if _, ok := e.(*ast.BasicLit); ok {
		return "a printed value"
	}
	return "a value"
}

// describe writes the pinned constant as the message shows it: a literal
// as written, a name with its value in its format's shortest form.
func (c *checker) describe(p pin) string {
	src := fixes.Source(c.pass.Fset, p.expr)
	if _, ok := ast.Unparen(p.expr).(*ast.BasicLit); ok {
		return src
	}
	bits := 64
	if p.f == numeric.Float32 {
		bits = 32
	}
	return src + " (" + strconv.FormatFloat(p.value, 'g', -1, bits) + ")"
}

// shortestDigits returns the significant digits of the shortest decimal
// that format f reads back as x.
func shortestDigits(x float64, f numeric.Format) string {
	bits := 64
	if f == numeric.Float32 {
		bits = 32
	}
	mant, _, _ := strings.Cut(strconv.FormatFloat(math.Abs(x), 'e', -1, bits), "e")
	return strings.ReplaceAll(mant, ".", "")
}

// roundTrip reports whether a string literal in fn holds the digits of the
// pinned value: the value under test was then parsed or printed from them,
// exact by correct rounding (IEEE 754-2019 §5.12). A message (an argument
// of a test's Error or Fatal, or of fmt's and log's printing functions)
// that quotes the value is printed from it, not parsed into it.
func (c *checker) roundTrip(fn ast.Node, p pin) bool {
	if fn == nil {
		return false
	}
	found := false
	ast.Inspect(fn, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.CallExpr:
			return !c.message(n)
		case *ast.BasicLit:
			found = n.Kind == token.STRING && strings.Contains(strings.ReplaceAll(n.Value, ".", ""), p.digits)
		}
		return !found
	})
	return found
}

// message reports whether call prints its arguments as a message: a
// function or method of package testing, log or errors, or a function of
// fmt other than the scanning ones.
func (c *checker) message(call *ast.CallExpr) bool {
	fn := typeutil.Callee(c.pass.TypesInfo, call)
	if fn == nil || fn.Pkg() == nil {
		return false
	}
	switch fn.Pkg().Path() {
	case "testing", "log", "errors":
		return true
	case "fmt":
		return !strings.Contains(strings.ToLower(fn.Name()), "scan")
	}
	return false
}

// passedThrough reports whether the pinned value also appears in fn among
// the inputs, not only as expected values of comparisons: a value such as a
// vertex kept by a convex hull or a clip reaches the result without
// arithmetic, and compares exactly.
func (c *checker) passedThrough(fn ast.Node, p pin) bool {
	if fn == nil {
		return false
	}
	expected := map[ast.Node]bool{}
	ast.Inspect(fn, func(m ast.Node) bool {
		switch m := m.(type) {
		case *ast.BinaryExpr:
			if m.Op == token.EQL || m.Op == token.NEQ {
				expected[ast.Unparen(m.X)], expected[ast.Unparen(m.Y)] = true, true
			}
		case *ast.CallExpr:
			if strings.Contains(types.ExprString(m.Fun), "Equal") {
				for _, a := range m.Args {
					expected[ast.Unparen(a)] = true
				}
			}
		}
		return true
	})
	found := false
	ast.Inspect(fn, func(m ast.Node) bool {
		if b, ok := m.(*ast.BasicLit); ok && b.Kind == token.FLOAT && !expected[b] && b != p.expr {
			v, ok := constval.Exact(c.pass.TypesInfo, c.decls, b)
			if stored, _ := storedValue(v, p.f); ok && stored == p.value {
				found = true
			}
		}
		return !found
	})
	return found
}

// fieldValues returns the values the package's composite literals give
// each struct field, computed once.
func (c *checker) fieldValues() map[types.Object][]ast.Expr {
	if c.fields == nil {
		c.fields = constval.Fields(c.pass.TypesInfo, c.pass.Files)
	}
	return c.fields
}

// isConst reports whether e is a constant expression.
func (c *checker) isConst(e ast.Expr) bool {
	tv, ok := c.pass.TypesInfo.Types[e]
	return ok && tv.Value != nil
}

// inTest reports whether cur lies in a _test.go file.
func (c *checker) inTest(cur inspector.Cursor) bool {
	return provenance.InTestFile(c.pass.Fset, cur.Node().Pos())
}

// enclosingFunc returns the outermost function declaration around cur, or nil.
func enclosingFunc(cur inspector.Cursor) ast.Node {
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		return fd.Node()
	}
	return nil
}
