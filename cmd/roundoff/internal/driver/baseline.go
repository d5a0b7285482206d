package driver

import (
	"bufio"
	"bytes"
	"errors"
	"fmt"
	"io/fs"
	"os"
	"slices"
	"strings"
)

// A baseline file records findings accepted as they stand, one per line:
//
//	roundoff baseline 1
//	# comment lines and blank lines are ignored
//	<analyzer> TAB <path> TAB <fingerprint> TAB <message>
//
// The path is relative to the project root (the git work tree's top, or
// the module root) and slash-separated; the fingerprint is the finding's
// (see finding.fingerprint); the message is for people and not matched.
// A finding is hidden when an entry with its analyzer, path and
// fingerprint remains; each entry hides one finding.
const baselineHeader = "roundoff baseline 1"

// A baseline is a read baseline file.
type baseline struct {
	entries []baselineEntry
}

type baselineEntry struct {
	analyzer, path, fingerprint string
	line                        int // in the baseline file
}

// matchKey returns the key findings and entries are matched by.
func (b baselineEntry) matchKey() string {
	return b.analyzer + "\t" + b.path + "\t" + b.fingerprint
}

// readBaseline reads the baseline file at path.
func readBaseline(path string) (*baseline, error) {
	data, err := os.ReadFile(path)
	if errors.Is(err, fs.ErrNotExist) {
		return nil, fmt.Errorf("-baseline %s: no such file; create it with -write-baseline %s", path, path)
	}
	if err != nil {
		return nil, fmt.Errorf("-baseline %s: %v", path, err)
	}
	return parseBaseline(path, data)
}

// parseBaseline parses the contents of a baseline file.
func parseBaseline(path string, data []byte) (*baseline, error) {
	b := &baseline{}
	sc := bufio.NewScanner(bytes.NewReader(data))
	sc.Buffer(nil, 1<<20)
	n := 0
	for sc.Scan() {
		n++
		line := strings.TrimRight(sc.Text(), "\r")
		if n == 1 {
			if line != baselineHeader {
				return nil, fmt.Errorf("%s:1: not a roundoff baseline (the first line must be %q)", path, baselineHeader)
			}
			continue
		}
		if strings.TrimSpace(line) == "" || strings.HasPrefix(line, "#") {
			continue
		}
		fields := strings.Split(line, "\t")
		if len(fields) != 4 || fields[0] == "" || fields[1] == "" || !isFingerprint(fields[2]) {
			return nil, fmt.Errorf("%s:%d: malformed baseline entry (want analyzer, path, 16-hex-digit fingerprint and message, separated by tabs)", path, n)
		}
		b.entries = append(b.entries, baselineEntry{fields[0], fields[1], fields[2], n})
	}
	if err := sc.Err(); err != nil {
		return nil, fmt.Errorf("%s:%d: %v", path, n+1, err)
	}
	if n == 0 {
		return nil, fmt.Errorf("%s: empty file, not a roundoff baseline", path)
	}
	return b, nil
}

func isFingerprint(s string) bool {
	return len(s) == 16 && strings.Trim(s, "0123456789abcdef") == ""
}

// checkBaselineTarget refuses to let -write-baseline replace a file that
// is not a baseline, so that a slip of the keyboard costs no source file.
func checkBaselineTarget(path string) error {
	data, err := os.ReadFile(path)
	switch {
	case errors.Is(err, fs.ErrNotExist):
		return nil
	case err != nil:
		return fmt.Errorf("-write-baseline %s: %v", path, err)
	case !bytes.HasPrefix(data, []byte(baselineHeader+"\n")):
		return fmt.Errorf("-write-baseline %s: the file exists and is not a roundoff baseline; refusing to overwrite it", path)
	}
	return nil
}

// entryOf returns the baseline entry that records f.
func (r *report) entryOf(f *finding) (baselineEntry, bool) {
	rel, ok := relTo(r.root, f.posn.Filename)
	if !ok {
		return baselineEntry{}, false
	}
	return baselineEntry{analyzer: f.analyzer.Name, path: rel, fingerprint: f.fingerprint(r.src)}, true
}

// writeBaseline records r's findings in the baseline file at path; it
// writes nothing when some package failed, whose entries would be lost.
func (e *env) writeBaseline(path string, r *report) int {
	if r.failed {
		return e.errorf("-write-baseline %s: not written, as some packages did not load (see above)", path)
	}
	var buf bytes.Buffer
	fmt.Fprintf(&buf, "%s\n# Findings accepted as they stand: roundoff -baseline %s hides them.\n", baselineHeader, path)
	fmt.Fprintf(&buf, "# Written by roundoff -write-baseline; fields: analyzer, path, fingerprint, message.\n")
	n := 0
	for _, f := range r.findings {
		if ent, ok := r.entryOf(f); ok {
			msg := strings.Join(strings.Fields(f.diag.Message), " ")
			fmt.Fprintf(&buf, "%s\t%s\t%s\t%s\n", ent.analyzer, ent.path, ent.fingerprint, msg)
			n++
		}
	}
	if err := writeAtomic(path, buf.Bytes()); err != nil {
		return e.errorf("-write-baseline %s: %v", path, err)
	}
	fmt.Fprintf(e.stderr, "roundoff: recorded %s in %s\n", plural(n, "finding", "findings"), path)
	return exitClean
}

// applyBaseline hides the findings the baseline records and summarises
// the entries, for files that were linted, that match no finding.
func (e *env) applyBaseline(r *report, path string, b *baseline) {
	left := map[string]int{}
	for _, ent := range b.entries {
		left[ent.matchKey()]++
	}
	r.findings = keep(r.findings, func(f *finding) bool {
		ent, ok := r.entryOf(f)
		if ok && left[ent.matchKey()] > 0 {
			left[ent.matchKey()]--
			return false
		}
		return true
	})
	linted := map[string]bool{}
	for name := range r.files {
		if rel, ok := relTo(r.root, name); ok {
			linted[rel] = true
		}
	}
	stale := map[string]int{}
	total := 0
	for _, ent := range b.entries {
		if linted[ent.path] && left[ent.matchKey()] > 0 {
			left[ent.matchKey()]--
			stale[ent.path]++
			total++
		}
	}
	if total > 0 {
		verb := "match"
		if total == 1 {
			verb = "matches"
		}
		fmt.Fprintf(e.stderr, "roundoff: %d of the %s of baseline %s %s no finding any more (%s); rewrite it with -write-baseline %s\n",
			total, plural(len(b.entries), "entry", "entries"), path, verb, countsByFile(stale), path)
	}
}

// countsByFile formats per-file counts as "a.go: 2, b.go: 1".
func countsByFile(counts map[string]int) string {
	var files []string
	for f := range counts {
		files = append(files, f)
	}
	slices.Sort(files)
	var parts []string
	for _, f := range files {
		parts = append(parts, fmt.Sprintf("%s: %d", f, counts[f]))
	}
	return strings.Join(parts, ", ")
}
