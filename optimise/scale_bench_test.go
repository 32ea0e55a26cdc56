package optimise

import (
	"runtime"
	"spanbreak/internal/scale"
	"testing"
	"unsafe"
)

// BenchmarkOptimiseKilometre: the whole run (Run: analysis, scan, layouts, alternatives,
// identical splices, sheets) of scale.Job(64) at its 5 mm step, 199,999 positions, on the
// machine's workers. Target (issue "Scale and faults", item 1): under 256 MB of heap at its
// peak and under 30 s, and per position no more than a few hundred bytes beyond its result
// row (the Candidate). It reports the sampled peak of the heap in use (peak-heap-B: live
// data and the garbage the collector lets build up, up to about twice the live data), the
// peak of the live heap (peak-live-B), the live bytes per position beyond the candidates at
// that peak (extra-live-B/position), the heap the runtime holds (heap-sys-B) and the bytes
// allocated per position.
func BenchmarkOptimiseKilometre(b *testing.B) {
	benchScale(b, 5)
}

func benchScale(b *testing.B, step float64) {
	s, err := Prepare("kilometre.yaml", scale.Job(64))
	if err != nil {
		b.Fatal(err)
	}
	var n int
	var peak, live uint64
	var before, after runtime.MemStats
	runtime.ReadMemStats(&before)
	for b.Loop() {
		p := scale.StartPeak()
		r, err := Run(s, Settings{Step: step})
		inUse, l := p.End()
		peak, live = max(peak, inUse), max(live, l)
		if err != nil {
			b.Fatal(err)
		}
		n = len(r.Candidates)
	}
	runtime.ReadMemStats(&after)
	alloc := float64(after.TotalAlloc-before.TotalAlloc) / float64(b.N)
	row := float64(unsafe.Sizeof(Candidate{}))
	b.ReportMetric(float64(n), "positions")
	b.ReportMetric(float64(peak), "peak-heap-B")
	b.ReportMetric(float64(live), "peak-live-B")
	b.ReportMetric(float64(live)/float64(n)-row, "extra-live-B/position")
	b.ReportMetric(float64(peak)/float64(n), "peak-B/position")
	b.ReportMetric(alloc/float64(n), "alloc-B/position")
	b.ReportMetric(float64(after.HeapSys), "heap-sys-B")
}
