package optimise

import (
	"math"
	"os"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/beam"
)

func loadJob(t *testing.T, file string) *Setup {
	t.Helper()
	data, err := os.ReadFile("testdata/" + file)
	require.NoError(t, err)
	s, err := Prepare(file, data)
	require.NoError(t, err)
	return s
}

func demoSetup(t *testing.T) *Setup {
	t.Helper()
	s, err := Prepare(DemoJobName, DemoJob())
	require.NoError(t, err)
	return s
}

// editedDemo returns the demo job with one line replaced (the old text must be present).
func editedDemo(t *testing.T, old, new string) *Setup {
	t.Helper()
	src := string(DemoJob())
	require.Contains(t, src, old)
	s, err := Prepare("edited-demo.yaml", []byte(strings.Replace(src, old, new, 1)))
	require.NoError(t, err)
	return s
}

func TestGrid(t *testing.T) {
	tests := []struct {
		name         string
		length, step float64
		want         []float64
	}{
		{"step divides the length: the ends are left out", 1000, 250, []float64{250, 500, 750}},
		{"step does not divide: the last point stops short", 1000, 300, []float64{300, 600, 900}},
		{"step longer than the beam: no position", 1000, 1500, []float64{}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			got, err := Grid(tc.length, tc.step)
			require.NoError(t, err)
			assert.Equal(t, tc.want, got)
		})
	}
	_, err := Grid(36200, 0.1)
	require.ErrorContains(t, err, "at most 200000")
	_, err = Grid(1000, 0)
	require.ErrorContains(t, err, "positive")
}

// TestDesignForcesAtAJumpTakeTheWorseSide: a simply supported beam, span L = 10 m, with a
// clockwise couple C = 100 kNm at midspan as its only (permanent) load. Statics (closed form):
// the reactions are a couple C/L, so V = C/L along the whole span, M = −C/2 just left of the
// couple and +C/2 just right. ULS 6.10 takes γG,sup = 1.35 (EN 1990 Table A1.2(B)) or
// γG,inf = 1.00 on the whole action, so at x = L/2 the design set must hold M_max = +1.35·C/2
// (right side) and M_min = −1.35·C/2 (left side), V = 1.35·C/L.
func TestDesignForcesAtAJumpTakeTheWorseSide(t *testing.T) {
	const L, C = 10000.0, 100e6 // mm, N·mm
	m := beam.Model{Length: L, Supports: []beam.Support{{X: 0, Kind: beam.Pinned}, {X: L, Kind: beam.Roller}},
		EI: beam.YoungModulus * 1e9, EA: beam.YoungModulus * 1e4}
	cases := []beam.Case{{Name: "G", Kind: beam.Permanent, Loads: []beam.Load{{Kind: beam.PointMoment, X1: L / 2, P: C}}}}
	an, err := beam.NewAnalysis(m, cases)
	require.NoError(t, err)
	rules, err := beam.NewRules("EN1990", "6.10", "characteristic", nil)
	require.NoError(t, err)
	combos, err := beam.Combinations(cases, rules)
	require.NoError(t, err)
	f, err := DesignForces(an, combos, []float64{2500, L / 2})
	require.NoError(t, err)
	at := f[1].ULS
	assert.InEpsilon(t, 1.35*C/2, at.MMax, 1e-9, "M_max: right of the couple")
	assert.InEpsilon(t, -1.35*C/2, at.MMin, 1e-9, "M_min: left of the couple")
	assert.InEpsilon(t, 1.35*C/L, at.V, 1e-9, "|V| = γ C/L")
	assert.InDelta(t, 0, at.NMax, 1e-9)
	assert.InEpsilon(t, C/2, f[1].SLS.MMax, 1e-9, "SLS characteristic: γ = 1")
	// at L/4 (no jump) M = −C/4 only: M_max is the less hogging of 1.35 and 1.00 × (−C/4)
	assert.InEpsilon(t, -1.00*C/4, f[0].ULS.MMax, 1e-9)
	assert.InEpsilon(t, -1.35*C/4, f[0].ULS.MMin, 1e-9)
}

