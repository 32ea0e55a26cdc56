package optimise

import "math"

// roundTo rounds v to the given number of decimals, for messages.
func roundTo(v float64, decimals int) float64 {
	f := math.Pow(10, float64(decimals))
	return math.Round(v*f) / f
}
