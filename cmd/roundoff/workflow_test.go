package main_test

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/santhosh-tekuri/jsonschema/v6"
	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"go.yaml.in/yaml/v3"
)

// Tests of roundoff in the workflow: output formats for code review,
// changed lines, baselines, review directives, the configuration file and
// the pre-commit hook, in temporary git repositories.

// mustRun runs a command that must succeed and returns its output.
func mustRun(t *testing.T, dir, name string, args ...string) string {
	t.Helper()
	stdout, stderr, code := run(t, dir, name, args...)
	require.Equal(t, 0, code, "%s %s: %s%s", name, strings.Join(args, " "), stdout, stderr)
	return stdout
}

// gitInit makes dir a git repository holding its files in one commit.
func gitInit(t *testing.T, dir string) string {
	t.Helper()
	mustRun(t, dir, "git", "init", "-q", "-b", "main")
	return commitAll(t, dir, "start")
}

// commitAll commits every change in dir, hooks skipped, and returns the
// commit's name.
func commitAll(t *testing.T, dir, msg string) string {
	t.Helper()
	mustRun(t, dir, "git", "add", "-A")
	mustRun(t, dir, "git", "commit", "-q", "--no-verify", "-m", msg)
	return strings.TrimSpace(mustRun(t, dir, "git", "rev-parse", "HEAD"))
}

// write writes content to dir/rel, creating directories.
func write(t *testing.T, dir, rel, content string) {
	t.Helper()
	path := filepath.Join(dir, filepath.FromSlash(rel))
	require.NoError(t, os.MkdirAll(filepath.Dir(path), 0o755))
	require.NoError(t, os.WriteFile(path, []byte(content), 0o644))
}

// edit replaces the first old in dir/rel with new.
func edit(t *testing.T, dir, rel, old, new string) {
	t.Helper()
	src := read(t, dir, rel)
	require.Contains(t, src, old, rel)
	write(t, dir, rel, strings.Replace(src, old, new, 1))
}

// findingLines returns the lines of text output that report findings
// (not the indented lines of their related places).
func findingLines(output string) []string {
	var out []string
	for l := range strings.Lines(output) {
		if strings.Contains(l, ".go:") && !strings.HasPrefix(l, " ") {
			out = append(out, strings.TrimSuffix(l, "\n"))
		}
	}
	return out
}

// A hazard to plant in new code: always false, whatever the reading.
const probeSrc = "package ramp\n\nimport \"math\"\n\n// Probe rejects a missing reading.\nfunc Probe(r float64) bool {\n\treturn r == math.NaN()\n}\n"

// sarifLog is the part of a SARIF log the tests read.
type sarifLog struct {
	Runs []struct {
		Tool struct {
			Driver struct {
				Rules []struct {
					ID                   string
					ShortDescription     struct{ Text string }
					FullDescription      struct{ Text string }
					HelpURI              string
					DefaultConfiguration struct{ Level string }
				}
			}
		}
		OriginalURIBaseIDs map[string]struct{ URI string } `json:"originalUriBaseIds"`
		Results            []struct {
			RuleID    string
			Level     string
			Message   struct{ Text string }
			Locations []struct {
				PhysicalLocation sarifPhysical
			}
			PartialFingerprints map[string]string
			Fixes               []struct {
				Description     struct{ Text string }
				ArtifactChanges []struct {
					ArtifactLocation sarifArtifact
					Replacements     []struct {
						DeletedRegion   sarifRegion
						InsertedContent struct{ Text string }
					}
				}
			}
		}
	}
}

type sarifPhysical struct {
	ArtifactLocation sarifArtifact
	Region           sarifRegion
}

type sarifArtifact struct {
	URI       string
	URIBaseID string `json:"uriBaseId"`
}

type sarifRegion struct{ StartLine, StartColumn, EndLine, EndColumn int }

// validateSARIF checks log against the OASIS SARIF 2.1.0 JSON schema
// (testdata/sarif; draft-07, formats such as uri asserted).
func validateSARIF(t *testing.T, log string) error {
	t.Helper()
	sch, err := jsonschema.NewCompiler().Compile(filepath.Join("..", "..", "testdata", "sarif", "sarif-schema-2.1.0.json"))
	require.NoError(t, err)
	inst, err := jsonschema.UnmarshalJSON(strings.NewReader(log))
	require.NoError(t, err)
	return sch.Validate(inst)
}

