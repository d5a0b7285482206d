package exacteq

import (
	_ "embed"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/passes/inspect"
	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/absval"
	"roundoff/analyzers/internal/analyzerdoc"
	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/lazyssa"
	"roundoff/analyzers/internal/portable"
	"roundoff/analyzers/internal/provenance"
	"roundoff/analyzers/internal/vecshape"
)

//go:embed doc.go
var doc string

// Analyzer reports exact equality tests on floating-point values that
// rounding makes unreliable.
var Analyzer = &analysis.Analyzer{
	Name:     "exacteq",
	Doc:      analyzerdoc.Extract(doc, "exacteq"),
	URL:      "docs/exacteq.md",
	Requires: []*analysis.Analyzer{inspect.Analyzer, constval.Analyzer, lazyssa.Analyzer, portable.Analyzer, vecshape.Analyzer, absval.Analyzer},
	Run:      run,
}

// Categories of diagnostics, one per kind of hazard.
const (
	catNaN      = "nan"
	catComputed = "computed"
	catLiteral  = "literal"
	catLoop     = "loop"
	catAggr     = "aggregate"
	catTestify  = "testify"
	catPinned   = "pinned"
	catResidue  = "residue"
	catWhole    = "whole"
	catTie      = "tie"
	catRoute    = "route"
	catGrid     = "grid"
	catExponent = "exponent"
	catSteps    = "steps"
)

// checker holds what one run needs.
type checker struct {
	pass    *analysis.Pass
	track   *provenance.Tracker
	decls   map[types.Object]ast.Expr
	globals constval.Globals
	ssa     *lazyssa.Lazy // the package's SSA, and its comparisons and calls by position (cmpAt, callAt)
	fields  map[types.Object][]ast.Expr
	judge   *portable.Judge
	shapes  vecshape.Imported // the vector functions of other packages
	// fills holds, for each struct field, the functions whose results
	// the package stores into it directly.
	fills map[*types.Var]map[*ssa.Function]bool
	// storedVals holds the float values the package stores into each
	// struct field.
	storedVals map[*types.Var][]ssa.Value
	// saysExact holds, for each test function asked about, whether it
	// says it checks exactness (deliberate).
	saysExact map[ast.Node]bool
	// signed caches eitherSign, by the statement adding to a sum.
	signed map[*ssa.BinOp]bool
}

func run(pass *analysis.Pass) (any, error) {
	insp := pass.ResultOf[inspect.Analyzer].(*inspector.Inspector)
	var work []inspector.Cursor
	for cur := range insp.Root().Preorder((*ast.BinaryExpr)(nil), (*ast.CaseClause)(nil), (*ast.CallExpr)(nil)) {
		if mayConcern(pass, cur) {
			work = append(work, cur)
		}
	}
	if len(work) == 0 {
		return nil, nil // no SSA needed
	}
	lazy := pass.ResultOf[lazyssa.Analyzer].(*lazyssa.Lazy)
	ssainfo := lazy.SSA()
	c := &checker{
		pass:    pass,
		track:   provenance.NewTracker(ssainfo.Pkg, ssainfo.SrcFuncs),
		decls:   constval.DeclsOf(pass),
		shapes:  vecshape.Of(pass),
		globals: lazy.Globals(),
		ssa:     lazy,
		fills:   make(map[*types.Var]map[*ssa.Function]bool),
		judge:   portable.Of(pass),

		storedVals: make(map[*types.Var][]ssa.Value),
		saysExact:  make(map[ast.Node]bool),
		signed:     make(map[*ssa.BinOp]bool),
	}
	c.index(ssainfo.SrcFuncs)
	for _, cur := range work {
		switch n := cur.Node().(type) {
		case *ast.BinaryExpr:
			switch n.Op {
			case token.EQL, token.NEQ:
				c.comparison(cur, n)
				c.truncGrid(n)
			case token.LSS, token.LEQ, token.GTR, token.GEQ:
				c.orderedLoop(cur, n)
				c.signSplit(cur, n)
			}
		case *ast.CaseClause:
			c.caseClause(cur, n)
		case *ast.CallExpr:
			c.testifyCall(cur, n)
			c.exponent(n)
			c.rangeCount(cur, n)
		}
	}
	return nil, nil
}

