package exacteq

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
)

// wholeCount reports x == k, k a nonzero whole constant, when the same
// function also truncates x to a whole number (int(x), math.Floor(x),
// math.Trunc(x)) and x is computed, or is a parameter that a call in the
// package fills with a computed value (degrees of freedom from a ratio of
// sums): the function treats x as a count. A value whole in exact
// arithmetic can come out an ulp above k, which the truncation takes for
// k and the equality does not, so the two branches that should agree
// part (the k case is skipped while int(x) says k). It reports whether
// it reported.
func (c *checker) wholeCount(cur inspector.Cursor, n *ast.BinaryExpr, op token.Token, x, y operand) bool {
	v, k := x, y
	if !c.isWholeConst(k.expr) {
		v, k = y, x
		if !c.isWholeConst(k.expr) {
			return false
		}
	}
	val := provenance.Strip(v.val)
	at := truncations(val)
	if len(at) == 0 || !c.track.Computed(val) && !c.filledComputed(val) || c.settled(cur, op, v.expr, at) {
		return false
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catWhole,
		Message: fmt.Sprintf("exact %s %s on %s, which this function also truncates to a whole number: a value whole in exact arithmetic can come out an ulp above (%s+%.3g), where the truncation gives %s and the equality fails, so the two disagree; compare the truncated value, or within a tolerance",
			op, fixes.Source(c.pass.Fset, k.expr), fixes.Source(c.pass.Fset, v.expr), fixes.Source(c.pass.Fset, k.expr), c.spacingAt(k.expr), fixes.Source(c.pass.Fset, k.expr)),
	})
	return true
}

// isWholeConst reports whether e is a nonzero whole-number constant.
func (c *checker) isWholeConst(e ast.Expr) bool {
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, e)
	if !ok || v.Kind() != constant.Int && v.Kind() != constant.Float || constant.Sign(v) == 0 {
		return false
	}
	return constant.ToInt(v).Kind() == constant.Int
}

// spacingAt returns the spacing of floats at the constant e.
func (c *checker) spacingAt(e ast.Expr) float64 {
	v, _ := constval.Exact(c.pass.TypesInfo, c.decls, e)
	f, _ := constant.Float64Val(v)
	return provenance.FormatOf(c.pass.TypesInfo.TypeOf(e)).Spacing(f)
}

// truncations returns the positions where v is converted to an integer
// type or passed to math.Floor or math.Trunc.
func truncations(v ssa.Value) []token.Pos {
	refs := v.Referrers()
	if refs == nil {
		return nil
	}
	var at []token.Pos
	for _, r := range *refs {
		switch r := r.(type) {
		case *ssa.Convert:
			if isInteger(r.Type()) {
				at = append(at, r.Pos())
			}
		case *ssa.Call:
			if integral(r) && slices.Contains(r.Call.Args, v) {
				at = append(at, r.Pos())
			}
		}
	}
	return at
}

// settled reports whether the equality at cur (op ==) is, alone or joined
// by || to others of the same x with whole constants, the condition of an
// if statement whose body holds every truncation: there x is one of those
// constants, and int(x) is that constant exactly (if x == -1 || x == 1 {
// return Inf(int(x)) }).
func (c *checker) settled(cur inspector.Cursor, op token.Token, x ast.Expr, at []token.Pos) bool {
	if op != token.EQL {
		return false
	}
	for p := cur.Parent(); ; p = p.Parent() {
		switch n := p.Node().(type) {
		case *ast.ParenExpr:
			continue
		case *ast.BinaryExpr:
			if n.Op == token.LOR {
				continue
			}
		case *ast.IfStmt:
			if !c.wholeChoices(n.Cond, x) {
				return false
			}
			for _, pos := range at {
				if !pos.IsValid() || pos < n.Body.Pos() || pos >= n.Body.End() {
					return false
				}
			}
			return true
		}
		return false
	}
}

// wholeChoices reports whether cond is x == k, or such tests joined by ||,
// each k a whole constant.
func (c *checker) wholeChoices(cond, x ast.Expr) bool {
	b, ok := ast.Unparen(cond).(*ast.BinaryExpr)
	if !ok {
		return false
	}
	switch b.Op {
	case token.LOR:
		return c.wholeChoices(b.X, x) && c.wholeChoices(b.Y, x)
	case token.EQL:
		src := types.ExprString(ast.Unparen(x))
		return types.ExprString(ast.Unparen(b.X)) == src && c.isWholeConst(b.Y) || types.ExprString(ast.Unparen(b.Y)) == src && c.isWholeConst(b.X)
	}
	return false
}

// filledComputed reports whether v is a parameter that some call in the
// package passes a computed value.
func (c *checker) filledComputed(v ssa.Value) bool {
	p, ok := v.(*ssa.Parameter)
	if !ok {
		return false
	}
	fn := p.Parent()
	i := slices.Index(fn.Params, p)
	for call := range c.ssa.Calls() {
		args := call.Common().Args
		if call.Common().StaticCallee() == fn && i < len(args) && c.track.Computed(args[i]) {
			return true
		}
	}
	return false
}
