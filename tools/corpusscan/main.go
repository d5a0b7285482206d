//go:build corpus

// Command corpusscan lists places worth reading when labelling a corpus
// repository by hand (LABELING.md §1). It parses every .go file under DIR
// (tests included, vendor/ and testdata/ skipped) without type checking and
// prints one tab-separated row per candidate: file, line, kind, source text.
// Over-inclusion is intended: the rows are a reading list, not findings.
package main

import (
	"fmt"
	"go/ast"
	"go/parser"
	"go/token"
	"io/fs"
	"os"
	"path/filepath"
	"regexp"
	"sort"
	"strconv"
	"strings"
)

func main() {
	if len(os.Args) != 2 {
		fmt.Fprintln(os.Stderr, "usage: corpusscan DIR")
		os.Exit(2)
	}
	root := os.Args[1]
	err := filepath.WalkDir(root, func(path string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		name := d.Name()
		if d.IsDir() {
			if path != root && (name == "vendor" || name == "testdata" || strings.HasPrefix(name, ".")) {
				return filepath.SkipDir
			}
			return nil
		}
		if !strings.HasSuffix(name, ".go") {
			return nil
		}
		src, err := os.ReadFile(path)
		if err != nil {
			return err
		}
		rel, _ := filepath.Rel(root, path)
		rows, err := scan(rel, src)
		if err != nil {
			fmt.Fprintln(os.Stderr, err) // a file that does not parse is skipped
		}
		for _, r := range rows {
			fmt.Printf("%s\t%d\t%s\t%s\n", r.file, r.line, r.kind, r.text)
		}
		return nil
	})
	if err != nil {
		fmt.Fprintln(os.Stderr, err)
		os.Exit(1)
	}
}

// row is one candidate.
type row struct {
	file       string
	line       int
	kind, text string
}

// scan returns the candidates of one file, sorted by line and kind.
func scan(file string, src []byte) ([]row, error) {
	fset := token.NewFileSet()
	f, err := parser.ParseFile(fset, file, src, parser.SkipObjectResolution)
	if err != nil {
		return nil, err
	}
	seen := map[row]bool{}
	var rows []row
	add := func(n ast.Node, kind string) {
		r := row{file, fset.Position(n.Pos()).Line, kind, text(src, fset, n)}
		if !seen[r] {
			seen[r] = true
			rows = append(rows, r)
		}
	}
	steps := smallVars(f)
	ast.Inspect(f, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.BinaryExpr:
			binary(n, add)
		case *ast.CallExpr:
			call(n, steps, add)
		case *ast.ForStmt:
			loop(n, add)
		}
		return true
	})
	sort.SliceStable(rows, func(i, j int) bool {
		if rows[i].line != rows[j].line {
			return rows[i].line < rows[j].line
		}
		return rows[i].kind < rows[j].kind
	})
	return rows, nil
}

// text is the one-line source of n, truncated to 160 characters.
func text(src []byte, fset *token.FileSet, n ast.Node) string {
	s := string(src[fset.Position(n.Pos()).Offset:fset.Position(n.End()).Offset])
	r := []rune(strings.Join(strings.Fields(s), " "))
	return string(r[:min(len(r), 160)])
}

var (
	tolName = regexp.MustCompile(`(?i)tol|eps|thresh|precision|accuracy|delta|tiny|small`)
	intName = regexp.MustCompile(`(?i)^([ijkmn]|.*(len|count|cnt|idx|index|num|size|width|height|rows|cols).*)$`)
	stepVar = regexp.MustCompile(`(?i)^(h|dx|eps|step|delta)$`)
)

func binary(b *ast.BinaryExpr, add func(ast.Node, string)) {
	switch {
	case isCmp(b.Op):
		if tolLike(b.X) || tolLike(b.Y) {
			add(b, "cmp-small")
		}
		if (b.Op == token.EQL || b.Op == token.NEQ) && (floaty(b.X) || floaty(b.Y)) {
			add(b, "eq-float")
		}
	case b.Op == token.QUO:
		if diffQuot(b) {
			add(b, "diffquot")
		}
		if isLit(b.X, token.INT) && isLit(b.Y, token.INT) {
			add(b, "intdiv-float")
		}
	case b.Op == token.ADD || b.Op == token.SUB:
		if isMathCall(b.X, "Exp") && isOne(b.Y) && b.Op == token.SUB {
			add(b, "near-one")
		}
		if plusRoot(b) {
			add(b, "near-one")
		}
	}
}

