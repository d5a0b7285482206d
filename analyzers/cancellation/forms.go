package cancellation

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"
	"math/big"
	"slices"
	"strings"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/consume"
	"roundoff/analyzers/internal/degree"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/vecshape"
)

// through returns the value e stands for: e itself, or the initial value
// of the never-reassigned local variable e names (followed up to three
// times), so that k := math.Exp(y); k - 1 reads as math.Exp(y) - 1.
func (c *checker) through(e ast.Expr) (ast.Expr, bool) {
	indirect := false
	for range 3 {
		id, ok := ast.Unparen(e).(*ast.Ident)
		if !ok {
			break
		}
		init := c.decls[c.pass.TypesInfo.Uses[id]]
		if init == nil {
			break
		}
		e, indirect = init, true
	}
	return ast.Unparen(e), indirect
}

// powAway reports whether the ranges of a and b at cur keep |b·ln a|, on
// which a^b - 1 loses about log10(1/|b·ln a|) digits, at least
// 1/boundedLoss: a constant base, or one whose range is one value, and an
// exponent bounded away from 0, as 2^-s behind if s > 20.
func (c *checker) powAway(cur inspector.Cursor, a, b ast.Expr) bool {
	ra, _ := c.spans.At(cur, a)
	if ra.Lo != ra.Hi || !(ra.Lo > 0) {
		return false
	}
	return c.boundedAway(cur, b, 1/(boundedLoss*math.Abs(math.Log(ra.Lo))))
}

// powm1 reports math.Pow(a, b)-1 and 1-math.Pow(a, b) with an exponent
// that is not a constant: a^b is near 1 when b·ln a is small (a short time
// step, a probability near 0 raised to a count), and the difference keeps
// only the rounding error of the power.
func (c *checker) powm1(cur inspector.Cursor, n *ast.BinaryExpr, call *ast.CallExpr, oneFirst, indirect bool) {
	a, b := call.Args[0], call.Args[1]
	if c.isConst(b) || !c.lossShows(cur, b, 0, 0) || c.powAway(cur, a, b) {
		return // a fixed power (x^2-1 is a difference of squares), or a value far from 1
	}
	if _, _, onePlus := c.onePlus(a); !onePlus && (c.computed(cur, a) || c.counts(b)) {
		// A computed base carries its own rounding, which Expm1 would
		// inherit; a whole exponent n >= 1 keeps |1-a^n| >= |1-a|, so the
		// power loses no more than 1-a does from the base's own rounding.
		return
	}
	q := qualifier(call)
	logA := q + ".Log(" + fixes.Source(c.pass.Fset, ast.Unparen(a)) + ")"
	if x, neg, ok := c.onePlus(a); ok {
		arg := fixes.Source(c.pass.Fset, ast.Unparen(x))
		if neg {
			arg = negate(c, x)
		}
		logA = q + ".Log1p(" + arg + ")" // (1-u)^b: the logarithm keeps u's digits too
	}
	text := q + ".Expm1(" + fixes.Operand(c.pass.Fset, b, token.MUL.Precedence()) + "*" + logA + ")"
	form, use := "math.Pow(a, b)-1", "math.Expm1(b*math.Log(a))"
	if oneFirst {
		text, form, use = "-"+text, "1-math.Pow(a, b)", "-math.Expm1(b*math.Log(a))"
	}
	d := analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catExpm1,
		Message: fmt.Sprintf("%s%s returns 0 when |b·ln a| is below %.3g, where the power rounds to 1, and loses about log10(1/|b·ln a|) digits when it is small; use %s (a > 0)",
			form, binding("ab", a, b), unitRoundoff/2, use),
	}
	if indirect || !fixes.Pure(c.pass.TypesInfo, a) || !fixes.Pure(c.pass.TypesInfo, b) {
		fixes.Report(c.pass, d) // the power is stored first, or its operands have effects
		return
	}
	// Needs review: for a negative base and a whole exponent the power is
	// defined and the logarithm is NaN.
	fixes.Report(c.pass, d, fixes.Judgement("Replace with "+text, fixes.Replace(n, text)))
}

// onePlus returns x when e is 1+x, x+1 (neg false) or 1-x (neg true).
func (c *checker) onePlus(e ast.Expr) (x ast.Expr, neg, ok bool) {
	sum, isSum := ast.Unparen(e).(*ast.BinaryExpr)
	if !isSum || sum.Op != token.ADD && sum.Op != token.SUB {
		return nil, false, false
	}
	switch {
	case c.isOne(sum.X):
		return sum.Y, sum.Op == token.SUB, true
	case c.isOne(sum.Y) && sum.Op == token.ADD:
		return sum.X, false, true
	}
	return nil, false, false
}

// radical reports u + math.Sqrt(u*u + c) and its mirror images
// (math.Sqrt(u*u+c) - u, -u + math.Sqrt(u*u-c), ...) when the sign of u is
// not known: for the sign that makes the two terms subtract, the result is
// about c/(2|u|) while the square root carries an absolute error of one
// rounding of |u|, so the relative error is about 2u·u²/|c| and every digit
// is gone once u² exceeds |c|/u. This is math.Asinh's form (c = 1) and
// the quadratic formula's (-b + math.Sqrt(b*b - 4*a*c)).
func (c *checker) radical(cur inspector.Cursor, n *ast.BinaryExpr) {
	u, root, minus, ok := c.rootSum(n)
	if !ok || c.isConst(u) || c.signKnown(cur, u) || c.smallLoss(cur, u, root) || c.quadric(u, root) {
		return
	}
	if minus {
		root = &ast.UnaryExpr{Op: token.SUB, X: root} // u*u - c, for the message
	}
	if call, isLog := c.parentCall(cur); isLog && c.mathFunc(call) == "Log" && c.isOne(root) {
		c.asinh(call, u)
		return
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catRadical,
		Message: fmt.Sprintf("u ± math.Sqrt(u*u+c)%s cancels for the sign of u that makes the terms subtract: the result is about |c|/(2|u|) with relative error about 2u·u²/|c| (u = %.3g), every digit lost once u² ≥ |c|/u; rationalise as c/(math.Sqrt(u*u+c) ∓ u), or take the root of larger magnitude with math.Copysign and the other from the product of the roots",
			binding("uc", u, root), unitRoundoff),
	})
}

// boundedLoss is the most digits the radical rule lets pass where the
// ranges of u and c bound the loss: two, the size of error that
// largeCoefficient also lets pass (common practice).
const boundedLoss = 100

// smallLoss reports whether the ranges of u and c, bounded by construction
// (rangeOf), keep u²/|c|, and with it the digits u ± math.Sqrt(u*u+c)
// loses (about log10(u²/|c|)), within two digits: c away from 0 and u
// bounded, as in Cardano's formula on a fractional part.
func (c *checker) smallLoss(cur inspector.Cursor, u, root ast.Expr) bool {
	ru, _ := c.spans.At(cur, u)
	rc, _ := c.spans.At(cur, root)
	_, uMax := ru.Magnitude()
	cMin, _ := rc.Magnitude()
	return cMin > 0 && uMax*uMax <= boundedLoss*cMin
}

