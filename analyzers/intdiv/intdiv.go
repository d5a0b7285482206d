package intdiv

import (
	"cmp"
	_ "embed"
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
	"slices"
	"strings"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/passes/inspect"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/analyzerdoc"
	"roundoff/analyzers/internal/fixes"
)

//go:embed doc.go
var doc string

// Analyzer reports integer divisions whose truncated quotient is used as a
// floating-point value.
var Analyzer = &analysis.Analyzer{
	Name:     "intdiv",
	Doc:      analyzerdoc.Extract(doc, "intdiv"),
	URL:      "docs/intdiv.md",
	Requires: []*analysis.Analyzer{inspect.Analyzer},
	Run:      run,
}

// Categories of diagnostics.
const (
	catConversion = "conversion"
	catConstant   = "constant"
)

// checker holds what one run needs.
type checker struct {
	pass      *analysis.Pass
	insp      *inspector.Inspector
	constUses map[*types.Const][]*ast.Ident // built on first need
}

func run(pass *analysis.Pass) (any, error) {
	c := &checker{pass: pass, insp: pass.ResultOf[inspect.Analyzer].(*inspector.Inspector)}
	for cur := range c.insp.Root().Preorder((*ast.BinaryExpr)(nil)) {
		n := cur.Node().(*ast.BinaryExpr)
		if n.Op != token.QUO {
			continue
		}
		if tv := pass.TypesInfo.Types[n]; tv.Value != nil {
			c.constantQuotient(cur, n, tv)
		} else {
			convertedQuotient(pass, cur, n)
		}
	}
	return nil, nil
}

// constantQuotient reports an inexact division of untyped integer
// constants whose value is used as a float: directly (1/2*x), or through
// the untyped constant it declares (const half = 1/2, then half*x).
func (c *checker) constantQuotient(cur inspector.Cursor, n *ast.BinaryExpr, tv types.TypeAndValue) {
	info := c.pass.TypesInfo
	x, y := info.Types[n.X].Value, info.Types[n.Y].Value
	if !c.intConst(n.X) || !c.intConst(n.Y) || constant.Sign(y) == 0 {
		return // not integer constants on both sides
	}
	if constant.Sign(constant.BinaryOp(x, token.REM, y)) == 0 {
		return // exact: 20*20/2
	}
	if named(n.X) && !named(n.Y) {
		return // a named count divided by a number: a whole-unit floor (the middle index of size/2), as float64(n/2)
	}
	var use ast.Node
	fixable := true
	if !isFloat(tv.Type) {
		use, fixable = c.floatUse(cur)
		if use == nil {
			return // never used as a float
		}
	}
	want := constant.BinaryOp(constant.ToFloat(x), token.QUO, constant.ToFloat(y))
	text := decimal(want)
	if text == "" {
		text = fixes.Operand(c.pass.Fset, n.X, token.MUL.Precedence()) + "*1.0/" + fixes.Operand(c.pass.Fset, n.Y, token.MUL.Precedence()+1)
		if lit, ok := ast.Unparen(n.X).(*ast.BasicLit); ok && lit.Kind == token.INT {
			text = lit.Value + ".0/" + fixes.Operand(c.pass.Fset, n.Y, token.MUL.Precedence()+1) // 1/3 becomes 1.0/3
		}
	}
	target := ast.Node(n)
	if p, ok := cur.Parent().Node().(*ast.ParenExpr); ok && !strings.Contains(text, "/") {
		target = p // (3/4) becomes 0.75
	}
	typ := tv.Type.String()
	d := analysis.Diagnostic{Pos: n.Pos(), End: n.End(), Category: catConstant}
	if use != nil {
		typ = info.TypeOf(use.(ast.Expr)).String()
		d.Related = []analysis.RelatedInformation{{Pos: use.Pos(), End: use.End(), Message: "used as " + typ + " here"}}
	}
	d.Message = fmt.Sprintf("%s divides untyped integer constants and is %s, not %s, in this %s expression; write %s",
		fixes.Source(c.pass.Fset, n), tv.Value.ExactString(), approx(want), typ, text)
	if !fixable {
		fixes.Report(c.pass, d) // the constant is also used as an integer: a float value would not compile there
		return
	}
	fixes.Report(c.pass, d, fixes.Judgement("Replace with "+text, fixes.Replace(target, text)))
}

// intConst reports whether e is an untyped integer constant expression:
// integer literals and untyped integer constants combined by arithmetic.
func (c *checker) intConst(e ast.Expr) bool {
	ok := true
	ast.Inspect(e, func(n ast.Node) bool {
		switch n := n.(type) {
		case *ast.BasicLit:
			ok = ok && (n.Kind == token.INT || n.Kind == token.CHAR)
		case *ast.Ident:
			k, isConst := c.pass.TypesInfo.Uses[n].(*types.Const)
			b, isBasic := types.Unalias(typeOf(k)).(*types.Basic)
			ok = ok && isConst && isBasic && b.Info()&types.IsUntyped != 0 && b.Info()&types.IsInteger != 0
		case nil, *ast.BinaryExpr, *ast.UnaryExpr, *ast.ParenExpr:
		default:
			ok = false
		}
		return ok
	})
	return ok
}

