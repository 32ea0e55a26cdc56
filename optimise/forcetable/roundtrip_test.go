package forcetable

import (
	"bytes"
	"encoding/csv"
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/beam"
)

// analysed is a real beam analysis: IPE 400 over two spans of 6 and 8 m with a 1.5 m right
// overhang, a permanent UDL and point load (a jump at 3 m), a patterned imposed UDL, wind
// uplift and an axial pull at the free end, combined by the EN 1990 recommended values
// (6.10a/b, characteristic SLS).
func analysed(t testing.TB, step float64) (beam.Model, beam.Envelopes) {
	t.Helper()
	sec, err := beam.LookupSection("IPE 400")
	require.NoError(t, err)
	m := beam.Model{
		Length: 15500,
		Supports: []beam.Support{
			{X: 0, Kind: beam.Pinned}, {X: 6000, Kind: beam.Roller}, {X: 14000, Kind: beam.Roller},
		},
		EI: beam.YoungModulus * sec.Iy,
		EA: beam.YoungModulus * sec.A,
	}
	psi := [3]float64{0.6, 0.5, 0}
	cases := []beam.Case{
		{Name: "G", Kind: beam.Permanent, Loads: []beam.Load{
			{Kind: beam.Distributed, X1: 0, X2: 15500, W1: 8, W2: 8},
			{Kind: beam.PointForce, X1: 3000, P: 40e3},
		}},
		{Name: "Q", Kind: beam.Imposed, Category: "B", Pattern: true,
			Loads: []beam.Load{{Kind: beam.Distributed, X1: 0, X2: 15500, W1: 12, W2: 12}}},
		{Name: "W", Kind: beam.Wind, Loads: []beam.Load{{Kind: beam.Distributed, X1: 0, X2: 15500, W1: -3, W2: -3}}},
		{Name: "T", Kind: beam.OtherVariable, Psi: &psi, Loads: []beam.Load{{Kind: beam.AxialForce, X1: 15500, P: 120e3}}},
	}
	rules, err := beam.NewRules("EN1990", "6.10ab", "characteristic", nil)
	require.NoError(t, err)
	combos, err := beam.Combinations(cases, rules)
	require.NoError(t, err)
	an, err := beam.NewAnalysis(m, cases)
	require.NoError(t, err)
	st, err := an.Stations(step)
	require.NoError(t, err)
	env, err := an.Envelopes(combos, st)
	require.NoError(t, err)
	return m, env
}

// rounded is what a value becomes once written to 1e-6 of the file's unit and read back.
func rounded(v, unit float64) float64 { return math.Round(v/unit*1e6) / 1e6 * unit }

// TestRoundTripOfAnAnalysis writes the envelopes of a real analysis, reads them back and
// compares every station, extreme and governing name, then writes again: the same bytes.
func TestRoundTripOfAnAnalysis(t *testing.T) {
	m, env := analysed(t, 250)
	var out bytes.Buffer
	require.NoError(t, WriteEnvelopes(&out, &env))
	written := out.String()
	header, _, _ := strings.Cut(written, "\n")
	assert.Equal(t, strings.Join(EnvelopeColumns(), ","), header)

	tab, err := Read("analyse.csv", out.Bytes(), Options{Length: m.Length, NeedSLS: true, NeedDeflection: true})
	require.NoError(t, err)
	assert.Equal(t, EnvelopeShape, tab.Shape)
	assert.Equal(t, allSLS(), tab.SLS)
	require.Len(t, tab.Envelopes.Stations, len(env.Stations))
	jumps := 0
	for i, s := range env.Stations {
		got := tab.Envelopes.Stations[i]
		assert.Equal(t, s.Side, got.Side, "station %d", i)
		assert.InDelta(t, rounded(s.X, 1e3), got.X, 1e-9, "station %d", i)
		if i > 0 && env.Stations[i-1].X == s.X {
			jumps++
		}
	}
	assert.Positive(t, jumps, "the point load and the supports give jumps")
	for _, c := range extremeCols() {
		want := *series(stateEnvelope(&env, c.state), c)
		got := *series(stateEnvelope(&tab.Envelopes, c.state), c)
		unit := c.q.toInternal()
		for i := range want {
			assert.InDelta(t, rounded(want[i].Value, unit), got[i].Value, 1e-9*math.Max(1, math.Abs(want[i].Value)), "%s at %d", c.valueName(), i)
			assert.Equal(t, env.Governing(want[i]), tab.Governing(got[i]), "%s at %d", c.governingName(), i)
		}
	}
	var again bytes.Buffer
	require.NoError(t, tab.Write(&again))
	assert.Equal(t, written, again.String(), "an exported table imports back unchanged")
}