// parentCall returns the call whose only argument is the expression at
// cur, parentheses aside.
func (c *checker) parentCall(cur inspector.Cursor) (*ast.CallExpr, bool) {
	for {
		switch p := cur.Parent().Node().(type) {
		case *ast.ParenExpr:
			cur = cur.Parent()
			continue
		case *ast.CallExpr:
			return p, len(p.Args) == 1
		}
		return nil, false
	}
}

// rootSum reads n as ±u ± math.Sqrt(u*u ± c), directly or through
// never-reassigned variables, the radicand perhaps a call of the package's
// own dot product with u·u among its terms, and returns u and c, and
// whether c is subtracted.
func (c *checker) rootSum(n *ast.BinaryExpr) (u, root ast.Expr, minus, ok bool) {
	if n.Op != token.ADD && n.Op != token.SUB {
		return nil, nil, false, false
	}
	for _, pair := range [][2]ast.Expr{{n.X, n.Y}, {n.Y, n.X}} {
		call, ok := ast.Unparen(pair[1]).(*ast.CallExpr)
		if !ok {
			e, _ := c.through(pair[1])
			call, ok = e.(*ast.CallExpr)
		}
		if !ok || c.mathFunc(call) != "Sqrt" {
			continue
		}
		arg, _ := c.through(call.Args[0])
		other := pair[0]
		if neg, ok := ast.Unparen(other).(*ast.UnaryExpr); ok && neg.Op == token.SUB {
			other = neg.X
		}
		if dot, isCall := arg.(*ast.CallExpr); isCall && fixes.Pure(c.pass.TypesInfo, other) {
			if rest, ok := c.dotSquare(dot, other); ok {
				return other, rest, false, true // the package's dot product with u·u among its terms
			}
		}
		sum, ok := arg.(*ast.BinaryExpr)
		if !ok || sum.Op != token.ADD && sum.Op != token.SUB {
			continue
		}
		for _, sq := range [][2]ast.Expr{{sum.X, sum.Y}, {sum.Y, sum.X}} {
			if x, isSquare := c.square(sq[0]); isSquare && same(x, other) && (sum.Op == token.ADD || sq[0] == sum.X) {
				return other, sq[1], sum.Op == token.SUB, true
			}
		}
	}
	return nil, nil, false, false
}

// signKnown reports whether u cannot take both signs where cur runs: a
// value never negative (nonNegative), a whole number, or a value an
// enclosing condition compares.
func (c *checker) signKnown(cur inspector.Cursor, u ast.Expr) bool {
	return c.wholeNumber(u) || c.guarded(cur, u, c.compares) || c.nonNegative(cur, u, 8)
}

// nonNegative reports whether e cannot be negative where cur runs: a
// constant of at least 0, an absolute value, modulus, root, exponential,
// length or square, and sums, products and quotients of those, directly,
// through conversions, or through the value last assigned to a variable
// before cur (consume.Reaching), depth variables deep.
func (c *checker) nonNegative(cur inspector.Cursor, e ast.Expr, depth int) bool {
	e = ast.Unparen(e)
	if v := c.pass.TypesInfo.Types[e].Value; v != nil {
		return v.Kind() != constant.Unknown && constant.Sign(v) >= 0
	}
	if depth == 0 {
		return false
	}
	switch e := e.(type) {
	case *ast.CallExpr:
		if tv := c.pass.TypesInfo.Types[e.Fun]; tv.IsType() && len(e.Args) == 1 {
			return c.nonNegative(cur, e.Args[0], depth) // a conversion keeps the sign
		}
		r := c.returned(e) // a function of the package returning such a value
		return c.signedCall(e) || r != nil && c.nonNegative(cur, r, depth-1)
	case *ast.BinaryExpr:
		if _, sq := c.square(e); sq {
			return true
		}
		return (e.Op == token.ADD || e.Op == token.MUL || e.Op == token.QUO) &&
			c.nonNegative(cur, e.X, depth) && c.nonNegative(cur, e.Y, depth)
	case *ast.Ident:
		v, ok := c.pass.TypesInfo.Uses[e].(*types.Var)
		if !ok {
			return false
		}
		if init := c.decls[v]; init != nil {
			return c.nonNegative(cur, init, depth-1)
		}
		rhs, ok := consume.Reaching(c.pass.TypesInfo, cur, v)
		return ok && c.nonNegative(rhs, rhs.Node().(ast.Expr), depth-1)
	}
	return false
}

// signedCall reports whether call returns a value that is never
// negative: an absolute value or modulus, a root, an exponential, a
// hyperbolic cosine, a length.
func (c *checker) signedCall(call *ast.CallExpr) bool {
	if _, isAbs := c.absArg(call); isAbs {
		return true
	}
	switch c.mathFunc(call) {
	case "Sqrt", "Exp", "Exp2", "Cosh":
		return true
	}
	if c.mathFunc2(call) == "Hypot" {
		return true
	}
	if id, ok := ast.Unparen(call.Fun).(*ast.Ident); ok && (id.Name == "len" || id.Name == "cap") {
		_, builtin := c.pass.TypesInfo.Uses[id].(*types.Builtin)
		return builtin
	}
	fn, ok := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func)
	return ok && fn.Pkg() != nil && fn.Pkg().Path() == "math/cmplx" && fn.Name() == "Abs"
}

// asinh reports math.Log(u + math.Sqrt(u*u+1)), the textbook inverse
// hyperbolic sine: for u below about -1.34e8, u*u+1 rounds to u*u, the
// sum is 0 and the logarithm -Inf; math.Asinh is accurate for every u.
func (c *checker) asinh(call *ast.CallExpr, u ast.Expr) {
	text := qualifier(call) + ".Asinh(" + fixes.Source(c.pass.Fset, ast.Unparen(u)) + ")"
	d := analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catRadical,
		Message: fmt.Sprintf("math.Log(x + math.Sqrt(x*x+1))%s cancels for negative x: about 2u·x² relative error, every digit lost from x ≈ %.3g and -Inf from x ≈ %.3g, where x*x+1 rounds to x*x; use math.Asinh(x)",
			binding("x", u), -1/math.Sqrt(2*unitRoundoff), -math.Sqrt(2/unitRoundoff)),
	}
	// Safe: math.Asinh is at least as accurate for every x (TestFixesSafe).
	fixes.Report(c.pass, d, fixes.Safe("Replace with "+text, fixes.Replace(call, text)))
}

