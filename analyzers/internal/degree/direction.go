package degree

import (
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"maps"
	"slices"
	"strconv"

	"golang.org/x/tools/go/types/typeutil"

	"roundoff/analyzers/internal/provenance"
)

// A direction is a vector divided by its own length: its components, and
// the dot product of two directions, are bounded by 1 whatever the data's
// units (see the package comment).

// Shape is what a function's single result is in terms of its inputs
// (the receiver first, then the parameters), read through its returns;
// facts carry it to other packages (see Summarize and Import).
type Shape int

const (
	Dot    Shape = iota // the dot product of inputs In[0] and In[1]
	Length              // the length of input In[0]
	Unit                // a direction
	Cosine              // the cosine of the angle between inputs In[0] and In[1]
	Cross               // the cross product of plane vectors In[0] and In[1], a.X*b.Y - a.Y*b.X
)

// A Summary is the shape of a function's result and the inputs it
// concerns.
type Summary struct {
	Shape Shape
	In    [2]int
}

// viaKey is a function, a shape and the inputs it concerns.
type viaKey struct {
	fn *types.Func
	p  Shape
	in [2]int
}

// vectorKeys returns the components of t, through a pointer, when it is a
// vector: the field names of a struct whose fields are all floats, or the
// indices of an array of floats.
func vectorKeys(t types.Type) []string {
	var keys []string
	switch u := derefd(t).Underlying().(type) {
	case *types.Struct:
		for f := range u.Fields() {
			if !isFloat(f.Type()) {
				return nil
			}
			keys = append(keys, f.Name())
		}
	case *types.Array:
		if !isFloat(u.Elem()) {
			return nil
		}
		for i := range u.Len() {
			keys = append(keys, strconv.FormatInt(i, 10))
		}
	}
	return keys
}

func isFloat(t types.Type) bool {
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&types.IsFloat != 0
}

// isVar reports whether e names x.
func (r *Reader) isVar(e ast.Expr, x *types.Var) bool {
	id, ok := ast.Unparen(e).(*ast.Ident)
	return ok && x != nil && r.varOf(id) == x
}

// comp returns the component of x that e reads (x.Y, x[1]).
func (r *Reader) comp(e ast.Expr, x *types.Var) (string, bool) {
	switch e := ast.Unparen(e).(type) {
	case *ast.SelectorExpr:
		if sel := r.info.Selections[e]; sel != nil && sel.Kind() == types.FieldVal && len(sel.Index()) == 1 && r.isVar(e.X, x) {
			return e.Sel.Name, true
		}
	case *ast.IndexExpr:
		if v := r.info.Types[e.Index].Value; v != nil && r.isVar(e.X, x) {
			return v.ExactString(), true
		}
	}
	return "", false
}

// value follows e through parentheses, conversions and local variables
// given one value (l := v.Len()) to the expression that computes it.
func (r *Reader) value(e ast.Expr) ast.Expr {
	for range 8 {
		switch x := ast.Unparen(e).(type) {
		case *ast.CallExpr:
			if len(x.Args) != 1 || !r.info.Types[x.Fun].IsType() {
				return x
			}
			e = x.Args[0]
		case *ast.Ident:
			v := r.varOf(x)
			if v == nil || r.params[v] || len(r.sets[v]) != 1 || r.sets[v][0] == nil || r.poison[v] || len(r.scales[v]) > 0 {
				return x
			}
			e = r.sets[v][0]
		default:
			return x
		}
	}
	return e
}

// isDot reports whether e is the dot product of a and b: the sum of
// a.c*b.c over every component c of their type, each once, or a call of a
// function of the package that returns one (v.Dot(v), v.LenSq()).
func (r *Reader) isDot(e ast.Expr, a, b *types.Var, depth int) bool {
	e = r.value(e)
	if call, ok := e.(*ast.CallExpr); ok {
		return r.via(call, Dot, a, b, depth)
	}
	keys := vectorKeys(a.Type())
	ts := sumTerms(e, nil)
	if len(keys) == 0 || len(ts) != len(keys) {
		return false
	}
	seen := map[string]bool{}
	for _, t := range ts {
		m, ok := r.value(t).(*ast.BinaryExpr) // float64(v.X*w.X) keeps the product from fusing
		if !ok || m.Op != token.MUL {
			return false
		}
		ka, oka := r.comp(m.X, a)
		kb, okb := r.comp(m.Y, b)
		if !oka || !okb || ka != kb {
			ka, oka = r.comp(m.Y, a)
			kb, okb = r.comp(m.X, b)
		}
		if !oka || !okb || ka != kb {
			return false
		}
		seen[ka] = true
	}
	return len(seen) == len(keys)
}

// sumTerms returns the terms of a sum.
func sumTerms(e ast.Expr, ts []ast.Expr) []ast.Expr {
	if b, ok := ast.Unparen(e).(*ast.BinaryExpr); ok && b.Op == token.ADD {
		return sumTerms(b.Y, sumTerms(b.X, ts))
	}
	return append(ts, e)
}