func call(c *ast.CallExpr, steps map[string]bool, add func(ast.Node, string)) {
	if len(c.Args) == 0 {
		return
	}
	arg := unparen(c.Args[0])
	if isMathCall(c, "Log", "Log10", "Log2", "Exp", "Sqrt", "Pow", "Acos", "Asin") {
		if a, ok := arg.(*ast.BinaryExpr); ok && (a.Op == token.ADD || a.Op == token.SUB) && (isOne(a.X) || isOne(a.Y)) {
			add(c, "near-one")
		}
	}
	if isMathCall(c, "Sqrt") && sumOfSquares(arg) {
		add(c, "sqrt-sumsq")
	}
	if id, ok := c.Fun.(*ast.Ident); ok && (id.Name == "float64" || id.Name == "float32") && len(c.Args) == 1 {
		if q, ok := arg.(*ast.BinaryExpr); ok && q.Op == token.QUO && !floatTyped(q.X) && !floatTyped(q.Y) {
			add(c, "intdiv-float")
		}
	}
	for _, a := range c.Args {
		if shifted(a, steps) {
			add(c, "diffquot")
			break
		}
	}
}

// loop reports a float exit test in the condition of l or in an
// if-with-break/return directly in its body.
func loop(l *ast.ForStmt, add func(ast.Node, string)) {
	if l.Cond != nil && floatExit(l.Cond) {
		add(l.Cond, "loop-float-exit")
	}
	for _, s := range l.Body.List {
		ifs, ok := s.(*ast.IfStmt)
		if ok && exits(ifs.Body) && floatExit(ifs.Cond) {
			add(ifs.Cond, "loop-float-exit")
		}
	}
}

// floatExit reports whether e contains math.Abs or a comparison with a
// tolerance-like operand.
func floatExit(e ast.Expr) bool {
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.CallExpr:
			found = found || isMathCall(n, "Abs")
		case *ast.BinaryExpr:
			found = found || isCmp(n.Op) && (tolLike(n.X) || tolLike(n.Y))
		}
		return !found
	})
	return found
}

func isCmp(op token.Token) bool {
	switch op {
	case token.LSS, token.LEQ, token.GTR, token.GEQ, token.EQL, token.NEQ:
		return true
	}
	return false
}

// exits reports whether b directly contains a return or break.
func exits(b *ast.BlockStmt) bool {
	for _, s := range b.List {
		switch s := s.(type) {
		case *ast.ReturnStmt:
			return true
		case *ast.BranchStmt:
			if s.Tok == token.BREAK {
				return true
			}
		}
	}
	return false
}

// tolLike reports whether e is a small nonzero float literal, a name
// suggesting a tolerance, or an extreme math float constant.
func tolLike(e ast.Expr) bool {
	e = unparen(e)
	if v, ok := floatLit(e); ok {
		return v != 0 && v < 1e-3 && v > -1e-3
	}
	switch e := e.(type) {
	case *ast.Ident:
		return tolName.MatchString(e.Name)
	case *ast.SelectorExpr:
		if x, ok := e.X.(*ast.Ident); ok && x.Name == "math" {
			return strings.HasPrefix(e.Sel.Name, "SmallestNonzeroFloat") || strings.HasPrefix(e.Sel.Name, "MaxFloat")
		}
		return tolName.MatchString(e.Sel.Name)
	}
	return false
}

// floatLit returns the value of a (possibly negated) FLOAT literal.
func floatLit(e ast.Expr) (float64, bool) {
	e = unparen(e)
	if u, ok := e.(*ast.UnaryExpr); ok && u.Op == token.SUB {
		v, ok := floatLit(u.X)
		return -v, ok
	}
	if !isLit(e, token.FLOAT) {
		return 0, false
	}
	v, err := strconv.ParseFloat(strings.ReplaceAll(e.(*ast.BasicLit).Value, "_", ""), 64)
	return v, err == nil
}

