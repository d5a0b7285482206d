//go:build bench

// Command bench measures the speed and memory of roundoff on a real tree
// against go vet, as docs/performance.md describes.
//
// From the root of the roundoff module:
//
//	go run -tags bench ./tools/bench [-runs 3] [-module gonum.org/v1/gonum@v0.17.0]
//
// It fetches the module through the Go module proxy into a temporary
// workspace (a writable copy of the module cache's directory, its
// dependencies downloaded), builds roundoff there, and runs in
// alternation, each run with a fresh empty GOCACHE:
//
//	a  go vet ./...                        the default vet suite
//	b  go vet -vettool=roundoff ./...
//	c  roundoff ./...                      standalone
//	d  roundoff ./... with ROUNDOFF_BENCH=load: one analyzer that only
//	   requires buildssa, the floor of loading, type-checking and SSA
//
// It prints the raw runs on standard error and, on standard output, a
// Markdown report: the medians, the ratios, each analyzer's share of the
// analysis time, and the pre-commit case (one package re-linted after one
// of its files changed, with a warm cache).
package main

import (
	"bytes"
	"encoding/json"
	"flag"
	"fmt"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strings"
	"syscall"
	"time"
)

var (
	runs          = flag.Int("runs", 3, "runs of each mode")
	module        = flag.String("module", "gonum.org/v1/gonum@v0.17.0", "the module to lint, `path@version`")
	pkg           = flag.String("pkg", "./optimize", "the package of the pre-commit case")
	file          = flag.String("file", "optimize/bfgs.go", "the file, relative to the module root, that the pre-commit case changes")
	keep          = flag.Bool("keep", false, "keep the workspace")
	only          = flag.String("modes", "a,b,c,d", "the modes of the whole-tree runs, comma-separated")
	precommitOnly = flag.Bool("precommit-only", false, "measure the pre-commit case only")
)

func main() {
	flag.Parse()
	if err := bench(os.Stdout); err != nil {
		fmt.Fprintln(os.Stderr, "bench:", err)
		os.Exit(1)
	}
}

// A mode is one way of linting the tree.
type mode struct {
	name, label string
	args        []string // the command, run in the module's directory
	env         []string // added to the environment
}

// A workspace is where the benchmark runs.
type workspace struct {
	dir  string // the temporary directory
	mod  string // the module's copy
	tool string // the roundoff binary
}

func bench(out io.Writer) error {
	w, err := setUp()
	if err != nil {
		return err
	}
	if !*keep {
		defer os.RemoveAll(w.dir)
	} else {
		fmt.Fprintln(os.Stderr, "bench: workspace", w.dir)
	}
	fmt.Fprintf(out, "# roundoff on %s\n\n%s\n", *module, machine())
	if !*precommitOnly {
		if err := w.cold(out); err != nil {
			return err
		}
		if err := w.shares(out); err != nil {
			return err
		}
	}
	return w.precommit(out)
}

// setUp builds roundoff and copies the module into a new workspace.
func setUp() (*workspace, error) {
	repo, err := output(".", nil, "go", "list", "-m", "-f", "{{.Dir}}")
	if err != nil {
		return nil, fmt.Errorf("run bench from the roundoff module: %v", err)
	}
	dir, err := os.MkdirTemp("", "roundoff-bench-")
	if err != nil {
		return nil, err
	}
	w := &workspace{dir: dir, tool: filepath.Join(dir, "roundoff")}
	if _, err := output(strings.TrimSpace(repo), nil, "go", "build", "-o", w.tool, "./cmd/roundoff"); err != nil {
		return nil, err
	}
	w.mod, err = fetch(dir, *module)
	return w, err
}

// fetch downloads path@version through the module proxy, copies it to a
// writable directory under dir and downloads its dependencies.
func fetch(dir, pathVersion string) (string, error) {
	js, err := output(dir, []string{"GOFLAGS=-mod=mod"}, "go", "mod", "download", "-json", pathVersion)
	if err != nil {
		return "", err
	}
	var m struct{ Dir, Error string }
	if err := json.Unmarshal([]byte(js), &m); err != nil || m.Error != "" {
		return "", fmt.Errorf("go mod download %s: %v%s", pathVersion, err, m.Error)
	}
	mod := filepath.Join(dir, "module")
	if err := os.CopyFS(mod, os.DirFS(m.Dir)); err != nil {
		return "", err
	}
	_, err = output(mod, nil, "go", "mod", "download")
	return mod, err
}