// bounded reports whether e is bounded by construction, far from the
// range where squares overflow or leave the normal range: a constant, a
// sine, cosine or other bounded function, a component of a unit vector
// (a/math.Sqrt(a*a+...), a/math.Hypot(a, ...)), or sums and products of
// those, directly or through never-reassigned variables.
func (c *checker) bounded(e ast.Expr, depth int) bool {
	e, _ = c.through(e)
	if v := c.pass.TypesInfo.Types[e].Value; v != nil {
		f, _ := constant.Float64Val(constant.ToFloat(v))
		return f == 0 || 1e-100 <= math.Abs(f) && math.Abs(f) <= 1e100 // squares far inside the normal range
	}
	if depth == 0 {
		return false
	}
	switch e := e.(type) {
	case *ast.CallExpr:
		switch c.mathFunc(e) {
		case "Sin", "Cos", "Tanh", "Erf", "Erfc", "Atan":
			return true
		}
		return c.mathFunc2(e) == "Atan2"
	case *ast.UnaryExpr:
		return (e.Op == token.SUB || e.Op == token.ADD) && c.bounded(e.X, depth-1)
	case *ast.BinaryExpr:
		switch e.Op {
		case token.ADD, token.SUB, token.MUL:
			return c.bounded(e.X, depth-1) && c.bounded(e.Y, depth-1)
		case token.QUO:
			return c.bounded(e.X, depth-1) && c.bounded(e.Y, 0) && !c.isZero(e.Y) || c.normalised(e)
		}
	}
	return false
}

// normalised reports whether q is a/n with n a norm that includes a:
// math.Sqrt of a sum with the term a*a, or math.Hypot with a among its
// arguments; |q| is then at most 1.
func (c *checker) normalised(q *ast.BinaryExpr) bool {
	d, _ := c.through(q.Y)
	call, ok := d.(*ast.CallExpr)
	if !ok {
		return false
	}
	if c.mathFunc2(call) == "Hypot" {
		return same(call.Args[0], q.X) || same(call.Args[1], q.X)
	}
	if c.mathFunc(call) != "Sqrt" {
		return false
	}
	found := false
	arg, _ := c.through(call.Args[0])
	ast.Inspect(arg, func(n ast.Node) bool {
		if x, ok := c.square(asExpr(n)); ok && same(x, q.X) {
			found = true
		}
		return !found
	})
	return found
}

// asExpr returns n as an expression, or nil.
func asExpr(n ast.Node) ast.Expr {
	e, _ := n.(ast.Expr)
	return e
}

// normCosine reports whether e is a ratio over a norm, a/|u| or
// a/(|u|·|v|): the cosine of an angle computed from a dot product.
func (c *checker) normCosine(e ast.Expr) bool {
	if call, ok := e.(*ast.CallExpr); ok {
		return c.cosineCall(call)
	}
	q, ok := e.(*ast.BinaryExpr)
	return ok && q.Op == token.QUO && c.isNorm(q.Y, 2)
}

// cosineCall reports whether call is of a function of the package whose
// every result is such a ratio or a constant (a clamp to ±1, 0 for a
// zero vector), read through variables given one value.
func (c *checker) cosineCall(call *ast.CallExpr) bool {
	fd := c.declOf(call)
	if fd == nil || fd.Body == nil {
		return false
	}
	cosine, other := false, false
	ast.Inspect(fd.Body, func(n ast.Node) bool {
		ret, ok := n.(*ast.ReturnStmt)
		if ok && len(ret.Results) == 1 && !c.isConst(ret.Results[0]) {
			r, _ := c.through(ret.Results[0])
			q, isQuo := ast.Unparen(r).(*ast.BinaryExpr)
			isCos := isQuo && q.Op == token.QUO && c.isNorm(q.Y, 2)
			cosine, other = cosine || isCos, other || !isCos
		}
		_, lit := n.(*ast.FuncLit)
		return !lit
	})
	return cosine && !other
}

// isNorm reports whether e is a Euclidean norm or a product of norms:
// math.Hypot, or math.Sqrt (math.Pow(·, 0.5)) of a sum of squares or of a
// self dot product (dot(v, v)), directly or through variables.
func (c *checker) isNorm(e ast.Expr, depth int) bool {
	e, _ = c.through(e)
	switch e := e.(type) {
	case *ast.BinaryExpr:
		return depth > 0 && e.Op == token.MUL && (c.isNorm(e.X, depth-1) || c.isNorm(e.Y, depth-1))
	case *ast.CallExpr:
		if c.mathFunc2(e) == "Hypot" {
			return true
		}
		if r := c.returned(e); r != nil && depth > 0 {
			return c.isNorm(r, depth-1) // a.Len() returning math.Sqrt(a.Dot(a))
		}
		if c.mathFunc(e) != "Sqrt" && (c.mathFunc2(e) != "Pow" || !c.isHalf(e.Args[1])) {
			return false
		}
		if id, ok := ast.Unparen(e.Args[0]).(*ast.Ident); ok {
			return c.sumOfSquares(id)
		}
		return c.hasSquare(e.Args[0])
	}
	return false
}

// hasSquare reports whether e contains a square x*x or a self dot product
// dot(v, v).
func (c *checker) hasSquare(e ast.Expr) bool {
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.BinaryExpr:
			_, found = c.square(n)
		case *ast.CallExpr:
			found = len(n.Args) == 2 && same(n.Args[0], n.Args[1]) && fixes.Pure(c.pass.TypesInfo, n.Args[0]) || c.selfProduct(n)
		}
		return !found
	})
	return found
}

// selfProduct reports a method call given its own receiver (a.Dot(a)) or
// a call of a function of the package that returns a sum of squares (of
// its receiver's fields: a.LenSq() returning a.X*a.X + a.Y*a.Y).
func (c *checker) selfProduct(call *ast.CallExpr) bool {
	if sel, ok := call.Fun.(*ast.SelectorExpr); ok && len(call.Args) == 1 && same(sel.X, call.Args[0]) && fixes.Pure(c.pass.TypesInfo, sel.X) {
		return true
	}
	r := c.returned(call)
	if r == nil {
		return false
	}
	found := false
	ast.Inspect(r, func(n ast.Node) bool {
		if b, ok := n.(*ast.BinaryExpr); ok {
			_, found = c.square(b)
		}
		return !found
	})
	return found
}

// sumOfSquares reports whether the variable id holds squares: its
// initial value has one, or its function adds one to it (na += a[i]*a[i]).
func (c *checker) sumOfSquares(id *ast.Ident) bool {
	obj := c.pass.TypesInfo.Uses[id]
	if init := c.decls[obj]; init != nil {
		return c.hasSquare(init)
	}
	cur, ok := c.insp.Root().FindNode(id)
	if !ok {
		return false
	}
	for fn := range cur.Enclosing((*ast.FuncDecl)(nil), (*ast.FuncLit)(nil)) {
		for a := range fn.Preorder((*ast.AssignStmt)(nil)) {
			as := a.Node().(*ast.AssignStmt)
			if l, ok := as.Lhs[0].(*ast.Ident); ok && as.Tok == token.ADD_ASSIGN && c.pass.TypesInfo.ObjectOf(l) == obj && c.hasSquare(as.Rhs[0]) {
				return true
			}
		}
		break
	}
	return false
}

