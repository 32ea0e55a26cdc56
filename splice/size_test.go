package splice

import (
	"math"
	"math/rand"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// randomProblem draws a position: a section, a category, a distribution and forces scaled to
// the section's plastic moment and shear resistance (some beyond what any splice can carry).
func randomProblem(t testing.TB, rng *rand.Rand) Problem {
	sections := []string{"IPE 300", "IPE 400", "IPE 500", "IPE 600", "HE 300 A", "HE 300 B"}
	m := member(t, sections[rng.Intn(len(sections))], steelS355())
	mpl := m.Section.WplY * m.FyFlange
	vpl := m.Section.Avz * m.FyWeb / math.Sqrt(3)
	npl := m.Section.A * m.FyWeb
	level := 0.05 + 1.1*rng.Float64()
	mmax := level * mpl * (rng.Float64()*2 - 0.6)
	mmin := mmax - level*mpl*rng.Float64()
	nmax := npl * 0.08 * (rng.Float64()*2 - 1)
	nmin := nmax - npl*0.08*rng.Float64()
	uls := Forces{MMax: mmax, MMin: mmin, V: level * vpl * rng.Float64(), NMax: nmax, NMin: nmin}
	sls := Forces{MMax: uls.MMax / 1.4, MMin: uls.MMin / 1.4, V: uls.V / 1.4, NMax: uls.NMax / 1.4, NMin: uls.NMin / 1.4}
	cats := []Category{CategoryA, CategoryB, CategoryC}
	dist := []Distribution{Proportional, FlangesOnly}[rng.Intn(2)]
	p := Problem{Member: m, ULS: uls, PlateSteel: steelS355(), Distribution: dist, Brief: true,
		Sizing: Sizing{Category: cats[rng.Intn(3)], FrictionClass: FrictionClass([]string{"A", "B", "C"}[rng.Intn(3)]), Gap: 10, Space: smallSpace()}}
	if rng.Intn(3) > 0 {
		p.SLS = &sls
	}
	if rng.Intn(4) == 0 {
		p.Sizing.Holes = OversizeHoles
	}
	return p
}

// TestSizeEqualsExhaustive: on 240 random positions the pruned search returns exactly the
// exhaustive search's splice, cost and utilisation, feasible or not (seeded).
func TestSizeEqualsExhaustive(t *testing.T) {
	rng := rand.New(rand.NewSource(7))
	n := 240
	if testing.Short() {
		n = 40
	}
	var sized, none int
	for i := 0; i < n; i++ {
		p := randomProblem(t, rng)
		a, err := Size(p)
		require.NoError(t, err, "case %d", i)
		b, err := SizeExhaustive(p)
		require.NoError(t, err, "case %d", i)
		require.Equal(t, b.Status, a.Status, "case %d: %+v", i, p.ULS)
		require.Equal(t, b.Geometry, a.Geometry, "case %d", i)
		require.Equal(t, b.Cost, a.Cost, "case %d", i)
		require.Equal(t, b.Utilisation, a.Utilisation, "case %d", i)
		require.Equal(t, b.Governing.ID, a.Governing.ID, "case %d", i)
		assert.Less(t, a.Evaluated, b.Evaluated, "case %d", i)
		if a.Status == Sized {
			sized++
			require.True(t, a.Pass)
		} else {
			none++
			require.False(t, a.Pass)
			require.Greater(t, a.Utilisation, 1.0)
		}
	}
	// both kinds of answer were exercised
	assert.Greater(t, sized, n/4)
	assert.Greater(t, none, 0)
}

// TestSizeEqualsExhaustiveWhenNothingPasses: with the random forces raised 1.5 to 4 times,
// most positions have no passing splice; the bounded search for the closest attempt returns
// exactly the exhaustive search's splice, cost, utilisation and governing check (seeded).
func TestSizeEqualsExhaustiveWhenNothingPasses(t *testing.T) {
	rng := rand.New(rand.NewSource(23))
	n := 160
	if testing.Short() {
		n = 30
	}
	none := 0
	for i := 0; i < n; i++ {
		p := randomProblem(t, rng)
		k := 1.5 + 2.5*rng.Float64()
		p.ULS = Forces{MMax: k * p.ULS.MMax, MMin: k * p.ULS.MMin, V: k * p.ULS.V, NMax: k * p.ULS.NMax, NMin: k * p.ULS.NMin}
		p.SLS = nil
		a, err := Size(p)
		require.NoError(t, err, "case %d", i)
		b, err := SizeExhaustive(p)
		require.NoError(t, err, "case %d", i)
		require.Equal(t, b.Status, a.Status, "case %d", i)
		require.Equal(t, b.Geometry, a.Geometry, "case %d", i)
		require.Equal(t, b.Cost, a.Cost, "case %d", i)
		require.Equal(t, b.Utilisation, a.Utilisation, "case %d", i)
		require.Equal(t, b.Governing.ID, a.Governing.ID, "case %d", i)
		if a.Status == NoFeasible {
			none++
		}
	}
	assert.Greater(t, none, n/2, "most positions have no passing splice")
}

// TestSizeEqualsExhaustiveDefaultSpace: a few positions over the whole default design space.
func TestSizeEqualsExhaustiveDefaultSpace(t *testing.T) {
	if testing.Short() {
		t.Skip("exhaustive search over the default space takes seconds")
	}
	rng := rand.New(rand.NewSource(11))
	for i := 0; i < 3; i++ {
		p := randomProblem(t, rng)
		p.Sizing.Space = DesignSpace{}
		a, err := Size(p)
		require.NoError(t, err)
		b, err := SizeExhaustive(p)
		require.NoError(t, err)
		require.Equal(t, b.Geometry, a.Geometry, "case %d", i)
		require.Equal(t, b.Cost, a.Cost, "case %d", i)
		require.Equal(t, b.Status, a.Status, "case %d", i)
	}
}

// TestSizedSpliceVerifies: the geometry Size returns, checked as a fixed splice, gives the same
// checks (the splice file round trip).
func TestSizedSpliceVerifies(t *testing.T) {
	p := workedProblem(t)
	p.Sizing = Sizing{Category: CategoryB, FrictionClass: "A", Gap: 10}
	r, err := Size(p)
	require.NoError(t, err)
	require.Equal(t, Sized, r.Status)
	v, err := Verify(p, r.Geometry)
	require.NoError(t, err)
	assert.Equal(t, r.Checks, v.Checks)
	assert.Equal(t, r.Cost, v.Cost)
	assert.True(t, v.Pass)
}

// TestNothingPasses: forces no splice in the space can carry give a NoFeasible result naming
// the governing check and the best utilisation reached.
func TestNothingPasses(t *testing.T) {
	p := workedProblem(t)
	p.ULS = Forces{MMax: knm(2000), MMin: knm(-2000), V: kn(1500)}
	p.SLS = nil
	p.Sizing = Sizing{Category: CategoryA, Gap: 10, Space: smallSpace()}
	r, err := Size(p)
	require.NoError(t, err)
	assert.Equal(t, NoFeasible, r.Status)
	assert.False(t, r.Pass)
	assert.Greater(t, r.Utilisation, 1.0)
	assert.NotEmpty(t, r.Governing.ID)
	assert.Equal(t, r.Utilisation, r.Governing.Utilisation)
	e, err := SizeExhaustive(p)
	require.NoError(t, err)
	assert.Equal(t, e.Geometry, r.Geometry)
	assert.Equal(t, e.Utilisation, r.Utilisation)
}

// TestMoreForceNeverCheaper: widening the envelope (M_max up, M_min down, |V| up, N_max up,
// N_min down) never makes the cheapest splice cheaper, nor turns an infeasible position
// feasible (seeded).
func TestMoreForceNeverCheaper(t *testing.T) {
	rng := rand.New(rand.NewSource(3))
	for i := 0; i < 120; i++ {
		p := randomProblem(t, rng)
		p.Sizing.Space = DesignSpace{}
		a, err := Size(p)
		require.NoError(t, err)
		q := p
		f := 1 + 0.5*rng.Float64()
		grow := func(v float64, up bool) float64 {
			if (up && v >= 0) || (!up && v <= 0) {
				return v * f
			}
			return v / f // towards zero: up for a negative maximum, down for a positive minimum
		}
		switch rng.Intn(5) {
		case 0:
			q.ULS.MMax = grow(p.ULS.MMax, true)
		case 1:
			q.ULS.MMin = grow(p.ULS.MMin, false)
		case 2:
			q.ULS.V = p.ULS.V * f
		case 3:
			q.ULS.NMax = grow(p.ULS.NMax, true)
		default:
			q.ULS.NMin = grow(p.ULS.NMin, false)
		}
		if q.SLS != nil {
			s := *q.SLS
			s.V *= f
			q.SLS = &s
		}
		b, err := Size(q)
		require.NoError(t, err)
		if a.Status == NoFeasible {
			assert.Equal(t, NoFeasible, b.Status, "case %d", i)
			continue
		}
		if b.Status == Sized {
			assert.GreaterOrEqual(t, b.Cost.Total, a.Cost.Total, "case %d: %+v → %+v", i, p.ULS, q.ULS)
		}
	}
}

// TestThickerPlateNeverWeaker: raising a plate thickness (through the usual thicknesses, which
// stay within one strength band of EN 1993-1-1 Table 3.1 or cross it with more area) never
// lowers the resistance of a structural check — except the flange bolts' shear and slip, where
// a thicker plate draws a larger share of the flange force through its own shear plane and
// friction surface (TestFlangeBoltPlanesCarryTheirPlatesShare); the search relies only on
// costs rising with thickness, never on resistances.
func TestThickerPlateNeverWeaker(t *testing.T) {
	p := workedProblem(t)
	ts := []float64{8, 10, 12, 15, 20, 25, 30, 35, 40, 45, 50}
	edits := []struct {
		name string
		set  func(g *Geometry, t float64)
	}{
		{"outer", func(g *Geometry, t float64) { g.Flange.Outer.Thickness = t }},
		{"inner", func(g *Geometry, t float64) { g.Flange.Inner.Thickness = t }},
		{"web", func(g *Geometry, t float64) { g.Web.Thickness = t }},
	}
	for _, ed := range edits {
		t.Run(ed.name, func(t *testing.T) {
			var prev map[string]float64
			for _, th := range ts {
				g := workedGeometry()
				ed.set(&g, th)
				r, err := Verify(p, g)
				require.NoError(t, err)
				cur := map[string]float64{}
				for _, c := range r.Checks {
					if c.State == StateDetailing || (ed.name != "web" && (c.ID == IDFlangeBoltShear || c.ID == IDFlangeSlip)) {
						continue
					}
					cur[c.ID+" "+c.Unit] = c.Resistance
				}
				for id, res := range prev {
					if now, ok := cur[id]; ok {
						assert.GreaterOrEqual(t, now*(1+1e-12), res, "%s at t = %g", id, th)
					}
				}
				prev = cur
			}
		})
	}
}

// TestSizeConcurrent: Size keeps no shared state; parallel calls give the serial answers.
func TestSizeConcurrent(t *testing.T) {
	rng := rand.New(rand.NewSource(5))
	ps := make([]Problem, 16)
	want := make([]Result, len(ps))
	for i := range ps {
		ps[i] = randomProblem(t, rng)
		ps[i].Sizing.Space = DesignSpace{}
		var err error
		want[i], err = Size(ps[i])
		require.NoError(t, err)
	}
	got := make([]Result, len(ps))
	done := make(chan int)
	for i := range ps {
		go func(i int) {
			got[i], _ = Size(ps[i])
			done <- i
		}(i)
	}
	for range ps {
		<-done
	}
	for i := range ps {
		assert.Equal(t, want[i].Geometry, got[i].Geometry)
		assert.Equal(t, want[i].Cost, got[i].Cost)
	}
}

// TestDetailingDefaults: spacings of a sized splice follow the stated rules (full bearing where
// there is room, multiples of 5 mm, within Table 3.3).
func TestDetailingDefaults(t *testing.T) {
	p := workedProblem(t)
	p.Sizing = Sizing{Category: CategoryA, Gap: 10, Space: DesignSpace{Sizes: []string{"M20"}, Classes: []string{"8.8"}}}
	r, err := Size(p)
	require.NoError(t, err)
	g := r.Geometry
	d0 := 22.0
	five := func(v float64) bool { return math.Abs(v/5-math.Round(v/5)) < 1e-9 }
	// e1 = 3 d0 = 66 → 70 unless 4t + 40 is smaller; p1 = 3.75 d0 = 82.5 → 85
	assert.True(t, five(g.Flange.End) && five(g.Flange.Pitch) && five(g.Flange.Gauge) && five(g.Web.End), "%+v", g)
	assert.GreaterOrEqual(t, g.Flange.End, 1.2*d0)
	if g.Flange.Rows > 1 {
		assert.Equal(t, math.Min(85, 5*math.Floor(math.Min(14*math.Min(g.Flange.Outer.Thickness, 16), 200)/5)), g.Flange.Pitch)
	}
	assert.LessOrEqual(t, g.Web.Depth, 500-2*16-2*21-10.0, "web plate between the fillets less 5 mm each side")
	assert.LessOrEqual(t, g.Flange.Outer.Width, 200.0)
	assert.True(t, r.Pass)
}

// TestSizeEqualsExhaustiveOddSpaces: the equality holds for unusual design spaces too — single
// rows, plates either side of the 40 mm strength step (where a thicker plate can be weaker),
// sheltered detailing, zero rates (ties broken by bolts and mass), every shear-plane rule,
// assemblies priced by mass (by length), the HR system for 10.9, grips too long for a bolt.
func TestSizeEqualsExhaustiveOddSpaces(t *testing.T) {
	rng := rand.New(rand.NewSource(13))
	n := 80
	if testing.Short() {
		n = 15
	}
	spaces := []DesignSpace{
		{Sizes: []string{"M16", "M24"}, Classes: []string{"10.9"}, Thicknesses: []float64{10, 40, 41, 50},
			FlangeRows: []int{1, 2, 3, 5, 8}, WebColumns: []int{1, 3}, WebRows: []int{2, 4, 7}},
		{Sizes: []string{"M20"}, Classes: []string{"8.8", "10.9"}, Thicknesses: []float64{6, 8, 12},
			Arrangements: []Arrangement{OuterInner}, FlangeColumns: []int{4}, FlangeRows: []int{1, 2, 4, 6, 9}, WebRows: []int{2, 3, 5, 8}},
		{Sizes: []string{"M12", "M30", "M36"}, Classes: []string{"8.8"}, Thicknesses: []float64{15, 25},
			Arrangements: []Arrangement{OuterOnly}, FlangeRows: []int{3, 4, 10}, WebColumns: []int{2}, WebRows: []int{2, 6}},
	}
	sized, single := 0, 0
	for i := 0; i < n; i++ {
		p := randomProblem(t, rng)
		p.Sizing.Space = spaces[rng.Intn(len(spaces))]
		p.Detailing.Sheltered = rng.Intn(2) == 0
		p.Sizing.ShearPlanes = []ShearPlaneRule{PlanesFromLength, PlanesInThread, PlanesOnShank}[rng.Intn(3)]
		switch rng.Intn(4) {
		case 0:
			p.Rates = Rates{Bolt: map[string]float64{"M12": 0, "M16": 0, "M20": 0, "M24": 0, "M30": 0, "M36": 0}}
		case 1:
			p.Rates = DefaultRates()
			p.Rates.AssemblyPerKg = 4.5
		}
		if p.Sizing.Category.Preloaded() && rng.Intn(3) == 0 {
			p.Sizing.System = SystemHR
		}
		a, err := Size(p)
		b, errE := SizeExhaustive(p)
		if err != nil || errE != nil {
			require.Equal(t, errE != nil, err != nil, "case %d: %v / %v", i, err, errE)
			continue
		}
		require.Equal(t, b.Status, a.Status, "case %d", i)
		require.Equal(t, b.Geometry, a.Geometry, "case %d", i)
		require.Equal(t, b.Cost, a.Cost, "case %d", i)
		require.Equal(t, b.Utilisation, a.Utilisation, "case %d", i)
		if a.Status == Sized {
			sized++
			if a.Geometry.Flange.Rows == 1 {
				single++
			}
		}
	}
	assert.Greater(t, sized, n/5, "feasible cases exercised")
	t.Logf("%d of %d sized, %d with single flange rows", sized, n, single)
}