// mayConcern reports, from syntax and types alone, whether cur is a node
// some rule may examine: a comparison of values holding floats, a case of
// a switch on a float, a call to a comparing function, a truncation of a
// ratio of logarithms, or, in a test file, a call outside the standard
// library (a helper assertion). A package with none needs no SSA.
func mayConcern(pass *analysis.Pass, cur inspector.Cursor) bool {
	info := pass.TypesInfo
	switch n := cur.Node().(type) {
	case *ast.BinaryExpr:
		_, _, grid := truncatedScales(info, constval.DeclsOf(pass), pass.Fset, n)
		return grid || provenance.IsFloatComparison(info, n, true)
	case *ast.CaseClause:
		sw, ok := cur.Parent().Parent().Node().(*ast.SwitchStmt)
		return ok && sw.Tag != nil && provenance.IsFloat(info.TypeOf(sw.Tag))
	case *ast.CallExpr:
		if _, _, ok := exponentSite(info, n); ok {
			return true
		}
		if _, ok := truncatesQuotient(info, n); ok {
			return true
		}
		fn, ok := typeutil.Callee(info, n).(*types.Func)
		if !ok || fn.Pkg() == nil {
			return false
		}
		path := fn.Pkg().Path()
		return deepEqual[path+"."+fn.Name()] || isTestify(path) || !provenance.InStd(pass.Fset, fn.Pos(), fn.Pkg()) && provenance.InTestFile(pass.Fset, n.Pos())
	}
	return false
}

// index records, in one walk of the package's SSA, the stores into
// struct fields.
func (c *checker) index(funcs []*ssa.Function) {
	for _, fn := range funcs {
		for _, b := range fn.Blocks {
			for _, instr := range b.Instrs {
				if v, ok := instr.(*ssa.Store); ok {
					c.recordFill(v)
					c.recordStore(v)
				}
			}
		}
	}
}

// cmpAt returns the SSA comparison whose operator is at pos, or nil.
func (c *checker) cmpAt(pos token.Pos) *ssa.BinOp {
	b, ok := c.ssa.At(pos).(*ssa.BinOp)
	if !ok || b.Op.Precedence() != token.EQL.Precedence() {
		return nil
	}
	return b
}

// callAt returns the SSA call whose opening parenthesis is at pos, or nil.
func (c *checker) callAt(pos token.Pos) *ssa.Call {
	call, _ := c.ssa.At(pos).(*ssa.Call)
	return call
}

// recordFill records a store of a call's result into a struct field.
func (c *checker) recordFill(st *ssa.Store) {
	fa, ok := st.Addr.(*ssa.FieldAddr)
	call, ok2 := provenance.Strip(st.Val).(*ssa.Call)
	if !ok || !ok2 || call.Common().StaticCallee() == nil {
		return
	}
	ptr, ok := fa.X.Type().Underlying().(*types.Pointer)
	if !ok {
		return
	}
	s, ok := ptr.Elem().Underlying().(*types.Struct)
	if !ok {
		return
	}
	f := s.Field(fa.Field)
	if c.fills[f] == nil {
		c.fills[f] = map[*ssa.Function]bool{}
	}
	c.fills[f][call.Common().StaticCallee()] = true
}

// operand pairs an operand's syntax with its SSA value.
type operand struct {
	expr ast.Expr
	val  ssa.Value
}

// comparison examines one == or != expression.
func (c *checker) comparison(cur inspector.Cursor, n *ast.BinaryExpr) {
	bin := c.cmpAt(n.OpPos)
	if bin == nil {
		return // folded to a constant or not built: nothing happens at run time
	}
	x, y := operand{n.X, bin.X}, operand{n.Y, bin.Y}
	t := c.pass.TypesInfo.TypeOf(n.X)
	switch {
	case provenance.IsFloat(t):
		if c.nan(cur, n, x, y) || c.loopCondition(cur, n, x, y) || c.deliberate(cur) || c.zeroPartner(cur, n) || c.tieBreak(cur, n) {
			return
		}
		fix := func() []fixes.Fix { return c.toleranceFix(cur, n, x, y, t) }
		if !c.pinned(cur, n, "exact "+n.Op.String(), x, y, fix) {
			c.scalar(cur, n, n.Op, x, y)
		}
	case provenance.HoldsFloat(t, false):
		if !c.deliberate(cur) && !c.pinned(cur, n, n.Op.String()+" on "+typeName(t)+" values", x, y, nil) {
			c.aggregate(n, x, y)
		}
	}
}

// caseClause examines the cases of an expression switch on a float value.
func (c *checker) caseClause(cur inspector.Cursor, cc *ast.CaseClause) {
	sw, ok := cur.Parent().Parent().Node().(*ast.SwitchStmt)
	if !ok || sw.Tag == nil || !provenance.IsFloat(c.pass.TypesInfo.TypeOf(sw.Tag)) {
		return // a type switch, a tagless switch or a switch on a non-float
	}
	for _, e := range cc.List {
		if bin := c.cmpAt(e.Pos()); bin != nil {
			c.scalar(cur, nil, token.EQL, operand{sw.Tag, bin.X}, operand{e, bin.Y})
		}
	}
}

