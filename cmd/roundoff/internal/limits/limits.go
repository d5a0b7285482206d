// Package limits is roundoff's limits calculator: for a float type, a
// function accuracy and magnitudes X, it prints what floating-point
// arithmetic can resolve at X (the spacing of floats, attainable
// tolerances) and the finite-difference steps that balance truncation
// against rounding there. The driver runs it as `roundoff limits`.
package limits

import (
	"encoding/json"
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"strconv"

	"roundoff/internal/numeric"
)

// Step is a recommended finite-difference step and the relative error
// expected at it.
type Step struct {
	H     float64 `json:"h"`
	Error float64 `json:"error"`
}

// Limits holds the numbers the calculator prints for one magnitude.
type Limits struct {
	X        float64 `json:"x"`
	Type     string  `json:"type"`
	Eps      float64 `json:"eps"`      // machine epsilon of the type
	Accuracy float64 `json:"accuracy"` // relative accuracy of the function: Eps or the noise level
	Ulp      float64 `json:"ulp"`      // spacing of floats at |X|
	RootTol  float64 `json:"root_tolerance"`
	MinTol   float64 `json:"min_tolerance"`
	Forward  Step    `json:"forward"`
	Central  Step    `json:"central"`
	Second   Step    `json:"second"`
}

// Compute returns the limits at x for format f and a function of relative
// accuracy acc (f.Eps for a clean formula). With eps_f = acc and
// x_c = max(1, |x|): root finding pins x to about eps_f·|x| but never below
// ulp(x); comparing function values pins a minimizer to sqrt(eps_f)·x_c;
// the forward, central and second-difference steps are eps_f^(1/2),
// eps_f^(1/3) and eps_f^(1/4) times x_c, with errors of order eps_f^(1/2),
// eps_f^(2/3) and eps_f^(1/2) (Numerical Recipes 3rd ed. §5.7; Nocedal &
// Wright 2nd ed. §8.1; Brent 1973). Steps are made representable at x as
// (x+h)-x.
func Compute(f numeric.Format, acc, x float64) Limits {
	xc := max(1, math.Abs(x))
	ulp := ulpAt(f, x)
	return Limits{
		X: x, Type: f.Name, Eps: f.Eps, Accuracy: acc, Ulp: ulp,
		RootTol: max(acc*math.Abs(x), ulp),
		MinTol:  math.Sqrt(acc) * xc,
		Forward: Step{representable(f, x, math.Sqrt(acc)*xc), math.Sqrt(acc)},
		Central: Step{representable(f, x, math.Cbrt(acc)*xc), math.Pow(math.Cbrt(acc), 2)},
		Second:  Step{representable(f, x, math.Sqrt(math.Sqrt(acc))*xc), math.Sqrt(acc)},
	}
}

// ulpAt returns the spacing of floats of format f at |x|.
func ulpAt(f numeric.Format, x float64) float64 {
	if f == numeric.Float32 {
		return float64(numeric.Ulp32(float32(x)))
	}
	return numeric.Ulp(x)
}

// representable returns the step the format actually takes at x for a
// requested step h: (x+h)-x, evaluated in the format [Numerical Recipes
// 3rd ed. §5.7].
func representable(f numeric.Format, x, h float64) float64 {
	if f == numeric.Float32 {
		x32 := float32(x)
		return float64((x32 + float32(h)) - x32)
	}
	return (x + h) - x
}

// Run parses the arguments of `roundoff limits`, prints the limits for
// each magnitude to stdout and returns the exit status: 0, or 2 for bad
// input, reported on stderr.
func Run(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("limits", flag.ContinueOnError)
	fs.SetOutput(stderr)
	typ := fs.String("type", "float64", "float type: float32 or float64")
	noise := fs.String("noise", "", "relative accuracy of the function (default: machine epsilon of the type)")
	asJSON := fs.Bool("json", false, "print JSON")
	fs.Usage = func() {
		fmt.Fprintln(stderr, "usage: roundoff limits [-type float32|float64] [-noise E] [-json] X...")
		fs.PrintDefaults()
	}
	if err := fs.Parse(args); err != nil {
		return 2
	}
	rows, err := compute(*typ, *noise, fs.Args())
	if err != nil {
		fmt.Fprintln(stderr, "roundoff limits:", err)
		return 2
	}
	if *asJSON {
		enc := json.NewEncoder(stdout)
		enc.SetIndent("", "  ")
		if err := enc.Encode(rows); err != nil {
			fmt.Fprintln(stderr, "roundoff limits:", err)
			return 1
		}
		return 0
	}
	write(stdout, rows)
	return 0
}

