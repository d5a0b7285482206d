package tolerance

import (
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
)

// Shrunk returns the float variables that nodes only ever shrink by a
// constant factor (w *= 0.5, w /= 2, w = 0.618*w): the widths of searches
// that track their bracket analytically, and steps that halve each pass.
// Such a variable stays non-negative when it starts so, and compared with
// a tolerance it measures progress.
func Shrunk(info *types.Info, nodes ...ast.Node) map[*types.Var]bool {
	out := make(map[*types.Var]bool)
	for v, m := range Geometric(info, nodes...) {
		if m < 1 {
			out[v] = true
		}
	}
	return out
}

// Geometric returns the float variables that nodes only ever multiply by
// one constant factor m other than 1 (w *= m, w /= 1/m, w = m*w), with m.
// Repeated, such a scaling reaches 0 or ±Inf within about 2100 passes in
// float64, whatever the start, or, for a factor between 1/2 and 1, a
// subnormal value the product rounds back to (4.9e-324 for 0.618).
func Geometric(info *types.Info, nodes ...ast.Node) map[*types.Var]float64 {
	out, other := make(map[*types.Var]float64), make(map[*types.Var]bool)
	visit := func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.AssignStmt:
			for i, lhs := range n.Lhs {
				v := VarOf(info, lhs)
				if v == nil || !isReal(v.Type()) {
					continue
				}
				m, ok := 0.0, false
				if len(n.Lhs) == len(n.Rhs) {
					m, ok = scaling(info, v, n.Tok, n.Rhs[i])
				}
				if prev, seen := out[v]; !ok || seen && prev != m {
					other[v] = true
				}
				out[v] = m
			}
		case *ast.IncDecStmt:
			if v := VarOf(info, n.X); v != nil {
				other[v] = true
			}
		}
		return true
	}
	for _, n := range nodes {
		if n != nil {
			ast.Inspect(n, visit)
		}
	}
	for v := range other {
		delete(out, v)
	}
	return out
}

// scaling returns the factor m when v tok rhs sets v to m·v, m a positive
// constant other than 1.
func scaling(info *types.Info, v *types.Var, tok token.Token, rhs ast.Expr) (float64, bool) {
	by := func(e ast.Expr, divide bool) (float64, bool) {
		tv, ok := info.Types[e]
		if !ok || tv.Value == nil {
			return 0, false
		}
		f, ok := constantFloat(tv)
		if divide && f != 0 {
			f = 1 / f
		}
		return f, ok && f > 0 && f != 1
	}
	switch tok {
	case token.MUL_ASSIGN:
		return by(rhs, false)
	case token.QUO_ASSIGN:
		return by(rhs, true)
	case token.ASSIGN:
		b, ok := ast.Unparen(rhs).(*ast.BinaryExpr)
		switch {
		case !ok:
		case b.Op == token.MUL && VarOf(info, b.X) == v:
			return by(b.Y, false)
		case b.Op == token.MUL && VarOf(info, b.Y) == v:
			return by(b.X, false)
		case b.Op == token.QUO && VarOf(info, b.X) == v:
			return by(b.Y, true)
		}
	}
	return 0, false
}

// constantFloat returns a numeric constant's value as a float64.
func constantFloat(tv types.TypeAndValue) (float64, bool) {
	if k := tv.Value.Kind(); k != constant.Int && k != constant.Float {
		return 0, false
	}
	f, _ := constant.Float64Val(constant.ToFloat(tv.Value))
	return f, true
}

// Ordered reports whether, in the function body, hi-lo is known not to be
// negative, so a bare hi-lo measures a bracket's width: the body swaps the
// two when out of order (if lo > hi { lo, hi = hi, lo }), gives up when
// they are (if hi <= lo { return }), or moves one of them to a point
// computed from both (m := (lo+hi)/2; lo = m), as bisection, golden-section
// and false-position steps do, which keeps a bracket ordered. Successive
// iterates x1-x0 of Newton or a fixed-point map are none of these: their
// difference is a signed step. hi and lo are variables or fields; the
// points may also move through movers (see Movers).
func Ordered(info *types.Info, movers map[*types.Func][][2]int, body ast.Node, hi, lo ast.Expr) bool {
	h, l := objOf(info, hi), objOf(info, lo)
	if h == nil || l == nil || h == l {
		return false
	}
	assigned := make(map[types.Object][]ast.Expr)
	found := false
	ast.Inspect(body, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.IfStmt:
			found = found || comparesPair(info, n.Cond, h, l) && (swaps(info, n.Body, h, l) || leaves(n.Body))
		case *ast.AssignStmt:
			if len(n.Lhs) == len(n.Rhs) {
				for i, lhs := range n.Lhs {
					if o := objOf(info, lhs); o != nil {
						assigned[o] = append(assigned[o], n.Rhs[i])
					}
				}
			}
		case *ast.CallExpr:
			for _, p := range Moved(info, movers, n) {
				if o := objOf(info, p[0]); o != nil {
					assigned[o] = append(assigned[o], p[1])
				}
			}
		}
		return !found
	})
	return found || interior(info, assigned, h, l)
}

