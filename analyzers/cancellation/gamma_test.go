package cancellation_test

import (
	"math"
	"testing"
)

// TestGammaMomentsLoss checks the numbers the moments rule quotes: the
// variance factor Γ(1+2/K) - Γ(1+1/K)² is about (π²/6)/K², and the plain
// difference loses about 2·log10(K) digits. The reference is the series
// ln Γ(1+z) = -γz + Σ_{k>=2} (-1)^k ζ(k) z^k/k (Abramowitz and Stegun
// 6.1.33, from memory), whose γ terms cancel in ln Γ(1+2z) - 2 ln Γ(1+z),
// so the difference is Γ(1+z)²·expm1(Σ (-1)^k ζ(k)(2^k-2) z^k/k) with no
// cancellation; ζ(3), ζ(5), ζ(6) to 17 digits from memory.
func TestGammaMomentsLoss(t *testing.T) {
	zeta := []float64{0, 0, math.Pi * math.Pi / 6, 1.2020569031595942, math.Pow(math.Pi, 4) / 90, 1.0369277551433699, 1.0173430619844491}
	for _, tc := range []struct{ k, minErr, maxErr float64 }{
		{1e4, 1e-9, 1e-6},       // about 8 digits lost
		{1e8, 0.5, math.Inf(1)}, // none left
	} {
		z, d := 1/tc.k, 0.0
		for k := 2; k < len(zeta); k++ {
			d += math.Pow(-1, float64(k)) * zeta[k] * (math.Pow(2, float64(k)) - 2) * math.Pow(z, float64(k)) / float64(k)
		}
		ref := math.Pow(math.Gamma(1+z), 2) * math.Expm1(d)
		if r := ref * tc.k * tc.k / zeta[2]; math.Abs(r-1) > 10/tc.k {
			t.Errorf("K = %g: variance factor %g is not about (π²/6)/K² (ratio %g)", tc.k, ref, r)
		}
		plain := math.Gamma(1+2/tc.k) - math.Pow(math.Gamma(1+1/tc.k), 2)
		if e := math.Abs(plain-ref) / ref; e < tc.minErr || e > tc.maxErr {
			t.Errorf("K = %g: relative error %g of the plain difference, want in [%g, %g]", tc.k, e, tc.minErr, tc.maxErr)
		}
	}
}

// TestLgammaRatioLoss checks the absolute error the gammaratio rule quotes,
// about u·x·ln x: log Γ(n+1) - log Γ(n-2) against log n + log(n-1) +
// log(n-2), the same value by Γ(x+1) = x·Γ(x) (Abramowitz and Stegun
// 6.1.15), whose three logarithms are each within an ulp.
func TestLgammaRatioLoss(t *testing.T) {
	const u = 0x1p-53
	for _, n := range []float64{1e9, 1e12} {
		a, _ := math.Lgamma(n + 1)
		c, _ := math.Lgamma(n - 2)
		ref := math.Log(n) + math.Log(n-1) + math.Log(n-2)
		want := u * n * math.Log(n)
		if e := math.Abs(a - c - ref); e < want/10 || e > 10*want {
			t.Errorf("n = %g: absolute error %g, want within a factor 10 of u·n·ln n = %g", n, e, want)
		}
	}
}

// TestLogOfRatioLoss checks the loss the log-of-ratio rule quotes:
// log(cos a / cos b) for a = b + 1e-9 against its Taylor series at b,
// -d·tan b - d²/(2cos²b) (ln cos has derivative -tan and second
// derivative -sec²; the next term is d³-small, 1e-18 relative), and the
// form the message recommends, log1p of a difference in closed form
// (cos a - cos b = -2·sin((a+b)/2)·sin((a-b)/2), a-b exact by Sterbenz).
func TestLogOfRatioLoss(t *testing.T) {
	b := 0.7
	a := b + 1e-9
	d := a - b
	ref := -d*math.Tan(b) - d*d/(2*math.Cos(b)*math.Cos(b))
	plain := math.Log(math.Cos(a) / math.Cos(b))
	closed := math.Log1p(-2 * math.Sin((a+b)/2) * math.Sin((a-b)/2) / math.Cos(b))
	if e := math.Abs(plain-ref) / math.Abs(ref); e < 1e-10 {
		t.Errorf("plain log of the ratio: relative error %g, want the loss of about 7 digits", e)
	}
	if e := math.Abs(closed-ref) / math.Abs(ref); e > 1e-14 {
		t.Errorf("closed form: relative error %g, want within 1e-14", e)
	}
}
