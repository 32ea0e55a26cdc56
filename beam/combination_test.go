package beam_test

import (
	"encoding/csv"
	"math"
	"os"
	"slices"
	"strconv"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"pgregory.net/rapid"

	"spanbreak/beam"
)

// Sources named by the reference rows below.
const (
	srcA11  = "EN 1990:2002+A1:2005 Table A1.1"
	srcA12B = "EN 1990:2002+A1:2005 Table A1.2(B)"
)

// relTol is the relative tolerance for factors: they are products of two or three decimals,
// so only floating-point rounding separates the code's value from the written expression.
const relTol = 1e-12

// assertFactor compares a factor relatively, or absolutely when the expected value is zero.
func assertFactor(t *testing.T, want, got float64, msgAndArgs ...any) {
	t.Helper()
	if want == 0 {
		assert.InDelta(t, want, got, 1e-15, msgAndArgs...)
		return
	}
	assert.InEpsilon(t, want, got, relTol, msgAndArgs...)
}

// kindByName maps the job-file spelling of an action kind to the kind.
func kindByName(t *testing.T, name string) beam.ActionKind {
	t.Helper()
	for k := beam.Permanent; k <= beam.Thermal; k++ {
		if k.String() == name {
			return k
		}
	}
	t.Fatalf("unknown action kind %q in the reference table", name)
	return 0
}

func TestPsiTableA11(t *testing.T) {
	f, err := os.Open("../testdata/en1990-psi.csv")
	require.NoError(t, err)
	defer f.Close()
	rows, err := csv.NewReader(f).ReadAll()
	require.NoError(t, err)
	require.Equal(t, []string{"action", "category", "description", "psi0", "psi1", "psi2", "kind", "source"}, rows[0])
	rows = rows[1:]
	// Table A1.1 has 13 rows: imposed A–H, three snow rows, wind, temperature.
	require.Len(t, rows, 13)

	covered := map[string]bool{}
	for _, row := range rows {
		action, category, description := row[0], row[1], row[2]
		t.Run(action+"/"+category+"/"+description, func(t *testing.T) {
			assert.Equal(t, srcA11, row[7], "source column")
			assert.Equal(t, "published", row[6], "kind column")
			var want [3]float64
			for j := range want {
				v, err := strconv.ParseFloat(row[3+j], 64)
				require.NoError(t, err)
				want[j] = v
			}
			got, err := beam.Psi(kindByName(t, action), category)
			require.NoError(t, err)
			for j := range want {
				assertFactor(t, want[j], got[j], "ψ%d (%s)", j, row[7])
			}
		})
		covered[action+"/"+category] = true
	}
	// Every category Psi accepts (apart from the aliases tested below) has a reference row.
	for _, c := range []string{"A", "B", "C", "D", "E", "F", "G", "H"} {
		assert.True(t, covered["imposed/"+c], "imposed category %s has a reference row", c)
	}
	for _, key := range []string{"snow/low", "snow/high", "wind/", "thermal/"} {
		assert.True(t, covered[key], "%s has a reference row", key)
	}
}

func TestPsiAliases(t *testing.T) {
	tests := []struct {
		name     string
		kind     beam.ActionKind
		category string
		want     [3]float64
		source   string
	}{
		{"snow without category is the H ≤ 1000 m row", beam.Snow, "", [3]float64{0.5, 0.2, 0}, srcA11 + ", snow, H ≤ 1000 m"},
		{"other variable named temperature", beam.OtherVariable, "temperature", [3]float64{0.6, 0.5, 0}, srcA11 + ", temperature (non-fire)"},
		{"other variable without category is the temperature row", beam.OtherVariable, "", [3]float64{0.6, 0.5, 0}, srcA11 + ", temperature (non-fire)"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			got, err := beam.Psi(tc.kind, tc.category)
			require.NoError(t, err)
			for j := range tc.want {
				assertFactor(t, tc.want[j], got[j], "ψ%d (%s)", j, tc.source)
			}
		})
	}
}

