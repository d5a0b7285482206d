package driver

import (
	"bytes"
	"cmp"
	"errors"
	"fmt"
	"go/format"
	"go/parser"
	"go/token"
	"io/fs"
	"os"
	"path/filepath"
	"slices"
	"strings"
)

// applyFixes applies, or with diff shows, the first fix of every finding.
// A fix whose edits overlap those of a fix already taken is skipped, and
// said so, as is a fix that edits a generated file; a file whose fixed
// form does not parse is left alone.
func (e *env) applyFixes(r *report, diff bool) int {
	byFile := map[string][]edit{}
	perFile := map[string]int{} // fixes by the first file they edit
	for _, f := range r.findings {
		if len(f.fixes) == 0 {
			continue
		}
		fx := f.fixes[0]
		if why := r.refuse(fx, byFile); why != "" {
			fmt.Fprintf(e.stderr, "roundoff: %s: skipped the fix %q for this %s finding: %s\n",
				e.position(f.posn), fx.message, f.analyzer.Name, why)
			continue
		}
		for _, ed := range fx.edits {
			if !slices.Contains(byFile[ed.file], ed) { // the same import added twice is one edit
				byFile[ed.file] = append(byFile[ed.file], ed)
			}
		}
		perFile[fx.edits[0].file]++
	}
	code := exitClean
	var files []string
	for file := range byFile {
		files = append(files, file)
	}
	slices.Sort(files)
	nfixes, nfiles := 0, 0
	for _, file := range files {
		if err := e.fixFile(file, byFile[file], diff); err != nil {
			code = e.errorf("%s: %v", e.display(file), err)
			continue
		}
		nfixes += perFile[file]
		nfiles++
	}
	if !diff && nfixes > 0 {
		fmt.Fprintf(e.stderr, "roundoff: applied %s to %s\n", plural(nfixes, "fix", "fixes"), plural(nfiles, "file", "files"))
	}
	return code
}

// refuse says why fix fx is not applied, or returns "": it edits a file
// that is not a source file of the packages linted, or a generated one,
// or it overlaps a fix already taken.
func (r *report) refuse(fx fix, taken map[string][]edit) string {
	for _, ed := range fx.edits {
		editable, ok := r.editable[ed.file]
		switch {
		case !ok:
			return "it edits " + ed.file + ", which is not a source file of the packages linted"
		case !editable:
			return "it edits a generated file (marked DO NOT EDIT)"
		}
	}
	if clash(taken, fx.edits) {
		return "it overlaps another fix; run roundoff -fix again to apply it"
	}
	return ""
}

// plural returns "n word", the word in the plural unless n is 1.
func plural(n int, one, many string) string {
	if n == 1 {
		return "1 " + one
	}
	return fmt.Sprintf("%d %s", n, many)
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

// fixFile applies edits to file and writes the result, or prints it as a
// unified diff. Only the lines the edits touch are laid out as gofmt
// would; every other byte stays as it was, line endings included (in a
// file whose lines all end in CR LF, the lines edits add do too).
func (e *env) fixFile(file string, edits []edit, diff bool) error {
	old, err := os.ReadFile(file)
	if err != nil {
		return err
	}
	crlf := bytes.Contains(old, []byte("\r\n")) && bytes.Count(old, []byte("\r\n")) == bytes.Count(old, []byte("\n"))
	out, edited, err := applyEdits(old, edits)
	if err != nil {
		return err
	}
	if crlf {
		out = bytes.ReplaceAll(out, []byte("\r\n"), []byte("\n"))
	}
	if _, err := parser.ParseFile(token.NewFileSet(), file, out, parser.SkipObjectResolution); err != nil {
		return fmt.Errorf("the fixes do not give valid Go (%v); file left unchanged", err)
	}
	out = gofmtLines(out, edited)
	if crlf {
		out = bytes.ReplaceAll(out, []byte("\n"), []byte("\r\n"))
	}
	if diff {
		name := filepath.ToSlash(e.display(file))
		_, err := e.stdout.Write(unifiedDiff("a/"+name, "b/"+name, string(old), string(out)))
		return err
	}
	return writeInPlace(file, old, out)
}

// applyEdits applies edits to src and returns the result and the lines
// (0-based) that the edits' new text spans in it.
func applyEdits(src []byte, edits []edit) ([]byte, map[int]bool, error) {
	// Insertions at a point go before a replacement starting there.
	slices.SortStableFunc(edits, func(a, b edit) int { return cmp.Or(cmp.Compare(a.start, b.start), cmp.Compare(a.end, b.end)) })
	var out []byte
	edited := map[int]bool{}
	at, line := 0, 0
	for _, ed := range edits {
		if ed.start < at || ed.end > len(src) {
			return nil, nil, fmt.Errorf("fix edits out of range; file changed since it was read?")
		}
		line += bytes.Count(src[at:ed.start], []byte("\n"))
		edited[line] = true
		for range strings.Count(ed.text, "\n") {
			line++
			edited[line] = true
		}
		out = append(append(out, src[at:ed.start]...), ed.text...)
		at = ed.end
	}
	return append(out, src[at:]...), edited, nil
}

// gofmtLines returns src with the given lines (0-based) as gofmt lays
// them out, and every other line as it was. Where gofmt changes a run of
// lines into a different number of lines, the run is taken whole if it
// holds or borders an edited line.
func gofmtLines(src []byte, edited map[int]bool) []byte {
	formatted, err := format.Source(src)
	if err != nil {
		return src
	}
	a, b := splitLines(string(src)), splitLines(string(formatted))
	var out strings.Builder
	at := 0
	for _, o := range lineDiff(a, b) {
		out.WriteString(strings.Join(a[at:o.a0], ""))
		touched := false
		for l := o.a0 - 1; l <= o.a1; l++ {
			touched = touched || edited[l]
		}
		switch {
		case o.a1-o.a0 == o.b1-o.b0:
			for i := range o.a1 - o.a0 {
				if edited[o.a0+i] {
					out.WriteString(b[o.b0+i])
				} else {
					out.WriteString(a[o.a0+i])
				}
			}
		case touched:
			out.WriteString(strings.Join(b[o.b0:o.b1], ""))
		default:
			out.WriteString(strings.Join(a[o.a0:o.a1], ""))
		}
		at = o.a1
	}
	out.WriteString(strings.Join(a[at:], ""))
	return []byte(out.String())
}

// writeInPlace replaces the contents of the file at path, which were old,
// with data. It writes into the file itself, as gofmt -w does, so that
// a symbolic link leads to the fixed file and the file keeps its mode,
// owner and links; a file without write permission for its owner is
// refused. Should the write fail, the old contents are put back.
func writeInPlace(path string, old, data []byte) error {
	info, err := os.Stat(path)
	if err != nil {
		return err
	}
	if info.Mode().Perm()&0o200 == 0 {
		return errors.New("the file is read-only; not changed")
	}
	if err := os.WriteFile(path, data, 0); err != nil {
		os.WriteFile(path, old, 0)
		return bareError(err)
	}
	return nil
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
		return bareError(err)
	}
	defer func() {
		if err != nil {
			os.Remove(tmp.Name())
			err = bareError(err)
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

// bareError drops the file names from a file system error, whose
// operation and cause are what the caller, naming its own file, needs.
func bareError(err error) error {
	var pe *fs.PathError
	var le *os.LinkError
	switch {
	case errors.As(err, &pe):
		return pe.Err
	case errors.As(err, &le):
		return le.Err
	}
	return err
}
