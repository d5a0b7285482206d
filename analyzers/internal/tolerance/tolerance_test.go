package tolerance_test

import (
	"go/ast"
	"go/importer"
	"go/parser"
	"go/token"
	"go/types"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/tolerance"
	"roundoff/internal/numeric"
)

// comparisons type-checks body inside func f(a, b, x, tol float64) and
// returns its ordered comparisons in order.
func comparisons(t *testing.T, body string) (*types.Info, map[types.Object]ast.Expr, *token.FileSet, []*ast.BinaryExpr) {
	fset := token.NewFileSet()
	src := "package p\n\nimport \"math\"\n\nvar _ = math.Abs\n\nfunc f(a, b, x, tol float64) bool {\n" + body + "\n}\n"
	file, err := parser.ParseFile(fset, "p.go", src, 0)
	require.NoError(t, err)
	info := &types.Info{Types: map[ast.Expr]types.TypeAndValue{}, Defs: map[*ast.Ident]types.Object{}, Uses: map[*ast.Ident]types.Object{}, Selections: map[*ast.SelectorExpr]*types.Selection{}}
	_, err = (&types.Config{Importer: importer.Default()}).Check("p", fset, []*ast.File{file}, info)
	require.NoError(t, err)
	var cmps []*ast.BinaryExpr
	ast.Inspect(file, func(n ast.Node) bool {
		if b, ok := n.(*ast.BinaryExpr); ok && (b.Op == token.LSS || b.Op == token.LEQ || b.Op == token.GTR || b.Op == token.GEQ) {
			cmps = append(cmps, b)
		}
		return true
	})
	return info, constval.Decls(info, inspector.New([]*ast.File{file})), fset, cmps
}

func TestRecognize(t *testing.T) {
	for body, want := range map[string]struct {
		kind      tolerance.Kind
		tol, a, b string
	}{
		"return math.Abs(a-b) < tol":                                      {tolerance.Absolute, "tol", "a", "b"},
		"return math.Abs(a-b) <= 1e-9*math.Abs(b)":                        {tolerance.Relative, "1e-9", "a", "b"},
		"return math.Abs(a-b)/math.Abs(b) < tol":                          {tolerance.Relative, "tol", "a", "b"},
		"return math.Abs((a-b)/b) < tol":                                  {tolerance.Relative, "tol", "a", "b"},
		"return tol*math.Max(math.Abs(a), math.Abs(b)) > math.Abs(a-b)":   {tolerance.Relative, "tol", "a", "b"},
		"d := math.Abs(a - b)\nreturn d < tol":                            {tolerance.Absolute, "tol", "a", "b"},
		"abs := math.Abs\nreturn abs(a-b) < tol":                          {tolerance.Absolute, "tol", "a", "b"},
		"return math.Abs(x) < 1e-16":                                      {tolerance.Magnitude, "1e-16", "x", ""},
		"return math.Abs(x) < tol*math.Abs(a)":                            {tolerance.RelativeMagnitude, "tol", "x", ""},
		"return float32(math.Abs(float64(float32(a)-float32(b)))) < 1e-9": {tolerance.Absolute, "1e-9", "float32(a)", "float32(b)"},
	} {
		info, decls, fset, cmps := comparisons(t, body)
		require.Len(t, cmps, 1, body)
		got, ok := tolerance.Recognize(info, decls, cmps[0])
		require.True(t, ok, body)
		assert.Equal(t, want.kind, got.Kind, body)
		assert.Equal(t, want.tol, fixes.Source(fset, got.Tol), body)
		assert.Equal(t, want.a, fixes.Source(fset, got.A), body)
		if want.b != "" {
			assert.Equal(t, want.b, fixes.Source(fset, got.B), body)
		}
	}
	for _, body := range []string{
		"return a < b", // an ordering, not a tolerance test
		"return math.Abs(a-b) <= 1e-12+1e-9*math.Abs(b)", // a mixed test
		"return a-b < tol", // a signed difference
	} {
		info, decls, _, cmps := comparisons(t, body)
		_, ok := tolerance.Recognize(info, decls, cmps[0])
		assert.False(t, ok, body)
	}
	info, decls, _, cmps := comparisons(t, "return b-a > tol")
	_, ok := tolerance.Recognize(info, decls, cmps[0])
	assert.False(t, ok, "a bare difference, not known to be a width")
	got, ok := tolerance.Reader{Info: info, Decls: decls, Ordered: func(_, _ ast.Expr) bool { return true }}.Recognize(cmps[0])
	assert.True(t, ok && got.Kind == tolerance.Absolute, "a bracket width, when the caller knows it is one")
}

