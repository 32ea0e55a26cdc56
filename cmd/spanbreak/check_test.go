package main

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise"
	"spanbreak/plots/encode"
)

// checkJob exercises most of what check reports (invented data): an overhang, a spring, every
// case kind, a trapezoid, an axial load and a point moment, (6.10ab) and an extra combination.
const checkJob = `title: check test beam (invented)
beam:
  section: IPE 300
  grade: S275
  spans: [6.0, 4.0]
  overhang: {right: 1.0}
  supports: [pinned, roller, {type: spring, k: 20000}]
cases:
  G:
    kind: permanent
    loads: [{udl: 10}, {point: 20, at: 3.0}]
  Q:
    kind: imposed
    category: C
    loads: [{trapezoid: [0, 6], from: 6.0, to: 10.0}]
  S:
    kind: snow
    loads: [{udl: 2.0, from: 0, to: 6.0}]
  W:
    kind: wind
    loads: [{udl: -1.5}]
  T:
    kind: other
    psi: [0.6, 0.5, 0.0]
    loads: [{axial: 50, at: 0}, {moment: 10, at: 2.0}]
combinations:
  uls: "6.10ab"
  extra: [{name: LIFT, state: uls, factors: {G: 1.0, Q: 0.5}}]
limits:
  max_piece_length: 8.0
  keep_out: {ranges: [[2.0, 2.5]]}
vehicles:
  - {name: flatbed, max_length: 9.0, payload: 10000, cost: 300}
`

func checkJSON(t *testing.T, job string) encode.JobSummary {
	t.Helper()
	var out bytes.Buffer
	require.NoError(t, runCheck(checkOptions{JobFile: writeJob(t, job), Format: "json"}, outTo(&out)))
	var s encode.JobSummary
	require.NoError(t, json.Unmarshal(out.Bytes(), &s))
	return s
}

func caseByName(t *testing.T, s encode.JobSummary, name string) encode.JobCase {
	t.Helper()
	for _, c := range s.Cases {
		if c.Name == name {
			return c
		}
	}
	t.Fatalf("no case %s in %+v", name, s.Cases)
	return encode.JobCase{}
}

