// Package fdstep defines an Analyzer that reports finite-difference steps
// that ignore the size of x.
//
// # Analyzer fdstep
//
// fdstep: finite-difference steps that ignore the size of x
//
// A difference quotient trades truncation error, which grows with the step
// h, against rounding error, which grows as h shrinks. With eps_f the
// relative accuracy of f (machine epsilon for a clean formula) and
// x_c = max(1,|x|) the scale of x, the balance is at h ≈ sqrt(eps_f)·x_c
// for the forward difference (f(x+h)-f(x))/h, eps_f^(1/3)·x_c for the
// central difference (f(x+h)-f(x-h))/(2h) and eps_f^(1/4)·x_c for the
// second difference (f(x+h)-2f(x)+f(x-h))/h² (Numerical Recipes 3rd ed.
// §5.7; Nocedal & Wright 2nd ed. §8.1). A fixed step works near x = 1 and
// fails as |x| grows: x+h rounds to x once |h| is below half the spacing
// of floats at x, from |x| ≈ 1.34e8 for h = 1e-8 in float64, and the
// quotient is then 0 (or 0/0).
//
// The five-point stencils (f(x-2h)-8f(x-h)+8f(x+h)-f(x+2h))/(12h) and
// (-f(x+2h)+16f(x+h)-30f(x)+16f(x-h)-f(x-2h))/(12h²) are fourth order: their
// truncation errors are h⁴·f⁽⁵⁾/30 and h⁴·f⁽⁶⁾/90, so the balance is near
// eps_f^(1/5)·x_c ≈ 7.4e-4·x_c and eps_f^(1/6)·x_c ≈ 2.5e-3·x_c.
//
// fdstep recognises forward, backward, central, second and five-point
// differences of one function evaluated at x and x+k·h (k up to ±2, the
// step written h, 2*h, or as constants that are multiples of one another): a plain function, a method, an
// interface method, a closure, a func-typed parameter or field, the same
// component of a vector result; x+h may be stored in a variable first and
// the quotient assembled over several statements. It also recognises
// gradient and Jacobian loops that perturb one element of a slice (in
// place and restored, or on a copy made by copy, slices.Clone or append),
// evaluate, and divide by h; and table-driven stencils, which evaluate f at
// x + h·loc (or add loc·h to an element of a copy of x) for offsets loc
// read from a table and divide the weighted sum by a power of h. The step
// must be a constant: a literal, a named constant, a variable never
// reassigned (captured by a closure or not), arithmetic of those, or the
// fixed default of a step chosen elsewhere (h := o.Step; if h == 0 { h =
// 1e-8 }, or a table's own Step field set to a constant).
//
// It reports:
//
//   - a fixed step not scaled by |x| (category unscaled): the message gives
//     the |x| from which x+h rounds to x in the operands' format and the
//     recommended step, sqrt(eps)·max(1,|x|) ≈ 1.49e-8·max(1,|x|) forward
//     or backward, eps^(1/3)·max(1,|x|) ≈ 6.06e-6·max(1,|x|) central,
//     eps^(1/4)·max(1,|x|) ≈ 1.22e-4·max(1,|x|) second, eps^(1/5) ≈ 7.4e-4
//     and eps^(1/6) ≈ 2.46e-3 times max(1,|x|) five-point (float64);
//   - a fixed step too large for a derivative: above 1e-2 and with a
//     truncation error of at least 1e-3 for f and its derivatives of unit
//     size (category badsize): a forward step of 0.1 errs by about 0.05;
//   - a step so far below the scheme's optimum that its expected error, for
//     f and its derivatives of unit size, is at least 100 times the error
//     at the optimum (category badsize): forward h = 1e-12 gives ~4.4e-4
//     against ~3.7e-8, central h = 1e-8 ~2.2e-8 against ~4.3e-11. The
//     message gives both errors. A step above the optimum is not called
//     badly sized: it is the right step for a function noisier than eps;
//   - in a derivative check, where the quotient (or the call returning it)
//     is compared with a tolerance, a step below the optimum whose
//     expected error exceeds that tolerance (category badsize): the check
//     then passes or fails on rounding, while the optimal step would meet
//     it. A central step of 1e-7 errs by ~2.2e-9, above a tolerance of
//     1e-10; at the optimum the error is ~4.3e-11. The message gives the
//     error and the tolerance.
//
// The tolerance of a check is read by the shared tolerance recognition:
// |a-b| < tol, relative |a-b| < tol·|b| and mixed |a-b| < atol + rtol·|b|
// tests, read at unit scale (tol, atol + rtol), reached from the quotient
// through arithmetic, absolute values and conversions, or inside a helper
// of the same package that the quotient is passed to, whose tolerance is
// then the constant the call passes. The tightest such tolerance counts;
// constants at or below 2^-511 (an early accept when |a-b| is below the
// smallest float) guard against underflow and are no tolerances.
//
// A step that reaches the quotient through a parameter, or through a
// struct field, is judged where a constant is passed or stored: the call
// argument (deriv(f, x, 1e-8)), the composite-literal field
// (Settings{Step: 1e-8}) or the assignment (s.Step = 1e-8). This works
// across packages through facts. When a parameter serves several schemes,
// the worst verdict is reported.
//
// Calls of gonum's diff/fd (Derivative, Gradient, Jacobian, Laplacian)
// whose settings are nil, or a composite literal with no Step, take the
// formula's own fixed Step for every component of x (2e-8 for Forward and
// Backward, 6e-6 for Central, 1e-4 for Central2nd; gonum v0.17.0,
// diff/fd/diff.go): that fixed step is judged at the settings argument as
// any other, and a step the caller gives, or settings built elsewhere,
// are the caller's.
//
// A step that is the default of a chosen one is reported at the quotient,
// naming the default's assignment; a table-driven stencil once per
// function, at its first perturbation, with the smallest constant its step
// can take and where that constant is written. Both only say that the step
// does not scale with x, and offer no fix.
//
// It leaves alone: a step far below the optimum in a derivative check
// whose tolerance is at least 10 times the step's expected error (a central
// step of 1e-8 errs by ~2.2e-8, 45 times below a tolerance of 1e-6): the
// step is adequate for the check, whatever it would cost elsewhere, and
// the factor 10 leaves room for |f| up to 10 and for the constant factors
// the error model drops; a guard on the quotient's size (|d| < 1e-12, does
// the slope vanish?), which compares it with no reference and is no
// derivative check; steps computed from x (c*math.Max(1, math.Abs(x)),
// c*(1+math.Abs(x)), a helper's result, per-component steps from a slice);
// steps above 1e-2 whose truncation error keeps three digits (a central
// step of 0.05 errs by h²/6 ≈ 4e-4), which would be optimal only for a
// function accurate to fewer than about four digits and are smoothing
// widths; steps of 1 or more, which difference a sequence; in _test.go
// files, steps that do not scale with x or are large, in quotients there
// and in constants a test passes or stores as a step (a test's derivative
// check evaluates at its own points with its own tolerance, chosen with
// the step: a step that failed there would fail the test, so it is
// deliberate, as are expected values pinned for it; a step far below the
// optimum is still reported, since the check's own rounding error then
// nears its tolerance);
// table-driven sums that multiply by the step instead of dividing
// (quadrature rules);
// differences of sampled data ((u[i+1]-u[i-1])/(2*dx) reads an array, not
// a function); evaluations at grid points, where x itself moves by h
// (t += dt) or is x0 + i·h, so h is the grid's spacing; complex-step
// derivatives (imag(f(complex(x, h)))/h has no subtraction); measured time
// series differenced by index; quotients at a constant x where the step is
// of the right size; differences of two different functions or receivers,
// secants through given points, stencils other than the six above, and
// quotients whose denominator does not match the scheme; steps reassigned
// in a loop (Richardson extrapolation, adaptive schemes and derivative
// checkers that shrink an initial step: the step they end with is not the
// one they start with), defaults scaled to x, and complex-valued functions.
//
// Fix (needs review, so go fix does not apply it): declare, just before
// the quotient's first use of the step, a step scaled to x and made exactly
// representable (Numerical Recipes 3rd ed. §5.7),
//
//	h := math.Sqrt(0x1p-52) * math.Max(1, math.Abs(x))
//	h = (x + h) - x
//
// (math.Cbrt for central, math.Sqrt(math.Sqrt(...)) for second
// differences; 0x1p-23 and conversions for float32; none for five-point
// stencils, whose outer points are written 2*h), use it in x±h and in
// the denominator, and delete the old local step when nothing else uses
// it; in vector loops the step is per component. The math import is added
// when missing. No fix is offered when the step reaches the quotient
// through a parameter or field, when the denominator's step is folded into
// a constant (2e-8 for 2*h) or assembled by d /= h, or when x cannot be
// evaluated where the step is declared.
package fdstep
