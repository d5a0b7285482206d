package degree

import (
	"go/ast"
	"go/token"
	"go/types"
	"math"
	"strconv"

	"golang.org/x/tools/go/types/typeutil"
)

// none is the degree of a variable that has no value of its own yet (its
// zero value, or itself while its assignments are being read): it does
// not raise the larger of a sum.
var none = math.Inf(-1)

// Reader reads degrees in one package. Its zero value is not usable: use
// New.
type Reader struct {
	fset   *token.FileSet
	info   *types.Info
	funcs  map[*types.Func]*ast.FuncDecl
	sets   map[*types.Var][]ast.Expr // values given to local variables; a nil value is the zero value
	poison map[*types.Var]bool       // local variables multiplied by themselves or changed through pointers
	tuples map[*types.Var][]result   // values given to local variables from calls of several results
	scales map[*types.Var][]scaling  // v *= e and v /= e outside loops, in order
	loops  []ast.Node                // the loops of the functions indexed
	lits   []ast.Node                // their function literals, which may run after a later assignment
	params map[*types.Var]bool
	done   map[*ast.FuncDecl]bool
	memo   map[string]float64
	busy   map[*types.Var]bool
	cancel map[cancelKey]bool
	files  []*ast.File
	plain  map[*types.Var][]plainSet   // v = e, v := e, v *= e and v /= e as statements of the block declaring v
	elems  map[*types.Var]bool         // slices and arrays given values by element stores (s[i] = e)
	self   map[*types.Var]bool         // variables multiplied or divided in a loop body that declares them (see plainSets)
	sums   map[*types.Var]ast.Node     // running sums over loops of data-dependent length, by the statement adding to them (see noteSum)
	factor map[string]bool             // entries of fixed-size arrays used as pure factors (see factors)
	units  map[*types.Func]bool        // functions of the package read for returning a direction (see unit)
	vias   map[viaKey]bool             // functions read for returning a dot product or a length (see via)
	dirs   map[*types.Var]bool         // vector fields read for holding directions (see directionField)
	stores map[*types.Var][]fieldStore // values stored into vector fields (see storesOnce)
	kept   map[*types.Func]bool        // pointer methods read for leaving their receiver as it was (see keeps)
	aiming map[*types.Var]bool         // local variables being read for holding directions (see directionVar)
	top    *frame                      // the reading at the top
	shapes map[*types.Func]shape       // functions of the package summarised (see Summarize)
	// imported summarises functions of other packages (see Import).
	imported func(*types.Func) (Summary, bool)
}

// New returns a Reader for the package of files.
func New(fset *token.FileSet, info *types.Info, files []*ast.File) *Reader {
	r := &Reader{fset: fset, info: info, funcs: map[*types.Func]*ast.FuncDecl{}, sets: map[*types.Var][]ast.Expr{}, poison: map[*types.Var]bool{}, tuples: map[*types.Var][]result{}, scales: map[*types.Var][]scaling{},
		params: map[*types.Var]bool{}, done: map[*ast.FuncDecl]bool{}, memo: map[string]float64{}, busy: map[*types.Var]bool{}, cancel: map[cancelKey]bool{}, files: files, plain: map[*types.Var][]plainSet{}, elems: map[*types.Var]bool{}, self: map[*types.Var]bool{}, sums: map[*types.Var]ast.Node{},
		units: map[*types.Func]bool{}, vias: map[viaKey]bool{}, dirs: map[*types.Var]bool{}, kept: map[*types.Func]bool{}, aiming: map[*types.Var]bool{}, shapes: map[*types.Func]shape{}, top: &frame{known: map[*types.Var]float64{}}}
	for _, f := range files {
		for _, d := range f.Decls {
			if fd, ok := d.(*ast.FuncDecl); ok && fd.Body != nil {
				if fn, ok := info.Defs[fd.Name].(*types.Func); ok {
					r.funcs[fn] = fd
				}
			}
		}
	}
	return r
}

// Of returns the degree of e, an expression inside fd, and whether it
// could be read.
func (r *Reader) Of(fd *ast.FuncDecl, e ast.Expr) (float64, bool) {
	r.index(fd)
	d := r.of(e, r.top, 0)
	return d, !math.IsNaN(d) && !math.IsInf(d, 0)
}

// cancelKey is a variable read by Cancels, in a call with the same
// receiver and argument or not.
type cancelKey struct {
	v    *types.Var
	self bool
}

// result is the i-th result of a call.
type result struct {
	call *ast.CallExpr
	i    int
}

// plainSet is an assignment v = e, v := e, or v *= e (read as v = v*e),
// that is a statement of the block declaring v (no branch or loop between
// them), ending at end.
type plainSet struct {
	end token.Pos
	e   ast.Expr
}

