package beam

import "testing"

// tenSpans is the benchmark beam: 10 spans of 8 m, six load cases (two permanent, four
// variable of which three are patterned), EN 1990 6.10a/b and the characteristic SLS
// combinations.
func tenSpans(b *testing.B) (Model, []Case, []Combination) {
	b.Helper()
	const span = 8000.0
	sup := []Support{{X: 0, Kind: Pinned}}
	for i := 1; i <= 10; i++ {
		sup = append(sup, Support{X: float64(i) * span, Kind: Roller})
	}
	m := Model{Length: 10 * span, Supports: sup, EI: testEI, EA: testEA}
	L := m.Length
	cases := []Case{
		{Name: "G1", Kind: Permanent, Loads: []Load{udl(8, 0, L)}},
		{Name: "G2", Kind: Permanent, Loads: []Load{point(40e3, 0.5*span), point(40e3, 4.5*span), point(40e3, 8.2*span)}},
		{Name: "Q1", Kind: Imposed, Category: "B", Pattern: true, Loads: []Load{udl(12, 0, L), udl(8, 2000, 14000)}},
		{Name: "Q2", Kind: Imposed, Category: "C", Pattern: true, Loads: []Load{point(30e3, 2.5*span), point(30e3, 6.5*span)}},
		{Name: "S", Kind: Snow, Pattern: true, Loads: []Load{{Kind: Distributed, X1: 0, X2: L, W1: 2, W2: 6}}},
		{Name: "W", Kind: Wind, Loads: []Load{udl(-4, 0, L)}},
	}
	rules, err := NewRules("EN1990", "6.10ab", "characteristic", nil)
	if err != nil {
		b.Fatal(err)
	}
	combos, err := Combinations(cases, rules)
	if err != nil {
		b.Fatal(err)
	}
	return m, cases, combos
}

// BenchmarkAnalyse10Spans6Cases: build, solve and envelope the 10-span beam at about 2,000
// stations. Target (issue 2): under 5 ms per analysis on one core.
func BenchmarkAnalyse10Spans6Cases(b *testing.B) {
	m, cases, combos := tenSpans(b)
	step := m.Length / 2000
	b.ReportAllocs()
	var nst int
	for b.Loop() {
		an, err := NewAnalysis(m, cases)
		if err != nil {
			b.Fatal(err)
		}
		st, err := an.Stations(step)
		if err != nil {
			b.Fatal(err)
		}
		if _, err := an.Envelopes(combos, st); err != nil {
			b.Fatal(err)
		}
		nst = len(st)
	}
	b.ReportMetric(float64(nst), "stations")
}

// BenchmarkMemberAndDeflectionChecks: the EN 1993-1-1 cross-section checks (four pairings per
// station) and the deflection check of every region of the 10-span beam at about 2,000
// stations, the analysis and envelopes already built. No target set; kept so a slowdown shows.
func BenchmarkMemberAndDeflectionChecks(b *testing.B) {
	m, cases, combos := tenSpans(b)
	an, err := NewAnalysis(m, cases)
	if err != nil {
		b.Fatal(err)
	}
	st, err := an.Stations(m.Length / 2000)
	if err != nil {
		b.Fatal(err)
	}
	env, err := an.Envelopes(combos, st)
	if err != nil {
		b.Fatal(err)
	}
	sec, err := LookupSection("IPE 500")
	if err != nil {
		b.Fatal(err)
	}
	g, err := LookupGrade("S355")
	if err != nil {
		b.Fatal(err)
	}
	mem, err := NewMember(sec, g, MemberSettings{})
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := mem.CheckEnvelopes(&env); err != nil {
			b.Fatal(err)
		}
		if _, err := an.CheckDeflections(&env, DeflectionLimits{}); err != nil {
			b.Fatal(err)
		}
	}
}
