// Package epsfloor defines an Analyzer that reports tolerances below what
// the float type can resolve.
//
// # Analyzer epsfloor
//
// epsfloor: tolerances below what the float type can resolve
//
// Adjacent float64 values near 1 are eps = 2^-52 ≈ 2.22e-16 apart, and the
// relative spacing of float64 values lies between the unit roundoff
// u = 2^-53 ≈ 1.11e-16 and eps (IEEE 754-2019 binary64; for binary32,
// 2^-24 and 2^-23). Two different float64 values a and b therefore always
// satisfy |a-b| > u·max(|a|,|b|): a relative tolerance below u can pass only
// when a == b, and a tolerance test becomes exact equality in disguise.
// math.SmallestNonzeroFloat64 (2^-1074 ≈ 4.9e-324) says how small a number
// can be, not how close two numbers can be. Numerical libraries use u
// itself as "converged to full precision", so between u and eps nothing is
// reported.
//
// epsfloor reports:
//
//   - relative tolerances below the unit roundoff of the operands' type:
//     math.Abs(a-b) <= tol*math.Abs(b), math.Abs(a-b)/math.Abs(b) < tol,
//     < tol*math.Max(math.Abs(a), math.Abs(b)) and the like;
//   - absolute tolerances on a difference, math.Abs(a-b) < tol, below eps:
//     the test still means something only for values below about tol/eps,
//     and is exact equality above; when one operand is a constant the
//     spacing of floats there decides;
//   - the smallest positive float used as a tolerance;
//   - tolerance tests on an iterate instead of on its change
//     (math.Abs(x) < 1e-16 inside a loop that updates x from itself), which
//     never pass for a root away from zero;
//   - absorbed addends: a constant k ± c that rounds back to k, so c has no
//     effect (1 - math.SmallestNonzeroFloat64 is exactly 1; math.Nextafter
//     was meant);
//   - constant tolerance arguments to well-known APIs (gonum's
//     floats/scalar EqualWithinAbs, EqualWithinRel, EqualWithinAbsOrRel,
//     floats.EqualApprox; testify's InDelta, InDeltaSlice, InEpsilon,
//     InEpsilonSlice), and to functions and struct fields of any package
//     that use a parameter or field as such a tolerance (carried across
//     packages as facts): the call argument, composite-literal field or
//     assignment (such as the defaulting idiom if s.Tol == 0 { s.Tol = c })
//     is reported.
//
// float32 operands are judged against float32's resolution, and a type
// parameter whose type set admits float32 against float32, since that
// instantiation is allowed.
//
// It leaves alone: zero tolerances (exact on purpose), negative and NaN
// sentinels; constants at or below 2^-1000, which guard against underflow
// (safe minimum), never tolerances; single magnitudes compared with tiny
// constants before a division (|d| < 1e-300); thresholds on squared
// quantities; mixed tests atol + rtol·scale; tolerances at or above eps
// (absolute) or u (relative); comparisons with a known magnitude where the
// tolerance exceeds half the spacing of floats there.
//
// Fixes (all need review, so go fix does not apply them): a relative
// tolerance below u becomes 4 ulps of the type, written exactly as
// 4*0x1p-52 (8.9e-16) for float64 and 4*0x1p-23 (4.8e-7) for float32, so
// values a few roundings apart still compare equal; an absolute tolerance
// below eps on a difference becomes a mixed test that keeps it as the floor
// near zero, math.Abs(a-b) <= tol + 4*0x1p-52*math.Max(math.Abs(a),
// math.Abs(b)); the smallest positive float becomes the type's eps; an
// absorbed addend becomes math.Nextafter(k, ±Inf) in the direction of its
// sign.
package epsfloor
