package main_test

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"go/format"
	"io/fs"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// tool is the roundoff binary that TestMain builds for every test.
var tool string

func TestMain(m *testing.M) {
	dir, err := os.MkdirTemp("", "roundoff-e2e-")
	if err != nil {
		fmt.Fprintln(os.Stderr, err)
		os.Exit(1)
	}
	tool = filepath.Join(dir, "roundoff")
	build := exec.Command("go", "build", "-o", tool, "roundoff/cmd/roundoff")
	build.Env = append(os.Environ(), "GOTOOLCHAIN=local")
	out, err := build.CombinedOutput()
	code := 1
	if err == nil {
		code = m.Run()
	} else {
		fmt.Fprintf(os.Stderr, "building roundoff: %v\n%s", err, out)
	}
	os.RemoveAll(dir)
	os.Exit(code)
}

// The planted hazards of testdata/e2e/mod: position (relative to the
// module root) and the start of the message.
const (
	nanPos     = "ramp/ramp.go:18:5: "
	nanMsg     = "comparison with math.NaN() is always false"
	loopPos    = "ramp/ramp.go:27:19: "
	loopMsg    = "float loop variable frac goes from 0 in steps of 0.1 and never equals 1"
	literalPos = "ramp/soak.go:8:9: "
	literalMsg = "exact == between a computed float64 value and 0.3"
)

// The hazards as the standalone text output prints them, analyzer named,
// and as go vet prints them.
var (
	standaloneHazards = []string{nanPos + "exacteq: " + nanMsg, loopPos + "exacteq: " + loopMsg, literalPos + "exacteq: " + literalMsg}
	vetHazards        = []string{nanPos + nanMsg, loopPos + loopMsg, literalPos + literalMsg}
)

// The source lines of the planted hazards and their fixed forms.
const (
	nanSrc     = "\tif reading == math.NaN() {\n"
	nanFixed   = "\tif math.IsNaN(reading) {\n"
	loopSrc    = "\tfor frac := 0.0; frac != 1; frac += 0.1 {\n"
	loopLess   = "\tfor frac := 0.0; frac < 1-0.5*0.1; frac += 0.1 {\n"
	literalSrc = "\treturn share == 0.3\n"
	literalTol = "\treturn math.Abs(share-0.3) <= 1e-9*0.3\n"
)

// fixture copies the module testdata/e2e/name to a fresh directory, so that
// no test changes testdata, and returns the copy's path.
func fixture(t *testing.T, name string) string {
	t.Helper()
	dir := t.TempDir()
	require.NoError(t, os.CopyFS(dir, os.DirFS(filepath.Join("..", "..", "testdata", "e2e", name))))
	return dir
}

// gitEnv makes git ignore the user's and the system's settings and gives
// commits an author.
var gitEnv = []string{
	"GIT_CONFIG_NOSYSTEM=1", "GIT_CONFIG_GLOBAL=" + os.DevNull,
	"GIT_AUTHOR_NAME=Kiln Lab", "GIT_AUTHOR_EMAIL=lab@kilnlab.invalid",
	"GIT_COMMITTER_NAME=Kiln Lab", "GIT_COMMITTER_EMAIL=lab@kilnlab.invalid",
}

// run runs a command in dir with a hermetic Go and git environment and
// returns its standard output, its standard error and its exit status.
func run(t *testing.T, dir, name string, args ...string) (stdout, stderr string, code int) {
	t.Helper()
	return runEnv(t, dir, nil, name, args...)
}

// runEnv is run with more environment variables, which win.
func runEnv(t *testing.T, dir string, env []string, name string, args ...string) (stdout, stderr string, code int) {
	t.Helper()
	cmd := exec.Command(name, args...)
	cmd.Dir = dir
	cmd.Env = append(os.Environ(), "GOFLAGS=", "GOTOOLCHAIN=local", "GOPROXY=off", "GOWORK=off")
	cmd.Env = append(append(cmd.Env, gitEnv...), env...)
	var out, errOut bytes.Buffer
	cmd.Stdout, cmd.Stderr = &out, &errOut
	err := cmd.Run()
	var exit *exec.ExitError
	if err != nil && !errors.As(err, &exit) {
		require.NoError(t, err)
	}
	return out.String(), errOut.String(), cmd.ProcessState.ExitCode()
}

// snapshot returns the contents of every file under dir by relative path.
func snapshot(t *testing.T, dir string) map[string]string {
	t.Helper()
	files := map[string]string{}
	require.NoError(t, filepath.WalkDir(dir, func(path string, d fs.DirEntry, err error) error {
		if err != nil || d.IsDir() {
			return err
		}
		data, err := os.ReadFile(path)
		rel, _ := filepath.Rel(dir, path)
		files[filepath.ToSlash(rel)] = string(data)
		return err
	}))
	return files
}

// read returns the contents of dir/rel.
func read(t *testing.T, dir, rel string) string {
	t.Helper()
	data, err := os.ReadFile(filepath.Join(dir, rel))
	require.NoError(t, err)
	return string(data)
}