func TestSARIF(t *testing.T) {
	t.Parallel()
	repo := t.TempDir()
	mod := filepath.Join(repo, "kiln") // the module sits below the repository root
	require.NoError(t, os.CopyFS(mod, os.DirFS(filepath.Join("..", "..", "testdata", "e2e", "mod"))))
	write(t, mod, "roundoff.yaml", "analyzers:\n  exacteq:\n    level: error\n")
	gitInit(t, repo)

	stdout, stderr, code := run(t, mod, tool, "-format", "sarif", "./...")
	require.Equal(t, 0, code, stderr) // findings are in the log, as with -json
	require.NoError(t, validateSARIF(t, stdout))
	var log sarifLog
	require.NoError(t, json.Unmarshal([]byte(stdout), &log))
	require.Len(t, log.Runs, 1)
	r := log.Runs[0]

	var ids []string
	for _, rule := range r.Tool.Driver.Rules {
		ids = append(ids, rule.ID)
		if rule.ID == "exacteq" {
			assert.Equal(t, "exact equality on floating-point values that carry rounding error", rule.ShortDescription.Text)
			assert.Contains(t, rule.FullDescription.Text, "IEEE 754-2019")
			assert.True(t, strings.HasSuffix(rule.HelpURI, "/docs/exacteq.md"), rule.HelpURI)
			assert.Equal(t, "error", rule.DefaultConfiguration.Level)
		}
	}
	assert.Contains(t, ids, "exacteq")
	assert.Contains(t, ids, "reviewmark")
	assert.Equal(t, "file://"+filepath.ToSlash(repo)+"/", r.OriginalURIBaseIDs["SRCROOT"].URI)

	require.Len(t, r.Results, 3)
	nan := r.Results[0]
	assert.Equal(t, "exacteq", nan.RuleID)
	assert.Equal(t, "error", nan.Level)
	assert.True(t, strings.HasPrefix(nan.Message.Text, nanMsg))
	loc := nan.Locations[0].PhysicalLocation
	assert.Equal(t, sarifArtifact{"kiln/ramp/ramp.go", "SRCROOT"}, loc.ArtifactLocation)
	assert.Equal(t, sarifRegion{18, 5, 18, 26}, loc.Region)
	require.Len(t, nan.Fixes, 1)
	fix := nan.Fixes[0]
	assert.Equal(t, "Replace with math.IsNaN(reading)", fix.Description.Text)
	require.Len(t, fix.ArtifactChanges, 1)
	assert.Equal(t, sarifArtifact{"kiln/ramp/ramp.go", "SRCROOT"}, fix.ArtifactChanges[0].ArtifactLocation)
	rep := fix.ArtifactChanges[0].Replacements[0]
	assert.Equal(t, sarifRegion{18, 5, 18, 26}, rep.DeletedRegion)
	assert.Equal(t, "math.IsNaN(reading)", rep.InsertedContent.Text)
	soak := r.Results[2]
	require.Len(t, soak.Fixes, 1)
	require.Len(t, soak.Fixes[0].ArtifactChanges[0].Replacements, 2, "the import of math and the comparison")

	// Fingerprints survive lines inserted above the findings.
	before := map[string]int{}
	for _, res := range r.Results {
		require.Len(t, res.PartialFingerprints, 1)
		for _, fp := range res.PartialFingerprints {
			before[fp] = res.Locations[0].PhysicalLocation.Region.StartLine
		}
	}
	require.Len(t, before, 3, "distinct fingerprints")
	edit(t, mod, "ramp/ramp.go", "// Check rejects", "// Peak is the hottest setting.\nconst Peak = 1300\n\n// Check rejects")
	edit(t, mod, "ramp/soak.go", "package ramp\n", "package ramp\n\n// Soak time in minutes.\nconst soakMinutes = 20\n")
	stdout, _, _ = run(t, mod, tool, "-format", "sarif", "./...")
	var after sarifLog
	require.NoError(t, json.Unmarshal([]byte(stdout), &after))
	require.Len(t, after.Runs[0].Results, 3)
	for _, res := range after.Runs[0].Results {
		for _, fp := range res.PartialFingerprints {
			require.Contains(t, before, fp)
			assert.Equal(t, before[fp]+3, res.Locations[0].PhysicalLocation.Region.StartLine)
		}
	}
}

