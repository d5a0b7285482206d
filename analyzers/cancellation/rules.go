package cancellation

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"
	"strings"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/consume"
	"roundoff/analyzers/internal/fixes"
)

// log1p reports math.Log(1+x) and math.Log(1-x), and the same in base 10
// and 2: 1±x rounds away the digits of a small x before the logarithm
// sees them.
func (c *checker) log1p(cur inspector.Cursor, call *ast.CallExpr, name string) {
	sum, indirect := c.through(call.Args[0])
	x, neg, ok := c.onePlus(sum)
	if !ok {
		return // Log(x-1) and Log(2+x) lose nothing to 1
	}
	if e, isCall := ast.Unparen(x).(*ast.CallExpr); isCall && !neg && name == "Log" && c.mathFunc(e) == "Exp" && !c.isConst(e.Args[0]) {
		c.softplus(cur, call, e.Args[0])
		return
	}
	if !c.lossShows(cur, x, 1.0/boundedLoss, halfDigits) && !(neg && c.failureTerm(cur, name, x)) || c.boundedAway(cur, x, 1.0/boundedLoss) || c.roundedBack(cur, call.Args[0]) {
		return
	}
	form, arg, use := "1+x", fixes.Source(c.pass.Fset, ast.Unparen(x)), "math.Log1p(x)"
	if neg {
		form, arg, use = "1-x", negate(c, x), "math.Log1p(-x)"
	}
	q := qualifier(call)
	text := q + ".Log1p(" + arg + ")"
	fix := fixes.Safe("Replace with "+text, fixes.Replace(call, text))
	if base := map[string]string{"Log10": "Ln10", "Log2": "Ln2"}[name]; base != "" {
		use += "/math." + base
		text += "/" + q + "." + base
		if _, inOperation := cur.Parent().Node().(*ast.BinaryExpr); inOperation {
			text = "(" + text + ")"
		}
		// Needs review: the division by the rounded constant misses exact
		// results at some powers of the base, which math.Log2 and
		// math.Log10 return exactly (TestExactPowers).
		fix = fixes.Judgement("Replace with "+text, fixes.Replace(call, text))
	}
	head := fmt.Sprintf("math.%s(%s)%s", name, form, binding("x", x))
	if indirect {
		held := types.ExprString(call.Args[0])
		head = fmt.Sprintf("math.%s(%s), %[2]s = %s%s,", name, held, form, binding("x", x))
	}
	d := analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catLog1p,
		Message: fmt.Sprintf("%s returns 0 for |x| below %.3g, where %s rounds to 1, and loses about log10(1/|x|) digits for small x; use %s",
			head, unitRoundoff/2, form, use),
	}
	if indirect {
		fixes.Report(c.pass, d) // the sum is stored in a variable: x may have changed since
		return
	}
	fixes.Report(c.pass, d, fix)
}

// roundedBack reports whether the logarithm at cur of y, a variable
// holding 1+x, is divided by y-1 computed from the same y, as in
// x * math.Log(y) / (y - 1): log(y)/(y-1) varies slowly near y = 1, so
// evaluating it at the rounded y and multiplying by x gives log(1+x) to a
// few ulps (Goldberg 1991, Theorem 4): the rounding of 1+x cancels out.
func (c *checker) roundedBack(cur inspector.Cursor, y ast.Expr) bool {
	id, ok := ast.Unparen(y).(*ast.Ident)
	if !ok || c.decls[c.pass.TypesInfo.Uses[id]] == nil {
		return false
	}
	for ; ; cur = cur.Parent() {
		switch p := cur.Parent().Node().(type) {
		case *ast.ParenExpr:
		case *ast.BinaryExpr:
			if p.Op == token.QUO && p.X == cur.Node() {
				d, _ := c.through(p.Y)
				sub, ok := d.(*ast.BinaryExpr)
				return ok && sub.Op == token.SUB && same(sub.X, id) && c.isOne(sub.Y)
			}
			if p.Op != token.MUL {
				return false
			}
		default:
			return false
		}
	}
}

// negate returns the source of -x.
func negate(c *checker, x ast.Expr) string {
	if u, ok := ast.Unparen(x).(*ast.UnaryExpr); ok && u.Op == token.SUB {
		return fixes.Source(c.pass.Fset, ast.Unparen(u.X))
	}
	return "-" + fixes.Operand(c.pass.Fset, x, token.UnaryPrec)
}

