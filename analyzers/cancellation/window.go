package cancellation

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/fixes"
)

// downdates reports a running sum or mean kept in a field of a method's
// receiver, or in an element of a slice field (see sumField), that the
// package's methods both take from (r.f -= e, e not a constant) and add
// into (see noteUpdate): values that passed are taken out again (a
// sliding window, a reservoir, a reweighted total, a windowed Welford
// update). Each update rounds at the size of the sum at that time
// (Higham 2002, §4.2), so a large value that passes through leaves its
// rounding, up to u·|value|, behind for good: once the sum holds small
// values again it carries an error that never decays. Recomputing the sum
// from the values kept, or a compensated sum, removes it. Sums in local
// variables last one call and are left alone. The first subtraction of
// each such field is reported.
func (c *checker) downdates() {
	reported := map[types.Object]bool{}
	for _, t := range c.taken {
		sub, f := t.as, t.field
		add := c.added[f]
		if add == nil || reported[f] {
			continue
		}
		reported[f] = true
		fixes.Report(c.pass, analysis.Diagnostic{
			Pos: sub.Pos(), End: sub.End(), Category: catVariance,
			Related: []analysis.RelatedInformation{{Pos: add.Pos(), End: add.End(), Message: "added to here"}},
			Message: fmt.Sprintf("running sum or mean %s, taken from as well as added to: each value removed leaves its rounding, up to u·|value| (u = %.3g), behind for good, so after a large value has passed the sum of small ones carries an error that never decays; recompute it from the values kept from time to time, or keep a compensated sum",
				fixes.Source(c.pass.Fset, sub.Lhs[0]), unitRoundoff),
		})
	}
}

// taking is a subtraction from a sum field.
type taking struct {
	as    *ast.AssignStmt
	field types.Object
}

// noteUpdate records an assignment that takes from a sum field or adds
// into one: r.f += e (e not a constant), or r.f = e where e adds to r.f
// (see addsInto).
func (c *checker) noteUpdate(cur inspector.Cursor, as *ast.AssignStmt) {
	if len(as.Lhs) != 1 || len(as.Rhs) != 1 {
		return
	}
	f := c.sumField(cur, as.Lhs[0])
	switch {
	case f == nil:
	case as.Tok == token.SUB_ASSIGN && !c.isConst(as.Rhs[0]) && !c.readsOperand(cur, as.Rhs[0]) && !c.reduces(cur, as.Rhs[0], f) && !c.rebuilt(cur, as, f):
		c.taken = append(c.taken, taking{as, f})
	case as.Tok == token.ADD_ASSIGN && !c.isConst(as.Rhs[0]),
		as.Tok == token.ASSIGN && c.addsInto(cur, as.Rhs[0], f):
		if c.added == nil {
			c.added = map[types.Object]ast.Node{}
		}
		if c.added[f] == nil {
			c.added[f] = as
		}
	}
}

// readsOperand reports whether e reads a parameter of the function around
// cur that is not a number (a matrix, a vector, an interface holding one):
// A.e[i] -= B.At(i, j) combines the receiver elementwise with a second
// operand of its shape, one rounding per entry, and takes out nothing that
// passed through it.
func (c *checker) readsOperand(cur inspector.Cursor, e ast.Expr) bool {
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		params := map[types.Object]bool{}
		for _, f := range fd.Node().(*ast.FuncDecl).Type.Params.List {
			for _, name := range f.Names {
				if obj := c.pass.TypesInfo.Defs[name]; obj != nil {
					_, number := obj.Type().Underlying().(*types.Basic)
					params[obj] = !number
				}
			}
		}
		found := false
		ast.Inspect(e, func(n ast.Node) bool {
			if id, ok := n.(*ast.Ident); ok && params[c.pass.TypesInfo.Uses[id]] {
				found = true
			}
			return !found
		})
		return found
	}
	return false
}

// reduces reports whether e, taken from field f, is worked out from f's
// own value and constants alone, directly or through local variables
// (d := 2π·⌊a/2π⌋; r.a -= d): a range reduction or a decay of what the
// sum holds now, not a value that passed through it. A downdate of a
// mean, r.m -= (x - r.m)/n, also reads a value that passed, and is not one.
func (c *checker) reduces(cur inspector.Cursor, e ast.Expr, f types.Object) bool {
	ok, seen := c.onlyFrom(cur, e, f, 4)
	return ok && seen
}

// onlyFrom reports whether every value e reads is field f, a constant or
// a local variable assigned only such values, and whether f is among them.
func (c *checker) onlyFrom(cur inspector.Cursor, e ast.Expr, f types.Object, depth int) (ok, seen bool) {
	if depth <= 0 {
		return false, false
	}
	ok = true
	ast.Inspect(e, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.SelectorExpr:
			if s := c.pass.TypesInfo.Selections[n]; s != nil {
				ok, seen = ok && s.Obj() == f, seen || s.Obj() == f
				return false
			}
		case *ast.Ident:
			if v, isVar := c.pass.TypesInfo.Uses[n].(*types.Var); isVar {
				assigns := c.assignsTo(cur, v)
				ok = ok && len(assigns) > 0
				for _, as := range assigns {
					for _, r := range as.Rhs {
						rok, rseen := c.onlyFrom(cur, r, f, depth-1)
						ok, seen = ok && rok, seen || rseen
					}
				}
			}
		}
		return ok
	})
	return ok, seen
}

