package fixes_test

import (
	"go/ast"
	"go/constant"
	"go/format"
	"go/importer"
	"go/parser"
	"go/token"
	"go/types"
	"slices"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/analysis"

	"roundoff/analyzers/internal/fixes"
	"roundoff/internal/config"
)

// The facts checked here are about Go source text, not numbers: the
// reference is the Go toolchain itself (go/parser, go/format, go/types).

func messages(fs []analysis.SuggestedFix) []string {
	var out []string
	for _, f := range fs {
		out = append(out, f.Message)
	}
	return out
}

func TestReportOrderAndFilter(t *testing.T) {
	var got []analysis.Diagnostic
	pass := &analysis.Pass{Report: func(d analysis.Diagnostic) { got = append(got, d) }}
	fs := []fixes.Fix{fixes.Judgement("j1"), fixes.Safe("s1"), fixes.Judgement("j2"), fixes.Safe("s2")}
	assert.False(t, fs[0].Unattended)
	assert.True(t, fs[1].Unattended)

	t.Cleanup(func() { config.KeepUnattendedOnly(false) })
	config.KeepUnattendedOnly(false)
	fixes.Report(pass, analysis.Diagnostic{Message: "all"}, fs...)
	config.KeepUnattendedOnly(true)
	fixes.Report(pass, analysis.Diagnostic{Message: "safe only"}, fs...)
	fixes.Report(pass, analysis.Diagnostic{Message: "judgement only"}, fs[0], fs[2])
	config.KeepUnattendedOnly(false)
	fixes.Report(pass, analysis.Diagnostic{Message: "none"})

	require.Len(t, got, 4)
	assert.Equal(t, []string{"s1", "s2", "j1", "j2"}, messages(got[0].SuggestedFixes), "safe first, stable")
	assert.Equal(t, []string{"s1", "s2"}, messages(got[1].SuggestedFixes))
	assert.Empty(t, got[2].SuggestedFixes, "diagnostic still reported without fixes")
	assert.Equal(t, "judgement only", got[2].Message)
	assert.Empty(t, got[3].SuggestedFixes)
}

func parseExpr(t *testing.T, src string) (*token.FileSet, ast.Expr) {
	fset := token.NewFileSet()
	e, err := parser.ParseExprFrom(fset, "e.go", src, 0)
	require.NoError(t, err)
	return fset, e
}

func TestOperandSourceReplace(t *testing.T) {
	// Operator precedences are the Go specification's: * and / bind at 5,
	// + and - at 4, comparisons at 3.
	for _, c := range []struct {
		src  string
		prec int
		want string
	}{
		{"a+b", 5, "(a + b)"}, // a sum under a product needs parentheses
		{"a+b", 4, "a + b"},   // left of a minus it does not
		{"(a+b)", 4, "a + b"}, // redundant parentheses go
		{"a-b", 5, "(a - b)"}, // right of a minus (prec+1) it does
		{"a*b", 5, "a * b"},   // a product binds tighter than any sum
		{"-x", 5, "-x"},       // unary operators bind tightest
		{"x", 5, "x"},
		{"f(x)", 5, "f(x)"},
		{"s[i]", 5, "s[i]"},
		{"x.y", 5, "x.y"},
		{"1e-8", 5, "1e-8"},
	} {
		fset, e := parseExpr(t, c.src)
		assert.Equal(t, c.want, fixes.Operand(fset, e, c.prec), c.src)
	}
	fset, e := parseExpr(t, "a  *   b")
	assert.Equal(t, "a * b", fixes.Source(fset, e))
	ed := fixes.Replace(e, "c")
	assert.Equal(t, e.Pos(), ed.Pos)
	assert.Equal(t, e.End(), ed.End)
	assert.Equal(t, "c", string(ed.NewText))
}

// fakeImporter serves the standard library from export data and invents
// any non-standard package (a dot in the first path element) with a
// constant C, so files with third-party imports type-check.
type fakeImporter struct{ std types.Importer }

func (i fakeImporter) Import(path string) (*types.Package, error) {
	if !strings.Contains(strings.Split(path, "/")[0], ".") {
		return i.std.Import(path)
	}
	p := types.NewPackage(path, path[strings.LastIndex(path, "/")+1:])
	p.Scope().Insert(types.NewConst(token.NoPos, p, "C", types.Typ[types.UntypedInt], constant.MakeInt64(1)))
	p.MarkComplete()
	return p, nil
}