// expm1 reports math.Exp(x)-1 and 1-math.Exp(x): exp(x) is close to 1 for
// small x, and the subtraction leaves only its rounding error.
func (c *checker) expm1(cur inspector.Cursor, n *ast.BinaryExpr, call *ast.CallExpr, oneFirst, indirect bool) {
	x := call.Args[0]
	if !c.lossShows(cur, x, 1.0/boundedLoss, halfDigits) {
		return
	}
	text, form, use := qualifier(call)+".Expm1("+fixes.Source(c.pass.Fset, ast.Unparen(x))+")", "math.Exp(x)-1", "math.Expm1(x)"
	if oneFirst {
		text, form, use = "-"+text, "1-math.Exp(x)", "-math.Expm1(x)"
	}
	target := ast.Node(n)
	if p, ok := cur.Parent().Node().(*ast.ParenExpr); ok && !oneFirst {
		target = p // (math.Exp(x) - 1) becomes math.Expm1(x)
	}
	d := analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catExpm1,
		Message: fmt.Sprintf("%s%s returns 0 for |x| below %.3g, where math.Exp(x) rounds to 1, and loses about log10(1/|x|) digits for small x; use %s",
			form, binding("x", x), unitRoundoff/2, use),
	}
	if indirect {
		fixes.Report(c.pass, d) // the exponential is stored in a variable: x may have changed since
		return
	}
	fixes.Report(c.pass, d, fixes.Safe("Replace with "+text, fixes.Replace(target, text)))
}

// cosine reports 1-math.Cos(x) and math.Cos(x)-1: cos(x) is 1-x²/2 near 0,
// so the difference keeps only the rounding error of the cosine, losing
// about log10(2/x²) digits: at most two where |x| ≥ sqrt(2/boundedLoss).
func (c *checker) cosine(cur inspector.Cursor, n *ast.BinaryExpr, call *ast.CallExpr, oneFirst, indirect bool) {
	f := halfAngle{form: "1-math.Cos(x)", use: "2*math.Sin(x/2)*math.Sin(x/2)", fix: func(_, sq string) string { return sq }, safe: true}
	if !oneFirst {
		f = halfAngle{form: "math.Cos(x)-1", use: "-2*math.Sin(x/2)*math.Sin(x/2)", fix: func(_, sq string) string { return "-" + sq }, safe: true}
	}
	c.cosineLoss(cur, n, call, indirect, f)
}

// secant reports 1/math.Cos(x) - 1 and 1 - 1/math.Cos(x): sec x is
// 1 + x²/2 near 0, and the difference keeps only the rounding of the
// quotient, losing digits as 1 - cos x does;
// 2*math.Sin(x/2)*math.Sin(x/2)/math.Cos(x) is the same quantity without
// a subtraction.
func (c *checker) secant(cur inspector.Cursor, n *ast.BinaryExpr, call *ast.CallExpr, oneFirst, indirect bool) {
	x := fixes.Source(c.pass.Fset, ast.Unparen(call.Args[0]))
	f := halfAngle{form: "1/math.Cos(x)-1", use: "2*math.Sin(x/2)*math.Sin(x/2)/math.Cos(x)", fix: func(q, sq string) string { return sq + "/" + q + ".Cos(" + x + ")" }}
	if oneFirst {
		f = halfAngle{form: "1-1/math.Cos(x)", use: "-2*math.Sin(x/2)*math.Sin(x/2)/math.Cos(x)", fix: func(q, sq string) string { return "-" + sq + "/" + q + ".Cos(" + x + ")" }}
	}
	c.cosineLoss(cur, n, call, indirect, f)
}

// logCosine reports math.Log(math.Cos(x)), also through a variable
// holding the cosine: the logarithm is 0 where the cosine rounds to 1
// instead of about -x²/2, and keeps only the cosine's rounding beyond
// that; math.Log1p(-2*math.Sin(x/2)*math.Sin(x/2)) keeps the digits.
func (c *checker) logCosine(cur inspector.Cursor, call *ast.CallExpr) {
	arg, indirect := c.through(call.Args[0])
	cos, ok := arg.(*ast.CallExpr)
	if !ok || c.mathFunc(cos) != "Cos" {
		return
	}
	c.cosineLoss(cur, call, cos, indirect, halfAngle{form: "math.Log(math.Cos(x))", use: "math.Log1p(-2*math.Sin(x/2)*math.Sin(x/2))", fix: func(q, sq string) string { return q + ".Log1p(-" + sq + ")" }})
}

// halfAngle is a form that holds 1 - cos(x) in disguise, and its
// accurate rewriting through the square 2*sin(x/2)*sin(x/2).
type halfAngle struct {
	form, use string                        // as written and as it should be, for the message
	fix       func(q, square string) string // the rewriting, from the math package's name and the square
	safe      bool                          // the rewriting keeps behaviour (else it needs review)
}

