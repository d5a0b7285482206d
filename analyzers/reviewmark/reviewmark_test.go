package reviewmark_test

import (
	"testing"

	"golang.org/x/tools/go/analysis/analysistest"

	"roundoff/analyzers/exacteq"
	"roundoff/analyzers/reviewmark"
	"roundoff/internal/config"
)

// The suite, as the driver announces it to the analyzers.
func useSuite(t *testing.T) {
	config.Use(config.Default([]string{"exacteq", "reviewmark"}, ""))
	t.Cleanup(func() { config.Use(nil) })
}

func TestMarks(t *testing.T) {
	useSuite(t)
	analysistest.RunWithSuggestedFixes(t, analysistest.TestData(), reviewmark.Analyzer, "marks")
}

// TestSuppression runs exacteq, whose findings fixes.Report filters by the
// review directives.
func TestSuppression(t *testing.T) {
	useSuite(t)
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "suppressed")
}

func TestNoiseDirectives(t *testing.T) {
	useSuite(t)
	analysistest.Run(t, analysistest.TestData(), reviewmark.Analyzer, "noise")
}
