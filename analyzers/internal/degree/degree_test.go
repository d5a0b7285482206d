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

func cross(p, q vec) (float64, bool) { return p.wedge(q), p != q }

func along(p0, p1 vec, t float64) vec {
	p0 = p0.times(1 - t)
	p1 = p1.times(t)
	return p0.plus(p1)
}

func sites(a0, a1, b0, b1 vec, n int, xs []float64, m affine, f func(float64) float64, k float64) {
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
	split, _ := cross(a0, b0)
	rise := f(a1.x) - f(a0.x)
	square := func(x float64) float64 { return x * x }
	own := square(a0.x)
	gain := area - k*a0.x*b0.x*b0.y/a0.y
	lifted := area - 1
	counted := area + float64(n)
	_, _, _, _, _, _, _, _, _, _, _ = jac, shift, sqdev, gap, power, split, rise, own, gain, lifted, counted
	_, _, _, _, _, _, _, _, _, _ = area, self, turn, spread, scaled, far, length, mid, r, ratio
}
`

// load type-checks src and returns a Reader of it and its last function.
func load(t *testing.T) (*types.Info, *degree.Reader, *ast.FuncDecl) {
	return loadSrc(t, src)
}

// loadSrc type-checks text and returns a Reader of it and its last function.
func loadSrc(t *testing.T, text string) (*types.Info, *degree.Reader, *ast.FuncDecl) {
	fset := token.NewFileSet()
	f, err := parser.ParseFile(fset, "src.go", text, 0)
	require.NoError(t, err)
	info := &types.Info{Types: map[ast.Expr]types.TypeAndValue{}, Defs: map[*ast.Ident]types.Object{}, Uses: map[*ast.Ident]types.Object{}, Selections: map[*ast.SelectorExpr]*types.Selection{}, Scopes: map[ast.Node]*types.Scope{}}
	_, err = (&types.Config{Importer: importer.ForCompiler(fset, "source", nil)}).Check(f.Name.Name, fset, []*ast.File{f}, info)
	require.NoError(t, err)
	r := degree.New(fset, info, []*ast.File{f})
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
		{"split", 2, true, true},    // the first of two results, a cross product
		{"rise", 1, true, true},     // values of a function the caller gives: the caller's data, as a parameter is
		{"own", 0, false, false},    // a function value made here: its body, not the caller, decides
		{"gain", 2, true, true},     // terms of one unit read as degrees 2 and 3: k, read as data, is a pure number, and the lower degree stands (dimensional consistency)
		{"lifted", 2, true, false},  // a constant takes the unit of the term beside it
		{"counted", 2, true, true},  // so does a count
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

// src3 is an invented package of a small ray caster: a vector type whose
// normalising helpers have unrevealing names, rays whose direction is
// stored normalised, and probes whose aim is stored once as given.
const src3 = `package caster

import "math"

type v3 struct{ x, y, z float64 }

func (a v3) sub(b v3) v3          { return v3{a.x - b.x, a.y - b.y, a.z - b.z} }
func (a v3) dot(b v3) float64     { return float64(a.x*b.x) + float64(a.y*b.y) + float64(a.z*b.z) }
func (a v3) sq() float64          { return a.dot(a) }
func (a v3) size() float64        { return math.Sqrt(a.sq()) }
func (a v3) mul(k float64) v3     { return v3{a.x * k, a.y * k, a.z * k} }
func (a v3) over(k float64) v3    { return v3{a.x / k, a.y / k, a.z / k} }
func (a v3) cross(b v3) v3        { return v3{a.y*b.z - a.z*b.y, a.z*b.x - a.x*b.z, a.x*b.y - a.y*b.x} }

// tame scales a to length 1, leaving the zero vector as it is.
func (a v3) tame() v3 {
	if a.x == 0 && a.y == 0 && a.z == 0 {
		return a
	}
	return a.mul(1 / a.size())
}

// squash divides each component by the length it computes itself.
func squash(a v3) v3 {
	n := math.Sqrt(a.x*a.x + a.y*a.y + a.z*a.z)
	if n == 0 {
		return v3{0, 0, 1}
	}
	return v3{a.x / n, a.y / n, a.z / n}
}

// grow is no normalisation: it doubles a when it is short.
func grow(a v3) v3 {
	if a.size() < 1 {
		return a.mul(2)
	}
	return a.over(a.size())
}

