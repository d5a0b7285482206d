package hazards

// shader picks the lightness step of a palette.
type shader interface {
	Grain() (dl, dh float64)
}

type pastel struct{}

func (pastel) Grain() (float64, float64) { return 0.05, 0.25 }

type fine struct{}

func (*fine) Grain() (dl, dh float64) {
	return 0.01, 0.125
}

// lightness walks the lightness from 0 to 1 by the shader's step: with
// fine's 0.01 the hundredth sum is 1.0000000000000007 (with pastel's 0.05
// the twentieth is 1.0000000000000002), past the bound, and the lightest
// shade is never drawn.
func lightness(s shader) int {
	n := 0
	dl, _ := s.Grain()
	for l := 0.0; l <= 1; l += dl { // want `float loop variable l goes from 0 in steps of 0.01 and the test l <= 1 passes 100 times, where exact arithmetic passes 101: the accumulated value 1.0000000000000007`
		n++
	}
	return n
}

// hues walks the hue by a step every shader returns as a power of two:
// the sums are exact, and the loop passes as often as exact arithmetic.
func hues(s shader) int {
	n := 0
	_, dh := s.Grain()
	for h := 0.0; h <= 1; h += dh {
		n++
	}
	return n
}
