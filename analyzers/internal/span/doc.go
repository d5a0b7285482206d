// Package span bounds the values of float expressions where they are
// evaluated, by interval arithmetic (common practice; Higham 2002 §26.4
// on interval analysis): constants; functions of bounded range (sine,
// cosine, tanh, erf between -1 and 1, atan within ±π/2) and monotone ones
// (sqrt, exp, log, a constant base to a power); sums, differences,
// products, quotients by ranges that exclude 0 (and, by a divisor that
// may be 0, the sign of the quotient), and squares of one value;
// variables never reassigned, through their values; the conditions under
// which the code runs, on such variables (the branches of an if, a case
// of a tagless switch and the failed ones before it, unless a case before
// it falls through, and the if chains
// earlier in a block every branch of which returns, breaks or continues:
// past them none of their conditions held); and, for a parameter of an
// unexported function used only by direct calls and never assigned, the
// join of its arguments at every call, each read where it is passed.
//
// An interval may exclude a neighbourhood of 0 (Away): the else branch of
// if math.Abs(x) < 0.05 knows |x| ≥ 0.05 on both sides of 0. NaN, for
// which every comparison fails, is left aside: it carries no digits to
// lose. A goto may land past a condition, so a branch ending in one does
// not count as leaving.
package span
