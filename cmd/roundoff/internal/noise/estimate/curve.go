package estimate

import "math"

// Point is one step of the error-against-step curve: the forward and
// central difference estimates of φ'(0) and their distance from the best
// estimate.
type Point struct {
	H            float64 `json:"h"`
	Forward      float64 `json:"forward"`
	Central      float64 `json:"central"`
	ForwardError float64 `json:"forward_error"`
	CentralError float64 `json:"central_error"`
}

// Steps returns the steps of the curve: from 1e-1 down to 1e-15 times
// scale, perDecade to a decade.
func Steps(scale float64, perDecade int) []float64 {
	var hs []float64
	for i := 0; i <= 14*perDecade; i++ {
		hs = append(hs, scale*math.Pow(10, -1-float64(i)/float64(perDecade)))
	}
	return hs
}

// Best returns the best estimate of φ'(0) the noise allows: the
// fourth-order central difference (8(φ(h)−φ(−h)) − (φ(2h)−φ(−2h)))/(12h),
// whose truncation error is O(h⁴), at h = (noise/|φ(0)|)^(1/5)·scale, the
// step that balances it against noise for a function of unit scale
// (Numerical Recipes 3rd ed. §5.7: a formula of error order n wants a step
// of order eps_f^(1/(n+1))). Where that step leaves the function's domain
// (a value is not finite), it takes steps 4 times smaller, at most 8 times.
func Best(l Line, f0, noise, scale float64) (float64, error) {
	h := math.Pow(noise/max(math.Abs(f0), noise), 0.2) * scale
	d := math.NaN()
	for i := 0; i < 8 && !finite(d); i, h = i+1, h/4 {
		hs := l.snap(h)
		v, err := l.Eval([]float64{hs, -hs, 2 * hs, -2 * hs})
		if err != nil {
			return 0, err
		}
		d = (8*(v[0]-v[1]) - (v[2] - v[3])) / (12 * hs)
	}
	return d, nil
}

// Curve evaluates the forward and central differences of φ at 0 at each
// step and compares them with best. Steps where a value is not finite
// (out of the function's domain) are left out.
func Curve(l Line, f0, best float64, steps []float64) ([]Point, error) {
	var ts, hs []float64
	for _, h := range steps {
		if h = l.snap(h); h != 0 { // a step absorbed by x gives no quotient
			hs = append(hs, h)
			ts = append(ts, h, -h)
		}
	}
	vs, err := l.Eval(ts)
	if err != nil {
		return nil, err
	}
	var pts []Point
	for i, h := range hs {
		fwd := (vs[2*i] - f0) / h
		cen := (vs[2*i] - vs[2*i+1]) / (2 * h)
		if finite(fwd) && finite(cen) {
			pts = append(pts, Point{H: h, Forward: fwd, Central: cen, ForwardError: math.Abs(fwd - best), CentralError: math.Abs(cen - best)})
		}
	}
	return pts, nil
}
