package portable

import (
	"go/constant"
	"go/token"
	"go/types"
	"math"
	"math/bits"
	"slices"

	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/provenance"
)

// The reading on inputs. A value whose product operands are known exact
// where the product is formed cannot change under fusion: a product of two
// floats k1·2^e1 and k2·2^e2 is k1·k2·2^(e1+e2), representable while
// |k1·k2| < 2^p (p = 53 for float64, 24 for float32), and fusedMultiplyAdd
// rounds x*y + z once (IEEE 754-2019 §5.4.1), which for an exact product
// is the rounding of the separate addition. Sums and differences of such
// values stay exact under the same bound, and a quotient by a power of two
// shifts the exponent. The inputs are what the call site gives: constants,
// composite literals of constants (a table of test cases), read through
// the fields that lead to them and through the variables a subtest's
// closure captures, with what the calls read on the way store through
// them. Anything a call or closure not read may have changed, and every
// other value (a parameter of the function read first, an integer of
// unknown size, a quotient, a value carried around a loop), is unknown.

// maxSites bounds the calls entered from one value, maxSteps the values
// and memory read for it.
const (
	maxSites = 4
	maxSteps = 2000
)

// span says what is known of a float: a whole multiple of 2^low of
// magnitude at most max. The zero span knows nothing.
type span struct {
	known bool
	low   int
	max   float64
}

// zeroLow is the low bit given to 0, above every other.
const zeroLow = 1 << 20

// site is the reading of one function on the inputs one call gives it.
type site struct {
	outer     *site                        // the caller's reading; nil at the function read first
	args      map[*ssa.Parameter]ssa.Value // the arguments of the call entered
	enclosing *site                        // the reading of the function that makes this closure
	shared    *reading
	busy      map[ssa.Value]bool // values in progress (a loop is unknown)
	depth     int
}

// reading is what the sites of one value share: the calls and closures
// entered, with the readings of their bodies, where their stores through
// what they are given are found; the literals known to be written through
// or not; and the steps taken.
type reading struct {
	entered map[ssa.Instruction]*site
	written map[*ssa.Alloc]bool // literals read by literalWritten
	steps   int
}

// enter reads fn's body on the arguments of call.
func (s *site) enter(j *Judge, call *ssa.CallCommon, fn *ssa.Function, depth int) bool {
	if s == nil || s.depth >= maxSites || len(fn.Params) != len(call.Args) {
		return false
	}
	inner := &site{outer: s, args: map[*ssa.Parameter]ssa.Value{}, shared: s.shared, depth: s.depth + 1}
	for i, p := range fn.Params {
		inner.args[p] = call.Args[i]
	}
	s.markEntered(call, inner)
	return j.walk(inner).body(fn, depth)
}

// markEntered records the call instruction whose common part is call, and
// the reading of its callee.
func (s *site) markEntered(call *ssa.CallCommon, inner *site) {
	for _, a := range call.Args {
		if a == nil || a.Referrers() == nil {
			continue
		}
		for _, r := range *a.Referrers() {
			if c, ok := r.(ssa.CallInstruction); ok && c.Common() == call {
				s.shared.entered[r] = inner
			}
		}
	}
}

// exact reports whether the product b is exact on the inputs known.
func (s *site) exact(b *ssa.BinOp) bool {
	return s != nil && s.of(b).known
}

// exactPow reports whether call is math.Pow(x, n) with a whole constant
// n >= 0 and an x that makes x^n exact. Go's Pow is pure Go on every
// architecture (haveArchPow is false in math/stubs.go and
// math/arith_s390x.go, Go 1.26) and, for a whole exponent, multiplies
// successive squarings of x's significand (math/pow.go): for x = k·2^e,
// each product is a power k^m with m <= n, exact while k^n is below 2^p.
// Any implementation faithful to within one ulp returns a representable
// result exactly, so the result does not depend on the Go version either.
func (s *site) exactPow(call *ssa.CallCommon) bool {
	if s == nil || call.StaticCallee().Name() != "Pow" || len(call.Args) != 2 {
		return false
	}
	return s.pow(call).known
}

func (s *site) pow(call *ssa.CallCommon) span {
	c, ok := provenance.Strip(call.Args[1]).(*ssa.Const)
	if !ok || c.Value == nil {
		return span{}
	}
	n, exact := constant.Int64Val(constant.ToInt(c.Value))
	if !exact || n < 0 || n > 64 {
		return span{}
	}
	r := spanOf(1)
	x := s.of(call.Args[0])
	for range n {
		r = fit(times(r, x), call.Args[0].Type())
	}
	return r
}

