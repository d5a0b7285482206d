package degree_test

import (
	"go/ast"
	"go/importer"
	"go/parser"
	"go/token"
	"go/types"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"roundoff/analyzers/internal/degree"
)

// src is an invented package of plane geometry: a vector type with the
// usual products, a quadratic solver and a few readers of them.
const src = `package plane

import "math"

type vec struct{ x, y float64 }

func (p vec) minus(q vec) vec      { return vec{p.x - q.x, p.y - q.y} }
func (p vec) plus(q vec) vec       { return vec{p.x + q.x, p.y + q.y} }
func (p vec) times(k float64) vec  { return vec{k * p.x, k * p.y} }
func (p vec) inner(q vec) float64  { return p.x*q.x + p.y*q.y }
func (p vec) wedge(q vec) float64  { return p.x*q.y - p.y*q.x }
func (p vec) norm() float64        { return math.Sqrt(p.inner(p)) }
func (p vec) unit() vec            { return p.times(1 / p.norm()) }

var origin = vec{}

// affine maps points: a linear part and an offset.
type affine [2][3]float64

func (m affine) apply(p vec) vec {
	return vec{m[0][0]*p.x + m[0][1]*p.y + m[0][2], m[1][0]*p.x + m[1][1]*p.y + m[1][2]}
}
func (m affine) det() float64 { return m[0][0]*m[1][1] - m[0][1]*m[1][0] }

func roots(a, b, c float64) (float64, float64) {
	if a == 0 {
		return -c / b, math.NaN()
	}
	d := b*b - 4*a*c
	q := math.Sqrt(d)
	if b < 0 {
		q = -q
	}
	r1 := -(b + q) / (2 * a)
	r2 := c / (a * r1)
	if r2 < r1 {
		r1, r2 = r2, r1
	}
	return r1, r2
}

func along(p0, p1 vec, t float64) vec {
	p0 = p0.times(1 - t)
	p1 = p1.times(t)
	return p0.plus(p1)
}

func sites(a0, a1, b0, b1 vec, n int, xs []float64, m affine) {
	area := a1.minus(a0).wedge(b1.minus(b0))
	self := a1.minus(a0).inner(a1.minus(a0))
	r, _ := roots(area, self, area)
	mid := along(a0, a1, r)
	turn := mid.wedge(b0)
	sum, sq := 0.0, 0.0
	for _, x := range xs {
		sum += x
		sq += x * x
	}
	spread := sq - sum*sum/float64(n)
	scaled := xs[0]
	for range n {
		scaled *= scaled
	}
	far := origin.minus(a0).x
	length := a0.norm()
	ratio := area
	ratio /= self
	east := a0.x
	rem := math.Mod(a0.x, b0.x)
	_, _ = east, rem
	jac := m.det()
	dir := a0
	dir = dir.unit()
	heading := dir.wedge(b0)
	_ = heading
	shift := m[0][2] * m[1][2]
	devs := make([]float64, len(xs))
	for i, x := range xs {
		dev := x - xs[0]
		dev *= dev
		devs[i] = dev
	}
	sqdev := devs[1]
	gaps := make([]float64, len(xs))
	gaps[0] = 1
	for i := 1; i < n; i++ {
		gaps[i] = xs[i] - xs[i-1]
	}
	gap := gaps[1]
	power := a0.x*a0.x + a0.y*a0.y + b0.x*b0.x
	_, _, _, _, _ = jac, shift, sqdev, gap, power
	_, _, _, _, _, _, _, _, _, _ = area, self, turn, spread, scaled, far, length, mid, r, ratio
}
`

// load type-checks src and returns a Reader of it and its last function.
func load(t *testing.T) (*types.Info, *degree.Reader, *ast.FuncDecl) {
	fset := token.NewFileSet()
	f, err := parser.ParseFile(fset, "plane.go", src, 0)
	require.NoError(t, err)
	info := &types.Info{Types: map[ast.Expr]types.TypeAndValue{}, Defs: map[*ast.Ident]types.Object{}, Uses: map[*ast.Ident]types.Object{}, Selections: map[*ast.SelectorExpr]*types.Selection{}, Scopes: map[ast.Node]*types.Scope{}}
	_, err = (&types.Config{Importer: importer.ForCompiler(fset, "source", nil)}).Check("plane", fset, []*ast.File{f}, info)
	require.NoError(t, err)
	r := degree.New(info, []*ast.File{f})
	fd := f.Decls[len(f.Decls)-1].(*ast.FuncDecl)
	return info, r, fd
}

// TestDegrees checks the degree of each variable in sites: the rule a
// rounding error eps·s^d at data size s rests on is dimensional analysis
// (common practice: each product of two lengths is an area, Higham 2002
// §3.1 bounds a dot product's error by a multiple of eps·|x|·|y|).
func TestDegrees(t *testing.T) {
	info, r, fd := load(t)
	read := func(name string) (float64, bool, bool) {
		for id, obj := range info.Defs {
			if id.Name == name && obj != nil && fd.Pos() <= id.Pos() && id.End() <= fd.End() {
				d, ok := r.Of(fd, id)
				return d, ok, r.Cancels(fd, id)
			}
		}
		t.Fatalf("no variable %s", name)
		return 0, false, false
	}
	for _, c := range []struct {
		name    string
		deg     float64
		ok      bool
		cancels bool
	}{
		{"area", 2, true, true},     // a cross product of two differences: an area
		{"self", 2, true, false},    // a vector's inner product with itself: a sum of squares
		{"r", 0, true, false},       // a root of a quadratic whose coefficients share a degree: a ratio
		{"mid", 1, true, true},      // a point along a segment, a sum of two scaled points: near zero its error is its terms'
		{"turn", 2, true, true},     // a cross product of two points
		{"spread", 2, true, true},   // a one-pass sum of squared deviations
		{"scaled", 0, false, false}, // multiplied by itself in a loop: not read
		{"far", 0, false, false},    // read from a package variable: not read
		{"length", 1, true, false},  // the square root of an inner product
		{"jac", 0, true, true},      // entries that multiply a point beside an offset are pure factors (dimensional consistency)
		{"shift", 2, true, false},   // the offsets themselves are data
		{"heading", 1, true, true},  // dir is a unit vector from its reassignment on: its cross product with a point is a length
		{"gap", 1, true, true},      // elements stored from differences: those elements are their terms' rounding near zero
		{"sqdev", 2, true, false},   // elements stored from a square made afresh in each pass: an area-like square, whose error is relative
		{"power", 2, true, false},   // a sum of three squares: non-negative terms never cancel, its error is relative (Higham 2002 §4.2)
	} {
		d, ok, cancels := read(c.name)
		require.Equal(t, c.ok, ok, c.name)
		if ok {
			require.Equal(t, c.deg, d, c.name)
		}
		require.Equal(t, c.cancels, cancels, c.name)
	}
}

// TestRounds checks which values carry a rounding error of their own:
// IEEE 754-2019 §5.3.1 makes remainder exact, and a value read as the
// caller gave it has none (Goldberg 1991, Thm 11: the difference of two
// such values is exact when they are close).
func TestRounds(t *testing.T) {
	info, r, fd := load(t)
	want := map[string]bool{"area": true, "spread": true, "east": false, "rem": false}
	for id, obj := range info.Defs {
		if w, ok := want[id.Name]; ok && obj != nil && fd.Pos() <= id.Pos() && id.End() <= fd.End() {
			assert.Equal(t, w, r.Rounds(fd, id), id.Name)
		}
	}
}
