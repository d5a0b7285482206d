package main_test

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// roundoff noise on a logger that rounds to 1e-6: the noise is the
// standard deviation of a uniform rounding error, 1e-6/√12 (textbook
// fact); -json, -plot and -write work together, -write inserts two lines
// and keeps the file's CRLF line endings, and a second -write replaces the
// directive without adding any.
func TestNoiseMeasuresAndWrites(t *testing.T) {
	dir := fixture(t, "noisy")
	file := filepath.Join(dir, "flow", "flow.go")
	crlf := strings.ReplaceAll(read(t, dir, "flow/flow.go"), "\n", "\r\n")
	require.NoError(t, os.WriteFile(file, []byte(crlf), 0o644))
	plot := filepath.Join(t.TempDir(), "curve.svg")
	stdout, stderr, code := run(t, dir, tool, "noise", "-at", "2", "-json", "-plot", plot, "-write", "./flow.Crest")
	require.Equal(t, 0, code, stderr)
	var r struct {
		Noise     float64
		Directive string
	}
	require.NoError(t, json.Unmarshal([]byte(stdout), &r))
	want := 1e-6 / math.Sqrt(12)
	assert.True(t, r.Noise > want/2 && r.Noise < 2*want, "noise %g, want about %g", r.Noise, want)
	svg, err := os.ReadFile(plot)
	require.NoError(t, err)
	assert.Contains(t, string(svg), "<svg")

	written := read(t, dir, "flow/flow.go")
	assert.Equal(t, strings.Replace(crlf, "rounded to the millilitre per second.\r\n", "rounded to the millilitre per second.\r\n//\r\n"+r.Directive+"\r\n", 1), written)
	_, stderr, code = run(t, dir, tool, "noise", "-at", "2", "-write", "./flow.Crest")
	require.Equal(t, 0, code, stderr)
	again := read(t, dir, "flow/flow.go")
	assert.Equal(t, strings.Count(written, "\n"), strings.Count(again, "\n"))
	assert.Equal(t, 1, strings.Count(again, "//roundoff:noise"))
}

// Bad input: one line on stderr, exit status 1, no file changed.
func TestNoiseBadInput(t *testing.T) {
	dir := fixture(t, "noisy")
	before := snapshot(t, dir)
	for _, c := range []struct {
		args []string
		want string
	}{
		{[]string{"./nowhere.Crest"}, "package ./nowhere"},
		{[]string{"./flow.Spill"}, "has no function or variable Spill"},
		{[]string{"./flow.Both"}, "want one of func(float64) float64, func(float32) float32 or func([]float64) float64"},
		{[]string{"./flow.Jammed"}, "flow.Jammed panics at x = 1: gate sensor missing"},
		{[]string{"-timeout", "3s", "./flow.Stuck"}, "did not finish within the time limit"},
		{[]string{"./flow.Dry"}, "flow.Dry returns NaN at x = 1"},
		{[]string{"./flow.Level"}, "is constant at every spacing tried"},
		{[]string{"-write", "./flow.Table"}, "is generated"},
		{[]string{"./flow.Icy"}, "has no function or variable Icy"},
	} {
		_, stderr, code := run(t, dir, tool, append([]string{"noise"}, c.args...)...)
		assert.Equal(t, 1, code, "%v", c.args)
		assert.Contains(t, stderr, c.want, "%v", c.args)
		assert.Equal(t, 1, strings.Count(stderr, "\n"), "%v: %q", c.args, stderr)
	}
	assert.Equal(t, before, snapshot(t, dir))
}

// Build tags reach the evaluator; float32 and vector functions run.
func TestNoiseKinds(t *testing.T) {
	dir := fixture(t, "noisy")
	for _, args := range [][]string{
		{"-tags", "winter", "-at", "2", "./flow.Icy"},
		{"-at", "0.5", "./flow.Gate"},
		{"-at", "1,2", "-seed", "3", "./flow.Basin"},
	} {
		stdout, stderr, code := run(t, dir, tool, append([]string{"noise"}, args...)...)
		assert.Equal(t, 0, code, "%v: %s", args, stderr)
		assert.Contains(t, stdout, "noise ", "%v", args)
	}
}
