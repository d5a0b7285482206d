package fdstep

import (
	"cmp"
	"go/token"
	"math"
	"slices"

	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/provenance"
)

// A quotient is a recognised difference quotient: evaluations of one
// function at x + k·h, combined with a scheme's weights and divided by
// the scheme's power of h.
type quotient struct {
	root   *ssa.BinOp // the division (or product) that completes it
	scheme *scheme
	x, h   ssa.Value
	evals  []evaluation
	bumps  []bump  // the computations of x+h and x-h
	vector bool    // x is a slice element perturbed in memory
	scale  float64 // for a constant step: the factor around the sum, λ aside
}

// A bump computes a perturbed point: x+h, h+x or x-h (in the vector case,
// the value stored into the slice).
type bump struct {
	op    *ssa.BinOp
	stepX bool // the step is op.X (h + x)
}

// An evaluation is a value read from the result of a call: the result
// itself, or a component selected from it.
type evaluation struct {
	value  ssa.Value
	call   *ssa.Call
	path   []ssa.Value // the selections from the result to the value
	weight float64
	offset int // k in x + k·h
}

// monomial is c · Π leaves[v]^power · delta: the shape of a difference
// quotient, one sum of evaluations scaled by constants and steps.
type monomial struct {
	c      float64
	leaves map[ssa.Value]int
	delta  ssa.Value
}

// maxDepth bounds the walks over expression trees.
const maxDepth = 8

// quotient recognises root as a difference quotient.
func (c *checker) quotient(root *ssa.BinOp) (*quotient, bool) {
	m, ok := c.monomial(root, true, maxDepth)
	if !ok || m.delta == nil || c.done[m.delta] {
		return nil, false // not a scaled sum, or judged from an inner operation
	}
	evals, ok := c.evaluations(m.delta)
	if !ok {
		return nil, false
	}
	q := &quotient{root: root, evals: evals}
	if !c.scalarOffsets(q) && !c.vectorOffsets(q) {
		return nil, false // no argument or element moves by a common step
	}
	w := make(map[int]float64)
	for _, e := range q.evals {
		w[e.offset] += e.weight
	}
	s, lambda, ok := match(w)
	if !ok || !c.scaled(q, m, s, lambda) {
		return nil, false
	}
	q.scheme = s
	c.done[m.delta] = true
	return q, true
}

// monomial decomposes v into a constant, powers of leaves and at most one
// sum or difference (when sumOK: only in a numerator).
func (c *checker) monomial(v ssa.Value, sumOK bool, depth int) (monomial, bool) {
	v = provenance.Strip(v)
	if f, ok := constval.Float(v, c.globals); ok {
		return monomial{c: f}, true
	}
	if depth == 0 {
		return monomial{}, false
	}
	switch v := v.(type) {
	case *ssa.BinOp:
		if !isReal(v.Type()) {
			break
		}
		switch v.Op {
		case token.MUL, token.QUO:
			x, okx := c.monomial(v.X, sumOK, depth-1)
			y, oky := c.monomial(v.Y, sumOK && v.Op == token.MUL, depth-1)
			if !okx || !oky || x.delta != nil && y.delta != nil {
				return monomial{}, false
			}
			return x.times(y, v.Op == token.QUO), true
		case token.ADD, token.SUB:
			if sumOK {
				return monomial{c: 1, delta: v}, true
			}
		}
	case *ssa.UnOp:
		if v.Op == token.SUB {
			m, ok := c.monomial(v.X, sumOK, depth-1)
			m.c = -m.c
			return m, ok
		}
	}
	return monomial{c: 1, leaves: map[ssa.Value]int{v: 1}}, true
}

// times returns m·n, or m/n when divide is set.
func (m monomial) times(n monomial, divide bool) monomial {
	sign := 1
	out := monomial{c: m.c * n.c, leaves: make(map[ssa.Value]int), delta: m.delta}
	if divide {
		sign, out.c = -1, m.c/n.c
	}
	if n.delta != nil {
		out.delta = n.delta
	}
	for v, p := range m.leaves {
		out.leaves[v] += p
	}
	for v, p := range n.leaves {
		out.leaves[v] += sign * p
	}
	return out
}

