package config_test

import (
	"bytes"
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"roundoff/internal/config"
)

// The facts checked here are about roundoff's own file format; YAML
// syntax is the YAML 1.2 specification's, as go.yaml.in/yaml/v3 reads it.

var suite = []string{"exacteq", "fdstep", "reviewmark"}

const full = `# settings of the kiln controller module
analyzers:
  exacteq:
    level: error
  fdstep:
    enabled: false
exclude:
  - internal/legacy
  - "**/*_gen.go"
  - testdata/**
noise:
  - package: kilnlab/sim/...
    relative: 1e-6
  - package: kilnlab/sim/heat
    function: Diffuse
    relative: 1e-3
  - package: kilnlab/sim/heat
    relative: 1e-5
`

func TestParse(t *testing.T) {
	c, err := config.Parse("/m/roundoff.yaml", []byte(full), suite)
	require.NoError(t, err)
	assert.Equal(t, "/m", c.Root)
	assert.True(t, c.Enabled("exacteq"))
	assert.Equal(t, "error", c.Level("exacteq"))
	assert.False(t, c.Enabled("fdstep"))
	assert.Equal(t, "warning", c.Level("fdstep"), "SARIF's default level")
	assert.True(t, c.Enabled("reviewmark"))
	assert.Equal(t, []string{"internal/legacy", "**/*_gen.go", "testdata/**"}, c.Exclude)
	require.Len(t, c.NoiseLevels, 3)
	assert.Equal(t, 12, c.NoiseLevels[0].Line)
}

func TestEmptyFileIsDefaults(t *testing.T) {
	for _, src := range []string{"", "# nothing yet\n"} {
		c, err := config.Parse("roundoff.yaml", []byte(src), suite)
		require.NoError(t, err)
		for _, n := range suite {
			assert.True(t, c.Enabled(n))
			assert.Equal(t, config.DefaultLevel, c.Level(n))
		}
	}
}

