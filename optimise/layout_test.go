package optimise

import (
	"errors"
	"os"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// tierProblem: a 20 m beam of 100 kg/m (2000 kg), a splice possible at every metre from 1 m to
// 19 m, each costing 300 and weighing 40 kg, no gap; pieces 2 m to 13.6 m; a lift costs 150.
// Vehicles: a rigid lorry for pieces up to 8 m at rigidCost a trip (payload 10 t) and a
// semi-trailer for pieces up to 13.6 m at 1500 a trip (payload 24 t). Every layout weighs
// 2000 kg + 40 kg per splice, so one trip always suffices.
func tierProblem(rigidCost float64) LayoutProblem {
	p := LayoutProblem{Length: 20000, MassPerLength: 0.1, Limits: PieceLimits{MaxLength: 13600, MinLength: 2000,
		MaxMass: 1e9}, MaxSplices: -1, Lift: 150, Extra: 2,
		Vehicles: []Vehicle{{Name: "rigid", MaxLength: 8000, Payload: 10000, Cost: rigidCost},
			{Name: "semi-trailer", MaxLength: 13600, Payload: 24000, Cost: 1500}}}
	for x := 1; x <= 19; x++ {
		p.Sites = append(p.Sites, Site{X: float64(x) * 1000, Cost: 300, Mass: 40, Class: 0, Candidate: x - 1})
	}
	return p
}

// TestTwoSplicesBeatOneOnACheaperVehicle, the arithmetic:
//
//	no splice:   one 20 m piece, longer than any vehicle takes — infeasible.
//	one splice:  two pieces ≤ 13.6 m need the semi-trailer (two pieces ≤ 8 m cannot make 20 m):
//	             300 + 1 trip × 1500 + 2 lifts × 150 = 2100.
//	two splices: three pieces ≤ 8 m go on the rigid lorry at 400 a trip:
//	             2 × 300 + 1 × 400 + 3 × 150 = 1450 < 2100: two splices win.
//	three:       3 × 300 + 400 + 4 × 150 = 1900.
//
// With equal costs the tie goes to the splices further left, taken from the right end: the
// one splice at 7 m (the first position leaving ≤ 13.6 m on the right is 6.4 m → 7 m), the
// two at 4 m and 12 m (the last at 12 m leaves 8 m; then the first at 4 m leaves 8 m between).
func TestTwoSplicesBeatOneOnACheaperVehicle(t *testing.T) {
	res, err := Layouts(tierProblem(400))
	require.NoError(t, err)
	require.Len(t, res.ByCount, 3)
	one, two, three := res.ByCount[0], res.ByCount[1], res.ByCount[2]
	assert.Equal(t, []float64{7000}, one.Splices)
	assert.Equal(t, "semi-trailer", one.Vehicle)
	assert.Equal(t, CostBreakdown{Splices: 300, Transport: 1500, Erection: 2 * 150, Total: 2100}, one.Cost)
	assert.Equal(t, []float64{4000, 12000}, two.Splices)
	assert.Equal(t, "rigid", two.Vehicle)
	assert.Equal(t, CostBreakdown{Splices: 2 * 300, Transport: 400, Erection: 3 * 150, Total: 1450}, two.Cost)
	assert.Equal(t, 1900.0, three.Cost.Total)
	assert.Equal(t, 1, res.Recommended, "two splices are cheapest")
	// piece masses: 4 m × 100 kg/m + 40/2 kg = 420 kg; 8 m + two halves = 840 kg
	assert.Equal(t, []float64{420, 840, 820}, []float64{two.Pieces[0].Mass, two.Pieces[1].Mass, two.Pieces[2].Mass})
}

// TestOneSpliceWinsWhenTheShortVehicleIsDear: the same beam with the rigid lorry at 1300 a
// trip. Two splices now cost 2 × 300 + 1300 + 3 × 150 = 2350 on the lorry, or
// 2 × 300 + 1500 + 450 = 2550 on the semi-trailer; one splice stays at 2100 and wins.
func TestOneSpliceWinsWhenTheShortVehicleIsDear(t *testing.T) {
	res, err := Layouts(tierProblem(1300))
	require.NoError(t, err)
	require.Len(t, res.ByCount, 3)
	assert.Equal(t, 0, res.Recommended)
	assert.Equal(t, 2100.0, res.ByCount[0].Cost.Total)
	assert.Equal(t, 2350.0, res.ByCount[1].Cost.Total)
	assert.Equal(t, "rigid", res.ByCount[1].Vehicle)
}

// TestMoreTripsCanDecideTheLayout: the trips depend on every piece at once, so the layout
// with the cheapest splices is not always the cheapest. An 18 m beam of 100 kg/m, no gap,
// two splices exactly, splices of 10 kg at 3, 6, 9 and 12 m costing 150, 100, 150, 100;
// pieces up to 9 m; one vehicle, payload 1000 kg at 500 a trip; no lift cost.
//
//	6 m + 12 m: splices 200, pieces 605, 610, 605 kg: no two share a trip (≥ 1210 kg): 3 trips,
//	            200 + 3 × 500 = 1700.
//	6 m + 9 m:  splices 250, pieces 605, 310, 905 kg: {605, 310} = 915 kg and {905}: 2 trips,
//	            250 + 2 × 500 = 1250 — the cheapest (3 m + 12 m and 9 m + 12 m tie at 1250
//	            but their last splice is further right).
//
// With a 1300 kg payload 605 + 610 = 1215 kg share a trip: 6 m + 12 m, 200 + 2 × 500 = 1200.
func TestMoreTripsCanDecideTheLayout(t *testing.T) {
	p := LayoutProblem{Length: 18000, MassPerLength: 0.1, Limits: PieceLimits{MaxLength: 9000, MaxMass: 1e9},
		MinSplices: 2, MaxSplices: 2,
		Vehicles: []Vehicle{{Name: "lorry", MaxLength: 9000, Payload: 1000, Cost: 500}}}
	p.Sites = []Site{{X: 3000, Cost: 150, Mass: 10}, {X: 6000, Cost: 100, Mass: 10, Class: 1},
		{X: 9000, Cost: 150, Mass: 10, Class: 2}, {X: 12000, Cost: 100, Mass: 10, Class: 3}}
	res, err := Layouts(p)
	require.NoError(t, err)
	best := res.Best()
	assert.Equal(t, []float64{6000, 9000}, best.Splices)
	assert.Equal(t, 2, best.Trips)
	assert.Equal(t, 1250.0, best.Cost.Total)
	assert.True(t, best.Proven)
	p.Vehicles[0].Payload = 1300
	res, err = Layouts(p)
	require.NoError(t, err)
	best = res.Best()
	assert.Equal(t, []float64{6000, 12000}, best.Splices)
	assert.Equal(t, 2, best.Trips)
	assert.Equal(t, 1200.0, best.Cost.Total)
}

// TestLimitThatCannotBeMetIsNamed: the job-level error names the limit and points at it.
func TestLimitThatCannotBeMetIsNamed(t *testing.T) {
	src, err := os.ReadFile("testdata/small-space.yaml")
	require.NoError(t, err)
	tests := []struct {
		name      string
		edits     []string // old, new, old, new, ...
		key, text string
		at        string // the text of the line the error points at; "" for none
	}{
		{"crane limit below any piece", []string{"max_piece_mass: 1200", "max_piece_mass: 150"}, "limits.max_piece_mass",
			"within max_piece_mass 150 kg", "max_piece_mass: 150"},
		{"too few splices allowed", []string{"splices: {min: 0, max: 4}", "splices: {min: 0, max: 0}"}, "limits.splices.max",
			"at most 0 splice(s) allowed, but the pieces need at least 1", "splices: {min: 0, max: 0}"},
		{"a lone short vehicle and too few splices allowed", []string{
			"  - {name: rigid 8 m, max_length: 8.0, payload: 10000, cost: 450}\n", "",
			"{name: semi-trailer, max_length: 13.6,", "{name: van, max_length: 4.0,"},
			"vehicles[0].max_length", "the longest vehicle, van, takes pieces of at most 4 m (its max_length), for which the " +
				"21.2 m beam needs at least 5 splice(s); limits.splices.max allows at most 4", "{name: van"},
		{"keep-out around the supports swallows the spans", []string{"supports: 0.8", "supports: 5.0"}, "limits.keep_out",
			"no admissible splice position", ""},
		{"no vehicle long enough", []string{"max_length: 8.0,", "max_length: 2.0,", "max_length: 13.6,", "max_length: 2.2,"},
			"vehicles", "no vehicle takes the pieces", "vehicles:"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			text := string(src)
			for i := 0; i < len(tc.edits); i += 2 {
				require.Contains(t, text, tc.edits[i])
				text = strings.Replace(text, tc.edits[i], tc.edits[i+1], 1)
			}
			s, err := Prepare("job.yaml", []byte(text))
			require.NoError(t, err)
			_, err = Run(s, Settings{})
			var inf *InfeasibleError
			require.True(t, errors.As(err, &inf), "got %v", err)
			assert.Equal(t, tc.key, inf.Limit.Key)
			assert.Contains(t, err.Error(), tc.text)
			assert.Contains(t, err.Error(), "job.yaml:")
			if tc.at != "" {
				line := strings.Count(text[:strings.Index(text, tc.at)], "\n") + 1
				assert.Equal(t, line, inf.At.Line, "%v", err)
			}
		})
	}
}
