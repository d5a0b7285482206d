package constval_test

import (
	"go/ast"
	"go/constant"
	"go/importer"
	"go/parser"
	"go/token"
	"go/types"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"
	"golang.org/x/tools/go/ssa/ssautil"

	"roundoff/analyzers/internal/constval"
)

// build type-checks src as package p and builds its SSA.
func build(t *testing.T, src string) (*ssa.Package, *types.Info, []*ast.File) {
	t.Helper()
	fset := token.NewFileSet()
	f, err := parser.ParseFile(fset, "p.go", src, 0)
	require.NoError(t, err)
	files := []*ast.File{f}
	pkg, info, err := ssautil.BuildPackage(&types.Config{Importer: importer.Default()}, fset,
		types.NewPackage("p", "p"), files, ssa.SanityCheckFunctions)
	require.NoError(t, err)
	return pkg, info, files
}

// rat returns the exact rational p/q as a constant.
func rat(p, q int64) constant.Value {
	return constant.BinaryOp(constant.MakeInt64(p), token.QUO, constant.MakeInt64(q))
}

func exactEq(t *testing.T, want, got constant.Value, msg string) {
	t.Helper()
	assert.True(t, constant.Compare(want, token.EQL, got), "%s: want %s, got %s", msg, want.ExactString(), got.ExactString())
}

const exactSrc = `package p

import "math"

const a = 0.1
const b float64 = 0.1
const c32 float32 = 0.1
const (
	c = 0.2
	d // repeats 0.2
	e = iota * 0.5
	f // repeats iota * 0.5 with iota = 3
	g float64 = 0.3
	h
)

var v = 1.5 // initialised once, never reassigned: followed like a constant

var w = 2.5 // reassigned below: not followed

func reassign() { w = 3 }

var (
	useA    = a
	useB    = b
	useC32  = c32
	useD    = d
	useF    = f
	useH    = h
	negA    = -a
	sum     = a + 0.2
	triple  = b * 3
	quo     = a / 3
	intDiv  = 7 / 2
	fltDiv  = 7.0 / 2
	conv    = float64(0.1)
	pi      = math.Pi
	useV    = v
	useW    = w
	call    = math.Sqrt(a)
	paren   = (a)
)
`

func TestExact(t *testing.T) {
	_, info, files := build(t, exactSrc)
	decls := constval.Decls(info, inspector.New(files))
	init := map[string]ast.Expr{}
	for _, d := range files[0].Decls {
		if gen, ok := d.(*ast.GenDecl); ok && gen.Tok == token.VAR {
			for _, s := range gen.Specs {
				vs := s.(*ast.ValueSpec)
				init[vs.Names[0].Name] = vs.Values[0]
			}
		}
	}
	exact := func(name string) constant.Value {
		v, ok := constval.Exact(info, decls, init[name])
		require.True(t, ok, name)
		return v
	}
	// 0.1 = 1/10 is not a binary64 number (Goldberg 1991; IEEE 754-2019): an
	// exact 1/10 is proof that the decimal was kept, not rounded.
	exactEq(t, rat(1, 10), exact("useA"), "untyped const")
	exactEq(t, rat(1, 10), exact("useB"), "typed float64 const keeps its decimal")
	exactEq(t, rat(1, 10), exact("useC32"), "typed float32 const keeps its decimal")
	exactEq(t, rat(1, 5), exact("useD"), "implicit repetition")
	exactEq(t, rat(3, 10), exact("useH"), "implicit repetition, typed")
	exactEq(t, rat(-1, 10), exact("negA"), "negation")
	exactEq(t, rat(3, 10), exact("sum"), "0.1+0.2 is exactly 0.3 in rationals")
	exactEq(t, rat(3, 10), exact("triple"), "typed b*3 evaluated exactly")
	exactEq(t, rat(1, 30), exact("quo"), "division")
	exactEq(t, constant.MakeInt64(3), exact("intDiv"), "integer division truncates")
	exactEq(t, rat(7, 2), exact("fltDiv"), "float division")
	exactEq(t, rat(1, 10), exact("paren"), "parentheses")
	// iota constants are skipped by Decls; Exact falls back on the type
	// checker's value: f = 3 * 0.5.
	exactEq(t, rat(3, 2), exact("useF"), "iota")
	// A numeric conversion is looked through: the decimal as written, the
	// rounding being what callers judge (constval.go's documented choice).
	exactEq(t, rat(1, 10), exact("conv"), "float64(0.1)")
	exactEq(t, rat(3, 2), exact("useV"), "never-reassigned variable")
	// The type checker rounds the typed constant b to float64: what Exact
	// adds over info.Types is the 1/10.
	assert.False(t, constant.Compare(rat(1, 10), token.EQL, info.Types[init["useB"]].Value))
	// Constants of other packages: the type checker's value.
	f, _ := constant.Float64Val(exact("pi"))
	assert.Equal(t, math.Pi, f)
	// Not constants: a reassigned variable, a call.
	for _, name := range []string{"useW", "call"} {
		_, ok := constval.Exact(info, decls, init[name])
		assert.False(t, ok, name)
	}

	// Decls: every non-iota constant, implicit repetitions included.
	names := map[string]bool{}
	for obj := range decls {
		if _, ok := obj.(*types.Const); ok {
			names[obj.Name()] = true
		}
	}
	assert.Equal(t, map[string]bool{"a": true, "b": true, "c32": true, "c": true, "d": true, "g": true, "h": true}, names)
	for obj := range decls {
		assert.NotEqual(t, "w", obj.Name(), "reassigned variable left out")
	}
}

