package provenance_test

import (
	"go/ast"
	"go/build"
	"go/constant"
	"go/importer"
	"go/parser"
	"go/token"
	"go/types"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/ssa"
	"golang.org/x/tools/go/ssa/ssautil"

	"roundoff/analyzers/internal/provenance"
)

// Facts relied on (IEEE 754-2019; section numbers quoted from memory):
// +, -, *, / and sqrt are correctly rounded, so in general inexact (§5.4.1);
// abs, negation, copySign (§5.5.1), roundToIntegral such as Floor (§5.3.1)
// and minimum/maximum (§9.6) never round; scaling by a power of two is
// exact away from overflow and underflow (Higham 2002, §2.1).

const src = `package p

import (
	"math"
	"strconv"
)

func use(string, any) {}

type S struct{ F float64 }

type T64 float64

var G float64

func sum(a, b float64) float64 { return a + b }

func ident(a float64) float64 { return a }

func pair(a, b float64) (float64, float64) { return a, a * b }

func rec(x float64, n int) float64 {
	if n == 0 {
		return x
	}
	return rec(x, n-1)
}

func recSum(x float64, n int) float64 {
	if n == 0 {
		return x + 1
	}
	return recSum(x, n-1)
}

func mkS() S { return S{} }

type P struct{ X, Y float64 }

func lerp(p, q P, s float64) P { return P{p.X, p.Y + s*(q.Y-p.Y)} }

func mkArr() [2]float64 { return [2]float64{} }

func closure(a float64) { func() { use("free", a) }() }

func f(a, b float64, f32 float32, p *float64, m map[string]float64, n int, c bool, fn func(float64) float64, str string) {
	use("const", 0.5)
	use("param", a)
	use("neg param", -a)
	use("conv param", float64(f32))
	use("named", T64(a))
	use("int conv", float64(n))
	use("load ptr", *p)
	use("load global", G)
	use("field", mkS().F)
	use("lerp.Y", lerp(P{}, P{}, a).Y)
	use("lerp.X", lerp(P{}, P{}, a).X)
	use("index", mkArr()[n])
	use("lookup", m["k"])
	use("arith", a+b)
	use("neg arith", -(a + b))
	use("sqrt", math.Sqrt(a))
	use("abs", math.Abs(a))
	use("abs arith", math.Abs(a+b))
	use("floor", math.Floor(a))
	use("max", math.Max(a, b))
	use("dynamic call", fn(a))
	v, _ := strconv.ParseFloat(str, 64)
	use("other package", v)
	fr, _ := math.Frexp(a)
	use("frexp", fr)
	q, r := pair(a, b)
	use("pair0", q)
	use("pair1", r)
	use("sum call", sum(a, b))
	use("ident call", ident(a))
	use("rec", rec(a, n))
	use("recSum", recSum(a, n))
	use("a*2", a*2)
	use("a*0.5", a*0.5)
	use("a/2", a/2)
	use("2*a", 2*a)
	use("-4*a", -4*a)
	use("(a+b)*2", (a+b)*2)
	use("a*3", a*3)
	use("2/a", 2/a)
	use("int arith", n+1)
	use("mid", (a+b)/2)
	x := a
	if c {
		x = a + b
	}
	use("phi computed", x)
	y := a
	if c {
		y = b
	}
	use("phi plain", y)
	acc := 0.0
	for i := 0; i < n; i++ {
		acc += 0.1
	}
	use("loop add", acc)
	prod := a
	for i := 0; i < n; i++ {
		prod = 3 * prod
	}
	use("loop mul", prod)
	k := a
	for i := 0; i < n; i++ {
		k = math.Min(k+b, 10)
	}
	use("clamp loop", k)
}
`

type fixture struct {
	pkg   *ssa.Package
	funcs []*ssa.Function
	vals  map[string]ssa.Value // use(label, v): v with the boxing removed
	boxed map[string]ssa.Value // v as passed, boxed in an interface
}

func load(t *testing.T) *fixture {
	t.Helper()
	fset := token.NewFileSet()
	file, err := parser.ParseFile(fset, "p.go", src, 0)
	require.NoError(t, err)
	pkg, _, err := ssautil.BuildPackage(&types.Config{Importer: importer.Default()}, fset,
		types.NewPackage("p", "p"), []*ast.File{file}, ssa.SanityCheckFunctions)
	require.NoError(t, err)
	fx := &fixture{pkg: pkg, vals: map[string]ssa.Value{}, boxed: map[string]ssa.Value{}}
	for fn := range ssautil.AllFunctions(pkg.Prog) {
		if fn.Package() != pkg || fn.Synthetic != "" {
			continue
		}
		fx.funcs = append(fx.funcs, fn)
		for _, b := range fn.Blocks {
			for _, instr := range b.Instrs {
				call, ok := instr.(*ssa.Call)
				if !ok || call.Call.StaticCallee() == nil || call.Call.StaticCallee().Name() != "use" {
					continue
				}
				label := constant.StringVal(call.Call.Args[0].(*ssa.Const).Value)
				fx.boxed[label] = call.Call.Args[1]
				fx.vals[label] = call.Call.Args[1].(*ssa.MakeInterface).X
			}
		}
	}
	require.Len(t, fx.vals, strings.Count(src, `use("`))
	return fx
}

