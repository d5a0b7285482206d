package fdstep

import (
	_ "embed"
	"go/ast"
	"go/token"
	"go/types"
	"slices"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/passes/inspect"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/analyzerdoc"
	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/lazyssa"
	"roundoff/analyzers/internal/noiselevel"
	"roundoff/analyzers/internal/provenance"
)

//go:embed doc.go
var doc string

// Analyzer reports finite-difference steps that ignore the size of x.
var Analyzer = &analysis.Analyzer{
	Name:      "fdstep",
	Doc:       analyzerdoc.Extract(doc, "fdstep"),
	URL:       "docs/fdstep.md",
	Requires:  []*analysis.Analyzer{inspect.Analyzer, constval.Analyzer, lazyssa.Analyzer, noiselevel.Analyzer},
	Run:       run,
	FactTypes: []analysis.Fact{new(stepFact)},
}

// Categories of diagnostics, one per kind of hazard.
const (
	catUnscaled = "unscaled" // a fixed step where x may be large
	catBadSize  = "badsize"  // a step far below the scheme's optimum
)

// checker holds what one run needs.
type checker struct {
	pass    *analysis.Pass
	noise   *noiselevel.Levels
	insp    *inspector.Inspector
	decls   map[types.Object]ast.Expr
	globals constval.Globals

	// SSA, indexed in one walk.
	roots      []*ssa.BinOp                  // float divisions and products, candidate quotients
	callers    map[*ssa.Function][]*ssa.Call // static calls by callee
	imported   []*ssa.Call                   // static calls of other packages' functions
	stores     map[*types.Var][]*ssa.Store   // stores of floats into struct fields
	fieldOrder []*types.Var                  // the keys of stores, in the order met
	closures   map[*ssa.Function]*ssa.MakeClosure
	copies     map[ssa.Value]ssa.Value // slice → the slice it was copied from
	stencils   []stencilPoint          // perturbations x + h·loc of table-driven stencils

	// Syntax, indexed in one walk on first use (node, value).
	syntax map[token.Pos]ast.Node // binary expressions by operator, op-assignments and calls by start
	values map[token.Pos]ast.Expr // values stored into fields, by the position of the SSA store

	// Steps that reach a quotient through a parameter or a field.
	params  map[*ssa.Function]map[int][]use
	fields  map[*types.Var][]use
	pending map[token.Pos]*pending // constants passed or stored as steps, judged once all uses are known

	done  map[ssa.Value]bool           // differences already judged
	said  map[token.Pos]bool           // positions already reported
	names map[ast.Node]map[string]bool // names in use, or taken by fixes, per top-level function
	src   map[*token.File][]byte       // file contents, for fixes that delete lines
}

func run(pass *analysis.Pass) (any, error) {
	c := &checker{
		pass:     pass,
		noise:    pass.ResultOf[noiselevel.Analyzer].(*noiselevel.Levels),
		insp:     pass.ResultOf[inspect.Analyzer].(*inspector.Inspector),
		decls:    constval.DeclsOf(pass),
		callers:  make(map[*ssa.Function][]*ssa.Call),
		stores:   make(map[*types.Var][]*ssa.Store),
		closures: make(map[*ssa.Function]*ssa.MakeClosure),
		copies:   make(map[ssa.Value]ssa.Value),
		params:   make(map[*ssa.Function]map[int][]use),
		fields:   make(map[*types.Var][]use),
		pending:  make(map[token.Pos]*pending),
		done:     make(map[ssa.Value]bool),
		said:     make(map[token.Pos]bool),
		names:    make(map[ast.Node]map[string]bool),
		src:      make(map[*token.File][]byte),
	}
	if len(pass.Files) == 0 || provenance.InStd(pass.Fset, pass.Files[0].Pos(), pass.Pkg) {
		return nil, nil // the standard library takes no step to difference with: no fact to learn, and nothing of it is reported
	}
	if !c.hasQuotients() && !c.importsSteps() && !importsFD(pass) {
		return nil, nil // no quotient here, no step elsewhere: no SSA needed (most dependencies)
	}
	lazy := pass.ResultOf[lazyssa.Analyzer].(*lazyssa.Lazy)
	ssainfo := lazy.SSA()
	c.globals = lazy.Globals()
	c.indexSSA(ssainfo.Pkg, ssainfo.SrcFuncs)
	for _, root := range c.roots {
		if q, ok := c.quotient(root); ok {
			c.judgeQuotient(q)
		}
	}
	c.judgeStencils()
	c.propagate()
	c.exportFacts()
	return nil, nil
}