// isLength reports whether e is the length of x: math.Sqrt of its dot
// product with itself, math.Hypot of its two components, or a call of a
// function of the package that returns one (v.Len()).
func (r *Reader) isLength(e ast.Expr, x *types.Var, depth int) bool {
	call, ok := r.value(e).(*ast.CallExpr)
	if !ok {
		return false
	}
	fn, _ := typeutil.Callee(r.info, call).(*types.Func)
	if fn == nil || fn.Pkg() == nil {
		return false
	}
	if fn.Pkg().Path() != "math" {
		return r.via(call, Length, x, x, depth)
	}
	switch {
	case fn.Name() == "Sqrt":
		return r.isDot(call.Args[0], x, x, depth+1)
	case fn.Name() == "Hypot":
		seen := map[string]bool{}
		return r.hypotOf(call, x, seen) && len(seen) == len(vectorKeys(x.Type()))
	}
	return false
}

// hypotOf reports whether e is math.Hypot of components of x or of such
// calls (math.Hypot(p.X, math.Hypot(p.Y, p.Z))), each component once,
// adding them to seen.
func (r *Reader) hypotOf(e ast.Expr, x *types.Var, seen map[string]bool) bool {
	if k, ok := r.comp(e, x); ok && !seen[k] {
		seen[k] = true
		return true
	}
	call, ok := r.value(e).(*ast.CallExpr)
	if !ok {
		return false
	}
	fn, _ := typeutil.Callee(r.info, call).(*types.Func)
	return fn != nil && fn.Pkg() != nil && fn.Pkg().Path() == "math" && fn.Name() == "Hypot" && r.hypotOf(call.Args[0], x, seen) && r.hypotOf(call.Args[1], x, seen)
}

// isInverseLength reports whether e is 1/|x|.
func (r *Reader) isInverseLength(e ast.Expr, x *types.Var, depth int) bool {
	q, ok := r.value(e).(*ast.BinaryExpr)
	if !ok || q.Op != token.QUO {
		return false
	}
	one := r.info.Types[q.X].Value
	return one != nil && constant.Compare(one, token.EQL, constant.MakeInt64(1)) && r.isLength(q.Y, x, depth)
}

// inputs returns the inputs of a call with the callee's variables for
// them: the receiver first, then the arguments.
func (r *Reader) inputs(call *ast.CallExpr, fn *types.Func) ([]ast.Expr, []*types.Var) {
	sig := fn.Signature()
	var es []ast.Expr
	var vs []*types.Var
	if sel, ok := call.Fun.(*ast.SelectorExpr); ok && sig.Recv() != nil {
		es, vs = append(es, sel.X), append(vs, sig.Recv())
	}
	if sig.Variadic() || len(call.Args) != sig.Params().Len() {
		return es, vs
	}
	for i, a := range call.Args {
		es, vs = append(es, a), append(vs, sig.Params().At(i))
	}
	return es, vs
}

// via reports whether call, of a function of the package with a and b
// among its inputs, returns p of them: every return of the callee is p of
// the inputs it binds to a and b.
func (r *Reader) via(call *ast.CallExpr, p Shape, a, b *types.Var, depth int) bool {
	fn, _ := typeutil.Callee(r.info, call).(*types.Func)
	fd := r.funcs[fn]
	if fd == nil {
		s, ok := r.importedAs(fn, p)
		return ok && r.bindsTo(call, fn, s, a, b)
	}
	if depth > 6 {
		return false
	}
	es, vs := r.inputs(call, fn)
	key := viaKey{fn, p, [2]int{-1, -1}}
	for k, x := range []*types.Var{a, b} {
		for i, e := range es {
			if r.isVar(e, x) && (key.in[k] < 0 || k == 1 && i != key.in[0]) {
				key.in[k] = i
			}
		}
		if key.in[k] < 0 {
			return false // x is not an input as it is
		}
	}
	if ok, known := r.vias[key]; known {
		return ok
	}
	r.vias[key] = false // recursion: no
	ca, cb := vs[key.in[0]], vs[key.in[1]]
	ok := r.allReturns(fd, func(e ast.Expr) bool {
		if p == Dot {
			return r.isDot(e, ca, cb, depth+1)
		}
		return r.isLength(e, ca, depth+1)
	})
	r.vias[key] = ok
	return ok
}

// allReturns reports whether fd has a single result, returns it at least
// once, and every returned value satisfies ok.
func (r *Reader) allReturns(fd *ast.FuncDecl, ok func(ast.Expr) bool) bool {
	if fd.Type.Results.NumFields() != 1 {
		return false
	}
	r.index(fd)
	found, all := false, true
	ast.Inspect(fd.Body, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.FuncLit:
			return false
		case *ast.ReturnStmt:
			found = true
			all = all && len(n.Results) == 1 && ok(n.Results[0])
		}
		return all
	})
	return found && all
}

