package suite_test

import (
	"bytes"
	"encoding/csv"
	"fmt"
	"go/token"
	"io"
	"maps"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/analysis/checker"
	"golang.org/x/tools/go/packages"

	"roundoff/analyzers/suite"
)

// corpusEnv names the directory that holds one work tree per repository
// of the development corpus (docs/evaluation.md says how to make them).
const corpusEnv = "ROUNDOFF_CORPUS"

// labelsDir holds the hand labels of the corpus, one file per repository,
// made by reading code that a separate scan (tools/corpusscan) listed,
// without the tool's findings. Each line, tab-separated: repo, commit,
// file, line, analyzer, verdict (hazard or clean), source (scan,
// scan-sample, read or review), reason.
const labelsDir = "../../testdata/corpus/labels"

// A label is one hand-judged site.
type label struct {
	repo, commit, file        string
	line                      int
	analyzer, verdict, source string
	reason                    string
}

// A site is a file and line in one repository.
type site struct {
	repo, file string
	line       int
}

// A finding is one diagnostic with the sites it names: its own position
// and its related locations.
type finding struct {
	analyzer, message string
	at                site
	sites             []site
}

// TestCorpus lints every repository of the development corpus with the
// whole suite and scores the findings against the hand labels: a labelled
// hazard counts as found when a finding names its line, and a finding is
// true when it names a line labelled hazard, false when it names only
// lines labelled clean, and unjudged otherwise. It prints the tables of
// docs/evaluation.md and the unjudged findings, which must be read and
// labelled (source "review") before the numbers are quoted. Recall counts
// only the hazards labelled without the tool, so reviewing findings can
// change precision but never raise recall.
func TestCorpus(t *testing.T) {
	dir := os.Getenv(corpusEnv)
	if dir == "" {
		t.Skip(corpusEnv + " does not name the corpus work trees")
	}
	labels := readLabels(t)
	byRepo := map[string][]label{}
	for _, l := range labels {
		byRepo[l.repo] = append(byRepo[l.repo], l)
	}
	var findings []finding
	for _, repo := range slices.Sorted(maps.Keys(byRepo)) {
		findings = append(findings, lintRepo(t, filepath.Join(dir, repo), repo, byRepo[repo][0].commit)...)
	}
	report(t, labels, findings)
}

// readLabels reads every file of labelsDir.
func readLabels(t *testing.T) []label {
	files, err := filepath.Glob(filepath.Join(labelsDir, "*.tsv"))
	require.NoError(t, err)
	var out []label
	for _, name := range files {
		data, err := os.ReadFile(name)
		require.NoError(t, err)
		r := csv.NewReader(bytes.NewReader(data))
		r.Comma, r.FieldsPerRecord, r.LazyQuotes = '\t', 8, true
		recs, err := r.ReadAll()
		require.NoError(t, err, name)
		for _, rec := range recs {
			line, err := strconv.Atoi(rec[3])
			require.NoError(t, err, "%s: line of %v", name, rec)
			require.Contains(t, []string{"hazard", "clean"}, rec[5], "%s: verdict of %v", name, rec)
			out = append(out, label{rec[0], rec[1], rec[2], line, rec[4], rec[5], rec[6], rec[7]})
		}
	}
	return out
}

// lintRepo lints the work tree of one repository, which must be at the
// labelled commit, tests included, and returns its findings.
func lintRepo(t *testing.T, root, repo, commit string) []finding {
	head, err := exec.Command("git", "-C", root, "rev-parse", "HEAD").Output()
	require.NoError(t, err, repo)
	require.Equal(t, commit, strings.TrimSpace(string(head)), "%s: work tree not at the labelled commit", repo)
	pattern := "./..."
	if repo == "gg" {
		pattern = "." // its examples/ are separate programs in one directory
	}
	cfg := &packages.Config{Mode: packages.LoadAllSyntax, Tests: true, Dir: root, Env: append(os.Environ(), "GOFLAGS=-mod=mod")}
	pkgs, err := packages.Load(cfg, pattern)
	require.NoError(t, err, repo)
	graph, err := checker.Analyze(suite.Analyzers, pkgs, nil)
	require.NoError(t, err, repo)
	seen := map[string]bool{}
	var out []finding
	for act := range graph.All() {
		if !act.IsRoot {
			continue
		}
		for _, d := range act.Diagnostics {
			f := finding{analyzer: act.Analyzer.Name, message: d.Message, at: siteOf(act.Package.Fset, root, repo, d.Pos)}
			f.sites = append(f.sites, f.at)
			for _, r := range d.Related {
				f.sites = append(f.sites, siteOf(act.Package.Fset, root, repo, r.Pos))
			}
			key := fmt.Sprint(f.analyzer, f.at, d.Message)
			if !seen[key] { // a file seen by a package and its test variant
				seen[key] = true
				out = append(out, f)
			}
		}
	}
	return out
}

// siteOf returns the site of pos, its file relative to the work tree.
func siteOf(fset *token.FileSet, root, repo string, pos token.Pos) site {
	p := fset.PositionFor(pos, false)
	rel, err := filepath.Rel(root, p.Filename)
	if err != nil {
		rel = p.Filename
	}
	return site{repo, filepath.ToSlash(rel), p.Line}
}

// A score counts one analyzer's results over a set of labels.
type score struct {
	hazards, found        int // labelled hazards, and those some finding names
	findings, truePos, fp int // findings, true ones, false ones
}

func (s score) precision() string { return ratio(s.truePos, s.truePos+s.fp) }
func (s score) recall() string    { return ratio(s.found, s.hazards) }

func ratio(a, b int) string {
	if b == 0 {
		return "–"
	}
	return fmt.Sprintf("%.2f (%d/%d)", float64(a)/float64(b), a, b)
}

