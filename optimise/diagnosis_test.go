package optimise

import (
	"errors"
	"fmt"
	"math"
	"os"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Reference values of the test beam, IPE 300 in S355, from outside the project.
const (
	// Wpl,y = 628.4 cm³ (EN 10365:2017 IPE table, published), fy = 355 N/mm² for tf = 10.7 mm
	// ≤ 40 mm (EN 1993-1-1 Table 3.1), γM0 = 1.00 (EN 1993-1-1 6.1(1) NOTE 2B):
	// Mpl,Rd = Wpl,y·fy/γM0 (6.2.5(2)).
	ipe300MplRd = 628.4e3 * 355 / 1.00 // [N·mm] = 223.08 kNm
	// Avz = 25.68 cm² (EN 10365:2017 IPE table, from memory): Vpl,Rd = Av·fy/(√3·γM0) (6.2.6(2)).
	ipe300VplRd = 25.68e2 * 355 / (1.7320508075688772 * 1.00) // [N] = 526.3 kN
)

// runInfeasible runs a job that must end without a layout and returns its outcome.
func runInfeasible(t *testing.T, s *Setup) *Outcome {
	t.Helper()
	o, err := Run(s, Settings{})
	var inf *InfeasibleError
	require.True(t, errors.As(err, &inf), "want an *InfeasibleError, got %v", err)
	require.NotNil(t, o)
	require.NotNil(t, o.Infeasible)
	require.Empty(t, o.Layouts.ByCount)
	require.NotEmpty(t, o.Diagnosis)
	return o
}

func jobText(t *testing.T, file string, edits ...string) *Setup {
	t.Helper()
	data, err := os.ReadFile("testdata/" + file)
	require.NoError(t, err)
	text := string(data)
	for i := 0; i < len(edits); i += 2 {
		require.Contains(t, text, edits[i])
		text = strings.Replace(text, edits[i], edits[i+1], 1)
	}
	s, err := Prepare(file, []byte(text))
	require.NoError(t, err)
	return s
}

// TestDiagnosisNamesTheStretchWhereNoSplicePasses: the IPE 300 of no-splice-midspan.yaml
// carries G = 10 + self weight and Q = 6 kN/m on a 10 m simple span; a piece may be at most
// 6 m long, so a splice is needed between 4 and 6 m, where no splice of the small design
// space passes. The diagnosis names that stretch, the closest attempt's failing check and
// utilisation, the largest |M| there and the beam's own Mpl,Rd, which the moment exceeds.
func TestDiagnosisNamesTheStretchWhereNoSplicePasses(t *testing.T) {
	o := runInfeasible(t, loadJob(t, "no-splice-midspan.yaml"))
	d := o.Diagnosis
	require.Len(t, d, 2, "%q", d.Lines())
	f := d[0]
	require.Equal(t, FindingStretch, f.Kind)
	assert.Equal(t, "beam.section", f.Key, "the beam itself is overstressed: the section is what to change")

	// the stretch is the whole run of positions where no splice passes, and it covers 4–6 m
	var run []Candidate
	for _, c := range o.Candidates {
		if c.X >= f.From && c.X <= f.To {
			run = append(run, c)
		}
	}
	require.Len(t, run, f.Positions)
	closest := run[0]
	for _, c := range run {
		require.False(t, c.Feasible)
		require.Nil(t, c.Zone)
		if c.Design.Utilisation < closest.Design.Utilisation {
			closest = c
		}
	}
	assert.LessOrEqual(t, f.From, 4000.0)
	assert.GreaterOrEqual(t, f.To, 6000.0)
	assert.True(t, o.CandidateAt(f.From-o.Step).Feasible || o.CandidateAt(f.From-o.Step).Zone != nil, "the run is maximal on the left")
	assert.True(t, o.CandidateAt(f.To+o.Step).Feasible || o.CandidateAt(f.To+o.Step).Zone != nil, "the run is maximal on the right")

	// the closest attempt (kind: regression against the scan's own candidates)
	assert.Equal(t, closest.X, f.At)
	assert.Equal(t, closest.Design.Governing, f.Check)
	assert.NotEmpty(t, f.Check)
	assert.Equal(t, closest.Design.Utilisation, f.Utilisation)
	assert.Greater(t, f.Utilisation, 1.0)

	// M_Ed: closed form of a simple span under a UDL, M = wL²/8 at midspan (a grid point),
	// w = 1.35·(10 + 42.2·9.80665/1000) + 1.5·6 kN/m (EN 1990 6.10 with Table A1.2(B)
	// γG = 1.35, γQ = 1.5; IPE 300 42.2 kg/m, EN 10365:2017, published)
	w := 1.35*(10+42.2*9.80665/1000) + 1.5*6 // kN/m = N/mm
	assert.InEpsilon(t, w*10000*10000/8, f.MEd, 2e-3, "self weight from the computed section mass")
	// V_Ed: at the first position of the stretch, V = w(L/2 − x)
	assert.InEpsilon(t, w*(5000-f.From), f.VEd, 2e-3)

	// the beam's own resistances (published section values, tolerance for the computed ones)
	assert.InEpsilon(t, ipe300MplRd, f.McRd, 5e-3)
	require.Less(t, f.VEd, ipe300VplRd)
	assert.Zero(t, f.VcRd, "V_Ed is below Vpl,Rd: not given")

	for _, want := range []string{
		fmt.Sprintf("no splice passes from %.3f to %.3f m (%d positions)", f.From/1e3, f.To/1e3, f.Positions),
		fmt.Sprintf("fails %s at utilisation %.2f", f.Check, f.Utilisation),
		"with the largest bolts and plates of the design space (M16 8.8, 8 mm plates)",
		fmt.Sprintf("|M_Ed| is up to %.1f kNm", f.MEd/1e6),
		fmt.Sprintf("Mc,Rd = %.1f kNm", ipe300MplRd/1e6),
		"EN 1993-1-1 6.2.5, 6.2.6",
	} {
		assert.Contains(t, f.Message, want)
	}

	l := d[1]
	assert.Equal(t, FindingLimit, l.Kind)
	assert.Equal(t, o.Infeasible.Key, l.Key)
	assert.Equal(t, "limits.max_piece_length: no layout keeps every piece within max_piece_length 6 m; "+
		"without that limit the best layout has a piece of 10 m", l.Message)
}

// TestDiagnosisWithinTheBeamsResistance: on an IPE 400 the same loads stay below the beam's
// Mpl,Rd = 1307 cm³ × 355 N/mm² = 464 kNm (EN 10365 Wpl,y, published): the stretch names the
// design space to change, and no beam resistance.
func TestDiagnosisWithinTheBeamsResistance(t *testing.T) {
	o := runInfeasible(t, jobText(t, "no-splice-midspan.yaml", "section: IPE 300", "section: IPE 400",
		"max_piece_length: 6.0", "max_piece_length: 5.0"))
	f := o.Diagnosis[0]
	require.Equal(t, FindingStretch, f.Kind, "%q", o.Diagnosis.Lines())
	assert.Equal(t, "splice", f.Key)
	assert.Less(t, f.MEd, 1307e3*355.0)
	assert.Zero(t, f.McRd)
	assert.Zero(t, f.VcRd)
	assert.NotContains(t, f.Message, "Mpl,Rd")
	assert.Greater(t, f.Utilisation, 1.0)
}

// TestDiagnosisOfTheMassLimitAlone: small-space.yaml with a 150 kg crane. Every stretch
// between admissible positions is short enough; only the mass limit fails, and its line gives
// the heaviest piece of the best layout without it.
func TestDiagnosisOfTheMassLimitAlone(t *testing.T) {
	o := runInfeasible(t, jobText(t, "small-space.yaml", "max_piece_mass: 1200", "max_piece_mass: 150"))
	require.Len(t, o.Diagnosis, 1, "%q", o.Diagnosis.Lines())
	f := o.Diagnosis[0]
	assert.Equal(t, FindingLimit, f.Kind)
	assert.Equal(t, "limits.max_piece_mass", f.Key)

	free, err := Run(jobText(t, "small-space.yaml", "max_piece_mass: 1200", "max_piece_mass: 1000000"), Settings{Alternatives: -1})
	require.NoError(t, err)
	heaviest := 0.0
	for _, p := range free.Recommended().Pieces {
		heaviest = math.Max(heaviest, p.Mass)
	}
	assert.Equal(t, fmt.Sprintf("limits.max_piece_mass: no layout keeps every piece within max_piece_mass 150 kg; "+
		"without that limit the best layout has a piece of %.0f kg", heaviest), f.Message)
}

// designed is a stand-in SpliceDesign that fails with the given check and utilisation.
func designed(check string, u float64) SpliceDesign {
	return SpliceDesign{Governing: check, Utilisation: u, Summary: "stand-in", Reason: "no splice passes"}
}

// TestDiagnosisOfHandMadeCandidates: which stretches matter, runs and zones, the closest
// attempt, and a shear force above Vpl,Rd, on candidates set by hand on the IPE 300 job
// (10 m beam, pieces at most 3 m here; kind: property of the rules of Outcome.diagnosis).
func TestDiagnosisOfHandMadeCandidates(t *testing.T) {
	s := loadJob(t, "no-splice-midspan.yaml")
	zone := &Zone{From: 4500, To: 6500, Reason: "keep-out: test zone", Key: "limits.keep_out.ranges[0]"}
	uls := func(m, v float64) PositionForces { return PositionForces{ULS: ForceSet{MMax: m, MMin: -m / 2, V: v}} }
	o := &Outcome{Setup: s, Step: 1000, Limits: PieceLimits{MaxLength: 3000, MaxMass: math.Inf(1)},
		Candidates: []Candidate{
			{X: 1000, Feasible: true},
			{X: 2000, Forces: uls(100e6, 600e3), Design: designed("web.bolt.shear", 1.30)},
			{X: 3000, Forces: uls(150e6, 100e3), Design: designed("flange.bolt.shear", 1.10)},
			{X: 4000, Forces: uls(120e6, 50e3), Design: designed("flange.plate.tension", 1.20)},
			{X: 5000, Zone: zone, Reason: zone.Reason},
			{X: 6000, Zone: zone, Reason: zone.Reason},
			{X: 7000, Feasible: true},
			{X: 8000, Forces: uls(500e6, 10e3), Design: designed("flange.beam.net", 2.0)},
			{X: 9000, Feasible: true},
		}}
	le := &LimitError{Key: "limits.max_piece_length", Message: "test limit"}
	d := o.diagnosis(le)
	require.Len(t, d, 3, "the stretch 7–9 m leaves a 2 m piece: it does not matter; %q", d.Lines())

	st := d[0]
	assert.Equal(t, FindingStretch, st.Kind)
	assert.Equal(t, [2]float64{2000, 4000}, [2]float64{st.From, st.To})
	assert.Equal(t, 3, st.Positions)
	assert.Equal(t, 3000.0, st.At, "the closest attempt has the lowest utilisation")
	assert.Equal(t, "flange.bolt.shear", st.Check)
	assert.Equal(t, 1.10, st.Utilisation)
	assert.Equal(t, 150e6, st.MEd)
	assert.Equal(t, 600e3, st.VEd)
	assert.Zero(t, st.McRd, "150 kNm is below Mpl,Rd = 223 kNm")
	assert.InEpsilon(t, ipe300VplRd, st.VcRd, 5e-3, "600 kN is above Vpl,Rd = 526 kN")
	assert.Equal(t, "beam.section", st.Key)
	assert.Contains(t, st.Message, fmt.Sprintf("Vc,Rd = %.1f kN", st.VcRd/1e3))
	assert.Contains(t, st.Message, "at 2.000 m: the beam itself is overstressed", "only where V exceeds it")
	assert.Contains(t, st.Message, "(stand-in)", "a splice other than the largest is described")

	z := d[1]
	assert.Equal(t, FindingKeepOut, z.Kind)
	assert.Equal(t, zone.Key, z.Key)
	assert.Equal(t, 2, z.Positions, "one finding per zone")
	assert.Equal(t, "no splice may go from 4.500 to 6.500 m: keep-out: test zone (limits.keep_out.ranges[0])", z.Message)

	assert.Equal(t, Finding{Kind: FindingLimit, Key: le.Key, Message: "limits.max_piece_length: test limit"}, d[2])
}
