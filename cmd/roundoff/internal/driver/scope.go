package driver

import (
	"fmt"
	"slices"

	"golang.org/x/tools/go/analysis"

	"roundoff/analyzers/reviewmark"
	"roundoff/internal/config"
)

// A scope is what limits the findings shown: the changed lines and the
// baseline, read before the packages are loaded so that bad input fails
// fast.
type scope struct {
	root     string        // the project root, when paths are shown relative to it
	changed  *changedLines // nil: every line
	baseline *baseline     // nil: none
}

// prepareScope reads the scope controls of o.
func (e *env) prepareScope(o *options, dir string) (*scope, error) {
	sc := &scope{changed: o.changed}
	var err error
	if o.since != "" {
		if sc.changed, err = changedSince(dir, o.since); err != nil {
			return nil, fmt.Errorf("-since %s: %v", o.since, err)
		}
	}
	switch {
	case sc.changed != nil:
		sc.root = sc.changed.root
	case o.format == "sarif" || o.format == "github" || o.baseline != "" || o.writeBaseline != "":
		if sc.root, err = gitRoot(dir); err != nil {
			sc.root = moduleRoot(dir)
		}
	}
	if o.baseline != "" {
		if sc.baseline, err = readBaseline(o.baseline); err != nil {
			return nil, err
		}
	}
	if o.writeBaseline != "" {
		if err := checkBaselineTarget(o.writeBaseline); err != nil {
			return nil, err
		}
	}
	return sc, nil
}

// finish applies the scope to r's findings and writes the outcome: a
// baseline, fixes, or the findings in the chosen format.
func (e *env) finish(o *options, r *report, sc *scope) int {
	if o.writeBaseline != "" {
		return e.writeBaseline(o.writeBaseline, r)
	}
	if sc.baseline != nil { // over every finding, so that entries out of scope are not stale
		e.applyBaseline(r, o.baseline, sc.baseline)
	}
	if sc.changed != nil {
		r.findings = keep(r.findings, func(f *finding) bool { return sc.changed.touches(f) })
	}
	var code int
	switch {
	case o.fix && !o.diff && r.failed:
		return e.errorf("no fixes applied, as some packages did not load (see above); fix those errors or name only the packages that load")
	case o.fix:
		code = e.applyFixes(r, o.diff)
	default:
		code = e.print(o.format, r)
	}
	if r.failed {
		return exitErrors
	}
	return code
}

// keep returns the findings for which ok holds.
func keep(fs []*finding, ok func(*finding) bool) []*finding {
	var out []*finding
	for _, f := range fs {
		if ok(f) {
			out = append(out, f)
		}
	}
	return out
}

// staleReviews adds a reviewmark finding for every review directive with
// a reason, in the root packages, that suppressed no finding of an
// analyzer it names among those that ran.
func (e *env) staleReviews(r *report, ran []*analysis.Analyzer) {
	for name, rf := range r.files {
		if r.cfg.Excluded(name) {
			continue
		}
		for _, rev := range config.Reviews(rf.res.fset, rf.file) {
			for _, a := range rev.Names {
				if rev.Reason == "" || !slices.ContainsFunc(ran, func(x *analysis.Analyzer) bool { return x.Name == a }) || config.ReviewUsed(name, rev.Line, a) {
					continue
				}
				d := analysis.Diagnostic{Pos: rev.Comment.Pos(), End: rev.Comment.End(), Category: staleCategory,
					Message: fmt.Sprintf("review directive for %s suppresses no finding on its line or the next; remove %s from it", a, a)}
				r.findings = append(r.findings, rf.res.newFinding(reviewmark.Analyzer, rf.pkgID, d))
			}
		}
	}
	slices.SortFunc(r.findings, compare)
}

// staleCategory is the category of the findings of -stale-reviews.
const staleCategory = "stale"
