package exacteq_test

import (
	"math"
	"math/big"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/go/analysis/analysistest"

	"roundoff/analyzers/exacteq"
	"roundoff/analyzers/internal/testrun"
	"roundoff/internal/config"
)

func TestHazards(t *testing.T) {
	analysistest.RunWithSuggestedFixes(t, analysistest.TestData(), exacteq.Analyzer, "hazards", "runfix")
}

func TestIdioms(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "idioms", "generic")
}

func TestTestFiles(t *testing.T) {
	analysistest.RunWithSuggestedFixes(t, analysistest.TestData(), exacteq.Analyzer, "gauge")
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "assay")
}

// TestUnattended checks that under go fix only the fixes that need no
// judgement are offered: the golden file keeps every tolerance comparison.
func TestUnattended(t *testing.T) {
	config.KeepUnattendedOnly(true)
	defer config.KeepUnattendedOnly(false)
	analysistest.RunWithSuggestedFixes(t, analysistest.TestData(), exacteq.Analyzer, "unattended")
}

// TestFixedProgramRuns runs testdata/src/runfix before and after its fixes
// (the golden file) and checks that each fix changes the outcome as claimed.
func TestFixedProgramRuns(t *testing.T) {
	// IEEE 754-2019 binary64: 0.1 and 0.2 round to 53-bit significands, and
	// their sum rounds to a different double than 0.3 does. Checked here
	// with math/big at 200 bits, independently of float64 arithmetic.
	exactSum := new(big.Float).SetPrec(200).Add(big.NewFloat(0.1), big.NewFloat(0.2))
	roundedSum, _ := new(big.Float).SetPrec(53).SetMode(big.ToNearestEven).Set(exactSum).Float64()
	require.NotEqual(t, roundedSum, 0.3, "binary64 0.1+0.2 must differ from binary64 0.3")

	src := filepath.Join("testdata", "src", "runfix")
	before := testrun.Output(t, filepath.Join(src, "main.go"))
	after := testrun.Output(t, filepath.Join(src, "main.go.golden"))

	// Before: the exact tests fail, and the loop passes 1 without equalling
	// it (0.9999999999999999, then 1.0999999999999999), stopped only by its cap.
	// And Log(2^29)/Ln2 rounds to 29.000000000000004, whose ceiling is 30.
	assert.Equal(t, "sum equals 0.3: false\nreading is NaN: false\nsteps: 1000\nhalvings of 2^29: 30\n", before)
	// After: the tolerance test accepts the rounded sum, math.IsNaN sees
	// the NaN (IEEE 754-2019 §5.11: NaN is unordered with everything), and
	// the loop runs the 10 steps that exact arithmetic gives for 0 to 1 by 0.1.
	// The exponent of 2^29 is 29 by definition (IEEE 754-2019 §3.4: 2^29 is
	// a binary64 with significand 1 and exponent 29), and math.Log2 returns
	// it exactly.
	assert.Equal(t, "sum equals 0.3: true\nreading is NaN: true\nsteps: 10\nhalvings of 2^29: 29\n", after)
}

// TestPinnedRelated checks that a printed value read from a table of cases
// is named as the finding's second place (common practice: the reader
// must find the value from the test and the test from the value).
func TestPinnedRelated(t *testing.T) {
	res := analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "gauge")
	found := false
	for _, r := range res {
		for _, d := range r.Diagnostics {
			if d.Category != "pinned" || len(d.Related) == 0 {
				continue
			}
			at := r.Pass.Fset.Position(d.Related[0].Pos)
			assert.Equal(t, "gauge_test.go", filepath.Base(at.Filename))
			assert.Less(t, at.Line, r.Pass.Fset.Position(d.Pos).Line, "the table comes before the loop")
			found = true
		}
	}
	assert.True(t, found, "a pinned finding names the table's value")
}

// TestTies checks the exact tests that ask whether values are zero
// together or break ties in an ordering, and their neighbours that stay
// hazards.
func TestTies(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "ties")
}

// TestPortableAcrossPackages checks that pinned results of another
// package's functions are judged by that package's portability facts.
func TestPortableAcrossPackages(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "example.com/blade")
}

