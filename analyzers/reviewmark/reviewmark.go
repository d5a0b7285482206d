package reviewmark

import (
	_ "embed"
	"fmt"
	"go/ast"
	"go/token"
	"slices"
	"strings"

	"golang.org/x/tools/go/analysis"

	"roundoff/analyzers/internal/analyzerdoc"
	"roundoff/analyzers/internal/fixes"
	"roundoff/internal/config"
)

//go:embed doc.go
var doc string

// Analyzer reports malformed review directives.
var Analyzer = &analysis.Analyzer{
	Name: "reviewmark",
	Doc:  analyzerdoc.Extract(doc, "reviewmark"),
	URL:  "docs/reviewmark.md",
	Run:  run,
}

// Categories of diagnostics, one per kind of mistake.
const (
	catNoReason = "noreason"
	catNoNames  = "nonames"
	catUnknown  = "unknown"
	catSpaced   = "spaced"
	catNoise    = "noise"
	catGlued    = "glued"
	catBlock    = "block"
	catEmpty    = "emptyname"
)

// spaced is a review directive written with a space after the slashes.
var spaced = "// " + strings.TrimPrefix(config.ReviewDirective, "//")

func run(pass *analysis.Pass) (any, error) {
	cfg := config.Current()
	for _, f := range pass.Files {
		for _, r := range config.Reviews(pass.Fset, f) {
			check(pass, cfg, r)
		}
		for _, g := range f.Comments {
			for _, c := range g.List {
				checkSpaced(pass, c)
				checkForm(pass, cfg, c)
			}
		}
		checkNoise(pass, f)
	}
	return nil, nil
}

// check reports the mistakes of one directive.
func check(pass *analysis.Pass, cfg *config.Config, r config.Review) {
	report := func(cat, format string, args ...any) {
		fixes.Report(pass, analysis.Diagnostic{Pos: r.Comment.Pos(), End: r.Comment.End(), Category: cat, Message: fmt.Sprintf(format, args...)})
	}
	if len(r.Names) == 0 {
		report(catNoNames, "review directive names no analyzer and suppresses nothing; write %s <analyzer> <reason>", config.ReviewDirective)
		return
	}
	if slices.Contains(r.Names, "") {
		report(catEmpty, "review directive has an empty analyzer name (a comma at the end of the names, or a space after a comma); write the names joined by commas without spaces, such as %s", strings.Join(cfg.Names()[:min(2, len(cfg.Names()))], ","))
	}
	for _, n := range r.Names {
		if n != "" && !cfg.Known(n) {
			report(catUnknown, "review directive names %q, which is not a roundoff analyzer (the suite has %s)", n, strings.Join(cfg.Names(), ", "))
		}
	}
	if r.Reason == "" {
		report(catNoReason, "review directive for %s gives no reason, so it suppresses nothing; say after the names why the hazard is acceptable", strings.Join(r.Names, ","))
	}
}

// checkSpaced reports a review directive with a space after the slashes.
func checkSpaced(pass *analysis.Pass, c *ast.Comment) {
	rest, ok := strings.CutPrefix(c.Text, spaced)
	if !ok || rest != "" && rest[0] != ' ' && rest[0] != '\t' {
		return // not the directive's word
	}
	space := c.Slash + token.Pos(len("//"))
	fixes.Report(pass, analysis.Diagnostic{
		Pos: c.Pos(), End: c.End(), Category: catSpaced,
		Message: fmt.Sprintf("comment %q is not a directive because of the space after //, so it suppresses nothing", spaced),
	}, fixes.Judgement("Remove the space after //", analysis.TextEdit{Pos: space, End: space + 1}))
}

// checkForm reports comments meant as review directives that are not
// one: the directive word glued to an analyzer name, or a block comment.
func checkForm(pass *analysis.Pass, cfg *config.Config, c *ast.Comment) {
	report := func(cat, msg string) {
		fixes.Report(pass, analysis.Diagnostic{Pos: c.Pos(), End: c.End(), Category: cat, Message: msg})
	}
	word, _, _ := strings.Cut(c.Text, " ")
	if glued, ok := strings.CutPrefix(word, config.ReviewDirective); ok && glued != "" {
		name, _, _ := strings.Cut(glued, ",")
		if slices.Contains(cfg.Names(), name) { // not a longer word such as reviewedness
			report(catGlued, fmt.Sprintf("comment %q is not a review directive: put a space between %s and the analyzer names", word, config.ReviewDirective))
		}
		return
	}
	inner, ok := strings.CutPrefix(c.Text, "/*")
	if _, _, isDirective := config.ParseReview("//" + strings.TrimSpace(strings.TrimSuffix(inner, "*/"))); ok && isDirective {
		report(catBlock, "review directives are // line comments; in a /* */ comment it suppresses nothing")
	}
}

// checkNoise reports noise directives that declare nothing: malformed, or
// outside a function's doc comment.
func checkNoise(pass *analysis.Pass, f *ast.File) {
	docs := make(map[*ast.CommentGroup]bool)
	for _, d := range f.Decls {
		if fd, ok := d.(*ast.FuncDecl); ok && fd.Doc != nil {
			docs[fd.Doc] = true
			if _, c, err := config.FindNoiseDirective(fd.Doc); err != nil {
				fixes.Report(pass, analysis.Diagnostic{Pos: c.Pos(), End: c.End(), Category: catNoise, Message: err.Error() + ", so it declares nothing"})
			}
		}
	}
	for _, g := range f.Comments {
		if _, c, _ := config.FindNoiseDirective(g); c != nil && !docs[g] {
			fixes.Report(pass, analysis.Diagnostic{Pos: c.Pos(), End: c.End(), Category: catNoise,
				Message: config.NoiseDirective + " declares a function's noise level only in its doc comment; here it declares nothing"})
		}
	}
}
