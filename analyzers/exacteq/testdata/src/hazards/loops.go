package hazards

import "math"

func loopUp() int {
	n := 0
	for x := 0.0; x != 1; x += 0.1 { // want `float loop variable x goes from 0 in steps of 0.1 and never equals 1 \(it passes from 0.9999999999999999 to 1.0999999999999999\), so the loop never stops`
		n++
	}
	return n
}

func loopDown() int {
	n := 0
	for x := 1.0; x != 0; x -= 0.1 { // want `float loop variable x goes from 1 in steps of -0.1 and never equals 0`
		n++
	}
	return n
}

func loopRight() int {
	n := 0
	for x := 0.0; 0.3 != x; x += 0.1 { // want `float loop variable x goes from 0 in steps of 0.1 and never equals 0.3`
		n++
	}
	return n
}

func loopGlobal() int {
	n := 0
	for x := 0.0; x != 2; x += step { // want `float loop variable x goes from 0 in steps of 0.1 and never equals 2`
		n++
	}
	return n
}

func loop32() int {
	n := 0
	for x := float32(0); x != 1; x += 0.1 { // want `float loop variable x goes from 0 in steps of 0.1 and never equals 1 \(it passes from 0.9000001 to 1.0000001\)`
		n++
	}
	return n
}

func loopUnknown(a, b, h float64) int {
	n := 0
	for x := a; x != b; x += h { // want `float loop variable x is tested with != against b but changes by rounded arithmetic and may step over it, so the loop may never stop`
		n++
	}
	return n
}

func loopAnd(limit int) int {
	n := 0
	for x := 0.5; x != 3.3 && n < limit; x *= 1.1 { // want `float loop variable x is tested with != against 3.3`
		n++
	}
	return n
}

func loopPlainAssign() int {
	n := 0
	for x := 0.0; x != 1; x = x + 0.1 { // want `float loop variable x goes from 0 in steps of 0.1 and never equals 1`
		n++
	}
	return n
}

func loopTimes() int {
	n := 0
	for x := 1.0; x != 2; x *= 1.1 { // want `float loop variable x is tested with != against 2 but changes by rounded arithmetic and may step over it, so the loop may never stop; stop with an ordered test instead`
		n++
	}
	return n
}

// A search for an upper bracket stepping by a constant toward infinity: the
// step is absorbed once x reaches 2^53 times it, short of +Inf, so x never
// equals the bound and the loop runs forever where f stays below y.
func bracketFlat(f func(float64) float64, y float64) float64 {
	top := math.Inf(1)
	x := 0.0
	for x != top && f(x) < y { // want `float loop variable x is tested with != against top but changes by rounded arithmetic and may step over it`
		x += 1
	}
	return x
}
