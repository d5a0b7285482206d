package estimate

import (
	"errors"
	"fmt"
	"math"
	"slices"
)

// Line is a function along a direction: Eval returns φ(t) = f(x+t·p) for
// each offset t. Snap, if set, returns the offset the function actually
// sees for a requested one (x+t rounded to the argument's format, minus x).
type Line struct {
	Eval func(ts []float64) ([]float64, error)
	Snap func(t float64) float64
}

func (l Line) snap(t float64) float64 {
	if l.Snap == nil {
		return t
	}
	return l.Snap(t)
}

// NotFinite reports a value of φ that is NaN or infinite in a difference
// table: the table cannot measure noise there.
type NotFinite struct{ T, V float64 }

func (e *NotFinite) Error() string { return fmt.Sprintf("φ(%g) = %g", e.T, e.V) }

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// ErrConstant reports that φ took one value at every point of every table.
var ErrConstant = errors.New("constant at every spacing tried")

// Noise measures the noise level of φ at 0 from tables of m+1 values at
// spacing h (centred on 0), moving to a spacing 100 times larger when a
// table finds it too small and 100 times smaller when it finds it too
// large, as Moré & Wild 2011 advise, for at most tries tables. It stops
// when the advice turns back on itself. The last table is the answer when
// its verdict is Detected.
func Noise(l Line, h float64, m, tries int) ([]Table, error) {
	var tables []Table
	for range tries {
		h = l.snap(h)
		ts := make([]float64, m+1)
		for i := range ts {
			ts[i] = float64(2*i-m) / 2 * h
		}
		vs, err := l.Eval(ts)
		if err != nil {
			return tables, err
		}
		for i, v := range vs {
			if !finite(v) {
				return tables, &NotFinite{ts[i], v}
			}
		}
		t := Differences(h, vs)
		tables = append(tables, t)
		if t.Verdict == Detected || turned(tables) {
			break
		}
		if t.Verdict == TooSmall {
			h *= 100
		} else {
			h /= 100
		}
	}
	if constant(tables) {
		return tables, ErrConstant
	}
	return tables, nil
}

// turned reports whether the last two tables gave opposite advice.
func turned(ts []Table) bool {
	n := len(ts)
	return n >= 2 && ts[n-1].Verdict != ts[n-2].Verdict
}

func constant(ts []Table) bool {
	for _, t := range ts {
		if slices.Min(t.Values) != slices.Max(t.Values) {
			return false
		}
	}
	return true
}

// Step is a recommended difference step along the direction, with the
// derivative of φ it rests on and the error expected at it.
type Step struct {
	H         float64 `json:"h"`
	Error     float64 `json:"expected_error"` // absolute error of the derivative estimate
	Curvature float64 `json:"curvature"`      // φ'' for the forward step, φ''' for the central one
	Measured  bool    `json:"measured"`       // false: the curvature could not be measured
}

// The acceptance tests of a curvature estimate (Moré & Wild 2012, §5;
// the values are quoted from memory): the difference must exceed the
// noise 100 times, and no value may move more than 10% from φ(0).
const (
	tau1 = 100
	tau2 = 0.1
)

// stencil is a difference formula: Σ w_i·φ(o_i·h) ≈ div·h^order·φ^(order).
type stencil struct {
	offsets, weights []float64
	order            int
	div              float64
}

var (
	second = stencil{[]float64{-1, 0, 1}, []float64{1, -2, 1}, 2, 1}
	third  = stencil{[]float64{-2, -1, 1, 2}, []float64{-1, 2, -2, 1}, 3, 2}
)

// Forward returns the forward-difference step for a function of absolute
// noise level noise, scale = max(1,|x|): with μ = φ” measured by a
// noise-aware second difference, h = 8^(1/4)·sqrt(noise/|μ|), which
// minimises the mean squared error (μh/2)² + 2·noise²/h², whose root at
// that h is 2^(1/4)·sqrt(noise·|μ|) (Moré & Wild 2012, §2).
func Forward(l Line, f0, noise, scale float64) (Step, error) {
	mu, ok, err := curvature(l, second, f0, noise, scale)
	if err != nil || !ok {
		return Step{}, err
	}
	h := l.snap(math.Pow(8, 0.25) * math.Sqrt(noise/math.Abs(mu)))
	return Step{H: h, Error: math.Pow(2, 0.25) * math.Sqrt(noise*math.Abs(mu)), Curvature: mu, Measured: true}, nil
}

