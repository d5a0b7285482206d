package driver

import (
	"fmt"
	"go/token"
	"net/url"
	"path/filepath"
	"strings"

	"golang.org/x/tools/go/analysis"
)

// The SARIF output follows SARIF 2.1.0 (OASIS Standard, 27 March 2020);
// section numbers below are the standard's.
const (
	sarifSchema  = "https://raw.githubusercontent.com/oasis-tcs/sarif-spec/master/Schemata/sarif-schema-2.1.0.json"
	sarifVersion = "2.1.0"
	// srcRoot is the uriBaseId (§3.4.4) of the project root, which the
	// run's originalUriBaseIds (§3.14.14) map to its absolute location.
	srcRoot = "SRCROOT"
	// fingerprintName names roundoff's partial fingerprint (§3.27.17):
	// the finding's fingerprint and its ordinal among equal ones.
	fingerprintName = "roundoffLineAndFunction/v1"
)

// docsBase is the absolute address that the analyzers' documentation
// URLs (docs/<analyzer>.md, relative to the repository root) are resolved
// against for SARIF's helpUri (§3.49.12), which must be absolute. Set it
// at build time: -ldflags=-X=roundoff/cmd/roundoff/internal/driver.docsBase=URL.
var docsBase = "https://roundoff.invalid/"

type (
	sarifLog struct {
		Schema  string     `json:"$schema"`
		Version string     `json:"version"`
		Runs    []sarifRun `json:"runs"`
	}
	sarifRun struct {
		Tool               sarifTool                   `json:"tool"`
		Invocations        []sarifInvocation           `json:"invocations"`
		OriginalURIBaseIDs map[string]sarifArtifactLoc `json:"originalUriBaseIds"`
		ColumnKind         string                      `json:"columnKind"`
		Results            []sarifResult               `json:"results"`
	}
	sarifTool struct {
		Driver sarifDriver `json:"driver"`
	}
	sarifDriver struct {
		Name  string      `json:"name"`
		Rules []sarifRule `json:"rules"`
	}
	sarifRule struct {
		ID                   string       `json:"id"`
		ShortDescription     sarifMessage `json:"shortDescription"`
		FullDescription      sarifMessage `json:"fullDescription"`
		HelpURI              string       `json:"helpUri"`
		Help                 sarifMessage `json:"help"`
		DefaultConfiguration sarifConfig  `json:"defaultConfiguration"`
	}
	sarifConfig struct {
		Level string `json:"level"`
	}
	sarifInvocation struct {
		ExecutionSuccessful        bool                `json:"executionSuccessful"`
		ToolExecutionNotifications []sarifNotification `json:"toolExecutionNotifications,omitempty"`
	}
	// sarifNotification (§3.58) reports a package that did not load.
	sarifNotification struct {
		Level     string          `json:"level"`
		Message   sarifMessage    `json:"message"`
		Locations []sarifLocation `json:"locations,omitempty"`
	}
	sarifMessage struct {
		Text string `json:"text"`
	}
	sarifResult struct {
		RuleID              string            `json:"ruleId"`
		RuleIndex           int               `json:"ruleIndex"`
		Level               string            `json:"level"`
		Message             sarifMessage      `json:"message"`
		Locations           []sarifLocation   `json:"locations"`
		RelatedLocations    []sarifLocation   `json:"relatedLocations,omitempty"`
		PartialFingerprints map[string]string `json:"partialFingerprints"`
		Fixes               []sarifFix        `json:"fixes,omitempty"`
	}
	sarifLocation struct {
		ID               *int                  `json:"id,omitempty"`
		PhysicalLocation sarifPhysicalLocation `json:"physicalLocation"`
		Message          *sarifMessage         `json:"message,omitempty"`
	}
	sarifPhysicalLocation struct {
		ArtifactLocation sarifArtifactLoc `json:"artifactLocation"`
		Region           sarifRegion      `json:"region"`
	}
	sarifArtifactLoc struct {
		URI       string `json:"uri"`
		URIBaseID string `json:"uriBaseId,omitempty"`
	}
	sarifRegion struct {
		StartLine   int `json:"startLine"`
		StartColumn int `json:"startColumn"`
		EndLine     int `json:"endLine,omitempty"`
		EndColumn   int `json:"endColumn,omitempty"`
	}
	sarifFix struct {
		Description     sarifMessage          `json:"description"`
		ArtifactChanges []sarifArtifactChange `json:"artifactChanges"`
	}
	sarifArtifactChange struct {
		ArtifactLocation sarifArtifactLoc   `json:"artifactLocation"`
		Replacements     []sarifReplacement `json:"replacements"`
	}
	sarifReplacement struct {
		DeletedRegion   sarifRegion   `json:"deletedRegion"`
		InsertedContent *sarifMessage `json:"insertedContent,omitempty"`
	}
)

