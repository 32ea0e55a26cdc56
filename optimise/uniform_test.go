package optimise

import (
	"fmt"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/require"
)

// TestUniformNotCheaperThanMixed: with the same number of splices, identical splices never
// cost less than the mixed layout, whose every splice is the cheapest at its position —
// provided those cheapest splices weigh no more than the uniform design, so that they fit the
// same pieces and trips (a lighter, dearer uniform splice could otherwise ease a mass limit).
// Random two-span jobs with the job file's design space, 40 to 90 positions (kind: property).
func TestUniformNotCheaperThanMixed(t *testing.T) {
	r := rand.New(rand.NewPCG(5, 2028))
	trials := 40
	if testing.Short() {
		trials = 10
	}
	held, dearer := 0, 0
	for trial := 0; trial < trials; trial++ {
		src, step := uniformJob(r, 40+r.IntN(50))
		s, err := Prepare("uniform.yaml", []byte(src))
		require.NoError(t, err)
		o, err := Run(s, Settings{Step: step * 1000})
		if err != nil {
			continue
		}
		u, err := o.Uniform()
		require.NoError(t, err)
		p := o.layoutProblem()
		for _, l := range u.ByCount {
			mixed := sameCount(o.Layouts.ByCount, len(l.Sites))
			if mixed == nil || len(l.Sites) == 0 {
				continue
			}
			light := true
			for _, site := range l.Sites {
				if o.Candidates[p.Sites[site].Candidate].Design.Mass() > l.Design.Mass() {
					light = false
				}
			}
			if !light {
				continue
			}
			held++
			name := fmt.Sprintf("trial %d, %d splices", trial, len(l.Sites))
			require.GreaterOrEqual(t, micro(l.Cost.Total), micro(mixed.Cost.Total), name)
			if micro(l.Cost.Total) > micro(mixed.Cost.Total) {
				dearer++
			}
		}
	}
	require.Greater(t, held, trials, "the mass condition held for most layouts")
	require.Greater(t, dearer, 0, "and some uniform layouts were dearer")
	t.Logf("%d comparisons, %d dearer", held, dearer)
}

// TestUniformDemo: on the demo job at its default step the mixed layouts of one and two
// splices use one splice design throughout, so their uniform layouts are the mixed ones —
// same positions, pieces, vehicle, trips and cost — and the uniform design is that splice,
// with each splice verified at its position; the three-splice mixed layout mixes designs
// (a piece limit pushes one splice into the stronger region), so identical splices cost more
// there (kind: regression against the mixed search).
func TestUniformDemo(t *testing.T) {
	o, err := Run(demoSetup(t), Settings{})
	require.NoError(t, err)
	u, err := o.Uniform()
	require.NoError(t, err)
	require.Len(t, u.ByCount, len(o.Layouts.ByCount))
	require.Equal(t, o.Layouts.Recommended, u.Recommended)
	p := o.layoutProblem()
	same, mixedDesigns := 0, 0
	for i, m := range o.Layouts.ByCount {
		got := u.ByCount[i]
		require.Len(t, got.Splices, len(m.Splices))
		first := o.Candidates[p.Sites[m.Sites[0]].Candidate].Design
		uniform := true
		for _, s := range m.Sites {
			uniform = uniform && sameDesign(first, o.Candidates[p.Sites[s].Candidate].Design)
		}
		if !uniform {
			mixedDesigns++
			require.Greater(t, got.Cost.Total, m.Cost.Total, "%d splices: identical splices cost more than mixed ones", len(m.Splices))
			require.Len(t, got.Designs, len(got.Sites))
			for _, ps := range got.Designs {
				require.LessOrEqual(t, ps.Utilisation, 1.0)
				require.Equal(t, got.Design.Summary, ps.Splice)
			}
			continue
		}
		same++
		require.Equal(t, m.Sites, got.Sites)
		require.Equal(t, m.Splices, got.Splices)
		require.Equal(t, m.Pieces, got.Pieces)
		require.Equal(t, m.Cost, got.Cost)
		require.Equal(t, m.Vehicle, got.Vehicle)
		require.Equal(t, m.Trips, got.Trips)
		require.Equal(t, m.Tie, got.Tie, "the mixed tie key under the cost ranking is the utilisation")

		d := got.Design
		require.Equal(t, first.Summary, d.Summary)
		require.Equal(t, first.Geometry, d.Geometry)
		require.Equal(t, first.Cost, d.Cost)
		require.Equal(t, first.Mass(), d.Mass())
		require.Equal(t, first.Bolts, d.Bolts)
		require.Equal(t, first.Holes, d.Holes)
		mixed := o.PlacedSplices(m)
		require.Len(t, got.Designs, len(m.Sites))
		for j, ps := range got.Designs {
			require.Equal(t, m.Splices[j], ps.X)
			require.Equal(t, mixed[j], ps, "each splice as the mixed layout describes it")
			require.LessOrEqual(t, ps.Utilisation, 1.0)
			require.LessOrEqual(t, ps.Utilisation, d.Utilisation)
		}
	}
	require.Positive(t, same, "some counts are uniform already")
	require.Positive(t, mixedDesigns, "the demo shows a count where identical splices cost more")
	require.Less(t, u.Stats.Listed, 200, "the bounds stop after a few of the design space's splices")
	require.Greater(t, u.Stats.Designs, 10000)
}

// TestUniformStandInDesigner: an outcome sized by a designer other than the splice package's
// is refused with an error, not a wrong answer.
func TestUniformStandInDesigner(t *testing.T) {
	s := demoSetup(t)
	o, err := Optimise(s, &countingDesigner{}, Settings{Step: 500})
	require.NoError(t, err)
	_, err = o.Uniform()
	require.ErrorContains(t, err, "not in the job's design space")
}
