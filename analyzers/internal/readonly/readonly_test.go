package readonly_test

import (
	"testing"

	"golang.org/x/tools/go/analysis/analysistest"

	"roundoff/analyzers/internal/readonly"
)

// TestFacts checks which float-slice parameters are learned as only read:
// a store, a slice, an append onto the slice itself or a reference kept
// elsewhere may change the caller's elements (Go specification,
// "Appending to and copying slices": append writes in place when the
// capacity suffices), so none of those is read-only; reads, copies and
// formatting are, in one package and across packages through facts.
func TestFacts(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), readonly.Analyzer, "knots", "fit")
}
