// Package degree reads the degree of a float expression in the data its
// function receives: how its size grows when every value the caller
// passes in grows by a factor s. A parameter, a field or element of one,
// the values of a function held in one (a weight function the caller
// gives), and whatever else arrives from outside is of degree 1 (it
// scales with the data); constants and integers (counts, indices) are of degree 0, and
// so are the entries of a fixed-size array that the package multiplies by
// data beside another entry as it is (m[0][0]*p.x + m[0][2]); a
// product adds degrees, a quotient subtracts them, a sum or difference
// takes the larger, a square root halves. The terms of a sum share a unit
// (dimensional consistency): where two terms that are not constants or
// counts read as different degrees, some factor read as data is a pure
// number (a resolution, a layer weight), and the sum takes the lower
// degree, the reading that claims the smaller error (k_in -
// gamma*k*sigma/m is a weight, not a weight squared). The rounding error of a value of
// degree d is about eps·s^d at data size s, which is what an absolute
// tolerance on it has to exceed.
//
// Functions of the package are read through their return statements,
// once per combination of argument degrees (p.Dot(q) is deg(p)+deg(q));
// a slice holds the values stored into its elements; where the reading
// cannot tell (a call into another package, a package variable, a
// product carried from pass to pass of a loop), it says so, and callers
// claim nothing. Functions of another package are read by their
// summaries (Summarize, carried as facts by package vecshape): a
// direction or the cosine of the angle between two vectors is of degree
// 0, bounded by 1 whatever its inputs; a dot product or a length of
// another package stays unknown, since that package's contract may fix
// its inputs' size (points on the unit sphere), but it tells a cosine
// (the dot product of two directions) apart.
//
// A direction is of degree 0: a normalised vector has length 1 up to
// rounding, so its components and the dot product of two directions are
// bounded by 1 whatever the caller's units, and their rounding error is
// about eps, not eps·s^d. A value is a direction when it is the result of
// a function of the package that divides an input it never changes (its
// receiver or an argument) by that input's own length, recognised from
// the body whatever its name: each component divided by the length or
// multiplied by its reciprocal, directly or through a function of the
// package that scales every component by one factor (x.Mul(1/l),
// x.Div(l)), where the length is math.Sqrt of x's dot product with itself
// (written out, or through the package's Dot, Norm2, Len...) or
// math.Hypot of all its components (nested for three). A return of the
// input itself under a test that bounds it by a constant no larger than 1
// (l == 0: the zero vector, which has no direction to give), or of a
// constant vector no longer than 1 (or of NaNs), does not spoil it. A
// function returning such a value is a direction too, and so is a vector
// field of a struct of the package every store of which in its non-test
// files (composite literals, assignments) is a direction or a constant
// vector no longer than 1 (a test builds its own fixtures). A field
// changed in any other way (a component stored, its address taken, a
// pointer method called on it that may change it: one of another package,
// or one that stores through its receiver or lets the pointer out) is
// data as before. A field read through a value built outside the package
// may hold anything its builder put there: the reading trusts the
// package's own stores.
package degree
