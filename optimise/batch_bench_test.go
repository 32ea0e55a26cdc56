package optimise

import (
	"fmt"
	"math/rand/v2"
	"reflect"
	"strings"
	"testing"
)

// batchSections are the sections the generated beams take, light to heavy, so that some beams
// carry their load on a small section and need heavy splices.
var batchSections = []string{"IPE 300", "IPE 360", "IPE 400", "IPE 450", "IPE 500", "IPE 600", "HE 300 A", "HE 400 B"}

// generatedJob is an invented job of 1 to 5 spans from the seed: spans of 4 to 12 m, a light to
// heavy section, permanent and imposed loads with a point load in one span, the default splice
// design space and the default scan step. Every value is invented for the benchmark.
func generatedJob(seed uint64) []byte {
	r := rand.New(rand.NewPCG(seed, 0x5eed))
	n := 1 + r.IntN(5)
	spans := make([]string, n)
	supports := []string{"pinned"}
	length := 0.0
	for i := range spans {
		l := 4 + float64(r.IntN(81))/10 // 4.0 to 12.0 m
		spans[i] = fmt.Sprintf("%.1f", l)
		length += l
		supports = append(supports, "roller")
	}
	sec := batchSections[r.IntN(len(batchSections))]
	g := 4 + float64(r.IntN(210))/10   // 4 to 25 kN/m
	q := 3 + float64(r.IntN(270))/10   // 3 to 30 kN/m
	p := 10 + float64(r.IntN(90))      // 10 to 99 kN
	at := 0.5 + r.Float64()*(length-1) // on the beam
	var b strings.Builder
	fmt.Fprintf(&b, "title: generated beam %d (invented)\n", seed)
	fmt.Fprintf(&b, "beam:\n  section: %s\n  grade: S355\n  spans: [%s]\n  supports: [%s]\n  self_weight: true\n",
		sec, strings.Join(spans, ", "), strings.Join(supports, ", "))
	fmt.Fprintf(&b, "cases:\n  G:\n    kind: permanent\n    loads:\n      - {udl: %.1f}\n      - {point: %.0f, at: %.2f}\n", g, p, at)
	fmt.Fprintf(&b, "  Q:\n    kind: imposed\n    category: B\n    pattern: true\n    loads:\n      - {udl: %.1f}\n", q)
	b.WriteString("limits:\n  max_piece_length: 13.6\n  min_piece_length: 2.0\n  keep_out: {supports: 0.5, point_loads: 0.25}\n")
	b.WriteString("vehicles:\n  - {name: semi-trailer, max_length: 13.6, payload: 24000, cost: 800}\n")
	return []byte(b.String())
}

// generatedBatch is n generated jobs.
func generatedBatch(n int) []BatchInput {
	in := make([]BatchInput, n)
	for i := range in {
		in[i] = BatchInput{File: fmt.Sprintf("beam-%03d.yaml", i), Data: generatedJob(uint64(i))}
	}
	return in
}

// TestGeneratedJobsAreValid: the benchmark's beams are jobs the program takes (each prepares),
// so the benchmark measures optimising, not refusing.
func TestGeneratedJobsAreValid(t *testing.T) {
	for _, in := range generatedBatch(40) {
		if _, err := Prepare(in.File, in.Data); err != nil {
			t.Fatalf("%s: %v\n%s", in.File, err, in.Data)
		}
	}
}

// BenchmarkBatch500 optimises 500 generated beams of 1 to 5 spans as one batch on every CPU
// (issue target: under 10 s on 2 cores), beams of one section sharing their sizer as a batch
// does. It reports the jobs refused (none expected).
func BenchmarkBatch500(b *testing.B) {
	in := generatedBatch(500)
	for b.Loop() {
		out := Batch(in, Settings{}, 0, nil)
		failed := 0
		for _, o := range out {
			if o.Err != nil && o.Outcome == nil {
				failed++
			}
		}
		b.ReportMetric(float64(failed), "refused")
	}
}

// TestBatchSharedSizersChangeNothing: a batch shares one sizer between beams of the same
// section, grade and design space, across its workers; every beam's candidates, layouts,
// identical-splice layouts, recommendation and checked splices are exactly those of the beam
// run alone with a sizer of its own.
func TestBatchSharedSizersChangeNothing(t *testing.T) {
	n := 16
	if testing.Short() {
		n = 6
	}
	in := generatedBatch(n)
	out := Batch(in, Settings{}, 2, nil)
	sections := map[string]int{}
	for i, x := range in {
		s, err := Prepare(x.File, x.Data)
		if err != nil {
			t.Fatal(err)
		}
		sections[s.Section.Name]++
		s.shelf = nil // a sizer of its own
		alone, err := Run(s, Settings{})
		got := out[i]
		if (err == nil) != (got.Err == nil) {
			t.Fatalf("%s: alone %v, in the batch %v", x.File, err, got.Err)
		}
		if alone == nil {
			continue
		}
		o := got.Outcome
		for _, c := range []struct {
			what      string
			want, got any
		}{
			{"candidates", alone.Candidates, o.Candidates},
			{"layouts", alone.Layouts, o.Layouts},
			{"identical splices", alone.Identical, o.Identical},
			{"pick", alone.Pick, o.Pick},
			{"chosen", alone.Chosen, o.Chosen},
		} {
			if !reflect.DeepEqual(c.want, c.got) {
				t.Fatalf("%s: the %s differ in the batch", x.File, c.what)
			}
		}
	}
	shared := 0
	for _, k := range sections {
		shared += k - 1
	}
	if shared == 0 {
		t.Fatal("no two beams of the batch share a section: the test shares nothing")
	}
}
