package optimise

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestDesignAtInsideAKeepOutZone: the demo job has a support at 20.5 m and
// limits.keep_out.supports 1.0 (job data), so 20.2 m lies in the zone 19.5 to 21.5 m; the
// design still runs and names the zone. 15 m is clear of every zone.
func TestDesignAtInsideAKeepOutZone(t *testing.T) {
	s := demoSetup(t)
	o, err := DesignAt(s, 20200, nil, "")
	require.NoError(t, err)
	require.NotNil(t, o.KeepOut)
	assert.Equal(t, "limits.keep_out.supports", o.KeepOut.Key)
	assert.Equal(t, "keep-out: 1 m each side of the support at 20.5 m", o.KeepOut.Reason)
	assert.InDelta(t, 19500, o.KeepOut.From, 1e-9)
	assert.InDelta(t, 21500, o.KeepOut.To, 1e-9)
	assert.NotEmpty(t, o.Result.Checks, "the splice is designed all the same")

	o, err = DesignAt(s, 15000, nil, "")
	require.NoError(t, err)
	assert.Nil(t, o.KeepOut)

	// a zone reaching past the left end is clipped to the beam: the support at 0 m
	o, err = DesignAt(s, 500, nil, "")
	require.NoError(t, err)
	require.NotNil(t, o.KeepOut)
	assert.Zero(t, o.KeepOut.From)
	assert.Equal(t, "limits.keep_out.supports", o.KeepOut.Key)
}