// TestCauseInSight checks that a pin is reported only where the
// computation shows a cause (a fusable product, a math function not
// correctly rounded: IEEE 754-2019 §5.4.1, §9.2), and left alone where it
// leaves sight through an interface or a function value with every step
// seen correctly rounded (IEEE 754-2019 §4.3).
func TestCauseInSight(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "example.com/kiln")
}

// TestCauseThroughCallback checks that a value a function hands to a
// closure the test gives it (stored into a map or a slice there) shows the
// causes of what the function computes, in this package or, by a fact,
// through a wrapper of another (a fusable product: IEEE 754-2019 §5.4.1),
// and that values handed on as stored are left alone.
func TestCauseThroughCallback(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "example.com/ledger", "example.com/ledger/check")
}

// TestCauseThroughInterface checks that a method a helper invokes on an
// interface parameter is judged as the method of the concrete type the
// test hands it, across packages and through a second helper (a fusable
// product shows; IEEE 754-2019 §5.4.1), and left alone where every step
// is correctly rounded or the type is unknown.
func TestCauseThroughInterface(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "example.com/pump/rotor")
}

// TestHelperAssertions checks equality assertions of a test suite's own
// helpers against short decimals.
func TestHelperAssertions(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "example.com/turbine")
}

// TestRecall checks the exact comparisons known from their context: ties
// of summed costs beside an ordered test, three-way sign splits of
// cancelling differences, and fields of structs the package computes.
func TestRecall(t *testing.T) {
	analysistest.RunWithSuggestedFixes(t, analysistest.TestData(), exacteq.Analyzer, "recall")
}

// TestSecondRoute checks tests that compare a result of the code under
// test exactly with a value only exact arithmetic makes equal to it.
func TestSecondRoute(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "route")
}

// TestExactInputs checks pinned results computed from the inputs a test
// gives: exact products cannot change under fusion (IEEE 754-2019
// §5.4.1), so such pins are left alone, and the others stay.
func TestExactInputs(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "survey")

	// The cases' claims, checked outside the analyzer. math.FMA is IEEE
	// 754-2019 fusedMultiplyAdd (one rounding); float64(x*y) forces the
	// product's own rounding (Go specification, "Arithmetic operators").
	pace := func(dx, dy float64, fused bool) float64 {
		if fused {
			return math.Sqrt(math.FMA(dx, dx, float64(dy*dy)))
		}
		return math.Sqrt(float64(dx*dx) + float64(dy*dy))
	}
	for _, d := range [][2]float64{{-43, -5}, {-1, -1}} {
		assert.Equal(t, pace(d[0], d[1], false), pace(d[0], d[1], true), "whole stakes %v: fusion changes nothing", d)
	}
	assert.Equal(t, 1.077032961426901, pace(0.4, 1, false))
	assert.Equal(t, 1.0770329614269007, pace(0.4, 1, true), "decimal stakes: the fused result differs")

	// math/big: 100000007^2 needs 54 bits, 5001^2 needs 25 (float32 holds
	// 24), 6^3 = 216 needs 5.
	wide := new(big.Int).Exp(big.NewInt(100000007), big.NewInt(2), nil)
	assert.Equal(t, 54, wide.BitLen()-int(wide.TrailingZeroBits()))
	side := 100000007.0
	assert.NotEqual(t, wide.String(), new(big.Float).SetFloat64(side*side).Text('f', 0), "the float64 product rounds")
	narrow := new(big.Int).Exp(big.NewInt(5001), big.NewInt(2), nil)
	assert.Equal(t, 25, narrow.BitLen()-int(narrow.TrailingZeroBits()))
	cube := new(big.Int).Exp(big.NewInt(6), big.NewInt(3), nil)
	assert.Equal(t, cube.String(), new(big.Float).SetFloat64(math.Pow(6, 3)).Text('f', 0))
}