func TestExactTypedIntLiteral(t *testing.T) {
	_, info, files := build(t, "package p\n\nconst n float64 = 1\n\nvar m float64 = 1\n\nvar q1, q2, q3 = n / 3, m / 3, float64(1) / 3\n")
	decls := constval.Decls(info, inspector.New(files))
	vals := files[0].Decls[2].(*ast.GenDecl).Specs[0].(*ast.ValueSpec).Values
	for _, e := range []ast.Expr{vals[0], vals[2]} {
		v, ok := constval.Exact(info, decls, e)
		require.True(t, ok)
		exactEq(t, rat(1, 3), v, "float64 operand: / is float division, 1/3 (Go spec, constant expressions)")
	}
	// m / 3 divides a variable: the division rounds at run time, so it has
	// no exact value even though m holds the constant 1.
	_, ok := constval.Exact(info, decls, vals[1])
	assert.False(t, ok)
}

const floatSrc = `package p

var (
	g1 = 0.25  // constant initialiser, never written again: found
	g2 = 0.5   // reassigned in a function
	g3 = 1.5   // address taken
	g4 = 2.5   // reassigned in a closure
	g5 float64 // no initialiser
	g6 = -0.75 // negative constant: found
	g7 = g1    // initialised from a variable
	g8 = 3.0   // reassigned by a user init function
)

func init() { g8 = 4 }

func set()           { g2 = 1 }
func addr() *float64 { return &g3 }
func closure() func() { return func() { g4++ } }

func use(float64) {}

func f(n int) {
	x := 0.1
	y := -x
	use(y*3 + float64(float32(0.5)))
	use(float64(float32(x)))
	use(float64(n))
	k := 3
	use(float64(k) / 4)
	use(g1 * 2)
	use(g2)
	use(g5)
	use(g6 - g1)
}
`

// useArgs returns the argument of every call to use in fn, in order.
func useArgs(fn *ssa.Function) []ssa.Value {
	var out []ssa.Value
	for _, b := range fn.Blocks {
		for _, instr := range b.Instrs {
			if c, ok := instr.(*ssa.Call); ok {
				if callee := c.Call.StaticCallee(); callee != nil && callee.Name() == "use" {
					out = append(out, c.Call.Args[0])
				}
			}
		}
	}
	return out
}

