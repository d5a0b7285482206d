package fdstep

import (
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"math"
	"slices"
	"strconv"
	"strings"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/fixes"
	"roundoff/internal/numeric"
)

// fix returns the fix that declares, just before the quotient's first use
// of the step, a step scaled to x and made exactly representable
// (Numerical Recipes 3rd ed. §5.7),
//
//	h := math.Sqrt(0x1p-52) * math.Max(1, math.Abs(x))
//	h = (x + h) - x
//
// and makes the quotient use it. It offers none when the quotient's syntax
// does not show every use of the step (a folded constant such as 2e-8 for
// 2*h, a quotient assembled by op-assignments), when x cannot be evaluated
// there, or when the old step variable would be left unused.
func (c *checker) fix(q *quotient, v verdict) []fixes.Fix {
	root, ok := c.node(q.root.Pos()).(*ast.BinaryExpr)
	if !ok {
		return nil // assembled by d /= h
	}
	x, nodes, ok := c.bumpNodes(q)
	if !ok {
		return nil
	}
	isStep, obj := c.stepMatcher(nodes[0])
	if isStep == nil || slices.ContainsFunc(nodes, func(n ast.Expr) bool { return !isStep(n) }) {
		return nil
	}
	more, ok := c.rootSteps(root, isStep, q, v.h)
	if !ok {
		return nil
	}
	nodes = append(nodes, more...)
	fn, file := c.enclosing(root)
	if fn == nil {
		return nil
	}
	del, reuse, ok := c.oldDecl(obj, nodes, fn)
	if !ok {
		return nil
	}
	at, ok := c.insertionPoint(nodes)
	if !ok || !fixes.Pure(c.pass.TypesInfo, x) || !c.available(file, x, at.Pos()) {
		return nil
	}
	m, edits, ok := fixes.Import(c.pass.TypesInfo, file, at.Pos(), "math")
	if !ok {
		return nil
	}
	name := c.freshName(fn, obj, reuse)
	decl, exact, ok := c.declaration(q.scheme, v.f, x, name, m)
	if !ok {
		return nil
	}
	indent := c.indent(at.Pos())
	text := decl + "\n" + indent + exact + "\n" + indent
	edits = append(edits, analysis.TextEdit{Pos: at.Pos(), End: at.Pos(), NewText: []byte(text)})
	edits = append(edits, del...)
	for _, n := range nodes {
		edits = append(edits, fixes.Replace(n, name))
	}
	c.names[fn][name] = true
	return []fixes.Fix{fixes.Judgement(fmt.Sprintf("Use the step %s·max(1,|x|), made exactly representable", q.scheme.root), edits...)}
}

// bumpNodes returns the syntax of x and of each use of the step in the
// computations of x±h, which must all perturb the same x.
func (c *checker) bumpNodes(q *quotient) (ast.Expr, []ast.Expr, bool) {
	var x ast.Expr
	var nodes []ast.Expr
	for _, b := range q.bumps {
		xb, step, ok := c.bumpSyntax(b)
		if !ok || x != nil && fixes.Source(c.pass.Fset, x) != fixes.Source(c.pass.Fset, xb) {
			return nil, nil, false
		}
		x = xb
		nodes = append(nodes, step)
	}
	return x, nodes, x != nil
}

// bumpSyntax returns the syntax of x and of the step in one x±h.
func (c *checker) bumpSyntax(b bump) (x, step ast.Expr, ok bool) {
	switch n := c.node(b.op.Pos()).(type) {
	case *ast.BinaryExpr:
		if b.stepX {
			return n.Y, n.X, true
		}
		return n.X, n.Y, true
	case *ast.AssignStmt: // x[i] += h
		if len(n.Lhs) == 1 && len(n.Rhs) == 1 {
			return n.Lhs[0], n.Rhs[0], true
		}
	}
	return nil, nil, false
}

// stepMatcher returns a test for the syntax of the step: a named constant
// or a variable never reassigned (returned as obj), or a literal.
func (c *checker) stepMatcher(step ast.Expr) (func(ast.Expr) bool, types.Object) {
	info := c.pass.TypesInfo
	switch s := ast.Unparen(step).(type) {
	case *ast.Ident:
		obj := info.Uses[s]
		if _, isVar := obj.(*types.Var); isVar && c.decls[obj] == nil {
			return nil, nil // a parameter, or reassigned
		}
		if _, isConst := obj.(*types.Const); !isConst && c.decls[obj] == nil {
			return nil, nil
		}
		return func(e ast.Expr) bool {
			id, ok := ast.Unparen(e).(*ast.Ident)
			return ok && info.Uses[id] == obj
		}, obj
	case *ast.BasicLit:
		val := info.Types[s].Value
		return func(e ast.Expr) bool {
			lit, ok := ast.Unparen(e).(*ast.BasicLit)
			return ok && info.Types[lit].Value != nil && constant.Compare(info.Types[lit].Value, token.EQL, val)
		}, nil
	}
	return nil, nil
}

