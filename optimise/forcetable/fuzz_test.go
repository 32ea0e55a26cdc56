package forcetable

import (
	"bytes"
	"errors"
	"math"
	"testing"

	"spanbreak/beam"
	"spanbreak/optimise/jobfile"
)

// FuzzRead feeds arbitrary bytes to Read for a member of 4 m. The seed corpus in
// testdata/fuzz/FuzzRead (both shapes, jumps, governing names, quoting, BOM and CRLF, bad
// tables) is replayed by every go test. Whatever the input: no panic; an error is a non-empty,
// bounded jobfile.Problems naming the file; an accepted table keeps every promise of Table;
// writing it and reading that back gives the same bytes again; and two runs agree.
func FuzzRead(f *testing.F) {
	f.Add([]byte(handTable))
	f.Add([]byte(atTable))
	f.Add([]byte(goodEnvelope))
	f.Add([]byte(goodCombination))
	const length = 4000
	f.Fuzz(func(t *testing.T, data []byte) {
		opt := Options{Length: length}
		tab, err := Read("f.csv", data, opt)
		_, again := Read("f.csv", data, opt)
		if errString(err) != errString(again) {
			t.Fatalf("two runs differ:\n%v\n---\n%v", err, again)
		}
		if err != nil {
			checkProblems(t, err)
			return
		}
		checkTable(t, tab)
		var first bytes.Buffer
		if err := tab.Write(&first); err != nil {
			t.Fatalf("write: %v", err)
		}
		// a written table may be larger than a read one: lift the size limit for the re-read
		lim := defaultLimits()
		lim.bytes = math.MaxInt
		back, err := read("f.csv", first.Bytes(), opt, lim)
		if err != nil {
			t.Fatalf("a written table does not read back: %v\n%s", err, first.String())
		}
		var second bytes.Buffer
		if err := back.Write(&second); err != nil {
			t.Fatalf("second write: %v", err)
		}
		if !bytes.Equal(first.Bytes(), second.Bytes()) {
			t.Fatalf("write, read, write is not a fixed point:\n%s\n---\n%s", first.String(), second.String())
		}
		if back.SLS != tab.SLS || len(back.Envelopes.Stations) != len(tab.Envelopes.Stations) {
			t.Fatalf("re-read table differs: %+v vs %+v", back.SLS, tab.SLS)
		}
	})
}

func checkProblems(t *testing.T, err error) {
	t.Helper()
	var ps jobfile.Problems
	if !errors.As(err, &ps) || len(ps) == 0 {
		t.Fatalf("error is not a non-empty Problems: %T %v", err, err)
	}
	if len(ps) > maxProblems+1 {
		t.Fatalf("%d problems, more than the bound", len(ps))
	}
	for _, p := range ps {
		if p.File != "f.csv" || p.Message == "" || p.Line < 0 || p.Column < 0 {
			t.Fatalf("malformed problem %#v", p)
		}
	}
}

// checkTable asserts what Read promises about a table it accepts.
func checkTable(t *testing.T, tab *Table) {
	t.Helper()
	env := &tab.Envelopes
	st := env.Stations
	n := len(st)
	if n < 2 || tab.Rows < n || n > MaxRows {
		t.Fatalf("%d stations from %d rows", n, tab.Rows)
	}
	if st[0].X > CoverTolerance || st[n-1].X < tab.Length-CoverTolerance {
		t.Fatalf("stations %g to %g mm do not cover 0 to %g", st[0].X, st[n-1].X, tab.Length)
	}
	for i := 1; i < n; i++ {
		switch {
		case st[i].X < st[i-1].X:
			t.Fatalf("stations not ascending at %d: %v", i, st[i-1:i+1])
		case st[i].X == st[i-1].X && !(st[i-1].Side == beam.Left && st[i].Side == beam.Right):
			t.Fatalf("a jump at %g mm is not left then right", st[i].X)
		case i > 1 && st[i].X == st[i-2].X:
			t.Fatalf("three stations at %g mm", st[i].X)
		}
	}
	for _, e := range []*beam.Envelope{&env.ULS, &env.SLS} {
		for q := qM; q < nQuantities; q++ {
			mx, mn := *series(e, extremeCol{e.State, q, true}), *series(e, extremeCol{e.State, q, false})
			if len(mx) != n || len(mn) != n {
				t.Fatalf("%s %s: %d and %d values for %d stations", e.State, q.symbol(), len(mx), len(mn), n)
			}
			for i := range mx {
				if !finite(mx[i].Value) || !finite(mn[i].Value) || mx[i].Value < mn[i].Value {
					t.Fatalf("%s %s at %d: max %g, min %g", e.State, q.symbol(), i, mx[i].Value, mn[i].Value)
				}
				for _, ex := range []beam.Extreme{mx[i], mn[i]} {
					if int(ex.Combination) >= len(env.Combinations) || ex.Combination < -1 ||
						ex.Combination >= 0 && env.Combinations[ex.Combination].State != e.State {
						t.Fatalf("%s %s at %d: combination %d of %d", e.State, q.symbol(), i, ex.Combination, len(env.Combinations))
					}
				}
			}
		}
	}
	for i := 0; i < n; i++ {
		for _, x := range []float64{st[i].X, (st[i].X + st[min(i+1, n-1)].X) / 2} {
			f, err := tab.At(x)
			if err != nil {
				t.Fatalf("At(%g): %v", x, err)
			}
			for _, v := range []float64{f.ULS.MMax, f.ULS.MMin, f.ULS.V, f.ULS.NMax, f.ULS.NMin, f.SLS.MMax, f.SLS.V} {
				if !finite(v) {
					t.Fatalf("At(%g) = %+v", x, f)
				}
			}
			if f.ULS.MMax < f.ULS.MMin || f.ULS.V < 0 || f.ULS.NMax < f.ULS.NMin {
				t.Fatalf("At(%g) = %+v", x, f)
			}
		}
	}
}

func errString(err error) string {
	if err == nil {
		return ""
	}
	return err.Error()
}
