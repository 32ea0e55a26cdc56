package splice

import (
	"math"
	"math/rand"
	"sync"
	"testing"

	"github.com/stretchr/testify/require"
)

// TestShelfSharesOnlyEqualProblems: the shelf gives one sizer to problems equal in every field
// but the forces, even when their plate steels are separate functions with the same
// strengths, and separate sizers when anything the sizing reads differs: the plate strengths
// at a thickness of the design space (the name alone is not enough), the section, the
// category, Brief. It forgets the least recently asked for first.
func TestShelfSharesOnlyEqualProblems(t *testing.T) {
	rng := rand.New(rand.NewSource(41))
	a := randomProblem(t, rng)
	b := a
	b.ULS = Forces{MMax: 2 * a.ULS.MMax, MMin: 2 * a.ULS.MMin, V: a.ULS.V}
	b.SLS = nil
	b.PlateSteel = steelS355() // a separate closure, the same Table 3.1 values
	sh := NewShelf(3)
	z := sh.Sizer(a)
	require.Same(t, z, sh.Sizer(b), "equal problems, other forces and another copy of the steel")

	s275 := a
	s275.PlateSteel = steelS275()
	s275.PlateSteel.Name = "S355" // the name says S355, the strengths are S275's
	z275 := sh.Sizer(s275)
	require.NotSame(t, z, z275, "other plate strengths under the same name")

	other := a
	other.Brief = !a.Brief
	require.NotSame(t, z, sh.Sizer(other), "Brief differs")

	// the shelf holds a, s275, other; asking for a again makes s275 the least recent, which a
	// fourth problem then pushes out
	require.Same(t, z, sh.Sizer(a))
	fourth := a
	fourth.Sizing.Gap = a.Sizing.Gap + 5
	require.NotSame(t, z, sh.Sizer(fourth), "the gap differs")
	require.NotSame(t, z275, sh.Sizer(s275), "s275 was pushed out and is made anew")
	require.Same(t, z, sh.Sizer(a), "a is still kept")

	var none *Shelf
	require.NotSame(t, none.Sizer(a), none.Sizer(a), "a nil shelf keeps nothing")
}

// TestShelfSizerEqualsSize: beams alike sized through one shelf from several goroutines — the
// sizer made for the first problem serving equal problems built separately — return exactly
// what Size returns for each (seeded).
func TestShelfSizerEqualsSize(t *testing.T) {
	rng := rand.New(rand.NewSource(43))
	sh := NewShelf(4)
	bases := []Problem{randomProblem(t, rng), randomProblem(t, rng)}
	type job struct {
		p    Problem
		want Result
	}
	var jobs []job
	for i := 0; i < 24; i++ {
		p := bases[i%2]
		p.PlateSteel = steelS355() // each job resolves its own steel, as each job file does
		scaleForces(&p, 0.3+3.5*rng.Float64())
		want, err := Size(p)
		require.NoError(t, err)
		jobs = append(jobs, job{p, want})
	}
	got := make([]Result, len(jobs))
	errs := make([]error, len(jobs))
	var wg sync.WaitGroup
	for i := range jobs {
		wg.Add(1)
		go func() {
			defer wg.Done()
			got[i], errs[i] = sh.Sizer(jobs[i].p).Size(jobs[i].p.ULS, jobs[i].p.SLS)
		}()
	}
	wg.Wait()
	for i, j := range jobs {
		require.NoError(t, errs[i])
		require.Equal(t, j.want, got[i], "job %d", i)
	}
}

// TestSizerErrorsAreSizes: a sizer given forces that are not numbers, or made for a problem
// that does not resolve, fails with exactly Size's error.
func TestSizerErrorsAreSizes(t *testing.T) {
	rng := rand.New(rand.NewSource(47))
	p := randomProblem(t, rng)
	z := NewSizer(p)
	bad := Forces{MMax: math.NaN(), V: math.Inf(1)}
	q := p
	q.ULS = bad
	_, want := Size(q)
	require.Error(t, want)
	_, got := z.Size(bad, nil)
	require.EqualError(t, got, want.Error())

	broken := p
	broken.Sizing.Category = "Z"
	_, want = Size(broken)
	require.Error(t, want)
	_, got = NewSizer(broken).Size(p.ULS, p.SLS)
	require.EqualError(t, got, want.Error())
	_, got = NewSizer(broken).Catalogue()
	require.Error(t, got)
}