// rootSteps decomposes the quotient's syntax as c·h^p·(sum), the step
// appearing only through isStep, and returns the step nodes; the
// decomposition must agree with the one SSA gave, so that replacing the
// nodes changes the step and nothing else.
func (c *checker) rootSteps(root ast.Expr, isStep func(ast.Expr) bool, q *quotient, h float64) ([]ast.Expr, bool) {
	var steps []ast.Expr
	coef, power, sums, ok := c.factor(root, isStep, &steps, maxDepth)
	if !ok || sums != 1 || power != -q.scheme.order {
		return nil, false
	}
	return steps, near(coef*math.Pow(h, float64(power)), q.scale)
}

// factor decomposes e as coef·h^power·(sums opaque factors).
func (c *checker) factor(e ast.Expr, isStep func(ast.Expr) bool, steps *[]ast.Expr, depth int) (coef float64, power, sums int, ok bool) {
	e = ast.Unparen(e)
	if isStep(e) {
		*steps = append(*steps, e)
		return 1, 1, 0, true
	}
	if depth == 0 {
		return 0, 0, 0, false
	}
	switch e := e.(type) {
	case *ast.BinaryExpr:
		if e.Op != token.MUL && e.Op != token.QUO {
			break
		}
		cx, px, sx, okx := c.factor(e.X, isStep, steps, depth-1)
		cy, py, sy, oky := c.factor(e.Y, isStep, steps, depth-1)
		if e.Op == token.QUO {
			return cx / cy, px - py, sx, okx && oky && sy == 0
		}
		return cx * cy, px + py, sx + sy, okx && oky
	case *ast.UnaryExpr:
		if e.Op == token.SUB {
			cx, px, sx, okx := c.factor(e.X, isStep, steps, depth-1)
			return -cx, px, sx, okx
		}
	}
	if tv := c.pass.TypesInfo.Types[e]; tv.Value != nil {
		f, _ := constant.Float64Val(constant.ToFloat(tv.Value))
		return f, 0, 0, true
	}
	return 1, 0, 1, true
}

// enclosing returns the top-level function declaration and the file that
// hold n.
func (c *checker) enclosing(n ast.Node) (*ast.FuncDecl, *ast.File) {
	cur, ok := c.insp.Root().FindByPos(n.Pos(), n.End())
	if !ok {
		return nil, nil
	}
	var fn *ast.FuncDecl
	for f := range cur.Enclosing((*ast.FuncDecl)(nil)) {
		fn = f.Node().(*ast.FuncDecl)
	}
	for f := range cur.Enclosing((*ast.File)(nil)) {
		return fn, f.Node().(*ast.File)
	}
	return nil, nil
}

// oldDecl decides what becomes of a local step declaration: when every use
// of it is replaced it is deleted (del) and its name may be reused; a
// variable that cannot be deleted cleanly would be left unused, so no fix.
func (c *checker) oldDecl(obj types.Object, nodes []ast.Expr, fn *ast.FuncDecl) (del []analysis.TextEdit, reuse, ok bool) {
	if obj == nil || obj.Parent() == c.pass.Pkg.Scope() || !within(obj.Pos(), fn) {
		return nil, false, true // a literal, or declared outside the function: untouched
	}
	replaced := make(map[token.Pos]bool)
	for _, n := range nodes {
		replaced[n.Pos()] = true
	}
	used := false
	ast.Inspect(fn, func(n ast.Node) bool {
		id, ok := n.(*ast.Ident)
		used = used || ok && c.pass.TypesInfo.Uses[id] == obj && !replaced[id.Pos()]
		return !used
	})
	if used {
		return nil, false, true // still used elsewhere
	}
	edit, ok := c.deleteDecl(obj)
	if !ok {
		_, isConst := obj.(*types.Const)
		return nil, false, isConst // an unused local constant is allowed, an unused variable is not
	}
	return []analysis.TextEdit{edit}, true, true
}

// within reports whether pos lies in n.
func within(pos token.Pos, n ast.Node) bool { return n.Pos() <= pos && pos < n.End() }

