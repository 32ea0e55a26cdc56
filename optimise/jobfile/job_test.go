package jobfile

import (
	"os"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// The full job is the example of DESIGN.md section 8 (invented demo data), copied verbatim.
// Expected values are the file's numbers converted to the internal units: m × 1000 = mm,
// kN × 1000 = N, kNm × 10⁶ = N·mm, kN/m × 1 = N/mm (SI prefixes, BIPM SI Brochure Table 7).
func TestLoadFullJob(t *testing.T) {
	data, err := os.ReadFile("testdata/full.yaml")
	require.NoError(t, err)
	j, err := LoadJob("full.yaml", data)
	require.NoError(t, err)
	const tol = 1e-12

	assert.Equal(t, "Roof girder over a sports hall extension (demo data, invented)", j.Title)
	b := j.Beam
	assert.Equal(t, "IPE 600", b.Section.Name)
	assert.Nil(t, b.Section.Welded)
	assert.Equal(t, Loc{File: "full.yaml", Pos: Pos{3, 12}, Path: "beam.section"}, b.Section.Meta.Loc)
	assert.Equal(t, "S355", b.Grade)
	assert.Equal(t, "", b.GradeTable)
	require.Len(t, b.Spans, 3)
	for i, want := range []float64{12.0 * 1000, 15.0 * 1000, 12.0 * 1000} {
		assert.InEpsilon(t, want, b.Spans[i].MM(), tol)
	}
	require.NotNil(t, b.Overhang)
	assert.InDelta(t, 0, b.Overhang.Left.MM(), 0)
	assert.InEpsilon(t, 1.5*1000, b.Overhang.Right.MM(), tol)
	assert.InEpsilon(t, (0+12+15+12+1.5)*1000, b.Length(), tol)
	assert.Equal(t, []float64{0, 12000, 27000, 39000}, b.SupportPositions())
	require.Len(t, b.Supports, 4)
	for i, want := range []string{"pinned", "roller", "roller", "roller"} {
		assert.Equal(t, want, b.Supports[i].Type)
		assert.Nil(t, b.Supports[i].K)
	}
	assert.Equal(t, Pos{8, 22}, b.Supports[1].Meta.Loc.Pos)
	assert.Equal(t, "beam.supports[1]", b.Supports[1].Meta.Loc.Path)
	assert.Empty(t, b.Hinges)
	assert.True(t, b.IncludesSelfWeight())

	require.Equal(t, []string{"G", "Q", "W", "T"}, j.Cases.Keys())
	g := j.Cases[0].Value
	assert.Equal(t, KindPermanent, g.Kind)
	assert.False(t, g.Patterned())
	require.Len(t, g.Loads, 2)
	assert.Equal(t, LoadUDL, g.Loads[0].Kind)
	assert.InEpsilon(t, 8.5, g.Loads[0].W[0].NPerMM(), tol)
	assert.InEpsilon(t, 8.5, g.Loads[0].W[1].NPerMM(), tol)
	from, to := g.Loads[0].Range(b.Length())
	assert.InDelta(t, 0, from, 0)
	assert.InEpsilon(t, 40500.0, to, tol)
	assert.Equal(t, LoadPoint, g.Loads[1].Kind)
	assert.InEpsilon(t, 45*1000.0, g.Loads[1].P.N(), tol)
	assert.InEpsilon(t, 18.0*1000, g.Loads[1].At.MM(), tol)
	assert.Equal(t, Loc{File: "full.yaml", Pos: Pos{17, 25}, Path: "cases.G.loads[1].at"}, g.Loads[1].Where("at"))

	q, ok := j.Cases.Get("Q")
	require.True(t, ok)
	assert.Equal(t, KindImposed, q.Kind)
	assert.Equal(t, "B", q.Category)
	require.NotNil(t, q.Pattern)
	assert.True(t, q.Patterned())
	assert.Nil(t, q.Psi)
	require.Len(t, q.Loads, 3)
	assert.InEpsilon(t, 12.0, q.Loads[0].W[0].NPerMM(), tol)
	assert.Nil(t, q.Loads[0].From)
	assert.InEpsilon(t, 20.0, q.Loads[1].W[0].NPerMM(), tol)
	from, to = q.Loads[1].Range(b.Length())
	assert.InEpsilon(t, 3.0*1000, from, tol)
	assert.InEpsilon(t, 9.0*1000, to, tol)
	assert.Equal(t, LoadTrapezoid, q.Loads[2].Kind)
	assert.InDelta(t, 0, q.Loads[2].W[0].NPerMM(), 0)
	assert.InEpsilon(t, 10.0, q.Loads[2].W[1].NPerMM(), tol)
	from, to = q.Loads[2].Range(b.Length())
	assert.InEpsilon(t, 24.0*1000, from, tol)
	assert.InEpsilon(t, 30.0*1000, to, tol)

	w, _ := j.Cases.Get("W")
	assert.Equal(t, KindWind, w.Kind)
	assert.False(t, w.Patterned())
	assert.InEpsilon(t, -4.0, w.Loads[0].W[0].NPerMM(), tol)

	tc, _ := j.Cases.Get("T")
	assert.Equal(t, KindOther, tc.Kind)
	require.NotNil(t, tc.Psi)
	assert.Equal(t, [3]float64{0.6, 0.5, 0.0}, *tc.Psi)
	assert.Equal(t, LoadAxial, tc.Loads[0].Kind)
	assert.InEpsilon(t, 150*1000.0, tc.Loads[0].P.N(), tol)
	assert.InDelta(t, 0, tc.Loads[0].At.MM(), 0)
	assert.Equal(t, LoadMoment, tc.Loads[1].Kind)
	assert.InEpsilon(t, 20*1e3*1e3, tc.Loads[1].M.NMM(), tol)
	assert.InEpsilon(t, 27.0*1000, tc.Loads[1].At.MM(), tol)

	cb := j.Combinations
	require.NotNil(t, cb)
	assert.Equal(t, RulesEN1990, cb.Rules)
	assert.Equal(t, ULS610, cb.ULS)
	assert.Empty(t, cb.Overrides)
	assert.Equal(t, SLSCharacteristic, cb.SLS)
	assert.Empty(t, cb.Extra)

	s := j.Splice
	require.NotNil(t, s)
	assert.Equal(t, CategoryB, s.Category)
	assert.Equal(t, "A", s.FrictionClass)
	assert.Equal(t, []string{"M20", "M24"}, s.Bolts.Sizes)
	assert.Equal(t, []string{"8.8", "10.9"}, s.Bolts.Classes)
	assert.Equal(t, "S355", s.Plates.Grade)
	assert.Equal(t, []Millimetres{10, 12, 15, 20, 25}, s.Plates.Thicknesses)
	assert.Equal(t, []string{FlangeOuter, FlangeOuterInner}, s.FlangePlates)
	assert.Equal(t, DistributionProportional, s.Distribution)
	require.NotNil(t, s.Gap)
	assert.InEpsilon(t, 10.0, s.Gap.MM(), tol)

	l := j.Limits
	require.NotNil(t, l)
	assert.InEpsilon(t, 13.6*1000, l.MaxPieceLength.MM(), tol)
	assert.InEpsilon(t, 2.0*1000, l.MinPieceLength.MM(), tol)
	assert.InEpsilon(t, 4000.0, l.MaxPieceMass.KG(), tol)
	assert.InEpsilon(t, 1.0*1000, l.KeepOut.Supports.MM(), tol)
	assert.InEpsilon(t, 0.3*1000, l.KeepOut.PointLoads.MM(), tol)
	require.Len(t, l.KeepOut.Ranges, 1)
	assert.InEpsilon(t, 17.5*1000, l.KeepOut.Ranges[0][0].MM(), tol)
	assert.InEpsilon(t, 18.5*1000, l.KeepOut.Ranges[0][1].MM(), tol)
	assert.Equal(t, 0, *l.Splices.Min)
	assert.Equal(t, 4, *l.Splices.Max)

	require.Len(t, j.Vehicles, 2)
	assert.Equal(t, "standard", j.Vehicles[0].Name)
	assert.InEpsilon(t, 13.6*1000, j.Vehicles[0].MaxLength.MM(), tol)
	assert.InEpsilon(t, 24000.0, j.Vehicles[0].Payload.KG(), tol)
	assert.InEpsilon(t, 850.0, j.Vehicles[0].Cost, tol)
	assert.Equal(t, "extendable", j.Vehicles[1].Name)
	assert.InEpsilon(t, 18.5*1000, j.Vehicles[1].MaxLength.MM(), tol)
	assert.InEpsilon(t, 20000.0, j.Vehicles[1].Payload.KG(), tol)
	assert.InEpsilon(t, 1600.0, j.Vehicles[1].Cost, tol)

	k := j.Costs
	require.NotNil(t, k)
	assert.Equal(t, []string{"M20", "M24"}, k.Bolt.Keys())
	m24, _ := k.Bolt.Get("M24")
	assert.InEpsilon(t, 4.5, m24, tol)
	f109, _ := k.BoltClassFactor.Get("10.9")
	assert.InEpsilon(t, 1.3, f109, tol)
	assert.InEpsilon(t, 2.4, *k.PlatePerKg, tol)
	assert.InEpsilon(t, 1.8, *k.Hole, tol)
	assert.InEpsilon(t, 35.0, *k.FayingPerM2, tol)
	assert.InEpsilon(t, 120.0, *k.Splice, tol)
	assert.InEpsilon(t, 180.0, *k.Lift, tol)

	require.NotNil(t, j.Scan)
	assert.InEpsilon(t, 0.05*1000, j.Scan.Step.MM(), tol)
	assert.Equal(t, 5, *j.Scan.Alternatives)
}

// TestLoadJobWithUnits writes every unit-bearing value of a job as a string with a unit.
func TestLoadJobWithUnits(t *testing.T) {
	src := `beam:
  section: {welded: {h: "0.9 m", b: 300, tw: "1.2 cm", tf: 25}}
  spans: ["7200 mm", 8.4]
  overhang: {right: "1500 mm"}
  supports: [fixed, {type: spring, k: "50 kN/mm"}, {type: roller}]
  hinges: ["9 m"]
  self_weight: false
cases:
  SW:
    kind: permanent
    loads: [{udl: "2.5 N/mm"}, {point: "45000 N", at: "3600 mm"}, {moment: "20000 Nm", at: 1}]
  S:
    kind: snow
    category: high
    loads: [{trapezoid: ["1 kN/m", "2000 N/m"], from: "1 m", to: 5}, {axial: "0.1 MN", at: 0}]
limits: {max_piece_mass: "2.5 t", max_piece_length: "12 m"}
vehicles: [{name: v, max_length: "13600 mm", payload: "24 t", cost: 1}]
scan: {step: "50 mm"}
`
	j, err := LoadJob("units.yaml", []byte(src))
	require.NoError(t, err)
	const tol = 1e-12
	w := j.Beam.Section.Welded
	require.NotNil(t, w)
	assert.InEpsilon(t, 0.9*1000, w.H.MM(), tol)
	assert.InEpsilon(t, 300.0, w.B.MM(), tol)
	assert.InEpsilon(t, 1.2*10, w.Tw.MM(), tol)
	assert.InEpsilon(t, 25.0, w.Tf.MM(), tol)
	assert.InEpsilon(t, 7200.0, j.Beam.Spans[0].MM(), tol)
	assert.InEpsilon(t, 8.4*1000, j.Beam.Spans[1].MM(), tol)
	assert.InEpsilon(t, 1500.0, j.Beam.RightOverhang(), tol)
	assert.InEpsilon(t, 50*1000.0, j.Beam.Supports[1].K.NPerMM(), tol)
	assert.Equal(t, SupportRoller, j.Beam.Supports[2].Type)
	assert.InEpsilon(t, 9.0*1000, j.Beam.Hinges[0].MM(), tol)
	assert.False(t, j.Beam.IncludesSelfWeight())
	sw := j.Cases[0].Value
	assert.InEpsilon(t, 2.5, sw.Loads[0].W[0].NPerMM(), tol)
	assert.InEpsilon(t, 45000.0, sw.Loads[1].P.N(), tol)
	assert.InEpsilon(t, 3600.0, sw.Loads[1].At.MM(), tol)
	assert.InEpsilon(t, 20000*1e3, sw.Loads[2].M.NMM(), tol)
	s := j.Cases[1].Value
	assert.Equal(t, "high", s.Category)
	assert.InEpsilon(t, 1.0, s.Loads[0].W[0].NPerMM(), tol)
	assert.InEpsilon(t, 2000/1e3, s.Loads[0].W[1].NPerMM(), tol)
	assert.InEpsilon(t, 0.1*1e6, s.Loads[1].P.N(), tol)
	assert.InEpsilon(t, 2.5*1000, j.Limits.MaxPieceMass.KG(), tol)
	assert.InEpsilon(t, 24*1000.0, j.Vehicles[0].Payload.KG(), tol)
	assert.InEpsilon(t, 50.0, j.Scan.Step.MM(), tol)
}

// A thermal case needs no psi (EN 1990 Table A1.1 has the temperature row) and is not
// patterned by default; roof_imposed_separate reads as written, and is true when absent.
func TestLoadThermalAndRoofRule(t *testing.T) {
	for _, tc := range []struct {
		block string
		want  bool
	}{{"", true}, {"combinations: {uls: \"6.10\"}\n", true},
		{"combinations: {roof_imposed_separate: true}\n", true}, {"combinations: {roof_imposed_separate: false}\n", false}} {
		j, err := LoadJob("job.yaml", []byte(minimal+"  T: {kind: thermal, loads: [{udl: 1}]}\n"+tc.block))
		require.NoError(t, err, tc.block)
		assert.Equal(t, tc.want, j.Combinations.SeparatesRoofImposed(), tc.block)
		th, ok := j.Cases.Get("T")
		require.True(t, ok)
		assert.Equal(t, KindThermal, th.Kind)
		assert.False(t, th.Patterned(), "only imposed cases are patterned by default")
		assert.Nil(t, th.Psi)
	}
}

// minimal is the smallest good job; the bad jobs below are variations of it.
const minimal = `beam:
  section: IPE 300
  spans: [6]
  supports: [pinned, roller]
cases:
  G:
    kind: permanent
    loads: [{udl: 5}]
`

func TestLoadMinimalJob(t *testing.T) {
	j, err := LoadJob("job.yaml", []byte(minimal))
	require.NoError(t, err)
	assert.Nil(t, j.Combinations)
	assert.True(t, j.Combinations.SeparatesRoofImposed(), "roof imposed loads kept apart by default")
	assert.Nil(t, j.Beam.Overhang)
	assert.InEpsilon(t, 6000.0, j.Beam.Length(), 1e-12)
}

func TestLoadBadJobs(t *testing.T) {
	tests := []problemCase{
		{"unknown top-level key", minimal + "limts: {}\n",
			[]string{`9:1: unknown key "limts" (allowed: title, beam, cases, forces, combinations, splice, limits, vehicles, costs, scan); did you mean "limits"?`}},
		{"misspelt beam key", `beam:
  sectoin: IPE 300
  spans: [6]
  supports: [pinned, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`2:3: beam: unknown key "sectoin" (allowed: section, grade, grade_table, spans, length, overhang, supports, hinges, self_weight); did you mean "section"?`}},
		{"missing required keys", "beam:\n  grade: S355\n",
			[]string{`1:1: beam: missing required key "section"`, `1:1: beam: missing required key "spans"`,
				`1:1: beam: missing required key "supports"`, `1:1: missing required key "cases"`}},
		{"wrong type for spans", `beam:
  section: IPE 300
  spans: 6
  supports: [pinned, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`3:10: beam.spans: want a list, got 6`}},
		{"span not a number", `beam:
  section: IPE 300
  spans: [6, six]
  supports: [pinned, roller, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`3:14: beam.spans[1]: want a length (a number in m, or a string such as "7200 mm"), got "six"`}},
		{"span zero and negative", `beam:
  section: IPE 300
  spans: [6, 0, -2]
  supports: [pinned, roller, roller, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`3:14: beam.spans[1]: a span must be longer than 0, got 0 m`,
			`3:17: beam.spans[2]: a span must be longer than 0, got -2 m`}},
		{"span NaN", `beam:
  section: IPE 300
  spans: [.nan]
  supports: [pinned, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`3:11: beam.spans[0]: NaN is not a value`}},
		{"span with a force unit", `beam:
  section: IPE 300
  spans: ["6 kN"]
  supports: [pinned, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`3:11: beam.spans[0]: "6 kN" is a force; want a length (m, cm, mm)`}},
		{"no spans", `beam:
  section: IPE 300
  spans: []
  supports: [pinned]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`3:10: beam.spans: the beam needs at least one span`}},
		{"negative overhang", `beam:
  section: IPE 300
  spans: [6]
  overhang: {left: -1, right: 2}
  supports: [pinned, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`4:20: beam.overhang.left: an overhang must not be negative, got -1 m`}},
		{"too few supports", `beam:
  section: IPE 300
  spans: [6, 6]
  supports: [pinned, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`4:13: beam.supports: 2 span(s) need 3 supports, one per span end; got 2`}},
		{"unknown support type", `beam:
  section: IPE 300
  spans: [6]
  supports: [pined, {type: rolled}]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`4:14: beam.supports[0]: unknown support type "pined" (allowed: pinned, roller, fixed, spring); did you mean "pinned"?`,
			`4:28: beam.supports[1].type: unknown support type "rolled" (allowed: pinned, roller, fixed, spring); did you mean "roller"?`}},
		{"spring without k, k on a roller, bad k", `beam:
  section: IPE 300
  spans: [6, 6, 6]
  supports: [spring, {type: roller, k: 10}, {type: spring, k: 0}, {type: spring, k: "5 kN"}]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`4:14: beam.supports[0]: a spring support needs its stiffness`,
			`4:40: beam.supports[1].k: k applies to spring supports only; this one is roller`,
			`4:63: beam.supports[2].k: a spring stiffness must be greater than 0, got 0 kN/m`,
			`4:85: beam.supports[3].k: "5 kN" is a force; want a spring stiffness`}},
		{"support as a list", `beam:
  section: IPE 300
  spans: [6]
  supports: [pinned, [roller]]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`4:22: beam.supports[1]: want a support type (pinned, roller, fixed, spring) or a mapping such as {type: spring, k: 50000}, got a list`}},
		{"welded section sizes", `beam:
  section: {welded: {h: 40, b: 0, tw: 12, tf: 25}}
  spans: [6]
  supports: [pinned, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`2:32: beam.section.welded.b: b must be greater than 0, got 0 mm`}},
		{"welded section with no web", `beam:
  section: {welded: {h: 40, b: 200, tw: 12, tf: 25}}
  spans: [6]
  supports: [pinned, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`2:49: beam.section.welded.tf: two flanges of tf = 25 mm leave no web in h = 40 mm`}},
		{"welded section missing tf and misspelt form", `beam:
  section: {welded: {h: 400, b: 200, tw: 12}, rolled: x}
  spans: [6]
  supports: [pinned, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`2:21: beam.section.welded: missing required key "tf"`,
			`2:47: beam.section: unknown key "rolled" (allowed: welded)`}},
		{"section a number", `beam:
  section: 300
  spans: [6]
  supports: [pinned, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`2:12: beam.section: want a catalogue name such as "IPE 600"`}},
		{"hinges off the beam and twice", `beam:
  section: IPE 300
  spans: [6, 6]
  supports: [pinned, roller, roller]
  hinges: [0, 14, 3, 3]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`5:12: beam.hinges[0]: a hinge at 0 m is not inside the beam (0 to 12 m)`,
			`5:15: beam.hinges[1]: a hinge at 14 m is not inside the beam (0 to 12 m)`,
			`5:22: beam.hinges[3]: a second hinge at 3 m (hinges[2])`}},
		{"bad grade table", `beam:
  section: IPE 300
  grade_table: EN10205
  spans: [6]
  supports: [pinned, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`3:16: beam.grade_table: unknown grade table "EN10205" (allowed: EN1993, EN10025); did you mean "EN10025"?`}},
		{"self weight bool wrong", `beam:
  section: IPE 300
  spans: [6]
  supports: [pinned, roller]
  self_weight: yes
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`5:16: beam.self_weight: want true or false, got "yes"`}},
		{"case named SW with self weight", `beam:
  section: IPE 300
  spans: [6]
  supports: [pinned, roller]
cases:
  SW: {kind: permanent, loads: [{udl: 5}]}
`, []string{`6:3: cases.SW: the case name "SW" is taken by the self weight (self_weight is on unless set to false)`}},
		{"no cases", `beam:
  section: IPE 300
  spans: [6]
  supports: [pinned, roller]
cases: {}
`, []string{`5:8: cases: at least one load case is needed`}},
		{"unknown case kind", minimal[:indexOf(minimal, "    kind")] + "    kind: permanant\n    loads: [{udl: 5}]\n",
			[]string{`7:11: cases.G.kind: unknown case kind "permanant" (allowed: permanent, imposed, snow, wind, thermal, other); did you mean "permanent"?`}},
		{"case kind missing", minimal[:indexOf(minimal, "    kind")] + "    loads: [{udl: 5}]\n",
			[]string{`6:3: cases.G: missing required key "kind"`}},
		{"imposed without category, bad category", minimal + `  Q1: {kind: imposed, loads: [{udl: 1}]}
  Q2: {kind: imposed, category: I, loads: [{udl: 1}]}
  Q3: {kind: imposed, category: a, loads: [{udl: 1}]}
`, []string{`9:7: cases.Q1: an imposed case needs a category (A to H, EN 1990 Table A1.1) or psi`,
			`10:33: cases.Q2.category: unknown imposed load category "I" (allowed: A, B, C, D, E, F, G, H)`,
			`11:33: cases.Q3.category: unknown imposed load category "a" (allowed: A, B, C, D, E, F, G, H); did you mean "A"?`}},
		{"category on wind, bad snow category", minimal + `  W: {kind: wind, category: B, loads: [{udl: 1}]}
  S: {kind: snow, category: alpine, loads: [{udl: 1}]}
`, []string{`9:29: cases.W.category: category applies to imposed and snow cases, not wind`,
			`10:29: cases.S.category: unknown snow category "alpine" (allowed: low, high)`}},
		{"category on thermal", minimal + `  T: {kind: thermal, category: temperature, loads: [{udl: 1}]}
`, []string{`9:32: cases.T.category: category applies to imposed and snow cases, not thermal`}},
		{"roof_imposed_separate not a boolean", minimal + `combinations: {roof_imposed_separate: yes}
`, []string{`9:39: combinations.roof_imposed_separate: want true or false, got "yes"`}},
		{"psi out of range, psi length, other without psi", minimal + `  T: {kind: other, psi: [0.6, 1.5, -0.1], loads: [{udl: 1}]}
  U: {kind: other, psi: [0.6, 0.5], loads: [{udl: 1}]}
  V: {kind: other, loads: [{udl: 1}]}
`, []string{`9:31: cases.T.psi[1]: ψ1 must lie between 0 and 1, got 1.5`,
			`9:36: cases.T.psi[2]: ψ2 must lie between 0 and 1, got -0.1`,
			`10:25: cases.U.psi: want a list of 3 values, got a list`,
			`11:6: cases.V: an 'other' case needs psi: [ψ0, ψ1, ψ2]`}},
		{"permanent patterned, permanent psi", minimal + `  G2: {kind: permanent, pattern: true, psi: [1, 1, 1], loads: [{udl: 1}]}
`, []string{`9:34: cases.G2.pattern: a permanent case is not patterned`,
			`9:45: cases.G2.psi: psi applies to variable actions, not to a permanent case`}},
		{"case without loads, empty loads", minimal + `  Q: {kind: wind}
  R: {kind: wind, loads: []}
`, []string{`9:6: cases.Q: the case has no loads`, `10:26: cases.R.loads: the list of loads is empty`}},
		{"load shape missing and doubled", minimal + `  Q:
    kind: wind
    loads:
      - {from: 1, to: 2}
      - {udl: 1, point: 2, at: 1}
`, []string{`12:9: cases.Q.loads[0]: a load needs one of udl, trapezoid, point, moment, axial`,
			`13:9: cases.Q.loads[1]: a load has one shape (udl, trapezoid, point, moment, axial), got udl and point`}},
		{"load keys of the wrong shape", minimal + `  Q:
    kind: wind
    loads:
      - {udl: 1, at: 2}
      - {point: 2, from: 1, at: 3}
      - {moment: 2}
      - {uld: 1}
`, []string{`12:22: cases.Q.loads[0].at: a udl runs from .. to ..; at is for point, moment and axial loads`,
			`13:26: cases.Q.loads[1].from: a point load sits at one x (at)`,
			`14:9: cases.Q.loads[2]: missing required key "at" (x of the moment load, m)`,
			`15:10: cases.Q.loads[3]: unknown key "uld" (allowed: udl, trapezoid, point, moment, axial, from, to, at); did you mean "udl"?`}},
		{"load positions off the beam", minimal + `  Q:
    kind: wind
    loads:
      - {point: 45, at: 6.5}
      - {udl: 1, from: -1}
      - {trapezoid: [1, 2], from: 2, to: "7000 mm"}
      - {axial: 10, at: "6 m"}
`, []string{`12:25: cases.Q.loads[0].at: position 6.5 m is off the beam (0 to 6 m)`,
			`13:24: cases.Q.loads[1].from: position -1 m is off the beam (0 to 6 m)`,
			`14:42: cases.Q.loads[2].to: position 7 m is off the beam (0 to 6 m)`}},
		{"load from after to", minimal + `  Q:
    kind: wind
    loads:
      - {udl: 1, from: 4, to: 2}
      - {udl: 1, from: 3, to: 3}
      - {udl: 1, from: 6}
`, []string{`12:31: cases.Q.loads[0].to: from (4 m) must be less than to (2 m)`,
			`13:31: cases.Q.loads[1].to: from (3 m) must be less than to (3 m)`,
			`14:24: cases.Q.loads[2].from: from (6 m) must be less than to (6 m)`}},
		{"trapezoid needs two values", minimal + `  Q: {kind: wind, loads: [{trapezoid: [1], from: 1, to: 2}]}
`, []string{`9:39: cases.Q.loads[0].trapezoid: want a list of 2 values, got a list`}},
		{"load value wrong dimension", minimal + `  Q: {kind: wind, loads: [{udl: "5 kN"}, {point: "5 kN/m", at: 1}, {moment: "5 kN", at: 1}]}
`, []string{`9:33: cases.Q.loads[0].udl: "5 kN" is a force; want a line load`,
			`9:50: cases.Q.loads[1].point: "5 kN/m" is a force per length (line load or stiffness); want a force`,
			`9:77: cases.Q.loads[2].moment: "5 kN" is a force; want a moment`}},
		{"combination rules", minimal + `combinations:
  rules: EN1991
  uls: 6.1
  sls: rare
  overrides: {gamma_G: 1.35, xi: 1.2, gamma_Q: -1}
`, []string{`10:10: combinations.rules: unknown rule set "EN1991" (allowed: EN1990); did you mean "EN1990"?`,
			`11:8: combinations.uls: unknown ULS combination "6.1" (allowed: 6.10, 6.10ab); did you mean "6.10"?`,
			`12:8: combinations.sls: unknown SLS combination "rare" (allowed: characteristic, frequent, quasi-permanent)`,
			`13:15: combinations.overrides.gamma_G: unknown override "gamma_G" (allowed: gamma_G_sup, gamma_G_inf, gamma_Q, xi)`,
			`13:30: combinations.overrides.xi: xi must lie in (0, 1], got 1.2`,
			`13:39: combinations.overrides.gamma_Q: gamma_Q must not be negative, got -1`}},
		{"gamma_G_inf above sup", minimal + `combinations: {overrides: {gamma_G_sup: 1.0, gamma_G_inf: 1.35}}
`, []string{`9:59: combinations.overrides.gamma_G_inf: gamma_G_inf (1.35) exceeds gamma_G_sup (1)`}},
		{"extra combinations", minimal + `combinations:
  extra:
    - {name: ACC, state: uls, factors: {G: 1.0, Q: 0.5, SW: 1}}
    - {name: ACC, state: ULS, factors: {G: -1}}
    - {name: E, state: sls, factors: {}}
    - {state: sls}
`, []string{`11:49: combinations.extra[0].factors.Q: case "Q" is not defined (cases: G, SW)`,
			`12:14: combinations.extra[1].name: a second combination named "ACC" (extra[0])`,
			`12:26: combinations.extra[1].state: unknown limit state "ULS" (allowed: uls, sls); did you mean "uls"?`,
			`12:41: combinations.extra[1].factors.G: a factor must not be negative, got -1`,
			`13:38: combinations.extra[2].factors: a combination needs at least one factor`,
			`14:7: combinations.extra[3]: missing required key "name"`,
			`14:7: combinations.extra[3]: missing required key "factors"`}},
		{"SW in a combination without self weight", `beam:
  section: IPE 300
  spans: [6]
  supports: [pinned, roller]
  self_weight: false
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
combinations: {extra: [{name: X, state: uls, factors: {SW: 1}}]}
`, []string{`7:56: combinations.extra[0].factors.SW: case "SW" is not defined (cases: G)`}},
		{"splice options", minimal + `splice:
  category: D
  friction_class: E
  bolts: {sizes: [M20, 24, M20], classes: ["8.8", "4.6", "9.8"]}
  plates: {grade: "", thicknesses: []}
  flange_plates: [outer, inner]
  distribution: flange-only
  gap: -5
`, []string{`10:13: splice.category: unknown splice category "D" (allowed: A, B, C)`,
			`11:19: splice.friction_class: unknown friction class "E" (allowed: A, B, C, D)`,
			`12:24: splice.bolts.sizes[1]: bolt size "24" is not a metric size such as M20`,
			`12:28: splice.bolts.sizes[2]: M20 is listed twice (also [0])`,
			`12:58: splice.bolts.classes[2]: unknown bolt class "9.8" (allowed: 4.6, 4.8, 5.6, 5.8, 6.8, 8.8, 10.9)`,
			`13:19: splice.plates.grade: the plate grade is empty`,
			`13:36: splice.plates.thicknesses: the list of plate thicknesses is empty`,
			`14:26: splice.flange_plates[1]: unknown flange plate arrangement "inner" (allowed: outer, outer+inner)`,
			`15:17: splice.distribution: unknown force distribution "flange-only" (allowed: proportional, flanges-only); did you mean "flanges-only"?`,
			`16:8: splice.gap: the gap must not be negative, got -5 mm`}},
		{"slip-resistant splice with non-preloadable bolts", minimal + `splice:
  category: B
  bolts: {sizes: [], classes: ["4.6", "10.9"]}
  plates: {thicknesses: [10, 0]}
`, []string{`11:18: splice.bolts.sizes: the list of bolt sizes is empty`,
			`11:32: splice.bolts.classes[0]: class 4.6 bolts cannot be preloaded (EN 1993-1-8 3.1.2: 8.8 and 10.9 only), as category B needs`,
			`12:30: splice.plates.thicknesses[1]: a plate thickness must be greater than 0, got 0 mm`}},
		{"limits", minimal + `limits:
  max_piece_length: 0
  min_piece_length: -2
  max_piece_mass: "-1 t"
  keep_out: {supports: -1, point_loads: -0.3}
  splices: {min: 3, max: -1}
`, []string{`10:21: limits.max_piece_length: max_piece_length must be greater than 0, got 0 m`,
			`11:21: limits.min_piece_length: min_piece_length must not be negative, got -2 m`,
			`12:19: limits.max_piece_mass: max_piece_mass must be greater than 0, got -1000 kg`,
			`13:24: limits.keep_out.supports: keep_out.supports must not be negative, got -1 m`,
			`13:41: limits.keep_out.point_loads: keep_out.point_loads must not be negative, got -0.3 m`,
			`14:18: limits.splices.min: splices.min (3) exceeds splices.max (-1)`,
			`14:26: limits.splices.max: splices.max must not be negative, got -1`}},
		{"min piece length not below max", minimal + `limits: {max_piece_length: 5, min_piece_length: "5000 mm", splices: {min: 2, max: 1}}
`, []string{`9:49: limits.min_piece_length: min_piece_length (5 m) must be less than max_piece_length (5 m)`,
			`9:75: limits.splices.min: splices.min (2) exceeds splices.max (1)`}},
		{"keep-out ranges", minimal + `limits:
  keep_out:
    ranges:
      - [3, 2]
      - [1, 2]
      - [1.5, 2.5]
      - [5, 7]
      - [4]
`, []string{`12:9: limits.keep_out.ranges[0]: the range [3 m, 2 m] is inverted or empty`,
			`14:9: limits.keep_out.ranges[2]: the range [1.5 m, 2.5 m] overlaps ranges[1] [1 m, 2 m]; merge them`,
			`15:9: limits.keep_out.ranges[3]: the range [5 m, 7 m] is not on the beam (0 to 6 m)`,
			`16:9: limits.keep_out.ranges[4]: want a list of 2 values, got a list`}},
		{"vehicles", minimal + `vehicles:
  - {name: a, max_length: 0, payload: 24000, cost: 850}
  - {name: a, max_length: 13.6, payload: -1, cost: -5}
  - {name: b, max_length: "13.6 t", payload: "24 m", cost: 1}
  - {max_length: 1, payload: 1}
`, []string{`10:27: vehicles[0].max_length: max_length must be greater than 0, got 0 m`,
			`11:12: vehicles[1].name: a second vehicle named "a" (vehicles[0])`,
			`11:42: vehicles[1].payload: payload must be greater than 0, got -1 kg`,
			`11:52: vehicles[1].cost: cost must not be negative, got -5`,
			`12:27: vehicles[2].max_length: "13.6 t" is a mass; want a length`,
			`12:46: vehicles[2].payload: "24 m" is a length; want a mass`,
			`13:5: vehicles[3]: missing required key "name"`,
			`13:5: vehicles[3]: missing required key "cost"`,
			`13:30: vehicles[3].payload: a payload of 1 kg is outside the plausible range (at least 100 kg)`}},
		{"limits of the sizing and the scan", "title: \"" + strings.Repeat("x", 201) + "\"\n" + minimal + `splice:
  plates: {thicknesses: [3, 10, 120]}
  gap: "5 m"
limits: {splices: {min: 1001, max: 2000}}
scan: {step: "0.5 mm", alternatives: 101}
`, []string{`1:8: title: a title of 201 characters is outside the plausible range (at most 200 characters); put the description in a comment`,
			`11:26: splice.plates.thicknesses[0]: a plate thickness of 3 mm is outside the plausible range (4 mm to 100 mm)`,
			`11:33: splice.plates.thicknesses[2]: a plate thickness of 120 mm is outside the plausible range (4 mm to 100 mm)`,
			`12:8: splice.gap: a gap between the beam ends of 5000 mm is outside the plausible range (at most 50 mm)`,
			`13:25: limits.splices.min: a number of splices of 1001 is outside the plausible range (at most 1000); a beam's layout needs far fewer`,
			`13:36: limits.splices.max: a number of splices of 2000 is outside the plausible range (at most 1000); a beam's layout needs far fewer`,
			`14:14: scan.step: a scan step of 0.5 mm is outside the plausible range (at least 1 mm)`,
			`14:38: scan.alternatives: a number of alternatives of 101 is outside the plausible range (at most 100); a few near-best layouts show the choice`}},
		{"costs", minimal + `splice: {bolts: {sizes: [M20, M24]}}
costs:
  bolt: {M20: 3.2, M2O: 4.5, M24: -1}
  bolt_class_factor: {"10.9": 0, "12.9": 1.5}
  plate_per_kg: -2.4
  hole: abc
  lift: .inf
`, []string{`11:20: costs.bolt.M2O: bolt size "M2O" is not a metric size such as M20`,
			`11:30: costs.bolt.M24: a bolt rate must not be negative, got -1`,
			`12:23: costs.bolt_class_factor["10.9"]: a class factor must be greater than 0, got 0`,
			`12:34: costs.bolt_class_factor["12.9"]: unknown bolt class "12.9" (allowed: 4.6, 4.8, 5.6, 5.8, 6.8, 8.8, 10.9); did you mean "10.9"?`,
			`13:17: costs.plate_per_kg: plate_per_kg must not be negative, got -2.4`,
			`14:9: costs.hole: want a number, got "abc"`,
			`15:9: costs.lift: an infinite value is not allowed`}},
		{"weld throats", `beam:
  section: {welded: {h: 900, b: 300, tw: 12, tf: 25, weld_throat: 2}}
  spans: [6]
  supports: [pinned, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`2:67: beam.section.welded.weld_throat: a weld throat a of 2 mm is outside the plausible range (at least 3 mm)`}},
		{"weld throat of zero", `beam:
  section: {welded: {h: 900, b: 300, tw: 12, tf: 25, weld_throat: 0}}
  spans: [6]
  supports: [pinned, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`2:67: beam.section.welded.weld_throat: the weld throat must be greater than 0, got 0 mm`}},
		{"welds that fill the flange outstand", `beam:
  section: {welded: {h: 900, b: 300, tw: 12, tf: 25, weld_throat: 110}}
  spans: [6]
  supports: [pinned, roller]
cases: {G: {kind: permanent, loads: [{udl: 5}]}}
`, []string{`2:67: beam.section.welded.weld_throat: welds of throat a = 110 mm have legs √2·a = 155.563 mm, which leave no web ` +
			`between them (h − 2tf = 850 mm) or no flange outstand beside them ((b − tw)/2 = 144 mm)`}},
		{"bolt-size bounds", minimal + `splice:
  bolts: {min_size: "20", max_size: M2O}
`, []string{`10:21: splice.bolts.min_size: bolt size "20" is not a metric size such as M20`,
			`10:37: splice.bolts.max_size: bolt size "M2O" is not a metric size such as M20`}},
		{"bolt-size bounds crossed", minimal + `splice: {bolts: {min_size: M27, max_size: M20}}
`, []string{`9:28: splice.bolts.min_size: min_size M27 is larger than max_size M20`}},
		{"detailing preferences", minimal + `splice:
  detailing:
    gauge: -5
    gauges: [{width: 200, gauge: 120}, {width: 200, gauge: 90}, {width: 150, gauge: 150}, {gauge: 0}]
    min_plate_to_flange: 3
    min_plate: 1
`, []string{`11:12: splice.detailing.gauge: a gauge must be greater than 0, got -5 mm`,
			`12:13: splice.detailing.gauges: give gauge (one gauge for every section) or gauges (a gauge by flange width), not both`,
			`12:48: splice.detailing.gauges[1].width: a second gauge for flanges 200 mm wide (gauges[0])`,
			`12:85: splice.detailing.gauges[2].gauge: a gauge of 150 mm is not less than the flange width 150 mm it is for`,
			`12:91: splice.detailing.gauges[3]: missing required key "width"`,
			`12:99: splice.detailing.gauges[3].gauge: a gauge must be greater than 0, got 0 mm`,
			`13:26: splice.detailing.min_plate_to_flange: min_plate_to_flange: 3 is not a ratio of cover-plate to flange thickness above 0 and at most 2`,
			`14:5: splice.detailing: unknown key "min_plate" (allowed: gauge, gauges, min_plate_to_flange)`}},
		{"an empty list of gauges", minimal + `splice: {detailing: {gauges: [], min_plate_to_flange: 0}}
`, []string{`9:30: splice.detailing.gauges: the list of gauges is empty`,
			`9:55: splice.detailing.min_plate_to_flange: min_plate_to_flange: 0 is not a ratio`}},
		{"bolting assemblies", minimal + `splice:
  assemblies: {system: HV, shear_planes: threads}
costs: {bolt: {M20: 3}, assembly_per_kg: -4.5}
`, []string{`10:24: splice.assemblies.system: HV assemblies are for preloaded bolts; a category A splice takes ISO 4014 or ISO 4017`,
			`10:42: splice.assemblies.shear_planes: unknown shear-plane rule "threads" (allowed: length, thread, shank); did you mean "thread"?`,
			`11:42: costs.assembly_per_kg: assembly_per_kg must not be negative, got -4.5`}},
		{"assemblies that cannot be preloaded", minimal + `splice:
  category: B
  friction_class: A
  assemblies: {system: ISO 4014}
`, []string{`12:24: splice.assemblies.system: ISO 4014 assemblies cannot be preloaded; a category B splice takes HV or HR`}},
		{"an unknown assembly system", minimal + `splice: {assemblies: {system: HVX}}
`, []string{`9:31: splice.assemblies.system: unknown bolting assembly system "HVX" (allowed: HV, HR, ISO 4014, ISO 4017); did you mean "HV"?`}},
		{"bolt size without a rate", minimal + `splice: {bolts: {sizes: [M20, M24]}}
costs: {bolt: {M20: 3.2}}
`, []string{`9:31: splice.bolts.sizes[1]: costs.bolt has no rate for M24 (rates for: M20)`}},
		{"scan", minimal + `scan: {step: 0, alternatives: -1}
`, []string{`9:14: scan.step: the scan step must be greater than 0, got 0 m`,
			`9:31: scan.alternatives: alternatives must not be negative, got -1`}},
		{"scan step longer than the beam", minimal + `scan: {step: "7 m", alternatives: 2.5}
`, []string{`9:14: scan.step: the scan step 7 m exceeds the beam length 6 m`,
			`9:35: scan.alternatives: want a whole number, got 2.5`}},
		{"duplicate case and duplicate key in a load", `beam:
  section: IPE 300
  spans: [6]
  supports: [pinned, roller]
cases:
  G: {kind: permanent, loads: [{udl: 5, udl: 6}]}
  G: {kind: permanent, loads: [{udl: 5}]}
`, []string{`6:41: cases.G.loads[0]: duplicate key "udl" (first at line 6)`,
			`7:3: cases: duplicate key "G" (first at line 6)`}},
		{"positions unchecked when the length is unknown", `beam:
  section: IPE 300
  spans: [6, abc]
  supports: [pinned, roller, roller]
cases: {G: {kind: permanent, loads: [{point: 5, at: 100}]}}
scan: {step: 1000}
`, []string{`3:14: beam.spans[1]: want a length`}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			j, err := LoadJob("job.yaml", []byte(tc.src))
			require.Error(t, err)
			assert.NotNil(t, j, "a parsed file returns its job with the problems")
			var ps Problems
			require.ErrorAs(t, err, &ps)
			checkProblems(t, "job.yaml", ps, tc.want)
		})
	}
	assert.GreaterOrEqual(t, len(tests), 25)
}

