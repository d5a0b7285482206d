package driver

import (
	"cmp"
	"crypto/sha256"
	"encoding/json"
	"errors"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
	"runtime/debug"
	"slices"
	"strings"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/unitchecker"

	"roundoff/internal/config"
)

// vetMode reports whether the go command runs roundoff: the handshakes
// -V=full and -flags, or a unit's .cfg file as the last argument.
func vetMode(args []string) bool {
	if len(args) == 0 {
		return false
	}
	return strings.HasSuffix(args[len(args)-1], ".cfg") ||
		slices.Contains(args, "-V=full") || slices.Contains(args, "-flags")
}

// vet hands the run to unitchecker, after installing the configuration
// of the unit's module and, when go fix or go vet -fix will apply the
// first fix of every finding unread, the unattended policy.
func vet(analyzers []*analysis.Analyzer, args []string) int {
	if slices.Contains(args, "-V=full") {
		return version()
	}
	if cfgFile := args[len(args)-1]; strings.HasSuffix(cfgFile, ".cfg") {
		cfg, factsOnly, err := unitConfig(cfgFile, analyzers)
		if err != nil {
			fmt.Fprintln(os.Stderr, "roundoff:", err)
			return exitErrors
		}
		cfg.Select(explicitlyOn(analyzers, args[:len(args)-1]), nil)
		config.Use(cfg)
		config.KeepUnattendedOnly(slices.Contains(args, "-fix"))
		if factsOnly {
			analyzers = factsOnlyRuns(analyzers)
		}
		if os.Getenv("GOGC") == "" {
			// A unit's process lives well under a second, and at the
			// default target most of its collections come while its
			// heap is small and growing: on gonum's units, 400 took
			// a fifth less CPU for a fifth more memory in the largest
			// process (docs/performance.md).
			debug.SetGCPercent(400)
		}
	}
	unitchecker.Main(inOrder(analyzers)...) // exits
	panic("unreachable")
}

// factsOnlyRuns returns copies of analyzers in which those that declare
// no fact types do nothing, for a unit that the go command analyses only
// for the facts its dependents import (a dependency outside the packages
// linted): unitchecker runs every analyzer that requires one with facts,
// and their diagnostics would be thrown away. The analyzers they require
// still run, so the unit's facts are the same.
func factsOnlyRuns(analyzers []*analysis.Analyzer) []*analysis.Analyzer {
	out := make([]*analysis.Analyzer, len(analyzers))
	for i, a := range analyzers {
		c := *a
		if len(a.FactTypes) == 0 {
			c.Run = func(*analysis.Pass) (any, error) { return nil, nil }
		}
		out[i] = &c
	}
	return out
}

// inOrder returns copies of analyzers that report their diagnostics in
// position order. The go command prints each analyzer's findings of a
// package as one group, in the order reported; the order of the groups
// is the go command's.
func inOrder(analyzers []*analysis.Analyzer) []*analysis.Analyzer {
	out := make([]*analysis.Analyzer, len(analyzers))
	for i, a := range analyzers {
		c := *a
		c.Run = func(pass *analysis.Pass) (any, error) {
			var diags []analysis.Diagnostic
			p := *pass
			p.Report = func(d analysis.Diagnostic) { diags = append(diags, d) }
			res, err := a.Run(&p)
			slices.SortStableFunc(diags, func(x, y analysis.Diagnostic) int { return cmp.Compare(x.Pos, y.Pos) })
			for _, d := range diags {
				pass.Report(d)
			}
			return res, err
		}
		out[i] = &c
	}
	return out
}

// version answers the go command's -V=full handshake with an ID that
// changes with the executable and with the configuration file of the
// module holding the current directory (looked for upwards from any
// subdirectory): go vet caches each package's results under it, and must
// not replay them once roundoff.yaml has changed.
func version() int {
	exe, err := os.Executable()
	if err != nil {
		fmt.Fprintln(os.Stderr, "roundoff:", err)
		return exitErrors
	}
	cwd, err := os.Getwd()
	if err != nil {
		fmt.Fprintln(os.Stderr, "roundoff:", err)
		return exitErrors
	}
	h := sha256.New()
	for _, file := range []string{exe, filepath.Join(moduleRoot(cwd), config.FileName)} {
		data, err := os.ReadFile(file)
		if err != nil && !errors.Is(err, fs.ErrNotExist) {
			fmt.Fprintln(os.Stderr, "roundoff:", err)
			return exitErrors
		}
		fmt.Fprintf(h, "%d\n", len(data))
		h.Write(data)
	}
	fmt.Printf("%s version devel roundoff buildID=%x\n", exe, h.Sum(nil))
	return exitClean
}

// unitConfig returns the configuration of the module holding the unit
// that the go command describes in cfgFile, and whether the go command
// wants only the unit's facts.
func unitConfig(cfgFile string, analyzers []*analysis.Analyzer) (*config.Config, bool, error) {
	data, err := os.ReadFile(cfgFile)
	if err != nil {
		return nil, false, err
	}
	var unit struct {
		Dir      string
		VetxOnly bool
	}
	if err := json.Unmarshal(data, &unit); err != nil {
		return nil, false, fmt.Errorf("%s: %v", cfgFile, err)
	}
	cfg, err := config.Load(moduleRoot(unit.Dir), names(analyzers))
	return cfg, unit.VetxOnly, err
}

// explicitlyOn returns the analyzers that flags turn on by name (-NAME or
// -NAME=true): they run whatever the configuration file says, as the only
// ones, which is how unitchecker treats such flags.
func explicitlyOn(analyzers []*analysis.Analyzer, flags []string) []string {
	var on []string
	for _, a := range analyzers {
		for _, f := range flags {
			f = strings.TrimPrefix(strings.TrimPrefix(f, "-"), "-")
			if f == a.Name || f == a.Name+"=true" || f == a.Name+"=1" {
				on = append(on, a.Name)
			}
		}
	}
	return on
}

func names(analyzers []*analysis.Analyzer) []string {
	var out []string
	for _, a := range analyzers {
		out = append(out, a.Name)
	}
	return out
}
