package beam_test

import (
	"slices"
	"strconv"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"pgregory.net/rapid"

	"spanbreak/beam"
)

// srcRoof names the rule that keeps the imposed load on a roof apart from snow and wind:
// EN 1991-1-1:2002 3.3.2(1) ("on roofs, particularly for category H roofs, imposed loads need
// not be applied in combination with either snow loads and/or wind actions", paraphrased
// from the clause), cited by the project as EN 1990 A1.2.1(3).
const srcRoof = "EN 1991-1-1 3.3.2(1) / EN 1990 A1.2.1(3)"

// roofJob is a roof beam: permanent G, roof imposed load Q (category H), snow S at a site
// below 1000 m, wind W.
func roofJob() []beam.Case {
	return []beam.Case{
		{Name: "G", Kind: beam.Permanent},
		{Name: "Q", Kind: beam.Imposed, Category: "H", Pattern: true},
		{Name: "S", Kind: beam.Snow},
		{Name: "W", Kind: beam.Wind},
	}
}

// Table A1.1 values used below (srcA11): Q category H ψ0 = ψ1 = ψ2 = 0; S (H ≤ 1000 m) 0.5,
// 0.2, 0; W 0.6, 0.2, 0. Table A1.2(B) (srcA12B): γG,sup 1.35, γG,inf 1.00, γQ 1.5, ξ 0.85.
// With the rule, Q leading takes S and W out; S or W leading takes Q out (at ψ0 = 0 it was
// already 0 there); nothing else changes.
func TestCombinationsRoofImposedApart(t *testing.T) {
	tests := []struct {
		name     string
		uls, sls string
		state    beam.LimitState
		source   string
		want     []want
	}{
		{
			name: "ULS 6.10", uls: "6.10", sls: "characteristic", state: beam.ULS,
			source: "EN 1990 (6.10), " + srcA12B + ", " + srcA11 + ", " + srcRoof,
			want: []want{
				{"ULS 6.10, Q leading", "6.10", "Q", beam.ULS,
					[4][2]float64{{1.35, 1.0}, {1.5, 0}, {0, 0}, {0, 0}}},
				{"ULS 6.10, S leading", "6.10", "S", beam.ULS,
					[4][2]float64{{1.35, 1.0}, {0, 0}, {1.5, 0}, {1.5 * 0.6, 0}}},
				{"ULS 6.10, W leading", "6.10", "W", beam.ULS,
					[4][2]float64{{1.35, 1.0}, {0, 0}, {1.5 * 0.5, 0}, {1.5, 0}}},
			},
		},
		{
			name: "ULS 6.10a and 6.10b", uls: "6.10ab", sls: "characteristic", state: beam.ULS,
			source: "EN 1990 (6.10a), (6.10b), " + srcA12B + ", " + srcA11 + ", " + srcRoof,
			want: []want{
				// 6.10a: Q at γQ ψ0 = 1.5 × 0 = 0, so snow and wind may stay
				{"ULS 6.10a", "6.10a", "", beam.ULS,
					[4][2]float64{{1.35, 1.0}, {0, 0}, {1.5 * 0.5, 0}, {1.5 * 0.6, 0}}},
				{"ULS 6.10b, Q leading", "6.10b", "Q", beam.ULS,
					[4][2]float64{{0.85 * 1.35, 1.0}, {1.5, 0}, {0, 0}, {0, 0}}},
				{"ULS 6.10b, S leading", "6.10b", "S", beam.ULS,
					[4][2]float64{{0.85 * 1.35, 1.0}, {0, 0}, {1.5, 0}, {1.5 * 0.6, 0}}},
				{"ULS 6.10b, W leading", "6.10b", "W", beam.ULS,
					[4][2]float64{{0.85 * 1.35, 1.0}, {0, 0}, {1.5 * 0.5, 0}, {1.5, 0}}},
			},
		},
		{
			name: "SLS characteristic", uls: "6.10", sls: "characteristic", state: beam.SLS,
			source: "EN 1990 (6.14b), " + srcA11 + ", " + srcRoof,
			want: []want{
				{"SLS characteristic, Q leading", "characteristic", "Q", beam.SLS,
					[4][2]float64{{1, 1}, {1, 0}, {0, 0}, {0, 0}}},
				{"SLS characteristic, S leading", "characteristic", "S", beam.SLS,
					[4][2]float64{{1, 1}, {0, 0}, {1, 0}, {0.6, 0}}},
				{"SLS characteristic, W leading", "characteristic", "W", beam.SLS,
					[4][2]float64{{1, 1}, {0, 0}, {0.5, 0}, {1, 0}}},
			},
		},
		{
			name: "SLS frequent", uls: "6.10", sls: "frequent", state: beam.SLS,
			source: "EN 1990 (6.15b), " + srcA11 + ", " + srcRoof,
			want: []want{
				// Q leading at ψ1 = 0; S and W at ψ2 = 0 in any case
				{"SLS frequent, Q leading", "frequent", "Q", beam.SLS,
					[4][2]float64{{1, 1}, {0, 0}, {0, 0}, {0, 0}}},
				{"SLS frequent, S leading", "frequent", "S", beam.SLS,
					[4][2]float64{{1, 1}, {0, 0}, {0.2, 0}, {0, 0}}},
				{"SLS frequent, W leading", "frequent", "W", beam.SLS,
					[4][2]float64{{1, 1}, {0, 0}, {0, 0}, {0.2, 0}}},
			},
		},
		{
			name: "SLS quasi-permanent", uls: "6.10", sls: "quasi-permanent", state: beam.SLS,
			source: "EN 1990 (6.16b), " + srcA11 + ", " + srcRoof,
			want: []want{
				{"SLS quasi-permanent", "quasi-permanent", "", beam.SLS,
					[4][2]float64{{1, 1}, {0, 0}, {0, 0}, {0, 0}}},
			},
		},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			r, err := beam.NewRules("EN1990", tc.uls, tc.sls, nil)
			require.NoError(t, err)
			assert.False(t, r.CombineRoofImposed, "NewRules applies the rule")
			assert.True(t, r.SeparatesRoofImposed(roofJob()))
			all, err := beam.Combinations(roofJob(), r)
			require.NoError(t, err)
			assertCombinations(t, roofJob(), tc.want, ofState(all, tc.state), tc.source)
			assertRoofApart(t, roofJob(), all)
		})
	}
}