// normalised reports whether e is x divided by its own length: a vector
// whose every component is x's divided by |x| or multiplied by 1/|x|,
// or a call of a function of the package that scales x so (x.Mul(1/l),
// x.Div(l)).
func (r *Reader) normalised(e ast.Expr, x *types.Var, depth int) bool {
	switch e := r.value(e).(type) {
	case *ast.UnaryExpr:
		return e.Op == token.AND && r.normalised(e.X, x, depth)
	case *ast.CompositeLit:
		op, factors := r.scaledBy(e, x)
		for _, f := range factors {
			if op == token.QUO && !r.isLength(f, x, depth) || op == token.MUL && !r.isInverseLength(f, x, depth) {
				return false
			}
		}
		return len(factors) > 0
	case *ast.CallExpr:
		fn, _ := typeutil.Callee(r.info, e).(*types.Func)
		if r.funcs[fn] == nil {
			return false
		}
		es, vs := r.inputs(e, fn)
		for iv, ev := range es {
			for ik, ek := range es {
				if iv != ik && r.isVar(ev, x) && isFloat(vs[ik].Type()) {
					op := r.scaler(fn, vs[iv], vs[ik])
					if op == token.QUO && r.isLength(ek, x, depth) || op == token.MUL && r.isInverseLength(ek, x, depth) {
						return true
					}
				}
			}
		}
	}
	return false
}

// scaledBy returns the operator and the factors of lit when it is x's
// type with every component x's op a factor (x.X/l, k*x.X, for each
// component once); else no factors.
func (r *Reader) scaledBy(lit *ast.CompositeLit, x *types.Var) (token.Token, []ast.Expr) {
	keys := vectorKeys(x.Type())
	if len(keys) == 0 || len(lit.Elts) != len(keys) || !types.Identical(derefd(r.info.TypeOf(lit)), derefd(x.Type())) {
		return token.ILLEGAL, nil
	}
	op := token.ILLEGAL
	var factors []ast.Expr
	for i, elt := range lit.Elts {
		want := keys[i]
		if kv, ok := elt.(*ast.KeyValueExpr); ok {
			id, _ := kv.Key.(*ast.Ident)
			if id == nil {
				return token.ILLEGAL, nil
			}
			want, elt = id.Name, kv.Value
		}
		b, ok := r.value(elt).(*ast.BinaryExpr)
		if !ok || op != token.ILLEGAL && b.Op != op {
			return token.ILLEGAL, nil
		}
		op = b.Op
		switch k, ok := r.comp(b.X, x); {
		case ok && k == want && (b.Op == token.QUO || b.Op == token.MUL):
			factors = append(factors, b.Y)
		case b.Op == token.MUL:
			if k, ok := r.comp(b.Y, x); ok && k == want {
				factors = append(factors, b.X)
				continue
			}
			return token.ILLEGAL, nil
		default:
			return token.ILLEGAL, nil
		}
	}
	return op, factors
}

func derefd(t types.Type) types.Type {
	if p, ok := t.(*types.Pointer); ok {
		return p.Elem()
	}
	return t
}

// scaler returns the operator by which fn scales its input v by its
// input k (MUL for v.Mul(k), QUO for v.Div(k)), or ILLEGAL.
func (r *Reader) scaler(fn *types.Func, v, k *types.Var) token.Token {
	op := token.ILLEGAL
	ok := r.allReturns(r.funcs[fn], func(e ast.Expr) bool {
		lit, isLit := r.value(e).(*ast.CompositeLit)
		if u, isAddr := r.value(e).(*ast.UnaryExpr); isAddr && u.Op == token.AND {
			lit, isLit = ast.Unparen(u.X).(*ast.CompositeLit)
		}
		if !isLit {
			return false
		}
		o, factors := r.scaledBy(lit, v)
		for _, f := range factors {
			if !r.isVar(f, k) {
				return false
			}
		}
		ok := len(factors) > 0 && (op == token.ILLEGAL || o == op)
		op = o
		return ok
	})
	if !ok {
		return token.ILLEGAL
	}
	return op
}

