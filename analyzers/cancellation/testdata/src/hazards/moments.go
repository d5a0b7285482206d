package hazards

import "math"

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
	g.syy += y * y
}

func (g *gaugePair) cov() float64 {
	return g.sxy/g.n - (g.sx/g.n)*(g.sy/g.n) // want `one-pass covariance g.sxy / g.n - \(g.sx / g.n\) \* \(g.sy / g.n\) subtracts two values of about mean\(x\)·mean\(y\)`
}

func (g *gaugePair) slope() float64 {
	return (g.n*g.sxy - g.sx*g.sy) / (g.n*g.sxx - g.sx*g.sx) // want `one-pass covariance g.n \* g.sxy - g.sx \* g.sy` `one-pass variance`
}

// A product of two sums of squares less a squared cross sum, Σx²·Σy² -
// (Σxy)²: the Cauchy–Schwarz gap of two series, which vanishes as they
// become proportional.
func schwarzGap(xs, ys []float64) float64 {
	var sxx, syy, sxy float64
	for i := range xs {
		sxx += xs[i] * xs[i]
		syy += ys[i] * ys[i]
		sxy += xs[i] * ys[i]
	}
	return sxx*syy - sxy*sxy // want `sxx \* syy - sxy \* sxy subtracts r² times the first term from it, r the correlation of xs\[i\] and ys\[i\]`
}

// calibration fits a line to paired readings with centred sums.
type calibration struct{ sxx, sxy, syy float64 }

func (c *calibration) add(x, y, mx, my float64) {
	dx, dy := x-mx, y-my
	c.sxx += dx * dx
	c.sxy += dx * dy
	c.syy += dy * dy
}

// The standard error of the slope from the residual Syy - Sxy²/Sxx.
func (c *calibration) slopeError(n float64) float64 {
	return math.Sqrt((c.syy - c.sxy*c.sxy/c.sxx) / (n - 2) / c.sxx) // want `c.syy - c.sxy \* c.sxy / c.sxx subtracts r² times the first term from it, r the correlation of dx and dy`
}

// The same residual through the slope, Syy - b·Sxy with b = Sxy/Sxx.
func (c *calibration) residualSum() float64 {
	slope := c.sxy / c.sxx
	return c.syy - slope*c.sxy // want `c.syy - slope \* c.sxy subtracts r² times`
}

// 1 - r² from its moments, with the power written out.
func (c *calibration) unexplained() float64 {
	return 1 - math.Pow(c.sxy, 2)/(c.sxx*c.syy) // want `1 - math.Pow\(c.sxy, 2\) / \(c.sxx \* c.syy\) subtracts r² times`
}

// One-pass sums, as gaugePair keeps them: the moments are the one-pass
// forms, reported themselves, and the residual built from them as well.
func (g *gaugePair) residual() float64 {
	ssxy := g.n*g.sxy - g.sx*g.sy // want `one-pass covariance`
	ssxx := g.n*g.sxx - g.sx*g.sx // want `one-pass variance`
	ssyy := g.n*g.syy - g.sy*g.sy // want `one-pass variance`
	return ssyy - ssxy*ssxy/ssxx  // want `ssyy - ssxy \* ssxy / ssxx subtracts r² times the first term from it, r the correlation of x and y`
}
