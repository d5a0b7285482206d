package degree

import (
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/provenance"
)

// Summed returns the statement that adds to a running sum e reads, inside
// fd, and whether there is one: a local variable given a term on each
// pass of a loop whose length the data decide (s += x or s = s + x, in a
// range over a slice or a for loop bounded by a variable, where s is
// declared outside that loop), read directly, through the local variables
// e reads, or through the returns of the package's functions it calls
// (t.area() of a triangulation summing its triangles). The rounding error
// of a sum of n terms grows with n, as √n·eps times the size of its
// partial sums for independent roundings and up to (n-1)·u in the worst
// case (Higham 2002, §2.8 and §4.2, from memory): its size in the data is
// its terms' degree, but its rounding also grows with their count.
func (r *Reader) Summed(fd *ast.FuncDecl, e ast.Expr) (ast.Node, bool) {
	r.index(fd)
	s := r.summed(e, 0)
	return s, s != nil
}

func (r *Reader) summed(e ast.Expr, depth int) ast.Node {
	if depth > 16 {
		return nil
	}
	switch x := ast.Unparen(e).(type) {
	case *ast.Ident:
		return r.summedVar(r.varOf(x), depth)
	case *ast.UnaryExpr:
		return r.summed(x.X, depth+1)
	case *ast.IndexExpr:
		return r.summed(x.X, depth+1) // the elements stored into a local slice
	case *ast.SelectorExpr:
		if sel, ok := r.info.Selections[x]; ok && sel.Kind() == types.FieldVal && !sel.Indirect() {
			return r.summed(x.X, depth+1) // the fields stored into a local struct
		}
	case *ast.BinaryExpr:
		switch {
		case x.Op == token.ADD || x.Op == token.SUB:
			if s := r.summed(x.X, depth+1); s != nil {
				return s
			}
			return r.summed(x.Y, depth+1)
		case x.Op == token.QUO:
			return r.summed(x.X, depth+1)
		case x.Op == token.MUL:
			if s := r.summed(x.X, depth+1); s != nil {
				return s
			}
			return r.summed(x.Y, depth+1)
		}
	case *ast.CallExpr:
		if len(x.Args) == 1 && (r.info.Types[x.Fun].IsType() || provenance.MathCallee(r.info, x) == "Abs") {
			return r.summed(x.Args[0], depth+1)
		}
		return r.summedCall(x, 0, depth)
	}
	return nil
}

// summedVar returns the running sum v is, or that a value given to it
// reads.
func (r *Reader) summedVar(v *types.Var, depth int) ast.Node {
	if v == nil || r.busy[v] {
		return nil
	}
	if s, ok := r.sums[v]; ok {
		return s
	}
	r.busy[v] = true
	defer delete(r.busy, v)
	for _, s := range r.sets[v] {
		if s != nil {
			if found := r.summed(s, depth+1); found != nil {
				return found
			}
		}
	}
	for _, t := range r.tuples[v] {
		if found := r.summedCall(t.call, t.i, depth+1); found != nil {
			return found
		}
	}
	return nil
}

// summedCall returns the running sum that result i of a call of a
// function of the package reads, through its returns.
func (r *Reader) summedCall(call *ast.CallExpr, i int, depth int) ast.Node {
	fn, ok := typeutil.Callee(r.info, call).(*types.Func)
	if !ok {
		return nil
	}
	fd, ok := r.funcs[fn]
	if !ok {
		return nil
	}
	r.index(fd)
	var found ast.Node
	ast.Inspect(fd.Body, func(n ast.Node) bool {
		if ret, ok := n.(*ast.ReturnStmt); ok && i < len(ret.Results) && found == nil {
			found = r.summed(ret.Results[i], depth+1)
		}
		_, lit := n.(*ast.FuncLit)
		return found == nil && !lit
	})
	return found
}

// noteSum records as, the i-th assignment of which adds a term to the
// local variable v (v += e, v -= e, v = v + e, v = v - e), when it repeats
// over a loop whose length the data decide (see overData) and that v
// outlives.
func (r *Reader) noteSum(as *ast.AssignStmt, i int, v *types.Var) {
	switch as.Tok {
	case token.ADD_ASSIGN, token.SUB_ASSIGN:
	case token.ASSIGN:
		b, ok := ast.Unparen(as.Rhs[i]).(*ast.BinaryExpr)
		if !ok || b.Op != token.ADD && b.Op != token.SUB {
			return
		}
		x, ok := ast.Unparen(b.X).(*ast.Ident)
		if !ok || r.varOf(x) != v {
			return
		}
	default:
		return
	}
	for _, l := range r.loops {
		outlives := v.Pos() < l.Pos() || v.Pos() >= l.End()
		if l.Pos() <= as.Pos() && as.End() <= l.End() && outlives && r.overData(l) {
			r.sums[v] = as
			return
		}
	}
}

// overData reports whether loop l runs once per element of the data: a
// range over a slice, map or string, or a for loop whose condition
// compares with the length of something or with a parameter or a field
// of one (i < n, i < len(xs), i < s.count). A range over an array or an
// integer has a count the source fixes, and a loop that runs until a
// test passes (a series, an iteration) one its convergence decides.
func (r *Reader) overData(l ast.Node) bool {
	switch l := l.(type) {
	case *ast.RangeStmt:
		switch r.info.TypeOf(l.X).Underlying().(type) {
		case *types.Slice, *types.Map:
			return true
		case *types.Basic:
			return r.info.Types[l.X].Value == nil && !isInteger(r.info.TypeOf(l.X))
		}
	case *ast.ForStmt:
		c, ok := l.Cond.(*ast.BinaryExpr)
		if !ok {
			return false
		}
		for _, side := range []ast.Expr{c.X, c.Y} {
			if call, ok := ast.Unparen(side).(*ast.CallExpr); ok && len(call.Args) == 1 {
				if b, ok := typeutil.Callee(r.info, call).(*types.Builtin); ok && b.Name() == "len" {
					return true
				}
			}
			if r.fromParam(side) && r.info.Types[side].Value == nil {
				return true
			}
		}
	}
	return false
}
