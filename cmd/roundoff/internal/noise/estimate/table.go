// Package estimate holds the numerics of `roundoff noise`: the noise level
// of a function from a difference table (Moré & Wild, "Estimating
// computational noise", SIAM J. Sci. Comput. 33(3), 2011), the forward and
// central difference steps that balance truncation against that noise
// (Moré & Wild, "Estimating derivatives of noisy simulations", ACM TOMS
// 38(3), 2012; Nocedal & Wright 2nd ed. §8.1) and the error-against-step
// curve. It works on a function of one variable, φ(t) = f(x + t·p) along a
// direction p, and never builds or runs a program, so it is tested on
// functions written in Go.
package estimate

import (
	"math"
	"slices"
)

// Verdict is the outcome of one difference table.
type Verdict int

// The outcomes of a difference table, as Moré & Wild 2011 diagnose them.
const (
	Detected Verdict = iota // the scaled differences agree and change sign: noise found
	TooSmall                // half the first differences are zero: spacing too small, try 100 times larger
	TooLarge                // the values vary by more than 10%, or no level settles: try 100 times smaller
)

func (v Verdict) String() string {
	return [...]string{"noise detected", "spacing too small", "spacing too large"}[v]
}

// Table is one difference table of m+1 values at equally spaced points.
type Table struct {
	H       float64   `json:"h"`      // spacing of the points
	Values  []float64 `json:"values"` // f at the m+1 points
	Levels  []float64 `json:"levels"` // σ_k, k = 1..m: noise estimates from the k-th differences
	Sign    []bool    `json:"sign_change"`
	Verdict Verdict   `json:"-"`
	Order   int       `json:"order"` // the order k whose level is taken, 0 if none
	Noise   float64   `json:"noise"` // the absolute noise level, 0 unless Detected
}

// Differences builds the difference table of values, f at m+1 equally
// spaced points, and reads the noise level from it (Moré & Wild 2011, §4
// and their ECnoise procedure; the 10% range test, the "half the first
// differences zero" test and the factor 4 of agreement are quoted from
// memory). With Δ^k the k-th differences and γ_k = (k!)²/(2k)!, the level
// of order k is σ_k = sqrt(γ_k·mean((Δ^k)²)): for independent noise of
// standard deviation σ, E[(Δ^k)²] = σ²·(2k)!/(k!)², so σ_k ≈ σ once the
// smooth part of f no longer shows in Δ^k. The noise is σ_k at the first
// k where σ_k, σ_{k+1} and σ_{k+2} agree within a factor 4 and the k-th
// differences change sign.
func Differences(h float64, values []float64) Table {
	t := Table{H: h, Values: values, Verdict: TooLarge}
	lo, hi := slices.Min(values), slices.Max(values)
	if hi-lo > 0.1*max(math.Abs(lo), math.Abs(hi)) {
		return t // the values vary too much: the smooth part dominates
	}
	d := slices.Clone(values)
	gamma := 1.0
	for k := 1; k < len(values); k++ {
		for i := range len(d) - 1 {
			d[i] = d[i+1] - d[i]
		}
		d = d[:len(d)-1]
		if k == 1 && 2*zeros(d) >= len(values) {
			t.Verdict = TooSmall
			return t
		}
		gamma *= 0.5 * float64(k) / float64(2*k-1)
		t.Levels = append(t.Levels, math.Sqrt(gamma*meanSquare(d)))
		t.Sign = append(t.Sign, slices.Min(d)*slices.Max(d) < 0)
	}
	for k := 0; k+2 < len(t.Levels); k++ {
		w := t.Levels[k : k+3]
		if slices.Max(w) <= 4*slices.Min(w) && t.Sign[k] {
			t.Verdict, t.Order, t.Noise = Detected, k+1, t.Levels[k]
			return t
		}
	}
	return t
}

func zeros(d []float64) int {
	n := 0
	for _, v := range d {
		if v == 0 {
			n++
		}
	}
	return n
}

func meanSquare(d []float64) float64 {
	s := 0.0
	for _, v := range d {
		s += v * v
	}
	return s / float64(len(d))
}