func TestPsiErrors(t *testing.T) {
	tests := []struct {
		name     string
		kind     beam.ActionKind
		category string
		contains []string
	}{
		{"permanent", beam.Permanent, "", []string{"permanent", "variable actions only"}},
		{"imposed without category", beam.Imposed, "", []string{`category ""`, "A, B, C, D, E, F, G, H"}},
		{"imposed category I", beam.Imposed, "I", []string{`category "I"`, "imposed", "A, B, C, D, E, F, G, H"}},
		{"imposed lower case", beam.Imposed, "b", []string{`category "b"`}},
		{"snow medium", beam.Snow, "medium", []string{`category "medium"`, "snow", "low", "high"}},
		{"wind with a category", beam.Wind, "A", []string{`category "A"`, "wind"}},
		{"other unknown", beam.OtherVariable, "crane", []string{`category "crane"`, "temperature"}},
		{"thermal with a category", beam.Thermal, "temperature", []string{`category "temperature"`, "thermal"}},
		{"unknown kind", beam.ActionKind(42), "", []string{"42", "unknown action kind"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := beam.Psi(tc.kind, tc.category)
			require.Error(t, err)
			for _, s := range tc.contains {
				assert.Contains(t, err.Error(), s)
			}
		})
	}
}

func TestRulesTableA12B(t *testing.T) {
	r, err := beam.NewRules("EN1990", "6.10", "characteristic", nil)
	require.NoError(t, err)
	tests := []struct {
		name   string
		got    float64
		want   float64
		source string
	}{
		{"γG,sup", r.GammaGSup, 1.35, srcA12B + " note 1, γGj,sup"},
		{"γG,inf", r.GammaGInf, 1.00, srcA12B + " note 1, γGj,inf"},
		{"γQ", r.GammaQ, 1.50, srcA12B + " note 1, γQ,1 and γQ,i"},
		{"ξ", r.Xi, 0.85, srcA12B + " note 2"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			assert.InEpsilon(t, tc.want, tc.got, relTol, tc.source)
		})
	}
	assert.Equal(t, beam.SetEN1990, r.Set)
	assert.Equal(t, beam.ULS610, r.ULS)
	assert.Equal(t, beam.SLSCharacteristic, r.SLS)
	assert.Empty(t, r.PsiOverrides)
}

func TestRulesDefaults(t *testing.T) {
	def, err := beam.NewRules("", "", "", nil)
	require.NoError(t, err)
	named, err := beam.NewRules("EN1990", "6.10", "characteristic", map[string]float64{})
	require.NoError(t, err)
	assert.Equal(t, named, def, "empty names select EN1990, 6.10 and characteristic")
}

func TestRulesOverrides(t *testing.T) {
	tests := []struct {
		name      string
		overrides map[string]float64
		want      [4]float64 // γG,sup, γG,inf, γQ, ξ
	}{
		{"gamma_G_sup", map[string]float64{"gamma_G_sup": 1.2}, [4]float64{1.2, 1.0, 1.5, 0.85}},
		{"gamma_G_inf", map[string]float64{"gamma_G_inf": 0.9}, [4]float64{1.35, 0.9, 1.5, 0.85}},
		{"gamma_Q", map[string]float64{"gamma_Q": 1.6}, [4]float64{1.35, 1.0, 1.6, 0.85}},
		{"xi", map[string]float64{"xi": 0.925}, [4]float64{1.35, 1.0, 1.5, 0.925}},
		{"gamma_Q zero is allowed", map[string]float64{"gamma_Q": 0}, [4]float64{1.35, 1.0, 0, 0.85}},
		{"all four", map[string]float64{"gamma_G_sup": 1.25, "gamma_G_inf": 0.9, "gamma_Q": 1.6, "xi": 0.9},
			[4]float64{1.25, 0.9, 1.6, 0.9}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			r, err := beam.NewRules("EN1990", "6.10ab", "frequent", tc.overrides)
			require.NoError(t, err)
			got := [4]float64{r.GammaGSup, r.GammaGInf, r.GammaQ, r.Xi}
			for i := range got {
				assertFactor(t, tc.want[i], got[i], "factor %d", i)
			}
			assert.Equal(t, "6.10ab", r.ULS)
			assert.Equal(t, "frequent", r.SLS)
		})
	}
}

