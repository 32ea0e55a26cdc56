package splice

import (
	"math/rand"
	"sync"
	"testing"

	"github.com/stretchr/testify/require"
)

// TestSizerEqualsSize: one Sizer per problem, used at many sets of forces — most of them with
// nothing passing, where the layouts it keeps are visited — and from several goroutines at
// once, returns exactly what Size returns for the problem with those forces (seeded).
func TestSizerEqualsSize(t *testing.T) {
	rng := rand.New(rand.NewSource(31))
	for k := 0; k < 6; k++ {
		base := randomProblem(t, rng)
		z := NewSizer(base)
		type job struct {
			p    Problem
			want Result
		}
		var jobs []job
		for i := 0; i < 12; i++ {
			p := base
			scaleForces(&p, 0.3+3.5*rng.Float64())
			want, err := Size(p)
			require.NoError(t, err)
			jobs = append(jobs, job{p, want})
		}
		var wg sync.WaitGroup
		got := make([]Result, len(jobs))
		errs := make([]error, len(jobs))
		for i := range jobs {
			wg.Add(1)
			go func() {
				defer wg.Done()
				got[i], errs[i] = z.Size(jobs[i].p.ULS, jobs[i].p.SLS)
			}()
		}
		wg.Wait()
		for i, j := range jobs {
			require.NoError(t, errs[i])
			require.Equal(t, j.want.Status, got[i].Status, "problem %d, forces %d", k, i)
			require.Equal(t, j.want.Geometry, got[i].Geometry, "problem %d, forces %d", k, i)
			require.Equal(t, j.want.Cost, got[i].Cost, "problem %d, forces %d", k, i)
			require.Equal(t, j.want.Utilisation, got[i].Utilisation, "problem %d, forces %d", k, i)
			require.Equal(t, j.want.Governing, got[i].Governing, "problem %d, forces %d", k, i)
		}
	}
}

// scaleForces multiplies p's ULS forces by f and, when p has SLS forces, sets them to the ULS
// ones over 1.4 (N left out), so that one problem is sized at many positions' forces.
func scaleForces(p *Problem, f float64) {
	u := p.ULS
	p.ULS = Forces{MMax: f * u.MMax, MMin: f * u.MMin, V: f * u.V, NMax: f * u.NMax, NMin: f * u.NMin}
	if p.SLS != nil {
		sls := Forces{MMax: p.ULS.MMax / 1.4, MMin: p.ULS.MMin / 1.4, V: p.ULS.V / 1.4}
		p.SLS = &sls
	}
}