// TestMixed checks the mixed test |a-b| <= atol + rtol·|b| read when the
// caller asks for it: the relative part as Tol and Scale, the absolute
// floor as Floor (the form of numpy-style closeness tests, common practice).
func TestMixed(t *testing.T) {
	for body, want := range map[string][3]string{
		"return math.Abs(a-b) <= 1e-12+1e-9*math.Abs(b)":         {"1e-9", "math.Abs(b)", "1e-12"},
		"return math.Abs(a-b) < tol*math.Abs(b)+1e-8":            {"tol", "math.Abs(b)", "1e-8"},
		"s := 1e-6 + 1e-6*math.Abs(b)\nreturn math.Abs(a-b) > s": {"1e-6", "math.Abs(b)", "1e-6"},
	} {
		info, decls, fset, cmps := comparisons(t, body)
		got, ok := tolerance.Reader{Info: info, Decls: decls, Mixed: true}.Recognize(cmps[0])
		require.True(t, ok, body)
		assert.Equal(t, tolerance.Relative, got.Kind, body)
		assert.Equal(t, want, [3]string{fixes.Source(fset, got.Tol), fixes.Source(fset, got.Scale), fixes.Source(fset, got.Floor)}, body)
	}
	info, decls, _, cmps := comparisons(t, "return math.Abs(a-b) < tol+x")
	_, ok := tolerance.Reader{Info: info, Decls: decls, Mixed: true}.Recognize(cmps[0])
	assert.False(t, ok, "a sum of two tolerances, no scale: not a mixed test")
}

// TestMeasures checks the measures of progress beyond |a-b|: widths scaled
// by constants, whose Factor turns the test into |a-b| < tol/Factor.
func TestMeasures(t *testing.T) {
	for body, want := range map[string]struct {
		kind   tolerance.Kind
		factor float64
	}{
		"return math.Abs((b-a)/2) < tol":           {tolerance.Absolute, 0.5},
		"return 0.5*math.Abs(b-a) < tol":           {tolerance.Absolute, 0.5},
		"return math.Abs(b-a)*0.25 <= tol":         {tolerance.Absolute, 0.25},
		"return math.Abs(0.5*(b-a)) < tol":         {tolerance.Absolute, 0.5},
		"return math.Abs(b-a)/2 < tol*math.Abs(a)": {tolerance.Relative, 0.5},
		"h := math.Abs(b - a) / 4\nreturn h < tol": {tolerance.Absolute, 0.25},
		"return math.Abs(x) < tol":                 {tolerance.Magnitude, 1},
	} {
		info, decls, _, cmps := comparisons(t, body)
		got, ok := tolerance.Recognize(info, decls, cmps[0])
		require.True(t, ok, body)
		assert.Equal(t, want.kind, got.Kind, body)
		assert.Equal(t, want.factor, got.Factor, body)
	}
}

// funcBody type-checks src, a function f, and returns its body and info.
func funcBody(t *testing.T, src string) (*types.Info, *ast.BlockStmt) {
	info, file := checkFile(t, src)
	return info, file.Decls[len(file.Decls)-1].(*ast.FuncDecl).Body
}

// checkFile parses and type-checks src as the one file of package p.
func checkFile(t *testing.T, src string) (*types.Info, *ast.File) {
	fset := token.NewFileSet()
	file, err := parser.ParseFile(fset, "p.go", "package p\n\n"+src, 0)
	require.NoError(t, err)
	info := &types.Info{Types: map[ast.Expr]types.TypeAndValue{}, Defs: map[*ast.Ident]types.Object{}, Uses: map[*ast.Ident]types.Object{}, Selections: map[*ast.SelectorExpr]*types.Selection{}}
	_, err = (&types.Config{Importer: importer.Default()}).Check("p", fset, []*ast.File{file}, info)
	require.NoError(t, err)
	return info, file
}