func TestRulesErrors(t *testing.T) {
	tests := []struct {
		name          string
		set, uls, sls string
		overrides     map[string]float64
		contains      []string
	}{
		{"unknown set", "EN1991", "6.10", "characteristic", nil, []string{"rules", `"EN1991"`, "EN1990"}},
		{"unknown uls", "EN1990", "6.11", "characteristic", nil, []string{"uls", `"6.11"`, "6.10ab"}},
		{"unknown sls", "EN1990", "6.10", "rare", nil, []string{"sls", `"rare"`, "quasi-permanent"}},
		{"unknown key", "EN1990", "6.10", "characteristic", map[string]float64{"gamma_q": 1.5},
			[]string{`"gamma_q"`, "1.5", "gamma_G_inf, gamma_G_sup, gamma_Q, xi"}},
		{"NaN", "EN1990", "6.10", "characteristic", map[string]float64{"gamma_Q": math.NaN()},
			[]string{"gamma_Q", "NaN"}},
		{"Inf", "EN1990", "6.10", "characteristic", map[string]float64{"gamma_G_sup": math.Inf(1)},
			[]string{"gamma_G_sup", "+Inf"}},
		{"negative", "EN1990", "6.10", "characteristic", map[string]float64{"gamma_G_inf": -0.5},
			[]string{"gamma_G_inf", "-0.5"}},
		{"xi above 1", "EN1990", "6.10ab", "characteristic", map[string]float64{"xi": 1.2},
			[]string{"xi", "1.2", "must not exceed 1"}},
		{"gamma_G_inf above gamma_G_sup", "EN1990", "6.10", "characteristic", map[string]float64{"gamma_G_inf": 1.5},
			[]string{"gamma_G_inf", "1.5", "gamma_G_sup = 1.35"}},
		{"every problem reported", "EN1991", "6.11", "rare", map[string]float64{"psi": 1, "xi": -1},
			[]string{`"EN1991"`, `"6.11"`, `"rare"`, `"psi"`, "xi: -1"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			r, err := beam.NewRules(tc.set, tc.uls, tc.sls, tc.overrides)
			require.Error(t, err)
			assert.Equal(t, beam.Rules{}, r)
			for _, s := range tc.contains {
				assert.Contains(t, err.Error(), s)
			}
		})
	}
}

// handJob is the hand-worked job: self weight and finishes G, office floor Q (category B),
// snow S at a site below 1000 m, wind W.
func handJob() []beam.Case {
	return []beam.Case{
		{Name: "G", Kind: beam.Permanent},
		{Name: "Q", Kind: beam.Imposed, Category: "B", Pattern: true},
		{Name: "S", Kind: beam.Snow},
		{Name: "W", Kind: beam.Wind},
	}
}

// want is an expected combination: factors per case of handJob, in order, as
// [adverse, relieving].
type want struct {
	name, rule, leading string
	state               beam.LimitState
	factors             [4][2]float64
}

