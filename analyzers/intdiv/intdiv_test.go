package intdiv_test

import (
	"math"
	"math/big"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"golang.org/x/tools/go/analysis/analysistest"

	"roundoff/analyzers/intdiv"
	"roundoff/analyzers/internal/testrun"
	"roundoff/internal/config"
)

func TestHazards(t *testing.T) {
	analysistest.RunWithSuggestedFixes(t, analysistest.TestData(), intdiv.Analyzer, "hazards")
}

func TestIdioms(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), intdiv.Analyzer, "idioms")
}

// TestUnattended checks that under go fix no intdiv fix is applied: both
// change what the program computes (a test pinning 4/3 == 1 would turn
// red), and whether the floor was meant is the author's call.
func TestUnattended(t *testing.T) {
	config.KeepUnattendedOnly(true)
	defer config.KeepUnattendedOnly(false)
	for _, r := range analysistest.Run(t, analysistest.TestData(), intdiv.Analyzer, "unattended") {
		assert.Len(t, r.Diagnostics, 3)
		for _, d := range r.Diagnostics {
			assert.Empty(t, d.SuggestedFixes, d.Message)
		}
	}
}

// TestFixedProgramRuns runs testdata/src/runfix before and after its fixes
// and compares the results with exact rational arithmetic in math/big.
func TestFixedProgramRuns(t *testing.T) {
	analysistest.RunWithSuggestedFixes(t, analysistest.TestData(), intdiv.Analyzer, "runfix")
	src := filepath.Join("testdata", "src", "runfix")
	before := testrun.Values(t, testrun.Output(t, filepath.Join(src, "main.go")))
	after := testrun.Values(t, testrun.Output(t, filepath.Join(src, "main.go.golden")))

	// Go specification, "Arithmetic operators" and "Constant expressions":
	// integer division truncates toward zero, and untyped integer constants
	// divide as integers: 7/3 is 2, 1/2 is 0, and x^0 is 1.
	assert.Equal(t, map[string]float64{"mean": 2, "half": 0, "cbrt": 1, "aspect": 1}, before)

	// The mean of 1, 2, 4 is 7/3; float64(7)/float64(3) is its correctly
	// rounded value (IEEE 754-2019 §5.4.1), the same as math/big's rounding
	// of the exact rational.
	mean, _ := new(big.Rat).SetFrac64(7, 3).Float64()
	assert.Equal(t, mean, after["mean"])
	// 16*1.0/9 divides untyped float constants exactly and rounds once
	// (Go specification, "Constant expressions"): 16/9 correctly rounded.
	aspect, _ := new(big.Rat).SetFrac64(16, 9).Float64()
	assert.Equal(t, aspect, after["aspect"])
	assert.Equal(t, 1.5, after["half"]) // 0.5 * 3, exact
	// 27^(1/3) = 3; math.Pow with the rounded exponent 1.0/3 lands within
	// an ulp or two of it (the exponent is 1/3 - 1.85e-17, so the exact
	// value of 27^(1.0/3) is 3·(1 - 6.1e-17), below one ulp of 3).
	assert.InDelta(t, 3.0, after["cbrt"], 2*math.Nextafter(3, 4)-2*3)
}