// ident finds the identifier named name in body.
func ident(body ast.Node, name string) *ast.Ident {
	var found *ast.Ident
	ast.Inspect(body, func(n ast.Node) bool {
		if id, ok := n.(*ast.Ident); ok && id.Name == name && found == nil {
			found = id
		}
		return found == nil
	})
	return found
}

func TestOrdered(t *testing.T) {
	for src, want := range map[string]bool{
		// Bisection: lo or hi moves to the midpoint of both.
		"func f(lo, hi float64) { for hi-lo > 1e-9 { m := (lo + hi) / 2; if m*m > 2 { hi = m } else { lo = m } } }": true,
		// The order is restored first.
		"func f(lo, hi float64) { if lo > hi { lo, hi = hi, lo }; for hi-lo > 1e-9 { hi -= 1 } }": true,
		// The order is checked.
		"func f(lo, hi float64) { if hi <= lo { return }; for hi-lo > 1e-9 { hi -= 1 } }": true,
		// Successive iterates of Newton: a signed step.
		"func f(hi, lo float64) { for hi-lo > 1e-9 { lo = hi; hi = hi - (hi*hi-2)/(2*hi) } }": false,
	} {
		info, body := funcBody(t, src)
		assert.Equal(t, want, tolerance.Ordered(info, nil, body, ident(body, "hi"), ident(body, "lo")), src)
	}
}

// TestOrderedThroughMover: a point shifted into place by a helper that
// stores through pointers (mov2(&x, &fx, u, fu), as ported C code shifts
// points) is assigned as if written out, so an end moved to it is still a
// point computed from both ends.
func TestOrderedThroughMover(t *testing.T) {
	src := `func mov2(a, b *float64, c, d float64) { *a = c; *b = d }

func f(g func(float64) float64, lo, hi float64) float64 {
	var x, fx float64
	for hi-lo > 1e-9 {
		u := (lo + hi) / 2
		fu := g(u)
		mov2(&x, &fx, u, fu)
		if fx > 0 {
			hi = x
		} else {
			lo = x
		}
	}
	return x
}`
	info, file := checkFile(t, src)
	body := file.Decls[1].(*ast.FuncDecl).Body
	movers := tolerance.Movers(info, []*ast.File{file})
	assert.Len(t, movers, 1)
	assert.True(t, tolerance.Ordered(info, movers, body, ident(body, "hi"), ident(body, "lo")))
	assert.False(t, tolerance.Ordered(info, nil, body, ident(body, "hi"), ident(body, "lo")), "the helper unread")
}

func TestShrunkAndFlags(t *testing.T) {
	info, body := funcBody(t, `func f(a, b float64) bool {
	w, h, s := b-a, 1.0, 1.0
	done := false
	for !done {
		w *= 0.618
		h = h / 2
		s = s * 2
		done = w < 1e-8 && h < 1e-3
	}
	return done
}`)
	shrunk := tolerance.Shrunk(info, body.List[2].(*ast.ForStmt).Body)
	assert.True(t, shrunk[info.Uses[ident(body.List[2], "w")].(*types.Var)])
	assert.True(t, shrunk[info.Uses[ident(body.List[2], "h")].(*types.Var)])
	assert.False(t, shrunk[info.Uses[ident(body.List[2], "s")].(*types.Var)], "grows")
	flags := tolerance.Flags(info, body)
	assert.Len(t, flags[info.Uses[ident(body.List[2], "done")].(*types.Var)], 1, "the comparison, not the false it starts with")
}

