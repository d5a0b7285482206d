package idioms

import "math"

// Ranges known from the conditions around a form, or from every call of
// its function, keep the small-argument forms away from the argument
// where they lose digits.

// dampedTail takes 1 - 2^-(1-s) only once s <= -19, where the power is at
// most 2^-20: nothing near 1 to lose.
func dampedTail(s float64) float64 {
	if s > -19 {
		return 0
	}
	return 1 - math.Pow(2, -(1-s))
}

// largeOrder is called only past s >= 15 (orderSum), so 3^-s is below
// 7e-8 there.
func largeOrder(s float64) float64 {
	return 1 / (1 - math.Pow(3, -s))
}

func OrderSum(s float64) float64 {
	if s <= 5 {
		return 0
	} else if s < 15 {
		return 1
	}
	return largeOrder(s) + largeOrder(2*s)
}

// HalfRatio uses a series where x*x is small and the logarithm only where
// |x| >= 0.05, which loses at most 1.3 digits.
func HalfRatio(x float64) float64 {
	if x*x < 0.0025 {
		return x + x*x*x/3
	} else if x < 1 {
		return 0.5 * math.Log((1+x)/(1-x))
	}
	return math.Inf(1)
}

// SoftStep takes log(1+e^y) only for y in [-4, 10): no overflow, and e^y
// at least 0.018.
func SoftStep(y float64) float64 {
	if y < -4 {
		return math.Exp(y)
	} else if y < 10 {
		return math.Log(1 + math.Exp(y))
	}
	return y
}

// Sag takes 1 - cos(t) only for |t| >= 0.5, where it loses under a digit.
func Sag(t float64) float64 {
	if math.Abs(t) < 0.5 {
		return t * t / 2
	}
	return 1 - math.Cos(t)
}

// narrow is called with sines scaled by 0.9, so |x| <= 0.9 and
// 1/(1-x²) <= 5.3.
func narrow(x float64) float64 {
	return math.Sqrt(1 - x*x)
}

func Chord(t float64) float64 {
	return narrow(0.9 * math.Sin(t))
}

// GrowthRate takes log(1+x) through the rounded sum and divides by what
// the sum rounded x to: log(w)/(w-1) varies slowly near 1, so the
// product recovers log(1+x) to a few ulps (Goldberg 1991, Theorem 4).
func GrowthRate(x float64) float64 {
	w := 1 + x
	d := w - 1
	if d == 0 {
		return x
	}
	return x * math.Log(w) / d
}

// Stretch takes sec(t) - 1 only for |t| >= 0.5, where it loses under a
// digit.
func Stretch(t float64) float64 {
	if math.Abs(t) < 0.5 {
		return t * t / 2
	}
	return 1/math.Cos(t) - 1
}

// Reduced squares a sine ratio that is computed on one branch and exactly
// 1 on the other: there both forms of 1 - s² are exact, and on the
// computed branch s carries its own rounding, which (1-s)*(1+s) keeps.
func Reduced(s0, sx, sy float64) float64 {
	var s float64
	if sy == 0 {
		s = 1
	} else {
		s = s0 * sx / sy
	}
	return math.Sqrt(1 - s*s)
}

// olverTerm is called only with z = x/nu for positive x and nu, so z is
// not negative, and its branch keeps z below 0.98: 1 - z² is at least
// 0.0396, a loss of 1.4 digits at most.
func olverTerm(z float64) float64 {
	if z < 0.98 {
		return 1 / math.Sqrt(1-z*z)
	}
	return 0
}

func Zone(x, nu float64) float64 {
	if x <= 0 || nu <= 0 {
		return 0
	}
	z := x / nu
	return olverTerm(z)
}