// scaling is v *= by or v /= by.
type scaling struct {
	op token.Token
	by ast.Expr
}

// env is what one reading knows: the parameters bound to the degrees of
// the arguments of a call being read (none at the top, where every
// parameter is of degree 1), and the degrees of variables read so far.
type env = *frame

type frame struct {
	bound map[*types.Var]float64
	known map[*types.Var]float64
}

// of returns the degree of e: NaN when unknown, none when e has no value
// of its own.
func (r *Reader) of(e ast.Expr, bind env, depth int) float64 {
	if depth > 40 {
		return math.NaN()
	}
	if tv, ok := r.info.Types[e]; ok && (tv.Value != nil || isInteger(tv.Type)) {
		return 0 // constants and counts are not measured in the data's units
	}
	switch e := e.(type) {
	case *ast.ParenExpr:
		return r.of(e.X, bind, depth)
	case *ast.UnaryExpr:
		if e.Op == token.SUB || e.Op == token.ADD {
			return r.of(e.X, bind, depth+1)
		}
	case *ast.StarExpr:
		return r.of(e.X, bind, depth+1)
	case *ast.IndexExpr:
		if key, ok := r.entry(e); ok && r.factors()[key] {
			return 0
		}
		return r.of(e.X, bind, depth+1)
	case *ast.SliceExpr:
		return r.of(e.X, bind, depth+1)
	case *ast.SelectorExpr:
		if sel, ok := r.info.Selections[e]; ok && sel.Kind() == types.FieldVal {
			if r.onDirection(sel, len(sel.Index())) {
				return 0 // a direction, or a component of one
			}
			return r.of(e.X, bind, depth+1)
		}
	case *ast.Ident:
		return r.ident(e, bind, depth)
	case *ast.BinaryExpr:
		return r.binary(e, bind, depth)
	case *ast.CallExpr:
		if r.isMake(e) {
			return none // zero values until its elements are stored
		}
		return r.call(e, 0, bind, depth)
	case *ast.CompositeLit:
		d := none
		for _, elt := range e.Elts {
			if kv, ok := elt.(*ast.KeyValueExpr); ok {
				elt = kv.Value
			}
			d = larger(d, r.of(elt, bind, depth+1))
		}
		return d
	}
	return math.NaN()
}

// ident reads a variable: a parameter is the data (or what the call being
// read binds it to); a local variable is the largest of the values it is
// given, or the last one before the use where all are plain statements of
// the body (see reaching).
func (r *Reader) ident(id *ast.Ident, bind env, depth int) float64 {
	v := r.varOf(id)
	if v == nil {
		return math.NaN()
	}
	if e, ok := r.reaching(v, id.Pos()); ok {
		return r.of(e, bind, depth+1)
	}
	if d, ok := bind.known[v]; ok {
		return d
	}
	sets, ok := r.sets[v]
	d, bound := bind.bound[v]
	switch {
	case r.poison[v] || r.self[v]:
		return math.NaN() // multiplied by itself, or changed through a pointer
	case bound:
	case r.params[v]:
		d = 1
	case !ok:
		return math.NaN() // a package variable
	default:
		d = none
	}
	if r.busy[v] {
		return none
	}
	r.busy[v] = true
	defer delete(r.busy, v)
	defer func() { bind.known[v] = d }() // in a cycle, what its other values give
	for _, s := range sets {
		if s != nil {
			d = larger(d, r.of(s, bind, depth+1))
		}
	}
	for _, t := range r.tuples[v] {
		d = larger(d, r.call(t.call, t.i, bind, depth+1))
	}
	for _, sc := range r.scales[v] {
		d = combine(sc.op, d, r.of(sc.by, bind, depth+1))
	}
	return d
}

// binary reads a product, quotient, sum or difference.
func (r *Reader) binary(b *ast.BinaryExpr, bind env, depth int) float64 {
	x, y := r.of(b.X, bind, depth+1), r.of(b.Y, bind, depth+1)
	if (b.Op == token.ADD || b.Op == token.SUB) && !math.IsInf(x, 0) && !math.IsInf(y, 0) && !r.fixed(b.X) && !r.fixed(b.Y) {
		return min(x, y) // terms of one unit; read apart, a factor read as data is a pure number
	}
	return combine(b.Op, x, y)
}

// fixed reports whether e is a constant or an integer (a count, also
// converted to float), of degree 0 by type.
func (r *Reader) fixed(e ast.Expr) bool {
	e = ast.Unparen(e)
	if call, ok := e.(*ast.CallExpr); ok && len(call.Args) == 1 && r.info.Types[call.Fun].IsType() {
		e = call.Args[0]
	}
	tv := r.info.Types[e]
	return tv.Value != nil || tv.Type != nil && isInteger(tv.Type)
}