// cosineLoss reports node, a form f of the cosine cos: cos(x) rounds to 1
// for |x| below 1.05e-8, and the form keeps only its rounding, losing
// about 2·log10(1/|x|) digits, at most two where |x| ≥ sqrt(2/boundedLoss).
func (c *checker) cosineLoss(cur inspector.Cursor, node ast.Node, cos *ast.CallExpr, indirect bool, f halfAngle) {
	x := cos.Args[0]
	if !c.lossShows(cur, x, math.Sqrt(2.0/boundedLoss), cosHalfDigits) || c.turnFraction(x, 4) {
		return
	}
	d := analysis.Diagnostic{
		Pos: node.Pos(), End: node.End(), Category: catCosine,
		Message: fmt.Sprintf("%s%s returns 0 for |x| below %.3g, where math.Cos(x) rounds to 1, and loses about 2·log10(1/|x|) digits for small x; use %s",
			f.form, binding("x", x), cosFlat, f.use),
	}
	if indirect || !fixes.Pure(c.pass.TypesInfo, x) {
		fixes.Report(c.pass, d) // stored first (x may have changed since), or the fix would evaluate x twice
		return
	}
	q := qualifier(cos)
	half := fixes.Operand(c.pass.Fset, x, token.MUL.Precedence()) + "/2"
	text := f.fix(q, "2*"+q+".Sin("+half+")*"+q+".Sin("+half+")")
	if f.safe {
		fixes.Report(c.pass, d, fixes.Safe("Replace with "+text, fixes.Replace(node, text)))
		return
	}
	// Needs review: far from 0 both forms round about equally, in different
	// last bits.
	fixes.Report(c.pass, d, fixes.Judgement("Replace with "+text, fixes.Replace(node, text)))
}

// hypot reports math.Sqrt(x*x+y*y) and math.Sqrt(x*x+y*y+z*z): the
// squares overflow, or leave the normal range, long before the result
// does.
func (c *checker) hypot(cur inspector.Cursor, call *ast.CallExpr) {
	ops, ok := c.squaresOf(call.Args[0])
	if !ok {
		c.selfDotLength(cur, call)
		return // not a sum of two or three squares
	}
	reach, bounded := false, true
	for _, e := range ops {
		reach = reach || c.farReaching(cur, e, 4) || c.unboundedData(e, 4)
		bounded = bounded && c.bounded(e, 4)
	}
	if !reach || bounded {
		return // data of a bounded range, or sines and cosines: math.Hypot would only cost accuracy
	}
	for _, e := range ops {
		if c.isConst(e) || c.wholeNumber(e) || c.scaled(e) || c.guarded(cur, e, c.compares) {
			return // a constant, a whole number, or a value whose range the code controls
		}
	}
	if c.overflowsFirst(cur) {
		return // the result feeds a function that overflows at far smaller magnitudes
	}
	if len(ops) == 3 {
		fixes.Report(c.pass, analysis.Diagnostic{
			Pos: call.Pos(), End: call.End(), Category: catHypot,
			Message: fmt.Sprintf("math.Sqrt(x*x+y*y+z*z)%s overflows to +Inf once |x|, |y| or |z| exceeds %.3g and loses precision below %.3g, where the squares leave the normal range; divide by the largest magnitude first and multiply the root by it",
				binding("xyz", ops...), squareMax, squareNormal),
		})
		return
	}
	x, y := ops[0], ops[1]
	q := qualifier(call)
	text := q + ".Hypot(" + fixes.Source(c.pass.Fset, ast.Unparen(x)) + ", " + fixes.Source(c.pass.Fset, ast.Unparen(y)) + ")"
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catHypot,
		Message: fmt.Sprintf("math.Sqrt(x*x+y*y)%s overflows to +Inf once |x| or |y| exceeds %.3g and loses precision below %.3g, where the squares leave the normal range; use math.Hypot(x, y)",
			binding("xy", x, y), squareMax, squareNormal),
	}, fixes.Judgement("Replace with "+text, fixes.Replace(call, text)))
}

// selfDotLength reports math.Sqrt(v.Dot(v)), also through what the
// package's functions return (math.Sqrt(w.lengthSq())), where Dot sums
// products of fields the package takes as unbounded (unboundedData): the
// squares overflow as in math.Sqrt(x*x+y*y). A squared length stored in
// a variable used elsewhere too is left alone (usedElsewhere).
func (c *checker) selfDotLength(cur inspector.Cursor, call *ast.CallExpr) {
	fields, ok := c.selfDotFields(call.Args[0], 3)
	if !ok || c.usedElsewhere(cur, call.Args[0]) {
		return
	}
	if c.unbounded == nil {
		c.unbounded = c.unboundedFields()
	}
	var names []string
	for _, f := range fields {
		if !c.unbounded[f] {
			return
		}
		names = append(names, f.Name())
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catHypot,
		Message: fmt.Sprintf("math.Sqrt of a vector's dot product with itself (fields %s, which the package takes as unbounded) overflows to +Inf once a component exceeds %.3g and loses precision below %.3g, where the squares leave the normal range; use math.Hypot of the components",
			strings.Join(names, ", "), squareMax, squareNormal),
	})
}