// typeOf returns the type of k, or nil.
func typeOf(k *types.Const) types.Type {
	if k == nil {
		return nil
	}
	return k.Type()
}

// named reports whether e mentions a named constant.
func named(e ast.Expr) bool {
	found := false
	ast.Inspect(e, func(n ast.Node) bool {
		_, isIdent := n.(*ast.Ident)
		found = found || isIdent
		return !found
	})
	return found
}

// floatUse returns, for a quotient in the value of an untyped constant
// declaration, a use of that constant (or of a constant declared from it)
// as a float, and whether every use is one, so that a float value could
// replace the quotient.
func (c *checker) floatUse(cur inspector.Cursor) (ast.Node, bool) {
	for p := range cur.Enclosing((*ast.ValueSpec)(nil)) {
		spec := p.Node().(*ast.ValueSpec)
		if spec.Type != nil || len(spec.Names) != len(spec.Values) {
			return nil, false
		}
		for i, v := range spec.Values {
			if v.Pos() <= cur.Node().Pos() && cur.Node().End() <= v.End() {
				k, ok := c.pass.TypesInfo.Defs[spec.Names[i]].(*types.Const)
				if !ok {
					return nil, false
				}
				return c.floatUses(k, 3)
			}
		}
	}
	return nil, false
}

// floatUses returns a use of constant k as a float, following constants
// declared from it up to depth, and whether every use is a float one.
func (c *checker) floatUses(k *types.Const, depth int) (first ast.Node, all bool) {
	all = true
	for _, id := range c.uses()[k] {
		t := c.pass.TypesInfo.TypeOf(id)
		switch {
		case isFloat(t):
			if first == nil {
				first = id
			}
		case depth > 0 && isUntyped(t):
			if k2 := c.declaredFrom(id); k2 != nil {
				f, a := c.floatUses(k2, depth-1)
				if first == nil {
					first = f
				}
				all = all && a
				continue
			}
			all = false
		default:
			all = false
		}
	}
	return first, all
}

// declaredFrom returns the untyped constant whose declaration's value
// holds the identifier id, or nil.
func (c *checker) declaredFrom(id *ast.Ident) *types.Const {
	cur, ok := c.insp.Root().FindNode(id)
	if !ok {
		return nil
	}
	for p := range cur.Enclosing((*ast.ValueSpec)(nil)) {
		spec := p.Node().(*ast.ValueSpec)
		for i, v := range spec.Values {
			if spec.Type == nil && i < len(spec.Names) && v.Pos() <= id.Pos() && id.End() <= v.End() {
				k, _ := c.pass.TypesInfo.Defs[spec.Names[i]].(*types.Const)
				return k
			}
		}
	}
	return nil
}

// uses returns the uses of the package's constants, indexed once.
func (c *checker) uses() map[*types.Const][]*ast.Ident {
	if c.constUses == nil {
		c.constUses = make(map[*types.Const][]*ast.Ident)
		for id, obj := range c.pass.TypesInfo.Uses {
			if k, ok := obj.(*types.Const); ok && k.Pkg() == c.pass.Pkg {
				c.constUses[k] = append(c.constUses[k], id)
			}
		}
		for _, ids := range c.constUses {
			slices.SortFunc(ids, func(a, b *ast.Ident) int { return cmp.Compare(a.Pos(), b.Pos()) })
		}
	}
	return c.constUses
}

func isUntyped(t types.Type) bool {
	b, ok := t.(*types.Basic)
	return ok && b.Info()&types.IsUntyped != 0
}

// decimal returns the exact decimal form of v when it has at most 8
// significant digits (0.5, 0.75, 0.125), else "".
func decimal(v constant.Value) string {
	for digits := 1; digits <= 8; digits++ {
		f, _ := constant.Float64Val(v)
		text := fmt.Sprintf("%.*g", digits, f)
		if constant.Compare(constant.MakeFromLiteral(text, token.FLOAT, 0), token.EQL, v) {
			if !strings.ContainsAny(text, ".e") {
				text += ".0"
			}
			return text
		}
	}
	return ""
}

// approx returns v for a message, to six significant digits.
func approx(v constant.Value) string {
	f, _ := constant.Float64Val(v)
	return fmt.Sprintf("%.6g", f)
}

func isFloat(t types.Type) bool {
	if t == nil {
		return false // ill-typed
	}
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&types.IsFloat != 0
}

func isInteger(t types.Type) bool {
	if t == nil {
		return false // ill-typed
	}
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&types.IsInteger != 0
}
