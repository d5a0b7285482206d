// Package provenance tells where an SSA value comes from: a constant, a
// parameter, a load, inexact floating-point arithmetic, a math-function
// call, a loop-carried update. Analyzers use it to separate values that
// carry rounding error (computed) from values that were only copied, loaded
// or chosen, which compare exactly by design.
package provenance

import (
	"go/ast"
	"go/build"
	"go/constant"
	"go/token"
	"go/types"
	"iter"
	"math"
	"path/filepath"
	"strings"

	"golang.org/x/tools/go/ssa"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/internal/numeric"
)

// Kind is the immediate origin of a value, after conversions are looked
// through.
type Kind int

// The kinds of origin.
const (
	Other       Kind = iota // anything not listed below
	Constant                // a compile-time constant
	Parameter               // a function parameter or free variable
	Load                    // a load from a field, element, pointer or package variable
	Arithmetic              // the result of +, -, *, / on floating-point values
	MathCall                // the result of a math function that rounds
	ExactCall               // the result of a math function that does not round (Abs, Floor, Max...)
	Call                    // the result of any other call
	LoopCarried             // a loop-header merge updated by arithmetic on itself
	Merge                   // any other merge of values from branches
)

// Tracker answers provenance questions for the functions of one package,
// remembering its answers. It is not safe for concurrent use.
type Tracker struct {
	pkg      *ssa.Package
	funcs    []*ssa.Function
	computed map[ssa.Value]bool
	returns  map[*ssa.Function][]bool // per result: whether some return is computed
	fields   map[*types.Var]bool      // fields receiving computed floats; nil until needed
}

// NewTracker returns an empty Tracker for pkg, whose source functions
// (nested ones included) are funcs.
func NewTracker(pkg *ssa.Package, funcs []*ssa.Function) *Tracker {
	return &Tracker{pkg: pkg, funcs: funcs, computed: make(map[ssa.Value]bool), returns: make(map[*ssa.Function][]bool)}
}

// Strip looks through value-preserving wrappers: float-to-float
// conversions, type changes and interface boxing.
func Strip(v ssa.Value) ssa.Value {
	for {
		switch w := v.(type) {
		case *ssa.ChangeType:
			v = w.X
		case *ssa.MakeInterface:
			v = w.X
		case *ssa.Convert:
			if !IsFloat(w.X.Type()) {
				return v
			}
			v = w.X
		default:
			return v
		}
	}
}

// Of returns the immediate origin of v.
func Of(v ssa.Value) Kind {
	switch v := Strip(v).(type) {
	case *ssa.Const:
		return Constant
	case *ssa.Parameter, *ssa.FreeVar:
		return Parameter
	case *ssa.UnOp:
		if v.Op == token.MUL {
			return Load
		}
		if v.Op == token.SUB {
			return Of(v.X)
		}
	case *ssa.Field, *ssa.Index, *ssa.Lookup:
		return Load
	case *ssa.BinOp:
		if isArith(v.Op) && IsFloat(v.Type()) {
			return Arithmetic
		}
	case *ssa.Call:
		return callKind(v.Common())
	case *ssa.Extract:
		if c, ok := v.Tuple.(*ssa.Call); ok {
			return callKind(c.Common())
		}
	case *ssa.Phi:
		if _, ok := LoopStep(v); ok {
			return LoopCarried
		}
		return Merge
	}
	return Other
}

func callKind(c *ssa.CallCommon) Kind {
	switch MathRounding(c) {
	case Rounds:
		return MathCall
	case Exact:
		return ExactCall
	}
	return Call
}

func isArith(op token.Token) bool {
	return op == token.ADD || op == token.SUB || op == token.MUL || op == token.QUO
}

// LoopStep reports whether phi is a loop-carried variable updated by
// arithmetic on itself (x = x + step, x = x * k): it returns that update.
// A variable that passes through another merge or a call on its way back
// (a clamp such as x = math.Min(x+h, end)) is not such a variable.
func LoopStep(phi *ssa.Phi) (*ssa.BinOp, bool) {
	for _, e := range phi.Edges {
		b, ok := Strip(e).(*ssa.BinOp)
		if !ok || !isArith(b.Op) {
			continue
		}
		if Strip(b.X) == phi || Strip(b.Y) == phi {
			return b, true
		}
	}
	return nil, false
}

