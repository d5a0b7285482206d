package driver

import (
	"math/rand/v2"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// The references for unified diffs are GNU diffutils' diff -u (the layout
// POSIX specifies for diff -u) and git apply, which must accept our diffs
// and reproduce the new text.

func TestUnifiedDiffMatchesDiffU(t *testing.T) {
	if _, err := exec.LookPath("diff"); err != nil {
		t.Skip("no diff on this machine")
	}
	old := "package p\n\nfunc a() {}\n\nfunc b() {}\n\nfunc c() {}\n\nfunc d() {}\n\nfunc e() {}\n"
	for name, new := range map[string]string{
		"one line":      strings.Replace(old, "func c() {}", "func c() { return }", 1),
		"two hunks":     strings.Replace(strings.Replace(old, "func a()", "func a1()", 1), "func e()", "func e1()", 1),
		"insert at top": "// Package p.\n" + old,
		"delete at end": strings.TrimSuffix(old, "\nfunc e() {}\n"),
		"no final eol":  strings.TrimSuffix(old, "\n"),
		"all new":       "x\ny\n",
		"merged hunks":  strings.Replace(strings.Replace(old, "func b()", "func b1()", 1), "func d()", "func d1()", 1),
		"insert import": strings.Replace(old, "package p\n", "package p\n\nimport \"math\"\n", 1),
	} {
		dir := t.TempDir()
		require.NoError(t, os.WriteFile(filepath.Join(dir, "old"), []byte(old), 0o644))
		require.NoError(t, os.WriteFile(filepath.Join(dir, "new"), []byte(new), 0o644))
		cmd := exec.Command("diff", "-u", "--label", "a/f.go", "--label", "b/f.go", "old", "new")
		cmd.Dir = dir
		want, _ := cmd.Output() // status 1: the files differ
		assert.Equal(t, string(want), string(unifiedDiff("a/f.go", "b/f.go", old, new)), name)
	}
	assert.Empty(t, unifiedDiff("a", "b", old, old))
}

func TestUnifiedDiffApplies(t *testing.T) {
	if _, err := exec.LookPath("git"); err != nil {
		t.Skip("no git on this machine")
	}
	rng := rand.New(rand.NewPCG(1, 2))
	words := []string{"a\n", "b\n", "c\n", "}\n", "\n"}
	text := func(n int) []string {
		var lines []string
		for range n {
			lines = append(lines, words[rng.IntN(len(words))])
		}
		return lines
	}
	dir := t.TempDir()
	for i := range 60 {
		old := text(rng.IntN(40))
		new := append([]string(nil), old...)
		for range rng.IntN(6) + 1 { // a few random insertions, deletions, changes
			at := rng.IntN(len(new) + 1)
			switch rng.IntN(3) {
			case 0:
				new = append(new[:at], append(text(rng.IntN(3)+1), new[at:]...)...)
			case 1:
				if at < len(new) {
					new = append(new[:at], new[at+1:]...)
				}
			default:
				if at < len(new) {
					new[at] = "changed\n"
				}
			}
		}
		o, n := strings.Join(old, ""), strings.Join(new, "")
		d := unifiedDiff("a/f", "b/f", o, n)
		require.NoError(t, os.WriteFile(filepath.Join(dir, "f"), []byte(o), 0o644))
		if o == n {
			assert.Empty(t, d)
			continue
		}
		cmd := exec.Command("git", "apply", "--unidiff-zero", "-")
		cmd.Dir = dir
		cmd.Stdin = strings.NewReader(string(d))
		out, err := cmd.CombinedOutput()
		require.NoError(t, err, "case %d: %s\n%s", i, out, d)
		got, err := os.ReadFile(filepath.Join(dir, "f"))
		require.NoError(t, err)
		require.Equal(t, n, string(got), "case %d:\n%s", i, d)
	}
}
