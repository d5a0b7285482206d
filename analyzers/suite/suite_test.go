package suite_test

import (
	"errors"
	"io/fs"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/checker"
	"golang.org/x/tools/go/packages"

	"roundoff/analyzers/suite"
)

func TestValidate(t *testing.T) {
	require.NoError(t, analysis.Validate(suite.Analyzers))
}

// TestGonum lints gonum v0.17.0 (a test dependency fetched through the Go
// module proxy), tests included, with every analyzer: nothing may panic,
// and each analyzer's findings must be exactly the ones listed in
// testdata/gonum/<analyzer>.txt and hand-checked in docs/evaluation.md
// (a missing file means no findings).
func TestGonum(t *testing.T) {
	if testing.Short() {
		t.Skip("loads all of gonum")
	}
	cfg := &packages.Config{Mode: packages.LoadAllSyntax, Tests: true}
	pkgs, err := packages.Load(cfg, "gonum.org/v1/gonum/...")
	require.NoError(t, err)
	require.Greater(t, len(pkgs), 100)
	graph, err := checker.Analyze(suite.Analyzers, pkgs, nil)
	require.NoError(t, err)

	got := map[string][]string{}
	for act := range graph.All() {
		if !act.IsRoot {
			continue
		}
		for _, d := range act.Diagnostics {
			posn := act.Package.Fset.Position(d.Pos)
			_, rel, _ := strings.Cut(filepath.ToSlash(posn.Filename), "gonum@v0.17.0/")
			got[act.Analyzer.Name] = append(got[act.Analyzer.Name], rel+":"+strconv.Itoa(posn.Line))
		}
	}
	for _, a := range suite.Analyzers {
		found := got[a.Name]
		slices.Sort(found)
		found = slices.Compact(found) // a file seen by a package and its test variant
		assert.Equal(t, expected(t, a.Name), found, a.Name)
	}
}

// expected reads the hand-checked findings of one analyzer: one
// file:line per line, # comments and blank lines ignored, sorted.
func expected(t *testing.T, name string) []string {
	data, err := os.ReadFile(filepath.Join("testdata", "gonum", name+".txt"))
	if errors.Is(err, fs.ErrNotExist) {
		return nil
	}
	require.NoError(t, err)
	var lines []string
	for line := range strings.Lines(string(data)) {
		if line = strings.TrimSpace(line); line != "" && !strings.HasPrefix(line, "#") {
			lines = append(lines, line)
		}
	}
	slices.Sort(lines)
	return lines
}