// Table A1.1 values used in the hand calculations below (srcA11):
// Q category B ψ0 0.7, ψ1 0.5, ψ2 0.3; S (H ≤ 1000 m) 0.5, 0.2, 0; W 0.6, 0.2, 0.
// Table A1.2(B) values (srcA12B): γG,sup 1.35, γG,inf 1.00, γQ 1.5, ξ 0.85.
func TestCombinationsHandWorked(t *testing.T) {
	tests := []struct {
		name     string
		uls, sls string
		state    beam.LimitState
		source   string
		want     []want
	}{
		{
			name: "ULS 6.10", uls: "6.10", sls: "characteristic", state: beam.ULS,
			source: "EN 1990 6.4.3.2(3) expression (6.10) with " + srcA12B + " and " + srcA11,
			want: []want{
				{"ULS 6.10, Q leading", "6.10", "Q", beam.ULS,
					[4][2]float64{{1.35, 1.0}, {1.5, 0}, {1.5 * 0.5, 0}, {1.5 * 0.6, 0}}},
				{"ULS 6.10, S leading", "6.10", "S", beam.ULS,
					[4][2]float64{{1.35, 1.0}, {1.5 * 0.7, 0}, {1.5, 0}, {1.5 * 0.6, 0}}},
				{"ULS 6.10, W leading", "6.10", "W", beam.ULS,
					[4][2]float64{{1.35, 1.0}, {1.5 * 0.7, 0}, {1.5 * 0.5, 0}, {1.5, 0}}},
			},
		},
		{
			name: "ULS 6.10a and 6.10b", uls: "6.10ab", sls: "characteristic", state: beam.ULS,
			source: "EN 1990 6.4.3.2(3) expressions (6.10a), (6.10b) with " + srcA12B + " and " + srcA11,
			want: []want{
				{"ULS 6.10a", "6.10a", "", beam.ULS,
					[4][2]float64{{1.35, 1.0}, {1.5 * 0.7, 0}, {1.5 * 0.5, 0}, {1.5 * 0.6, 0}}},
				{"ULS 6.10b, Q leading", "6.10b", "Q", beam.ULS,
					[4][2]float64{{0.85 * 1.35, 1.0}, {1.5, 0}, {1.5 * 0.5, 0}, {1.5 * 0.6, 0}}},
				{"ULS 6.10b, S leading", "6.10b", "S", beam.ULS,
					[4][2]float64{{0.85 * 1.35, 1.0}, {1.5 * 0.7, 0}, {1.5, 0}, {1.5 * 0.6, 0}}},
				{"ULS 6.10b, W leading", "6.10b", "W", beam.ULS,
					[4][2]float64{{0.85 * 1.35, 1.0}, {1.5 * 0.7, 0}, {1.5 * 0.5, 0}, {1.5, 0}}},
			},
		},
		{
			name: "SLS characteristic", uls: "6.10", sls: "characteristic", state: beam.SLS,
			source: "EN 1990 6.5.3(2)a expression (6.14b) with " + srcA11,
			want: []want{
				{"SLS characteristic, Q leading", "characteristic", "Q", beam.SLS,
					[4][2]float64{{1, 1}, {1, 0}, {0.5, 0}, {0.6, 0}}},
				{"SLS characteristic, S leading", "characteristic", "S", beam.SLS,
					[4][2]float64{{1, 1}, {0.7, 0}, {1, 0}, {0.6, 0}}},
				{"SLS characteristic, W leading", "characteristic", "W", beam.SLS,
					[4][2]float64{{1, 1}, {0.7, 0}, {0.5, 0}, {1, 0}}},
			},
		},
		{
			name: "SLS frequent", uls: "6.10", sls: "frequent", state: beam.SLS,
			source: "EN 1990 6.5.3(2)b expression (6.15b) with " + srcA11,
			want: []want{
				{"SLS frequent, Q leading", "frequent", "Q", beam.SLS,
					[4][2]float64{{1, 1}, {0.5, 0}, {0, 0}, {0, 0}}},
				{"SLS frequent, S leading", "frequent", "S", beam.SLS,
					[4][2]float64{{1, 1}, {0.3, 0}, {0.2, 0}, {0, 0}}},
				{"SLS frequent, W leading", "frequent", "W", beam.SLS,
					[4][2]float64{{1, 1}, {0.3, 0}, {0, 0}, {0.2, 0}}},
			},
		},
		{
			name: "SLS quasi-permanent", uls: "6.10ab", sls: "quasi-permanent", state: beam.SLS,
			source: "EN 1990 6.5.3(2)c expression (6.16b) with " + srcA11,
			want: []want{
				{"SLS quasi-permanent", "quasi-permanent", "", beam.SLS,
					[4][2]float64{{1, 1}, {0.3, 0}, {0, 0}, {0, 0}}},
			},
		},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			r, err := beam.NewRules("EN1990", tc.uls, tc.sls, nil)
			require.NoError(t, err)
			all, err := beam.Combinations(handJob(), r)
			require.NoError(t, err)
			assertCombinations(t, handJob(), tc.want, ofState(all, tc.state), tc.source)
		})
	}
}

// ofState returns the combinations of one limit state, in order.
func ofState(all []beam.Combination, s beam.LimitState) []beam.Combination {
	var out []beam.Combination
	for _, c := range all {
		if c.State == s {
			out = append(out, c)
		}
	}
	return out
}

func assertCombinations(t *testing.T, cases []beam.Case, want []want, got []beam.Combination, source string) {
	t.Helper()
	require.Len(t, got, len(want))
	for k, w := range want {
		g := got[k]
		assert.Equal(t, w.name, g.Name)
		assert.Equal(t, w.rule, g.Rule, g.Name)
		assert.Equal(t, w.leading, g.Leading, g.Name)
		assert.Equal(t, w.state, g.State, g.Name)
		require.Len(t, g.Factors, len(cases), g.Name)
		for i, f := range g.Factors {
			assert.Equal(t, cases[i].Name, f.Case, g.Name)
			assertFactor(t, w.factors[i][0], f.Adverse, "%s, %s adverse (%s)", g.Name, f.Case, source)
			assertFactor(t, w.factors[i][1], f.Relieving, "%s, %s relieving (%s)", g.Name, f.Case, source)
		}
	}
}