// combine returns the degree of x op y from theirs.
func combine(op token.Token, x, y float64) float64 {
	switch op {
	case token.ADD, token.SUB:
		return larger(x, y)
	case token.MUL, token.QUO:
		if math.IsNaN(x) || math.IsNaN(y) {
			return math.NaN()
		}
		if x == none || y == none {
			return none // a variable read while its value is: this value says nothing new
		}
		if op == token.QUO {
			return x - y
		}
		return x + y
	}
	return math.NaN()
}

// larger returns the larger degree; NaN wins.
func larger(x, y float64) float64 {
	if math.IsNaN(x) || math.IsNaN(y) {
		return math.NaN()
	}
	return max(x, y)
}

// call reads result i of a conversion, a builtin, a math function, or a
// function of the package through its returns.
func (r *Reader) call(call *ast.CallExpr, i int, bind env, depth int) float64 {
	if tv, ok := r.info.Types[call.Fun]; ok && tv.IsType() && len(call.Args) == 1 {
		return r.of(call.Args[0], bind, depth+1)
	}
	args := make([]float64, len(call.Args))
	for i, a := range call.Args {
		args[i] = r.of(a, bind, depth+1)
	}
	if b, ok := typeutil.Callee(r.info, call).(*types.Builtin); ok && (b.Name() == "append" || b.Name() == "min" || b.Name() == "max") {
		d := none
		for _, a := range args {
			d = larger(d, a) // the values kept, or the one chosen
		}
		return d
	}
	fn, ok := typeutil.Callee(r.info, call).(*types.Func)
	if !ok {
		if r.fromParam(call.Fun) {
			return 1 // a function the caller gives: its values are the caller's data
		}
		return math.NaN()
	}
	if fn.Pkg() != nil && fn.Pkg().Path() == "math" {
		return mathDegree(fn.Name(), args, r.info, call)
	}
	fd, ok := r.funcs[fn]
	if !ok {
		return r.importedDegree(fn)
	}
	if r.unit(fn) {
		return 0 // a direction, whatever it was made from
	}
	recv := none
	if sel, ok := call.Fun.(*ast.SelectorExpr); ok && fn.Signature().Recv() != nil {
		recv = r.of(sel.X, bind, depth+1)
		if s := r.info.Selections[sel]; s != nil && len(s.Index()) > 1 && r.onDirection(s, len(s.Index())-1) {
			recv = 0 // a method promoted from an embedded direction
		}
	}
	return r.through(fd, fn, i, recv, args, depth)
}

// importedDegree returns the degree of a call of a function of another
// package from its summary: 0 for a direction or a cosine, bounded by 1
// whatever the inputs; unknown otherwise, a dot product or a length too,
// whose inputs' size that package's own contract may fix (unit points).
func (r *Reader) importedDegree(fn *types.Func) float64 {
	if s, ok := r.summary(fn); ok && (s.Shape == Unit || s.Shape == Cosine) {
		return 0
	}
	return math.NaN()
}

// mathDegree returns the degree of a math function's result from its
// arguments' degrees.
func mathDegree(name string, args []float64, info *types.Info, call *ast.CallExpr) float64 {
	switch name {
	case "Sqrt":
		return args[0] / 2
	case "Cbrt":
		return args[0] / 3
	case "Abs", "Copysign":
		return args[0]
	case "Floor", "Ceil", "Trunc", "Round", "RoundToEven":
		return math.NaN() // integrality depends on the unit: a count or a pure number, not data of any size
	case "Max", "Min", "Hypot", "Mod", "Remainder", "Dim":
		return larger(args[0], args[1])
	case "Pow":
		if tv := info.Types[call.Args[1]]; tv.Value != nil {
			k, _ := strconv.ParseFloat(tv.Value.ExactString(), 64)
			return args[0] * k
		}
	case "Sin", "Cos", "Sincos", "Asin", "Acos", "Atan", "Atan2", "Tanh", "Erf", "Erfc":
		return 0 // bounded results
	case "NaN", "Inf":
		return none // no size
	}
	return math.NaN()
}

