// Package suite lists every roundoff analyzer, in one place, and runs the
// roundoff command on them.
package suite

import (
	"os"

	"golang.org/x/tools/go/analysis"

	"roundoff/analyzers/cancellation"
	"roundoff/analyzers/epsfloor"
	"roundoff/analyzers/exacteq"
	"roundoff/analyzers/fdstep"
	"roundoff/analyzers/intdiv"
	"roundoff/analyzers/internal/driver"
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

// Main runs the roundoff command on the suite with the process's
// arguments and exits with its status.
func Main() { os.Exit(driver.Main(Analyzers, os.Args[1:])) }
