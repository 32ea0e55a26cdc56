package main

import (
	"fmt"
	"io"
	"os"
	"path/filepath"
	"runtime"
	"runtime/metrics"
	"strings"
	"sync"
	"testing"
	"time"

	"spanbreak/optimise"
	"spanbreak/plots/encode"
)

// kilometreJob is a beam at the edge of the documented limits, invented for the benchmarks: a
// continuous IPE 600 over 64 spans of 15.625 m (1 km, the longest beam; 64 regions, the
// most), seven load cases of which three are patterned.
func kilometreJob() []byte {
	const spans, span = 64, 15.625
	var b strings.Builder
	b.WriteString("title: Long continuous runway beam (invented, for benchmarks)\nbeam:\n  section: IPE 600\n  grade: S355\n  spans: [")
	for i := range spans {
		if i > 0 {
			b.WriteString(", ")
		}
		fmt.Fprintf(&b, "%g", span)
	}
	b.WriteString("]\n  supports: [pinned" + strings.Repeat(", roller", spans) + "]\n  self_weight: true\n")
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
	b.WriteString("  H:\n    kind: other\n    psi: [0.6, 0.5, 0.2]\n    loads:\n      - {udl: 1.5, from: 0, to: 400}\n")
	b.WriteString("combinations:\n  rules: EN1990\n  uls: \"6.10ab\"\n  sls: characteristic\n")
	return []byte(b.String())
}

// countingDiscard counts the bytes written to it and keeps none.
type countingDiscard struct{ n int64 }

func (c *countingDiscard) Write(p []byte) (int, error) { c.n += int64(len(p)); return len(p), nil }

// heapPeak samples the heap in use (objects and the unused part of their spans, as the
// runtime's HeapInuse) every millisecond through runtime/metrics, which does not stop the
// world, and keeps the largest sample.
type heapPeak struct {
	stop chan struct{}
	done sync.WaitGroup
	max  uint64 // heap in use
	live uint64 // heap live after a collection (/gc/heap/live)
}

func startHeapPeak() *heapPeak {
	runtime.GC()
	p := &heapPeak{stop: make(chan struct{})}
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
func (p *heapPeak) end() (inUse, live uint64) {
	close(p.stop)
	p.done.Wait()
	return p.max, p.live
}

// BenchmarkAnalyseMillionStations: the analysis of kilometreJob at a 1 mm step — 10⁶
// stations, the most Stations allows — with the envelopes, the member checks and the
// document written in each format to a writer that keeps nothing (what runAnalyse does
// without its buffer of the whole output). Target (issue "Scale and faults", item 1): under
// 512 MB of heap at its peak. It reports the sampled peak of the heap in use (peak-heap-B)
// and of the live heap (peak-live-B), the peak per station, the bytes allocated per station
// and the size of the document.
func BenchmarkAnalyseMillionStations(b *testing.B) {
	for _, format := range []string{"text", "json", "csv"} {
		b.Run(format, func(b *testing.B) {
			setup, err := optimise.Prepare("kilometre.yaml", kilometreJob())
			if err != nil {
				b.Fatal(err)
			}
			var peak, live uint64
			var stations int
			var out countingDiscard
			var before, after runtime.MemStats
			runtime.ReadMemStats(&before)
			for b.Loop() {
				p := startHeapPeak()
				o, err := optimise.AnalyseBeam(setup, optimise.BeamSettings{Step: 1})
				if err != nil {
					b.Fatal(err)
				}
				out = countingDiscard{}
				if err := encode.WriteAnalysis(&out, format, o); err != nil {
					b.Fatal(err)
				}
				inUse, l := p.end()
				peak, live = max(peak, inUse), max(live, l)
				stations = len(o.Stations)
			}
			runtime.ReadMemStats(&after)
			b.ReportMetric(float64(stations), "stations")
			b.ReportMetric(float64(peak), "peak-heap-B")
			b.ReportMetric(float64(live), "peak-live-B")
			b.ReportMetric(float64(peak)/float64(stations), "peak-B/station")
			b.ReportMetric(float64(after.TotalAlloc-before.TotalAlloc)/float64(b.N)/float64(stations), "alloc-B/station")
			b.ReportMetric(float64(out.n), "output-B")
		})
	}
}

// BenchmarkAnalyseCommandMillionStations is BenchmarkAnalyseMillionStations through the
// command itself (runAnalyse, reading the job file, --step 1 mm), so that what the command
// holds besides the encoder counts too: the target is under 512 MB at 10⁶ stations.
func BenchmarkAnalyseCommandMillionStations(b *testing.B) {
	job := filepath.Join(b.TempDir(), "kilometre.yaml")
	if err := os.WriteFile(job, kilometreJob(), 0o644); err != nil {
		b.Fatal(err)
	}
	for _, format := range []string{"text", "json", "csv"} {
		b.Run(format, func(b *testing.B) {
			var peak, live uint64
			var out countingDiscard
			for b.Loop() {
				p := startHeapPeak()
				out = countingDiscard{}
				if err := runAnalyse(analyseOptions{JobFile: job, Format: format, Step: 1}, streams{Out: &out, Err: io.Discard}); err != nil {
					b.Fatal(err)
				}
				inUse, l := p.end()
				peak, live = max(peak, inUse), max(live, l)
			}
			b.ReportMetric(float64(peak), "peak-heap-B")
			b.ReportMetric(float64(live), "peak-live-B")
			b.ReportMetric(float64(out.n), "output-B")
		})
	}
}