func TestErrorsNameFileAndLine(t *testing.T) {
	for _, c := range []struct{ src, want string }{
		{"exlude:\n  - a\n", `cfg.yaml:1: unknown key "exlude" in the top level (want analyzers, datasize, exclude, noise)`},
		{"analyzers:\n  exacteqq:\n    level: error\n", `cfg.yaml:2: unknown analyzer "exacteqq" (the suite has exacteq, fdstep, reviewmark)`},
		{"analyzers:\n  exacteq:\n    level: fatal\n", `cfg.yaml:3: level must be one of error, warning, note, not "fatal"`},
		{"analyzers:\n  exacteq:\n    enabled: maybe\n", `cfg.yaml:3: enabled must be true or false, not "maybe"`},
		{"analyzers:\n  exacteq:\n    colour: red\n", `cfg.yaml:3: unknown key "colour" in analyzer exacteq (want enabled, level)`},
		{"analyzers:\n  exacteq: off\n", `cfg.yaml:2: analyzer exacteq must be a mapping of keys to values`},
		{"exclude: testdata\n", `cfg.yaml:1: exclude must be a list of path patterns`},
		{"exclude:\n  - ../elsewhere\n", `cfg.yaml:2: exclude pattern "../elsewhere": may not leave the module root`},
		{"exclude:\n  - /abs\n", `cfg.yaml:2: exclude pattern "/abs": want a slash-separated path relative to the module root`},
		{"exclude:\n  - \"a/[b\"\n", `cfg.yaml:2: exclude pattern "a/[b": syntax error in pattern`},
		{"noise:\n  - package: a/b\n", `cfg.yaml:2: a noise entry needs relative, the relative accuracy of the results (such as 1e-6)`},
		{"noise:\n  - relative: 1e-6\n", `cfg.yaml:2: a noise entry needs a package`},
		{"noise:\n  - package: a/b\n    relative: 2\n", `cfg.yaml:3: relative 2: not a relative accuracy between the unit roundoff of float64 (1.11e-16) and 1, such as 1e-6`},
		{"noise:\n  - package: a/b\n    relative: -1e-6\n", `cfg.yaml:3: relative -1e-6: not a relative accuracy between the unit roundoff of float64 (1.11e-16) and 1, such as 1e-6`},
		{"noise:\n  - package: a/b\n    relative: .nan\n", `cfg.yaml:3: relative .nan: not a number; a noise level is a relative accuracy such as 1e-6`},
		// IEEE 754-2019 binary64 unit roundoff 2^-53 ≈ 1.11e-16: no computed value is more accurate.
		{"noise:\n  - package: a/b\n    relative: 1e-17\n", `cfg.yaml:3: relative 1e-17: below the unit roundoff of float64 (1.11e-16): no computed float64 value is that accurate`},
		{"noise:\n  - package: a/b\n    relative: 1e-6\n    scope: all\n", `cfg.yaml:4: unknown key "scope" in a noise entry (want function, package, relative)`},
		{"datasize:\n  - package: a/b\n", `cfg.yaml:2: a datasize entry needs size, the largest magnitude of the data (such as 1e6)`},
		{"datasize:\n  - package: a/b\n    size: -3\n", `cfg.yaml:3: size must be a positive number such as 1e6, not "-3"`},
		{"datasize:\n  - size: 1e6\n", `cfg.yaml:2: a datasize entry needs a package`},
		{"exclude: []\nexclude: []\n", `cfg.yaml:2: key "exclude" appears twice in the top level`},
		{"analyzers:\n  exacteq:\n    level: note\n  exacteq:\n    level: error\n", `cfg.yaml:4: analyzer "exacteq" appears twice`},
		{"analyzers: [exacteq]\n", `cfg.yaml:1: analyzers must map analyzer names to settings`},
		{"- a\n- b\n", `cfg.yaml:1: the top level must be a mapping of keys to values`},
		{"# kiln\nexclude: testdata\n  noise: x\n", `cfg.yaml:3: not valid YAML: mapping values are not allowed in this context`},
	} {
		_, err := config.Parse("cfg.yaml", []byte(c.src), suite)
		if assert.Error(t, err, c.src) {
			assert.Equal(t, c.want, err.Error(), c.src)
		}
	}
}

func TestLoad(t *testing.T) {
	dir := t.TempDir()
	c, err := config.Load(dir, suite)
	require.NoError(t, err)
	assert.Empty(t, c.File, "no file: defaults")
	assert.Equal(t, dir, c.Root)

	require.NoError(t, os.WriteFile(filepath.Join(dir, config.FileName), []byte("analyzers:\n  fdstep:\n    enabled: false\n"), 0o644))
	c, err = config.Load(dir, suite)
	require.NoError(t, err)
	assert.False(t, c.Enabled("fdstep"))

	require.NoError(t, os.WriteFile(filepath.Join(dir, config.FileName), []byte("analyzers: [\n"), 0o644))
	_, err = config.Load(dir, suite)
	assert.ErrorContains(t, err, config.FileName+":")
}

func TestExcluded(t *testing.T) {
	c, err := config.Parse("/m/roundoff.yaml", []byte(full), suite)
	require.NoError(t, err)
	for file, want := range map[string]bool{
		"/m/internal/legacy/old.go":       true, // a directory excludes what is under it
		"/m/internal/legacy/sub/x.go":     true,
		"/m/internal/legacyx/x.go":        false,
		"/m/zone_gen.go":                  true, // ** matches no directory too
		"/m/a/b/c/zone_gen.go":            true,
		"/m/a/b/zone_gen_test.go":         false,
		"/m/testdata/src/p/p.go":          true,
		"/m/sim/testdata.go":              false,
		"/elsewhere/internal/legacy/x.go": false, // outside the module
	} {
		assert.Equal(t, want, c.Excluded(filepath.FromSlash(file)), file)
	}
}

