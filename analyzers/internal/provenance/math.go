package provenance

import (
	"go/ast"
	"go/types"

	"golang.org/x/tools/go/ssa"
	"golang.org/x/tools/go/types/typeutil"
)

// Rounding classifies a math-package function by whether its result is
// rounded.
type Rounding int

// The classes of math functions.
const (
	NotMath Rounding = iota // not a math or math/cmplx function
	Rounds                  // result is the exact value rounded (Sqrt, Exp, Sin...)
	Exact                   // result is exact: no rounding happens (Abs, Floor, Max...)
)

// exactMath lists the math and math/cmplx functions whose float results
// involve no rounding (IEEE 754-2019 §5.3 and §5.5 operations, selections
// and constructors); every other float-valued function of those packages
// rounds. Ldexp rounds only when its result is subnormal. A function
// with no float or complex result (IsNaN, IsInf, Signbit, Float64bits,
// Ilogb) reads bits or classifies and rounds nothing (IEEE 754-2019 §5.7).
var exactMath = map[string]bool{
	"math.Abs": true, "math.Ceil": true, "math.Copysign": true, "math.Floor": true,
	"math.Float32frombits": true, "math.Float64frombits": true, "math.Frexp": true,
	"math.Inf": true, "math.Ldexp": true, "math.Max": true, "math.Min": true,
	"math.Mod": true, "math.Modf": true, "math.NaN": true, "math.Nextafter": true,
	"math.Nextafter32": true, "math.Remainder": true, "math.Round": true,
	"math.RoundToEven": true, "math.Trunc": true,
	"math/cmplx.Conj": true, "math/cmplx.Inf": true, "math/cmplx.NaN": true,
}

// MathRounding classifies the callee of c.
func MathRounding(c *ssa.CallCommon) Rounding {
	fn := c.StaticCallee()
	if fn == nil || fn.Pkg == nil {
		return NotMath
	}
	path := fn.Pkg.Pkg.Path()
	switch {
	case path != "math" && path != "math/cmplx":
		return NotMath
	case exactMath[path+"."+fn.Name()] || !roundedResult(fn.Signature.Results()):
		return Exact
	}
	return Rounds
}

// roundedResult reports whether a tuple holds a float or complex number.
func roundedResult(t *types.Tuple) bool {
	for v := range t.Variables() {
		if b, ok := v.Type().Underlying().(*types.Basic); ok && b.Info()&(types.IsFloat|types.IsComplex) != 0 {
			return true
		}
	}
	return false
}

// IsInf reports whether v is the result of math.Inf or math/cmplx.Inf.
func IsInf(v ssa.Value) bool {
	call, ok := Strip(v).(*ssa.Call)
	if !ok {
		return false
	}
	fn := call.Common().StaticCallee()
	return fn != nil && fn.Pkg != nil && fn.Name() == "Inf" && (fn.Pkg.Pkg.Path() == "math" || fn.Pkg.Pkg.Path() == "math/cmplx")
}

// MathCallee returns the name of the math package function that call
// calls, or "" when it calls something else.
func MathCallee(info *types.Info, call *ast.CallExpr) string {
	fn, ok := typeutil.Callee(info, call).(*types.Func)
	if !ok || fn.Pkg() == nil || fn.Pkg().Path() != "math" {
		return ""
	}
	return fn.Name()
}
