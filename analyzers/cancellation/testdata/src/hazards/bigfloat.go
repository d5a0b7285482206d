package hazards

import "math/big"

// A "robust" orientation test in math/big that never sets a precision:
// every Float gets 53 bits from SetFloat64, so the determinant rounds as
// in float64.
func turnSign(ax, ay, bx, by float64) int {
	var p, q big.Float
	p.SetFloat64(ax).Mul(&p, big.NewFloat(by))
	q.SetFloat64(ay).Mul(&q, big.NewFloat(bx))
	return p.Sub(&p, &q).Sign() // want `p.Sub of big.Float products in a function that never calls SetPrec: a zero big.Float takes its operands' precision, 53 bits`
}
