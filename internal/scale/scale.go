// Package scale holds the fixtures of the scale benchmarks (optimise and the command): a job
// at the edge of the documented limits, invented for them, and a sampler of the heap's peak.
// Only tests import it.
package scale

import (
	"fmt"
	"runtime"
	"runtime/metrics"
	"strings"
	"sync"
	"time"
)

// Job is a job at the edge of the documented limits, invented for the memory and speed
// benchmarks: a continuous IPE 600 over spans×(1000 m / spans) (64 spans: the most pattern
// regions, beam.MaxRegions, and the longest beam, jobfile.MaxBeamLength), seven load cases
// (self weight, three patterned), pieces up to 13.6 m, three vehicle tiers and a 5 mm scan
// step (199,999 positions on 1 km, MaxCandidates).
func Job(spans int) []byte {
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

// Peak samples the heap in use (the runtime's HeapInuse: spans holding objects) every
// millisecond while a function runs, through runtime/metrics, which does not stop the world,
// and keeps the largest sample.
type Peak struct {
	stop chan struct{}
	done sync.WaitGroup
	max  uint64 // heap in use
	live uint64 // heap live after a collection (/gc/heap/live)
}

// StartPeak collects garbage and starts sampling.
func StartPeak() *Peak {
	runtime.GC()
	p := &Peak{stop: make(chan struct{})}
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

// End stops the sampling and returns the largest heap in use and live heap sampled.
func (p *Peak) End() (inUse, live uint64) {
	close(p.stop)
	p.done.Wait()
	return p.max, p.live
}
