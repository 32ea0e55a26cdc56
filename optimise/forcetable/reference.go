package forcetable

import "strings"

// Reference returns the users' description of a forces table, a section in the style of the
// job-file reference (`spanbreak help job-file`), ending in a newline.
func Reference() string { return strings.TrimLeft(reference, "\n") }

const reference = `
FORCES TABLE (forces.file)

  A job may take the member's internal forces from another analysis instead of from its
  cases and combinations: forces: {file: PATH}, PATH relative to the folder of the job file.
  The splices are then placed and designed from the table's envelopes. The file is a CSV
  table: cells separated by commas, UTF-8 text (a byte-order mark is allowed), lines ending
  in LF or CRLF, any cell may be quoted ("..." with "" for a quote inside). The first row is
  the header; its column names say the unit. Rows whose cells are all empty are skipped. The
  table is one of two shapes, told from the header; columns may come in any order.

  Signs         As in the job file: x from the left end of the member, bending moment
                positive when sagging, shear V = dM/dx, axial force positive in tension,
                deflection positive downward.
  Stations      The stations must cover the whole member, from x = 0 to its length L, each
                end within 1 mm, and lie on it. x is read to 0.000001 m (0.001 mm). A jump
                (at a support, a point load or a point moment) is two rows at the same x: the
                value just left of x, then the value just right.
  Between       Values are exact only at the stations; between two stations they are taken
                as linear, so give a station at every support, load point and peak, and
                enough between them for the curvature of the moment diagram. At a station
                that is a jump, a splice is designed for the worse of the two sides.
  Numbers       Decimal only, with a point (12.5, -3e2): no thousands separators, no NaN or
                infinity, at most 1e12 in magnitude.
  Text          A name beginning with =, +, -, @, a tab, a carriage return or an apostrophe
                may carry one leading apostrophe (spanbreak writes it so that a spreadsheet
                does not take the name for a formula); it is not part of the name.
  Limits        At most 4 MiB, 1,000,000 data rows and 1,000 combinations.
  Problems      Every problem is reported at once (up to 100) as FILE:LINE:COLUMN: NAME:
                message, LINE being the line in the file and COLUMN the column's number
                in the table (1 for the first), NAME the column's name.

ENVELOPE TABLE

  One row per station with the extremes over all combinations, exactly what
  "spanbreak analyse JOB.yaml --format csv" writes, so an exported envelope imports back
  unchanged. Stations ascend.

  x_m                       position [m]                                    required
  side                      left or right: which side of x the row gives    optional
  uls_M_max_kNm, uls_M_min_kNm   ULS bending moment, max and min [kNm]      required
  uls_V_max_kN,  uls_V_min_kN    ULS shear, max and min [kN]                required
  uls_N_max_kN,  uls_N_min_kN    ULS axial force, max and min [kN]          required
  sls_M_max_kNm, sls_M_min_kNm   SLS bending moment [kNm]                   optional pair
  sls_V_max_kN,  sls_V_min_kN    SLS shear [kN]                             optional pair
  sls_N_max_kN,  sls_N_min_kN    SLS axial force [kN]                       optional pair
  sls_w_max_mm,  sls_w_min_mm    SLS deflection [mm]                        optional pair
  uls_M_max_governing, uls_M_min_governing, uls_V_max_governing, uls_V_min_governing,
  uls_N_max_governing, uls_N_min_governing, sls_M_max_governing, sls_M_min_governing,
  sls_V_max_governing, sls_V_min_governing, sls_N_max_governing, sls_N_min_governing,
  sls_w_max_governing, sls_w_min_governing
                            the combination that gives the value, shown in the report
                            as written; optional, each with its value column; a cell
                            may be empty

  An SLS quantity is given by both its columns or by neither; a maximum must not be below its
  minimum. Without a side column, the first of two rows at one x is the left side and the
  second the right; with it, such a pair must read left, then right.

PER-COMBINATION TABLE

  One row per station and combination, rows in any order: for example the member results of a
  frame analysis, one block per combination. The envelopes are built from it, each extreme
  keeping the name of the combination that gives it.

  x_m          position [m]                                                 required
  combination  the combination's name, as the report shows it               required
  state        ULS or SLS (any letter case)                                 required
  M_kNm        bending moment [kNm]                                         required
  V_kN         shear [kN]                                                   required
  N_kN         axial force [kN]                                             required
  w_mm         deflection [mm]; needed in every SLS row when the column is  optional
               there, may be empty in a ULS row (where it is not used)

  A combination belongs to one limit state. Within a combination, the first row at an x is
  the left side of a jump and the second the right; a third is an error. Every combination
  must cover the member on its own, but the combinations need not share stations, and the
  SLS ones need not have the stations of the ULS ones: each combination is taken as linear
  between its own stations, at every station of the table, and the envelopes are the largest
  and smallest of those values (the worse side of every jump any combination has).

WHAT THE SPLICE NEEDS

  The ULS bending moment, shear and axial force are always needed. A category B splice is
  checked for slip at SLS (EN 1993-1-8 Table 3.2 and 3.9): its table must give the SLS
  bending moment, shear and axial force (in an envelope table, the sls_M, sls_V and sls_N
  pairs; in a per-combination table, SLS rows). A deflection limit needs the SLS deflection
  (sls_w pair, or w_mm). The report names the file and its SHA-256 hash.
`
