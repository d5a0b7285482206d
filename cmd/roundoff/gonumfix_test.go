package main_test

import (
	"encoding/json"
	"fmt"
	"go/format"
	"maps"
	"os"
	"os/exec"
	"regexp"
	"slices"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// gonumFixEnv names the environment variable that turns on TestGonumFixes,
// which needs gonum's dependencies (fetched through the module proxy) and
// several minutes.
const gonumFixEnv = "ROUNDOFF_GONUM_FIX"

// TestGonumFixes applies roundoff's fixes to copies of gonum v0.17.0, the
// reference library of the project's tests: every fix with standalone
// -fix, and the unattended ones with go fix. Each fixed tree must build,
// stay gofmt-clean and give go vet nothing it did not give before. The log
// has the counts per analyzer (docs/evaluation.md, "Fixes on gonum").
func TestGonumFixes(t *testing.T) {
	if os.Getenv(gonumFixEnv) != "1" {
		t.Skipf("set %s=1 to apply every fix to a copy of gonum v0.17.0", gonumFixEnv)
	}
	pristine := gonumCopy(t)
	_, vetBefore, _ := run(t, pristine, "go", "vet", "./...")
	before := fixCounts(t, pristine)

	t.Run("standalone -fix", func(t *testing.T) {
		dir := gonumCopy(t)
		applied := map[string]int{}
		for pass := 1; ; pass++ {
			offered := fixCounts(t, dir)
			_, stderr, code := run(t, dir, tool, "-fix", "./...")
			require.Equal(t, 0, code, stderr)
			skipped := skippedFixes(stderr)
			for name, c := range offered {
				applied[name] += c.fixes - skipped[name]
			}
			if len(skipped) == 0 || pass == 4 {
				break
			}
		}
		checkFixedTree(t, pristine, dir, vetBefore)
		after := fixCounts(t, dir)
		for _, name := range slices.Sorted(maps.Keys(before)) {
			t.Logf("%-12s findings %3d, with a fix %3d, fixes applied %3d; after: findings %3d, with a fix %3d",
				name, before[name].findings, before[name].fixes, applied[name], after[name].findings, after[name].fixes)
		}
	})

	t.Run("go fix", func(t *testing.T) {
		dir := gonumCopy(t)
		stdout, stderr, code := run(t, dir, "go", "fix", "-fixtool="+tool, "./...")
		require.Equal(t, 0, code, stdout+stderr)
		checkFixedTree(t, pristine, dir, vetBefore)
		after := fixCounts(t, dir)
		for _, name := range slices.Sorted(maps.Keys(before)) {
			t.Logf("%-12s findings %3d, removed by go fix %3d", name, before[name].findings, before[name].findings-after[name].findings)
		}
	})
}

// gonumCopy returns a writable copy of gonum v0.17.0 from the module
// cache, with its dependencies downloaded.
func gonumCopy(t *testing.T) string {
	t.Helper()
	src, err := exec.Command("go", "list", "-m", "-f", "{{.Dir}}", "gonum.org/v1/gonum").Output()
	require.NoError(t, err)
	dir := t.TempDir()
	require.NoError(t, os.CopyFS(dir, os.DirFS(strings.TrimSpace(string(src)))))
	download := exec.Command("go", "mod", "download")
	download.Dir = dir
	download.Env = append(os.Environ(), "GOTOOLCHAIN=local", "GOWORK=off", "GOFLAGS=")
	out, err := download.CombinedOutput()
	require.NoError(t, err, "%s", out)
	return dir
}

// counts are an analyzer's findings, and those of them that carry a fix.
type counts struct{ findings, fixes int }

// fixCounts lints dir and counts the findings and fixes per analyzer.
func fixCounts(t *testing.T, dir string) map[string]counts {
	t.Helper()
	stdout, stderr, code := run(t, dir, tool, "-json", "./...")
	require.Equal(t, 0, code, stderr)
	var tree map[string]map[string][]struct {
		SuggestedFixes []json.RawMessage `json:"suggested_fixes"`
	}
	require.NoError(t, json.Unmarshal([]byte(stdout), &tree))
	out := map[string]counts{}
	for _, byAnalyzer := range tree {
		for name, diags := range byAnalyzer {
			c := out[name]
			for _, d := range diags {
				c.findings++
				if len(d.SuggestedFixes) > 0 {
					c.fixes++
				}
			}
			out[name] = c
		}
	}
	return out
}

// skippedFixes counts, per analyzer, the fixes that -fix skipped because
// they overlap another.
func skippedFixes(stderr string) map[string]int {
	skipped := map[string]int{}
	re := regexp.MustCompile(`skipped the fix ".*" for this (\w+) finding`)
	for _, m := range re.FindAllStringSubmatch(stderr, -1) {
		skipped[m[1]]++
	}
	return skipped
}

// vetPosition matches the line and column of a go vet report.
var vetPosition = regexp.MustCompile(`:\d+(:\d+)?: `)

// checkFixedTree checks that the fixed copy dir builds, that its changed
// files are gofmt-clean and that go vet reports nothing beyond what it
// reported on the pristine copy (vetBefore; gonum has reports of its own,
// in generated files).
func checkFixedTree(t *testing.T, pristine, dir, vetBefore string) {
	t.Helper()
	_, stderr, code := run(t, dir, "go", "build", "./...")
	require.Equal(t, 0, code, "go build of the fixed tree:\n%s", stderr)

	old, now := snapshot(t, pristine), snapshot(t, dir)
	changed := 0
	for rel, src := range now {
		if src == old[rel] || !strings.HasSuffix(rel, ".go") {
			continue
		}
		changed++
		formatted, err := format.Source([]byte(src))
		require.NoError(t, err, rel)
		assert.Equal(t, string(formatted), src, "%s is not gofmt-clean", rel)
	}
	t.Logf("%d files changed", changed)

	// go vet names files by absolute path, and fixes move lines.
	normal := func(root, l string) string {
		return vetPosition.ReplaceAllString(strings.ReplaceAll(l, root+string(os.PathSeparator), ""), ": ")
	}
	known := map[string]bool{}
	for l := range strings.Lines(vetBefore) {
		known[normal(pristine, l)] = true
	}
	_, vetAfter, _ := run(t, dir, "go", "vet", "./...")
	var added []string
	for l := range strings.Lines(vetAfter) {
		if !known[normal(dir, l)] {
			added = append(added, l)
		}
	}
	assert.Empty(t, added, "go vet of the fixed tree reports more than of gonum itself:\n%s", fmt.Sprint(added))
}