// output runs a command in dir and returns its standard output.
func output(dir string, env []string, name string, args ...string) (string, error) {
	cmd := exec.Command(name, args...)
	cmd.Dir = dir
	cmd.Env = append(baseEnv(), env...)
	var stderr bytes.Buffer
	cmd.Stderr = &stderr
	out, err := cmd.Output()
	if err != nil {
		return "", fmt.Errorf("%s %s: %v\n%s", name, strings.Join(args, " "), err, stderr.Bytes())
	}
	return string(out), nil
}

// baseEnv is the environment of every command: the caller's, with the
// local toolchain only and no workspace file.
func baseEnv() []string {
	return append(os.Environ(), "GOTOOLCHAIN=local", "GOWORK=off")
}

// modes returns the four ways of linting the whole tree.
func (w *workspace) modes() []mode {
	return []mode{
		{"a", "go vet ./...", []string{"go", "vet", "./..."}, nil},
		{"b", "go vet -vettool=roundoff ./...", []string{"go", "vet", "-vettool=" + w.tool, "./..."}, nil},
		{"c", "roundoff ./...", []string{w.tool, "./..."}, nil},
		{"d", "load-only baseline", []string{w.tool, "./..."}, []string{"ROUNDOFF_BENCH=load"}},
	}
}

// cold runs every mode in alternation, each time with an empty GOCACHE,
// and reports the medians and the ratios.
func (w *workspace) cold(out io.Writer) error {
	var ms []mode
	for _, m := range w.modes() {
		if slices.Contains(strings.Split(*only, ","), m.name) {
			ms = append(ms, m)
		}
	}
	samples := map[string][]sample{}
	for i := range *runs {
		for _, m := range ms {
			cache := filepath.Join(w.dir, fmt.Sprintf("gocache-%s-%d", m.name, i))
			s, err := w.run(m, append(m.env, "GOCACHE="+cache, "GOPROXY=off"))
			os.RemoveAll(cache)
			if err != nil {
				return err
			}
			fmt.Fprintf(os.Stderr, "bench: run %d %s: %s\n", i+1, m.name, s)
			samples[m.name] = append(samples[m.name], s)
		}
	}
	fmt.Fprintf(out, "## The whole tree, empty build cache (median of %d runs)\n\n", *runs)
	fmt.Fprintln(out, "| | command | wall s | CPU s (user+sys) | max RSS of one process, MB | peak RSS of the process tree, MB |")
	fmt.Fprintln(out, "|---|---|---|---|---|---|")
	med := map[string]sample{}
	for _, m := range ms {
		med[m.name] = median(samples[m.name])
		s := med[m.name]
		fmt.Fprintf(out, "| %s | `%s` | %.1f | %.1f | %d | %d |\n", m.name, m.label, s.wall.Seconds(), s.cpu.Seconds(), s.maxRSS>>20, s.treeRSS>>20)
	}
	fmt.Fprintln(out)
	for _, r := range []struct {
		x, y, what string
		target     float64
		measure    func(sample) float64
	}{
		{"b", "a", "wall", 1.15, sample.seconds},
		{"c", "a", "wall", 0.35, sample.seconds},
		{"c", "d", "wall", 1.3, sample.seconds},
		{"c", "d", "peak memory", 1.2, sample.memory},
	} {
		x, okx := med[r.x]
		y, oky := med[r.y]
		if okx && oky {
			v := r.measure(x) / r.measure(y)
			fmt.Fprintf(out, "- %s/%s %s: %.2f (target ≤ %.2f: %s)\n", r.x, r.y, r.what, v, r.target, map[bool]string{true: "met", false: "missed"}[v <= r.target])
		}
	}
	fmt.Fprintln(out)
	return nil
}

