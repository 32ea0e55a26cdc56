package beam

import (
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/require"
	"pgregory.net/rapid"
)

// randomBeam draws a continuous beam with n spans, optional overhangs and random loads.
// Every Q load lies inside one region except one full-length UDL, so the brute force below
// can build any span pattern without the code under test.
type randomBeam struct {
	model   Model
	regions []Region
	g, w    []Load
	qFull   float64        // Q's full-length UDL [N/mm]
	qLocal  map[int][]Load // Q loads inside region r
	station []float64
}

func drawBeam(rng *rand.Rand, n int) randomBeam {
	var b randomBeam
	left, right := 0.0, 0.0
	if rng.IntN(2) == 0 {
		left = 500 + 2000*rng.Float64()
	}
	if rng.IntN(2) == 0 {
		right = 500 + 2000*rng.Float64()
	}
	x := left
	sup := []Support{{X: x, Kind: Pinned}}
	for i := 0; i < n; i++ {
		x += 3000 + 9000*rng.Float64()
		sup = append(sup, Support{X: x, Kind: Roller})
	}
	if rng.IntN(3) == 0 && left == 0 {
		sup[0].Kind = Fixed
	}
	b.model = Model{Length: x + right, Supports: sup, EI: testEI, EA: testEA}
	b.regions = regionsOf(b.model)
	L := b.model.Length
	b.g = []Load{udl(5+10*rng.Float64(), 0, L), point(20e3*rng.Float64(), L*rng.Float64())}
	b.w = []Load{udl(-2-3*rng.Float64(), 0, L)}
	b.qFull = 5 + 15*rng.Float64()
	b.qLocal = map[int][]Load{}
	for r, reg := range b.regions {
		span := reg.To - reg.From
		a := reg.From + 0.1*span + 0.3*span*rng.Float64()
		e := a + 0.2*span + 0.3*span*rng.Float64()
		b.qLocal[r] = []Load{
			{Kind: Distributed, X1: a, X2: e, W1: 20 * rng.Float64(), W2: 20 * rng.Float64()},
			point(60e3*rng.Float64(), reg.From+span*(0.05+0.9*rng.Float64())),
		}
	}
	for i := 0; i < 40; i++ {
		b.station = append(b.station, L*rng.Float64())
	}
	for _, s := range sup {
		b.station = append(b.station, s.X)
	}
	return b
}

func (b randomBeam) qLoads(mask uint64) []Load {
	var out []Load
	for r, reg := range b.regions {
		if mask&(1<<uint(r)) == 0 {
			continue
		}
		out = append(out, udl(b.qFull, reg.From, reg.To))
		out = append(out, b.qLocal[r]...)
	}
	return out
}

func scaled(loads []Load, f float64) []Load {
	out := make([]Load, len(loads))
	for i, l := range loads {
		l.W1, l.W2, l.P = l.W1*f, l.W2*f, l.P*f
		out[i] = l
	}
	return out
}

