// Package gauge smooths readings of a pressure sensor.
package gauge

import (
	"math"
	"sync/atomic"
)

// Smoother is a smoothed reading.
type Smoother interface {
	Level() float64
	Feed(x float64)
}

// New returns a smoother with weight w, or a silent one when w is 0.
func New(w float64) Smoother {
	if w == 0 {
		return quiet{}
	}
	return &blend{w: w}
}

// NewSlow returns a smoother with a small weight.
func NewSlow() Smoother { return New(0.05) }

type quiet struct{}

func (quiet) Level() float64 { return 0 }
func (quiet) Feed(float64)   {}

// blend keeps its level as the bits of a float64, updated atomically.
type blend struct {
	w    float64
	bits uint64
}

func (b *blend) Level() float64 { return math.Float64frombits(atomic.LoadUint64(&b.bits)) }

func (b *blend) Feed(x float64) {
	l := math.Float64frombits(atomic.LoadUint64(&b.bits))
	l += b.w * (x - l)
	atomic.StoreUint64(&b.bits, math.Float64bits(l))
}

// Tally sums readings; its mean is a sum divided by a count, each step
// correctly rounded.
type Tally struct {
	sum float64
	n   int
}

func (t *Tally) Add(x float64) { t.sum += x }
func (t *Tally) Count()        { t.n++ }
func (t *Tally) Mean() float64 { return t.sum / float64(t.n) }

// Spread keeps a running second moment; its update adds a product.
type Spread struct {
	n, mean, m2 float64
}

func (s *Spread) Add(x float64) {
	s.n++
	d := x - s.mean
	s.mean += d / s.n
	s.m2 += d * (x - s.mean)
}

func (s *Spread) Variance() float64 { return s.m2 / (s.n - 1) }

// Opaque returns a smoother made elsewhere: its type is not known.
func Opaque(make func() Smoother) Smoother { return make() }
