package fdstep

import (
	"go/ast"
	"go/types"
	"math"

	"roundoff/internal/numeric"
)

// A scheme is a finite-difference formula
//
//	Σ weights[k]·f(x + k·h) / (den·h^order)
//
// with the step that balances its truncation and rounding errors
// (Numerical Recipes 3rd ed. §5.7; Nocedal & Wright 2nd ed. §8.1).
type scheme struct {
	name    string
	weights map[int]float64 // offset k in steps → weight
	den     float64
	order   int
	root    string                         // the optimal relative step, in words
	call    string                         // the same in Go, from the math package's name and eps
	optimal func(f numeric.Format) float64 // the optimal relative step for f.Eps
	err     func(h, eps float64) float64   // expected error at relative step h, f and its derivatives of unit size
}

// schemes lists the formulas fdstep recognises. The error models are the
// "error at step h" column of the shared table (truncation plus rounding).
var schemes = []*scheme{
	{
		name: "forward", weights: map[int]float64{1: 1, 0: -1}, den: 1, order: 1,
		root: "sqrt(eps)", call: "%[1]s.Sqrt(%[2]s)", optimal: numeric.Format.SqrtEps,
		err: func(h, eps float64) float64 { return h/2 + 2*eps/h },
	},
	{
		name: "backward", weights: map[int]float64{0: 1, -1: -1}, den: 1, order: 1,
		root: "sqrt(eps)", call: "%[1]s.Sqrt(%[2]s)", optimal: numeric.Format.SqrtEps,
		err: func(h, eps float64) float64 { return h/2 + 2*eps/h },
	},
	{
		name: "central", weights: map[int]float64{1: 1, -1: -1}, den: 2, order: 1,
		root: "eps^(1/3)", call: "%[1]s.Cbrt(%[2]s)", optimal: numeric.Format.CbrtEps,
		err: func(h, eps float64) float64 { return h*h/6 + eps/h },
	},
	{
		name: "second", weights: map[int]float64{1: 1, 0: -2, -1: 1}, den: 1, order: 2,
		root: "eps^(1/4)", call: "%[1]s.Sqrt(%[1]s.Sqrt(%[2]s))", optimal: numeric.Format.QuartEps,
		err: func(h, eps float64) float64 { return h*h/12 + 4*eps/(h*h) },
	},
	// The five-point stencils are fourth order: truncation h^4·f^(5)/30 and
	// h^4·f^(6)/90, rounding (1+8+8+1)/12·eps/h and (1+16+30+16+1)/12·eps/h²
	// (Taylor expansion of the stencil, as in Numerical Recipes 3rd ed.
	// §5.7), so the optimum is near eps^(1/5) and eps^(1/6).
	{
		name: "five-point", weights: map[int]float64{2: -1, 1: 8, -1: -8, -2: 1}, den: 12, order: 1,
		root: "eps^(1/5)", call: "%[1]s.Pow(%[2]s, 0.2)", optimal: func(f numeric.Format) float64 { return math.Pow(f.Eps, 0.2) },
		err: func(h, eps float64) float64 { return h*h*h*h/30 + 1.5*eps/h },
	},
	{
		name: "five-point second", weights: map[int]float64{2: -1, 1: 16, 0: -30, -1: 16, -2: -1}, den: 12, order: 2,
		root: "eps^(1/6)", call: "%[1]s.Pow(%[2]s, 1.0/6)", optimal: func(f numeric.Format) float64 { return math.Pow(f.Eps, 1.0/6) },
		err: func(h, eps float64) float64 { return h*h*h*h/90 + 16*eps/(3*h*h) },
	},
}

// truncation returns the truncation part of s's error model at relative
// step h: the error of exact arithmetic.
func (s *scheme) truncation(h float64) float64 { return s.err(h, 0) }

// maxTruncation is the truncation error, for f and its derivatives of unit
// size, from which a step above maxStep is too large for a derivative:
// fewer than three correct digits (common practice). A forward step of 0.1
// errs by about 0.05; a central step of 0.05 by 4e-4 is left alone.
const maxTruncation = 1e-3

