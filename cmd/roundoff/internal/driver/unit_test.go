package driver

import (
	"go/token"
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/analysis"
)

// Workflow command escaping as GitHub Actions defines it (the toolkit's
// command.ts, escapeData and escapeProperty; quoted from memory): data
// escapes %, CR and LF; properties also : and ,.
func TestGitHubEscaping(t *testing.T) {
	assert.Equal(t, "100%25 of 1e-9%0D%0Anext: a, b", escapeData("100% of 1e-9\r\nnext: a, b"))
	assert.Equal(t, "C%3A/w/a%2Cb.go%25%0A", escapeProperty("C:/w/a,b.go%\n"))
	assert.Equal(t, "%2525", escapeData("%25"), "% first, so escapes are not escaped twice")
}

func TestClash(t *testing.T) {
	taken := map[string][]edit{"f": {{"f", 10, 20, "x"}, {"f", 30, 30, "ins"}}}
	for name, c := range map[string]struct {
		e    edit
		want bool
	}{
		"disjoint before":          {edit{"f", 0, 10, "y"}, false}, // touching is not overlapping
		"disjoint after":           {edit{"f", 20, 25, "y"}, false},
		"overlap":                  {edit{"f", 15, 25, "y"}, true},
		"inside":                   {edit{"f", 12, 13, "y"}, true},
		"insert inside":            {edit{"f", 15, 15, "y"}, true},
		"insert at start":          {edit{"f", 10, 10, "y"}, false},
		"insert at end":            {edit{"f", 20, 20, "y"}, false},
		"same edit twice":          {edit{"f", 10, 20, "x"}, false}, // e.g. one import added by two fixes
		"two inserts at one point": {edit{"f", 30, 30, "other"}, true},
		"replace around insert":    {edit{"f", 28, 32, "y"}, true},
		"other file":               {edit{"g", 10, 20, "y"}, false},
	} {
		assert.Equal(t, c.want, clash(taken, []edit{c.e}), name)
	}
}

func TestParseDiff(t *testing.T) {
	// The layout of git diff -U0 (git-diff(1), "combined diff format" aside):
	// a new file, a modified one whose added line looks like a header, a
	// renamed one with a change, a pure rename, a deletion, a quoted path.
	const diff = `diff --git a/new.go b/new.go
new file mode 100644
index 0000000..e69de29
--- /dev/null
+++ b/new.go
@@ -0,0 +1,3 @@
+package p
+
+var x = 1
diff --git a/mod.go b/mod.go
index 1111111..2222222 100644
--- a/mod.go
+++ b/mod.go
@@ -4 +4 @@ func f() {
-	a := 1
+++ b/fake.go
@@ -9,0 +10,2 @@ func g() {
+	b := 2
+	c := 3
@@ -20,3 +21,0 @@ func h() {
-	x
-	y
-	z
diff --git a/old/r.go b/r/r.go
similarity index 90%
rename from old/r.go
rename to r/r.go
--- a/old/r.go
+++ b/r/r.go
@@ -7 +7 @@
-	v := 0.1
+	v := 0.25
diff --git a/same.go b/moved.go
similarity index 100%
rename from same.go
rename to moved.go
diff --git a/gone.go b/gone.go
deleted file mode 100644
--- a/gone.go
+++ /dev/null
@@ -1,2 +0,0 @@
-package p
-
diff --git "a/sp ace\tx.go" "b/sp ace\tx.go"
--- "a/sp ace\tx.go"
+++ "b/sp ace\tx.go"
@@ -1 +1 @@
-a
+b
`
	got := parseDiff(diff)
	assert.Equal(t, map[string]map[int]bool{
		"new.go":       {1: true, 2: true, 3: true},
		"mod.go":       {4: true, 10: true, 11: true},
		"r/r.go":       {7: true},
		"sp ace\tx.go": {1: true},
	}, got)
}

func TestBaselineFormat(t *testing.T) {
	b, err := parseBaseline("b.txt", []byte(baselineHeader+"\n# comment\n\nexacteq\tramp/ramp.go\t0123456789abcdef\tcomparison with math.NaN()\n"))
	require.NoError(t, err)
	require.Len(t, b.entries, 1)
	assert.Equal(t, baselineEntry{"exacteq", "ramp/ramp.go", "0123456789abcdef", 4}, b.entries[0])
	for src, want := range map[string]string{
		"":                                   "b.txt: empty file, not a roundoff baseline",
		"package p\n":                        `b.txt:1: not a roundoff baseline (the first line must be "roundoff baseline 1")`,
		baselineHeader + "\nexacteq\tx.go\n": "b.txt:2: malformed baseline entry (want analyzer, path, 16-hex-digit fingerprint and message, separated by tabs)",
		baselineHeader + "\nexacteq\tx.go\tXYZ\tm\n": "b.txt:2: malformed baseline entry",
	} {
		_, err := parseBaseline("b.txt", []byte(src))
		assert.ErrorContains(t, err, want, src)
	}
}

// SARIF columnKind unicodeCodePoints (SARIF 2.1.0 §3.14.20) counts code
// points, where Go positions count UTF-8 bytes (RFC 3629: ° is 2 bytes,
// € 3).
func TestColumnsInCodePoints(t *testing.T) {
	file := filepath.Join(t.TempDir(), "t.go")
	require.NoError(t, os.WriteFile(file, []byte("package t\n\nvar s = \"°€\" + x\n"), 0o644))
	src := sources{}
	assert.Equal(t, 9, src.column(token.Position{Filename: file, Line: 3, Column: 9}), "before the text: bytes and code points agree")
	assert.Equal(t, 16, src.column(token.Position{Filename: file, Line: 3, Column: 19}), "x: after 5 bytes that are 2 code points")
	p := src.offsetPosition(file, len("package t\n\nvar s = \"°€\" + "))
	assert.Equal(t, token.Position{Filename: file, Line: 3, Column: 19}, p)
	assert.Equal(t, 1, src.offsetPosition(file, 0).Line)
}

type testFact struct{}

func (*testFact) AFact() {}

// On a unit analysed only for facts, an analyzer without facts of its own
// runs none of its code, while what it requires still runs (common
// practice: unitchecker's VetxOnly contract, the facts of every
// dependency are written for its dependents).
func TestFactsOnlyRuns(t *testing.T) {
	ran := map[string]bool{}
	run := func(pass *analysis.Pass) (any, error) { ran[pass.Analyzer.Name] = true; return nil, nil }
	facts := &analysis.Analyzer{Name: "facts", Doc: "facts", Run: run, FactTypes: []analysis.Fact{new(testFact)}}
	rule := &analysis.Analyzer{Name: "rule", Doc: "rule", Run: run, Requires: []*analysis.Analyzer{facts}}
	out := factsOnlyRuns([]*analysis.Analyzer{rule, facts})
	require.Len(t, out, 2)
	assert.Equal(t, "rule", out[0].Name)
	assert.Equal(t, rule.Requires, out[0].Requires)
	for _, a := range out {
		_, err := a.Run(&analysis.Pass{Analyzer: a})
		require.NoError(t, err)
	}
	assert.Equal(t, map[string]bool{"facts": true}, ran)
}
