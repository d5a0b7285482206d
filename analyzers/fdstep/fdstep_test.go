package fdstep_test

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"golang.org/x/tools/go/analysis/analysistest"

	"roundoff/analyzers/fdstep"
	"roundoff/internal/config"
)

func TestHazards(t *testing.T) {
	analysistest.RunWithSuggestedFixes(t, analysistest.TestData(), fdstep.Analyzer, "hazards", "runfix")
}

func TestIdioms(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), fdstep.Analyzer, "idioms")
}

// TestFacts checks that steps chosen in one package reach difference
// quotients in another through facts: parameters and struct fields.
func TestFacts(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), fdstep.Analyzer, "fdlib", "fduser")
}

// TestUnattended checks that under go fix, which applies fixes unseen, the
// scaled-step fixes are not offered: choosing a step is a judgement.
func TestUnattended(t *testing.T) {
	config.KeepUnattendedOnly(true)
	defer config.KeepUnattendedOnly(false)
	for _, r := range analysistest.Run(t, analysistest.TestData(), fdstep.Analyzer, "runfix") {
		assert.NotEmpty(t, r.Diagnostics)
		for _, d := range r.Diagnostics {
			assert.Empty(t, d.SuggestedFixes, d.Message)
		}
	}
}

// TestNoise checks that a function declared noisy (//roundoff:noise 1e-6)
// gets its own optimal step, sqrt(1e-6)·max(1,|x|) (Gill, Murray & Wright
// 1981): the machine-precision step is reported for it, not for a clean
// function.
func TestNoise(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), fdstep.Analyzer, "noisy")
}