// of returns what is known of the float v; nothing of a complex value,
// whose products Go may also fuse.
func (s *site) of(v ssa.Value) span {
	if b, ok := v.Type().Underlying().(*types.Basic); !ok || b.Info()&types.IsComplex != 0 {
		return span{}
	}
	if s.busy == nil {
		s.busy = map[ssa.Value]bool{}
	}
	if s.busy[v] {
		return span{} // around a loop: unknown
	}
	s.busy[v] = true
	defer delete(s.busy, v)
	switch v := v.(type) {
	case *ssa.Const:
		if v.Value == nil {
			return spanOf(0)
		}
		fv := constant.ToFloat(v.Value)
		if fv.Kind() != constant.Float {
			return span{} // a complex constant
		}
		f, _ := constant.Float64Val(fv)
		return fit(spanOf(f), v.Type())
	case *ssa.Convert:
		if provenance.IsFloat(v.X.Type()) {
			return fit(s.of(v.X), v.Type())
		}
		if c, ok := v.X.(*ssa.Const); ok {
			return s.of(ssa.NewConst(c.Value, v.Type()))
		}
	case *ssa.ChangeType:
		return s.of(v.X)
	case *ssa.UnOp:
		switch v.Op {
		case token.SUB:
			return s.of(v.X)
		case token.MUL:
			return s.content(v.X, nil)
		}
	case *ssa.Field, *ssa.Index, *ssa.Parameter:
		return s.content(v, nil)
	case *ssa.BinOp:
		return s.binOp(v)
	case *ssa.Phi:
		r := span{}
		for i, e := range v.Edges {
			if i == 0 {
				r = s.of(e)
			} else if r = join(r, s.of(e)); !r.known {
				return r
			}
		}
		return r
	case *ssa.Call:
		if provenance.MathRounding(v.Common()) == provenance.NotMath {
			return span{}
		}
		switch v.Common().StaticCallee().Name() {
		case "Abs":
			return s.of(v.Common().Args[0])
		case "Pow":
			return s.pow(v.Common())
		}
	}
	return span{}
}

// binOp returns what is known of a sum, difference, product or quotient.
func (s *site) binOp(b *ssa.BinOp) span {
	x, y := s.of(b.X), s.of(b.Y)
	switch b.Op {
	case token.ADD, token.SUB:
		if x.known && y.known {
			return fit(span{true, min(x.low, y.low), x.max + y.max}, b.Type())
		}
	case token.MUL:
		return fit(times(x, y), b.Type())
	case token.QUO:
		if k, ok := powerOfTwo(y); ok && x.known {
			return fit(span{true, x.low - k, math.Ldexp(x.max, -k)}, b.Type())
		}
	}
	return span{}
}

// content returns what is known of every float that v, a reference or an
// aggregate, holds along path (field indices; elements are all read).
func (s *site) content(v ssa.Value, path []int) span {
	if s.shared.steps++; s.shared.steps > maxSteps {
		return span{}
	}
	switch v := v.(type) {
	case *ssa.Alloc:
		return s.refs(v, path)
	case *ssa.Parameter:
		arg, ok := s.args[v]
		if !ok {
			return span{} // an input of the function read first
		}
		return join(s.outer.content(arg, path), s.refs(v, path)) // and what the function stores through it
	case *ssa.FreeVar:
		outer, bound := s.captured(v)
		if outer == nil {
			return span{}
		}
		return join(outer.content(bound, path), s.refs(v, path)) // and what the closure stores through it
	case *ssa.UnOp:
		if v.Op == token.MUL {
			return s.content(v.X, path)
		}
	case *ssa.Field:
		return s.content(v.X, append([]int{v.Field}, path...))
	case *ssa.FieldAddr:
		return s.content(v.X, append([]int{v.Field}, path...))
	case *ssa.Index, *ssa.IndexAddr, *ssa.Slice, *ssa.MakeInterface, *ssa.ChangeType:
		return s.content(*v.(ssa.Instruction).Operands(nil)[0], path)
	case *ssa.Const:
		if v.Value == nil {
			return spanOf(0) // a nil slice or a zero value
		}
	}
	if provenance.IsFloat(v.Type()) && len(path) == 0 {
		return s.of(v)
	}
	return span{}
}

