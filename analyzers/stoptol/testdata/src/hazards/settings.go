package hazards

import "math"

// Search configures a golden-section search.
type Search struct {
	XTol float64 // want XTol:"an absolute x-tolerance of a minimization in Run"
}

// Run searches [a, b] for a minimum of f.
func (s *Search) Run(f func(float64) float64, a, b float64) float64 {
	if s.XTol == 0 {
		s.XTol = 1e-14 // want `1e-14, assigned to field XTol \(an absolute x-tolerance of a minimization in Run\), is too tight: comparing function values locates a minimum only to about sqrt\(eps\)`
	}
	for i := 0; i < 100; i++ {
		c, d := b-invPhi*(b-a), a+invPhi*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if math.Abs(b-a) < s.XTol {
			break
		}
	}
	return a
}

func newSearch() *Search {
	return &Search{XTol: 1e-12} // want `1e-12, set as field XTol \(an absolute x-tolerance of a minimization in Run\), is too tight`
}

// minimizeTo is a golden-section search with a tolerance parameter.
func minimizeTo(f func(float64) float64, a, b, tol float64) float64 { // want minimizeTo:"parameter 3 is an absolute x-tolerance of a minimization in minimizeTo"
	for i := 0; i < 100; i++ {
		c, d := b-invPhi*(b-a), a+invPhi*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if b-a < tol {
			break
		}
	}
	return a
}

func callMinimize(f func(float64) float64) float64 {
	return minimizeTo(f, 0, 1, 1e-14) // want `1e-14, passed as tol to minimizeTo \(an absolute x-tolerance of a minimization in minimizeTo\), is too tight`
}

func checkGradient(grad []float64, gradThresh float64) bool { // want checkGradient:"parameter 1 is a gradient-norm threshold in checkGradient"
	if gradThresh == 0 {
		gradThresh = 1e-12 // the finding stands at the test below, naming this line
	}
	norm := 0.0
	for _, g := range grad {
		norm = math.Max(norm, math.Abs(g))
	}
	gradNorm := norm
	return gradNorm < gradThresh // want `1e-12, given as the default of gradThresh \(a gradient-norm threshold in checkGradient\), ignores the scale of f and may stop a minimization too early or never`
}

func gradientLiteral(gnorm float64) bool {
	return gnorm < 1e-11 // want `absolute gradient-norm threshold 1e-11 ignores the scale of f`
}

// Bracket configures a golden-section search whose loop reads a copy.
type Bracket struct {
	Width float64 // want Width:"an absolute x-tolerance of a minimization in Shrink"
}

// Shrink searches [a, b] for a minimum of f, with a default width.
func (s Bracket) Shrink(f func(float64) float64, a, b float64) float64 {
	width := s.Width
	if width == 0 {
		width = 1e-6
	}
	for i := 0; i < 100; i++ {
		c, d := b-invPhi*(b-a), a+invPhi*(b-a)
		if f(c) < f(d) {
			b = d
		} else {
			a = c
		}
		if b-a < width {
			break
		}
	}
	return a
}

func narrowBracket() Bracket {
	return Bracket{Width: 1e-13} // want `1e-13, set as field Width \(an absolute x-tolerance of a minimization in Shrink\), is too tight`
}