func TestCombinationsOverriddenGammas(t *testing.T) {
	r, err := beam.NewRules("EN1990", "6.10ab", "quasi-permanent",
		map[string]float64{"gamma_G_sup": 1.25, "gamma_G_inf": 0.9, "gamma_Q": 1.6, "xi": 0.9})
	require.NoError(t, err)
	all, err := beam.Combinations(handJob(), r)
	require.NoError(t, err)
	source := "EN 1990 (6.10a), (6.10b) with the overridden γ and ξ and " + srcA11
	assertCombinations(t, handJob(), []want{
		{"ULS 6.10a", "6.10a", "", beam.ULS,
			[4][2]float64{{1.25, 0.9}, {1.6 * 0.7, 0}, {1.6 * 0.5, 0}, {1.6 * 0.6, 0}}},
		{"ULS 6.10b, Q leading", "6.10b", "Q", beam.ULS,
			[4][2]float64{{0.9 * 1.25, 0.9}, {1.6, 0}, {1.6 * 0.5, 0}, {1.6 * 0.6, 0}}},
		{"ULS 6.10b, S leading", "6.10b", "S", beam.ULS,
			[4][2]float64{{0.9 * 1.25, 0.9}, {1.6 * 0.7, 0}, {1.6, 0}, {1.6 * 0.6, 0}}},
		{"ULS 6.10b, W leading", "6.10b", "W", beam.ULS,
			[4][2]float64{{0.9 * 1.25, 0.9}, {1.6 * 0.7, 0}, {1.6 * 0.5, 0}, {1.6, 0}}},
	}, ofState(all, beam.ULS), source)
	// SLS factors do not depend on γ or ξ (EN 1990 6.5.3(2)c, (6.16b)).
	assertCombinations(t, handJob(), []want{
		{"SLS quasi-permanent", "quasi-permanent", "", beam.SLS,
			[4][2]float64{{1, 1}, {0.3, 0}, {0, 0}, {0, 0}}},
	}, ofState(all, beam.SLS), srcA11)
}

func TestCombinationsPsiPrecedence(t *testing.T) {
	explicit := [3]float64{0.8, 0.6, 0.4}
	permanentPsi := [3]float64{0.1, 0.1, 0.1}
	cases := []beam.Case{
		{Name: "G", Kind: beam.Permanent, Category: "not used", Psi: &permanentPsi},
		{Name: "Q", Kind: beam.Imposed, Category: "B", Psi: &explicit},
		{Name: "T", Kind: beam.OtherVariable},
		{Name: "R", Kind: beam.Imposed, Psi: &explicit}, // no category: not needed with ψ given
	}
	tests := []struct {
		name      string
		overrides map[string][3]float64
		want      []want
	}{
		{
			name: "Case.Psi over Table A1.1",
			want: []want{
				{"SLS characteristic, Q leading", "characteristic", "Q", beam.SLS,
					[4][2]float64{{1, 1}, {1, 0}, {0.6, 0}, {0.8, 0}}},
				{"SLS characteristic, T leading", "characteristic", "T", beam.SLS,
					[4][2]float64{{1, 1}, {0.8, 0}, {1, 0}, {0.8, 0}}},
				{"SLS characteristic, R leading", "characteristic", "R", beam.SLS,
					[4][2]float64{{1, 1}, {0.8, 0}, {0.6, 0}, {1, 0}}},
			},
		},
		{
			name:      "PsiOverrides over Case.Psi and Table A1.1; permanent key ignored",
			overrides: map[string][3]float64{"Q": {0.9, 0.7, 0.5}, "T": {0.4, 0.3, 0.2}, "G": {0.5, 0.5, 0.5}},
			want: []want{
				{"SLS characteristic, Q leading", "characteristic", "Q", beam.SLS,
					[4][2]float64{{1, 1}, {1, 0}, {0.4, 0}, {0.8, 0}}},
				{"SLS characteristic, T leading", "characteristic", "T", beam.SLS,
					[4][2]float64{{1, 1}, {0.9, 0}, {1, 0}, {0.8, 0}}},
				{"SLS characteristic, R leading", "characteristic", "R", beam.SLS,
					[4][2]float64{{1, 1}, {0.9, 0}, {0.4, 0}, {1, 0}}},
			},
		},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			r, err := beam.NewRules("EN1990", "6.10", "characteristic", nil)
			require.NoError(t, err)
			r.PsiOverrides = tc.overrides
			all, err := beam.Combinations(cases, r)
			require.NoError(t, err)
			// T without override takes the temperature row of Table A1.1 (ψ0 = 0.6).
			assertCombinations(t, cases, tc.want, ofState(all, beam.SLS),
				"EN 1990 (6.14b) with the given ψ and "+srcA11+" (temperature)")
		})
	}
}

