//go:build corpus

package main

import (
	"fmt"
	"testing"

	"github.com/stretchr/testify/require"
)

// snippet is invented; each line that must yield candidates is listed in
// TestScan with the kinds LABELING.md §1 defines for it.
const snippet = `package p

import "math"

func f(x, y, tol float64, a, b, n int, g func(float64) float64) float64 {
	const h = 1e-6
	for math.Abs(x-y) > tol {
		x = (x + y) / 2
	}
	if x == 0.1*3 {
		return (g(x+h) - g(x)) / h
	}
	if y < 1e-9 {
		return math.Log(1 + x)
	}
	for i := 0; i < n; i++ {
		if x*y < tol {
			break
		}
	}
	r := math.Sqrt(x*x + y*y)
	d := x + math.Sqrt(x*x+1)
	_ = float64(a / b) + 1/2
	if a == b || i == n {
		return r + d
	}
	return math.Exp(x) - 1
}
`

func TestScan(t *testing.T) {
	got := map[string]bool{}
	rows, err := scan("p.go", []byte(snippet))
	require.NoError(t, err)
	for _, r := range rows {
		got[fmt.Sprintf("%d %s", r.line, r.kind)] = true
	}
	// Expected rows, by the kind definitions of LABELING.md §1.
	want := []string{
		"7 loop-float-exit",  // for condition with math.Abs and a tolerance name
		"7 cmp-small",        // comparison with tol
		"10 eq-float",        // == with a float literal
		"11 diffquot",        // (g(x+h)-g(x))/h
		"13 cmp-small",       // literal 1e-9 below 1e-3
		"14 near-one",        // math.Log(1+x)
		"17 loop-float-exit", // if ... break with a tolerance name
		"17 cmp-small",       // comparison with tol
		"21 sqrt-sumsq",      // math.Sqrt(x*x + y*y)
		"22 near-one",        // x + math.Sqrt(x*x+1)
		"22 sqrt-sumsq",      // x*x+1 is a sum with a square
		"23 intdiv-float",    // float64(a/b) and 1/2
		"27 near-one",        // math.Exp(x) - 1
	}
	for _, w := range want {
		require.True(t, got[w], "missing %q; got %v", w, got)
	}
	// a == b and i == n compare integer-looking names: no eq-float.
	require.False(t, got["24 eq-float"], "integer comparison listed")
	require.Len(t, got, len(want), "unexpected rows: %v", got)
}
