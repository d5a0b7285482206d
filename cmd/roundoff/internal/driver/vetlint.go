package driver

import (
	"bytes"
	"encoding/json"
	"errors"
	"go/token"
	"io"
	"os"
	"os/exec"
	"slices"
	"strconv"
	"strings"

	"golang.org/x/tools/go/analysis"
)

// vetLint lints the packages o names, from dir, as lint does, but through
// the go command: go vet -json with this executable as the vet tool. The
// go command keeps every package's facts and findings in its build cache,
// so re-linting a package after one of its files changed costs about a
// second, where lint, which loads every dependency from source to compute
// their facts, costs several on a large tree (docs/performance.md). The
// pre-commit hook lints this way. The configuration, review directives and
// scope work as in lint; fixes are not read.
func (e *env) vetLint(o *options, dir string) int {
	cfg, err := e.loadConfig(o.configFile, dir)
	if err != nil {
		return e.errorf("%v", err)
	}
	sc, err := e.prepareScope(o, dir)
	if err != nil {
		return e.errorf("%v", err)
	}
	exe, err := os.Executable()
	if err != nil {
		return e.errorf("%v", err)
	}
	args := append([]string{"vet", "-vettool=" + exe, "-json"}, o.buildFlags()...)
	if o.staged != nil && o.staged.overlay != "" {
		args = append(args, "-overlay="+o.staged.overlay)
	}
	cmd := exec.Command("go", append(args, o.patterns...)...)
	cmd.Dir = dir
	var stdout, stderr bytes.Buffer
	cmd.Stdout, cmd.Stderr = &stdout, &stderr
	r := newReport(cfg, sc.root)
	err = cmd.Run()
	e.stderr.Write(o.staged.rename(stderr.Bytes(), e.display)) // build and type errors, as go vet words them
	if err != nil {
		var exit *exec.ExitError
		if !errors.As(err, &exit) {
			return e.errorf("go vet: %v", err)
		}
		r.failed = true
	}
	if err := e.readVetJSON(r, &stdout); err != nil {
		return e.errorf("reading the output of go vet: %v", err)
	}
	if o.staged != nil { // go vet saw the staged files under temporary names
		for _, f := range r.findings {
			f.posn.Filename, f.end.Filename = o.staged.file(f.posn.Filename), o.staged.file(f.end.Filename)
			for i := range f.related {
				f.related[i].posn.Filename = o.staged.file(f.related[i].posn.Filename)
			}
		}
		r.findings = keep(r.findings, func(f *finding) bool { return !cfg.Excluded(f.posn.Filename) })
	}
	return e.finish(o, r, sc)
}

// readVetJSON adds to r the findings of the JSON trees that go vet -json
// prints, one per package (package ID → analyzer → diagnostics, or an
// object holding the analyzer's error). A file shared by a package and its
// test variant gives its findings twice; they are kept once.
func (e *env) readVetJSON(r *report, in io.Reader) error {
	seen := map[string]bool{}
	dec := json.NewDecoder(in)
	for {
		var tree map[string]map[string]json.RawMessage
		if err := dec.Decode(&tree); err == io.EOF {
			break
		} else if err != nil {
			return err
		}
		for pkgID, byAnalyzer := range tree {
			for name, raw := range byAnalyzer {
				var diags []jsonDiagnostic
				if err := json.Unmarshal(raw, &diags); err != nil {
					var failed struct{ Error string }
					json.Unmarshal(raw, &failed)
					r.failed = true
					e.errorf("%s on %s: %s", name, pkgID, failed.Error)
					continue
				}
				a := e.analyzer(name)
				for _, d := range diags {
					if a == nil || seen[name+" "+d.Posn+" "+d.Message] {
						continue // not ours, or already seen in the other variant
					}
					seen[name+" "+d.Posn+" "+d.Message] = true
					r.findings = append(r.findings, r.vetFinding(a, pkgID, d))
				}
			}
		}
	}
	slices.SortFunc(r.findings, compare)
	return nil
}

// vetFinding turns a diagnostic of go vet's JSON into a finding, its
// positions resolved in the file on disk.
func (r *report) vetFinding(a *analysis.Analyzer, pkgID string, d jsonDiagnostic) *finding {
	f := &finding{
		analyzer: a,
		pkgID:    pkgID,
		diag:     analysis.Diagnostic{Category: d.Category, Message: d.Message},
		posn:     r.src.position(d.Posn),
		end:      r.src.position(d.End),
	}
	for _, rel := range d.Related {
		f.related = append(f.related, place{r.src.position(rel.Posn), r.src.position(rel.End), rel.Message})
	}
	return f
}

// position parses file:line:col (the file may hold colons), adding the
// byte offset; an empty or malformed s gives an invalid position.
func (s sources) position(posn string) token.Position {
	rest, col, ok1 := cutLastInt(posn)
	file, line, ok2 := cutLastInt(rest)
	if !ok1 || !ok2 {
		return token.Position{}
	}
	return token.Position{Filename: file, Line: line, Column: col, Offset: s.offset(file, line, col)}
}

// cutLastInt splits s at its last colon, which a positive integer follows.
func cutLastInt(s string) (string, int, bool) {
	i := strings.LastIndexByte(s, ':')
	if i < 0 {
		return "", 0, false
	}
	n, err := strconv.Atoi(s[i+1:])
	return s[:i], n, err == nil && n > 0
}