// floaty reports whether e contains a float literal, a math call, a
// division, or arithmetic on an operand that does not look integer.
func floaty(e ast.Expr) bool {
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.BasicLit:
			found = found || n.Kind == token.FLOAT
		case *ast.CallExpr:
			found = found || isMathCall(n)
		case *ast.BinaryExpr:
			switch n.Op {
			case token.QUO:
				found = true
			case token.ADD, token.SUB, token.MUL:
				found = found || !intish(n.X) || !intish(n.Y)
			}
		case *ast.FuncLit:
			return false
		}
		return !found
	})
	return found
}

// intish reports whether e looks like an integer: an int literal, len or
// cap, an int-like name, or arithmetic on such.
func intish(e ast.Expr) bool {
	switch e := unparen(e).(type) {
	case *ast.BasicLit:
		return e.Kind == token.INT || e.Kind == token.STRING || e.Kind == token.CHAR
	case *ast.Ident:
		return intName.MatchString(e.Name)
	case *ast.SelectorExpr:
		return intName.MatchString(e.Sel.Name)
	case *ast.CallExpr:
		id, ok := e.Fun.(*ast.Ident)
		return ok && (id.Name == "len" || id.Name == "cap" || strings.HasPrefix(id.Name, "int") || strings.HasPrefix(id.Name, "uint"))
	case *ast.BinaryExpr:
		return intish(e.X) && intish(e.Y)
	case *ast.UnaryExpr:
		return intish(e.X)
	}
	return false
}

// floatTyped reports whether e visibly holds a float: a float literal, a
// math call or a float conversion.
func floatTyped(e ast.Expr) bool {
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.BasicLit:
			found = found || n.Kind == token.FLOAT
		case *ast.CallExpr:
			id, ok := n.Fun.(*ast.Ident)
			found = found || isMathCall(n) || ok && strings.HasPrefix(id.Name, "float")
		}
		return !found
	})
	return found
}

// diffQuot reports (f(a)-f(b))/h, (f(a)-v)/h and (v-f(b))/h with h an
// identifier, selector, literal or 2*h.
func diffQuot(q *ast.BinaryExpr) bool {
	num, ok := unparen(q.X).(*ast.BinaryExpr)
	if !ok || num.Op != token.SUB {
		return false
	}
	_, cx := unparen(num.X).(*ast.CallExpr)
	_, cy := unparen(num.Y).(*ast.CallExpr)
	if !(cx && (cy || isName(num.Y)) || cy && isName(num.X)) {
		return false
	}
	den := unparen(q.Y)
	if m, ok := den.(*ast.BinaryExpr); ok && m.Op == token.MUL {
		return isLit(m.X, token.INT) && isName(m.Y) || isName(m.X) && isLit(m.Y, token.INT)
	}
	_, lit := den.(*ast.BasicLit)
	return lit || isName(den)
}

// smallVars collects names h, dx, eps, step, delta assigned a float
// literal below 1e-2 anywhere in f.
func smallVars(f *ast.File) map[string]bool {
	vars := map[string]bool{}
	note := func(id *ast.Ident, v ast.Expr) {
		if x, ok := floatLit(v); ok && x > 0 && x < 1e-2 && stepVar.MatchString(id.Name) {
			vars[id.Name] = true
		}
	}
	ast.Inspect(f, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.AssignStmt:
			for i, l := range n.Lhs {
				if id, ok := l.(*ast.Ident); ok && i < len(n.Rhs) {
					note(id, n.Rhs[i])
				}
			}
		case *ast.ValueSpec:
			for i, id := range n.Names {
				if i < len(n.Values) {
					note(id, n.Values[i])
				}
			}
		}
		return true
	})
	return vars
}

// shifted reports whether a contains x±h with h a step variable or a small
// float literal below 1e-2.
func shifted(a ast.Expr, steps map[string]bool) bool {
	step := func(e ast.Expr) bool {
		if id, ok := unparen(e).(*ast.Ident); ok {
			return steps[id.Name]
		}
		v, ok := floatLit(e)
		return ok && v > 0 && v < 1e-2
	}
	found := false
	ast.Inspect(a, func(n ast.Node) bool {
		if b, ok := n.(*ast.BinaryExpr); ok && (b.Op == token.ADD || b.Op == token.SUB) {
			found = found || step(b.Y) || b.Op == token.ADD && step(b.X)
		}
		return !found
	})
	return found
}

