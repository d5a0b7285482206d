// Package turn is internal: only its module calls it.
package turn

import "math"

// Wrap is exported, but only this module can import it.
func Wrap(p float64) float64 {
	for p < 0 { // the module's own callers
		p += 2 * math.Pi
	}
	return p
}
