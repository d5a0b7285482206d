package exacteq

import (
	"fmt"
	"go/ast"
	"go/token"
	"slices"
	"strings"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
)

// signSplit reports a three-way sign classification (v > 0, then v < 0,
// then the rest, which may be to do nothing) of a difference of computed
// values, such as the cross
// product that tells a left turn from a right turn and leaves collinear
// to the rest. The rest is an exact zero test of v, with the same hazard
// as v == 0 (see residue): inputs that make v zero in exact arithmetic
// usually leave a residue of a few ulps of its terms, and land in a
// signed branch. It is reported at the first of the two sign tests.
func (c *checker) signSplit(cur inspector.Cursor, n *ast.BinaryExpr) {
	e, positive, ok := c.signTest(n)
	bin := c.cmpAt(n.OpPos)
	if !ok || bin == nil || !c.oppositeFollows(cur, e, positive) || c.tieCascade(cur) {
		return
	}
	v := bin.X
	if c.isZero(operand{expr: n.X}) {
		v = bin.Y
	}
	if !provenance.IsFloat(v.Type()) || !c.cancels(v, 4) {
		return
	}
	f := provenance.FormatOf(v.Type())
	src := fixes.Source(c.pass.Fset, e)
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catResidue,
		Message: fmt.Sprintf("the tests %s > 0 and %s < 0 leave exact 0 to the remaining branch, and %s is a difference of computed %s values: it is 0 only when both terms round to the same float, so inputs that make it 0 in exact arithmetic (collinear points) usually fall in a signed branch by a residue of a few ulps of the terms (%.3g relative each); decide the zero case within a tolerance scaled by the terms or with an exact predicate",
			src, src, src, typeName(v.Type()), f.U),
	})
}

// signTest reports whether n compares an expression with zero by < or >,
// returning the expression and whether the test is for a positive value.
func (c *checker) signTest(n *ast.BinaryExpr) (ast.Expr, bool, bool) {
	if n.Op != token.LSS && n.Op != token.GTR {
		return nil, false, false
	}
	switch {
	case c.isZero(operand{expr: n.Y}):
		return n.X, n.Op == token.GTR, true
	case c.isZero(operand{expr: n.X}):
		return n.Y, n.Op == token.LSS, true
	}
	return nil, false, false
}

// oppositeFollows reports whether the sign test at cur is followed by the
// opposite test of e: in a later case of the same tagless switch, in the
// next else if of an if chain, or, when both branches return, in the next
// statement. Whatever follows them is the zero case.
func (c *checker) oppositeFollows(cur inspector.Cursor, e ast.Expr, positive bool) bool {
	opposite := func(x ast.Expr) bool {
		b, ok := ast.Unparen(x).(*ast.BinaryExpr)
		if !ok {
			return false
		}
		e2, pos2, ok := c.signTest(b)
		return ok && pos2 != positive && sameExpr(e, e2)
	}
	switch cur.ParentEdgeKind() {
	case edge.CaseClause_List:
		return c.laterCase(cur.Parent(), opposite)
	case edge.IfStmt_Cond:
		ifs := cur.Parent().Node().(*ast.IfStmt)
		if next, ok := ifs.Else.(*ast.IfStmt); ok {
			return opposite(next.Cond)
		}
		next, ok := nextStmt(cur.Parent()).(*ast.IfStmt)
		return ok && ifs.Else == nil && next.Else == nil && opposite(next.Cond) && returns(ifs.Body) && returns(next.Body)
	}
	return false
}

// laterCase reports whether a case clause after cc in its switch has a
// test satisfying match.
func (c *checker) laterCase(cc inspector.Cursor, match func(ast.Expr) bool) bool {
	after := false
	for _, s := range cc.Parent().Node().(*ast.BlockStmt).List {
		clause := s.(*ast.CaseClause)
		if after && slices.ContainsFunc(clause.List, match) {
			return true
		}
		after = after || clause == cc.Node()
	}
	return false
}

// nextStmt returns the statement after the one at cur in its block, or nil.
func nextStmt(cur inspector.Cursor) ast.Stmt {
	block, ok := cur.Parent().Node().(*ast.BlockStmt)
	if !ok {
		return nil
	}
	for i, s := range block.List[:max(len(block.List)-1, 0)] {
		if s == cur.Node() {
			return block.List[i+1]
		}
	}
	return nil
}

// returns reports whether a block ends in a return statement.
func returns(b *ast.BlockStmt) bool {
	if len(b.List) == 0 {
		return false
	}
	_, ok := b.List[len(b.List)-1].(*ast.ReturnStmt)
	return ok
}

// tieCascade reports whether the split at cur, written as ifs whose
// bodies return, leaves the zero case only to choose among the same
// outcomes by other keys (if d < 0 { assign(e, left); return } else if
// d > 0 { assign(e, right); return }, then the same two actions chosen by
// area, then by count): a lexicographic choice. A residue of a few ulps
// that sends a tie to a signed branch picks an outcome the tie-break could
// have picked for the next key, so no result depends on the exact zero.
func (c *checker) tieCascade(cur inspector.Cursor) bool {
	if cur.ParentEdgeKind() != edge.IfStmt_Cond {
		return false
	}
	first := cur.Parent()
	ifs := first.Node().(*ast.IfStmt)
	chain := first
	var second *ast.BlockStmt
	if next, ok := ifs.Else.(*ast.IfStmt); ok && next.Else == nil {
		second = next.Body
	} else if next, ok := nextStmt(first).(*ast.IfStmt); ok && ifs.Else == nil && next.Else == nil {
		second = next.Body
		chain, _ = first.Parent().FindNode(next)
	}
	block, ok := chain.Parent().Node().(*ast.BlockStmt)
	if second == nil || !ok || !returns(ifs.Body) || !returns(second) {
		return false
	}
	outcomes := map[string]bool{c.outcome(ifs.Body.List): true, c.outcome(second.List): true}
	rest := block.List[slices.Index(block.List, chain.Node().(ast.Stmt))+1:]
	for i, s := range rest {
		next, isIf := s.(*ast.IfStmt)
		if !isIf {
			return outcomes[c.outcome(rest[i:])]
		}
		for next != nil {
			if !returns(next.Body) || !outcomes[c.outcome(next.Body.List)] {
				return false
			}
			switch e := next.Else.(type) {
			case *ast.IfStmt:
				next = e
			case *ast.BlockStmt:
				return outcomes[c.outcome(e.List)]
			default:
				next = nil
			}
		}
	}
	return false // the zero case falls through with nothing chosen
}

// outcome returns the source of stmts, a final bare return dropped: the
// action a branch of a choice takes.
func (c *checker) outcome(stmts []ast.Stmt) string {
	if n := len(stmts); n > 0 {
		if r, ok := stmts[n-1].(*ast.ReturnStmt); ok && len(r.Results) == 0 {
			stmts = stmts[:n-1]
		}
	}
	var text []string
	for _, s := range stmts {
		text = append(text, fixes.Source(c.pass.Fset, s))
	}
	return strings.Join(text, "\n")
}
