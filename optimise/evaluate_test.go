package optimise

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestPriceIsTheHandArithmetic: the beam of tierProblem with splices at 4 m and 12 m, priced
// by the cost rule of DESIGN.md section 6 (closed form, hand arithmetic):
//
//	pieces 4, 8 and 8 m, all within the rigid lorry's 8 m: 2 × 300 + 1 trip × 400 + 3 lifts × 150 = 1450;
//	on the semi-trailer the same pieces cost 2 × 300 + 1500 + 450 = 2550, so the lorry is used;
//	masses 4 m × 100 kg/m + 40/2 = 420 kg, 8 m + 2 × 20 = 840 kg, 8 m + 20 = 820 kg.
//
// With a splice at 13 m alone the 13 m piece is too long for the lorry: the semi-trailer,
// 300 + 1500 + 2 × 150 = 2100.
func TestPriceIsTheHandArithmetic(t *testing.T) {
	p := tierProblem(400)
	l, ok := p.Price([]int{3, 11}) // sites at 4 m and 12 m
	require.True(t, ok)
	assert.Equal(t, []float64{4000, 12000}, l.Splices)
	assert.Equal(t, "rigid", l.Vehicle)
	assert.Equal(t, 1, l.Trips)
	assert.Equal(t, CostBreakdown{Splices: 600, Transport: 400, Erection: 450, Total: 1450}, l.Cost)
	require.Len(t, l.Pieces, 3)
	assert.Equal(t, []float64{420, 840, 820}, []float64{l.Pieces[0].Mass, l.Pieces[1].Mass, l.Pieces[2].Mass})

	l, ok = p.Price([]int{12}) // 13 m
	require.True(t, ok)
	assert.Equal(t, "semi-trailer", l.Vehicle)
	assert.Equal(t, 2100.0, l.Cost.Total)

	// every piece fits a vehicle, but the 14 m piece from 6 m takes none: no tier
	l, ok = p.Price([]int{5}) // 6 m: pieces 6 m and 14 m
	assert.False(t, ok)
	require.Len(t, l.Pieces, 2, "the pieces are still given")
	assert.Equal(t, 14000.0, l.Pieces[1].Length)
}

// TestNoOneVehicleTakesEveryPiece: a 20 m beam of 100 kg/m, no gap, splices at 9 m (no mass)
// and 12 m (1000 kg, 500 kg on each side). Pieces: 9 m of 900 kg, 3 m of 300 + 500 = 800 kg,
// 8 m of 800 + 500 = 1300 kg (hand arithmetic). Vehicle A carries 8.5 m and 5000 kg: not the
// 9 m piece; vehicle B carries 13.6 m and 1000 kg: not the 1300 kg piece. Each piece fits a
// vehicle, none takes them all.
func TestNoOneVehicleTakesEveryPiece(t *testing.T) {
	p := LayoutProblem{Length: 20000, MassPerLength: 0.1, Limits: PieceLimits{MaxLength: 1e9, MaxMass: 1e9}, MaxSplices: -1,
		Vehicles: []Vehicle{{Name: "A", MaxLength: 8500, Payload: 5000, Cost: 100}, {Name: "B", MaxLength: 13600, Payload: 1000, Cost: 100}},
		Sites:    []Site{{X: 9000}, {X: 12000, Mass: 1000}}}
	l, ok := p.Price([]int{0, 1})
	require.False(t, ok)
	require.Len(t, l.Pieces, 3)
	assert.Equal(t, []float64{900, 800, 1300}, []float64{l.Pieces[0].Mass, l.Pieces[1].Mass, l.Pieces[2].Mass})
	for _, pc := range l.Pieces {
		assert.Empty(t, p.breaches(pc, false), "each piece alone fits a vehicle")
	}
	msg := p.noCommonTier(l.Pieces)
	assert.Contains(t, msg, "no one vehicle takes every piece")
	assert.Contains(t, msg, "the longest is 9 m, the heaviest 1300 kg")
}

