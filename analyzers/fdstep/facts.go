package fdstep

import (
	"cmp"
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"maps"
	"slices"
	"strings"

	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/provenance"
	"roundoff/internal/numeric"
)

// stepFact records that parameters of a function, or a struct field, hold
// the step of a difference quotient, so that other packages can judge the
// constants they pass or store.
type stepFact struct{ Uses []stepUse }

// A stepUse is one difference quotient that takes its step from a
// parameter or a field.
type stepUse struct {
	Param  int     // the parameter's index, receiver first; -1 for a field
	Name   string  // the parameter or the field
	Scheme string  // the scheme's name
	X      int     // the parameter holding x, or -1
	Float  string  // the format of x: "float64" or "float32"
	Eps    float64 // eps_f of the evaluated function
	In     string  // the function taking the parameter, or reading the field
}

func (*stepFact) AFact() {}

func (f *stepFact) String() string {
	var parts []string
	for _, u := range f.Uses {
		parts = append(parts, fmt.Sprintf("%s step of %s", u.Scheme, u.In))
	}
	return "fdstep(" + strings.Join(parts, ", ") + ")"
}

// A use is a stepUse seen from this package: pos is the quotient when it
// is here.
type use struct {
	stepUse
	pos token.Pos
}

// format returns x's format with eps replaced by eps_f.
func (u use) format() numeric.Format {
	f := numeric.Float64
	if u.Float == numeric.Float32.Name {
		f = numeric.Float32
	}
	f.Eps = u.Eps
	return f
}

func (u use) scheme() *scheme { return schemeNamed(u.Scheme) }

// schemeNamed returns the scheme called name, or nil.
func schemeNamed(name string) *scheme {
	for _, s := range schemes {
		if s.name == name {
			return s
		}
	}
	return nil
}

// addParam records that parameter p holds the step of u, and judges the
// arguments of the calls in this package.
func (c *checker) addParam(p *ssa.Parameter, u use) {
	fn := p.Parent()
	i := slices.Index(fn.Params, p)
	if c.params[fn] == nil {
		c.params[fn] = make(map[int][]use)
	}
	for _, old := range c.params[fn][i] {
		if old.stepUse == u.stepUse {
			return // already known
		}
	}
	c.params[fn][i] = append(c.params[fn][i], u)
	for _, call := range c.callers[fn] {
		c.argument(call, i, u)
	}
}

// addField records that field f holds the step of u.
func (c *checker) addField(f *types.Var, u use) {
	if !slices.ContainsFunc(c.fields[f], func(old use) bool { return old.stepUse == u.stepUse }) {
		c.fields[f] = append(c.fields[f], u)
	}
}

// argument judges the argument a call passes for parameter i, which holds
// the step of u.
func (c *checker) argument(call *ssa.Call, i int, u use) {
	args := call.Common().Args
	if call.Common().IsInvoke() || i >= len(args) {
		return
	}
	var x ssa.Value
	if u.X >= 0 && u.X < len(args) {
		x = args[u.X]
	}
	if x != nil && c.onGrid(x, args[i]) {
		return // x moves by h: a grid spacing
	}
	o, ok := c.origin(args[i])
	if !ok {
		return
	}
	switch {
	case o.constant:
		c.candidate(c.argSyntax(call, i), o.value, x, call, u)
	case o.param != nil:
		fn := o.param.Parent()
		u2 := u
		u2.Param, u2.Name, u2.In, u2.X = paramIndex(fn, o.param), o.param.Name(), funcName(fn), -1
		if x != nil {
			u2.X = paramIndex(fn, x)
		}
		c.addParam(o.param, u2)
	case o.field != nil:
		u2 := u
		u2.Param, u2.Name, u2.In, u2.X = -1, o.field.Name(), funcName(call.Parent()), -1
		c.addField(o.field, u2)
	}
}

