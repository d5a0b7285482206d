package main_test

import (
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// The hook lints through go vet: a staged file that does not type-check is
// an error (status 1) worded by the go command, not a crash, and findings
// reach the staged lines of a package whose dependencies go vet analyzed.
func TestHookThroughVet(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	gitInit(t, dir)

	write(t, dir, "vent/vent.go", "package vent\n\n// Open is the damper setting.\nvar Open float64 = \"wide\"\n")
	mustRun(t, dir, "git", "add", "vent/vent.go")
	stdout, stderr, code := run(t, dir, tool, "hook", "run")
	assert.Equal(t, 1, code, stdout+stderr)
	assert.Contains(t, stderr, "vent.go:4:20: cannot use \"wide\" (untyped string constant) as float64 value")
	assert.NotContains(t, stdout+stderr, "panic")

	mustRun(t, dir, "git", "rm", "-q", "--cached", "vent/vent.go")
	require.NoError(t, os.RemoveAll(filepath.Join(dir, "vent")))
	write(t, dir, "ramp/probe.go", probeSrc)
	mustRun(t, dir, "git", "add", "ramp/probe.go")
	stdout, stderr, code = run(t, dir, tool, "hook", "run")
	assert.Equal(t, 3, code, stderr)
	assert.Equal(t, []string{"ramp/probe.go:7:9: exacteq: " + nanMsg + ": NaN is unequal to every value, itself included; test with math.IsNaN"}, findingLines(stdout))
}
