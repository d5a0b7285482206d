package fdstep

import (
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"slices"

	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/provenance"
	"roundoff/internal/numeric"
)

// An origin is where a step comes from: a constant, a parameter or a field.
// A parameter or field may come with a fixed default (h := o.Step; if h ==
// 0 { h = 1e-8 }): fallback is then set to the default's value.
type origin struct {
	constant bool
	value    float64
	param    *ssa.Parameter
	field    *types.Var
	fallback float64
	phi      *ssa.Phi // the merge of the chosen step and its default
}

// origin follows v through closure bindings to a constant (a literal,
// named constant, variable never reassigned or arithmetic of those), a
// parameter, or a load of a struct field.
func (c *checker) origin(v ssa.Value) (origin, bool) {
	for range 4 {
		v = provenance.Strip(v)
		if f, ok := constval.Float(v, c.globals); ok {
			return origin{constant: true, value: f}, true
		}
		switch w := v.(type) {
		case *ssa.Parameter:
			return origin{param: w}, true
		case *ssa.FreeVar:
			mc, i := c.closures[w.Parent()], slices.Index(w.Parent().FreeVars, w)
			if mc == nil || i < 0 {
				return origin{}, false
			}
			v = mc.Bindings[i]
			continue
		case *ssa.UnOp:
			if w.Op != token.MUL {
				break
			}
			switch addr := w.X.(type) {
			case *ssa.FieldAddr:
				f := fieldOf(addr.X.Type(), addr.Field)
				return origin{field: f}, f != nil
			case *ssa.FreeVar: // a captured variable, read through its cell
				f, ok := c.constVar(addr.Pos())
				return origin{constant: true, value: f}, ok
			}
		case *ssa.Field:
			f := fieldOf(w.X.Type(), w.Field)
			return origin{field: f}, f != nil
		case *ssa.Phi:
			return c.defaulted(w)
		}
		return origin{}, false
	}
	return origin{}, false
}

// defaulted reads a merge of a parameter or field with one constant, the
// defaulting idiom h := o.Step; if h == 0 { h = 1e-8 }.
func (c *checker) defaulted(phi *ssa.Phi) (origin, bool) {
	if len(phi.Edges) != 2 {
		return origin{}, false
	}
	for i, e := range phi.Edges {
		d, ok := constval.Float(provenance.Strip(e), c.globals)
		if !ok {
			continue
		}
		o, ok := c.origin(phi.Edges[1-i])
		if !ok || o.constant || o.phi != nil || d == 0 {
			return origin{}, false
		}
		o.fallback, o.phi = d, phi
		return o, true
	}
	return origin{}, false
}

// defaultSite returns the constant assigned as the default merged by phi:
// the right side of the assignment name = <constant> in phi's function.
func (c *checker) defaultSite(phi *ssa.Phi, val float64) ast.Expr {
	fn := phi.Parent().Syntax()
	if fn == nil {
		return nil
	}
	var site ast.Expr
	ast.Inspect(fn, func(n ast.Node) bool {
		as, ok := n.(*ast.AssignStmt)
		if !ok || len(as.Lhs) != 1 || len(as.Rhs) != 1 || site != nil {
			return site == nil
		}
		id, isIdent := as.Lhs[0].(*ast.Ident)
		tv := c.pass.TypesInfo.Types[as.Rhs[0]]
		if isIdent && id.Name == phi.Comment && tv.Value != nil {
			if f, _ := constant.Float64Val(constant.ToFloat(tv.Value)); f == val {
				site = as.Rhs[0]
			}
		}
		return true
	})
	return site
}

// scaledStep reads h as r·max(1,|x|) or r·(1+|x|) with r constant,
// possibly made representable as (x+h0)-x, and returns r.
func (c *checker) scaledStep(h, x ssa.Value) (float64, bool) {
	h, x = provenance.Strip(h), provenance.Strip(x)
	if d, ok := h.(*ssa.BinOp); ok && d.Op == token.SUB && provenance.Strip(d.Y) == x {
		if s, ok := provenance.Strip(d.X).(*ssa.BinOp); ok && s.Op == token.ADD && provenance.Strip(s.X) == x {
			h = provenance.Strip(s.Y) // (x+h0)-x, the representable step
		}
	}
	m, ok := h.(*ssa.BinOp)
	if !ok || m.Op != token.MUL {
		return 0, false
	}
	for _, pair := range [][2]ssa.Value{{m.X, m.Y}, {m.Y, m.X}} {
		if r, ok := constval.Float(provenance.Strip(pair[0]), c.globals); ok && scalesWith(pair[1], x) {
			return r, true
		}
	}
	return 0, false
}

