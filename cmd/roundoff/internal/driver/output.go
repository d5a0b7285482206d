package driver

import (
	"encoding/json"
	"fmt"
	"go/token"
	"io"
	"strconv"
	"strings"
)

// print writes r's findings in the given format and returns the status:
// findings give exitFindings in the formats people read (text, github);
// json and sarif, read by programs, report them in the output and exit 0,
// as the x/tools driver does with -json.
func (e *env) print(format string, r *report) int {
	var err error
	switch format {
	case "text":
		err = e.printText(r)
	case "json":
		err = e.printJSON(r)
	case "sarif":
		err = e.printSARIF(r)
	case "github":
		err = e.printGitHub(r)
	}
	switch {
	case err != nil:
		return e.errorf("writing %s output: %v", format, err)
	case len(r.findings) > 0 && (format == "text" || format == "github"):
		return exitFindings
	}
	return exitClean
}

// position returns posn as file:line:col, the file relative to the
// current directory.
func (e *env) position(posn token.Position) string {
	return fmt.Sprintf("%s:%d:%d", e.display(posn.Filename), posn.Line, posn.Column)
}

// printText writes one line per finding, file:line:col: analyzer:
// message, and below it one indented line per related place,
// file:line:col: message.
func (e *env) printText(r *report) error {
	var b strings.Builder
	for _, f := range r.findings {
		fmt.Fprintf(&b, "%s: %s: %s\n", e.position(f.posn), f.analyzer.Name, f.diag.Message)
		for _, rel := range f.related {
			fmt.Fprintf(&b, "    %s: %s\n", e.position(rel.posn), rel.message)
		}
	}
	_, err := io.WriteString(e.stdout, b.String())
	return err
}

// The JSON output is the diagnostic tree of the x/tools drivers: package
// ID → analyzer → list of diagnostics, positions as absolute
// file:line:col, fix edits as byte offsets.
type (
	jsonDiagnostic struct {
		Category       string        `json:"category,omitempty"`
		Posn           string        `json:"posn"`
		End            string        `json:"end"`
		Message        string        `json:"message"`
		SuggestedFixes []jsonFix     `json:"suggested_fixes,omitempty"`
		Related        []jsonRelated `json:"related,omitempty"`
	}
	jsonFix struct {
		Message string     `json:"message"`
		Edits   []jsonEdit `json:"edits"`
	}
	jsonEdit struct {
		Filename string `json:"filename"`
		Start    int    `json:"start"`
		End      int    `json:"end"`
		New      string `json:"new"`
	}
	jsonRelated struct {
		Posn    string `json:"posn"`
		End     string `json:"end"`
		Message string `json:"message"`
	}
)

func (e *env) printJSON(r *report) error {
	tree := map[string]map[string][]jsonDiagnostic{}
	for _, f := range r.findings {
		d := jsonDiagnostic{Category: f.diag.Category, Posn: f.posn.String(), End: endOr(f.end, f.posn).String(), Message: f.diag.Message}
		for _, fx := range f.fixes {
			jf := jsonFix{Message: fx.message}
			for _, ed := range fx.edits {
				jf.Edits = append(jf.Edits, jsonEdit{ed.file, ed.start, ed.end, ed.text})
			}
			d.SuggestedFixes = append(d.SuggestedFixes, jf)
		}
		for _, rel := range f.related {
			d.Related = append(d.Related, jsonRelated{rel.posn.String(), endOr(rel.end, rel.posn).String(), rel.message})
		}
		if tree[f.pkgID] == nil {
			tree[f.pkgID] = map[string][]jsonDiagnostic{}
		}
		tree[f.pkgID][f.analyzer.Name] = append(tree[f.pkgID][f.analyzer.Name], d)
	}
	return writeJSON(e.stdout, tree)
}

// writeJSON writes v as indented JSON, leaving <, > and & as they are.
func writeJSON(w io.Writer, v any) error {
	enc := json.NewEncoder(w)
	enc.SetEscapeHTML(false)
	enc.SetIndent("", "\t")
	return enc.Encode(v)
}

func endOr(end, start token.Position) token.Position {
	if end.IsValid() {
		return end
	}
	return start
}

// printGitHub writes one GitHub Actions workflow command per finding,
// which the runner shows as an annotation on the file and line:
//
//	::warning file=ramp/ramp.go,line=18,col=5,title=roundoff exacteq::message
//
// The path is relative to the project root (the repository checkout);
// the command is the finding's level (error, warning, or notice for
// note).
func (e *env) printGitHub(r *report) error {
	var b strings.Builder
	for _, le := range r.errors { // packages that did not load
		props := []string{"title=" + escapeProperty("roundoff")}
		if le.posn.IsValid() {
			props = append(r.githubPlace(le.posn, token.Position{}), props...)
		}
		fmt.Fprintf(&b, "::error %s::%s\n", strings.Join(props, ","), escapeData(le.msg))
	}
	for _, f := range r.findings {
		cmd := r.cfg.Level(f.analyzer.Name)
		if cmd == "note" {
			cmd = "notice"
		}
		props := append(r.githubPlace(f.posn, f.end), "title="+escapeProperty("roundoff "+f.analyzer.Name))
		msg := f.diag.Message
		for _, rel := range f.related { // an annotation has one place: name the others
			msg += fmt.Sprintf(" (%s: %s)", r.rootPath(rel.posn.Filename)+":"+strconv.Itoa(rel.posn.Line), rel.message)
		}
		fmt.Fprintf(&b, "::%s %s::%s\n", cmd, strings.Join(props, ","), escapeData(msg))
	}
	_, err := io.WriteString(e.stdout, b.String())
	return err
}

// githubPlace returns the properties of a workflow command that place it
// at [posn, end): the file relative to the project root, line and column.
func (r *report) githubPlace(posn, end token.Position) []string {
	props := []string{"file=" + escapeProperty(r.rootPath(posn.Filename)), "line=" + strconv.Itoa(posn.Line), "col=" + strconv.Itoa(r.src.column(posn))}
	if end.IsValid() {
		props = append(props, "endLine="+strconv.Itoa(end.Line), "endColumn="+strconv.Itoa(r.src.column(end)))
	}
	return props
}

// rootPath returns filename relative to the project root when inside it.
func (r *report) rootPath(filename string) string {
	if rel, ok := relTo(r.root, filename); ok {
		return rel
	}
	return filename
}

// escapeData escapes the message of a workflow command: %, CR and LF
// become %25, %0D and %0A, so that the message stays on one line.
func escapeData(s string) string {
	return strings.NewReplacer("%", "%25", "\r", "%0D", "\n", "%0A").Replace(s)
}

// escapeProperty escapes a property value of a workflow command: as
// escapeData, and also : and , (which separate the properties) as %3A
// and %2C.
func escapeProperty(s string) string {
	return strings.NewReplacer("%", "%25", "\r", "%0D", "\n", "%0A", ":", "%3A", ",", "%2C").Replace(s)
}