func indexOf(s, sub string) int {
	i := strings.Index(s, sub)
	if i < 0 {
		panic("no " + sub)
	}
	return i
}

func TestLoadJobUnparsed(t *testing.T) {
	j, err := LoadJob("job.yaml", []byte("beam: [\n"))
	assert.Nil(t, j)
	require.Error(t, err)
	assert.Contains(t, err.Error(), "job.yaml:")
	assert.Contains(t, err.Error(), "YAML syntax")
}

// TestCallerChecks shows the lead's use: add a problem about a decoded value (an unknown
// section name, say) to the same list, at the value's position.
func TestCallerChecks(t *testing.T) {
	j, err := LoadJob("job.yaml", []byte(minimal))
	require.NoError(t, err)
	var ps Problems
	ps.Add(j.Beam.Section.Meta.Loc, "unknown section %q", j.Beam.Section.Name)
	ps.Add(j.Cases[0].Value.Loads[0].Where("udl"), "checked")
	ps.Add(j.Beam.Where("grade"), "no grade given")
	assert.Equal(t, "job.yaml:1:1: beam.grade: no grade given\n"+
		"job.yaml:2:12: beam.section: unknown section \"IPE 300\"\n"+
		"job.yaml:8:19: cases.G.loads[0].udl: checked", ps.Err().Error())
}