// Computed reports whether v carries rounding error from floating-point
// work done in this package: inexact arithmetic, a rounding math function,
// a call of a package function whose result is computed, or a merge of
// which some input is computed. Constants, parameters, loads, exact math
// functions (Floor, Max...) and calls of unknown functions are not
// computed; Abs and Copysign of a computed value are, since they change
// only its sign. Multiplying or dividing by a power of two is exact and passes
// the provenance of the other operand through.
func (t *Tracker) Computed(v ssa.Value) bool {
	v = Strip(v)
	if c, ok := t.computed[v]; ok {
		return c
	}
	t.computed[v] = false // cycles through merges count as not computed
	c := t.compute(v)
	t.computed[v] = c
	return c
}

func (t *Tracker) compute(v ssa.Value) bool {
	switch v := v.(type) {
	case *ssa.UnOp:
		return v.Op == token.SUB && t.Computed(v.X)
	case *ssa.BinOp:
		if !isArith(v.Op) || !IsFloat(v.Type()) {
			return false
		}
		if x, ok := exactScaling(v); ok {
			return t.Computed(x)
		}
		return true
	case *ssa.Phi:
		for _, e := range v.Edges {
			if t.Computed(e) {
				return true
			}
		}
	case *ssa.Call:
		return t.callComputed(v.Parent(), v.Common(), 0)
	case *ssa.Extract:
		if c, ok := v.Tuple.(*ssa.Call); ok {
			return t.callComputed(c.Parent(), c.Common(), v.Index)
		}
	case *ssa.Field:
		if c, ok := v.X.(*ssa.Call); ok && IsFloat(v.Type()) {
			return t.fieldComputed(c, v.Field)
		}
	}
	return false
}

// fieldComputed reports whether field i of the struct a package function
// returns (p.Lerp(q, s).Y) holds a computed float on some path: the
// function builds the struct from computed values (return Point{x, y}).
// A test reading a field of what the code under test returns makes no
// claim, as for callComputed.
func (t *Tracker) fieldComputed(c *ssa.Call, i int) bool {
	fn := c.Common().StaticCallee()
	if fn == nil || fn.Blocks == nil || fn.Package() != t.pkg || inTestFile(c.Parent()) && !inTestFile(fn) || fn.Signature.Results().Len() != 1 {
		return false
	}
	for ret := range Returns(fn) {
		load, ok := ret.Results[0].(*ssa.UnOp)
		if !ok || load.Op != token.MUL || load.X.Referrers() == nil {
			continue
		}
		for _, r := range *load.X.Referrers() {
			fa, ok := r.(*ssa.FieldAddr)
			if ok && fa.Field == i && storesComputed(t, fa) {
				return true
			}
		}
	}
	return false
}

// storesComputed reports whether a computed value is stored at addr.
func storesComputed(t *Tracker, addr ssa.Value) bool {
	for _, r := range *addr.Referrers() {
		if st, ok := r.(*ssa.Store); ok && st.Addr == addr && t.Computed(st.Val) {
			return true
		}
	}
	return false
}

// ExactScaling reports whether b multiplies or divides by a constant power
// of two, which changes only the exponent: exact unless the result
// overflows or falls among the subnormals.
func ExactScaling(b *ssa.BinOp) bool { _, ok := exactScaling(b); return ok }

// exactScaling reports whether b multiplies or divides by a power of two,
// returning the other operand.
func exactScaling(b *ssa.BinOp) (ssa.Value, bool) {
	if b.Op != token.MUL && b.Op != token.QUO {
		return nil, false
	}
	if powerOfTwo(b.Y) {
		return b.X, true
	}
	if b.Op == token.MUL && powerOfTwo(b.X) {
		return b.Y, true
	}
	return nil, false
}

func powerOfTwo(v ssa.Value) bool {
	c, ok := Strip(v).(*ssa.Const)
	if !ok || c.Value == nil || (c.Value.Kind() != constant.Float && c.Value.Kind() != constant.Int) {
		return false
	}
	f, _ := constant.Float64Val(c.Value)
	frac, _ := math.Frexp(math.Abs(f))
	return frac == 0.5
}

