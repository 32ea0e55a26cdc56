package optimise

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/beam"
)

// roofJobFile is a roof beam (invented data): roof imposed load Q (category H), snow S, wind W
// and a thermal action T, with the self weight off so that G is the only permanent case.
const roofJobFile = `beam:
  section: IPE 300
  spans: [6.0, 6.0]
  supports: [pinned, roller, roller]
  self_weight: false
cases:
  G: {kind: permanent, loads: [{udl: 4}]}
  Q: {kind: imposed, category: H, loads: [{udl: 3}]}
  S: {kind: snow, loads: [{udl: 2}]}
  W: {kind: wind, loads: [{udl: -1}]}
  T: {kind: thermal, loads: [{axial: 20, at: 0}]}
`

// factorsOf returns the adverse factor of each case in the named combination.
func factorsOf(t *testing.T, combos []beam.Combination, name string) map[string]float64 {
	t.Helper()
	for _, c := range combos {
		if c.Name == name {
			out := map[string]float64{}
			for _, f := range c.Factors {
				out[f.Case] = f.Adverse
			}
			return out
		}
	}
	t.Fatalf("no combination %q", name)
	return nil
}

// The job's kinds reach the combinations: T is thermal (EN 1990 Table A1.1 temperature row,
// ψ0 = 0.6, so γQ ψ0 = 1.5 × 0.6 = 0.9 accompanying in (6.10); γQ = 1.5 from Table A1.2(B)),
// and Q (category H) leads without S and W by EN 1990 A1.2.1(3) / EN 1991-1-1 3.3.2(1) unless
// combinations.roof_imposed_separate is false.
func TestPrepareThermalAndRoofRule(t *testing.T) {
	s, err := Prepare("roof.yaml", []byte(roofJobFile))
	require.NoError(t, err)
	require.Len(t, s.Cases, 5)
	assert.Equal(t, beam.Thermal, s.Cases[4].Kind)
	assert.False(t, s.Cases[4].Pattern, "a thermal case is not patterned by default")
	assert.True(t, s.Cases[1].Pattern, "an imposed case is")
	assert.False(t, s.Rules.CombineRoofImposed)

	const tol = 1e-12
	q := factorsOf(t, s.Combinations, "ULS 6.10, Q leading")
	assert.InEpsilon(t, 1.5, q["Q"], tol)
	assert.InDelta(t, 0, q["S"], 0, "snow absent while the roof imposed load leads")
	assert.InDelta(t, 0, q["W"], 0, "wind absent while the roof imposed load leads")
	assert.InEpsilon(t, 1.5*0.6, q["T"], tol, "thermal accompanying at γQ ψ0")
	w := factorsOf(t, s.Combinations, "ULS 6.10, W leading")
	assert.InEpsilon(t, 1.5*0.5, w["S"], tol, "snow accompanying wind at γQ ψ0 (H ≤ 1000 m)")
	assert.InEpsilon(t, 1.5*0.6, w["T"], tol)
	tl := factorsOf(t, s.Combinations, "ULS 6.10, T leading")
	assert.InEpsilon(t, 1.5, tl["T"], tol)
	assert.InDelta(t, 0, tl["Q"], 0, "category H ψ0 = 0")

	off, err := Prepare("roof.yaml", []byte(roofJobFile+"combinations: {roof_imposed_separate: false}\n"))
	require.NoError(t, err)
	assert.True(t, off.Rules.CombineRoofImposed)
	q = factorsOf(t, off.Combinations, "ULS 6.10, Q leading")
	assert.InEpsilon(t, 1.5*0.5, q["S"], tol, "snow at γQ ψ0 when the rule is off")
	assert.InEpsilon(t, 1.5*0.6, q["W"], tol, "wind at γQ ψ0 when the rule is off")
	assert.Equal(t, len(s.Combinations), len(off.Combinations), "the rule removes actions, not combinations")
}