// even divides by a length made of nested hypotenuses, and gives the
// zero vector NaNs.
func even(a v3) v3 {
	if a.x == 0 && a.y == 0 && a.z == 0 {
		return v3{math.NaN(), math.NaN(), math.NaN()}
	}
	return a.over(math.Hypot(a.x, math.Hypot(a.y, a.z)))
}

// shift divides a by a length it had before one of its components moved:
// no direction.
func shift(a v3) v3 {
	l := a.size()
	a.x += 1e3
	return v3{a.x / l, a.y / l, a.z / l}
}

// flat divides by the length of the horizontal part alone: no direction.
func flat(a v3) v3 { return a.over(math.Hypot(a.x, a.y)) }

// quat is an array vector of float32, normalised by a reciprocal.
type quat [4]float32

func (q quat) size() float32 {
	return float32(math.Sqrt(float64(q[0]*q[0] + q[1]*q[1] + q[2]*q[2] + q[3]*q[3])))
}

func (q quat) norm() quat {
	l := 1.0 / q.size()
	return quat{q[0] * l, q[1] * l, q[2] * l, q[3] * l}
}

type spin struct{ axis quat }

func turn(q quat) spin { return spin{q.norm()} }

// top reads through its pointer; flip changes what it points to.
func (a *v3) top() float64 { return math.Max(a.x, math.Max(a.y, a.z)) }
func (a *v3) flip()        { a.x, a.y, a.z = -a.x, -a.y, -a.z }

func (r *ray) peak() float64 { return r.dir.top() }

type lamp struct{ glow, halo v3 }

func light(at v3) lamp { return lamp{squash(at), shift(at)} }
func (l *lamp) dim()   { l.glow.flip() }

type mast struct{ foot, lean v3 }

func raise(foot, top v3) mast { return mast{foot, flat(top.sub(foot))} }

// keep returns a long vector as it is: no normalisation.
func keep(a v3) v3 {
	if a.size() > 1e3 {
		return a
	}
	return squash(a)
}

type ray struct{ from, dir v3 }

func aim(from, to v3) ray        { return ray{from, to.sub(from).tame()} }
func (r ray) bent(n v3) ray     { return ray{from: r.from, dir: squash(n)} }
func (r ray) tilt(n v3) ray      { return ray{r.from, even(n)} }

// cast normalises its parameter in place before storing it.
func cast(from, to v3) ray {
	to = to.sub(from)
	to = squash(to)
	return ray{from, to}
}

type probe struct{ at, toward v3 }

func point(at, to v3) probe { return probe{at, squash(to)} }
func raw(at, to v3) probe   { return probe{at: at, toward: to} }

func (p *probe) nudge(d v3) { p.toward = p.toward.sub(d) }

func sites(r, s ray, p probe, q v3, m mast, sp spin, l lamp) {
	cosine := r.dir.dot(s.dir)
	slant := r.dir.x
	reach := r.dir.dot(q)
	offset := r.from.dot(s.dir)
	facing := p.toward.dot(r.dir)
	q = q.tame()
	turned := q.dot(r.dir)
	e := squash(q.sub(r.from))
	spread := e.cross(q).dot(r.dir)
	g := grow(p.at)
	doubled := g.dot(g)
	k := keep(p.at)
	kept := k.dot(k)
	leaning := m.lean.dot(m.lean)
	twist := sp.axis[0]*sp.axis[3] - sp.axis[1]*sp.axis[2]
	glowing := l.glow.dot(l.glow)
	haloed := l.halo.dot(l.halo)
	_, _, _, _, _, _, _, _, _, _, _, _, _ = cosine, slant, reach, offset, facing, turned, spread, doubled, kept, leaning, twist, glowing, haloed
}
`

// TestDirections checks the reading of normalised vectors: a vector
// divided by its own length has length 1 up to rounding, so its components
// and the dot product of two of them are at most 1 in size whatever the
// data's units (common practice: |u·v| <= |u||v| by Cauchy-Schwarz).
func TestDirections(t *testing.T) {
	info, r, fd := loadSrc(t, src3)
	want := map[string]float64{
		"cosine":  0, // two ray directions, stored only through tame and squash
		"slant":   0, // a component of one
		"reach":   1, // a direction against a point: a length
		"offset":  1, // a point against a direction
		"facing":  1, // toward is stored once as given (raw): data
		"turned":  0, // the parameter reassigned from its normalised value
		"spread":  0, // a triple product of directions
		"doubled": 2, // grow keeps a's size: data
		"kept":    2, // keep returns a long input as it is: data
		"leaning": 2, // lean is divided by part of its length only: data
		"twist":   0, // products of components of a normalised array
		"glowing": 2, // glow is changed in place by a pointer method: data
		"haloed":  2, // shift divides by the length a had before it changed: data
	}
	for id, obj := range info.Defs {
		if w, ok := want[id.Name]; ok && obj != nil && fd.Pos() <= id.Pos() && id.End() <= fd.End() {
			d, ok := r.Of(fd, id)
			require.True(t, ok, id.Name)
			assert.Equal(t, w, d, id.Name)
		}
	}
}

// srcSum is an invented package of a flock counter: running sums over
// sightings, over a fixed week, through helpers, in nested loops and in
// ratios.
const srcSum = `package flock

