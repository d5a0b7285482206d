package stoptol

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"slices"

	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/tolerance"
)

// sweep judges a loop that cuts its state at a fraction: an exit compares
// x with a constant bound, NaN leaves the loop, and each pass sets x
// afresh (not from its own value) and cuts the state x is computed from at
// x (lo, hi = cut(lo, hi, x)). Each pass then consumes the fraction x of
// what is left, so the loop advances to its bound and is no convergence
// loop, as long as x cannot be 0. It reports whether the loop is such a
// sweep, and reports the loop when a parameter among x's factors can make
// x 0 (a tolerance of 0, which neither the function nor, for an
// unexported one, its callers floor at a positive value).
func (c *checker) sweep(d *deps, tested map[*types.Var]bool) bool {
	for _, x := range d.near(tested) {
		bound, ok := d.boundTest(x)
		if !ok || len(d.rhs[x]) != 1 || d.tokens[x][0] != token.ASSIGN && d.tokens[x][0] != token.DEFINE ||
			slices.Contains(d.from[x], x) || !d.cuts(x) || d.canVanish(d.rhs[x][0], 4, false) {
			continue
		}
		if p := c.zeroFactor(d, d.rhs[x][0], 4); p != nil {
			fn := "the function literal"
			if d.l.decl != nil {
				fn = d.l.decl.Name.Name
			}
			c.reportLoop(d, catStall, fmt.Sprintf("loop cuts its state at %s = %s each pass and ends only when %s reaches %s: %[1]s is 0 when %[5]s is 0, which neither %[6]s nor its callers exclude, and the loop then never advances; floor %[5]s at a positive value (math.Max(%[5]s, c)) or add an iteration limit",
				x.Name(), fixes.Source(c.pass.Fset, d.rhs[x][0]), x.Name(), bound, p.Name(), fn))
		}
		return true
	}
	return false
}

// boundTest returns the constant that an exit test compares x with.
func (d *deps) boundTest(x *types.Var) (string, bool) {
	for _, t := range d.tests {
		b, ok := ast.Unparen(t.e).(*ast.BinaryExpr)
		if !ok || !provenance.Ordered(b.Op) {
			continue
		}
		for _, pair := range [][2]ast.Expr{{b.X, b.Y}, {b.Y, b.X}} {
			if subjectOf(d.info, pair[0]) == x && d.info.Types[pair[1]].Value != nil {
				return d.info.Types[pair[1]].Value.String(), true
			}
		}
	}
	return "", false
}

// cuts reports whether the loop passes x to a call whose results it
// assigns to variables x is computed from: the state is cut at x.
func (d *deps) cuts(x *types.Var) bool {
	inputs := make(map[*types.Var]bool)
	var visit func(v *types.Var)
	visit = func(v *types.Var) {
		for _, w := range d.from[v] {
			if !inputs[w] {
				inputs[w] = true
				visit(w)
			}
		}
	}
	visit(x)
	found := false
	ast.Inspect(d.l.stmt.Body, func(n ast.Node) bool {
		as, ok := n.(*ast.AssignStmt)
		if !ok || found || len(as.Rhs) != 1 {
			return !found
		}
		call, ok := as.Rhs[0].(*ast.CallExpr)
		if !ok || !slices.ContainsFunc(call.Args, func(a ast.Expr) bool { return subjectOf(d.info, a) == x }) {
			return true
		}
		found = slices.ContainsFunc(as.Lhs, func(l ast.Expr) bool { return inputs[subjectOf(d.info, l)] })
		return !found
	})
	return found
}

// zeroFactor returns a parameter of the function around the loop that is
// a factor of e (through products, numerators, roots, absolute values,
// minima and local variables) and may be 0: not floored by
// p = math.Max(p, c) with c > 0 in the function, nor, for an unexported
// function, by every caller in the package's non-test files.
func (c *checker) zeroFactor(d *deps, e ast.Expr, depth int) *types.Var {
	if depth == 0 {
		return nil
	}
	switch e := ast.Unparen(e).(type) {
	case *ast.UnaryExpr:
		return c.zeroFactor(d, e.X, depth)
	case *ast.BinaryExpr:
		switch e.Op {
		case token.MUL:
			if p := c.zeroFactor(d, e.X, depth); p != nil {
				return p
			}
			return c.zeroFactor(d, e.Y, depth)
		case token.QUO:
			return c.zeroFactor(d, e.X, depth)
		}
	case *ast.CallExpr:
		switch provenance.MathCallee(d.info, e) {
		case "Sqrt", "Cbrt", "Abs", "Pow": // Pow(x, y) is 0 with x, for y > 0
			return c.zeroFactor(d, e.Args[0], depth-1)
		case "Min":
			if p := c.zeroFactor(d, e.Args[0], depth-1); p != nil {
				return p
			}
			return c.zeroFactor(d, e.Args[1], depth-1)
		}
	case *ast.Ident:
		v := tolerance.VarOf(d.info, e)
		switch {
		case v == nil || c.positive(e):
			return nil
		case c.isParam(d.l.decl, v):
			if c.floored(d.l.decl, v, d.l.stmt.Pos()) {
				return nil
			}
			return v
		}
		rs := assignments(d.info, d.l.body, v)
		if len(rs) == 0 {
			return v // a parameter of a function literal, or a package variable: nothing here bounds it
		}
		for _, r := range rs {
			if p := c.zeroFactor(d, r, depth-1); p != nil {
				return p
			}
		}
	}
	return nil
}