// TestPatternEnvelopeEqualsBruteForce compares the superposition envelope with the worst of
// every one of the 2^n span patterns of Q, each with G at γG,sup or γG,inf and W present or
// absent (the definition of an envelope over patterns, EN 1990 6.4.3.2 and A1.2).
func TestPatternEnvelopeEqualsBruteForce(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	combos := []Combination{
		{Name: "ULS Q leading", State: ULS, Factors: []Factor{{"G", 1.35, 1.0}, {"Q", 1.5, 0}, {"W", 1.5 * 0.6, 0}}},
		{Name: "ULS W leading", State: ULS, Factors: []Factor{{"G", 1.35, 1.0}, {"Q", 1.5 * 0.7, 0}, {"W", 1.5, 0}}},
	}
	for trial := 0; trial < 12; trial++ {
		n := 1 + trial%6
		b := drawBeam(rng, n)
		allQ := b.qLoads(math.MaxUint64)
		an, err := NewAnalysis(b.model, []Case{
			{Name: "G", Kind: Permanent, Loads: b.g},
			{Name: "Q", Kind: Imposed, Pattern: true, Loads: allQ},
			{Name: "W", Kind: Wind, Loads: b.w},
		})
		require.NoError(t, err)
		st, err := an.StationsAt(b.station)
		require.NoError(t, err)
		env, err := an.Envelopes(combos, st)
		require.NoError(t, err)

		nr := len(b.regions)
		bestMax := make([]float64, len(st))
		bestMin := make([]float64, len(st))
		bestVMax := make([]float64, len(st))
		for i := range st {
			bestMax[i], bestMin[i], bestVMax[i] = math.Inf(-1), math.Inf(1), math.Inf(-1)
		}
		scale := 0.0
		for _, cb := range combos {
			fq, fw := cb.Factors[1].Adverse, cb.Factors[2].Adverse
			for mask := uint64(0); mask < 1<<uint(nr); mask++ {
				for _, g := range []float64{1.35, 1.0} {
					for _, wOn := range []float64{0, fw} {
						var loads []Load
						loads = append(loads, scaled(b.g, g)...)
						loads = append(loads, scaled(b.qLoads(mask), fq)...)
						loads = append(loads, scaled(b.w, wOn)...)
						one, err := NewAnalysis(b.model, []Case{{Name: "X", Loads: loads}})
						require.NoError(t, err)
						r, err := one.CaseResult("X", st)
						require.NoError(t, err)
						for i := range st {
							bestMax[i] = math.Max(bestMax[i], r.Effects.M[i])
							bestMin[i] = math.Min(bestMin[i], r.Effects.M[i])
							bestVMax[i] = math.Max(bestVMax[i], r.Effects.V[i])
							scale = math.Max(scale, math.Abs(r.Effects.M[i]))
						}
					}
				}
			}
		}
		for i := range st {
			require.InDelta(t, bestMax[i], env.ULS.MMax[i].Value, 1e-9*scale, "trial %d, x = %g, M max", trial, st[i].X)
			require.InDelta(t, bestMin[i], env.ULS.MMin[i].Value, 1e-9*scale, "trial %d, x = %g, M min", trial, st[i].X)
			require.InDelta(t, bestVMax[i], env.ULS.VMax[i].Value, 1e-9*scale/1000, "trial %d, x = %g, V max", trial, st[i].X)
		}
	}
}

// TestGoverningPatternReproducesExtreme rebuilds each extreme from the combination and the
// pattern it reports, so the governing record is checked and not just stored.
func TestGoverningPatternReproducesExtreme(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 5))
	b := drawBeam(rng, 4)
	combos := []Combination{{Name: "ULS", State: ULS, Factors: []Factor{{"G", 1.35, 1.0}, {"Q", 1.5, 0}}}}
	an, err := NewAnalysis(b.model, []Case{
		{Name: "G", Kind: Permanent, Loads: b.g},
		{Name: "Q", Kind: Imposed, Pattern: true, Loads: b.qLoads(math.MaxUint64)},
	})
	require.NoError(t, err)
	st, err := an.StationsAt(b.station)
	require.NoError(t, err)
	env, err := an.Envelopes(combos, st)
	require.NoError(t, err)
	for i, s := range st {
		for _, ex := range []Extreme{env.ULS.MMax[i], env.ULS.MMin[i]} {
			// rebuild with the reported Q pattern and each G factor; one must match
			best := math.NaN()
			for _, gf := range []float64{1.35, 1.0} {
				loads := append(scaled(b.g, gf), scaled(b.qLoads(env.Loaded(ex)[0]), 1.5)...)
				one, err := NewAnalysis(b.model, []Case{{Name: "X", Loads: loads}})
				require.NoError(t, err)
				r, _ := one.CaseResult("X", []Station{s})
				if math.IsNaN(best) || math.Abs(r.Effects.M[0]-ex.Value) < math.Abs(best-ex.Value) {
					best = r.Effects.M[0]
				}
			}
			require.InDelta(t, ex.Value, best, 1e-6*math.Max(1, math.Abs(ex.Value)), "x = %g: pattern %b", s.X, env.Loaded(ex)[0])
		}
	}
}

