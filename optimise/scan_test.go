package optimise

import (
	"errors"
	"sync/atomic"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/beam"
)

// countingDesigner prices a splice by the moment and counts its calls.
type countingDesigner struct{ calls atomic.Int64 }

func (d *countingDesigner) Design(f PositionForces) (SpliceDesign, error) {
	d.calls.Add(1)
	return SpliceDesign{Feasible: true, Cost: 100 + f.ULS.MMax/1e6, Utilisation: 0.5}, nil
}

// TestScanSharesEqualForceSets: an unloaded beam has the same (zero) forces everywhere, so
// the normal scan sizes one force set and shares it; the exhaustive scan sizes every position.
func TestScanSharesEqualForceSets(t *testing.T) {
	m := beam.Model{Length: 10000, Supports: []beam.Support{{X: 0, Kind: beam.Pinned}, {X: 10000, Kind: beam.Roller}},
		EI: beam.YoungModulus * 1e9, EA: beam.YoungModulus * 1e4}
	cases := []beam.Case{{Name: "G", Kind: beam.Permanent}}
	an, err := beam.NewAnalysis(m, cases)
	require.NoError(t, err)
	rules, err := beam.NewRules("EN1990", "6.10", "characteristic", nil)
	require.NoError(t, err)
	combos, err := beam.Combinations(cases, rules)
	require.NoError(t, err)
	xs, err := Grid(10000, 500)
	require.NoError(t, err)
	zones := []Zone{{From: 4000, To: 5000, Reason: "test zone", Key: "limits.keep_out.ranges[0]"}}
	for _, exhaustive := range []bool{false, true} {
		d := &countingDesigner{}
		cands, stats, err := Scan(AnalysedForces(an, combos), xs, zones, d, ScanSettings{Exhaustive: exhaustive, Workers: 3})
		require.NoError(t, err)
		require.Len(t, cands, 19)
		assert.Equal(t, 3, stats.KeptOut, "4.0, 4.5 and 5.0 m are in the closed zone")
		if exhaustive {
			assert.Equal(t, int64(16), d.calls.Load())
			assert.Equal(t, 0, stats.Shared)
		} else {
			assert.Equal(t, int64(1), d.calls.Load())
			assert.Equal(t, 15, stats.Shared)
		}
		assert.Equal(t, "test zone", cands[7].Reason)
		assert.True(t, cands[6].Feasible)
	}
}

type failingDesigner struct{}

func (failingDesigner) Design(PositionForces) (SpliceDesign, error) {
	return SpliceDesign{}, errors.New("bolts.sizes: M99 is not a bolt size")
}

func TestScanReturnsTheDesignersError(t *testing.T) {
	s := demoSetup(t)
	an, err := s.Analyse()
	require.NoError(t, err)
	for _, ex := range []bool{false, true} {
		_, _, err = Scan(AnalysedForces(an, s.Combinations), []float64{5000, 15000, 25000}, nil, failingDesigner{}, ScanSettings{Exhaustive: ex})
		require.ErrorContains(t, err, "M99")
	}
}

// TestRankings: the candidates are numbered by the ranking's measure, and the ranking breaks
// ties between layouts of equal cost.
func TestRankings(t *testing.T) {
	s := loadJob(t, "small-space.yaml")
	for _, rank := range Ranks() {
		r, err := Run(s, Settings{Rank: rank})
		require.NoError(t, err)
		measure := func(c Candidate) float64 {
			switch rank {
			case RankBolts:
				return float64(c.Design.Bolts)
			case RankMass:
				return c.Design.PlateMass
			case RankUtilisation:
				return c.Design.Utilisation
			}
			return c.Design.Cost
		}
		byRank := map[int]Candidate{}
		for _, c := range r.Candidates {
			if c.Feasible {
				require.NotContains(t, byRank, c.Rank)
				byRank[c.Rank] = c
			} else {
				assert.Zero(t, c.Rank)
			}
		}
		for k := 2; k <= len(byRank); k++ {
			require.Contains(t, byRank, k)
			assert.LessOrEqual(t, measure(byRank[k-1]), measure(byRank[k]), "%s: rank %d", rank, k)
		}
	}
	_, err := ParseRank("price")
	require.ErrorContains(t, err, "cost, bolts, mass, utilisation")
}

func TestBatch(t *testing.T) {
	good := DemoJob()
	inputs := []BatchInput{
		{File: "demo.yaml", Data: good},
		{File: "missing.yaml", Err: errors.New("open missing.yaml: no such file or directory")},
		{File: "broken.yaml", Data: []byte("title: [unclosed\n")},
	}
	var calls []int
	out := Batch(inputs, Settings{Step: 250}, 2, func(done, total int) {
		require.Equal(t, 3, total)
		calls = append(calls, done)
	})
	require.Len(t, out, 3)
	assert.Equal(t, []int{1, 2, 3}, calls)
	assert.NoError(t, out[0].Err)
	require.NotNil(t, out[0].Outcome)
	assert.Equal(t, "Roof girder over a bus-depot wash bay (demo data, invented)", out[0].Title)
	assert.ErrorContains(t, out[1].Err, "no such file")
	assert.ErrorContains(t, out[2].Err, "broken.yaml")
	// the batch result is the single run's
	single, err := Run(demoSetup(t), Settings{Step: 250})
	require.NoError(t, err)
	assert.Equal(t, single.Layouts, out[0].Outcome.Layouts)
}
