package fixes

import (
	"go/ast"
	"go/token"
	"regexp"
	"strings"

	"golang.org/x/tools/go/ast/inspector"
)

// exactWords are the words by which code says a comparison is meant to be
// exact.
var exactWords = regexp.MustCompile(`(?i)\b(exact|exactly|exactness|bit[- ]?for[- ]?bit|bitwise|bit[- ]?identical)\b`)

// SaysExact reports whether the code around the node at cur says that it
// compares exactly: a string literal in the enclosing statement (an error
// message such as "want exactly %v") or a comment on its lines or on the
// line above mentions exactness. A fix that loosens the comparison to a
// tolerance would leave that text untrue, so none is offered there.
// Expectation comments of analysis tests ("want ...") are not read.
func SaysExact(fset *token.FileSet, file *ast.File, cur inspector.Cursor) bool {
	stmt := cur
	for c := range cur.Enclosing() {
		if _, ok := c.Node().(ast.Stmt); ok {
			stmt = c
			break
		}
	}
	return says(fset, file, stmt.Node())
}

// FuncSaysExact reports whether the function declaration around cur says,
// in its doc comment, its comments or its strings, that it checks
// exactness: a test of what correctly rounded arithmetic guarantees.
func FuncSaysExact(fset *token.FileSet, file *ast.File, cur inspector.Cursor) bool {
	for fd := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		return says(fset, file, fd.Node())
	}
	return false
}

// says reports whether n's string literals, or comments on its lines or on
// the line above, mention exactness.
func says(fset *token.FileSet, file *ast.File, n ast.Node) bool {
	found := false
	ast.Inspect(n, func(m ast.Node) bool {
		if lit, ok := m.(*ast.BasicLit); ok && lit.Kind == token.STRING && exactWords.MatchString(lit.Value) {
			found = true
		}
		return !found
	})
	if found || file == nil {
		return found
	}
	first, last := fset.Position(n.Pos()).Line-1, fset.Position(n.End()).Line
	for _, g := range file.Comments {
		line := fset.Position(g.End()).Line
		text := g.Text()
		if line >= first && fset.Position(g.Pos()).Line <= last && !strings.HasPrefix(text, "want ") && exactWords.MatchString(text) {
			return true
		}
	}
	return false
}