// unit reports whether fn, a function of the package, returns a
// direction: every return is an input that fn never changes divided by
// its own length, another
// direction, a constant vector no longer than 1 (the zero vector for
// zero input), or the input itself under a test of it (if v.X == 0 &&
// v.Y == 0 { return v }: the zero vector, which has no direction to
// give); at least one return is not of the last two kinds.
func (r *Reader) unit(fn *types.Func) bool {
	if ok, known := r.units[fn]; known {
		return ok
	}
	r.units[fn] = false // recursion: no
	fd := r.funcs[fn]
	if fd == nil {
		_, ok := r.importedAs(fn, Unit)
		r.units[fn] = ok
		return ok
	}
	if fn.Signature().Results().Len() != 1 || vectorKeys(fn.Signature().Results().At(0).Type()) == nil {
		return false
	}
	var ins []*types.Var // the inputs fd only reads: a value of one is what it was given
	if recv := fn.Signature().Recv(); recv != nil && !r.written(fd, recv) {
		ins = append(ins, recv)
	}
	for p := range fn.Signature().Params().Variables() {
		if !r.written(fd, p) {
			ins = append(ins, p)
		}
	}
	r.index(fd)
	guarded := r.guards(fd)
	some := false
	ok := r.allReturns(fd, func(e ast.Expr) bool {
		if r.direction(fd, e, 0) && !r.constantVector(e) {
			some = true
			return true
		}
		for _, x := range ins {
			if r.normalised(e, x, 0) {
				some = true
				return true
			}
			if r.isVar(e, x) && guarded[e.Pos()][x] {
				return true
			}
		}
		return r.constantVector(e)
	})
	r.units[fn] = ok && some
	return ok && some
}

// guards returns, for each return inside the body of an if in fd, the
// variables its condition bounds (see small).
func (r *Reader) guards(fd *ast.FuncDecl) map[token.Pos]map[*types.Var]bool {
	out := map[token.Pos]map[*types.Var]bool{}
	ast.Inspect(fd.Body, func(n ast.Node) bool {
		s, ok := n.(*ast.IfStmt)
		if !ok {
			return true
		}
		tested := map[*types.Var]bool{}
		r.small(s.Cond, tested)
		ast.Inspect(s.Body, func(n ast.Node) bool {
			if ret, ok := n.(*ast.ReturnStmt); ok && len(ret.Results) == 1 {
				if out[ret.Results[0].Pos()] == nil {
					out[ret.Results[0].Pos()] = map[*types.Var]bool{}
				}
				maps.Copy(out[ret.Results[0].Pos()], tested)
			}
			return true
		})
		return true
	})
	return out
}

// small adds to into the variables that cond bounds above by a constant
// no larger than 1 in size (l == 0, n2 < 1e-12, p.X == 0 && p.Y == 0):
// under it an input returned as it is has length at most 1 or is zero.
func (r *Reader) small(cond ast.Expr, into map[*types.Var]bool) {
	b, ok := ast.Unparen(cond).(*ast.BinaryExpr)
	if !ok {
		return
	}
	if b.Op == token.LAND {
		r.small(b.X, into)
		r.small(b.Y, into)
		return
	}
	x, c, op := b.X, b.Y, b.Op
	if r.info.Types[x].Value != nil {
		x, c, op = c, x, map[token.Token]token.Token{token.GTR: token.LSS, token.GEQ: token.LEQ, token.EQL: token.EQL}[op]
	}
	k := r.info.Types[c].Value
	if k == nil || k.Kind() != constant.Int && k.Kind() != constant.Float || op != token.EQL && op != token.LSS && op != token.LEQ {
		return
	}
	if f, _ := constant.Float64Val(k); f >= -1 && f <= 1 {
		r.tested(x, into, 0)
	}
}

// tested adds the variables e reads, and those their single values read.
func (r *Reader) tested(e ast.Expr, into map[*types.Var]bool, depth int) {
	ast.Inspect(e, func(n ast.Node) bool {
		if id, ok := n.(*ast.Ident); ok && r.varOf(id) != nil {
			v := r.varOf(id)
			into[v] = true
			if depth < 3 && len(r.sets[v]) == 1 && r.sets[v][0] != nil {
				r.tested(r.sets[v][0], into, depth+1)
			}
		}
		return true
	})
}

// constantVector reports whether e is a vector literal of constants no
// longer than 1 (a unit axis, the zero vector), or of NaNs (no size at
// all: what some normalisers give the zero vector).
func (r *Reader) constantVector(e ast.Expr) bool {
	e = ast.Unparen(e)
	if u, ok := e.(*ast.UnaryExpr); ok && u.Op == token.AND {
		e = ast.Unparen(u.X)
	}
	lit, ok := e.(*ast.CompositeLit)
	if !ok || vectorKeys(r.info.TypeOf(lit)) == nil {
		return false
	}
	sq := 0.0
	for _, elt := range lit.Elts {
		if kv, ok := elt.(*ast.KeyValueExpr); ok {
			elt = kv.Value
		}
		v := r.info.Types[elt].Value
		if call, ok := ast.Unparen(elt).(*ast.CallExpr); ok && v == nil {
			fn, _ := typeutil.Callee(r.info, call).(*types.Func)
			if fn != nil && fn.Pkg() != nil && fn.Pkg().Path() == "math" && fn.Name() == "NaN" {
				continue
			}
		}
		if v == nil {
			return false
		}
		f, _ := constant.Float64Val(constant.ToFloat(v))
		sq += f * f
	}
	return sq <= 1+1e-9 // a rounded unit axis (0.7071067811865476, twice) sums to 1 + 2.2e-16
}