// through reads result i of a function of the package called with
// arguments of the given degrees: the largest degree among its returns,
// once per function, result and degrees.
func (r *Reader) through(fd *ast.FuncDecl, fn *types.Func, i int, recv float64, args []float64, depth int) float64 {
	key := fn.FullName() + strconv.Itoa(i) + ":" + strconv.FormatFloat(recv, 'g', -1, 64)
	for _, a := range args {
		key += "," + strconv.FormatFloat(a, 'g', -1, 64)
	}
	if d, ok := r.memo[key]; ok {
		return d
	}
	r.memo[key] = math.NaN() // recursion: unknown
	r.index(fd)
	bind := &frame{bound: map[*types.Var]float64{}, known: map[*types.Var]float64{}}
	sig := fn.Signature()
	if sig.Recv() != nil {
		bind.bound[sig.Recv()] = recv
	}
	for k := range sig.Params().Len() {
		if k < len(args) && !sig.Variadic() {
			bind.bound[sig.Params().At(k)] = args[k]
		}
	}
	d := none
	ast.Inspect(fd.Body, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.FuncLit:
			return false
		case *ast.ReturnStmt:
			if i < len(n.Results) {
				d = larger(d, r.of(n.Results[i], bind, 0)) // a fresh depth: memo stops recursion
			}
		}
		return true
	})
	r.memo[key] = d
	return d
}

// index learns the parameters and the assignments of the local variables
// of fd, once.
func (r *Reader) index(fd *ast.FuncDecl) {
	if r.done[fd] {
		return
	}
	r.done[fd] = true
	ops := map[*ast.AssignStmt]bool{}
	if !jumps(fd) {
		ops = r.plainSets(fd)
	}
	ast.Inspect(fd, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.FuncType:
			r.fieldVars(n.Params)
		case *ast.FuncDecl:
			r.fieldVars(n.Recv)
		case *ast.ForStmt, *ast.RangeStmt:
			r.loops = append(r.loops, n)
		case *ast.FuncLit:
			r.lits = append(r.lits, n)
		}
		switch n := n.(type) {
		case *ast.AssignStmt:
			r.assign(n, ops[n])
		case *ast.ValueSpec:
			for i, name := range n.Names {
				r.set(name, nil)
				if len(n.Values) == len(n.Names) {
					r.set(name, n.Values[i])
				}
			}
		case *ast.RangeStmt:
			if id, ok := n.Value.(*ast.Ident); ok {
				r.set(id, n.X)
			}
		case *ast.UnaryExpr:
			if id, ok := ast.Unparen(n.X).(*ast.Ident); ok && n.Op == token.AND {
				r.spoil(id) // changed through a pointer
			}
		}
		return true
	})
}

// jumps reports whether fd holds a label: a jump back may carry a later
// value to an earlier statement.
func jumps(fd *ast.FuncDecl) bool {
	found := false
	ast.Inspect(fd.Body, func(n ast.Node) bool {
		_, found = n.(*ast.LabeledStmt)
		return !found
	})
	return found
}

func (r *Reader) fieldVars(fl *ast.FieldList) {
	if fl == nil {
		return
	}
	for _, f := range fl.List {
		for _, name := range f.Names {
			if v, ok := r.info.Defs[name].(*types.Var); ok {
				r.params[v] = true
			}
		}
	}
}

// assign records v = e, v := e, v += e and v -= e (a sum of values of
// degree d stays of degree d), and the same stores into elements of a
// local slice or array s[i] (its values are those of its elements); v *=
// e and v /= e are read as v = v*e where plain (a statement of the block
// declaring v, see plainSets), else they leave v unknown but outside
// loops.
func (r *Reader) assign(as *ast.AssignStmt, plain bool) {
	for i, l := range as.Lhs {
		if r.store(as, i) {
			continue
		}
		id, ok := ast.Unparen(l).(*ast.Ident)
		if !ok {
			continue
		}
		call, isCall := as.Rhs[0].(*ast.CallExpr)
		switch {
		case len(as.Rhs) == 1 && len(as.Lhs) > 1 && isCall && as.Tok != token.ADD_ASSIGN:
			if v := r.varOf(id); v != nil {
				r.tuples[v] = append(r.tuples[v], result{call, i})
				r.sets[v] = append(r.sets[v], nil)
			}
		case len(as.Lhs) != len(as.Rhs):
			r.spoil(id)
		case as.Tok == token.ASSIGN || as.Tok == token.DEFINE || as.Tok == token.ADD_ASSIGN || as.Tok == token.SUB_ASSIGN:
			r.set(id, as.Rhs[i])
			if v := r.varOf(id); v != nil {
				r.noteSum(as, i, v)
			}
		case plain && r.inLoop(as):
			r.set(id, selfOp(as, i)) // x := a - b; x *= x in a loop body: a fresh square each pass
			r.self[r.varOf(id)] = true
		case (as.Tok == token.MUL_ASSIGN || as.Tok == token.QUO_ASSIGN) && !r.inLoop(as) && r.varOf(id) != nil:
			v := r.varOf(id) // scaled once in straight code (b /= a): its degree moves by e's
			r.scales[v] = append(r.scales[v], scaling{map[token.Token]token.Token{token.MUL_ASSIGN: token.MUL, token.QUO_ASSIGN: token.QUO}[as.Tok], as.Rhs[i]})
		default:
			r.spoil(id)
		}
	}
}

