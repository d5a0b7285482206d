package noise

import (
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

const directive = "//roundoff:noise 3e-07 measured by roundoff noise at x = 2"

// The directive goes into the doc comment and nothing else changes: after
// an existing doc with a blank comment line between, before a declaration
// without doc, in place of an existing directive; CRLF files keep CRLF.
func TestEdit(t *testing.T) {
	for name, c := range map[string]struct{ src, want string }{
		"doc": {
			"package p\n\n// F is f.\nfunc F(x float64) float64 { return x }\n",
			"package p\n\n// F is f.\n//\n" + directive + "\nfunc F(x float64) float64 { return x }\n",
		},
		"no doc": {
			"package p\n\nfunc F(x float64) float64 { return x }\n",
			"package p\n\n" + directive + "\nfunc F(x float64) float64 { return x }\n",
		},
		"existing": {
			"package p\n\n// F is f.\n//\n//roundoff:noise 1e-3 a guess\nfunc F(x float64) float64 { return x }\n",
			"package p\n\n// F is f.\n//\n" + directive + "\nfunc F(x float64) float64 { return x }\n",
		},
		"crlf": {
			"package p\r\n\r\n// F is f.\r\nfunc F(x float64) float64 { return x }\r\n",
			"package p\r\n\r\n// F is f.\r\n//\r\n" + directive + "\r\nfunc F(x float64) float64 { return x }\r\n",
		},
	} {
		s := sourceOf(t, c.src)
		require.NoError(t, s.write(directive), name)
		got, err := os.ReadFile(s.path)
		require.NoError(t, err)
		assert.Equal(t, c.want, string(got), name)
	}
}

// A file changed after it was read is left alone.
func TestWriteRefusesChangedFile(t *testing.T) {
	s := sourceOf(t, "package p\n\nfunc F(x float64) float64 { return x }\n")
	changed := "package p\n\nfunc F(x float64) float64 { return 2 * x }\n"
	require.NoError(t, os.WriteFile(s.path, []byte(changed), 0o644))
	assert.ErrorContains(t, s.write(directive), "changed since roundoff noise read it")
	got, _ := os.ReadFile(s.path)
	assert.Equal(t, changed, string(got))
}

// sourceOf writes src to a file and reads it as -write does.
func sourceOf(t *testing.T, src string) *source {
	t.Helper()
	file := filepath.Join(t.TempDir(), "p.go")
	require.NoError(t, os.WriteFile(file, []byte(src), 0o644))
	s, err := readSource(&target{name: "F", file: file})
	require.NoError(t, err)
	return s
}
