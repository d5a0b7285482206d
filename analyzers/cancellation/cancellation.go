package cancellation

import (
	_ "embed"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"
	"slices"
	"strings"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/passes/inspect"
	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/absval"
	"roundoff/analyzers/internal/analyzerdoc"
	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/consume"
	"roundoff/analyzers/internal/degree"
	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/span"
	"roundoff/analyzers/internal/vecshape"
	"roundoff/internal/numeric"
)

//go:embed doc.go
var doc string

// Analyzer reports expressions that lose digits to cancellation, overflow
// or underflow where the math package has an accurate form.
var Analyzer = &analysis.Analyzer{
	Name:     "cancellation",
	Doc:      analyzerdoc.Extract(doc, "cancellation"),
	URL:      "docs/cancellation.md",
	Requires: []*analysis.Analyzer{inspect.Analyzer, constval.Analyzer, absval.Analyzer, vecshape.Analyzer},
	Run:      run,
}

// Categories of diagnostics, one per rewrite.
const (
	catLog1p      = "log1p"
	catExpm1      = "expm1"
	catCosine     = "cosine"
	catHypot      = "hypot"
	catLogSumExp  = "logsumexp"
	catRadical    = "radical"
	catArc        = "arc"
	catSquares    = "squares"
	catTail       = "tail"
	catVariance   = "variance"
	catDivided    = "divided"
	catShare      = "share"
	catRoundTrip  = "roundtrip"
	catSplit      = "split"
	catBigFloat   = "bigfloat"
	catMoments    = "moments"
	catGammaRatio = "gammaratio"
	catResidual   = "residual"
)

// The magnitudes the messages quote, derived from the binary64 format
// (IEEE 754-2019): 1+x rounds to 1 for |x| up to the unit roundoff u;
// cos(x) rounds to 1 below sqrt(u); squares overflow above
// sqrt(MaxFloat64) and leave the normal range below 2^-511; exp overflows
// above log(MaxFloat64) and rounds to 0 below log(2^-1075).
var (
	unitRoundoff  = numeric.Float64.U
	cosFlat       = math.Sqrt(numeric.Float64.U)
	halfDigits    = cosFlat                   // |x| from which log(1+x), e^x - 1 and kin keep half their digits
	cosHalfDigits = math.Sqrt(2 * halfDigits) // the same for 1 - cos x, about x²/2
	squareMax     = math.Sqrt(math.MaxFloat64)
	squareNormal  = math.Sqrt(0x1p-1022)
	expOverflow   = math.Log(math.MaxFloat64)
	expUnderflows = -1075 * math.Ln2 // log(2^-1075); math.Log of a subnormal is inexact on amd64
)

// checker holds what one run needs.
type checker struct {
	pass  *analysis.Pass
	insp  *inspector.Inspector
	decls map[types.Object]ast.Expr // never-reassigned variables and their initial values
	abs   *absval.Known             // absolute-value functions, by meaning
	spans *span.Reader              // ranges of values, from construction and conditions
	acc   *accumulation             // how variables are updated, scanned when first needed
	deg   *degree.Reader            // directions and cosines of vectors, made when first needed

	wrappers  map[*types.Func]string      // the package's own wrappers of math functions, by mathName
	fields    map[types.Object][]ast.Expr // values assigned to the package's fields, by fieldValues
	bodies    map[*types.Func]ast.Expr    // what the package's functions return, by returned
	lgammas   map[types.Object]ast.Expr   // variables set once by math.Lgamma, and its argument, by lgammaArg
	unbounded map[types.Object]bool       // fields the package takes as unbounded, by unboundedData
	selectors map[*types.Func]bool        // the package's functions that return one of their parameters
	used      map[string]bool             // math functions the package calls, by usesMath
	taken     []taking                    // subtractions from sum fields, by noteUpdate
	added     map[types.Object]ast.Node   // sum fields added into, at their first addition, by noteUpdate
}

