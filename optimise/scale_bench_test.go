package optimise

import (
	"fmt"
	"runtime"
	"runtime/metrics"
	"strings"
	"sync"
	"testing"
	"time"
	"unsafe"
)

// scaleJob is a job at the edge of the documented limits, invented for the memory and speed
// benchmarks: a continuous IPE 600 over spans×(1000 m / spans) (64 spans: the most pattern
// regions, beam.MaxRegions, and the longest beam, jobfile.MaxBeamLength), seven load cases
// (self weight, three patterned), pieces up to 13.6 m, three vehicle tiers and a 5 mm scan
// step (199,999 positions on 1 km, MaxCandidates).
func scaleJob(spans int) []byte {
	span := 1000.0 / float64(spans)
	var b strings.Builder
	fmt.Fprintf(&b, "title: Long continuous runway beam (invented, for benchmarks)\n")
	fmt.Fprintf(&b, "beam:\n  section: IPE 600\n  grade: S355\n  spans: [")
	for i := range spans {
		if i > 0 {
			b.WriteString(", ")
		}
		fmt.Fprintf(&b, "%g", span)
	}
	b.WriteString("]\n  supports: [pinned")
	for range spans {
		b.WriteString(", roller")
	}
	b.WriteString("]\n  self_weight: true\n")
	b.WriteString("cases:\n  G:\n    kind: permanent\n    loads:\n      - {udl: 9.0}\n")
	for i := 0; i < spans; i += 4 {
		fmt.Fprintf(&b, "      - {point: 30, at: %g}\n", (float64(i)+0.5)*span)
	}
	b.WriteString("  Q:\n    kind: imposed\n    category: B\n    pattern: true\n    loads:\n      - {udl: 6.0}\n")
	b.WriteString("  S:\n    kind: snow\n    category: low\n    pattern: true\n    loads:\n      - {udl: 2.5}\n")
	b.WriteString("  W:\n    kind: wind\n    loads:\n      - {udl: -2.0}\n")
	b.WriteString("  E:\n    kind: other\n    psi: [0.7, 0.5, 0.3]\n    pattern: true\n    loads:\n")
	for i := 2; i < spans; i += 8 {
		fmt.Fprintf(&b, "      - {point: 40, at: %g}\n", (float64(i)+0.25)*span)
	}
	b.WriteString("  H:\n    kind: other\n    psi: [0.6, 0.5, 0.2]\n    loads:\n")
	fmt.Fprintf(&b, "      - {udl: 1.5, from: 0, to: %g}\n", 0.4*1000)
	b.WriteString(`combinations:
  rules: EN1990
  uls: "6.10ab"
  sls: characteristic
splice:
  category: B
  friction_class: A
  bolts: {sizes: [M20, M24], classes: ["8.8", "10.9"]}
  plates: {grade: S355, thicknesses: [10, 12, 15, 20, 25]}
  flange_plates: [outer, outer+inner]
  distribution: proportional
  gap: 10
limits:
  max_piece_length: 13.6
  min_piece_length: 3.0
  max_piece_mass: 3500
  keep_out:
    supports: 1.0
    point_loads: 0.4
vehicles:
  - {name: rigid 10 m, max_length: 10.0, payload: 12000, cost: 520}
  - {name: semi-trailer, max_length: 13.6, payload: 24000, cost: 780}
  - {name: extendable trailer, max_length: 18.5, payload: 20000, cost: 1450}
costs:
  bolt: {M20: 2.9, M24: 4.1}
  bolt_class_factor: {"10.9": 1.35}
  plate_per_kg: 2.6
  hole: 1.6
  faying_per_m2: 32
  splice: 140
  lift: 165
scan:
  step: 0.005
  alternatives: 5
`)
	return []byte(b.String())
}

// peakHeap samples the heap in use (the runtime's HeapInuse: spans holding objects) every
// millisecond while a function runs, through runtime/metrics, which does not stop the world,
// and keeps the largest sample.
type peakHeap struct {
	stop chan struct{}
	done sync.WaitGroup
	max  uint64 // heap in use
	live uint64 // heap live after a collection (/gc/heap/live)
}

func startPeak() *peakHeap {
	runtime.GC()
	p := &peakHeap{stop: make(chan struct{})}
	p.done.Add(1)
	go func() {
		defer p.done.Done()
		t := time.NewTicker(time.Millisecond)
		defer t.Stop()
		sample := []metrics.Sample{{Name: "/memory/classes/heap/objects:bytes"}, {Name: "/memory/classes/heap/unused:bytes"},
			{Name: "/gc/heap/live:bytes"}}
		for {
			metrics.Read(sample)
			p.max = max(p.max, sample[0].Value.Uint64()+sample[1].Value.Uint64())
			p.live = max(p.live, sample[2].Value.Uint64())
			select {
			case <-p.stop:
				return
			case <-t.C:
			}
		}
	}()
	return p
}

// end stops the sampling and returns the largest heap in use and live heap sampled.
func (p *peakHeap) end() (inUse, live uint64) {
	close(p.stop)
	p.done.Wait()
	return p.max, p.live
}

// BenchmarkOptimiseKilometre: the whole run (Run: analysis, scan, layouts, alternatives,
// identical splices, sheets) of scaleJob(64) at its 5 mm step, 199,999 positions, on the
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
	s, err := Prepare("kilometre.yaml", scaleJob(64))
	if err != nil {
		b.Fatal(err)
	}
	var n int
	var peak, live uint64
	var before, after runtime.MemStats
	runtime.ReadMemStats(&before)
	for b.Loop() {
		p := startPeak()
		r, err := Run(s, Settings{Step: step})
		inUse, l := p.end()
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
