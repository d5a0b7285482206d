package epsfloor

import (
	_ "embed"
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"path/filepath"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/passes/inspect"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/absval"
	"roundoff/analyzers/internal/analyzerdoc"
	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/degree"
	"roundoff/analyzers/internal/lazyssa"
	"roundoff/analyzers/internal/portable"
	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/readonly"
	"roundoff/analyzers/internal/tolerance"
	"roundoff/analyzers/internal/vecshape"
	"roundoff/internal/numeric"
)

//go:embed doc.go
var doc string

// Analyzer reports tolerances below what the float type can resolve.
var Analyzer = &analysis.Analyzer{
	Name:      "epsfloor",
	Doc:       analyzerdoc.Extract(doc, "epsfloor"),
	URL:       "docs/epsfloor.md",
	Requires:  []*analysis.Analyzer{inspect.Analyzer, constval.Analyzer, absval.Analyzer, lazyssa.Analyzer, portable.Analyzer, vecshape.Analyzer, readonly.Analyzer},
	Run:       run,
	FactTypes: []analysis.Fact{new(tolerance.ParamsFact[use]), new(tolerance.FieldFact[use])},
}

// Categories of diagnostics.
const (
	catRelative  = "relative"
	catAbsolute  = "absolute"
	catSubnormal = "subnormal"
	catIterate   = "iterate"
	catAbsorbed  = "absorbed"
	catOverflow  = "overflow"
	catScale     = "scale"
	catEmpty     = "empty"
)

// use records how a parameter or field is used as a tolerance.
type use struct {
	Kind    tolerance.Kind
	Strict  bool   // a difference equal to the tolerance is outside it (|a-b| < tol), and 0 is not handled apart
	Float32 bool   // judged against float32
	Where   string // the function or type that compares with it, for messages
	At      string // file:line of that comparison, for messages
	// Values holds 1 + the index of each parameter that the function
	// compares (got and want of a test helper), 0 for a compared value
	// that is no parameter: a call's arguments there tell their size.
	Values [2]int
	// A tolerance of a computed quantity whose size grows with the data
	// (see scaleUse): the test as written ("" for other uses), the
	// quantity's grade, and the data size of the package that tests it.
	Quantity string
	Degree   float64
	Summed   bool
	Size     float64
	Declared bool
}

// key returns u without the compared values, which a wrapper that hands
// the tolerance on names by its own parameters: the test is the same.
func (u use) key() use {
	u.Values = [2]int{}
	return u
}

// scaled reports whether u is judged at the data size (see scaleUse).
func (u use) scaled() bool { return u.Quantity != "" }

func (u use) String() string {
	s := map[tolerance.Kind]string{tolerance.Absolute: "an absolute tolerance", tolerance.Relative: "a relative tolerance", tolerance.Magnitude: "a threshold"}[u.Kind]
	s += " of " + u.format().Name
	if u.scaled() {
		s += fmt.Sprintf(" on %s, %s,", u.Quantity, grade{u.Degree, u.Summed})
	}
	s += " in " + u.Where
	if u.At != "" {
		s += ", tested at " + u.At
	}
	return s
}

func (u use) format() numeric.Format { return numeric.Select(u.Float32) }

// checker holds what one run needs.
type checker struct {
	pass   *analysis.Pass
	decls  map[types.Object]ast.Expr
	read   tolerance.Reader
	uses   *tolerance.Uses[use]
	tested map[use]token.Pos // this package's tolerance tests, by use (see key)
	fields map[types.Object][]ast.Expr

	deg     *degree.Reader         // made on first use (see degrees)
	helpers map[*types.Func]helper // predicates comparing two parameters (see atScale)
}

func run(pass *analysis.Pass) (any, error) {
	c := &checker{
		pass:   pass,
		decls:  constval.DeclsOf(pass),
		uses:   tolerance.NewUses[use](pass),
		tested: make(map[use]token.Pos),
	}
	c.read = tolerance.Reader{Info: pass.TypesInfo, Decls: c.decls, Abs: absval.Of(pass)}
	root := pass.ResultOf[inspect.Analyzer].(*inspector.Inspector).Root()
	// First the tolerance tests, which also learn the tolerance parameters
	// and fields; then the places that pass constants to those.
	for cur := range root.Preorder((*ast.BinaryExpr)(nil)) {
		c.comparison(cur, cur.Node().(*ast.BinaryExpr))
	}
	c.wrappers(root)
	c.uses.Export()
	known, sites := c.uses.Lookup(), c.uses.Known()
	for cur := range root.Preorder((*ast.CallExpr)(nil), (*ast.CompositeLit)(nil), (*ast.AssignStmt)(nil), (*ast.BinaryExpr)(nil)) {
		n := cur.Node()
		if sites {
			tolerance.Sites(c.pass.TypesInfo, n, known, func(val ast.Expr, u use, how string) {
				c.site(val, u, c.argSize(cur, n, u), how, n)
			})
		}
		switch n := n.(type) {
		case *ast.CallExpr:
			fn, _ := typeutil.Callee(c.pass.TypesInfo, n).(*types.Func)
			c.call(cur, n, fn)
			c.helperCall(cur, n, fn)
			c.stepless(cur, n, fn)
		case *ast.BinaryExpr:
			c.absorbed(cur, n)
		case *ast.AssignStmt:
			c.seed(cur, n)
		}
	}
	return nil, nil
}