func run(pass *analysis.Pass) (any, error) {
	insp := pass.ResultOf[inspect.Analyzer].(*inspector.Inspector)
	c := &checker{pass: pass, insp: insp, decls: constval.DeclsOf(pass), abs: absval.Of(pass)}
	c.spans = span.New(pass.TypesInfo, insp, c.decls, c.abs)
	for file := range insp.Root().Children() {
		if strings.HasSuffix(pass.Fset.File(file.Node().Pos()).Name(), "_test.go") {
			continue // a test's arguments come from its own table of cases
		}
		for cur := range file.Preorder((*ast.CallExpr)(nil), (*ast.BinaryExpr)(nil), (*ast.AssignStmt)(nil)) {
			switch n := cur.Node().(type) {
			case *ast.AssignStmt:
				c.noteUpdate(cur, n)
				c.shoelace(cur, n)
				if n.Tok == token.QUO_ASSIGN && len(n.Lhs) == 1 {
					c.expShare(cur, n.Lhs[0], n.Rhs[0], n)
				}
			case *ast.CallExpr:
				c.call(cur, n)
			case *ast.BinaryExpr:
				switch n.Op {
				case token.SUB:
					c.sums(cur, n)
					c.difference(cur, n)
					c.roundTrip(cur, n)
					c.splitReduction(cur, n)
				case token.ADD:
					c.sums(cur, n)
					c.roundTrip(cur, n)
					c.lowerTail(cur, n)
					c.opposite(cur, n)
				case token.QUO:
					c.dividedDifference(n)
					c.expRatio(cur, n)
					c.expShare(cur, n.X, n.Y, n)
				}
				c.radical(cur, n)
			}
		}
	}
	c.downdates()
	return nil, nil
}

// call examines math.Log and math.Sqrt calls, and big.Float differences.
func (c *checker) call(cur inspector.Cursor, call *ast.CallExpr) {
	c.bigProducts(cur, call)
	switch name := c.mathFunc(call); name {
	case "Log", "Log10", "Log2":
		if name != "Log" || !c.logSumExp(cur, call) && !c.atanh(cur, call) && !c.logistic(cur, call) {
			c.log1p(cur, call, name)
		}
		c.logOfRatio(cur, call, name)
		if name == "Log" {
			c.logExpSum(cur, call)
			c.logCosine(cur, call)
		}
	case "Sqrt":
		c.hypot(cur, call)
	case "Acos":
		c.acos(cur, call, name)
	case "":
		if c.mathFunc2(call) == "Pow" {
			c.pnorm(cur, call)
		}
		switch wrapped := c.mathName(call); wrapped {
		case "Acos":
			c.acos(cur, call, "Acos") // a package's own wrapper: reported, with no fix
		case "Log", "Log10", "Log2":
			c.logOfRatio(cur, call, wrapped)
		}
	}
}

// difference examines x-1 and 1-x where x is math.Exp, math.Cos or
// math.Pow, directly or through a variable that holds it.
func (c *checker) difference(cur inspector.Cursor, n *ast.BinaryExpr) {
	call, one := n.X, n.Y
	if c.isOne(n.X) {
		call, one = n.Y, n.X
	}
	if c.gram(cur, n) || c.residual(cur, n) || c.squares(cur, n) || c.variance(n) || c.covariance(n) || c.share(cur, n) || c.logRatio(cur, n) || c.overlapComplement(cur, n) || c.scaledLogistic(cur, n) {
		return
	}
	e, indirect := c.through(call)
	if c.isOne(one) && !c.addend(cur, 2) {
		switch {
		case c.normCosine(e):
			c.dotCosine(n, e, "a cosine computed as a ratio over norms")
			return
		case c.vectorCosine(cur, call):
			c.dotCosine(n, e, "the cosine of the angle between two vectors")
			return
		}
	}
	if p, ok := c.complement(n); ok && c.upperTail(n, p) {
		return
	}
	if q, isQuo := e.(*ast.BinaryExpr); isQuo && q.Op == token.QUO && c.isOne(q.X) && c.isOne(one) {
		if cos, isCall := ast.Unparen(q.Y).(*ast.CallExpr); isCall && c.mathFunc(cos) == "Cos" {
			c.secant(cur, n, cos, one == n.X, indirect)
		}
		return
	}
	inner, ok := e.(*ast.CallExpr)
	if !ok || !c.isOne(one) {
		return // not a difference with the constant 1
	}
	switch c.mathFunc(inner) {
	case "Exp":
		c.expm1(cur, n, inner, one == n.X, indirect)
	case "Cos":
		c.cosine(cur, n, inner, one == n.X, indirect)
	}
	if c.mathFunc2(inner) == "Pow" {
		c.powm1(cur, n, inner, one == n.X, indirect)
	}
}

