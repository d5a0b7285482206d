package portable_test

import (
	"testing"

	"golang.org/x/tools/go/analysis/analysistest"

	"roundoff/analyzers/internal/portable"
)

// TestFacts checks which functions are learned portable, within a package
// and through the facts of the packages it imports. Sources: IEEE
// 754-2019 §4.3 and §5.4 (+ - * / and square root correctly rounded); Go
// specification, "Arithmetic operators" (x*y + z may be fused unless the
// product is converted explicitly).
func TestFacts(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), portable.Analyzer, "example.com/hub", "example.com/farm")
}