func TestCombinationsPermanentOnly(t *testing.T) {
	cases := []beam.Case{{Name: "SW", Kind: beam.Permanent}, {Name: "G", Kind: beam.Permanent}}
	tests := []struct {
		uls, sls string
		want     []want
	}{
		{"6.10", "characteristic", []want{
			{"ULS 6.10, permanent only", "6.10", "", beam.ULS, [4][2]float64{{1.35, 1.0}, {1.35, 1.0}}},
			{"SLS characteristic, permanent only", "characteristic", "", beam.SLS, [4][2]float64{{1, 1}, {1, 1}}},
		}},
		{"6.10ab", "frequent", []want{
			{"ULS 6.10a", "6.10a", "", beam.ULS, [4][2]float64{{1.35, 1.0}, {1.35, 1.0}}},
			{"SLS frequent, permanent only", "frequent", "", beam.SLS, [4][2]float64{{1, 1}, {1, 1}}},
		}},
		{"6.10", "quasi-permanent", []want{
			{"ULS 6.10, permanent only", "6.10", "", beam.ULS, [4][2]float64{{1.35, 1.0}, {1.35, 1.0}}},
			{"SLS quasi-permanent", "quasi-permanent", "", beam.SLS, [4][2]float64{{1, 1}, {1, 1}}},
		}},
	}
	for _, tc := range tests {
		t.Run(tc.uls+"/"+tc.sls, func(t *testing.T) {
			r, err := beam.NewRules("EN1990", tc.uls, tc.sls, nil)
			require.NoError(t, err)
			got, err := beam.Combinations(cases, r)
			require.NoError(t, err)
			assertCombinations(t, cases, tc.want, got, srcA12B+" and EN 1990 (6.10), (6.10a), 6.5.3")
		})
	}
}