// evaluations expands delta into a weighted sum of at least two
// evaluations of one function, ordered by position.
func (c *checker) evaluations(delta ssa.Value) ([]evaluation, bool) {
	acc := make(map[ssa.Value]float64)
	if !c.terms(delta, 1, acc, maxDepth) || len(acc) < 2 {
		return nil, false
	}
	var evals []evaluation
	for v, w := range acc {
		e, ok := evaluationOf(v)
		if !ok {
			return nil, false
		}
		e.weight = w
		evals = append(evals, e)
	}
	slices.SortFunc(evals, func(a, b evaluation) int { return cmp.Compare(a.call.Pos(), b.call.Pos()) })
	for _, e := range evals[1:] {
		if !sameFunction(evals[0].call.Common(), e.call.Common()) || !samePath(evals[0].path, e.path) {
			return nil, false
		}
	}
	return evals, true
}

// terms adds the evaluations of the linear combination v, times w, to acc.
func (c *checker) terms(v ssa.Value, w float64, acc map[ssa.Value]float64, depth int) bool {
	if depth == 0 {
		return false
	}
	v = provenance.Strip(v)
	switch b := v.(type) {
	case *ssa.BinOp:
		switch b.Op {
		case token.ADD:
			return c.terms(b.X, w, acc, depth-1) && c.terms(b.Y, w, acc, depth-1)
		case token.SUB:
			return c.terms(b.X, w, acc, depth-1) && c.terms(b.Y, -w, acc, depth-1)
		case token.MUL:
			if k, ok := constval.Float(provenance.Strip(b.X), c.globals); ok {
				return c.terms(b.Y, w*k, acc, depth-1)
			}
			if k, ok := constval.Float(provenance.Strip(b.Y), c.globals); ok {
				return c.terms(b.X, w*k, acc, depth-1)
			}
		}
		return false
	case *ssa.UnOp:
		if b.Op == token.SUB {
			return c.terms(b.X, -w, acc, depth-1)
		}
	}
	if _, ok := evaluationOf(v); !ok {
		return false
	}
	acc[v] += w
	return true
}

// evaluationOf reports whether v is read from the result of a call of a
// function (not a builtin): the result, a result of several, or an element
// or field of one.
func evaluationOf(v ssa.Value) (evaluation, bool) {
	e := evaluation{value: v}
	for range 3 {
		switch w := provenance.Strip(v).(type) {
		case *ssa.Call:
			_, builtin := w.Common().Value.(*ssa.Builtin)
			e.call = w
			return e, !builtin
		case *ssa.Extract:
			e.path, v = append(e.path, w), w.Tuple
		case *ssa.Field:
			e.path, v = append(e.path, w), w.X
		case *ssa.Index:
			e.path, v = append(e.path, w), w.X
		case *ssa.UnOp:
			addr, ok := w.X.(*ssa.IndexAddr)
			if w.Op != token.MUL || !ok {
				return e, false
			}
			e.path, v = append(e.path, addr), addr.X
		default:
			return e, false
		}
	}
	return e, false
}

// samePath reports whether two evaluations select the same component of
// their results.
func samePath(p, q []ssa.Value) bool {
	if len(p) != len(q) {
		return false
	}
	for i := range p {
		switch a := p[i].(type) {
		case *ssa.Extract:
			b, ok := q[i].(*ssa.Extract)
			if !ok || a.Index != b.Index {
				return false
			}
		case *ssa.Field:
			b, ok := q[i].(*ssa.Field)
			if !ok || a.Field != b.Field {
				return false
			}
		case *ssa.Index:
			b, ok := q[i].(*ssa.Index)
			if !ok || !same(a.Index, b.Index) {
				return false
			}
		case *ssa.IndexAddr:
			b, ok := q[i].(*ssa.IndexAddr)
			if !ok || !same(a.Index, b.Index) {
				return false
			}
		}
	}
	return true
}

// sameFunction reports whether two calls evaluate the same function, on
// the same receiver for a method of an interface.
func sameFunction(a, b *ssa.CallCommon) bool {
	if a.IsInvoke() || b.IsInvoke() {
		return a.IsInvoke() && b.IsInvoke() && a.Method == b.Method && same(a.Value, b.Value)
	}
	return same(a.Value, b.Value)
}

// same reports whether a and b read the same value: one SSA value, equal
// constants, or loads and selections of the same place.
func same(a, b ssa.Value) bool { return sameDepth(a, b, 4) }