// deleteDecl returns the edit deleting the lines of the statement that
// declares obj alone (h := 1e-8, var h = 1e-8, const h = 1e-8).
func (c *checker) deleteDecl(obj types.Object) (analysis.TextEdit, bool) {
	cur, ok := c.insp.Root().FindByPos(obj.Pos(), obj.Pos()+token.Pos(len(obj.Name())))
	if !ok {
		return analysis.TextEdit{}, false
	}
	var stmt ast.Stmt
	switch p := cur.Parent().Node().(type) {
	case *ast.AssignStmt:
		if len(p.Lhs) == 1 && len(p.Rhs) == 1 {
			stmt = p
		}
	case *ast.ValueSpec:
		gen, ok := cur.Parent().Parent().Node().(*ast.GenDecl)
		ds, isStmt := cur.Parent().Parent().Parent().Node().(*ast.DeclStmt)
		if ok && isStmt && len(p.Names) == 1 && len(gen.Specs) == 1 {
			stmt = ds
		}
	}
	if stmt == nil {
		return analysis.TextEdit{}, false
	}
	return c.deleteLines(stmt)
}

// deleteLines returns the edit deleting the whole lines of stmt, with a
// trailing comment, when nothing else shares them.
func (c *checker) deleteLines(stmt ast.Stmt) (analysis.TextEdit, bool) {
	tf := c.pass.Fset.File(stmt.Pos())
	src := c.source(tf)
	start, end := tf.Offset(stmt.Pos()), tf.Offset(stmt.End())
	if src == nil {
		return analysis.TextEdit{}, false
	}
	ls := start
	for ls > 0 && (src[ls-1] == ' ' || src[ls-1] == '\t') {
		ls--
	}
	rest := strings.TrimLeft(string(src[end:]), " \t")
	if strings.HasPrefix(rest, "//") {
		rest = rest[strings.IndexByte(rest+"\n", '\n'):]
	}
	if ls > 0 && src[ls-1] != '\n' || !strings.HasPrefix(rest, "\n") {
		return analysis.TextEdit{}, false // shares a line
	}
	le := len(src) - len(rest) + 1
	return analysis.TextEdit{Pos: tf.Pos(ls), End: tf.Pos(le)}, true
}

// source returns the content of tf, or nil.
func (c *checker) source(tf *token.File) []byte {
	if src, ok := c.src[tf]; ok {
		return src
	}
	src, err := c.pass.ReadFile(tf.Name())
	if err != nil || len(src) != tf.Size() {
		src = nil
	}
	c.src[tf] = src
	return src
}

// indent returns the white space that starts the line holding pos.
func (c *checker) indent(pos token.Pos) string {
	tf := c.pass.Fset.File(pos)
	src := c.source(tf)
	if src == nil {
		return ""
	}
	off := tf.Offset(pos)
	ls := off
	for ls > 0 && src[ls-1] != '\n' {
		ls--
	}
	if strings.Trim(string(src[ls:off]), " \t") != "" {
		return "" // not the first statement on its line
	}
	return string(src[ls:off])
}

// insertionPoint returns the statement before which the new step is
// declared: in the innermost statement list holding every node, the
// statement holding the first. All nodes must lie in one function, and
// not in the header of a loop, where the step would not follow x.
func (c *checker) insertionPoint(nodes []ast.Expr) (ast.Stmt, bool) {
	var chains [][]inspector.Cursor
	var fn ast.Node
	for _, n := range nodes {
		chain, f, ok := c.statements(n)
		if !ok || fn != nil && f != fn {
			return nil, false
		}
		fn = f
		chains = append(chains, chain)
	}
	depth := -1
	for d := 0; ; d++ {
		if slices.ContainsFunc(chains, func(ch []inspector.Cursor) bool {
			return d >= len(ch) || ch[d].Parent() != chains[0][d].Parent()
		}) {
			break
		}
		depth = d
	}
	if depth < 0 {
		return nil, false
	}
	var at ast.Stmt
	for _, ch := range chains {
		if s := ch[depth].Node().(ast.Stmt); at == nil || s.Pos() < at.Pos() {
			at = s
		}
	}
	return at, !inLoopHeader(at, nodes)
}

// statements returns the statements enclosing n that sit directly in a
// statement list, outermost first, up to n's function.
func (c *checker) statements(n ast.Node) ([]inspector.Cursor, ast.Node, bool) {
	cur, ok := c.insp.Root().FindByPos(n.Pos(), n.End())
	if !ok {
		return nil, nil, false
	}
	var chain []inspector.Cursor
	for p := cur; p.Node() != nil; p = p.Parent() {
		switch p.Node().(type) {
		case *ast.FuncLit, *ast.FuncDecl:
			slices.Reverse(chain)
			return chain, p.Node(), true
		}
		switch p.ParentEdgeKind() {
		case edge.BlockStmt_List, edge.CaseClause_Body, edge.CommClause_Body:
			chain = append(chain, p)
		}
	}
	return nil, nil, false
}