// isHalf reports whether e is the constant 0.5.
func (c *checker) isHalf(e ast.Expr) bool {
	v := c.pass.TypesInfo.Types[e].Value
	return v != nil && constant.Compare(v, token.EQL, constant.MakeFloat64(0.5))
}

// lawOfCosines reports whether e is a sum of two products of sines and
// cosines, sin a·sin b + cos a·cos b·cos c: the cosine of a great-circle
// distance.
func (c *checker) lawOfCosines(e ast.Expr) bool {
	sum, ok := e.(*ast.BinaryExpr)
	if !ok || sum.Op != token.ADD {
		return false
	}
	trig := func(x ast.Expr) bool {
		found := false
		ast.Inspect(x, func(n ast.Node) bool {
			if call, ok := n.(*ast.CallExpr); ok && (c.mathName(call) == "Sin" || c.mathName(call) == "Cos") {
				found = true
			}
			return !found
		})
		m, isProduct := ast.Unparen(x).(*ast.BinaryExpr)
		return found && isProduct && m.Op == token.MUL
	}
	return trig(sum.X) && trig(sum.Y)
}

// acos reports math.Acos of the cosine of an angle between vectors (a dot
// product over norms) or of a great-circle distance (the spherical law of
// cosines): near ±1 its slope 1/sqrt(1-x²) is unbounded, so an error of one
// rounding in x becomes an angle error of about sqrt(2u) ≈ 1.49e-8 rad,
// half the digits, at the angles 0 and π where such cosines land most
// often (parallel vectors, nearby points), and math.Atan2 of the sine and
// cosine parts is exact there. An angle only counted (math.Ceil of it, an
// integer conversion) is left alone.
func (c *checker) acos(cur inspector.Cursor, call *ast.CallExpr, name string) {
	x, clamped := c.unclamped(cur, call.Args[0])
	sides := c.sidesCosine(x)
	if !c.normCosine(x) && !c.degrees().CosineCall(x) && !c.lawOfCosines(x) && !sides || c.counted(cur) {
		return
	}
	nan := ""
	if _, fromFunc := x.(*ast.CallExpr); !clamped && !fromFunc {
		nan = ", and returns NaN where rounding puts x just beyond ±1 (clamp it to [-1, 1] first)"
	}
	remedy := "compute the angle with math.Atan2 of its sine and cosine parts (for vectors, the cross and dot products)"
	if sides {
		remedy = "for an angle from three sides, use the half-angle form 2*math.Atan(math.Sqrt(((a-b)+c)*(c-(a-b))/((a+(b+c))*((a-c)+b)))), c the side opposite the angle and a ≥ b, which subtracts only the sides themselves"
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catArc,
		Message: fmt.Sprintf("math.%s(x)%s loses half the digits where x is near ±1 (angles near 0 and π): one rounding in x becomes an angle error of about sqrt(2u) ≈ %.3g rad%s; %s",
			name, binding("x", call.Args[0]), math.Sqrt(2*unitRoundoff), nan, remedy),
	})
}

// sidesCosine reports whether e is the planar law of cosines, the cosine
// of an angle from three lengths: (a*a + b*b - c*c) / (2*a*b), the squares
// also written math.Pow(x, 2), the terms in any order and signs, the
// denominator a constant times the product of two of the lengths squared.
func (c *checker) sidesCosine(e ast.Expr) bool {
	q, ok := e.(*ast.BinaryExpr)
	if !ok || q.Op != token.QUO {
		return false
	}
	var lengths []string
	for _, t := range c.addTerms(q.X, 1, nil) {
		x, ok := c.lengthSquared(t.e)
		if !ok {
			return false
		}
		lengths = append(lengths, x)
	}
	den := c.factors(q.Y)
	if len(lengths) != 3 || len(den) != 2 {
		return false
	}
	a, b := types.ExprString(ast.Unparen(den[0])), types.ExprString(ast.Unparen(den[1]))
	return a != b && slices.Contains(lengths, a) && slices.Contains(lengths, b)
}

// lengthSquared returns the source of x where e is x*x or math.Pow(x, 2).
func (c *checker) lengthSquared(e ast.Expr) (string, bool) {
	if call, ok := ast.Unparen(e).(*ast.CallExpr); ok && c.mathFunc2(call) == "Pow" {
		v := c.pass.TypesInfo.Types[call.Args[1]].Value
		return types.ExprString(ast.Unparen(call.Args[0])), v != nil && v.ExactString() == "2"
	}
	x, ok := c.square(e)
	if !ok {
		return "", false
	}
	return types.ExprString(ast.Unparen(x)), true
}

// unclamped returns the value e at cur stands for, through variables (the
// value last assigned before cur) and a clamp to [-1, 1] written with
// math.Max and math.Min, also when the clamp reassigns the variable, and
// whether it passed a clamp.
func (c *checker) unclamped(cur inspector.Cursor, e ast.Expr) (ast.Expr, bool) {
	clamped := false
	for range 6 {
		e, _ = c.through(e)
		if id, ok := e.(*ast.Ident); ok {
			if v, ok := c.pass.TypesInfo.Uses[id].(*types.Var); ok {
				if rhs, ok := consume.Reaching(c.pass.TypesInfo, cur, v); ok {
					cur, e = rhs, rhs.Node().(ast.Expr)
					continue
				}
			}
		}
		call, ok := e.(*ast.CallExpr)
		if !ok || c.mathFunc2(call) != "Max" && c.mathFunc2(call) != "Min" {
			return e, clamped
		}
		clamped = true
		if c.isConst(call.Args[0]) {
			e = call.Args[1]
		} else {
			e = call.Args[0]
		}
	}
	return e, clamped
}

// counted reports whether the value at cur, carried through arithmetic,
// is rounded to a whole number (math.Ceil, Floor, Round, Trunc or an
// integer conversion): a count of segments needs no accurate angle.
func (c *checker) counted(cur inspector.Cursor) bool {
	for ; ; cur = cur.Parent() {
		switch p := cur.Parent().Node().(type) {
		case *ast.ParenExpr, *ast.BinaryExpr, *ast.UnaryExpr:
		case *ast.CallExpr:
			switch c.mathFunc(p) {
			case "Ceil", "Floor", "Round", "Trunc":
				return true
			}
			tv := c.pass.TypesInfo.Types[p.Fun]
			return tv.IsType() && isInteger(tv.Type)
		default:
			return false
		}
	}
}

func isInteger(t types.Type) bool {
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&types.IsInteger != 0
}

// dotCosine reports 1 - cos θ where cos θ is a dot product over norms or
// the dot product of two directions (what says which):
// the quotient carries an absolute error of a few roundings, so 1 - cos θ,
// about θ²/2, is 0 for θ below about sqrt(2u) ≈ 1.49e-8 and loses
// 2·log10(1/θ) digits above.
func (c *checker) dotCosine(n *ast.BinaryExpr, cos ast.Expr, what string) {
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catCosine,
		Message: fmt.Sprintf("1 - c%s, %s, returns 0 for angles below about %.3g rad and loses about 2·log10(1/θ) digits for small θ; use 2*math.Sin(θ/2)*math.Sin(θ/2) with θ from math.Atan2 of the cross and dot products, or |a/|a| - b/|b||²/2",
			binding("c", cos), what, math.Sqrt(2*unitRoundoff)),
	})
}

