package jobfile

import (
	"errors"
	"math"
	"strings"
	"testing"
)

// FuzzLoadJob feeds arbitrary bytes to LoadJob. The seed corpus in testdata/fuzz/FuzzLoadJob
// (the full example, the minimal job, bad jobs, an alias bomb) is replayed by every go test.
// Whatever the input: no panic; a nil error means a usable job; an error is a non-empty,
// bounded Problems naming the file; and the result does not depend on the run.
func FuzzLoadJob(f *testing.F) {
	f.Add([]byte(minimal))
	f.Fuzz(func(t *testing.T, data []byte) {
		job, err := LoadJob("f.yaml", data)
		checkFuzzResult(t, err)
		if err == nil {
			checkGoodJob(t, job)
		}
		_, again := LoadJob("f.yaml", data)
		if errString(err) != errString(again) {
			t.Fatalf("two runs differ:\n%v\n---\n%v", err, again)
		}
	})
}

// FuzzLoadSpliceFile does the same for the fixed-splice file.
func FuzzLoadSpliceFile(f *testing.F) {
	f.Add([]byte(minimalSplice))
	f.Fuzz(func(t *testing.T, data []byte) {
		sf, err := LoadSpliceFile("f.yaml", data)
		checkFuzzResult(t, err)
		if err == nil && (sf == nil || !(sf.Flange.Outer.Thickness > 0) || sf.Web.Rows < 1) {
			t.Fatalf("accepted a splice file with impossible values: %+v", sf)
		}
	})
}

func checkFuzzResult(t *testing.T, err error) {
	t.Helper()
	if err == nil {
		return
	}
	var ps Problems
	if !errors.As(err, &ps) || len(ps) == 0 {
		t.Fatalf("error is not a non-empty Problems: %T %v", err, err)
	}
	if len(ps) > maxProblems+1 {
		t.Fatalf("%d problems, more than the bound", len(ps))
	}
	for _, p := range ps {
		if p.File != "f.yaml" || p.Message == "" || p.Line < 0 || p.Column < 0 {
			t.Fatalf("malformed problem %#v", p)
		}
	}
}

// checkGoodJob asserts what LoadJob promises about a job it accepts.
func checkGoodJob(t *testing.T, j *Job) {
	t.Helper()
	if j == nil {
		t.Fatal("nil job without an error")
	}
	l := j.Beam.Length()
	if !(l > 0) || l > MaxBeamLength {
		t.Fatalf("accepted a beam of length %v mm", l)
	}
	if len(j.Beam.Supports) != len(j.Beam.Spans)+1 {
		t.Fatalf("accepted %d supports for %d spans", len(j.Beam.Supports), len(j.Beam.Spans))
	}
	for _, e := range j.Cases {
		for _, ld := range e.Value.Loads {
			if ld.Distributed() {
				from, to := ld.Range(l)
				if !(0 <= from && from < to && to <= l) {
					t.Fatalf("accepted a load from %v to %v on a beam of %v", from, to, l)
				}
			} else if ld.At < 0 || ld.At.MM() > l {
				t.Fatalf("accepted a load at %v on a beam of %v", ld.At.MM(), l)
			}
			if math.Abs(ld.W[0].NPerMM()) > MaxLineLoad || math.Abs(ld.W[1].NPerMM()) > MaxLineLoad ||
				math.Abs(ld.P.N()) > MaxPointLoad || math.Abs(ld.M.NMM()) > MaxPointMoment {
				t.Fatalf("accepted an implausible load %+v", ld)
			}
		}
	}
}

func errString(err error) string {
	if err == nil {
		return ""
	}
	return strings.TrimSpace(err.Error())
}