// The validator must reject what the schema forbids, or the test above
// proves nothing.
func TestSARIFValidatorRejects(t *testing.T) {
	t.Parallel()
	for name, log := range map[string]string{
		"no version":       `{"runs": []}`,
		"relative helpUri": `{"version": "2.1.0", "runs": [{"tool": {"driver": {"name": "r", "rules": [{"id": "x", "helpUri": "docs/x.md"}]}}}]}`,
		"bad level":        `{"version": "2.1.0", "runs": [{"tool": {"driver": {"name": "r"}}, "results": [{"message": {"text": "m"}, "level": "fatal"}]}]}`,
	} {
		assert.Error(t, validateSARIF(t, log), name)
	}
}

func TestGitHubAnnotations(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	write(t, dir, "ramp/probe,v2.go", probeSrc) // a comma in the path is escaped
	write(t, dir, "roundoff.yaml", "analyzers:\n  exacteq:\n    level: note\n")
	stdout, stderr, code := run(t, dir, tool, "-format", "github", "./ramp")
	assert.Equal(t, 3, code, stderr)
	lines := strings.Split(strings.TrimSuffix(stdout, "\n"), "\n")
	require.Len(t, lines, 4, stdout)
	assert.Equal(t, "::notice file=ramp/probe%2Cv2.go,line=7,col=9,endLine=7,endColumn=24,title=roundoff exacteq::"+
		"comparison with math.NaN() is always false: NaN is unequal to every value, itself included; test with math.IsNaN", lines[0])
	assert.True(t, strings.HasPrefix(lines[1], "::notice file=ramp/ramp.go,line=18,col=5,"), lines[1])
}

func TestSinceChangedLines(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	base := gitInit(t, dir)

	// Committed since base: a new file, a hazard added to an existing file.
	write(t, dir, "ramp/probe.go", probeSrc)
	edit(t, dir, "ramp/ramp.go", "\treturn steps\n}\n", "\treturn steps\n}\n\n// Idle reports an unset setpoint.\nfunc Idle(sp float64) bool { return sp == math.NaN() }\n")
	commitAll(t, dir, "probe")
	// In the work tree: an untracked file, a pure rename (its old hazard
	// is not new), a rename with a hazard added, a deletion.
	write(t, dir, "ramp/fresh.go", strings.ReplaceAll(probeSrc, "Probe", "Fresh"))
	mustRun(t, dir, "git", "mv", "ramp/soak.go", "ramp/dwell.go")
	mustRun(t, dir, "git", "mv", "units/units.go", "units/convert.go")
	edit(t, dir, "units/convert.go", "package units\n", "package units\n\nimport \"math\"\n\n// Unset reports a missing reading.\nfunc Unset(f float64) bool { return f == math.NaN() }\n")
	mustRun(t, dir, "git", "rm", "-q", "main.go")

	// From a subdirectory, as a developer in it would.
	stdout, stderr, code := run(t, filepath.Join(dir, "ramp"), tool, "-since", base, "../...")
	stdout = "\n" + stdout
	assert.Equal(t, 3, code, stderr)
	got := findingLines(stdout)
	assert.Len(t, got, 4, stdout)
	// Paths are relative to the current directory, absolute outside it.
	for _, want := range []string{"\nfresh.go:7:9: exacteq: ", "\nprobe.go:7:9: exacteq: ", "\nramp.go:37:37: exacteq: ", "/units/convert.go:8:37: exacteq: "} {
		assert.Equal(t, 1, strings.Count(stdout, want), "want %s in\n%s", want, stdout)
	}
	assert.NotContains(t, stdout, "ramp.go:18:")
	assert.NotContains(t, stdout, "dwell.go")

	// Nothing changed since HEAD but the work tree's edits.
	commitAll(t, dir, "all")
	stdout, stderr, code = run(t, dir, tool, "-since", "HEAD", "./...")
	assert.Equal(t, 0, code, stderr)
	assert.Empty(t, stdout)
}