// usedElsewhere reports whether e is a variable that the function
// enclosing cur also uses other than at cur: a squared length that enters
// other products (4*C*A beside math.Sqrt(C)), which overflow at the same
// magnitudes or earlier, so math.Hypot at the root would not remove the
// overflow.
func (c *checker) usedElsewhere(cur inspector.Cursor, e ast.Expr) bool {
	id, ok := ast.Unparen(e).(*ast.Ident)
	fn, inFunc := enclosingFunc(cur)
	if !ok || !inFunc {
		return false
	}
	v := c.pass.TypesInfo.Uses[id]
	for u := range fn.Preorder((*ast.Ident)(nil)) {
		if n := u.Node().(*ast.Ident); n != id && c.pass.TypesInfo.Uses[n] == v {
			return true
		}
	}
	return false
}

// squaresOf returns the operands of e when it is a sum of two or three
// squares (x*x + y*y, x*x + y*y + z*z).
func (c *checker) squaresOf(e ast.Expr) ([]ast.Expr, bool) {
	sum, ok := ast.Unparen(e).(*ast.BinaryExpr)
	if !ok || sum.Op != token.ADD {
		return nil, false
	}
	y, oky := c.square(sum.Y)
	if !oky {
		return nil, false
	}
	if x, okx := c.square(sum.X); okx {
		return []ast.Expr{x, y}, true
	}
	inner, ok := ast.Unparen(sum.X).(*ast.BinaryExpr)
	if !ok || inner.Op != token.ADD {
		return nil, false
	}
	x, okx := c.square(inner.X)
	w, okw := c.square(inner.Y)
	return []ast.Expr{x, w, y}, okx && okw
}

// square returns x when e is x*x, or math.Pow(x, 2), for a
// side-effect-free float64 x.
func (c *checker) square(e ast.Expr) (ast.Expr, bool) {
	if call, ok := ast.Unparen(e).(*ast.CallExpr); ok && c.mathFuncOf(call, 2) == "Pow" && isFloat64(c.pass.TypesInfo.TypeOf(call.Args[0])) {
		v := c.pass.TypesInfo.Types[call.Args[1]].Value
		return call.Args[0], v != nil && constant.Compare(constant.ToFloat(v), token.EQL, constant.MakeFloat64(2)) && fixes.Pure(c.pass.TypesInfo, call.Args[0])
	}
	m, ok := ast.Unparen(e).(*ast.BinaryExpr)
	if !ok || m.Op != token.MUL || !isFloat64(c.pass.TypesInfo.TypeOf(m.X)) {
		return nil, false
	}
	return m.X, fixes.Pure(c.pass.TypesInfo, m.X) && same(m.X, m.Y)
}

// logSumExp reports math.Log(math.Exp(a)+math.Exp(b)), which overflows for
// large arguments and underflows to log(0) for very negative ones; it
// reports whether the call had that shape.
func (c *checker) logSumExp(cur inspector.Cursor, call *ast.CallExpr) bool {
	sum, ok := ast.Unparen(call.Args[0]).(*ast.BinaryExpr)
	if !ok || sum.Op != token.ADD {
		return false
	}
	ea, oka := ast.Unparen(sum.X).(*ast.CallExpr)
	eb, okb := ast.Unparen(sum.Y).(*ast.CallExpr)
	if !oka || !okb || c.mathFunc(ea) != "Exp" || c.mathFunc(eb) != "Exp" {
		return false
	}
	a, b := ea.Args[0], eb.Args[0]
	if c.isConst(a) && c.isConst(b) || c.commonShift(a, b) {
		return true // constants, or already shifted by a common value (the larger): the range is known
	}
	d := analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catLogSumExp,
		Message: fmt.Sprintf("math.Log(math.Exp(a)+math.Exp(b))%s overflows to +Inf once a or b exceeds %.6g and gives -Inf once both are below %.6g; shift by the larger: math.Max(a, b) + math.Log1p(math.Exp(-math.Abs(a-b)))",
			binding("ab", a, b), expOverflow, expUnderflows),
	}
	if !fixes.Pure(c.pass.TypesInfo, a) || !fixes.Pure(c.pass.TypesInfo, b) {
		fixes.Report(c.pass, d) // the fix would evaluate the arguments twice
		return true
	}
	q, fset := qualifier(call), c.pass.Fset
	diff := fixes.Operand(fset, a, token.ADD.Precedence()) + "-" + fixes.Operand(fset, b, token.ADD.Precedence()+1)
	text := fmt.Sprintf("%s.Max(%s, %s) + %[1]s.Log1p(%[1]s.Exp(-%[1]s.Abs(%[4]s)))", q, fixes.Source(fset, ast.Unparen(a)), fixes.Source(fset, ast.Unparen(b)), diff)
	if _, ok := cur.Parent().Node().(*ast.BinaryExpr); ok {
		text = "(" + text + ")"
	} else if _, ok := cur.Parent().Node().(*ast.UnaryExpr); ok {
		text = "(" + text + ")"
	}
	fixes.Report(c.pass, d, fixes.Judgement("Shift by the larger argument", fixes.Replace(call, text)))
	return true
}

