// Package analyzerdoc takes an analyzer's Doc from its package's doc.go, so
// the explanation is written once.
package analyzerdoc

import (
	"go/parser"
	"go/token"
	"strings"
)

// Extract returns the section of the package comment in src (the text of a
// doc.go file) headed "# Analyzer <name>", whose first line is
// "<name>: <title>"; the result starts at the title, the rest being the full
// explanation. It panics when the
// section is missing, which is a mistake in the analyzer's own source.
func Extract(src, name string) string {
	f, err := parser.ParseFile(token.NewFileSet(), "doc.go", src, parser.ParseComments|parser.PackageClauseOnly)
	if err != nil || f.Doc == nil {
		panic("analyzerdoc: doc.go has no package comment")
	}
	text := f.Doc.Text()
	heading := "# Analyzer " + name + "\n"
	i := strings.Index(text, heading)
	if i < 0 {
		panic("analyzerdoc: doc.go has no section " + strings.TrimSpace(heading))
	}
	section := text[i+len(heading):]
	if j := strings.Index(section, "\n# "); j >= 0 {
		section = section[:j]
	}
	section = strings.TrimSpace(section)
	title, ok := strings.CutPrefix(section, name+": ")
	if !ok {
		panic("analyzerdoc: section must start with \"" + name + ": <title>\"")
	}
	return title
}