// store records as's i-th target when it is an element of a local slice
// or array s, or a field of a local struct (s[i] = e, s[i][j] += e, w.in
// += e), and reports whether it is: the variable's values are those of
// its parts.
func (r *Reader) store(as *ast.AssignStmt, i int) bool {
	id, ok := r.partOf(as.Lhs[i])
	if !ok || id == nil || r.varOf(id) == nil || r.params[r.varOf(id)] {
		return ok
	}
	switch {
	case len(as.Lhs) == len(as.Rhs) && (as.Tok == token.ASSIGN || as.Tok == token.ADD_ASSIGN || as.Tok == token.SUB_ASSIGN):
		r.set(id, as.Rhs[i])
		r.elems[r.varOf(id)] = true
		r.noteSum(as, i, r.varOf(id))
	default:
		r.spoil(id)
	}
	return true
}

// partOf returns the variable whose element or field e is, through
// elements and fields held by value, and whether e is such a part; the
// identifier is nil where the root is not a variable (a call, a field
// reached through a pointer).
func (r *Reader) partOf(e ast.Expr) (*ast.Ident, bool) {
	part := false
	for {
		switch x := ast.Unparen(e).(type) {
		case *ast.IndexExpr:
			e, part = x.X, true
			continue
		case *ast.SelectorExpr:
			if sel, ok := r.info.Selections[x]; ok && sel.Kind() == types.FieldVal {
				if sel.Indirect() {
					return nil, true
				}
				e, part = x.X, true
				continue
			}
		case *ast.Ident:
			return x, part
		}
		return nil, part
	}
}

// selfOp returns v *= e or v /= e, the i-th of as, as the value v*e or v/e.
func selfOp(as *ast.AssignStmt, i int) ast.Expr {
	op := map[token.Token]token.Token{token.MUL_ASSIGN: token.MUL, token.QUO_ASSIGN: token.QUO}[as.Tok]
	return &ast.BinaryExpr{X: as.Lhs[i], OpPos: as.TokPos, Op: op, Y: as.Rhs[i]}
}

// isMake reports whether e is make(...): zero values.
func (r *Reader) isMake(e ast.Expr) bool {
	call, ok := ast.Unparen(e).(*ast.CallExpr)
	if !ok {
		return false
	}
	b, ok := typeutil.Callee(r.info, call).(*types.Builtin)
	return ok && b.Name() == "make"
}

// reaching returns the value of v at pos when every assignment of v is a
// plain statement of its function's body: the last one before pos (start
// = start.unit() makes start a pure number after it, whatever it was
// before). No loop or branch holds an assignment, so none can reach pos
// from elsewhere; a parameter read before them all is read as usual.
func (r *Reader) reaching(v *types.Var, pos token.Pos) (ast.Expr, bool) {
	ps := r.plain[v]
	if len(ps) == 0 || len(ps) != len(r.sets[v]) || len(r.tuples[v]) > 0 || len(r.scales[v]) > 0 || r.poison[v] {
		return nil, false
	}
	for _, l := range r.lits {
		if l.Pos() <= pos && pos < l.End() {
			return nil, false
		}
	}
	var e ast.Expr
	for _, p := range ps {
		if p.end <= pos {
			e = p.e
		}
	}
	return e, e != nil
}

// plainSets records the assignments v = e, v := e, v *= e and v /= e
// that are statements of the block declaring v (a parameter: of fd's body
// itself), and returns those of the last two kinds. A variable declared
// in a loop body starts afresh each pass, so within the pass only the
// statements before a use reach it: x := a - b; x *= x is a square of
// degree 2·deg(a), where x declared outside the loop and squared each pass
// grows without bound.
func (r *Reader) plainSets(fd *ast.FuncDecl) map[*ast.AssignStmt]bool {
	ops := map[*ast.AssignStmt]bool{}
	ast.Inspect(fd.Body, func(n ast.Node) bool {
		b, ok := n.(*ast.BlockStmt)
		if !ok {
			_, lit := n.(*ast.FuncLit)
			return !lit
		}
		scope := r.info.Scopes[b]
		if b == fd.Body {
			scope = r.info.Scopes[fd.Type]
		}
		for _, st := range b.List {
			as, ok := st.(*ast.AssignStmt)
			if !ok || len(as.Lhs) != len(as.Rhs) {
				continue
			}
			for i, l := range as.Lhs {
				id, ok := ast.Unparen(l).(*ast.Ident)
				if !ok || r.varOf(id) == nil || r.varOf(id).Parent() != scope {
					continue
				}
				v := r.varOf(id)
				switch as.Tok {
				case token.ASSIGN, token.DEFINE:
					r.plain[v] = append(r.plain[v], plainSet{as.End(), as.Rhs[i]})
				case token.MUL_ASSIGN, token.QUO_ASSIGN:
					ops[as] = true
					r.plain[v] = append(r.plain[v], plainSet{as.End(), selfOp(as, i)})
				}
			}
		}
		return true
	})
	return ops
}