func (fx *fixture) v(t *testing.T, label string) ssa.Value {
	v, ok := fx.vals[label]
	require.True(t, ok, label)
	return v
}

func TestStrip(t *testing.T) {
	fx := load(t)
	param := func(name string) ssa.Value {
		for _, p := range fx.pkg.Func("f").Params {
			if p.Name() == name {
				return p
			}
		}
		t.Fatal(name)
		return nil
	}
	assert.Equal(t, param("a"), provenance.Strip(fx.boxed["param"]), "interface boxing")
	assert.Equal(t, param("f32"), provenance.Strip(fx.v(t, "conv param")), "float32 -> float64 is exact (IEEE 754-2019)")
	assert.Equal(t, param("a"), provenance.Strip(fx.v(t, "named")), "type change")
	conv := fx.v(t, "int conv")
	assert.Equal(t, conv, provenance.Strip(conv), "int -> float conversion can round: kept")
	assert.Equal(t, param("a"), provenance.Strip(param("a")))
}

func TestOf(t *testing.T) {
	fx := load(t)
	for label, want := range map[string]provenance.Kind{
		"const":         provenance.Constant,
		"param":         provenance.Parameter,
		"neg param":     provenance.Parameter,
		"conv param":    provenance.Parameter,
		"named":         provenance.Parameter,
		"int conv":      provenance.Other,
		"int arith":     provenance.Other,
		"free":          provenance.Load, // a captured variable is read through its cell
		"load ptr":      provenance.Load,
		"load global":   provenance.Load,
		"field":         provenance.Load,
		"index":         provenance.Load,
		"lookup":        provenance.Load,
		"arith":         provenance.Arithmetic,
		"neg arith":     provenance.Arithmetic,
		"mid":           provenance.Arithmetic,
		"sqrt":          provenance.MathCall,
		"abs":           provenance.ExactCall,
		"floor":         provenance.ExactCall,
		"max":           provenance.ExactCall,
		"frexp":         provenance.ExactCall,
		"dynamic call":  provenance.Call,
		"sum call":      provenance.Call,
		"pair0":         provenance.Call,
		"other package": provenance.Call,
		"loop add":      provenance.LoopCarried,
		"loop mul":      provenance.LoopCarried,
		"clamp loop":    provenance.Merge,
		"phi computed":  provenance.Merge,
		"phi plain":     provenance.Merge,
	} {
		assert.Equal(t, want, provenance.Of(fx.v(t, label)), label)
	}
}

func TestLoopStep(t *testing.T) {
	fx := load(t)
	for label, want := range map[string]token.Token{"loop add": token.ADD, "loop mul": token.MUL} {
		phi := fx.v(t, label).(*ssa.Phi)
		b, ok := provenance.LoopStep(phi)
		require.True(t, ok, label)
		assert.Equal(t, want, b.Op, label)
	}
	for _, label := range []string{"clamp loop", "phi computed"} {
		_, ok := provenance.LoopStep(fx.v(t, label).(*ssa.Phi))
		assert.False(t, ok, label)
	}
}

func TestComputed(t *testing.T) {
	fx := load(t)
	tr := provenance.NewTracker(fx.pkg, fx.funcs)
	for label, want := range map[string]bool{
		"arith":         true, // rounded operation
		"neg arith":     true,
		"mid":           true,
		"sqrt":          true,
		"a*3":           true,
		"2/a":           true, // division by a is not scaling by a power of two
		"(a+b)*2":       true, // exact scaling of a computed value stays computed
		"pair1":         true, // a*b returned as second result
		"sum call":      true, // package function returning a+b
		"recSum":        true,
		"phi computed":  true, // merge with a computed input
		"loop add":      true,
		"loop mul":      true,
		"const":         false,
		"param":         false,
		"neg param":     false, // negation is exact
		"conv param":    false, // float32 -> float64 is exact
		"free":          false,
		"load ptr":      false,
		"load global":   false,
		"field":         false,
		"lerp.Y":        true,  // a field the function fills with a computed value
		"lerp.X":        false, // a field it copies from a parameter
		"index":         false,
		"lookup":        false,
		"abs":           false,
		"abs arith":     true, // Abs changes only the sign: a+b keeps its rounding error
		"floor":         false,
		"max":           false,
		"frexp":         false,
		"clamp loop":    false, // merges a parameter and math.Min, which does not round
		"dynamic call":  false, // unknown callee
		"other package": false, // unknown callee
		"pair0":         false,
		"ident call":    false,
		"rec":           false,
		"a*2":           false, // power-of-two scaling passes the parameter through
		"a*0.5":         false,
		"a/2":           false,
		"2*a":           false,
		"-4*a":          false,
		"int arith":     false, // not floating point
		"int conv":      false,
		"phi plain":     false,
	} {
		assert.Equal(t, want, tr.Computed(fx.v(t, label)), label)
	}
}