func TestCheckReportsWhatItUnderstood(t *testing.T) {
	s := checkJSON(t, checkJob)
	setup, err := optimise.Prepare("job.yaml", []byte(checkJob))
	require.NoError(t, err)
	const tol = 1e-9
	sw := setup.Section.Mass * optimise.StandardGravity / 1000 // kN/m = N/mm

	assert.True(t, s.Valid)
	assert.Equal(t, "check test beam (invented)", s.Title)
	assert.Equal(t, "IPE 300", s.Section.Name)
	assert.InEpsilon(t, 10.7, s.Section.Tf, tol, "IPE 300 tf, EN 10365 / Euronorm 19-57 section tables")
	assert.Equal(t, "S275", s.Grade.Name)
	// EN 1993-1-1 Table 3.1, S275, t ≤ 40 mm: fy = 275, fu = 430 N/mm².
	assert.InEpsilon(t, 275.0, s.Grade.FyFlange, tol)
	assert.InEpsilon(t, 430.0, s.Grade.FuFlange, tol)
	assert.InEpsilon(t, 275.0, s.Grade.FyWeb, tol)
	assert.InEpsilon(t, 6.0+4.0+1.0, s.Length, tol, "spans + overhang")
	assert.Equal(t, []float64{6, 4}, s.Spans)
	assert.Equal(t, [2]float64{0, 1}, s.Overhang)
	require.Len(t, s.Supports, 3)
	assert.Equal(t, []float64{0, 6, 10}, []float64{s.Supports[0].X, s.Supports[1].X, s.Supports[2].X})
	assert.Equal(t, "spring", s.Supports[2].Type)
	require.NotNil(t, s.Supports[2].K)
	assert.InEpsilon(t, 20000.0, *s.Supports[2].K, tol)
	assert.Nil(t, s.Supports[0].K)
	assert.Empty(t, s.Hinges)
	assert.InEpsilon(t, sw, s.SelfWeight, 1e-6)

	rows := []struct {
		name, kind, category string
		psi                  *[3]float64
		source               string // of psi
		pattern              bool
		loads                int
		down                 float64 // kN
		why                  string
	}{
		{"SW", "permanent", "", nil, "", false, 1, sw * 11, "mass × g × L (closed form)"},
		{"G", "permanent", "", nil, "", false, 2, 10*11 + 20, "w·L + P"},
		{"Q", "imposed", "C", &[3]float64{0.7, 0.7, 0.6}, "EN 1990 Table A1.1", true, 1, (0 + 6) / 2.0 * 4, "(w1 + w2)/2 · (to − from); EN 1990 Table A1.1 category C; imposed cases patterned by default"},
		{"S", "snow", "", &[3]float64{0.5, 0.2, 0}, "EN 1990 Table A1.1", false, 1, 2.0 * 6, "snow, sites at H ≤ 1000 m (the default row), EN 1990 Table A1.1"},
		{"W", "wind", "", &[3]float64{0.6, 0.2, 0}, "EN 1990 Table A1.1", false, 1, -1.5 * 11, "wind, EN 1990 Table A1.1; upward load is negative"},
		{"T", "other", "", &[3]float64{0.6, 0.5, 0}, "job file", false, 2, 0, "an axial load and a point moment have no transverse resultant"},
	}
	require.Len(t, s.Cases, len(rows))
	for i, r := range rows {
		c := s.Cases[i]
		assert.Equal(t, r.name, c.Name, "cases in file order, SW first")
		assert.Equal(t, r.kind, c.Kind, r.name)
		assert.Equal(t, r.category, c.Category, r.name)
		assert.Equal(t, r.psi, c.Psi, "%s: %s", r.name, r.why)
		assert.Equal(t, r.source, c.PsiSource, r.name)
		assert.Equal(t, r.pattern, c.Pattern, "%s: %s", r.name, r.why)
		assert.Equal(t, r.loads, c.Loads, r.name)
		if r.down == 0 {
			assert.InDelta(t, 0, c.TotalDown, 1e-9, r.name)
		} else {
			assert.InEpsilon(t, r.down, c.TotalDown, 1e-6, "%s: %s", r.name, r.why)
		}
	}

	// EN 1990 6.4.3.2: (6.10a) once with every variable action at ψ0, (6.10b) once per leading
	// variable action (4 here); 6.5.3 (6.14b) once per leading variable action; plus LIFT.
	cb := s.Combinations
	assert.Equal(t, "6.10ab", cb.ULS)
	assert.Equal(t, 1+4+1, cb.ULSCount)
	assert.Equal(t, 4, cb.SLSCount)
	assert.Equal(t, 1, cb.UserCount)
	assert.Contains(t, cb.Names, "LIFT")
	// EN 1990 Table A1.2(B) recommended values.
	assert.InEpsilon(t, 1.35, cb.GammaGSup, tol)
	assert.InEpsilon(t, 1.00, cb.GammaGInf, tol)
	assert.InEpsilon(t, 1.50, cb.GammaQ, tol)
	assert.InEpsilon(t, 0.85, cb.Xi, tol)

	assert.Equal(t, []string{"span 1", "span 2", "right overhang"}, s.Regions)
	require.NotNil(t, s.Limits.MaxPieceLength)
	assert.InEpsilon(t, 8.0, *s.Limits.MaxPieceLength, tol)
	assert.Nil(t, s.Limits.MaxPieceMass, "no limit")
	assert.Nil(t, s.Limits.MaxSplices, "no limit")
	assert.Equal(t, [][2]float64{{2.0, 2.5}}, s.Limits.KeepRanges)
	require.Len(t, s.Vehicles, 1)
	assert.Equal(t, encode.JobVehicle{Name: "flatbed", MaxLength: 9, Payload: 10000, Cost: 300}, s.Vehicles[0])
	assert.True(t, s.Costs.Indicative, "no costs block")
	assert.Contains(t, s.Defaults, "costs")
	assert.Contains(t, s.Defaults, "splice.category")
	assert.NotContains(t, s.Defaults, "beam.grade")
	assert.NotContains(t, s.Defaults, "combinations.uls")
	assert.Contains(t, s.Defaults, "beam.overhang.left", "overhang gives only right")
	assert.NotContains(t, s.Defaults, "beam.overhang.right")
}

