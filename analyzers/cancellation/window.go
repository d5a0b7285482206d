package cancellation

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"

	"roundoff/analyzers/internal/fixes"
)

// slidingSum reports a float field updated in one block both by
// x.f -= old and by x.f += new: a running sum over a sliding window kept
// in the state of a value, across an unbounded number of calls. Each
// update rounds at the size of the sum at that time (Higham 2002, §4.2),
// so a large value that passes through leaves its rounding, up to
// u·|value|, behind for good: once the window holds small values again
// their sum carries an error that never decays. Recomputing the sum from
// the window from time to time, or a compensated sum, removes it. Sums in
// local variables last one call and are left alone.
func (c *checker) slidingSum(block *ast.BlockStmt) {
	subtracted := map[string]*ast.AssignStmt{}
	for _, s := range block.List {
		as, ok := s.(*ast.AssignStmt)
		if !ok || len(as.Lhs) != 1 || !c.floatField(as.Lhs[0]) {
			continue
		}
		key := types.ExprString(as.Lhs[0])
		switch as.Tok {
		case token.SUB_ASSIGN:
			subtracted[key] = as
		case token.ADD_ASSIGN:
			if sub := subtracted[key]; sub != nil {
				fixes.Report(c.pass, analysis.Diagnostic{
					Pos: sub.Pos(), End: sub.End(), Category: catVariance,
					Message: fmt.Sprintf("running window sum %s: each value removed leaves its rounding, up to u·|value| (u = %.3g), behind for good, so after a large value has passed the sum of small ones carries an error that never decays; recompute it from the window from time to time, or keep a compensated sum",
						key, unitRoundoff),
				})
				delete(subtracted, key)
			}
		}
	}
}

// floatField reports whether e selects a float64 field.
func (c *checker) floatField(e ast.Expr) bool {
	sel, ok := e.(*ast.SelectorExpr)
	s := c.pass.TypesInfo.Selections[sel]
	return ok && s != nil && s.Kind() == types.FieldVal && isFloat64(s.Type())
}