var imp = fakeImporter{importer.Default()}

func check(t *testing.T, src string) (*token.FileSet, *ast.File, *types.Info) {
	t.Helper()
	fset := token.NewFileSet()
	f, err := parser.ParseFile(fset, "p.go", src, parser.ParseComments)
	require.NoError(t, err, src)
	info := &types.Info{Scopes: map[ast.Node]*types.Scope{}, Defs: map[*ast.Ident]types.Object{}, Uses: map[*ast.Ident]types.Object{}}
	_, err = (&types.Config{Importer: imp}).Check("p", fset, []*ast.File{f}, info)
	require.NoError(t, err, src)
	return fset, f, info
}

// apply applies edits to src (positions from fset), last first.
func apply(fset *token.FileSet, src string, edits []analysis.TextEdit) string {
	slices.SortFunc(edits, func(a, b analysis.TextEdit) int { return int(b.Pos - a.Pos) })
	for _, e := range edits {
		start, end := fset.Position(e.Pos).Offset, fset.Position(e.End).Offset
		src = src[:start] + string(e.NewText) + src[end:]
	}
	return src
}

func mathImports(f *ast.File) int {
	n := 0
	for _, s := range f.Imports {
		if p, _ := strconv.Unquote(s.Path.Value); p == "math" {
			n++
		}
	}
	return n
}

// The marker literal 4.0 is where a fix wants math.Sqrt(4.0).
const marker = "4.0"

func TestImport(t *testing.T) {
	for _, c := range []struct {
		name, src, want, id string
		edits               bool
	}{
		{"a no imports", "package p\n\nfunc f() float64 { return 4.0 }\n",
			"package p\n\nimport \"math\"\n\nfunc f() float64 { return math.Sqrt(4.0) }\n", "math", true},
		{"b single fmt", "package p\n\nimport \"fmt\"\n\nvar _ = fmt.Sprint\n\nfunc f() float64 { return 4.0 }\n",
			"package p\n\nimport \"fmt\"\nimport \"math\"\n\nvar _ = fmt.Sprint\n\nfunc f() float64 { return math.Sqrt(4.0) }\n", "math", true},
		{"c single strings", "package p\n\nimport \"strings\"\n\nvar _ = strings.ToUpper\n\nfunc f() float64 { return 4.0 }\n",
			"package p\n\nimport \"math\"\nimport \"strings\"\n\nvar _ = strings.ToUpper\n\nfunc f() float64 { return math.Sqrt(4.0) }\n", "math", true},
		{"d std and third-party groups",
			"package p\n\nimport (\n\t\"fmt\"\n\t\"strings\"\n\n\t\"example.com/y\"\n)\n\nvar _, _, _ = fmt.Sprint, strings.ToUpper, y.C\n\nfunc f() float64 { return 4.0 }\n",
			"package p\n\nimport (\n\t\"fmt\"\n\t\"math\"\n\t\"strings\"\n\n\t\"example.com/y\"\n)\n\nvar _, _, _ = fmt.Sprint, strings.ToUpper, y.C\n\nfunc f() float64 { return math.Sqrt(4.0) }\n", "math", true},
		{"d2 std all after math",
			"package p\n\nimport (\n\t\"os\"\n\t\"strings\"\n)\n\nvar _, _ = os.Exit, strings.ToUpper\n\nfunc f() float64 { return 4.0 }\n",
			"package p\n\nimport (\n\t\"math\"\n\t\"os\"\n\t\"strings\"\n)\n\nvar _, _ = os.Exit, strings.ToUpper\n\nfunc f() float64 { return math.Sqrt(4.0) }\n", "math", true},
		{"d3 third-party only",
			"package p\n\nimport (\n\t\"example.com/y\"\n)\n\nvar _ = y.C\n\nfunc f() float64 { return 4.0 }\n",
			"package p\n\nimport (\n\t\"example.com/y\"\n\t\"math\"\n)\n\nvar _ = y.C\n\nfunc f() float64 { return math.Sqrt(4.0) }\n", "math", true},
		{"d5 comments stay with their imports",
			"package p\n\nimport (\n\t\"fmt\" // printing\n\t// strings doc\n\t\"strings\"\n)\n\nvar _, _ = fmt.Sprint, strings.ToUpper\n\nfunc f() float64 { return 4.0 }\n",
			"package p\n\nimport (\n\t\"fmt\" // printing\n\t\"math\"\n\t// strings doc\n\t\"strings\"\n)\n\nvar _, _ = fmt.Sprint, strings.ToUpper\n\nfunc f() float64 { return math.Sqrt(4.0) }\n", "math", true},
		{"d4 empty group", "package p\n\nimport ()\n\nfunc f() float64 { return 4.0 }\n",
			"package p\n\nimport (\n\t\"math\"\n)\n\nfunc f() float64 { return math.Sqrt(4.0) }\n", "math", true},
		{"e math imported", "package p\n\nimport \"math\"\n\nvar _ = math.Pi\n\nfunc f() float64 { return 4.0 }\n",
			"package p\n\nimport \"math\"\n\nvar _ = math.Pi\n\nfunc f() float64 { return math.Sqrt(4.0) }\n", "math", false},
		{"f math renamed", "package p\n\nimport m \"math\"\n\nvar _ = m.Pi\n\nfunc f() float64 { return 4.0 }\n",
			"package p\n\nimport m \"math\"\n\nvar _ = m.Pi\n\nfunc f() float64 { return m.Sqrt(4.0) }\n", "m", false},
		{"local math elsewhere", "package p\n\nfunc g() int { math := 1; return math }\n\nfunc f() float64 { return 4.0 }\n",
			"package p\n\nimport \"math\"\n\nfunc g() int { math := 1; return math }\n\nfunc f() float64 { return math.Sqrt(4.0) }\n", "math", true},
	} {
		t.Run(c.name, func(t *testing.T) {
			fset, f, info := check(t, c.src)
			pos := f.FileStart + token.Pos(strings.Index(c.src, marker))
			id, edits, ok := fixes.Import(info, f, pos, "math")
			require.True(t, ok)
			assert.Equal(t, c.id, id)
			assert.Equal(t, c.edits, len(edits) > 0)
			edits = append(edits, analysis.TextEdit{Pos: pos, End: pos + token.Pos(len(marker)), NewText: []byte(id + ".Sqrt(" + marker + ")")})
			out, err := format.Source([]byte(apply(fset, c.src, edits)))
			require.NoError(t, err)
			assert.Equal(t, c.want, string(out))
			_, f2, _ := check(t, string(out)) // parses and type-checks
			assert.Equal(t, 1, mathImports(f2))
		})
	}
}

