package exacteq

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"
	"math/big"
	"strings"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
)

// An exponent taken from logarithms. int(math.Log(n)/math.Log(b)), or
// math.Floor or math.Ceil of it, is meant to be the whole k with b^k = n
// when n is a power of b. The quotient of two rounded logarithms is
// rounded again, and at exact powers it lands within an ulp of k, on
// either side: math.Log(1000)/math.Log(10) is 2.9999999999999996, so the
// truncation is off by one exactly at the values the count is about.
// Where the base is a constant, the quotient is evaluated as the code
// writes it at every power of the base the argument's type can hold, and
// only a truncation that some power sends the wrong way is reported:
// math.Log(x)/math.Ln2 lands at or above k at every power of two, so
// int() of it is right there, while math.Ceil of it is not.

// logRatio is a logarithm of x to another base, as written.
type logRatio struct {
	quot   *ast.BinaryExpr
	num    *ast.CallExpr // the logarithm of x
	x      ast.Expr
	base   float64                 // a whole constant base, or 0 when it is not constant
	eval   func(x float64) float64 // the ratio as written, for a constant base
	offset float64                 // a constant added before truncation
}

// exponentSite reads call as a truncation of a ratio of logarithms whose
// argument is not drawn at random. It reports whether the truncation is
// upward.
func exponentSite(info *types.Info, call *ast.CallExpr) (r logRatio, up, ok bool) {
	up, ok = truncation(info, call)
	if !ok {
		return r, false, false
	}
	r, ok = readLogRatio(info, call.Args[0])
	return r, up, ok && !drawn(info, r.x)
}

// exponent reports call, a truncation (math.Floor, Ceil, Trunc, or a
// conversion to an integer type) of a ratio of logarithms, when exact
// powers of the base make it take the wrong whole number. An argument
// that this package computes with rounding (a series, a product) is an
// exact power only by accident, and its exponent is left alone; one read
// as given (a parameter, a field, a count converted to float) may be any
// power its caller passes.
func (c *checker) exponent(call *ast.CallExpr) {
	r, up, ok := exponentSite(c.pass.TypesInfo, call)
	if !ok {
		return
	}
	if lc := c.callAt(r.num.Lparen); lc == nil || len(lc.Call.Args) != 1 || c.track.Computed(lc.Call.Args[0]) {
		return
	}
	fset := c.pass.Fset
	trunc := math.Floor
	if up {
		trunc = math.Ceil
	}
	what := fixes.Source(fset, call)
	d := analysis.Diagnostic{Pos: call.Pos(), End: call.End(), Category: catExponent}
	if r.base == 0 {
		d.Message = fmt.Sprintf("%s takes a whole number from a quotient of rounded logarithms: at exact powers of the base the quotient lands within an ulp of the exponent, on either side (math.Log(1000)/math.Log(10) is 2.9999999999999996), and the truncation is then off by one; count with integers (multiply by the base until past the value)", what)
		fixes.Report(c.pass, d)
		return
	}
	limit, holder := powerLimit(c.pass.TypesInfo, r.x)
	k, q, wrong, total := wrongPowers(r, limit, trunc)
	if wrong == 0 {
		return
	}
	got, want := trunc(q+r.offset), trunc(float64(k)+r.offset)
	advice := "count with integers (multiply by the base until past the value)"
	var fs []fixes.Fix
	if r.base == 2 {
		advice = "math.Log2 is exact at powers of two (it splits off the binary exponent, math/log10.go), or use bits.Len on an integer"
		if sel, ok := r.num.Fun.(*ast.SelectorExpr); ok {
			log2 := fmt.Sprintf("%s.Log2(%s)", fixes.Source(fset, sel.X), fixes.Source(fset, r.x))
			fs = append(fs, fixes.Judgement("Take the exponent with "+log2, fixes.Replace(r.quot, log2)))
		}
	}
	d.Message = fmt.Sprintf("%s is %v, not %v, at %s = %s (%v^%d): the quotient of rounded logarithms is %v there, and %d of the %d powers of %v %s land on the wrong side; %s",
		what, got, want, fixes.Source(fset, r.x), formatPower(r.base, k), r.base, k, q, wrong, total, r.base, holder, advice)
	fixes.Report(c.pass, d, fs...)
}

// truncation reports whether call truncates its one float argument to a
// whole number, and whether upward (math.Ceil).
func truncation(info *types.Info, call *ast.CallExpr) (up, ok bool) {
	if len(call.Args) != 1 || !provenance.IsFloat(info.TypeOf(call.Args[0])) {
		return false, false
	}
	if tv := info.Types[call.Fun]; tv.IsType() {
		return false, isInteger(tv.Type)
	}
	switch provenance.MathCallee(info, call) {
	case "Floor", "Trunc":
		return false, true
	case "Ceil":
		return true, true
	}
	return false, false
}

// logs are the logarithms a ratio is read from, with the base each is to.
var logs = map[string]struct {
	base float64
	fn   func(float64) float64
}{"Log": {math.E, math.Log}, "Log10": {10, math.Log10}, "Log2": {2, math.Log2}}