// mathFunc returns the name of the math package function call calls,
// with one argument of type float64, or "".
func (c *checker) mathFunc(call *ast.CallExpr) string {
	return c.mathFuncOf(call, 1)
}

// mathFuncOf returns the name of the math package function call calls
// with n arguments, named through the package (a dot import leaves the
// fixes no package to name), or "".
func (c *checker) mathFuncOf(call *ast.CallExpr, n int) string {
	if _, ok := call.Fun.(*ast.SelectorExpr); !ok || len(call.Args) != n {
		return ""
	}
	return provenance.MathCallee(c.pass.TypesInfo, call)
}

// mathName returns the name of the math package function of one float64
// argument that call calls, directly or through a function of the
// package whose body only returns that function of its parameter
// (func acos(x float64) float64 { return math.Acos(x) }), or "".
func (c *checker) mathName(call *ast.CallExpr) string {
	if name := c.mathFunc(call); name != "" {
		return name
	}
	fn, ok := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func)
	if !ok || fn.Pkg() != c.pass.Pkg || len(call.Args) != 1 {
		return ""
	}
	if c.wrappers == nil {
		c.wrappers = wrappersOf(c.pass)
	}
	return c.wrappers[fn]
}

// wrappersOf maps each function of the package whose body is only
// return math.F(x), x its one parameter, to F.
func wrappersOf(pass *analysis.Pass) map[*types.Func]string {
	m := make(map[*types.Func]string)
	for _, f := range pass.Files {
		for _, d := range f.Decls {
			fd, ok := d.(*ast.FuncDecl)
			if !ok || fd.Recv != nil || fd.Body == nil || len(fd.Body.List) != 1 || fd.Type.Params.NumFields() != 1 {
				continue
			}
			ret, ok := fd.Body.List[0].(*ast.ReturnStmt)
			if !ok || len(ret.Results) != 1 {
				continue
			}
			call, ok := ret.Results[0].(*ast.CallExpr)
			if !ok || len(call.Args) != 1 || len(fd.Type.Params.List[0].Names) != 1 {
				continue
			}
			param := pass.TypesInfo.Defs[fd.Type.Params.List[0].Names[0]]
			fn, isFunc := typeutil.Callee(pass.TypesInfo, call).(*types.Func)
			if id, isIdent := ast.Unparen(call.Args[0]).(*ast.Ident); isIdent && pass.TypesInfo.Uses[id] == param &&
				isFunc && fn.Pkg() != nil && fn.Pkg().Path() == "math" {
				m[pass.TypesInfo.Defs[fd.Name].(*types.Func)] = fn.Name()
			}
		}
	}
	return m
}

// mathFunc2 returns the name of the math package function call calls
// with two arguments, or "".
func (c *checker) mathFunc2(call *ast.CallExpr) string {
	return c.mathFuncOf(call, 2)
}

// absArg returns x when call computes |x|, by math.Abs or any function
// that does (a float32 library's Abs, a package's own helper).
func (c *checker) absArg(call *ast.CallExpr) (ast.Expr, bool) {
	return c.abs.Arg(c.pass.TypesInfo, c.decls, call)
}

// qualifier returns the name by which call refers to package math.
func qualifier(call *ast.CallExpr) string {
	return types.ExprString(call.Fun.(*ast.SelectorExpr).X)
}

// isOne reports whether e is the constant 1.
func (c *checker) isOne(e ast.Expr) bool {
	tv, ok := c.pass.TypesInfo.Types[e]
	return ok && tv.Value != nil && constant.Compare(tv.Value, token.EQL, constant.MakeInt64(1))
}

// isConst reports whether e is a constant expression.
func (c *checker) isConst(e ast.Expr) bool {
	tv, ok := c.pass.TypesInfo.Types[e]
	return ok && tv.Value != nil
}

// wholeNumber reports whether e is a conversion of an integer to a float:
// such a value is 0 or at least 1 in magnitude, never small.
func (c *checker) wholeNumber(e ast.Expr) bool {
	conv, ok := ast.Unparen(e).(*ast.CallExpr)
	if !ok || len(conv.Args) != 1 || !c.pass.TypesInfo.Types[conv.Fun].IsType() {
		return false
	}
	t := c.pass.TypesInfo.TypeOf(conv.Args[0])
	if t == nil {
		return false // ill-typed
	}
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&types.IsInteger != 0
}

