package fdstep

import (
	"fmt"
	"go/ast"
	"go/types"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/internal/numeric"
)

// gonum's diff/fd takes the step of its stencils from the formula it
// uses, unless the caller's settings give one: with settings nil, or with
// no Step, every component of x is perturbed by the formula's fixed Step,
// whatever its size (gonum v0.17.0, diff/fd/diff.go and the functions'
// "Default settings"). A call that leaves the step to the formula is a
// fixed step written elsewhere and is judged as one.
const fdPath = "gonum.org/v1/gonum/diff/fd"

// fdFuncs maps the functions of diff/fd that difference with the
// formula's own Step to the index of their x argument and their default
// formula.
var fdFuncs = map[string]struct {
	x       int
	formula string
}{
	"Derivative": {1, "Forward"}, "Gradient": {2, "Forward"}, "Jacobian": {2, "Forward"}, "Laplacian": {1, "Central2nd"},
}

// fdFormulas gives the Step of diff/fd's formulas and the scheme each is.
var fdFormulas = map[string]struct {
	step   float64
	scheme string
}{
	"Forward": {2e-8, "forward"}, "Backward": {2e-8, "backward"}, "Central": {6e-6, "central"}, "Central2nd": {1e-4, "second"},
}

// importsFD reports whether the package imports diff/fd.
func importsFD(pass *analysis.Pass) bool {
	return slices.ContainsFunc(pass.Pkg.Imports(), func(p *types.Package) bool { return p.Path() == fdPath })
}

// gonumFD reports a call of diff/fd whose settings leave the step to the
// formula: nil, or a composite literal with no Step (or Step 0).
func (c *checker) gonumFD(call *ssa.Call) {
	fn := call.Common().StaticCallee()
	obj := fn.Object()
	spec, ok := fdFuncs[fn.Name()]
	if obj == nil || obj.Pkg() == nil || obj.Pkg().Path() != fdPath || !ok {
		return
	}
	args := call.Common().Args
	node := c.argSyntax(call, len(args)-1)
	formula, ok := c.fdFormula(node, spec.formula)
	f, known := fdFormulas[formula]
	if !ok || !known {
		return
	}
	s := schemeNamed(f.scheme)
	xv, xKnown := constval.Float(provenance.Strip(args[spec.x]), c.globals)
	v, report := judge(s, f.step, numeric.Float64, xv, xKnown, 0)
	if !report || c.deliberate(node.Pos(), v) || c.said[node.Pos()] {
		return
	}
	c.said[node.Pos()] = true
	subject := fmt.Sprintf("fixed %s-difference step %s (the Step of fd.%s, which fd.%s takes when its settings give none)",
		s.name, numeric.Short(f.step), formula, fn.Name())
	fixes.Report(c.pass, analysis.Diagnostic{Pos: node.Pos(), End: node.End(), Category: category(v), Message: message(subject, v)})
}

// fdFormula reads the settings argument e of a diff/fd call: nil, or the
// address of a composite literal without a nonzero Step, leaves the step
// to the formula, which is the literal's Formula (fd.Central) or def. It
// reports false for settings it cannot read, or that set a step.
func (c *checker) fdFormula(e ast.Expr, def string) (string, bool) {
	e = ast.Unparen(e)
	if id, ok := e.(*ast.Ident); ok && id.Name == "nil" && c.pass.TypesInfo.Types[e].IsNil() {
		return def, true
	}
	u, ok := e.(*ast.UnaryExpr)
	if !ok {
		return "", false
	}
	lit, ok := ast.Unparen(u.X).(*ast.CompositeLit)
	if !ok {
		return "", false
	}
	formula := def
	for _, elt := range lit.Elts {
		kv, ok := elt.(*ast.KeyValueExpr)
		key, isIdent := kv.Key.(*ast.Ident)
		if !ok || !isIdent {
			return "", false
		}
		switch key.Name {
		case "Step":
			if v := c.pass.TypesInfo.Types[kv.Value].Value; v == nil || v.String() != "0" {
				return "", false // a step of the caller's
			}
		case "Formula":
			sel, ok := ast.Unparen(kv.Value).(*ast.SelectorExpr)
			if !ok {
				return "", false
			}
			formula = sel.Sel.Name
		}
	}
	return formula, true
}
