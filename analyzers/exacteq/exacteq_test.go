package exacteq_test

import (
	"testing"

	"golang.org/x/tools/go/analysis/analysistest"

	"roundoff/analyzers/exacteq"
)

func TestSmoke(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "smoke")
}
