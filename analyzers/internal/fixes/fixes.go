// Package fixes builds roundoff's suggested fixes: text edits over existing
// positions, the import they need, and the policy that decides which fixes
// may be applied without a person reading them.
package fixes

import (
	"bytes"
	"go/ast"
	"go/format"
	"go/token"
	"go/types"
	"strconv"
	"strings"

	"golang.org/x/tools/go/analysis"

	"roundoff/internal/config"
)

// A Fix is a suggested fix together with whether it is safe to apply
// unattended, as `go fix` and `go vet -fix` do: a safe fix keeps the
// program's meaning apart from the hazard it removes; any other fix carries
// a judgement (a tolerance, a step) that a person should confirm.
type Fix struct {
	analysis.SuggestedFix
	Unattended bool
}

// Safe returns a fix that may be applied without review.
func Safe(msg string, edits ...analysis.TextEdit) Fix {
	return Fix{analysis.SuggestedFix{Message: msg, TextEdits: edits}, true}
}

// Judgement returns a fix that embodies a numerical choice and needs review.
func Judgement(msg string, edits ...analysis.TextEdit) Fix {
	return Fix{analysis.SuggestedFix{Message: msg, TextEdits: edits}, false}
}

// Report reports d with the given fixes, safe ones first, leaving out the
// ones that need review when the driver asked for unattended fixes only.
// It is the one place where findings are dropped in every mode: when the
// run's configuration turns the analyzer off or excludes the file, and
// when a review directive (see ReviewDirective) covers the finding.
func Report(pass *analysis.Pass, d analysis.Diagnostic, fs ...Fix) {
	if dropped(pass, d) {
		return
	}
	for _, safe := range []bool{true, false} {
		for _, f := range fs {
			if f.Unattended == safe && (safe || !config.UnattendedOnly()) {
				d.SuggestedFixes = append(d.SuggestedFixes, f.SuggestedFix)
			}
		}
	}
	pass.Report(d)
}

// Replace returns the edit that replaces node n with text.
func Replace(n ast.Node, text string) analysis.TextEdit {
	return analysis.TextEdit{Pos: n.Pos(), End: n.End(), NewText: []byte(text)}
}

// Source returns n printed in gofmt style, without comments.
func Source(fset *token.FileSet, n ast.Node) string {
	var buf bytes.Buffer
	if err := format.Node(&buf, fset, n); err != nil {
		panic(err) // n came from the parser, so it always prints
	}
	return buf.String()
}

// Operand returns expression e printed for use as an operand of a binary
// operator of precedence prec (go/token's scale: 4 for + and -, 5 for * and
// /): parenthesised when it is a binary expression binding less tightly.
// Pass prec+1 for the right operand of a non-associative operator such as -.
func Operand(fset *token.FileSet, e ast.Expr, prec int) string {
	if b, ok := ast.Unparen(e).(*ast.BinaryExpr); ok && b.Op.Precedence() < prec {
		return "(" + Source(fset, b) + ")"
	}
	return Source(fset, ast.Unparen(e))
}

// Import returns the name under which file refers to the package at path,
// adding the import when it is missing. The name must resolve to that
// package at pos; ok is false when a local declaration shadows it, in which
// case the caller offers no fix.
func Import(info *types.Info, file *ast.File, pos token.Pos, path string) (name string, edits []analysis.TextEdit, ok bool) {
	for _, spec := range file.Imports {
		if p, _ := strconv.Unquote(spec.Path.Value); p != path {
			continue
		}
		name = defaultName(path)
		if spec.Name != nil {
			name = spec.Name.Name
		}
		if name != "_" && name != "." { // a blank or dot import is no use by name
			return name, nil, resolvesTo(info, file, pos, name, path)
		}
	}
	name = defaultName(path)
	if !resolvesTo(info, file, pos, name, "") {
		return "", nil, false // the name is taken by something else
	}
	return name, []analysis.TextEdit{importEdit(file, path)}, true
}

// defaultName returns the name a standard-library import path declares:
// its last element, or the one before a major-version suffix (math/rand/v2).
func defaultName(path string) string {
	elems := strings.Split(path, "/")
	last := elems[len(elems)-1]
	if len(elems) > 1 && len(last) > 1 && last[0] == 'v' && strings.Trim(last[1:], "0123456789") == "" {
		return elems[len(elems)-2]
	}
	return last
}

// resolvesTo reports whether name at pos refers to the package at path,
// or, with path "", whether name is free at pos.
func resolvesTo(info *types.Info, file *ast.File, pos token.Pos, name, path string) bool {
	scope := info.Scopes[file]
	if scope == nil {
		return false
	}
	inner := scope.Innermost(pos)
	if inner == nil {
		inner = scope
	}
	_, obj := inner.LookupParent(name, pos)
	if path == "" {
		return obj == nil || obj.Parent() == types.Universe
	}
	pkg, ok := obj.(*types.PkgName)
	return ok && pkg.Imported().Path() == path
}

// importEdit returns the edit that adds an import of path to file, in
// sorted position within the first import declaration when there is one.
func importEdit(file *ast.File, path string) analysis.TextEdit {
	quoted := strconv.Quote(path)
	for _, decl := range file.Decls {
		gen, ok := decl.(*ast.GenDecl)
		if !ok || gen.Tok != token.IMPORT {
			continue
		}
		if !gen.Lparen.IsValid() { // import "x": turn into a group of two
			spec := gen.Specs[0].(*ast.ImportSpec)
			if spec.Path.Value > quoted {
				return analysis.TextEdit{Pos: gen.Pos(), End: gen.Pos(), NewText: []byte("import " + quoted + "\n")}
			}
			return analysis.TextEdit{Pos: gen.End(), End: gen.End(), NewText: []byte("\nimport " + quoted)}
		}
		return groupEdit(gen, quoted)
	}
	end := file.Name.End()
	return analysis.TextEdit{Pos: end, End: end, NewText: []byte("\n\nimport " + quoted)}
}

// groupEdit adds quoted (a standard-library path) to a parenthesised import
// declaration, on a line of its own: before the first import that follows
// the last standard-library import sorting before it (or before the first
// import), else at the end of the group. Inserting before a spec keeps
// trailing comments with the imports they belong to.
func groupEdit(gen *ast.GenDecl, quoted string) analysis.TextEdit {
	at := 0
	for i, s := range gen.Specs {
		spec := s.(*ast.ImportSpec)
		if spec.Path.Value < quoted && !strings.Contains(strings.SplitN(spec.Path.Value, "/", 2)[0], ".") {
			at = i + 1
		}
	}
	if at < len(gen.Specs) {
		pos := gen.Specs[at].Pos()
		if doc := gen.Specs[at].(*ast.ImportSpec).Doc; doc != nil {
			pos = doc.Pos()
		}
		return analysis.TextEdit{Pos: pos, End: pos, NewText: []byte(quoted + "\n\t")}
	}
	return analysis.TextEdit{Pos: gen.Rparen, End: gen.Rparen, NewText: []byte("\t" + quoted + "\n")}
}
