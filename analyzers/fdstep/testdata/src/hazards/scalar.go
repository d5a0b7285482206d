// Package hazards holds difference quotients whose fixed steps ignore the
// size of x, or are far from the scheme's optimum.
//
// Magnitudes in the messages: x+h == x once |h| < ulp(x)/2, and for a
// binary64 x in [2^e, 2^(e+1)) ulp(x) = 2^(e-52) (IEEE 754-2019 §3.4). For
// h in [2^(k-1), 2^k) that first holds at |x| = 2^(k+53): 1e-8 → 2^27 ≈
// 1.34e8 (as NUMERICS.md states), 1e-5 → 2^37 ≈ 1.37e11, 1e-4 → 2^40 ≈
// 1.1e12, 1e-6 → 2^34 ≈ 1.72e10, 1e-7 → 2^30 ≈ 1.07e9. In binary32 ulp(x)
// = 2^(e-23), so from 2^(k+24). The recommended steps and
// error models are those of Numerical Recipes 3rd ed. §5.7 and Nocedal &
// Wright 2nd ed. §8.1 as tabled in NUMERICS.md: sqrt(eps) ≈ 1.49e-8,
// eps^(1/3) ≈ 6.06e-6, eps^(1/4) ≈ 1.22e-4.
package hazards

import "math"

const h = 1e-8

var gstep = 1e-7 // never reassigned

// Forward difference with a named constant.
func forwardConst(f func(float64) float64, x float64) float64 {
	return (f(x+h) - f(x)) / h // want `fixed forward-difference step h = 1e-08 does not scale with x: x\+h rounds to x for \|x\| ≥ 1.34e\+08 in float64, where the difference vanishes; use h = sqrt\(eps\)·max\(1,\|x\|\) ≈ 1.49e-08·max\(1,\|x\|\)`
}

// Forward difference with literals.
func forwardLiteral(f func(float64) float64, x float64) float64 {
	return (f(x+1e-8) - f(x)) / 1e-8 // want `fixed forward-difference step 1e-08 does not scale with x`
}

// Backward difference with a local variable never reassigned.
func backward(f func(float64) float64, x float64) float64 {
	d := 1e-6
	return (f(x) - f(x-d)) / d // want `fixed backward-difference step d = 1e-06 does not scale with x: x\+h rounds to x for \|x\| ≥ 1.72e\+10`
}

// Central difference over 2*d.
func centralLocal(f func(float64) float64, x float64) float64 {
	d := 1e-5
	return (f(x+d) - f(x-d)) / (2 * d) // want `fixed central-difference step d = 1e-05 does not scale with x: x\+h rounds to x for \|x\| ≥ 1.37e\+11 in float64, where the difference vanishes; use h = eps\^\(1/3\)·max\(1,\|x\|\) ≈ 6.06e-06·max\(1,\|x\|\)`
}

// Central difference written as 0.5*(...)/h.
func centralHalf(f func(float64) float64, x float64) float64 {
	const step = 1e-5
	return 0.5 * (f(x+step) - f(x-step)) / step // want `fixed central-difference step step = 1e-05 does not scale with x`
}

// Central difference divided twice.
func centralTwice(f func(float64) float64, x float64) float64 {
	const step = 1e-5
	return (f(x+step) - f(x-step)) / step / 2 // want `fixed central-difference step step = 1e-05`
}

// Central difference whose denominator the compiler folds to 2e-8; the
// step is also far below the central optimum: eps/h = 2.2e-8 against
// (6.06e-6)²/6 + eps/6.06e-6 ≈ 4.3e-11.
func centralTooSmall(f func(float64) float64, x float64) float64 {
	return (f(x+1e-8) - f(x-1e-8)) / 2e-8 // want `fixed central-difference step 1e-08 is too small: expected error ~2.2e-08 at this step against ~4.3e-11 at h = eps\^\(1/3\)·max\(1,\|x\|\) ≈ 6.06e-06·max\(1,\|x\|\) \(float64, f and its derivatives of unit size\)`
}

// Second difference over s*s.
func second(f func(float64) float64, x float64) float64 {
	const s = 1e-4
	return (f(x+s) - 2*f(x) + f(x-s)) / (s * s) // want `fixed second-difference step s = 0.0001 does not scale with x: x\+h rounds to x for \|x\| ≥ 1.1e\+12 in float64, where the difference vanishes; use h = eps\^\(1/4\)·max\(1,\|x\|\) ≈ 0.000122·max\(1,\|x\|\)`
}

// Second difference with a step far below eps^(1/4): 4·eps/h² ≈ 8.9 at
// h = 1e-8.
func secondTooSmall(f func(float64) float64, x float64) float64 {
	return (f(x+h) + f(x-h) - 2*f(x)) / (h * h) // want `fixed second-difference step h = 1e-08 is too small: expected error ~8.9 at this step against ~6.1e-08`
}

// Forward difference of a math function, far below sqrt(eps): 2·eps/h ≈
// 4.4e-4 at h = 1e-12.
func forwardTooSmall(x float64) float64 {
	return (math.Exp(x+1e-12) - math.Exp(x)) / 1e-12 // want `fixed forward-difference step 1e-12 is too small: expected error ~0.00044 at this step against ~3.7e-08`
}

// The point x+h stored in a variable first.
func storedPoint(f func(float64) float64, x float64) float64 {
	xp := x + h
	fp := f(xp)
	f0 := f(x)
	return (fp - f0) / h // want `fixed forward-difference step h = 1e-08`
}

// The quotient assembled over several statements.
func assembled(f func(float64) float64, x float64) float64 {
	d := f(x + h)
	d -= f(x)
	d /= h // want `fixed forward-difference step h = 1e-08`
	return d
}

// A package variable never reassigned.
func global(f func(float64) float64, x float64) float64 {
	return (f(x+gstep) - f(x)) / gstep // want `fixed forward-difference step gstep = 1e-07 does not scale with x: x\+h rounds to x for \|x\| ≥ 1.07e\+09`
}

// The representable-step correction alone does not scale the step: at
// |x| ≥ 2^27 xp == x and the quotient is 0/0.
func representableOnly(f func(float64) float64, x float64) float64 {
	xp := x + h
	dx := xp - x
	return (f(xp) - f(x)) / dx // want `fixed forward-difference step h = 1e-08 does not scale with x`
}

// A float32 function: 1e-3 is in [2^-10, 2^-9), so x+h rounds to x from
// 2^15 = 32768; sqrt(eps) = 2^-11.5 ≈ 3.45e-4 for binary32 (NUMERICS.md).
func float32Forward(f func(float32) float32, x float32) float32 {
	return (f(x+1e-3) - f(x)) / 1e-3 // want `fixed forward-difference step 0.001 does not scale with x: x\+h rounds to x for \|x\| ≥ 3.28e\+04 in float32, where the difference vanishes; use h = sqrt\(eps\)·max\(1,\|x\|\) ≈ 0.000345·max\(1,\|x\|\)`
}

// A function with several results.
func results(f func(float64) (float64, error), x float64) float64 {
	fp, _ := f(x + h)
	f0, _ := f(x)
	return (fp - f0) / h // want `fixed forward-difference step h = 1e-08`
}

// The same component of a vector-valued function.
func component(f func(float64) []float64, x float64, i int) float64 {
	return (f(x + h)[i] - f(x)[i]) / h // want `fixed forward-difference step h = 1e-08`
}

// A negated quotient: minus the derivative of a potential.
func force(u func(float64) float64, r float64) float64 {
	return -(u(r+h) - u(r)) / h // want `fixed forward-difference step h = 1e-08 does not scale with x`
}