// inLoopHeader reports whether some node lies in the header of loop
// statement at.
func inLoopHeader(at ast.Stmt, nodes []ast.Expr) bool {
	var body *ast.BlockStmt
	switch s := at.(type) {
	case *ast.ForStmt:
		body = s.Body
	case *ast.RangeStmt:
		body = s.Body
	default:
		return false
	}
	return slices.ContainsFunc(nodes, func(n ast.Expr) bool { return n.Pos() < body.Lbrace })
}

// available reports whether every name in x refers at pos to what it
// refers to in x.
func (c *checker) available(file *ast.File, x ast.Expr, pos token.Pos) bool {
	scope := c.pass.TypesInfo.Scopes[file]
	if scope == nil {
		return false
	}
	if inner := scope.Innermost(pos); inner != nil {
		scope = inner
	}
	ok := true
	ast.Inspect(x, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.SelectorExpr:
			if _, isField := c.pass.TypesInfo.Selections[n]; isField {
				ok = ok && c.available(file, n.X, pos)
				return false
			}
		case *ast.Ident:
			_, obj := scope.LookupParent(n.Name, pos)
			ok = ok && obj != nil && obj == c.pass.TypesInfo.Uses[n]
		}
		return ok
	})
	return ok
}

// freshName returns a name for the new step that no identifier of fn
// uses, nor an earlier fix in fn took: the old step's name when its
// declaration goes (reuse), else h, step, dx, hx, h2...
func (c *checker) freshName(fn *ast.FuncDecl, obj types.Object, reuse bool) string {
	taken := c.names[fn]
	if taken == nil {
		taken = make(map[string]bool)
		others := make(map[string]bool) // names used for something other than obj
		ast.Inspect(fn, func(n ast.Node) bool {
			if id, ok := n.(*ast.Ident); ok {
				taken[id.Name] = true
				if o := c.pass.TypesInfo.ObjectOf(id); obj == nil || o != obj {
					others[id.Name] = true
				}
			}
			return true
		})
		c.names[fn] = taken
		if reuse && !others[obj.Name()] {
			return obj.Name()
		}
	}
	for _, name := range []string{"h", "step", "dx", "hx"} {
		if !taken[name] {
			return name
		}
	}
	for i := 2; ; i++ {
		if name := "h" + strconv.Itoa(i); !taken[name] {
			return name
		}
	}
}

// declaration returns the two statements that declare the new step:
// scaled to x, then made exactly representable. Types other than float64
// go through float64 for the math functions.
func (c *checker) declaration(s *scheme, f numeric.Format, x ast.Expr, name, m string) (decl, exact string, ok bool) {
	xs := fixes.Source(c.pass.Fset, x)
	arg, wrap := xs, "%s"
	if t := c.pass.TypesInfo.TypeOf(x); !types.Identical(t, types.Typ[types.Float64]) {
		tn, ok := c.typeName(t)
		if !ok {
			return "", "", false
		}
		arg, wrap = "float64("+xs+")", tn+"(%s)"
	}
	scale := fmt.Sprintf(s.call, m, epsLiteral(f.Eps)) + " * " + m + ".Max(1, " + m + ".Abs(" + arg + "))"
	exact = fmt.Sprintf("%s = (%s + %s) - %s", name, fixes.Operand(c.pass.Fset, x, token.ADD.Precedence()), name, fixes.Operand(c.pass.Fset, x, token.SUB.Precedence()+1))
	return name + " := " + fmt.Sprintf(wrap, scale), exact, true
}

// typeName returns how this package writes the float type t: a basic type
// or a named type of this package.
func (c *checker) typeName(t types.Type) (string, bool) {
	switch t := types.Unalias(t).(type) {
	case *types.Basic:
		return t.Name(), true
	case *types.Named:
		return t.Obj().Name(), t.Obj().Pkg() == c.pass.Pkg && t.TypeArgs() == nil
	}
	return "", false
}

// epsLiteral writes eps as Go source: a power of two in hexadecimal
// (0x1p-52), any other value in decimal.
func epsLiteral(eps float64) string {
	if frac, _ := math.Frexp(eps); frac == 0.5 {
		return strconv.FormatFloat(eps, 'x', -1, 64)
	}
	return numeric.Short(eps)
}
