package driver

import (
	"cmp"
	"fmt"
	"go/format"
	"os"
	"path/filepath"
	"slices"
)

// applyFixes applies, or with diff shows, the first fix of every finding.
// A fix whose edits overlap those of a fix already taken is skipped, and
// said so; a file whose fixed form does not parse is left alone. Files
// are written atomically.
func (e *env) applyFixes(findings []*finding, diff bool) int {
	byFile := map[string][]edit{}
	nfixes := 0
	for _, f := range findings {
		if len(f.fixes) == 0 {
			continue
		}
		fx := f.fixes[0]
		if clash(byFile, fx.edits) {
			fmt.Fprintf(e.stderr, "roundoff: %s: skipped the fix %q for this %s finding: it overlaps another fix; run roundoff -fix again to apply it\n",
				e.position(f.posn), fx.message, f.analyzer.Name)
			continue
		}
		for _, ed := range fx.edits {
			if !slices.Contains(byFile[ed.file], ed) { // the same import added twice is one edit
				byFile[ed.file] = append(byFile[ed.file], ed)
			}
		}
		nfixes++
	}
	code := exitClean
	var files []string
	for file := range byFile {
		files = append(files, file)
	}
	slices.Sort(files)
	for _, file := range files {
		if err := e.fixFile(file, byFile[file], diff); err != nil {
			code = e.errorf("%s: %v", e.display(file), err)
		}
	}
	if !diff && nfixes > 0 {
		fmt.Fprintf(e.stderr, "roundoff: applied %d fixes to %d files\n", nfixes, len(files))
	}
	return code
}

// clash reports whether edits overlap an edit already taken: they share
// bytes, one inserts strictly inside the other's range, or two different
// texts are inserted at one point.
func clash(taken map[string][]edit, edits []edit) bool {
	for _, a := range edits {
		for _, b := range taken[a.file] {
			switch {
			case a == b:
			case a.start < b.end && b.start < a.end:
				return true
			case a.start == a.end && b.start == b.end && a.start == b.start:
				return true
			}
		}
	}
	return false
}

// fixFile applies edits to file and writes the gofmt-ed result, or
// prints it as a unified diff.
func (e *env) fixFile(file string, edits []edit, diff bool) error {
	old, err := os.ReadFile(file)
	if err != nil {
		return err
	}
	// Insertions at a point go before a replacement starting there.
	slices.SortStableFunc(edits, func(a, b edit) int { return cmp.Or(cmp.Compare(a.start, b.start), cmp.Compare(a.end, b.end)) })
	var out []byte
	at := 0
	for _, ed := range edits {
		if ed.start < at || ed.end > len(old) {
			return fmt.Errorf("fix edits out of range; file changed since it was read?")
		}
		out = append(append(out, old[at:ed.start]...), ed.text...)
		at = ed.end
	}
	out = append(out, old[at:]...)
	formatted, err := format.Source(out)
	if err != nil {
		return fmt.Errorf("the fixes do not give valid Go (%v); file left unchanged", err)
	}
	if diff {
		name := filepath.ToSlash(e.display(file))
		_, err := e.stdout.Write(unifiedDiff("a/"+name, "b/"+name, string(old), string(formatted)))
		return err
	}
	return writeAtomic(file, formatted)
}

// writeAtomic replaces the file at path with data: it writes a temporary
// file in the same directory and renames it over path, so that readers
// and crashes see the old contents or the new, never a mix. The file
// keeps its permissions.
func writeAtomic(path string, data []byte) (err error) {
	mode := os.FileMode(0o644)
	if info, err := os.Stat(path); err == nil {
		mode = info.Mode().Perm()
	}
	tmp, err := os.CreateTemp(filepath.Dir(path), "."+filepath.Base(path)+".roundoff-*")
	if err != nil {
		return err
	}
	defer func() {
		if err != nil {
			os.Remove(tmp.Name())
		}
	}()
	if _, err := tmp.Write(data); err != nil {
		tmp.Close()
		return err
	}
	if err := tmp.Sync(); err != nil {
		tmp.Close()
		return err
	}
	if err := tmp.Close(); err != nil {
		return err
	}
	if err := os.Chmod(tmp.Name(), mode); err != nil {
		return err
	}
	return os.Rename(tmp.Name(), path)
}
