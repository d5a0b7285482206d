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
//   - a division of two untyped integer literals that is not exact and is
//     used as a float: 1/2*x, math.Pow(x, 1/3), var w float64 = 2/3.
//
// It leaves alone integer arithmetic that stays integer (index arithmetic,
// a quotient stored in an int and converted later: k := n/2 is a
// deliberate floor); conversions that divide by a constant (float64(n/2),
// float64(n*(n-1)/2), the number of pairs, is a count by design); a
// dividend that is a multiple of the divisor in the source (float64(k*n/n));
// time.Duration quotients, which count whole units and lose under one
// nanosecond; conversions with a comment on the same or the previous line
// saying the floor is meant ("floor", "truncate", "integer division",
// "whole", "round down"); float64(a)/float64(b); and untyped divisions that
// are exact (20*20/2) or involve named constants, whose integer meaning
// may be the point (size/2*h for the centre of a grid).
//
// Fixes. A literal quotient becomes its exact decimal value when it has a
// short one (1/2 becomes 0.5, 3/4 becomes 0.75), else a float numerator
// (1/3 becomes 1.0/3); the truncated value is never what two literals
// mean, so this fix is safe to apply unattended. T(a/b) becomes
// T(a)/T(b); whether the floor was meant is the author's call, so that fix
// needs review and only standalone roundoff -fix applies it.
package intdiv
