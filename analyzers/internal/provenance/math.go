package provenance

import "golang.org/x/tools/go/ssa"

// Rounding classifies a math-package function by whether its result is
// rounded.
type Rounding int

// The classes of math functions.
const (
	NotMath Rounding = iota // not a math or math/cmplx function
	Rounds                  // result is the exact value rounded (Sqrt, Exp, Sin...)
	Exact                   // result is exact: no rounding happens (Abs, Floor, Max...)
)

// exactMath lists the math functions whose float results involve no rounding
// (IEEE 754-2019 §5.3 and §5.5 operations, and selections); every other
// float-valued math function rounds.
var exactMath = map[string]bool{
	"Abs": true, "Ceil": true, "Copysign": true, "Floor": true, "Float32frombits": true,
	"Float64frombits": true, "Frexp": true, "Inf": true, "Ldexp": true, "Max": true,
	"Min": true, "Mod": true, "Modf": true, "NaN": true, "Nextafter": true,
	"Nextafter32": true, "Remainder": true, "Round": true, "RoundToEven": true, "Trunc": true,
}

// MathRounding classifies the callee of c.
func MathRounding(c *ssa.CallCommon) Rounding {
	fn := c.StaticCallee()
	if fn == nil || fn.Pkg == nil || fn.Pkg.Pkg.Path() != "math" && fn.Pkg.Pkg.Path() != "math/cmplx" {
		return NotMath
	}
	if exactMath[fn.Name()] && fn.Pkg.Pkg.Path() == "math" {
		return Exact
	}
	return Rounds
}
