package beam_test

import (
	"fmt"

	"spanbreak/beam"
)

// Two equal spans of 8 m in IPE 400, S355, under a permanent UDL of 10 kN/m and a patterned
// imposed UDL of 15 kN/m: the EN 1993-1-1 cross-section checks along the beam and the
// deflection of each span.
func ExampleMember_CheckEnvelopes() {
	sec, _ := beam.LookupSection("IPE 400")
	steel, _ := beam.LookupGrade("S355")
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
	st, _ := an.Stations(50)
	env, _ := an.Envelopes(combos, st)

	member, err := beam.NewMember(sec, steel, beam.MemberSettings{})
	if err != nil {
		fmt.Println(err)
		return
	}
	res, err := member.CheckEnvelopes(&env)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%v, Mc,Rd %.1f kNm, Vc,Rd %.1f kN\n", res.Class, res.Section.McRd/1e6, res.Section.VcRd/1e3)
	fmt.Printf("governing: %s %.3f at x = %.1f m (%s; %v)\n", res.Check, res.Utilisation, res.X/1e3, res.Combination, res.Pairing)

	defl, err := an.CheckDeflections(&env, beam.DeflectionLimits{})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, r := range defl.Regions {
		fmt.Printf("%s: w %.1f mm at x = %.2f m, limit %.1f mm, utilisation %.3f\n", r.Region.Name, r.W, r.Station.X/1e3, r.Limit, r.Utilisation)
	}
	// By hand: Mc,Rd = Wpl,y·fy/γM0 = 1307 cm³·355 = 464 kNm (published Wpl,y, EN 10365); the
	// support moment −0.125·36·8² = −288 kNm (three-moment theorem) gives 288/464 = 0.621;
	// Vc,Rd = Avz·fy/(√3·γM0) = 42.7 cm²·355/√3 = 875 kN. Deflection (SLS characteristic):
	// G on both spans, 0.0054·wL⁴/EI, plus Q on one span, 0.0092·wL⁴/EI (handbook
	// coefficients for two equal spans, from memory), with L⁴/EI = (8 m)⁴/(210 GPa·23 130 cm⁴)
	// = 84.3 mm per kN/m: 0.0054·10·84.3 + 0.0092·15·84.3 ≈ 16 mm; limit L/250 = 32 mm.

	// Output:
	// class 1, Mc,Rd 464.0 kNm, Vc,Rd 875.1 kN
	// governing: bending 0.621 at x = 8.0 m (ULS 6.10, Q leading; Q on the whole beam; M min with |V| from V min and N max)
	// span 1: w 16.1 mm at x = 3.65 m, limit 32.0 mm, utilisation 0.503
	// span 2: w 16.1 mm at x = 12.35 m, limit 32.0 mm, utilisation 0.503
}