func TestFloatAndGlobals(t *testing.T) {
	pkg, _, _ := build(t, floatSrc)
	var funcs []*ssa.Function
	for fn := range ssautil.AllFunctions(pkg.Prog) {
		if fn.Package() == pkg && fn.Synthetic == "" { // as buildssa's SrcFuncs: no package initializer
			funcs = append(funcs, fn)
		}
	}
	globals := constval.FindGlobals(pkg, funcs)
	found := map[string]float64{}
	for g, v := range globals {
		found[g.Name()] = v
	}
	assert.Equal(t, map[string]float64{"g1": 0.25, "g6": -0.75}, found)

	x := 0.1 // binary64 arithmetic is the reference (IEEE 754-2019: each operation correctly rounded)
	n := 3
	want := []struct {
		v  float64
		ok bool
	}{
		{-x*3 + 0.5, true},
		{x, true},  // documented: Float looks through float32(x) without rounding
		{0, false}, // parameter
		{float64(n) / 4, true},
		{0.5, true}, // g1*2
		{0, false},  // g2 reassigned
		{0, false},  // g5 never initialised with a constant
		{-0.75 - 0.25, true},
	}
	args := useArgs(pkg.Func("f"))
	require.Len(t, args, len(want))
	for i, w := range want {
		v, ok := constval.Float(args[i], globals)
		assert.Equal(t, w.ok, ok, "use #%d: %s", i, args[i])
		if w.ok {
			assert.Equal(t, w.v, v, "use #%d: %s", i, args[i])
		}
	}
}

// TestFields checks that a field's values are gathered from composite
// literals by key and by position, through pointers elided in slices (the
// Go specification, "Composite literals").
func TestFields(t *testing.T) {
	pkg, info, files := build(t, `package p

type row struct{ in, want float64 }

var rows = []row{{1, 0.5}, {in: 2, want: 0.25}}

var ptrs = []*row{{3, 0.125}}
`)
	fields := constval.Fields(info, files)
	want := pkg.Pkg.Scope().Lookup("row").Type().Underlying().(*types.Struct).Field(1)
	var got []string
	for _, e := range fields[want] {
		got = append(got, info.Types[e].Value.String())
	}
	assert.Equal(t, []string{"0.5", "0.25", "0.125"}, got)
}

// TestDeclsPointerMethod: calling a method with a pointer receiver on a
// variable takes its address (Go spec, "Calls": x.m() is (&x).m()), so the
// variable may change and is no longer followed; a value method is not.
func TestDeclsPointerMethod(t *testing.T) {
	src := "package p\n\ntype L float64\n\nfunc (l *L) Halve() { *l /= 2 }\n\nfunc (l L) Twice() L { return 2 * l }\n\nfunc f() (L, L) {\n\ta := L(3)\n\ta.Halve()\n\tb := L(5)\n\treturn a, b.Twice()\n}\n"
	_, info, files := build(t, src)
	decls := constval.Decls(info, inspector.New(files))
	names := map[string]bool{}
	for obj := range decls {
		names[obj.Name()] = true
	}
	assert.False(t, names["a"], "a.Halve() takes &a")
	assert.True(t, names["b"], "b.Twice() copies b")
}

// TestSetOnce: a local declared with no value and assigned once holds
// that value wherever it is read after the assignment in the same block
// (Go spec, "Variable declarations": before it, the zero value).
func TestSetOnce(t *testing.T) {
	src := `package p

func f(n int, x float64) float64 {
	var tol1, tol2, early, outside, twice, self, never float64
	var pair, other float64
	pair, other = x, x
	s := never + pair + other
	for i := 0; i < n; i++ {
		tol1 = 1e-10*x + 2e-19
		tol2 = 2 * tol1
		s += tol2 + early
		early = x
		outside = x
		twice = x
		twice = 2 * x
		self = self + x
	}
	return s + outside + twice + self
}
`
	_, info, files := build(t, src)
	set := constval.SetOnce(info, inspector.New(files))
	names := map[string]bool{}
	for _, obj := range info.Defs {
		if _, ok := set(obj); obj != nil && ok {
			names[obj.Name()] = true
		}
	}
	assert.True(t, names["tol1"], "read only after its one assignment")
	assert.True(t, names["tol2"], "read only after its one assignment")
	assert.False(t, names["early"], "read before the assignment: the zero value, or the last pass's")
	assert.False(t, names["outside"], "read after the loop, where the zero value may reach")
	assert.False(t, names["twice"], "assigned twice")
	assert.False(t, names["self"], "reads itself in its own assignment")
	assert.False(t, names["never"], "never assigned: the zero value")
	assert.True(t, names["pair"], "one assignment of two values")
}
