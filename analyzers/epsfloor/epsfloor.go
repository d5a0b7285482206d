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
	pass   *analysis.Pass
	decls  map[types.Object]ast.Expr
	params map[*types.Func]map[int]use // this package's functions
	fields map[*types.Var]use          // this package's fields
}

func run(pass *analysis.Pass) (any, error) {
	c := &checker{
		pass:   pass,
		decls:  constval.Decls(pass.TypesInfo, pass.Files),
		params: make(map[*types.Func]map[int]use),
		fields: make(map[*types.Var]use),
	}
	root := pass.ResultOf[inspect.Analyzer].(*inspector.Inspector).Root()
	// First the tolerance tests, which also learn the tolerance parameters
	// and fields; then the places that pass constants to those.
	for cur := range root.Preorder((*ast.BinaryExpr)(nil)) {
		c.comparison(cur, cur.Node().(*ast.BinaryExpr))
	}
	c.exportFacts()
	for cur := range root.Preorder((*ast.CallExpr)(nil), (*ast.CompositeLit)(nil), (*ast.AssignStmt)(nil), (*ast.BinaryExpr)(nil)) {
		switch n := cur.Node().(type) {
		case *ast.CallExpr:
			c.call(n)
		case *ast.CompositeLit:
			c.compositeLit(n)
		case *ast.AssignStmt:
			c.assign(n)
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
	u := use{Kind: t.Kind, Float32: f == numeric.Float32}
	switch tol := ast.Unparen(t.Tol).(type) {
	case *ast.Ident:
		if fn, i, ok := paramOf(c.pass.TypesInfo, cur, tol); ok && t.Kind != tolerance.Magnitude {
			u.Where = fn.Name()
			c.learnParam(fn, i, u)
		}
	case *ast.SelectorExpr:
		if field, ok := fieldOf(c.pass.TypesInfo, tol); ok && t.Kind != tolerance.Magnitude && field.Pkg() == c.pass.Pkg {
			u.Where = enclosingName(cur)
			c.fields[field] = u
		}
	}
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

// paramOf reports whether id names a parameter of the function declaration
// enclosing cur, returning the function and the parameter's index.
func paramOf(info *types.Info, cur inspector.Cursor, id *ast.Ident) (*types.Func, int, bool) {
	obj, ok := info.Uses[id].(*types.Var)
	if !ok {
		return nil, 0, false
	}
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		fn, ok := info.Defs[fd.Node().(*ast.FuncDecl).Name].(*types.Func)
		if !ok {
			return nil, 0, false
		}
		params := fn.Signature().Params()
		for i := range params.Len() {
			if params.At(i) == obj {
				return fn, i, true
			}
		}
	}
	return nil, 0, false
}

// fieldOf returns the struct field a selector reads.
func fieldOf(info *types.Info, sel *ast.SelectorExpr) (*types.Var, bool) {
	s, ok := info.Selections[sel]
	if !ok || s.Kind() != types.FieldVal {
		return nil, false
	}
	v, ok := s.Obj().(*types.Var)
	return v, ok
}

// enclosingName names the function declaration around cur, for messages.
func enclosingName(cur inspector.Cursor) string {
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		return fd.Node().(*ast.FuncDecl).Name.Name
	}
	return "a function literal"
}
