// Package recall holds the shapes of exact comparison that only their
// context gives away: ties of sums beside an ordered test, a sign split
// whose rest is an exact zero, fields of structs returned by the package.
package recall

// channel is a canal reach between two gates with its head loss.
type channel struct {
	from, to int
	loss     float64
}

// leastLoss relaxes the head losses along canal reaches and keeps every
// predecessor of equal loss: a loss 0.1+0.2 through one gate and 0.3
// direct tie in exact arithmetic, but not in float64.
func leastLoss(reaches []channel, n int) ([]float64, [][]int) {
	best := make([]float64, n)
	prev := make([][]int, n)
	for i := range best {
		best[i] = 1e300
	}
	best[0] = 0
	for range n {
		for _, r := range reaches {
			cand := best[r.from] + r.loss
			if cand < best[r.to] {
				best[r.to], prev[r.to] = cand, []int{r.from}
			} else if cand == best[r.to] { // want `exact == decides a tie of cand and best\[r.to\] next to an ordered test of the same pair`
				prev[r.to] = append(prev[r.to], r.from)
			}
		}
	}
	return best, prev
}

// table is a dense matrix of losses from another source.
type table interface{ At(i, j int) float64 }

// throughGate tests the tie by the difference of the two sums.
func throughGate(t table, i, j, k int) int {
	direct := t.At(i, j)
	via := t.At(i, k) + t.At(k, j)
	if direct > via {
		return 1
	} else if direct-via == 0 { // want `exact == decides a tie of direct and via`
		return 2
	}
	return 0
}

// stepTie steps a counter by a constant, exact for whole numbers below
// 2^53: no tie of two summed paths.
func stepTie(t table, i int) int {
	next := t.At(i, i) + 1
	if next < t.At(i, 0) {
		return 1
	} else if next == t.At(i, 0) {
		return 2
	}
	return 0
}

// loneTie has no ordered test of the pair beside it: the tie rule does
// not judge it (the pair is not computed on both sides either).
func loneTie(t table, i int) bool {
	return t.At(i, 0)+t.At(0, i) == t.At(i, i)
}

// point is a survey mark.
type point struct{ E, N float64 }

func (p point) sub(q point) point { return point{p.E - q.E, p.N - q.N} }

func (p point) cross(q point) float64 { return p.E*q.N - p.N*q.E }

// turn tells how a penstock route turns at b: the products of the cross
// product round independently, so collinear marks rarely give 0.
func turn(a, b, c point) int {
	cp := b.sub(a).cross(c.sub(b))
	switch {
	case cp > 0: // want `the tests cp > 0 and cp < 0 leave exact 0 to the remaining branch, and cp is a difference of computed float64 values`
		return 1
	case cp < 0:
		return -1
	default:
		return 0
	}
}

// side is the same split written as an if chain.
func side(a, b, c point) int {
	if d := b.sub(a).cross(c.sub(a)); 0 < d { // want `the tests d > 0 and d < 0 leave exact 0`
		return 1
	} else if d < 0 {
		return -1
	} else {
		return 0
	}
}

// sideSeq is the same split written as two returning ifs.
func sideSeq(a, b, c point) int {
	d := b.sub(a).cross(c.sub(a))
	if d < 0 { // want `the tests d > 0 and d < 0 leave exact 0`
		return -1
	}
	if d > 0 {
		return 1
	}
	return 0
}

// flowSign splits the sign of a metered flow, an input: it is 0 exactly
// when the meter reads 0, and nothing cancels.
func flowSign(q float64) int {
	switch {
	case q > 0:
		return 1
	case q < 0:
		return -1
	default:
		return 0
	}
}

// windingStep counts a crossing up or down and nothing on the line: the
// zero case is to do nothing, still decided by the exact zero.
func windingStep(a, b, c point, n int) int {
	if d := b.sub(a).cross(c.sub(a)); d > 0 { // want `the tests d > 0 and d < 0 leave exact 0`
		n++
	} else if d < 0 {
		n--
	}
	return n
}

// oneSided tests one sign only: it draws a boundary, not a class of its
// own for 0, and a residue moves a point at rounding distance from the
// boundary to its other side, as any ordered test of nearby values does.
func oneSided(a, b, c point) bool {
	if d := b.sub(a).cross(c.sub(a)); d > 0 {
		return true
	}
	return false
}

// along returns the mark a fraction s of the way from p to q.
func (p point) along(q point, s float64) point {
	return point{p.E + s*(q.E-p.E), p.N + s*(q.N-p.N)}
}

// gauge is a staff gauge placed on the survey.
type gauge struct {
	at point
}

// onProfile asks whether a gauge lies on the profile from p to q by
// interpolating the northing at its easting: the interpolated value
// carries rounding, so a gauge on the line misses by an ulp.
func onProfile(g *gauge, p, q point) bool {
	s := (g.at.E - p.E) / (q.E - p.E)
	return g.at.N == p.along(q, s).N // want `exact == between a computed float64 value and field N`
}

// place stores a computed mark into a gauge.
func place(g *gauge, p, q point) { g.at = p.along(q, 0.5) }

// tail is a series whose shape depends on the parity of a count of
// degrees of freedom, with a special case for one.
func tail(t, dof float64) float64 {
	odd := int(dof)%2 == 1
	if dof == 1 { // want `exact == 1 on dof, which this function also truncates to a whole number: a value whole in exact arithmetic can come out an ulp above \(1\+2.22e-16\)`
		return t / 2
	}
	if odd {
		return t
	}
	return 2 * t
}

// welchTail passes a ratio of sums as the count.
func welchTail(t, a, b, c float64) float64 {
	return tail(t, (a+b)*(a+b)/(a*a/c+b*b/c))
}

// pooledTail passes whole counts only: float64 of an integer.
func pooledTail(t float64, n, m int) float64 {
	return wholeTail(t, float64(n+m-2))
}

// wholeTail is tail for counts that arrive whole: int(dof) and dof == 1
// agree on every value it is given.
func wholeTail(t, dof float64) float64 {
	if dof == 1 {
		return t / 2
	}
	return t * float64(int(dof)%2)
}

// edgeSign returns the sign of an endpoint of [-1, 1] as a count: the
// truncation runs only where x is -1 or 1 exactly, so it agrees with the
// tests that select it.
func edgeSign(x float64) int {
	if x == -1 || x == 1 {
		return int(x)
	}
	return 0
}

func callsEdge(a, b float64) int { return edgeSign(a / b) }

// crate is a bin of a packing heuristic.
type crate struct{ load, room float64 }

func (k *crate) put(w float64) { k.load += w }

// placeBy puts a parcel in the crate whose fill grows least, then the
// emptier one, then the first: the zero case only chooses between the
// same two placements by the next key, so a tie that rounding sends to a
// signed branch gets a placement the tie-break could have given it.
func placeBy(a, b *crate, w float64) {
	if d := (a.load+w)/a.room - (b.load+w)/b.room; d < 0 {
		a.put(w)
		return
	} else if d > 0 {
		b.put(w)
		return
	}
	if d := a.load - b.load; d <= 0 {
		a.put(w)
		return
	}
	b.put(w)
}

// placeOrSplit does something of its own in the zero case: it halves the
// parcel, which only an exact tie of the two fills asks for.
func placeOrSplit(a, b *crate, w float64) {
	if d := (a.load+w)/a.room - (b.load+w)/b.room; d < 0 { // want `the tests d > 0 and d < 0 leave exact 0`
		a.put(w)
		return
	} else if d > 0 {
		b.put(w)
		return
	}
	a.put(w / 2)
	b.put(w / 2)
}