func TestDependsOn(t *testing.T) {
	fx := load(t)
	var a, b ssa.Value
	for _, p := range fx.pkg.Func("f").Params {
		switch p.Name() {
		case "a":
			a = p
		case "b":
			b = p
		}
	}
	for _, label := range []string{"mid", "arith", "neg arith", "sqrt", "a*3", "max", "param", "named"} {
		assert.True(t, provenance.DependsOn(fx.v(t, label), a), label)
	}
	assert.True(t, provenance.DependsOn(fx.v(t, "mid"), b))
	for _, label := range []string{"phi computed", "sum call", "dynamic call", "const", "loop mul"} {
		assert.False(t, provenance.DependsOn(fx.v(t, label), a), label)
	}
	assert.False(t, provenance.DependsOn(fx.v(t, "a*3"), b))
}

const typesSrc = `package p

type Celsius float32

type F64 interface{ ~float64 }

type Float interface{ ~float32 | ~float64 }

func g1[T ~float32 | ~float64](x T)      {}
func g2[T ~float64](x T)                 {}
func g3[T ~int | ~float64](x T)          {}
func g4[T any](x T)                      {}
func g5[T Float](x T)                    {}
func g6[T ~complex64 | ~complex128](x T) {}
func g7[T interface{ F64 }](x T)         {}
func g8[T interface{ F64 | ~float32 }](x T) {}
`

func TestIsFloatAdmits32(t *testing.T) {
	// float32 is IEEE 754-2019 binary32, float64 binary64; complex64 holds
	// two binary32 parts.
	fset := token.NewFileSet()
	file, err := parser.ParseFile(fset, "p.go", typesSrc, 0)
	require.NoError(t, err)
	pkg, err := (&types.Config{}).Check("p", fset, []*ast.File{file}, nil)
	require.NoError(t, err)
	tparam := func(fn string) types.Type {
		return pkg.Scope().Lookup(fn).(*types.Func).Signature().Params().At(0).Type()
	}
	for _, c := range []struct {
		name          string
		typ           types.Type
		float, admits bool
	}{
		{"float64", types.Typ[types.Float64], true, false},
		{"float32", types.Typ[types.Float32], true, true},
		{"complex64", types.Typ[types.Complex64], true, true},
		{"complex128", types.Typ[types.Complex128], true, false},
		{"untyped float", types.Typ[types.UntypedFloat], true, false}, // default type float64 (Go spec, constants)
		{"int", types.Typ[types.Int], false, false},
		{"string", types.Typ[types.String], false, false},
		{"Celsius", pkg.Scope().Lookup("Celsius").Type(), true, true},
		{"~float32|~float64", tparam("g1"), true, true},
		{"~float64", tparam("g2"), true, false},
		{"~int|~float64", tparam("g3"), false, false},
		{"any", tparam("g4"), false, true}, // its type set includes float32
		{"named Float", tparam("g5"), true, true},
		{"complex", tparam("g6"), true, true},
	} {
		assert.Equal(t, c.float, provenance.IsFloat(c.typ), "IsFloat(%s)", c.name)
		assert.Equal(t, c.admits, provenance.Admits32(c.typ), "Admits32(%s)", c.name)
	}

	t.Run("embedded constraint", func(t *testing.T) {
		assert.True(t, provenance.IsFloat(tparam("g7")))   // type set {~float64}
		assert.False(t, provenance.Admits32(tparam("g7"))) // got true
		assert.True(t, provenance.IsFloat(tparam("g8")))   // type set {~float64, ~float32}; got false
	})
}

// TestInStd checks that the standard library is told by where its files
// lie, under GOROOT/src or "$GOROOT/src" (a -trimpath build's form, from
// memory), so that a module whose path has no dot ("go mod init
// sim") is not taken for it (common practice: go/build's layout of GOROOT).
func TestInStd(t *testing.T) {
	fset := token.NewFileSet()
	file := func(name string) token.Pos { return token.Pos(fset.AddFile(name, -1, 10).Base()) }
	std := types.NewPackage("math", "math")
	user := types.NewPackage("sim/orbit", "orbit")
	assert.True(t, provenance.InStd(fset, file(filepath.Join(build.Default.GOROOT, "src", "math", "abs.go")), std))
	assert.True(t, provenance.InStd(fset, file("$GOROOT/src/math/abs.go"), std))
	assert.False(t, provenance.InStd(fset, file("/home/ana/sim/orbit/step.go"), user))
	assert.True(t, provenance.InStd(fset, token.NoPos, std), "no position: the import path decides")
	assert.False(t, provenance.InStd(fset, token.NoPos, types.NewPackage("example.com/sim", "sim")))
}
