// Command roundoff finds floating-point hazards in Go numerical code.
//
// It runs standalone (roundoff [flags] packages...), as a vet tool
// (go vet -vettool=$(command -v roundoff)) and as a fix tool
// (go fix -fixtool=$(command -v roundoff)). See README.md and docs/.
package main

import "roundoff/analyzers/suite"

func main() { suite.Main() }