func TestBaseline(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	_, stderr, code := run(t, dir, tool, "-write-baseline", "roundoff-baseline.txt", "./...")
	require.Equal(t, 0, code, stderr)
	assert.Contains(t, stderr, "recorded 3 findings in roundoff-baseline.txt")
	assert.True(t, strings.HasPrefix(read(t, dir, "roundoff-baseline.txt"), "roundoff baseline 1\n"))

	stdout, stderr, code := run(t, dir, tool, "-baseline", "roundoff-baseline.txt", "./...")
	assert.Equal(t, 0, code, stderr)
	assert.Empty(t, stdout+stderr)

	// Lines inserted above every finding: still hidden.
	edit(t, dir, "ramp/ramp.go", "import (", "// Lines inserted to shift the findings.\n\nimport (")
	edit(t, dir, "ramp/soak.go", "package ramp\n", "package ramp\n\n// Soak time in minutes.\nconst soakMinutes = 20\n")
	stdout, stderr, code = run(t, dir, tool, "-baseline", "roundoff-baseline.txt", "./...")
	assert.Equal(t, 0, code, stderr)
	assert.Empty(t, stdout+stderr)

	// A new hazard shows; a fixed one leaves a stale entry, summarised.
	write(t, dir, "ramp/probe.go", probeSrc)
	edit(t, dir, "ramp/ramp.go", "if reading == math.NaN() {", "if math.IsNaN(reading) {")
	stdout, stderr, code = run(t, dir, tool, "-baseline", "roundoff-baseline.txt", "./...")
	assert.Equal(t, 3, code)
	assert.Equal(t, []string{"ramp/probe.go:7:9: exacteq: " + nanMsg + ": NaN is unequal to every value, itself included; test with math.IsNaN"}, findingLines(stdout))
	assert.Equal(t, "roundoff: 1 of the 3 entries of baseline roundoff-baseline.txt matches no finding any more (ramp/ramp.go: 1); rewrite it with -write-baseline roundoff-baseline.txt\n", stderr)

	// Rewriting the baseline is allowed; overwriting a source file is not.
	_, stderr, code = run(t, dir, tool, "-write-baseline", "roundoff-baseline.txt", "./...")
	assert.Equal(t, 0, code, stderr)
	before := read(t, dir, "ramp/soak.go")
	_, stderr, code = run(t, dir, tool, "-write-baseline", "ramp/soak.go", "./...")
	assert.Equal(t, 1, code)
	assert.Equal(t, "roundoff: -write-baseline ramp/soak.go: the file exists and is not a roundoff baseline; refusing to overwrite it\n", stderr)
	assert.Equal(t, before, read(t, dir, "ramp/soak.go"))
}

func TestSuppression(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	edit(t, dir, "ramp/ramp.go", "\tif reading == math.NaN() {", "\t//roundoff:reviewed exacteq the thermocouple driver signals faults out of band\n\tif reading == math.NaN() {")
	edit(t, dir, "ramp/soak.go", "\treturn share == 0.3", "\t//roundoff:reviewed exacteq\n\treturn share == 0.3")
	edit(t, dir, "units/units.go", "\tif alpha == 1 {", "\t//roundoff:reviewed exacteq alpha is set, never computed\n\tif alpha == 1 {")

	stdout, stderr, code := run(t, dir, tool, "./...")
	assert.Equal(t, 3, code, stderr)
	assert.Equal(t, []string{
		"ramp/ramp.go:28:19: exacteq: " + loopMsg + " (it passes from 0.9999999999999999 to 1.0999999999999999), so the loop never stops; stop with an ordered test half a step short of the bound instead",
		"ramp/soak.go:8:2: reviewmark: review directive for exacteq gives no reason, so it suppresses nothing; say after the names why the hazard is acceptable",
		"ramp/soak.go:9:9: exacteq: " + literalMsg + ", which float64 stores as 0.2999999999999999888977697537484345...: one rounding error (ulp 5.55e-17 there) makes the test fail; compare within a tolerance such as 1e-9 relative",
	}, findingLines(stdout))

	// On request, directives that suppress nothing are reported too.
	stdout, _, _ = run(t, dir, tool, "-stale-reviews", "./...")
	assert.Contains(t, stdout, "units/units.go:10:2: reviewmark: review directive for exacteq suppresses no finding on its line or the next; remove exacteq from it\n")
	assert.Len(t, findingLines(stdout), 4, stdout)

	// The same filtering under go vet, which runs roundoff per package.
	_, stderr, code = run(t, dir, "go", "vet", "-vettool="+tool, "./...")
	assert.NotEqual(t, 0, code)
	assert.NotContains(t, stderr, nanMsg)
	assert.Contains(t, stderr, "ramp/soak.go:8:2: review directive for exacteq gives no reason")
	assert.Contains(t, stderr, literalMsg)
}