// printSARIF writes r as a SARIF log of one run.
func (e *env) printSARIF(r *report) error {
	run := sarifRun{
		Tool:               sarifTool{sarifDriver{Name: "roundoff", Rules: []sarifRule{}}},
		Invocations:        []sarifInvocation{{ExecutionSuccessful: !r.failed, ToolExecutionNotifications: r.notifications()}},
		OriginalURIBaseIDs: map[string]sarifArtifactLoc{srcRoot: {URI: dirURI(r.root)}},
		ColumnKind:         "unicodeCodePoints",
		Results:            []sarifResult{},
	}
	ruleIndex := map[string]int{}
	for _, a := range e.analyzers {
		ruleIndex[a.Name] = len(run.Tool.Driver.Rules)
		run.Tool.Driver.Rules = append(run.Tool.Driver.Rules, rule(a, r.cfg.Level(a.Name)))
	}
	seen := map[string]int{}
	for _, f := range r.findings {
		fp := f.fingerprint(r.src)
		loc := r.artifact(f.posn.Filename)
		n := seen[f.analyzer.Name+"\x00"+loc.URI+"\x00"+fp]
		seen[f.analyzer.Name+"\x00"+loc.URI+"\x00"+fp]++
		res := sarifResult{
			RuleID:              f.analyzer.Name,
			RuleIndex:           ruleIndex[f.analyzer.Name],
			Level:               r.cfg.Level(f.analyzer.Name),
			Message:             sarifMessage{f.diag.Message},
			Locations:           []sarifLocation{r.location(f.posn, f.end)},
			PartialFingerprints: map[string]string{fingerprintName: fmt.Sprintf("%s:%d", fp, n)},
		}
		for i, rel := range f.related {
			l := r.location(rel.posn, rel.end)
			l.ID, l.Message = &i, &sarifMessage{rel.message}
			res.RelatedLocations = append(res.RelatedLocations, l)
		}
		for _, fx := range f.fixes {
			res.Fixes = append(res.Fixes, r.sarifFix(fx))
		}
		run.Results = append(run.Results, res)
	}
	return writeJSON(e.stdout, sarifLog{sarifSchema, sarifVersion, []sarifRun{run}})
}

// notifications returns the load errors as error notifications.
func (r *report) notifications() []sarifNotification {
	var out []sarifNotification
	for _, le := range r.errors {
		n := sarifNotification{Level: "error", Message: sarifMessage{le.msg}}
		if le.posn.IsValid() {
			n.Locations = []sarifLocation{r.location(le.posn, token.Position{})}
		}
		out = append(out, n)
	}
	return out
}

// rule describes analyzer a as a reportingDescriptor (§3.49).
func rule(a *analysis.Analyzer, level string) sarifRule {
	title, _, _ := strings.Cut(a.Doc, "\n")
	return sarifRule{
		ID:                   a.Name,
		ShortDescription:     sarifMessage{title},
		FullDescription:      sarifMessage{a.Doc},
		HelpURI:              docsBase + strings.TrimPrefix(a.URL, "/"),
		Help:                 sarifMessage{a.Doc},
		DefaultConfiguration: sarifConfig{level},
	}
}

// artifact returns the location of filename: relative to the project
// root when inside it, else an absolute file URI.
func (r *report) artifact(filename string) sarifArtifactLoc {
	if rel, ok := relTo(r.root, filename); ok {
		segs := strings.Split(rel, "/")
		for i, s := range segs {
			segs[i] = url.PathEscape(s)
		}
		return sarifArtifactLoc{URI: strings.Join(segs, "/"), URIBaseID: srcRoot}
	}
	return sarifArtifactLoc{URI: fileURI(filename)}
}

// location returns the physical location of the range [posn, end).
func (r *report) location(posn, end token.Position) sarifLocation {
	reg := sarifRegion{StartLine: posn.Line, StartColumn: r.src.column(posn)}
	if end.IsValid() {
		reg.EndLine, reg.EndColumn = end.Line, r.src.column(end)
	}
	return sarifLocation{PhysicalLocation: sarifPhysicalLocation{r.artifact(posn.Filename), reg}}
}

// sarifFix converts a fix (§3.55): one artifactChange per file, each edit
// a replacement of a region (an empty one for an insertion) by text.
func (r *report) sarifFix(fx fix) sarifFix {
	out := sarifFix{Description: sarifMessage{fx.message}}
	index := map[string]int{}
	for _, ed := range fx.edits {
		i, ok := index[ed.file]
		if !ok {
			i = len(out.ArtifactChanges)
			index[ed.file] = i
			out.ArtifactChanges = append(out.ArtifactChanges, sarifArtifactChange{ArtifactLocation: r.artifact(ed.file)})
		}
		rep := sarifReplacement{DeletedRegion: r.offsetRegion(ed.file, ed.start, ed.end)}
		if ed.text != "" {
			rep.InsertedContent = &sarifMessage{ed.text}
		}
		out.ArtifactChanges[i].Replacements = append(out.ArtifactChanges[i].Replacements, rep)
	}
	return out
}

// offsetRegion returns the region of bytes [start, end) of file as lines
// and code-point columns.
func (r *report) offsetRegion(file string, start, end int) sarifRegion {
	s, e := r.src.offsetPosition(file, start), r.src.offsetPosition(file, end)
	return sarifRegion{StartLine: s.Line, StartColumn: r.src.column(s), EndLine: e.Line, EndColumn: r.src.column(e)}
}

func dirURI(dir string) string {
	u := fileURI(dir)
	if !strings.HasSuffix(u, "/") {
		u += "/"
	}
	return u
}

func fileURI(path string) string {
	return (&url.URL{Scheme: "file", Path: filepath.ToSlash(path)}).String()
}