// TestEquilibriumProperty: support reactions balance the applied loads (force and moment
// about x = 0) to 1e-9 relative, for random beams and loads.
func TestEquilibriumProperty(t *testing.T) {
	rapid.Check(t, func(rt *rapid.T) {
		seed := rapid.Uint64().Draw(rt, "seed")
		n := rapid.IntRange(1, 6).Draw(rt, "spans")
		b := drawBeam(rand.New(rand.NewPCG(seed, 1)), n)
		loads := append(append(append([]Load{}, b.g...), b.w...), b.qLoads(math.MaxUint64)...)
		loads = append(loads, Load{Kind: PointMoment, X1: b.model.Length * 0.37, P: 25e6})
		an, err := NewAnalysis(b.model, []Case{{Name: "X", Loads: loads}})
		if err != nil {
			rt.Fatalf("analysis: %v", err)
		}
		r, err := an.CaseResult("X", nil)
		if err != nil {
			rt.Fatal(err)
		}
		force, moment, mag := 0.0, 0.0, 0.0 // downward total, clockwise moment about x = 0
		for _, l := range loads {
			switch l.Kind {
			case Distributed:
				f := (l.W1 + l.W2) / 2 * (l.X2 - l.X1)
				// centroid of a trapezoid measured from X1
				c := (l.X2 - l.X1) * (l.W1 + 2*l.W2) / (3 * (l.W1 + l.W2))
				if l.W1+l.W2 == 0 {
					continue
				}
				force += f
				moment += f * (l.X1 + c)
				mag += math.Abs(f)
			case PointForce:
				force += l.P
				moment += l.P * l.X1
				mag += math.Abs(l.P)
			case PointMoment:
				moment += l.P
			}
		}
		sumR, sumM := 0.0, 0.0
		for _, rc := range r.Reactions {
			sumR += rc.Fz
			sumM += -rc.Fz*rc.X + rc.My // reactions' clockwise moment about x = 0
		}
		if math.Abs(sumR-force) > 1e-9*mag {
			rt.Fatalf("vertical equilibrium: reactions %g, loads %g", sumR, force)
		}
		if math.Abs(sumM+moment) > 1e-9*mag*b.model.Length {
			rt.Fatalf("moment equilibrium: reactions %g, loads %g", sumM, -moment)
		}
	})
}

// TestShearIsDerivativeOfMoment: a difference quotient of M equals V away from jumps.
// Between load discontinuities M is a cubic at most (loads are linear in x, handbook statics
// dM/dx = V, d²M/dx² = -w), so the five-point stencil (M(x-2h) - 8M(x-h) + 8M(x+h) - M(x+2h))/12h
// is exact there up to rounding; the plain central difference is not (error h²/6·dw/dx on a
// trapezoidal load), which made this test fail on steep trapezoids.
func TestShearIsDerivativeOfMoment(t *testing.T) {
	rapid.Check(t, func(rt *rapid.T) {
		seed := rapid.Uint64().Draw(rt, "seed")
		n := rapid.IntRange(1, 5).Draw(rt, "spans")
		rng := rand.New(rand.NewPCG(seed, 2))
		b := drawBeam(rng, n)
		loads := append(append([]Load{}, b.g...), b.qLoads(math.MaxUint64)...)
		an, err := NewAnalysis(b.model, []Case{{Name: "X", Loads: loads}})
		if err != nil {
			rt.Fatal(err)
		}
		const h = 0.5 // mm
		for _, x := range b.station {
			near := false
			for _, nd := range an.keys {
				if math.Abs(nd-x) < 3*h {
					near = true
				}
			}
			if near {
				continue
			}
			r, _ := an.CaseResult("X", []Station{{X: x - 2*h}, {X: x - h}, {X: x}, {X: x + h}, {X: x + 2*h}})
			m := r.Effects.M
			dm := (m[0] - 8*m[1] + 8*m[3] - m[4]) / (12 * h)
			v := r.Effects.V[2]
			if math.Abs(dm-v) > 1e-6*math.Max(math.Abs(v), 1e3) {
				rt.Fatalf("x = %g: dM/dx %g, V %g", x, dm, v)
			}
		}
	})
}