// lossShows reports whether the digits that the expression at cur loses
// when its argument x is small can reach a result: x may be small (it is
// not a constant, a whole number or a uniform random draw; its range, by
// construction, conditions or calls, does not keep |x| at or above least,
// the size from which the form loses at most two digits (boundedAway;
// none for least 0, where the rule judges the range itself); and no
// enclosing condition splits the range at split or above, or at a
// threshold held in a variable: an author who handles small x apart has
// judged the loss above the split, but not one that leaves more than half
// the digits to it, as a split at 1e-10 before 1 - cos x does, where the
// cosine rounds to 1), and the value is not added
// to another term, which hides a relative error in a small value, nor only
// the slope of a Newton update of x (newtonSlope), which the root does not
// depend on.
func (c *checker) lossShows(cur inspector.Cursor, x ast.Expr, least, split float64) bool {
	return !c.isConst(x) && !c.wholeNumber(x) && !c.uniformDraw(cur, x) &&
		(!c.addend(cur, 2) || c.dividedByFactor(cur, x)) && !c.guarded(cur, x, c.awayBy(split)) && !(least > 0 && c.boundedAway(cur, x, least)) &&
		!c.newtonSlope(cur, x) && !consume.Threshold(c.pass.TypesInfo, cur)
}

// dividedByFactor reports whether the value at cur, carried through
// products, signs and parentheses, is divided by a factor of x, or by a
// function that vanishes like it (sin, tan, their inverses and hyperbolic
// kin, expm1, log1p of a factor, also held in a variable, as last
// assigned before the division): log(1+a·m)/a,
// (exp(a·m)-1)/a and log(cos x)/tan(x) stay of the size of m or x as a or
// x shrinks, so the term is not small while its rounding error, about
// u/|a|, grows: a sum does not hide it.
func (c *checker) dividedByFactor(cur inspector.Cursor, x ast.Expr) bool {
	for ; ; cur = cur.Parent() {
		switch p := cur.Parent().Node().(type) {
		case *ast.ParenExpr, *ast.UnaryExpr:
		case *ast.BinaryExpr:
			if p.Op == token.QUO && p.X == cur.Node() {
				by, _ := c.through(p.Y)
				if id, ok := by.(*ast.Ident); ok {
					if v, ok := c.pass.TypesInfo.Uses[id].(*types.Var); ok {
						if rhs, ok := consume.Reaching(c.pass.TypesInfo, cur, v); ok {
							by = ast.Unparen(rhs.Node().(ast.Expr)) // t = math.Tan(x) last before the division
						}
					}
				}
				if call, ok := by.(*ast.CallExpr); ok && vanishesLinearly[c.mathFunc(call)] {
					by = call.Args[0] // tan(x) ~ x near 0
				}
				return slices.ContainsFunc(factorsOf(x), func(f ast.Expr) bool { return (same(f, p.Y) || same(f, by)) && !c.isConst(f) })
			}
			if p.Op != token.MUL {
				return false
			}
		default:
			return false
		}
	}
}

// vanishesLinearly lists the math functions f with f(0) = 0 and f'(0) ≠ 0:
// near 0 they are proportional to their argument.
var vanishesLinearly = map[string]bool{"Sin": true, "Tan": true, "Sinh": true, "Tanh": true, "Asin": true, "Atan": true, "Asinh": true, "Atanh": true, "Expm1": true, "Log1p": true}

// factorsOf returns the factors of a product e (a*b*c: a, b, c).
func factorsOf(e ast.Expr) []ast.Expr {
	if m, ok := ast.Unparen(e).(*ast.BinaryExpr); ok && m.Op == token.MUL {
		return append(factorsOf(m.X), factorsOf(m.Y)...)
	}
	return []ast.Expr{ast.Unparen(e)}
}

