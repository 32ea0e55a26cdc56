package forcetable

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/beam"
)

// handTable is a per-combination table on a member of L = 4 m, rows shuffled. Each
// combination keeps V = dM/dx between its stations (M linear where V is constant, and the
// change of M equal to the mean V times the distance), so it reads like a real analysis:
//
//	ULS A  x = 0, 2 (left), 2 (right), 4: M 0, 40, 40, 0; V 30, 10, -20, -20; N 10
//	       (a point load at 2 m: V jumps from 10 to -20)
//	ULS B  x = 0, 1, 3, 4: M 0, 18, 18, 0; V 23, 13, -13, -23; N -50
//	SLS C  x = 0, 2, 4: M 0, 20, 0; V 20, 0, -20; N 5; w 0, 3, 0
const handTable = "x_m,combination,state,M_kNm,V_kN,N_kN,w_mm\r\n" +
	"3,ULS B,ULS,18,-13,-50,\r\n" +
	"2,ULS A,ULS,40,10,10,\r\n" +
	"0,SLS C,SLS,0,20,5,0\r\n" +
	"0,ULS A,ULS,0,30,10,\r\n" +
	"4,ULS B,ULS,0,-23,-50,\r\n" +
	"2,SLS C,sls,20,0,5,3\r\n" +
	"1,ULS B,ULS,18,13,-50,\r\n" +
	"2,ULS A,ULS,40,-20,10,\r\n" +
	"4,SLS C,SLS,0,-20,5,0\r\n" +
	"\"0\",\"ULS B\",ULS,0,23,-50,\r\n" +
	"4,ULS A,uls,0,-20,10,\r\n"

func readHand(t *testing.T) *Table {
	t.Helper()
	tab, err := Read("hand.csv", []byte(handTable), Options{Length: 4000})
	require.NoError(t, err)
	return tab
}

// want is one extreme expected at a station: value in the file's unit and governing name.
type want struct {
	v    float64
	comb string
}

