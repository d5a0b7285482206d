// Command roundoff finds floating-point hazards in Go numerical code.
//
// It runs standalone (roundoff [flags] packages...), as a vet tool
// (go vet -vettool=$(command -v roundoff)) and as a fix tool
// (go fix -fixtool=$(command -v roundoff)). See README.md and docs/.
package main

import (
	"os"
	"strings"

	"golang.org/x/tools/go/analysis/multichecker"

	"roundoff/analyzers/suite"
)

func main() {
	// go vet and go fix hand the tool one .cfg file per package and apply
	// the first fix of every diagnostic unseen.
	suite.Unattended(strings.HasSuffix(os.Args[len(os.Args)-1], ".cfg"))
	multichecker.Main(suite.Analyzers...)
}
