// Package testrun runs a Go source file as a program, for tests that check
// what a fix changes at run time.
package testrun

import (
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// Output copies one Go source file (a main package using only the standard
// library) into a scratch module, runs it and returns its standard output.
// The test fails if the program does not build or exits with an error.
func Output(t testing.TB, file string) string {
	t.Helper()
	dir := t.TempDir()
	src, err := os.ReadFile(file)
	if err != nil {
		t.Fatal(err)
	}
	for name, data := range map[string][]byte{"main.go": src, "go.mod": []byte("module runfix\n\ngo 1.26\n")} {
		if err := os.WriteFile(filepath.Join(dir, name), data, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	cmd := exec.Command("go", "run", ".")
	cmd.Dir = dir
	cmd.Env = append(os.Environ(), "GOFLAGS=", "GOTOOLCHAIN=local", "GOWORK=off")
	out, err := cmd.Output()
	if err != nil {
		t.Fatalf("running %s: %v", file, err)
	}
	return string(out)
}

// Values parses output made of lines "name value" into a map from name to
// the float value; the test fails on a line of another shape.
func Values(t testing.TB, out string) map[string]float64 {
	t.Helper()
	m := map[string]float64{}
	for line := range strings.Lines(out) {
		name, v, ok := strings.Cut(strings.TrimSpace(line), " ")
		f, err := strconv.ParseFloat(v, 64)
		if !ok || err != nil {
			t.Fatalf("output line %q is not \"name value\"", line)
		}
		m[name] = f
	}
	return m
}
