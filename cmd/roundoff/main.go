// Command roundoff finds floating-point hazards in Go numerical code.
//
// It runs standalone (roundoff [flags] packages...), as a vet tool
// (go vet -vettool=$(command -v roundoff)) and as a fix tool
// (go fix -fixtool=$(command -v roundoff)). See README.md and docs/.
package main

import (
	"os"
	"slices"
	"strings"

	"golang.org/x/tools/go/analysis/multichecker"

	"roundoff/analyzers/suite"
)

func main() {
	// go fix and go vet -fix hand the tool -fix and one .cfg file per
	// package, and apply the first fix of every diagnostic unseen.
	args := os.Args[1:]
	suite.Unattended(len(args) > 0 && strings.HasSuffix(args[len(args)-1], ".cfg") && slices.Contains(args, "-fix"))
	multichecker.Main(suite.Analyzers...)
}
