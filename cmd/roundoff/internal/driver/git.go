package driver

import (
	"bufio"
	"bytes"
	"errors"
	"fmt"
	"go/token"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
)

// git runs git in dir and returns its standard output; the error carries
// git's first line of complaint.
func git(dir string, args ...string) (string, error) {
	cmd := exec.Command("git", args...)
	cmd.Dir = dir
	var out, errOut bytes.Buffer
	cmd.Stdout, cmd.Stderr = &out, &errOut
	if err := cmd.Run(); err != nil {
		msg, _, _ := strings.Cut(strings.TrimSpace(errOut.String()), "\n")
		if msg == "" {
			msg = err.Error()
		}
		return "", errors.New(msg)
	}
	return out.String(), nil
}

// gitRoot returns the top directory of the git work tree holding dir.
func gitRoot(dir string) (string, error) {
	out, err := git(dir, "rev-parse", "--show-toplevel")
	if err != nil {
		return "", fmt.Errorf("%s is not inside a git work tree", dir)
	}
	return strings.TrimSpace(out), nil
}

// changedLines holds, by path relative to the work tree's top, the lines
// added or changed in each file; a nil set means the whole file is new.
type changedLines struct {
	root  string
	files map[string]map[int]bool
}

// contains reports whether line of the file at repository-relative path
// rel was added or changed.
func (c *changedLines) contains(rel string, line int) bool {
	lines, ok := c.files[rel]
	return ok && (lines == nil || lines[line])
}

// touches reports whether a line of f changed: its own, or that of a
// related place (a tolerance written elsewhere that makes the test wrong).
func (c *changedLines) touches(f *finding) bool {
	changed := func(posn token.Position) bool {
		rel, ok := relTo(c.root, posn.Filename)
		return ok && c.contains(rel, posn.Line)
	}
	for _, p := range f.related {
		if changed(p.posn) {
			return true
		}
	}
	return changed(f.posn)
}

// diffArgs make git print a plain unified diff with no context whatever
// the user's configuration says, detecting renames.
var diffArgs = []string{"-c", "core.quotePath=false", "diff", "--no-color", "--no-ext-diff", "--no-textconv",
	"--no-relative", "--unified=0", "--find-renames", "--src-prefix=a/", "--dst-prefix=b/"}

// changedSince returns the lines of the work tree of dir that differ from
// revision rev, untracked files (not ignored) counting as new.
func changedSince(dir, rev string) (*changedLines, error) {
	root, err := gitRoot(dir)
	if err != nil {
		return nil, err
	}
	if _, err := git(root, "rev-parse", "--verify", "--quiet", "--end-of-options", rev+"^{commit}"); err != nil {
		return nil, fmt.Errorf("unknown git revision %q", rev)
	}
	out, err := git(root, append(diffArgs, "--end-of-options", rev, "--")...)
	if err != nil {
		return nil, err
	}
	c := &changedLines{root: root, files: parseDiff(out)}
	untracked, err := git(root, "ls-files", "--others", "--exclude-standard", "-z")
	if err != nil {
		return nil, err
	}
	for _, name := range strings.Split(untracked, "\x00") {
		if name != "" {
			c.files[name] = nil
		}
	}
	return c, nil
}

// stagedChanges returns the lines of the index that differ from HEAD (or
// every staged line before the first commit).
func stagedChanges(dir string) (*changedLines, error) {
	root, err := gitRoot(dir)
	if err != nil {
		return nil, err
	}
	out, err := git(root, append(diffArgs, "--cached", "--")...)
	if err != nil {
		return nil, err
	}
	return &changedLines{root: root, files: parseDiff(out)}, nil
}

// parseDiff returns the added lines of each file in a unified diff with
// no context (git diff -U0), by new path. A file the diff deletes is
// absent; a renamed file without changes is absent too, as its lines are
// not new.
func parseDiff(diff string) map[string]map[int]bool {
	files := map[string]map[int]bool{}
	var file string // the new path of the current file, "" if deleted
	minus, plus := 0, 0
	sc := bufio.NewScanner(strings.NewReader(diff))
	sc.Buffer(nil, 1<<26)
	for sc.Scan() {
		line := sc.Text()
		switch {
		case minus > 0 && strings.HasPrefix(line, "-"):
			minus--
		case plus > 0 && strings.HasPrefix(line, "+"):
			plus--
		case strings.HasPrefix(line, "+++ "):
			file = diffPath(line[len("+++ "):])
		case strings.HasPrefix(line, "@@ ") && file != "":
			start, n := hunkNew(line)
			minus, plus = hunkOld(line), n
			if files[file] == nil {
				files[file] = map[int]bool{}
			}
			for l := start; l < start+n; l++ {
				files[file][l] = true
			}
		}
	}
	return files
}

// diffPath returns the path of a "+++ " line: "" for /dev/null.
func diffPath(s string) string {
	if strings.HasPrefix(s, `"`) {
		if u, err := strconv.Unquote(s); err == nil {
			s = u
		}
	}
	if p, ok := strings.CutPrefix(s, "b/"); ok {
		return filepath.ToSlash(p)
	}
	return ""
}

// hunkNew returns the first line and count of the new side of a hunk
// header "@@ -a,b +c,d @@".
func hunkNew(header string) (start, n int) {
	fields := strings.Fields(header)
	if len(fields) < 3 {
		return 0, 0
	}
	return hunkRange(strings.TrimPrefix(fields[2], "+"))
}

// hunkOld returns the number of lines of the old side of a hunk header.
func hunkOld(header string) int {
	fields := strings.Fields(header)
	if len(fields) < 2 {
		return 0
	}
	_, n := hunkRange(strings.TrimPrefix(fields[1], "-"))
	return n
}

// hunkRange parses "c,d" or "c" (meaning d = 1).
func hunkRange(s string) (start, n int) {
	first, count, ok := strings.Cut(s, ",")
	start, _ = strconv.Atoi(first)
	n = 1
	if ok {
		n, _ = strconv.Atoi(count)
	}
	return start, n
}