func (t *Tracker) callComputed(caller *ssa.Function, c *ssa.CallCommon, index int) bool {
	switch MathRounding(c) {
	case Rounds:
		return true
	case Exact:
		// |x| and Copysign(x, y) change only the sign: x's rounding error stays.
		name := c.StaticCallee().Name()
		return (name == "Abs" || name == "Copysign") && len(c.Args) > 0 && t.Computed(c.Args[0])
	}
	fn := c.StaticCallee()
	if fn == nil || fn.Blocks == nil || fn.Package() != t.pkg {
		return false // unknown, abstract or from another package: no claim
	}
	if caller != nil && inTestFile(caller) && !inTestFile(fn) {
		return false // a test comparing two routes through the code under test does so on purpose
	}
	res := t.resultComputed(fn)
	return index < len(res) && res[index]
}

// inTestFile reports whether fn is declared in a _test.go file.
func inTestFile(fn *ssa.Function) bool { return InTestFile(fn.Prog.Fset, fn.Pos()) }

// InStd reports whether the object declared at pos (pkg its package)
// belongs to the standard library: its file lies under GOROOT/src, or
// under "$GOROOT/src", the form a build with -trimpath records (from
// memory), or, where the position is unknown, its import path has no dot
// in its first element.
func InStd(fset *token.FileSet, pos token.Pos, pkg *types.Package) bool {
	if f := fset.File(pos); f != nil && f.Name() != "" {
		name := filepath.ToSlash(f.Name())
		return strings.HasPrefix(name, "$GOROOT/src/") || strings.HasPrefix(name, filepath.ToSlash(build.Default.GOROOT)+"/src/")
	}
	return !strings.Contains(strings.Split(pkg.Path(), "/")[0], ".")
}

// InTestFile reports whether pos lies in a _test.go file.
func InTestFile(fset *token.FileSet, pos token.Pos) bool {
	f := fset.File(pos)
	return f != nil && strings.HasSuffix(f.Name(), "_test.go")
}

// Returns reports, per result, whether fn, a function of the tracked
// package, returns a computed value on some path.
func (t *Tracker) Returns(fn *ssa.Function) []bool { return t.resultComputed(fn) }

// resultComputed summarises, per result, whether fn returns a computed value
// on some path.
func (t *Tracker) resultComputed(fn *ssa.Function) []bool {
	if res, ok := t.returns[fn]; ok {
		return res
	}
	n := fn.Signature.Results().Len()
	res := make([]bool, n)
	t.returns[fn] = res // recursion sees "not computed" until finished
	for ret := range Returns(fn) {
		for i, r := range ret.Results {
			res[i] = res[i] || t.Computed(r)
		}
	}
	return res
}

// MergedFrom reports whether v is a merge (possibly of merges) with w
// among its inputs, where w is defined before the merge: as in
// s := t; if cond { s = t*k }; if s == t, a test of whether the branch
// changed s. A loop-carried input from a later iteration does not count.
// An input that reads the same field as w, through the same value, in a
// function that stores into no such field (see unstored), counts as w: a running
// maximum started at o.floor and tested max == o.floor after the loop
// asks whether any value exceeded the start.
func MergedFrom(v, w ssa.Value) bool {
	return mergedFrom(Strip(v), Strip(w), 4)
}

func mergedFrom(v, w ssa.Value, depth int) bool {
	phi, ok := v.(*ssa.Phi)
	if !ok || depth == 0 {
		return false
	}
	for _, e := range phi.Edges {
		e = Strip(e)
		if e == w && definedBefore(w, phi.Block()) || sameField(e, w) && unstored(e) && definedBefore(e, phi.Block()) || mergedFrom(e, w, depth-1) {
			return true
		}
	}
	return false
}

// unstored reports whether v, a load of a field through a pointer, reads
// a field that its function stores into nowhere (through any pointer to
// the same struct type): every such load in it reads the same value.
func unstored(v ssa.Value) bool {
	load, ok := v.(*ssa.UnOp)
	if !ok {
		return true // a field of a struct value, which nothing changes
	}
	fa, ok := load.X.(*ssa.FieldAddr)
	if !ok || fa.Parent() == nil {
		return false
	}
	for _, blk := range fa.Parent().Blocks {
		for _, instr := range blk.Instrs {
			if st, ok := instr.(*ssa.Store); ok {
				if f, ok := st.Addr.(*ssa.FieldAddr); ok && f.Field == fa.Field && types.Identical(f.X.Type(), fa.X.Type()) {
					return false
				}
			}
		}
	}
	return true
}

