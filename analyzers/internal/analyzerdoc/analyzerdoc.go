// Package analyzerdoc takes an analyzer's Doc from its package's doc.go, so
// the explanation is written once.
package analyzerdoc

import (
	"strings"
)

// Extract returns the section of the package comment in src (the text of a
// doc.go file) headed "# Analyzer <name>", whose first line is
// "<name>: <title>"; the result starts at the title, the rest being the full
// explanation, as go/ast's CommentGroup.Text gives it (comment markers and
// the first space after them removed, trailing spaces trimmed, runs of
// empty lines reduced to one). It panics when the section is missing, which
// is a mistake in the analyzer's own source.
//
// It reads the lines itself rather than parsing src: every Doc is built
// when the program starts, and go vet starts roundoff once per package.
func Extract(src, name string) string {
	heading := "// # Analyzer " + name + "\n"
	i := strings.Index(src, heading)
	if i < 0 || (i > 0 && src[i-1] != '\n') {
		panic("analyzerdoc: doc.go has no section # Analyzer " + name)
	}
	var lines []string
	for line := range strings.Lines(src[i+len(heading):]) {
		text, ok := strings.CutPrefix(strings.TrimSuffix(line, "\n"), "//")
		if !ok || strings.HasPrefix(text, " # ") {
			break // the end of the comment, or the next section
		}
		text = strings.TrimRight(strings.TrimPrefix(text, " "), " \t")
		if text == "" && len(lines) > 0 && lines[len(lines)-1] == "" {
			continue
		}
		lines = append(lines, text)
	}
	section := strings.TrimSpace(strings.Join(lines, "\n"))
	title, ok := strings.CutPrefix(section, name+": ")
	if !ok {
		panic("analyzerdoc: section must start with \"" + name + ": <title>\"")
	}
	return title
}