// TestCombinationTableByHand checks the envelope of handTable at x = 1 m, at both sides of the
// jump at 2 m and at x = 3 m against values worked by hand (closed form: linear interpolation
// of each combination between its own stations, then the max and min over the combinations of
// the limit state).
func TestCombinationTableByHand(t *testing.T) {
	tab := readHand(t)
	env := &tab.Envelopes
	assert.Equal(t, CombinationShape, tab.Shape)
	assert.Equal(t, 11, tab.Rows)
	assert.Equal(t, Parts{M: true, V: true, N: true, W: true}, tab.SLS)
	// union of the stations 0, 1, 2, 3, 4 m; A jumps at 2 m; the end station is the left side
	assert.Equal(t, []beam.Station{{X: 0, Side: beam.Right}, {X: 1000, Side: beam.Right}, {X: 2000, Side: beam.Left},
		{X: 2000, Side: beam.Right}, {X: 3000, Side: beam.Right}, {X: 4000, Side: beam.Left}}, env.Stations)

	type row struct {
		station                            int
		mMax, mMin, vMax, vMin, nMax, nMin want
		sls                                [4]float64 // SLS C alone: M, V, N, w
	}
	rows := []row{
		// x = 1 m: A between 0 and 2 (left): M = 0 + ½·40 = 20, V = 30 + ½(10 − 30) = 20, N = 10;
		// B at its station: M 18, V 13, N −50. C between 0 and 2: M 10, V 10, N 5, w 1.5.
		{1, want{20, "ULS A"}, want{18, "ULS B"}, want{20, "ULS A"}, want{13, "ULS B"}, want{10, "ULS A"}, want{-50, "ULS B"},
			[4]float64{10, 10, 5, 1.5}},
		// x = 2 m, left: A's first row at 2 m: M 40, V 10; B between 1 and 3: M 18,
		// V = 13 + ½(−13 − 13) = 0. C at its station: M 20, V 0, w 3.
		{2, want{40, "ULS A"}, want{18, "ULS B"}, want{10, "ULS A"}, want{0, "ULS B"}, want{10, "ULS A"}, want{-50, "ULS B"},
			[4]float64{20, 0, 5, 3}},
		// x = 2 m, right: A's second row: M 40, V −20; B as on the left.
		{3, want{40, "ULS A"}, want{18, "ULS B"}, want{0, "ULS B"}, want{-20, "ULS A"}, want{10, "ULS A"}, want{-50, "ULS B"},
			[4]float64{20, 0, 5, 3}},
		// x = 3 m: A between 2 (right) and 4: M = 40 + ½(0 − 40) = 20, V −20; B at its
		// station: M 18, V −13. C between 2 and 4: M 10, V −10, w 1.5.
		{4, want{20, "ULS A"}, want{18, "ULS B"}, want{-13, "ULS B"}, want{-20, "ULS A"}, want{10, "ULS A"}, want{-50, "ULS B"},
			[4]float64{10, -10, 5, 1.5}},
	}
	check := func(what string, ex beam.Extreme, w want, unit float64) {
		t.Helper()
		assert.InDelta(t, w.v*unit, ex.Value, 1e-9*unit, what)
		assert.Equal(t, w.comb, tab.Governing(ex), what)
	}
	for _, r := range rows {
		i, u := r.station, &env.ULS
		check("M max", u.MMax[i], r.mMax, 1e6)
		check("M min", u.MMin[i], r.mMin, 1e6)
		check("V max", u.VMax[i], r.vMax, 1e3)
		check("V min", u.VMin[i], r.vMin, 1e3)
		check("N max", u.NMax[i], r.nMax, 1e3)
		check("N min", u.NMin[i], r.nMin, 1e3)
		s := &env.SLS
		for k, ser := range [][]beam.Extreme{s.MMax, s.MMin, s.VMax, s.VMin, s.NMax, s.NMin, s.WMax, s.WMin} {
			unit := []float64{1e6, 1e3, 1e3, 1}[k/2]
			check("SLS", ser[i], want{r.sls[k/2], "SLS C"}, unit)
		}
		assert.Zero(t, u.WMax[i].Value, "no ULS deflection")
		assert.Equal(t, int32(-1), u.WMax[i].Combination)
	}
	// the design forces at the jump: the worse side of each (DESIGN.md section 5 pairing):
	// M max 40, M min 18, |V| max = max(10, 0, 0, 20) = 20 kN, N max 10, N min −50
	f, err := tab.At(2000)
	require.NoError(t, err)
	assert.InDelta(t, 40e6, f.ULS.MMax, 1e-3)
	assert.InDelta(t, 18e6, f.ULS.MMin, 1e-3)
	assert.InDelta(t, 20e3, f.ULS.V, 1e-6)
	assert.InDelta(t, 10e3, f.ULS.NMax, 1e-6)
	assert.InDelta(t, -50e3, f.ULS.NMin, 1e-6)
	assert.InDelta(t, 20e6, f.SLS.MMax, 1e-3)
	assert.InDelta(t, 0, f.SLS.V, 1e-6)
	// the combinations in the order they first appear, names kept
	var names []string
	for _, c := range env.Combinations {
		names = append(names, c.State.String()+" "+c.Name)
	}
	assert.Equal(t, []string{"ULS ULS B", "ULS ULS A", "SLS SLS C"}, names)
}

// TestHashAndName: the table keeps its name and the SHA-256 of the bytes as read.
func TestHashAndName(t *testing.T) {
	tab := readHand(t)
	assert.Equal(t, "hand.csv", tab.File)
	// FIPS 180-2 appendix B.1 example: SHA-256("abc"), lower-case hex as the report shows it
	assert.Equal(t, "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", sha256Hex([]byte("abc")))
	assert.Equal(t, sha256Hex([]byte(handTable)), tab.SHA256)
	// a BOM is part of the file's bytes: the hash changes, the table does not
	bom, err := Read("hand.csv", []byte("\ufeff"+handTable), Options{Length: 4000})
	require.NoError(t, err)
	assert.NotEqual(t, tab.SHA256, bom.SHA256)
	assert.Equal(t, tab.Envelopes, bom.Envelopes)
	// LF line ends read the same as CRLF
	lf, err := Read("hand.csv", []byte(strings.ReplaceAll(handTable, "\r\n", "\n")), Options{Length: 4000})
	require.NoError(t, err)
	assert.Equal(t, tab.Envelopes, lf.Envelopes)
}