// earlyOverflow lists the math functions that overflow for arguments of a
// few hundred (exp(710) = +Inf), far below the 1.34e154 at which squares
// do: a hypotenuse fed to them overflows there first.
var earlyOverflow = map[string]bool{"Exp": true, "Exp2": true, "Expm1": true, "Cosh": true, "Sinh": true, "Gamma": true}

// overflowsFirst reports whether the value at cur, carried through
// arithmetic and parentheses, is the argument of a function in
// earlyOverflow.
func (c *checker) overflowsFirst(cur inspector.Cursor) bool {
	for ; ; cur = cur.Parent() {
		switch p := cur.Parent().Node().(type) {
		case *ast.ParenExpr, *ast.BinaryExpr, *ast.UnaryExpr:
		case *ast.CallExpr:
			if _, isAbs := c.absArg(p); isAbs {
				continue
			}
			return earlyOverflow[c.mathFunc(p)]
		default:
			return false
		}
	}
}

// dividedForms gives, per function, the divided difference (f(a)-f(b))/(a-b)
// without the subtraction of nearly equal values: sum-to-product for the
// sine and cosine, a factored exponential, and a logarithm of the ratio.
var dividedForms = map[string]string{
	"Cos": "-2*math.Sin((a+b)/2)*math.Sin((a-b)/2)/(a-b)",
	"Sin": "2*math.Cos((a+b)/2)*math.Sin((a-b)/2)/(a-b)",
	"Exp": "math.Exp(b)*math.Expm1(a-b)/(a-b)",
	"Log": "math.Log1p((a-b)/b)/(a-b)",
}

// dividedDifference reports (f(a)-f(b))/(a-b) (or over b-a) for a math
// function f with a closed form in dividedForms: as a approaches b the
// numerator is f'(ξ)(a-b) while each value carries an absolute error of
// u·|f|, so the quotient keeps only about log10(|f'|·|a-b|/(u·|f|))
// digits and is 0/0 at a = b, where its limit f'(a) exists. The
// difference a-b itself is exact there (Sterbenz), so the closed forms
// keep every digit.
func (c *checker) dividedDifference(n *ast.BinaryExpr) {
	for _, pair := range [2][2]ast.Expr{{n.X, n.Y}, {n.Y, n.X}} {
		if name, a, b, ok := c.divided(pair[0], pair[1]); ok {
			fixes.Report(c.pass, analysis.Diagnostic{
				Pos: n.Pos(), End: n.End(), Category: catDivided,
				Message: fmt.Sprintf("(f(a)-f(b))/(a-b) for f = math.%s%s (or its reciprocal) is a divided difference: as a approaches b each value's rounding (u = %.3g of |f|) leaves about log10(|f'|·|a-b|/(u·|f|)) digits, and a = b gives 0/0 though the limit f'(a) exists; use %s, with f'(a) where a == b",
					name, binding("ab", a, b), unitRoundoff, dividedForms[name]),
			})
			return
		}
	}
}

// divided reports whether num is f(a)-f(b) and den is a-b or b-a, for a
// function f of dividedForms and arguments that are not constants.
func (c *checker) divided(num, den ast.Expr) (name string, a, b ast.Expr, ok bool) {
	fs, okn := ast.Unparen(num).(*ast.BinaryExpr)
	d, okd := ast.Unparen(den).(*ast.BinaryExpr)
	if !okn || !okd || fs.Op != token.SUB || d.Op != token.SUB {
		return "", nil, nil, false
	}
	fa, oka := ast.Unparen(fs.X).(*ast.CallExpr)
	fb, okb := ast.Unparen(fs.Y).(*ast.CallExpr)
	if !oka || !okb {
		return "", nil, nil, false
	}
	name = c.mathName(fa)
	if _, known := dividedForms[name]; !known || c.mathName(fb) != name {
		return "", nil, nil, false
	}
	a, b = fa.Args[0], fb.Args[0]
	over := same(a, d.X) && same(b, d.Y) || same(a, d.Y) && same(b, d.X)
	return name, a, b, over && !c.isConst(a) && !c.isConst(b)
}