// sumOfSquares reports whether e is a sum with at least one squared term
// (a*a or math.Pow(a, 2)).
func sumOfSquares(e ast.Expr) bool {
	b, ok := unparen(e).(*ast.BinaryExpr)
	if !ok || b.Op != token.ADD {
		return false
	}
	square := func(t ast.Expr) bool {
		t = unparen(t)
		if m, ok := t.(*ast.BinaryExpr); ok && m.Op == token.MUL {
			return same(m.X, m.Y)
		}
		c, ok := t.(*ast.CallExpr)
		return ok && isMathCall(c, "Pow") && len(c.Args) == 2 && isLitValue(c.Args[1], "2")
	}
	return square(b.X) || square(b.Y) || sumOfSquares(b.X) || sumOfSquares(b.Y)
}

// plusRoot reports x ± math.Sqrt(... x*x ...).
func plusRoot(b *ast.BinaryExpr) bool {
	for _, p := range [][2]ast.Expr{{b.X, b.Y}, {b.Y, b.X}} {
		c, ok := unparen(p[1]).(*ast.CallExpr)
		if !ok || !isMathCall(c, "Sqrt") || len(c.Args) != 1 {
			continue
		}
		found := false
		ast.Inspect(c.Args[0], func(n ast.Node) bool {
			if m, ok := n.(*ast.BinaryExpr); ok && m.Op == token.MUL && same(m.X, m.Y) && same(m.X, p[0]) {
				found = true
			}
			return !found
		})
		if found {
			return true
		}
	}
	return false
}

// isMathCall reports whether e is a call math.F with F among names (any F
// when names is empty).
func isMathCall(e ast.Expr, names ...string) bool {
	c, ok := unparen(e).(*ast.CallExpr)
	if !ok {
		return false
	}
	sel, ok := c.Fun.(*ast.SelectorExpr)
	if !ok {
		return false
	}
	if x, ok := sel.X.(*ast.Ident); !ok || x.Name != "math" {
		return false
	}
	if len(names) == 0 {
		return true
	}
	for _, n := range names {
		if sel.Sel.Name == n {
			return true
		}
	}
	return false
}

// same reports whether a and b are the same identifier or selector chain.
func same(a, b ast.Expr) bool {
	a, b = unparen(a), unparen(b)
	switch a := a.(type) {
	case *ast.Ident:
		b, ok := b.(*ast.Ident)
		return ok && a.Name == b.Name
	case *ast.SelectorExpr:
		b, ok := b.(*ast.SelectorExpr)
		return ok && a.Sel.Name == b.Sel.Name && same(a.X, b.X)
	case *ast.IndexExpr:
		b, ok := b.(*ast.IndexExpr)
		return ok && same(a.X, b.X) && same(a.Index, b.Index)
	case *ast.BasicLit:
		b, ok := b.(*ast.BasicLit)
		return ok && a.Value == b.Value
	}
	return false
}

func isName(e ast.Expr) bool {
	switch unparen(e).(type) {
	case *ast.Ident, *ast.SelectorExpr, *ast.IndexExpr:
		return true
	}
	return false
}

func isLit(e ast.Expr, kind token.Token) bool {
	l, ok := unparen(e).(*ast.BasicLit)
	return ok && l.Kind == kind
}

func isLitValue(e ast.Expr, vals ...string) bool {
	l, ok := unparen(e).(*ast.BasicLit)
	if !ok {
		return false
	}
	for _, v := range vals {
		if l.Value == v {
			return true
		}
	}
	return false
}

func isOne(e ast.Expr) bool { return isLitValue(e, "1", "1.0", "1.", "1.00") }

func unparen(e ast.Expr) ast.Expr {
	for {
		p, ok := e.(*ast.ParenExpr)
		if !ok {
			return e
		}
		e = p.X
	}
}