// inLoop reports whether n lies in a loop of an indexed function, where
// a scaling may repeat.
func (r *Reader) inLoop(n ast.Node) bool {
	for _, l := range r.loops {
		if l.Pos() <= n.Pos() && n.End() <= l.End() {
			return true
		}
	}
	return false
}

// set records that the local variable id may hold e (nil: its zero value).
func (r *Reader) set(id *ast.Ident, e ast.Expr) {
	v := r.varOf(id)
	if v == nil {
		return
	}
	r.sets[v] = append(r.sets[v], e)
}

// spoil marks id as a variable whose degree cannot be read.
func (r *Reader) spoil(id *ast.Ident) {
	if v := r.varOf(id); v != nil {
		r.poison[v] = true
	}
}

func (r *Reader) varOf(id *ast.Ident) *types.Var {
	if v, ok := r.info.Defs[id].(*types.Var); ok {
		return v
	}
	v, _ := r.info.Uses[id].(*types.Var)
	return v
}

func isInteger(t types.Type) bool {
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&types.IsInteger != 0
}

// Cancels reports whether e, an expression inside fd, can cancel: a
// difference or sum of two values neither of them constant (a sum of
// non-negative terms excepted), a remainder (math.Mod, math.Remainder: an
// exact difference x - k·y), a product or quotient with such a factor, a
// variable every value of which cancels, or a call of a function of the
// package whose result does (the i-th of several results, for a variable
// given several at once: d, ok := split(a, b)). Near zero such a quantity is made of its
// terms' rounding, eps times their size; a product of values that do not
// cancel keeps a relative error, eps times its own size.
func (r *Reader) Cancels(fd *ast.FuncDecl, e ast.Expr) bool {
	r.index(fd)
	return r.cancels(e, false, 0)
}

// cancels reads x; self says that x is in a function called with the
// same value for its receiver and arguments (a.Dot(a)), so p.X*q.X is a
// square there.
func (r *Reader) cancels(x ast.Expr, self bool, depth int) bool {
	if depth > 8 {
		return false
	}
	switch e := ast.Unparen(x).(type) {
	case *ast.Ident:
		return r.varCancels(e, self, depth)
	case *ast.IndexExpr:
		return r.cancels(e.X, self, depth+1)
	case *ast.BinaryExpr:
		switch e.Op {
		case token.SUB:
			return r.info.Types[e.X].Value == nil && r.info.Types[e.Y].Value == nil
		case token.ADD:
			return r.info.Types[e.X].Value == nil && r.info.Types[e.Y].Value == nil && !(squares(r.info, e.X, self) && squares(r.info, e.Y, self))
		case token.MUL, token.QUO:
			return r.cancels(e.X, self, depth+1) || r.cancels(e.Y, self, depth+1)
		}
	case *ast.CompositeLit:
		for _, elt := range e.Elts {
			if kv, ok := elt.(*ast.KeyValueExpr); ok {
				elt = kv.Value
			}
			if r.cancels(elt, self, depth+1) {
				return true
			}
		}
	case *ast.CallExpr:
		return r.callCancels(e, 0, depth)
	}
	return false
}

// varCancels reports whether every value given to the local variable id
// cancels; for a slice or array given values by element stores, whether
// one does: each element keeps the value stored in it, so the elements
// stored from a cancelling difference are noise of eps times its terms.
func (r *Reader) varCancels(id *ast.Ident, self bool, depth int) bool {
	v := r.varOf(id)
	key := cancelKey{v, self}
	if c, ok := r.cancel[key]; ok {
		return c
	}
	sets := r.sets[v]
	if len(sets) == 0 || r.poison[v] || r.params[v] {
		return false
	}
	if r.busy[v] {
		return false
	}
	r.busy[v] = true
	defer delete(r.busy, v)
	values := func(yield func(bool) bool) {
		for _, s := range sets {
			if s != nil && !r.isMake(s) && !yield(r.cancels(s, self, depth+1)) {
				return
			}
		}
		for _, t := range r.tuples[v] {
			if !yield(r.callCancels(t.call, t.i, depth+1)) {
				return
			}
		}
	}
	c := false
	for c = range values {
		if c == r.elems[v] {
			break // one value that does not cancel decides for a variable, one that does for elements
		}
	}
	r.cancel[key] = c
	return c
}