func TestDefaults(t *testing.T) {
	yes, no := true, false
	tests := []struct {
		name string
		got  bool
		want bool
	}{
		{"self weight absent is on", Beam{}.IncludesSelfWeight(), true},
		{"self weight false", Beam{SelfWeight: &no}.IncludesSelfWeight(), false},
		{"imposed patterned by default", Case{Kind: KindImposed}.Patterned(), true},
		{"imposed pattern false", Case{Kind: KindImposed, Pattern: &no}.Patterned(), false},
		{"wind not patterned by default", Case{Kind: KindWind}.Patterned(), false},
		{"snow pattern true", Case{Kind: KindSnow, Pattern: &yes}.Patterned(), true},
		{"permanent not patterned", Case{Kind: KindPermanent}.Patterned(), false},
		{"shear planes from the length by default", BoltSpec{}.ShearPlanes() == PlanesLength, true},
		{"threads not in shear plane", BoltSpec{ThreadsInShearPlane: &no}.ShearPlanes() == PlanesShank, true},
		{"8.8 preloadable (EN 1993-1-8 3.1.2)", PreloadableClass("8.8"), true},
		{"10.9 preloadable (EN 1993-1-8 3.1.2)", PreloadableClass("10.9"), true},
		{"6.8 not preloadable (EN 1993-1-8 3.1.2)", PreloadableClass("6.8"), false},
	}
	for _, tc := range tests {
		assert.Equal(t, tc.want, tc.got, tc.name)
	}
}

