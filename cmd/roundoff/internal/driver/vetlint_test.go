package driver

import (
	"bytes"
	"go/token"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/analysis"
)

// The JSON that go vet -json prints is one diagnostic tree per package,
// as unitchecker writes it: package ID → analyzer → diagnostics, or an
// object with the analyzer's error.
func TestReadVetJSON(t *testing.T) {
	dir := t.TempDir()
	file := filepath.Join(dir, "a:b", "gain.go") // a colon in the path
	require.NoError(t, os.MkdirAll(filepath.Dir(file), 0o755))
	require.NoError(t, os.WriteFile(file, []byte("package gain\n\nvar g = 0.1\n"), 0o644))
	posn := file + ":3:9"
	stream := `{}
{"gain": {"exacteq": [{"category": "literal", "posn": "` + posn + `", "end": "` + file + `:3:12", "message": "exact"}]}}
{"gain [gain.test]": {"exacteq": [{"posn": "` + posn + `", "message": "exact"}], "other": [{"posn": "` + posn + `", "message": "not ours"}]}}
{"broken": {"exacteq": {"error": "internal failure"}}}
`
	var stderr bytes.Buffer
	e := &env{analyzers: []*analysis.Analyzer{{Name: "exacteq"}}, stderr: &stderr, cwd: dir}
	r := &report{src: sources{}}
	require.NoError(t, e.readVetJSON(r, strings.NewReader(stream)))

	require.Len(t, r.findings, 1, "the test variant's copy is dropped, the unknown analyzer ignored")
	f := r.findings[0]
	assert.Equal(t, "exacteq", f.analyzer.Name)
	assert.Equal(t, "literal", f.diag.Category)
	assert.Equal(t, file, f.posn.Filename)
	assert.Equal(t, 3, f.posn.Line)
	assert.Equal(t, len("package gain\n\nvar g = "), f.posn.Offset)
	assert.Equal(t, f.posn.Offset+3, f.end.Offset)
	assert.True(t, r.failed)
	assert.Equal(t, "roundoff: exacteq on broken: internal failure\n", stderr.String())
}

func TestVetPosition(t *testing.T) {
	src := sources{}
	assert.Equal(t, token.Position{}, src.position(""))
	assert.Equal(t, token.Position{}, src.position("gain.go:x:1"))
	assert.Equal(t, 4, src.position(`C:\w\gain.go:4:2`).Line)
}