// callCancels reports whether a call's result can cancel: a remainder,
// or a function of the package whose returned value cancels.
func (r *Reader) callCancels(call *ast.CallExpr, i int, depth int) bool {
	fn, ok := typeutil.Callee(r.info, call).(*types.Func)
	if !ok || fn.Pkg() == nil {
		return false
	}
	if fn.Pkg().Path() == "math" {
		return fn.Name() == "Mod" || fn.Name() == "Remainder"
	}
	fd, ok := r.funcs[fn]
	if !ok {
		return false
	}
	r.index(fd)
	self := sameOperands(call)
	found := false
	ast.Inspect(fd.Body, func(n ast.Node) bool {
		if ret, ok := n.(*ast.ReturnStmt); ok && i < len(ret.Results) {
			found = found || r.cancels(ret.Results[i], self, depth+1)
		}
		_, lit := n.(*ast.FuncLit)
		return !found && !lit
	})
	return found
}

// sameOperands reports whether a method call passes its receiver again
// as its only argument (a.Dot(a)).
func sameOperands(call *ast.CallExpr) bool {
	sel, ok := call.Fun.(*ast.SelectorExpr)
	return ok && len(call.Args) == 1 && types.ExprString(sel.X) == types.ExprString(call.Args[0])
}

// square reports whether e is non-negative by construction (see
// NonNegative), or, with self, a product of the same field of the
// receiver and of the argument (p.X*q.X in a.Dot(a)).
func square(info *types.Info, e ast.Expr, self bool) bool {
	if NonNegative(info, e) {
		return true
	}
	m, ok := ast.Unparen(e).(*ast.BinaryExpr)
	if !ok || m.Op != token.MUL || !self {
		return false
	}
	x, okx := ast.Unparen(m.X).(*ast.SelectorExpr)
	y, oky := ast.Unparen(m.Y).(*ast.SelectorExpr)
	return okx && oky && x.Sel.Name == y.Sel.Name
}

// squares reports whether e is a square (see square) or a sum of them,
// x*x + y*y + z*z: a sum of non-negative terms does not cancel, its
// rounding error is relative, a few eps of its own value.
func squares(info *types.Info, e ast.Expr, self bool) bool {
	if b, ok := ast.Unparen(e).(*ast.BinaryExpr); ok && b.Op == token.ADD {
		return squares(info, b.X, self) && squares(info, b.Y, self)
	}
	return square(info, e, self)
}

// NonNegative reports whether e is non-negative by construction: a square
// x*x, or a call of math.Abs, Sqrt, Hypot or Exp.
func NonNegative(info *types.Info, e ast.Expr) bool {
	switch e := ast.Unparen(e).(type) {
	case *ast.BinaryExpr:
		return e.Op == token.MUL && types.ExprString(e.X) == types.ExprString(e.Y)
	case *ast.CallExpr:
		fn, _ := typeutil.Callee(info, e).(*types.Func)
		return fn != nil && fn.Pkg() != nil && fn.Pkg().Path() == "math" && map[string]bool{"Abs": true, "Sqrt": true, "Hypot": true, "Exp": true}[fn.Name()]
	}
	return false
}

// Rounds reports whether e, an expression inside fd, carries a rounding
// error of its own: it is computed by arithmetic (a sum, product or
// quotient, a call other than a conversion, math.Abs, Copysign, Mod or
// Remainder, which are exact) rather than read as the caller gave it. A
// difference of two values read as given is exact when they are close
// (Sterbenz; Goldberg 1991, Thm 11): no rounding drowns a tolerance there.
func (r *Reader) Rounds(fd *ast.FuncDecl, e ast.Expr) bool {
	r.index(fd)
	return r.rounds(e, 0)
}

func (r *Reader) rounds(e ast.Expr, depth int) bool {
	if depth > 8 {
		return true
	}
	switch x := ast.Unparen(e).(type) {
	case *ast.Ident:
		v := r.varOf(x)
		if v == nil || r.params[v] || r.busy[v] {
			return false
		}
		r.busy[v] = true
		defer delete(r.busy, v)
		for _, s := range r.sets[v] {
			if s != nil && r.rounds(s, depth+1) {
				return true
			}
		}
		return len(r.tuples[v]) > 0 || len(r.scales[v]) > 0
	case *ast.SelectorExpr:
		return r.rounds(x.X, depth+1)
	case *ast.IndexExpr:
		return r.rounds(x.X, depth+1)
	case *ast.StarExpr:
		return r.rounds(x.X, depth+1)
	case *ast.UnaryExpr:
		return r.rounds(x.X, depth+1)
	case *ast.BinaryExpr:
		return r.info.Types[x].Value == nil
	case *ast.CallExpr:
		if len(x.Args) == 1 && r.info.Types[x.Fun].IsType() {
			return r.rounds(x.Args[0], depth+1)
		}
		fn, ok := typeutil.Callee(r.info, x).(*types.Func)
		if ok && fn.Pkg() != nil && fn.Pkg().Path() == "math" && exact[fn.Name()] {
			for _, a := range x.Args {
				if r.rounds(a, depth+1) {
					return true
				}
			}
			return false
		}
		return true
	}
	return false
}

