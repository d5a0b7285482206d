package epsfloor

import (
	_ "embed"
	"fmt"
	"go/ast"
	"go/constant"
	"go/types"
	"slices"
	"strings"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/passes/inspect"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/analyzerdoc"
	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/numeric"
	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/tolerance"
)

//go:embed doc.go
var doc string

// Analyzer reports tolerances below what the float type can resolve.
var Analyzer = &analysis.Analyzer{
	Name:      "epsfloor",
	Doc:       analyzerdoc.Extract(doc, "epsfloor"),
	URL:       "docs/epsfloor.md",
	Requires:  []*analysis.Analyzer{inspect.Analyzer},
	Run:       run,
	FactTypes: []analysis.Fact{new(paramsFact), new(fieldFact)},
}

// Categories of diagnostics.
const (
	catRelative  = "relative"
	catAbsolute  = "absolute"
	catSubnormal = "subnormal"
	catIterate   = "iterate"
	catAbsorbed  = "absorbed"
)

// use records how a parameter or field is used as a tolerance.
type use struct {
	Kind    tolerance.Kind
	Float32 bool   // judged against float32
	Where   string // the function or type that compares with it, for messages
}

func (u use) String() string {
	article := "a"
	if u.Kind == tolerance.Absolute {
		article = "an"
	}
	return fmt.Sprintf("%s %s tolerance of %s in %s", article, u.Kind, u.format().Name, u.Where)
}

func (u use) format() numeric.Format {
	if u.Float32 {
		return numeric.Float32
	}
	return numeric.Float64
}

// paramsFact records the parameters of a function used as tolerances.
type paramsFact struct{ Params map[int]use }

func (*paramsFact) AFact() {}
func (f *paramsFact) String() string {
	var parts []string
	for i, u := range f.Params {
		parts = append(parts, fmt.Sprintf("parameter %d is %s", i, u))
	}
	slices.Sort(parts)
	return strings.Join(parts, "; ")
}

// fieldFact records a struct field used as a tolerance.
type fieldFact struct{ Use use }

func (*fieldFact) AFact()           {}
func (f *fieldFact) String() string { return f.Use.String() }

// checker holds what one run needs.
type checker struct {
	pass      *analysis.Pass
	decls     map[types.Object]ast.Expr
	params    map[*types.Func]map[int]use // this package's functions
	fields    map[*types.Var]use          // this package's fields
	defaulted map[*ast.FuncDecl]map[*types.Var][]ast.Expr
}

func run(pass *analysis.Pass) (any, error) {
	c := &checker{
		pass:      pass,
		decls:     constval.Decls(pass.TypesInfo, pass.Files),
		params:    make(map[*types.Func]map[int]use),
		fields:    make(map[*types.Var]use),
		defaulted: make(map[*ast.FuncDecl]map[*types.Var][]ast.Expr),
	}
	root := pass.ResultOf[inspect.Analyzer].(*inspector.Inspector).Root()
	// First the tolerance tests, which also learn the tolerance parameters
	// and fields; then the places that pass constants to those.
	for cur := range root.Preorder((*ast.BinaryExpr)(nil)) {
		c.comparison(cur, cur.Node().(*ast.BinaryExpr))
	}
	c.exportFacts()
	known := c.known()
	for cur := range root.Preorder((*ast.CallExpr)(nil), (*ast.CompositeLit)(nil), (*ast.AssignStmt)(nil), (*ast.BinaryExpr)(nil)) {
		n := cur.Node()
		tolerance.Sites(c.pass.TypesInfo, n, known, func(val ast.Expr, u use, how string) {
			c.site(val, u, 0, how)
		})
		switch n := n.(type) {
		case *ast.CallExpr:
			c.call(n)
		case *ast.BinaryExpr:
			c.absorbed(cur, n)
		}
	}
	return nil, nil
}

// comparison judges one ordered comparison that reads as a tolerance test.
func (c *checker) comparison(cur inspector.Cursor, n *ast.BinaryExpr) {
	t, ok := tolerance.Recognize(c.pass.TypesInfo, c.decls, n)
	if !ok || !provenance.IsFloat(c.pass.TypesInfo.TypeOf(t.A)) {
		return
	}
	f := formatOf(c.pass.TypesInfo.TypeOf(t.A))
	if v, ok := constval.Exact(c.pass.TypesInfo, c.decls, t.Tol); ok {
		c.constantTol(cur, t, f, value(v, f))
		return
	}
	u := use{Kind: t.Kind, Float32: f == numeric.Float32, Where: enclosingName(cur)}
	if t.Kind == tolerance.Magnitude || t.Kind == tolerance.RelativeMagnitude {
		return // steps and residuals: stoptol's, or no tolerance of a difference
	}
	if field := tolerance.FieldOf(c.pass.TypesInfo, t.Tol); field != nil && field.Pkg() == c.pass.Pkg {
		c.fields[field] = u
		return
	}
	id, ok := ast.Unparen(t.Tol).(*ast.Ident)
	if !ok {
		return
	}
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		decl := fd.Node().(*ast.FuncDecl)
		if fn, i, ok := tolerance.ParamOf(c.pass.TypesInfo, decl, id); ok {
			c.learnParam(fn, i, u)
		}
		c.defaults(decl, id, u)
	}
}

// defaults reports constants given to the tolerance id in the defaulting
// idiom if tol == 0 { tol = c } within the function.
func (c *checker) defaults(decl *ast.FuncDecl, id *ast.Ident, u use) {
	v, _ := c.pass.TypesInfo.Uses[id].(*types.Var)
	for _, val := range c.defaultsOf(decl)[v] {
		c.site(val, u, 0, "given as the default of "+id.Name)
	}
}

// defaultsOf returns the defaulting idioms of a function, computed once.
func (c *checker) defaultsOf(decl *ast.FuncDecl) map[*types.Var][]ast.Expr {
	d, ok := c.defaulted[decl]
	if !ok {
		d = tolerance.Defaults(c.pass.TypesInfo, decl.Body)
		c.defaulted[decl] = d
	}
	return d
}

// learnParam records parameter i of fn as a tolerance.
func (c *checker) learnParam(fn *types.Func, i int, u use) {
	if c.params[fn] == nil {
		c.params[fn] = make(map[int]use)
	}
	c.params[fn][i] = u
}

// exportFacts makes this package's tolerance parameters and fields known to
// the packages importing it.
func (c *checker) exportFacts() {
	for fn, ps := range c.params {
		c.pass.ExportObjectFact(fn, &paramsFact{Params: ps})
	}
	for field, u := range c.fields {
		c.pass.ExportObjectFact(field, &fieldFact{Use: u})
	}
}

// formatOf returns the format that judges values of type t: float32 when t
// admits float32 (as a type parameter may), else float64.
func formatOf(t types.Type) numeric.Format {
	if provenance.Admits32(t) {
		return numeric.Float32
	}
	return numeric.Float64
}

// value returns the value format f stores for constant v.
func value(v constant.Value, f numeric.Format) float64 {
	if f == numeric.Float32 {
		x, _ := constant.Float32Val(constant.ToFloat(v))
		return float64(x)
	}
	x, _ := constant.Float64Val(constant.ToFloat(v))
	return x
}

// enclosingName names the function declaration around cur, for messages.
func enclosingName(cur inspector.Cursor) string {
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		return fd.Node().(*ast.FuncDecl).Name.Name
	}
	return "a function literal"
}