// TestEvaluateEveryReportedLayoutPricesAtItsCost: every layout the search reports on the
// demo job (best for each count and the alternatives), placed by hand, prices at exactly its
// reported cost, vehicle, trips and pieces — the same arithmetic (regression against the
// search's own result, which the brute-force tests check).
func TestEvaluateEveryReportedLayoutPricesAtItsCost(t *testing.T) {
	o, err := Run(demoSetup(t), Settings{Step: 100})
	require.NoError(t, err)
	layouts := append(append([]Layout{}, o.Layouts.ByCount...), o.Layouts.Alternatives...)
	require.Greater(t, len(layouts), 3)
	for _, l := range layouts {
		e, err := o.Evaluate(l.Splices)
		require.NoError(t, err)
		require.True(t, e.Feasible, "%v: %v", l.Splices, e.Reasons)
		assert.Empty(t, e.Reasons)
		assert.Equal(t, l.Cost, e.Layout.Cost, "%v", l.Splices)
		assert.Equal(t, l.Vehicle, e.Layout.Vehicle)
		assert.Equal(t, l.Trips, e.Layout.Trips)
		assert.Equal(t, l.Pieces, e.Layout.Pieces)
		assert.Equal(t, l.Sites, e.Layout.Sites, "sites index the search's sites")
		assert.InDelta(t, l.Cost.Total-o.Recommended().Cost.Total, e.Difference, 1e-6)
		require.Len(t, e.Pieces, len(l.Pieces))
		for _, pc := range e.Pieces {
			assert.Empty(t, pc.Breaks)
		}
	}
	e, err := o.Evaluate(o.Recommended().Splices)
	require.NoError(t, err)
	assert.Equal(t, 0.0, e.Difference, "the recommended layout is the optimum")
}

// TestEvaluateSnapsToTheScanGrid: a position within half a step of a scan position takes
// that position's splice; the demo's step is 0.05 m, so 5.02 m is 5.00 m and 5.03 m is
// 5.05 m; the order of the positions asked does not matter.
func TestEvaluateSnapsToTheScanGrid(t *testing.T) {
	o, err := Run(demoSetup(t), Settings{})
	require.NoError(t, err)
	rec := o.Recommended()
	require.Equal(t, []float64{5000, 18250}, rec.Splices, "the demo's recommended layout, as its golden outputs print it")
	e, err := o.Evaluate([]float64{18250 - 24, 5020})
	require.NoError(t, err)
	require.True(t, e.Feasible, "%v", e.Reasons)
	assert.Equal(t, rec.Cost, e.Layout.Cost)
	assert.Equal(t, []float64{5000, 18250}, []float64{e.Splices[0].X, e.Splices[1].X})
	assert.Equal(t, []float64{5020, 18226}, []float64{e.Splices[0].Asked, e.Splices[1].Asked})

	e, err = o.Evaluate([]float64{5030, 18250})
	require.NoError(t, err)
	assert.Equal(t, 5050.0, e.Splices[0].X)
	c := o.CandidateAt(5050)
	require.NotNil(t, c)
	assert.Equal(t, c.Design, e.Splices[0].Design)
}

