package noise

import (
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"

	"roundoff/cmd/roundoff/internal/limits"
	"roundoff/cmd/roundoff/internal/noise/estimate"
)

// Result is what `roundoff noise` reports.
type Result struct {
	Function    string           `json:"function"`
	Type        string           `json:"type"`
	X           []float64        `json:"x"`
	Direction   []float64        `json:"direction"`
	Evaluations int              `json:"evaluations"`
	F           float64          `json:"f"`
	Noise       float64          `json:"noise"`          // absolute
	Relative    float64          `json:"relative_noise"` // noise/|f(x)|
	Digits      float64          `json:"digits"`         // -log10(relative)
	Clean       bool             `json:"clean"`          // relative noise within a few ulps: no directive needed
	Tables      []table          `json:"tables"`
	Forward     estimate.Step    `json:"forward"`
	Central     estimate.Step    `json:"central"`
	Limits      limits.Limits    `json:"limits"`     // rules of thumb and attainable tolerances at eps_f
	Derivative  float64          `json:"derivative"` // best estimate of the directional derivative
	Curve       []estimate.Point `json:"curve"`
	Directive   string           `json:"directive,omitempty"`
}

// table is a difference table with its verdict in words.
type table struct {
	estimate.Table
	Verdict string `json:"verdict"`
}

// cleanUlps is the relative noise, in units of machine epsilon, up to
// which a function counts as clean: a few roundings (common practice).
const cleanUlps = 4

// measure runs the estimate through the evaluator.
func measure(ev *evaluator, t *target, o *options, x, p []float64) (*Result, error) {
	f := t.kind.format()
	mag := x[0]
	if len(x) > 1 {
		mag = norm(x)
	}
	scale := max(1, math.Abs(mag))
	h := o.spacing
	if h == 0 {
		h = 1e-4 * scale
	}
	l := line(ev, t.kind, x, p)
	f0, err := l.Eval([]float64{0})
	if err != nil {
		return nil, err
	}
	if math.IsNaN(f0[0]) || math.IsInf(f0[0], 0) {
		return nil, fmt.Errorf("returns %v at x = %s", f0[0], pointString(x))
	}
	est, err := estimate.Analyze(l, estimate.Options{H: h, M: o.points - 1, Tries: 5, Scale: scale})
	if err != nil {
		return nil, diagnose(err, est.Tables, x, p)
	}
	curve, err := estimate.Curve(l, est.F0, est.Best, estimate.Steps(scale, 2))
	if err != nil {
		return nil, err
	}
	r := &Result{
		Function: t.pkgPath + "." + t.name, Type: f.Name, X: x, Direction: p,
		F: est.F0, Noise: est.Noise, Forward: est.Forward, Central: est.Central,
		Derivative: est.Best, Curve: curve, Evaluations: ev.count,
	}
	for _, tb := range est.Tables {
		r.Tables = append(r.Tables, table{tb, tb.Verdict.String()})
	}
	r.Relative = est.Noise / math.Abs(est.F0)
	if r.Relative >= 1 {
		return nil, fmt.Errorf("has noise %.2g at least as large as |f(x)| = %.2g: no digit of f is correct at this point; try another -at", est.Noise, math.Abs(est.F0))
	}
	r.Digits = -math.Log10(r.Relative)
	r.Clean = r.Relative <= cleanUlps*f.Eps
	r.Limits = limits.Compute(f, max(r.Relative, f.Eps), mag)
	if !r.Clean {
		r.Directive = fmt.Sprintf("//roundoff:noise %s measured by roundoff noise at x = %s", level(r.Relative), pointString(x))
	}
	return r, nil
}

// level writes a relative noise level with two significant digits,
// rounded up so the directive never claims more accuracy than measured.
func level(rel float64) string {
	e := math.Floor(math.Log10(rel)) - 1
	v := math.Ceil(rel/math.Pow(10, e)) * math.Pow(10, e)
	return strconv.FormatFloat(v, 'g', 2, 64)
}

// diagnose words a failed measurement.
func diagnose(err error, tables []estimate.Table, x, p []float64) error {
	if nf, ok := errors.AsType[*estimate.NotFinite](err); ok {
		at := make([]float64, len(x))
		for i := range x {
			at[i] = x[i] + nf.T*p[i]
		}
		return fmt.Errorf("returns %v at x = %s, in the difference table around the point; try another -at or a smaller -spacing", nf.V, pointString(at))
	}
	if len(tables) == 0 {
		return err
	}
	first, last := tables[0].H, tables[len(tables)-1].H
	switch {
	case errors.Is(err, estimate.ErrConstant):
		return fmt.Errorf("is constant at every spacing tried (%.2g to %.2g): no noise is visible along this direction; try another -at or -dir, or a -spacing on the scale where f changes", first, last)
	case !errors.Is(err, estimate.ErrNoNoise):
		return err
	case tables[len(tables)-1].Verdict == estimate.TooSmall:
		return fmt.Errorf("takes too few distinct values at every spacing tried (%.2g to %.2g): the spacing is too small; try a larger -spacing", first, last)
	}
	return fmt.Errorf("shows no noise level at any spacing tried (%.2g to %.2g): its values vary too much or its differences never settle, so the spacing is too large; try a smaller -spacing", first, last)
}