// comparison judges one ordered comparison that reads as a tolerance test.
func (c *checker) comparison(cur inspector.Cursor, n *ast.BinaryExpr) {
	if c.aboveLargest(cur, n) || c.read.InTwoSided(cur) {
		return
	}
	t, ok := c.read.Recognize(n)
	if !ok {
		c.bare(cur, n)
	}
	if (!ok || t.Kind == tolerance.Magnitude) && c.zeroThreshold(cur, n) || !ok || !provenance.IsFloat(c.pass.TypesInfo.TypeOf(t.A)) {
		return
	}
	f := provenance.FormatOf(c.pass.TypesInfo.TypeOf(t.A))
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, t.Tol)
	if !ok {
		v, ok = c.assignedBefore(cur, t.Tol) // a tolerance variable set again: tol = 1e-20 before the next check
	}
	if c.vanished(t, f, v, ok) {
		return
	}
	if ok {
		c.constantTol(cur, t, f, f.Value(v))
		return
	}
	posn := c.pass.Fset.Position(n.Pos())
	decl := enclosingDecl(cur)
	u := use{Kind: t.Kind, Strict: strictTest(t) && !zeroHandled(c.pass.TypesInfo, decl, t.Tol), Float32: f == numeric.Float32, Where: enclosingName(cur), At: fmt.Sprintf("%s:%d", filepath.Base(posn.Filename), posn.Line)}
	if t.Kind == tolerance.Absolute {
		u.Values = c.valuesOf(decl, t.A, t.B)
	}
	if !c.scaleUse(decl, t, &u) && t.Kind != tolerance.Absolute && t.Kind != tolerance.Relative {
		return // steps and residuals: stoptol's, or no tolerance of a difference
	}
	c.learn(decl, t, u)
}

// learn records the parameter or field that t's tolerance comes from as a
// tolerance of use u, and reports the defaults the function gives it.
func (c *checker) learn(decl *ast.FuncDecl, t tolerance.Test, u use) {
	c.tested[u.key()] = t.Cmp.Pos()
	origin := t.Tol
	if decl != nil {
		origin = c.uses.Origin(decl, t.Tol) // tol := o.Tol: the field is the tolerance
	}
	known := c.uses.Lookup()
	if field := tolerance.FieldOf(c.pass.TypesInfo, origin); field != nil && field.Pkg() == c.pass.Pkg {
		if prev, ok := known.Field(field); !ok || replaces(u, prev) {
			c.uses.Field(field, u)
		}
	}
	id, ok := ast.Unparen(t.Tol).(*ast.Ident)
	if !ok || decl == nil {
		return
	}
	if param, ok := ast.Unparen(origin).(*ast.Ident); ok {
		if fn, i, ok := tolerance.ParamOf(c.pass.TypesInfo, decl, param); ok {
			if prev, ok := known.Params(fn)[i]; !ok || replaces(u, prev) {
				c.uses.Param(fn, i, u)
			}
		}
	}
	c.defaults(decl, id, u)
}

// replaces reports whether use u of a tolerance replaces prev, learnt from
// another test: a threshold on a cancelling quantity neither replaces a
// tolerance of a difference nor one of a higher degree, which fails at a
// smaller data size.
func replaces(u, prev use) bool {
	return !u.scaled() || prev.scaled() && u.Degree > prev.Degree
}

// wrappers learns the parameters and fields a function passes on, as they
// are, to a tolerance parameter: a test helper that calls a helper that
// tests. Facts carry them to importers, so wrappers of wrappers compose
// within and across packages.
func (c *checker) wrappers(root inspector.Cursor) {
	if !c.uses.Known() {
		return
	}
	known := c.uses.Lookup()
	for range 4 {
		grew := false
		for cur := range root.Preorder((*ast.CallExpr)(nil)) {
			tolerance.Sites(c.pass.TypesInfo, cur.Node(), known, func(val ast.Expr, u use, _ string) {
				if !eitherOr(cur, val) {
					grew = c.uses.Forward(cur, val, c.handedOn(cur, u), known) || grew
				}
			})
		}
		if !grew {
			return
		}
	}
}

// argSize returns the size of the values compared by a call n that gives
// a tolerance of use u, when the arguments for them have one the source
// fixes (see sizeOf), else 0.
func (c *checker) argSize(cur inspector.Cursor, n ast.Node, u use) float64 {
	call, ok := n.(*ast.CallExpr)
	size := 0.0
	for _, v := range u.Values {
		if ok && v > 0 && v <= len(call.Args) {
			size = max(size, c.sizeOf(cur, call.Args[v-1], u.format()))
		}
	}
	return size
}

