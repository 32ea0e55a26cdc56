package optimise

import (
	"bytes"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestRiggingAllowanceAddsToEveryPiece: limits.rigging adds its mass to every piece's lifted
// mass (DESIGN.md section 6: piece mass = steel + the splice parts it carries + rigging).
func TestRiggingAllowanceAddsToEveryPiece(t *testing.T) {
	base, err := Prepare("demo.yaml", DemoJob())
	require.NoError(t, err)
	withRig := bytes.Replace(DemoJob(), []byte("  max_piece_mass: 3500\n"), []byte("  max_piece_mass: 3500\n  rigging: 120\n"), 1)
	require.NotEqual(t, DemoJob(), withRig, "the demo job has max_piece_mass: 3500")
	rigged, err := Prepare("demo-rigged.yaml", withRig)
	require.NoError(t, err)
	r0, err := Run(base, Settings{Step: 200})
	require.NoError(t, err)
	r1, err := Run(rigged, Settings{Step: 200})
	require.NoError(t, err)
	a, b := r0.Recommended(), r1.Recommended()
	require.Equal(t, len(a.Pieces), len(b.Pieces))
	compared := 0
	for i := range a.Pieces {
		if a.Pieces[i].From == b.Pieces[i].From && a.Pieces[i].To == b.Pieces[i].To {
			assert.InDelta(t, a.Pieces[i].Mass+120, b.Pieces[i].Mass, 1e-9)
			assert.InDelta(t, a.Pieces[i].SteelMass, b.Pieces[i].SteelMass, 1e-9)
			compared++
		}
	}
	assert.Positive(t, compared, "the same pieces in both runs")
}
