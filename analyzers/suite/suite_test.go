package suite_test

import (
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
// and the findings must be the ones hand-checked in docs/evaluation.md.
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
	for name := range got {
		slices.Sort(got[name])
		got[name] = slices.Compact(got[name]) // a file seen by a package and its test variant
	}
	// docs/evaluation.md, exacteq: all six findings hand-checked as true alarms.
	assert.Equal(t, []string{
		"graph/path/bellman_ford_moore.go:156",
		"graph/path/dijkstra.go:176",
		"graph/path/dynamic/dstarlite.go:218",
		"graph/path/dynamic/dstarlite.go:264",
		"graph/path/dynamic/dstarlite.go:328",
		"graph/path/dynamic/dstarlite.go:383",
	}, got["exacteq"])
}
