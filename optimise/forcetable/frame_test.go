package forcetable

import (
	"fmt"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/beam"
)

// Closed forms for a beam fixed at both ends under a uniform load w over the span L (standard
// handbook beam tables, e.g. Roark's Formulas for Stress and Strain, Table 8.1 case 2e with
// both ends fixed; from memory, and checked here by statics: M(x) = −wL²/12 + wLx/2 − wx²/2):
//
//	M(x) = w(6Lx − 6x² − L²)/12   (−wL²/12 at the ends, +wL²/24 at midspan, +wL²/96 at L/4)
//	V(x) = w(L/2 − x)             (dM/dx)
//	δ(x) = w x²(L − x)²/(24 EI)   (wL⁴/(384 EI) at midspan)
func fixedM(w, l, x float64) float64 { return w * (6*l*x - 6*x*x - l*l) / 12 }
func fixedV(w, l, x float64) float64 { return w * (l/2 - x) }
func fixedW(w, l, ei, x float64) float64 {
	return w * x * x * (l - x) * (l - x) / (24 * ei)
}

// frameTable writes the results of a frame analysis of such a beam as a per-combination table,
// one block per combination, stations every L/n: ULS 1.35 G and 1.00 G (γG,sup and γG,inf of
// EN 1990 Table A1.2(B)) and the characteristic SLS G with its deflection. w [N/mm], l [mm],
// ei [N·mm²].
func frameTable(w, l, ei float64, n int) string {
	var b strings.Builder
	b.WriteString("x_m,combination,state,M_kNm,V_kN,N_kN,w_mm\n")
	for _, c := range []struct {
		name, state string
		factor      float64
	}{{"ULS 1.35G", "ULS", 1.35}, {"ULS 1.00G", "ULS", 1.00}, {"SLS G", "SLS", 1.00}} {
		for i := 0; i <= n; i++ {
			x := float64(i) * l / float64(n)
			defl := ""
			if c.state == "SLS" {
				defl = fmt.Sprintf("%.6f", c.factor*fixedW(w, l, ei, x))
			}
			fmt.Fprintf(&b, "%.6f,%s,%s,%.6f,%.6f,0,%s\n", x/1e3, c.name, c.state,
				c.factor*fixedM(w, l, x)/1e6, c.factor*fixedV(w, l, x)/1e3, defl)
		}
	}
	return b.String()
}

