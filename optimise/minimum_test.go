package optimise

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestMinimumForcesRaiseTheDesignState: splice.minimum_forces {moment: 0.5} on the demo's
// IPE 450 in S355 (class 1 in bending): Mc,Rd = Wpl,y·fy/γM0 = 1702 cm³ × 355 N/mm² =
// 604.2 kNm (EN 10365 Wpl,y, from memory; EN 1993-1-1 6.2.5), so every splice is designed for
// at least |M| = 302.1 kNm. At 5 m the envelope gives M_max ≈ +123 and M_min ≈ −104 kNm; both
// are raised, keeping their signs, and the sheet says so. The computed Wpl differs from the
// published one by less than 0.5 %.
func TestMinimumForcesRaiseTheDesignState(t *testing.T) {
	src := strings.Replace(string(DemoJob()), "  distribution: proportional", "  distribution: proportional\n  minimum_forces: {moment: 0.5}", 1)
	s, err := Prepare("min.yaml", []byte(src))
	require.NoError(t, err)
	mc := 1702e3 * 355.0
	o, err := DesignAt(s, 5000, nil, "")
	require.NoError(t, err)
	a := o.Result.Actions
	assert.InEpsilon(t, 0.5*mc, a.ULS.MMax, 0.005)
	assert.InEpsilon(t, -0.5*mc, a.ULS.MMin, 0.005)
	assert.Contains(t, a.MinimumNote, "M_max raised to +30")
	assert.Contains(t, a.MinimumNote, "M_min raised to -30")
	assert.Contains(t, o.Result.Notes, a.MinimumNote, "the sheet prints it")
	// the scan sizes for the raised forces: every splice costs at least as much as without
	own, err := Run(demoSetup(t), Settings{})
	require.NoError(t, err)
	raised, err := Run(s, Settings{})
	require.NoError(t, err)
	dearer := 0
	for i, c := range raised.Candidates {
		if !c.Feasible || !own.Candidates[i].Feasible {
			continue
		}
		require.GreaterOrEqual(t, c.Design.Cost, own.Candidates[i].Design.Cost, "x = %g mm", c.X)
		if c.Design.Cost > own.Candidates[i].Design.Cost {
			dearer++
		}
	}
	assert.Positive(t, dearer, "the rule makes the splices of the low-moment stretches dearer")
	assert.True(t, s.IsDefault("splice.minimum_forces") == false)
	assert.True(t, demoSetup(t).IsDefault("splice.minimum_forces"))
}
