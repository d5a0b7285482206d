package marks

// Each malformed directive is reported at the directive; the want comment
// sits on the line above it, since the directive's text runs to the end of
// its own line.

func levels(a, b float64) bool {
	// want +1 `review directive for exacteq gives no reason, so it suppresses nothing`
	//roundoff:reviewed exacteq
	return a+b == 0.3
}

func sums(a, b float64) bool {
	// want +1 `review directive names "the", which is not a roundoff analyzer \(the suite has exacteq, reviewmark\)`
	//roundoff:reviewed the tank levels are integers
	return a == b
}

func empty(a, b float64) bool {
	// want +1 `review directive names no analyzer and suppresses nothing; write //roundoff:reviewed <analyzer> <reason>`
	//roundoff:reviewed
	return a == b
}

func probes(a, b float64) bool {
	// want +1 `review directive names "exacteg", which is not a roundoff analyzer`
	//roundoff:reviewed exacteg,exacteq probe readings are set, not computed
	return a == b
}

func spaced(a, b float64) bool {
	// want +1 `comment "// roundoff:reviewed" is not a directive because of the space after //, so it suppresses nothing`
	// roundoff:reviewed exacteq both sides come from the same table
	return a == b
}

func glued(a, b float64) bool {
	// want +1 `comment "//roundoff:reviewedexacteq" is not a review directive: put a space between //roundoff:reviewed and the analyzer names`
	//roundoff:reviewedexacteq gate positions are set from a table
	return a == b
}

func block(a, b float64) bool {
	/*roundoff:reviewed exacteq gate positions are set from a table*/ // want `review directives are // line comments; in a /\* \*/ comment it suppresses nothing`
	return a == b
}

func trailing(a, b float64) bool {
	// want +1 `review directive has an empty analyzer name \(a comma at the end of the names, or a space after a comma\); write the names joined by commas without spaces, such as exacteq,reviewmark`
	//roundoff:reviewed exacteq, gate positions are set from a table
	return a == b
}

func spacedList(a, b float64) bool {
	// want +1 `review directive has an empty analyzer name`
	//roundoff:reviewed exacteq, reviewmark gate positions are set from a table
	return a == b
}

// Well-formed directives stay silent.

func gates(a, b float64) bool {
	//roundoff:reviewed exacteq gate positions are set from a table, never computed
	return a == b
}

func valves(a, b float64) bool {
	return a == b //roundoff:reviewed exacteq,reviewmark valve states are 0 or 1
}

// Comments that only mention the word stay silent:
// roundoff:reviewedness is not the directive's word, and neither is
//roundoff:reviewedness written as a directive.
