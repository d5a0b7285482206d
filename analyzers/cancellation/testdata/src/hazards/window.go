package hazards

import "math"

// A moving average over a stream: the sum is only ever corrected by the
// value leaving the window.
type movingMean struct {
	ring  []float64
	next  int
	total float64
}

func (m *movingMean) push(v float64) {
	gone := m.ring[m.next]
	m.ring[m.next] = v
	m.next = (m.next + 1) % len(m.ring)
	m.total -= gone // want `running sum or mean m.total, taken from as well as added to: each value removed leaves its rounding, up to u·\|value\| \(u = 1.11e-16\), behind for good`
	m.total += v
}

// A weighted pool whose per-bucket totals are raised by one method and
// lowered by another, element by element.
type pool struct {
	weights []float64
	totals  []float64
}

func (p *pool) add(i int, w float64) {
	p.weights[i] += w
	p.totals[i/8] = p.totals[i/8] + w
}

func (p *pool) drop(i int) {
	w := p.weights[i]
	p.weights[i] = 0
	p.totals[i/8] -= w // want `running sum or mean p.totals\[i/8\], taken from as well as added to`
}

// A budget only ever spent, and reset to a constant: nothing passes
// through it, so no large value leaves its rounding behind.
type budget struct{ left float64 }

func (b *budget) spend(x float64) { b.left -= x }
func (b *budget) reset()          { b.left = 100 }

// A windowed mean and second moment, updated in place as values enter and
// leave: the sums are carried over from call to call.
type windowMoments struct {
	n        float64
	mean, m2 float64
}

func (s *windowMoments) enter(x float64) {
	s.n++
	d := x - s.mean
	s.mean += d / s.n
	grown := s.m2
	grown += d * (x - s.mean)
	s.m2 = grown
}

func (s *windowMoments) leave(x float64) {
	s.n--
	d := x - s.mean
	s.mean -= d / s.n        // want `running sum or mean s.mean, taken from as well as added to`
	s.m2 -= d * (x - s.mean) // want `running sum or mean s.m2, taken from as well as added to`
}

// A box moved by value: the receiver is a copy, so nothing is kept from
// call to call.
type box struct{ lo, hi float64 }

func (b box) shifted(d float64) box {
	b.lo += d
	b.hi -= d
	b.hi += 2 * d
	return b
}

// A grid of readings combined elementwise with another grid: each entry
// is rounded once by the operation asked for, and nothing that entered
// one grid leaves it again.
type grid struct{ cells []float64 }

func (g *grid) plus(h *grid) {
	for i := range g.cells {
		g.cells[i] += h.cells[i]
	}
}

func (g *grid) minus(h *grid) {
	for i := range g.cells {
		g.cells[i] -= h.cells[i]
	}
}

// A heading kept in [0, 2π): the wrap takes out a multiple of 2π worked
// out from the heading alone, a range reduction of what it holds now.
type rudder struct{ heading, turned float64 }

func (r *rudder) turn(by float64) {
	r.heading += by
	r.turned += by
}

func (r *rudder) wrap() {
	d := 2 * math.Pi * math.Floor(r.heading/(2*math.Pi))
	r.heading -= d
}

// The moment of inertia of a hull about its centre: rebuilt from zero on
// each call, the parts added and the shift to the centre taken out once.
type hull struct{ mass, inertia, arm float64 }

func (h *hull) settle(parts []float64) {
	h.inertia = 0
	for _, p := range parts {
		h.inertia += p
	}
	h.inertia -= h.mass * h.arm * h.arm
}

// A windowed mean downdated as a reading leaves: the removal reads the
// reading as well as the mean, so what passed is taken out again.
type meanWindow struct{ n, mean float64 }

func (m *meanWindow) enter(x float64) { m.n++; m.mean += (x - m.mean) / m.n }
func (m *meanWindow) leave(x float64) {
	m.n--
	m.mean -= (x - m.mean) / m.n // want `running sum or mean m.mean, taken from as well as added to`
}

// A scratch sum restarted each call from the kept running sum: it carries
// that sum's history on, so the value taken out leaves its rounding there.
type coMoments struct{ sums, next []float64 }

func (m *coMoments) add(k int, x float64) { m.sums[k] += x }

func (m *coMoments) leave(k int, x float64) {
	m.next[k] = 0
	m.next[k] += m.sums[k]
	m.next[k] -= x // want `running sum or mean m.next\[k\], taken from as well as added to`
	m.sums, m.next = m.next, m.sums
}