// shares runs the standalone suite once more, its actions one at a time,
// and reports the time of each analyzer, infrastructure included.
func (w *workspace) shares(out io.Writer) error {
	cmd := exec.Command(w.tool, "./...")
	cmd.Dir = w.mod
	cmd.Env = append(baseEnv(), "ROUNDOFF_BENCH=times", "GOCACHE="+filepath.Join(w.dir, "gocache-warm"), "GOPROXY=off")
	var stderr bytes.Buffer
	cmd.Stderr = &stderr
	if err := cmd.Run(); err != nil && cmd.ProcessState.ExitCode() != 3 {
		return fmt.Errorf("roundoff ./... (times): %v\n%s", err, stderr.Bytes())
	}
	fmt.Fprintln(out, "## Time per analyzer (one standalone run, actions run one at a time)")
	fmt.Fprintln(out)
	fmt.Fprintln(out, "| analyzer | packages | time s | share |")
	fmt.Fprintln(out, "|---|---|---|---|")
	for l := range strings.Lines(stderr.String()) {
		var name string
		var n int
		var secs, share float64
		if _, err := fmt.Sscanf(l, "roundoff-bench: analyzer %s packages %d time %fs share %f%%", &name, &n, &secs, &share); err == nil {
			fmt.Fprintf(out, "| %s | %d | %.2f | %.1f%% |\n", name, n, secs, share)
		}
		if _, err := fmt.Sscanf(l, "roundoff-bench: of which SSA construction through lazyssa %fs share %f%%", &secs, &share); err == nil {
			fmt.Fprintf(out, "| of which SSA construction (lazyssa, counted in the analyzer that asked first) | | %.2f | %.1f%% |\n", secs, share)
		}
	}
	fmt.Fprintln(out)
	return nil
}

// precommit measures one package re-linted after one of its files
// changed, with a warm cache: under go vet, standalone, and through the
// pre-commit hook with the change staged.
func (w *workspace) precommit(out io.Writer) error {
	cache := "GOCACHE=" + filepath.Join(w.dir, "gocache-warm")
	env := []string{cache, "GOPROXY=off"}
	ms := []mode{
		{"b", "go vet -vettool=roundoff " + *pkg, []string{"go", "vet", "-vettool=" + w.tool, *pkg}, env},
		{"c", "roundoff " + *pkg, []string{w.tool, *pkg}, env},
		{"hook", "roundoff hook run (the change staged)", []string{w.tool, "hook", "run"}, append(env, gitEnv...)},
	}
	if err := w.gitInit(); err != nil {
		return err
	}
	for _, m := range ms { // warm the cache
		if _, err := w.run(m, m.env); err != nil {
			return err
		}
	}
	samples := map[string][]sample{}
	for i := range *runs {
		for _, m := range ms {
			if err := w.touch(fmt.Sprintf("// bench edit %d %s\n", i, m.name)); err != nil {
				return err
			}
			s, err := w.run(m, m.env)
			if err != nil {
				return err
			}
			fmt.Fprintf(os.Stderr, "bench: pre-commit run %d %s: %s\n", i+1, m.name, s)
			samples[m.name] = append(samples[m.name], s)
		}
	}
	fmt.Fprintf(out, "## Pre-commit: %s re-linted after %s changed, warm cache (median of %d runs)\n\n", *pkg, *file, *runs)
	fmt.Fprintln(out, "| | command | wall s | CPU s | max RSS of one process, MB |")
	fmt.Fprintln(out, "|---|---|---|---|---|")
	for _, m := range ms {
		s := median(samples[m.name])
		fmt.Fprintf(out, "| %s | `%s` | %.2f | %.2f | %d |\n", m.name, m.label, s.wall.Seconds(), s.cpu.Seconds(), s.maxRSS>>20)
	}
	fmt.Fprintln(out)
	return nil
}

// gitEnv makes git ignore the user's settings and gives commits an author.
var gitEnv = []string{
	"GIT_CONFIG_NOSYSTEM=1", "GIT_CONFIG_GLOBAL=" + os.DevNull,
	"GIT_AUTHOR_NAME=bench", "GIT_AUTHOR_EMAIL=bench@example.invalid",
	"GIT_COMMITTER_NAME=bench", "GIT_COMMITTER_EMAIL=bench@example.invalid",
}