// scalar applies the computed-value rules to a float comparison; n is nil
// for a switch case, which gets no fix.
func (c *checker) scalar(cur inspector.Cursor, n *ast.BinaryExpr, op token.Token, x, y operand) {
	if c.fraction(x.val) && isConstVal(y.val) || c.fraction(y.val) && isConstVal(x.val) {
		c.reportFraction(n, op, x, y) // 0 included: a remainder of 0 is a divisibility test
		return
	}
	if n != nil && (c.sumTie(cur, n, op, x, y) || c.secondRoute(cur, n, op, x, y) || c.wholeCount(cur, n, op, x, y)) || c.residue(cur, n, op, x, y) || c.exempt(x) || c.exempt(y) {
		return
	}
	cx, cy := c.track.Computed(x.val), c.track.Computed(y.val)
	if cx && wholeOf(y.val, x.val) || cy && wholeOf(x.val, y.val) {
		c.reportWhole(n, op, x, y)
		return
	}
	if cx && cy {
		if !derived(x.val, y.val) {
			c.reportComputed(cur, n, op, x, y, nil)
		}
		return
	}
	if cx && c.stored(cur, n, op, x, y) || cy && c.stored(cur, n, op, y, x) {
		return
	}
	if cx {
		c.literal(cur, n, op, x, y)
	} else if cy {
		c.literal(cur, n, op, y, x)
	}
}

// stored reports a computed value x compared with y, a load of a field into
// which the package stores computed values, unless x is derived from y,
// stored into that very field (a cache key) or computed by a function whose
// results the field receives. It reports whether y was such
// a load.
func (c *checker) stored(cur inspector.Cursor, n *ast.BinaryExpr, op token.Token, x, y operand) bool {
	field := c.track.StoredField(y.val)
	if field == nil {
		return false
	}
	if !derived(x.val, y.val) && !provenance.StoredInto(x.val, field) && !c.sameFill(x.val, field) && !c.sameForm(x.val, field) {
		c.reportComputed(cur, n, op, x, y, field)
	}
	return true
}

// sameFill reports whether x is the result of a function whose results
// the package also stores into field: the same function gives the same
// bits for the same inputs, so the test asks whether the field still holds
// what the function gives (a default still in use), not whether two
// roundings of different routes agree.
func (c *checker) sameFill(x ssa.Value, field *types.Var) bool {
	call, ok := provenance.Strip(x).(*ssa.Call)
	return ok && call.Common().StaticCallee() != nil && c.fills[field][call.Common().StaticCallee()]
}

// derived reports whether the operands are related in a way that makes an
// exact comparison deliberate: one computed or merged from the other, both
// copies of the same value, or a tolerance test of the same pair nearby.
func derived(x, y ssa.Value) bool {
	return provenance.DependsOn(x, y) || provenance.DependsOn(y, x) ||
		provenance.MergedFrom(x, y) || provenance.MergedFrom(y, x) ||
		provenance.SameSources(x, y) || provenance.Differenced(x, y) ||
		lastValue(x, y) || lastValue(y, x) || sameRoute(x, y)
}

// sameRoute reports whether x and y are results of the same function on
// arguments passed by value (numbers, and structs and arrays of them): the
// same roundings applied to equal inputs give equal results, so the test
// compares the inputs as the function sees them, as a sort comparator
// breaking ties (hue(a) == hue(b)) or a snap to a grid (snap(p) == snap(q))
// does. A function of slices or pointers, such as a sum over a slice in
// another order, stays a hazard.
func sameRoute(x, y ssa.Value) bool {
	cx, ok1 := provenance.Strip(x).(*ssa.Call)
	cy, ok2 := provenance.Strip(y).(*ssa.Call)
	if !ok1 || !ok2 || cx.Common().StaticCallee() == nil || cx.Common().StaticCallee() != cy.Common().StaticCallee() {
		return false
	}
	for _, a := range append(cx.Common().Args, cy.Common().Args...) {
		if !byValue(a.Type(), 4) {
			return false
		}
	}
	return true
}

