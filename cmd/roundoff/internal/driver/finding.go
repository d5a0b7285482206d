package driver

import (
	"bytes"
	"cmp"
	"crypto/sha256"
	"encoding/hex"
	"go/ast"
	"go/token"
	"os"
	"strings"
	"unicode"

	"golang.org/x/tools/go/analysis"
)

// A finding is one diagnostic, with its positions resolved in the file
// on disk (line directives ignored) so that it can be matched, printed
// and fixed without its package's file set.
type finding struct {
	analyzer *analysis.Analyzer
	pkgID    string
	diag     analysis.Diagnostic
	posn     token.Position
	end      token.Position // invalid when the diagnostic has no end
	function string         // enclosing function, Type.Method or ""
	related  []place
	fixes    []fix
}

// A place is a position with its message, for related information.
type place struct {
	posn, end token.Position
	message   string
}

// A fix is a suggested fix as edits of files by byte offset.
type fix struct {
	message string
	edits   []edit
}

// An edit replaces bytes [start, end) of file with text.
type edit struct {
	file       string
	start, end int
	text       string
}

// A resolver resolves the positions of one package's syntax in the files
// on disk. A package's own Go files are read as they are, line directives
// ignored; the files cgo generates from them are mapped back to the
// source through their line directives, as go vet shows them.
type resolver struct {
	fset    *token.FileSet
	files   []*ast.File
	sources map[string]bool // the package's Go files
	src     sources
}

// position returns the position of pos in a source file of the package.
func (r *resolver) position(pos token.Pos) token.Position {
	p := r.fset.PositionFor(pos, false)
	if r.sources[p.Filename] {
		return p
	}
	q := r.fset.PositionFor(pos, true)
	if !r.sources[q.Filename] {
		return p // no directive leads back to a source file
	}
	q.Offset = r.src.offset(q.Filename, q.Line, q.Column)
	return q
}

// edit converts te to byte offsets in a source file of the package; ok is
// false when te lies in a generated file and its bytes are not the same
// bytes of the source that the line directives map it to.
func (r *resolver) edit(te analysis.TextEdit) (ed edit, ok bool) {
	start, end := r.fset.PositionFor(te.Pos, false), r.fset.PositionFor(cmp.Or(te.End, te.Pos), false)
	ed = edit{start.Filename, start.Offset, end.Offset, string(te.NewText)}
	if r.sources[start.Filename] {
		return ed, true
	}
	s, e := r.position(te.Pos), r.position(cmp.Or(te.End, te.Pos))
	gen, src := r.src.data(start.Filename), r.src.data(s.Filename)
	if !r.sources[s.Filename] || e.Filename != s.Filename || e.Offset-s.Offset != end.Offset-start.Offset ||
		e.Offset > len(src) || end.Offset > len(gen) || !bytes.Equal(src[s.Offset:e.Offset], gen[start.Offset:end.Offset]) {
		return edit{}, false
	}
	return edit{s.Filename, s.Offset, e.Offset, ed.text}, true
}

// newFinding resolves d, reported by a on package pkgID.
func (r *resolver) newFinding(a *analysis.Analyzer, pkgID string, d analysis.Diagnostic) *finding {
	f := &finding{analyzer: a, pkgID: pkgID, diag: d, posn: r.position(d.Pos)}
	if d.End.IsValid() {
		f.end = r.position(d.End)
	}
	f.function = enclosingFunc(r.files, d.Pos)
	for _, rel := range d.Related {
		p := place{posn: r.position(rel.Pos), message: rel.Message}
		if rel.End.IsValid() {
			p.end = r.position(rel.End)
		}
		f.related = append(f.related, p)
	}
fixes:
	for _, sf := range d.SuggestedFixes {
		fx := fix{message: sf.Message}
		for _, te := range sf.TextEdits {
			ed, ok := r.edit(te)
			if !ok {
				continue fixes // a fix that cannot be mapped to the source is not offered
			}
			fx.edits = append(fx.edits, ed)
		}
		f.fixes = append(f.fixes, fx)
	}
	return f
}

// key identifies a finding across the packages that share its file (a
// package and its test variant).
type key struct {
	file        string
	offset, end int
	analyzer    string
	message     string
}

func (f *finding) key() key {
	return key{f.posn.Filename, f.posn.Offset, f.end.Offset, f.analyzer.Name, f.diag.Message}
}