// share reports 1 - a/(a+b), the complement of a share of a sum, also
// through never-reassigned variables, where its consumer needs it to
// relative accuracy (consume.Relative: a root, power, logarithm, divisor
// or sign test): where |b| is small against |a|
// the quotient is within a rounding of 1, so the difference keeps only
// about log10(|b|/(u·|a|)) digits and is 0 once |b| < u·|a|, while
// b/(a+b) is the same value with two roundings. It reports whether n had
// the form.
func (c *checker) share(cur inspector.Cursor, n *ast.BinaryExpr) bool {
	if !c.isOne(n.X) {
		return false
	}
	e, _ := c.through(n.Y)
	q, ok := e.(*ast.BinaryExpr)
	if !ok || q.Op != token.QUO {
		return false
	}
	d, _ := c.through(q.Y)
	sum, ok := d.(*ast.BinaryExpr)
	if !ok || sum.Op != token.ADD {
		return false
	}
	rest := sum.Y
	switch {
	case same(sum.X, q.X):
	case same(sum.Y, q.X):
		rest = sum.X
	default:
		return false
	}
	if consume.Of(c.pass.TypesInfo, cur, 2) != consume.Relative {
		return true // the absolute error of a rounding of 1 shows only where relative accuracy is needed
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catShare,
		Message: fmt.Sprintf("1 - a/(a+b)%s loses about log10(|a|/|b|) digits where |b| is small against |a|, where the quotient is within u = %.3g of 1, and is 0 once |b| < u·|a|; use b/(a+b)",
			binding("ab", q.X, rest), unitRoundoff),
	})
	return true
}

// roundTrip reports c1 ± k*(x - c2) and its mirror images whose constants
// cancel (1 + 2*(p - 0.5) is 2*p), unless the consumer needs only its
// absolute accuracy: x - c2 is rounded to the spacing of floats near c2,
// an absolute error up to ulp(c2)/2 that adding c1 back does not undo,
// so a small x keeps only about log10(|x|/ulp(c2)) digits while k*x
// keeps them all.
func (c *checker) roundTrip(cur inspector.Cursor, n *ast.BinaryExpr) {
	x, d, k, c2, ok := c.cancelledOffset(n)
	if !ok || consume.Of(c.pass.TypesInfo, cur, 2) == consume.Absolute {
		return
	}
	f, _ := constant.Float64Val(constant.ToFloat(c2))
	kf, _ := constant.Float64Val(constant.ToFloat(k))
	grain := math.Nextafter(math.Abs(f), math.Inf(1)) - math.Abs(f)
	fset := c.pass.Fset
	product := fmt.Sprintf("%g*%s", kf, fixes.Operand(fset, x, token.MUL.Precedence()))
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catRoundTrip,
		Message: fmt.Sprintf("%s is %s, but %s is rounded first, to within %.3g, which adding the constant back does not undo: where |%[5]s| is small against %[6]g it keeps only about log10(|%[5]s|/%.3[7]g) digits; use %[2]s",
			fixes.Source(fset, n), product, fixes.Source(fset, d), grain/2, types.ExprString(ast.Unparen(x)), math.Abs(f), grain),
	})
}

// cancelledOffset reads n as c1 ± k*(x - c2) (also (c2 - x), the constant
// term on either side, k = 1 where there is no factor) with constants
// that cancel, c1 ± k·(∓c2) = 0, and returns x, the difference, the
// factor of x in the value, and c2.
func (c *checker) cancelledOffset(n *ast.BinaryExpr) (x ast.Expr, d *ast.BinaryExpr, k, c2 constant.Value, ok bool) {
	if n.Op != token.ADD && n.Op != token.SUB || !isFloat64(c.pass.TypesInfo.TypeOf(n)) {
		return nil, nil, nil, nil, false
	}
	c1, term, sign := c.pass.TypesInfo.Types[n.X].Value, n.Y, 1
	if n.Op == token.SUB {
		sign = -1
	}
	if c1 == nil {
		c1, term, sign = c.pass.TypesInfo.Types[n.Y].Value, n.X, 1
		if c1 != nil && n.Op == token.SUB {
			c1 = constant.UnaryOp(token.SUB, c1, 0)
		}
	}
	if c1 == nil || c.isConst(term) {
		return nil, nil, nil, nil, false
	}
	k = constant.MakeInt64(int64(sign))
	inner := ast.Unparen(term)
	if m, isMul := inner.(*ast.BinaryExpr); isMul && m.Op == token.MUL {
		for _, pair := range [2][2]ast.Expr{{m.X, m.Y}, {m.Y, m.X}} {
			if v := c.pass.TypesInfo.Types[pair[0]].Value; v != nil {
				k, inner = constant.BinaryOp(k, token.MUL, v), ast.Unparen(pair[1])
				break
			}
		}
	}
	d, isSub := inner.(*ast.BinaryExpr)
	if !isSub || d.Op != token.SUB {
		return nil, nil, nil, nil, false
	}
	if v := c.pass.TypesInfo.Types[d.Y].Value; v != nil && !c.isConst(d.X) {
		x, c2 = d.X, v // c1 + k*(x - c2)
	} else if v := c.pass.TypesInfo.Types[d.X].Value; v != nil && !c.isConst(d.Y) {
		x, c2, k = d.Y, v, constant.UnaryOp(token.SUB, k, 0) // c1 + k*(c2 - x) = c1 - k*(x - c2)
	} else {
		return nil, nil, nil, nil, false
	}
	// The value is c1 + k*(x - c2) = k*x + (c1 - k*c2).
	rest := constant.BinaryOp(c1, token.SUB, constant.BinaryOp(k, token.MUL, c2))
	if constant.Sign(c2) == 0 || constant.Sign(rest) != 0 {
		return nil, nil, nil, nil, false
	}
	return x, d, k, c2, true
}

