package stoptol

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/tolerance"
)

// recursion is a function declaration that calls itself (a method on the
// same receiver), read as the loop for { body }: each recursive call is a
// pass, which assigns its arguments to the parameters and runs the body
// again; the returns that neither make nor follow a recursive call are
// the exits.
type recursion struct {
	decl   *ast.FuncDecl
	params []*types.Var
	calls  []*ast.CallExpr          // the recursive calls
	passes map[*ast.ReturnStmt]bool // returns that make or follow a recursive call
}

// newRecursion returns decl read as a recursion when it calls itself, or
// nil.
func newRecursion(info *types.Info, decl *ast.FuncDecl) *recursion {
	obj, _ := info.Defs[decl.Name].(*types.Func)
	if obj == nil {
		return nil
	}
	r := &recursion{decl: decl, calls: selfCalls(info, decl, obj), passes: map[*ast.ReturnStmt]bool{}}
	if len(r.calls) == 0 {
		return nil
	}
	for v := range obj.Signature().Params().Variables() {
		r.params = append(r.params, v)
	}
	return r
}

// read reads the recursion as a loop of function fn. A function with no
// results may end by reaching the end of its body with no recursive call:
// when its body ends in if cond { ... recursive calls ... }, it is read as
// for cond { body }, which ends when cond fails; any other such end is an
// exit on no test stoptol reads.
func (r *recursion) read(info *types.Info, fn *function) *loop {
	stmt := &ast.ForStmt{For: r.decl.Name.Pos(), Body: r.decl.Body}
	open := !r.markBlock(r.decl.Body.List, false) && r.decl.Type.Results == nil
	if list := r.decl.Body.List; open && len(list) > 0 {
		if last, ok := list[len(list)-1].(*ast.IfStmt); ok && last.Init == nil && last.Else == nil && r.holds(last.Body, true) {
			stmt.Cond, open = last.Cond, false
		}
	}
	l := readLoop(info, stmt, fn, r)
	l.other = l.other || open
	return l
}

// selfCalls returns the calls of obj in decl's body, outside function
// literals; a method's must be on its own receiver.
func selfCalls(info *types.Info, decl *ast.FuncDecl, obj *types.Func) []*ast.CallExpr {
	var recv *types.Var
	if decl.Recv != nil && len(decl.Recv.List) == 1 && len(decl.Recv.List[0].Names) == 1 {
		recv, _ = info.Defs[decl.Recv.List[0].Names[0]].(*types.Var)
	}
	var out []*ast.CallExpr
	ast.Inspect(decl.Body, func(n ast.Node) bool {
		call, ok := n.(*ast.CallExpr)
		if isFuncLit(n) || !ok {
			return !isFuncLit(n)
		}
		fun := ast.Unparen(call.Fun)
		switch ix := fun.(type) {
		case *ast.IndexExpr: // rec[T](x)
			fun = ix.X
		case *ast.IndexListExpr:
			fun = ix.X
		}
		sel, isSel := fun.(*ast.SelectorExpr)
		if id, _ := fun.(*ast.Ident); (id == nil || id.Name != obj.Name()) && (!isSel || sel.Sel.Name != obj.Name()) {
			return true // cheap: not even the name
		}
		if callee, _ := typeutil.Callee(info, call).(*types.Func); callee == nil || callee.Origin() != obj {
			return true
		}
		if decl.Recv == nil || isSel && recv != nil && tolerance.VarOf(info, sel.X) == recv {
			out = append(out, call)
		}
		return true
	})
	return out
}

// markBlock marks the returns of stmts that make a recursive call, or
// follow one made by an earlier statement of their block or of a block
// around it (s := rec(a, m); return s), as passes; after says whether one
// was made before the block. It reports whether the end of the block
// follows a recursive call.
func (r *recursion) markBlock(stmts []ast.Stmt, after bool) bool {
	for _, s := range stmts {
		r.markStmt(s, after)
		after = after || r.holds(s, false)
	}
	return after
}

// markStmt marks the returns of s.
func (r *recursion) markStmt(s ast.Stmt, after bool) {
	switch s := s.(type) {
	case *ast.ReturnStmt:
		r.passes[s] = after || r.holds(s, true)
	case *ast.BlockStmt:
		r.markBlock(s.List, after)
	case *ast.LabeledStmt:
		r.markStmt(s.Stmt, after)
	case *ast.IfStmt:
		r.markBlock(s.Body.List, after)
		if s.Else != nil {
			r.markStmt(s.Else, after)
		}
	case *ast.ForStmt:
		r.markBlock(s.Body.List, after)
	case *ast.RangeStmt:
		r.markBlock(s.Body.List, after)
	case *ast.SwitchStmt, *ast.TypeSwitchStmt, *ast.SelectStmt:
		ast.Inspect(s, func(n ast.Node) bool {
			switch n := n.(type) {
			case *ast.CaseClause:
				r.markBlock(n.Body, after)
				return false
			case *ast.CommClause:
				r.markBlock(n.Body, after)
				return false
			}
			return !isFuncLit(n)
		})
	}
}