// boundedAway reports whether x's range at cur (span.Reader.At: by
// construction, as of the golden-section ratio (3 - math.Sqrt(5))/2, by
// the conditions under which cur runs, as in the else branch of
// if x < 0.05, or by every call of its function) keeps |x| at or above
// least: 1/boundedLoss for log(1 ± x) and exp(x) - 1, which lose about
// log10(1/|x|) digits, so that they lose at most two. A whole number
// scaled by a constant (float64(q)/10, the exponent of a decibel table)
// is 0, where every form here is exact (a^0 - 1, e^0 - 1, log(1 + 0) are
// 0), or at least the scale: that gap counts as the range.
func (c *checker) boundedAway(cur inspector.Cursor, x ast.Expr, least float64) bool {
	if g, ok := c.wholeGap(x); ok && g >= least {
		return true
	}
	r, _ := c.spans.At(cur, x)
	lo, _ := r.Magnitude()
	return lo >= least
}

// wholeGap returns g when e is 0 or at least g in magnitude: a whole
// number (wholeNumber) times or over a nonzero constant.
func (c *checker) wholeGap(e ast.Expr) (float64, bool) {
	b, ok := ast.Unparen(e).(*ast.BinaryExpr)
	if !ok || b.Op != token.QUO && b.Op != token.MUL {
		return 0, false
	}
	w, k := b.X, b.Y
	if b.Op == token.MUL && c.isConst(w) {
		w, k = k, w
	}
	tv := c.pass.TypesInfo.Types[k]
	if !c.wholeNumber(w) || tv.Value == nil || constant.Sign(tv.Value) == 0 {
		return 0, false
	}
	kv, _ := constant.Float64Val(constant.ToFloat(tv.Value))
	if b.Op == token.QUO {
		return 1 / math.Abs(kv), true
	}
	return math.Abs(kv), true
}

// addend reports whether the value at cur, carried through products,
// quotients, signs and parentheses, is added to or subtracted from another
// term, directly or (depth permitting) through a variable every use of
// which is such a term. A term multiplied by a large coefficient is not
// hidden by the sum: its absolute error grows with the coefficient (see
// large).
func (c *checker) addend(cur inspector.Cursor, depth int) bool {
	for ; ; cur = cur.Parent() {
		switch p := cur.Parent().Node().(type) {
		case *ast.ParenExpr:
		case *ast.UnaryExpr:
			if p.Op != token.SUB && p.Op != token.ADD {
				return false
			}
		case *ast.BinaryExpr:
			switch p.Op {
			case token.ADD, token.SUB:
				return true
			case token.MUL:
				other := p.X
				if other == cur.Node() {
					other = p.Y
				}
				if c.large(other) {
					return false // n * term: the coefficient scales the term's error
				}
			case token.QUO:
				if p.X != cur.Node() && c.large(p.X) {
					return false // k / term: the coefficient scales the error as well
				}
			default:
				return false
			}
		case *ast.AssignStmt:
			if p.Tok == token.ADD_ASSIGN || p.Tok == token.SUB_ASSIGN {
				return true
			}
			return depth > 0 && len(p.Lhs) == 1 && c.usedAsAddend(cur.Parent(), p.Lhs[0], depth-1)
		default:
			return false
		}
	}
}

// largeCoefficient is the size from which a constant coefficient makes
// the term's error visible in a sum of terms of unit size: the term's
// absolute error of one rounding becomes |k| roundings, two significant
// digits at |k| = 100 (common practice).
const largeCoefficient = 100

// large reports whether e, a factor of a term, is a large coefficient: a
// constant of magnitude at least largeCoefficient, or a count converted
// from an integer (float64(n-k), the number of observations), which grows
// with the data while the terms it multiplies do not.
func (c *checker) large(e ast.Expr) bool {
	if v := c.pass.TypesInfo.Types[e].Value; v != nil {
		f, _ := constant.Float64Val(constant.ToFloat(v))
		return math.Abs(f) >= largeCoefficient
	}
	return c.wholeNumber(e)
}