// assertHazards checks that output names each of the hazards exactly once
// and nothing else.
func assertHazards(t *testing.T, output string, hazards []string) {
	t.Helper()
	for _, msg := range hazards {
		assert.Equal(t, 1, strings.Count(output, msg), "want once: %s\nin:\n%s", msg, output)
	}
	assert.Equal(t, len(hazards), strings.Count(output, ".go:"), output)
}

// Exit statuses of the standalone driver follow the x/tools checker
// convention (go/analysis/internal/checker): 0 clean, 1 errors, 3 findings.

func TestStandaloneReportsHazards(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	stdout, stderr, code := run(t, dir, tool, "./...")
	assert.Equal(t, 3, code, stderr)
	assert.Empty(t, stderr)
	assertHazards(t, stdout, standaloneHazards)
	lines := strings.Split(strings.TrimSuffix(stdout, "\n"), "\n")
	require.Len(t, lines, 3)
	for i, l := range lines {
		assert.True(t, strings.HasPrefix(l, standaloneHazards[i]), "one finding per line, in file order: %s", l)
	}
	// The message names the values on either side of the bound; Go's own
	// float64 arithmetic (IEEE 754-2019 binary64) gives them here.
	frac := 0.0
	for range 10 {
		frac += 0.1
	}
	assert.Contains(t, stdout, fmt.Sprintf("(it passes from %v to %v)", frac, frac+0.1))
}

func TestStandaloneCleanPackage(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	stdout, stderr, code := run(t, dir, tool, "./units")
	assert.Equal(t, 0, code, stderr)
	assert.Empty(t, stdout+stderr)
}

func TestStandaloneAnalyzerDisabled(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	stdout, stderr, code := run(t, dir, tool, "-exacteq=false", "./...")
	assert.Equal(t, 0, code, stderr)
	assert.Empty(t, stdout+stderr)
}

func TestStandaloneJSON(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	stdout, stderr, code := run(t, dir, tool, "-json", "./...")
	// With -json the checker always exits 0 (go/analysis/internal/checker).
	assert.Equal(t, 0, code, stderr)
	var tree map[string]map[string][]struct {
		Category       string `json:"category"`
		Posn           string `json:"posn"`
		Message        string `json:"message"`
		SuggestedFixes []struct {
			Message string `json:"message"`
		} `json:"suggested_fixes"`
	}
	require.NoError(t, json.Unmarshal([]byte(stdout), &tree), stdout)
	require.Len(t, tree, 1, "only kilnlab/ramp has findings")
	diags := tree["kilnlab/ramp"]["exacteq"]
	require.Len(t, diags, 3)
	var got []string
	for _, d := range diags {
		rel, err := filepath.Rel(dir, d.Posn)
		require.NoError(t, err)
		got = append(got, filepath.ToSlash(rel)+": "+d.Message)
		assert.Len(t, d.SuggestedFixes, 1, "standalone offers every fix: %s", d.Message)
	}
	assertHazards(t, strings.Join(got, "\n"), vetHazards)
	assert.ElementsMatch(t, []string{"nan", "loop", "literal"}, []string{diags[0].Category, diags[1].Category, diags[2].Category})
}

func TestStandaloneDiff(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	before := snapshot(t, dir)
	stdout, stderr, code := run(t, dir, tool, "-fix", "-diff", "./...")
	assert.Equal(t, 0, code, stderr)
	assert.Contains(t, stdout, "--- a/ramp/ramp.go\n+++ b/ramp/ramp.go\n")
	for _, line := range []string{"-" + nanSrc, "+" + nanFixed, "-" + loopSrc, "+" + loopLess, "-" + literalSrc, "+" + literalTol, "+import \"math\"\n"} {
		assert.Contains(t, stdout, line)
	}
	assert.Equal(t, before, snapshot(t, dir), "-diff must not write files")
}

func TestStandaloneFix(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	_, stderr, code := run(t, dir, tool, "-fix", "./...")
	require.Equal(t, 0, code, stderr)

	ramp, soak := read(t, dir, "ramp/ramp.go"), read(t, dir, "ramp/soak.go")
	assert.Contains(t, ramp, nanFixed)
	assert.Contains(t, ramp, loopLess)
	assert.Contains(t, soak, literalTol)
	assert.Contains(t, soak, "\nimport \"math\"\n")

	_, stderr, code = run(t, dir, "go", "build", "./...")
	assert.Equal(t, 0, code, stderr)
	for rel, src := range snapshot(t, dir) {
		if strings.HasSuffix(rel, ".go") {
			formatted, err := format.Source([]byte(src))
			require.NoError(t, err, rel)
			assert.Equal(t, string(formatted), src, "%s is not gofmt-clean", rel)
		}
	}
	stdout, stderr, code := run(t, dir, tool, "./...")
	assert.Equal(t, 0, code, stderr)
	assert.Empty(t, stdout+stderr)
}

func TestGoVet(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	before := snapshot(t, dir)
	_, stderr, code := run(t, dir, "go", "vet", "-vettool="+tool, "./...")
	assert.NotEqual(t, 0, code)
	assertHazards(t, stderr, vetHazards)
	assert.Equal(t, before, snapshot(t, dir))
}

