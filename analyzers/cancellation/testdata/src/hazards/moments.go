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

// tally keeps weighted sums of readings behind accessors.
type tally struct{ sums struct{ w, wx, wx2 float64 } }

func (t *tally) fill(x, w float64) {
	t.sums.w += w
	t.sums.wx += w * x
	t.sums.wx2 += w * x * x
}

func (t *tally) W() float64   { return t.sums.w }
func (t *tally) WX() float64  { return t.sums.wx }
func (t *tally) WX2() float64 { return t.sums.wx2 }

// The weighted one-pass form Σw·Σwx² - (Σwx)², read through accessors.
func (t *tally) spread() float64 {
	sw := t.W()
	return (t.WX2()*sw - t.WX()*t.WX()) / (sw * sw) // want `one-pass variance t.WX2\(\) \* sw - t.WX\(\) \* t.WX\(\) subtracts two values of about mean²`
}

// The count-weighted form n·Σx² - (Σx)².
func countSpread(xs []float64) float64 {
	var s1, s2 float64
	for _, x := range xs {
		s1 += x
		s2 += x * x
	}
	n := float64(len(xs))
	return (n*s2 - s1*s1) / (n * n) // want `one-pass variance n \* s2 - s1 \* s1 subtracts`
}

// gaugePair correlates two river gauges read in metres above a datum of
// 1e4: sums of raw readings and of their products, combined once.
type gaugePair struct{ n, sx, sy, sxy, sxx, syy float64 }

func (g *gaugePair) add(x, y float64) {
	g.n++
	g.sx += x
	g.sy += y
	g.sxy += x * y
	g.sxx += x * x
}

func (g *gaugePair) cov() float64 {
	return g.sxy/g.n - (g.sx/g.n)*(g.sy/g.n) // want `one-pass covariance g.sxy / g.n - \(g.sx / g.n\) \* \(g.sy / g.n\) subtracts two values of about mean\(x\)·mean\(y\)`
}

func (g *gaugePair) slope() float64 {
	return (g.n*g.sxy - g.sx*g.sy) / (g.n*g.sxx - g.sx*g.sx) // want `one-pass covariance g.n \* g.sxy - g.sx \* g.sy` `one-pass variance`
}
