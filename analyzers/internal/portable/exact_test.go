package portable

import (
	"go/types"
	"math"
	"math/big"
	"testing"

	"github.com/stretchr/testify/assert"
)

// TestSpanExactness checks the spans' claims against math/big at 300 bits:
// wherever a product or sum is claimed exact in float64, the float64
// result equals the exact one, and the products at the edge of 53 bits
// are told apart (IEEE 754-2019 §3.3: binary64 has p = 53).
func TestSpanExactness(t *testing.T) {
	f64 := types.Typ[types.Float64]
	values := []float64{0, 1, 3, -40, 7, 0.5, 0.375, 0.1, 1.1, 94906265, 94906267, 1 << 52, 1<<53 - 1, math.Ldexp(3, -1070), 6.02e23}
	exact := func(op byte, x, y float64) bool {
		a, b := new(big.Float).SetPrec(300).SetFloat64(x), new(big.Float).SetPrec(300).SetFloat64(y)
		var want *big.Float
		var got float64
		if op == '*' {
			want, got = new(big.Float).SetPrec(300).Mul(a, b), x*y
		} else {
			want, got = new(big.Float).SetPrec(300).Add(a, b), x+y
		}
		return want.Cmp(new(big.Float).SetFloat64(got)) == 0
	}
	claims := 0
	for _, x := range values {
		for _, y := range values {
			if p := fit(times(spanOf(x), spanOf(y)), f64); p.known {
				claims++
				assert.True(t, exact('*', x, y), "%v * %v claimed exact", x, y)
			}
			sx, sy := spanOf(x), spanOf(y)
			if s := fit(span{true, min(sx.low, sy.low), sx.max + sy.max}, f64); sx.known && sy.known && s.known {
				assert.True(t, exact('+', x, y), "%v + %v claimed exact", x, y)
			}
		}
	}
	assert.Greater(t, claims, 50)
	// 94906265^2 < 2^53 is held; 94906267^2 > 2^53 and odd is not.
	assert.True(t, fit(times(spanOf(94906265), spanOf(94906265)), f64).known)
	assert.False(t, fit(times(spanOf(94906267), spanOf(94906267)), f64).known)
	assert.False(t, exact('*', 94906267, 94906267), "math/big: the product rounds")
	// 0.1 is a 53-bit binary fraction: its square needs more.
	assert.False(t, fit(times(spanOf(0.1), spanOf(0.1)), f64).known)
}