func TestBeamGeometry(t *testing.T) {
	b := Beam{Spans: []Metres{NewMetres(5), NewMetres(7)},
		Overhang: &Overhang{Left: NewMetres(1), Right: NewMetres(2)}}
	assert.InEpsilon(t, (1+5+7+2)*1000.0, b.Length(), 1e-12)
	assert.Equal(t, []float64{1000, 6000, 13000}, b.SupportPositions())
	assert.InDelta(t, 0, Beam{}.Length(), 0)

	from, to := Load{Kind: LoadUDL}.Range(15000)
	assert.InDelta(t, 0, from, 0)
	assert.InEpsilon(t, 15000.0, to, 1e-12)
	x := NewMetres(4)
	from, to = Load{Kind: LoadUDL, From: &x}.Range(15000)
	assert.InEpsilon(t, 4000.0, from, 1e-12)
	assert.InEpsilon(t, 15000.0, to, 1e-12)
}

func TestMapMethods(t *testing.T) {
	m := Map[float64]{{Key: "M20", Value: 3.2}, {Key: "M24", Value: 4.5}}
	v, ok := m.Get("M24")
	assert.True(t, ok)
	assert.InEpsilon(t, 4.5, v, 1e-15)
	_, ok = m.Get("M30")
	assert.False(t, ok)
	assert.True(t, m.Has("M20"))
	assert.Equal(t, []string{"M20", "M24"}, m.Keys())
}

func BenchmarkLoadFullJob(b *testing.B) {
	data, err := os.ReadFile("testdata/full.yaml")
	require.NoError(b, err)
	for b.Loop() {
		if _, err := LoadJob("full.yaml", data); err != nil {
			b.Fatal(err)
		}
	}
}
