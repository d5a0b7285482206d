package cancellation

import (
	"fmt"
	"go/ast"
	"go/token"
	"math"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
)

// logistic reports math.Log(σ(z)) and math.Log(1 - σ(z)) for the logistic
// σ(z) = 1/(1+e^-z), written out (1/(1+math.Exp(-z)), math.Exp(z)/(1 +
// math.Exp(z))), held in a variable or returned by the package's own
// function. σ(z) rounds to exactly 1 once e^-z is below half an ulp of 1
// (z above about 36.7), where log(1-σ(z)) is -Inf though its value is
// about -z, and to 0 once e^-z overflows (z below about -709.8), where
// log(σ(z)) is -Inf though its value is about z: the log-loss of a
// confident prediction. log σ(z) = -softplus(-z) and log(1-σ(z)) =
// -softplus(z) hold exactly and stay finite, and Log1p(-σ(z)) does not
// help: σ(z) is already 1. It reports whether the call had either form.
func (c *checker) logistic(cur inspector.Cursor, call *ast.CallExpr) bool {
	arg, _ := c.through(call.Args[0])
	x, neg, complement := c.onePlus(arg)
	if !complement || !neg {
		x = arg
	}
	z, ok := c.sigmoid(x, 4)
	if !ok {
		return false
	}
	form, value, where, use := "σ(z)", "z", fmt.Sprintf("z below %.4g, where σ(z) underflows to 0", -expOverflow), "-(math.Max(-z, 0) + math.Log1p(math.Exp(-math.Abs(z))))"
	if complement && neg {
		form, value, where, use = "1-σ(z)", "-z", fmt.Sprintf("z above %.3g, where σ(z) rounds to 1", -math.Log(unitRoundoff)), "-(math.Max(z, 0) + math.Log1p(math.Exp(-math.Abs(z))))"
	}
	c.pass.Report(analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catLogSumExp,
		Message: fmt.Sprintf("math.Log(%s) of the logistic σ(z) = 1/(1+e^-z)%s is -Inf for %s, though its value is about %s; use the softplus form %s",
			form, binding("z", z), where, value, use),
	})
	return true
}

// sigmoid reads e, through variables and the package's own functions, as
// the logistic 1/(1+math.Exp(-z)) or math.Exp(z)/(1+math.Exp(z)), and
// returns z.
func (c *checker) sigmoid(e ast.Expr, depth int) (ast.Expr, bool) {
	if depth == 0 {
		return nil, false
	}
	e, _ = c.through(e)
	switch q := ast.Unparen(e).(type) {
	case *ast.CallExpr:
		if r := c.returned(q); r != nil {
			return c.sigmoid(r, depth-1)
		}
	case *ast.BinaryExpr:
		if q.Op != token.QUO {
			return nil, false
		}
		w, neg, ok := c.onePlus(q.Y)
		wv, _ := c.through(w)
		exp, isCall := wv.(*ast.CallExpr)
		if !ok || neg || !isCall || c.mathFunc(exp) != "Exp" {
			return nil, false
		}
		y := exp.Args[0]
		switch {
		case c.isOne(q.X):
			if m, ok := ast.Unparen(y).(*ast.UnaryExpr); ok && m.Op == token.SUB {
				return m.X, true // 1/(1+e^-z)
			}
			return &ast.UnaryExpr{Op: token.SUB, X: y}, true // 1/(1+e^y) is σ(-y)
		case same(q.X, w):
			return y, true // e^z/(1+e^z)
		}
	}
	return nil, false
}