func TestCombinationsErrors(t *testing.T) {
	nan := [3]float64{math.NaN(), 0.5, 0.3}
	big := [3]float64{0.7, 1.2, 0.3}
	neg := [3]float64{0.7, 0.5, -0.1}
	valid, err := beam.NewRules("EN1990", "6.10", "characteristic", nil)
	require.NoError(t, err)
	withOverride := valid
	withOverride.PsiOverrides = map[string][3]float64{"X": {0.5, 0.5, 0.5}}
	badOverride := valid
	badOverride.PsiOverrides = map[string][3]float64{"Q": {0.5, math.Inf(1), 0.5}}
	badGamma := valid
	badGamma.GammaQ = -1.5

	tests := []struct {
		name     string
		cases    []beam.Case
		rules    beam.Rules
		contains []string
	}{
		{"no cases", nil, valid, []string{"no load cases"}},
		{"duplicate name", []beam.Case{{Name: "G"}, {Name: "G", Kind: beam.Wind}}, valid,
			[]string{"cases.G", `duplicate case name "G"`}},
		{"empty name", []beam.Case{{Name: ""}}, valid, []string{"cases[0]", "empty case name"}},
		{"unknown kind", []beam.Case{{Name: "G", Kind: beam.ActionKind(9)}}, valid,
			[]string{"cases.G.kind", "9"}},
		{"imposed without category", []beam.Case{{Name: "Q", Kind: beam.Imposed}}, valid,
			[]string{"cases.Q.category", `""`, "A, B, C, D, E, F, G, H"}},
		{"snow category typo", []beam.Case{{Name: "S", Kind: beam.Snow, Category: "hihg"}}, valid,
			[]string{"cases.S.category", `"hihg"`, "low", "high"}},
		{"ψ NaN", []beam.Case{{Name: "Q", Kind: beam.Imposed, Psi: &nan}}, valid,
			[]string{"cases.Q.psi", "ψ0 = NaN"}},
		{"ψ above 1", []beam.Case{{Name: "Q", Kind: beam.Imposed, Psi: &big}}, valid,
			[]string{"cases.Q.psi", "ψ1 = 1.2", "[0, 1]"}},
		{"ψ negative", []beam.Case{{Name: "Q", Kind: beam.Imposed, Psi: &neg}}, valid,
			[]string{"cases.Q.psi", "ψ2 = -0.1"}},
		{"override of an undefined case", handJob(), withOverride, []string{"psi overrides", `undefined case "X"`}},
		{"override infinite", handJob(), badOverride, []string{"psi overrides.Q", "ψ1 = +Inf"}},
		{"zero Rules", handJob(), beam.Rules{}, []string{`rules: unknown parameter set ""`, `uls: unknown rule ""`}},
		{"hand-built negative γQ", handJob(), badGamma, []string{"gamma_Q", "-1.5"}},
		{"every problem reported", []beam.Case{{Name: "Q", Kind: beam.Imposed}, {Name: "Q", Kind: beam.Wind}}, beam.Rules{},
			[]string{"cases.Q.category", `duplicate case name "Q"`, "rules:"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			got, err := beam.Combinations(tc.cases, tc.rules)
			require.Error(t, err)
			assert.Nil(t, got)
			for _, s := range tc.contains {
				assert.Contains(t, err.Error(), s)
			}
		})
	}
}

// TestCombinationsProperties checks, over random jobs and factor sets, the number of
// combinations of each rule, unique names, one factor per case in the order of cases, the
// relieving factors (γG,inf or 1 for permanent, 0 for variable) and determinism.
func TestCombinationsProperties(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		n := rapid.IntRange(1, 8).Draw(t, "cases")
		cases := make([]beam.Case, n)
		nVar := 0
		for i := range cases {
			kind := beam.ActionKind(rapid.IntRange(0, int(beam.Thermal)).Draw(t, "kind"))
			c := beam.Case{Name: "C" + strconv.Itoa(i), Kind: kind}
			switch kind {
			case beam.Imposed:
				c.Category = rapid.SampledFrom([]string{"A", "B", "C", "D", "E", "F", "G", "H"}).Draw(t, "category")
			case beam.Snow:
				c.Category = rapid.SampledFrom([]string{"", "low", "high"}).Draw(t, "category")
			}
			if kind.Variable() {
				nVar++
			}
			cases[i] = c
		}
		uls := rapid.SampledFrom([]string{"6.10", "6.10ab"}).Draw(t, "uls")
		sls := rapid.SampledFrom([]string{"characteristic", "frequent", "quasi-permanent"}).Draw(t, "sls")
		gInf := rapid.Float64Range(0, 1.2).Draw(t, "gInf")
		r, err := beam.NewRules("EN1990", uls, sls, map[string]float64{
			"gamma_G_inf": gInf,
			"gamma_G_sup": gInf + rapid.Float64Range(0, 0.5).Draw(t, "gSupExtra"),
			"gamma_Q":     rapid.Float64Range(0, 2).Draw(t, "gQ"),
			"xi":          rapid.Float64Range(0, 1).Draw(t, "xi"),
		})
		if err != nil {
			t.Fatalf("NewRules: %v", err)
		}
		got, err := beam.Combinations(cases, r)
		if err != nil {
			t.Fatalf("Combinations: %v", err)
		}
		again, _ := beam.Combinations(cases, r)
		if !assert.Equal(t, got, again, "deterministic") {
			t.FailNow()
		}

		wantULS := max(1, nVar) // 6.10: one per leading case, or permanent only
		if uls == "6.10ab" {
			wantULS = 1 + nVar // 6.10a, then 6.10b per leading case
		}
		wantSLS := max(1, nVar)
		if sls == "quasi-permanent" {
			wantSLS = 1
		}
		if len(ofState(got, beam.ULS)) != wantULS || len(ofState(got, beam.SLS)) != wantSLS {
			t.Fatalf("%d ULS and %d SLS combinations, want %d and %d",
				len(ofState(got, beam.ULS)), len(ofState(got, beam.SLS)), wantULS, wantSLS)
		}
		names := make([]string, len(got))
		for k, c := range got {
			names[k] = c.Name
			if len(c.Factors) != n {
				t.Fatalf("%s: %d factors, want %d", c.Name, len(c.Factors), n)
			}
			for i, f := range c.Factors {
				wantRel := 0.0
				if !cases[i].Kind.Variable() {
					wantRel = 1
					if c.State == beam.ULS {
						wantRel = r.GammaGInf
					}
				}
				if f.Case != cases[i].Name || f.Relieving != wantRel || f.Adverse < 0 {
					t.Fatalf("%s: factor %d = %+v, want case %s, relieving %g, adverse ≥ 0",
						c.Name, i, f, cases[i].Name, wantRel)
				}
			}
		}
		slices.Sort(names)
		if len(slices.Compact(names)) != len(got) {
			t.Fatalf("duplicate combination names in %v", names)
		}
	})
}