// usedAsAddend reports whether the variable assigned by the statement at
// assign is used, and every use in the enclosing function is an addend.
func (c *checker) usedAsAddend(assign inspector.Cursor, lhs ast.Expr, depth int) bool {
	id, ok := lhs.(*ast.Ident)
	obj := c.pass.TypesInfo.ObjectOf(id)
	if !ok || obj == nil {
		return false
	}
	var body inspector.Cursor
	for f := range assign.Enclosing((*ast.FuncDecl)(nil), (*ast.FuncLit)(nil)) {
		body = f
		break
	}
	if !body.Valid() || body.Node() == nil {
		return false
	}
	uses := 0
	for u := range body.Preorder((*ast.Ident)(nil)) {
		if c.pass.TypesInfo.Uses[u.Node().(*ast.Ident)] != obj {
			continue
		}
		if u.Node() == lhs {
			continue // the assignment being followed
		}
		if u.ParentEdgeKind() == edge.AssignStmt_Lhs || !c.addend(u, depth) {
			return false // assigned again, or used other than as a term of a sum
		}
		uses++
	}
	return uses > 0
}

// uniformDraw reports whether x is a draw from math/rand/v2's or
// math/rand's Float64 (or Float32), called directly or through a local
// function variable only ever set to one: v2 draws are multiples of 2^-53,
// for which 1-x is exact, and a draw small enough to lose digits in 1+x
// comes up with a probability of that size.
func (c *checker) uniformDraw(cur inspector.Cursor, x ast.Expr) bool {
	call, ok := ast.Unparen(x).(*ast.CallExpr)
	if !ok || len(call.Args) != 0 {
		return false
	}
	if isDraw(typeutil.Callee(c.pass.TypesInfo, call)) {
		return true
	}
	id, ok := ast.Unparen(call.Fun).(*ast.Ident)
	if !ok {
		return false
	}
	v, ok := c.pass.TypesInfo.Uses[id].(*types.Var)
	return ok && c.onlyDraws(cur, v)
}

// onlyDraws reports whether every value assigned to the function variable
// v in the function enclosing cur is a random draw function.
func (c *checker) onlyDraws(cur inspector.Cursor, v *types.Var) bool {
	assigned := 0
	for f := range cur.Enclosing((*ast.FuncDecl)(nil), (*ast.FuncLit)(nil)) {
		for a := range f.Preorder((*ast.AssignStmt)(nil)) {
			as := a.Node().(*ast.AssignStmt)
			for i, lhs := range as.Lhs {
				id, ok := lhs.(*ast.Ident)
				if !ok || c.pass.TypesInfo.ObjectOf(id) != v {
					continue
				}
				if len(as.Rhs) != len(as.Lhs) || !isDraw(c.funcValue(as.Rhs[i])) {
					return false
				}
				assigned++
			}
		}
		break
	}
	return assigned > 0
}

// funcValue returns the function or method that e, a function value such
// as rand.Float64 or r.Float64, denotes.
func (c *checker) funcValue(e ast.Expr) types.Object {
	switch e := ast.Unparen(e).(type) {
	case *ast.SelectorExpr:
		if sel := c.pass.TypesInfo.Selections[e]; sel != nil {
			return sel.Obj()
		}
		return c.pass.TypesInfo.Uses[e.Sel]
	case *ast.Ident:
		return c.pass.TypesInfo.Uses[e]
	}
	return nil
}

// isDraw reports whether obj is the Float64 or Float32 function or method
// of math/rand or math/rand/v2.
func isDraw(obj types.Object) bool {
	fn, ok := obj.(*types.Func)
	if !ok || fn.Pkg() == nil {
		return false
	}
	path := fn.Pkg().Path()
	return (path == "math/rand" || path == "math/rand/v2") && (fn.Name() == "Float64" || fn.Name() == "Float32")
}

// binding returns " with x = <source>, y = <source>" for the given names
// and expressions, leaving out a name bound to itself and sources too long
// for a one-line message.
func binding(names string, es ...ast.Expr) string {
	var parts []string
	for i, e := range es {
		name, src := names[i:i+1], types.ExprString(ast.Unparen(e))
		if src != name && len(src) <= 40 {
			parts = append(parts, name+" = "+src)
		}
	}
	if len(parts) == 0 {
		return ""
	}
	return " with " + strings.Join(parts, ", ")
}

// enclosingFunc returns the innermost function declaration or literal
// around cur.
func enclosingFunc(cur inspector.Cursor) (inspector.Cursor, bool) {
	for f := range cur.Enclosing((*ast.FuncDecl)(nil), (*ast.FuncLit)(nil)) {
		return f, true
	}
	return inspector.Cursor{}, false
}