func TestImportShadowed(t *testing.T) {
	for name, src := range map[string]string{
		"g local var":            "package p\n\nfunc f() float64 { math := 2.0; return 4.0 * math }\n",
		"local shadows import":   "package p\n\nimport \"math\"\n\nvar _ = math.Pi\n\nfunc f() float64 { math := 2.0; return 4.0 * math }\n",
		"parameter":              "package p\n\nfunc f(math float64) float64 { return 4.0 * math }\n",
		"package-level var":      "package p\n\nvar math = 2.0\n\nfunc f() float64 { return 4.0 * math }\n",
		"renamed import shadows": "package p\n\nimport m \"math\"\n\nvar _ = m.Pi\n\nfunc f() float64 { m := 2.0; return 4.0 * m }\n",
	} {
		_, f, info := check(t, src)
		pos := f.FileStart + token.Pos(strings.Index(src, marker))
		_, edits, ok := fixes.Import(info, f, pos, "math")
		assert.False(t, ok, name)
		assert.Empty(t, edits, name)
	}
}

func TestImportBlankOrDot(t *testing.T) {
	for spec, use := range map[string]string{`_ "math"`: "1", `. "math"`: "Pi"} {
		src := "package p\n\nimport " + spec + "\n\nvar _ = " + use + "\n\nfunc f() float64 { return 4.0 }\n"
		_, f, info := check(t, src)
		pos := f.FileStart + token.Pos(strings.Index(src, marker))
		id, _, ok := fixes.Import(info, f, pos, "math")
		assert.True(t, ok, spec)
		assert.Equal(t, "math", id, spec)
	}
}