// assertRoofApart fails where a combination has a category H case and a snow or wind case
// both with a non-zero factor.
func assertRoofApart(t *testing.T, cases []beam.Case, combos []beam.Combination) {
	t.Helper()
	for _, c := range combos {
		var roof, climate []string
		for i, f := range c.Factors {
			if f.Adverse == 0 && f.Relieving == 0 {
				continue
			}
			switch cases[i].Kind {
			case beam.Snow, beam.Wind:
				climate = append(climate, f.Case)
			case beam.Imposed:
				if cases[i].Category == "H" {
					roof = append(roof, f.Case)
				}
			}
		}
		assert.False(t, len(roof) > 0 && len(climate) > 0,
			"%s: roof imposed %v together with snow or wind %v (%s)", c.Name, roof, climate, srcRoof)
	}
}

// Turned off, the roof imposed load is combined like any other imposed load: Q leading keeps
// snow and wind at γQ ψ0 (EN 1990 (6.10) and (6.14b) with Table A1.1).
func TestCombinationsRoofImposedCombined(t *testing.T) {
	r, err := beam.NewRules("EN1990", "6.10", "characteristic", nil)
	require.NoError(t, err)
	r.CombineRoofImposed = true
	assert.False(t, r.SeparatesRoofImposed(roofJob()))
	all, err := beam.Combinations(roofJob(), r)
	require.NoError(t, err)
	source := "EN 1990 (6.10), (6.14b), " + srcA12B + ", " + srcA11 + ", rule not applied"
	assertCombinations(t, roofJob(), []want{
		{"ULS 6.10, Q leading", "6.10", "Q", beam.ULS,
			[4][2]float64{{1.35, 1.0}, {1.5, 0}, {1.5 * 0.5, 0}, {1.5 * 0.6, 0}}},
		{"ULS 6.10, S leading", "6.10", "S", beam.ULS,
			[4][2]float64{{1.35, 1.0}, {1.5 * 0, 0}, {1.5, 0}, {1.5 * 0.6, 0}}},
		{"ULS 6.10, W leading", "6.10", "W", beam.ULS,
			[4][2]float64{{1.35, 1.0}, {1.5 * 0, 0}, {1.5 * 0.5, 0}, {1.5, 0}}},
	}, ofState(all, beam.ULS), source)
	assertCombinations(t, roofJob(), []want{
		{"SLS characteristic, Q leading", "characteristic", "Q", beam.SLS,
			[4][2]float64{{1, 1}, {1, 0}, {0.5, 0}, {0.6, 0}}},
		{"SLS characteristic, S leading", "characteristic", "S", beam.SLS,
			[4][2]float64{{1, 1}, {0, 0}, {1, 0}, {0.6, 0}}},
		{"SLS characteristic, W leading", "characteristic", "W", beam.SLS,
			[4][2]float64{{1, 1}, {0, 0}, {0.5, 0}, {1, 0}}},
	}, ofState(all, beam.SLS), source)
}