// report prints the result as text or JSON.
func report(w io.Writer, r *Result, asJSON bool) error {
	if asJSON {
		enc := json.NewEncoder(w)
		enc.SetIndent("", "  ")
		return enc.Encode(r)
	}
	writeText(w, r)
	return nil
}

// writeText prints the result for a reader.
func writeText(w io.Writer, r *Result) {
	fmt.Fprintf(w, "%s at x = %s (%s, %d evaluations)\n\n", r.Function, pointString(r.X), r.Type, r.Evaluations)
	fmt.Fprintf(w, "noise      %s absolute; %s relative to |f(x)| = %s: about %.1f correct digits\n", g(r.Noise), g(r.Relative), g(math.Abs(r.F)), r.Digits)
	for _, t := range r.Tables {
		fmt.Fprintf(w, "  table    %d points %s apart: %s", len(t.Values), g(t.H), t.Verdict)
		if t.Order > 0 {
			fmt.Fprintf(w, " (differences of order %d to %d agree)", t.Order, t.Order+2)
		}
		fmt.Fprintln(w)
	}
	fmt.Fprintf(w, "\nsteps for the derivative along the direction (best estimate %s)\n", strconv.FormatFloat(r.Derivative, 'g', 6, 64))
	step(w, "forward", r.Forward, "8^(1/4)·sqrt(noise/|f''|), f''", r.Limits.Forward.H, "sqrt(eps_f)·x_c")
	step(w, "central", r.Central, "(3·noise/|f'''|)^(1/3), f'''", r.Limits.Central.H, "eps_f^(1/3)·x_c")
	fmt.Fprintf(w, "\nattainable accuracy at eps_f = %s (as roundoff limits -noise computes it)\n", g(r.Limits.Accuracy))
	fmt.Fprintf(w, "  minimization  %-10s sqrt(eps_f)·max(1,|x|): best x from comparing f values\n", g(r.Limits.MinTol))
	fmt.Fprintf(w, "  root finding  %-10s eps_f·|x|, at least ulp: best x from sign changes\n", g(r.Limits.RootTol))
	writeCurve(w, r)
	fmt.Fprintln(w)
	if r.Clean {
		fmt.Fprintf(w, "clean: the noise is within %d ulps, as for any %s formula; no //roundoff:noise directive is needed\n", cleanUlps, r.Type)
		return
	}
	fmt.Fprintf(w, "directive for the doc comment (-write inserts it):\n%s\n", r.Directive)
}

// g writes v with three significant digits.
func g(v float64) string { return strconv.FormatFloat(v, 'g', 3, 64) }

// step prints a recommended step, or the rule of thumb when the curvature
// could not be measured.
func step(w io.Writer, name string, s estimate.Step, rule string, thumb float64, thumbRule string) {
	if !s.Measured {
		fmt.Fprintf(w, "  %-8s h = %-10s %s (the curvature could not be measured)\n", name, g(thumb), thumbRule)
		return
	}
	fmt.Fprintf(w, "  %-8s h = %-10s expected error %-10s %s ≈ %s; rule of thumb %s = %s\n", name, g(s.H), g(s.Error), rule, g(s.Curvature), thumbRule, g(thumb))
}

// writeCurve prints the error-against-step table, marking the rows
// nearest the recommended steps.
func writeCurve(w io.Writer, r *Result) {
	fmt.Fprintf(w, "\nerror against step (distance from the best estimate)\n  %-10s %-12s %-12s\n", "h", "forward", "central")
	fwd, cen := nearest(r.Curve, r.Forward.H), nearest(r.Curve, r.Central.H)
	for i, p := range r.Curve {
		mark := ""
		if i == fwd && r.Forward.Measured {
			mark += "  <- forward step"
		}
		if i == cen && r.Central.Measured {
			mark += "  <- central step"
		}
		fmt.Fprintf(w, "  %-10.3g %-12.3g %-12.3g%s\n", p.H, p.ForwardError, p.CentralError, mark)
	}
}

// nearest returns the index of the curve step nearest h on a log scale.
func nearest(c []estimate.Point, h float64) int {
	best, arg := math.Inf(1), -1
	for i, p := range c {
		if d := math.Abs(math.Log(p.H / h)); d < best {
			best, arg = d, i
		}
	}
	return arg
}