func TestUserCombination(t *testing.T) {
	cases := []beam.Case{
		{Name: "G", Kind: beam.Permanent},
		{Name: "SW", Kind: beam.Permanent},
		{Name: "Q", Kind: beam.Imposed, Category: "B"},
		{Name: "W", Kind: beam.Wind},
	}
	got, err := beam.UserCombination("ACC", beam.ULS, map[string]float64{"G": 1.0, "SW": 1.0, "Q": 0.5}, cases)
	require.NoError(t, err)
	// The user's factors as given; permanent both ways, variable adverse only, W not named → absent.
	assertCombinations(t, cases, []want{
		{"ACC", "user", "", beam.ULS, [4][2]float64{{1.0, 1.0}, {1.0, 1.0}, {0.5, 0}, {0, 0}}},
	}, []beam.Combination{got}, "user-defined factors (combinations.extra)")

	sls, err := beam.UserCombination("check", beam.SLS, map[string]float64{"G": 1, "SW": 0, "W": 0.2}, cases)
	require.NoError(t, err)
	assertCombinations(t, cases, []want{
		{"check", "user", "", beam.SLS, [4][2]float64{{1, 1}, {0, 0}, {0, 0}, {0.2, 0}}},
	}, []beam.Combination{sls}, "user-defined factors (combinations.extra)")
}

func TestUserCombinationErrors(t *testing.T) {
	cases := []beam.Case{{Name: "G", Kind: beam.Permanent}, {Name: "Q", Kind: beam.Imposed, Category: "B"}}
	tests := []struct {
		name     string
		combo    string
		state    beam.LimitState
		factors  map[string]float64
		cases    []beam.Case
		contains []string
	}{
		{"undefined case", "ACC", beam.ULS, map[string]float64{"G": 1, "X": 1}, cases,
			[]string{`extra "ACC"`, "factors.X", `undefined case "X"`}},
		{"negative", "ACC", beam.ULS, map[string]float64{"G": 1, "Q": -0.5}, cases,
			[]string{"factors.Q", "-0.5"}},
		{"NaN", "ACC", beam.ULS, map[string]float64{"G": math.NaN()}, cases, []string{"factors.G", "NaN"}},
		{"Inf", "ACC", beam.SLS, map[string]float64{"G": 1, "Q": math.Inf(1)}, cases, []string{"factors.Q", "+Inf"}},
		{"permanent case not named", "ACC", beam.ULS, map[string]float64{"Q": 0.5}, cases,
			[]string{"factors.G", `permanent case "G" has no factor`}},
		{"empty name", "", beam.ULS, map[string]float64{"G": 1}, cases, []string{"empty combination name"}},
		{"unknown state", "ACC", beam.LimitState(5), map[string]float64{"G": 1}, cases, []string{"state", "5"}},
		{"duplicate case", "ACC", beam.ULS, map[string]float64{"G": 1}, append(slices.Clone(cases), cases[0]),
			[]string{`duplicate case name "G"`}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			got, err := beam.UserCombination(tc.combo, tc.state, tc.factors, tc.cases)
			require.Error(t, err)
			assert.Equal(t, beam.Combination{}, got)
			for _, s := range tc.contains {
				assert.Contains(t, err.Error(), s)
			}
		})
	}
}
