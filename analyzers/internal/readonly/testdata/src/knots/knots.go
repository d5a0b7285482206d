// Package knots is an invented spline library for a kiln's temperature
// profile: knots are the hours of the firing, values the set points.
package knots

import "fmt"

// Span reads its knots only: their count, two elements and a range.
func Span(hours []float64) float64 { // want Span:`reads only \[0\]`
	total := 0.0
	for _, h := range hours {
		total += h
	}
	if len(hours) == 0 || hours == nil {
		return 0
	}
	return hours[len(hours)-1] - hours[0] + 0*total
}

// Keep copies the knots it is given and formats them.
func (p *Profile) Keep(hours, temps []float64) error { // want Keep:`reads only \[0 1\]`
	p.hours = append(p.hours[:0], hours...)
	p.temps = make([]float64, len(temps))
	copy(p.temps, temps)
	if !Rising(hours) {
		return fmt.Errorf("hours %v do not rise", hours)
	}
	return nil
}

// Profile holds a copy of its knots.
type Profile struct{ hours, temps []float64 }

// Rising reads its argument through a helper that reads it.
func Rising(hours []float64) bool { // want Rising:`reads only \[0\]`
	return Span(hours) > 0
}

// Shift stores into its knots: not read-only.
func Shift(hours []float64, by float64) {
	for i := range hours {
		hours[i] += by
	}
}

// Hold keeps its knots by reference, which another call may change.
func (p *Profile) Hold(hours []float64) {
	p.hours = hours
}

// Grow appends to its knots in place, which may write their backing array.
func Grow(hours []float64) []float64 {
	return append(hours, 24)
}

// Tail slices them: the sub-slice may be written elsewhere.
func Tail(hours []float64) []float64 {
	return hours[1:]
}

// Retime hands them to a function that stores into them.
func Retime(hours []float64) {
	Shift(hours, 0.5)
}

// Count reads them, but through a recursion, which is not followed: a
// parameter handed on to a function still being read counts as changed.
func Count(hours []float64, n int) int {
	if n >= len(hours) {
		return n
	}
	return Count(hours, n+1)
}
