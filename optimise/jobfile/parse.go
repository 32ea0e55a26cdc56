package jobfile

// ParseMetres reads a length as the job file writes a position or a span: a bare number in
// metres, or a number with a length unit ("9", "9 m", "900 cm", "9000 mm"). It returns the
// length [mm]. NaN, an infinity, a number out of range, an unknown unit or a unit of another
// dimension is an error that says so.
func ParseMetres(s string) (float64, error) {
	return parseQuantity(s, quantity{dimLength, "m", "a length", "9000 mm"})
}

// ParseMillimetres reads a length as the job file writes a size (plates, the gap): a bare
// number in millimetres, or a number with a length unit ("10", "10 mm", "1 cm"). It returns
// the length [mm], with the errors of ParseMetres.
func ParseMillimetres(s string) (float64, error) {
	return parseQuantity(s, quantity{dimLength, "mm", "a size", "10 mm"})
}