// The JSON keys are a machine contract: scripts read them.
func TestCheckJSONKeys(t *testing.T) {
	var out bytes.Buffer
	require.NoError(t, runCheck(checkOptions{JobFile: writeJob(t, checkJob), Format: "json"}, outTo(&out)))
	var top map[string]json.RawMessage
	require.NoError(t, json.Unmarshal(out.Bytes(), &top))
	for _, k := range []string{"input", "version", "valid", "units", "title", "section", "grade", "length", "spans",
		"overhang", "supports", "hinges", "self_weight", "cases", "combinations", "pattern_regions", "limits",
		"vehicles", "splice", "costs", "scan", "defaults", "notes"} {
		assert.Contains(t, top, k)
	}
	var cases []map[string]any
	require.NoError(t, json.Unmarshal(top["cases"], &cases))
	for _, k := range []string{"name", "kind", "category", "psi", "psi_source", "pattern", "loads", "total_down"} {
		assert.Contains(t, cases[0], k)
	}
	var grade map[string]any
	require.NoError(t, json.Unmarshal(top["grade"], &grade))
	for _, k := range []string{"name", "table", "fy_flange", "fu_flange", "fy_web", "fu_web"} {
		assert.Contains(t, grade, k)
	}
}

// Statics: each case's total downward load equals the sum of its support reactions in the
// unfactored analysis (vertical equilibrium).
func TestCheckTotalsMatchReactions(t *testing.T) {
	for name, job := range map[string]string{"check job": checkJob, "starter": string(optimise.StarterJob())} {
		t.Run(name, func(t *testing.T) {
			s := checkJSON(t, job)
			setup, err := optimise.Prepare("job.yaml", []byte(job))
			require.NoError(t, err)
			an, err := setup.Analyse()
			require.NoError(t, err)
			st, err := an.StationsAt([]float64{0})
			require.NoError(t, err)
			for _, c := range s.Cases {
				r, err := an.CaseResult(c.Name, st)
				require.NoError(t, err)
				sum := 0.0
				for _, rc := range r.Reactions {
					sum += rc.Fz * encode.ToKN
				}
				assert.InDelta(t, sum, c.TotalDown, 1e-6*(1+math.Abs(sum)), "case %s: ΣFz = total load", c.Name)
			}
		})
	}
}

// A job that leaves everything optional out is reported with the documented defaults, each
// marked as one.
func TestCheckShowsDefaults(t *testing.T) {
	const minimal = `beam:
  section: IPE 300
  spans: [6.0]
  supports: [pinned, roller]
cases:
  G: {kind: permanent, loads: [{udl: 10}]}
  Q: {kind: imposed, category: B, loads: [{udl: 5}]}
`
	s := checkJSON(t, minimal)
	assert.Equal(t, "S355", s.Grade.Name)
	// EN 1993-1-1 Table 3.1, S355, t ≤ 40 mm: fy = 355 N/mm² (IPE 300, tf = 10.7 mm).
	assert.InEpsilon(t, 355.0, s.Grade.FyFlange, 1e-9)
	assert.Equal(t, "EN1990", s.Combinations.Rules)
	assert.Equal(t, "6.10", s.Combinations.ULS)
	assert.Equal(t, "characteristic", s.Combinations.SLS)
	assert.True(t, caseByName(t, s, "Q").Pattern, "imposed cases are patterned by default")
	assert.False(t, caseByName(t, s, "G").Pattern)
	assert.Equal(t, "A", s.Splice.Category)
	assert.Equal(t, "proportional", s.Splice.Distribution)
	assert.InEpsilon(t, 10.0, s.Splice.Gap, 1e-9)
	assert.Equal(t, []string{"8.8", "10.9"}, s.Splice.BoltClasses)
	assert.Equal(t, []string{"outer", "outer+inner"}, s.Splice.FlangePlates)
	assert.Equal(t, "S355", s.Splice.PlateGrade, "the plates take the beam's grade")
	assert.InEpsilon(t, 0.05, s.Scan.Step, 1e-9, "DESIGN.md section 6: 50 mm")
	assert.Equal(t, optimise.DefaultAlternatives, s.Scan.Alternatives)
	for _, p := range []string{"beam.grade", "beam.self_weight", "beam.overhang.left", "beam.overhang.right", "beam.hinges", "cases.G.pattern",
		"combinations.rules", "combinations.uls", "combinations.sls", "combinations.overrides.gamma_G_sup",
		"splice.category", "splice.gap", "splice.bolts.sizes", "limits.max_piece_length", "scan.step", "costs",
		"splice.bolts.min_size", "splice.bolts.max_size", "splice.detailing.gauge", "splice.detailing.min_plate_to_flange"} {
		assert.Contains(t, s.Defaults, p)
	}
	assert.Nil(t, s.Splice.Detailing.Gauge)
	assert.Nil(t, s.Splice.Detailing.MinPlateToFlange)
	assert.Equal(t, s.Splice.BoltSizes, s.Splice.BoltSizesTried, "no bounds: every size of the list is tried")
	assert.Len(t, s.Notes, 3, "no piece limits, no vehicles, no costs")

	var out bytes.Buffer
	require.NoError(t, runCheck(checkOptions{JobFile: writeJob(t, minimal), Format: "text"}, outTo(&out)))
	text := out.String()
	for _, want := range []string{"S355 (default)", "EN 1993-1-1 Table 3.1 (default)", "γG,sup 1.35 (default)",
		"category A (default)", "max piece length no limit (default)", "invented indicative rates", "CAUTION",
		"flange gauge chosen by the sizing (default)", "flange cover plates of any listed thickness (default)"} {
		assert.Contains(t, text, want)
	}
}