// indexSSA records, in one walk of the package's SSA (its source functions
// and the package initializer, which fills package variables), the
// candidate quotients, the calls, the field stores, the closures and the
// slice copies.
func (c *checker) indexSSA(pkg *ssa.Package, funcs []*ssa.Function) {
	if init := pkg.Func("init"); init != nil && !slices.Contains(funcs, init) {
		funcs = append([]*ssa.Function{init}, funcs...)
	}
	for _, fn := range funcs {
		for _, b := range fn.Blocks {
			for _, instr := range b.Instrs {
				c.indexInstr(fn, instr)
			}
		}
	}
}

func (c *checker) indexInstr(fn *ssa.Function, instr ssa.Instruction) {
	switch v := instr.(type) {
	case *ssa.BinOp:
		if (v.Op == token.QUO || v.Op == token.MUL) && isReal(v.Type()) {
			c.roots = append(c.roots, v)
		}
		if p, ok := c.stencilPoint(v); ok {
			c.stencils = append(c.stencils, p)
		}
	case *ssa.Call:
		c.indexCall(fn, v)
	case *ssa.Store:
		if fa, ok := v.Addr.(*ssa.FieldAddr); ok && isReal(v.Val.Type()) {
			if f := fieldOf(fa.X.Type(), fa.Field); f != nil {
				if c.stores[f] == nil {
					c.fieldOrder = append(c.fieldOrder, f)
				}
				c.stores[f] = append(c.stores[f], v)
			}
		}
	case *ssa.MakeClosure:
		if cl, ok := v.Fn.(*ssa.Function); ok {
			c.closures[cl] = v
		}
	}
}

// indexCall records a call by callee, and the slice copies that builtin
// copy, append(s, x...) and slices.Clone make.
func (c *checker) indexCall(fn *ssa.Function, call *ssa.Call) {
	com := call.Common()
	if b, ok := com.Value.(*ssa.Builtin); ok {
		switch {
		case b.Name() == "copy" && len(com.Args) == 2:
			c.copies[com.Args[0]] = com.Args[1]
		case b.Name() == "append" && len(com.Args) == 2 && isNil(com.Args[0]):
			c.copies[call] = com.Args[1] // append([]float64(nil), x...)
		}
		return
	}
	callee := com.StaticCallee()
	if callee == nil {
		return
	}
	if o := callee.Origin(); o != nil && o.Pkg != nil && o.Pkg.Pkg.Path() == "slices" && o.Name() == "Clone" {
		c.copies[call] = com.Args[0]
	}
	if callee.Package() != fn.Package() {
		c.imported = append(c.imported, call)
		return
	}
	c.callers[callee] = append(c.callers[callee], call)
}

// hasQuotients reports whether the package has a float product or
// quotient, the operations that the candidate quotients of SSA come from.
func (c *checker) hasQuotients() bool {
	for cur := range c.insp.Root().Preorder((*ast.BinaryExpr)(nil), (*ast.AssignStmt)(nil)) {
		switch n := cur.Node().(type) {
		case *ast.BinaryExpr:
			if (n.Op == token.QUO || n.Op == token.MUL) && c.realExpr(n) {
				return true
			}
		case *ast.AssignStmt:
			if (n.Tok == token.QUO_ASSIGN || n.Tok == token.MUL_ASSIGN) && c.realExpr(n.Lhs[0]) {
				return true
			}
		}
	}
	return false
}

// node returns the syntax that the SSA position pos points at, or nil.
func (c *checker) node(pos token.Pos) ast.Node {
	c.indexSyntax()
	return c.syntax[pos]
}

