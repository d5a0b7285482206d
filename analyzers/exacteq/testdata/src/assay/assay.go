// Package assay scores sequencing reads.
package assay

import "math"

// Entropy is the Shannon entropy, in bits, of base frequencies.
func Entropy(freqs []float64) float64 {
	h := 0.0
	for _, f := range freqs {
		if f > 0 {
			h -= f * math.Log2(f)
		}
	}
	return h
}

// Count is the number of reads of a run, as a float.
func Count(reads []string) float64 { return float64(len(reads)) }