// gitInit makes the module's copy a git repository with one commit, for
// the hook to diff the staged changes against.
func (w *workspace) gitInit() error {
	for _, args := range [][]string{{"init", "-q"}, {"add", "-A"}, {"commit", "-q", "--no-verify", "-m", "start"}} {
		if _, err := output(w.mod, gitEnv, "git", args...); err != nil {
			return err
		}
	}
	return nil
}

// touch appends line to the pre-commit case's file and stages it.
func (w *workspace) touch(line string) error {
	f, err := os.OpenFile(filepath.Join(w.mod, *file), os.O_APPEND|os.O_WRONLY, 0)
	if err != nil {
		return err
	}
	if _, err := f.WriteString(line); err != nil {
		f.Close()
		return err
	}
	if err := f.Close(); err != nil {
		return err
	}
	_, err = output(w.mod, gitEnv, "git", "add", *file)
	return err
}

// A sample is the cost of one run.
type sample struct {
	wall, cpu time.Duration
	maxRSS    int64 // the largest resident set of one process of the tree
	treeRSS   int64 // the largest sum of the resident sets of the tree, sampled
	status    int
}

func (s sample) seconds() float64 { return s.wall.Seconds() }

func (s sample) memory() float64 { return float64(s.maxRSS) }

func (s sample) String() string {
	return fmt.Sprintf("wall %.2fs cpu %.2fs maxrss %dMB tree %dMB status %d", s.wall.Seconds(), s.cpu.Seconds(), s.maxRSS>>20, s.treeRSS>>20, s.status)
}

// run runs m in the module's copy and measures it. Findings and the
// targets' own vet reports are not errors; a crash or a load failure of
// roundoff is.
func (w *workspace) run(m mode, env []string) (sample, error) {
	cmd := exec.Command(m.args[0], m.args[1:]...)
	cmd.Dir = w.mod
	cmd.Env = append(baseEnv(), env...)
	var stderr bytes.Buffer
	cmd.Stdout, cmd.Stderr = io.Discard, &stderr
	start := time.Now()
	if err := cmd.Start(); err != nil {
		return sample{}, err
	}
	stop := make(chan int64)
	go watchTree(cmd.Process.Pid, stop)
	err := cmd.Wait()
	s := sample{wall: time.Since(start), status: cmd.ProcessState.ExitCode()}
	stop <- 0
	s.treeRSS = <-stop
	if ru, ok := cmd.ProcessState.SysUsage().(*syscall.Rusage); ok {
		// Linux: the rusage of a waited-for child covers it and its waited-for
		// descendants; Maxrss, in KiB, is that of the largest single process.
		s.cpu = time.Duration(syscall.TimevalToNsec(ru.Utime) + syscall.TimevalToNsec(ru.Stime))
		s.maxRSS = ru.Maxrss << 10
	}
	if bytes.Contains(stderr.Bytes(), []byte("panic:")) || m.args[0] == w.tool && s.status != 0 && s.status != 3 {
		return s, fmt.Errorf("%s: %v\n%s", strings.Join(m.args, " "), err, tail(stderr.Bytes()))
	}
	return s, nil
}

// tail returns the last lines of b.
func tail(b []byte) []byte {
	lines := bytes.SplitAfter(b, []byte("\n"))
	return bytes.Join(lines[max(0, len(lines)-20):], nil)
}

// median returns the sample made of the median of each measure.
func median(ss []sample) sample {
	pick := func(f func(sample) int64) int64 {
		v := make([]int64, len(ss))
		for i, s := range ss {
			v[i] = f(s)
		}
		slices.Sort(v)
		if len(v)%2 == 1 {
			return v[len(v)/2]
		}
		return (v[len(v)/2-1] + v[len(v)/2]) / 2
	}
	return sample{
		wall:    time.Duration(pick(func(s sample) int64 { return int64(s.wall) })),
		cpu:     time.Duration(pick(func(s sample) int64 { return int64(s.cpu) })),
		maxRSS:  pick(func(s sample) int64 { return s.maxRSS }),
		treeRSS: pick(func(s sample) int64 { return s.treeRSS }),
	}
}
