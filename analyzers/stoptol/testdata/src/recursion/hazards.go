// Package recursion holds functions that call themselves until a float
// test passes, with nothing that bounds the depth.
package recursion

import "math"

// crossing halves [lo, hi] around a sign change of g until |g(mid)| is
// below eps. For g(x) = x²-2 and eps = 1e-17 the test never passes: near
// √2 adjacent float64 values are 2.22e-16 apart (IEEE 754-2019 binary64),
// so |g| takes no value between 0 and about 4.4e-16 there, and once lo and
// hi are adjacent mid repeats forever.
func crossing(g func(float64) float64, lo, hi, eps float64) float64 {
	mid := (lo + hi) / 2
	if math.Abs(g(mid)) < eps { // want `recursion may never end: its only base cases are float tests \(math.Abs\(g\(mid\)\) < eps\) and nothing bounds the depth, so a recursion that stalls, oscillates or diverges keeps calling itself, and so does a NaN, which fails every ordered comparison; every call holds a stack frame until the stack passes its limit \(1 GB on 64-bit platforms\), where Go aborts the program with a fatal error that recover cannot catch; add a depth parameter with a cap, or rewrite it as a loop with an iteration limit`
		return mid
	}
	if g(lo)*g(mid) < 0 {
		return crossing(g, lo, mid, eps)
	}
	return crossing(g, mid, hi, eps)
}

// simpsonArea is adaptive Simpson quadrature with the tolerance halved at
// each level and no depth limit: halving the tolerance makes the test
// harder, not easier, and once the halves are below rounding |s2-s| stays
// at a few ulps of the area while 15·tol goes to 0.
func simpsonArea(g func(float64) float64, a, b, tol, whole float64) float64 {
	m := (a + b) / 2
	left, right := simpson3(g, a, m), simpson3(g, m, b)
	if math.Abs(left+right-whole) <= 15*tol { // want `recursion may never end: its only base cases are float tests \(math.Abs\(left\+right-whole\) <= 15\*tol\)`
		return left + right + (left+right-whole)/15
	}
	return simpsonArea(g, a, m, tol/2, left) + simpsonArea(g, m, b, tol/2, right)
}

func simpson3(g func(float64) float64, a, b float64) float64 {
	return (b - a) / 6 * (g(a) + 4*g((a+b)/2) + g(b))
}

// path is a curve sampled by recursive halving.
type path struct {
	at  func(t float64) [2]float64
	out [][2]float64
}

// refine halves [t0, t1] until the chord's midpoint lies within dev of the
// curve; a cusp, or a curve far from the origin where points are more than
// dev apart, keeps it halving.
func (p *path) refine(t0, t1, dev float64) {
	tm := (t0 + t1) / 2
	a, b, m := p.at(t0), p.at(t1), p.at(tm)
	if math.Hypot((a[0]+b[0])/2-m[0], (a[1]+b[1])/2-m[1]) < dev { // want `recursion may never end: its only base cases are float tests`
		p.out = append(p.out, b)
		return
	}
	p.refine(t0, tm, dev)
	p.refine(tm, t1, dev)
}

// fill splits while the gap is wider than gap, read as for hi-lo > gap:
// with gap below the spacing of floats near lo, once lo and hi are
// adjacent mid rounds to one of them and fill(lo, hi) calls itself with
// the same ends forever.
func fill(out *[]float64, lo, hi, gap float64) {
	if hi-lo > gap { // want `recursion may never end: its only base cases are float tests \(hi-lo > gap\) and nothing bounds the depth, so a recursion that stalls, oscillates or diverges keeps calling itself;`
		mid := (lo + hi) / 2
		fill(out, lo, mid, gap)
		*out = append(*out, mid)
		fill(out, mid, hi, gap)
	}
}

// halfway is a generic recursion, calling itself instantiated: it
// averages toward a fixed point of g and stops only when |y-x| < tol; with
// tol below the spacing near x (2.22e-16·|x| in float64, 1.19e-7·|x| in
// float32) only y == x passes, and rounding can leave y cycling between
// neighbouring floats.
func halfway[F float32 | float64](g func(F) F, x, tol F) F {
	y := (x + g(x)) / 2
	if y-x < tol && x-y < tol { // want `recursion may never end: its only base cases are float tests \(y-x < tol && x-y < tol\)`
		return y
	}
	return halfway[F](g, y, tol)
}

// stuckCount compares a count that every call passes on as it is: n > 50
// caps nothing, and the float test alone must end the recursion.
func stuckCount(g, dg func(float64) float64, x float64, n int) float64 {
	next := x - g(x)/dg(x)
	if n > 50 {
		return next
	}
	if math.Abs(next-x) <= 1e-15*math.Abs(next) { // want `recursion may never end: its only base cases are float tests`
		return next
	}
	return stuckCount(g, dg, next, n)
}

// straddle bisects a sign change and gives up with +Inf when neither
// half holds one: that last return runs only where no test of the chain
// before it held, so it is an exit on float tests too, and nothing bounds
// the depth.
func straddle(g func(float64) float64, lo, hi, tol float64) float64 {
	m := (lo + hi) / 2
	if math.Abs(g(m)) < tol { // want `recursion may never end: its only base cases are float tests \(math.Abs\(g\(m\)\) < tol\)`
		return m
	} else if (g(lo) < 0) != (g(m) < 0) {
		return straddle(g, lo, m, tol)
	} else if (g(hi) < 0) != (g(m) < 0) {
		return straddle(g, m, hi, tol)
	}
	return math.Inf(1)
}