// TestNeutralisedText: combination names that a spreadsheet would run as formulas are written
// with an apostrophe and read back without it; numbers are never touched.
func TestNeutralisedText(t *testing.T) {
	names := []string{"=SUM(A1:A9)", "+1.35G", "-G only", "@ULS", "\tULS tab", "\rULS cr", "'quoted'", "'=both", "ULS plain"}
	var b strings.Builder
	w := csv.NewWriter(&b)
	_ = w.Write([]string{"x_m", "combination", "state", "M_kNm", "V_kN", "N_kN"})
	for k, n := range names {
		// each name governs a different station: its moment is largest there
		for _, x := range []string{"0", "1", "2", "3", "4", "5", "6", "7", "8"} {
			m := "0"
			if x == []string{"0", "1", "2", "3", "4", "5", "6", "7", "8"}[k] {
				m = "10"
			}
			_ = w.Write([]string{x, neutralise(n), "ULS", m, "-1", "-2"})
		}
	}
	w.Flush()
	tab, err := Read("f.csv", []byte(b.String()), Options{Length: 8000})
	require.NoError(t, err)
	for k, n := range names {
		assert.Equal(t, n, tab.Governing(tab.Envelopes.ULS.MMax[k]), "station %d", k)
	}
	var out bytes.Buffer
	require.NoError(t, tab.Write(&out))
	rows, err := csv.NewReader(strings.NewReader(out.String())).ReadAll()
	require.NoError(t, err)
	col := map[string]int{}
	for i, n := range rows[0] {
		col[n] = i
	}
	for k, n := range names {
		cell := rows[1+k][col["uls_M_max_governing"]]
		if strings.ContainsAny(n[:1], "=+-@\t\r'") {
			assert.Equal(t, "'"+n, cell, "neutralised")
		} else {
			assert.Equal(t, n, cell)
		}
		assert.Equal(t, "-1", rows[1+k][col["uls_V_max_kN"]], "a negative number is written as it is")
	}
	back, err := Read("f.csv", out.Bytes(), Options{Length: 8000})
	require.NoError(t, err)
	for k, n := range names {
		assert.Equal(t, n, back.Governing(back.Envelopes.ULS.MMax[k]))
	}
}

// TestNumberFormat: 6 decimals of the unit, the shortest form, no negative zero.
func TestNumberFormat(t *testing.T) {
	for _, r := range []struct {
		in   float64
		want string
	}{
		{0, "0"}, {math.Copysign(0, -1), "0"}, {-4e-7, "0"}, {4e-7, "0"}, {6e-7, "0.000001"},
		{-6e-7, "-0.000001"}, {12.5, "12.5"}, {-288.0000004, "-288"}, {1.2345675e3, "1234.5675"},
		{0.1 + 0.2, "0.3"}, {1e12, "1000000000000"},
	} {
		assert.Equal(t, r.want, num(r.in), "%v", r.in)
	}
}

// TestWriteRefusesNonFinite: nothing is written for an envelope holding NaN.
func TestWriteRefusesNonFinite(t *testing.T) {
	_, env := analysed(t, 2000)
	env.SLS.WMin[1].Value = math.NaN()
	var out bytes.Buffer
	err := WriteEnvelopes(&out, &env)
	require.Error(t, err)
	assert.Contains(t, err.Error(), "sls_w_min_mm")
	assert.Zero(t, out.Len())
}

// TestPositionsToTheWrittenResolution: x is read to 1e-6 m, the resolution tables are written
// with, so stations that would print alike are one station and a table written from a read one
// reads back.
func TestPositionsToTheWrittenResolution(t *testing.T) {
	data := "x_m,combination,state,M_kNm,V_kN,N_kN\n" +
		"0,A,ULS,0,1,0\n1.0000004,A,ULS,1,1,0\n2,A,ULS,2,1,0\n" +
		"0,B,ULS,0,1,0\n1.0000001,B,ULS,1,1,0\n2,B,ULS,2,1,0\n"
	tab, err := Read("f.csv", []byte(data), Options{Length: 2000})
	require.NoError(t, err)
	require.Len(t, tab.Envelopes.Stations, 3)
	assert.Equal(t, 1000.0, tab.Envelopes.Stations[1].X)
	var out bytes.Buffer
	require.NoError(t, tab.Write(&out))
	_, err = Read("f.csv", out.Bytes(), Options{Length: 2000})
	assert.NoError(t, err)
}