// holds reports whether n holds a recursive call, looking into nested
// blocks when deep; one made outside them is followed by the statements
// after n.
func (r *recursion) holds(n ast.Node, deep bool) bool {
	found := false
	ast.Inspect(n, func(m ast.Node) bool {
		switch m := m.(type) {
		case *ast.BlockStmt, *ast.CaseClause, *ast.CommClause:
			return deep
		case *ast.CallExpr:
			found = found || slices.Contains(r.calls, m)
		}
		return !found && !isFuncLit(m)
	})
	return found
}

// ends reports whether ret leaves the loop or recursion l reads: every
// return of a loop, a return of a recursion that is no pass.
func (l *loop) ends(ret *ast.ReturnStmt) bool {
	return l.rec == nil || !l.rec.passes[ret]
}

// isPass reports whether call is a recursive call of the recursion l
// reads.
func (l *loop) isPass(call *ast.CallExpr) bool {
	return l.rec != nil && slices.Contains(l.rec.calls, call)
}

// recordCalls records each recursive call as assigning its arguments to
// the parameters; a parameter passed on as it is keeps its value, and a
// call spread over the parameters (rec(xs...), rec(pair())) is skipped.
func (d *deps) recordCalls() {
	r := d.l.rec
	if r == nil {
		return
	}
	for _, call := range r.calls {
		if len(call.Args) != len(r.params) || call.Ellipsis.IsValid() {
			continue
		}
		for i, arg := range call.Args {
			if tolerance.VarOf(d.info, arg) != r.params[i] {
				d.add(r.params[i], token.ASSIGN, arg)
			}
		}
	}
}

// decided reports whether exit e reads nothing the recursion changes and
// calls nothing: with the parameters passed on as they are (n, not n+1), it
// holds at every level or at none, and bounds nothing.
func (r *recursion) decided(info *types.Info, e ast.Expr) bool {
	changed := changedIn(info, r.decl.Body)
	for _, v := range r.params {
		changed[v] = changed[v] || r.changed(info, v)
	}
	return !reads(info, e, changed)
}

// changed reports whether some recursive call passes parameter v on as
// something other than itself.
func (r *recursion) changed(info *types.Info, v *types.Var) bool {
	i := slices.Index(r.params, v)
	return i >= 0 && slices.ContainsFunc(r.calls, func(call *ast.CallExpr) bool {
		return i < len(call.Args) && tolerance.VarOf(info, call.Args[i]) != v
	})
}

// counterStep returns the smallest step of a float parameter v that every
// recursive call passes on stepped by a nonzero constant, all of one sign
// (k+1, k-0.5), and that the body never assigns: a counter, whose start
// is the caller's as an integer depth's is.
func (r *recursion) counterStep(info *types.Info, v *types.Var) (float64, bool) {
	i := slices.Index(r.params, v)
	if i < 0 || assigns(info, r.decl.Body, v) {
		return 0, false
	}
	minStep, signs := math.Inf(1), map[bool]bool{}
	for _, call := range r.calls {
		if len(call.Args) != len(r.params) {
			return 0, false
		}
		b, ok := ast.Unparen(call.Args[i]).(*ast.BinaryExpr)
		if !ok || b.Op != token.ADD && b.Op != token.SUB || tolerance.VarOf(info, b.X) != v || info.Types[b.Y].Value == nil {
			return 0, false
		}
		c, _ := constant.Float64Val(constant.ToFloat(info.Types[b.Y].Value))
		if b.Op == token.SUB {
			c = -c
		}
		if c == 0 {
			return 0, false
		}
		minStep, signs[c > 0] = min(minStep, math.Abs(c)), true
	}
	return minStep, len(signs) == 1
}

// reportRecursion reports a recursion that nothing bounds at its first
// float base-case test, naming its first recursive call. Each call holds
// a stack frame; past the goroutine's maximum stack (1 GB on 64-bit
// platforms, 250 MB on 32-bit: the doc of runtime/debug.SetMaxStack) the
// runtime aborts the program with a fatal error, which recover cannot
// catch.
func (c *checker) reportRecursion(d *deps, nanRuns bool) {
	exit, call := d.tests[0].e, d.l.rec.calls[0]
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: exit.Pos(), End: exit.End(), Category: catNoCap,
		Message: fmt.Sprintf("recursion may never end: its only base cases are float tests (%s) and nothing bounds the depth, so a recursion that stalls, oscillates or diverges keeps calling itself%s; every call holds a stack frame until the stack passes its limit (1 GB on 64-bit platforms), where Go aborts the program with a fatal error that recover cannot catch; add a depth parameter with a cap, or rewrite it as a loop with an iteration limit",
			c.exitText(exit), nanClause(nanRuns)),
		Related: []analysis.RelatedInformation{{Pos: call.Pos(), End: call.End(), Message: "the recursive call"}},
	})
}