// handedOn returns u as the function around the call at cur learns it
// when it hands on its tolerance: the compared values become its own
// parameters that it passes for them, or none.
func (c *checker) handedOn(cur inspector.Cursor, u use) use {
	call := cur.Node().(*ast.CallExpr)
	var args [2]ast.Expr
	for k, v := range u.Values {
		if v > 0 && v <= len(call.Args) {
			args[k] = call.Args[v-1]
		}
	}
	u.Values = c.valuesOf(enclosingDecl(cur), args[0], args[1])
	return u
}

// valuesOf returns, for a and b, 1 + the index of the parameter of decl
// that each names (through conversions), 0 where it names none.
func (c *checker) valuesOf(decl *ast.FuncDecl, a, b ast.Expr) [2]int {
	var vs [2]int
	if decl == nil {
		return vs
	}
	fn, _ := c.pass.TypesInfo.Defs[decl.Name].(*types.Func)
	for k, e := range []ast.Expr{a, b} {
		if i, ok := paramIndex(c.pass.TypesInfo, fn, e); ok {
			vs[k] = i + 1
		}
	}
	return vs
}

// eitherOr reports whether the call at cur, which hands on val as a
// tolerance, is an operand of || whose other operands may pass where it
// cannot, as in EqualWithinAbs(a, b, atol) || EqualWithinRel(a, b, rtol):
// its tolerance cannot make the whole exact. When every operand hands on
// val (near(p, q, tol) || near(q, r, tol)), each is the same test of other
// values, exact with the others.
func eitherOr(cur inspector.Cursor, val ast.Expr) bool {
	var top *ast.BinaryExpr
walk:
	for p := cur.Parent(); ; p = p.Parent() {
		switch b := p.Node().(type) {
		case *ast.ParenExpr:
		case *ast.UnaryExpr:
			if b.Op != token.NOT {
				break walk
			}
		case *ast.BinaryExpr:
			if b.Op != token.LOR {
				break walk
			}
			top = b
		default:
			break walk
		}
	}
	return top != nil && slices.ContainsFunc(operands(top), func(x ast.Expr) bool { return !writes(x, val) })
}

// operands returns the operands of a chain of ||.
func operands(e ast.Expr) []ast.Expr {
	if b, ok := ast.Unparen(e).(*ast.BinaryExpr); ok && b.Op == token.LOR {
		return append(operands(b.X), operands(b.Y)...)
	}
	return []ast.Expr{e}
}

// writes reports whether e holds an expression written as x is.
func writes(e, x ast.Expr) bool {
	want, found := types.ExprString(ast.Unparen(x)), false
	ast.Inspect(e, func(n ast.Node) bool {
		if y, ok := n.(ast.Expr); ok && !found {
			found = types.ExprString(y) == want
		}
		return !found
	})
	return found
}

// defaults reports constants given to the tolerance id in the defaulting
// idiom if tol == 0 { tol = c } within the function.
func (c *checker) defaults(decl *ast.FuncDecl, id *ast.Ident, u use) {
	v, _ := c.pass.TypesInfo.Uses[id].(*types.Var)
	for _, val := range c.uses.DefaultsOf(decl)[v] {
		c.site(val, u, 0, "given as the default of "+id.Name, nil)
	}
}

// strictTest reports whether t counts a difference equal to the tolerance
// as outside it: |a-b| < tol, or |a-b| >= tol for "not within". With a
// tolerance of 0 such a test holds for no values, equal ones included.
func strictTest(t tolerance.Test) bool {
	if t.TwoSided || t.Floor != nil {
		return false
	}
	right := t.Cmp.Y.Pos() <= t.Tol.Pos() && t.Tol.End() <= t.Cmp.Y.End()
	switch t.Cmp.Op {
	case token.LSS, token.GEQ:
		return right
	case token.GTR, token.LEQ:
		return !right
	}
	return false
}

// zeroHandled reports whether decl compares the variable tol names with
// 0 (if tol == 0 { tol = 1e-9 }, tol <= 0 for exact equality): a zero
// tolerance then takes another path than the test.
func zeroHandled(info *types.Info, decl *ast.FuncDecl, tol ast.Expr) bool {
	id, ok := ast.Unparen(tol).(*ast.Ident)
	if !ok || decl == nil {
		return false
	}
	v := info.Uses[id]
	found := false
	ast.Inspect(decl.Body, func(n ast.Node) bool {
		if b, ok := n.(*ast.BinaryExpr); ok && !found {
			for _, xy := range [][2]ast.Expr{{b.X, b.Y}, {b.Y, b.X}} {
				x, isID := ast.Unparen(xy[0]).(*ast.Ident)
				tv := info.Types[xy[1]]
				found = found || isID && info.Uses[x] == v && tv.Value != nil && constant.Sign(tv.Value) == 0
			}
		}
		return !found
	})
	return found
}

// enclosingName names the function declaration around cur, for messages.
func enclosingName(cur inspector.Cursor) string {
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		return fd.Node().(*ast.FuncDecl).Name.Name
	}
	return "a function literal"
}