func sameDepth(a, b ssa.Value, depth int) bool {
	a, b = provenance.Strip(a), provenance.Strip(b)
	if a == b {
		return true
	}
	if depth == 0 {
		return false
	}
	switch a := a.(type) {
	case *ssa.Const:
		b, ok := b.(*ssa.Const)
		return ok && equalConst(a, b)
	case *ssa.UnOp:
		b, ok := b.(*ssa.UnOp)
		return ok && a.Op == token.MUL && b.Op == token.MUL && sameDepth(a.X, b.X, depth-1)
	case *ssa.FieldAddr:
		b, ok := b.(*ssa.FieldAddr)
		return ok && a.Field == b.Field && sameDepth(a.X, b.X, depth-1)
	case *ssa.Field:
		b, ok := b.(*ssa.Field)
		return ok && a.Field == b.Field && sameDepth(a.X, b.X, depth-1)
	case *ssa.IndexAddr:
		b, ok := b.(*ssa.IndexAddr)
		return ok && sameDepth(a.X, b.X, depth-1) && sameDepth(a.Index, b.Index, depth-1)
	case *ssa.Index:
		b, ok := b.(*ssa.Index)
		return ok && sameDepth(a.X, b.X, depth-1) && sameDepth(a.Index, b.Index, depth-1)
	}
	return false
}

// equalConst reports whether two SSA constants have equal values of the
// same type.
func equalConst(a, b *ssa.Const) bool {
	if a.Value == nil || b.Value == nil {
		return a.Value == nil && b.Value == nil && a.Type() == b.Type()
	}
	return a.Value.ExactString() == b.Value.ExactString() && a.Type() == b.Type()
}

// sameStep reports whether a and b are the same step: the same value or
// equal constants.
func (c *checker) sameStep(a, b ssa.Value) bool {
	if same(a, b) {
		return true
	}
	fa, oka := constval.Float(provenance.Strip(a), c.globals)
	fb, okb := constval.Float(provenance.Strip(b), c.globals)
	return oka && okb && fa == fb
}

// scalarOffsets classifies the evaluations by one argument that differs
// between them as x, x+h or x-h, all other arguments being the same.
func (c *checker) scalarOffsets(q *quotient) bool {
	pos, ok := varying(q.evals)
	if !ok || pos < 0 {
		return false
	}
	var args []ssa.Value
	for _, e := range q.evals {
		args = append(args, e.call.Common().Args[pos])
	}
	if !isReal(args[0].Type()) {
		return false
	}
	for _, x := range candidates(args) {
		if c.offsetsFrom(q, args, x) {
			return true
		}
	}
	return false
}

// varying returns the one argument position where the evaluations differ,
// or -1 when they agree everywhere.
func varying(evals []evaluation) (int, bool) {
	pos := -1
	for i, a := range evals[0].call.Common().Args {
		for _, e := range evals[1:] {
			if !same(a, e.call.Common().Args[i]) {
				if pos >= 0 && pos != i {
					return 0, false // two arguments vary
				}
				pos = i
			}
		}
	}
	return pos, true
}

// candidates returns the values that may be x: each argument, the operands
// of a sum and the left operand of a difference.
func candidates(args []ssa.Value) []ssa.Value {
	var out []ssa.Value
	for _, a := range args {
		out = append(out, a)
		if b, ok := provenance.Strip(a).(*ssa.BinOp); ok && (b.Op == token.ADD || b.Op == token.SUB) {
			out = append(out, b.X)
			if b.Op == token.ADD {
				out = append(out, b.Y)
			}
		}
	}
	return out
}

// offsetsFrom classifies every argument relative to x as x + k·h with a
// common step h: k is ±1, or a whole multiple for the outer points of a
// five-point stencil (x+2*h, or constants 1e-3 and 2e-3 where the smaller
// is h).
func (c *checker) offsetsFrom(q *quotient, args []ssa.Value, x ssa.Value) bool {
	type point struct {
		sign  int
		step  ssa.Value // as written, x + step
		base  ssa.Value // step = mult·base
		mult  float64
		value float64 // the base's value when constant, else 0
	}
	points := make([]point, len(args))
	unit := -1 // the point with the smallest step
	var bumps []bump
	for i, a := range args {
		k, step, bp, ok := offset(a, x)
		if !ok {
			return false
		}
		if k == 0 {
			continue
		}
		p := point{sign: k, step: step}
		p.base, p.mult = c.multiple(step)
		p.value, _ = constval.Float(provenance.Strip(p.base), c.globals)
		points[i] = p
		bumps = append(bumps, bp)
		if unit < 0 || p.mult*math.Abs(p.value) < points[unit].mult*math.Abs(points[unit].value) || p.mult < points[unit].mult {
			unit = i
		}
	}
	if unit < 0 {
		return false
	}
	u := points[unit]
	for i, p := range points {
		if p.sign == 0 {
			q.evals[i].offset = 0
			continue
		}
		k := p.mult / u.mult
		if !c.sameStep(p.base, u.base) {
			if p.value == 0 || u.value == 0 {
				return false // different steps that are not multiples of one constant
			}
			k *= p.value / u.value
		}
		if k != math.Round(k) || math.Abs(k) > 2 {
			return false
		}
		q.evals[i].offset = p.sign * int(k)
	}
	q.x, q.h, q.bumps = x, u.step, bumps
	return true
}

