package optimise

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise/forcetable"
)

// importedJob turns a job's text into the same job with its forces imported from file: the
// cases and combinations blocks and the self_weight key removed, forces: {file} added.
func importedJob(t *testing.T, job, file string) string {
	t.Helper()
	var out []string
	skip := false
	for _, line := range strings.Split(job, "\n") {
		top := line != "" && line[0] != ' ' && line[0] != '#'
		if top {
			skip = strings.HasPrefix(line, "cases:") || strings.HasPrefix(line, "combinations:")
			if strings.HasPrefix(line, "cases:") {
				out = append(out, "forces: {file: "+file+"}")
			}
		}
		if skip || strings.HasPrefix(strings.TrimSpace(line), "self_weight:") {
			continue
		}
		out = append(out, line)
	}
	return strings.Join(out, "\n")
}

// TestImportedRoundTrip: the envelopes `analyse --format csv` writes, read back through
// forces: {file}, give the same candidates, costs and layouts as the job with its loads, on
// the demo and on two test jobs. The table is written at the scan's own step, so every
// candidate is a station of the table and nothing is interpolated; the values pass through
// the CSV's six decimals of a kNm, so utilisations agree to 1e-5 (the costs, designs and
// layouts exactly). The keep-out zones around point loads come from the table's jumps.
func TestImportedRoundTrip(t *testing.T) {
	for _, tc := range []struct {
		name string
		job  []byte
	}{
		{"demo", DemoJob()},
		{"small-space", mustRead(t, "testdata/small-space.yaml")},
		{"symmetric", mustRead(t, "testdata/symmetric.yaml")},
	} {
		t.Run(tc.name, func(t *testing.T) {
			dir := t.TempDir()
			own, err := Prepare(filepath.Join(dir, "own.yaml"), tc.job)
			require.NoError(t, err)
			want, err := Run(own, Settings{})
			require.NoError(t, err)
			b, err := AnalyseBeam(own, BeamSettings{Step: want.Step})
			require.NoError(t, err)
			var csv bytes.Buffer
			require.NoError(t, forcetable.WriteEnvelopes(&csv, b.Envelopes))
			require.NoError(t, os.WriteFile(filepath.Join(dir, "forces.csv"), csv.Bytes(), 0o644))

			jobFile := filepath.Join(dir, "imported.yaml")
			imp, err := Prepare(jobFile, []byte(importedJob(t, string(tc.job), "forces.csv")))
			require.NoError(t, err)
			require.True(t, imp.Imported())
			got, err := Run(imp, Settings{})
			require.NoError(t, err)

			require.Len(t, got.Candidates, len(want.Candidates))
			for i, w := range want.Candidates {
				g := got.Candidates[i]
				require.Equal(t, w.X, g.X)
				require.Equal(t, w.Feasible, g.Feasible, "x = %g mm: %s | %s", w.X, w.Reason, g.Reason)
				require.Equal(t, w.Zone != nil, g.Zone != nil, "x = %g mm", w.X)
				if w.Zone != nil {
					assert.Equal(t, w.Zone.Key, g.Zone.Key)
					continue
				}
				assert.Equal(t, w.Design.Cost, g.Design.Cost, "x = %g mm", w.X)
				assert.Equal(t, w.Design.Summary, g.Design.Summary, "x = %g mm", w.X)
				assert.Equal(t, w.Design.Governing, g.Design.Governing, "x = %g mm", w.X)
				assert.InDelta(t, w.Design.Utilisation, g.Design.Utilisation, 1e-5, "x = %g mm", w.X)
				// (ranks are not compared: positions of equal cost are ordered by utilisations
				// that agree only to 1e-5 here, and on a symmetric beam to float noise anyway)
			}
			require.Len(t, got.Layouts.ByCount, len(want.Layouts.ByCount))
			for i := range want.Layouts.ByCount {
				a, b := want.Layouts.ByCount[i], got.Layouts.ByCount[i]
				assert.Equal(t, a.Splices, b.Splices)
				assert.Equal(t, a.Cost, b.Cost)
				assert.Equal(t, a.Vehicle, b.Vehicle)
				assert.Equal(t, a.Trips, b.Trips)
			}
			assert.Equal(t, want.Layouts.Recommended, got.Layouts.Recommended)
			// the member check sees the same forces
			assert.InDelta(t, want.Member.Member.Utilisation, got.Member.Member.Utilisation, 1e-5)
		})
	}
}

func mustRead(t *testing.T, path string) []byte {
	t.Helper()
	b, err := os.ReadFile(path)
	require.NoError(t, err)
	return b
}