// report scores findings against labels per analyzer and per repository
// and logs the tables and the unjudged findings.
func report(t *testing.T, labels []label, findings []finding) {
	verdicts := map[site]string{} // hazard wins over clean on one line
	for _, l := range labels {
		s := site{l.repo, l.file, l.line}
		if verdicts[s] != "hazard" {
			verdicts[s] = l.verdict
		}
	}
	named := map[site]bool{}
	perAnalyzer, perRepo := map[string]*score{}, map[string]*score{}
	get := func(m map[string]*score, k string) *score {
		if m[k] == nil {
			m[k] = new(score)
		}
		return m[k]
	}
	var unjudged, falseAlarms, missed []string
	for _, f := range findings {
		verdict := "" // hazard if any site is one, else clean if any is
		for _, s := range f.sites {
			named[s] = true
			if verdict != "hazard" && verdicts[s] != "" {
				verdict = verdicts[s]
			}
		}
		for _, sc := range []*score{get(perAnalyzer, f.analyzer), get(perRepo, f.at.repo)} {
			sc.findings++
			switch verdict {
			case "hazard":
				sc.truePos++
			case "clean":
				sc.fp++
			}
		}
		if verdict == "clean" {
			falseAlarms = append(falseAlarms, fmt.Sprintf("%s\t%s\t%d\t%s\t%s", f.at.repo, f.at.file, f.at.line, f.analyzer, f.message))
		}
		if verdict == "" {
			unjudged = append(unjudged, fmt.Sprintf("%s\t%s\t%d\t%s\t%s", f.at.repo, f.at.file, f.at.line, f.analyzer, f.message))
		}
	}
	for _, l := range labels {
		if l.verdict != "hazard" || l.source == "review" {
			continue // recall counts only hazards found without the tool
		}
		found := named[site{l.repo, l.file, l.line}]
		if !found {
			missed = append(missed, fmt.Sprintf("%s\t%s\t%d\t%s\t%s", l.repo, l.file, l.line, l.analyzer, l.reason))
		}
		for _, sc := range []*score{get(perAnalyzer, l.analyzer), get(perRepo, l.repo)} {
			sc.hazards++
			if found {
				sc.found++
			}
		}
	}
	var b strings.Builder
	table(&b, "analyzer", perAnalyzer)
	table(&b, "repository", perRepo)
	for _, list := range []struct {
		name  string
		lines []string
	}{{"missed hazards", missed}, {"false findings", falseAlarms}, {"unjudged findings", unjudged}} {
		slices.Sort(list.lines)
		fmt.Fprintf(&b, "\n%d %s:\n%s\n", len(list.lines), list.name, strings.Join(list.lines, "\n"))
	}
	t.Log("\n" + b.String())
	if out := os.Getenv("ROUNDOFF_CORPUS_REPORT"); out != "" {
		require.NoError(t, os.WriteFile(out, []byte(b.String()), 0o644))
	}
}

// table writes one Markdown table of scores, rows sorted by key.
func table(w io.Writer, key string, scores map[string]*score) {
	fmt.Fprintf(w, "\n| %s | findings | precision | recall |\n| --- | ---: | ---: | ---: |\n", key)
	var all score
	for _, k := range slices.Sorted(maps.Keys(scores)) {
		s := *scores[k]
		fmt.Fprintf(w, "| %s | %d | %s | %s |\n", k, s.findings, s.precision(), s.recall())
		all.hazards += s.hazards
		all.found += s.found
		all.findings += s.findings
		all.truePos += s.truePos
		all.fp += s.fp
	}
	fmt.Fprintf(w, "| all | %d | %s | %s |\n", all.findings, all.precision(), all.recall())
}

// secondRater holds the verdicts of a second reader who judged a random
// sample of 100 labelled sites (40 drawn from the hazards, 60 from the
// cleans) without seeing the first labels: repo, file, line, analyzer,
// verdict, reason.
const secondRater = "../../testdata/corpus/second-rater.tsv"

// TestLabelAgreement measures how far two independent readers agree on
// the labels, by Cohen's kappa (Cohen 1960: observed agreement corrected
// for the agreement two raters with the same verdict rates would reach by
// chance). Labels that readers cannot agree on would measure nothing; a
// kappa above 0.6 is conventionally read as substantial agreement (Landis
// & Koch 1977, quoted from memory).
func TestLabelAgreement(t *testing.T) {
	first := map[site]string{}
	for _, l := range readLabels(t) {
		first[site{l.repo, l.file, l.line}] = l.verdict
	}
	data, err := os.ReadFile(secondRater)
	require.NoError(t, err)
	r := csv.NewReader(bytes.NewReader(data))
	r.Comma, r.FieldsPerRecord, r.LazyQuotes = '\t', 6, true
	recs, err := r.ReadAll()
	require.NoError(t, err)
	var n, agree, hazard1, hazard2 float64
	for _, rec := range recs {
		line, err := strconv.Atoi(rec[2])
		require.NoError(t, err)
		v1 := first[site{rec[0], rec[1], line}]
		require.NotEmpty(t, v1, "%v has no first label", rec)
		n++
		if v1 == rec[4] {
			agree++
		}
		if v1 == "hazard" {
			hazard1++
		}
		if rec[4] == "hazard" {
			hazard2++
		}
	}
	po := agree / n
	pe := hazard1/n*hazard2/n + (1-hazard1/n)*(1-hazard2/n)
	kappa := (po - pe) / (1 - pe)
	t.Logf("%d sites, agreement %.2f, Cohen's kappa %.2f", int(n), po, kappa)
	require.Greater(t, kappa, 0.6)
}