// TestKeepOutReasons: positions inside a keep-out zone of the demo job carry the zone's
// reason and are not sized; the ones outside are sized.
func TestKeepOutReasons(t *testing.T) {
	r, err := Run(demoSetup(t), Settings{Step: 50})
	require.NoError(t, err)
	at := func(x float64) Candidate {
		for _, c := range r.Candidates {
			if math.Abs(c.X-x) < 1e-6 {
				return c
			}
		}
		t.Fatalf("no candidate at %g mm", x)
		return Candidate{}
	}
	tests := []struct {
		name string
		x    float64 // mm
		key  string
		text string
	}{
		{"0.9 m right of the support at 20.5 m (keep-out 1 m)", 21400, "limits.keep_out.supports", "support at 20.5 m"},
		{"exactly 1 m from the support: the zone is closed", 19500, "limits.keep_out.supports", "support at 20.5 m"},
		{"0.35 m from the point load of G at 14.25 m (keep-out 0.4 m)", 14600, "limits.keep_out.point_loads", "point load of case G at 14.25 m"},
		{"inside the user range [9.2, 10.6] m", 9900, "limits.keep_out.ranges[0]", "range 9.2 m to 10.6 m"},
		{"2.5 m from the left end, min piece 3 m", 2500, "limits.min_piece_length", "left end"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			c := at(tc.x)
			require.False(t, c.Feasible)
			require.NotNil(t, c.Zone)
			assert.Equal(t, tc.key, c.Zone.Key)
			assert.Contains(t, c.Reason, tc.text)
			assert.Zero(t, c.Design.Cost, "not sized")
		})
	}
	c := at(15000)
	assert.True(t, c.Feasible, "15 m is clear of every zone: %s", c.Reason)
	assert.Greater(t, c.Design.Cost, 0.0)
	assert.Positive(t, c.Rank)
}

// TestInfeasiblePositionNamesTheCheck: a moment of 1500 kNm on the demo's IPE 450 is above
// its plastic resistance Wpl,y fy = 1702 cm³ × 355 N/mm² ≈ 604 kNm (EN 10365 Wpl,y, from
// memory), so no cover-plate splice can pass; the reason names the failing check and by how
// much it fails.
func TestInfeasiblePositionNamesTheCheck(t *testing.T) {
	d := demoSetup(t).NewSpliceDesigner(false)
	f := ForceSet{MMax: 1500e6, MMin: -1500e6, V: 300e3}
	des, err := d.Design(PositionForces{ULS: f, SLS: ForceSet{MMax: 1100e6, MMin: -1100e6, V: 220e3}})
	require.NoError(t, err)
	require.False(t, des.Feasible)
	assert.Contains(t, des.Reason, "no splice passes")
	assert.Contains(t, des.Reason, des.Governing)
	assert.Contains(t, des.Reason, "% over")
	assert.Greater(t, des.Utilisation, 1.0)
	assert.Zero(t, des.Cost)
}

// TestMirrorSymmetricBeamGivesMirrorSymmetricCandidates: equal spans, overhangs and loads
// about midlength, positions every 0.1 m on a 22 m beam, so the grid is symmetric too. The
// candidate at x and the one at L − x must agree: feasibility, splice cost (to rounding) and
// utilisation (kind: property, symmetry).
func TestMirrorSymmetricBeamGivesMirrorSymmetricCandidates(t *testing.T) {
	r, err := Run(loadJob(t, "symmetric.yaml"), Settings{})
	require.NoError(t, err)
	cs := r.Candidates
	require.Len(t, cs, 219) // 22 m / 0.1 m − 1
	feasible := 0
	for i := range cs {
		a, b := cs[i], cs[len(cs)-1-i]
		require.InDelta(t, r.Setup.Model.Length, a.X+b.X, 1e-6)
		require.Equal(t, a.Feasible, b.Feasible, "x = %g mm", a.X)
		if !a.Feasible {
			continue
		}
		feasible++
		assert.InDelta(t, a.Design.Cost, b.Design.Cost, 1e-6, "cost at x = %g mm", a.X)
		assert.InDelta(t, a.Design.Utilisation, b.Design.Utilisation, 1e-6, "utilisation at x = %g mm", a.X)
		assert.Equal(t, a.Design.Summary, b.Design.Summary)
		assert.InDelta(t, a.Forces.ULS.V, b.Forces.ULS.V, 1e-3)
	}
	assert.Greater(t, feasible, 100)
}