// multiple reads step as m·h with m a whole constant (2*h), returning h
// and m; any other step is 1·step.
func (c *checker) multiple(step ssa.Value) (ssa.Value, float64) {
	if b, ok := provenance.Strip(step).(*ssa.BinOp); ok && b.Op == token.MUL {
		for _, pair := range [][2]ssa.Value{{b.X, b.Y}, {b.Y, b.X}} {
			if m, ok := constval.Float(provenance.Strip(pair[0]), c.globals); ok && m == math.Round(m) && m > 0 {
				if _, constStep := constval.Float(provenance.Strip(pair[1]), c.globals); !constStep {
					return pair[1], m
				}
			}
		}
	}
	return step, 1
}

// offset returns k and h when a is x + k·h for k in -1, 0, 1.
func offset(a, x ssa.Value) (int, ssa.Value, bump, bool) {
	if same(a, x) {
		return 0, nil, bump{}, true
	}
	b, ok := provenance.Strip(a).(*ssa.BinOp)
	switch {
	case !ok:
	case b.Op == token.ADD && same(b.X, x):
		return 1, b.Y, bump{op: b}, true
	case b.Op == token.ADD && same(b.Y, x):
		return 1, b.X, bump{op: b, stepX: true}, true
	case b.Op == token.SUB && same(b.X, x):
		return -1, b.Y, bump{op: b}, true
	}
	return 0, nil, bump{}, false
}

// scaled reports whether the constants and steps around the sum make it
// ±λ·weights/(den·h^order) for scheme s.
func (c *checker) scaled(q *quotient, m monomial, s *scheme, lambda float64) bool {
	coef, power := m.c, 0
	for leaf, p := range m.leaves {
		k, ok := c.steps(q, leaf)
		if !ok {
			return false // something other than the step scales the sum
		}
		coef *= math.Pow(k, float64(p))
		power += p
	}
	if o, ok := c.origin(q.h); ok && o.constant {
		hc := o.value
		q.scale = coef * math.Pow(hc, float64(power))
		return nearAbs(lambda*q.scale, 1/(s.den*math.Pow(hc, float64(s.order))))
	}
	return power == -s.order && nearAbs(lambda*coef, 1/s.den)
}

// nearAbs reports whether |a| and |b| agree: a negated quotient, such as
// a force -(U(r+h)-U(r))/h, has the same scheme and step.
func nearAbs(a, b float64) bool { return near(math.Abs(a), math.Abs(b)) }

// steps returns how many steps the value v is: 1 for h, k-j for the
// difference of the points x+k·h and x+j·h (the representable step
// (x+h)-x of Numerical Recipes §5.7).
func (c *checker) steps(q *quotient, v ssa.Value) (float64, bool) {
	if c.sameStep(v, q.h) {
		return 1, true
	}
	if m, ok := provenance.Strip(q.h).(*ssa.BinOp); ok && m.Op == token.MUL {
		// h = r·s, a scaled step such as r·max(1,|x|): the leaf s is h/r.
		for _, pair := range [][2]ssa.Value{{m.X, m.Y}, {m.Y, m.X}} {
			if r, ok := constval.Float(provenance.Strip(pair[0]), c.globals); ok && r != 0 && same(pair[1], v) {
				return 1 / r, true
			}
		}
	}
	d, ok := provenance.Strip(v).(*ssa.BinOp)
	if !ok || d.Op != token.SUB || q.vector {
		return 0, false
	}
	k, okk := q.pointOffset(d.X)
	j, okj := q.pointOffset(d.Y)
	return float64(k - j), okk && okj && k != j
}

// pointOffset returns k when v is the point x + k·h of the quotient.
func (q *quotient) pointOffset(v ssa.Value) (int, bool) {
	if same(v, q.x) {
		return 0, true
	}
	for _, b := range q.bumps {
		if same(v, b.op) {
			if b.op.Op == token.SUB {
				return -1, true
			}
			return 1, true
		}
	}
	return 0, false
}
