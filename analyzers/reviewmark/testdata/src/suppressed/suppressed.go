package suppressed

import "math"

// A directive with a reason suppresses the named analyzer on its own line
// and the line below; without a reason, or naming another analyzer, or
// two lines away, it suppresses nothing.

func dosing(flow float64) bool {
	//roundoff:reviewed exacteq the pump reports NaN as its only error value, checked upstream
	return flow == math.NaN()
}

func trailing(flow float64) bool {
	return flow == math.NaN() //roundoff:reviewed exacteq checked upstream, see dosing
}

func listed(flow float64) bool {
	//roundoff:reviewed reviewmark,exacteq checked upstream, see dosing
	return flow == math.NaN()
}

func noReason(flow float64) bool {
	//roundoff:reviewed exacteq
	return flow == math.NaN() // want `comparison with math.NaN\(\) is always false`
}

func otherAnalyzer(flow float64) bool {
	//roundoff:reviewed reviewmark the pump reports NaN on error
	return flow == math.NaN() // want `comparison with math.NaN\(\) is always false`
}

func tooFar(flow float64) bool {
	//roundoff:reviewed exacteq the pump reports NaN on error

	return flow == math.NaN() // want `comparison with math.NaN\(\) is always false`
}
