package encode

import "runtime/debug"

// ReactionsNote is printed with every table of support reactions: they come from the STR
// combinations, and holding down needs the EQU set, with other partial factors.
const ReactionsNote = "The ULS reactions are those of the STR combinations (EN 1990 6.10, Table A1.2(B)); " +
	"static equilibrium — uplift, holding-down, overturning — needs the EQU combinations of EN 1990 Table A1.2(A), " +
	"which spanbreak does not form: check them separately."

// Caution is printed with every engineering result.
const Caution = "CAUTION: spanbreak is a design aid. Every result must be verified by a competent engineer; " +
	"national annex values, local codes and licensed practice govern. Static design only: " +
	"no fatigue, seismic, fire or lateral-torsional buckling of the member."

// Version returns the module version the binary was built from, "dev" for a local build.
func Version() string {
	if bi, ok := debug.ReadBuildInfo(); ok && bi.Main.Version != "" && bi.Main.Version != "(devel)" {
		return bi.Main.Version
	}
	return "dev"
}
