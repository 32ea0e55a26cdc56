package splice

import "testing"

// benchProblem is one position of a long roof girder: IPE 600 in S355, category B, friction
// class A, M = +520/−310 kNm, V = 290 kN, N = +60/−120 kN at ULS (SLS about 1/1.4 of it),
// sized over the whole default design space (DefaultDesignSpace).
func benchProblem(b *testing.B) Problem {
	sls := Forces{MMax: knm(370), MMin: knm(-220), V: kn(205), NMax: kn(40), NMin: kn(-85)}
	return Problem{
		Member:     member(b, "IPE 600", steelS355()),
		ULS:        Forces{MMax: knm(520), MMin: knm(-310), V: kn(290), NMax: kn(60), NMin: kn(-120)},
		SLS:        &sls,
		PlateSteel: steelS355(),
		Brief:      true,
		Sizing:     Sizing{Category: CategoryB, FrictionClass: "A", Gap: 10},
	}
}

// BenchmarkSize sizes one position over the default design space (target: under 50 µs).
func BenchmarkSize(b *testing.B) {
	p := benchProblem(b)
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		if _, err := Size(p); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSizeSheet is BenchmarkSize with the full calculation-sheet text of the result.
func BenchmarkSizeSheet(b *testing.B) {
	p := benchProblem(b)
	p.Brief = false
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		if _, err := Size(p); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSizeExhaustive evaluates every configuration of the default design space.
func BenchmarkSizeExhaustive(b *testing.B) {
	p := benchProblem(b)
	for i := 0; i < b.N; i++ {
		if _, err := SizeExhaustive(p); err != nil {
			b.Fatal(err)
		}
	}
}
