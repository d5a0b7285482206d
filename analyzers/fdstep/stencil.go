package fdstep

import (
	"cmp"
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"math"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/internal/numeric"
)

// A table-driven stencil evaluates f at x + h·loc (or adds loc·h to one
// element of a copy of x) for coefficients loc read from a table, weights
// the values and divides by a power of h:
//
//	for _, pt := range stencil { d += pt.Coeff * f(x + h*pt.Loc) }
//	return d / math.Pow(h, order)
//
// The scheme is data, so only the step's scaling can be judged: a step
// that is a fixed constant, directly or as the default of a parameter or
// field (a formula's own Step), does not grow with |x|.

// A stencilPoint is one perturbation x + h·loc: h is one of the factors
// of the product, the one the function divides by.
type stencilPoint struct {
	add     *ssa.BinOp
	x       ssa.Value
	factors [2]ssa.Value
	h       ssa.Value // set once judged
}

// stencilPoint recognises b as x + a·b with a or b a coefficient read from
// a table.
func (c *checker) stencilPoint(b *ssa.BinOp) (stencilPoint, bool) {
	if b.Op != token.ADD || !isReal(b.Type()) {
		return stencilPoint{}, false
	}
	for _, pair := range [][2]ssa.Value{{b.X, b.Y}, {b.Y, b.X}} {
		m, ok := provenance.Strip(pair[1]).(*ssa.BinOp)
		if ok && m.Op == token.MUL && (coefficient(m.X) || coefficient(m.Y)) {
			return stencilPoint{add: b, x: pair[0], factors: [2]ssa.Value{m.X, m.Y}}, true
		}
	}
	return stencilPoint{}, false
}

// step returns the factor of p's product that fn divides by, the other
// being a coefficient, and its cell.
func (c *checker) step(p stencilPoint) (ssa.Value, any, bool) {
	for i, h := range p.factors {
		if _, constant := constval.Float(provenance.Strip(h), c.globals); constant || !coefficient(p.factors[1-i]) {
			continue
		}
		if cell := c.cell(h); c.dividesBy(p.add.Parent(), cell) {
			return h, cell, true
		}
	}
	return nil, nil, false
}

// coefficient reports whether v is read from a table: a field of a struct
// value or pointer, or an element of a slice.
func coefficient(v ssa.Value) bool {
	switch w := provenance.Strip(v).(type) {
	case *ssa.Field, *ssa.Index:
		return true
	case *ssa.UnOp:
		switch w.X.(type) {
		case *ssa.FieldAddr, *ssa.IndexAddr:
			return w.Op == token.MUL
		}
	}
	return false
}

// judgeStencils reports, once per function and step, the first
// perturbation of a table-driven stencil whose step is fixed.
func (c *checker) judgeStencils() {
	slices.SortFunc(c.stencils, func(a, b stencilPoint) int { return cmp.Compare(a.add.Pos(), b.add.Pos()) })
	seen := make(map[[2]any]bool)
	for _, p := range c.stencils {
		fn := p.add.Parent()
		h, cell, ok := c.step(p)
		if !ok || seen[[2]any{fn, cell}] || provenance.InTestFile(c.pass.Fset, p.add.Pos()) {
			continue
		}
		p.h = h
		seen[[2]any{fn, cell}] = true
		var sites []constSite
		if !c.stepLeaves(p.h, 10, make(map[ssa.Value]bool), &sites) || len(sites) == 0 {
			continue // computed (perhaps scaled), or chosen by the caller alone
		}
		c.reportStencil(p, slices.MinFunc(sites, func(a, b constSite) int { return cmp.Compare(a.value, b.value) }))
	}
}

// A constSite is a constant a step may take, and where it is written.
type constSite struct {
	value float64
	node  ast.Expr // nil when unknown
}

