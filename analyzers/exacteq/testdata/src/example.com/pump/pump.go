// Package pump evaluates any head curve through an interface.
package pump

// Curve gives the head of a pump at a flow.
type Curve interface {
	Head(q float64) float64
}

// At evaluates c at q.
func At(c Curve, q float64) float64 { return c.Head(q) }

// Sweep evaluates c at every flow, through At.
func Sweep(c Curve, qs []float64) []float64 {
	out := make([]float64, 0, len(qs))
	for _, q := range qs {
		out = append(out, At(c, q))
	}
	return out
}
