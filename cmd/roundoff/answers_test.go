package main_test

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// The documented CI recipe, -since with -baseline: entries of findings
// outside the changed lines are not stale.
func TestSinceWithBaseline(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	_, stderr, code := run(t, dir, tool, "-write-baseline", "accepted.txt", "./...")
	require.Equal(t, 0, code, stderr)
	gitInit(t, dir)
	write(t, dir, "ramp/probe.go", probeSrc)
	stdout, stderr, code := run(t, dir, tool, "-since", "HEAD", "-baseline", "accepted.txt", "./...")
	assert.Equal(t, 3, code)
	assert.Equal(t, []string{"ramp/probe.go:7:9: exacteq: " + nanMsg + ": NaN is unequal to every value, itself included; test with math.IsNaN"}, findingLines(stdout))
	assert.Empty(t, stderr, "no entry is stale")
}

// A package that does not load is an error notification in SARIF (SARIF
// 2.1.0 §3.20.21 toolExecutionNotifications, §3.58 notification) and an
// ::error workflow command in the github format.
func TestLoadErrorsInMachineFormats(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	write(t, dir, "vent/vent.go", "package vent\n\n// Open is the damper setting.\nvar Open float64 = \"wide\"\n")
	const msg = "cannot use \"wide\" (untyped string constant) as float64 value in variable declaration"
	stdout, _, code := run(t, dir, tool, "-format", "sarif", "./...")
	assert.Equal(t, 1, code)
	require.NoError(t, validateSARIF(t, stdout))
	var log struct {
		Runs []struct {
			Invocations []struct {
				ExecutionSuccessful        bool
				ToolExecutionNotifications []struct {
					Level     string
					Message   struct{ Text string }
					Locations []struct{ PhysicalLocation sarifPhysical }
				}
			}
		}
	}
	require.NoError(t, json.Unmarshal([]byte(stdout), &log))
	inv := log.Runs[0].Invocations[0]
	assert.False(t, inv.ExecutionSuccessful)
	require.Len(t, inv.ToolExecutionNotifications, 1)
	n := inv.ToolExecutionNotifications[0]
	assert.Equal(t, "error", n.Level)
	assert.Contains(t, n.Message.Text, msg)
	require.Len(t, n.Locations, 1)
	assert.Equal(t, sarifArtifact{"vent/vent.go", "SRCROOT"}, n.Locations[0].PhysicalLocation.ArtifactLocation)
	assert.Equal(t, 4, n.Locations[0].PhysicalLocation.Region.StartLine)

	stdout, _, code = run(t, dir, tool, "-format", "github", "./...")
	assert.Equal(t, 1, code)
	assert.Contains(t, stdout, "::error file=vent/vent.go,line=4,col=20,title=roundoff::"+msg+"\n")
}

// Build tags select files as for go build.
func TestBuildTags(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	write(t, dir, "ramp/probe.go", "//go:build bench\n\n"+probeSrc)
	stdout, _, _ := run(t, dir, tool, "./ramp")
	assert.NotContains(t, stdout, "probe.go")
	stdout, stderr, code := run(t, dir, tool, "-tags", "bench", "./ramp")
	assert.Equal(t, 3, code, stderr)
	assert.Contains(t, stdout, "ramp/probe.go:9:9: exacteq: "+nanMsg)
}

// A syntax error reads as the compiler reports it: one line, the first
// error of the file.
func TestSyntaxErrorOneLine(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	write(t, dir, "vent/vent.go", "package vent\n\n// Open reports a full opening.\nfunc Open(x float64) bool {\n\treturn x == 0.3 +\n}\n")
	stdout, stderr, code := run(t, dir, tool, "./vent")
	assert.Equal(t, 1, code)
	assert.Empty(t, stdout)
	assert.Equal(t, "vent/vent.go:6:1: expected operand, found '}'\n", stderr)
	assert.Equal(t, 1, strings.Count(stderr, "\n"))
}

// One convention for help and usage: help TOPIC and -h print the usage
// on standard output with status 0; usage errors give status 1, as
// README's table says, in one line.
func TestHelpConvention(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	for _, args := range [][]string{
		{"help", "limits"}, {"limits", "-h"},
		{"help", "config"}, {"config", "-h"},
		{"help", "hook"}, {"hook", "-h"}, {"hook", "install", "-h"},
		{"-h"}, {"help"},
	} {
		stdout, stderr, code := run(t, dir, tool, args...)
		assert.Equal(t, 0, code, args)
		assert.Empty(t, stderr, args)
		assert.Contains(t, stdout, "usage", args)
	}
	for _, args := range [][]string{{"limits"}, {"limits", "-bogus", "1"}, {"hook"}, {"config", "extra"}, {"help", "nosuch"}} {
		stdout, stderr, code := run(t, dir, tool, args...)
		assert.Equal(t, 1, code, args)
		assert.Empty(t, stdout, args)
		assert.Equal(t, 1, strings.Count(stderr, "\n"), "one line: %s", stderr)
	}
	// Negative magnitudes need no "--".
	stdout, stderr, code := run(t, dir, tool, "limits", "-3")
	assert.Equal(t, 0, code, stderr)
	assert.Contains(t, stdout, "x = -3 ")
}

// Counts read as English: one finding, one fix, one file.
func TestPlurals(t *testing.T) {
	t.Parallel()
	dir := gaugeModule(t)
	write(t, dir, "gauge/fault.go", gaugeSrc)
	_, stderr, _ := run(t, dir, tool, "-write-baseline", "one.txt", "./...")
	assert.Equal(t, "roundoff: recorded 1 finding in one.txt\n", stderr)
	_, stderr, _ = run(t, dir, tool, "-fix", "./...")
	assert.Equal(t, "roundoff: applied 1 fix to 1 file\n", stderr)
}

// CI lints the project with roundoff itself and fails on findings; the
// deliberate bit-exact checks of the cancellation tests carry reviewed
// directives, so that package is clean (the full run is .ci/run's).
func TestDogfood(t *testing.T) {
	t.Parallel()
	root := filepath.Join("..", "..")
	script, err := os.ReadFile(filepath.Join(root, ".ci", "run"))
	require.NoError(t, err)
	assert.Contains(t, string(script), "\nset -euo pipefail\n")
	assert.Contains(t, string(script), "\ngo run ./cmd/roundoff ./...\n")
	stdout, stderr, code := run(t, root, tool, "./analyzers/cancellation")
	assert.Equal(t, 0, code, stdout+stderr)
}
