package cancellation

import (
	"go/ast"
	"go/constant"
	"go/token"
	"math"
)

// interval is a closed range of real values.
type interval struct{ lo, hi float64 }

// rangeOf bounds e by construction, directly or through never-reassigned
// variables: constants, the fractional part x - math.Floor(x) (in [0, 1]),
// sines, cosines and other functions bounded by 1, and sums, differences,
// products, square roots and quotients by ranges that exclude 0 of those.
func (c *checker) rangeOf(e ast.Expr, depth int) (interval, bool) {
	e, _ = c.through(e)
	if v := c.pass.TypesInfo.Types[e].Value; v != nil {
		f, exact := constant.Float64Val(constant.ToFloat(v))
		return interval{f, f}, exact || !math.IsInf(f, 0)
	}
	if depth == 0 {
		return interval{}, false
	}
	switch e := e.(type) {
	case *ast.CallExpr:
		switch c.mathFunc(e) {
		case "Sin", "Cos", "Tanh", "Erf":
			return interval{-1, 1}, true
		case "Sqrt":
			r, ok := c.rangeOf(e.Args[0], depth-1)
			return interval{math.Sqrt(math.Max(r.lo, 0)), math.Sqrt(r.hi)}, ok && r.hi >= 0
		}
	case *ast.UnaryExpr:
		r, ok := c.rangeOf(e.X, depth-1)
		return interval{-r.hi, -r.lo}, ok && e.Op == token.SUB
	case *ast.BinaryExpr:
		if c.fractionalPart(e) {
			return interval{0, 1}, true
		}
		x, okx := c.rangeOf(e.X, depth-1)
		y, oky := c.rangeOf(e.Y, depth-1)
		if !okx || !oky {
			return interval{}, false
		}
		switch e.Op {
		case token.ADD:
			return interval{x.lo + y.lo, x.hi + y.hi}, true
		case token.SUB:
			return interval{x.lo - y.hi, x.hi - y.lo}, true
		case token.MUL:
			return span(x.lo*y.lo, x.lo*y.hi, x.hi*y.lo, x.hi*y.hi), true
		case token.QUO:
			if y.lo <= 0 && y.hi >= 0 {
				return interval{}, false
			}
			return span(x.lo/y.lo, x.lo/y.hi, x.hi/y.lo, x.hi/y.hi), true
		}
	}
	return interval{}, false
}

// fractionalPart reports whether d is x - math.Floor(x), the floor perhaps
// stored in a never-reassigned variable first.
func (c *checker) fractionalPart(d *ast.BinaryExpr) bool {
	f, _ := c.through(d.Y)
	call, ok := f.(*ast.CallExpr)
	return d.Op == token.SUB && ok && c.mathFunc(call) == "Floor" && same(call.Args[0], d.X)
}

// span returns the smallest interval holding the values.
func span(vs ...float64) interval {
	r := interval{math.Inf(1), math.Inf(-1)}
	for _, v := range vs {
		r.lo, r.hi = math.Min(r.lo, v), math.Max(r.hi, v)
	}
	return r
}

// magnitude returns the smallest and the largest |x| for x in r.
func (r interval) magnitude() (lo, hi float64) {
	hi = math.Max(math.Abs(r.lo), math.Abs(r.hi))
	if r.lo <= 0 && r.hi >= 0 {
		return 0, hi
	}
	return math.Min(math.Abs(r.lo), math.Abs(r.hi)), hi
}
