// Package exacteq defines an Analyzer that reports exact equality tests on
// floating-point values that rounding makes unreliable.
//
// # Analyzer exacteq
//
// exacteq: exact equality on floating-point values that carry rounding error
//
// Every floating-point operation rounds its exact result to a nearby float
// (IEEE 754-2019 §4.3; Goldberg 1991), so two computations that agree in
// exact arithmetic often differ in the last bits: 0.1+0.2 is
// 0.30000000000000004, not 0.3. Go may also fuse x*y+z into one operation on
// some architectures, so an exact result seen on one machine may not hold on
// another. exacteq reports ==, != and switch cases on float32, float64,
// complex values (and named types and type parameters over them) when:
//
//   - both operands are computed: produced by inexact arithmetic or a
//     rounding math function in this package (a+b == c, f(x) == f(y) for a
//     function f of this package, accumulated sums);
//   - a computed operand is compared with a decimal constant the type cannot
//     represent (0.1, 0.3); the message shows the value actually stored;
//   - an operand is math.NaN(): such a comparison is always false (==) or
//     always true (!=);
//   - arrays or structs holding computed floats are compared with ==, which
//     compares every element exactly;
//   - a loop condition tests a float loop variable, stepped by arithmetic on
//     itself, with == or != (for x := 0.0; x != 1; x += 0.1 never stops); when
//     start, step and bound are constants the loop is simulated and reported
//     only if the bound is missed;
//   - testify's assert or require Equal compares floats that way in tests.
//
// It leaves alone the idioms that compare exactly on purpose: the NaN test
// x != x; comparisons with exact zero; parameters, fields, loads and copies
// compared with anything (sentinels such as alpha == 1, sorting and
// deduplication, knot hits in interpolation); values merged from branches;
// results of math functions that do not round (Abs, Floor, Max...) and of
// functions from other packages; comparisons with infinities or
// math.MaxFloat64; an operand derived from the other on purpose (the
// bisection stop m == a where m := (a+b)/2, the overflow test x*c == x); and
// loop variables clamped to the bound.
//
// Fixes: math.NaN() comparisons become math.IsNaN(x) and float loop
// conditions become < or > by the sign of the step; both are safe to apply
// unattended. Comparisons of computed values become a relative-tolerance test
// math.Abs(a-b) <= rtol*math.Max(math.Abs(a), math.Abs(b)) with rtol 1e-9
// for float64 (1e-5 for float32), and testify's Equal becomes InEpsilon; the
// tolerance is a judgement, so go fix and go vet -fix do not apply these.
package exacteq
