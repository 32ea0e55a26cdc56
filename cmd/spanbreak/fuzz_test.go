package main

import (
	"math"
	"testing"

	"spanbreak/optimise"
)

// FuzzParseDesignForces: the parser of design's --uls and --sls never panics, and whatever it
// accepts is a finite force set within the plausible magnitudes with ordered extremes, so a
// NaN, an infinity or an overflowing number never reaches the sizing. The seed corpus is in
// testdata/fuzz/FuzzParseDesignForces.
func FuzzParseDesignForces(f *testing.F) {
	f.Fuzz(func(t *testing.T, s string) {
		got, err := parseDesignForces(s)
		if err != nil {
			return
		}
		for _, v := range []float64{got.MMax, got.MMin, got.V, got.NMax, got.NMin} {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				t.Fatalf("%q: accepted a value that is not finite: %+v", s, got)
			}
		}
		if math.Abs(got.MMax) > optimise.MaxDirectMoment || math.Abs(got.MMin) > optimise.MaxDirectMoment {
			t.Fatalf("%q: a moment beyond the plausible range: %+v", s, got)
		}
		for _, v := range []float64{got.V, got.NMax, got.NMin} {
			if math.Abs(v) > optimise.MaxDirectForce {
				t.Fatalf("%q: a force beyond the plausible range: %+v", s, got)
			}
		}
		if got.MMax < got.MMin || got.NMax < got.NMin {
			t.Fatalf("%q: extremes out of order: %+v", s, got)
		}
	})
}

// FuzzLengthFlag: the parser of --at, --step and --gap values never panics, and whatever it
// accepts is a finite length in mm that the flag takes (a position 0 or more, a spacing more
// than 0, a size 0 or more); a list of positions holds only such values. The seed corpus is
// in testdata/fuzz/FuzzLengthFlag.
func FuzzLengthFlag(f *testing.F) {
	f.Fuzz(func(t *testing.T, s string) {
		for _, k := range []lengthKind{position, spacing, size} {
			mm, err := k.parse(s)
			if err != nil {
				continue
			}
			if math.IsNaN(mm) || math.IsInf(mm, 0) || mm < 0 || (k == spacing && mm == 0) {
				t.Fatalf("kind %d accepted %q as %g mm", k, s, mm)
			}
		}
		var at []float64
		v := &lengthsValue{mm: &at, kind: position}
		if err := v.Set(s); err != nil {
			return
		}
		for _, mm := range at {
			if math.IsNaN(mm) || math.IsInf(mm, 0) || mm < 0 {
				t.Fatalf("--at accepted %q with %g mm", s, mm)
			}
		}
	})
}
