package beam_test

import (
	"fmt"

	"spanbreak/beam"
)

// Two equal spans of 8 m under a permanent UDL of 10 kN/m and a patterned imposed UDL of
// 15 kN/m; the ULS envelope at the middle support and at 3 m into the first span.
func ExampleAnalysis_Envelopes() {
	sec, _ := beam.LookupSection("IPE 400")
	m := beam.Model{
		Length: 16000,
		Supports: []beam.Support{
			{X: 0, Kind: beam.Pinned}, {X: 8000, Kind: beam.Roller}, {X: 16000, Kind: beam.Roller},
		},
		EI: beam.YoungModulus * sec.Iy,
		EA: beam.YoungModulus * sec.A,
	}
	cases := []beam.Case{
		{Name: "G", Kind: beam.Permanent, Loads: []beam.Load{{Kind: beam.Distributed, X1: 0, X2: 16000, W1: 10, W2: 10}}},
		{Name: "Q", Kind: beam.Imposed, Category: "B", Pattern: true,
			Loads: []beam.Load{{Kind: beam.Distributed, X1: 0, X2: 16000, W1: 15, W2: 15}}},
	}
	rules, _ := beam.NewRules("EN1990", "6.10", "characteristic", nil)
	combos, _ := beam.Combinations(cases, rules)
	an, err := beam.NewAnalysis(m, cases)
	if err != nil {
		fmt.Println(err)
		return
	}
	st, _ := an.StationsAt([]float64{3000, 8000})
	env, _ := an.Envelopes(combos, st)
	for i, s := range st {
		fmt.Printf("x = %.1f m: M max %7.1f kNm, M min %7.1f kNm (%s)\n", s.X/1e3,
			env.ULS.MMax[i].Value/1e6, env.ULS.MMin[i].Value/1e6, env.Governing(env.ULS.MMin[i]))
	}
	// By hand (three-moment theorem, equal spans L = 8 m): all spans at 1.35·10 + 1.5·15 = 36 kN/m
	// give −0.125·36·8² = −288 kNm at the support; G alone at γG,inf gives −0.125·10·8² = −80.
	// At 3 m: 1.35 G (60.75) + Q on span 1 only (135.0) = 195.75; G (45.0) + Q on span 2 only
	// (−33.75) = 11.25.

	// Output:
	// x = 3.0 m: M max   195.7 kNm, M min    11.2 kNm (ULS 6.10, Q leading; Q on span 2)
	// x = 8.0 m: M max   -80.0 kNm, M min  -288.0 kNm (ULS 6.10, Q leading; Q on the whole beam)
	// x = 8.0 m: M max   -80.0 kNm, M min  -288.0 kNm (ULS 6.10, Q leading; Q on the whole beam)
}