// maxStep is the largest step fdstep judges. A step above it would be
// the optimum only for a function accurate to fewer than about four digits
// (forward: sqrt(eps_f) = 1e-2 at eps_f = 1e-4); such a step is a grid
// spacing or a deliberate smoothing, not a derivative taken at the limit
// (common practice).
const maxStep = 1e-2

// badRatio is how many times the optimal error the error at a step below
// the optimum must reach to count as badly sized: two significant digits
// lost (common practice).
const badRatio = 100

// match returns the scheme whose weights are proportional to w, and the
// factor λ with w = λ·weights.
func match(w map[int]float64) (*scheme, float64, bool) {
	for _, s := range schemes {
		if len(s.weights) != len(w) {
			continue
		}
		var lambda float64
		ok := true
		for k, sw := range s.weights {
			wk, found := w[k]
			if !found {
				ok = false
				break
			}
			if lambda == 0 {
				lambda = wk / sw
			}
			ok = ok && near(wk, lambda*sw)
		}
		if ok && lambda != 0 {
			return s, lambda, true
		}
	}
	return nil, 0, false
}

// near reports whether a and b agree to 1e-9 relative: constants written
// differently (0.5/h and 1/(2*h)) round differently.
func near(a, b float64) bool {
	return math.Abs(a-b) <= 1e-9*math.Max(math.Abs(a), math.Abs(b))
}

// epsF returns eps_f, the relative accuracy of the values of the function
// callee, for results of format f: the one place that decides it. callee
// is the function evaluated at x±h (a *types.Func, or the variable or
// field holding a function value; nil when unknown). A function declared
// noisy (//roundoff:noise, or the configuration file) has its declared
// level; any other is accurate to the format's machine epsilon.
func (c *checker) epsF(callee types.Object, f numeric.Format) float64 {
	if fn, ok := callee.(*types.Func); ok {
		if level, ok := c.noise.Of(fn); ok {
			return max(level, f.Eps)
		}
	}
	return f.Eps
}

// verdict is the judgement of one fixed step.
type verdict struct {
	scheme    *scheme
	h         float64        // the step
	f         numeric.Format // the float format of x, with Eps replaced by eps_f
	absorbed  float64        // |x| from which x+h == x
	bad       bool           // the step is far below the optimum
	large     bool           // the step is above maxStep and truncates too much
	isDefault bool           // the step is the fixed default of a chosen step
	fallback  ast.Expr       // its site: the constant assigned as the default
	scaled    bool           // h is relative: the step is h·max(1,|x|)
	errH      float64        // expected error at the step
	errOpt    float64        // expected error at the optimal step
	tol       float64        // the tolerance of the check comparing the quotient, 0 when none
}

// judge assesses step h of scheme s in format f, and reports whether it
// deserves a diagnostic: badly sized, or fixed where x is not known. A
// known x sets the scale, max(1,|x|), against which h is sized. tol is the
// tolerance of the check that compares the quotient (checkTolerance), 0
// when there is none: a step below the optimum is then badly sized when
// the tolerance is below adequate times its expected error and either the
// step is far below the optimum or the tolerance is below the error.
func judge(s *scheme, h float64, f numeric.Format, x float64, xKnown bool, tol float64) (verdict, bool) {
	v := verdict{scheme: s, h: h, f: f, absorbed: f.AbsorbingMagnitude(h)}
	scale := 1.0
	if xKnown {
		scale = math.Max(1, math.Abs(x))
	}
	hr, opt := h/scale, s.optimal(f)
	v.errH, v.errOpt = s.err(hr, f.Eps), s.err(opt, f.Eps)
	if h > maxStep {
		// A smoothing width or a derivative of a very noisy function, unless
		// the truncation alone leaves fewer than three digits.
		v.large = s.truncation(hr) >= maxTruncation
		return v, v.large
	}
	v.bad = hr < opt && v.errH >= badRatio*v.errOpt
	if tol > 0 {
		v.tol = tol
		v.bad = hr < opt && tol < adequate*v.errH && (v.bad || tol < v.errH)
	}
	return v, v.bad || !xKnown
}