// vectorCosine reports whether e, at cur, is the cosine of the angle
// between two vectors by package degree: the dot product of two
// directions, or a call of a function (of any package) returning a dot
// product over lengths.
func (c *checker) vectorCosine(cur inspector.Cursor, e ast.Expr) bool {
	var fd *ast.FuncDecl
	for f := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		fd = f.Node().(*ast.FuncDecl)
		break
	}
	return fd != nil && c.mentionsVector(e) && c.degrees().IsCosine(fd, e)
}

// mentionsVector reports whether e, or the value a variable in it was
// given, holds an operand of a vector type: a cosine between vectors
// reads some.
func (c *checker) mentionsVector(e ast.Expr) bool {
	e, _ = c.through(e)
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		if x, ok := n.(ast.Expr); ok && !found {
			found = degree.Vector(c.pass.TypesInfo.TypeOf(x))
		}
		return !found
	})
	return found
}

// degrees returns the package's degree reader, made on first use.
func (c *checker) degrees() *degree.Reader {
	if c.deg == nil {
		c.deg = degree.New(c.pass.Fset, c.pass.TypesInfo, c.pass.Files)
		c.deg.Import(vecshape.Of(c.pass))
	}
	return c.deg
}

// opposite reports 1 + c where c is the cosine of the angle between two
// vectors (the 1/(1 + a·b) of a rotation taking direction a to b): near
// π, where the vectors are nearly opposite, 1 + cos θ ≈ (π-θ)²/2 is all
// cancellation, 0 within about sqrt(2u) of π, while for directions
// |a+b|²/2 is the same value with nearly every digit (a+b is exact there
// by Sterbenz's lemma; TestOppositeDirections).
func (c *checker) opposite(cur inspector.Cursor, n *ast.BinaryExpr) {
	cos := n.Y
	if c.isOne(n.Y) {
		cos = n.X
	} else if !c.isOne(n.X) {
		return
	}
	if !c.vectorCosine(cur, cos) || c.addend(cur, 2) {
		return
	}
	if r, _ := c.spans.At(cur, cos); r.Lo >= -1+unitRoundoff {
		return // a guard sent the nearly opposite case elsewhere (if c < -1+eps { ... return })
	}
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catCosine,
		Message: fmt.Sprintf("1 + c%s, the cosine of the angle between two vectors, returns 0 for angles within about %.3g rad of π and loses about 2·log10(1/(π-θ)) digits near π, where the vectors are nearly opposite; for directions a and b use |a+b|²/2, whose sum a+b is exact there",
			binding("c", cos), math.Sqrt(2*unitRoundoff)),
	})
}

// isZero reports whether e is the constant 0.
func (c *checker) isZero(e ast.Expr) bool {
	v := c.pass.TypesInfo.Types[e].Value
	return v != nil && constant.Sign(v) == 0
}

// squares reports a*a - b*b, 1 - x*x and x*x - 1: each square carries an
// absolute error of one rounding of its size, u·a², which is all of the
// difference when |a| and |b| are close (|x| near 1); (a-b)*(a+b) forms
// the difference exactly (Sterbenz) before one rounded product. It reports
// whether n had that form.
func (c *checker) squares(cur inspector.Cursor, n *ast.BinaryExpr) bool {
	x, _ := c.through(n.X) // x2 := x*x; 1 - x2
	y, _ := c.through(n.Y)
	a, oka := c.square(x)
	b, okb := c.square(y)
	switch {
	case oka && okb:
	case oka && c.isOne(n.Y):
		b = n.Y
	case okb && c.isOne(n.X):
		a = n.X
	default:
		return false
	}
	if c.isConst(a) && c.isConst(b) || c.wholeNumber(a) || c.wholeNumber(b) || c.fixedLoss(a, b) {
		return true // known, or whole numbers whose squares are exact
	}
	if c.sineSquared(cur, n, a, b) {
		return true
	}
	if c.computedOrSquare(cur, a) || c.computedOrSquare(cur, b) {
		return true // the operand's own rounding error already costs what the factorisation would save
	}
	if x := a; c.isOne(a) || c.isOne(b) {
		if c.isOne(a) {
			x = b
		}
		if c.guarded(cur, x, c.awayFromOne) || c.rangeAwayFromOne(cur, x) {
			return true // |x| kept away from 1: at most two digits go
		}
	}
	if consume.Of(c.pass.TypesInfo, cur, 2) != consume.Relative {
		return true // backward stable: an absolute error of u·a² shows only where relative accuracy is needed
	}
	fset := c.pass.Fset
	text := "(" + fixes.Operand(fset, a, token.ADD.Precedence()) + " - " + fixes.Operand(fset, b, token.ADD.Precedence()+1) +
		") * (" + fixes.Operand(fset, a, token.ADD.Precedence()) + " + " + fixes.Operand(fset, b, token.ADD.Precedence()) + ")"
	d := analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catSquares,
		Message: fmt.Sprintf("a*a - b*b%s loses about log10(a²/|a²-b²|) digits where |a| and |b| are close: each square carries a rounding error of about u·a² (u = %.3g), all of the difference as it vanishes; use (a-b)*(a+b)",
			binding("ab", a, b), unitRoundoff),
	}
	// Needs review: far from |a| = |b| both forms round about equally, in
	// different last bits.
	fixes.Report(c.pass, d, fixes.Judgement("Replace with "+text, fixes.Replace(n, text)))
	return true
}

// sineSquared reports 1 - c*c and c*c - 1 where c is math.Cos(x),
// directly or through a variable that holds it, and reports whether n had
// that form: cos(x) rounds to 1 for |x| below 1.05e-8, so 1 - cos²x, which
// is sin²x, comes out 0 there and loses about 2·log10(1/|x|) digits
// above, however it is factorised (c carries its own rounding);
// math.Sin(x)*math.Sin(x) is the same quantity without a subtraction.
func (c *checker) sineSquared(cur inspector.Cursor, n *ast.BinaryExpr, a, b ast.Expr) bool {
	x, sign := b, ""
	if !c.isOne(a) {
		x, sign = a, "-"
	}
	e, indirect := c.through(x)
	cos, ok := e.(*ast.CallExpr)
	if !ok || c.mathFunc(cos) != "Cos" || !c.isOne(a) && !c.isOne(b) {
		return false
	}
	arg := fixes.Source(c.pass.Fset, ast.Unparen(cos.Args[0]))
	f := halfAngle{form: "1-math.Cos(x)*math.Cos(x)", use: "math.Sin(x)*math.Sin(x)", safe: true,
		fix: func(q, _ string) string { return sign + q + ".Sin(" + arg + ")*" + q + ".Sin(" + arg + ")" }}
	if sign != "" {
		f.form, f.use = "math.Cos(x)*math.Cos(x)-1", "-math.Sin(x)*math.Sin(x)"
	}
	c.cosineLoss(cur, n, cos, indirect, f)
	return true
}

