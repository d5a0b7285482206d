package cancellation_test

import (
	"math"
	"math/big"
)

// The 200-bit reference: series and Newton's method in math/big, with
// intermediate work at prec bits. Each function names the identity used.
const prec = 256

func bf(x float64) *big.Float { return new(big.Float).SetPrec(prec).SetFloat64(x) }

func newF() *big.Float { return new(big.Float).SetPrec(prec) }

// f64 rounds z to the nearest float64 (IEEE 754-2019 roundTiesToEven).
func f64(z *big.Float) float64 { f, _ := z.Float64(); return f }

// tiny is 2^-300, far below the 200 bits the results need.
var tiny = new(big.Float).SetMantExp(big.NewFloat(1), -300)

// series sums terms t_k, t_{k+1} = t_k * next(k), from t_0 until they fall
// below tiny relative to the sum.
func series(t0 *big.Float, next func(k int, t *big.Float)) *big.Float {
	sum, t := newF().Set(t0), newF().Set(t0)
	for k := 1; k < 2000; k++ {
		next(k, t)
		sum.Add(sum, t)
		if t.Sign() == 0 || new(big.Float).Quo(new(big.Float).Abs(t), new(big.Float).Abs(sum)).Cmp(tiny) < 0 {
			break
		}
	}
	return sum
}

// expm1Ref returns e^x - 1 = Σ_{k>=1} x^k/k! (Taylor series) for |x| <= 1;
// larger x is halved s times and rebuilt with e^{2y}-1 = (e^y-1)(e^y+1).
func expm1Ref(x *big.Float) *big.Float {
	y, s := newF().Set(x), 0
	for new(big.Float).Abs(y).Cmp(big.NewFloat(1)) > 0 {
		y.SetMantExp(y, -1) // exact halving
		s++
	}
	r := series(y, func(k int, t *big.Float) { t.Mul(t, y).Quo(t, big.NewFloat(float64(k+1))) })
	for range s {
		r.Mul(r, newF().Add(r, big.NewFloat(2))) // (e^y-1)(e^y-1+2)
	}
	return r
}

// log1pRef returns log(1+x) by Newton's method on e^z - 1 = x from the
// float64 estimate: z <- z - (e^z-1-x)/e^z, quadratic convergence
// (53 -> 106 -> 212 bits).
func log1pRef(x float64) *big.Float { return logOnePlusRef(bf(x)) }

// logOnePlusRef is log1pRef for an argument held at prec bits.
func logOnePlusRef(bx *big.Float) *big.Float {
	z := bf(math.Log1p(f64(bx)))
	for range 5 {
		em1 := expm1Ref(z)
		d := newF().Sub(em1, bx)
		z.Sub(z, d.Quo(d, newF().Add(em1, big.NewFloat(1))))
	}
	return z
}

// oneMinusCosRef returns 1 - cos x = Σ_{k>=1} (-1)^(k+1) x^(2k)/(2k)!
// (Taylor series; |x| <= 4 keeps the terms below 2^-300 after ~60 steps).
func oneMinusCosRef(x float64) *big.Float {
	bx := bf(x)
	x2 := newF().Mul(bx, bx)
	t0 := newF().Quo(x2, big.NewFloat(2))
	return series(t0, func(k int, t *big.Float) {
		t.Mul(t, x2).Quo(t, big.NewFloat(float64((2*k+1)*(2*k+2)))).Neg(t)
	})
}

// logCosRef returns log(cos x) = log(1 - w), w = 1 - cos x by its
// Taylor series, and log(1 - w) = -Σ_{k>=1} w^k/k (Taylor series).
func logCosRef(x float64) *big.Float {
	w := oneMinusCosRef(x)
	return series(newF().Neg(w), func(k int, t *big.Float) {
		t.Mul(t, w).Mul(t, big.NewFloat(float64(k))).Quo(t, big.NewFloat(float64(k+1)))
	})
}

// secm1Ref returns sec x - 1 = w/(1 - w), w = 1 - cos x by its Taylor
// series.
func secm1Ref(x float64) *big.Float {
	w := oneMinusCosRef(x)
	return newF().Quo(w, newF().Sub(big.NewFloat(1), w))
}

// hypotRef returns sqrt(x² + y²), squares and sum exact at prec bits.
func hypotRef(x, y float64) *big.Float {
	s := newF().Add(newF().Mul(bf(x), bf(x)), newF().Mul(bf(y), bf(y)))
	return s.Sqrt(s)
}

// ln2Ref returns ln 2 = Σ_{k>=1} 1/(k·2^k) (the series of -ln(1-1/2)).
func ln2Ref() *big.Float {
	half := bf(0.5)
	sum, pow := newF(), bf(1)
	for k := 1; k < 400; k++ {
		pow.Mul(pow, half)
		sum.Add(sum, newF().Quo(pow, big.NewFloat(float64(k))))
	}
	return sum
}

// ulps returns |got - want| in units of the spacing of float64 at want.
func ulps(got float64, want *big.Float) float64 {
	w := f64(want)
	if math.IsInf(got, 0) || math.IsNaN(got) {
		return math.Inf(1)
	}
	d := newF().Sub(bf(got), want)
	dist, _ := d.Abs(d).Float64()
	return dist / (math.Nextafter(math.Abs(w), math.Inf(1)) - math.Abs(w))
}

// ln10Ref returns ln 10 = log(1+9), by log1pRef.
func ln10Ref() *big.Float { return log1pRef(9) }

// powm1Ref returns 1-(1-r)^3 = 3r - 3r² + r³ (binomial expansion, exact
// at prec bits).
func powm1Ref(r float64) *big.Float {
	br := bf(r)
	r2 := newF().Mul(br, br)
	r3 := newF().Mul(r2, br)
	out := newF().Mul(bf(3), br)
	out.Sub(out, newF().Mul(bf(3), r2))
	return out.Add(out, r3)
}

// asinhRef returns asinh x = sign(x)·log(|x| + sqrt(x²+1)), the sum formed
// without cancellation for |x| and its logarithm by log1pRef's Newton
// iteration, started from the float64 value of the sum minus 1.
func asinhRef(x float64) *big.Float {
	ax := math.Abs(x)
	s := newF().Add(newF().Mul(bf(ax), bf(ax)), bf(1))
	s.Sqrt(s).Add(s, bf(ax)).Sub(s, bf(1))
	r := logOnePlusRef(s)
	if x < 0 {
		r.Neg(r)
	}
	return r
}

// squaresRef returns 1 - c², exact at prec bits.
func squaresRef(c float64) *big.Float {
	return newF().Sub(bf(1), newF().Mul(bf(c), bf(c)))
}