// definedBefore reports whether w is available on entry to block b.
func definedBefore(w ssa.Value, b *ssa.BasicBlock) bool {
	instr, ok := w.(ssa.Instruction)
	if !ok || instr.Block() == nil {
		return true // constants, parameters, free variables, globals
	}
	return instr.Block() != b && instr.Block().Dominates(b)
}

// SameSources reports whether v and w are both merges that draw on a
// common non-constant input: copies of the same value shuffled through
// branches, as the points a and c of Brent's zero finder are, whose exact
// comparison asks which copy is which.
func SameSources(v, w ssa.Value) bool {
	pv, ok1 := Strip(v).(*ssa.Phi)
	pw, ok2 := Strip(w).(*ssa.Phi)
	if !ok1 || !ok2 {
		return false
	}
	seen := sources(pv, make(map[ssa.Value]bool), 6)
	for src := range sources(pw, make(map[ssa.Value]bool), 6) {
		if _, isConst := src.(*ssa.Const); seen[src] && !isConst {
			return true
		}
	}
	return false
}

// sources collects the values feeding phi through chains of merges.
func sources(phi *ssa.Phi, acc map[ssa.Value]bool, depth int) map[ssa.Value]bool {
	if acc[phi] || depth == 0 {
		return acc
	}
	acc[phi] = true
	for _, e := range phi.Edges {
		e = Strip(e)
		if p, ok := e.(*ssa.Phi); ok {
			sources(p, acc, depth-1)
		} else {
			acc[e] = true
		}
	}
	return acc
}

// Differenced reports whether the function also subtracts one of v and w
// from the other, as a tolerance test |v-w| <= tol does: an exact test of
// the same pair is then a shortcut or a special case, not the only test.
func Differenced(v, w ssa.Value) bool {
	v, w = Strip(v), Strip(w)
	for _, x := range []ssa.Value{v, w} {
		refs := x.Referrers()
		if refs == nil {
			continue
		}
		for _, r := range *refs {
			if b, ok := r.(*ssa.BinOp); ok && b.Op == token.SUB && (Strip(b.X) == v && Strip(b.Y) == w || Strip(b.X) == w && Strip(b.Y) == v) {
				return true
			}
		}
	}
	return false
}

// DependsOn reports whether v is computed from w through arithmetic,
// conversions and math-function calls, without crossing a merge: as in
// m := (a+b)/2 compared with a, or x*c compared with x.
func DependsOn(v, w ssa.Value) bool {
	return dependsOn(Strip(v), Strip(w), 8)
}

func dependsOn(v, w ssa.Value, depth int) bool {
	if v == w || sameField(v, w) {
		return true
	}
	if depth == 0 {
		return false
	}
	var ops []ssa.Value
	switch v := v.(type) {
	case *ssa.BinOp:
		ops = []ssa.Value{v.X, v.Y}
	case *ssa.UnOp:
		if v.Op == token.SUB {
			ops = []ssa.Value{v.X}
		}
	case *ssa.Call:
		if MathRounding(v.Common()) != NotMath {
			ops = v.Common().Args
		}
	}
	for _, op := range ops {
		if dependsOn(Strip(op), w, depth-1) {
			return true
		}
	}
	return false
}

// sameField reports whether v and w load one field of one struct value or
// pointer (two reads of d.lo): the same variable read twice.
func sameField(v, w ssa.Value) bool {
	switch v := v.(type) {
	case *ssa.Field:
		w, ok := w.(*ssa.Field)
		return ok && v.X == w.X && v.Field == w.Field
	case *ssa.UnOp:
		w, ok := w.(*ssa.UnOp)
		if !ok || v.Op != token.MUL || w.Op != token.MUL {
			return false
		}
		a, oka := v.X.(*ssa.FieldAddr)
		b, okb := w.X.(*ssa.FieldAddr)
		return oka && okb && a.X == b.X && a.Field == b.Field
	}
	return false
}

// IsFloat reports whether t is a floating-point or complex type, a named
// type over one, or a type parameter whose type set holds only such types.
func IsFloat(t types.Type) bool {
	return allTerms(t, func(b *types.Basic) bool {
		return b.Info()&(types.IsFloat|types.IsComplex) != 0
	})
}

// IsFloatComparison reports whether n orders or equates operands of
// which one is a float, or, with aggregates, holds a float by value (an
// array or struct compared with == or !=).
func IsFloatComparison(info *types.Info, n *ast.BinaryExpr, aggregates bool) bool {
	switch n.Op {
	case token.LSS, token.LEQ, token.GTR, token.GEQ, token.EQL, token.NEQ:
		x := info.TypeOf(n.X)
		return IsFloat(x) || IsFloat(info.TypeOf(n.Y)) || aggregates && HoldsFloat(x, false)
	}
	return false
}

