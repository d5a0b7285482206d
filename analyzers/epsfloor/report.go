package epsfloor

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"math"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/tolerance"
	"roundoff/internal/numeric"
)

// constantTol judges a tolerance test whose tolerance is a constant tol.
func (c *checker) constantTol(cur inspector.Cursor, t tolerance.Test, f numeric.Format, tol float64) {
	if t.Kind == tolerance.Magnitude {
		c.iterate(cur, t, f, tol)
		return
	}
	res := tolerance.Judge(t.Kind, tol, f, c.magnitude(t, f))
	if res == tolerance.Resolvable {
		return
	}
	d := analysis.Diagnostic{
		Pos: t.Cmp.Pos(), End: t.Cmp.End(),
		Category: category(res),
		Message:  describe(t.Kind, fixes.Source(c.pass.Fset, t.Tol), tol) + " " + explain(res, tol, f, c.magnitude(t, f)),
		Related:  c.declaredAt(t.Tol),
	}
	fixes.Report(c.pass, d, c.tolFix(cur, t, res, f)...)
}

// magnitude returns the size of the compared values when an operand is a
// constant, else 0.
func (c *checker) magnitude(t tolerance.Test, f numeric.Format) float64 {
	for _, e := range []ast.Expr{t.A, t.B} {
		if v, ok := constval.Exact(c.pass.TypesInfo, c.decls, e); ok {
			return math.Abs(f.Value(v))
		}
	}
	return 0
}

func category(res tolerance.Resolution) string {
	switch res {
	case tolerance.BelowRoundoff:
		return catRelative
	case tolerance.Subnormal:
		return catSubnormal
	}
	return catAbsolute
}

// explain writes why a tolerance tol cannot be resolved by format f, to
// follow its description; mag is the known size of the compared values, or 0.
func explain(res tolerance.Resolution, tol float64, f numeric.Format, mag float64) string {
	switch res {
	case tolerance.BelowRoundoff:
		return fmt.Sprintf("is below the unit roundoff of %[1]s (%.3[2]g): two different %[1]s values always differ by more, so the test is exact equality; use a few ulps, such as %[3]s (%.2[4]g)",
			f.Name, f.U, f.FewUlpsLiteral(), 4*f.Eps)
	case tolerance.BelowEpsilon:
		return fmt.Sprintf("is below %s epsilon (%.3g): the test can hold for unequal values only when they are below about %.2g (tol/eps), and is exact equality above; add a relative term",
			f.Name, f.Eps, tol/f.Eps)
	case tolerance.BelowSpacing:
		return fmt.Sprintf("is below half the spacing of %s values at %s (%.3g): the test passes only on exact equality",
			f.Name, numeric.Short(mag), f.Spacing(mag)/2)
	}
	return fmt.Sprintf("is the smallest positive %[1]s: it says how small a number can be, not how close two can be (%[1]s epsilon is %.3[2]g), so the test is exact equality except among subnormal values",
		f.Name, f.Eps)
}

// describe names a tolerance written as src with value tol.
func describe(kind tolerance.Kind, src string, tol float64) string {
	word := map[tolerance.Kind]string{tolerance.Absolute: "absolute", tolerance.Relative: "relative"}[kind]
	return word + " tolerance " + numeric.WithValue(src, tol)
}

// declaredAt points at the declaration of a named tolerance declared in
// this package, away from the comparison.
func (c *checker) declaredAt(e ast.Expr) []analysis.RelatedInformation {
	id, ok := ast.Unparen(e).(*ast.Ident)
	if !ok {
		return nil
	}
	init, ok := c.decls[c.pass.TypesInfo.Uses[id]]
	if !ok {
		return nil
	}
	return []analysis.RelatedInformation{{Pos: init.Pos(), End: init.End(), Message: id.Name + " is set here"}}
}

// tolFix returns the fix for an unresolvable constant tolerance.
func (c *checker) tolFix(cur inspector.Cursor, t tolerance.Test, res tolerance.Resolution, f numeric.Format) []fixes.Fix {
	switch res {
	case tolerance.BelowRoundoff:
		target := ast.Node(ast.Unparen(t.Tol))
		if id, ok := target.(*ast.Ident); ok {
			if init, ok := c.decls[c.pass.TypesInfo.Uses[id]]; ok {
				target = init // change the named tolerance where it is set
			}
		}
		return []fixes.Fix{fixes.Judgement("Use 4 ulps as the relative tolerance: "+f.FewUlpsLiteral(), fixes.Replace(target, f.FewUlpsLiteral()))}
	case tolerance.Subnormal:
		return []fixes.Fix{fixes.Judgement("Use "+f.Name+" epsilon: "+f.EpsLiteral(), fixes.Replace(t.Tol, f.EpsLiteral()))}
	case tolerance.BelowEpsilon, tolerance.BelowSpacing:
		return c.mixedFix(cur, t, f)
	}
	return nil
}

// mixedFix turns |a-b| < tol into |a-b| < tol + 4ulps·max(|a|,|b|), keeping
// tol as the floor near zero. It needs the difference written in the
// comparison itself, so that a and b are the values compared, and float64
// operands, which math.Abs and math.Max take as they are.
func (c *checker) mixedFix(cur inspector.Cursor, t tolerance.Test, f numeric.Format) []fixes.Fix {
	f64 := types.Typ[types.Float64]
	if !types.Identical(c.pass.TypesInfo.TypeOf(t.A), f64) || !types.Identical(c.pass.TypesInfo.TypeOf(t.B), f64) {
		return nil
	}
	if t.Scale != nil || !within(t.A, t.Cmp) || !within(t.Tol, t.Cmp) ||
		!fixes.Pure(c.pass.TypesInfo, t.A) || !fixes.Pure(c.pass.TypesInfo, t.B) {
		return nil
	}
	name, edits, ok := fixes.Import(c.pass.TypesInfo, fileOf(cur), t.Cmp.Pos(), "math")
	if !ok {
		return nil
	}
	a, b := fixes.Source(c.pass.Fset, t.A), fixes.Source(c.pass.Fset, t.B)
	text := fmt.Sprintf("%[1]s + %[2]s*%[3]s.Max(%[3]s.Abs(%[4]s), %[3]s.Abs(%[5]s))", fixes.Operand(c.pass.Fset, t.Tol, token.ADD.Precedence()), f.FewUlpsLiteral(), name, a, b)
	return []fixes.Fix{fixes.Judgement("Add a relative term of 4 ulps: "+text, append(edits, fixes.Replace(t.Tol, text))...)}
}

// within reports whether n lies inside outer.
func within(n, outer ast.Node) bool {
	return n.Pos() >= outer.Pos() && n.End() <= outer.End()
}

// fileOf returns the file enclosing cur.
func fileOf(cur inspector.Cursor) *ast.File {
	for f := range cur.Enclosing((*ast.File)(nil)) {
		return f.Node().(*ast.File)
	}
	return nil
}