// logRatio reports math.Log(a) - math.Log(b) (also through variables, and
// in base 10 or 2) where the consumer needs the difference to relative
// accuracy (a divisor, a root, a logarithm, a sign test): each logarithm
// carries a rounding of its own size, u·|log a|, so where a and b are
// close the difference log(a/b) ≈ (a-b)/b keeps only about
// log10(|a-b|/(u·|b|·|log a|)) digits, while math.Log1p((a-b)/b) keeps
// them all where a-b is exact (within a factor 2, Sterbenz). It reports
// whether n had the form.
func (c *checker) logRatio(cur inspector.Cursor, n *ast.BinaryExpr) bool {
	la, oka := c.logOf(n.X)
	lb, okb := c.logOf(n.Y)
	if !oka || !okb || la.name != lb.name {
		return false
	}
	if c.isConst(la.arg) || c.isConst(lb.arg) || c.inDivided(cur, n) || consume.Of(c.pass.TypesInfo, cur, 2) != consume.Relative {
		return true // constants, a divided difference reported as one, or only absolute accuracy used
	}
	use := "math.Log1p((a-b)/b)"
	if la.name != "Log" {
		use += "/math." + map[string]string{"Log10": "Ln10", "Log2": "Ln2"}[la.name]
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catLog1p,
		Message: fmt.Sprintf("math.%s(a) - math.%[1]s(b)%s, consumed where its relative accuracy matters, keeps only about log10(|a-b|/(u·|b|·|log a|)) digits where a and b are close (u = %.3g): each logarithm carries a rounding of its own size; use %s",
			la.name, binding("ab", la.arg, lb.arg), unitRoundoff, use),
	})
	return true
}

// logCall is a call of math.Log, Log10 or Log2 and its argument.
type logCall struct {
	name string
	arg  ast.Expr
}

// logOf reads e, through never-reassigned variables, as a logarithm.
func (c *checker) logOf(e ast.Expr) (logCall, bool) {
	e, _ = c.through(e)
	call, ok := e.(*ast.CallExpr)
	if !ok {
		return logCall{}, false
	}
	switch name := c.mathFunc(call); name {
	case "Log", "Log10", "Log2":
		return logCall{name, call.Args[0]}, true
	}
	return logCall{}, false
}

// inDivided reports whether the difference n at cur is the numerator or
// denominator of a divided difference (dividedDifference).
func (c *checker) inDivided(cur inspector.Cursor, n *ast.BinaryExpr) bool {
	for ; ; cur = cur.Parent() {
		switch p := cur.Parent().Node().(type) {
		case *ast.ParenExpr:
			continue
		case *ast.BinaryExpr:
			if p.Op != token.QUO {
				return false
			}
			_, _, _, num := c.divided(n, p.Y)
			_, _, _, den := c.divided(n, p.X)
			return num || den
		}
		return false
	}
}

