package ramp

// SoakDue reports whether heating and soaking together take up the 30%
// share of a firing that the glaze recipe asks for. The file imports
// nothing, so a tolerance fix has to add the import of math.
func SoakDue(heat, soak float64) bool {
	share := heat + soak
	return share == 0.3
}
