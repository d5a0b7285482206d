package fdstep_test

import (
	"fmt"
	"path/filepath"
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

// TestGonumDefaults checks calls of gonum's diff/fd that leave the step to
// the formula (its Forward, Central and Central2nd steps 2e-8, 6e-6 and
// 1e-4, gonum v0.17.0 diff/fd/diff.go): a fixed step, judged as one
// (Numerical Recipes 3rd ed. §5.7 for the scaled optimum), and left alone
// where the caller gives a step or the point is of unit size.
func TestGonumDefaults(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), fdstep.Analyzer, "fdclient")
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

// TestRelated checks that a finding whose step is set apart from the
// quotient names both places: the default's assignment for a defaulted
// step, the declaration for a named step on another line.
func TestRelated(t *testing.T) {
	related := map[string]int{} // file:line of a finding → line of its related location
	for _, r := range analysistest.Run(t, analysistest.TestData(), fdstep.Analyzer, "hazards") {
		for _, d := range r.Diagnostics {
			pos := r.Pass.Fset.Position(d.Pos)
			if len(d.Related) > 0 {
				related[fmt.Sprintf("%s:%d", filepath.Base(pos.Filename), pos.Line)] = r.Pass.Fset.Position(d.Related[0].Pos).Line
			}
		}
	}
	assert.Equal(t, 40, related["stencils.go:42"], "the default h = 1e-8")
	assert.Equal(t, 24, related["stencils.go:25"], "the constant w = 0.1")
	assert.Equal(t, 14, related["table.go:24"], "the rule's Step: 1e-6")
}
