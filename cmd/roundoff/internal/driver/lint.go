package driver

import (
	"cmp"
	"errors"
	"flag"
	"fmt"
	"go/ast"
	"go/token"
	"os"
	"slices"
	"strings"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/checker"
	"golang.org/x/tools/go/packages"

	"roundoff/internal/config"
)

// lintCmd runs the standalone linter on the command line's packages.
func (e *env) lintCmd(args []string) int {
	o, err := e.parseFlags(args)
	if errors.Is(err, flag.ErrHelp) {
		return e.help(nil)
	}
	if err != nil {
		return e.errorf("%v (roundoff help lists the flags)", err)
	}
	return e.lint(o, e.cwd)
}

// A report is what one run found, before it is printed.
type report struct {
	cfg      *config.Config
	findings []*finding
	failed   bool                // some package did not load or analyze
	errors   []loadError         // the errors of loading them
	files    map[string]rootFile // the root packages' files, by name
	editable map[string]bool     // their Go source files, false when generated
	src      sources
	root     string // the project root: git work tree top or module root
}

// A rootFile is a file of a package named on the command line.
type rootFile struct {
	file  *ast.File
	res   *resolver
	pkgID string
}

// lint lints the packages that o names, loading them from dir.
func (e *env) lint(o *options, dir string) int {
	cfg, err := e.loadConfig(o.configFile, dir)
	if err != nil {
		return e.errorf("%v", err)
	}
	cfg.Select(o.selection())
	config.Use(cfg)
	config.KeepUnattendedOnly(false)
	var analyzers []*analysis.Analyzer
	for _, a := range e.analyzers {
		if cfg.Enabled(a.Name) {
			analyzers = append(analyzers, a)
		}
	}
	if len(analyzers) == 0 {
		return e.errorf("every analyzer is turned off (by flags or %s)", config.FileName)
	}
	bench, err := startBench()
	if err != nil {
		return e.errorf("%v", err)
	}
	defer bench.stop()
	analyzers = bench.suite(analyzers)
	sc, err := e.prepareScope(o, dir)
	if err != nil {
		return e.errorf("%v", err)
	}
	r := newReport(cfg, sc.root)
	pkgs, ok := e.load(o, dir, analyzers, r)
	if pkgs == nil {
		return exitErrors
	}
	r.failed = !ok
	graph, err := checker.Analyze(analyzers, pkgs, bench.options())
	if err := cmp.Or(err, bench.done(graph, e.stderr)); err != nil {
		return e.errorf("%v", err)
	}
	e.collect(r, graph)
	if o.staleReviews {
		e.staleReviews(r, analyzers)
	}
	return e.finish(o, r, sc)
}

func newReport(cfg *config.Config, root string) *report {
	return &report{cfg: cfg, src: sources{}, root: root, files: map[string]rootFile{}, editable: map[string]bool{}}
}

// loadConfig reads the configuration file named by -config, or else the
// one at the root of the module holding dir.
func (e *env) loadConfig(file, dir string) (*config.Config, error) {
	if file != "" {
		c, err := config.Read(file, names(e.analyzers))
		if errors.Is(err, os.ErrNotExist) {
			return nil, fmt.Errorf("-config %s: no such file", file)
		}
		return c, err
	}
	c, err := config.Load(moduleRoot(dir), names(e.analyzers))
	if cerr, ok := err.(*config.Error); ok {
		cerr.File = e.display(cerr.File)
	}
	return c, err
}

// load loads the packages o names, printing their errors and recording
// them in r; ok is false when some did not load or type-check, and pkgs
// nil when none did.
func (e *env) load(o *options, dir string, analyzers []*analysis.Analyzer, r *report) (pkgs []*packages.Package, ok bool) {
	mode := packages.LoadSyntax | packages.NeedModule
	if needFacts(analyzers) {
		mode = packages.LoadAllSyntax | packages.NeedModule
	}
	cfg := &packages.Config{Mode: mode, Tests: o.tests, Dir: dir, BuildFlags: o.buildFlags()}
	pkgs, err := packages.Load(cfg, o.patterns...)
	if err != nil {
		e.errorf("loading packages: %v", err)
		return nil, false
	}
	if len(pkgs) == 0 {
		e.errorf("%s matched no packages", strings.Join(o.patterns, " "))
		return nil, false
	}
	seen := map[string]bool{}
	packages.Visit(pkgs, nil, func(p *packages.Package) {
		for _, err := range compilerErrors(p.Errors) {
			le := loadErrorOf(err)
			if msg := e.errorLine(le); !seen[msg] {
				seen[msg] = true
				fmt.Fprintln(e.stderr, msg)
				r.errors = append(r.errors, le)
			}
		}
	})
	return pkgs, len(seen) == 0
}

