package forcetable

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// atTable is an envelope table on a member of 4 m with a jump at 2 m (a point load: V steps
// from +30 to −10 ULS, M does not step) and SLS columns.
const atTable = "x_m,side,uls_M_max_kNm,uls_M_min_kNm,uls_V_max_kN,uls_V_min_kN,uls_N_max_kN,uls_N_min_kN," +
	"sls_M_max_kNm,sls_M_min_kNm,sls_V_max_kN,sls_V_min_kN,sls_N_max_kN,sls_N_min_kN\n" +
	"0,right,0,-20,40,10,30,-10,0,-10,30,5,20,-5\n" +
	"2,left,60,10,30,-20,30,-10,40,5,20,-10,20,-5\n" +
	"2,right,60,10,-10,-50,10,-30,40,5,-5,-35,10,-15\n" +
	"4,left,0,-40,-10,-30,10,-30,0,-20,-5,-25,10,-15\n"

// TestAtInterpolatesAndTakesTheWorseSide checks Table.At by hand: linear between stations
// (closed form: v = va + (x − xa)/(xb − xa)·(vb − va)), the worse of the two sides at a jump,
// and the DESIGN.md section 5 pairing (V = the largest |V|).
func TestAtInterpolatesAndTakesTheWorseSide(t *testing.T) {
	tab, err := Read("at.csv", []byte(atTable), Options{Length: 4000})
	require.NoError(t, err)
	const r = 0.001 / 2000
	rows := []struct {
		name     string
		x        float64 // [mm]
		uls, sls ForceSet
	}{
		// x = 0.5 m, a quarter of the way from 0 to 2 (left): M max 0 + ¼·60 = 15,
		// M min −20 + ¼·30 = −12.5, V max 40 − ¼·10 = 37.5, V min 10 − ¼·30 = 2.5 → |V| 37.5;
		// N 30 and −10. SLS: M 10 and −10 + ¼·15 = −6.25; V 30 − 2.5 = 27.5, 5 − 3.75 = 1.25; N 20, −5.
		{"a quarter of the way", 500,
			ForceSet{MMax: 15e6, MMin: -12.5e6, V: 37.5e3, NMax: 30e3, NMin: -10e3},
			ForceSet{MMax: 10e6, MMin: -6.25e6, V: 27.5e3, NMax: 20e3, NMin: -5e3}},
		// x = 2 m: left V max 30, V min −20; right V max −10, V min −50 → |V| 50; N max =
		// max(30, 10) = 30, N min = min(−10, −30) = −30. SLS |V| max(20, 10, 5, 35) = 35,
		// N max 20, N min −15.
		{"at the jump", 2000,
			ForceSet{MMax: 60e6, MMin: 10e6, V: 50e3, NMax: 30e3, NMin: -30e3},
			ForceSet{MMax: 40e6, MMin: 5e6, V: 35e3, NMax: 20e3, NMin: -15e3}},
		// x = 3 m, half way from 2 (right) to 4: M max 30, M min −15, V max −10, V min −40
		// → |V| 40; N 10, −30. SLS: M 20, −7.5; V −5, −30 → 30; N 10, −15.
		{"half way after the jump", 3000,
			ForceSet{MMax: 30e6, MMin: -15e6, V: 40e3, NMax: 10e3, NMin: -30e3},
			ForceSet{MMax: 20e6, MMin: -7.5e6, V: 30e3, NMax: 10e3, NMin: -15e3}},
		// just right of the jump (1 µm: more than float noise, so not the jump): the right side
		// only, r = 0.001/2000 of the way to 4 m; N max is 10 there, not the left side's 30
		{"just after the jump", 2000.001,
			ForceSet{MMax: 60e6 + r*(0-60e6), MMin: 10e6 + r*(-40e6-10e6), V: 50e3 - r*20e3, NMax: 10e3, NMin: -30e3},
			ForceSet{MMax: 40e6 + r*(0-40e6), MMin: 5e6 + r*(-20e6-5e6), V: 35e3 - r*10e3, NMax: 10e3, NMin: -15e3}},
		// the ends, and within the tolerance beyond them
		{"the left end", 0,
			ForceSet{MMax: 0, MMin: -20e6, V: 40e3, NMax: 30e3, NMin: -10e3},
			ForceSet{MMax: 0, MMin: -10e6, V: 30e3, NMax: 20e3, NMin: -5e3}},
		{"within the tolerance past the right end", 4000.5,
			ForceSet{MMax: 0, MMin: -40e6, V: 30e3, NMax: 10e3, NMin: -30e3},
			ForceSet{MMax: 0, MMin: -20e6, V: 25e3, NMax: 10e3, NMin: -15e3}},
	}
	for _, r := range rows {
		f, err := tab.At(r.x)
		require.NoError(t, err, r.name)
		for _, c := range []struct {
			what      string
			got, want ForceSet
		}{{"ULS", f.ULS, r.uls}, {"SLS", f.SLS, r.sls}} {
			assert.InDelta(t, c.want.MMax, c.got.MMax, 1e-3, "%s %s M max", r.name, c.what)
			assert.InDelta(t, c.want.MMin, c.got.MMin, 1e-3, "%s %s M min", r.name, c.what)
			assert.InDelta(t, c.want.V, c.got.V, 1e-6, "%s %s V", r.name, c.what)
			assert.InDelta(t, c.want.NMax, c.got.NMax, 1e-6, "%s %s N max", r.name, c.what)
			assert.InDelta(t, c.want.NMin, c.got.NMin, 1e-6, "%s %s N min", r.name, c.what)
		}
	}
	_, err = tab.At(4002)
	assert.EqualError(t, err, "x = 4.002 m is off the member (0 to 4 m) of the forces table at.csv")
	_, err = tab.At(-2)
	assert.Error(t, err)
	all, err := tab.ForcesAt([]float64{500, 2000})
	require.NoError(t, err)
	assert.InDelta(t, 50e3, all[1].ULS.V, 1e-6)
	assert.InDelta(t, 15e6, all[0].ULS.MMax, 1e-3)
}

// TestAtWithoutSLS: a quantity the file does not give is 0, and Table.SLS says so.
func TestAtWithoutSLS(t *testing.T) {
	tab, err := Read("f.csv", []byte(goodEnvelope), Options{Length: 2000})
	require.NoError(t, err)
	assert.Equal(t, Parts{}, tab.SLS)
	assert.False(t, tab.Deflection())
	f, err := tab.At(1000)
	require.NoError(t, err)
	assert.Equal(t, ForceSet{}, f.SLS)
	// x = 1 m is a station: M max 5, M min 2, |V| max(0, 1) = 1 kN
	assert.Equal(t, ForceSet{MMax: 5e6, MMin: 2e6, V: 1e3}, f.ULS)
}
