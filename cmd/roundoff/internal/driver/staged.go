package driver

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strconv"
	"strings"
)

// An indexView makes the go command see the Go files of a work tree as
// the git index holds them, through a build overlay (go help build,
// -overlay): a file whose work-tree contents differ from the index is
// replaced by its staged contents, written to a temporary directory, and
// a Go file the index does not hold (untracked) is hidden. The work tree
// itself is not touched.
type indexView struct {
	dir     string            // the temporary directory, "" when none was needed
	overlay string            // the overlay file, "" when the work tree is the index
	actual  map[string]string // temporary file → work-tree file it stands for
}

// stageIndex returns the view of the index of the work tree at root.
func stageIndex(root string) (*indexView, error) {
	v := &indexView{actual: map[string]string{}}
	unstaged, err := git(root, "-c", "core.quotePath=false", "diff", "--name-only", "--no-renames", "--no-relative", "-z")
	if err != nil {
		return nil, err
	}
	untracked, err := git(root, "ls-files", "--others", "--exclude-standard", "-z")
	if err != nil {
		return nil, err
	}
	replace := map[string]string{}
	for _, rel := range goFiles(untracked) {
		replace[filepath.Join(root, filepath.FromSlash(rel))] = ""
	}
	for _, rel := range goFiles(unstaged) {
		if err := v.stage(root, rel, replace); err != nil {
			v.remove()
			return nil, err
		}
	}
	if len(replace) == 0 {
		return v, nil
	}
	if err := v.mkdir(); err != nil {
		return nil, err
	}
	data, err := json.Marshal(map[string]any{"Replace": replace})
	if err == nil {
		v.overlay = filepath.Join(v.dir, "overlay.json")
		err = os.WriteFile(v.overlay, data, 0o600)
	}
	if err != nil {
		v.remove()
		return nil, bareError(err)
	}
	return v, nil
}

// stage writes the staged contents of the file at rel to the temporary
// directory and records the replacement.
func (v *indexView) stage(root, rel string, replace map[string]string) error {
	blob, err := git(root, "cat-file", "blob", ":"+rel)
	if err != nil {
		return err
	}
	if err := v.mkdir(); err != nil {
		return err
	}
	sub := filepath.Join(v.dir, strconv.Itoa(len(v.actual)))
	tmp := filepath.Join(sub, filepath.Base(rel)) // the same base name, for messages
	if err := os.Mkdir(sub, 0o700); err != nil {
		return bareError(err)
	}
	if err := os.WriteFile(tmp, []byte(blob), 0o600); err != nil {
		return bareError(err)
	}
	abs := filepath.Join(root, filepath.FromSlash(rel))
	replace[abs] = tmp
	v.actual[tmp] = abs
	return nil
}

func (v *indexView) mkdir() (err error) {
	if v.dir == "" {
		v.dir, err = os.MkdirTemp("", "roundoff-index-")
	}
	return bareError(err)
}

// remove deletes the temporary directory.
func (v *indexView) remove() {
	if v.dir != "" {
		os.RemoveAll(v.dir)
	}
}

// file returns the work-tree file that name, perhaps a temporary file of
// the view, stands for.
func (v *indexView) file(name string) string {
	if v != nil && v.actual[name] != "" {
		return v.actual[name]
	}
	return name
}

// goFiles returns the .go paths of a NUL-separated list.
func goFiles(list string) []string {
	var out []string
	for _, rel := range strings.Split(list, "\x00") {
		if strings.HasSuffix(rel, ".go") {
			out = append(out, rel)
		}
	}
	return out
}

// rename replaces the temporary file names in go command output by the
// names of the work-tree files, as display shows them.
func (v *indexView) rename(out []byte, display func(string) string) []byte {
	if v == nil {
		return out
	}
	s := string(out)
	for tmp, abs := range v.actual {
		s = strings.ReplaceAll(s, tmp, display(abs))
	}
	return []byte(s)
}