// scalesWith reports whether v is max(1,|x|) or 1+|x|.
func scalesWith(v, x ssa.Value) bool {
	isAbsX := func(w ssa.Value) bool {
		call, ok := provenance.Strip(w).(*ssa.Call)
		fn := callee(call)
		return ok && fn != nil && fn.Pkg != nil && fn.Pkg.Pkg.Path() == "math" && fn.Name() == "Abs" && provenance.Strip(call.Call.Args[0]) == x
	}
	isOne := func(w ssa.Value) bool { f, ok := constval.Float(provenance.Strip(w), nil); return ok && f == 1 }
	switch v := provenance.Strip(v).(type) {
	case *ssa.Call:
		fn := callee(v)
		return fn != nil && fn.Pkg != nil && fn.Pkg.Pkg.Path() == "math" && fn.Name() == "Max" && len(v.Call.Args) == 2 &&
			(isOne(v.Call.Args[0]) && isAbsX(v.Call.Args[1]) || isOne(v.Call.Args[1]) && isAbsX(v.Call.Args[0]))
	case *ssa.BinOp:
		return v.Op == token.ADD && (isOne(v.X) && isAbsX(v.Y) || isOne(v.Y) && isAbsX(v.X))
	}
	return false
}

// callee returns the static callee of call, or nil.
func callee(call *ssa.Call) *ssa.Function {
	if call == nil {
		return nil
	}
	return call.Call.StaticCallee()
}

// constVar returns the value of the variable declared at pos when it is
// initialised with a constant and never reassigned.
func (c *checker) constVar(pos token.Pos) (float64, bool) {
	cur, ok := c.insp.Root().FindByPos(pos, pos)
	id, isIdent := cur.Node().(*ast.Ident)
	if !ok || !isIdent {
		return 0, false
	}
	init, ok := c.decls[c.pass.TypesInfo.ObjectOf(id)]
	if !ok {
		return 0, false
	}
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, init)
	if !ok || v.Kind() != constant.Float && v.Kind() != constant.Int {
		return 0, false
	}
	f, _ := constant.Float64Val(v)
	return f, true
}

// judgeQuotient reports a quotient whose step is constant, or records the
// parameter or field it takes its step from.
func (c *checker) judgeQuotient(q *quotient) {
	if c.onGrid(q.x, q.h) {
		return // x moves by h: h is a grid spacing, not a chosen step
	}
	f := c.format(q)
	tol := c.checkTolerance(q.root)
	if r, ok := c.scaledStep(q.h, q.x); ok {
		// Scaled with x: only its size relative to max(1,|x|) can be wrong,
		// as the machine-precision step is for a function declared noisy.
		if v, _ := judge(q.scheme, r, f, 1, true, tol); (v.bad || v.large) && inRange(r) {
			v.scaled = true
			c.reportQuotient(q, v)
		}
		return
	}
	o, ok := c.origin(q.h)
	if !ok {
		return // computed, loaded or merged: not a fixed step
	}
	xv, xKnown := constval.Float(provenance.Strip(q.x), c.globals)
	if o.phi != nil {
		c.judgeDefault(q, f, o)
	}
	switch {
	case o.constant:
		if v, report := judge(q.scheme, o.value, f, xv, xKnown, tol); report && inRange(o.value) {
			c.reportQuotient(q, v)
		}
	case xKnown:
		// x is fixed inside, the step comes from outside: rare, not judged
	case o.param != nil:
		fn := o.param.Parent()
		c.addParam(o.param, c.newUse(q, f, paramIndex(fn, o.param), o.param.Name(), paramIndex(fn, q.x)))
	case o.field != nil:
		c.addField(o.field, c.newUse(q, f, -1, o.field.Name(), -1))
	}
}