// argSyntax returns the syntax of argument i (counted as SSA counts, the
// receiver first) of call, or nil.
func (c *checker) argSyntax(call *ssa.Call, i int) ast.Expr {
	ce, ok := c.node(call.Pos()).(*ast.CallExpr)
	if !ok || ce.Ellipsis.IsValid() {
		return nil
	}
	j := i - (len(call.Common().Args) - len(ce.Args))
	if j < 0 || j >= len(ce.Args) {
		return nil
	}
	return ce.Args[j]
}

// A pending report is the worst verdict found so far for one constant
// passed or stored as a step.
type pending struct {
	node ast.Expr
	v    verdict
	u    use
}

// candidate judges the constant h passed or stored at node as the step of
// u, keeping the worst verdict per node. result is the call that passes
// it, whose result a check may compare with a tolerance; nil for a store.
func (c *checker) candidate(node ast.Expr, h float64, x, result ssa.Value, u use) {
	s := u.scheme()
	if node == nil || s == nil || !inRange(h) {
		return
	}
	var xv float64
	xKnown := false
	if x != nil {
		xv, xKnown = constval.Float(provenance.Strip(x), c.globals)
	}
	tol := c.checkTolerance(result)
	v, report := judge(s, h, u.format(), xv, xKnown, tol)
	if !report || c.deliberate(node.Pos(), v) {
		return
	}
	p, ok := c.pending[node.Pos()]
	if !ok || worse(v, p.v) {
		c.pending[node.Pos()] = &pending{node, v, u}
	}
}

// worse reports whether verdict a is worse than b: badly sized beats
// unscaled, and a larger error ratio beats a smaller.
func worse(a, b verdict) bool {
	if a.bad != b.bad || a.large != b.large {
		return a.bad || a.large
	}
	return a.errH/a.errOpt > b.errH/b.errOpt
}

// propagate judges the constants passed to step parameters of other
// packages' functions and stored into step fields, then reports every
// pending constant.
func (c *checker) propagate() {
	for _, call := range c.imported {
		c.gonumFD(call)
		var fact stepFact
		obj := call.Common().StaticCallee().Object()
		if obj == nil || !c.pass.ImportObjectFact(obj, &fact) {
			continue
		}
		for _, su := range fact.Uses {
			c.argument(call, su.Param, use{stepUse: su})
		}
	}
	for _, f := range c.fieldOrder {
		uses := c.fields[f]
		var fact stepFact
		if f.Pkg() != c.pass.Pkg && c.pass.ImportObjectFact(f, &fact) {
			for _, su := range fact.Uses {
				uses = append(uses, use{stepUse: su})
			}
		}
		for _, st := range c.stores[f] {
			if o, ok := c.origin(st.Val); ok && o.constant {
				for _, u := range uses {
					c.candidate(c.value(st.Pos()), o.value, nil, nil, u)
				}
			}
		}
	}
	ps := slices.Collect(maps.Values(c.pending))
	slices.SortFunc(ps, func(a, b *pending) int { return cmp.Compare(a.node.Pos(), b.node.Pos()) })
	for _, p := range ps {
		c.reportConstant(p)
	}
}

// exportFacts exports the step parameters and fields of this package.
func (c *checker) exportFacts() {
	for fn, params := range c.params {
		obj := fn.Object()
		if obj == nil || obj.Pkg() != c.pass.Pkg {
			continue
		}
		fact := new(stepFact)
		for _, i := range slices.Sorted(maps.Keys(params)) {
			for _, u := range params[i] {
				fact.Uses = append(fact.Uses, u.stepUse)
			}
		}
		c.pass.ExportObjectFact(obj, fact)
	}
	for f, uses := range c.fields {
		if f.Pkg() != c.pass.Pkg {
			continue
		}
		fact := new(stepFact)
		for _, u := range uses {
			fact.Uses = append(fact.Uses, u.stepUse)
		}
		c.pass.ExportObjectFact(f, fact)
	}
}