// Under go fix and go vet -fix the first fix of every diagnostic is applied
// unread, so roundoff offers only the safe ones: IsNaN and < are applied,
// the tolerance test (a numerical judgement) is not.
func TestGoFixAppliesSafeFixesOnly(t *testing.T) {
	t.Parallel()
	for name, args := range map[string][]string{
		"go fix":      {"fix", "-fixtool=" + tool, "./..."},
		"go vet -fix": {"vet", "-vettool=" + tool, "-fix", "./..."},
	} {
		t.Run(name, func(t *testing.T) {
			t.Parallel()
			dir := fixture(t, "mod")
			before := snapshot(t, dir)
			stdout, stderr, code := run(t, dir, "go", args...)
			require.Equal(t, 0, code, stdout+stderr)

			after := snapshot(t, dir)
			want := strings.Replace(before["ramp/ramp.go"], nanSrc, nanFixed, 1)
			want = strings.Replace(want, loopSrc, loopLess, 1)
			assert.Equal(t, want, after["ramp/ramp.go"])
			assert.Equal(t, before["ramp/soak.go"], after["ramp/soak.go"], "judgement fix applied unattended")
			delete(before, "ramp/ramp.go")
			delete(after, "ramp/ramp.go")
			assert.Equal(t, before, after)

			stdout, _, code = run(t, dir, tool, "./...")
			assert.Equal(t, 3, code)
			assert.Contains(t, stdout, literalPos+"exacteq: "+literalMsg)
			assert.Equal(t, 1, strings.Count(stdout, ".go:"), stdout)
		})
	}
}

func TestGoFixDiff(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	before := snapshot(t, dir)
	stdout, stderr, code := run(t, dir, "go", "fix", "-fixtool="+tool, "-diff", "./...")
	// go fix -diff exits non-zero when the diff is not empty (go help fix).
	assert.NotEqual(t, 0, code, stderr)
	for _, line := range []string{"-" + nanSrc, "+" + nanFixed, "-" + loopSrc, "+" + loopLess} {
		assert.Contains(t, stdout, line)
	}
	assert.NotContains(t, stdout, "soak.go")
	assert.NotContains(t, stdout, "math.Abs")
	assert.Equal(t, before, snapshot(t, dir))
}

// A package that does not type-check is an error (status 1), not a finding.
func TestBrokenModule(t *testing.T) {
	t.Parallel()
	for name, args := range map[string][]string{
		"standalone": {tool, "./..."},
		"go vet":     {"go", "vet", "-vettool=" + tool, "./..."},
		"go fix":     {"go", "fix", "-fixtool=" + tool, "./..."},
	} {
		t.Run(name, func(t *testing.T) {
			t.Parallel()
			dir := fixture(t, "broken")
			before := snapshot(t, dir)
			stdout, stderr, code := run(t, dir, args[0], args[1:]...)
			output := stdout + stderr
			assert.Equal(t, 1, code, output)
			assert.Contains(t, output, "firing/firing.go:6:20: cannot use \"hot\" (untyped string constant) as float64 value")
			assert.NotContains(t, output, "panic")
			assert.Equal(t, before, snapshot(t, dir))
		})
	}
}

// go vet caches results under the tool's ID, which must change with the
// module's roundoff.yaml when go vet runs from a subdirectory too.
func TestGoVetSeesConfigFromSubdirectory(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	sub := filepath.Join(dir, "ramp")
	_, stderr, _ := run(t, sub, "go", "vet", "-vettool="+tool, ".")
	assert.Contains(t, stderr, nanMsg)
	write(t, dir, "roundoff.yaml", "analyzers:\n  exacteq:\n    enabled: false\n")
	_, stderr, code := run(t, sub, "go", "vet", "-vettool="+tool, ".")
	assert.Equal(t, 0, code, stderr)
	assert.NotContains(t, stderr, nanMsg)
}

// go vet prints an analyzer's findings of a package in file order (the
// demo's turbine minimization gives two stoptol findings, reported by
// the analyzer in the other order).
func TestGoVetFileOrder(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	require.NoError(t, os.CopyFS(filepath.Join(dir, "turbine"), os.DirFS(filepath.Join("..", "..", "testdata", "demo", "turbine"))))
	write(t, dir, "go.mod", "module hydro\n\ngo 1.26\n")
	_, stderr, _ := run(t, dir, "go", "vet", "-vettool="+tool, "-stoptol", "./turbine")
	var lines []int
	for l := range strings.Lines(stderr) {
		if rest, ok := strings.CutPrefix(l, "turbine/turbine.go:"); ok {
			n, _, _ := strings.Cut(rest, ":")
			line, err := strconv.Atoi(n)
			require.NoError(t, err)
			lines = append(lines, line)
		}
	}
	require.GreaterOrEqual(t, len(lines), 2, stderr)
	assert.True(t, slices.IsSorted(lines), "in file order: %v", lines)
}