// prefsJob has detailing preferences (invented data): an IPE 450 (b = 190 mm, tf = 14.6 mm,
// EN 10365) with a gauge table, cover plates of at least 0.6·tf and bolts M20 to M24.
const prefsJob = `beam:
  section: IPE 450
  spans: [8.0]
  supports: [pinned, roller]
cases:
  G: {kind: permanent, loads: [{udl: 20}]}
splice:
  bolts: {min_size: M20, max_size: M24}
  detailing:
    gauges: [{width: 150, gauge: 90}, {width: 180, gauge: 100}, {width: 200, gauge: 120}]
    min_plate_to_flange: 0.6
`

// check prints the detailing preferences it understood, in each format, and the sizes the
// bounds leave: the 180 mm entry is the widest not above b = 190 mm; 0.6 × 14.6 = 8.76 mm.
func TestCheckPrintsDetailingPreferences(t *testing.T) {
	s := checkJSON(t, prefsJob)
	d := s.Splice.Detailing
	require.NotNil(t, d.Gauge)
	assert.Equal(t, 100.0, *d.Gauge)
	assert.Equal(t, "splice.detailing.gauges[1]", d.GaugeFrom)
	require.NotNil(t, d.MinPlate)
	assert.InDelta(t, 0.6*14.6, *d.MinPlate, 1e-6)
	assert.Equal(t, []string{"M20", "M22", "M24"}, s.Splice.BoltSizesTried)
	assert.Equal(t, "M20", s.Splice.BoltMinSize)
	assert.NotContains(t, s.Defaults, "splice.detailing.gauge")

	var out bytes.Buffer
	require.NoError(t, runCheck(checkOptions{JobFile: writeJob(t, prefsJob), Format: "text"}, outTo(&out)))
	for _, want := range []string{
		"bolts M20, M22, M24 (of M16, M20, M22, M24, M27, M30 (default), within min_size M20 and max_size M24)",
		"flange gauge 100 mm (splice.detailing.gauges[1]; with 4 bolt lines between the two nearest the web)",
		"at least 0.6 × tf = 0.6 × 14.6 = 8.76 mm (the outer plate, or outer and inner plates together)"} {
		assert.Contains(t, out.String(), want)
	}
	out.Reset()
	require.NoError(t, runCheck(checkOptions{JobFile: writeJob(t, prefsJob), Format: "csv"}, outTo(&out)))
	for _, want := range []string{"splice.detailing.gauge,100,mm,false", "splice.detailing.gauge_from,splice.detailing.gauges[1],,false",
		"splice.detailing.min_plate_to_flange,0.6,,false", "splice.detailing.min_plate_thickness,8.76,mm,false",
		"splice.bolts.min_size,M20,,false", "splice.bolts.tried[2],M24,,true"} {
		assert.Contains(t, out.String(), want)
	}
}