// fixedLoss reports whether a and b hold constants, written or through
// variables never reassigned (r := 1.3125; h := 0.75), whose difference
// of squares loses at most two digits: a²/|a²-b²| is then a fixed number
// within boundedLoss.
func (c *checker) fixedLoss(a, b ast.Expr) bool {
	va, oka := constval.Exact(c.pass.TypesInfo, c.decls, a)
	vb, okb := constval.Exact(c.pass.TypesInfo, c.decls, b)
	if !oka || !okb {
		return false
	}
	x, _ := constant.Float64Val(constant.ToFloat(va))
	y, _ := constant.Float64Val(constant.ToFloat(vb))
	big := max(x*x, y*y)
	return big <= boundedLoss*math.Abs(x*x-y*y)
}

// upperTail reports 1 - math.Erf(x) and 1 - F(x) for a method or function
// F named CDF: a probability near 1 rounds to 1 within u, so the upper tail
// (a survival probability) is 0 below about 1.1e-16 and loses digits
// above; the complementary function computes it directly.
func (c *checker) upperTail(n *ast.BinaryExpr, e ast.Expr) bool {
	if x, ok := c.normalCDF(e); ok {
		use := "0.5*math.Erfc(x)"
		var fix []fixes.Fix
		if e == n.Y {
			// The leading minus is the argument's first token.
			text := "0.5 * " + qualifier(x.call) + ".Erfc(" + strings.TrimPrefix(fixes.Source(c.pass.Fset, x.arg), "-") + ")"
			fix = append(fix, fixes.Judgement("Replace with "+text, fixes.Replace(n, text)))
		}
		c.reportTail(n, use, fix)
		return true
	}
	call, ok := e.(*ast.CallExpr)
	if !ok {
		return false
	}
	use := "a complementary function (math.Erfc, a regularized incomplete function with its arguments swapped) or the CDF of the mirrored variable"
	var fix []fixes.Fix
	switch fn, _ := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func); {
	case c.mathFunc(call) == "Erf":
		use = "math.Erfc(x)"
		if e == n.Y { // not through a variable
			text := qualifier(call) + ".Erfc(" + fixes.Source(c.pass.Fset, ast.Unparen(call.Args[0])) + ")"
			fix = append(fix, fixes.Judgement("Replace with "+text, fixes.Replace(n, text)))
		}
	case fn != nil && strings.EqualFold(fn.Name(), "cdf"):
	default:
		return false
	}
	c.reportTail(n, use, fix)
	return true
}

// lowerTail reports 1 + math.Erf(x) and k + k*math.Erf(x), the normal
// distribution function 0.5*(1 + erf(z)) among them, for x not known to
// be non-negative: erf tends to -1 as x falls, so the sum keeps only its
// rounding, is 0 below x ≈ -5.92 and loses about log10(1/(1+erf x))
// digits above (1.5e-5 relative at x = -5); math.Erfc(-x) is the same
// value computed directly.
func (c *checker) lowerTail(cur inspector.Cursor, n *ast.BinaryExpr) {
	for _, pair := range [][2]ast.Expr{{n.X, n.Y}, {n.Y, n.X}} {
		k := c.pass.TypesInfo.Types[pair[0]].Value
		e, scale := ast.Unparen(pair[1]), ""
		if m, ok := e.(*ast.BinaryExpr); ok && m.Op == token.MUL && k != nil {
			if v := c.pass.TypesInfo.Types[m.X].Value; v != nil && constant.Compare(v, token.EQL, k) {
				e, scale = ast.Unparen(m.Y), fixes.Source(c.pass.Fset, m.X)+" * "
			}
		}
		if scale == "" && !c.isOne(pair[0]) {
			continue
		}
		inner, indirect := c.through(e)
		call, ok := inner.(*ast.CallExpr)
		if !ok || c.mathFunc(call) != "Erf" || c.nonNegative(cur, call.Args[0], 8) {
			continue
		}
		text := scale + qualifier(call) + ".Erfc(" + negate(c, call.Args[0]) + ")"
		d := analysis.Diagnostic{
			Pos: n.Pos(), End: n.End(), Category: catTail,
			Message: fmt.Sprintf("%s returns 0 where math.Erf(x) rounds to -1 (x below %.3g) and loses about log10(1/(1+erf x)) digits for negative x (%.2g relative at x = -5); use %smath.Erfc(-x)",
				fixes.Source(c.pass.Fset, n), lowestErf, erfLossAt5, scale),
		}
		if indirect {
			fixes.Report(c.pass, d) // the error function is stored in a variable: x may have changed since
			return
		}
		fixes.Report(c.pass, d, fixes.Judgement("Replace with "+text, fixes.Replace(n, text)))
		return
	}
}

// lowestErf is where 1 + math.Erf(x) becomes 0 in float64, and erfLossAt5
// the relative error of 1 + math.Erf(-5) against math.Erfc(5)
// (TestLowerTail).
const (
	lowestErf  = -5.92
	erfLossAt5 = 1.5e-5
)

func (c *checker) reportTail(n *ast.BinaryExpr, use string, fix []fixes.Fix) {
	fixes.Report(c.pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catTail,
		Message: fmt.Sprintf("%s returns 0 where the probability rounds to 1 (upper tails below %.3g) and loses about log10(1/tail) digits for small tails; use %s",
			fixes.Source(c.pass.Fset, n.X)+" - "+fixes.Source(c.pass.Fset, ast.Unparen(n.Y)), unitRoundoff, use),
	}, fix...)
}

// erfcCall is a call of math.Erfc and its negated argument.
type erfcCall struct {
	call *ast.CallExpr
	arg  ast.Expr
}

// normalCDF reports 0.5*math.Erfc(-x), the normal distribution function
// Φ(x√2), near 1 for large x; its upper tail is 0.5*math.Erfc(x).
func (c *checker) normalCDF(e ast.Expr) (erfcCall, bool) {
	m, ok := e.(*ast.BinaryExpr)
	if !ok || m.Op != token.MUL {
		return erfcCall{}, false
	}
	for _, pair := range [][2]ast.Expr{{m.X, m.Y}, {m.Y, m.X}} {
		v := c.pass.TypesInfo.Types[pair[0]].Value
		call, isCall := ast.Unparen(pair[1]).(*ast.CallExpr)
		if v == nil || !constant.Compare(v, token.EQL, constant.MakeFloat64(0.5)) || !isCall || c.mathFunc(call) != "Erfc" {
			continue
		}
		if leadingMinus(call.Args[0]) {
			return erfcCall{call, call.Args[0]}, true
		}
	}
	return erfcCall{}, false
}

