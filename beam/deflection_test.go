package beam

import (
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

const deflectionTables = "standard beam tables (Roark's Formulas for Stress and Strain, Table 8.1; from memory)"

// deflectionJob analyses cases on a model and returns the analysis and its envelopes with
// EN 1990 6.10 and the characteristic SLS combinations (6.14b) at stations every step [mm].
func deflectionJob(t *testing.T, m Model, cases []Case, step float64) (*Analysis, Envelopes) {
	t.Helper()
	an, err := NewAnalysis(m, cases)
	require.NoError(t, err)
	rules, err := NewRules(SetEN1990, ULS610, SLSCharacteristic, nil)
	require.NoError(t, err)
	combos, err := Combinations(cases, rules)
	require.NoError(t, err)
	st, err := an.Stations(step)
	require.NoError(t, err)
	env, err := an.Envelopes(combos, st)
	require.NoError(t, err)
	return an, env
}

func ipe300EI(t *testing.T) (ei, ea float64) {
	t.Helper()
	s, err := LookupSection("IPE 300")
	require.NoError(t, err)
	return YoungModulus * s.Iy, YoungModulus * s.A
}

// TestDeflectionSimplySupportedSpan: L = 6 m, G = 10 kN/m, Q = 15 kN/m, SLS characteristic
// (EN 1990 6.14b): w = 25 kN/m. δ = 5wL⁴/(384EI) at mid-span (handbook closed form); limit
// L/250 = 24 mm (common practice default).
func TestDeflectionSimplySupportedSpan(t *testing.T) {
	const L, w = 6000.0, 25.0
	ei, ea := ipe300EI(t)
	m := Model{Length: L, Supports: []Support{at(0, Pinned), at(L, Roller)}, EI: ei, EA: ea}
	an, env := deflectionJob(t, m, gq(10, 15, L), 100)
	res, err := an.CheckDeflections(&env, DeflectionLimits{})
	require.NoError(t, err)
	require.Len(t, res.Regions, 1)
	r := res.Regions[0]
	delta := 5 * w * math.Pow(L, 4) / (384 * ei)
	assert.Equal(t, "span 1", r.Region.Name)
	assert.False(t, r.Overhang)
	assert.Equal(t, FromChord, r.Reference)
	assert.InEpsilon(t, delta, r.W, 1e-9, "5wL⁴/384EI, %s", deflectionTables)
	assert.InDelta(t, L/2, r.Station.X, 1e-9)
	assert.InEpsilon(t, L/250, r.Limit, 1e-12)
	assert.Equal(t, 250.0, r.Ratio)
	assert.InEpsilon(t, delta/(L/250), r.Utilisation, 1e-9)
	assert.Equal(t, r.Utilisation <= 1, r.Pass)
	assert.Equal(t, "SLS characteristic, Q leading; Q on span 1", r.Combination)
	assert.Equal(t, DeflectionLimits{Span: DefaultSpanRatio, Overhang: DefaultOverhangRatio}, res.Limits)

	// a job's own ratio
	res360, err := an.CheckDeflections(&env, DeflectionLimits{Span: 360})
	require.NoError(t, err)
	assert.InEpsilon(t, L/360, res360.Regions[0].Limit, 1e-12)
	assert.InEpsilon(t, delta/(L/360), res360.Regions[0].Utilisation, 1e-9)
}

// TestDeflectionCantilever: a cantilever fixed at x = 0, L = 2 m, G = 10 kN/m, Q = 15 kN/m:
// the whole beam is an overhang, the tip deflects wL⁴/(8EI) (handbook closed form); limit
// L/180 (common practice default for overhangs).
func TestDeflectionCantilever(t *testing.T) {
	const L, w = 2000.0, 25.0
	ei, ea := ipe300EI(t)
	m := Model{Length: L, Supports: []Support{at(0, Fixed)}, EI: ei, EA: ea}
	an, env := deflectionJob(t, m, gq(10, 15, L), 50)
	res, err := an.CheckDeflections(&env, DeflectionLimits{})
	require.NoError(t, err)
	require.Len(t, res.Regions, 1)
	r := res.Regions[0]
	assert.True(t, r.Overhang)
	assert.Equal(t, FromSupport, r.Reference)
	assert.InEpsilon(t, w*math.Pow(L, 4)/(8*ei), r.W, 1e-9, "wL⁴/8EI, %s", deflectionTables)
	assert.InDelta(t, L, r.Station.X, 1e-9)
	assert.InEpsilon(t, L/180, r.Limit, 1e-12)
	assert.InEpsilon(t, w*math.Pow(L, 4)/(8*ei)/(L/180), r.Utilisation, 1e-9)
}

// TestDeflectionOnSprings: a span on two springs k = 5000 N/mm under w = 25 kN/m settles
// wL/(2k) at each end; relative to the chord the mid-span deflection is still 5wL⁴/(384EI)
// (rigid-body movement removed), while the absolute SLS envelope adds the settlement.
func TestDeflectionOnSprings(t *testing.T) {
	const L, w, k = 6000.0, 25.0, 5000.0
	ei, ea := ipe300EI(t)
	m := Model{Length: L, Supports: []Support{{X: 0, Kind: Spring, K: k}, {X: L, Kind: Spring, K: k}}, EI: ei, EA: ea}
	an, env := deflectionJob(t, m, gq(10, 15, L), 100)
	res, err := an.CheckDeflections(&env, DeflectionLimits{})
	require.NoError(t, err)
	r := res.Regions[0]
	assert.Equal(t, FromChord, r.Reference)
	delta := 5 * w * math.Pow(L, 4) / (384 * ei)
	assert.InEpsilon(t, delta, r.W, 1e-9, deflectionTables)
	i := stationAt(t, env, L/2)
	assert.InEpsilon(t, delta+w*L/(2*k), env.SLS.WMax[i].Value, 1e-9, "absolute: plus the settlement wL/2k")
}

// TestDeflectionOverhangBeyondSpring: pinned at 0, a spring k at L, an overhang a with a
// characteristic tip load P (permanent). Statics: the spring carries R = P(L + a)/L and
// settles δs = R/k; the back span turns rigidly by δs/L about the pin. Relative to the
// spring, the tip moves Pa²(L + a)/(3EI) (handbook closed form, overhang with tip load) plus
// the rigid turn δs·a/L, which the reference keeps.
func TestDeflectionOverhangBeyondSpring(t *testing.T) {
	const L, a, P, k = 6000.0, 1500.0, 20e3, 8000.0
	ei, ea := ipe300EI(t)
	m := Model{Length: L + a, Supports: []Support{at(0, Pinned), {X: L, Kind: Spring, K: k}}, EI: ei, EA: ea}
	cases := []Case{{Name: "G", Kind: Permanent, Loads: []Load{point(P, L+a)}}}
	an, env := deflectionJob(t, m, cases, 50)
	res, err := an.CheckDeflections(&env, DeflectionLimits{Overhang: 150})
	require.NoError(t, err)
	require.Len(t, res.Regions, 2)
	over := res.Regions[1]
	require.Equal(t, "right overhang", over.Region.Name)
	assert.True(t, over.Overhang)
	ds := P * (L + a) / L / k
	want := P*a*a*(L+a)/(3*ei) + ds*a/L
	assert.InEpsilon(t, want, over.W, 1e-9, deflectionTables+", superposed with the rigid turn")
	assert.InDelta(t, L+a, over.Station.X, 1e-9)
	assert.InEpsilon(t, a/150, over.Limit, 1e-12)
	// the back span lifts between its supports relative to the chord: negative W
	assert.Negative(t, res.Regions[0].W)
}

func stationAt(t *testing.T, env Envelopes, x float64) int {
	t.Helper()
	for i, s := range env.Stations {
		if math.Abs(s.X-x) < 1e-9 {
			return i
		}
	}
	require.Failf(t, "no station", "x = %g", x)
	return -1
}

// TestDeflectionRigidSupportsEqualsEnvelope: with pinned, roller and fixed supports the
// relative deflection is the absolute one, so each region's W is the largest |WMax|, |WMin|
// of the SLS envelope at the region's stations (random patterned beams, seeded).
func TestDeflectionRigidSupportsEqualsEnvelope(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	for trial := 0; trial < 20; trial++ {
		b := drawBeam(rng, 1+rng.IntN(4))
		cases := []Case{
			{Name: "G", Kind: Permanent, Loads: b.g},
			{Name: "Q", Kind: Imposed, Category: "B", Pattern: true, Loads: append([]Load{udl(b.qFull, 0, b.model.Length)}, allLocal(b)...)},
			{Name: "W", Kind: Wind, Loads: b.w},
		}
		an, env := deflectionJob(t, b.model, cases, 200)
		res, err := an.CheckDeflections(&env, DeflectionLimits{})
		require.NoError(t, err)
		for r, reg := range an.Regions() {
			want := 0.0
			for i, s := range env.Stations {
				if s.X < reg.From-1e-6 || s.X > reg.To+1e-6 {
					continue
				}
				want = math.Max(want, math.Max(math.Abs(env.SLS.WMax[i].Value), math.Abs(env.SLS.WMin[i].Value)))
			}
			assert.InDelta(t, want, math.Abs(res.Regions[r].W), 1e-9*math.Max(want, 1), "trial %d, %s", trial, reg.Name)
		}
		g := res.Regions[res.Governing]
		for _, rd := range res.Regions {
			assert.LessOrEqual(t, rd.Utilisation, g.Utilisation)
		}
	}
}

func allLocal(b randomBeam) []Load {
	var out []Load
	for r := range b.regions {
		out = append(out, b.qLocal[r]...)
	}
	return out
}

// TestDeflectionErrors: bad limits, foreign envelopes, no SLS combination, a region with no
// station.
func TestDeflectionErrors(t *testing.T) {
	const L = 6000.0
	ei, ea := ipe300EI(t)
	m := Model{Length: 2 * L, Supports: []Support{at(0, Pinned), at(L, Roller), at(2*L, Roller)}, EI: ei, EA: ea}
	an, env := deflectionJob(t, m, gq(10, 15, 2*L), 500)

	_, err := an.CheckDeflections(&env, DeflectionLimits{Span: -250})
	assert.ErrorContains(t, err, "span ratio")
	_, err = an.CheckDeflections(&env, DeflectionLimits{Overhang: math.Inf(1)})
	assert.ErrorContains(t, err, "overhang ratio")

	other := Model{Length: L, Supports: []Support{at(0, Pinned), at(L, Roller)}, EI: ei, EA: ea}
	_, foreign := deflectionJob(t, other, gq(10, 15, L), 500)
	_, err = an.CheckDeflections(&foreign, DeflectionLimits{})
	assert.ErrorContains(t, err, "not this analysis's")

	uls, err := UserCombination("U", ULS, map[string]float64{"G": 1.35, "Q": 1.5}, gq(10, 15, 2*L))
	require.NoError(t, err)
	st, err := an.Stations(500)
	require.NoError(t, err)
	onlyULS, err := an.Envelopes([]Combination{uls}, st)
	require.NoError(t, err)
	_, err = an.CheckDeflections(&onlyULS, DeflectionLimits{})
	assert.ErrorContains(t, err, "no SLS combination")

	few, err := an.StationsAt([]float64{1000, 3000})
	require.NoError(t, err)
	envFew, err := an.Envelopes(env.Combinations, few)
	require.NoError(t, err)
	_, err = an.CheckDeflections(&envFew, DeflectionLimits{})
	assert.ErrorContains(t, err, "span 2")

	_, err = an.CheckDeflections(&Envelopes{}, DeflectionLimits{})
	assert.ErrorContains(t, err, "no stations")
}