// compute validates the inputs and computes one row per magnitude.
func compute(typ, noise string, xs []string) ([]Limits, error) {
	var f numeric.Format
	switch typ {
	case "float64":
		f = numeric.Float64
	case "float32":
		f = numeric.Float32
	default:
		return nil, fmt.Errorf("unknown -type %q: want float32 or float64", typ)
	}
	acc, err := accuracy(f, noise)
	if err != nil {
		return nil, err
	}
	if len(xs) == 0 {
		return nil, errors.New("no magnitude given: name at least one X, such as 1 or 1e6")
	}
	rows := make([]Limits, 0, len(xs))
	for _, s := range xs {
		x, err := magnitude(f, s)
		if err != nil {
			return nil, err
		}
		rows = append(rows, Compute(f, acc, x))
	}
	return rows, nil
}

// accuracy returns the function's relative accuracy: the noise level when
// one is given, which must lie in [eps, 1), else machine epsilon.
func accuracy(f numeric.Format, noise string) (float64, error) {
	if noise == "" {
		return f.Eps, nil
	}
	e, err := strconv.ParseFloat(noise, 64)
	switch {
	case err != nil:
		return 0, fmt.Errorf("-noise %q is not a number", noise)
	case math.IsNaN(e) || e <= 0:
		return 0, fmt.Errorf("-noise %s must be a positive relative accuracy, such as 1e-6", noise)
	case e >= 1:
		return 0, fmt.Errorf("-noise %s means no correct digit: a relative accuracy must be below 1", noise)
	case e < f.Eps:
		return 0, fmt.Errorf("-noise %s is below %s machine epsilon %s: no computed %[2]s value is that accurate", noise, f.Name, numeric.Short(f.Eps))
	}
	return e, nil
}

// magnitude parses one X, which must be finite in format f.
func magnitude(f numeric.Format, s string) (float64, error) {
	x, err := strconv.ParseFloat(s, 64)
	switch {
	case err != nil && !errors.Is(err, strconv.ErrRange):
		return 0, fmt.Errorf("%q is not a number", s)
	case math.IsNaN(x) || math.IsInf(x, 0) || errors.Is(err, strconv.ErrRange):
		return 0, fmt.Errorf("%s is not a finite magnitude", s)
	case f == numeric.Float32 && math.Abs(x) > math.MaxFloat32:
		return 0, fmt.Errorf("%s overflows float32 (largest %g)", s, math.MaxFloat32)
	}
	return x, nil
}

// write prints the rows as text: a heading for the format and the
// function accuracy, then one block per magnitude.
func write(w io.Writer, rows []Limits) {
	r0 := rows[0]
	source := "machine epsilon"
	if r0.Accuracy != r0.Eps {
		source = "-noise"
	}
	fmt.Fprintf(w, "%s: machine epsilon %s; function accuracy eps_f %s (%s)\n", r0.Type, short(r0.Type, r0.Eps), short(r0.Type, r0.Accuracy), source)
	for _, r := range rows {
		fmt.Fprintf(w, "\nx = %s   (x_c = max(1,|x|) = %s)\n", short(r.Type, r.X), short(r.Type, max(1, math.Abs(r.X))))
		line := func(name, value, rule string) { fmt.Fprintf(w, "  %-22s %-24s %s\n", name, value, rule) }
		line("ulp", short(r.Type, r.Ulp), "spacing of floats at |x|")
		line("root tolerance", short(r.Type, r.RootTol), "eps_f·|x|, at least ulp: best x from sign changes or Newton")
		line("minimization tol", short(r.Type, r.MinTol), "sqrt(eps_f)·x_c: best x from comparing f values")
		step := func(name string, s Step, rule string) {
			line(name, short(r.Type, s.H), fmt.Sprintf("%s, error ~%.2g", rule, s.Error))
		}
		step("forward step", r.Forward, "eps_f^(1/2)·x_c")
		step("central step", r.Central, "eps_f^(1/3)·x_c")
		step("second-difference step", r.Second, "eps_f^(1/4)·x_c")
	}
}

// short formats v in the shortest form that reads back as the same value
// of the named type.
func short(typ string, v float64) string {
	if typ == "float32" {
		return strconv.FormatFloat(v, 'g', -1, 32)
	}
	return numeric.Short(v)
}
