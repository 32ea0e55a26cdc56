package optimise

import (
	"slices"
	"strings"
	"testing"
	"time"
)

// benchUniform times Outcome.Uniform on a job at its default step after one whole run, and
// reports the run's own time on one worker (median of 5) as run-ns and the ratio
// uniform/run.
func benchUniform(b *testing.B, s *Setup) {
	b.Helper()
	var runs []time.Duration
	var o *Outcome
	for range 5 {
		start := time.Now()
		var err error
		if o, err = Run(s, Settings{Workers: 1}); err != nil {
			b.Fatal(err)
		}
		runs = append(runs, time.Since(start))
	}
	slices.Sort(runs)
	run := float64(runs[len(runs)/2].Nanoseconds())
	var u UniformResult
	for b.Loop() {
		var err error
		if u, err = o.Uniform(); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(run, "run-ns")
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/run, "uniform/run")
	b.ReportMetric(float64(u.Stats.Listed), "listed")
	b.ReportMetric(float64(u.Stats.Evaluations), "checks")
}

// BenchmarkUniformDemo: the uniform search on the demo job at its default step (50 mm, 605
// positions on the 30.3 m beam). Target (issue
// "What a fabricator asks for", item 1): uniform/run below 1, the search taking less time
// than the whole run it follows.
func BenchmarkUniformDemo(b *testing.B) {
	s, err := Prepare(DemoJobName, DemoJob())
	if err != nil {
		b.Fatal(err)
	}
	benchUniform(b, s)
}

// BenchmarkUniformDemoHeavyRoof: the same with the demo's permanent roof load twice as heavy
// (27 kN/m), so that the splice grows further along the beam.
func BenchmarkUniformDemoHeavyRoof(b *testing.B) {
	src := string(DemoJob())
	if !strings.Contains(src, "{udl: 13.5}") {
		b.Fatal("the demo's roof load has changed")
	}
	s, err := Prepare("heavy-roof.yaml", []byte(strings.Replace(src, "{udl: 13.5}", "{udl: 27.0}", 1)))
	if err != nil {
		b.Fatal(err)
	}
	benchUniform(b, s)
}