// leadingMinus reports whether e is -x, or a product or quotient whose
// leftmost factor is: -(a-m)/s negates the whole.
func leadingMinus(e ast.Expr) bool {
	switch e := e.(type) {
	case *ast.UnaryExpr:
		return e.Op == token.SUB
	case *ast.BinaryExpr:
		return (e.Op == token.MUL || e.Op == token.QUO) && leadingMinus(e.X)
	}
	return false
}

// complement returns P, through variables, where n is 1 - P or the
// scaled c - c*P (a two-sided tail 2 - 2*P).
func (c *checker) complement(n *ast.BinaryExpr) (ast.Expr, bool) {
	if c.isOne(n.X) {
		p, _ := c.through(n.Y)
		return p, true
	}
	k := c.pass.TypesInfo.Types[n.X].Value
	m, ok := ast.Unparen(n.Y).(*ast.BinaryExpr)
	if k == nil || !ok || m.Op != token.MUL {
		return nil, false
	}
	if v := c.pass.TypesInfo.Types[m.X].Value; v != nil && constant.Compare(v, token.EQL, k) {
		p, _ := c.through(m.Y)
		return p, true
	}
	return nil, false
}

// atanh reports math.Log((1+x)/(1-x)), twice the inverse hyperbolic
// tangent: for small x the ratio is 1+2x rounded, so the logarithm keeps
// only about log10(1/|x|) fewer digits than x has; 2*math.Atanh(x) keeps
// them. It reports whether the call had that shape.
func (c *checker) atanh(cur inspector.Cursor, call *ast.CallExpr) bool {
	arg, indirect := c.through(call.Args[0])
	q, ok := arg.(*ast.BinaryExpr)
	if !ok || q.Op != token.QUO {
		return false
	}
	num, viaNum := c.through(q.X) // div := 1 + x; math.Log((1-x)/div)
	den, viaDen := c.through(q.Y)
	x, neg, okx := c.onePlus(num)
	y, negy, oky := c.onePlus(den)
	if !okx || !oky || neg == negy || !same(x, y) {
		return false
	}
	if !c.lossShows(cur, x, 1.0/boundedLoss, halfDigits) {
		return true
	}
	text := "2*" + qualifier(call) + ".Atanh(" + fixes.Source(c.pass.Fset, ast.Unparen(x)) + ")"
	if neg {
		text = "-" + text // log((1-x)/(1+x)) = -2·atanh(x)
	}
	if _, inOperation := cur.Parent().Node().(*ast.BinaryExpr); inOperation {
		text = "(" + text + ")"
	}
	d := analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catLog1p,
		Message: fmt.Sprintf("math.Log((1+x)/(1-x))%s returns 0 for |x| below %.3g, where the ratio rounds to 1, and loses about log10(1/|x|) digits for small x; use 2*math.Atanh(x)",
			binding("x", x), unitRoundoff/2),
	}
	if indirect || viaNum || viaDen {
		fixes.Report(c.pass, d) // a term is held in a variable: x may have changed since
		return true
	}
	fixes.Report(c.pass, d, fixes.Judgement("Replace with "+text, fixes.Replace(call, text)))
	return true
}

// softplus reports math.Log(1+math.Exp(y)): e^y overflows to +Inf for y
// above 709.78, where the result is about y, and 1+e^y rounds to 1 for y
// below ln(u) ≈ -36.7, where the result is about e^y; a sum does not hide
// an infinity, so the rule ignores the terms around it. The shifted form
// max(y,0) + log1p(e^-|y|) is accurate for every y. Where y's range at
// cur lies within [-ln(boundedLoss), 709.78] neither happens, and 1+e^y
// loses at most two digits of e^y.
func (c *checker) softplus(cur inspector.Cursor, call *ast.CallExpr, y ast.Expr) {
	if r, _ := c.spans.At(cur, y); r.Lo >= -math.Log(boundedLoss) && r.Hi <= expOverflow {
		return // e^y at least 1/boundedLoss: log(1+e^y) loses at most two digits, and cannot overflow
	}
	d := analysis.Diagnostic{
		Pos: call.Pos(), End: call.End(), Category: catLogSumExp,
		Message: fmt.Sprintf("math.Log(1+math.Exp(y))%s overflows to +Inf for y above %.6g, where the result is about y, and returns 0 for y below %.3g, where 1+e^y rounds to 1; use math.Max(y, 0) + math.Log1p(math.Exp(-math.Abs(y)))",
			binding("y", y), expOverflow, math.Log(unitRoundoff)),
	}
	if !fixes.Pure(c.pass.TypesInfo, y) {
		fixes.Report(c.pass, d) // the fix would evaluate y twice
		return
	}
	q, ys := qualifier(call), fixes.Source(c.pass.Fset, ast.Unparen(y))
	text := fmt.Sprintf("%s.Max(%s, 0) + %[1]s.Log1p(%[1]s.Exp(-%[1]s.Abs(%[2]s)))", q, ys)
	if _, inOperation := cur.Parent().Node().(*ast.BinaryExpr); inOperation {
		text = "(" + text + ")"
	}
	// Needs review: the forms agree at ±Inf and NaN, but differ in the last
	// bits where nothing overflows.
	fixes.Report(c.pass, d, fixes.Judgement("Shift by the larger of y and 0", fixes.Replace(call, text)))
}

// farReaching reports whether e is computed by an operation that reaches
// magnitudes beyond 1e154 or below 1e-154 from ordinary inputs: a quotient
// by a variable that may be small (not one whose range by construction
// excludes 0, such as math.Sqrt(1 - k*s*s) with k < 1 and s a sine), an
// exponential, power, gamma,
// tangent or hyperbolic function, or a constant already out there;
// directly, through sums, products and signs, or through never-reassigned
// variables, unless an enclosing condition at cur compares a variable on
// the way (if r <= 0 { return }; if r >= 1 { return }). Squares of data
// (coordinates, differences, fields) reach
// those magnitudes only if the data do, which physical and geometric data
// do not; there math.Hypot would only cost accuracy (0.35 against 0.17 ulp
// on average).
func (c *checker) farReaching(cur inspector.Cursor, e ast.Expr, depth int) bool {
	if _, isIdent := ast.Unparen(e).(*ast.Ident); isIdent && c.guarded(cur, e, c.compares) {
		return false // a variable whose range an enclosing condition checked
	}
	e, _ = c.through(e)
	if v := c.pass.TypesInfo.Types[e].Value; v != nil {
		f, _ := constant.Float64Val(constant.ToFloat(v))
		return f != 0 && (math.Abs(f) > 1e100 || math.Abs(f) < 1e-100)
	}
	if depth == 0 {
		return false
	}
	switch e := e.(type) {
	case *ast.CallExpr:
		switch c.mathFunc(e) {
		case "Exp", "Exp2", "Gamma", "Tan", "Cosh", "Sinh":
			return true
		}
		return c.mathFunc2(e) == "Pow" || c.mathFunc2(e) == "Ldexp"
	case *ast.UnaryExpr:
		return c.farReaching(cur, e.X, depth-1)
	case *ast.BinaryExpr:
		if e.Op == token.QUO && !c.isConst(e.Y) && !c.awayFromZeroRange(cur, e.Y) {
			return true // a divisor that may come near 0
		}
		return c.farReaching(cur, e.X, depth-1) || c.farReaching(cur, e.Y, depth-1)
	}
	return false
}