// frameBeamTable writes the per-combination table of a fixed-ended beam under a uniform load
// w over L, from the handbook closed forms (a beam fixed at both ends, uniform load: standard
// beam tables): M(x) = w(6Lx − 6x² − L²)/12, so −wL²/12 at the ends and +wL²/24 at midspan;
// V(x) = w(L/2 − x); no axial force. Stations every 0.1 m; one ULS and one SLS combination.
func frameBeamTable(L, wULS, wSLS float64) string {
	var b strings.Builder
	b.WriteString("x_m,combination,state,M_kNm,V_kN,N_kN\n")
	for _, c := range []struct {
		name, state string
		w           float64
	}{{"ULS frame", "ULS", wULS}, {"SLS frame", "SLS", wSLS}} {
		for i := 0; i <= int(math.Round(L*10)); i++ {
			x := float64(i) / 10
			m := c.w * (6*L*x - 6*x*x - L*L) / 12
			v := c.w * (L/2 - x)
			fmt.Fprintf(&b, "%g,%s,%s,%.6f,%.6f,0\n", x, c.name, c.state, m, v)
		}
	}
	return b.String()
}

// TestFrameBeamEndMoments: a frame beam with end moments, imported as a per-combination table
// of a fixed-ended beam (14.4 m IPE 500 in S355, w = 40 kN/m at ULS and 28 kN/m at SLS), with
// no supports of its own (beam.length), optimised end to end: a 7.5 m piece limit needs one
// splice; its design forces are the closed forms at its position; the member check finds the
// end moment wL²/12 = 40 × 14.4²/12 = 691.2 kNm (at the ends, where it is largest) against
// Mc,Rd = Wpl·fy = 2194 cm³ × 355 N/mm² = 778.9 kNm (EN 10365 Wpl; EN 1993-1-1 Table 3.1).
func TestFrameBeamEndMoments(t *testing.T) {
	dir := t.TempDir()
	L, w := 14.4, 40.0
	require.NoError(t, os.WriteFile(filepath.Join(dir, "frame.csv"), []byte(frameBeamTable(L, w, 28)), 0o644))
	job := `title: Frame beam with end moments from a frame model (invented)
beam: {section: IPE 500, grade: S355, length: 14.4}
forces: {file: frame.csv}
splice: {category: B, friction_class: A}
limits: {max_piece_length: 7.5, min_piece_length: 2.0}
scan: {step: 0.1}
`
	s, err := Prepare(filepath.Join(dir, "frame.yaml"), []byte(job))
	require.NoError(t, err)
	require.True(t, s.Imported())
	assert.Empty(t, s.Model.Supports)
	o, err := Run(s, Settings{})
	require.NoError(t, err)
	rec := o.Recommended()
	require.Len(t, rec.Splices, 1, "14.4 m in pieces of at most 7.5 m")
	x := rec.Splices[0] / 1e3
	c := o.CandidateAt(rec.Splices[0])
	require.NotNil(t, c)
	mx := w * (6*L*x - 6*x*x - L*L) / 12 // kNm
	assert.InDelta(t, mx, c.Forces.ULS.MMax/1e6, 1e-5, "M at the splice, x = %g m", x)
	assert.InDelta(t, mx, c.Forces.ULS.MMin/1e6, 1e-5)
	assert.InDelta(t, math.Abs(w*(L/2-x)), c.Forces.ULS.V/1e3, 1e-5, "V at the splice")
	// the member check: the largest |M| is the end moment
	m := o.Member.Member
	assert.InEpsilon(t, w*L*L/12, math.Abs(m.Pairing.Forces().M)/1e6, 1e-6)
	assert.InEpsilon(t, w*L*L/12/(2194e3*355/1e6), m.Utilisation, 0.005)
	assert.NotEmpty(t, o.Member.NoDeflection, "no supports and no w: the deflection is not checked")
	// the sheets name the table's combinations
	require.Len(t, o.Chosen, 1)
	assert.Equal(t, "ULS frame", o.Chosen[0].Origins.ULS.MMax)
	assert.Equal(t, "SLS frame", o.Chosen[0].Origins.SLS.MMin)
}

// TestImportedJobProblems: the job-file rules of imported forces, each located.
func TestImportedJobProblems(t *testing.T) {
	dir := t.TempDir()
	require.NoError(t, os.WriteFile(filepath.Join(dir, "f.csv"), []byte(frameBeamTable(6, 10, 7)), 0o644))
	for _, tc := range []struct {
		name, job, want string
	}{
		{"forces and cases", "beam: {section: IPE 300, length: 6}\nforces: {file: f.csv}\ncases: {G: {kind: permanent, loads: [{udl: 1}]}}\n",
			"cases: the forces come from forces.file"},
		{"length without forces", "beam: {section: IPE 300, length: 6}\ncases: {G: {kind: permanent, loads: [{udl: 1}]}}\n",
			"beam.length describes a member with no supports"},
		{"length and spans", "beam: {section: IPE 300, length: 6, spans: [6], supports: [pinned, roller]}\nforces: {file: f.csv}\n",
			"spans: the beam gives its length"},
		{"no cases nor forces", "beam: {section: IPE 300, spans: [6], supports: [pinned, roller]}\n",
			`missing required key "cases" (or forces`},
		{"missing file", "beam: {section: IPE 300, length: 6}\nforces: {file: nope.csv}\n", "nope.csv"},
		{"table too short", "beam: {section: IPE 300, length: 8}\nforces: {file: f.csv}\n", "f.csv"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Prepare(filepath.Join(dir, "job.yaml"), []byte(tc.job))
			require.Error(t, err)
			assert.Contains(t, err.Error(), tc.want)
		})
	}
}
