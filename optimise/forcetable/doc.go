// Package forcetable reads the internal forces of a member from a CSV table written by another
// analysis (or by spanbreak's own `analyse --format csv`), checks it as strictly as a job file,
// and turns it into the ULS and SLS envelopes from which splices are placed and designed; it
// also writes such tables, so an exported envelope imports back unchanged.
//
// # Two shapes
//
// The shape is told from the header row (Reference gives the full text for users):
//
//   - The envelope table, one row per station: x_m, side, then the ULS extremes
//     uls_M_max_kNm, uls_M_min_kNm, uls_V_max_kN, uls_V_min_kN, uls_N_max_kN, uls_N_min_kN,
//     the optional SLS pairs sls_M_*, sls_V_*, sls_N_* and sls_w_* (deflection), and an optional
//     governing column for each extreme (uls_M_max_governing, …). EnvelopeColumns lists them in
//     the order WriteEnvelopes writes them.
//   - The per-combination table, one row per station and combination, in any order:
//     x_m, combination, state (ULS or SLS), M_kNm, V_kN, N_kN and optionally w_mm. The
//     envelopes are built from it, each extreme keeping the name of its combination.
//
// # Units and signs
//
// The file is in m, kN, kNm and mm (the unit is part of each column name); the Table holds
// N, mm and N·mm like the rest of spanbreak. Signs are those of DESIGN.md section 3: x from the
// left end of the member, bending moment sagging positive, V = dM/dx, axial force tension
// positive, deflection downward positive.
//
// # Stations, jumps and interpolation
//
// A jump (support, point load, point moment) is two rows at one x: the value just left of x,
// then the value just right. Values are exact only at the stations; between them they are taken
// as linear. For the per-combination table every combination is interpolated linearly between
// its own stations onto the union of all stations, and the envelope is taken there; since the
// maximum of linear functions is convex (the minimum concave), interpolating the envelope
// between those stations never lies on the unsafe side of the interpolated combinations.
// Table.At gives the design forces at any x with the same rule, the worse side at a jump, in
// the pairing of DESIGN.md section 5 (M_max, M_min, the largest |V|, N_max, N_min).
//
// # Checks
//
// Read reports every problem of a file at once (at most 100, like job files), each with the
// file, the 1-based line in the file and the 1-based column of the table with its name: the
// problems are jobfile.Problems, Line being the line and Column the column's index (not a
// character offset), Path the column's name. It checks the size (jobfile.MaxFileSize, the
// limit of job files, and MaxRows rows), UTF-8, the header (unknown, missing, duplicate and
// unpaired columns, a header of neither shape), every cell (decimal numbers only, finite and
// below MaxMagnitude), the order of the stations and the sides at a jump, that the stations
// cover the member [0, L] within CoverTolerance, that a combination keeps one limit state, and
// that the SLS forces or the deflection are there when the caller needs them (Options).
//
// # Text cells and spreadsheets
//
// A text cell (a governing or combination name) that begins with =, +, -, @, a tab, a carriage
// return or an apostrophe is written with a leading apostrophe, so a spreadsheet never takes it
// for a formula; reading strips that one apostrophe again. Numbers are never changed: they are
// written rounded to 1e-6 of their unit, without a negative zero.
//
// # Errors
//
// Everything a file can cause is a returned jobfile.Problems; the package never panics on
// input and never prints. Panics are kept for programmer error: Options.Length not positive,
// or envelopes whose series lengths differ from their stations.
package forcetable
