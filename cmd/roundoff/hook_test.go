package main_test

import (
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// onPath returns the environment setting of a PATH on which roundoff is
// found in a directory of its own (a copy of the tool), before the
// directories of go, git and the shell.
func onPath(t *testing.T) (env []string, bin string) {
	t.Helper()
	bin = t.TempDir()
	data, err := os.ReadFile(tool)
	require.NoError(t, err)
	require.NoError(t, os.WriteFile(filepath.Join(bin, "roundoff"), data, 0o755))
	return []string{"PATH=" + bin + string(os.PathListSeparator) + basePath(t)}, bin
}

// basePath is a PATH with go, git and sh and no roundoff.
func basePath(t *testing.T) string {
	t.Helper()
	var dirs []string
	for _, cmd := range []string{"go", "git", "sh"} {
		p, err := exec.LookPath(cmd)
		require.NoError(t, err)
		dirs = append(dirs, filepath.Dir(p))
	}
	return strings.Join(dirs, string(os.PathListSeparator))
}

// The hook lints what the commit holds (the index), not the work tree:
// unstaged lines inserted above a staged hazard do not hide it, and an
// unstaged deletion does not move an old finding onto a staged line.
func TestHookLintsTheIndex(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	gitInit(t, dir)
	env, _ := onPath(t)
	_, stderr, code := runEnv(t, dir, env, tool, "hook", "install")
	require.Equal(t, 0, code, stderr)

	write(t, dir, "ramp/probe.go", probeSrc)
	mustRun(t, dir, "git", "add", "ramp/probe.go")
	edit(t, dir, "ramp/probe.go", "// Probe rejects", "// Lines not staged.\n\n// More of them.\n\n// Probe rejects")
	stdout, stderr, code := runEnv(t, dir, env, "git", "commit", "-q", "-m", "probe")
	assert.NotEqual(t, 0, code, "the staged hazard stops the commit")
	assert.Contains(t, stdout+stderr, "ramp/probe.go:7:9: exacteq: "+nanMsg, "at its line in the index")
	assert.Contains(t, read(t, dir, "ramp/probe.go"), "// Lines not staged.", "the work tree is untouched")

	mustRun(t, dir, "git", "rm", "-q", "-f", "ramp/probe.go")
	edit(t, dir, "ramp/ramp.go", "// Check rejects a failed thermocouple reading.", "// Check rejects a failed reading.")
	mustRun(t, dir, "git", "add", "ramp/ramp.go")
	edit(t, dir, "ramp/ramp.go", "// Package ramp plans the firing schedule of a fictional pottery kiln. It\n// plants the float hazards the roundoff end-to-end tests expect to find.\n", "")
	stdout, stderr, code = runEnv(t, dir, env, "git", "commit", "-q", "-m", "doc")
	assert.Equal(t, 0, code, "the old finding sits on an unchanged line of the index: %s", stdout+stderr)
}

// A hook that install -force moved aside still runs, first; the hook runs
// roundoff from PATH, so it survives the binary moving, and says what to
// do when there is none.
func TestHookChainsAndFindsTheBinary(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	gitInit(t, dir)
	hook := filepath.Join(dir, ".git", "hooks", "pre-commit")
	require.NoError(t, os.WriteFile(hook, []byte("#!/bin/sh\necho ran >> \"$(git rev-parse --git-dir)/foreign-ran\"\n[ ! -e stop ]\n"), 0o755))
	env, bin := onPath(t)
	_, stderr, code := runEnv(t, dir, env, tool, "hook", "install", "-force")
	require.Equal(t, 0, code, stderr)

	edit(t, dir, "ramp/ramp.go", "// Check rejects a failed thermocouple reading.", "// Check rejects a failed reading.")
	write(t, dir, "stop", "")
	mustRun(t, dir, "git", "add", "ramp/ramp.go")
	_, _, code = runEnv(t, dir, env, "git", "commit", "-q", "-m", "doc")
	assert.NotEqual(t, 0, code, "the saved hook fails, so the commit stops")
	assert.Equal(t, "ran\n", read(t, dir, ".git/foreign-ran"))

	require.NoError(t, os.Remove(filepath.Join(dir, "stop")))
	moved := t.TempDir()
	require.NoError(t, os.Rename(filepath.Join(bin, "roundoff"), filepath.Join(moved, "roundoff")))
	stdout, stderr, code := runEnv(t, dir, []string{"PATH=" + moved + string(os.PathListSeparator) + basePath(t)}, "git", "commit", "-q", "-m", "doc")
	assert.Equal(t, 0, code, stdout+stderr)
	assert.Equal(t, "ran\nran\n", read(t, dir, ".git/foreign-ran"))

	edit(t, dir, "ramp/ramp.go", "// Check rejects a failed reading.", "// Check rejects a bad reading.")
	mustRun(t, dir, "git", "add", "ramp/ramp.go")
	_, stderr, code = runEnv(t, dir, []string{"PATH=" + basePath(t)}, "git", "commit", "-q", "-m", "doc")
	assert.NotEqual(t, 0, code)
	assert.Contains(t, stderr, "roundoff pre-commit hook: no roundoff command on PATH; install it")
}
