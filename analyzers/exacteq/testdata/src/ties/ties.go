package ties

import "math"

// bearing returns the bearing of a wind vector scaled by gust factors;
// the pair of tests asks whether both scaled components are zero: under
// ey == 0, ex == ey holds exactly when ex is 0.
func bearing(x, y, gx, gy float64) float64 {
	ex := (1 + gx) * x
	ey := (1 + gy) * y
	if ex != ey || ey != 0 {
		return math.Atan2(ey, ex)
	}
	if ex == ey && ex == 0 {
		return 0
	}
	if ex == ey && gx == 0 { // want `exact == between two computed float64 values`
		return 1
	}
	return 2
}

type turbine struct {
	head, loss float64
}

// pick chooses the turbine of least net head, breaking ties by loss: a
// tie missed by an ulp orders by the net heads themselves.
func pick(ts []turbine, drop float64) int {
	best, bestNet, bestLoss := -1, math.Inf(1), math.Inf(1)
	for i, t := range ts {
		net := t.head*0.98 - drop
		if net < bestNet || (net == bestNet && t.loss < bestLoss) {
			best, bestNet, bestLoss = i, net, t.loss
		}
	}
	return best
}

// equalNets is no ordering: the equality alone decides.
func equalNets(a, b turbine, drop float64) bool {
	na := a.head*0.98 - drop
	nb := b.head*0.98 - drop
	return na == nb || na < 0 // want `exact == between two computed float64 values`
}

// compareFlow orders turbines by flow per unit head; equal flows are a tie.
func compareFlow(a, b turbine) int {
	fa := a.loss / a.head * 3.6
	fb := b.loss / b.head * 3.6
	if fa == fb {
		return 0
	}
	if fa < fb {
		return -1
	}
	return 1
}

// overlap is no comparator: it returns a count, and its equality decides
// a case of its own.
func overlap(a, b turbine, k float64) int {
	fa := a.loss / a.head * k
	fb := b.loss / b.head * k
	if fa == fb { // want `exact == between two computed float64 values`
		return 2
	}
	return 0
}

type node struct {
	cost, dist float64
	prev       *node
}

func pipe(a, b *node) float64 { return a.cost + b.cost }

// relax keeps the least route cost of n; the later test asks whether the
// cost came from p: the same sum of the same operands gives the same bits.
func relax(n, p *node) {
	n.dist = math.Min(n.dist, pipe(n, p)+p.dist)
	old := p.dist
	if n.dist == pipe(n, p)+old {
		n.prev = p
	}
}

// scaled stores a product-free sum but tests a scaled one: different
// operations, a real comparison of rounded values.
func scaled(n, p *node, k float64) bool {
	n.dist = n.cost + p.dist
	return n.dist == n.cost*k+p.cost // want `exact == between a computed float64 value and field dist`
}
