package exacteq

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"math"
	"strconv"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/inspector"
	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/constval"
	"roundoff/analyzers/internal/fixes"
	"roundoff/analyzers/internal/provenance"
	"roundoff/internal/numeric"
)

// maxSteps bounds the simulation of a loop with constant start, step and
// bound; longer loops are judged without it.
const maxSteps = 1 << 20

// loopCondition handles == and != in a for condition where one operand is a
// float loop variable stepped by arithmetic on itself. It reports whether
// the comparison was such a loop test (reported or proven to terminate).
func (c *checker) loopCondition(cur inspector.Cursor, n *ast.BinaryExpr, x, y operand) bool {
	loop, ok := inForCond(cur)
	if !ok {
		return false
	}
	v, bound, varLeft := x, y, true
	phi, ok := provenance.Strip(x.val).(*ssa.Phi)
	if !ok || provenance.Of(phi) != provenance.LoopCarried {
		v, bound, varLeft = y, x, false
		if phi, ok = provenance.Strip(y.val).(*ssa.Phi); !ok || provenance.Of(phi) != provenance.LoopCarried {
			return false
		}
	}
	if lastValue(phi, bound.val) || provenance.DependsOn(bound.val, phi) {
		return true // the previous pass's value (a stagnation stop), or x != x-1 (an absorption guard)
	}
	step, _ := provenance.LoopStep(phi)
	sim := c.simulate(phi, step, bound.val)
	if sim.hits || c.towardInfinity(phi, step, bound.val) {
		return true // the constant loop lands on the bound exactly, or overflows onto it
	}
	name := fixes.Source(c.pass.Fset, v.expr)
	bnd := fixes.Source(c.pass.Fset, bound.expr)
	remedy := "stop with an ordered test instead"
	if step.Op == token.ADD || step.Op == token.SUB {
		remedy = "stop with an ordered test half a step short of the bound instead"
	}
	msg := fmt.Sprintf("float loop variable %s is tested with %s against %s but changes by rounded arithmetic and may step over it, so the loop may never stop; %s", name, n.Op, bnd, remedy)
	if sim.known {
		short := numeric.Short
		if provenance.FormatOf(phi.Type()) == numeric.Float32 {
			short = func(v float64) string { return strconv.FormatFloat(v, 'g', -1, 32) }
		}
		msg = fmt.Sprintf("float loop variable %s goes from %s in steps of %s and never equals %s (it passes from %s to %s), so the loop %s; %s",
			name, short(sim.start), short(sim.step), bnd, short(sim.before), short(sim.after),
			map[token.Token]string{token.NEQ: "never stops", token.EQL: "never runs to the bound"}[n.Op], remedy)
	}
	d := analysis.Diagnostic{Pos: n.Pos(), End: n.End(), Category: catLoop, Message: msg}
	fixes.Report(c.pass, d, c.halfStepFix(n, loop, v, bound, step, phi, varLeft)...)
	return true
}

// towardInfinity reports whether bound is ±Inf and the loop variable
// grows geometrically toward it: multiplied by a constant above 1 in
// magnitude each pass, or stepped by a loop-carried step so multiplied
// (x += d; d *= 2). Then it overflows onto the infinity exactly within
// about 2100 passes (2^1024 is the overflow threshold), and no float lies
// beyond an infinity to step over. A constant step is absorbed at 2^53
// times its size, short of any infinity, and stays a hazard.
func (c *checker) towardInfinity(phi *ssa.Phi, step *ssa.BinOp, bound ssa.Value) bool {
	b, ok := constval.Float(bound, c.globals)
	if !ok || !math.IsInf(b, 0) || step == nil {
		return false
	}
	if step.Op == token.MUL {
		return c.grows(phi, step) && c.startSign(phi, step) == math.Copysign(1, b)
	}
	d := step.Y
	if provenance.Strip(step.Y) == phi {
		d = step.X
	}
	dphi, ok := provenance.Strip(d).(*ssa.Phi)
	if !ok || step.Op != token.ADD && step.Op != token.SUB || step.Op == token.SUB && provenance.Strip(step.Y) == phi {
		return false
	}
	dstep, ok := provenance.LoopStep(dphi)
	dir := c.startSign(dphi, dstep)
	if step.Op == token.SUB {
		dir = -dir
	}
	return ok && c.grows(dphi, dstep) && dir == math.Copysign(1, b)
}

// grows reports whether the update mul of v multiplies it by a constant
// above 1 (x *= 2).
func (c *checker) grows(v *ssa.Phi, mul *ssa.BinOp) bool {
	k := mul.Y
	if provenance.Strip(mul.Y) == v {
		k = mul.X
	}
	f, ok := constval.Float(k, c.globals)
	return mul.Op == token.MUL && ok && f > 1
}

// startSign returns the sign of v's constant value on entry to the loop
// (the edge that is not its update), or 0 when it is not known.
func (c *checker) startSign(v *ssa.Phi, update *ssa.BinOp) float64 {
	for _, e := range v.Edges {
		if provenance.Strip(e) == update {
			continue
		}
		if f, ok := constval.Float(provenance.Strip(e), c.globals); ok && f != 0 {
			return math.Copysign(1, f)
		}
		return 0
	}
	return 0
}

