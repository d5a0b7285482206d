package cancellation

import (
	"fmt"
	"go/ast"
	"go/constant"
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
		y, w, ok := c.onePlusExp(q.Y)
		switch {
		case !ok:
		case c.isOne(q.X):
			return negated(y), true // 1/(1+e^-z), and 1/(1+e^y) is σ(-y)
		case same(q.X, w):
			return y, true // e^z/(1+e^z)
		}
	}
	return nil, false
}

// onePlusExp returns y and e^y (as written) when e is 1 + math.Exp(y).
func (c *checker) onePlusExp(e ast.Expr) (y, w ast.Expr, ok bool) {
	w, neg, ok := c.onePlus(e)
	wv, _ := c.through(w)
	exp, isCall := wv.(*ast.CallExpr)
	if !ok || neg || !isCall || c.mathFunc(exp) != "Exp" {
		return nil, nil, false
	}
	return exp.Args[0], w, true
}

// negated returns -y, taking off a minus sign y already has.
func negated(y ast.Expr) ast.Expr {
	if m, ok := ast.Unparen(y).(*ast.UnaryExpr); ok && m.Op == token.SUB {
		return m.X
	}
	return &ast.UnaryExpr{Op: token.SUB, X: y}
}

// scaledLogistic reports 2σ(z) - 1 and 1 - 2σ(z) for the logistic σ(z) =
// 1/(1+e^-z), written 2/(1+math.Exp(-z)) or 2*σ(z) as sigmoid reads it,
// and reports whether n had that form: 2σ(z) - 1 is tanh(z/2), about z/2
// near 0, where 2σ(z) is near 1 and carries an absolute error of about u,
// so the difference keeps about log10(|z|/u) digits, and is 0 for |z|
// below about 2u, where 1+e^-z rounds to 2. math.Tanh(z/2) has no
// subtraction.
func (c *checker) scaledLogistic(cur inspector.Cursor, n *ast.BinaryExpr) bool {
	e, one := n.X, n.Y
	if c.isOne(n.X) {
		e, one = n.Y, n.X
	}
	z, ok := c.doubledSigmoid(e)
	if !ok || !c.isOne(one) || c.isConst(z) {
		return false
	}
	bound := binding("z", z)
	if !local(cur, z) {
		bound = "" // read through a function of the package: z is written in its terms
	}
	form, use := "2σ(z)-1", "math.Tanh(z/2)"
	if one == n.X {
		form, use = "1-2σ(z)", "-math.Tanh(z/2)"
	}
	c.pass.Report(analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catLogSumExp,
		Message: fmt.Sprintf("%s of the logistic σ(z) = 1/(1+e^-z)%s is %s, about ±z/2 near 0, where 2σ(z) is near 1: it keeps about log10(|z|/u) digits (u = %.3g) and is 0 for |z| below about %.2g; use %[3]s",
			form, bound, use, unitRoundoff, 2*unitRoundoff),
	})
	return true
}

// local reports whether z, or the operand of a minus sign put before it,
// is written in the function around cur, not in one it calls.
func local(cur inspector.Cursor, z ast.Expr) bool {
	if u, ok := z.(*ast.UnaryExpr); ok && !u.OpPos.IsValid() {
		z = u.X
	}
	for fn := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		return fn.Node().Pos() <= z.Pos() && z.End() <= fn.Node().End()
	}
	return false
}

// doubledSigmoid returns z when e is 2σ(z): 2/(1+math.Exp(-z)), or 2
// times a logistic as sigmoid reads it.
func (c *checker) doubledSigmoid(e ast.Expr) (ast.Expr, bool) {
	b, ok := ast.Unparen(e).(*ast.BinaryExpr)
	if !ok || b.Op != token.MUL && b.Op != token.QUO {
		return nil, false
	}
	two := func(x ast.Expr) bool {
		v := c.pass.TypesInfo.Types[x].Value
		return v != nil && constant.Compare(constant.ToFloat(v), token.EQL, constant.MakeFloat64(2))
	}
	switch {
	case b.Op == token.QUO && two(b.X):
		y, _, ok := c.onePlusExp(b.Y)
		if ok {
			return negated(y), true
		}
	case b.Op == token.MUL && two(b.X):
		return c.sigmoid(b.Y, 4)
	case b.Op == token.MUL && two(b.Y):
		return c.sigmoid(b.X, 4)
	}
	return nil, false
}