// TestEvaluateRefusesWithReasons: each way a hand-placed layout can be inadmissible on the
// demo job (IPE 450, 30.3 m long, supports at 0, 8, 20.5 and 28.5 m, point loads of case G at
// 14.25 m and of case E at 4 and 24.5 m, keep-out 1 m each side of a support and 0.4 m each
// side of a point load, pieces 3 m to 18.5 m and 3500 kg, at most 4 splices, gap 10 mm) names
// its limit and key.
func TestEvaluateRefusesWithReasons(t *testing.T) {
	o, err := Run(demoSetup(t), Settings{})
	require.NoError(t, err)
	for _, tc := range []struct {
		name    string
		xs      []float64
		reasons []string
	}{
		{"keep-out at a support", []float64{8000, 18250}, []string{"S1 at 8 m: keep-out: 1 m each side of the support at 8 m (limits.keep_out.supports)"}},
		{"keep-out at a point load", []float64{5000, 14250}, []string{"S2 at 14.25 m: keep-out: 0.4 m each side of the point load of case G at 14.25 m (limits.keep_out.point_loads)"}},
		{"off the beam", []float64{-1000, 5000}, []string{"S1 at -1 m: off the beam, which runs from 0 to 30.3 m"}},
		{"at the right end", []float64{30300}, []string{"S1 at 30.3 m: off the beam"}},
		// one splice at 5 m: the second piece is 30.3 − 5.005 = 25.295 m
		{"piece too long", []float64{5000}, []string{"piece 2 (5.005 m to 30.3 m): 25.295 m long, over max_piece_length 18.5 m (limits.max_piece_length)"}},
		// 5 m and 6.5 m: the middle piece is 6.495 − 5.005 = 1.49 m
		{"piece too short", []float64{5000, 6500, 18250}, []string{"piece 2 (5.005 m to 6.495 m): 1.49 m long, under min_piece_length 3 m (limits.min_piece_length)"}},
		{"two at one position", []float64{5000, 5010, 18250}, []string{"S1 and S2 are at the same scan position 5 m"}},
		{"too many splices", []float64{3100, 6500, 12000, 18250, 23000}, []string{"5 splice(s), more than the 4 the job allows (limits.splices.max)"}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			e, err := o.Evaluate(tc.xs)
			require.NoError(t, err)
			assert.False(t, e.Feasible)
			assert.Equal(t, Layout{}, e.Layout, "no price for an inadmissible layout")
			for _, want := range tc.reasons {
				assert.True(t, strings.Contains(strings.Join(e.Reasons, "\n"), want), "want %q in\n%s", want, strings.Join(e.Reasons, "\n"))
			}
		})
	}
	// the breaches are on the pieces too, for the drawing: one splice at 25 m leaves a first
	// piece of 25 − 0.005 = 24.995 m
	e, err := o.Evaluate([]float64{25000})
	require.NoError(t, err)
	require.Len(t, e.Pieces, 2)
	assert.Equal(t, []Breach{{Key: "limits.max_piece_length", Label: "over max length", Message: "24.995 m long, over max_piece_length 18.5 m"}},
		e.Pieces[0].Breaks)
	// not a layout at all: the error
	_, err = o.Evaluate(make([]float64, MaxEvaluatedSplices+1))
	assert.ErrorContains(t, err, "at most 64")
}

// TestEvaluateWhereNoSplicePasses: the midspan of no-splice-midspan.yaml takes no splice of
// its design space; the reason names the check that fails.
func TestEvaluateWhereNoSplicePasses(t *testing.T) {
	o, err := Run(loadJob(t, "no-splice-midspan.yaml"), Settings{})
	require.Error(t, err, "no layout fits that job")
	require.NotNil(t, o)
	e, err := o.Evaluate([]float64{5000})
	require.NoError(t, err)
	assert.False(t, e.Feasible)
	require.Len(t, e.Splices, 1)
	assert.False(t, e.Splices[0].Feasible)
	assert.Contains(t, e.Reasons[0], "S1 at 5 m: no splice passes: ")
	assert.Contains(t, e.Reasons[0], e.Splices[0].Design.Governing)
	assert.Equal(t, Layout{}, e.Optimum, "no optimum to compare with")
}

// TestWithLayoutMakesTheHandLayoutTheRecommendation: the copy has the hand layout as its one
// recommended layout with full sheets, and the original is unchanged.
func TestWithLayoutMakesTheHandLayoutTheRecommendation(t *testing.T) {
	o, err := Run(demoSetup(t), Settings{Step: 100})
	require.NoError(t, err)
	before := o.Recommended()
	e, err := o.Evaluate([]float64{13000, 26500})
	require.NoError(t, err)
	require.True(t, e.Feasible, "%v", e.Reasons)
	w, err := o.WithLayout(e)
	require.NoError(t, err)
	assert.True(t, w.Placed)
	assert.Equal(t, e.Layout, w.Recommended())
	require.Len(t, w.Chosen, 2)
	assert.Equal(t, 13000.0, w.Chosen[0].Position)
	assert.Equal(t, *o.CandidateAt(13000).Design.Geometry, w.Chosen[0].Result.Geometry, "the scan's splice, checked in full")
	assert.Contains(t, w.Notes[len(w.Notes)-1], "placed by hand")
	assert.Contains(t, w.Notes[len(w.Notes)-1], "splices at 13, 26.5 m")
	assert.Equal(t, before, o.Recommended(), "the original outcome is unchanged")
	assert.False(t, o.Placed)
	assert.Len(t, o.Notes, len(w.Notes)-1)

	bad, err := o.Evaluate([]float64{10500})
	require.NoError(t, err)
	_, err = o.WithLayout(bad)
	assert.ErrorContains(t, err, "not admissible")
}