// interior reports whether h or l is assigned a point computed from both,
// directly or through a variable so assigned.
func interior(info *types.Info, assigned map[types.Object][]ast.Expr, h, l types.Object) bool {
	fromBoth := func(e ast.Expr) bool {
		seen := map[types.Object]bool{}
		var visit func(e ast.Expr, depth int)
		visit = func(e ast.Expr, depth int) {
			ast.Inspect(e, func(n ast.Node) bool {
				if x, ok := n.(ast.Expr); ok {
					if o := objOf(info, x); o != nil && !seen[o] {
						seen[o] = true
						if depth > 0 && o != h && o != l {
							for _, r := range assigned[o] {
								visit(r, depth-1)
							}
						}
					}
				}
				return true
			})
		}
		visit(e, 2)
		return seen[h] && seen[l]
	}
	for _, o := range []types.Object{h, l} {
		for _, rhs := range assigned[o] {
			if _, isBin := ast.Unparen(rhs).(*ast.BinaryExpr); isBin || VarOf(info, rhs) != nil {
				if fromBoth(rhs) {
					return true
				}
			}
		}
	}
	return false
}

// comparesPair reports whether cond orders h and l.
func comparesPair(info *types.Info, cond ast.Expr, h, l types.Object) bool {
	b, ok := ast.Unparen(cond).(*ast.BinaryExpr)
	if !ok || b.Op != token.LSS && b.Op != token.LEQ && b.Op != token.GTR && b.Op != token.GEQ {
		return false
	}
	x, y := objOf(info, b.X), objOf(info, b.Y)
	return x == h && y == l || x == l && y == h
}

// swaps reports whether block exchanges h and l: h, l = l, h.
func swaps(info *types.Info, block *ast.BlockStmt, h, l types.Object) bool {
	for _, s := range block.List {
		as, ok := s.(*ast.AssignStmt)
		if ok && len(as.Lhs) == 2 && len(as.Rhs) == 2 && objOf(info, as.Lhs[0]) == objOf(info, as.Rhs[1]) && objOf(info, as.Lhs[1]) == objOf(info, as.Rhs[0]) && comparesObjs(info, as.Lhs, h, l) {
			return true
		}
	}
	return false
}

func comparesObjs(info *types.Info, pair []ast.Expr, h, l types.Object) bool {
	x, y := objOf(info, pair[0]), objOf(info, pair[1])
	return x == h && y == l || x == l && y == h
}

// leaves reports whether block ends by returning or panicking.
func leaves(block *ast.BlockStmt) bool { return Leaves(block, false) }

// Leaves reports whether block ends by returning or panicking, or, with
// loops, by a break or continue that leaves the pass of the loop around.
func Leaves(block *ast.BlockStmt, loops bool) bool {
	if len(block.List) == 0 {
		return false
	}
	switch s := block.List[len(block.List)-1].(type) {
	case *ast.ReturnStmt:
		return true
	case *ast.BranchStmt:
		return loops && (s.Tok == token.BREAK || s.Tok == token.CONTINUE)
	case *ast.ExprStmt:
		if call, ok := s.X.(*ast.CallExpr); ok {
			id, ok := ast.Unparen(call.Fun).(*ast.Ident)
			return ok && id.Name == "panic"
		}
	}
	return false
}

// Flags returns the boolean variables of n assigned a comparison or a
// logical combination of them (converged = math.Abs(dx) < tol), with the
// expressions assigned: a loop ending on such a flag (for !converged) ends
// on those tests.
func Flags(info *types.Info, n ast.Node) map[*types.Var][]ast.Expr {
	out := make(map[*types.Var][]ast.Expr)
	ast.Inspect(n, func(n ast.Node) bool {
		as, ok := n.(*ast.AssignStmt)
		if !ok || len(as.Lhs) != len(as.Rhs) || as.Tok != token.ASSIGN && as.Tok != token.DEFINE {
			return true
		}
		for i, lhs := range as.Lhs {
			v := VarOf(info, lhs)
			if b, ok := ast.Unparen(as.Rhs[i]).(*ast.BinaryExpr); ok && v != nil && isBool(v.Type()) && (b.Op != token.EQL && b.Op != token.NEQ || Comparator(info, b)) {
				out[v] = append(out[v], b)
			}
		}
		return true
	})
	return out
}