// halfStepFix replaces x != bound, for a loop variable moving by a constant
// step s written in the loop's post statement (x += s or x -= s), with an
// ordered test half a step short of the bound: x < bound - 0.5*s when x
// grows. A loop that lands on the bound exactly runs as before, and one
// that would miss it by rounding stops after the iterations exact
// arithmetic gives, instead of running one more at bound - ulp.
func (c *checker) halfStepFix(n *ast.BinaryExpr, loop *ast.ForStmt, v, bound operand, step *ssa.BinOp, phi *ssa.Phi, varLeft bool) []fixes.Fix {
	s0, add, ok := postStep(c.pass.TypesInfo, loop.Post, v.expr)
	if n.Op != token.NEQ || !ok || !fixes.Pure(c.pass.TypesInfo, s0) || !fixes.Pure(c.pass.TypesInfo, bound.expr) {
		return nil
	}
	other := step.Y
	if provenance.Strip(step.Y) == phi {
		other = step.X
	}
	s, ok := constval.Float(provenance.Strip(other), c.globals)
	if !ok || s == 0 || math.IsNaN(s) {
		return nil // the step's sign, hence the direction, is unknown
	}
	grows, back := (s > 0) == add, " - "
	if !add {
		back = " + "
	}
	limit := fixes.Operand(c.pass.Fset, bound.expr, token.ADD.Precedence()) + back + "0.5*" + fixes.Operand(c.pass.Fset, s0, token.MUL.Precedence()+1)
	rel := map[bool]string{true: " < ", false: " > "}[grows == varLeft]
	text := fixes.Source(c.pass.Fset, v.expr) + rel + limit
	if !varLeft {
		text = limit + rel + fixes.Source(c.pass.Fset, v.expr)
	}
	return []fixes.Fix{fixes.Safe("Stop half a step before the bound: "+text, fixes.Replace(n, text))}
}

// postStep reads a loop's post statement as a constant-step update of the
// variable x: x += s, x -= s, x = x + s or x = x - s. It returns s and
// whether the step is added.
func postStep(info *types.Info, post ast.Stmt, x ast.Expr) (ast.Expr, bool, bool) {
	as, ok := post.(*ast.AssignStmt)
	if !ok || len(as.Lhs) != 1 || len(as.Rhs) != 1 || !sameVar(info, as.Lhs[0], x) {
		return nil, false, false
	}
	switch as.Tok {
	case token.ADD_ASSIGN, token.SUB_ASSIGN:
		return as.Rhs[0], as.Tok == token.ADD_ASSIGN, true
	case token.ASSIGN:
		b, ok := ast.Unparen(as.Rhs[0]).(*ast.BinaryExpr)
		if ok && (b.Op == token.ADD || b.Op == token.SUB) && sameVar(info, b.X, x) {
			return b.Y, b.Op == token.ADD, true
		}
	}
	return nil, false, false
}

// sameVar reports whether a and b name the same variable.
func sameVar(info *types.Info, a, b ast.Expr) bool {
	ia, ok1 := ast.Unparen(a).(*ast.Ident)
	ib, ok2 := ast.Unparen(b).(*ast.Ident)
	return ok1 && ok2 && info.ObjectOf(ia) != nil && info.ObjectOf(ia) == info.ObjectOf(ib)
}

// simulation is the outcome of running a constant loop.
type simulation struct {
	known         bool // start, step and bound are constants and the run was conclusive
	hits          bool // the variable lands exactly on the bound
	start, step   float64
	before, after float64 // the values on either side of the bound
}

// simulate runs x = x op step from the loop's constant start, in the
// variable's own format, until x equals the bound, passes it, stops moving
// or maxSteps is reached.
func (c *checker) simulate(phi *ssa.Phi, step *ssa.BinOp, boundVal ssa.Value) simulation {
	var start ssa.Value
	for _, e := range phi.Edges {
		if provenance.Strip(e) != step {
			start = e
		}
	}
	other := step.Y
	if provenance.Strip(step.Y) == phi {
		other = step.X
	}
	x0, ok1 := constval.Float(provenance.Strip(start), c.globals)
	s, ok2 := constval.Float(provenance.Strip(other), c.globals)
	b, ok3 := constval.Float(provenance.Strip(boundVal), c.globals)
	if start == nil || !ok1 || !ok2 || !ok3 || isComplex(phi.Type()) {
		return simulation{}
	}
	round := func(v float64) float64 { return v }
	if provenance.FormatOf(phi.Type()) == numeric.Float32 {
		round = func(v float64) float64 { return float64(float32(v)) }
	}
	x0, s, b = round(x0), round(s), round(b)
	x, swapped := x0, provenance.Strip(step.Y) == phi
	for range maxSteps {
		if x == b {
			return simulation{known: true, hits: true}
		}
		next := round(apply(step.Op, x, s, swapped))
		if next == x || math.IsNaN(next) || math.IsInf(next, 0) || (x < b) != (next < b) && next != b {
			additive := step.Op == token.ADD || step.Op == token.SUB && !swapped
			if step.Op == token.SUB {
				s = -s
			}
			return simulation{known: additive && next != x, start: x0, step: s, before: x, after: next}
		}
		x = next
	}
	return simulation{}
}

// apply performs one update; swapped means the variable is the right operand.
func apply(op token.Token, x, s float64, swapped bool) float64 {
	switch op {
	case token.ADD:
		return x + s
	case token.SUB:
		if swapped {
			return s - x
		}
		return x - s
	case token.MUL:
		return x * s
	case token.QUO:
		if swapped {
			return s / x
		}
		return x / s
	}
	return math.NaN()
}
