package recursion

import "math"

// Recursions left alone: each ends for a reason the floats cannot take
// away.

// simpsonCapped is simpsonArea with a depth parameter: at most 2^depth
// calls, whatever the floats do.
func simpsonCapped(g func(float64) float64, a, b, tol, whole float64, depth int) float64 {
	m := (a + b) / 2
	left, right := simpson3(g, a, m), simpson3(g, m, b)
	if depth <= 0 || math.Abs(left+right-whole) <= 15*tol { // a depth cap
		return left + right + (left+right-whole)/15
	}
	return simpsonCapped(g, a, m, tol/2, left, depth-1) + simpsonCapped(g, m, b, tol/2, right, depth-1)
}

// newtonRoot counts its steps: it ends after at most 51 calls.
func newtonRoot(g, dg func(float64) float64, x float64, n int) float64 {
	next := x - g(x)/dg(x)
	if math.Abs(next-x) <= 1e-15*math.Abs(next) {
		return next
	}
	if n > 50 { // a count cap
		return next
	}
	return newtonRoot(g, dg, next, n+1)
}

// contFrac evaluates a continued fraction with its level kept in a float:
// k moves by 1 at each call, exactly, from any start below 2^52, and
// reaches 40 within 40 calls from 0.
func contFrac(x, k, acc float64) float64 {
	if k > 40 || math.Abs(acc) > 1e300 { // a float counter
		return acc
	}
	return contFrac(x, k+1, x/(k+acc))
}

// split bisects until no float is left between the ends: mid rounds to lo
// or hi after at most about 2100 halvings in float64.
func split(g func(float64) float64, lo, hi float64) float64 {
	mid := lo + (hi-lo)/2
	if mid <= lo || mid >= hi {
		return mid
	}
	if g(mid) > 0 {
		return split(g, lo, mid)
	}
	return split(g, mid, hi)
}

// shrinkStep divides its step by 3 at each call until it gives a
// decrease: it reaches 1e-9 within about 700 calls from any finite start
// below the largest float64 (1.8e308 / 3^700 < 1e-9).
func shrinkStep(g func(float64) float64, x, h, gx float64) float64 {
	if h < 1e-9 || g(x+h) < gx {
		return h
	}
	return shrinkStep(g, x, h/3, gx)
}

// node is a tree whose evaluation calls the same method on its children,
// not on its own receiver: the depth is the tree's.
type node struct {
	w    float64
	kids []*node
}

func (n *node) weight(cut float64) float64 {
	if n.w < cut {
		return 0
	}
	s := n.w
	for _, k := range n.kids {
		s += k.weight(cut)
	}
	return s
}

// sumHalves ends on the length of its data, not on a float test.
func sumHalves(xs []float64) float64 {
	if len(xs) <= 1 {
		if len(xs) == 1 && xs[0] > 0 {
			return xs[0]
		}
		return 0
	}
	return sumHalves(xs[:len(xs)/2]) + sumHalves(xs[len(xs)/2:])
}

// simpsonGuarded recurses only while depth is left: the return after the
// guard ends it on an integer test, whatever the floats do.
func simpsonGuarded(g func(float64) float64, a, b, tol, whole float64, depth int) float64 {
	m := (a + b) / 2
	left, right := simpson3(g, a, m), simpson3(g, m, b)
	if depth > 0 && math.Abs(left+right-whole) > 15*tol { // a guard on the depth
		return simpsonGuarded(g, a, m, tol/2, left, depth-1) + simpsonGuarded(g, m, b, tol/2, right, depth-1)
	}
	return left + right + (left+right-whole)/15
}

// wrapped brings a bearing into [0, 2π): a negative one is reflected once,
// and 2π - b is positive for every negative b, so the call never comes
// back to the test. A chain whose branches only pass on holds no base case
// of its own, and the return after it is not read as one.
func wrapped(b float64) float64 {
	if b < 0 {
		return wrapped(2*math.Pi - b)
	}
	return math.Mod(b, 2*math.Pi)
}

// refine splits an interval while the score rises, and stops on a NaN
// score: math.IsNaN classifies a value exactly, a test of no tolerance,
// and the split below bounds the depth by the grain.
func refine(score func(float64) float64, lo, hi, grain float64) []float64 {
	s := score((lo + hi) / 2)
	if math.IsNaN(s) {
		return nil
	}
	if hi-lo < grain {
		return []float64{lo, hi}
	}
	m := (lo + hi) / 2
	return append(refine(score, lo, m, grain), refine(score, m, hi, grain)...)
}
