package hazards

import "math"

func arcCos(x float64) float64 { return math.Acos(x) }
func sine(x float64) float64   { return math.Sin(x) }
func cosine(x float64) float64 { return math.Cos(x) }

// The spherical law of cosines through the package's own wrappers: near
// the centre the argument is within a rounding of 1.
func centralAngle(lat0, lat1, dlon float64) float64 {
	return arcCos(sine(lat0)*sine(lat1) + cosine(lat0)*cosine(lat1)*cosine(dlon)) // want `math.Acos\(x\) loses half the digits where x is near ±1`
}

// The clamp reassigns the cosine before the arc: the value reaching
// math.Acos is still a dot product over norms.
func sweepAngle(ux, uy, vx, vy float64) float64 {
	c := (ux*vx + uy*vy) / math.Sqrt((ux*ux+uy*uy)*(vx*vx+vy*vy))
	c = math.Min(1, math.Max(-1, c))
	return math.Acos(c) // want `math.Acos\(x\) with x = c loses half the digits`
}

// A hull panel's normal, with its length and inner product as methods.
type panel struct{ nx, ny, nz float64 }

func (p panel) inner(q panel) float64 { return p.nx*q.nx + p.ny*q.ny + p.nz*q.nz }
func (p panel) size() float64         { return math.Sqrt(p.inner(p)) }
func (p panel) sizeSq() float64       { return p.nx*p.nx + p.ny*p.ny + p.nz*p.nz }

// The dihedral angle between two panels from norms computed by methods.
func dihedral(p, q panel) float64 {
	return math.Acos(p.inner(q) / (p.size() * q.size())) // want `math.Acos\(x\) with x = p.inner\(q\) / \(p.size\(\) \* q.size\(\)\) loses half the digits`
}

// tilt is the cosine of the angle between two panels, clamped, and 0 for
// a degenerate panel.
func tilt(p, q panel) float64 {
	n := p.sizeSq() * q.sizeSq()
	if n == 0 {
		return 0
	}
	c := p.inner(q) / math.Sqrt(n)
	if c > 1 {
		return 1
	}
	if c < -1 {
		return -1
	}
	return c
}

// The angle from that cosine, through the package's function.
func tiltAngle(p, q panel) float64 {
	return math.Acos(tilt(p, q)) // want `math.Acos\(x\) with x = tilt\(p, q\) loses half the digits`
}

// A bearing change between two headings from their dot product over their
// lengths, unclamped: for parallel headings the rounded ratio can be
// 1 + 2.2e-16, and the arc of that is NaN.
func bearingChange(ax, ay, bx, by float64) float64 {
	return math.Acos((ax*bx + ay*by) / (math.Hypot(ax, ay) * math.Hypot(bx, by))) // want `≈ 1.49e-08 rad, and returns NaN where rounding puts x just beyond ±1 \(clamp it to \[-1, 1\] first\)`
}

// apexAngle is a mast's angle seen from two stays of lengths a and b
// whose feet are c apart: for a slender mast the cosine is within an
// ulp of 1 and the arc loses half its digits, all of them once c/a is
// below about 1.5e-8.
func apexAngle(a, b, c float64) float64 {
	return math.Acos((a*a + b*b - c*c) / (2 * a * b)) // want `math.Acos\(x\) with x = \(a \* a \+ b \* b - c \* c\) / \(2 \* a \* b\) loses half the digits.*for an angle from three sides, use the half-angle form`
}

// sightAngle writes the squares as powers and the sides in another order.
func sightAngle(near, far, gap float64) float64 {
	cos := (math.Pow(near, 2) - math.Pow(gap, 2) + math.Pow(far, 2)) / (2 * far * near)
	return math.Acos(cos) // want `math.Acos\(x\) with x = cos loses half the digits.*half-angle form`
}

// length returns its value through a named result, set once before the
// bare return: the norm all the same.
func (p panel) length() (l float64) {
	l = math.Sqrt(p.sizeSq())
	return
}

// facetAngle is the angle between two panels' normals over norms read
// through a named result.
func facetAngle(p, q panel) float64 {
	return math.Acos(p.inner(q) / (p.length() * q.length())) // want `math.Acos\(x\) with x = p.inner\(q\) / \(p.length\(\) \* q.length\(\)\) loses half the digits`
}
