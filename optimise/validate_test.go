package optimise

import (
	"errors"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// agreementJob is a small valid job (invented data): two 6 m spans of IPE 300, pieces of at
// most 7 m, a 0.1 m scan. Lines 1 to 5; a row's extra text starts on line 6.
const agreementJob = `title: agreement test (invented)
beam: {section: IPE 300, spans: [6.0, 6.0], supports: [pinned, roller, roller]}
cases: {G: {kind: permanent, loads: [{udl: 10}]}}
limits: {max_piece_length: 7}
scan: {step: 0.1}
`

// checkAndOptimise runs a job as `check` does (Prepare, CheckJob) and as `optimise` does
// (Prepare, Run). It returns check's error, and optimise's unless the run only found no
// layout within the limits (exit status 3, a result and not a refusal of the file).
func checkAndOptimise(t *testing.T, src string) (checkErr, runErr error) {
	t.Helper()
	s, err := Prepare("job.yaml", []byte(src))
	if err != nil {
		return err, err
	}
	if _, checkErr = CheckJob(s); checkErr != nil {
		return checkErr, checkErr
	}
	_, runErr = Run(s, Settings{})
	var inf *InfeasibleError
	if errors.As(runErr, &inf) {
		runErr = nil
	}
	return nil, runErr
}

// Check and optimise agree: every limit the sizing and the scan enforce is checked by check,
// at the entry's own line and key, so a job check accepts is one optimise runs, and one
// optimise refuses is one check refuses with the same located message. Each bad row was
// accepted by check before and refused only by optimise, at "splice:" or without a line.
func TestCheckAndOptimiseAgree(t *testing.T) {
	many := make([]string, 101)
	for i := range many {
		many[i] = strconv.FormatFloat(4+0.5*float64(i), 'f', -1, 64)
	}
	tests := []struct {
		name  string
		src   string
		check string // check's exact message; "" when the job is valid
	}{
		{"a plate thickness past the absolute limit", agreementJob + "splice: {plates: {thicknesses: [10, 250]}}\n",
			"job.yaml:6:37: splice.plates.thicknesses[1]: a plate thickness of 250 mm is outside the plausible range " +
				"(4 mm to 100 mm); check the value and its unit"},
		{"a plate thickness past the plate grade's table", agreementJob + "splice: {plates: {thicknesses: [10, 90]}}\n",
			"job.yaml:6:37: splice.plates.thicknesses[1]: the plate grade has no strength for it: S355: thickness " +
				"t = 90 mm is outside EN 1993-1-1 Table 3.1 (t ≤ 80 mm); choose thinner plates or set " +
				"beam.grade_table: EN10025, whose steps go further"},
		{"the same plate within the product standard's steps",
			strings.Replace(agreementJob, "supports:", "grade_table: EN10025, supports:", 1) +
				"splice: {plates: {thicknesses: [10, 90]}}\n", ""},
		{"a plate grade whose table stops short", agreementJob + "splice: {plates: {grade: S235, thicknesses: [20, 85]}}\n",
			"job.yaml:6:50: splice.plates.thicknesses[1]: the plate grade has no strength for it: S235: thickness " +
				"t = 85 mm is outside EN 1993-1-1 Table 3.1 (t ≤ 80 mm); choose thinner plates or set " +
				"beam.grade_table: EN10025, whose steps go further"},
		{"101 plate thicknesses", agreementJob + "splice: {plates: {thicknesses: [" + strings.Join(many, ", ") + "]}}\n",
			"job.yaml:6:32: splice.plates.thicknesses: a list of 101 entries is outside the plausible range " +
				"(at most 100 entries); leave out the entries that cannot win"},
		{"an unknown bolt size", agreementJob + "splice: {bolts: {sizes: [M20, M240]}}\n",
			`job.yaml:6:31: splice.bolts.sizes[1]: bolt size "M240" is not known (known: M12, M16, M20, M22, M24, M27, M30, M36)`},
		{"bolts too large for the section", strings.Replace(agreementJob, "IPE 300", "IPE 160", 1) +
			"splice: {bolts: {sizes: [M30, M36]}}\n",
			"job.yaml:6:26: splice.bolts.sizes[0]: M30 bolts cannot be detailed on IPE 160: its flange (b = 82 mm) " +
				"is too narrow for two bolt lines of them, or its web too shallow for two bolt rows\n" +
				"job.yaml:6:31: splice.bolts.sizes[1]: M36 bolts cannot be detailed on IPE 160: its flange (b = 82 mm) " +
				"is too narrow for two bolt lines of them, or its web too shallow for two bolt rows"},
		{"one bolt size too large among others that fit", strings.Replace(agreementJob, "IPE 300", "IPE 160", 1) +
			"splice: {bolts: {sizes: [M12, M36]}}\n", ""},
		{"a 1 mm step on a 1 km beam", strings.Replace(strings.Replace(strings.Replace(agreementJob, "[6.0, 6.0]", "[200, 200, 200, 200, 200]", 1),
			"[pinned, roller, roller]", "[pinned, roller, roller, roller, roller, roller]", 1), "step: 0.1", "step: \"1 mm\"", 1),
			"job.yaml:5:14: scan.step: a scan of 999999 positions (a step of 0.001 m on the 1000 m beam) is outside " +
				"the plausible range (at most 200000 positions); take a coarser step"},
		{"a 5 m gap", agreementJob + "splice: {gap: \"5 m\"}\n",
			"job.yaml:6:15: splice.gap: a gap between the beam ends of 5000 mm is outside the plausible range " +
				"(at most 50 mm); check the value and its unit"},
		{"a 50 mm gap", agreementJob + "splice: {gap: 50}\n", ""},
		{"a 1 µm span", strings.Replace(strings.Replace(agreementJob, "[6.0, 6.0]", "[\"0.001 mm\"]", 1), "roller, roller", "roller", 1),
			"job.yaml:2:34: beam.spans[0]: a span of 1e-06 m is outside the plausible range (0.1 m to 200 m); " +
				"check the value and its unit"},
		{"a welded section without tw", strings.Replace(agreementJob, "IPE 300", "{welded: {h: 600, b: 200, tf: 15}}", 1),
			`job.yaml:2:26: beam.section.welded: missing required key "tw"`},
		{"a title of 201 characters", strings.Replace(agreementJob, "agreement test (invented)", strings.Repeat("é", 201), 1),
			"job.yaml:1:8: title: a title of 201 characters is outside the plausible range (at most 200 characters); " +
				"put the description in a comment"},
		{"a title of 200 characters", strings.Replace(agreementJob, "agreement test (invented)", strings.Repeat("é", 200), 1), ""},
		{"a trip that overflows the costs", agreementJob + "vehicles: [{name: lorry, max_length: 13.6, payload: 20000, cost: 1e17}]\n",
			"job.yaml:6:66: vehicles[0].cost: a rate of 100000000000000000 is outside the plausible range (at most 1000000000); " +
				"check the value and its unit"},
		{"an unknown smallest bolt size", agreementJob + "splice: {bolts: {min_size: M18}}\n",
			`job.yaml:6:28: splice.bolts.min_size: bolt size "M18" is not known (known: M12, M16, M20, M22, M24, M27, M30, M36)`},
		{"bolt-size bounds that leave no size", agreementJob + "splice: {bolts: {sizes: [M16, M20], min_size: M24}}\n",
			"job.yaml:6:47: splice.bolts.min_size: leaves no bolt size to try: none of the sizes M16, M20 (splice.bolts.sizes) " +
				"lies at M24 or larger"},
		{"bolt-size bounds on the default list", agreementJob + "splice: {bolts: {max_size: M12}}\n",
			"job.yaml:6:28: splice.bolts.max_size: leaves no bolt size to try: none of the sizes M16, M20, M22, M24, M27, M30 " +
				"(the default list) lies at M12 or smaller"},
		{"bolt-size bounds that leave some", agreementJob + "splice: {bolts: {min_size: M20, max_size: M24}}\n", ""},
		// IPE 300: tf = 10.7 mm (EN 10365); 2 × 10.7 = 21.4 mm
		{"a least plate thickness no plate reaches", agreementJob +
			"splice: {flange_plates: [outer], plates: {thicknesses: [10, 15, 20]}, detailing: {min_plate_to_flange: 2}}\n",
			"job.yaml:6:104: splice.detailing.min_plate_to_flange: 2 asks the flange cover plates to be at least 2 × tf = 21.4 mm " +
				"(tf = 10.7 mm of IPE 300): no plate of splice.plates.thicknesses (at most 20 mm) reaches it"},
		{"a least plate thickness outer and inner plates reach", agreementJob +
			"splice: {plates: {thicknesses: [10, 15, 20]}, detailing: {min_plate_to_flange: 2}}\n", ""},
		// IPE 300, b = 150 mm; M16 (the smallest default size), d0 = 18 mm: e2 = (150 − 110)/2 = 20 mm < 1.2 × 18 = 21.6 mm
		{"a gauge too wide for the flange", agreementJob + "splice: {detailing: {gauge: 110}}\n",
			"job.yaml:6:29: splice.detailing.gauge: a gauge of 110 mm cannot be detailed on IPE 300 (flange b = 150 mm) with any " +
				"bolt size and number of bolt lines tried; with M16 bolts (the smallest): " +
				"an outer plate, 2 lines: e2 = (150 − 110)/2 = 20 mm to the edge of the 150 mm plate is less than 1.2·d0 = 21.6 mm (EN 1993-1-8 Table 3.3); " +
				"an outer plate, 4 lines: 4 lines leave p2 = (150 − 2×30 − 110)/2 = -10 mm between the inner and outer lines, less than 2.4·d0 = 43.2 mm (EN 1993-1-8 Table 3.3); " +
				"outer and inner plates, 2 lines: e2 = (150 − 110)/2 = 20 mm to the edge of the 150 mm plate is less than 1.2·d0 = 21.6 mm (EN 1993-1-8 Table 3.3); " +
				"outer and inner plates, 4 lines: 4 lines leave p2 = (150 − 2×30 − 110)/2 = -10 mm between the inner and outer lines, less than 2.4·d0 = 43.2 mm (EN 1993-1-8 Table 3.3)"},
		// washers Ø30 mm of M16 clear of the fillets: 66/2 − 15 = 18 mm < tw/2 + r = 3.55 + 15 = 18.55 mm
		{"a gauge from the table too narrow for the washers", agreementJob +
			"splice: {bolts: {sizes: [M16]}, flange_plates: [outer], detailing: {gauges: [{width: 140, gauge: 66}, {width: 200, gauge: 120}]}}\n",
			"job.yaml:6:98: splice.detailing.gauges[0].gauge: a gauge of 66 mm cannot be detailed on IPE 300 (flange b = 150 mm) " +
				"with any bolt size and number of bolt lines tried; with M16 bolts (the smallest): " +
				"an outer plate, 2 lines: the washers (Ø30 mm) under the flange reach the web's fillets: g/2 − Ø/2 = 18 mm is less than tw/2 + fillet = 18.6 mm; " +
				"an outer plate, 4 lines: 4 lines leave p2 = (150 − 2×30 − 66)/2 = 12 mm between the inner and outer lines, less than 2.4·d0 = 43.2 mm (EN 1993-1-8 Table 3.3)"},
		{"a gauge that fits", agreementJob + "splice: {detailing: {gauge: 90}}\n", ""},
		// gauge 70 mm on IPE 300 fits an outer plate alone (M16 washers: 35 − 15 = 20 ≥ 3.55 + 15 mm) but
		// not inner plates (35 − 25 = 10 mm < 1.2 × 18 mm to their edge), which 2 × tf = 21.4 mm needs
		{"preferences that exclude each other", agreementJob +
			"splice: {bolts: {sizes: [M16]}, plates: {thicknesses: [10, 12, 15, 20]}, detailing: {gauge: 70, min_plate_to_flange: 2}}\n",
			"job.yaml:6:85: splice.detailing: the detailing preferences together leave no splice of the design space that can be " +
				"detailed on IPE 300: each layout the gauge allows breaks another preference; relax one of them"},
		{"a Latin-1 title", strings.Replace(agreementJob, "agreement", "caf\xe9", 1),
			"job.yaml:1:11: byte 0xE9 is not UTF-8 text (is the file saved as Latin-1 or Windows-1252? save it as UTF-8)"},
		{"a NUL byte", strings.Replace(agreementJob, "agreement", "a\x00b", 1),
			"job.yaml:1:9: the character U+0000 is not allowed in a YAML file (a control character other than tab " +
				"and line breaks, or a non-character); in a double-quoted string write it as an escape such as \\x1b"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			checkErr, runErr := checkAndOptimise(t, tc.src)
			if tc.check == "" {
				assert.NoError(t, checkErr, "check")
				assert.NoError(t, runErr, "optimise")
				return
			}
			require.Error(t, checkErr, "check accepts a job optimise refuses")
			assert.Equal(t, tc.check, checkErr.Error())
			assert.Error(t, runErr, "optimise")
		})
	}
}
