package assay

import (
	"testing"

	"gopkg.in/check.v1"
)

type suite struct{}

// A pin through gocheck's Equals: the entropy is a sum of products of
// logarithms, whose last bits depend on the platform (fused multiply-add,
// the math library); reported as a pin.
func (suite) TestEntropy(c *check.C) {
	c.Assert(Entropy([]float64{0.1, 0.2, 0.7}), check.Equals, 1.1567796494470395) // want `check.Equals pins a computed result to 1.1567796494470395`
}

// The same pin read from a table of cases, with a comment after the
// expected value.
func (suite) TestEntropyTable(c *check.C) {
	for i, tc := range []struct {
		freqs []float64
		want  float64
	}{
		{nil, 0},
		{[]float64{0.1, 0.9}, 0.4689955935892812},
	} {
		h := Entropy(tc.freqs)
		c.Check(h, check.Equals, tc.want, check.Commentf("case %d", i)) // want `check.Equals pins a computed result to 0.4689955935892812`
	}
}

// A count compared with Equals is exact: left alone.
func (suite) TestCount(c *check.C) {
	c.Check(Count([]string{"a", "c", "g"}), check.Equals, 3.0)
}

func TestSuite(t *testing.T) {}
