//go:build winter

package flow

// Icy returns the discharge in winter, with the crest iced over.
func Icy(h float64) float64 { return 0.8 * Crest(h) }