// direction reports whether e, an expression inside fd (nil: a package
// initialiser), is a direction: a call of a function of the package that
// returns one (see unit), a field that is one (see directionField), a
// constant vector no longer than 1, or a local variable every value of
// which is one (or the one reaching e).
func (r *Reader) direction(fd *ast.FuncDecl, e ast.Expr, depth int) bool {
	if depth > 8 {
		return false
	}
	if fd != nil {
		r.index(fd)
	}
	switch x := ast.Unparen(e).(type) {
	case *ast.CallExpr:
		if len(x.Args) == 1 && r.info.Types[x.Fun].IsType() {
			return r.direction(fd, x.Args[0], depth+1)
		}
		fn, _ := typeutil.Callee(r.info, x).(*types.Func)
		return fn != nil && r.unit(fn)
	case *ast.SelectorExpr:
		sel := r.info.Selections[x]
		return sel != nil && sel.Kind() == types.FieldVal && r.onDirection(sel, len(sel.Index()))
	case *ast.Ident:
		return r.directionVar(fd, x, depth)
	}
	return r.constantVector(e)
}

// directionVar reports whether the local variable id holds a direction.
func (r *Reader) directionVar(fd *ast.FuncDecl, id *ast.Ident, depth int) bool {
	v := r.varOf(id)
	if v == nil {
		return false
	}
	if e, ok := r.reaching(v, id.Pos()); ok {
		return r.direction(fd, e, depth+1) // d = d.Normalize() before the use
	}
	if r.params[v] || r.poison[v] || len(r.sets[v]) == 0 || len(r.tuples[v]) > 0 || len(r.scales[v]) > 0 {
		return false
	}
	if r.aiming[v] {
		return true // d = d in a loop: its other values decide
	}
	r.aiming[v] = true
	defer delete(r.aiming, v)
	for _, s := range r.sets[v] {
		if s != nil && !r.direction(fd, s, depth+1) {
			return false
		}
	}
	return true
}

// onDirection reports whether one of the first n fields on sel's path is
// a direction: p.Dir, or p.X where X is promoted from an embedded
// direction.
func (r *Reader) onDirection(sel *types.Selection, n int) bool {
	t := sel.Recv()
	for _, i := range sel.Index()[:n] {
		s, ok := derefd(t).Underlying().(*types.Struct)
		if !ok {
			return false
		}
		f := s.Field(i)
		if r.directionField(f) {
			return true
		}
		t = f.Type()
	}
	return false
}

// fieldStore is a value stored into a field, inside fd (nil at package
// level).
type fieldStore struct {
	fd *ast.FuncDecl
	e  ast.Expr
}

// directionField reports whether f is a vector field every store of which
// in the package is a direction: its components are bounded by 1 at every
// read. A field changed in another way (a component stored, its address
// taken, a pointer method called on it that may change it) is not.
func (r *Reader) directionField(f *types.Var) bool {
	if vectorKeys(f.Type()) == nil || !r.declares(f) {
		return false // a field of another package's struct: its stores are elsewhere
	}
	if ok, known := r.dirs[f]; known {
		return ok
	}
	r.storesOnce()
	r.dirs[f] = true // a field stored from itself (r.Dir = s.Dir) is what its other stores make it
	ok := len(r.stores[f]) > 0
	for _, s := range r.stores[f] {
		if !ok {
			break
		}
		ok = s.e != nil && r.direction(s.fd, s.e, 0)
	}
	r.dirs[f] = ok
	return ok
}

// declares reports whether f is declared in the package's files.
func (r *Reader) declares(f *types.Var) bool {
	for _, file := range r.files {
		if file.FileStart <= f.Pos() && f.Pos() < file.FileEnd {
			return true
		}
	}
	return false
}

// storesOnce indexes the stores into vector fields in the package's
// files, once; a nil value marks a field changed in another way. Test
// files are left out: a test builds its own fixtures, which the
// package's invariants do not bind.
func (r *Reader) storesOnce() {
	if r.stores != nil {
		return
	}
	r.stores = map[*types.Var][]fieldStore{}
	for _, f := range r.files {
		if provenance.InTestFile(r.fset, f.Pos()) {
			continue
		}
		for _, d := range f.Decls {
			fd, _ := d.(*ast.FuncDecl)
			ast.Inspect(d, func(n ast.Node) bool {
				r.storesIn(fd, n)
				return true
			})
		}
	}
}