// compare orders findings by file, position, analyzer and message.
func compare(a, b *finding) int {
	return cmp.Or(
		cmp.Compare(a.posn.Filename, b.posn.Filename),
		cmp.Compare(a.posn.Offset, b.posn.Offset),
		cmp.Compare(a.analyzer.Name, b.analyzer.Name),
		cmp.Compare(a.diag.Message, b.diag.Message))
}

// enclosingFunc returns the name of the function declaration around pos
// (Type.Method for a method), or "" outside functions.
func enclosingFunc(files []*ast.File, pos token.Pos) string {
	for _, file := range files {
		if pos < file.FileStart || pos > file.FileEnd {
			continue
		}
		for _, decl := range file.Decls {
			fn, ok := decl.(*ast.FuncDecl)
			if !ok || pos < fn.Pos() || pos >= fn.End() {
				continue
			}
			if fn.Recv != nil && len(fn.Recv.List) == 1 {
				return recvName(fn.Recv.List[0].Type) + "." + fn.Name.Name
			}
			return fn.Name.Name
		}
	}
	return ""
}

// recvName returns the base type name of a receiver type expression.
func recvName(t ast.Expr) string {
	for {
		switch x := t.(type) {
		case *ast.StarExpr:
			t = x.X
		case *ast.ParenExpr:
			t = x.X
		case *ast.IndexExpr:
			t = x.X
		case *ast.IndexListExpr:
			t = x.X
		case *ast.Ident:
			return x.Name
		default:
			return "?"
		}
	}
}

// sources caches the files findings are in.
type sources map[string]*srcFile

type srcFile struct {
	data  []byte
	lines []string
}

// file returns the cached file, empty when unreadable.
func (s sources) file(filename string) *srcFile {
	f, ok := s[filename]
	if !ok {
		data, _ := os.ReadFile(filename)
		f = &srcFile{data, strings.Split(string(data), "\n")}
		s[filename] = f
	}
	return f
}

// data returns the contents of filename, none when unreadable.
func (s sources) data(filename string) []byte { return s.file(filename).data }

// lines returns the lines of filename, none when unreadable.
func (s sources) lines(filename string) []string { return s.file(filename).lines }

// line returns line n (1-based) of filename, "" when unreadable.
func (s sources) line(filename string, n int) string {
	lines := s.lines(filename)
	if n < 1 || n > len(lines) {
		return ""
	}
	return lines[n-1]
}

// offset returns the byte offset of line and byte column col of filename.
func (s sources) offset(filename string, line, col int) int {
	off := col - 1
	for _, text := range s.lines(filename)[:max(0, min(line-1, len(s.lines(filename))))] {
		off += len(text) + 1
	}
	return off
}

// fingerprint identifies f by what survives unrelated edits: its source
// line with all white space removed and its enclosing function, not its
// line number, and so too the source lines of its related places, so
// that changing one of them (the tolerance value a test reads) makes the
// finding new. 16 hex digits (64 bits of SHA-256).
func (f *finding) fingerprint(src sources) string {
	squeeze := func(posn token.Position) string {
		return strings.Map(func(r rune) rune {
			if unicode.IsSpace(r) {
				return -1
			}
			return r
		}, src.line(posn.Filename, posn.Line))
	}
	text := squeeze(f.posn) + "\x00" + f.function
	for _, p := range f.related {
		text += "\x00" + squeeze(p.posn)
	}
	sum := sha256.Sum256([]byte(text))
	return hex.EncodeToString(sum[:8])
}

// column converts the byte column of posn to a column counted in Unicode
// code points, as SARIF's columnKind unicodeCodePoints and GitHub count.
func (s sources) column(posn token.Position) int {
	line := s.line(posn.Filename, posn.Line)
	if posn.Column-1 > len(line) {
		return posn.Column
	}
	return len([]rune(line[:posn.Column-1])) + 1
}

// offsetPosition returns the line and byte column of a byte offset
// (clamped to the end of the file).
func (s sources) offsetPosition(filename string, offset int) token.Position {
	lines := s.lines(filename)
	for i, text := range lines {
		if offset <= len(text) || i == len(lines)-1 {
			return token.Position{Filename: filename, Line: i + 1, Column: min(offset, len(text)) + 1}
		}
		offset -= len(text) + 1
	}
	return token.Position{Filename: filename, Line: 1, Column: 1}
}