// readLogRatio reads e as L(x)/L'(b), L(x)/C or L(x)*C (C a constant),
// perhaps plus or minus a constant, with L and L' among logs: the
// logarithm of x to another base.
func readLogRatio(info *types.Info, e ast.Expr) (logRatio, bool) {
	var r logRatio
	e = ast.Unparen(e)
	if b, ok := e.(*ast.BinaryExpr); ok && (b.Op == token.ADD || b.Op == token.SUB) {
		if v, ok := constFloat(info, b.Y); ok {
			r.offset, e = v, ast.Unparen(b.X)
			if b.Op == token.SUB {
				r.offset = -v
			}
		} else if v, ok := constFloat(info, b.X); ok && b.Op == token.ADD {
			r.offset, e = v, ast.Unparen(b.Y)
		}
	}
	q, ok := e.(*ast.BinaryExpr)
	if !ok || q.Op != token.QUO && q.Op != token.MUL {
		return r, false
	}
	num, other := ast.Unparen(q.X), ast.Unparen(q.Y)
	if q.Op == token.MUL {
		if _, isConst := constFloat(info, num); isConst {
			num, other = other, num
		}
	}
	call, ok := num.(*ast.CallExpr)
	if !ok || len(call.Args) != 1 {
		return r, false
	}
	l, ok := logs[provenance.MathCallee(info, call)]
	if !ok {
		return r, false
	}
	r.quot, r.num, r.x = q, call, call.Args[0]
	if c, isConst := constFloat(info, other); isConst {
		if q.Op == token.MUL {
			r.eval, r.base = func(x float64) float64 { return l.fn(x) * c }, math.Pow(l.base, 1/c)
		} else {
			r.eval, r.base = func(x float64) float64 { return l.fn(x) / c }, math.Pow(l.base, c)
		}
		return r.whole()
	}
	den, ok := other.(*ast.CallExpr)
	if !ok || q.Op != token.QUO || len(den.Args) != 1 {
		return r, false
	}
	ld, ok := logs[provenance.MathCallee(info, den)]
	if !ok {
		return r, false
	}
	if b, isConst := constFloat(info, den.Args[0]); isConst {
		r.eval, r.base = func(x float64) float64 { return l.fn(x) / ld.fn(b) }, b
		return r.whole()
	}
	return r, true // a base known only at run time
}

// whole keeps a constant base that is a whole number of at least 2,
// rounding away the error of the constant it was read from (math.Ln2
// gives e^Ln2 = 2.0000000000000004); another base counts nothing.
func (r logRatio) whole() (logRatio, bool) {
	b := math.Round(r.base)
	if b < 2 || math.Abs(r.base-b) > 1e-9*b {
		return r, false
	}
	r.base = b
	return r, true
}

// constFloat returns the value of a constant expression.
func constFloat(info *types.Info, e ast.Expr) (float64, bool) {
	tv, ok := info.Types[e]
	if !ok || tv.Value == nil || tv.Value.Kind() == constant.Bool || tv.Value.Kind() == constant.String {
		return 0, false
	}
	v, _ := constant.Float64Val(constant.ToFloat(tv.Value))
	return v, true
}

// drawn reports whether x is computed from a draw: a call into math/rand
// or a call with no arguments that returns a float (a generator's next
// value). A continuous variate is an exact power of the base with
// probability 0, and the geometric variate Floor(Log(u)/Log(1-p)) is
// right.
func drawn(info *types.Info, x ast.Expr) bool {
	found := false
	ast.Inspect(x, func(n ast.Node) bool {
		call, ok := n.(*ast.CallExpr)
		if !ok || found {
			return !found
		}
		if fn, ok := typeutil.Callee(info, call).(*types.Func); ok && fn.Pkg() != nil && strings.HasPrefix(fn.Pkg().Path(), "math/rand") {
			found = true
		}
		if len(call.Args) == 0 && provenance.IsFloat(info.TypeOf(call)) {
			found = true
		}
		return !found
	})
	return found
}

// powerLimit returns the bound below which x's values lie, and what
// holds them: an integer converted to a float holds its type's range
// (int as on 64-bit platforms), a float any finite value.
func powerLimit(info *types.Info, x ast.Expr) (float64, string) {
	if conv, ok := ast.Unparen(x).(*ast.CallExpr); ok && len(conv.Args) == 1 && info.Types[conv.Fun].IsType() {
		t := info.TypeOf(conv.Args[0])
		if b, ok := t.Underlying().(*types.Basic); ok && b.Info()&types.IsInteger != 0 {
			bits := 8 * types.SizesFor("gc", "amd64").Sizeof(b)
			if b.Info()&types.IsUnsigned == 0 {
				bits--
			}
			return math.Ldexp(1, int(bits)), "that " + types.TypeString(t, types.RelativeTo(nil)) + " holds"
		}
	}
	return math.MaxFloat64, "exact in float64"
}

// wrongPowers evaluates the ratio at each power of the base exactly
// representable in float64 and at most limit, and counts those whose
// truncation is not the exponent (plus the offset). It returns the first
// such exponent and its quotient.
func wrongPowers(r logRatio, limit float64, trunc func(float64) float64) (first int, q float64, wrong, total int) {
	p := big.NewInt(1)
	b := big.NewInt(int64(r.base))
	for k := 0; ; k++ {
		f, acc := new(big.Float).SetInt(p).Float64()
		if acc != big.Exact || f >= limit || math.IsInf(f, 0) {
			return first, q, wrong, total
		}
		total++
		if v := r.eval(f); trunc(v+r.offset) != trunc(float64(k)+r.offset) {
			if wrong == 0 {
				first, q = k, v
			}
			wrong++
		}
		p.Mul(p, b)
	}
}

// formatPower writes base^k in full below 1e21, as 536870912.
func formatPower(base float64, k int) string {
	if p := math.Pow(base, float64(k)); p < 1e21 {
		return fmt.Sprintf("%.0f", p)
	}
	return fmt.Sprint(math.Pow(base, float64(k)))
}
