// Package jobfile reads spanbreak's input files — the job file and the fixed-splice file of
// DESIGN.md section 8 — into plain data structs, strictly, reporting every problem of a file
// in one pass with its file, line, column and key path.
//
// # Decoding
//
// Decode parses one YAML document with go.yaml.in/yaml/v3 into a yaml.Node tree and walks it
// into a struct by the fields' `yaml:"name"` tags (`yaml:"name,required"` for a key that must
// be present). Unknown keys (with the allowed keys and a did-you-mean), wrong types, duplicate
// keys, NaN and infinities, hexadecimal or octal numbers, merge keys and non-standard tags are
// problems. Aliases are rejected wherever they appear and the tree is never expanded, so an
// alias bomb costs no more than its size; input over MaxFileSize (4 MiB) is refused before
// parsing. Types that read themselves implement NodeDecoder; Map keeps a mapping's order and
// key positions.
//
// # Units
//
// Unit-bearing values take a bare number in the field's documented unit or a string with a
// unit ("7.2 m", "7200 mm", "25 kN/m", "180 kNm", "2.5 t"); a wrong dimension or an unknown
// unit is a problem. The value types hold the internal unit of spanbreak — mm, N, N·mm, N/mm,
// kg — and their names say the unit of a bare number in the file:
//
//	type              bare number  held in  units a string may carry
//	Metres            m            mm       m, cm, mm
//	Millimetres       mm           mm       m, cm, mm
//	KiloNewtons       kN           N        kN, N, MN
//	KiloNewtonMetres  kNm          N·mm     kNm, Nm, Nmm, kNmm, MNm ("kN·m", "kN m" too)
//	LineLoad          kN/m         N/mm     kN/m, N/mm, N/m, kN/mm, MN/m
//	Stiffness         kN/m         N/mm     as LineLoad (a spring's force per deflection)
//	Kilograms         kg           kg       kg, t
//
// Read them with MM, N, NMM, NPerMM or KG; a conversion like float64(Metres) gives mm, not m.
//
// # Signs
//
// As in the job file: x from the left end of the beam; transverse loads positive downward,
// point moments positive clockwise, axial forces positive along +x. The package does not
// change signs.
//
// # Checks
//
// LoadJob and LoadSpliceFile add the checks that need no analysis: required keys, counts
// (one support per span end), ranges (spans > 0, positions on the beam, from < to, ψ in
// [0, 1], no negative limits or rates), allowed values, references between blocks (case
// names in combinations, bolt sizes in the costs) and overlapping keep-out ranges. The
// beam's geometry and loads must also lie in their plausible ranges (PlausibleRanges: spans
// 0.1 m to 200 m, a beam of at most 1 km, line loads up to 10 000 kN/m...), each refused at
// its own key; within them no product of the analysis can overflow, and a number that
// overflows on reading (1e306 m in mm) is refused where it is written. So are the limits of
// the sizing and the scan — plates 4 to 100 mm, a gap of at most 50 mm, lists of at most 100
// entries, at most MaxCandidates scan positions — and the lengths of titles and names, so
// that a file check accepts is one optimise runs. Section
// and grade names are not looked up here: the caller does that and may add its problems to
// the same list through each struct's Meta (Meta.Where gives the location of any key below
// it) and Problems.Add. List indices in key paths count from 0.
//
// # References
//
// The allowed values follow the standards they come from: imposed-load categories A to H and
// the snow rows of EN 1990 Table A1.1; γ and ξ overrides of EN 1990 Table A1.2(B) and
// expression (6.10b); bolt classes of EN 1993-1-8 Table 3.1, splice categories of Table 3.2,
// and 3.1.2 (only 8.8 and 10.9 may be preloaded, as categories B and C need); friction
// classes A to D and normal or oversize holes of EN 1090-2. Unit factors are the SI prefixes.
//
// # Errors
//
// Everything a file can cause is a returned Problems (which implements error, one line
// "file:line:col: path: message" per problem, sorted by position); the decoder never panics on
// input. Panics are kept for programmer error: decoding into something other than a pointer
// to a struct, or a schema field without a yaml tag. The package never prints.
package jobfile
