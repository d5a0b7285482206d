package cancellation

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/consume"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
)

// overlapComplement reports 1 - s where s accumulates math.Sqrt(p*q)
// (s += math.Sqrt(p[i]*q[i]), in the same function or in the package's
// own function that returns s), consumed to relative accuracy (under a
// root, as a divisor, in a logarithm or a sign test): for distributions
// that sum to 1, s is the Bhattacharyya coefficient, at most 1 and equal
// to 1 where they coincide, so 1 - s is the squared Hellinger distance.
// Each term carries a rounding, s about n·u in all, so squared distances
// below that are noise and distances below about sqrt(n·u) ≈ 1e-8 are
// lost; 0.5·Σ(√p-√q)² is the same value without the subtraction. s is the
// cosine of the angle between the unit vectors √p and √q, so this is the
// cosine rule's 1 - cos θ. It reports whether n had the form.
func (c *checker) overlapComplement(cur inspector.Cursor, n *ast.BinaryExpr) bool {
	if !c.isOne(n.X) || !c.usesMath("Sqrt") {
		return false
	}
	e, _ := c.through(n.Y)
	var acc *ast.Ident
	var body ast.Node
	switch e := e.(type) {
	case *ast.Ident:
		if fn, ok := enclosingFunc(cur); ok {
			acc, body = e, fn.Node()
		}
	case *ast.CallExpr:
		if acc, _ = ast.Unparen(c.returned(e)).(*ast.Ident); acc != nil {
			body = c.declOf(e)
		}
	}
	if acc == nil || body == nil || !c.sumsRootProducts(c.pass.TypesInfo.Uses[acc], body) {
		return false
	}
	if consume.Of(c.pass.TypesInfo, cur, 2) == consume.Relative {
		fixes.Report(c.pass, analysis.Diagnostic{
			Pos: n.Pos(), End: n.End(), Category: catCosine,
			Message: fmt.Sprintf("1 - s with s a sum of math.Sqrt(p*q)%s (a Bhattacharyya coefficient, 1 where the distributions coincide) keeps only the rounding of s, about n·u (u = %.3g), for close distributions: squared distances below that are noise and distances below about 1e-8 are lost; use 0.5·Σ(math.Sqrt(p)-math.Sqrt(q))²",
				binding("s", n.Y), unitRoundoff),
		})
	}
	return true
}

// sumsRootProducts reports whether v is updated, in body, only by
// v += math.Sqrt(a*b), at least once.
func (c *checker) sumsRootProducts(v types.Object, body ast.Node) bool {
	updates, others := 0, 0
	ast.Inspect(body, func(n ast.Node) bool {
		as, ok := n.(*ast.AssignStmt)
		if !ok || others > 0 {
			return others == 0
		}
		id, isIdent := as.Lhs[0].(*ast.Ident)
		if !isIdent || c.pass.TypesInfo.ObjectOf(id) != v || as.Tok == token.DEFINE {
			return true
		}
		root, isCall := ast.Unparen(as.Rhs[0]).(*ast.CallExpr)
		p, isProduct := (*ast.BinaryExpr)(nil), false
		if isCall && c.mathFunc(root) == "Sqrt" {
			p, isProduct = ast.Unparen(root.Args[0]).(*ast.BinaryExpr)
		}
		if as.Tok == token.ADD_ASSIGN && isProduct && p.Op == token.MUL {
			updates++
		} else {
			others++
		}
		return true
	})
	return v != nil && updates > 0 && others == 0
}

// declOf returns the declaration of the package's own function that call
// calls, or nil.
func (c *checker) declOf(call *ast.CallExpr) *ast.FuncDecl {
	fd, _ := provenance.CalleeDecl(c.pass.TypesInfo, c.pass.Files, c.pass.Pkg, call)
	return fd
}