// value returns the value stored by the field store at pos, or nil.
func (c *checker) value(pos token.Pos) ast.Expr {
	c.indexSyntax()
	return c.values[pos]
}

// indexSyntax records, once, the syntax that SSA positions point at: float
// binary expressions and comparisons by operator, float op-assignments
// (x += h) and calls by their start, and the value stored by each field
// store (composite literal elements and assignments to selectors). Most
// packages never ask.
func (c *checker) indexSyntax() {
	if c.syntax != nil {
		return
	}
	c.syntax, c.values = make(map[token.Pos]ast.Node), make(map[token.Pos]ast.Expr)
	types := []ast.Node{(*ast.BinaryExpr)(nil), (*ast.AssignStmt)(nil), (*ast.CallExpr)(nil), (*ast.CompositeLit)(nil)}
	for cur := range c.insp.Root().Preorder(types...) {
		switch n := cur.Node().(type) {
		case *ast.BinaryExpr:
			if c.realExpr(n.X) {
				c.syntax[n.OpPos] = n
			}
		case *ast.CallExpr:
			c.syntax[n.Lparen] = n
		case *ast.AssignStmt:
			c.indexAssign(n)
		case *ast.CompositeLit:
			for _, e := range n.Elts {
				if kv, ok := e.(*ast.KeyValueExpr); ok {
					c.values[kv.Colon] = kv.Value
				} else {
					c.values[e.Pos()] = e
				}
			}
		}
	}
}

// realExpr reports whether e has a real float type.
func (c *checker) realExpr(e ast.Expr) bool {
	t := c.pass.TypesInfo.TypeOf(e)
	return t != nil && isReal(t)
}

func (c *checker) indexAssign(as *ast.AssignStmt) {
	if as.Tok != token.ASSIGN && as.Tok != token.DEFINE {
		if c.realExpr(as.Lhs[0]) {
			c.syntax[as.Pos()] = as // x op= y: SSA places the operation at the statement
		}
		return
	}
	if len(as.Lhs) != len(as.Rhs) {
		return
	}
	for i, lhs := range as.Lhs {
		if sel, ok := ast.Unparen(lhs).(*ast.SelectorExpr); ok {
			c.values[sel.Sel.Pos()] = as.Rhs[i]
		}
	}
}

// importsSteps reports whether a package this one depends on has step
// parameters or fields, which calls and stores here may feed.
func (c *checker) importsSteps() bool {
	for _, f := range c.pass.AllObjectFacts() {
		if _, ok := f.Fact.(*stepFact); ok {
			return true
		}
	}
	return false
}

// isReal reports whether t is a floating-point type (not complex), a named
// type over one, or a type parameter admitting floats.
func isReal(t types.Type) bool {
	b, ok := t.Underlying().(*types.Basic)
	return provenance.IsFloat(t) && (!ok || b.Info()&types.IsComplex == 0)
}

// deliberate reports whether verdict v at pos concerns a step a test chose
// on purpose: a test's derivative check evaluates at the test's own points
// and compares with its own tolerance, so a step that does not scale with
// x, or is large, was chosen for those points (a step that failed there
// would fail the test, and expected values may be pinned for it). A step
// far below the optimum is not: the check's own rounding error then nears
// its tolerance, and the test passes or fails with the last bits.
func (c *checker) deliberate(pos token.Pos, v verdict) bool {
	return provenance.InTestFile(c.pass.Fset, pos) && !v.bad
}

// line returns the line of pos.
func (c *checker) line(pos token.Pos) int { return c.pass.Fset.Position(pos).Line }

// isNil reports whether v is the constant nil.
func isNil(v ssa.Value) bool {
	k, ok := v.(*ssa.Const)
	return ok && k.IsNil()
}

// fieldOf returns the field with the given index of the struct that t, or
// the type t points to, is.
func fieldOf(t types.Type, index int) *types.Var {
	if p, ok := t.Underlying().(*types.Pointer); ok {
		t = p.Elem()
	}
	s, ok := t.Underlying().(*types.Struct)
	if !ok || index >= s.NumFields() {
		return nil
	}
	return s.Field(index)
}
