package fdstep

import (
	"go/ast"
	"go/constant"
	"go/token"

	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/tolerance"
)

// adequate is how many times a quotient's expected error the tolerance of
// the check comparing it must be for its step to be adequate there. The
// error model assumes f and its derivatives of unit size and drops
// constant factors; a tolerance ten times the estimate leaves room for
// |f| up to ten (common practice).
const adequate = 10

// checkTolerance returns the tightest tolerance that result, a difference
// quotient or a call returning one, is compared with in a tolerance test
// that measures a difference result is an operand of (package tolerance),
// read at unit scale: tol for |a-b| < tol and for |a-b| < tol·|b|,
// atol + rtol for the mixed |a-b| < atol + rtol·|b|. A test of |result|
// alone asks whether the derivative vanishes, and checks it against no
// reference. It follows result through arithmetic, absolute values and
// conversions, and into a helper of this package that does the
// comparison, whose tolerance is then the constant the call passes. It
// returns 0 when there is none.
func (c *checker) checkTolerance(result ssa.Value) float64 {
	if result == nil {
		return 0
	}
	tol := 0.0
	c.compared(result, nil, 0, false, func(t float64) {
		if tol == 0 || t < tol {
			tol = t
		}
	})
	return tol
}

// compared calls visit with the tolerance of every tolerance test that v
// reaches within a few operations, as an operand of the difference the
// test measures (diff: a subtraction is on the way). args are the
// arguments of the call into the helper v belongs to, nil outside a helper.
func (c *checker) compared(v ssa.Value, args []ssa.Value, depth int, diff bool, visit func(float64)) {
	refs := v.Referrers()
	if refs == nil || depth > 4 {
		return
	}
	for _, r := range *refs {
		switch r := r.(type) {
		case *ssa.BinOp:
			switch r.Op {
			case token.LSS, token.LEQ, token.GTR, token.GEQ:
				if diff {
					c.tested(r, args, visit)
				}
			case token.ADD, token.SUB, token.MUL, token.QUO:
				c.compared(r, args, depth+1, diff || r.Op == token.SUB, visit)
			}
		case *ssa.UnOp:
			if r.Op == token.SUB {
				c.compared(r, args, depth+1, diff, visit)
			}
		case *ssa.Convert:
			c.compared(r, args, depth+1, diff, visit)
		case *ssa.ChangeType:
			c.compared(r, args, depth+1, diff, visit)
		case *ssa.Call:
			c.intoCall(r, v, args, depth, diff, visit)
		}
	}
}

// intoCall follows v into a call: through math.Abs, and into a helper of
// this package (one level) that receives it as a parameter.
func (c *checker) intoCall(call *ssa.Call, v ssa.Value, args []ssa.Value, depth int, diff bool, visit func(float64)) {
	fn := call.Call.StaticCallee()
	switch {
	case fn == nil:
	case fn.Pkg != nil && fn.Pkg.Pkg.Path() == "math" && fn.Name() == "Abs":
		c.compared(call, args, depth+1, diff, visit)
	case args == nil && fn.Package() == call.Parent().Package() && len(fn.Params) == len(call.Call.Args):
		for i, a := range call.Call.Args {
			if a == v {
				c.compared(fn.Params[i], call.Call.Args, depth+1, false, visit)
			}
		}
	}
}

// tested reads the comparison cmp as a tolerance test and calls visit
// with its tolerance when that is known: a constant, or a parameter of
// the helper given a constant by args.
func (c *checker) tested(cmp *ssa.BinOp, args []ssa.Value, visit func(float64)) {
	be, ok := c.node(cmp.Pos()).(*ast.BinaryExpr)
	if !ok {
		return
	}
	t, ok := tolerance.Reader{Info: c.pass.TypesInfo, Decls: c.decls, Mixed: true}.Recognize(be)
	if !ok || t.Kind != tolerance.Absolute && t.Kind != tolerance.Relative {
		return
	}
	tol, ok := c.tolValue(t.Tol, cmp.Parent(), args)
	if !ok || !(tol > tolerance.UnderflowGuard) {
		return // no tolerance: an exact test, or an underflow guard (accept when |a-b| is below the smallest float)
	}
	floor := 0.0
	if t.Floor != nil {
		if floor, ok = c.tolValue(t.Floor, cmp.Parent(), args); !ok {
			return
		}
	}
	visit(tol/t.Factor + floor)
}

// tolValue returns the value of a tolerance as written: a constant, or a
// parameter of fn given a constant by args.
func (c *checker) tolValue(e ast.Expr, fn *ssa.Function, args []ssa.Value) (float64, bool) {
	if v, ok := constval.Exact(c.pass.TypesInfo, c.decls, e); ok {
		f, _ := constant.Float64Val(constant.ToFloat(v))
		return f, v.Kind() == constant.Float || v.Kind() == constant.Int
	}
	id, ok := ast.Unparen(e).(*ast.Ident)
	if !ok || args == nil {
		return 0, false
	}
	obj := c.pass.TypesInfo.Uses[id]
	for i, p := range fn.Params {
		if p.Object() == obj && obj != nil {
			return constval.Float(provenance.Strip(args[i]), c.globals)
		}
	}
	return 0, false
}