// The product-standard table gives other strengths than Table 3.1.
func TestCheckGradeTable(t *testing.T) {
	job := strings.Replace(simpleJob, "  grade: S275\n", "  grade: S355\n  grade_table: EN10025\n", 1)
	s := checkJSON(t, job)
	// EN 10025-2:2004 Table 7, S355: ReH = 355 N/mm² for t ≤ 16 mm, Rm ≥ 470 N/mm² for
	// 3 mm ≤ t ≤ 100 mm (IPE 300: tf = 10.7 mm).
	assert.InEpsilon(t, 355.0, s.Grade.FyFlange, 1e-9)
	assert.InEpsilon(t, 470.0, s.Grade.FuFlange, 1e-9)
	assert.NotContains(t, s.Defaults, "beam.grade_table")
}

func TestCheckTextOfStarter(t *testing.T) {
	var out bytes.Buffer
	require.NoError(t, runCheck(checkOptions{JobFile: writeJob(t, string(optimise.StarterJob())), Format: "text"}, outTo(&out)))
	text := out.String()
	for _, want := range []string{
		"Transfer beam under an offset column",
		"Length:    25.8 m",
		"Spans:     7.8, 10.2, 7.8 m",
		"x = 18 m roller",
		"0.7, 0.7, 0.6 (EN 1990 Table A1.1)", // category F, EN 1990 Table A1.1
		"2 ULS by EN 1990 6.10,",
		"max piece mass 2600 kg", // "2.6 t" read with its unit
		"bolts M20, M24 in classes 8.8, 10.9",
		"semi-trailer",
		"per lift 150",
		"candidates every 0.1 m",
	} {
		assert.Contains(t, text, want)
	}
	assert.NotContains(t, text, "-0.00")
}

// A bad job exits 1 with every problem, each with its line and key path, and prints nothing
// on stdout; so does a job whose beam is a mechanism or whose splice block cannot be used.
func TestCheckBadJobs(t *testing.T) {
	rows := []struct {
		name string
		job  string
		want []string
	}{
		{"two problems at once", "beam:\n  section: IPE 300\n  spans: [0]\n  supports: [pinned, roller]\n  sectoin: x\n" +
			"cases:\n  G: {kind: permanent, loads: [{udl: 10}]}\n",
			[]string{"job.yaml:3:", "beam.spans[0]", "job.yaml:5:", "sectoin"}},
		{"mechanism", "beam:\n  section: IPE 300\n  spans: [6.0]\n  supports: [roller, roller]\n  hinges: [3.0]\n" +
			"cases:\n  G: {kind: permanent, loads: [{udl: 10}]}\n",
			[]string{"beam.supports", "mechanism"}},
		{"unknown plate grade", simpleJob + "splice:\n  plates: {grade: S999}\n",
			[]string{"splice.plates.grade", "S999"}},
		{"slip-resistant without friction class", simpleJob + "splice:\n  category: B\n",
			[]string{"friction_class"}},
	}
	for _, tc := range rows {
		t.Run(tc.name, func(t *testing.T) {
			path := filepath.Join(t.TempDir(), "job.yaml")
			require.NoError(t, os.WriteFile(path, []byte(tc.job), 0o644))
			for _, format := range []string{"text", "json"} {
				out, stderr, code := runMine(t, "check", path, "--format", format)
				assert.Equal(t, exitFailure, code, stderr)
				assert.Empty(t, out, "nothing on stdout for a bad job")
				for _, w := range tc.want {
					assert.Contains(t, stderr, w)
				}
				assert.NotContains(t, stderr, "goroutine")
			}
		})
	}
	_, stderr, code := runMine(t, "check", filepath.Join(t.TempDir(), "missing.yaml"))
	assert.Equal(t, exitFailure, code)
	assert.Contains(t, stderr, "missing.yaml")
}

