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
//     gap between floats just under its magnitude decides: floats near m
//     are all multiples of that gap, so two different ones differ by at
//     least it (the difference is exact, Goldberg 1991 Thm 11), and a
//     smaller tolerance is equality (1e-16 at 0.75, where the gap is
//     1.11e-16);
//   - the smallest positive float used as a tolerance, and x < it or
//     x > it (no float lies between 0 and it, so for x ≥ 0 the test is
//     x == 0, or x > 0; the smallest normal value, 0x1p-1022, catches
//     subnormal values); the same for any positive threshold below 1024
//     times that value (10*math.SmallestNonzeroFloat64 = 4.9e-323: only 0
//     and nine subnormal values lie below it; a larger subnormal constant
//     such as 1/math.MaxFloat64 is an underflow guard) or positive as
//     written but 0 there (math.SmallestNonzeroFloat64
//     squared, 2.4e-647, which Go rounds to 0), on a value the function
//     computes (a parameter or a field of one, read as given, carries no
//     residue of this code, and a test of its sign is exact on purpose);
//   - x > math.MaxFloat64 (or >=, and the float32 analogue): no finite
//     value exceeds the largest one, so the test is x == +Inf, and an
//     overflow of a negative value, -Inf, passes unseen (math.IsInf(x, 0)
//     tests both);
//   - a tiny constant that floors a variable which then divides (the
//     modified Lentz method's if d == 0 { d = tiny }; d = 1/d): when
//     1/constant overflows, as 1/4.9e-324 does (the largest float64 is
//     1.8e308), the next quotient is +Inf;
//   - a running maximum started at the smallest positive float: it is not
//     the most negative value, so the maximum of values all ≤ 0 comes out
//     as 4.9e-324;
//   - tolerance tests on an iterate instead of on its change
//     (math.Abs(x) < 1e-16 inside a loop that updates x from itself), which
//     never pass for a root away from zero; not a floor that assigns the
//     iterate in its branch (the modified Lentz method's if |d| < 1e-30
//     { d = 1e-30 }), which keeps it off zero before a division and ends
//     nothing;
//   - absorbed addends: an addend of a constant sum without which the sum
//     rounds to the same value (1 - math.SmallestNonzeroFloat64 is exactly
//     1; math.Nextafter was meant). Go evaluates a constant expression
//     exactly and rounds it once (Go spec, "Constant expressions"), so the
//     sum is judged whole, never step by step, and a sum inside a larger
//     constant expression by that expression: 1 in (1e16 + 1) / 2e16 has
//     no effect because the quotient, 0.50000000000000005 exactly, rounds
//     to 0.5 as 1e16 / 2e16 does, not because 1e16 + 1 rounds (it never
//     does on its own). In a sum whose run-time
//     terms all carry rounding error (calls, products, quotients), a
//     constant below half the spacing at another constant term (a float64
//     correction of 6.1e-17 kept beside π/2 in float32 code) has no effect
//     either: absorbed while the sum stays near that term, and below the
//     other terms' rounding errors when they cancel it. A plain variable
//     can cancel the term exactly (Sterbenz), so 1 - p + 1e-16 is left
//     alone. An element of a local slice of constants at an index the
//     source fixes holds a known value at run time (see below), so
//     hours[last] - 1e-17 with hours[last] = 8 is 8 after its one rounding;
//   - math.Nextafter(x, y) and math.Nextafter32 whose direction y is x
//     itself (equal constants, or the same variable): the call returns x
//     unchanged (IEEE 754-2019 §5.3.1 steps toward a direction), so
//     Nextafter(1, 1) - 1 is 0, not eps, and a tolerance made that way
//     turns its test into exact equality; and a direction x+c or x-c with
//     c a constant, which rounds to x once |x| reaches 2^53·|c| (2^24·|c|
//     in float32): Nextafter(t, t+1) - t is 0 from t = 9.0e15 on, and the
//     direction math.Inf(±1) gives the same neighbour wherever t+1 differs
//     from t (fixed unattended);
//   - constant tolerance arguments to well-known APIs (gonum's
//     floats/scalar EqualWithinAbs, EqualWithinRel, EqualWithinAbsOrRel,
//     floats.EqualApprox; testify's InDelta, InDeltaSlice, InEpsilon,
//     InEpsilonSlice), and to functions and struct fields of any package
//     that use a parameter or field as such a tolerance, directly or by
//     passing it on to one (wrappers of wrappers; carried across packages
//     as facts), also through a local copy (tol := o.Tol, with or
//     without a default): the call argument, composite-literal field or
//     assignment (such as the defaulting idiom if s.Tol == 0 { s.Tol = c })
//     is reported, at the size of the compared values where the call's
//     arguments for them have one the source fixes (expectNear(t, got,
//     1.19e7, 1e-9): see below). A tolerance one operand of || hands on
//     beside others that test otherwise (EqualWithinAbs(a, b, atol) ||
//     EqualWithinRel(a, b, rtol)) is not learnt, since the other test may
//     pass where it cannot; when every operand hands on the same one
//     (near(p, q, tol) || near(q, r, tol)), each is the same test of other
//     values, and it is. Where the parameter or field is the tolerance of a
//     computed quantity whose size grows with the data, |a-b| < tol or a
//     threshold |x| < tol (or x < tol) on an x that cancels (a determinant
//     (x0-x1)·(x1-x2)·(x2-x0) < o.Pivot in a parabola fit), a constant
//     given to it is judged at the data size as the same constant written
//     in the test would be (below), in a file that is not a test; the
//     highest degree among its tests decides;
//   - a tolerance positive as written that rounds to 0 in the type, as a
//     product or quotient of constants or of variables holding them does
//     (1e-6*math.SmallestNonzeroFloat64 is 4.9e-330, below half the
//     smallest positive float64): |a-b| < 0 holds for no pair of values,
//     equal ones included, and |a-b| <= 0 is exact equality (category
//     empty); a product of two constants is a tolerance of its own,
//     never a relative one with a constant scale;
//   - a tolerance of 0 given to such a parameter or field whose test is
//     strict, |a-b| < tol (or |a-b| >= tol for "not within"), where the
//     function does not take 0 apart (if tol == 0 { return a == b }):
//     |a-b| < 0 is always false, so the check meant as exact equality
//     holds for no pair of values, equal ones included (category empty).
//
// A difference bounded from both sides, -tol < a-b && a-b < tol, is read
// as |a-b| < tol (package tolerance), with no fix: tol is written twice.
// A tolerance test is read through any absolute value (math.Abs, the Abs
// of a float32 math library, a package's own helper; see package absval),
// so float32 code through its own math library is judged against float32's
// resolution (eps 2^-23 ≈ 1.19e-7), as are float32 operands in general and
// a type parameter whose type set admits float32. A finding at the place
// that gives a tolerance parameter or field its value names the test that
// uses it (file:line, and the related position in this package).
//
// An absolute tolerance is judged at the size of the compared values when
// the source fixes it exactly:
//
//   - a constant operand;
//   - an element of a local slice or array of constants that its function
//     only reads (zs[i] of zs := []float64{360, 720, 6.2e23}): the largest,
//     or the element itself at an index the source fixes (zs[m] after m :=
//     len(zs) - 1); handing the slice to a parameter that only reads it
//     (package readonly, a fact across packages) keeps it so;
//   - a value read from a table of constants (tc.want) whose type a test
//     file or test support code (a file of the package that imports
//     testing) declares: the largest of them that reach the test (not a
//     sentinel row an enclosing condition sends elsewhere: the else branch
//     of if tc.want == fail);
//   - inside a loop over a literal table of cases, a value worked out from
//     each case's constants (want := tc.mu + tc.k*(tc.x[0]-tc.x[1])),
//     evaluated exactly for every case: the largest (the program's value
//     differs from it by rounding only);
//   - a local variable whose last assignment before the test, in
//     straight-line code, gives it a constant (want = -1000.5 before the
//     next check): it holds exactly that constant there. A tolerance
//     variable set again (tol = 1e-20) is read the same way.
//
// A call in the expression, a loop that changes the case or assigns the
// variable, a branch, a closure that assigns it, or its address taken
// (also by a pointer method) leave the value unknown, and nothing is
// claimed. A tolerance written as a constant k times a value given beside
// it (the expected value of the same case, or another argument of the same
// call: 1e-14*want) is relative to that value: k is judged against u, not
// the product against eps, since 1e-14 of an area of 5e-21 asks for 14
// digits of it however small the product is.
//
// An absolute tolerance on values whose size the code does not fix is
// judged at the size of the data. Library code receives its callers'
// data, of any size: a quantity of degree d in the data (a parameter, a
// field or element of one: 1; a product adds degrees, a quotient
// subtracts them, a square root halves, a sum keeps the larger; read
// through the package's own functions, so p.Cross(q) of two differences
// is 2; an entry of a fixed-size array that the package multiplies by
// data and adds to another entry of the same type, m[0][0]*p.X + m[0][2],
// is 0 by dimensional consistency, a pure factor such as the linear part
// of an affine map; a variable assigned only by statements of the block
// that declares it has the value of the last one before its use, so
// heading = heading.Unit() makes heading a direction from there on, and
// d := a - b; d *= d in a loop body is a fresh square, degree 2, on each
// pass; a slice made with make holds the values stored into its elements,
// and its elements cancel where one of those values does; a direction, a
// vector that a function of the package divides by its own length, or a
// vector field every store of which in the package is one, is 0; see
// package degree) carries a rounding error of about eps·s^d at
// data size s, so a tolerance t stops passing anything but equality once
// the data reach (t/eps)^(1/d): 1e-10 on a cross product of coordinates
// fails at 670, 1e-14 on a one-pass variance at 6.7, 2.2e-14 on a
// difference of two data values at 99. epsfloor reports it when that size
// lies below the size of the data: the size roundoff.yaml declares for the
// package (datasize), at every degree; else 1e3, at degree 2 and above
// only. The SI habit of choosing the prefix that keeps a value below 1000
// (BIPM SI Brochure, 9th ed., §3, from memory) makes 1e3 a size ordinary
// data reach in whatever unit a caller picks; but a quantity of degree 1
// may be a pure number (an angle, a fraction, a colour component), which
// its reading cannot tell from a length, and whose tolerance states the
// size its author expects. A tolerance that is a whole multiple k of eps
// (worked out from it, 100*eps with eps = 1.0/(1<<52): a decimal literal
// such as 2.2e-14 never is one, its binary value carries low-order bits)
// states a relative precision instead, k ulps at magnitude 1; it is judged
// at degree 1 too, and even on a difference of two values read as given,
// whose exactness does not help: once the data exceed k it is an exact
// equality test (r := hi - lo; r < 100*eps). A running sum over a loop of
// the data's length (s += x in a range over a slice or up to a variable
// count, also into a field of a local struct, w.in += x, and read through
// the package's functions that return one, and through products and
// quotients with other values, whose degrees scale its error as they scale
// it) rounds at about √n·eps times the size of its terms for n terms (Higham
// 2002, §2.8, from memory), so its count is data too, at the same size:
// 1e-9 on the difference of two areas each summed over a parcel's corners
// (degree 2) fails from 460 where one product would last to 2100, and a
// sum of fractions (degree 0) is judged by its count alone, 1e-15 failing
// from 20 terms; a loop of fixed count (i < 3, a range over an array)
// adds nothing. A product of two data values squares whatever
// size they have, so one tolerance used for lengths and for their
// products (1e-10 on a point's offset and on a cross product) breaks at
// sizes as modest as 670. It judges |a-b| < t, |x| < t and a bare
// x < t (or its negation x > t) where x can cancel (a difference or sum of non-constant values, a
// remainder, a product with such a factor; a product that does not cancel,
// w*h, keeps a relative error, eps·|w*h|, and is left alone, as is a sum
// of squares, x*x + y*y + z*z, whose terms cannot cancel; so is a
// difference of two values read as the caller gave them, exact when they
// are close by Sterbenz's lemma, and an integrality test x - math.Round(x),
// whose x is a count or a pure number), and the calls
// of a predicate that compares two of its parameters (Equal(a, b float64)
// bool), where the arguments give the degree: Equal(p.Cross(q), 0), or,
// when an argument has a size the source fixes (above), that size: a
// helper's 1e-12 at a call with tc.want up to 1.2e7, where floats are
// 1.86e-9 apart, is exact equality, reported at the call. The
// fix, where the test is |a-b| < t, adds 4 ulps of max(|a|,|b|) to t (for
// b*b - 4*a*c that is b² and 4ac, the size of its rounding). A test file
// supplies its own data, whose size it fixes: there only a size the code
// shows is judged, as above.
//
// A difference multiplied or divided by a constant before the test
// (|(x-c)/c| < tol, |b-a|/2 < tol, |k·(a-b)| < tol) holds when
// |a-b| < tol/k, so tol/k is what the float spacing is held to: 1e-15 on
// (x-2.4e6)/2.4e6 is 2.4e-9 on x-2.4e6, about five spacings there.
//
// It leaves alone: zero tolerances of tests that hold at equality (exact
// on purpose, |a-b| <= 0), negative and NaN
// sentinels; tiny floors whose reciprocal is finite (1e-300), and floors
// that never divide; running maxima of values non-negative by construction
// (squares, Abs, Sqrt, Hypot, Exp), which a positive floor keeps positive
// on purpose; a tiny constant added to a run-time value with no constant
// beside it (x + 1e-300 keeps a logarithm finite at x = 0); constant sums
// whose addends together change the rounded result (1 + 1e-16 + 1e-16 is
// 1 + 2^-52); normal constants at or below 2^-511 ≈ 1.5e-154, which
// guard against underflow (safe minimum), never tolerances; single magnitudes compared with tiny
// constants before a division (|d| < 1e-300); thresholds on squared
// quantities, squared distances against tol² (degree 2 on both sides:
// consistent at every size); mixed tests atol + rtol·scale; a predicate
// that compares values read straight from its parameters (its callers'
// data decide); quantities of unknown degree (a call into another
// package, a package variable, a variable declared before a loop and
// multiplied by itself on each pass, of degree 2^k after k passes, which
// no fixed degree bounds) and of degree 0 (a ratio, a sine; a component
// of a direction, or the dot product of two, such as the cosine between a
// ray and a surface normal, also from another package's functions, known
// by their facts (package vecshape): a normalised vector has length 1 up to
// rounding, so these are bounded by 1 whatever the caller's units, and
// their rounding error is about eps, not eps·s^d); tolerances at or above eps
// (absolute) or u (relative); comparisons with a known magnitude where the
// tolerance reaches the gap between floats just under that magnitude; in
// a test file, a tolerance below the resolution of what it compares,
// passed with or applied to the difference of values whose computation
// shows no reason to differ between platforms (package portable: no
// product a platform may fuse into an add, no math function that is not
// correctly rounded, in the values, in the calls that fill a slice before
// it is checked, or in what a helper of the project computes from what it
// is given; where sight is lost first, nothing is claimed): the check is
// then exact equality, which holds everywhere it holds once (exacteq's
// standard for pinned results).
//
// Fixes (all need review, so go fix does not apply them): a relative
// tolerance below u becomes 4 ulps of the type, written exactly as
// 4*0x1p-52 (8.9e-16) for float64 and 4*0x1p-23 (4.8e-7) for float32, so
// values a few roundings apart still compare equal; an absolute tolerance
// below eps on a difference becomes a mixed test that keeps it as the floor
// near zero, math.Abs(a-b) <= tol + 4*0x1p-52*math.Max(math.Abs(a),
// math.Abs(b)); the smallest positive float as the tolerance of a
// difference becomes 4*0x1p-52*math.Max(math.Abs(a), math.Abs(b)) alone
// (the residual k·q² - h of a Newton step rounds at about eps·|h|, so no
// fixed tolerance passes for every h; one relative to the compared values
// does); as a tolerance of a relative test it becomes the type's eps. The
// difference may be held in a variable (r := k*q*q - h; if math.Abs(r) <
// tol) when the variables it reads do not change before the test; no fix
// is offered otherwise, nor where nearby text says the test is exact. A
// subnormal floor that divides becomes 0x1p-970 (2^-1022/2^-52), a
// maximum's seed math.Inf(-1), and an absorbed addend math.Nextafter(k,
// ±Inf) in the direction of its sign.
package epsfloor
