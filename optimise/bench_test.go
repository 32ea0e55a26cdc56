package optimise

import (
	"testing"
)

// BenchmarkOptimiseDemo10mm: the whole optimisation of the demo job at a 10 mm step (3,029
// positions) on one worker — analysis, envelopes, sizing, layouts and alternatives.
// Target (issue 4): under 0.5 s on one core, and at least 20 times faster than the
// exhaustive run (TestDemoExhaustiveAt10mm measures that one; it takes tens of minutes).
func BenchmarkOptimiseDemo10mm(b *testing.B) {
	s, err := Prepare(DemoJobName, DemoJob())
	if err != nil {
		b.Fatal(err)
	}
	var n int
	for b.Loop() {
		r, err := Run(s, Settings{Step: 10, Workers: 1})
		if err != nil {
			b.Fatal(err)
		}
		n = len(r.Candidates)
	}
	b.ReportMetric(float64(n), "positions")
}

// BenchmarkExhaustivePosition: one position of the exhaustive scan of the demo job (its own
// envelope calculation and the splice package's exhaustive sizing), averaged over positions
// spread along the beam; × the open positions of the 10 mm scan gives the exhaustive run.
func BenchmarkExhaustivePosition(b *testing.B) {
	s, err := Prepare(DemoJobName, DemoJob())
	if err != nil {
		b.Fatal(err)
	}
	an, err := s.Analyse()
	if err != nil {
		b.Fatal(err)
	}
	d := s.NewSpliceDesigner(true)
	xs := []float64{2500, 5000, 6500, 11000, 12500, 16000, 18250, 23000, 26000} // on the 30.3 m beam
	i := 0
	for b.Loop() {
		if _, _, err := Scan(AnalysedForces(an, s.Combinations), xs[i%len(xs):i%len(xs)+1], nil, d, ScanSettings{Exhaustive: true}); err != nil {
			b.Fatal(err)
		}
		i++
	}
}