// HoldsFloat reports whether t is a float (IsFloat) or holds one in an
// array or struct element at some depth; with viaRefs, also through the
// elements of slices and the targets of pointers.
func HoldsFloat(t types.Type, viaRefs bool) bool {
	if viaRefs {
		return holdsFloat(t, true, 4) // references may lead far: look less deep
	}
	return holdsFloat(t, false, 8)
}

func holdsFloat(t types.Type, viaRefs bool, depth int) bool {
	if IsFloat(t) {
		return true
	}
	if depth == 0 {
		return false
	}
	switch u := t.Underlying().(type) {
	case *types.Array:
		return holdsFloat(u.Elem(), viaRefs, depth-1)
	case *types.Slice:
		return viaRefs && holdsFloat(u.Elem(), viaRefs, depth-1)
	case *types.Pointer:
		return viaRefs && holdsFloat(u.Elem(), viaRefs, depth-1)
	case *types.Struct:
		for f := range u.Fields() {
			if holdsFloat(f.Type(), viaRefs, depth-1) {
				return true
			}
		}
	}
	return false
}

// FormatOf returns the format that judges values of type t: float32 when t
// admits float32 (a type parameter may), else float64.
func FormatOf(t types.Type) numeric.Format { return numeric.Select(Admits32(t)) }

// Admits32 reports whether t is float32 or complex64, or a type parameter
// whose type set includes one of them.
func Admits32(t types.Type) bool {
	return !allTerms(t, func(b *types.Basic) bool {
		return b.Kind() != types.Float32 && b.Kind() != types.Complex64
	})
}

// allTerms reports whether every type in t's type set has a basic underlying
// type satisfying pred (for a non-parameter type, its one underlying type).
func allTerms(t types.Type, pred func(*types.Basic) bool) bool {
	if tp, ok := types.Unalias(t).(*types.TypeParam); ok {
		t = tp.Constraint()
	}
	switch u := t.Underlying().(type) {
	case *types.Basic:
		return pred(u)
	case *types.Interface:
		return ifaceTerms(u, pred)
	}
	return false
}

// ifaceTerms applies allTerms to the type set of a constraint interface,
// expanding unions and embedded interfaces; an interface without type terms
// admits every type and fails.
func ifaceTerms(iface *types.Interface, pred func(*types.Basic) bool) bool {
	seen := false
	for i := range iface.NumEmbeddeds() {
		terms := []types.Type{iface.EmbeddedType(i)}
		if u, ok := iface.EmbeddedType(i).(*types.Union); ok {
			terms = terms[:0]
			for j := range u.Len() {
				terms = append(terms, u.Term(j).Type())
			}
		}
		for _, term := range terms {
			if !allTerms(term, pred) {
				return false
			}
		}
		seen = true
	}
	return seen
}

// CalleeDecl returns the declaration in files of the function of package
// pkg that call calls, with the function, or nil.
func CalleeDecl(info *types.Info, files []*ast.File, pkg *types.Package, call *ast.CallExpr) (*ast.FuncDecl, *types.Func) {
	fn, ok := typeutil.Callee(info, call).(*types.Func)
	if !ok || fn.Pkg() != pkg {
		return nil, nil
	}
	for _, f := range files {
		if f.FileStart <= fn.Pos() && fn.Pos() < f.FileEnd {
			for _, d := range f.Decls {
				if fd, ok := d.(*ast.FuncDecl); ok && fd.Name.Pos() == fn.Pos() {
					return fd, fn
				}
			}
		}
	}
	return nil, nil
}

// Ordered reports whether op is one of the ordered comparisons < <= > >=.
func Ordered(op token.Token) bool {
	return op == token.LSS || op == token.LEQ || op == token.GTR || op == token.GEQ
}

// Returns yields the return statements of fn, one per block that ends in
// one.
func Returns(fn *ssa.Function) iter.Seq[*ssa.Return] {
	return func(yield func(*ssa.Return) bool) {
		for _, b := range fn.Blocks {
			if ret, ok := b.Instrs[len(b.Instrs)-1].(*ssa.Return); ok && !yield(ret) {
				return
			}
		}
	}
}
