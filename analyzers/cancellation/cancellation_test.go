package cancellation_test

import (
	"testing"

	"golang.org/x/tools/go/analysis/analysistest"

	"roundoff/analyzers/cancellation"
)

func TestHazards(t *testing.T) {
	analysistest.RunWithSuggestedFixes(t, analysistest.TestData(), cancellation.Analyzer, "hazards")
}

func TestIdioms(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), cancellation.Analyzer, "idioms")
}