// storesIn records the stores n makes.
func (r *Reader) storesIn(fd *ast.FuncDecl, n ast.Node) {
	switch n := n.(type) {
	case *ast.CompositeLit:
		t := r.info.TypeOf(n)
		if t == nil {
			return
		}
		s, ok := t.Underlying().(*types.Struct)
		if !ok {
			return
		}
		for i, elt := range n.Elts {
			f := (*types.Var)(nil)
			if kv, ok := elt.(*ast.KeyValueExpr); ok {
				id, _ := kv.Key.(*ast.Ident)
				f, _ = r.info.Uses[id].(*types.Var)
				elt = kv.Value
			} else if i < s.NumFields() {
				f = s.Field(i)
			}
			r.record(f, fd, elt)
		}
	case *ast.AssignStmt:
		for i, l := range n.Lhs {
			var e ast.Expr
			if len(n.Lhs) == len(n.Rhs) && (n.Tok == token.ASSIGN || n.Tok == token.DEFINE) {
				e = n.Rhs[i]
			}
			r.changes(fd, l, e)
		}
	case *ast.IncDecStmt:
		r.changes(fd, n.X, nil)
	case *ast.RangeStmt:
		r.changes(fd, n.Key, nil)
		r.changes(fd, n.Value, nil)
	case *ast.UnaryExpr:
		if n.Op == token.AND {
			r.changes(fd, n.X, nil)
		}
	case *ast.CallExpr:
		if sel, ok := n.Fun.(*ast.SelectorExpr); ok && r.info.Selections[sel] != nil && r.info.Selections[sel].Kind() == types.MethodVal {
			if m := r.info.Selections[sel].Obj().(*types.Func); !r.keeps(m) {
				r.changes(fd, sel.X, nil)
			}
		}
	}
}

// keeps reports whether a call of the method m leaves its receiver as
// it was: a value receiver, or a pointer receiver of a method of the
// package that only reads through it (no store, increment or address
// taken under it, the pointer neither passed on, returned nor copied,
// and its own pointer methods keep it).
func (r *Reader) keeps(m *types.Func) bool {
	recv := m.Signature().Recv()
	if _, ptr := recv.Type().(*types.Pointer); !ptr {
		return true
	}
	if ok, known := r.kept[m]; known {
		return ok
	}
	fd := r.funcs[m]
	r.kept[m] = fd != nil // recursion: what its other statements say
	ok := fd != nil
	if ok {
		ast.Inspect(fd.Body, func(n ast.Node) bool {
			ok = ok && r.readsOnly(n, recv)
			return ok
		})
	}
	r.kept[m] = ok
	return ok
}

// readsOnly reports whether n, a node in a method with pointer receiver
// recv, neither changes what recv points to nor lets the pointer out.
func (r *Reader) readsOnly(n ast.Node, recv *types.Var) bool {
	if r.writes(n, recv) {
		return false
	}
	out := func(es []ast.Expr) bool {
		return slices.ContainsFunc(es, func(e ast.Expr) bool { return r.isVar(e, recv) })
	}
	switch n := n.(type) {
	case *ast.AssignStmt:
		return !out(n.Rhs)
	case *ast.ReturnStmt:
		return !out(n.Results)
	case *ast.CompositeLit:
		return !out(n.Elts)
	case *ast.CallExpr:
		return !out(n.Args) // the pointer passed on
	}
	return true
}

// writes reports whether n changes x or a part of it: an assignment, an
// increment, its address taken, or a pointer method that may change it.
func (r *Reader) writes(n ast.Node, x *types.Var) bool {
	under := func(e ast.Expr) bool { return e != nil && r.isVar(starless(rootOf(starless(e))), x) }
	switch n := n.(type) {
	case *ast.AssignStmt:
		return slices.ContainsFunc(n.Lhs, under)
	case *ast.IncDecStmt:
		return under(n.X)
	case *ast.RangeStmt:
		return under(n.Key) || under(n.Value)
	case *ast.UnaryExpr:
		return n.Op == token.AND && under(n.X)
	case *ast.CallExpr:
		sel, ok := n.Fun.(*ast.SelectorExpr)
		return ok && r.info.Selections[sel] != nil && r.info.Selections[sel].Kind() == types.MethodVal && under(sel.X) && !r.keeps(r.info.Selections[sel].Obj().(*types.Func))
	}
	return false
}

// written reports whether fd changes x anywhere (see writes).
func (r *Reader) written(fd *ast.FuncDecl, x *types.Var) bool {
	found := false
	ast.Inspect(fd.Body, func(n ast.Node) bool {
		found = found || r.writes(n, x)
		return !found
	})
	return found
}

// starless strips parentheses and dereferences from e.
func starless(e ast.Expr) ast.Expr {
	for {
		s, ok := ast.Unparen(e).(*ast.StarExpr)
		if !ok {
			return ast.Unparen(e)
		}
		e = s.X
	}
}

// changes records a store of e (nil: a change of unknown value) into
// target, and marks every field the target lies in as changed (p.Dir.X = 0
// changes p.Dir).
func (r *Reader) changes(fd *ast.FuncDecl, target, e ast.Expr) {
	for first := true; target != nil; first = false {
		switch x := ast.Unparen(target).(type) {
		case *ast.SelectorExpr:
			if sel := r.info.Selections[x]; sel != nil && sel.Kind() == types.FieldVal {
				if first {
					r.record(sel.Obj().(*types.Var), fd, e)
				} else {
					r.record(sel.Obj().(*types.Var), fd, nil)
				}
			}
			target = x.X
		case *ast.IndexExpr:
			target = x.X
		case *ast.StarExpr:
			target = x.X
		default:
			target = nil
		}
	}
}