// byValue reports whether t holds no references: a number, a string, or a
// struct or array of such.
func byValue(t types.Type, depth int) bool {
	if depth == 0 {
		return false
	}
	switch u := t.Underlying().(type) {
	case *types.Basic:
		return true
	case *types.Array:
		return byValue(u.Elem(), depth-1)
	case *types.Struct:
		for f := range u.Fields() {
			if !byValue(f.Type(), depth-1) {
				return false
			}
		}
		return true
	}
	return false
}

// lastValue reports whether y holds x's value from the previous pass of a
// loop, x being carried from pass to pass: a merge one of whose incoming
// values is x itself (last = sum at the top of each pass, then sum != last
// as the stop). A fresh value against a running minimum (w == min, a tie
// of path costs summed in different orders) is not such a test. A series summed
// until a term no longer changes the sum stops exactly when the term is
// absorbed, when the sum holds every digit the format can.
func lastValue(x, y ssa.Value) bool {
	acc, ok := provenance.Strip(x).(*ssa.Phi)
	if !ok || provenance.Of(acc) != provenance.LoopCarried {
		return false // not a value carried from pass to pass, such as a fresh candidate against a running minimum
	}
	phi, ok := provenance.Strip(y).(*ssa.Phi)
	if !ok {
		return false
	}
	for _, e := range phi.Edges {
		if provenance.Strip(e) == provenance.Strip(x) && e != phi {
			return true
		}
	}
	return false
}

// landsOn reports whether x is a sum or difference with the constant y
// itself among its operands: x = a + P; x == P asks whether a was absorbed
// (an angle of -1e-17 wrapped by adding 2π rounds to 2π exactly), which is
// the right question.
func landsOn(x, y ssa.Value) bool {
	c, ok := provenance.Strip(y).(*ssa.Const)
	b, ok2 := provenance.Strip(x).(*ssa.BinOp)
	if !ok || !ok2 || c.Value == nil || b.Op != token.ADD && b.Op != token.SUB {
		return false
	}
	for _, op := range []ssa.Value{b.X, b.Y} {
		if k, ok := provenance.Strip(op).(*ssa.Const); ok && k.Value != nil && constant.Compare(k.Value, token.EQL, c.Value) {
			return true
		}
	}
	return false
}

// exempt reports whether an operand makes any comparison deliberate: exact
// zero, an infinity, or ±math.MaxFloat64.
func (c *checker) exempt(o operand) bool {
	if provenance.IsInf(o.val) {
		return true
	}
	v, ok := constval.Exact(c.pass.TypesInfo, c.decls, o.expr)
	if !ok {
		f, ok := constval.Float(provenance.Strip(o.val), c.globals)
		return ok && f == 0
	}
	switch v.Kind() {
	case constant.Int, constant.Float:
	case constant.Complex:
		return constant.Sign(constant.Real(v)) == 0 && constant.Sign(constant.Imag(v)) == 0
	default:
		return false // a boolean or string: no number to judge
	}
	if constant.Sign(v) == 0 {
		return true
	}
	f, _ := constant.Float64Val(v)
	return f > 1.79e308 || f < -1.79e308
}

// deliberate reports whether cur lies in a test function that says it
// checks exactness (fixes.FuncSaysExact): one correctly rounded operation
// on each side gives the same float (IEEE 754-2019 §4.3), and such tests
// check exactly that, so a tolerance would defeat them. The answer is
// kept per function.
func (c *checker) deliberate(cur inspector.Cursor) bool {
	if !c.inTest(cur) {
		return false
	}
	fd := enclosingFunc(cur)
	says, ok := c.saysExact[fd]
	if !ok {
		says = fixes.FuncSaysExact(c.pass.Fset, fileOf(cur), cur)
		c.saysExact[fd] = says
	}
	return says
}

// inForCond reports whether cur lies in the condition of a for statement,
// possibly inside && and || chains and parentheses, returning the statement.
func inForCond(cur inspector.Cursor) (*ast.ForStmt, bool) {
	for {
		k := cur.ParentEdgeKind()
		switch k {
		case edge.ForStmt_Cond:
			return cur.Parent().Node().(*ast.ForStmt), true
		case edge.ParenExpr_X, edge.BinaryExpr_X, edge.BinaryExpr_Y:
			if b, ok := cur.Parent().Node().(*ast.BinaryExpr); ok && b.Op != token.LAND && b.Op != token.LOR {
				return nil, false
			}
			cur = cur.Parent()
		default:
			return nil, false
		}
	}
}

// fileOf returns the file enclosing cur.
func fileOf(cur inspector.Cursor) *ast.File {
	for f := range cur.Enclosing((*ast.File)(nil)) {
		return f.Node().(*ast.File)
	}
	return nil
}
