package optimise

import (
	"spanbreak/splice"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestFixedSpliceAlongTheBeam: one splice the office already uses (the one the demo sizes at
// 5 m), checked at every position instead of sizing one: it passes where the demo's moments
// and shears are moderate and fails near the supports and the middle of the long span, each
// failure giving its check and utilisation; the layouts use only it, and the positions it
// passes at are exactly those where Verify passes (kind: regression against Verify).
func TestFixedSpliceAlongTheBeam(t *testing.T) {
	s := demoSetup(t)
	at5, err := DesignAt(s, 5000, nil, "")
	require.NoError(t, err)
	g := at5.Result.Geometry
	o, err := Run(s, Settings{Fixed: &g})
	require.NoError(t, err)
	passes, fails := 0, 0
	for _, c := range o.Candidates {
		if c.Zone != nil {
			continue
		}
		p := s.Splice
		p.ULS = spliceForces(c.Forces.ULS)
		sls := spliceForces(c.Forces.SLS)
		p.SLS = &sls
		v, err := verifyAt(p, g)
		require.NoError(t, err)
		require.Equal(t, v.Pass, c.Feasible, "x = %g mm", c.X)
		if c.Feasible {
			passes++
			assert.Equal(t, summary(g), c.Design.Summary)
			continue
		}
		fails++
		assert.True(t, strings.HasPrefix(c.Reason, "the fixed splice fails "+v.Governing.ID), c.Reason)
		assert.Greater(t, c.Design.Utilisation, 1.0)
	}
	assert.Positive(t, passes)
	assert.Positive(t, fails, "it fails somewhere: near the supports and midspan")
	assert.Empty(t, o.Identical.ByCount, "every layout of one fixed splice is uniform already")
	for _, l := range append(append([]Layout{}, o.Layouts.ByCount...), o.Layouts.Alternatives...) {
		for _, x := range l.Splices {
			c := o.CandidateAt(x)
			require.NotNil(t, c)
			assert.True(t, c.Feasible)
			assert.Equal(t, summary(g), c.Design.Summary)
		}
	}
}

func spliceForces(f ForceSet) splice.Forces { return splice.Forces(f) }

func verifyAt(p splice.Problem, g splice.Geometry) (splice.Result, error) { return splice.Verify(p, g) }
