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
//     function f of this package, accumulated sums), or one is computed and
//     the other is loaded from a struct field (or a slice or array held in
//     one) into which the package stores computed floats, such as a table
//     of path lengths; a field of a struct that a package function builds
//     from computed values and returns (an interpolated point's y) is
//     computed;
//   - a computed operand is compared with a decimal constant the type cannot
//     represent (0.1, 0.3); the message shows the value actually stored;
//   - an operand is math.NaN(), also through a function of the package
//     that only returns it (func NaN() float32 { return
//     float32(math.NaN()) }): such a comparison is always false (==) or
//     always true (!=);
//   - arrays or structs holding computed floats are compared with ==, which
//     compares every element exactly;
//   - a loop condition tests a float loop variable, stepped by arithmetic on
//     itself, with == or != (for x := 0.0; x != 1; x += 0.1 never stops); when
//     start, step and bound are constants the loop is simulated in the
//     variable's own format and reported only if the bound is missed;
//   - an ordered loop condition (x <= b, x < b) on a float variable with a
//     constant start and bound and a step of one or more constant values
//     (also the constant results of the package's functions, or of each
//     of its methods behind an interface the step is read through),
//     that makes fewer passes in the variable's format than exact
//     arithmetic on the decimals as written gives (from 0 by 0.05, x <= 1
//     passes 20 times, not 21: the 21st value is 1.0000000000000002);
//   - a zero test of a difference of computed values (the cross product
//     x1*y2 - x2*y1 == 0, a line residual a*x + b*y + c whose c is such a
//     difference, a sum of such differences accumulated over a loop, as a
//     signed area summed edge by edge, or of terms the loop itself knows
//     to take either sign (it compares them with 0 or takes their absolute
//     value: the weights of a stencil normalised by their sum, or by
//     their positive part when they cancel, where eight of -0.1 around a
//     centre of 0.8 sum to 2^-55 ≈ 2.8e-17), also through a package function,
//     and a cross product of plane vectors computed by another package,
//     r.Cross(s), known by its shape from package vecshape):
//     the difference is 0
//     exactly when its terms round to the same float (Sterbenz), so inputs
//     that make it 0 in exact arithmetic usually leave a residue of a few
//     ulps; a zero test of a spread of data about their computed mean (a
//     sum of squared deviations (x-m)*(x-m) over a loop, scaled, or its
//     square root, also returned by a function of the package) is
//     reported even where it guards a division: for constant data the
//     mean rounds away from the value unless every partial sum is exact
//     (three readings of 0.1 have the mean 0.10000000000000002), so the
//     spread is a few ulps of the data and the guard misses the case it
//     is for, and the deviations divided by it are of order 1, not 0
//     (TestConstantSpread); the same when a three-way split by sign (v > 0, v < 0, then
//     whatever follows, as an orientation test leaves collinear to its
//     default) leaves the exact zero to the rest, unless the rest only
//     chooses among the signed branches' own outcomes by further keys (a
//     lexicographic choice, whose ties any branch may take);
//   - a tie test chained by else to an ordered test of the same pair (if
//     c < best {...} else if c == best {...}, or best-c == 0) where one is
//     a sum of two variable terms, the cost of a path: sums equal in exact
//     arithmetic but added in another order differ by an ulp, so an
//     equally good alternative is taken as better or lost;
//   - a product or quotient tested against its own whole part
//     (pos == math.Floor(pos), pos == float64(int(pos)) with pos := p*n): a
//     value whole in exact arithmetic can come out an ulp below
//     (0.29*100 is 28.999999999999996), and the test misses it; so does
//     its fractional part tested against a constant (pos-math.Floor(pos)
//     == 0.5: 0.29*50 is 14.499999999999998), and the remainder
//     math.Mod(x, y) of a product, a quotient or a sum carried around a
//     loop tested against a constant, 0 included (ten steps of 0.1 leave
//     0.4999999999999999 by 0.5); the remainder of a value as given, or of
//     a sum of such values, is exact and left alone;
//   - a computed value (or a parameter some call in the package fills with
//     one, as degrees of freedom from a ratio of sums) compared with a
//     nonzero whole constant (df == 1) in a function that also truncates
//     it (int(df), math.Floor): the function treats it as a count, and a
//     value an ulp above 1 (1+2.22e-16) is 1 to the truncation and not to
//     the equality, so the special case and the counting branches part;
//     not where every truncation runs inside the if the equality (alone
//     or with others of x joined by ||) selects: if x == -1 || x == 1 {
//     return Inf(int(x)) } truncates only the constants themselves;
//   - in tests, testify's assert or require Equal (and its variants) compares
//     floats under the same rules;
//   - in tests, an exact comparison of a result the code under test
//     computes with a value only exact arithmetic makes equal to it: exact
//     zero where the function returns a difference one of whose terms
//     passes through a math function that is not correctly rounded (lat =
//     2*atan(exp(y))*(180/π) - 90 at y = 0: Atan and Exp may differ in the
//     last bit between platforms and Go versions, so one ulp of 90,
//     1.42e-14, can remain), or a value the test computes with rounding by
//     another formula (math.Sqrt(2)*c against the function's
//     math.Sqrt(2*c*c): equal at c = 1, an ulp apart at c = 3); the same
//     formula on both sides gives the same bits and is left alone;
//   - in tests, an exact comparison (==, !=, testify's Equal,
//     reflect.DeepEqual, cmp.Equal, gocheck's c.Assert(got, check.Equals,
//     want) and c.Check, also with a check.Commentf after want, on
//     floats or on structs and arrays of
//     them) of a result with a printed value: a constant whose shortest
//     decimal form has 16 or more significant digits (8 for float32) and
//     that its type stores inexactly, written in the comparison, named, or
//     read from a table of cases (tc.want, also where the table names a
//     variable given the value: want: far with far := 43.88496325622251). Such a test pins the last bits
//     of a computation, which change with the order of operations and with
//     fused multiply-add, so it fails on other platforms;
//   - in tests, two floats compared to a number of digits by truncating
//     both to integers, int(a*d) == int(b*d): a result one rounding below
//     a decimal grid point (1.4999999999999998 for 1.5) truncates a whole
//     step lower (math.Round, or a tolerance, states the digits);
//   - an exponent taken by truncating a ratio of logarithms (int,
//     math.Floor, Trunc or Ceil of math.Log(n)/math.Log(b), of
//     math.Log(n)/math.Ln2 or math.Log(n)*math.Log2E, perhaps plus a
//     constant): at exact powers of the base the rounded quotient lands
//     within an ulp of the exponent, on either side (math.Log(1000)/
//     math.Log(10) is 2.9999999999999996). With a constant base the
//     quotient is evaluated as written at every power of the base the
//     argument's type holds, and only a truncation some power sends the
//     wrong way is reported; a base known only at run time is reported;
//     an argument drawn at random (math/rand, a call with no arguments
//     returning a float: the geometric variate Floor(Log(u)/Log(1-p)))
//     or computed by the package with rounding (a series summed, then
//     split into mantissa and exponent) is left alone, since it is an
//     exact power only by accident; one read as given (a parameter, a
//     field, a count converted to float) may be any power;
//   - the count of a range's steps taken by truncating a quotient of a
//     span by a step, int((end-start)/step), plus a whole constant (the
//     points of the range) or held in a variable that sizes a slice or
//     bounds a loop, and int(end/step) of a single value held in a variable
//     or field where it sizes or bounds (plus 1, it may be the next grid
//     line past a position): where the range holds a whole number of steps, the
//     quotient lands within an ulp of it, on either side ((0.3-0)/0.1 is
//     2.9999999999999996: 3 points, not 4). A bin index, int((x-lo)/w)
//     or int(x/w) used as an index, and a shifted position,
//     int((lon+180)/6)+1, are
//     left alone: a sample on an edge goes to one side by a rounding,
//     which no binning rule avoids;
//   - in tests, an equality assertion of the suite's own helpers (a
//     function whose name says Equal without a tolerance, or one given
//     such a function, as So(x, ShouldEqual, 2.9), unless it takes a third
//     float operand or its body, where the package declares it, holds a
//     tolerance test: then it compares within that tolerance, whatever
//     its name says (PracticallyEqual(a, b) returning |a-b| < 1e-9);
//     or an Equal method
//     of a type holding floats by value, as c.Equal(Point{1.5, 0.45}), with
//     the decimal among a literal's elements) of a result that a
//     function of this package computes in several rounded steps (also
//     through variables captured by nested closures) against
//     a shorter decimal the type stores inexactly (0.2127): the decimal is
//     the exact answer, and the result lands on the double nearest to it
//     only while every rounding happens to; one correctly rounded operation
//     of its parameters does land there (IEEE 754-2019 §4.3) and is left
//     alone.
//
// It leaves alone the idioms that compare exactly on purpose: the NaN test
// x != x; an equality joined to an exact zero test of one of its operands
// (x == y && y == 0 holds exactly when both are 0, as b != a || a != 0
// before math.Atan2(b, a) asks); the tie test of an ordering (x < y ||
// x == y && k, a three-way comparator's branch that returns 0 on x == y,
// or if x == y { x, y = p, q } swapping in secondary keys before the
// statement after it orders x and y): a tie missed by an ulp orders the two by the primary key, whose
// values differ by that ulp, a consistent order that departs from exact
// arithmetic only between values that agree to rounding; a computed
// value against a field into which the package stores the same
// expression (rhs = math.Min(rhs, w + n.g), later rhs == w + n.g) built by
// + - / without products, which could fuse at one site and not the other:
// the same operations on the same operands give the same bits, so the
// test asks whether the field was set from these operands; a single
// sign test of a difference (d > 0 alone draws a boundary, not a class
// for 0, and a residue moves only points at rounding distance from it); a tie of a counter stepped by a constant (k+1 is exact
// for whole numbers below 2^53); comparisons with exact zero, with infinities and with
// ±math.MaxFloat64; parameters, fields, loads and copies compared with
// anything (sentinels such as alpha == 1, sorting and deduplication, knot
// hits in interpolation); computed values compared with a constant the type
// stores exactly (scale != 1 shortcuts); results of math functions that do
// not round (Abs, Floor, Max...) of inputs (Abs and Copysign of a computed
// value carry its error) and of functions from other packages; an
// operand derived from the other on purpose (the bisection stop m == a where
// m := (a+b)/2, also with the ends in fields read twice, m == b.lo, the
// overflow test x*c == x, x == math.Floor(x) for an x
// that is not a product or quotient); a value
// against a merge that has it as an input (did the branch change it?),
// also a field read twice in a function that stores into no such field
// (a running maximum started at c.floor, then best == c.floor: did any
// value exceed the start?);
// copies of the same value shuffled through branches (the points a and c of
// Brent's zero finder); a variable against its own earlier value; a pair
// whose difference the same function also tests against a tolerance (the
// exact test is a shortcut); results of the same function on arguments
// passed by value (the same roundings applied to equal inputs give equal
// results, so hue(a) == hue(b) in a comparator compares the inputs; a
// function of slices such as a sum stays a hazard); a field compared with
// the result of a function whose results the package stores into it (the
// same function gives the same bits for the same inputs: the test asks
// whether a default is still in use); loop variables clamped
// to the bound; a value
// against its own value from the previous pass (a series summed until a
// term no longer changes the sum stops exactly when the term is absorbed,
// with every digit the format holds); infinities held in variables, as
// math.Inf itself; a sum tested against a constant it was made by adding
// (a = a + 2π; a == 2π asks whether a was absorbed); absorption guards
// (x+1 == x, and x != x-1 in a loop condition, which ask whether 1 is below
// half the spacing at x); zero tests of differences of inputs (0 exactly
// when they are equal), of sums of squares (0 only for the zero vector), of
// remainder reductions x - k*y with k from Floor, Ceil, Trunc or Round
// (exact where exact sign algorithms use them), of recurrence terms
// that feed the next pass (a residue there only scales the next term),
// and of divisors the function then divides by when the zero branch
// computes no answer of its own (it assigns or returns constants, nil,
// zero values, or an error, or panics: zero is the one divisor that gives Inf or
// NaN; a residue in its place gives a large finite quotient, which the
// code goes on to judge, as a ratio far outside [0, 1] for near-parallel
// segments; a zero branch that handles a case of its own, such as
// overlapping parallel segments, stays a hazard, since a residue skips it;
// an assertion of the package given the nonzero test, require(det != 0),
// which panics on false or, in a release build, ignores it, is such a
// guard);
// a loop variable tested against an infinity that grows geometrically
// toward it (multiplied by a constant above 1, or stepped by a step so
// multiplied, x += d; d *= 2): it overflows onto the infinity exactly
// within about 2100 passes, and no float lies beyond an infinity to step
// over (a constant step is absorbed at 2^53 times its size and stays a
// hazard); ordered float loops whose pass count agrees with exact arithmetic or
// exceeds it (the extra value lies within rounding error below the bound,
// inside the admitted range); and,
// in _test.go files, results and fields produced by the code under test,
// which a test compares with a second route through that code on purpose,
// tests whose function says it checks exactness (one correctly rounded
// operation on each side gives the same float, IEEE 754-2019 §4.3, and a
// tolerance would defeat the check), printed values parsed back from a
// string holding the same digits or decoded from text by the standard
// library (exact by correct rounding, IEEE 754-2019 §5.12), results of
// package functions that return their input unrounded, results computed
// the same way on every platform (by + - * / with no product added to
// another value, which Go may fuse into one rounding, unless an explicit
// conversion float64(x*y) rounds the product first, and by correctly
// rounded or exact math functions such as Sqrt, Abs and Floor, through
// functions built the same way, of this package or, known by a fact that
// crosses packages, of another; Sin, Exp, Pow and the like may
// differ in the last bits between platforms), results computed the same
// way on every platform from the inputs the test gives them (constants,
// composite literals of constants, the fields of a table of cases that
// lead to them, also as a subtest's closure captures them): a product whose operands make it exact there cannot
// change under fusion, since fusedMultiplyAdd rounds x*y + z once (IEEE
// 754-2019 §5.4.1) and for an exact x*y that is the rounding of the
// addition; products and sums of whole multiples of 2^e stay exact while
// their significands fit the format, and math.Pow of such a value to a
// whole constant power is exact when its result is representable;
// printed values that also appear among the test's inputs
// (passed through without arithmetic, as the vertices a hull keeps); and
// results whose computation shows no cause before it leaves sight. A pin
// claims the bits can change between platforms, so it is reported only
// where the analyzer sees why: a product added to another value (not a
// scaling by a constant power of two, which is exact), or a math function
// that is not correctly rounded (not math.Pow to a whole constant power,
// which Go computes in pure Go on every architecture by products of
// squarings that no sum takes in), in the test, in the functions of its
// package it calls, or, by a fact, in those of another package. Every
// other step (+ - * /, square root, a conversion between float formats)
// is correctly rounded (IEEE 754-2019 §4.3, §5.4.2) and gives the same
// bits from the same operands. An interface method is in sight where the
// value it is called on has a concrete type the test gives (li :=
// linear.New(); interpolate.WithSingle(li, x), whose helper calls
// li.Interpolate, directly or through another helper, also across
// packages), or where the value is made in sight (a constructor of the
// package returning &T{...} behind an interface, directly or through
// another: each concrete type it can return is searched). A getter that
// reads a field through a pointer (s.Level() returning s.level, or its
// bits through atomic.LoadUint64 and math.Float64frombits) returns what
// the methods called before it stored there, so the values the package
// stores into that field are searched: a running update l += w*(x-l) in
// Feed is a cause of the pinned Level(). A map or slice the test fills in
// a closure it hands to a function (g.Rank(0.85, tol, func(id int, r
// float64) { got[id] = r })) holds what that function passes the
// closure, searched where the function calls it, also through wrappers
// and across packages. Where the computation leaves
// sight (an interface method on a value of unknown type, a function value,
// a body not available, floats behind an interface or a map handed to a
// call) before any cause shows, nothing is known, and nothing is claimed.
// A string that quotes the pinned digits marks a round trip only where it
// can be parsed into the value: the message of a test's Errorf, or of
// fmt's and log's printing, is printed from it.
//
// Fixes. A math.NaN() comparison becomes math.IsNaN(x). A float loop
// condition x != b with a constant step s in the loop's post statement
// becomes x < b-0.5*s (or > for a falling loop): a loop that lands on the
// bound runs as before, and one that would miss it stops after the
// iterations exact arithmetic gives. Both are safe to apply unattended.
// Comparisons of computed values become a relative-tolerance test
// math.Abs(a-b) <= rtol*math.Max(math.Abs(a), math.Abs(b)) (rtol*c for a
// positive constant c) with rtol 1e-9 for float64 and 1e-5 for float32, and
// testify's Equal becomes InEpsilon when the expected value is a nonzero
// constant; the tolerance is a judgement, so go fix and go vet -fix do not
// apply these, only standalone roundoff -fix does. No tolerance fix is
// offered where the statement's strings or nearby comments say the
// comparison is exact ("exactly", "bit-for-bit"): the fix would leave them
// untrue. Residues, ordered loops and pinned structs get no fix.
package exacteq