// The rule only matters where both groups are present: a floor beam (category B, snow, wind)
// and a roof without snow or wind keep every combination.
func TestCombinationsRoofRuleNeedsBothGroups(t *testing.T) {
	r, err := beam.NewRules("EN1990", "6.10ab", "characteristic", nil)
	require.NoError(t, err)
	off := r
	off.CombineRoofImposed = true
	roofOnly := []beam.Case{{Name: "G", Kind: beam.Permanent}, {Name: "Q", Kind: beam.Imposed, Category: "H"},
		{Name: "T", Kind: beam.Thermal}}
	for name, cases := range map[string][]beam.Case{"floor": handJob(), "roof without snow or wind": roofOnly} {
		t.Run(name, func(t *testing.T) {
			assert.False(t, r.SeparatesRoofImposed(cases))
			on, err := beam.Combinations(cases, r)
			require.NoError(t, err)
			combined, err := beam.Combinations(cases, off)
			require.NoError(t, err)
			assert.Equal(t, combined, on)
		})
	}
}

// A roof imposed load given ψ > 0 accompanies a floor imposed load F: the combination with F
// leading, in which Q and S, W would act together, becomes two. The ψ of Q is given in the job
// (Table A1.1 has 0); its value 0.4/0.3/0.2 is arbitrary, chosen to make Q accompany.
func TestCombinationsRoofImposedSplit(t *testing.T) {
	roofPsi := [3]float64{0.4, 0.3, 0.2}
	cases := []beam.Case{
		{Name: "G", Kind: beam.Permanent},
		{Name: "F", Kind: beam.Imposed, Category: "B"},
		{Name: "Q", Kind: beam.Imposed, Category: "H", Psi: &roofPsi},
		{Name: "W", Kind: beam.Wind},
	}
	r, err := beam.NewRules("EN1990", "6.10ab", "quasi-permanent", nil)
	require.NoError(t, err)
	all, err := beam.Combinations(cases, r)
	require.NoError(t, err)
	source := "EN 1990 (6.10a), (6.10b), (6.16b), " + srcA12B + ", " + srcA11 + " (F category B, W), " + srcRoof
	assertCombinations(t, cases, []want{
		{"ULS 6.10a, without snow and wind", "6.10a", "", beam.ULS,
			[4][2]float64{{1.35, 1.0}, {1.5 * 0.7, 0}, {1.5 * 0.4, 0}, {0, 0}}},
		{"ULS 6.10a, without roof imposed", "6.10a", "", beam.ULS,
			[4][2]float64{{1.35, 1.0}, {1.5 * 0.7, 0}, {0, 0}, {1.5 * 0.6, 0}}},
		{"ULS 6.10b, F leading, without snow and wind", "6.10b", "F", beam.ULS,
			[4][2]float64{{0.85 * 1.35, 1.0}, {1.5, 0}, {1.5 * 0.4, 0}, {0, 0}}},
		{"ULS 6.10b, F leading, without roof imposed", "6.10b", "F", beam.ULS,
			[4][2]float64{{0.85 * 1.35, 1.0}, {1.5, 0}, {0, 0}, {1.5 * 0.6, 0}}},
		{"ULS 6.10b, Q leading", "6.10b", "Q", beam.ULS,
			[4][2]float64{{0.85 * 1.35, 1.0}, {1.5 * 0.7, 0}, {1.5, 0}, {0, 0}}},
		{"ULS 6.10b, W leading", "6.10b", "W", beam.ULS,
			[4][2]float64{{0.85 * 1.35, 1.0}, {1.5 * 0.7, 0}, {0, 0}, {1.5, 0}}},
	}, ofState(all, beam.ULS), source)
	// ψ2 of wind is 0, so Q at ψ2 = 0.2 does not meet it: one combination, unchanged.
	assertCombinations(t, cases, []want{
		{"SLS quasi-permanent", "quasi-permanent", "", beam.SLS,
			[4][2]float64{{1, 1}, {0.3, 0}, {0.2, 0}, {0, 0}}},
	}, ofState(all, beam.SLS), source)
	assertRoofApart(t, cases, all)
}

