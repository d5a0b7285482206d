// Package suite lists every roundoff analyzer, in one place.
package suite

import (
	"golang.org/x/tools/go/analysis"

	"roundoff/analyzers/cancellation"
	"roundoff/analyzers/epsfloor"
	"roundoff/analyzers/exacteq"
	"roundoff/analyzers/fdstep"
	"roundoff/analyzers/intdiv"
	"roundoff/analyzers/reviewmark"
	"roundoff/analyzers/stoptol"
)

// Analyzers is the roundoff suite.
var Analyzers = []*analysis.Analyzer{
	epsfloor.Analyzer,
	exacteq.Analyzer,
	stoptol.Analyzer,
	reviewmark.Analyzer,
	cancellation.Analyzer,
	intdiv.Analyzer,
	fdstep.Analyzer,
}