// compilerErrors returns the errors of a package as the compiler reports
// them: when a file does not parse, only the first syntax error of each
// file (what follows it, syntax or type errors, is mostly its echo).
func compilerErrors(errs []packages.Error) []packages.Error {
	if !slices.ContainsFunc(errs, func(e packages.Error) bool { return e.Kind == packages.ParseError }) {
		return errs
	}
	var out []packages.Error
	files := map[string]bool{}
	for _, e := range errs {
		file, _, _ := strings.Cut(e.Pos, ":")
		if e.Kind == packages.ParseError && !files[file] {
			files[file] = true
			out = append(out, e)
		}
	}
	return out
}

// A loadError is an error of loading or type-checking a package.
type loadError struct {
	posn token.Position // invalid when the error has no position
	msg  string
}

// errorLine formats l as file:line:col: message, the file relative to
// the current directory.
func (e *env) errorLine(l loadError) string {
	if !l.posn.IsValid() {
		return "roundoff: " + l.msg
	}
	return e.position(l.posn) + ": " + l.msg
}

// loadErrorOf resolves the position of a package error (file:line:col or
// file:line).
func loadErrorOf(err packages.Error) loadError {
	le := loadError{msg: err.Msg}
	rest, n, ok := cutLastInt(err.Pos)
	if !ok {
		return le
	}
	if file, line, ok := cutLastInt(rest); ok {
		le.posn = token.Position{Filename: file, Line: line, Column: n}
	} else {
		le.posn = token.Position{Filename: rest, Line: n, Column: 1}
	}
	return le
}

// needFacts reports whether an analyzer, or one it requires, uses facts,
// for which dependencies must be loaded from source.
func needFacts(analyzers []*analysis.Analyzer) bool {
	seen := map[*analysis.Analyzer]bool{}
	var visit func([]*analysis.Analyzer) bool
	visit = func(as []*analysis.Analyzer) bool {
		for _, a := range as {
			if !seen[a] {
				seen[a] = true
				if len(a.FactTypes) > 0 || visit(a.Requires) {
					return true
				}
			}
		}
		return false
	}
	return visit(analyzers)
}

// collect gathers the findings of the root actions, once each, in order,
// and prints the failures of analyzers.
func (e *env) collect(r *report, graph *checker.Graph) {
	seen := map[key]bool{}
	for _, act := range graph.Roots {
		pkg := act.Package
		res := r.resolver(pkg)
		if act.Err != nil {
			if !pkg.IllTyped { // ill-typed packages were reported when loaded
				e.errorf("%s on %s: %v", act.Analyzer.Name, pkg.ID, act.Err)
				r.failed = true
			}
			continue
		}
		for _, d := range act.Diagnostics {
			f := res.newFinding(act.Analyzer, pkg.ID, d)
			if k := f.key(); !seen[k] {
				seen[k] = true
				r.findings = append(r.findings, f)
			}
		}
	}
	slices.SortFunc(r.findings, compare)
}

// resolver returns the resolver of pkg's positions, recording its files.
func (r *report) resolver(pkg *packages.Package) *resolver {
	res := &resolver{fset: pkg.Fset, files: pkg.Syntax, sources: map[string]bool{}, src: r.src}
	for _, name := range pkg.GoFiles {
		res.sources[name] = true
		r.editable[name] = true
	}
	for _, f := range pkg.Syntax {
		name := pkg.Fset.File(f.FileStart).Name()
		if r.files[name].file == nil {
			r.files[name] = rootFile{f, res, pkg.ID}
		}
		if res.sources[name] && ast.IsGenerated(f) {
			r.editable[name] = false
		}
	}
	return res
}
