package hazards

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
	m.total -= gone // want `running window sum m.total: each value removed leaves its rounding, up to u·\|value\| \(u = 1.11e-16\), behind for good`
	m.total += v
}