// TestJudge checks the lines against IEEE 754-2019 binary64: u = 2^-53,
// eps = 2^-52, spacing 2^-52 at 1 and 2^-33 at 1e6, smallest subnormal
// 2^-1074; underflow guards at or below 2^-511 (common practice).
func TestJudge(t *testing.T) {
	f := numeric.Float64
	for _, c := range []struct {
		kind tolerance.Kind
		tol  float64
		mag  float64
		want tolerance.Resolution
	}{
		{tolerance.Relative, 1e-17, 0, tolerance.BelowRoundoff},
		{tolerance.Relative, math.Ldexp(1, -53), 0, tolerance.Resolvable}, // u itself
		{tolerance.Relative, 1.5e-16, 0, tolerance.Resolvable},            // between u and eps
		{tolerance.Absolute, 1e-20, 0, tolerance.BelowEpsilon},
		{tolerance.Absolute, 1e-15, 0, tolerance.Resolvable},
		{tolerance.Absolute, 1e-17, 1, tolerance.BelowSpacing}, // half of 2^-52 is 1.1e-16
		{tolerance.Absolute, 1e-10, 1e6, tolerance.Resolvable}, // half of 2^-33 is 5.8e-11
		{tolerance.Absolute, 5e-11, 1e6, tolerance.BelowSpacing},
		{tolerance.Absolute, math.SmallestNonzeroFloat64, 0, tolerance.Subnormal},
		{tolerance.Magnitude, math.SmallestNonzeroFloat64, 0, tolerance.Resolvable}, // |x| < smallest is x == 0
		{tolerance.Absolute, 1e-300, 0, tolerance.Resolvable},                       // an underflow guard
		{tolerance.Absolute, 0, 0, tolerance.Resolvable},                            // exact on purpose
		{tolerance.Relative, -1, 0, tolerance.Resolvable},                           // a sentinel
		{tolerance.Relative, math.NaN(), 0, tolerance.Resolvable},
	} {
		assert.Equal(t, c.want, tolerance.Judge(c.kind, c.tol, f, c.mag), "%v %g at %g", c.kind, c.tol, c.mag)
	}
	assert.Equal(t, math.Ldexp(1, -511), tolerance.UnderflowGuard)
}

// TestCopies checks which local variables hand a parameter or a field on
// to their tests unchanged (common practice: a copy with a default, tol :=
// o.Tol; if tol == 0 { tol = c }, is how options reach a loop).
func TestCopies(t *testing.T) {
	info, body := funcBody(t, `func f(o struct{ Tol float64 }, tol float64) {
	copied := o.Tol
	if copied == 0 {
		copied = 1e-9
	}
	again := copied
	passed := tol
	scaled := tol
	scaled *= 1e6
	mixed := tol
	mixed = o.Tol
	_, _, _, _, _ = copied, again, passed, scaled, mixed
}`)
	copies := tolerance.Copies(info, body)
	name := func(v string) string {
		e, ok := copies[info.Uses[ident(body.List[len(body.List)-1], v)].(*types.Var)]
		if !ok {
			return ""
		}
		return types.ExprString(e)
	}
	assert.Equal(t, "o.Tol", name("copied"), "the default is a constant")
	assert.Equal(t, "copied", name("again"), "a copy of a copy, followed by Origin")
	assert.Equal(t, "tol", name("passed"))
	assert.Empty(t, name("scaled"), "scaled: the tolerance tested is not the one given")
	assert.Empty(t, name("mixed"), "two sources")
}

// TestTwoSided checks that a difference bounded from both sides by a
// tolerance and its negation reads as |a-b| < tol (common practice:
// -e < d && d < e is |d| < e, IEEE 754-2019 comparisons being exact).
func TestTwoSided(t *testing.T) {
	info, body := funcBody(t, `func f(a, b, e float64) []bool {
	return []bool{
		a-b > -e && a-b < e,
		-1e-9 < a-b && a-b <= 1e-9,
		a-b < e && -e < a-b,
		a-b > -2*e && a-b < e,
		-1e-9 < a-b && a-b < 1,
	}
}`)
	elts := body.List[0].(*ast.ReturnStmt).Results[0].(*ast.CompositeLit).Elts
	r := tolerance.Reader{Info: info}
	for i, want := range []string{"e", "1e-9", "e", "", ""} {
		test, ok := r.Recognize(elts[i].(*ast.BinaryExpr))
		if want == "" {
			assert.False(t, ok, i)
			continue
		}
		require.True(t, ok, i)
		assert.True(t, test.TwoSided, i)
		assert.Equal(t, tolerance.Absolute, test.Kind, i)
		assert.Equal(t, want, types.ExprString(test.Tol), i)
		assert.Equal(t, "a", types.ExprString(test.A), i)
	}
}
