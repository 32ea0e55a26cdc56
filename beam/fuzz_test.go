package beam

import (
	"errors"
	"math"
	"testing"
)

// FuzzAnalysis feeds arbitrary beams and loads to the analysis: it must return an error or
// finite results, never panic and never NaN; after a good analysis the only error a case
// result or an envelope may return is a *NonFiniteError (loads too large for float64). The
// seed corpus lives in testdata/fuzz/FuzzAnalysis and is replayed by every go test.
func FuzzAnalysis(f *testing.F) {
	f.Add(uint8(2), 6000.0, 1500.0, uint8(0b0101), 10.0, 3000.0, 50e3, 2000.0, 4000.0, 25e6, 1e3, uint8(1))
	f.Add(uint8(1), 1.0, 0.0, uint8(0), -1.0, 0.5, 0.0, 0.0, 1.0, 0.0, 0.0, uint8(0))
	f.Add(uint8(6), 12000.0, 0.0, uint8(0xff), 1e9, -5.0, math.Inf(1), 3.0, 2.0, math.NaN(), 7.0, uint8(3))
	f.Fuzz(func(t *testing.T, nSpans uint8, span, overhang float64, kinds uint8, w, at, p, from, to, c, k float64, hinges uint8) {
		n := int(nSpans%8) + 1
		m := Model{EI: 1e14, EA: 2e9}
		x := overhang
		for i := 0; i <= n; i++ {
			sp := Support{X: x, Kind: SupportKind((kinds >> (uint(i) % 8)) & 3), K: k}
			m.Supports = append(m.Supports, sp)
			x += span * (1 + float64(i%3)/2)
		}
		m.Length = m.Supports[n].X + overhang
		for h := 0; h < int(hinges%3); h++ {
			m.Hinges = append(m.Hinges, m.Length*float64(h+1)/4)
		}
		cases := []Case{
			{Name: "A", Kind: Permanent, Loads: []Load{
				{Kind: Distributed, X1: from, X2: to, W1: w, W2: -w / 2},
				{Kind: PointForce, X1: at, P: p},
				{Kind: PointMoment, X1: at / 2, P: c},
			}},
			{Name: "B", Kind: Imposed, Pattern: true, Loads: []Load{
				{Kind: Distributed, X1: 0, X2: m.Length, W1: w, W2: w},
				{Kind: AxialForce, X1: at, P: p},
			}},
		}
		an, err := NewAnalysis(m, cases)
		if err != nil {
			return
		}
		combos := []Combination{{Name: "U", State: ULS, Factors: []Factor{{"A", 1.35, 1}, {"B", 1.5, 0}}}}
		st, err := an.Stations(math.Max(m.Length/50, 1))
		if err != nil {
			return
		}
		var nf *NonFiniteError
		if r, err := an.CaseResult("A", st); err == nil {
			for i := range st {
				assertFinite(t, st[i], r.Effects.M[i], r.Effects.V[i], r.Effects.N[i], r.Effects.W[i])
			}
		} else if !errors.As(err, &nf) {
			t.Fatalf("case result after a good analysis: %v", err)
		}
		env, err := an.Envelopes(combos, st)
		if errors.As(err, &nf) {
			return
		}
		if err != nil {
			t.Fatalf("envelopes after a good analysis: %v", err)
		}
		for i := range st {
			u := &env.ULS
			assertFinite(t, st[i], u.MMax[i].Value, u.MMin[i].Value, u.VMax[i].Value, u.VMin[i].Value,
				u.NMax[i].Value, u.NMin[i].Value, u.WMax[i].Value, u.WMin[i].Value)
		}
	})
}

func assertFinite(t *testing.T, st Station, vs ...float64) {
	t.Helper()
	for _, v := range vs {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			t.Fatalf("non-finite result %g at x = %g", v, st.X)
		}
	}
}