func TestCheckUsage(t *testing.T) {
	job := writeJob(t, simpleJob)
	for _, args := range [][]string{{"check"}, {"check", job, job}, {"check", job, "--format", "xml"}, {"check", job, "--nonsense"}} {
		_, stderr, code := runMine(t, args...)
		assert.Equal(t, exitUsage, code, "%v: %s", args, stderr)
	}
}

// roofCheckJob is a roof beam (invented data) with a roof imposed load (category H), snow,
// wind and a thermal action.
const roofCheckJob = `beam:
  section: IPE 300
  spans: [6.0, 6.0]
  supports: [pinned, roller, roller]
cases:
  G: {kind: permanent, loads: [{udl: 4}]}
  Q: {kind: imposed, category: H, loads: [{udl: 3}]}
  S: {kind: snow, loads: [{udl: 2}]}
  W: {kind: wind, loads: [{udl: -1}]}
  T: {kind: thermal, loads: [{axial: 20, at: 0}]}
`

// check names the rule keeping the roof imposed load apart from snow and wind (EN 1990
// A1.2.1(3), EN 1991-1-1 3.3.2(1)) when it applies it, marks the key's default, says so when
// the job turns it off, and reports a thermal case with the temperature row of EN 1990
// Table A1.1 (0.6, 0.5, 0), not patterned.
func TestCheckRoofRuleAndThermal(t *testing.T) {
	s := checkJSON(t, roofCheckJob)
	th := caseByName(t, s, "T")
	assert.Equal(t, "thermal", th.Kind)
	assert.Equal(t, &[3]float64{0.6, 0.5, 0}, th.Psi, "EN 1990 Table A1.1, temperature (non-fire)")
	assert.Equal(t, "EN 1990 Table A1.1", th.PsiSource)
	assert.False(t, th.Pattern, "only imposed cases are patterned by default")
	cb := s.Combinations
	assert.True(t, cb.RoofImposedSeparate)
	assert.True(t, cb.RoofImposedApplied)
	assert.Contains(t, cb.RoofImposedRule, "EN 1990 A1.2.1(3)")
	assert.Contains(t, s.Defaults, "combinations.roof_imposed_separate")
	// (6.10) one per leading variable case, (6.14b) the same: Q, S, W, T (EN 1990 6.4.3.2, 6.5.3)
	assert.Equal(t, 4, cb.ULSCount)
	assert.Equal(t, 4, cb.SLSCount)
	assert.Contains(t, cb.Names, "ULS 6.10, Q leading")
	assert.Contains(t, cb.Names, "ULS 6.10, T leading")

	var out bytes.Buffer
	require.NoError(t, runCheck(checkOptions{JobFile: writeJob(t, roofCheckJob), Format: "text"}, outTo(&out)))
	assert.Contains(t, out.String(), "Roof:      EN 1990 A1.2.1(3), EN 1991-1-1 3.3.2(1) applied (default): "+
		"the imposed load on the roof (category H) is not combined with snow or wind")
	assert.Regexp(t, `T +thermal +- +0\.6, 0\.5, 0 \(EN 1990 Table A1\.1\) +no \(default\)`, out.String())

	off := roofCheckJob + "combinations: {roof_imposed_separate: false}\n"
	s = checkJSON(t, off)
	assert.False(t, s.Combinations.RoofImposedSeparate)
	assert.False(t, s.Combinations.RoofImposedApplied)
	assert.NotContains(t, s.Defaults, "combinations.roof_imposed_separate")
	out.Reset()
	require.NoError(t, runCheck(checkOptions{JobFile: writeJob(t, off), Format: "text"}, outTo(&out)))
	assert.Contains(t, out.String(), "EN 1990 A1.2.1(3), EN 1991-1-1 3.3.2(1) not applied (roof_imposed_separate: false)")

	// a floor beam has no roof imposed load: no line, no rule named
	s = checkJSON(t, checkJob)
	assert.False(t, s.Combinations.RoofImposedApplied)
	assert.Empty(t, s.Combinations.RoofImposedRule)
	out.Reset()
	require.NoError(t, runCheck(checkOptions{JobFile: writeJob(t, checkJob), Format: "text"}, outTo(&out)))
	assert.NotContains(t, out.String(), "A1.2.1")
}
