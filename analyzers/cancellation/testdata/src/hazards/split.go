package hazards

// A quarter turn split for float64 (the leading part has 23 significant
// bits) used in float32 arithmetic: y*quarterA is exact only for |y| < 2.
const (
	quarterA = 7.85398125648498535156e-1
	quarterB = 3.77489470793079817668e-8
	quarterC = 2.69515142907905952645e-15
)

func octantRemainder(x float32) float32 {
	y := float32(int(x * (4 / 3.14159265)))
	return ((x - y*quarterA) - y*quarterB) - y*quarterC // want `range reduction x - y\*A - y\*B in float32: A = 0.785398126 has 23 significant bits there, so y\*A is exact only for \|y\| < 2`
}

// The float64 bound of the same split (2^29) guards the float32 code.
func guardedRemainder(x float32) float32 {
	if x >= 1<<29 { // want `x >= 1<<29 sends arguments up to 5.37e\+08 to the range reduction x - y\*A - y\*B below, which is exact in float32 only for x below about 1.57`
		return 0
	} else {
		y := float32(int(x * (4 / 3.14159265)))
		return (x - y*quarterA) - y*quarterB // want `range reduction x - y\*A - y\*B in float32`
	}
}