// judgeDefault judges the fixed default of a chosen step at the quotient
// that takes it, naming the default's site.
func (c *checker) judgeDefault(q *quotient, f numeric.Format, o origin) {
	if v, report := judge(q.scheme, o.fallback, f, 0, false, 0); report && inRange(o.fallback) {
		v.isDefault, v.fallback = true, c.defaultSite(o.phi, o.fallback)
		c.reportQuotient(q, v)
	}
}

func (c *checker) newUse(q *quotient, f numeric.Format, param int, name string, x int) use {
	return use{stepUse{Param: param, Name: name, Scheme: q.scheme.name, X: x, Float: f.Name, Eps: f.Eps, In: funcName(q.root.Parent())}, q.root.Pos()}
}

// funcName names fn for a message.
func funcName(fn *ssa.Function) string {
	if fn.Parent() != nil {
		return "the function literal in " + funcName(fn.Parent())
	}
	return fn.Name()
}

// inRange reports whether h is a step fdstep judges: positive and below 1.
// A step of 1 or more differences a sequence ((f(n+1)-f(n))/1), and is not
// a derivative step.
func inRange(h float64) bool { return h > 0 && h < 1 }

// paramIndex returns the index of v among fn's parameters, or -1.
func paramIndex(fn *ssa.Function, v ssa.Value) int {
	p, ok := provenance.Strip(v).(*ssa.Parameter)
	if !ok {
		return -1
	}
	return slices.Index(fn.Params, p)
}

// format returns the format of x (float32 when the quotient or x may be
// float32) with its epsilon replaced by eps_f of the evaluated function.
func (c *checker) format(q *quotient) numeric.Format {
	f := numeric.Float64
	if provenance.Admits32(q.x.Type()) || provenance.Admits32(q.root.Type()) {
		f = numeric.Float32
	}
	f.Eps = c.epsF(calleeObject(q.evals[0].call.Common()), f)
	return f
}

// calleeObject returns the declared function, method, parameter or field
// that a call evaluates, or nil.
func calleeObject(com *ssa.CallCommon) types.Object {
	if com.IsInvoke() {
		return com.Method
	}
	if fn := com.StaticCallee(); fn != nil {
		return fn.Object()
	}
	switch v := provenance.Strip(com.Value).(type) {
	case *ssa.Parameter:
		return v.Object()
	case *ssa.UnOp:
		if fa, ok := v.X.(*ssa.FieldAddr); ok {
			return fieldOf(fa.X.Type(), fa.Field)
		}
	}
	return nil
}

// onGrid reports whether x is a point of a grid of spacing h: x moves by a
// multiple of h in a loop (t += dt), or x = x0 + i·h. h is then fixed by
// the data or the discretisation, not chosen for the derivative.
func (c *checker) onGrid(x, h ssa.Value) bool {
	switch v := provenance.Strip(x).(type) {
	case *ssa.Phi:
		b, ok := provenance.LoopStep(v)
		if !ok {
			return false
		}
		if provenance.Strip(b.Y) == v {
			return c.multipleOf(b.X, h)
		}
		return c.multipleOf(b.Y, h)
	case *ssa.BinOp:
		if v.Op == token.ADD || v.Op == token.SUB {
			return c.multipleOf(v.X, h) || c.multipleOf(v.Y, h)
		}
	}
	return c.multipleOf(x, h)
}

// multipleOf reports whether v is h, or h times a constant or a converted
// integer.
func (c *checker) multipleOf(v, h ssa.Value) bool {
	if c.sameStep(v, h) {
		return true
	}
	b, ok := provenance.Strip(v).(*ssa.BinOp)
	if !ok || b.Op != token.MUL {
		return false
	}
	return c.sameStep(b.X, h) && c.counter(b.Y) || c.sameStep(b.Y, h) && c.counter(b.X)
}

// counter reports whether v is a constant or an integer converted to float.
func (c *checker) counter(v ssa.Value) bool {
	if _, ok := constval.Float(provenance.Strip(v), c.globals); ok {
		return true
	}
	conv, ok := v.(*ssa.Convert)
	if !ok {
		return false
	}
	b, ok := conv.X.Type().Underlying().(*types.Basic)
	return ok && b.Info()&types.IsInteger != 0
}
