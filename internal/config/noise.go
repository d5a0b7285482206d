package config

import (
	"errors"
	"fmt"
	"math"
	"strconv"

	"roundoff/internal/numeric"
)

// ParseNoise reads a noise level, the relative accuracy of a function's
// results, for a function computing in format f. It is the one check
// that the configuration file, the //roundoff:noise directive and the
// limits calculator share: a level lies below 1 (1 would mean no correct
// digit) and at or above the unit roundoff of f, the relative error of a
// single correctly rounded operation (IEEE 754-2019 §4.3), which no
// computed value beats.
func ParseNoise(text string, f numeric.Format) (float64, error) {
	v, err := strconv.ParseFloat(text, 64)
	switch {
	case err != nil && !errors.Is(err, strconv.ErrRange) || math.IsNaN(v):
		return 0, errors.New("not a number; a noise level is a relative accuracy such as 1e-6")
	case v < 0 || v >= 1:
		return 0, fmt.Errorf("not a relative accuracy between the unit roundoff of %s (%.3g) and 1, such as 1e-6", f.Name, f.U)
	case v < f.U:
		return 0, fmt.Errorf("below the unit roundoff of %s (%.3g): no computed %[1]s value is that accurate", f.Name, f.U)
	}
	return v, nil
}
