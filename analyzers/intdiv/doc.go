// Package intdiv defines an Analyzer that reports integer divisions whose
// truncated quotient is used as a floating-point value.
//
// # Analyzer intdiv
//
// intdiv: integer division whose truncated quotient is used as a float
//
// Go divides integers by truncating toward zero, and it evaluates a
// constant expression of untyped integers as an integer before converting
// it: 7/2 is 3, 1/2 is 0, and 1/2*x is 0 for every float x. intdiv reports
// two shapes where the fraction is almost certainly wanted:
//
//   - a conversion T(a/b) of an integer quotient to a float type T, when the
//     divisor is not a constant (a count such as n or len(xs), which does
//     not divide the dividend for typical values: mean := float64(sum/n)),
//     or when the dividend is a sum or count accumulated in a loop;
//   - a division of untyped integer constants (literals, named constants,
//     or expressions of them, as in the chain 3/4/12) that is not exact and
//     is used as a float: 1/2*x, math.Pow(x, 1/3), var w float64 = 2/3,
//     width/height for two named constants, or const half = 1/2 declared
//     untyped and then used as a float (half*x), directly or through
//     another constant declared from it.
//
// It leaves alone integer arithmetic that stays integer (index arithmetic,
// a quotient stored in an int and converted later: k := n/2 is a
// deliberate floor); conversions that divide by a constant (float64(n/2),
// float64(n*(n-1)/2), the number of pairs, is a count by design); a
// dividend that is a multiple of the divisor in the source (float64(k*n/n));
// time.Duration quotients, which count whole units and lose under one
// nanosecond; conversions with a comment on the same or the previous line
// saying the floor is meant ("floor", "truncate", "integer division",
// "whole", "round down"); the counter of an enclosing loop divided by
// anything (float64(i/width) in a loop over width·height cells numbers the
// rows, float32(k/2) the pairs: whole groups by design); the argument of
// math.Floor or math.Trunc
// (math.Floor(float64(a/b)) says the whole number is meant: the floor of a
// whole number is itself); float64(a)/float64(b); untyped divisions that
// are exact (20*20/2); a named constant divided by a number (size/2*h),
// which, like float64(n/2), halves a count to a whole index (the centre of
// a grid); and constants declared from a truncated quotient that are never
// used as a float (const mid = 9/2 as an index).
//
// Fixes. A constant quotient becomes its exact decimal value when it has a
// short one (1/2 becomes 0.5, 3/4 becomes 0.75), else a float numerator
// (1/3 becomes 1.0/3, w/h becomes w*1.0/h); none is offered when the
// declared constant is also used as an integer, where a float would not
// compile. T(a/b) becomes T(a)/T(b). A fix is applied unattended (go fix,
// go vet -fix) only when it keeps what the program computes or cures a
// certain bug; both intdiv fixes change the value (4/3 goes from 1 to
// 1.3333333333333333, and a test that pins the aspect ratio 4/3 == 1 turns
// red), and whether the floor was meant is the author's call, so both need
// review and only standalone roundoff -fix applies them.
package intdiv