func TestConfigFile(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	write(t, dir, "roundoff.yaml", "# kiln lab settings\nanalyzers:\n  exacteq:\n    level: note\nexclude:\n  - ramp/soak.go\n")
	stdout, stderr, code := run(t, dir, tool, "./...")
	assert.Equal(t, 3, code, stderr)
	assert.Len(t, findingLines(stdout), 2, stdout)
	assert.NotContains(t, stdout, "soak.go")
	_, stderr, _ = run(t, dir, "go", "vet", "-vettool="+tool, "./...")
	assert.Contains(t, stderr, nanMsg)
	assert.NotContains(t, stderr, "soak.go", "excluded under go vet too")

	stdout, stderr, code = run(t, dir, tool, "config")
	assert.Equal(t, 0, code, stderr)
	assert.Contains(t, stdout, "# effective configuration, read from roundoff.yaml\n")
	assert.Contains(t, stdout, "  exacteq:\n    enabled: true\n    level: note\n")
	assert.Contains(t, stdout, "  reviewmark:\n    enabled: true\n    level: warning\n")
	assert.Contains(t, stdout, "exclude:\n  - ramp/soak.go\n")

	// Turned off in the file, on again by name on the command line.
	write(t, dir, "roundoff.yaml", "analyzers:\n  exacteq:\n    enabled: false\n")
	stdout, stderr, code = run(t, dir, tool, "./...")
	assert.Equal(t, 0, code, stderr)
	assert.Empty(t, stdout)
	stdout, _, code = run(t, dir, tool, "-exacteq", "./...")
	assert.Equal(t, 3, code)
	assert.Len(t, findingLines(stdout), 3)
	_, stderr, _ = run(t, dir, "go", "vet", "-vettool="+tool, "./...")
	assert.NotContains(t, stderr, nanMsg)

	// Mistakes name the file and line, in every mode.
	write(t, dir, "roundoff.yaml", "analyzers:\n  exacteq:\n    levle: note\n")
	const want = `roundoff.yaml:3: unknown key "levle" in analyzer exacteq (want enabled, level)`
	for _, args := range [][]string{{tool, "./..."}, {tool, "config"}, {"go", "vet", "-vettool=" + tool, "./..."}} {
		_, stderr, code = run(t, dir, args[0], args[1:]...)
		assert.NotEqual(t, 0, code, args)
		assert.Contains(t, stderr, want, args)
	}
}

func TestHook(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	gitInit(t, dir)
	hook := filepath.Join(dir, ".git", "hooks", "pre-commit")
	const foreign = "#!/bin/sh\necho checking commit message style\n"
	require.NoError(t, os.WriteFile(hook, []byte(foreign), 0o755))

	_, stderr, code := run(t, dir, tool, "hook", "install")
	assert.Equal(t, 1, code)
	assert.Contains(t, stderr, "was not installed by roundoff; rerun with -force")
	assert.Equal(t, foreign, read(t, dir, ".git/hooks/pre-commit"))

	_, stderr, code = run(t, dir, tool, "hook", "install", "-force")
	require.Equal(t, 0, code, stderr)
	assert.Equal(t, foreign, read(t, dir, ".git/hooks/pre-commit.saved-by-roundoff"))
	assert.Contains(t, read(t, dir, ".git/hooks/pre-commit"), "# roundoff pre-commit hook")
	_, stderr, code = run(t, dir, tool, "hook", "install") // again: ours, replaced
	assert.Equal(t, 0, code, stderr)

	// A commit that adds a hazard is stopped; the report names only it.
	head := mustRun(t, dir, "git", "rev-parse", "HEAD")
	write(t, dir, "ramp/probe.go", probeSrc)
	mustRun(t, dir, "git", "add", "ramp/probe.go")
	env, _ := onPath(t)
	stdout, stderr, code := runEnv(t, dir, env, "git", "commit", "-q", "-m", "probe")
	assert.NotEqual(t, 0, code)
	out := stdout + stderr
	assert.Contains(t, out, "ramp/probe.go:7:9: exacteq: "+nanMsg)
	assert.NotContains(t, out, "ramp/ramp.go", "old hazards on unchanged lines are not the commit's")
	assert.Contains(t, out, "commit stopped")
	assert.Equal(t, head, mustRun(t, dir, "git", "rev-parse", "HEAD"))

	// A commit that touches a file with old hazards, not on their lines, passes.
	mustRun(t, dir, "git", "rm", "-q", "--cached", "ramp/probe.go")
	require.NoError(t, os.Remove(filepath.Join(dir, "ramp", "probe.go")))
	edit(t, dir, "ramp/ramp.go", "// Package ramp plans", "// Package ramp plans, for the lab,")
	stdout, stderr, code = runEnv(t, dir, env, "git", "commit", "-q", "-am", "doc")
	require.Equal(t, 0, code, stdout+stderr)

	_, stderr, code = run(t, dir, tool, "hook", "uninstall")
	assert.Equal(t, 0, code, stderr)
	assert.Equal(t, foreign, read(t, dir, ".git/hooks/pre-commit"), "the saved hook is back")
	_, err := os.Stat(hook + ".saved-by-roundoff")
	assert.True(t, os.IsNotExist(err))
	_, stderr, code = run(t, dir, tool, "hook", "uninstall")
	assert.Equal(t, 1, code)
	assert.Contains(t, stderr, "was not installed by roundoff; leaving it")
	assert.Equal(t, foreign, read(t, dir, ".git/hooks/pre-commit"))
}