// exact lists the math functions whose result is exact.
var exact = map[string]bool{"Abs": true, "Copysign": true, "Mod": true, "Remainder": true}

// entry returns a key for e when it is an entry of a fixed-size array at
// constant indices (m[0][1]): its type and the indices.
func (r *Reader) entry(e ast.Expr) (string, bool) {
	path := ""
	for {
		ix, ok := ast.Unparen(e).(*ast.IndexExpr)
		if !ok {
			break
		}
		if r.info.Types[ix.Index].Value == nil {
			return "", false
		}
		path = "[" + r.info.Types[ix.Index].Value.ExactString() + "]" + path
		e = ix.X
	}
	t := r.info.TypeOf(e)
	if _, ok := t.Underlying().(*types.Array); !ok || path == "" {
		return "", false
	}
	return types.TypeString(t, nil) + path, true
}

// factors returns the entries of fixed-size arrays that the package uses
// as pure factors, read once: by dimensional consistency, in a sum
// m[0][0]*p.x + m[0][2] of a parameter's entry m[0][2] (degree 1) and a
// product of another entry with data p.x (degree 1), that entry is of
// degree 0 (the linear part of an affine map, beside its offset).
func (r *Reader) factors() map[string]bool {
	if r.factor != nil {
		return r.factor
	}
	r.factor = map[string]bool{}
	for _, f := range r.files {
		ast.Inspect(f, func(n ast.Node) bool {
			if b, ok := n.(*ast.BinaryExpr); ok && (b.Op == token.ADD || b.Op == token.SUB) {
				r.factorsIn(terms(b, nil))
			}
			return true
		})
	}
	return r.factor
}

// factorsIn records the factors of a sum of terms: entries multiplied by
// data from outside their array, beside a parameter's entry of the same
// array type added as it is.
func (r *Reader) factorsIn(ts []ast.Expr) {
	offsets := map[string]bool{} // array types with an entry added as it is
	for _, t := range ts {
		if _, ok := r.entry(t); ok && r.fromParam(t) {
			offsets[r.info.TypeOf(rootOf(t)).String()] = true
		}
	}
	for _, t := range ts {
		m, ok := ast.Unparen(t).(*ast.BinaryExpr)
		if !ok || m.Op != token.MUL {
			continue
		}
		for _, pair := range [2][2]ast.Expr{{m.X, m.Y}, {m.Y, m.X}} {
			key, ok := r.entry(pair[0])
			typ := r.info.TypeOf(rootOf(pair[0])).String()
			if ok && offsets[typ] && r.fromParam(pair[1]) && r.info.TypeOf(rootOf(pair[1])).String() != typ {
				r.factor[key] = true
			}
		}
	}
}

// terms returns the terms of a sum or difference, signs dropped.
func terms(e ast.Expr, ts []ast.Expr) []ast.Expr {
	switch x := ast.Unparen(e).(type) {
	case *ast.BinaryExpr:
		if x.Op == token.ADD || x.Op == token.SUB {
			return terms(x.Y, terms(x.X, ts))
		}
	case *ast.UnaryExpr:
		if x.Op == token.SUB || x.Op == token.ADD {
			return terms(x.X, ts)
		}
	}
	return append(ts, e)
}

// rootOf strips indices and field selections from e: m for m[0][1], p
// for p.x.
func rootOf(e ast.Expr) ast.Expr {
	for {
		switch x := ast.Unparen(e).(type) {
		case *ast.IndexExpr:
			e = x.X
		case *ast.SelectorExpr:
			e = x.X
		default:
			return e
		}
	}
}

// fromParam reports whether e is a parameter or receiver, or a field or
// element of one: data of degree 1.
func (r *Reader) fromParam(e ast.Expr) bool {
	id, ok := rootOf(e).(*ast.Ident)
	if !ok {
		return false
	}
	v, ok := r.info.Uses[id].(*types.Var)
	return ok && (v.Kind() == types.ParamVar || v.Kind() == types.RecvVar)
}
