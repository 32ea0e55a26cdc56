package encode

import (
	"encoding/json"
	"fmt"
	"sync"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise"
)

var demo = sync.OnceValues(func() (*optimise.Outcome, error) {
	s, err := optimise.Prepare(optimise.DemoJobName, optimise.DemoJob())
	if err != nil {
		return nil, err
	}
	return optimise.Run(s, optimise.Settings{})
})

// demoOutcome optimises the embedded demo job once for the tests of this package.
func demoOutcome(t *testing.T) *optimise.Outcome {
	t.Helper()
	o, err := demo()
	require.NoError(t, err)
	return o
}

func mustJSON(t *testing.T, v any) string {
	t.Helper()
	b, err := json.Marshal(v)
	require.NoError(t, err)
	return string(b)
}

func TestChosenSplicesJSON(t *testing.T) {
	res := demoOutcome(t)
	rec := res.Recommended()
	raw, err := json.Marshal(ChosenSplices(res.Chosen, res.Bill().Splices))
	require.NoError(t, err)
	var out []struct {
		Name      string           `json:"name"`
		Governing string           `json:"governing"`
		Position  float64          `json:"position"`
		Checks    []map[string]any `json:"checks"`
		Splice    map[string]any   `json:"splice"`
	}
	require.NoError(t, json.Unmarshal(raw, &out))
	require.Len(t, out, len(rec.Splices))
	for i, x := range rec.Splices {
		assert.Equal(t, fmt.Sprintf("S%d", i+1), out[i].Name)
		assert.InDelta(t, x/1e3, out[i].Position, 1e-6)
		assert.Equal(t, res.Chosen[i].Result.Governing.ID, out[i].Governing)
		require.Len(t, out[i].Checks, len(res.Chosen[i].Result.Checks))
		for _, key := range []string{"id", "clause", "state", "demand", "resistance", "unit", "utilisation", "pass"} {
			assert.Contains(t, out[i].Checks[0], key, "DESIGN.md section 7 check key")
		}
		for _, key := range []string{"bolt", "category", "friction_class", "holes", "gap", "flange", "web"} {
			assert.Contains(t, out[i].Splice, key, "splice file key (DESIGN.md section 8)")
		}
	}
	assert.Equal(t, "[]", mustJSON(t, ChosenSplices(nil, nil)), "no splice is an empty list, not null")
}