// Over random jobs and ψ values the rule's set is exactly the set without it, each combination
// restricted to the alternatives the rule allows: with H leading, the one without snow and
// wind; with snow or wind leading, the one without H; otherwise both where both groups act.
func TestCombinationsRoofImposedProperties(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		n := rapid.IntRange(1, 7).Draw(t, "cases")
		cases := make([]beam.Case, n)
		for i := range cases {
			kind := beam.ActionKind(rapid.IntRange(0, int(beam.Thermal)).Draw(t, "kind"))
			c := beam.Case{Name: "C" + strconv.Itoa(i), Kind: kind}
			switch kind {
			case beam.Imposed:
				c.Category = rapid.SampledFrom([]string{"B", "H", "H"}).Draw(t, "category")
			case beam.OtherVariable:
				c.Psi = &[3]float64{0.5, 0.5, 0.5}
			}
			if kind.Variable() && rapid.Bool().Draw(t, "explicit ψ") {
				c.Psi = &[3]float64{rapid.Float64Range(0, 1).Draw(t, "ψ0"), rapid.Float64Range(0, 1).Draw(t, "ψ1"),
					rapid.Float64Range(0, 1).Draw(t, "ψ2")}
			}
			cases[i] = c
		}
		uls := rapid.SampledFrom([]string{"6.10", "6.10ab"}).Draw(t, "uls")
		sls := rapid.SampledFrom([]string{"characteristic", "frequent", "quasi-permanent"}).Draw(t, "sls")
		r, err := beam.NewRules("EN1990", uls, sls, nil)
		if err != nil {
			t.Fatalf("NewRules: %v", err)
		}
		on, err := beam.Combinations(cases, r)
		if err != nil {
			t.Fatalf("Combinations: %v", err)
		}
		r.CombineRoofImposed = true
		off, _ := beam.Combinations(cases, r)

		var want []beam.Combination
		for _, c := range off {
			want = append(want, allowedAlternatives(cases, c)...)
		}
		if len(on) != len(want) {
			t.Fatalf("%d combinations with the rule, want %d", len(on), len(want))
		}
		for k := range want {
			if !slices.Equal(adverse(on[k]), adverse(want[k])) || on[k].Leading != want[k].Leading ||
				on[k].State != want[k].State || on[k].Rule != want[k].Rule {
				t.Fatalf("combination %d: got %s %v, want %v", k, on[k].Name, adverse(on[k]), adverse(want[k]))
			}
		}
		names := make([]string, len(on))
		for k, c := range on {
			names[k] = c.Name
		}
		slices.Sort(names)
		if len(slices.Compact(names)) != len(on) {
			t.Fatalf("duplicate combination names in %v", names)
		}
	})
}

