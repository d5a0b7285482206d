package compose

import "testing"

// A table-driven test: the tolerance reaches refine through a field of
// the table's struct, which is learned; the constants of the cases are left
// alone, since each runs on the one problem of its case.
func TestRefine(t *testing.T) {
	for _, tc := range []struct {
		name string
		tol  float64 // want tol:"an absolute x-tolerance of a minimization in refine"
	}{
		{"loose", 1e-6},
		{"tight", 1e-14}, // a test case: run on its one problem
	} {
		got := refine(func(x float64) float64 { return (x - 0.5) * (x - 0.5) }, 0, 1, tc.tol)
		if got < 0.4 || got > 0.6 {
			t.Errorf("%s: got %g", tc.name, got)
		}
	}
}
