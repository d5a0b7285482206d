package idioms

import "math"

// tally puts a reading into a histogram bin: a reading on a bin edge goes
// to one side or the other by a rounding, which no binning rule avoids.
func tally(counts []int, x, lo, w float64) {
	counts[int((x-lo)/w)]++
}

// zone is the 1-based six-degree zone of a longitude: a position on a
// grid, not a span between two ends.
func zone(lon float64) int {
	return int((lon+180)/6) + 1
}

// points rounds the count of steps, which are meant to be whole.
func points(lo, hi, step float64) int {
	return int(math.Round((hi-lo)/step)) + 1
}
