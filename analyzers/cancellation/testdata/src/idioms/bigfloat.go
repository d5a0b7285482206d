package idioms

import "math/big"

// With 106 bits the products of float64 values are exact, and so is the
// sign of their difference.
func exactTurnSign(ax, ay, bx, by float64) int {
	p := new(big.Float).SetPrec(106).SetFloat64(ax)
	q := new(big.Float).SetPrec(106).SetFloat64(ay)
	p.Mul(p, big.NewFloat(by))
	q.Mul(q, big.NewFloat(bx))
	return p.Sub(p, q).Sign()
}

// A difference of values that are not products: it rounds once, as in
// float64, and cancels nothing the data did not already hold.
func bigGap(a, b float64) float64 {
	var p, q big.Float
	p.SetFloat64(a)
	q.SetFloat64(b)
	f, _ := p.Sub(&p, &q).Float64()
	return f
}
