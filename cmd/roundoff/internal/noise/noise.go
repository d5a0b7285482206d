// Package noise is `roundoff noise`: it measures the noise level of a Go
// function at a point by evaluating it in a program built against the
// user's module, recommends the difference steps and attainable
// tolerances that level allows, draws the error-against-step curve and
// writes the //roundoff:noise directive. The numerics live in the
// subpackage estimate; this package runs the function and reports.
package noise

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"math/rand/v2"
	"os"
	"strconv"
	"strings"
	"time"

	"roundoff/cmd/roundoff/internal/noise/estimate"
	"roundoff/internal/numeric"
)

// options are the command's flags.
type options struct {
	at, dir, tags, plot string
	seed                uint64
	spacing             float64
	points              int
	timeout             time.Duration
	json, write         bool
}

// Run runs `roundoff noise` and returns the exit status: 0, or 1 with a
// one-line error on stderr.
func Run(args []string, cwd string, stdout, stderr io.Writer) int {
	o, arg, err := parse(args, stderr)
	if err != nil {
		if errors.Is(err, flag.ErrHelp) {
			return 0
		}
		fmt.Fprintln(stderr, "roundoff noise:", err)
		return 1
	}
	if err := run(o, arg, cwd, stdout, stderr); err != nil {
		fmt.Fprintln(stderr, "roundoff noise:", err)
		return 1
	}
	return 0
}

func parse(args []string, stderr io.Writer) (*options, string, error) {
	o := &options{}
	fs := flag.NewFlagSet("noise", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.StringVar(&o.at, "at", "1", "the point x: a number, or comma-separated coordinates for func([]float64) float64")
	fs.StringVar(&o.dir, "dir", "", "direction along which to measure, comma-separated (default: a pseudo-random unit vector; 1 for scalar functions)")
	fs.Uint64Var(&o.seed, "seed", 1, "seed of the default direction")
	fs.Float64Var(&o.spacing, "spacing", 0, "starting spacing of the difference table (default 1e-4·max(1,|x|))")
	fs.IntVar(&o.points, "points", 17, "points of the difference table, odd, 5 to 41")
	fs.DurationVar(&o.timeout, "timeout", 2*time.Minute, "time limit of the evaluations")
	fs.StringVar(&o.tags, "tags", "", "build tags, as for go build")
	fs.BoolVar(&o.json, "json", false, "print JSON")
	fs.StringVar(&o.plot, "plot", "", "draw the error-against-step curve to this file (.svg or .png)")
	fs.BoolVar(&o.write, "write", false, "insert or update the //roundoff:noise directive in the function's doc comment")
	fs.Usage = func() {
		fmt.Fprintln(stderr, "usage: roundoff noise [flags] PACKAGE.FUNC")
		fs.PrintDefaults()
	}
	if err := fs.Parse(args); err != nil {
		return nil, "", err
	}
	switch {
	case fs.NArg() != 1:
		return nil, "", errors.New("name one function, as PACKAGE.FUNC (for example ./turbine.HeadLoss)")
	case o.points < 5 || o.points > 41 || o.points%2 == 0:
		return nil, "", fmt.Errorf("-points %d: want an odd number from 5 to 41", o.points)
	case o.spacing < 0 || math.IsNaN(o.spacing) || math.IsInf(o.spacing, 0):
		return nil, "", fmt.Errorf("-spacing %g: want a positive spacing", o.spacing)
	case o.timeout <= 0:
		return nil, "", fmt.Errorf("-timeout %s: want a positive duration", o.timeout)
	}
	return o, fs.Arg(0), nil
}

// run measures, reports and, if asked, plots and writes.
func run(o *options, arg, cwd string, stdout, stderr io.Writer) error {
	t, err := resolve(arg, o.tags, cwd)
	if err != nil {
		return err
	}
	var src *source
	if o.write {
		if src, err = readSource(t); err != nil {
			return err
		}
	}
	x, p, err := parsePoint(o, t.kind)
	if err != nil {
		return err
	}
	ev, stop, err := start(context.Background(), t, o.tags, o.timeout)
	if err != nil {
		return err
	}
	defer stop()
	if isTerminal(stderr) {
		ev.progress = stderr
		defer fmt.Fprintln(stderr)
	}
	r, err := measure(ev, t, o, x, p)
	if err != nil {
		return fmt.Errorf("%s.%s %v", t.pkgName, t.name, err)
	}
	if o.plot != "" {
		if err := drawCurve(o.plot, r); err != nil {
			return err
		}
	}
	if src != nil {
		if err := src.write(r.Directive); err != nil {
			return err
		}
	}
	return report(stdout, r, o.json)
}

// parsePoint parses -at and -dir: the point x and the unit direction p.
func parsePoint(o *options, k kind) (x, p []float64, err error) {
	if x, err = floats("-at", o.at); err != nil {
		return nil, nil, err
	}
	if k != vector && len(x) != 1 {
		return nil, nil, fmt.Errorf("-at %s: the function takes one number", o.at)
	}
	switch {
	case o.dir != "":
		if p, err = floats("-dir", o.dir); err != nil {
			return nil, nil, err
		}
		if len(p) != len(x) {
			return nil, nil, fmt.Errorf("-dir has %d coordinates, -at %d", len(p), len(x))
		}
	case len(x) == 1:
		p = []float64{1}
	default:
		r := rand.New(rand.NewPCG(o.seed, 0))
		p = make([]float64, len(x))
		for i := range p {
			p[i] = r.NormFloat64()
		}
	}
	n := norm(p)
	if n == 0 {
		return nil, nil, errors.New("-dir is the zero vector")
	}
	for i := range p {
		p[i] /= n
	}
	if k == scalar32 {
		x[0] = float64(float32(x[0]))
	}
	return x, p, nil
}

// floats parses a comma-separated list of finite numbers.
func floats(name, s string) ([]float64, error) {
	var v []float64
	for f := range strings.SplitSeq(s, ",") {
		c, err := strconv.ParseFloat(strings.TrimSpace(f), 64)
		if err != nil || math.IsNaN(c) || math.IsInf(c, 0) {
			return nil, fmt.Errorf("%s %s: %q is not a finite number", name, s, f)
		}
		v = append(v, c)
	}
	return v, nil
}

func norm(v []float64) float64 {
	s := 0.0
	for _, c := range v {
		s += c * c
	}
	return math.Sqrt(s)
}

// line is f along p from x, evaluated by ev.
func line(ev *evaluator, k kind, x, p []float64) estimate.Line {
	l := estimate.Line{Eval: func(ts []float64) ([]float64, error) {
		pts := make([][]float64, len(ts))
		for i, t := range ts {
			pts[i] = make([]float64, len(x))
			for j := range x {
				pts[i][j] = x[j] + t*p[j]
			}
		}
		return ev.eval(pts)
	}}
	switch k {
	case scalar64:
		l.Snap = func(t float64) float64 { return (x[0] + t) - x[0] }
	case scalar32:
		l.Snap = func(t float64) float64 { return float64(float32(x[0]+t)) - x[0] }
	}
	return l
}

// isTerminal reports whether w is a terminal.
func isTerminal(w io.Writer) bool {
	f, ok := w.(*os.File)
	if !ok {
		return false
	}
	st, err := f.Stat()
	return err == nil && st.Mode()&os.ModeCharDevice != 0
}

// format returns the numeric format of the function's argument.
func (k kind) format() numeric.Format { return numeric.Select(k == scalar32) }
