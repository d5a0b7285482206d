// Package hazards holds exact comparisons that rounding makes unreliable.
package hazards

import "math"

// Celsius is a named float type.
type Celsius float64

const target = 0.7 // not representable in binary

const limit float64 = 0.1

var step = 0.1 // never reassigned

func literal(a, b float64) bool {
	s := a + b
	return s == 0.3 // want `exact == between a computed float64 value and 0.3, which float64 stores as 0.2999999999999999888977697537484345\.\.\.: one rounding error \(ulp 5.55e-17 there\)`
}

func literalNeq(a, b float64) bool {
	return a*b != 0.1 // want `exact != between a computed float64 value and 0.1, which float64 stores as 0.1000000000000000055511151231257827\.\.\.`
}

func literalLeft(a, b float64) bool {
	return 0.1 == a/b // want `exact == between a computed float64 value and 0.1`
}

func namedConst(a, b float64) bool {
	return a-b == target // want `and target, which float64 stores as 0.6999999999999999555910790149937383\.\.\.`
}

func typedConst(a float64) bool {
	return math.Sqrt(a) == limit // want `and limit, which float64 stores as 0.1000000000000000055511151231257827\.\.\.`
}

func localOnce(a, b float64) bool {
	want := 0.3
	return a+b == want // want `and want, which float64 stores as 0.29999`
}

func twoComputed(x, y, u, v float64) bool {
	return x*y == u/v // want `exact == between two computed float64 values: each carries rounding error \(up to 1.11e-16 relative per operation`
}

func twoComputedNeq(x, y, u, v float64) bool {
	return x+y != u-v // want `exact != between two computed float64 values`
}

func mathCalls(x, y float64) bool {
	return math.Sqrt(x) == math.Cbrt(y) // want `two computed float64 values`
}

func sum(xs []float64) float64 {
	s := 0.0
	for _, x := range xs {
		s += x
	}
	return s
}

func sameFunction(xs, ys []float64) bool {
	return sum(xs) == sum(ys) // want `two computed float64 values`
}

func accumulated(xs []float64, a, b float64) bool {
	total := 0.0
	for _, x := range xs {
		total += x
	}
	return total == a*b // want `two computed float64 values`
}

func nan(x float64) bool {
	return x == math.NaN() // want `comparison with math.NaN\(\) is always false: NaN is unequal to every value, itself included`
}

func nanNeq(x float64) bool {
	return math.NaN() != x // want `comparison with math.NaN\(\) is always true`
}

func nan32(x float32) bool {
	return x == float32(math.NaN()) // want `comparison with math.NaN\(\) is always false`
}

// quietNaN is the package's own NaN for float32 code.
func quietNaN() float32 { return float32(math.NaN()) }

// A comparison with the package's NaN is as false as one with math.NaN().
func unset(h float32) bool {
	return h == quietNaN() // want `comparison with math.NaN\(\) is always false`
}

func float32Literal(a, b float32) bool {
	return a+b == 0.3 // want `exact == between a computed float32 value and 0.3, which float32 stores as 0.300000011920928955078125: one rounding error \(ulp 2.98e-08 there\)`
}

func named(t1, t2 Celsius) bool {
	return (t1+t2)/3 == 36.6 // want `computed Celsius value and 36.6, which float64 stores as 36.60000000000000142108547152020037\.\.\.`
}

func complexValues(z, w complex128) bool {
	return z*w == z+w // want `two computed complex128 values`
}

func switchCase(a, b float64) int {
	switch a + b {
	case 0.1: // want `exact == between a computed float64 value and 0.1`
		return 1
	case 0.5:
		return 2 // 0.5 is exact: a deliberate target
	}
	return 0
}

func arrays(a, b, c, d float64) bool {
	p := [2]float64{a + b, c}
	q := [2]float64{c * d, a}
	return p == q // want `== on \[2\]float64 values compares their float elements exactly`
}

type point struct{ X, Y float64 }

func structs(a, b, c float64) bool {
	var p, q point
	p.X = a * b
	q.X = b * c
	return p != q // want `!= on point values compares their float elements exactly`
}

type road struct{ dist []float64 }

func (r *road) relax(to int, d float64) { r.dist[to] = d }

func tie(r *road, from, to int, w float64) bool {
	joint := r.dist[from] + w
	r.relax(to, joint)
	return joint == r.dist[from+1] // want `exact == between a computed float64 value and field dist, which this package fills with computed values`
}

func inclusiveGrid() int {
	n := 0
	for w := 0.0; w <= 1; w += 0.05 { // want `float loop variable w goes from 0 in steps of 0.05 and the test w <= 1 passes 20 times, where exact arithmetic passes 21: the accumulated value 1.0000000000000002 is off by rounding`
		n++
	}
	return n
}

func chosenStep(fine bool) int {
	dw := 0.25
	if fine {
		dw = 0.01
	}
	n := 0
	for w := 0.0; w <= 1; w += dw { // want `in steps of 0.01 and the test w <= 1 passes 100 times, where exact arithmetic passes 101`
		n++
	}
	return n
}

type vec struct{ X, Y float64 }

func (p vec) sub(q vec) vec       { return vec{p.X - q.X, p.Y - q.Y} }
func (p vec) cross(q vec) float64 { return p.X*q.Y - p.Y*q.X }

func collinear(a, b, c vec) bool {
	return b.sub(a).cross(c.sub(a)) == 0 // want `exact == 0 on b.sub\(a\).cross\(c.sub\(a\)\), a difference of computed float64 values: it is 0 only when both terms round to the same float`
}