// rebuilt reports whether the function around cur sets field f to a
// constant before the subtraction as and adds into it only values that
// read no state of the receiver: the sum is then rebuilt from the values
// kept on each call (r.i = 0; r.i += part.i; r.i -= shift), so a rounding
// left by the subtraction lasts until the next call. A sum restarted from
// another running sum (r.next = 0; r.next += r.sums[k]) carries that
// sum's history on.
func (c *checker) rebuilt(cur inspector.Cursor, as *ast.AssignStmt, f types.Object) bool {
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		reset := false
		for n := range fd.Preorder((*ast.AssignStmt)(nil)) {
			a := n.Node().(*ast.AssignStmt)
			if len(a.Lhs) != 1 || len(a.Rhs) != 1 || !c.readsField(a.Lhs[0], f) {
				continue
			}
			switch {
			case a.Tok == token.ASSIGN && c.isConst(a.Rhs[0]):
				reset = reset || a.Pos() < as.Pos()
			case a.Tok == token.ADD_ASSIGN && c.readsState(fd.Node().(*ast.FuncDecl), a.Rhs[0]):
				return false
			}
		}
		return reset
	}
	return false
}

// readsState reports whether e reads a field through the receiver of fd.
func (c *checker) readsState(fd *ast.FuncDecl, e ast.Expr) bool {
	if fd.Recv == nil || len(fd.Recv.List) != 1 || len(fd.Recv.List[0].Names) != 1 {
		return false
	}
	recv := c.pass.TypesInfo.Defs[fd.Recv.List[0].Names[0]]
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		if sel, ok := n.(*ast.SelectorExpr); ok {
			if id, isID := ast.Unparen(sel.X).(*ast.Ident); isID && recv != nil && c.pass.TypesInfo.Uses[id] == recv {
				found = true
			}
		}
		return !found
	})
	return found
}

// addsInto reports whether e, assigned to field f, adds to f's value: a
// sum with a term that reads f (f = f + x, f = k*f + x), or a local
// variable started from f and then added to (s := k*f; s += x; f = s).
func (c *checker) addsInto(cur inspector.Cursor, e ast.Expr, f types.Object) bool {
	if sum, ok := ast.Unparen(e).(*ast.BinaryExpr); ok && sum.Op == token.ADD {
		return c.readsField(sum.X, f) || c.readsField(sum.Y, f)
	}
	id, ok := ast.Unparen(e).(*ast.Ident)
	v, isVar := c.pass.TypesInfo.Uses[id].(*types.Var)
	if !ok || !isVar {
		return false
	}
	from, grows := false, false
	for _, as := range c.assignsTo(cur, v) {
		for i, l := range as.Lhs {
			if id, ok := ast.Unparen(l).(*ast.Ident); ok && c.pass.TypesInfo.ObjectOf(id) == v && len(as.Lhs) == len(as.Rhs) {
				from = from || c.readsField(as.Rhs[i], f)
				grows = grows || as.Tok == token.ADD_ASSIGN
			}
		}
	}
	return from && grows
}

// sumField returns the float64 field that e selects, directly or as an
// element of a slice or array field (x.f, x.f[i]), when it is state that
// outlives the call: reached through the receiver of the method around
// cur, a pointer, or by a value receiver through a slice it shares.
// Otherwise, or for a local copy, it returns nil.
func (c *checker) sumField(cur inspector.Cursor, e ast.Expr) types.Object {
	info := c.pass.TypesInfo
	if !isFloat64(info.TypeOf(e)) {
		return nil
	}
	x, shared := ast.Unparen(e), false
	if ix, ok := x.(*ast.IndexExpr); ok {
		switch info.TypeOf(ix.X).Underlying().(type) {
		case *types.Slice, *types.Map:
			shared = true
		}
		x = ast.Unparen(ix.X)
	}
	sel, ok := x.(*ast.SelectorExpr)
	if !ok {
		return nil
	}
	s := info.Selections[sel]
	recv, isID := ast.Unparen(sel.X).(*ast.Ident)
	if s == nil || s.Kind() != types.FieldVal || !isID {
		return nil
	}
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		r := fd.Node().(*ast.FuncDecl).Recv
		if r == nil || len(r.List) != 1 || len(r.List[0].Names) != 1 || info.Defs[r.List[0].Names[0]] != info.Uses[recv] {
			return nil
		}
		if _, ptr := info.TypeOf(recv).(*types.Pointer); ptr || shared {
			return s.Obj()
		}
	}
	return nil
}

// readsField reports whether e reads field f.
func (c *checker) readsField(e ast.Expr, f types.Object) bool {
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		if sel, ok := n.(*ast.SelectorExpr); ok {
			if s := c.pass.TypesInfo.Selections[sel]; s != nil && s.Obj() == f {
				found = true
			}
		}
		return !found
	})
	return found
}

// assignsTo returns the assignments to the local variable v in the
// function around cur.
func (c *checker) assignsTo(cur inspector.Cursor, v *types.Var) []*ast.AssignStmt {
	var out []*ast.AssignStmt
	for fn := range cur.Enclosing((*ast.FuncDecl)(nil), (*ast.FuncLit)(nil)) {
		for n := range fn.Preorder((*ast.AssignStmt)(nil)) {
			as := n.Node().(*ast.AssignStmt)
			for _, l := range as.Lhs {
				if id, ok := ast.Unparen(l).(*ast.Ident); ok && c.pass.TypesInfo.ObjectOf(id) == v {
					out = append(out, as)
					break
				}
			}
		}
		break
	}
	return out
}
