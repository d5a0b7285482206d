package absval

import (
	"go/ast"
	"go/constant"
	"go/token"
	"go/types"

	"golang.org/x/tools/go/types/typeutil"
)

// matcher reads the body of a function of one parameter p.
type matcher struct {
	k     *Known
	info  *types.Info
	decls map[types.Object]ast.Expr
	p     types.Object
}

// stmts reports whether list returns |p|: return abs(p); if p < 0 {
// return -p }; return p (either test, else branch or not); if p < 0 {
// p = -p }; return p.
func (m matcher) stmts(list []ast.Stmt) bool {
	switch len(list) {
	case 1:
		if r, ok := list[0].(*ast.ReturnStmt); ok {
			return len(r.Results) == 1 && m.absOf(r.Results[0])
		}
		if ifs, ok := list[0].(*ast.IfStmt); ok && ifs.Init == nil {
			if els, ok := ifs.Else.(*ast.BlockStmt); ok && len(els.List) == 1 {
				return m.branches(ifs.Cond, ifs.Body, els.List[0])
			}
		}
	case 2:
		ifs, ok := list[0].(*ast.IfStmt)
		if !ok || ifs.Init != nil || ifs.Else != nil {
			return false
		}
		return m.branches(ifs.Cond, ifs.Body, list[1]) || m.negateInPlace(ifs) && m.returns(list[1], false)
	}
	return false
}

// branches reports whether "if cond then; rest" returns |p|.
func (m matcher) branches(cond ast.Expr, then *ast.BlockStmt, rest ast.Stmt) bool {
	if len(then.List) != 1 {
		return false
	}
	neg, ok := m.signTest(cond)
	return ok && m.returns(then.List[0], neg) && m.returns(rest, !neg)
}

// negateInPlace reports whether ifs is if p < 0 { p = -p }.
func (m matcher) negateInPlace(ifs *ast.IfStmt) bool {
	neg, ok := m.signTest(ifs.Cond)
	if !ok || !neg || len(ifs.Body.List) != 1 {
		return false
	}
	as, ok := ifs.Body.List[0].(*ast.AssignStmt)
	return ok && as.Tok == token.ASSIGN && len(as.Lhs) == 1 && len(as.Rhs) == 1 && m.isP(as.Lhs[0]) && m.isNegP(as.Rhs[0])
}

// returns reports whether s is return p, or return -p when negated.
func (m matcher) returns(s ast.Stmt, negated bool) bool {
	r, ok := s.(*ast.ReturnStmt)
	if !ok || len(r.Results) != 1 {
		return false
	}
	if negated {
		return m.isNegP(r.Results[0])
	}
	return m.isP(r.Results[0])
}

// signTest reads cond as a test of p's sign against zero: neg is true for
// p < 0, p <= 0, math.Signbit(p) and their mirrors, false for p > 0, p >= 0.
func (m matcher) signTest(cond ast.Expr) (neg, ok bool) {
	cond = ast.Unparen(cond)
	if call, ok := cond.(*ast.CallExpr); ok && len(call.Args) == 1 && isMath(typeutil.Callee(m.info, call), "Signbit") {
		return true, m.isP(call.Args[0])
	}
	b, isBin := cond.(*ast.BinaryExpr)
	if !isBin {
		return false, false
	}
	op := b.Op
	if m.isP(b.Y) && m.isZero(b.X) {
		op = mirror[op]
	} else if !m.isP(b.X) || !m.isZero(b.Y) {
		return false, false
	}
	switch op {
	case token.LSS, token.LEQ:
		return true, true
	case token.GTR, token.GEQ:
		return false, true
	}
	return false, false
}

var mirror = map[token.Token]token.Token{token.LSS: token.GTR, token.LEQ: token.GEQ, token.GTR: token.LSS, token.GEQ: token.LEQ}