// Bad input gets one clear line on standard error and status 1, and no
// file changes.
func TestBadInput(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		name  string
		args  []string
		setup func(dir string)
		want  string
	}{
		{"bad format", []string{"-format", "xml", "./..."}, nil, `roundoff: -format "xml": want one of text, json, sarif, github`},
		{"json and sarif", []string{"-json", "-format", "sarif", "./..."}, nil, "roundoff: -json contradicts -format sarif"},
		{"unknown flag", []string{"-exacteqq", "./..."}, nil, "roundoff: flag provided but not defined: -exacteqq"},
		{"bad analyzer flag", []string{"-exacteq=maybe", "./..."}, nil, `roundoff: invalid boolean value "maybe" for -exacteq: want true or false`},
		{"fix with sarif", []string{"-fix", "-format", "sarif", "./..."}, nil, "roundoff: -fix and -diff apply or show fixes and print no findings: drop -format sarif"},
		{"no packages", nil, nil, "roundoff: no packages to lint; name them as for go build, such as ./..."},
		{"missing package", []string{"./nowhere"}, nil, "nowhere: directory not found"},
		{"since outside git", []string{"-since", "main", "./..."}, nil, "is not inside a git work tree"},
		{"unknown revision", []string{"-since", "no-such-branch", "./..."}, func(dir string) { gitInit(t, dir) }, `roundoff: -since no-such-branch: unknown git revision "no-such-branch"`},
		{"missing baseline", []string{"-baseline", "accepted.txt", "./..."}, nil, "roundoff: -baseline accepted.txt: no such file; create it with -write-baseline accepted.txt"},
		{"corrupt baseline", []string{"-baseline", "accepted.txt", "./..."}, func(dir string) { write(t, dir, "accepted.txt", "roundoff baseline 1\nexacteq ramp/ramp.go\n") },
			"roundoff: accepted.txt:2: malformed baseline entry"},
		{"baseline over source", []string{"-write-baseline", "main.go", "./..."}, nil, "refusing to overwrite it"},
		{"baseline in a missing directory", []string{"-write-baseline", "nodir/b.txt", "./..."}, nil, "roundoff: -write-baseline nodir/b.txt: no such file or directory\n"}, // no temporary file name
		{"write and read baseline", []string{"-write-baseline", "b.txt", "-baseline", "b.txt", "./..."}, nil, "roundoff: -write-baseline records every current finding"},
		{"missing config", []string{"-config", "lab.yaml", "./..."}, nil, "roundoff: -config lab.yaml: no such file"},
		{"corrupt config", []string{"./..."}, func(dir string) { write(t, dir, "roundoff.yaml", "analyzers:\n  exacteq: [\n") }, "roundoff: roundoff.yaml:2: not valid YAML"},
		{"bad hook command", []string{"hook", "reinstall"}, nil, "roundoff: usage: roundoff hook install [-force] | uninstall | run"},
		{"hook outside git", []string{"hook", "install"}, nil, "is not inside a git work tree"},
	} {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			dir := fixture(t, "mod")
			if c.setup != nil {
				c.setup(dir)
			}
			before := snapshot(t, dir)
			stdout, stderr, code := run(t, dir, tool, c.args...)
			assert.Equal(t, 1, code, stdout+stderr)
			assert.Contains(t, stderr, c.want)
			assert.Equal(t, 1, strings.Count(stderr, "\n"), "one line: %s", stderr)
			assert.NotContains(t, stdout+stderr, "panic")
			assert.Equal(t, before, snapshot(t, dir))
		})
	}
}

