// Command roundoff finds floating-point hazards in Go numerical code.
//
// It runs standalone (roundoff [flags] packages...), as a vet tool
// (go vet -vettool=$(command -v roundoff)) and as a fix tool
// (go fix -fixtool=$(command -v roundoff)). See README.md and docs/.
package main

import (
	"os"

	"roundoff/analyzers/suite"
	"roundoff/cmd/roundoff/internal/driver"
)

func main() { os.Exit(driver.Main(suite.Analyzers, os.Args[1:])) }