// stepLeaves collects the constants that v may take, following merges,
// captured and escaping variables, math.Sqrt, parameters (through this
// package's calls) and fields (through this package's stores). It fails on
// any other computation, which may scale the step.
func (c *checker) stepLeaves(v ssa.Value, depth int, seen map[ssa.Value]bool, out *[]constSite) bool {
	v = provenance.Strip(v)
	if seen[v] {
		return true
	}
	seen[v] = true
	if f, ok := constval.Float(v, c.globals); ok {
		if f != 0 { // 0 stands for "not set": the default applies
			*out = append(*out, constSite{value: f})
		}
		return true
	}
	if depth == 0 {
		return false
	}
	switch w := v.(type) {
	case *ssa.Phi:
		for _, e := range w.Edges {
			if !c.stepLeaves(e, depth-1, seen, out) {
				return false
			}
		}
		return true
	case *ssa.Parameter:
		i := slices.Index(w.Parent().Params, w)
		for _, call := range c.callers[w.Parent()] {
			if provenance.InTestFile(c.pass.Fset, call.Pos()) {
				continue // a test's own step
			}
			if i >= len(call.Common().Args) || !c.stepLeaves(call.Common().Args[i], depth-1, seen, out) {
				return false
			}
		}
		return true // with no caller here, the step is the caller's choice
	case *ssa.FreeVar:
		mc, i := c.closures[w.Parent()], slices.Index(w.Parent().FreeVars, w)
		return mc != nil && i >= 0 && c.stepLeaves(mc.Bindings[i], depth-1, seen, out)
	case *ssa.Alloc:
		for _, r := range *w.Referrers() {
			if st, ok := r.(*ssa.Store); ok && st.Addr == w && !c.stepLeaves(st.Val, depth-1, seen, out) {
				return false
			}
		}
		return true
	case *ssa.Call:
		fn := callee(w)
		if fn == nil || fn.Pkg == nil || fn.Pkg.Pkg.Path() != "math" || fn.Name() != "Sqrt" {
			return false
		}
		var inner []constSite
		if !c.stepLeaves(w.Call.Args[0], depth-1, seen, &inner) {
			return false
		}
		for _, s := range inner {
			*out = append(*out, constSite{math.Sqrt(s.value), s.node})
		}
		return true
	case *ssa.Field:
		return c.fieldLeaves(fieldOf(w.X.Type(), w.Field), out)
	case *ssa.UnOp:
		switch addr := w.X.(type) {
		case *ssa.FieldAddr:
			return c.fieldLeaves(fieldOf(addr.X.Type(), addr.Field), out)
		case *ssa.Alloc, *ssa.FreeVar:
			return w.Op == token.MUL && c.stepLeaves(addr, depth-1, seen, out)
		}
	}
	return false
}

// fieldLeaves collects the constants this package stores into field f.
func (c *checker) fieldLeaves(f *types.Var, out *[]constSite) bool {
	if f == nil {
		return false
	}
	for _, st := range c.stores[f] {
		if v, ok := constval.Float(provenance.Strip(st.Val), c.globals); ok && v != 0 && !provenance.InTestFile(c.pass.Fset, st.Pos()) {
			*out = append(*out, constSite{v, c.value(st.Pos())})
		}
	}
	return true
}

// cell returns what identifies the step h across its reads: the variable
// an escaping or captured h is loaded from, the field it is read from,
// else h itself.
func (c *checker) cell(h ssa.Value) any {
	h = provenance.Strip(h)
	if u, ok := h.(*ssa.UnOp); ok && u.Op == token.MUL {
		if fa, ok := u.X.(*ssa.FieldAddr); ok {
			return fieldOf(fa.X.Type(), fa.Field)
		}
		h = u.X
	}
	switch w := h.(type) {
	case *ssa.Field:
		return fieldOf(w.X.Type(), w.Field)
	case *ssa.FreeVar:
		if mc, i := c.closures[w.Parent()], slices.Index(w.Parent().FreeVars, w); mc != nil && i >= 0 {
			return c.cell(mc.Bindings[i])
		}
	}
	return h
}

// dividesBy reports whether fn, or the function it is a literal of,
// divides by the step in cell: by h, by a product with h (h*h), or by
// math.Pow(h, k).
func (c *checker) dividesBy(fn *ssa.Function, cell any) bool {
	for ; fn != nil; fn = fn.Parent() {
		for _, b := range fn.Blocks {
			for _, instr := range b.Instrs {
				if q, ok := instr.(*ssa.BinOp); ok && q.Op == token.QUO && c.isStepPower(q.Y, cell) {
					return true
				}
			}
		}
	}
	return false
}

// isStepPower reports whether v is h, a product with h, or math.Pow(h, k).
func (c *checker) isStepPower(v ssa.Value, cell any) bool {
	switch w := provenance.Strip(v).(type) {
	case *ssa.BinOp:
		return w.Op == token.MUL && (c.cell(w.X) == cell || c.cell(w.Y) == cell)
	case *ssa.Call:
		fn := callee(w)
		return fn != nil && fn.Pkg != nil && fn.Pkg.Pkg.Path() == "math" && fn.Name() == "Pow" && c.cell(w.Call.Args[0]) == cell
	}
	return c.cell(v) == cell
}

// reportStencil reports a table-driven stencil whose step takes the fixed
// value s, at its first perturbation, naming where s is written.
func (c *checker) reportStencil(p stencilPoint, s constSite) {
	node := c.node(p.add.Pos())
	if node == nil || c.said[node.Pos()] || !inRange(s.value) {
		return
	}
	c.said[node.Pos()] = true
	f := numeric.Float64
	if provenance.Admits32(p.x.Type()) {
		f = numeric.Float32
	}
	d := analysis.Diagnostic{
		Pos: node.Pos(), End: node.End(), Category: catUnscaled,
		Message: fmt.Sprintf("fixed stencil step %.3g does not scale with x: x+h rounds to x for |x| ≥ %.3g in %s, where the difference vanishes; scale it as r·max(1,|x|), r the formula's relative step (sqrt(eps) ≈ %.3g for a first difference)",
			s.value, f.AbsorbingMagnitude(s.value), f.Name, f.SqrtEps()),
	}
	if s.node != nil {
		d.Related = []analysis.RelatedInformation{{Pos: s.node.Pos(), End: s.node.End(), Message: fmt.Sprintf("step %.3g set here", s.value)}}
	}
	fixes.Report(c.pass, d)
}
