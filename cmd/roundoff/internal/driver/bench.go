package driver

import (
	"cmp"
	"fmt"
	"io"
	"maps"
	"os"
	"runtime"
	"runtime/pprof"
	"slices"
	"strings"
	"sync"
	"time"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/checker"
	"golang.org/x/tools/go/analysis/passes/buildssa"
)

// benchEnv names the environment variable through which the benchmark
// command (tools/bench, docs/performance.md) instruments a standalone run.
// It holds comma-separated words:
//
//	load            run only loadOnly instead of the suite: the floor that
//	                loading, type-checking and SSA construction set
//	times           run the actions one at a time and print on standard
//	                error the time spent in each analyzer
//	cpuprofile=FILE write a CPU profile of the run to FILE
//	memprofile=FILE write a heap profile, taken once the analysis is done
//	                and before its results are dropped, to FILE
//
// It is not a user interface and may change with the benchmark.
const benchEnv = "ROUNDOFF_BENCH"

// benchOptions are the instruments benchEnv asks for.
type benchOptions struct {
	loadOnly, times        bool
	cpuProfile, memProfile string
	stopCPU                func() // set while a CPU profile is written

	mu    sync.Mutex
	lazys []buildTimer // lazyssa's results, kept for their build times
}

// buildTimer is the part of lazyssa's result the benchmark reads.
type buildTimer interface{ BuildTime() time.Duration }

// readBenchEnv parses benchEnv; unknown words are an error.
func readBenchEnv() (*benchOptions, error) {
	b := &benchOptions{}
	for w := range strings.SplitSeq(os.Getenv(benchEnv), ",") {
		k, v, _ := strings.Cut(w, "=")
		switch k {
		case "":
		case "load":
			b.loadOnly = true
		case "times":
			b.times = true
		case "cpuprofile":
			b.cpuProfile = v
		case "memprofile":
			b.memProfile = v
		default:
			return nil, fmt.Errorf("%s: unknown word %q", benchEnv, w)
		}
	}
	return b, nil
}

// loadOnly does nothing but require buildssa.
var loadOnly = &analysis.Analyzer{
	Name:     "loadonly",
	Doc:      "loadonly: build SSA and report nothing (benchmark baseline)",
	Requires: []*analysis.Analyzer{buildssa.Analyzer},
	Run:      func(*analysis.Pass) (any, error) { return nil, nil },
}

// startBench reads benchEnv and starts the CPU profile it asks for.
func startBench() (*benchOptions, error) {
	b, err := readBenchEnv()
	if err != nil || b.cpuProfile == "" {
		return b, err
	}
	f, err := os.Create(b.cpuProfile)
	if err != nil {
		return nil, err
	}
	if err := pprof.StartCPUProfile(f); err != nil {
		f.Close()
		return nil, err
	}
	b.stopCPU = func() {
		pprof.StopCPUProfile()
		f.Close()
	}
	return b, nil
}

// suite returns the analyzers to run: loadOnly alone, or analyzers.
// When times are wanted it also makes lazyssa hand each package's result
// to b: the checker drops the results of actions that are not roots, so
// the SSA build times could not be read from the graph afterwards.
func (b *benchOptions) suite(analyzers []*analysis.Analyzer) []*analysis.Analyzer {
	if b.loadOnly {
		return []*analysis.Analyzer{loadOnly}
	}
	if lazy := required(analyzers, "lazyssa"); b.times && lazy != nil {
		run := lazy.Run
		lazy.Run = func(pass *analysis.Pass) (any, error) {
			res, err := run(pass)
			if t, ok := res.(buildTimer); ok {
				b.mu.Lock()
				b.lazys = append(b.lazys, t)
				b.mu.Unlock()
			}
			return res, err
		}
	}
	return analyzers
}

// required returns the analyzer of that name among analyzers and what
// they require, or nil.
func required(analyzers []*analysis.Analyzer, name string) *analysis.Analyzer {
	for _, a := range analyzers {
		if a.Name == name {
			return a
		}
		if r := required(a.Requires, name); r != nil {
			return r
		}
	}
	return nil
}

// options returns the checker's options: one action at a time when the
// times are wanted, since parallel actions inflate each other's.
func (b *benchOptions) options() *checker.Options {
	return &checker.Options{Sequential: b.times}
}

// stop stops the CPU profile, if one is being written.
func (b *benchOptions) stop() {
	if b.stopCPU != nil {
		b.stopCPU()
	}
}

// done prints the time per analyzer and writes the heap profile, as
// asked.
func (b *benchOptions) done(graph *checker.Graph, stderr io.Writer) error {
	if b.times && graph != nil {
		b.printTimes(graph, stderr)
	}
	if b.memProfile == "" {
		return nil
	}
	f, err := os.Create(b.memProfile)
	if err != nil {
		return err
	}
	runtime.GC()
	if err := pprof.WriteHeapProfile(f); err != nil {
		f.Close()
		return err
	}
	return f.Close()
}

// printTimes prints, for each analyzer of the graph (infrastructure
// included), the packages it ran on and its time, largest first, and the
// part of those times spent building SSA on request (lazyssa).
func (b *benchOptions) printTimes(graph *checker.Graph, w io.Writer) {
	type total struct {
		name    string
		actions int
		time    time.Duration
	}
	totals := map[*analysis.Analyzer]*total{}
	var sum time.Duration
	for act := range graph.All() {
		t := totals[act.Analyzer]
		if t == nil {
			t = &total{name: act.Analyzer.Name}
			totals[act.Analyzer] = t
		}
		t.actions++
		t.time += act.Duration
		sum += act.Duration
	}
	list := slices.Collect(maps.Values(totals))
	slices.SortFunc(list, func(a, b *total) int { return cmp.Or(cmp.Compare(b.time, a.time), cmp.Compare(a.name, b.name)) })
	for _, t := range list {
		fmt.Fprintf(w, "roundoff-bench: analyzer %-12s packages %5d time %8.3fs share %5.1f%%\n",
			t.name, t.actions, t.time.Seconds(), 100*t.time.Seconds()/sum.Seconds())
	}
	var ssa time.Duration
	for _, l := range b.lazys {
		ssa += l.BuildTime()
	}
	fmt.Fprintf(w, "roundoff-bench: of which SSA construction through lazyssa %.3fs share %.1f%%\n", ssa.Seconds(), 100*ssa.Seconds()/sum.Seconds())
}
