package noise

import (
	"bytes"
	"errors"
	"fmt"
	"go/ast"
	"go/parser"
	"go/token"
	"os"
	"path/filepath"

	"roundoff/internal/config"
)

// source is the file that declares the target, as read before measuring.
type source struct {
	path string
	data []byte
	mode os.FileMode
	fset *token.FileSet
	decl *ast.FuncDecl
}

// readSource reads and parses the target's file for -write.
func readSource(t *target) (*source, error) {
	if t.isVar {
		return nil, fmt.Errorf("-write: %s is a variable, and %s applies to function declarations: declare its level in roundoff.yaml (docs/noise.md)", t.name, config.NoiseDirective)
	}
	st, err := os.Stat(t.file)
	if err != nil {
		return nil, fmt.Errorf("-write: %v", err)
	}
	data, err := os.ReadFile(t.file)
	if err != nil {
		return nil, fmt.Errorf("-write: %v", err)
	}
	s := &source{path: t.file, data: data, mode: st.Mode().Perm(), fset: token.NewFileSet()}
	f, err := parser.ParseFile(s.fset, t.file, data, parser.ParseComments|parser.SkipObjectResolution)
	if err != nil {
		return nil, fmt.Errorf("-write: %v", err)
	}
	if ast.IsGenerated(f) {
		return nil, fmt.Errorf("-write: %s is generated (it says Code generated ... DO NOT EDIT): declare the level in its generator or in roundoff.yaml", t.file)
	}
	for _, d := range f.Decls {
		if fd, ok := d.(*ast.FuncDecl); ok && fd.Recv == nil && fd.Name.Name == t.name {
			s.decl = fd
		}
	}
	if s.decl == nil {
		return nil, fmt.Errorf("-write: no declaration of %s in %s", t.name, t.file)
	}
	return s, nil
}

// write puts the directive into the declaration's doc comment, replacing
// an existing one, and changes no other byte. It refuses when the file
// changed since it was read, and replaces the file atomically.
func (s *source) write(directive string) error {
	if directive == "" {
		return nil // a clean function needs none
	}
	now, err := os.ReadFile(s.path)
	if err != nil {
		return fmt.Errorf("-write: %v", err)
	}
	if !bytes.Equal(now, s.data) {
		return fmt.Errorf("-write: %s changed since roundoff noise read it; run again", s.path)
	}
	return replaceFile(s.path, s.edit(directive), s.mode)
}

// edit returns the file with the directive in place.
func (s *source) edit(directive string) []byte {
	off := func(p token.Pos) int { return s.fset.Position(p).Offset }
	eol := "\n"
	if bytes.Contains(s.data, []byte("\r\n")) {
		eol = "\r\n"
	}
	var at, end int
	var text string
	doc := s.decl.Doc
	if _, c, _ := config.FindNoiseDirective(doc); c != nil {
		at, end, text = off(c.Pos()), off(c.End()), directive
	} else if doc != nil {
		at, text = off(doc.End()), eol+"//"+eol+directive
		end = at
	} else {
		at = off(s.decl.Pos())
		at = bytes.LastIndexByte(s.data[:at], '\n') + 1 // the start of the line
		end, text = at, directive+eol
	}
	out := append([]byte(nil), s.data[:at]...)
	out = append(out, text...)
	return append(out, s.data[end:]...)
}

// replaceFile writes data to a temporary file beside path and renames it
// over path.
func replaceFile(path string, data []byte, mode os.FileMode) error {
	tmp, err := os.CreateTemp(filepath.Dir(path), "."+filepath.Base(path)+".roundoff-*")
	if err != nil {
		return fmt.Errorf("-write: %v", err)
	}
	_, werr := tmp.Write(data)
	err = errors.Join(werr, tmp.Chmod(mode), tmp.Sync(), tmp.Close())
	if err == nil {
		err = os.Rename(tmp.Name(), path)
	}
	if err != nil {
		os.Remove(tmp.Name())
		return fmt.Errorf("-write: %v", err)
	}
	return nil
}
