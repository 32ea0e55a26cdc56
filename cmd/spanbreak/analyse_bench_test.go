package main

import (
	"io"
	"os"
	"path/filepath"
	"runtime"
	"testing"

	"spanbreak/internal/scale"
	"spanbreak/optimise"
	"spanbreak/plots/encode"
)

// countingDiscard counts the bytes written to it and keeps none.
type countingDiscard struct{ n int64 }

func (c *countingDiscard) Write(p []byte) (int, error) { c.n += int64(len(p)); return len(p), nil }

// BenchmarkAnalyseMillionStations: the analysis of scale.Job(64) at a 1 mm step — 10⁶
// stations, the most Stations allows — with the envelopes, the member checks and the
// document written in each format to a writer that keeps nothing (what runAnalyse does
// without its buffer of the whole output). Target (issue "Scale and faults", item 1): under
// 512 MB of heap at its peak. It reports the sampled peak of the heap in use (peak-heap-B)
// and of the live heap (peak-live-B), the peak per station, the bytes allocated per station
// and the size of the document.
func BenchmarkAnalyseMillionStations(b *testing.B) {
	for _, format := range []string{"text", "json", "csv"} {
		b.Run(format, func(b *testing.B) {
			setup, err := optimise.Prepare("kilometre.yaml", scale.Job(64))
			if err != nil {
				b.Fatal(err)
			}
			var peak, live uint64
			var stations int
			var out countingDiscard
			var before, after runtime.MemStats
			runtime.ReadMemStats(&before)
			for b.Loop() {
				p := scale.StartPeak()
				o, err := optimise.AnalyseBeam(setup, optimise.BeamSettings{Step: 1})
				if err != nil {
					b.Fatal(err)
				}
				out = countingDiscard{}
				if err := encode.WriteAnalysis(&out, format, o); err != nil {
					b.Fatal(err)
				}
				inUse, l := p.End()
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
	if err := os.WriteFile(job, scale.Job(64), 0o644); err != nil {
		b.Fatal(err)
	}
	for _, format := range []string{"text", "json", "csv"} {
		b.Run(format, func(b *testing.B) {
			var peak, live uint64
			var out countingDiscard
			for b.Loop() {
				p := scale.StartPeak()
				out = countingDiscard{}
				if err := runAnalyse(analyseOptions{JobFile: job, Format: format, Step: 1}, streams{Out: &out, Err: io.Discard}); err != nil {
					b.Fatal(err)
				}
				inUse, l := p.End()
				peak, live = max(peak, inUse), max(live, l)
			}
			b.ReportMetric(float64(peak), "peak-heap-B")
			b.ReportMetric(float64(live), "peak-live-B")
			b.ReportMetric(float64(out.n), "output-B")
		})
	}
}
