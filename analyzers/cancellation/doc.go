// Package cancellation defines an Analyzer that reports expressions which
// lose digits to cancellation, overflow or underflow where the math package
// has an accurate form.
//
// # Analyzer cancellation
//
// cancellation: expressions that lose digits where the math package has an accurate form
//
// Subtracting two nearly equal floats cancels their leading digits and
// leaves the rounding error of their last ones (Goldberg 1991, "catastrophic
// cancellation"); squaring and exponentiating overflow or underflow long
// before the final result would. The math package has forms that avoid
// both, and cancellation reports the plain forms:
//
//   - math.Log(1+x) and math.Log(1-x), and the same with math.Log10 and
//     math.Log2: 1±x rounds to 1 for |x| below 5.55e-17, so the logarithm
//     is 0, and loses about log10(1/|x|) digits for larger small x;
//     math.Log1p(x) keeps them all (divided by math.Ln10 or math.Ln2);
//     also where a variable holds the sum (g := 1 + r; math.Log(g)),
//     with no fix, since r may have changed since (not x * math.Log(g) /
//     (g - 1) from the same g: log(g)/(g-1) varies slowly near 1, and the
//     product gives log(1+x) to a few ulps, Goldberg 1991, Theorem 4);
//     math.Log((1+x)/(1-x)) likewise, where 2*math.Atanh(x) keeps them;
//   - math.Log(a) - math.Log(b) (also Log10, Log2, through variables)
//     consumed to relative accuracy (a divisor, a root, a logarithm, a
//     sign test): each logarithm carries a rounding of its own size,
//     u·|log a|, so where a and b are close the difference, about
//     (a-b)/b, keeps only about log10(|a-b|/(u·|b|·|log a|)) digits;
//     math.Log1p((a-b)/b) keeps them all where a-b is exact (Sterbenz).
//     In a sum, as a log-likelihood ratio, only the absolute error shows;
//   - math.Log(f(a)/f(b)) and math.Log(f(a)*g(b)) with g the reciprocal
//     of f (1/f written out, or the package's sec of cos), for one math
//     function f (also through the package's wrappers) at two arguments
//     that are not constants, consumed to relative accuracy (a divisor,
//     as in the cone constant of a conic projection): as a approaches b
//     the ratio is within a few roundings of 1, so about
//     log10(|f(a)-f(b)|/(u·|f(b)|)) digits remain (7 lost at
//     a - b = 1e-9), and a = b gives log 1 = 0, a 0/0 where the limit
//     exists; math.Log1p((f(a)-f(b))/f(b)) with the difference in closed
//     form (sum-to-product) keeps them;
//   - math.Exp(x)-1 and 1-math.Exp(x), also with the exponential stored
//     in a variable first: the same loss; math.Expm1(x);
//   - math.Pow(a, b)-1 and 1-math.Pow(a, b) with an exponent that is not a
//     constant: a^b is near 1 when b·ln a is small (a short time step, a
//     small probability over n trials); math.Expm1(b*math.Log(a));
//   - u + math.Sqrt(u*u+c) and its mirror images (the quadratic formula's
//     -b + math.Sqrt(b*b-4*a*c), math.Sqrt(r*r+k) - r, and a radicand
//     formed by the package's own dot product with u·u among its terms,
//     dot3(b, a, 0, b, -c, 0)) when the sign of u is not known: for the sign that makes the terms subtract the result
//     is about |c|/(2|u|) with relative error about 2u·u²/|c| (a sign
//     is known for a value never negative: a modulus, root or exponential,
//     also returned by the package's own function, cmplx.Abs(complex(re,
//     im)) behind a helper, and sums, products and quotients of such
//     values through the assignments that reach u; then the terms of u +
//     math.Sqrt(u*u-1) have one sign and nothing cancels);
//     math.Log(x + math.Sqrt(x*x+1)) is -Inf from x ≈ -1.34e8, where
//     math.Asinh(x) is exact to an ulp;
//   - math.Acos(x) of the cosine of an angle between vectors (a dot
//     product over norms, the norms also from the package's own methods,
//     a.Len() returning math.Sqrt(a.Dot(a)), also through a named result
//     set once before a bare return, and the ratio also returned
//     by the package's own function, clamped or not, or by a function of
//     another package whose body returns it, r3.Cos(p, q), learned as a
//     fact by package vecshape), of a great-circle
//     distance (the spherical law of cosines), or of an angle from three
//     sides (the planar law of cosines, (a*a + b*b - c*c) / (2*a*b), where
//     the half-angle form on differences of the sides keeps every digit;
//     the message adds the NaN
//     that an unclamped ratio gives once rounding puts it beyond ±1): near ±1, where parallel vectors and nearby points put
//     it, one rounding in x becomes an angle error of sqrt(2u) ≈ 1.49e-8
//     rad, half the digits; math.Atan2 of the sine and cosine parts;
//   - 1 - c where c is a cosine computed as a ratio over norms
//     (dot/(math.Sqrt(na)*math.Sqrt(nb))), or the cosine of the angle
//     between two vectors as package degree reads it (the dot product of
//     two directions, u.Dot(w) with u and w made by a function that
//     divides a vector by its length, of this package or another; a
//     function returning a dot product over lengths): 0 for angles
//     below 1.49e-8;
//   - 1 + c where c is such a cosine of the angle between two vectors
//     (the factor 1/(1 + a·b) of the rotation that takes direction a to
//     b): near π, where the vectors are nearly opposite, 1 + cos θ ≈
//     (π-θ)²/2 is all cancellation, 0 within 1.49e-8 of π, while
//     |a+b|²/2 keeps nearly every digit (a+b is exact there by
//     Sterbenz's lemma); a dot product of vectors that are not
//     directions has the data's size and is left alone, and so is 1 + c
//     where a condition keeps c above -1 (if c < -1+0.001 { ...; return }
//     handles nearly opposite vectors by themselves);
//   - 1 - s where s accumulates math.Sqrt(p*q) (s += math.Sqrt(p[i]*q[i]),
//     in the function or in the package's own function returning s),
//     consumed to relative accuracy (under a root, as a divisor): for
//     distributions of unit mass s is the Bhattacharyya coefficient, the
//     cosine of the angle between √p and √q, 1 where they coincide, and
//     1 - s the squared Hellinger distance; s carries about n·u, so
//     distances below about 1e-8 are lost, while 0.5·Σ(√p-√q)² keeps
//     them. A complement only returned or stored is left alone, as for
//     the squares;
//   - a*a - b*b, 1 - x*x and x*x - 1 (a square also held in a variable
//     never reassigned: x2 := x*x; 1 - x2, or written math.Pow(x, 2))
//     where the difference is consumed
//     to relative accuracy: under a square root (a radicand near
//     tangency, where sqrt turns an absolute error d into sqrt(d)), in a
//     logarithm, as a divisor, or in a test of its sign against 0, also
//     through products, odd functions such as sin, and local variables:
//     each square carries a rounding error of about u·a², all of the
//     difference where |a| and |b| are close; (a-b)*(a+b) forms the
//     difference exactly first; not where both operands hold constants
//     (through variables never reassigned) whose loss, a²/|a²-b²|, is a
//     fixed number within 100, nor where an enclosing condition keeps
//     the x of 1 - x*x or x*x - 1 above sqrt(100/99) ≈ 1.005 or its |x|
//     below sqrt(0.99) ≈ 0.995 (case x > 2:), where at most two digits go;
//   - 1 - math.Erf(x), 1 - 0.5*math.Erfc(-x) (the normal distribution
//     function) and 1 - F(x) for a function or method F named CDF, also
//     scaled (2 - 2*F(x), a two-sided tail): upper-tail probabilities
//     below 1.11e-16 come out 0 and small ones lose digits; math.Erfc(x),
//     0.5*math.Erfc(x), or a complementary function; and the lower tail
//     1 + math.Erf(x), also scaled (0.5*(1 + math.Erf(z)), 0.5 +
//     0.5*math.Erf(z)), for x not known to be non-negative: erf tends to
//     -1, so the sum is 0 below x ≈ -5.92 and off by 1.5e-5 relative at
//     x = -5 (TestLowerTail, against Abramowitz & Stegun 7.1.23);
//     math.Erfc(-x);
//   - the one-pass covariance E[xy]-E[x]E[y]: sxy - sx*sy/n, n*sxy -
//     sx*sy or sxy/n - mx*my, where sxy accumulates products x*y of data
//     (not of deviations from means taken first) and sx, sy accumulate
//     values: both terms are about n²·mean(x)·mean(y), and the difference
//     keeps only about log10(|mean(x)·mean(y)/cov|) digits;
//   - the one-pass variance E[x²]-E[x]²: s2/n - m*m, s2 - s1*s1/n or the
//     weighted n*s2 - s1*s1 (Σw·Σwx² - (Σwx)²) where s2 accumulates squares
//     of data (s2 += x*x, s2 = k*s2 + w*(x*x), or a value squared in place
//     first, w*x*x; also a field read through an accessor, d.SumWX2()), but
//     not a product of two such sums (Σx²·Σy² - (Σxy)², the residual rule
//     above), nor sums of data
//     centred before squaring (x = (v - mean)/sd, also through the
//     package's own function), which hold no mean² to cancel: both terms are about mean², so the
//     difference loses about log10(mean²/variance) digits and can turn
//     negative; accumulate squared deviations from the mean (two passes
//     or Welford's update). An accumulator of squared deviations
//     ((x-m)*(x-m)) is the accurate two-pass form and is left alone;
//   - a sum of terms of both signs, each a constant times a product of
//     powers of math.Gamma(1 + c/v) with one and the same v (also through
//     what the package's own functions return): the central moments of a
//     distribution of shape v from its raw moments, such as the variance
//     Γ(1+2/v) - Γ(1+1/v)². Every factor tends to Γ(1) = 1 as v grows, so
//     each term is about its coefficient and rounded at that size, while
//     the sum shrinks like a power of 1/v ((π²/6)/v² for the variance):
//     about 2·log10(v) digits go and from v ≈ 1e8 none are left; the
//     series ln Γ(1+z) = -γz + Σ (-1)^k ζ(k) z^k/k in z = 1/v has no
//     cancellation. Terms that only add, and Gamma values of two
//     different shapes, are left alone;
//   - a sum in which math.Lgamma(x) and math.Lgamma(y) (values stored
//     by v, _ := math.Lgamma(·), each variable assigned once) enter with
//     opposite signs and x and y share a term that is not a constant
//     (n+1 and n-k+1, (v+1)/2 and v/2): the log of the ratio Γ(x)/Γ(y),
//     as in a log binomial coefficient or a log beta function. Each value
//     is about x·ln x and rounded at that size, while the difference is
//     about (x-y)·ln x, so about log10(x/|x-y|) digits go, and the
//     absolute error u·x·ln x, which exponentiating turns into a relative
//     one, is 1.5e-9 at x = 1e6 and 3e-3 at 1e12. It is left alone where
//     another term of the sum, or of a sum its value joins through a
//     variable, has a coefficient (a factor other than a call) containing
//     the shared term, ((v+1)/2)·log(1+z²/v) in a
//     log-density: that term already carries an absolute error of about
//     u·|v|, and the difference adds only a factor ln v to it;
//   - 1-math.Cos(x) and math.Cos(x)-1: cos(x) rounds to 1 for |x| below
//     1.05e-8 and the difference loses about 2·log10(1/|x|) digits;
//     2*math.Sin(x/2)*math.Sin(x/2) is the same quantity without a
//     subtraction; math.Log(math.Cos(x)) likewise, about -x²/2 for small
//     x, where math.Log1p(-2*math.Sin(x/2)*math.Sin(x/2)) keeps the digits,
//     and 1/math.Cos(x) - 1, where the same square over math.Cos(x) does;
//     and 1 - math.Cos(x)*math.Cos(x) (also through a variable holding the
//     cosine, or as a power), which is sin²x and comes out 0 where the
//     cosine rounds to 1, however it is factorised: math.Sin(x)*math.Sin(x)
//     is within about 3 ulps of it (TestFixesSafe);
//   - math.Sqrt(x*x+y*y) and math.Sqrt(x*x+y*y+z*z), the same operands
//     squared, where an operand is computed by an operation that reaches
//     such magnitudes from ordinary inputs (a quotient by a variable that
//     may come near 0, not one bounded away from it by construction such
//     as math.Sqrt(1-e2*s*s) with e2 < 1 and s a sine; an exponential, power, gamma, tangent or hyperbolic function, a
//     constant beyond 1e100), or is made of fields the package itself
//     takes as unbounded: fields it tests with math.IsInf (a validation
//     that rejects only non-finite values, so every finite value is an
//     input), also through differences, variables and maxima (math.Max, a max of the package's own). The
//     squares overflow to +Inf once an operand exceeds 1.34e154 and become
//     subnormal below 1.49e-154, though the result is representable;
//     math.Hypot(x, y) scales instead (for three operands, divide by the
//     largest magnitude first). The same holds for math.Sqrt(v.Dot(v)),
//     also through what the package's functions return
//     (math.Sqrt(w.lengthSq())), where Dot sums products of the same such
//     fields of its receiver and parameter, unless the squared length is
//     a variable used elsewhere too (4*C*A beside math.Sqrt(C)), whose
//     products overflow as early or earlier, so that math.Hypot at the
//     root would not remove the overflow;
//   - math.Pow(s, 1/p) where s accumulates math.Pow(x, p) in the same
//     function and p is not a constant (a p-norm): the powers overflow
//     once |x| exceeds MaxFloat64^(1/p), 5.64e102 for p = 3 and 6.69e30
//     for p = 10, and vanish for tiny x, though the norm is representable;
//     dividing by the largest |x| first keeps every power at most 1, and
//     a base so divided is left alone;
//   - e/(…(1+e)…) with e = math.Exp(y) (directly or through a variable),
//     the sigmoid e/(1+e) and the logistic density e/(s·(1+e)²), and with
//     a numerator c±e, the hyperbolic tangent (1-e)/(1+e) with
//     e = math.Exp(-2x): once y exceeds 709.78 both overflow and the
//     quotient is ∞/∞ = NaN, though it tends to a finite limit; dividing
//     through by e (the exponential of -y) keeps every value finite. An
//     exponent known not to be positive (-|z|) is left alone, as is a
//     quotient under a condition that checks e or y (math.IsInf(e, 1),
//     y < 700);
//   - a sum of exponentials over a loop (s += math.Exp(y), or of a
//     variable or slice the loop stores math.Exp(y) into), divided into
//     one of them (a softmax share, x/s or x /= s) or passed to math.Log
//     (a log-sum-exp): once a y exceeds 709.78 the term and the sum are
//     +Inf and the share NaN, and once every y is below -745.13 they are 0,
//     the share 0/0 = NaN and the log -Inf, though the share lies in [0, 1] and the log is about the
//     largest y; subtracting the largest y before exponentiating keeps
//     every term at most 1 and the sum at least 1. An exponent shifted by
//     a value (y - m), also in place before it is taken (lp[i] -= m),
//     not positive (-|z|) or constant is left alone, as
//     is a use under a condition that checks the sum (math.IsInf(s, 1));
//   - 2σ(z) - 1 and 1 - 2σ(z) of the logistic σ(z) = 1/(1+e^-z)
//     (2/(1+math.Exp(-z)) - 1, or twice the package's own logistic):
//     they are ±tanh(z/2), about ±z/2 near 0, where 2σ(z) is near 1 and
//     carries an absolute error of about u, so only log10(|z|/u) digits
//     are left, none below |z| ≈ 2.2e-16, where 1+e^-z rounds to 2;
//     math.Tanh(z/2) has no subtraction (TestScaledLogistic, against
//     math/big);
//   - math.Log(σ(z)) and math.Log(1 - σ(z)) of the logistic σ(z) =
//     1/(1+math.Exp(-z)) or math.Exp(z)/(1+math.Exp(z)), written out, held
//     in a variable or returned by the package's own function (the
//     log-loss of a classifier): σ(z) rounds to 1 for z above 36.7, where
//     log(1-σ(z)) is -Inf though about -z, and to 0 for z below -709.8,
//     where log σ(z) is -Inf though about z; Log1p(-σ(z)) does not help,
//     σ(z) being 1 already. The softplus forms log σ(z) = -softplus(-z)
//     and log(1-σ(z)) = -softplus(z) stay finite (TestLogisticLoss);
//   - math.Log(1+math.Exp(y)) (softplus): +Inf for y above 709.78, where
//     the result is about y, also as a term of a sum, which hides no
//     infinity; math.Max(y, 0) + math.Log1p(math.Exp(-math.Abs(y)));
//   - (f(a)-f(b))/(a-b) and its reciprocal for f = math.Cos, Sin, Exp or
//     Log (also through the package's own wrapper of f): a divided
//     difference, whose numerator is f'(ξ)(a-b) while each value carries
//     an absolute error of u·|f|, so about log10(|f'|·|a-b|/(u·|f|))
//     digits remain as a approaches b and a = b gives 0/0 though the
//     limit f'(a) exists; a-b is exact there (Sterbenz), so the closed
//     forms (-2·sin((a+b)/2)·sin((a-b)/2)/(a-b), e^b·expm1(a-b)/(a-b),
//     log1p((a-b)/b)/(a-b)) keep every digit;
//   - a*c - b*b where a and c are dot products of vectors u and v with
//     themselves and b = u·v, calls of one dot-product function (a Gram
//     determinant): by Lagrange's identity it is |u×v|² =
//     |u|²|v|²·sin²θ, so for nearly parallel vectors it keeps about
//     log10(sin²θ/u) digits and may turn negative, while the squared
//     norm of the cross product keeps them all; reported unless the
//     consumer needs only absolute accuracy;
//   - a difference whose second term is r² times its first, r the
//     correlation of two data series: Syy - Sxy²/Sxx, Syy - b·Sxy with
//     the slope b = Sxy/Sxx, Sxx·Syy - Sxy², 1 - Sxy²/(Sxx·Syy), where
//     Sxx, Syy, Sxy are second moments (variables or fields that sum
//     products of data, centred or not: sxy += dx*dy; or the one-pass
//     variances and covariances built from them; also through variables
//     and math.Pow(s, 2)). By Cauchy–Schwarz Sxy² ≤ Sxx·Syy, so the
//     difference is Syy·(1 - r²) ≥ 0, the residual sum of squares of the
//     least-squares line: as the fit improves the terms approach each
//     other and log10(1/(1 - r²)) digits go, and on an exact line it
//     comes out negative about half the time (NaN under math.Sqrt;
//     TestFitResidual). Summing the squared residuals of the fitted line
//     in a second pass keeps them; reported unless the consumer needs
//     only absolute accuracy, and not where the cross moment pairs other
//     series than the squares (no bound ties the terms);
//   - s += (x1+x0)*(y1-y0) and s += x0*y1 - x1*y0 in a loop, with x0, x1
//     (y0, y1) the same coordinate of two points taken as they are (p0.X
//     and p1.X, r[i][0] and r[i+1][0]): the shoelace area of a ring. Each
//     term is about |x|·|Δy| (|x|·|y| for the cross form) with a rounding
//     of that size, while the sum is twice the area, about L² for a ring
//     of size L, so a ring at distance X from the origin keeps only about
//     log10(L/(u·X)) digits; coordinates relative to the first vertex
//     (q.X - o.X) keep them all and are left alone;
//   - a float field of a method's receiver, or an element of a slice
//     field (r.f, r.f[i]), that the package's methods both take from
//     (r.f -= e) and add into (r.f += e, r.f = r.f + e, or a local started
//     from r.f, added to and stored back): a running sum or mean kept in a
//     value's state across an unbounded number of calls, from which values
//     that passed are taken out again (a sliding window, a reservoir, a
//     reweighted total, a windowed Welford update). Each update rounds at
//     the size of the sum at that time (Higham 2002, §4.2), so a large
//     value that passes leaves its rounding, up to u·|value|, behind for
//     good, and the sum of the small values that follow carries an error
//     that never decays; recompute it from the values kept from time to
//     time or keep a compensated sum. Sums in local variables, and fields
//     of a local copy or a value receiver (a box moved by value), last one
//     call and are left alone, as are fields only ever added to, or only
//     taken from and reset to constants (a budget spent down), a
//     subtraction of what a parameter that is not a number holds (A.e[i]
//     -= B.At(i, j), an elementwise combination with a second operand of
//     the receiver's shape: one rounding per entry, nothing that passed
//     through is taken out), a subtraction worked out from the field's own
//     value and constants alone (r.a -= 2π·⌊r.a/2π⌋, a range reduction or
//     decay of what it holds now; a mean's downdate r.m -= (x - r.m)/n
//     also reads the value x that leaves, and stays a hazard), and one in
//     a function that first sets the field to a constant and adds into it
//     only values that read no state of the receiver (r.i = 0; r.i +=
//     part.i; r.i -= m·d², the sum rebuilt from the values kept on each
//     call, so its rounding lasts until the next; a sum restarted from
//     another running sum, r.next = 0; r.next += r.sums[k], carries that
//     sum's history and stays a hazard);
//   - 1 - a/(a+b), the complement of a share of a sum (also through
//     variables): where |b| is small against |a| the quotient is within
//     a rounding of 1, so about log10(|a|/|b|) digits go and |b| < u·|a|
//     gives 0; b/(a+b) is the same value with two roundings. Reported
//     where the consumer needs the value to relative accuracy (a root, a
//     power, a logarithm, a divisor, a sign test), as for the squares:
//     elsewhere its absolute error is one rounding of 1, and whether |b|
//     can be that small against |a| (a count against a fraction below 2
//     cannot) is seldom visible in the code;
//   - c1 + k*(x - c2) whose constants cancel (1 + 2*(p - 0.5) is 2*p):
//     x - c2 is rounded to the spacing near c2 (5.55e-17 for 0.5), which
//     adding c1 back does not undo, so a small x keeps only about
//     log10(|x|/ulp(c2)) digits; k*x keeps them all. Reported unless the
//     consumer needs only absolute accuracy;
//   - the first step (x - y*A) - y*B of an additive range reduction
//     (Cody and Waite's split of a constant such as π/4 into a leading
//     part A and corrections) where A has so many significant bits in the
//     expression's type that y*A is exact only for |y| below 2^8: the
//     reduction relies on y*A being exact, and past that its rounding, up
//     to u·|y·A|, is all the reduced argument's error (a float64 split,
//     23 bits in A, computed in float32: exact only for |y| < 2). Where
//     an enclosing condition sends only x below a constant T to the
//     reduction (x >= T in the if, the reduction in the else), T decides
//     instead: silent when T is within the exact range 2^(p-s)·|A| (p
//     the type's precision, s the significant bits of A), and otherwise
//     the condition is reported too;
//   - z.Sub(x, y) and z.Add(x, y) on math/big Floats whose operands were
//     last set by Mul, in a function that starts its values from float64
//     (SetFloat64, big.NewFloat) and never calls SetPrec: a zero Float
//     takes its operands' precision, 53 bits there, so the products round
//     as float64 products do and the difference cancels as in float64,
//     though an exact product of two float64 values needs only 106 bits;
//   - math.Log(math.Exp(a)+math.Exp(b)), unless both are already shifted
//     by a common value (l1-m, l2-m): +Inf once an argument exceeds
//     709.78 and -Inf once both are below -745.13; the shifted form
//     max(a,b) + math.Log1p(math.Exp(-|a-b|)) is exact in range.
//
// The small-argument rules report only where the loss can reach a result:
// the argument is not a constant, not a conversion of an integer (0 or at
// least 1 in magnitude), not a draw of math/rand's Float64 (1-u is exact
// for math/rand/v2 draws, and small draws are as rare as they are small),
// and no enclosing condition keeps it away from zero (if x < -0.5 ||
// x > 0.5, a case math.Abs(x) > t, the code after an early return taken
// when math.Abs(x) < 1e-5, or after a chain if s < 1 { return ... } else
// if s <= 20 { return ... } every branch of which returns, past which
// s > 20; a split at a constant counts where the form keeps at least
// half its digits beyond it, |x| ≥ sqrt(u) ≈ 1.05e-8, or 1.45e-4 for the
// forms of 1 - cos x: a split at 1e-10 before math.Log(math.Cos(x))
// leaves x where the cosine still rounds to 1), nor, for log(1 ± x) and exp(x) - 1, which
// lose about log10(1/|x|) digits, its range keeps |x| at
// least 0.01 (two digits at most: the golden-section ratio (3 -
// math.Sqrt(5))/2 = 0.382 in math.Log(1-ratio); a whole number times or
// over a constant, float64(q)/10, is 0, where the forms are exact, or at
// least the scale); the same holds for
// b·ln a in a^b - 1, for x in 1 - cos(x), which loses about log10(2/x²)
// digits, from |x| = sqrt(0.02) ≈ 0.141 up, and for y in log(1+e^y)
// inside [-ln 100, 709.78], where e^y keeps two digits and cannot
// overflow. A range is read (package span) by interval arithmetic from
// constants, functions of bounded range, variables never reassigned, the
// conditions under which the code runs on such variables (if s > -19 {
// return } leaves 1-s at least 20, so 2^-(1-s) at most 2^-20; the else
// branch of if x*x < 0.0025 leaves |x| at least 0.05), and, for a
// parameter of an unexported function used only by direct calls, the
// arguments of all those calls, each read where it is passed (a function
// called only past if s < 15 { return } sees s ≥ 15); the value does not only
// meet a comparison with a nonzero constant (math.Abs(math.Exp(y)-1) >
// 0.5 choosing a series: a rounding of 1 moves the choice only within
// that rounding of the threshold, where either side serves); and the
// value is not added to another term, directly, through +=, or through a
// variable used only as a term of a sum:
// mu + s*math.Log(1-p) has the absolute error of one rounding, which is all
// a sum can show. A term divided by a factor of its small argument,
// log(1+a·m)/a or (exp(a·m)-1)/a, tends to m as a shrinks, so it is not
// small while its rounding error, about u/|a|, grows: reported in a sum
// too. A term multiplied by a large coefficient is reported in a
// sum too: a constant of at least 100 in magnitude (two digits of the
// term's error show) or a count converted from an integer
// (float64(n-k)*math.Log(1-p) in a log-likelihood), which grows with the
// data. So is (n-k)*math.Log(1-p) beside k*math.Log(p) with k not a
// constant, the log-likelihood of k successes in n trials: for small p the
// likeliest count is k = 0, where the other term vanishes and the sum is
// the failure term itself, whose relative error u/p is then the result's
// (a density's (α-1)·log x + (β-1)·log(1-x), whose coefficients are not
// complementary counts, is left alone).
// Nor is the slope of a Newton update of a variable the argument
// mentions (slope := 1 - math.Cos(t); t -= resid/slope, the step perhaps
// also compared in a stopping test): the iteration stops where the
// residual vanishes, a point the slope does not move, so a relative
// error in it only lengthens or shortens the steps. The cosine rule leaves alone an angle built from constants and
// whole numbers by products and quotients (2πi/(n-1) of a window, a
// quarter turn over a segment count), also through a field of the
// package every assignment of which is such an angle: it is 0 or at least |c|/n, cos rounds
// to 1 there only for counts beyond 10^8, and the absolute error of 1-cos
// stays one rounding of 1, the scale of such weights. The power rule also
// leaves alone a constant exponent (1 -
// math.Pow(x, 2) is a difference of squares), a whole exponent with a
// base other than 1±u (math.Pow(2, float64(n)) - 1, a bias correction
// 1 - math.Pow(beta, t) with t a float only ever incremented): for n >= 1,
// |1-a^n| >= |1-a|, so the power loses no more than 1-a already does from
// the base's own rounding, and a computed base other
// than 1±u ((x/λ)^k - 1: the base carries its own rounding, which
// math.Expm1 would inherit). The radical rule is silent where the sign of
// u is known: math.Abs, math/cmplx.Abs, math.Sqrt, math.Exp, math.Hypot,
// a square, sums, products and quotients of such values, an enclosing
// condition that compares u, or the value last assigned to u before the
// expression in straight-line code (no loop or label between) being one
// of those: then the terms add and nothing cancels. It is silent too where
// u and c are bounded by construction (constants, a fractional part
// x - math.Floor(x), sines and cosines, and arithmetic on those) so that
// u²/|c| stays within 100: the loss, about log10(u²/|c|) digits, is then
// at most two, as in Cardano's formula on the fractional part of a
// logarithm. It is silent on a ray meeting a quadric of definite form,
// the quadratic a·t² + b·t + c with a = d·d, b = 2·d·o and c = o·o - w in
// one dot product (a package method p.Dot(q), a package function
// Dot(p, q), or products of the same fields): c
// is itself a difference, off by about u·o·o whichever way the roots are
// formed, and (d·o)² ≤ (d·d)(o·o) (Cauchy–Schwarz) bounds b²/4a by o·o,
// so the cancellation adds an error of the same order and the stable
// form gains at most a small factor. A cone's indefinite form has no such
// bound and stays reported. The arc rule reads the cosine through
// the value last assigned to a variable (a clamp to [-1, 1] that
// reassigns it included) and through the package's own wrappers of
// math.Acos, Sin and Cos (no fix is offered there). It is silent for other arguments,
// which reach ±1 only where the problem itself is ill-conditioned (a ratio
// of sines near a pole) or feed a Newton iteration that refines them, for
// math.Asin, and for an angle that is only counted (math.Ceil, an integer
// conversion), where half the digits are plenty. An absolute value is recognised by meaning wherever these rules
// look for one (guards, signs): math.Abs, a float32 library's Abs, or the
// package's own helper (absval). The squares rule is silent where the
// difference is used linearly: fl(fl(a*a) - fl(b*b)) is the exact
// a'² - b'² of inputs perturbed by about u/2 relative, so it is backward
// stable, and its absolute error u·max(a², b²) only shows where the next
// operation needs the difference to relative accuracy. A term of a sum,
// a factor of such a term, a threshold compared at its own scale, the
// argument of cos or exp (which pass an absolute error on as one) carry
// that error at the size of the roundings the result already has; a
// difference returned, stored or passed on is as accurate as its data,
// and its consumer is not seen. The squares rule is also silent for constants
// and whole numbers, whose squares are exact, and for operands computed in
// the function (c := z/r; 1 - c*c, also when the value last assigned to
// c, or every value assigned to it, is computed, or a constant whose
// square is exact, as c = 1 on one branch, where both forms are exact):
// a computed c carries a
// rounding of its own, so 1 - c² has an absolute error of about 2u near |c| = 1 however it
// is formed, and the factorisation gains only for exact inputs. Code in
// _test.go files is not checked: a test's arguments come from its own
// table. The overflow rule is silent when an
// operand is a constant or a whole number, when it was divided by a
// variable scale first (xs := x / s), when an enclosing condition compares
// it or its absolute value, as scaled rotations do, and when the result
// feeds math.Exp, Cosh, Sinh or Gamma, which overflow long before the
// squares; for squares of data (parameters, fields, coordinates and their
// differences) that the package does not declare unbounded, which reach
// 1e154 only if the data do, and physical and geometric data do not; for
// a quotient whose variable an enclosing condition compares (the
// parameter of a projection after if t <= 0 { return }); and where all
// operands are bounded by construction (sines,
// cosines, components of a unit vector a/math.Hypot(a, b), sums and
// products of those): there nothing overflows, and math.Hypot is less
// accurate on average (0.35 against 0.17 ulp over a million random pairs).
// Look-alikes that lose nothing are left alone: math.Log(2+x),
// math.Log(x-1), math.Exp(x)-2, and code already in the
// accurate form. math.Pow(x, 0.5) and math.Pow(x, 2) are not reported: the
// math package computes the first as math.Sqrt(x) and the second, in the
// normal range, with the same single rounding as x*x, so they cost time
// but lose no digit.
//
// Fixes. A fix is applied unattended (go fix, go vet -fix) only when it
// keeps what the program computes or cures a certain bug: here, when the
// new form is at least as accurate as the plain one at every argument
// (measured against 200-bit math/big references), so that it changes
// nothing but the loss. math.Log1p, math.Expm1, the sine form and
// math.Asinh qualify. The sine form is offered only when x can be
// evaluated twice without side effects; no fix is offered when the
// exponential or power was stored in a variable first (its argument may
// have changed since). math.Log1p(x)/math.Ln10 (and /math.Ln2) is as
// accurate, but misses exact results at powers of the base that
// math.Log10 and math.Log2 return exactly (8 of 60 powers of two), so it
// needs review, as does the power's fix, which gives NaN for a negative
// base where math.Pow gives a value. (a-b)*(a+b), math.Erfc,
// 2*math.Atanh and the shifted softplus need review too: where nothing cancels they round differently in the last
// bits. math.Hypot removes the overflow but
// is up to about 1.6 ulps off in the normal range, where x*x+y*y is within
// one, and it is slower; whether the extremes occur is the author's
// knowledge, so that fix needs review. The shifted log-sum-exp form gives
// NaN where both arguments are the same infinity (a log-probability of
// -Inf), where the plain form gave ±Inf, so it needs review too; only
// standalone roundoff -fix applies these two.
package cancellation