// TestFixedEndedBeamFromAFrameAnalysis reads the per-combination results of a fixed-ended
// beam (L = 6 m, w = 20 kN/m, IPE 400) and checks the envelopes and design forces at the ends,
// the quarter points and midspan against the closed forms above.
func TestFixedEndedBeamFromAFrameAnalysis(t *testing.T) {
	const (
		w = 20.0   // N/mm = kN/m
		l = 6000.0 // mm
		n = 24     // stations every 250 mm: the quarter points and midspan are stations
	)
	// IPE 400: Iy = 23130 cm⁴ (EN 10365:2017, the IPE table; testdata/sections-reference.csv)
	ei := beam.YoungModulus * 23130e4
	tab, err := Read("frame.csv", []byte(frameTable(w, l, ei, n)), Options{Length: l, NeedSLS: true, NeedDeflection: true})
	require.NoError(t, err)
	assert.Equal(t, Parts{M: true, V: true, N: true, W: true}, tab.SLS)
	env := &tab.Envelopes
	require.Len(t, env.Stations, n+1)

	rows := []struct {
		name string
		x    float64
		// expected ULS extremes: where M or V is positive the larger factor gives the maximum
		mMax, mMin, vMax, vMin float64
		mMaxBy, mMinBy         string
	}{
		{"left end", 0, 1.00 * -w * l * l / 12, 1.35 * -w * l * l / 12, 1.35 * w * l / 2, 1.00 * w * l / 2, "ULS 1.00G", "ULS 1.35G"},
		{"quarter point", l / 4, 1.35 * w * l * l / 96, 1.00 * w * l * l / 96, 1.35 * w * l / 4, 1.00 * w * l / 4, "ULS 1.35G", "ULS 1.00G"},
		{"midspan", l / 2, 1.35 * w * l * l / 24, 1.00 * w * l * l / 24, 0, 0, "ULS 1.35G", "ULS 1.00G"},
		{"three-quarter point", 3 * l / 4, 1.35 * w * l * l / 96, 1.00 * w * l * l / 96, 1.00 * -w * l / 4, 1.35 * -w * l / 4, "ULS 1.35G", "ULS 1.00G"},
		{"right end", l, 1.00 * -w * l * l / 12, 1.35 * -w * l * l / 12, 1.00 * -w * l / 2, 1.35 * -w * l / 2, "ULS 1.00G", "ULS 1.35G"},
	}
	// the table holds 6 decimals of kNm and kN: 1e-6 kNm = 1 N·mm, 1e-6 kN = 1e-3 N
	const tolM, tolV = 1.0, 1e-3
	for _, r := range rows {
		i := stationAt(t, env.Stations, r.x)
		assert.InDelta(t, r.mMax, env.ULS.MMax[i].Value, tolM, "%s M max", r.name)
		assert.InDelta(t, r.mMin, env.ULS.MMin[i].Value, tolM, "%s M min", r.name)
		assert.InDelta(t, r.vMax, env.ULS.VMax[i].Value, tolV, "%s V max", r.name)
		assert.InDelta(t, r.vMin, env.ULS.VMin[i].Value, tolV, "%s V min", r.name)
		assert.Equal(t, r.mMaxBy, tab.Governing(env.ULS.MMax[i]), "%s M max governing", r.name)
		assert.Equal(t, r.mMinBy, tab.Governing(env.ULS.MMin[i]), "%s M min governing", r.name)
		// the SLS is G alone
		assert.InDelta(t, fixedM(w, l, r.x), env.SLS.MMax[i].Value, tolM, "%s SLS M", r.name)
		assert.InDelta(t, fixedW(w, l, ei, r.x), env.SLS.WMax[i].Value, 1e-6, "%s SLS w", r.name)

		f, err := tab.At(r.x)
		require.NoError(t, err)
		assert.InDelta(t, r.mMax, f.ULS.MMax, tolM, "%s design M max", r.name)
		assert.InDelta(t, r.mMin, f.ULS.MMin, tolM, "%s design M min", r.name)
		assert.InDelta(t, 1.35*w*abs(l/2-r.x), f.ULS.V, tolV, "%s design |V|", r.name)
		assert.InDelta(t, abs(fixedV(w, l, r.x)), f.SLS.V, tolV, "%s SLS |V|", r.name)
		assert.Zero(t, f.ULS.NMax, "%s: no axial force", r.name)
	}
	// the closed-form values themselves, at midspan: wL²/24 = 20·6²/24 = 30 kNm; ends
	// wL²/12 = 60 kNm; wL⁴/(384 EI) = 20·6000⁴/(384·210000·23130e4) = 1.38966 mm (E = 210000 N/mm², EN 1993-1-1 3.2.6)
	mid := stationAt(t, env.Stations, l/2)
	assert.InEpsilon(t, 1.35*30e6, env.ULS.MMax[mid].Value, 1e-7)
	assert.InEpsilon(t, -1.35*60e6, env.ULS.MMin[0].Value, 1e-7)
	assert.InEpsilon(t, 1.38966, env.SLS.WMax[mid].Value, 1e-5)

	// between stations the moment is interpolated: the chord of the parabola lies below it
	// by at most |M''|h²/8 = 1.35·w·h²/8 (closed form of the chord's error), h = 250 mm
	h := l / n
	x := l/4 + h/2
	f, err := tab.At(x)
	require.NoError(t, err)
	chord := 1.35 * w * h * h / 8
	assert.InDelta(t, 1.35*fixedM(w, l, x)-chord, f.ULS.MMax, tolM, "M max between stations")
	assert.InDelta(t, 1.35*fixedV(w, l, x), f.ULS.V, tolV, "V is linear: exact between stations")
}

// stationAt is the index of the single station at x.
func stationAt(t *testing.T, st []beam.Station, x float64) int {
	t.Helper()
	for i, s := range st {
		if abs(s.X-x) < 1e-6 {
			return i
		}
	}
	t.Fatalf("no station at %g mm", x)
	return -1
}

func abs(v float64) float64 {
	if v < 0 {
		return -v
	}
	return v
}