// Central returns the central-difference step: with μ = φ”' measured by a
// noise-aware third difference, the truncation error h²|μ|/6 balances the
// noise error noise/h at h = (3·noise/|μ|)^(1/3) (Nocedal & Wright 2nd ed.
// §8.1), where the error is h²|μ|/6 + noise/h.
func Central(l Line, f0, noise, scale float64) (Step, error) {
	mu, ok, err := curvature(l, third, f0, noise, scale)
	if err != nil || !ok {
		return Step{}, err
	}
	h := l.snap(math.Cbrt(3 * noise / math.Abs(mu)))
	return Step{H: h, Error: h*h*math.Abs(mu)/6 + noise/h, Curvature: mu, Measured: true}, nil
}

// curvature estimates φ^(order) at 0 after Moré & Wild 2012, §5: try the
// stencil at h_a, first (noise/|φ0|)^(1/(order+2))·scale, then at h_b =
// (noise/|μ_a|)^(1/(order+2)), where the noise error (about noise/h^order)
// balances a truncation error of the size h²·|μ|; take μ_b when both agree
// within 50% or when only h_b passes the tests, μ_a when only h_a does.
// Otherwise move h_a 10 times up (noise dominates) or down (values move
// too much), or to the geometric middle once steps on both sides have
// failed, and retry. ok is false when no step passes.
func curvature(l Line, s stencil, f0, noise, scale float64) (mu float64, ok bool, err error) {
	p := 1 / float64(s.order+2)
	ha := math.Pow(noise/max(math.Abs(f0), noise), p) * scale
	small, large := 0.0, math.Inf(1) // the largest step too small, the smallest too large
	for range 10 {
		ma, fa, err := s.apply(l, f0, noise, ha)
		if err != nil {
			return 0, false, err
		}
		hb := ha * 10
		if ma != 0 {
			hb = math.Pow(noise/math.Abs(ma), p)
		}
		mb, fb, err := s.apply(l, f0, noise, hb)
		if err != nil {
			return 0, false, err
		}
		switch {
		case fb == 0 && (fa != 0 || math.Abs(ma-mb) <= math.Abs(mb)/2):
			return mb, true, nil
		case fa == 0:
			return ma, true, nil
		case fa > 0:
			small = max(small, ha)
		default:
			large = min(large, ha)
		}
		switch {
		case small > 0 && !math.IsInf(large, 1):
			ha = math.Sqrt(small * large)
		case small > 0:
			ha = small * 10
		default:
			ha = large / 10
		}
	}
	return 0, false, nil
}

// apply returns the stencil's estimate at step h and which test failed:
// +1 when the difference is within tau1 times the noise (h too small), -1
// when a value moves more than tau2 from φ(0) or is not finite (h too
// large, or out of the function's domain), else 0.
func (s stencil) apply(l Line, f0, noise, h float64) (mu float64, fail int, err error) {
	h = l.snap(h)
	ts := make([]float64, len(s.offsets))
	for i, o := range s.offsets {
		ts[i] = o * h
	}
	vs, err := l.Eval(ts)
	if err != nil {
		return 0, 0, err
	}
	delta := 0.0
	for i, v := range vs {
		delta += s.weights[i] * v
		if !finite(v) || math.Abs(v-f0) > tau2*max(math.Abs(f0), math.Abs(v)) {
			fail = -1
		}
	}
	if fail == 0 && math.Abs(delta) < tau1*noise {
		fail = 1
	}
	return delta / (s.div * math.Pow(h, float64(s.order))), fail, nil
}

// Options set the measurement.
type Options struct {
	H     float64 // starting spacing of the difference table
	M     int     // intervals of the table (m+1 points), even
	Tries int     // most tables
	Scale float64 // max(1,|x|)
}

// Report is everything measured at one point.
type Report struct {
	F0      float64 `json:"f"`
	Tables  []Table `json:"tables"`
	Noise   float64 `json:"noise"` // absolute noise level
	Forward Step    `json:"forward"`
	Central Step    `json:"central"`
	Best    float64 `json:"derivative"` // best estimate of φ'(0)
	Curve   []Point `json:"curve"`
}

// ErrNoNoise reports that no table found the noise; the last table's
// verdict says why.
var ErrNoNoise = errors.New("no difference table found the noise")

// Analyze measures the noise of φ at 0, the steps it calls for and the
// best estimate of φ'(0). A zero Step is one whose curvature could not
// be measured.
func Analyze(l Line, o Options) (Report, error) {
	tables, err := Noise(l, o.H, o.M, o.Tries)
	r := Report{Tables: tables}
	if err != nil {
		return r, err
	}
	last := tables[len(tables)-1]
	if last.Verdict != Detected {
		return r, ErrNoNoise
	}
	r.F0, r.Noise = last.Values[o.M/2], last.Noise
	if r.Forward, err = Forward(l, r.F0, r.Noise, o.Scale); err != nil {
		return r, err
	}
	if r.Central, err = Central(l, r.F0, r.Noise, o.Scale); err != nil {
		return r, err
	}
	r.Best, err = Best(l, r.F0, r.Noise, o.Scale)
	return r, err
}
