// Package consume tells how a floating-point value is consumed by the code
// around it: whether the next operations need it to relative accuracy or
// only to the absolute accuracy of its scale.
//
// A value computed with an absolute error of a rounding of its scale
// (a difference of squares, 1 - cos x) is backward stable: it is the exact
// result for inputs perturbed by about u. Whether that hurts depends on
// its consumer. A square root turns an absolute error δ near 0 into
// sqrt(δ), a logarithm and a reciprocal turn a relative error into an
// error without bound, and a comparison with 0 decides a sign that the
// rounding may have set. A sum, a cosine or an exponential only carry the
// absolute error on, where it is of the size of the rounding the sum or
// the result already has. Products, quotients by another value, signs and
// odd functions that vanish at 0 (sin, tan, atan, ...) keep the relative
// error as it is and pass the question on to their own consumer.
package consume

import (
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/ast/edge"
	"golang.org/x/tools/go/ast/inspector"

	"roundoff/analyzers/internal/provenance"
)

// Use is how a value is consumed.
type Use int

// The ways a value is consumed.
const (
	Unknown  Use = iota // returned, stored, passed to a function: not seen here
	Absolute            // only its absolute error reaches a result
	Relative            // its relative error reaches a result unbounded
)

// mathUse classifies the math functions by what they do with the
// relative error of their argument: Relative where it is amplified or
// decides the result (Sqrt near 0, Log, a sign), Absolute where an
// absolute error passes on as one (Cos, Exp), and passOn for the odd
// functions that vanish at 0 with unit slope, which keep it as it is.
var mathUse = map[string]Use{
	"Sqrt": Relative, "Cbrt": Relative, "Log": Relative, "Log10": Relative, "Log2": Relative,
	"Signbit": Relative, "Copysign": Relative, "Pow": Relative,
	"Cos": Absolute, "Cosh": Absolute, "Exp": Absolute, "Exp2": Absolute, "Log1p": Absolute, "Expm1": Absolute,
	"Sin": passOn, "Tan": passOn, "Sinh": passOn, "Tanh": passOn, "Asin": passOn, "Atan": passOn,
	"Asinh": passOn, "Atanh": passOn, "Erf": passOn, "Abs": passOn,
}

// passOn marks a function that keeps the relative error of its argument.
const passOn Use = -1

// Of returns how the value of the expression at cur is consumed, following
// it through products, quotients, signs and the functions that keep its
// relative error, and through local variables it is assigned to (depth
// levels deep) into every use the assignment reaches.
func Of(info *types.Info, cur inspector.Cursor, depth int) Use {
	u, _ := consumer(info, cur, depth)
	return u
}

// Threshold reports whether the value at cur, followed as Of follows it
// (not through variables), meets an ordered or equality comparison with a
// nonzero constant: only its absolute error near that threshold can move
// the decision.
func Threshold(info *types.Info, cur inspector.Cursor) bool {
	_, n := consumer(info, cur, 0)
	b, ok := n.(*ast.BinaryExpr)
	if !ok || !provenance.Ordered(b.Op) && b.Op != token.EQL && b.Op != token.NEQ {
		return false
	}
	for _, side := range []ast.Expr{b.X, b.Y} {
		if v := info.Types[side].Value; v != nil && v.Kind() != constant.Unknown && constant.Sign(v) != 0 {
			return true
		}
	}
	return false
}

// consumer returns how the value at cur is used and the node that decides
// it (nil where nothing does).
func consumer(info *types.Info, cur inspector.Cursor, depth int) (Use, ast.Node) {
	for ; ; cur = cur.Parent() {
		switch p := cur.Parent().Node().(type) {
		case *ast.ParenExpr:
		case *ast.UnaryExpr:
			if p.Op != token.SUB && p.Op != token.ADD {
				return Unknown, nil
			}
		case *ast.BinaryExpr:
			if u, done := binary(info, p, cur.ParentEdgeKind()); done {
				return u, p
			}
		case *ast.CallExpr:
			if u, done := call(info, p, cur.ParentEdgeIndex()); done {
				return u, p
			}
		case *ast.AssignStmt:
			return assigned(info, cur, p, depth), p
		default:
			return Unknown, nil
		}
	}
}

// binary classifies the use of an operand of p, reached by edge, or
// reports that the question passes on to p's consumer.
func binary(info *types.Info, p *ast.BinaryExpr, e edge.Kind) (Use, bool) {
	switch p.Op {
	case token.ADD, token.SUB:
		return Absolute, true // a term of a sum: its absolute error joins the sum's
	case token.MUL:
		return 0, false
	case token.QUO:
		if e == edge.BinaryExpr_Y {
			return Relative, true // a divisor
		}
		return 0, false
	case token.LSS, token.LEQ, token.GTR, token.GEQ, token.EQL, token.NEQ:
		other := p.X
		if e == edge.BinaryExpr_X {
			other = p.Y
		}
		if v := info.Types[other].Value; v != nil && v.Kind() != constant.Unknown && constant.Sign(v) == 0 {
			return Relative, true // a sign decision
		}
		return Absolute, true // a threshold at the value's own scale
	}
	return Unknown, true
}

// call classifies the use of argument i of p, or reports that the
// question passes on to p's consumer (a conversion, a function that keeps
// the relative error).
func call(info *types.Info, p *ast.CallExpr, i int) (Use, bool) {
	if tv := info.Types[p.Fun]; tv.IsType() {
		b, ok := tv.Type.Underlying().(*types.Basic)
		return Unknown, !ok || b.Info()&types.IsFloat == 0
	}
	name := provenance.MathCallee(info, p)
	if name == "" {
		return Unknown, true
	}
	u, known := mathUse[name]
	switch {
	case !known:
		return Unknown, true
	case name == "Copysign" && i == 0, name == "Pow" && i == 1:
		return Absolute, true // the magnitude of Copysign; an exponent scales the logarithm
	case u == passOn:
		return 0, false
	}
	return u, true
}

// assigned classifies the value assigned at cur by the statement as: the
// join of the uses of the local variable it is assigned to that the
// assignment reaches.
func assigned(info *types.Info, cur inspector.Cursor, as *ast.AssignStmt, depth int) Use {
	if cur.ParentEdgeKind() != edge.AssignStmt_Rhs || len(as.Lhs) != len(as.Rhs) || depth == 0 {
		return Unknown
	}
	switch as.Tok {
	case token.ADD_ASSIGN, token.SUB_ASSIGN:
		return Absolute
	case token.QUO_ASSIGN:
		return Relative
	case token.ASSIGN, token.DEFINE:
	default:
		return Unknown
	}
	id, ok := as.Lhs[cur.ParentEdgeIndex()].(*ast.Ident)
	v, isVar := info.ObjectOf(id).(*types.Var)
	if !ok || !isVar || v.Parent() == nil || v.Parent() == v.Pkg().Scope() {
		return Unknown // a field, an element, a package variable
	}
	join := Absolute
	n := 0
	for use := range Reached(info, cur.Parent(), v) {
		switch Of(info, use, depth-1) {
		case Relative:
			return Relative
		case Unknown:
			join = Unknown
		}
		n++
	}
	if n == 0 {
		return Unknown
	}
	return join
}
