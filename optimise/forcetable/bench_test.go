package forcetable

import (
	"fmt"
	"strings"
	"testing"
)

// benchTable is a per-combination table of a 12 m member: 60 combinations × 481 stations
// (every 25 mm), about 29,000 rows — a large frame-analysis export.
func benchTable() string {
	var b strings.Builder
	b.WriteString("x_m,combination,state,M_kNm,V_kN,N_kN,w_mm\n")
	for c := 0; c < 60; c++ {
		state := "ULS"
		if c >= 40 {
			state = "SLS"
		}
		f := 1 + float64(c)/60
		for i := 0; i <= 480; i++ {
			x := float64(i) * 12 / 480
			fmt.Fprintf(&b, "%.3f,C%d,%s,%.3f,%.3f,%.3f,%.3f\n", x, c, state, f*10*x*(12-x)/2, f*10*(6-x), -f*20, f*x*(12-x)/10)
		}
	}
	return b.String()
}

// BenchmarkReadCombinations: reading and enveloping a large per-combination table.
func BenchmarkReadCombinations(b *testing.B) {
	data := []byte(benchTable())
	b.SetBytes(int64(len(data)))
	for b.Loop() {
		if _, err := Read("bench.csv", data, Options{Length: 12000}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkAt: the design forces at a candidate position, as a scan asks for them.
func BenchmarkAt(b *testing.B) {
	tab, err := Read("bench.csv", []byte(benchTable()), Options{Length: 12000})
	if err != nil {
		b.Fatal(err)
	}
	x := 0.0
	for b.Loop() {
		if _, err := tab.At(x); err != nil {
			b.Fatal(err)
		}
		x += 37
		if x > 12000 {
			x = 0
		}
	}
}
