package encode

import "runtime/debug"

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