// awayFromZeroRange reports whether e's range by construction (rangeOf)
// excludes 0: A/math.Sqrt(1 - k*s*s) with k < 1 and s a sine is at most
// A/math.Sqrt(1-k), however the angle falls.
func (c *checker) awayFromZeroRange(cur inspector.Cursor, e ast.Expr) bool {
	r, _ := c.spans.At(cur, e)
	return r.Lo > 0 || r.Hi < 0
}

// computed reports whether e, at cur, directly or through variables (the
// value last assigned before cur, or else every value assigned), is the result of arithmetic or of a call rather than an input
// (a parameter, a field, an element, a constant). A computed c carries a
// relative error of a rounding, so 1 - c*c has an absolute error of about
// 2u near |c| = 1 however it is formed: (1-c)*(1+c) gains only for exact
// inputs.
func (c *checker) computed(cur inspector.Cursor, e ast.Expr) bool {
	return c.computedDepth(cur, e, 3, nil)
}

// computedOrSquare is computed, with a constant whose square is exact
// (1.0, 0.5, 3) also accepted among the values a variable is given: on
// that path a*a - b*b and (a-b)*(a+b) are both exact, so the
// factorisation gains nothing there either (sa = 1 on one branch, a
// computed sa on the other).
func (c *checker) computedOrSquare(cur inspector.Cursor, e ast.Expr) bool {
	return c.computedDepth(cur, e, 3, squareExact)
}

// squareExact reports whether the float64 square of the constant v is
// exact.
func squareExact(v constant.Value) bool {
	f, _ := constant.Float64Val(constant.ToFloat(v))
	exact := new(big.Float).SetPrec(106).SetFloat64(f)
	return exact.Mul(exact, exact).Cmp(new(big.Float).SetFloat64(f*f)) == 0
}

func (c *checker) computedDepth(cur inspector.Cursor, e ast.Expr, depth int, exactSquare func(constant.Value) bool) bool {
	e, _ = c.through(e)
	switch e := e.(type) {
	case *ast.BinaryExpr, *ast.CallExpr:
		return !c.isConst(e)
	case *ast.UnaryExpr:
		return depth > 0 && c.computedDepth(cur, e.X, depth-1, exactSquare)
	case *ast.Ident:
		if v, ok := c.pass.TypesInfo.Uses[e].(*types.Var); ok && depth > 0 {
			if rhs, ok := consume.Reaching(c.pass.TypesInfo, cur, v); ok {
				return c.computedDepth(rhs, rhs.Node().(ast.Expr), depth-1, exactSquare) || c.accepted(rhs.Node().(ast.Expr), exactSquare)
			}
		}
		return depth > 0 && c.assignedComputed(e, depth-1, exactSquare)
	}
	return false
}

// assignedComputed reports whether the local variable id is assigned, and
// every value assigned to it in its function is computed (ack = (at+1)*raz
// in one place, ack = ... in another).
func (c *checker) assignedComputed(id *ast.Ident, depth int, exactSquare func(constant.Value) bool) bool {
	v, ok := c.pass.TypesInfo.Uses[id].(*types.Var)
	if !ok || v.Parent() == nil || v.Parent() == c.pass.Pkg.Scope() {
		return false
	}
	cur, ok := c.insp.Root().FindNode(id)
	if !ok {
		return false
	}
	n := 0
	for fn := range cur.Enclosing((*ast.FuncDecl)(nil), (*ast.FuncLit)(nil)) {
		for a := range fn.Preorder((*ast.AssignStmt)(nil)) {
			as := a.Node().(*ast.AssignStmt)
			for i, lhs := range as.Lhs {
				if l, isIdent := lhs.(*ast.Ident); !isIdent || c.pass.TypesInfo.ObjectOf(l) != v {
					continue
				}
				if len(as.Rhs) != len(as.Lhs) || as.Tok != token.ASSIGN && as.Tok != token.DEFINE {
					return false
				}
				if _, isIdent := ast.Unparen(as.Rhs[i]).(*ast.Ident); isIdent || !c.computedDepth(a, as.Rhs[i], depth, exactSquare) && !c.accepted(as.Rhs[i], exactSquare) {
					return false
				}
				n++
			}
		}
		break
	}
	return n > 0
}

// accepted reports whether e is a constant that accept, if given, takes
// for a computed value.
func (c *checker) accepted(e ast.Expr, accept func(constant.Value) bool) bool {
	v := c.pass.TypesInfo.Types[e].Value
	return accept != nil && v != nil && v.Kind() != constant.Complex && accept(v)
}

// turnFraction reports whether x is built only from constants and whole
// numbers by products and quotients, directly or through never-reassigned
// variables: an angle step c·i/n (2πi/(n-1) of a window, a quarter turn
// over a segment count). It is 0 or at least |c|/n, so cos(x) rounds to 1
// only for counts beyond 10^8·|c|, and 1-cos(x) keeps an absolute error of
// one rounding of 1, the scale of such weights and sagittas.
func (c *checker) turnFraction(x ast.Expr, depth int) bool {
	ok, counts := c.ratioOfCounts(x, depth)
	return ok && counts
}

// ratioOfCounts reports whether x is built from constants and whole
// numbers by products and quotients (ok), and whether a whole number is
// among them (counts).
func (c *checker) ratioOfCounts(x ast.Expr, depth int) (ok, counts bool) {
	x, _ = c.through(x)
	switch {
	case c.wholeNumber(x):
		return true, true
	case c.isConst(x):
		return true, false
	case depth == 0:
		return false, false
	}
	switch e := x.(type) {
	case *ast.UnaryExpr:
		return c.ratioOfCounts(e.X, depth-1)
	case *ast.BinaryExpr:
		if e.Op != token.MUL && e.Op != token.QUO {
			return false, false
		}
		okx, cx := c.ratioOfCounts(e.X, depth-1)
		oky, cy := c.ratioOfCounts(e.Y, depth-1)
		return okx && oky, cx || cy
	case *ast.SelectorExpr:
		vals, all := c.fieldValues(e) // a field every assignment of which is such a ratio
		for _, v := range vals {
			okv, cv := c.ratioOfCounts(v, depth-1)
			all, counts = all && okv, counts || cv
		}
		return all, counts
	}
	return false, false
}

// commonShift reports whether a and b are both differences with the same
// subtrahend (l1 - m, l2 - m): the log-sum-exp already shifted, by the
// larger value when m is their maximum, so neither exponential overflows.
func (c *checker) commonShift(a, b ast.Expr) bool {
	da, oka := ast.Unparen(a).(*ast.BinaryExpr)
	db, okb := ast.Unparen(b).(*ast.BinaryExpr)
	return oka && okb && da.Op == token.SUB && db.Op == token.SUB && same(da.Y, db.Y)
}
