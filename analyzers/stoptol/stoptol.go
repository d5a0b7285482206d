package stoptol

import (
	_ "embed"
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/passes/inspect"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/absval"
	"roundoff/analyzers/internal/analyzerdoc"
	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/noiselevel"
	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/span"
	"roundoff/analyzers/internal/tolerance"
	"roundoff/internal/numeric"
)

//go:embed doc.go
var doc string

// Analyzer reports stopping tests that a method cannot meet.
var Analyzer = &analysis.Analyzer{
	Name:      "stoptol",
	Doc:       analyzerdoc.Extract(doc, "stoptol"),
	URL:       "docs/stoptol.md",
	Requires:  []*analysis.Analyzer{inspect.Analyzer, constval.Analyzer, noiselevel.Analyzer, absval.Analyzer},
	Run:       run,
	FactTypes: []analysis.Fact{new(tolerance.ParamsFact[use]), new(tolerance.FieldFact[use])},
}

// Categories of diagnostics.
const (
	catTight     = "tight"
	catUnscaled  = "unscaled"
	catFScale    = "fscale"
	catNoCap     = "nocap"
	catBacktrack = "backtrack"
)

// use records how a tolerance is used in a stopping test.
type use struct {
	Class    class
	Relative bool // relative to |x| rather than absolute
	Step     bool // on a step (|dx|), not on a difference of two x values
	Grad     bool // a gradient-norm threshold
	Float32  bool
	Noise    float64 // the objective's declared relative accuracy, or 0 for machine precision
	Where    string  // the function that tests it
}

func (u use) String() string {
	if u.Grad {
		return "a gradient-norm threshold in " + u.Where
	}
	scale := map[bool]string{false: "an absolute", true: "a relative"}[u.Relative]
	return fmt.Sprintf("%s x-tolerance of a %s in %s", scale, u.Class, u.Where)
}

func (u use) format() numeric.Format { return numeric.Select(u.Float32) }

// checker holds what one run needs.
type checker struct {
	pass   *analysis.Pass
	noise  *noiselevel.Levels
	decls  map[types.Object]ast.Expr
	abs    *absval.Known
	uses   *tolerance.Uses[use]
	tests  map[use]ast.Node                    // the tests of the tolerances learned here
	later  func(types.Object) (ast.Expr, bool) // locals declared first and assigned once (constval.SetOnce), made on first use
	movers map[*types.Func][][2]int            // helpers that store through pointers (tolerance.Movers), read on first use
	span   *span.Reader                        // intervals of the package's values (see spans), made on first use
}

// reader returns the tolerance reader for a loop of the function body.
func (c *checker) reader(l *loop) tolerance.Reader {
	info := c.pass.TypesInfo
	if c.later == nil {
		c.later = constval.SetOnce(info, c.pass.ResultOf[inspect.Analyzer].(*inspector.Inspector))
	}
	r := tolerance.Reader{
		Info: info, Decls: c.decls, Abs: c.abs, Mixed: true, Later: c.later,
		Ordered: func(hi, lo ast.Expr) bool { return tolerance.Ordered(info, l.movers, l.body, hi, lo) },
	}
	r.Widths = r.TrackedWidths(l.body, l.shrunk)
	return r
}

func run(pass *analysis.Pass) (any, error) {
	c := &checker{
		pass:  pass,
		noise: pass.ResultOf[noiselevel.Analyzer].(*noiselevel.Levels),
		decls: constval.DeclsOf(pass),
		abs:   absval.Of(pass),
		uses:  tolerance.NewUses[use](pass),
		tests: make(map[use]ast.Node),
	}
	root := pass.ResultOf[inspect.Analyzer].(*inspector.Inspector).Root()
	var floatTests []token.Pos
	for cur := range root.Preorder((*ast.BinaryExpr)(nil), (*ast.CallExpr)(nil)) {
		if n, ok := cur.Node().(*ast.BinaryExpr); ok && provenance.IsFloatComparison(pass.TypesInfo, n, false) {
			floatTests = append(floatTests, n.OpPos)
			c.gradient(cur, n)
		} else if ok && tolerance.Comparator(pass.TypesInfo, n) {
			floatTests = append(floatTests, n.OpPos)
		} else if n, ok := cur.Node().(*ast.CallExpr); ok && isFloatPredicate(pass.TypesInfo, n) {
			floatTests = append(floatTests, n.Lparen)
		}
	}
	slices.Sort(floatTests)               // files need not come in the order of their positions
	funcs := make(map[ast.Node]*function) // per function body
	for cur := range root.Preorder((*ast.ForStmt)(nil)) {
		n := cur.Node().(*ast.ForStmt)
		if !holdsAny(floatTests, n) {
			continue // every rule is about a loop ended by a float test
		}
		l := readLoop(pass.TypesInfo, n, c.function(funcs, enclosingBody(cur), enclosingDecl(cur)), nil)
		l.noise = c.objectiveNoise(l)
		c.loop(cur, l)
	}
	for cur := range root.Preorder((*ast.FuncDecl)(nil)) {
		n := cur.Node().(*ast.FuncDecl)
		if n.Body == nil || !holdsAny(floatTests, n.Body) {
			continue // a recursion is judged only when a float test may end it
		}
		if r := newRecursion(pass.TypesInfo, n); r != nil {
			c.unbounded(r.read(pass.TypesInfo, c.function(funcs, n.Body, n)))
		}
	}
	c.sites(root)
	return nil, nil
}

