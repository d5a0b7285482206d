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
// stoptol finds the stopping tests of loops (the loop condition, a flag
// that holds a test, as in for !converged, and conditions guarding break,
// return or panic in the body) that compare a measure of progress with a
// tolerance: |b-a| with the absolute value taken by any route (math.Abs,
// the Abs of a float32 library, a package's own helper, a variable bound
// to one, learned by meaning in package absval), a bracket width b-a
// written without one where the body keeps the bracket ordered, widths
// scaled by constants ((b-a)/2 < tol holds when |b-a| < 2·tol), a width
// shrunk by a constant factor each pass, differences of slice elements,
// steps, and their relative forms, mixed ones too (rtol·|x| + atol, its
// relative part rtol judged; twice such a sum, Brent's tol2 = 2·tol1, as
// m/2 against it; and Brent's |x - xm| <= tol2 - (b-a)/2, a test on the
// offset and the half-width together, against tol2), read through locals
// given one value, also those declared first and assigned once (var tol1
// float64, as code ported from C writes it; see constval.SetOnce). A
// helper of the package that only stores its values through its pointers
// (mov3(&x, &fx, &dx, u, fu, du), as C ports shift a search's points)
// assigns what it is handed, for every reading here. It classifies the
// loop: a
// derivative-free minimization when it compares function values to choose
// points (golden-section, parabolic interpolation through three points,
// Brent-like search, backtracking), a root finding when it tests signs
// (f(a)*f(m) < 0, math.Signbit) or steps by a quotient of function values
// (Newton, secant), a fixed-point iteration when it replaces x by a
// nonlinear formula of itself (Heron's x = (x + a/x)/2, x = g(x), a
// corrector applied again), which converges to a few ulps as root finders
// do; otherwise unknown. It reports:
//
//   - in a minimization, an x-tolerance below sqrt(eps) of the type,
//     relative or at unit scale (category tight);
//   - in a root finding or fixed-point iteration, an absolute x-tolerance
//     below sqrt(eps) that ignores |x|, with the |x| beyond which the test
//     can never pass (category unscaled), and a relative step tolerance
//     below the unit roundoff (category tight);
//   - absolute gradient-norm thresholds that ignore the scale of f, with
//     lower confidence (category fscale);
//   - loops whose only exits are such tolerance tests and that have no
//     iteration cap, when the tolerance is too tight, or is a parameter or
//     field that a caller may set too tight (category nocap); a cap in the
//     loop condition beside an operand the loop does not change (for i :=
//     0; max == 0 || i < max; i++) is off wherever that operand holds, and
//     so caps nothing on that path; a guard the loop does not change around
//     an exit (if o.Tol != 0 { if d < o.Tol { break } }) selects the exit
//     and ends nothing itself, so the exit is the test inside it; and
//     backtracking loops that shrink a step until a sufficient-decrease test
//     holds with neither a floor on the step nor a cap (category
//     backtrack);
//   - any other loop with no cap (for { }, or for true { } as ported code
//     writes it: a condition that never fails ends nothing) whose only
//     exits are float tests (a three-way comparator of floats tested
//     against 0, cmp(x, p, tol) != 0, is one: its 0 says the two agree;
//     so is a call of a function, not a method, given a float value and
//     perhaps its tolerances, floats only, and returning a bool, such as a
//     helper epsilon.IsZero(frac, tol...) of any package, which can decide
//     only from them; not a method, s.Step(dt), which may report a state
//     the loop drives, nor math.IsNaN, an exact classification, nor a
//     helper given a slice of data first, allZero(g)) on values
//     it carries from pass to pass by float work (category nocap): an
//     iteration that stalls, oscillates or diverges keeps it running, and
//     so does a NaN when every exit is false for NaN (d < tol breaks; d >
//     tol as the loop condition does not); a series whose only exit tests
//     the term, when a NaN term keeps it running;
//   - a function that calls itself (a method, on its own receiver) until a
//     float test passes, read as the loop for { body } whose passes are the
//     recursive calls, each assigning its arguments to the parameters, and
//     whose exits are the returns that make and follow no recursive call,
//     each guarded by the conditions of the ifs around it (a function
//     with no results whose body ends in if cond { ... recursive calls ... }
//     is read as for cond { body }; an exit standing after an if chain
//     every branch of which leaves, one by a base case of its own, if a {
//     return m } else if b { return rec(...) }; return math.Inf(1), runs
//     only where no condition of the chain held and is guarded by their
//     negations, in loops too, but not after a chain that only passes on,
//     a reflection if x < 0 { return f(-x) } whose call leaves the
//     guard's domain): judged as such
//     a loop, it is reported at its first float base-case test when
//     nothing bounds the depth (category nocap). A recursion that never
//     ends is worse than a loop: every call holds a stack frame, and once
//     the goroutine's stack passes its maximum (1 GB on 64-bit platforms,
//     250 MB on 32-bit, per the doc of runtime/debug.SetMaxStack) the
//     runtime aborts the program with a fatal error that recover cannot
//     catch. Bisection to |f(m)| < 1e-17 on x²-2 never passes: f takes no
//     value between 0 and about 4.4e-16 near √2, where floats are 2.22e-16
//     apart, and m repeats once the ends are adjacent; adaptive Simpson
//     quadrature that halves its tolerance at each level, with no depth
//     limit, never passes once the halves are below rounding;
//   - a range reduction by repeated addition, for x < 0 { x += 2*math.Pi }
//     (also for { if x >= 0 { break }; x += 2*math.Pi }), on a parameter
//     of an exported function or on a local given before the loop only
//     parameters moved or scaled by constants (b := math.Pi/2 - theta),
//     which takes |x|/c passes and never ends once c is absorbed, from
//     |x| = 2^56 ≈ 7.2e16 for 2π in float64 (category reduction); a
//     value computed otherwise first (math.Atan2, math.Mod) may be
//     bounded, and is left alone;
//   - a loop that advances x by a step computed by a formula that can round
//     to zero (acos(r/(r+d)) once d/r < eps/2, a difference, a remainder)
//     and ends only on float tests (category stall);
//   - a loop that cuts its state at a fraction t computed afresh each
//     pass (lo, hi = cut(lo, hi, t)) until t reaches a constant bound,
//     when a parameter among t's factors can be 0 (t = 2·sqrt(tol·|k|)
//     with a tolerance of 0, which neither the function nor, for an
//     unexported one, its callers floor at a positive value): t is then 0
//     and the loop never advances (category stall);
//   - constants reaching such a tolerance as a call argument, a struct
//     field, a default, the elements of a slice or a test table's field, in
//     this package or another, through any number of wrappers (facts).
//
// A finding whose value is written in one place and tested in another
// names both: a default is reported at its test with the constant as the
// related place; a constant at a call or in a field names the test it sets
// when this package holds it; a loop finding stands at its exit test and
// names the loop and the computed step.
//
// A tolerance that no float could resolve (relative below the unit
// roundoff, absolute below eps) is epsfloor's to report, and stoptol stays
// silent there, so no test is reported twice.
//
// It leaves alone, each for a numerical reason:
//   - bisection with a tolerance of a few eps relative to |x|, tolerances
//     already scaled (tol*(1+math.Abs(x)), sqrt(eps)·|x| + abstol, Brent's
//     mixed forms), loops with an iteration cap (a counter, or a panic past
//     a count) and a sane tolerance: they can be met; a float counter
//     caps like an integer one when it is declared in the function
//     outside the loop's body, set only to constants outside the loop,
//     stepped in it only by constants of one sign and by a constant c on
//     every pass, against a constant bound below 2^52·|c|: it can never
//     be NaN or ±Inf, and half the spacing of floats below 2^52·|c| is
//     below |c|, so each step moves it (z := 1.; z += 1; z > 50);
//   - tolerances on quantities that are not x (residual norms), a signed
//     difference x1-x0 of successive iterates (not a width), a value
//     passed through a helper that is not an absolute value (a ramp
//     max(x, 0)), a step multiplier that starts at 1 (relative to a
//     direction, not a length in x), and a running average (linear in x):
//     none measures how well x is located;
//   - bisection until no float is left (m <= a || m >= b, or m == a ||
//     m == b): m rounds to an end after at most about 2100 halvings;
//   - values scaled each pass by a factor the loop does not change (h /= 3,
//     b *= 1/safmin): they reach 0 or ±Inf in at most about 2100 passes
//     (a factor between 1/2 and 1 stops at a subnormal value instead,
//     0.618 at 4.9e-324, where the product rounds back to it), unless
//     their only exits test v < tol (or v <= tol, for a factor between
//     1/2 and 1) with tol a parameter or a field of one that the function
//     neither assigns nor compares with a constant: a positive v never
//     falls below a caller's tol = 0 (nor, stopped at a subnormal, reaches
//     it), and the loop is reported (category nocap, the golden-section width tracked as h *=
//     0.618 with no cap); or unless the factor is a constant that moves the value away from
//     passing (a tolerance halved each pass or at each level of a
//     recursion, tested as |s2-s| <= 15*tol: as tol goes to 0 the test
//     gets harder, not easier, or unless a value grown by constant
//     factors above 1 can start at 0, which no scaling moves: a search
//     outward by d *= 2 from d := |math.Nextafter(x, 2*x) - x|, which is 0
//     at x = 0, never ends, and is reported (category stall), unless an
//     exit compares the value itself with a constant (w <= tiny && w !=
//     0), which decides at 0 by itself; a value shrunk from 0 is where
//     shrinking leads anyway);
//     series terms scaled by a changing factor and series that test the
//     term, when a NaN ends the loop (|t| > tol as the loop condition);
//   - loops that only rearrange their values (xa, xb, xc = xb, xc, xa)
//     and test values worked out afresh from them: they visit a fixed,
//     finite set of states, none of which rounding can make stall or
//     drift, so whether one passes is settled within the first passes;
//   - tests on values drawn anew each pass (rejection sampling, polling)
//     when no call acts by side effect: the loop ends with probability 1,
//     not by convergence; tests read at a new integer each pass (an
//     integer counter, or a value computed from one): no float stalls;
//     loops that carry only integers or pointers (walking data);
//   - sweeps by fractions: a loop that sets t afresh each pass, cuts the
//     state t is computed from at t, and ends when t reaches a constant
//     bound or is NaN (NaN < 1 is false), where t cannot be 0 (its
//     factors are positive constants, roots and absolute values of values
//     that cannot round to 0, and parameters floored at a positive value by
//     math.Max(tol, c) in the function or by every caller): each pass
//     consumes the fraction t of what is left, so the loop advances to its
//     bound and is no convergence loop that could stall or oscillate;
//   - scans by a constant step from a constant start, by a step the caller
//     gives (a parameter, a field, data), by a span divided by a count
//     ((hi-lo)/n, zero only when the span is, and then x < hi fails at
//     once; a closed scan x <= hi enters a span of width 0 and never moves,
//     and is reported, also where the step comes back from a function of
//     the package with one return statement), or by a step that cannot
//     round to zero (1/slope; a math function of constant arguments is
//     evaluated: spacing·sin(60°) is never 0); and a
//     bracket end pushed away from the other end by the bracket's own
//     width (lo -= hi - lo, hi += hi - lo, the other end fixed in the
//     loop): the width doubles each pass, so a step that is not 0 on entry
//     never falls below the spacing, and the end overflows to an infinity
//     within about 2100 passes;
//   - exits on errors count as no bound, but loops with another exit on
//     data (a length, a state flag) are left alone;
//   - range reductions in unexported functions or internal packages (their
//     callers are the module's own, and a value within a few periods takes a pass or two)
//     or against another variable (how far apart they start is the
//     caller's);
//   - recursions capped like loops: a base case or a panic guarded by an
//     integer comparison of a depth or count that the recursive calls
//     change (if n > 50 { return x } with n+1 passed on), or a base case on
//     anything else the calls change (the length of the data); a test on
//     values every call passes on as they are holds at every level or at
//     none, and bounds nothing; a
//     recursion into other receivers (a tree's children), whose depth is the
//     data's;
//   - loops and recursions in test files, which run on the fixed inputs
//     they were written for: one that never ended would hang the test; and
//     constants written in test files, since each case runs on its one
//     problem;
//   - a for block written for its breaks (for { ...; break }): its body
//     ends in an unguarded break, return or panic and no continue goes
//     back to the top, so every path leaves on the first pass;
//   - loops it cannot classify, except for the missing cap.
//
// Fixes (all need review): in a minimization, the test becomes
// |b-a| <= 2*(0x1p-26*|x| + tol) (sqrt(eps) = 2^-26 exactly for float64), or
// a too-tight constant becomes 0x1p-26; in a root finding, an unscaled
// tolerance gains 4 ulps of |x|: |b-a| <= tol + 4*0x1p-52*|x|. A missing
// iteration cap, a range reduction and a stalling step get guidance, not
// a fix.
package stoptol