func TestSubcommands(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	stdout, stderr, code := run(t, dir, tool, "help")
	assert.Equal(t, 0, code, stderr)
	assert.Contains(t, stdout, "roundoff hook install [-force]")
	assert.Contains(t, stdout, "  reviewmark     review directives that suppress nothing or name no reason\n")
	stdout, _, code = run(t, dir, tool, "help", "reviewmark")
	assert.Equal(t, 0, code)
	assert.True(t, strings.HasPrefix(stdout, "reviewmark: review directives that suppress nothing or name no reason\n"), stdout)
	// The hook offered to hook managers runs the command the installed
	// hook runs.
	var hooks []struct{ ID, Entry, Language string }
	data, err := os.ReadFile(filepath.Join("..", "..", ".pre-commit-hooks.yaml"))
	require.NoError(t, err)
	require.NoError(t, yaml.Unmarshal(data, &hooks))
	require.Len(t, hooks, 1)
	assert.Equal(t, "roundoff", hooks[0].ID)
	assert.Equal(t, "roundoff hook run", hooks[0].Entry)
	assert.Equal(t, "golang", hooks[0].Language)
	// Such a manager installs every main package of the module (go
	// install ./...): that must be the roundoff command alone.
	stdout, stderr, code = run(t, filepath.Join("..", ".."), "go", "list", "-f", `{{if eq .Name "main"}}{{.ImportPath}}{{end}}`, "./...")
	require.Equal(t, 0, code, stderr)
	assert.Equal(t, "roundoff/cmd/roundoff\n", stdout)
	// The limits calculator is its own package; here only the dispatch.
	stdout, stderr, code = run(t, dir, tool, "limits", "1")
	assert.Equal(t, 0, code, stderr)
	assert.Contains(t, stdout, "machine epsilon")
}

// Two fixes that edit the same bytes: the second is skipped, said so, and
// applied by the next run on the updated file.
func TestFixConflict(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	write(t, dir, "go.mod", "module gainlab\n\ngo 1.26\n")
	write(t, dir, "gain/gain.go", "package gain\n\nimport \"math\"\n\n// Hits reports whether the log gain hits the design value.\nfunc Hits(x float64) bool {\n\treturn math.Sqrt(math.Log(1+x)) == 0.3\n}\n")
	stdout, stderr, code := run(t, dir, tool, "./...")
	require.Equal(t, 3, code, stderr)
	require.Len(t, findingLines(stdout), 2, "two findings at one expression: %s", stdout)

	_, stderr, code = run(t, dir, tool, "-fix", "./...")
	assert.Equal(t, 0, code, stderr)
	assert.Contains(t, stderr, "gain/gain.go:7:19: skipped the fix")
	assert.Contains(t, stderr, "it overlaps another fix; run roundoff -fix again to apply it")
	first := read(t, dir, "gain/gain.go")
	assert.NotContains(t, first, "math.Sqrt(math.Log(1+x)) == 0.3")

	_, stderr, code = run(t, dir, tool, "-fix", "./...")
	assert.Equal(t, 0, code, stderr)
	assert.NotContains(t, stderr, "skipped")
	assert.NotEqual(t, first, read(t, dir, "gain/gain.go"))
	_, stderr, code = run(t, dir, "go", "build", "./...")
	assert.Equal(t, 0, code, stderr)
	stdout, _, code = run(t, dir, tool, "./...")
	assert.Equal(t, 0, code, stdout)
	for rel := range snapshot(t, dir) {
		assert.NotContains(t, rel, ".roundoff-", "a temporary file of the atomic write was left")
	}
}

// A package with a type error is reported as an error (status 1) while
// the packages that load are linted all the same.
func TestBrokenPackageAmongGood(t *testing.T) {
	t.Parallel()
	dir := fixture(t, "mod")
	write(t, dir, "vent/vent.go", "package vent\n\n// Open is the damper setting.\nvar Open float64 = \"wide\"\n")
	stdout, stderr, code := run(t, dir, tool, "./...")
	assert.Equal(t, 1, code)
	assert.Contains(t, stderr, "vent/vent.go:4:20: cannot use \"wide\" (untyped string constant) as float64 value")
	assertHazards(t, stdout, standaloneHazards)
	assert.NotContains(t, stdout+stderr, "panic")
}