// absOf reports whether e is |p|: a call of an absolute value on p,
// max(p, -p), or p with its sign bit cleared, through float conversions.
func (m matcher) absOf(e ast.Expr) bool {
	call, ok := m.unconvert(e).(*ast.CallExpr)
	if !ok {
		return false
	}
	switch fn := typeutil.Callee(m.info, call); {
	case len(call.Args) == 1 && m.isP(call.Args[0]) && m.k.funcValue(m.info, m.decls, call.Fun, 4):
		return true
	case len(call.Args) == 2 && (isMath(fn, "Max") || fn == types.Universe.Lookup("max")):
		return m.isP(call.Args[0]) && m.isNegP(call.Args[1]) || m.isNegP(call.Args[0]) && m.isP(call.Args[1])
	case len(call.Args) == 1:
		return m.clearsSign(call)
	}
	return false
}

// clearsSign reports whether call is frombits(bits(p) &^ signBit) or
// frombits(bits(p) & ^signBit), where frombits and bits reinterpret a float
// and an unsigned integer of the same width, as math.Float64frombits and
// math.Float64bits do.
func (m matcher) clearsSign(call *ast.CallExpr) bool {
	mask, ok := ast.Unparen(call.Args[0]).(*ast.BinaryExpr)
	if !ok || mask.Op != token.AND_NOT && mask.Op != token.AND {
		return false
	}
	inner, ok := ast.Unparen(mask.X).(*ast.CallExpr)
	if !ok || len(inner.Args) != 1 || !m.isP(inner.Args[0]) {
		return false
	}
	bits := bitsWidth(m.info.TypeOf(inner))
	if bits == 0 || bits != bitsWidth(m.info.TypeOf(call.Args[0])) || floatWidth(m.info.TypeOf(call)) != bits || floatWidth(m.info.TypeOf(inner.Args[0])) != bits {
		return false
	}
	tv, ok := m.info.Types[mask.Y]
	if !ok || tv.Value == nil {
		return false
	}
	sign := constant.Shift(constant.MakeUint64(1), token.SHL, uint(bits-1))
	if mask.Op == token.AND {
		sign = constant.BinaryOp(sign, token.SUB, constant.MakeUint64(1)) // every bit but the sign
	}
	return constant.Compare(tv.Value, token.EQL, sign)
}

// bitsWidth returns the width of an unsigned 32- or 64-bit type, else 0.
func bitsWidth(t types.Type) int { return width(t, types.Uint32, types.Uint64) }

// floatWidth returns the width of a float type, else 0.
func floatWidth(t types.Type) int { return width(t, types.Float32, types.Float64) }

// width returns 32 or 64 when t's underlying type is k32 or k64, else 0.
func width(t types.Type, k32, k64 types.BasicKind) int {
	if b, ok := t.Underlying().(*types.Basic); ok {
		switch b.Kind() {
		case k32:
			return 32
		case k64:
			return 64
		}
	}
	return 0
}

// unconvert looks through parentheses and conversions between float types.
func (m matcher) unconvert(e ast.Expr) ast.Expr {
	for {
		e = ast.Unparen(e)
		call, ok := e.(*ast.CallExpr)
		if !ok || len(call.Args) != 1 || !m.info.Types[call.Fun].IsType() || !isReal(m.info.TypeOf(call)) {
			return e
		}
		e = call.Args[0]
	}
}

// isP reports whether e is the parameter, possibly converted.
func (m matcher) isP(e ast.Expr) bool {
	id, ok := m.unconvert(e).(*ast.Ident)
	return ok && m.info.Uses[id] == m.p
}

// isNegP reports whether e is -p.
func (m matcher) isNegP(e ast.Expr) bool {
	u, ok := m.unconvert(e).(*ast.UnaryExpr)
	return ok && u.Op == token.SUB && m.isP(u.X)
}

func (m matcher) isZero(e ast.Expr) bool {
	tv, ok := m.info.Types[e]
	return ok && tv.Value != nil && tv.Value.Kind() != constant.Bool && tv.Value.Kind() != constant.String && constant.Sign(tv.Value) == 0
}

// isMath reports whether obj is the math function of that name.
func isMath(obj types.Object, name string) bool {
	fn, ok := obj.(*types.Func)
	return ok && fn.Pkg() != nil && fn.Pkg().Path() == "math" && fn.Name() == name
}