// record notes that f is given e (nil: changed in another way).
func (r *Reader) record(f *types.Var, fd *ast.FuncDecl, e ast.Expr) {
	if f != nil && vectorKeys(f.Type()) != nil {
		r.stores[f] = append(r.stores[f], fieldStore{fd, e})
	}
}

// Import makes r read functions of other packages by their summaries, as
// their own packages' Readers made them (see Summarize).
func (r *Reader) Import(summary func(*types.Func) (Summary, bool)) { r.imported = summary }

// importedAs returns the summary of fn, a function of another package,
// when it has shape p.
func (r *Reader) importedAs(fn *types.Func, p Shape) (Summary, bool) {
	s, ok := r.summary(fn)
	return s, ok && s.Shape == p
}

// operands returns the inputs of call that s concerns.
func (r *Reader) operands(call *ast.CallExpr, fn *types.Func, s Summary) (ast.Expr, ast.Expr, bool) {
	es, _ := r.inputs(call, fn)
	if s.In[0] >= len(es) || s.In[1] >= len(es) {
		return nil, nil, false
	}
	return es[s.In[0]], es[s.In[1]], true
}

// bindsTo reports whether call passes a and b as the inputs s concerns
// (in either order: a dot product and a cosine are symmetric).
func (r *Reader) bindsTo(call *ast.CallExpr, fn *types.Func, s Summary, a, b *types.Var) bool {
	x, y, ok := r.operands(call, fn, s)
	return ok && (r.isVar(x, a) && r.isVar(y, b) || s.Shape != Length && r.isVar(x, b) && r.isVar(y, a))
}

// Summarize returns the shape of the result of fn, a function of the
// package, when it has one: a direction (see unit); the dot product of
// two vector inputs or the length of one, every return being one; the
// cosine of the angle between two, every return being their dot product
// over the product of their lengths; or the cross product of two plane
// vectors.
func (r *Reader) Summarize(fn *types.Func) (Summary, bool) {
	if s, known := r.shapes[fn]; known {
		return s.Summary, s.ok
	}
	r.shapes[fn] = shape{} // recursion: none
	s, ok := r.summarize(fn)
	r.shapes[fn] = shape{s, ok}
	return s, ok
}

// shape is a function's summary, if it has one, as Summarize found it.
type shape struct {
	Summary
	ok bool
}

func (r *Reader) summarize(fn *types.Func) (Summary, bool) {
	fd := r.funcs[fn]
	sig := fn.Signature()
	if fd == nil || sig.Results().Len() != 1 {
		return Summary{}, false
	}
	if r.unit(fn) {
		return Summary{Shape: Unit}, true
	}
	if !isFloat(sig.Results().At(0).Type()) {
		return Summary{}, false
	}
	var vs []*types.Var
	if sig.Recv() != nil {
		vs = append(vs, sig.Recv())
	}
	vs = slices.AppendSeq(vs, sig.Params().Variables())
	for i, a := range vs {
		for j := i; j < len(vs) && vectorKeys(a.Type()) != nil; j++ {
			b := vs[j]
			if !types.Identical(derefd(a.Type()), derefd(b.Type())) {
				continue
			}
			in := [2]int{i, j}
			switch {
			case r.allReturns(fd, func(e ast.Expr) bool { return r.isDot(e, a, b, 1) }):
				return Summary{Dot, in}, true
			case i == j && r.allReturns(fd, func(e ast.Expr) bool { return r.isLength(e, a, 1) }):
				return Summary{Length, in}, true
			case i != j && r.allReturns(fd, func(e ast.Expr) bool { return r.isCosine(e, a, b) }):
				return Summary{Cosine, in}, true
			case i != j && r.allReturns(fd, func(e ast.Expr) bool { return r.isCross(e, a, b) }):
				return Summary{Cross, in}, true
			}
		}
	}
	return Summary{}, false
}

// isCosine reports whether e is the dot product of a and b over the
// product of their lengths, or a call of a function returning that.
func (r *Reader) isCosine(e ast.Expr, a, b *types.Var) bool {
	if call, ok := r.value(e).(*ast.CallExpr); ok {
		fn, _ := typeutil.Callee(r.info, call).(*types.Func)
		s, ok := r.summary(fn)
		return ok && s.Shape == Cosine && r.bindsTo(call, fn, s, a, b)
	}
	q, ok := r.value(e).(*ast.BinaryExpr)
	if !ok || q.Op != token.QUO || !r.isDot(q.X, a, b, 1) && !r.isDot(q.X, b, a, 1) {
		return false
	}
	m, ok := r.value(q.Y).(*ast.BinaryExpr)
	return ok && m.Op == token.MUL && (r.isLength(m.X, a, 1) && r.isLength(m.Y, b, 1) || r.isLength(m.X, b, 1) && r.isLength(m.Y, a, 1))
}

