// Package reviewmark defines an Analyzer that checks the directives by
// which people accept roundoff findings.
//
// # Analyzer reviewmark
//
// reviewmark: review directives that suppress nothing or name no reason
//
// A finding that a person has looked at and accepts (the exact comparison
// is a sentinel the code sets itself, the data never comes near the
// problem range) is marked in the source, on the finding's line or on the
// line above it:
//
//	//roundoff:reviewed exacteq the grid points are set from this table, never computed
//
// The directive names one or more analyzers, separated by commas without
// spaces, then the reason. It suppresses those analyzers' findings on its
// own line and on the next. The reason is the point of the directive: it
// tells the next reader why the hazard is acceptable, so a directive
// without one suppresses nothing. reviewmark reports, at the comment:
//
//   - a directive without a reason (category noreason);
//   - a directive that names no analyzer (category nonames);
//   - a name that is not an analyzer of the suite, such as a misspelling
//     (category unknown); the other names of the directive still apply;
//   - a comment "// roundoff:reviewed ..." with a space after the slashes,
//     which Go tools treat as an ordinary comment, not a directive
//     (category spaced); the fix removes the space, and as that makes the
//     comment suppress findings it is offered for review only;
//   - the directive glued to an analyzer name, //roundoff:reviewedexacteq
//     (category glued); a longer word such as reviewedness is not taken
//     for a directive;
//   - the directive in a block comment, which is no directive (category
//     block);
//   - an empty analyzer name, from a comma at the end of the names or a
//     space after a comma, which makes the following names part of the
//     reason (category emptyname).
//
// It also checks the noise directive //roundoff:noise <relative accuracy>
// (see docs/noise.md): a level that is not a relative accuracy from the
// unit roundoff of float64 (2^-53, IEEE 754-2019) up to 1 (the check the
// configuration file and the limits calculator share), and a directive
// outside a function's doc comment, declare nothing (category noise).
//
// Directives that no longer suppress anything (the code was fixed) are
// reported by the standalone driver on request: roundoff -stale-reviews.
package reviewmark