// captured returns the reading of the function that makes the closure
// fv belongs to, and the value bound to fv there, when the closure is read
// first (a subtest's body, t.Run(name, func...)) and made once; the
// closure is then taken as entered, its stores through fv read here.
func (s *site) captured(fv *ssa.FreeVar) (*site, ssa.Value) {
	fn := fv.Parent()
	if s.args != nil || fn.Parent() == nil {
		return nil, nil
	}
	var made *ssa.MakeClosure
	for _, b := range fn.Parent().Blocks {
		for _, instr := range b.Instrs {
			if mc, ok := instr.(*ssa.MakeClosure); ok && mc.Fn == fn {
				if made != nil {
					return nil, nil // made twice
				}
				made = mc
			}
		}
	}
	i := slices.Index(fn.FreeVars, fv)
	if made == nil || i < 0 {
		return nil, nil
	}
	if s.enclosing == nil {
		s.enclosing = &site{shared: s.shared, depth: s.depth}
	}
	s.shared.entered[made] = s
	return s.enclosing, made.Bindings[i]
}

// refs returns what is known of the floats stored through addr along
// path, or nothing when addr escapes to a call not entered, where it may
// be written. A value that holds no reference has nothing stored through
// it.
func (s *site) refs(addr ssa.Value, path []int) span {
	r := spanOf(0)
	if !holdsReference(addr.Type(), 4) {
		return r
	}
	for _, ref := range *addr.Referrers() {
		var got span
		switch ref := ref.(type) {
		case *ssa.Store:
			if ref.Addr != addr {
				if root := literalOf(ref.Addr); root == nil || s.literalWritten(root) {
					return span{} // the reference is stored away
				}
				continue // into a local composite literal that nothing writes through
			}
			got = s.content(ref.Val, path)
		case *ssa.FieldAddr, *ssa.Field:
			f := fieldIndex(ref)
			switch {
			case len(path) == 0:
				got = s.refs(ref.(ssa.Value), nil)
			case path[0] == f:
				got = s.refs(ref.(ssa.Value), path[1:])
			default:
				continue
			}
		case *ssa.IndexAddr, *ssa.Index, *ssa.Slice, *ssa.MakeInterface, *ssa.ChangeType, *ssa.UnOp:
			got = s.refs(ref.(ssa.Value), path)
		case *ssa.Call, *ssa.MakeClosure:
			in := s.shared.entered[ref]
			if in == nil {
				if call, ok := ref.(*ssa.Call); ok && readOnly(call.Common()) {
					continue
				}
				return span{} // given to a call or closure not read
			}
			got = spanOf(0)
			for _, p := range inside(ref, addr) {
				got = join(got, in.refs(p, path)) // what the callee stores through it
			}
		case *ssa.DebugRef, *ssa.BinOp:
			continue
		default:
			return span{}
		}
		if r = join(r, got); !r.known {
			return r
		}
	}
	return r
}

// fieldIndex returns the field a FieldAddr or Field selects.
func fieldIndex(ref ssa.Instruction) int {
	if fa, ok := ref.(*ssa.FieldAddr); ok {
		return fa.Field
	}
	return ref.(*ssa.Field).Field
}

// literalOf returns the local variable or composite literal whose field or
// element addr is, or nil.
func literalOf(addr ssa.Value) *ssa.Alloc {
	a, _ := addrRoot(addr, false).(*ssa.Alloc)
	return a
}

// addrRoot returns the value an address is reached from through fields
// and elements, and, with viaRefs, through slices and loads as well
// (o.data[i] from o).
func addrRoot(addr ssa.Value, viaRefs bool) ssa.Value {
	for {
		switch a := addr.(type) {
		case *ssa.FieldAddr:
			addr = a.X
		case *ssa.IndexAddr:
			addr = a.X
		case *ssa.Slice:
			if !viaRefs {
				return a
			}
			addr = a.X
		case *ssa.UnOp:
			if !viaRefs {
				return a
			}
			addr = a.X
		default:
			return a
		}
	}
}

// literalWritten reports whether a reference held in the literal root may
// be written through, read once per literal.
func (s *site) literalWritten(root *ssa.Alloc) bool {
	w, ok := s.shared.written[root]
	if !ok {
		s.shared.written[root] = true // around a cycle of copies: written
		w = s.writesThrough(root, false)
		s.shared.written[root] = w
	}
	return w
}

// writesThrough reports whether a reference loaded from v's memory may be
// written through: a store through it, a copy of it kept where that may
// happen, a call not entered or a closure not read that is given it, or
// any use the reading does not know.
func (s *site) writesThrough(v ssa.Value, loaded bool) bool {
	if s.shared.steps++; s.shared.steps > maxSteps {
		return true
	}
	if !holdsReference(v.Type(), 4) {
		return false
	}
	for _, ref := range *v.Referrers() {
		var w bool
		switch ref := ref.(type) {
		case *ssa.FieldAddr, *ssa.Field, *ssa.IndexAddr, *ssa.Index, *ssa.Slice, *ssa.MakeInterface, *ssa.ChangeType:
			w = s.writesThrough(ref.(ssa.Value), loaded)
		case *ssa.UnOp:
			w = s.writesThrough(ref, true)
		case *ssa.Store:
			if ref.Addr == v {
				w = loaded
			} else {
				root := literalOf(ref.Addr)
				w = root == nil || s.literalWritten(root) // a copy kept elsewhere
			}
		case *ssa.Call, *ssa.MakeClosure:
			in := s.shared.entered[ref]
			call, isCall := ref.(*ssa.Call)
			w = in == nil && !(isCall && readOnly(call.Common()))
			for _, p := range inside(ref, v) {
				w = w || in.writesThrough(p, true)
			}
		case *ssa.DebugRef, *ssa.BinOp:
		default:
			w = true
		}
		if w {
			return true
		}
	}
	return false
}

