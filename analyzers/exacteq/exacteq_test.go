package exacteq_test

import (
	"testing"

	"golang.org/x/tools/go/analysis/analysistest"

	"roundoff/analyzers/exacteq"
)

func TestHazards(t *testing.T) {
	analysistest.RunWithSuggestedFixes(t, analysistest.TestData(), exacteq.Analyzer, "hazards")
}

func TestIdioms(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "idioms", "generic")
}