// checkLayout verifies one reported layout against every limit of the result.
func checkLayout(t *testing.T, r *Outcome, l Layout) {
	t.Helper()
	var vehicle *Vehicle
	for i := range r.Setup.Vehicles {
		if r.Setup.Vehicles[i].Name == l.Vehicle {
			vehicle = &r.Setup.Vehicles[i]
		}
	}
	if len(r.Setup.Vehicles) > 0 {
		require.NotNil(t, vehicle, "vehicle %q", l.Vehicle)
	}
	require.Len(t, l.Pieces, len(l.Splices)+1)
	assert.InDelta(t, 0, l.Pieces[0].From, 1e-9)
	assert.InDelta(t, r.Setup.Model.Length, l.Pieces[len(l.Pieces)-1].To, 1e-9)
	total := 0.0
	for i, p := range l.Pieces {
		assert.InDelta(t, p.To-p.From, p.Length, 1e-9)
		assert.LessOrEqual(t, p.Length, r.Limits.MaxLength+1e-6, "piece %d length", i)
		if len(l.Splices) > 0 {
			assert.GreaterOrEqual(t, p.Length, r.Limits.MinLength-1e-6, "piece %d length", i)
		}
		assert.LessOrEqual(t, p.Mass, r.Limits.MaxMass+1e-6, "piece %d mass", i)
		assert.InDelta(t, r.Setup.Section.Mass*p.Length/1000+p.SpliceMass+r.Limits.Rigging, p.Mass, 1e-9)
		if vehicle != nil {
			assert.LessOrEqual(t, p.Length, vehicle.MaxLength+1e-6)
			assert.LessOrEqual(t, p.Mass, vehicle.Payload+1e-6)
		}
		if i > 0 {
			assert.InDelta(t, r.Gap(), p.From-l.Pieces[i-1].To, 1e-9, "gap at the splice")
		}
		total += p.Mass
	}
	splices := 0.0
	for k, site := range l.Sites {
		c := r.Candidates[r.layoutSites()[site]]
		require.True(t, c.Feasible)
		assert.Equal(t, c.X, l.Splices[k])
		splices += c.Design.Cost
	}
	assert.InDelta(t, splices, l.Cost.Splices, 1e-5)
	assert.InDelta(t, r.Setup.Lift*float64(len(l.Pieces)), l.Cost.Erection, 1e-6)
	if vehicle != nil {
		assert.InDelta(t, vehicle.Cost*float64(l.Trips), l.Cost.Transport, 1e-6)
		assert.GreaterOrEqual(t, float64(l.Trips), math.Ceil(total/vehicle.Payload-1e-9))
	}
	assert.InDelta(t, l.Cost.Splices+l.Cost.Transport+l.Cost.Erection, l.Cost.Total, 1e-5)
	if r.Setup.MaxSplices >= 0 {
		assert.LessOrEqual(t, len(l.Splices), r.Setup.MaxSplices)
	}
	assert.GreaterOrEqual(t, len(l.Splices), r.Setup.MinSplices)
}

// layoutSites maps the site indices of the layout search back to candidate indices.
func (r *Outcome) layoutSites() []int {
	var out []int
	for i, c := range r.Candidates {
		if c.Feasible {
			out = append(out, i)
		}
	}
	return out
}

// TestEveryReportedPieceWithinEveryLimit on the demo job and the small test job, with a
// rigging allowance.
func TestEveryReportedPieceWithinEveryLimit(t *testing.T) {
	for _, tc := range []struct {
		name  string
		setup *Setup
		set   Settings
	}{
		{"demo at 0.1 m", demoSetup(t), Settings{Step: 100}},
		{"demo, 60 kg rigging", demoSetup(t), Settings{Step: 100, Rigging: 60}},
		{"small design space", loadJob(t, "small-space.yaml"), Settings{}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			r, err := Run(tc.setup, tc.set)
			require.NoError(t, err)
			require.NotEmpty(t, r.Layouts.ByCount)
			for i, l := range append(append([]Layout{}, r.Layouts.ByCount...), r.Layouts.Alternatives...) {
				t.Logf("layout %d: %v m, %s, total %.2f", i, l.Splices, l.Vehicle, l.Cost.Total)
				checkLayout(t, r, l)
			}
			counts := []int{}
			for _, l := range r.Layouts.ByCount {
				counts = append(counts, len(l.Splices))
			}
			fewest := counts[0]
			assert.Equal(t, []int{fewest, fewest + 1, fewest + 2}, counts[:3], "the fewest feasible count and the next two")
			for _, l := range r.Layouts.ByCount {
				assert.GreaterOrEqual(t, l.Cost.Total, r.Recommended().Cost.Total)
			}
		})
	}
}

// TestBeamShorterThanMaxPieceNeedsNoSplice: a single 9 m span under max_piece_length 13.6 m
// and the cheapest vehicle's 10 m is delivered in one piece: zero splices, one lift, one trip.
func TestBeamShorterThanMaxPieceNeedsNoSplice(t *testing.T) {
	r, err := Run(loadJob(t, "short-beam.yaml"), Settings{})
	require.NoError(t, err)
	best := r.Recommended()
	assert.Empty(t, best.Splices)
	require.Len(t, best.Pieces, 1)
	assert.InDelta(t, 9000, best.Pieces[0].Length, 1e-9)
	assert.Equal(t, "rigid 10 m", best.Vehicle, "9 m fits the cheapest tier")
	// total = one trip on the rigid 10 m (520) + one lift (165), no splice
	assert.InDelta(t, 520+165, best.Cost.Total, 1e-9)
	assert.Empty(t, r.Layouts.ByCount[0].Splices, "the fewest feasible count is zero")
	checkLayout(t, r, best)
}
