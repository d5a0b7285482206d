// Package stoptol defines an Analyzer that reports stopping tests that
// cannot be met: x-tolerances tighter than a method can locate x,
// tolerances blind to the scale of x, and loops with nothing else to end
// them.
//
// # Analyzer stoptol
//
// stoptol: stopping tests tighter than the method can meet
//
// Near a minimizer x*, f(x*+δ) ≈ f(x*) + f”(x*)·δ²/2, so comparing function
// values cannot tell apart points closer than about sqrt(eps)·max(1,|x*|):
// 1.49e-8 relative in float64, 3.45e-4 in float32 (Brent 1973, ch. 5;
// Numerical Recipes 3rd ed. §10.2; Gill, Murray & Wright 1981). Root
// finding with sign changes, Newton and secant steps locate x to a few ulps,
// about eps·|x|, but an absolute tolerance that ignores |x| still fails
// once adjacent floats are farther apart than the tolerance: from |x| =
// 2^19 ≈ 5.2e5 on, float64 values are more than 1e-10 apart, so
// |b-a| < 1e-10 never holds there.
//
// stoptol finds the stopping tests of loops (the loop condition, and
// conditions guarding break or return in the body) that compare a step or
// bracket quantity (|b-a|, |x1-x0|, |step|, their relative forms) with a
// tolerance, and classifies the loop: a derivative-free minimization when it
// compares function values to choose points (golden-section, parabolic,
// Brent-like search, backtracking), a root finding or derivative-based
// search when it tests signs (f(a)*f(m) < 0, math.Signbit) or steps by a
// quotient (Newton, secant), otherwise unknown. It reports:
//
//   - in a minimization, an x-tolerance below sqrt(eps) of the type,
//     relative or at unit scale (category tight);
//   - in a root finding, an absolute x-tolerance below sqrt(eps) that
//     ignores |x|, with the |x| beyond which the test can never pass
//     (category unscaled), and a relative step tolerance below the unit
//     roundoff (category tight);
//   - absolute gradient-norm thresholds that ignore the scale of f, with
//     lower confidence (category fscale);
//   - loops whose only exits are such tolerance tests and that have no
//     iteration cap, when the tolerance is too tight, or is a parameter or
//     field that a caller may set too tight (category nocap); and
//     backtracking loops that shrink a step until a sufficient-decrease test
//     holds with neither a floor on the step nor a cap (category
//     backtrack);
//   - constants reaching such a tolerance as a call argument, a struct
//     field or a default, in this package or another (through facts).
//
// A tolerance that no float could resolve (relative below the unit
// roundoff, absolute below eps) is epsfloor's to report, and stoptol stays
// silent there, so no test is reported twice.
//
// It leaves alone: bisection with a tolerance of a few eps relative to |x|;
// tolerances already scaled (tol*(1+math.Abs(x)), sqrt(eps)·|x| + abstol,
// Brent's mixed forms); loops with an iteration cap and a sane tolerance;
// tolerances on quantities that are not x (residual norms); loops it cannot
// classify, except for the missing cap.
//
// Fixes (all need review): in a minimization, the test becomes
// |b-a| <= 2*(0x1p-26*|x| + tol) (sqrt(eps) = 2^-26 exactly for float64), or
// a too-tight constant becomes 0x1p-26; in a root finding, an unscaled
// tolerance gains 4 ulps of |x|: |b-a| <= tol + 4*0x1p-52*|x|. A missing
// iteration cap gets guidance, not a fix.
package stoptol
