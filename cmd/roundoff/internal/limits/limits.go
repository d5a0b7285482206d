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
	"math/big"
	"strconv"
	"strings"

	"roundoff/internal/config"
	"roundoff/internal/numeric"
)

// Step is a recommended finite-difference step and the relative error
// expected at it; None says why there is no step (H is then 0).
type Step struct {
	H     float64 `json:"h"`
	Error float64 `json:"error"`
	None  string  `json:"none,omitempty"`
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
		Forward: step(f, x, math.Sqrt(acc)*xc, math.Sqrt(acc)),
		Central: step(f, x, math.Cbrt(acc)*xc, math.Pow(math.Cbrt(acc), 2)),
		Second:  step(f, x, math.Sqrt(math.Sqrt(acc))*xc, math.Sqrt(acc)),
	}
}

// ulpAt returns the spacing of floats of format f at |x|: the gap to the
// next float up, or at the largest finite float, where the next is
// infinite, the gap to the one below (2^(emax-p+1), IEEE 754-2019 §3.3).
func ulpAt(f numeric.Format, x float64) float64 {
	if f == numeric.Float32 {
		ax := float32(math.Abs(x))
		if ax == math.MaxFloat32 {
			return float64(ax - math.Nextafter32(ax, 0))
		}
		return float64(numeric.Ulp32(ax))
	}
	if math.Abs(x) == math.MaxFloat64 {
		return math.MaxFloat64 - math.Nextafter(math.MaxFloat64, 0)
	}
	return numeric.Ulp(x)
}

// step returns the step the format actually takes at x for a requested
// step h, (x+h)-x evaluated in the format [Numerical Recipes 3rd ed.
// §5.7], or no step when x+h overflows.
func step(f numeric.Format, x, h, errAt float64) Step {
	taken := (x + h) - x
	if f == numeric.Float32 {
		x32 := float32(x)
		taken = float64((x32 + float32(h)) - x32)
	}
	if math.IsInf(taken, 0) || math.IsNaN(taken) {
		return Step{None: fmt.Sprintf("x+h overflows %s: no difference quotient can be formed at x", f.Name)}
	}
	return Step{H: taken, Error: errAt}
}

// usage is the synopsis of `roundoff limits`.
const usage = "usage: roundoff limits [-type float32|float64] [-noise E] [-json] X..."

// Run parses the arguments of `roundoff limits`, prints the limits for
// each magnitude to stdout and returns the exit status: 0, or 1 for bad
// input, reported on stderr in one line. -h prints the usage to stdout.
// Magnitudes may be negative and mixed with the flags.
func Run(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("limits", flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	typ := fs.String("type", "float64", "float type: float32 or float64")
	noise := fs.String("noise", "", "relative accuracy of the function (default: machine epsilon of the type)")
	asJSON := fs.Bool("json", false, "print JSON")
	flags, xs := splitArgs(fs, args)
	if err := fs.Parse(flags); errors.Is(err, flag.ErrHelp) {
		fmt.Fprintln(stdout, usage)
		fs.SetOutput(stdout)
		fs.PrintDefaults()
		return 0
	} else if err != nil {
		fmt.Fprintf(stderr, "roundoff limits: %v (%s)\n", err, usage)
		return 1
	}
	rows, err := compute(*typ, *noise, append(fs.Args(), xs...))
	if err != nil {
		fmt.Fprintln(stderr, "roundoff limits:", err)
		return 1
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

// splitArgs separates the magnitudes from the flags, so that a negative
// magnitude such as -3 needs no "--" before it.
func splitArgs(fs *flag.FlagSet, args []string) (flags, xs []string) {
	for i := 0; i < len(args); i++ {
		a := args[i]
		if _, err := strconv.ParseFloat(a, 64); err == nil || errors.Is(err, strconv.ErrRange) {
			xs = append(xs, a)
			continue
		}
		flags = append(flags, a)
		if takesValue(fs, a) && i+1 < len(args) {
			flags = append(flags, args[i+1]) // the flag's value, whatever it looks like
			i++
		}
	}
	return flags, xs
}

// takesValue reports whether arg is a flag of fs, written without "=",
// that takes the next argument as its value.
func takesValue(fs *flag.FlagSet, arg string) bool {
	f := fs.Lookup(strings.TrimLeft(arg, "-"))
	if f == nil {
		return false
	}
	b, ok := f.Value.(interface{ IsBoolFlag() bool })
	return !ok || !b.IsBoolFlag()
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
	acc := f.Eps
	if noise != "" {
		var err error
		if acc, err = config.ParseNoise(noise, f); err != nil {
			return nil, fmt.Errorf("-noise %s: %v", noise, err)
		}
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

// magnitude parses one X, rounded to format f, in which it must be finite
// and, unless written as zero, not zero.
func magnitude(f numeric.Format, s string) (float64, error) {
	bitSize := 64
	if f == numeric.Float32 {
		bitSize = 32
	}
	x, err := strconv.ParseFloat(s, bitSize)
	exact, _, _ := big.ParseFloat(s, 0, 64, big.ToNearestEven)
	switch {
	case err != nil && !errors.Is(err, strconv.ErrRange):
		return 0, fmt.Errorf("%q is not a number", s)
	case math.IsNaN(x):
		return 0, fmt.Errorf("%s is not a finite magnitude", s)
	case math.IsInf(x, 0) && err == nil: // written as infinity
		return 0, fmt.Errorf("%s is not a finite magnitude", s)
	case math.IsInf(x, 0):
		return 0, fmt.Errorf("%s overflows %s (largest %s)", s, f.Name, short(f.Name, largest(f)))
	case x == 0 && exact != nil && exact.Sign() != 0:
		return 0, fmt.Errorf("%s underflows to zero in %s (smallest positive %s)", s, f.Name, short(f.Name, smallest(f)))
	}
	return x, nil
}

// largest and smallest return the largest finite and the smallest
// positive (subnormal) value of format f.
func largest(f numeric.Format) float64 {
	if f == numeric.Float32 {
		return math.MaxFloat32
	}
	return math.MaxFloat64
}

func smallest(f numeric.Format) float64 {
	if f == numeric.Float32 {
		return math.SmallestNonzeroFloat32
	}
	return math.SmallestNonzeroFloat64
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
			if s.None != "" {
				line(name, "none", s.None)
				return
			}
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
