package hazards

// gauge keeps running sums of readings.
type gauge struct {
	weight, total, totalSq float64
}

func (g *gauge) add(v, w float64) {
	g.weight += w
	g.total += w * v
	g.totalSq = 0.99*g.totalSq + w*(v*v)
}

func (g *gauge) spread() float64 {
	m := g.total / g.weight
	return g.totalSq/g.weight - m*m // want `one-pass variance g.totalSq / g.weight - m \* m subtracts two values of about mean²`
}

func scatter(xs []float64) float64 {
	var s1, s2 float64
	for _, x := range xs {
		s1 += x
		s2 += x * x
	}
	n := float64(len(xs))
	return (s2 - s1*s1/n) / (n - 1) // want `one-pass variance s2 - s1 \* s1 / n subtracts`
}

func windowSpread(xs []float64) float64 {
	var s1, s2 float64
	for _, x := range xs {
		s1 += x
		x *= x
		s2 += x
	}
	mean, meanSq := s1/float64(len(xs)), s2/float64(len(xs))
	return meanSq - mean*mean // want `one-pass variance meanSq - mean \* mean subtracts`
}