// function returns what stoptol learns about a function body, once.
func (c *checker) function(funcs map[ast.Node]*function, body ast.Node, decl *ast.FuncDecl) *function {
	if funcs[body] == nil {
		if c.movers == nil {
			c.movers = tolerance.Movers(c.pass.TypesInfo, c.pass.Files)
		}
		funcs[body] = &function{body: body, decl: decl, fvals: FValues(c.pass.TypesInfo, c.movers, body), flags: tolerance.Flags(c.pass.TypesInfo, body), movers: c.movers}
	}
	return funcs[body]
}

// isFloatPredicate reports whether call returns a bool from a float
// argument, as a helper that compares angles or tests nearness does.
func isFloatPredicate(info *types.Info, call *ast.CallExpr) bool {
	t := info.TypeOf(call)
	if t == nil {
		return false // not type-checked
	}
	if b, ok := t.Underlying().(*types.Basic); !ok || b.Info()&types.IsBoolean == 0 {
		return false
	}
	return slices.ContainsFunc(call.Args, func(a ast.Expr) bool { return provenance.IsFloat(info.TypeOf(a)) })
}

// holdsAny reports whether one of the sorted positions lies within n.
func holdsAny(sorted []token.Pos, n ast.Node) bool {
	i, _ := slices.BinarySearch(sorted, n.Pos())
	return i < len(sorted) && sorted[i] < n.End()
}

// objectiveNoise returns the largest declared noise level among the
// functions whose values a minimization compares, or 0.
func (c *checker) objectiveNoise(l *loop) float64 {
	if l.class != minimize {
		return 0
	}
	level := 0.0
	ast.Inspect(l.stmt, func(n ast.Node) bool {
		if call, ok := n.(*ast.CallExpr); ok && isFValue(c.pass.TypesInfo, call) {
			fn, _ := typeutil.Callee(c.pass.TypesInfo, call).(*types.Func)
			if v, ok := c.noise.Of(fn); ok {
				level = max(level, v)
			}
		}
		return true
	})
	return level
}

// source is where a stopping test's tolerance comes from.
type source struct {
	constant bool
	value    float64
	learned  bool // a parameter or field, recorded for its callers
}

// resolve finds the value of tolerance expression tol, tested in test,
// or records the parameter or field it names (with the given use) and
// reports constants given to it as a default.
func (c *checker) resolve(cur inspector.Cursor, tol ast.Expr, u use, test ast.Node) source {
	if v, ok := constval.Exact(c.pass.TypesInfo, c.decls, tol); ok {
		return source{constant: true, value: u.format().Value(v)}
	}
	var decl *ast.FuncDecl
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		decl = fd.Node().(*ast.FuncDecl)
	}
	origin := tol
	if decl != nil {
		origin = c.uses.Origin(decl, tol) // tol := o.Tol: the field is the tolerance
	}
	src := source{}
	if field := tolerance.FieldOf(c.pass.TypesInfo, origin); field != nil {
		c.uses.Field(field, u)
		c.learned(u, test)
		src.learned = true
	}
	id, ok := ast.Unparen(tol).(*ast.Ident)
	if !ok || decl == nil {
		return src
	}
	if param, ok := ast.Unparen(origin).(*ast.Ident); ok {
		if fn, i, ok := tolerance.ParamOf(c.pass.TypesInfo, decl, param); ok {
			c.uses.Param(fn, i, u)
			c.learned(u, test)
			src.learned = true
		}
	}
	v, _ := c.pass.TypesInfo.Uses[id].(*types.Var)
	for _, val := range c.uses.DefaultsOf(decl)[v] {
		c.site(val, u, "given as the default of "+id.Name, test)
	}
	return src
}

// learned remembers the first test of a tolerance of use u.
func (c *checker) learned(u use, test ast.Node) {
	if _, ok := c.tests[u]; !ok {
		c.tests[u] = test
	}
}

// enclosingBody returns the body of the function around cur.
func enclosingBody(cur inspector.Cursor) ast.Node {
	for fn := range cur.Enclosing((*ast.FuncDecl)(nil), (*ast.FuncLit)(nil)) {
		switch fn := fn.Node().(type) {
		case *ast.FuncDecl:
			return fn.Body
		case *ast.FuncLit:
			return fn.Body
		}
	}
	return cur.Node()
}

// enclosingDecl returns the function declaration whose body directly
// holds cur, or nil inside a function literal.
func enclosingDecl(cur inspector.Cursor) *ast.FuncDecl {
	for fn := range cur.Enclosing((*ast.FuncDecl)(nil), (*ast.FuncLit)(nil)) {
		d, _ := fn.Node().(*ast.FuncDecl)
		return d
	}
	return nil
}

// enclosingName names the function declaration around cur.
func enclosingName(cur inspector.Cursor) string {
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		return fd.Node().(*ast.FuncDecl).Name.Name
	}
	return "a function literal"
}
