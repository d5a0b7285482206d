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

// cell finds the grid cell of a position from the origin: an index, not a
// count; a position on a cell edge falls on one side by a rounding, as
// any binning rule allows.
func cell(grid []int, x, w float64) {
	grid[int(x/w)]++
}

// nextLine is the first grid line past a position: x/w + 1 of a single
// value may be a grid index, not the points of a span.
func nextLine(x, w float64) float64 {
	return w * float64(int(x/w)+1)
}