// inside returns what stands for v inside an entered call or closure: the
// callee's parameters given v, the closure's free variables bound to it.
func inside(ref ssa.Instruction, v ssa.Value) []ssa.Value {
	var in []ssa.Value
	switch r := ref.(type) {
	case *ssa.Call:
		if fn := r.Common().StaticCallee(); fn != nil && len(fn.Params) == len(r.Common().Args) {
			for i, a := range r.Common().Args {
				if a == v {
					in = append(in, fn.Params[i])
				}
			}
		}
	case *ssa.MakeClosure:
		fn := r.Fn.(*ssa.Function)
		for i, b := range r.Bindings {
			if b == v {
				in = append(in, fn.FreeVars[i])
			}
		}
	}
	return in
}

// readOnly reports whether c only reads what it is given: the builtins
// len and cap, and the functions and methods of fmt, log and testing,
// which format their arguments to print or report them (a String or
// Error method of an argument's type, which formatting calls, is taken
// not to write what it formats).
func readOnly(c *ssa.CallCommon) bool {
	if b, ok := c.Value.(*ssa.Builtin); ok {
		return b.Name() == "len" || b.Name() == "cap"
	}
	var pkg *types.Package
	if fn := c.StaticCallee(); fn != nil && fn.Object() != nil {
		pkg = fn.Object().Pkg()
	} else if c.IsInvoke() {
		pkg = c.Method.Pkg()
	}
	return pkg != nil && slices.Contains([]string{"fmt", "log", "testing"}, pkg.Path())
}

// holdsReference reports whether a value of type t can reach memory that
// others share: a pointer, slice, map, channel, function or interface,
// alone or in a struct or array.
func holdsReference(t types.Type, depth int) bool {
	switch u := t.Underlying().(type) {
	case *types.Basic:
		return false
	case *types.Array:
		return depth == 0 || holdsReference(u.Elem(), depth-1)
	case *types.Struct:
		for f := range u.Fields() {
			if depth == 0 || holdsReference(f.Type(), depth-1) {
				return true
			}
		}
		return false
	}
	return true
}

// spanOf returns the span of the float f alone.
func spanOf(f float64) span {
	if f == 0 {
		return span{true, zeroLow, 0}
	}
	if math.IsInf(f, 0) || math.IsNaN(f) {
		return span{}
	}
	frac, exp := math.Frexp(math.Abs(f))
	mant := uint64(math.Ldexp(frac, 53))
	return span{true, exp - 53 + bits.TrailingZeros64(mant), math.Abs(f)}
}

// times returns the span of a product of values of spans x and y.
func times(x, y span) span {
	if !x.known || !y.known {
		return span{}
	}
	if x.max == 0 || y.max == 0 {
		return spanOf(0)
	}
	return span{true, x.low + y.low, x.max * y.max}
}

// join returns the span of a value of span x or y.
func join(x, y span) span {
	if !x.known || !y.known {
		return span{}
	}
	return span{true, min(x.low, y.low), max(x.max, y.max)}
}

// fit returns x if the float type t holds every value of x exactly: fewer
// than p significant bits, no bit below the smallest subnormal, no
// overflow; otherwise nothing is known of the rounded result.
func fit(x span, t types.Type) span {
	if !x.known || x.low == zeroLow {
		return x // unknown, or exactly 0
	}
	f := provenance.FormatOf(t)
	lowest := math.Ilogb(f.Smallest)
	largest := math.MaxFloat64
	if f.Bits == 24 {
		largest = math.MaxFloat32
	}
	if x.low < lowest || x.max > largest || math.Ldexp(x.max, -x.low) >= math.Ldexp(1, f.Bits) {
		return span{}
	}
	return x
}

// powerOfTwo reports whether x is a single power of two, 2^k.
func powerOfTwo(x span) (int, bool) {
	if !x.known || x.max == 0 {
		return 0, false
	}
	return x.low, math.Ldexp(1, x.low) == x.max
}