// isParam reports whether v is a parameter of fd.
func (c *checker) isParam(fd *ast.FuncDecl, v *types.Var) bool {
	if fd == nil {
		return false
	}
	for _, field := range fd.Type.Params.List {
		for _, name := range field.Names {
			if c.pass.TypesInfo.Defs[name] == v {
				return true
			}
		}
	}
	return false
}

// floored reports whether parameter v of fd is floored at a positive value
// before pos: in fd itself, or, when fd is unexported, at every call in the
// package's non-test files, each passing a positive constant or a floored
// parameter of its own function.
func (c *checker) floored(fd *ast.FuncDecl, v *types.Var, pos token.Pos) bool {
	if c.flooredIn(fd, v, pos) {
		return true
	}
	fn, _ := c.pass.TypesInfo.Defs[fd.Name].(*types.Func)
	if fn == nil || fd.Name.IsExported() || fd.Recv != nil {
		return false
	}
	i := 0
	for i < fn.Signature().Params().Len() && fn.Signature().Params().At(i) != v {
		i++
	}
	calls, uses := 0, 0
	for _, f := range c.pass.Files {
		if provenance.InTestFile(c.pass.Fset, f.Pos()) {
			continue
		}
		ok := true
		ast.Inspect(f, func(n ast.Node) bool {
			switch n := n.(type) {
			case *ast.Ident:
				if c.pass.TypesInfo.Uses[n] == fn {
					uses++
				}
			case *ast.CallExpr:
				if typeutil.StaticCallee(c.pass.TypesInfo, n) == fn && i < len(n.Args) {
					calls++
					ok = ok && c.positiveArg(f, n, n.Args[i])
				}
			}
			return ok
		})
		if !ok {
			return false
		}
	}
	return calls > 0 && calls == uses
}

// positiveArg reports whether a, an argument of call in file f, is a
// positive constant or a parameter floored by the function declaring it.
func (c *checker) positiveArg(f *ast.File, call *ast.CallExpr, a ast.Expr) bool {
	if c.positive(a) {
		return true
	}
	v := tolerance.VarOf(c.pass.TypesInfo, a)
	for _, decl := range f.Decls {
		if fd, ok := decl.(*ast.FuncDecl); ok && fd.Body != nil && fd.Pos() <= call.Pos() && call.End() <= fd.End() {
			return v != nil && c.isParam(fd, v) && c.flooredIn(fd, v, call.Pos())
		}
	}
	return false
}

// flooredIn reports whether the body of fd begins, before pos, with
// v = math.Max(v, c) or math.Max(c, v), c positive, as a statement of its
// own at the top level, and assigns v nowhere else.
func (c *checker) flooredIn(fd *ast.FuncDecl, v *types.Var, pos token.Pos) bool {
	if fd == nil || fd.Body == nil {
		return false
	}
	all := assignments(c.pass.TypesInfo, fd.Body, v)
	for _, s := range fd.Body.List {
		as, ok := s.(*ast.AssignStmt)
		if !ok || as.Pos() >= pos || len(as.Lhs) != 1 || len(as.Rhs) != 1 || tolerance.VarOf(c.pass.TypesInfo, as.Lhs[0]) != v {
			continue
		}
		call, ok := as.Rhs[0].(*ast.CallExpr)
		fn, _ := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func)
		if !ok || fn == nil || fn.Pkg() == nil || fn.Pkg().Path() != "math" || fn.Name() != "Max" || len(all) != 1 {
			return false
		}
		x, y := call.Args[0], call.Args[1]
		return tolerance.VarOf(c.pass.TypesInfo, x) == v && c.positive(y) || tolerance.VarOf(c.pass.TypesInfo, y) == v && c.positive(x)
	}
	return false
}

// positive reports whether e is a positive constant, or a package variable
// declared with a positive constant (a floor such as var Epsilon = 1e-10).
func (c *checker) positive(e ast.Expr) bool {
	val := c.pass.TypesInfo.Types[e].Value
	if val == nil {
		if v := tolerance.VarOf(c.pass.TypesInfo, e); v != nil && v.Parent() == c.pass.Pkg.Scope() {
			val = c.packageInit(v)
		}
	}
	return val != nil && (val.Kind() == constant.Float || val.Kind() == constant.Int) && constant.Sign(val) > 0
}

// packageInit returns the constant a package variable is declared with.
func (c *checker) packageInit(v *types.Var) constant.Value {
	for _, f := range c.pass.Files {
		for _, decl := range f.Decls {
			gd, ok := decl.(*ast.GenDecl)
			if !ok || gd.Tok != token.VAR || v.Pos() < gd.Pos() || v.Pos() > gd.End() {
				continue
			}
			for _, spec := range gd.Specs {
				vs := spec.(*ast.ValueSpec)
				for i, name := range vs.Names {
					if c.pass.TypesInfo.Defs[name] == v && i < len(vs.Values) {
						return c.pass.TypesInfo.Types[vs.Values[i]].Value
					}
				}
			}
		}
	}
	return nil
}
