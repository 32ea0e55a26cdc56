package optimise

import (
	"os"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// comparable strips what may differ between the normal and the exhaustive run and is not a
// result: the designer's own record of the configurations it evaluated.
func comparableCandidates(cs []Candidate) []Candidate {
	out := make([]Candidate, len(cs))
	for i, c := range cs {
		out[i] = c
	}
	return out
}

func requireSameResults(t *testing.T, a, b *Outcome) {
	t.Helper()
	require.Equal(t, comparableCandidates(a.Candidates), comparableCandidates(b.Candidates))
	require.Equal(t, a.Layouts, b.Layouts)
	require.Equal(t, a.Setup.Zones, b.Setup.Zones)
}

// TestExhaustiveRunGivesTheSameResults: the reference run (one envelope per position, no
// shared force sets, the splice package's exhaustive sizing, one position at a time) and the
// normal run agree on every candidate and every layout (kind: equality with the exhaustive
// version).
func TestExhaustiveRunGivesTheSameResults(t *testing.T) {
	s := loadJob(t, "small-space.yaml")
	for _, rank := range Ranks() {
		fast, err := Run(s, Settings{Rank: rank})
		require.NoError(t, err)
		slow, err := Run(s, Settings{Rank: rank, Exhaustive: true})
		require.NoError(t, err)
		requireSameResults(t, fast, slow)
		assert.Equal(t, slow.Stats.Sized, slow.Stats.Candidates-slow.Stats.KeptOut, "the reference sizes every open position")
	}
}

// TestDemoExhaustiveAt10mm is the long reference run of the benchmark: the demo job at a
// 10 mm step, normal against exhaustive. It takes tens of minutes, so it runs only with
// SPANBREAK_LONG=1 and reports both times.
func TestDemoExhaustiveAt10mm(t *testing.T) {
	if os.Getenv("SPANBREAK_LONG") != "1" {
		t.Skip("set SPANBREAK_LONG=1 to run the exhaustive demo scan at 10 mm (tens of minutes)")
	}
	s := demoSetup(t)
	t0 := time.Now()
	fast, err := Run(s, Settings{Step: 10, Workers: 1})
	require.NoError(t, err)
	tFast := time.Since(t0)
	t0 = time.Now()
	slow, err := Run(s, Settings{Step: 10, Exhaustive: true})
	require.NoError(t, err)
	tSlow := time.Since(t0)
	requireSameResults(t, fast, slow)
	t.Logf("demo at 10 mm, %d positions: normal %v (one worker), exhaustive %v, ratio %.0f",
		len(fast.Candidates), tFast, tSlow, tSlow.Seconds()/tFast.Seconds())
}
