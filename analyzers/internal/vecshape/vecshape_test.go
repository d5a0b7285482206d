package vecshape_test

import (
	"testing"

	"golang.org/x/tools/go/analysis/analysistest"

	"roundoff/analyzers/internal/vecshape"
)

// TestFacts checks the shapes learned from bodies, and across a package
// boundary. A direction is a vector over its own length; the cosine of
// the angle between p and q is p·q/(|p||q|) (common practice).
func TestFacts(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), vecshape.Analyzer, "shapes", "usesshapes")
}