// pnorm reports math.Pow(x, p) accumulated into s (s += math.Pow(x, p))
// of which the same function takes math.Pow(s, 1/p) (s += math.Pow(math.Abs(v), p)) and p is not a constant:
// the p-th powers overflow to +Inf once |x| exceeds MaxFloat64^(1/p)
// (1.8e308^(1/p): 5.6e102 for p = 3, 6.7e30 for p = 10) and vanish below
// 2^-1074^(1/p), though the norm itself is representable; dividing every
// x by the largest |x| first, as math.Hypot does for p = 2, keeps the
// powers at most 1, and a base so divided is left alone.
func (c *checker) pnorm(cur inspector.Cursor, call *ast.CallExpr) {
	q, ok := ast.Unparen(call.Args[1]).(*ast.BinaryExpr)
	id, isIdent := ast.Unparen(call.Args[0]).(*ast.Ident)
	if !ok || !isIdent || q.Op != token.QUO || !c.isOne(q.X) || c.isConst(q.Y) {
		return
	}
	s := c.pass.TypesInfo.Uses[id]
	fn, ok := enclosingFunc(cur)
	if s == nil || !ok {
		return
	}
	for a := range fn.Preorder((*ast.AssignStmt)(nil)) {
		as := a.Node().(*ast.AssignStmt)
		lhs, ok := as.Lhs[0].(*ast.Ident)
		if !ok || as.Tok != token.ADD_ASSIGN || c.pass.TypesInfo.Uses[lhs] != s {
			continue
		}
		if p, isCall := ast.Unparen(as.Rhs[0]).(*ast.CallExpr); isCall && c.mathFunc2(p) == "Pow" && same(p.Args[1], q.Y) && !c.scaledBase(p.Args[0]) {
			fixes.Report(c.pass, analysis.Diagnostic{
				Pos: p.Pos(), End: p.End(), Category: catHypot,
				Message: fmt.Sprintf("math.Pow(x, p) summed for the root math.Pow(s, 1/p)%s overflows to +Inf once a term's base exceeds MaxFloat64^(1/p) (%.3g for p = 3, %.3g for p = 10) and loses tiny vectors, though the norm is representable; divide each value by the largest magnitude first and multiply the root by it",
					binding("p", q.Y), math.Pow(math.MaxFloat64, 1.0/3), math.Pow(math.MaxFloat64, 0.1)),
			})
			return
		}
	}
}

// expTerm returns the term of a numerator that grows with e, x itself or
// the non-constant side of c±x, and the numerator's form for messages.
func (c *checker) expTerm(x ast.Expr) (ast.Expr, string) {
	b, ok := ast.Unparen(x).(*ast.BinaryExpr)
	if !ok || b.Op != token.ADD && b.Op != token.SUB {
		return x, "e"
	}
	switch {
	case c.isConst(b.X) && !c.isConst(b.Y):
		return b.Y, "(" + types.ExprString(b.X) + b.Op.String() + "e)"
	case c.isConst(b.Y) && !c.isConst(b.X):
		return b.X, "(e" + b.Op.String() + types.ExprString(b.Y) + ")"
	}
	return x, "e"
}

// scaledBase reports whether e, or the argument of an absolute value e, is
// a quotient by a value that is not a constant: a scaled magnitude.
func (c *checker) scaledBase(e ast.Expr) bool {
	if call, ok := ast.Unparen(e).(*ast.CallExpr); ok {
		if arg, isAbs := c.absArg(call); isAbs {
			e = arg
		}
	}
	q, ok := ast.Unparen(e).(*ast.BinaryExpr)
	return ok && q.Op == token.QUO && !c.isConst(q.Y)
}

// expRatio reports e/(…(c+e)…) where e is math.Exp(y) (directly or
// through a never-reassigned variable), or the numerator is c-e, e-c or
// c+e (the hyperbolic tangent (1-e)/(1+e) with e = math.Exp(-2x)), and
// the denominator holds c+e, as the logistic density e/(s·(1+e)²) and the
// sigmoid e/(1+e) do: once y
// exceeds 709.78 both overflow and the quotient is ∞/∞ = NaN, though
// it tends to a finite limit (e^-y·… ); for y > 0, dividing through by e,
// i.e. using math.Exp(-y), keeps every value finite. An exponent known
// not to be positive (-|z|) is left alone, as is a quotient under a
// condition that checks e or y (math.IsInf(e, 1), y < 700).
func (c *checker) expRatio(cur inspector.Cursor, n *ast.BinaryExpr) {
	num, form := c.expTerm(n.X)
	e, _ := c.through(num)
	call, ok := e.(*ast.CallExpr)
	if n.Op != token.QUO || !ok || c.mathFunc(call) != "Exp" || c.isConst(call.Args[0]) {
		return
	}
	if neg, ok := ast.Unparen(call.Args[0]).(*ast.UnaryExpr); ok && neg.Op == token.SUB && c.nonNegative(cur, neg.X, 3) {
		return // e^-|z| is at most 1
	}
	if c.guarded(cur, num, c.overflowChecked) || c.guarded(cur, call.Args[0], c.overflowChecked) {
		return // the code checks the range of e or of its exponent
	}
	found := false
	ast.Inspect(n.Y, func(m ast.Node) bool {
		if s, ok := m.(*ast.BinaryExpr); ok && s.Op == token.ADD {
			found = found || c.isConst(s.X) && same(s.Y, num) || c.isConst(s.Y) && same(s.X, num)
		}
		return !found
	})
	if !found {
		return
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catLogSumExp,
		Message: fmt.Sprintf("%s/(…(1+e)…) with e = %s is ∞/∞ = NaN once the exponent exceeds %.6g, though the quotient tends to a finite limit; for a positive exponent divide through by e, using math.Exp of the negated exponent",
			form, types.ExprString(call), expOverflow),
	})
}