// Comparator reports whether e compares with 0 the integer result of a
// call with two or more float operands (the receiver included), as
// cmp(x, p, tol) != 0 does with a three-way comparison of x and p within
// a tolerance: 0 says they are equal to it, so the test is a float test
// whatever integer carries it.
func Comparator(info *types.Info, e *ast.BinaryExpr) bool {
	if e.Op != token.EQL && e.Op != token.NEQ {
		return false
	}
	for _, pair := range [][2]ast.Expr{{e.X, e.Y}, {e.Y, e.X}} {
		call, isCall := ast.Unparen(pair[0]).(*ast.CallExpr)
		zero := info.Types[pair[1]].Value
		if !isCall || zero == nil || zero.Kind() != constant.Int || constant.Sign(zero) != 0 || !basicIs(info.TypeOf(call), types.IsInteger) {
			continue
		}
		if CountOperands(info, call, func(t types.Type) bool { return basicIs(t, types.IsFloat) }) >= 2 {
			return true
		}
	}
	return false
}

// CountOperands counts the operands of call, the receiver of a method
// included, whose types satisfy is.
func CountOperands(info *types.Info, call *ast.CallExpr, is func(types.Type) bool) int {
	args := call.Args
	if sel, ok := ast.Unparen(call.Fun).(*ast.SelectorExpr); ok && info.Selections[sel] != nil {
		args = append([]ast.Expr{sel.X}, args...)
	}
	n := 0
	for _, a := range args {
		if is(info.TypeOf(a)) {
			n++
		}
	}
	return n
}

// basicIs reports whether t is a basic type of the kind info says.
func basicIs(t types.Type, info types.BasicInfo) bool {
	if t == nil {
		return false
	}
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&info != 0
}

// VarOf returns the variable (not a field) an expression names, or nil.
func VarOf(info *types.Info, e ast.Expr) *types.Var {
	id, ok := ast.Unparen(e).(*ast.Ident)
	if !ok {
		return nil
	}
	v, _ := info.ObjectOf(id).(*types.Var)
	if v == nil || v.IsField() {
		return nil
	}
	return v
}

// objOf returns the variable or field an expression names: x, s.f, p.f.
func objOf(info *types.Info, e ast.Expr) types.Object {
	switch e := ast.Unparen(e).(type) {
	case *ast.Ident:
		v, _ := info.ObjectOf(e).(*types.Var)
		if v != nil {
			return v
		}
	case *ast.SelectorExpr:
		if f := FieldOf(info, e); f != nil {
			return f
		}
	}
	return nil
}

func isReal(t types.Type) bool {
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&types.IsFloat != 0
}

func isBool(t types.Type) bool {
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&types.IsBoolean != 0
}

// TrackedWidths returns the variables of shrunk that start, in body, as a
// difference of two points (w := b - a, w := math.Abs(hi-lo)/2): bracket
// widths tracked analytically, as golden-section searches do. A step
// multiplier that starts at 1 (backtracking's t) is none: it is relative
// to a direction, not a length in x.
func (r Reader) TrackedWidths(body ast.Node, shrunk map[*types.Var]bool) map[*types.Var]bool {
	out := make(map[*types.Var]bool)
	if len(shrunk) == 0 {
		return out // nothing to look for
	}
	ast.Inspect(body, func(n ast.Node) bool {
		as, ok := n.(*ast.AssignStmt)
		if !ok || len(as.Lhs) != len(as.Rhs) {
			return true
		}
		for i, lhs := range as.Lhs {
			if v := VarOf(r.Info, lhs); v != nil && shrunk[v] && r.isDifference(as.Rhs[i]) {
				out[v] = true
			}
		}
		return true
	})
	return out
}

// isDifference reports whether e is b-a or |b-a|, possibly scaled by a
// constant.
func (r Reader) isDifference(e ast.Expr) bool {
	e = r.follow(e)
	if x, _, ok := r.constScaled(e); ok {
		return r.isDifference(x)
	}
	if d, ok := e.(*ast.BinaryExpr); ok {
		return d.Op == token.SUB
	}
	t, ok := r.measure(e)
	return ok && t.Kind == Absolute
}