func onLine(x1, y1, x2, y2, px, py float64) bool {
	c := x2*y1 - x1*y2
	r := (y2-y1)*px + (x1-x2)*py + c
	return r != 0 // want `exact != 0 on r, a difference of computed float64 values`
}

// rankOf picks the rank at fraction p of n sorted values, averaging two
// neighbours when p·n is whole.
func rankOf(p float64, n int) (int, bool) {
	pos := p * float64(n)
	if pos == float64(int(pos)) { // want `exact == tests whether the computed value pos is a whole number: a value whole in exact arithmetic can come out an ulp below or above \(0.29\*100 is 28.999999999999996\)`
		return int(pos), true
	}
	return int(pos), false
}

func ratioWhole(a, b float64) bool {
	r := a / b
	return math.Trunc(r) == r // want `tests whether the computed value r is a whole number`
}

// cheapest breaks ties between path costs summed in different orders by
// the lower index; a tie missed by an ulp picks the cheaper by that ulp.
func cheapest(costs [][2]float64) int {
	best, min := -1, math.Inf(1)
	for i, c := range costs {
		w := c[0] + c[1]
		if w < min || w == min && i < best { // a tie of the argmin's secondary key: a missed tie picks a cost within an ulp of the minimum
			best, min = i, w
		}
	}
	return best
}

// netArea is zero when the holes fill the shell in exact arithmetic; the
// two rounded areas rarely agree to the last bit.
func netArea(shell, holes float64, w, h float64) bool {
	a := math.Abs(shell * w * h)
	return a-holes*w*h == 0 // want `exact == 0 on a - holes\*w\*h, a difference of computed float64 values`
}

func sagZero(x1, y1, x2, y2 float64) bool {
	return math.Abs(x1*y2-x2*y1) == 0 // want `exact == 0 on math.Abs\(x1\*y2 - x2\*y1\)`
}

// A divisor tested for zero whose zero branch handles a case of its own
// (overlapping parallel segments): a residue skips that case and sends
// the pair through the quotient instead.
func meet(ux, uy, vx, vy, wx, wy float64) float64 {
	det := ux*vy - uy*vx
	if det == 0 { // want `exact == 0 on det, a difference of computed float64 values`
		return overlapLength(ux, uy, wx, wy)
	}
	return (wx*vy - wy*vx) / det
}

func overlapLength(ux, uy, wx, wy float64) float64 { return math.Hypot(ux-wx, uy-wy) }

// turning sums the cross products of a polygon's edges and calls the
// points collinear when the sum is exactly 0: each term carries rounding
// of its products, so collinear points rarely sum to 0 exactly.
func turning(xs, ys []float64) bool {
	sum, j := 0.0, len(xs)-1
	for i := range xs {
		sum += xs[j]*ys[i] - xs[i]*ys[j]
		j = i
	}
	return sum == 0 // want `exact == 0 on sum, a difference of computed float64 values`
}

// meanOf is the mean of readings.
func meanOf(xs []float64) float64 {
	total := 0.0
	for _, x := range xs {
		total += x
	}
	return total / float64(len(xs))
}

// spreadOf is the standard deviation of readings about their mean.
func spreadOf(xs []float64) (float64, error) {
	if len(xs) == 0 {
		return math.NaN(), nil
	}
	m, s := meanOf(xs), 0.0
	for _, x := range xs {
		s += (x - m) * (x - m)
	}
	return math.Sqrt(s / float64(len(xs))), nil
}

// standardise scales readings to unit spread, leaving constant readings
// at 0: but three readings of 0.1 have a mean of 0.10000000000000002 and
// a spread of about 1.4e-17, so the guard is skipped and each reading
// comes out near -0.7 instead of 0.
func standardise(xs []float64) []float64 {
	sd, _ := spreadOf(xs)
	out := make([]float64, len(xs))
	if sd == 0 { // want `exact == 0 on sd, a spread of data about their computed mean: for constant data the mean is off by rounding`
		return out
	}
	m := meanOf(xs)
	for i, x := range xs {
		out[i] = (x - m) / sd
	}
	return out
}

// normalizeStencil scales a smoothing stencil to unit sum, or, when its
// weights cancel (an edge finder), to unit positive part: the loop knows
// the weights take either sign, and eight weights of -0.1 beside 0.8 sum
// to 2.8e-17, not 0, so such a stencil is divided by the residue.
func normalizeStencil(weights []float64) {
	var sum, pos float64
	for _, w := range weights {
		sum += w
		if w > 0 {
			pos += w
		}
	}
	div := pos
	if sum != 0 { // want `exact != 0 on sum, a difference of computed float64 values`
		div = sum
	}
	for i := range weights {
		weights[i] /= div
	}
}

// balance scales a stencil by its sum, or by its total magnitude when the
// sum is 0: summing |w| beside w shows the weights take either sign.
func balance(weights []float64) float64 {
	var sum, mass float64
	for _, w := range weights {
		sum += w
		mass += math.Abs(w)
	}
	if sum == 0 { // want `exact == 0 on sum, a difference of computed float64 values`
		return mass
	}
	return sum
}

// cloud is an invented point-cloud hull builder whose floor the package
// fills with a computed value.
type cloud struct{ floor float64 }

// flatAfterRescale seeds a running maximum with the floor, then rescales
// the floor before comparing: the two reads no longer hold the same value.
func (c *cloud) flatAfterRescale(d []float64, extent float64) bool {
	best := c.floor
	for _, d := range d {
		if sq := d * d; sq > best {
			best = sq
		}
	}
	c.floor = 1e-12 * extent * extent
	return best == c.floor // want `exact == between a computed float64 value and field floor, which this package fills with computed values`
}