import "math"

type day [7]float64

func total(xs []float64) float64 {
	s := 0.0
	for _, x := range xs {
		s += x
	}
	return s
}

func mean(xs []float64) float64 { return total(xs) / float64(len(xs)) }

func count(xs []float64, w day, n int) {
	seen := total(xs)
	avg := mean(xs)
	week := 0.0
	for i := 0; i < 7; i++ {
		week += w[i]
	}
	days := 0.0
	for _, v := range w {
		days = days + v
	}
	late := 0.0
	for i := 0; i < n; i++ {
		late = late - xs[i]
	}
	last := 0.0
	for _, x := range xs {
		fresh := 0.0
		fresh += x
		last = fresh
	}
	pairs := 0.0
	for i := range xs {
		for j := 0; j < 2; j++ {
			pairs += xs[i] * float64(j)
		}
	}
	limit := 100
	series := 0.0
	for k := 1; k < limit; k++ {
		series += 1 / float64(k*k)
	}
	share := xs[0] / (xs[0] + math.Abs(seen))
	per := seen / float64(len(xs))
	frac := seen / xs[0]
	weighed := xs[0] * seen
	var flow struct{ in, out float64 }
	for _, x := range xs {
		flow.in += x
	}
	inflow := flow.in
	fresh2 := 0.0
	for _, x := range xs {
		var once struct{ in float64 }
		once.in += x
		fresh2 = once.in
	}
	_, _, _, _, _, _, _, _, _, _ = seen, avg, week, days, late, last, pairs, series, share, per
	_, _, _, _ = frac, weighed, inflow, fresh2
}
`

// TestSummed checks which values read a running sum over a loop of the
// data's length: the rounding error of a sum of n terms grows with n, up
// to (n-1)·u times the sum of their sizes and about √n·u for independent
// roundings (Higham 2002, §2.8 and §4.2, from memory).
func TestSummed(t *testing.T) {
	info, r, fd := loadSrc(t, srcSum)
	want := map[string]bool{
		"seen":    true,  // a helper's running sum, through its return
		"avg":     true,  // through a helper of a helper
		"week":    false, // seven terms: the count is fixed
		"days":    false, // a range over an array: the count is fixed
		"late":    true,  // late = late - x, in a loop bounded by a variable
		"last":    false, // fresh starts afresh on each pass: one term
		"pairs":   true,  // an inner loop of fixed count inside one over the data
		"series":  false, // a loop that runs to a count of its own, not the data's
		"share":   false, // a sum in a divisor: the ratio's error is relative, as small as the ratio
		"per":     true,  // a sum divided by a count: its error scales with it
		"frac":    true,  // a sum divided by data: its error is divided with it
		"weighed": true,  // a sum times data: its error is multiplied with it
		"inflow":  true,  // a field of a local struct that a loop over the data adds to
		"fresh2":  false, // a field of a struct made afresh on each pass: one term
	}
	for id, obj := range info.Defs {
		if w, ok := want[id.Name]; ok && obj != nil && fd.Pos() <= id.Pos() && id.End() <= fd.End() {
			_, got := r.Summed(fd, id)
			assert.Equal(t, w, got, id.Name)
		}
	}
}