// isCross reports whether e is the cross product of plane vectors a and b
// (or of b and a): the difference of the products of their crossed
// components, a.X*b.Y - a.Y*b.X.
func (r *Reader) isCross(e ast.Expr, a, b *types.Var) bool {
	d, ok := r.value(e).(*ast.BinaryExpr)
	if !ok || d.Op != token.SUB || len(vectorKeys(a.Type())) != 2 {
		return false
	}
	pair := func(e ast.Expr) (string, string, bool) { // the components of a and b in a product
		m, ok := r.value(e).(*ast.BinaryExpr)
		if !ok || m.Op != token.MUL {
			return "", "", false
		}
		ka, oka := r.comp(m.X, a)
		kb, okb := r.comp(m.Y, b)
		if !oka || !okb {
			ka, oka = r.comp(m.Y, a)
			kb, okb = r.comp(m.X, b)
		}
		return ka, kb, oka && okb
	}
	a1, b1, ok1 := pair(d.X)
	a2, b2, ok2 := pair(d.Y)
	return ok1 && ok2 && a1 != b1 && a1 == b2 && a2 == b1
}

// IsCosine reports whether e, an expression inside fd, is the cosine of
// the angle between two vectors: a call of a function with that shape
// (of the package or, through Import, of another), the dot product of
// two directions, or the dot product of two variables over the product
// of their lengths.
func (r *Reader) IsCosine(fd *ast.FuncDecl, e ast.Expr) bool {
	r.index(fd)
	if r.CosineCall(e) {
		return true
	}
	if x, y, ok := r.dotOf(e); ok {
		return r.direction(fd, x, 0) && r.direction(fd, y, 0)
	}
	q, ok := r.value(e).(*ast.BinaryExpr)
	if !ok || q.Op != token.QUO {
		return false
	}
	x, y, ok := r.dotOf(q.X)
	a, b := r.varOf(identOf(x)), r.varOf(identOf(y))
	return ok && a != nil && b != nil && r.isCosine(q, a, b)
}

// CosineCall reports whether e is a call of a function of the package or,
// through Import, of another, whose result is the cosine of the angle
// between two of its inputs.
func (r *Reader) CosineCall(e ast.Expr) bool {
	call, ok := r.value(e).(*ast.CallExpr)
	if !ok {
		return false
	}
	fn, _ := typeutil.Callee(r.info, call).(*types.Func)
	s, ok := r.summary(fn)
	return ok && s.Shape == Cosine
}

// identOf returns e as an identifier, or nil.
func identOf(e ast.Expr) *ast.Ident {
	id, _ := ast.Unparen(e).(*ast.Ident)
	return id
}

// summary returns the summary of fn, of the package or another.
func (r *Reader) summary(fn *types.Func) (Summary, bool) {
	switch {
	case fn == nil:
		return Summary{}, false
	case r.funcs[fn] != nil:
		return r.Summarize(fn)
	case r.imported == nil:
		return Summary{}, false
	}
	return r.imported(fn)
}

// dotOf returns the two vectors whose dot product e is: the inputs of a
// call of a function with that shape, or two local variables whose
// products are written out.
func (r *Reader) dotOf(e ast.Expr) (ast.Expr, ast.Expr, bool) {
	call, ok := r.value(e).(*ast.CallExpr)
	if !ok {
		a, b, ok := r.dotTerms(e)
		return a, b, ok
	}
	fn, _ := typeutil.Callee(r.info, call).(*types.Func)
	if fn == nil {
		return nil, nil, false
	}
	if s, ok := r.summary(fn); ok && s.Shape == Dot {
		return r.operands(call, fn, s)
	}
	return nil, nil, false
}

// dotTerms returns a and b where e is their dot product written out
// (a.X*b.X + a.Y*b.Y + ...), a and b local variables.
func (r *Reader) dotTerms(e ast.Expr) (*ast.Ident, *ast.Ident, bool) {
	m, ok := r.value(sumTerms(r.value(e), nil)[0]).(*ast.BinaryExpr)
	if !ok || m.Op != token.MUL {
		return nil, nil, false
	}
	base := func(e ast.Expr) *ast.Ident {
		sel, _ := ast.Unparen(e).(*ast.SelectorExpr)
		if sel == nil {
			return nil
		}
		id, _ := ast.Unparen(sel.X).(*ast.Ident)
		return id
	}
	a, b := base(m.X), base(m.Y)
	if a == nil || b == nil || r.varOf(a) == nil || r.varOf(b) == nil || !r.isDot(e, r.varOf(a), r.varOf(b), 0) {
		return nil, nil, false
	}
	return a, b, true
}

// Vector reports whether t, through a pointer, is a vector: a struct
// whose fields are all floats or an array of floats.
func Vector(t types.Type) bool { return t != nil && vectorKeys(t) != nil }