func TestSelect(t *testing.T) {
	c, err := config.Parse("roundoff.yaml", []byte(full), suite)
	require.NoError(t, err)
	c.Select(nil, []string{"reviewmark"})
	assert.Equal(t, []bool{true, false, false}, []bool{c.Enabled("exacteq"), c.Enabled("fdstep"), c.Enabled("reviewmark")})
	c.Select([]string{"fdstep"}, nil) // named on the command line: runs, alone
	assert.Equal(t, []bool{false, true, false}, []bool{c.Enabled("exacteq"), c.Enabled("fdstep"), c.Enabled("reviewmark")})
}

func TestNoise(t *testing.T) {
	c, err := config.Parse("roundoff.yaml", []byte(full), suite)
	require.NoError(t, err)
	for _, q := range []struct {
		pkg, fn string
		want    float64
		ok      bool
	}{
		{"kilnlab/sim/heat", "Diffuse", 1e-3, true}, // the function's own level
		{"kilnlab/sim/heat", "Conduct", 1e-5, true}, // the package's exact path beats the tree
		{"kilnlab/sim", "Step", 1e-6, true},         // the tree includes its root
		{"kilnlab/sim/flow/pipe", "", 1e-6, true},
		{"kilnlab/simx", "Step", 0, false},
		{"kilnlab/ramp", "Plan", 0, false},
	} {
		got, ok := c.Noise(q.pkg, q.fn)
		assert.Equal(t, q.ok, ok, q.pkg+"."+q.fn)
		assert.Equal(t, q.want, got, q.pkg+"."+q.fn)
	}
	config.Use(c)
	defer config.Use(nil)
	got, ok := config.Noise("kilnlab/sim/heat", "Diffuse")
	assert.True(t, ok)
	assert.Equal(t, 1e-3, got)
}

func TestWriteReadsBack(t *testing.T) {
	c, err := config.Parse("/m/roundoff.yaml", []byte(full), suite)
	require.NoError(t, err)
	var buf bytes.Buffer
	require.NoError(t, c.Write(&buf))
	back, err := config.Parse("/m/roundoff.yaml", buf.Bytes(), suite)
	require.NoError(t, err, buf.String())
	for _, n := range suite {
		assert.Equal(t, c.Enabled(n), back.Enabled(n), n)
		assert.Equal(t, c.Level(n), back.Level(n), n)
	}
	assert.Equal(t, c.Exclude, back.Exclude)
	require.Len(t, back.NoiseLevels, 3)
	for i := range c.NoiseLevels {
		a, b := c.NoiseLevels[i], back.NoiseLevels[i]
		assert.Equal(t, [3]any{a.Package, a.Function, a.Relative}, [3]any{b.Package, b.Function, b.Relative})
	}
	assert.Contains(t, buf.String(), "  reviewmark:\n    enabled: true\n    level: warning\n", "every analyzer listed")
}

// TestDataSize checks that the most specific datasize entry applies.
func TestDataSize(t *testing.T) {
	c, err := config.Parse("roundoff.yaml", []byte("datasize:\n  - package: survey/...\n    size: 1e6\n  - package: survey/plan\n    size: 10\n"), suite)
	require.NoError(t, err)
	for _, tc := range []struct {
		pkg  string
		size float64
		ok   bool
	}{{"survey", 1e6, true}, {"survey/field", 1e6, true}, {"survey/plan", 10, true}, {"surveyor", 0, false}} {
		size, ok := c.DataSize(tc.pkg)
		assert.Equal(t, tc.ok, ok, tc.pkg)
		assert.Equal(t, tc.size, size, tc.pkg)
	}
	var buf bytes.Buffer
	require.NoError(t, c.Write(&buf))
	back, err := config.Parse("roundoff.yaml", buf.Bytes(), suite)
	require.NoError(t, err)
	assert.Equal(t, c.DataSizes[0].Size, back.DataSizes[0].Size)
}