// allowedAlternatives restricts one combination made without the rule, written out from the
// rule's three cases independently of the code under test.
func allowedAlternatives(cases []beam.Case, c beam.Combination) []beam.Combination {
	isRoof := func(k beam.Case) bool { return k.Kind == beam.Imposed && k.Category == "H" }
	isClimate := func(k beam.Case) bool { return k.Kind == beam.Snow || k.Kind == beam.Wind }
	hasRoof := slices.ContainsFunc(cases, isRoof)
	hasClimate := slices.ContainsFunc(cases, isClimate)
	if !hasRoof || !hasClimate {
		return []beam.Combination{c}
	}
	drop := func(group func(beam.Case) bool) beam.Combination {
		d := c
		d.Factors = slices.Clone(c.Factors)
		for i := range d.Factors {
			if group(cases[i]) {
				d.Factors[i] = beam.Factor{Case: d.Factors[i].Case}
			}
		}
		return d
	}
	active := func(group func(beam.Case) bool) bool {
		for i, f := range c.Factors {
			if group(cases[i]) && f.Adverse != 0 {
				return true
			}
		}
		return false
	}
	for _, k := range cases {
		if k.Name == c.Leading && isRoof(k) {
			return []beam.Combination{drop(isClimate)}
		}
		if k.Name == c.Leading && isClimate(k) {
			return []beam.Combination{drop(isRoof)}
		}
	}
	if active(isRoof) && active(isClimate) {
		return []beam.Combination{drop(isClimate), drop(isRoof)}
	}
	return []beam.Combination{c}
}

// adverse lists the adverse factors of a combination, in the order of its cases.
func adverse(c beam.Combination) []float64 {
	out := make([]float64, len(c.Factors))
	for i, f := range c.Factors {
		out[i] = f.Adverse
	}
	return out
}

// A thermal action is a variable action with the temperature row of EN 1990 Table A1.1
// (ψ0 0.6, ψ1 0.5, ψ2 0): accompanying at γQ ψ0 = 1.5 × 0.6 = 0.9 in (6.10), leading at γQ,
// and not patterned unless the case says so.
func TestCombinationsThermal(t *testing.T) {
	cases := []beam.Case{
		{Name: "G", Kind: beam.Permanent},
		{Name: "Q", Kind: beam.Imposed, Category: "B", Pattern: true},
		{Name: "T", Kind: beam.Thermal},
	}
	for _, sls := range []string{"characteristic", "frequent"} {
		t.Run(sls, func(t *testing.T) {
			r, err := beam.NewRules("EN1990", "6.10", sls, nil)
			require.NoError(t, err)
			all, err := beam.Combinations(cases, r)
			require.NoError(t, err)
			src := "EN 1990 (6.10), (6.14b), (6.15b), " + srcA12B + ", " + srcA11 + " (category B; temperature)"
			three := func(w [3][2]float64) [4][2]float64 { return [4][2]float64{w[0], w[1], w[2]} }
			assertCombinations(t, cases, []want{
				{"ULS 6.10, Q leading", "6.10", "Q", beam.ULS, three([3][2]float64{{1.35, 1.0}, {1.5, 0}, {1.5 * 0.6, 0}})},
				{"ULS 6.10, T leading", "6.10", "T", beam.ULS, three([3][2]float64{{1.35, 1.0}, {1.5 * 0.7, 0}, {1.5, 0}})},
			}, ofState(all, beam.ULS), src)
			wantSLS := []want{
				{"SLS characteristic, Q leading", "characteristic", "Q", beam.SLS, three([3][2]float64{{1, 1}, {1, 0}, {0.6, 0}})},
				{"SLS characteristic, T leading", "characteristic", "T", beam.SLS, three([3][2]float64{{1, 1}, {0.7, 0}, {1, 0}})},
			}
			if sls == "frequent" {
				wantSLS = []want{
					{"SLS frequent, Q leading", "frequent", "Q", beam.SLS, three([3][2]float64{{1, 1}, {0.5, 0}, {0, 0}})},
					{"SLS frequent, T leading", "frequent", "T", beam.SLS, three([3][2]float64{{1, 1}, {0.3, 0}, {0.5, 0}})},
				}
			}
			assertCombinations(t, cases, wantSLS, ofState(all, beam.SLS), src)
		})
	}
	assert.Equal(t, "thermal", beam.Thermal.String())
	assert.True(t, beam.Thermal.Variable())
}
