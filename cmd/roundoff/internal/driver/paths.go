package driver

import (
	"os"
	"path/filepath"
	"strings"
)

// moduleRoot returns the nearest directory at or above dir that holds a
// go.mod file, or dir itself when there is none.
func moduleRoot(dir string) string {
	for d := dir; ; {
		if _, err := os.Stat(filepath.Join(d, "go.mod")); err == nil {
			return d
		}
		parent := filepath.Dir(d)
		if parent == d {
			return dir
		}
		d = parent
	}
}

// relTo returns filename relative to dir, slash-separated, and whether it
// lies inside dir; symbolic links in either path are resolved when the
// plain paths disagree.
func relTo(dir, filename string) (string, bool) {
	if rel, ok := inside(dir, filename); ok {
		return rel, true
	}
	d, err1 := filepath.EvalSymlinks(dir)
	f, err2 := filepath.EvalSymlinks(filename)
	if err1 != nil || err2 != nil {
		return "", false
	}
	return inside(d, f)
}

func inside(dir, filename string) (string, bool) {
	rel, err := filepath.Rel(dir, filename)
	if err != nil || rel == ".." || strings.HasPrefix(rel, ".."+string(filepath.Separator)) || filepath.IsAbs(rel) {
		return "", false
	}
	return filepath.ToSlash(rel), true
}

// display returns filename as the text output shows it: relative to the
// current directory when inside it, absolute otherwise.
func (e *env) display(filename string) string {
	if rel, ok := relTo(e.cwd, filename); ok {
		return filepath.FromSlash(rel)
	}
	return filename
}