// TestConstantSpread checks the premise of the spread rule: the standard
// deviation of constant data is exactly 0 in exact arithmetic (math/big at
// 200 bits here), but in float64 the mean of three readings of 0.1 rounds
// to 0.10000000000000002 (each addition rounds, IEEE 754-2019 §4.3), so
// the spread is a few ulps of the data, not 0, while readings that sum
// exactly (whole numbers) give an exact 0.
func TestConstantSpread(t *testing.T) {
	spread := func(xs []float64) float64 {
		m := 0.0
		for _, x := range xs {
			m += x
		}
		m /= float64(len(xs))
		s := 0.0
		for _, x := range xs {
			s += (x - m) * (x - m)
		}
		return math.Sqrt(s / float64(len(xs)))
	}
	exact := func(xs []float64) *big.Float {
		m := new(big.Float).SetPrec(200)
		for _, x := range xs {
			m.Add(m, big.NewFloat(x))
		}
		m.Quo(m, big.NewFloat(float64(len(xs))))
		s := new(big.Float).SetPrec(200)
		for _, x := range xs {
			d := new(big.Float).SetPrec(200).Sub(big.NewFloat(x), m)
			s.Add(s, d.Mul(d, d))
		}
		return s
	}
	tenths := []float64{0.1, 0.1, 0.1}
	assert.Zero(t, exact(tenths).Sign(), "exact spread of constant data")
	sd := spread(tenths)
	assert.NotZero(t, sd, "float64 spread of three readings of 0.1")
	assert.Less(t, sd, 4*0x1p-53*0.1, "a few ulps of the data")
	assert.Zero(t, spread([]float64{5, 5, 5}), "whole readings sum exactly")
}

// TestCauseInState checks pins of values a getter reads from a field: the
// field holds what the package stored there, so a fusable product in a
// store (IEEE 754-2019 §5.4.1) is a cause of the read, also through bits
// kept atomically and behind an interface a constructor makes in sight; a
// mean built by correctly rounded steps (IEEE 754-2019 §4.3) and a value
// of a type out of sight are left alone.
func TestCauseInState(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "example.com/gauge")
}

// TestRangeQuotient checks the example the steps category gives: binary64
// 0.3 over binary64 0.1, correctly rounded (IEEE 754-2019 §4.3), is below
// 3. The quotient is taken at 200 bits with math/big and rounded to 53.
func TestRangeQuotient(t *testing.T) {
	exact := new(big.Float).SetPrec(200).Quo(big.NewFloat(0.3), big.NewFloat(0.1))
	q, _ := new(big.Float).SetPrec(53).SetMode(big.ToNearestEven).Set(exact).Float64()
	assert.Equal(t, 2.9999999999999996, q)
	assert.Equal(t, 2, int(q)+0, "the range 0 to 0.3 by 0.1 counts 2 whole steps")
}

// TestCrossAcrossPackages checks that a cross product of another package's
// plane vectors (its shape learned from the body, package vecshape) is a
// difference of computed values whose exact zero is a residue's
// (Goldberg 1991, Thm 11: the difference is exact, the products are not),
// and that a zero test guarding a division stays alone.
func TestCrossAcrossPackages(t *testing.T) {
	analysistest.Run(t, analysistest.TestData(), exacteq.Analyzer, "example.com/plane/clip")
}

// TestCancellingStencil checks the residue the either-sign rule rests on:
// the nine weights of a 3×3 edge stencil, -0.1 around a centre of 0.8,
// sum to exactly 0 as stored (float64(0.8) is 8·float64(0.1), scaled by a
// power of two; math/big at 200 bits), yet summed row by row in float64
// they give 2^-55 ≈ 2.8e-17 (IEEE 754-2019 binary64, round to nearest), so
// a test sum != 0 takes the branch that divides by the residue.
func TestCancellingStencil(t *testing.T) {
	w := []float64{-0.1, -0.1, -0.1, -0.1, 0.8, -0.1, -0.1, -0.1, -0.1}
	exact := new(big.Float).SetPrec(200)
	sum := 0.0
	for _, x := range w {
		exact.Add(exact, big.NewFloat(x))
		sum += x
	}
	assert.Equal(t, 0, exact.Sign())
	assert.Equal(t, math.Ldexp(1, -55), sum)
}
