package driver

import (
	"bytes"
	"encoding/json"
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"

	"github.com/santhosh-tekuri/jsonschema/v6"
	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/analysis"
)

// twoPlaces is a test analyzer whose findings have two places: every
// comparison x < c with a named constant c is reported at the comparison,
// with the place where c's value is written as related information.
var twoPlaces = &analysis.Analyzer{
	Name: "twoplaces",
	Doc:  "twoplaces: comparisons with a named tolerance, shown where the value is written too",
	Run: func(pass *analysis.Pass) (any, error) {
		for _, f := range pass.Files {
			ast.Inspect(f, func(n ast.Node) bool {
				b, ok := n.(*ast.BinaryExpr)
				if !ok || b.Op != token.LSS {
					return true
				}
				id, _ := b.Y.(*ast.Ident)
				if c, ok := pass.TypesInfo.Uses[id].(*types.Const); ok {
					pass.Report(analysis.Diagnostic{Pos: b.Pos(), End: b.End(), Message: fmt.Sprintf("comparison with tolerance %s = %s", id.Name, c.Val()),
						Related: []analysis.RelatedInformation{{Pos: c.Pos(), End: c.Pos() + token.Pos(len(id.Name)), Message: "tolerance " + id.Name + " written here"}}})
				}
				return true
			})
		}
		return nil, nil
	},
}

// gateModule writes a module whose one finding has its related place in
// another file, and returns its directory.
func gateModule(t *testing.T) string {
	dir := t.TempDir()
	for name, src := range map[string]string{
		"go.mod":       "module gatelab\n\ngo 1.26\n",
		"gate/tol.go":  "package gate\n\nconst tol = 1e-30\n",
		"gate/gate.go": "package gate\n\n// Shut reports a closed gate.\nfunc Shut(gap float64) bool {\n\treturn gap < tol\n}\n",
	} {
		require.NoError(t, os.MkdirAll(filepath.Join(dir, filepath.Dir(name)), 0o755))
		require.NoError(t, os.WriteFile(filepath.Join(dir, name), []byte(src), 0o644))
	}
	return dir
}

// lintTwoPlaces runs the standalone linter with twoPlaces in dir.
func lintTwoPlaces(t *testing.T, dir string, args ...string) (stdout, stderr string, code int) {
	t.Helper()
	var out, errb bytes.Buffer
	e := &env{analyzers: []*analysis.Analyzer{twoPlaces}, stdout: &out, stderr: &errb, cwd: dir}
	code = e.lintCmd(append(args, "./..."))
	return out.String(), errb.String(), code
}

// Related places appear in every output format.
func TestRelatedInEveryFormat(t *testing.T) {
	dir := gateModule(t)
	const msg = "comparison with tolerance tol = 1e-30"
	stdout, stderr, code := lintTwoPlaces(t, dir)
	require.Equal(t, exitFindings, code, stderr)
	assert.Equal(t, "gate/gate.go:5:9: twoplaces: "+msg+"\n    gate/tol.go:3:7: tolerance tol written here\n", stdout)

	stdout, _, _ = lintTwoPlaces(t, dir, "-json")
	var tree map[string]map[string][]jsonDiagnostic
	require.NoError(t, json.Unmarshal([]byte(stdout), &tree))
	d := tree["gatelab/gate"]["twoplaces"][0]
	require.Len(t, d.Related, 1)
	assert.Equal(t, jsonRelated{filepath.Join(dir, "gate", "tol.go") + ":3:7", filepath.Join(dir, "gate", "tol.go") + ":3:10", "tolerance tol written here"}, d.Related[0])

	stdout, _, _ = lintTwoPlaces(t, dir, "-format", "sarif")
	// SARIF 2.1.0 (OASIS), its JSON schema: relatedLocations are locations
	// (§3.27.22), each with an id and a message.
	sch, err := jsonschema.NewCompiler().Compile(filepath.Join("..", "..", "..", "..", "testdata", "sarif", "sarif-schema-2.1.0.json"))
	require.NoError(t, err)
	inst, err := jsonschema.UnmarshalJSON(strings.NewReader(stdout))
	require.NoError(t, err)
	require.NoError(t, sch.Validate(inst))
	var log sarifLog
	require.NoError(t, json.Unmarshal([]byte(stdout), &log))
	res := log.Runs[0].Results[0]
	require.Len(t, res.RelatedLocations, 1)
	rel := res.RelatedLocations[0]
	assert.Equal(t, sarifArtifactLoc{"gate/tol.go", srcRoot}, rel.PhysicalLocation.ArtifactLocation)
	assert.Equal(t, sarifRegion{3, 7, 3, 10}, rel.PhysicalLocation.Region)
	assert.Equal(t, "tolerance tol written here", rel.Message.Text)

	stdout, _, _ = lintTwoPlaces(t, dir, "-format", "github")
	assert.Equal(t, "::warning file=gate/gate.go,line=5,col=9,endLine=5,endColumn=18,title=roundoff twoplaces::"+msg+" (gate/tol.go:3: tolerance tol written here)\n", stdout)
}

// A baseline entry stands for both places: editing the related place
// (the tolerance's value) makes the finding new; editing elsewhere does
// not. -since reports a finding whose related place changed.
func TestRelatedInBaselineAndSince(t *testing.T) {
	dir := gateModule(t)
	_, stderr, code := lintTwoPlaces(t, dir, "-write-baseline", "accepted.txt")
	require.Equal(t, exitClean, code, stderr)
	stdout, stderr, code := lintTwoPlaces(t, dir, "-baseline", "accepted.txt")
	assert.Equal(t, exitClean, code, stdout+stderr)

	tol := filepath.Join(dir, "gate", "tol.go")
	require.NoError(t, os.WriteFile(tol, []byte("package gate\n\n// tol is the gap of a shut gate.\nconst tol = 1e-30\n"), 0o644))
	stdout, stderr, code = lintTwoPlaces(t, dir, "-baseline", "accepted.txt")
	assert.Equal(t, exitClean, code, stdout+stderr)

	for _, args := range [][]string{{"init", "-q"}, {"add", "-A"}, {"-c", "user.name=Gate Lab", "-c", "user.email=lab@gatelab.invalid", "commit", "-q", "-m", "start"}} {
		out, err := exec.Command("git", append([]string{"-C", dir}, args...)...).CombinedOutput()
		require.NoError(t, err, string(out))
	}
	stdout, _, code = lintTwoPlaces(t, dir, "-since", "HEAD")
	assert.Equal(t, exitClean, code, stdout)

	require.NoError(t, os.WriteFile(tol, []byte("package gate\n\n// tol is the gap of a shut gate.\nconst tol = 1e-40\n"), 0o644))
	stdout, _, code = lintTwoPlaces(t, dir, "-baseline", "accepted.txt")
	assert.Equal(t, exitFindings, code)
	assert.Contains(t, stdout, "gate/gate.go:5:9: twoplaces: comparison with tolerance tol = 1e-40\n")
	stdout, _, code = lintTwoPlaces(t, dir, "-since", "HEAD")
	assert.Equal(t, exitFindings, code, "the test's own line is unchanged, its tolerance is not")
	assert.Contains(t, stdout, "    gate/tol.go:4:7: tolerance tol written here\n")
}
