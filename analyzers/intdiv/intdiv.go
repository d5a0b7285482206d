package intdiv

import (
	_ "embed"
	"fmt"
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"
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

func run(pass *analysis.Pass) (any, error) {
	insp := pass.ResultOf[inspect.Analyzer].(*inspector.Inspector)
	for cur := range insp.Root().Preorder((*ast.BinaryExpr)(nil)) {
		n := cur.Node().(*ast.BinaryExpr)
		if n.Op != token.QUO {
			continue
		}
		if tv := pass.TypesInfo.Types[n]; tv.Value != nil {
			constantQuotient(pass, cur, n, tv)
		} else {
			convertedQuotient(pass, cur, n)
		}
	}
	return nil, nil
}

// constantQuotient reports an inexact division of two untyped integer
// literals whose value is used as a float.
func constantQuotient(pass *analysis.Pass, cur inspector.Cursor, n *ast.BinaryExpr, tv types.TypeAndValue) {
	x, okx := intLiteral(n.X)
	y, oky := intLiteral(n.Y)
	if !okx || !oky || !isFloat(tv.Type) || constant.Sign(y) == 0 {
		return // not two integer literals, or not used as a float
	}
	if constant.Sign(constant.BinaryOp(x, token.REM, y)) == 0 {
		return // exact: 20*20/2
	}
	want := constant.BinaryOp(constant.ToFloat(x), token.QUO, constant.ToFloat(y))
	text := decimal(want)
	if text == "" {
		text = fixes.Source(pass.Fset, n.X) + ".0/" + fixes.Source(pass.Fset, n.Y)
	}
	target := ast.Node(n)
	if p, ok := cur.Parent().Node().(*ast.ParenExpr); ok && !strings.Contains(text, "/") {
		target = p // (3/4) becomes 0.75
	}
	fixes.Report(pass, analysis.Diagnostic{
		Pos: n.Pos(), End: n.End(), Category: catConstant,
		Message: fmt.Sprintf("%s divides untyped integer constants and is %s, not %s, in this %s expression; write %s",
			fixes.Source(pass.Fset, n), tv.Value.ExactString(), approx(want), tv.Type, text),
	}, fixes.Safe("Replace with "+text, fixes.Replace(target, text)))
}

// intLiteral returns the value of an integer literal, possibly negated.
func intLiteral(e ast.Expr) (constant.Value, bool) {
	switch e := ast.Unparen(e).(type) {
	case *ast.BasicLit:
		if e.Kind == token.INT {
			return constant.MakeFromLiteral(e.Value, e.Kind, 0), true
		}
	case *ast.UnaryExpr:
		if v, ok := intLiteral(e.X); ok && (e.Op == token.SUB || e.Op == token.ADD) {
			return constant.UnaryOp(e.Op, v, 0), true
		}
	}
	return nil, false
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
