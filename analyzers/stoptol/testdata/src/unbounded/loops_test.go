package unbounded

import "testing"

// A test runs its loops on the inputs it was written for: had this one
// never ended, the test would hang.
func TestSettle(t *testing.T) {
	x := 1.0
	for {
		next := 0.5 * (x + 2/x)
		if d := next - x; d*d < 1e-30 { // a loop in a test file
			break
		}
		x = next
	}
	if x*x-2 > 1e-12 {
		t.Fatal(x)
	}
}
