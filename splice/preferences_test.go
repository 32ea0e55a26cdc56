package splice

import (
	"errors"
	"math"
	"math/rand"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/beam"
)

// The detailing preferences (Detailing.Gauge, Detailing.MinPlateToFlange, DesignSpace.MinSize
// and MaxSize, Member.WeldThroat) against EN 1993-1-8 Table 3.3, the published dimensions of
// the sections and hand arithmetic.

// ipe450 is IPE 450 to EN 10365 (published section tables): h 450, b 190, tw 9.4, tf 14.6,
// r 21 mm, A 98.8 cm², Iy 33740 cm⁴, Wpl,y 1702 cm³. The shear area is EN 1993-1-1
// 6.2.6(3)(a) with η = 1.0.
func ipe450(t testing.TB) Member {
	t.Helper()
	s := beam.Section{Name: "IPE 450", Series: "test", Source: "EN 10365", H: 450, B: 190, Tw: 9.4, Tf: 14.6, R: 21,
		A: 98.8e2, Iy: 33740e4, WplY: 1702e3}
	s.Avz = s.A - 2*s.B*s.Tf + (s.Tw+2*s.R)*s.Tf
	m, err := NewMember(s, steelS355())
	require.NoError(t, err)
	return m
}

// welded900 is the welded I-section 900 × 300 × 12 × 25 of the job-file example: a clear web
// of h − 2tf = 900 − 2×25 = 850 mm between the flanges.
func welded900(t testing.TB, throat float64) Member {
	t.Helper()
	s, err := beam.WeldedSection(900, 300, 12, 25)
	require.NoError(t, err)
	m, err := NewMember(s, steelS355())
	require.NoError(t, err)
	m.WeldThroat = throat
	return m
}

// gaugeProblem is a sizing problem on a member with one bolt size and a fixed gauge.
func gaugeProblem(m Member, size string, gauge float64, cols int, arr Arrangement) Problem {
	sp := smallSpace()
	sp.Sizes, sp.FlangeColumns, sp.Arrangements = []string{size}, []int{cols}, []Arrangement{arr}
	return Problem{Member: m, PlateSteel: steelS355(), Detailing: Detailing{Gauge: gauge},
		Sizing: Sizing{Category: CategoryA, Gap: 10, Space: sp}}
}

// A fixed gauge is refused exactly where EN 1993-1-8 Table 3.3 (e2 ≥ 1.2·d0, p2 ≥ 2.4·d0) or
// the washers' clearance to the web's fillets forbid it, and Size then draws no flange with it.
// d0 = 22 mm for M20 in a normal hole (EN 1090-2: d + 2 mm); washer Ø37 mm for M20 (EN 14399-6,
// from memory).
func TestFixedGaugeLimits(t *testing.T) {
	ipe := ipe450(t)
	plain := welded900(t, 0) // no fillet: only Table 3.3 limits the gauge from below
	heb := member(t, "HE 300 B", steelS355())
	rows := []struct {
		name, kind, source string
		m                  Member
		gauge              float64
		cols               int
		arr                Arrangement
		fits               bool
		reason             string // a fragment of the refusal
	}{
		// 2 lines on IPE 450, outer plate 190 mm: e2 = (190 − g)/2 ≥ 1.2×22 = 26.4 mm → g ≤ 137.2 mm
		{"e2 just enough", "closed form", "EN 1993-1-8 Table 3.3 e2 ≥ 1.2 d0", ipe, 137, 2, OuterOnly, true, ""},
		{"e2 too small", "closed form", "EN 1993-1-8 Table 3.3 e2 ≥ 1.2 d0", ipe, 138, 2, OuterOnly, false,
			"e2 = (190 − 138)/2 = 26 mm to the edge of the 190 mm plate is less than 1.2·d0 = 26.4 mm"},
		// washers: g/2 − 37/2 ≥ tw/2 + r = 4.7 + 21 = 25.7 mm → g ≥ 88.4 mm
		{"washers clear of the root radius", "common practice", "washer clear of the fillet; EN 10365 r = 21 mm", ipe, 89, 2, OuterOnly, true, ""},
		{"washers on the root radius", "common practice", "washer clear of the fillet; EN 10365 r = 21 mm", ipe, 88, 2, OuterOnly, false,
			"the washers (Ø37 mm) under the flange reach the web's fillets: g/2 − Ø/2 = 25.5 mm is less than tw/2 + fillet = 25.7 mm"},
		// no fillet (welded, no weld given): washers need g ≥ 12 + 37 = 49 mm; Table 3.3 p2 ≥ 2.4×22 = 52.8 mm governs
		{"p2 just enough", "closed form", "EN 1993-1-8 Table 3.3 p2 ≥ 2.4 d0", plain, 53, 2, OuterOnly, true, ""},
		{"p2 too small", "closed form", "EN 1993-1-8 Table 3.3 p2 ≥ 2.4 d0", plain, 52, 2, OuterOnly, false,
			"the gauge p2 = 52 mm is less than 2.4·d0 = 52.8 mm"},
		// 4 lines on HE 300 B (b = 300 mm): outer lines at e2 = 1.5×22 = 33 → 35 mm (5 mm steps),
		// p2 = (300 − 2×35 − g)/2 ≥ 52.8 mm → g ≤ 124.4 mm
		{"4 lines, outer spacing enough", "closed form", "EN 1993-1-8 Table 3.3 p2 ≥ 2.4 d0", heb, 124, 4, OuterOnly, true, ""},
		{"4 lines, outer spacing too small", "closed form", "EN 1993-1-8 Table 3.3 p2 ≥ 2.4 d0", heb, 126, 4, OuterOnly, false,
			"p2 = (300 − 2×35 − 126)/2 = 52 mm between the inner and outer lines, less than 2.4·d0 = 52.8 mm"},
		// inner plates on IPE 450: width down(95 − 4.7 − 21 − 5) = 60 mm, inner edge 95 − 60 = 35 mm
		// from the web centre; the lines nearest the web need g/2 − 35 ≥ 26.4 → g ≥ 122.8 mm
		{"inner plates, edge by the web enough", "closed form", "EN 1993-1-8 Table 3.3 e2 ≥ 1.2 d0", ipe, 123, 2, OuterInner, true, ""},
		{"inner plates, edge by the web too small", "closed form", "EN 1993-1-8 Table 3.3 e2 ≥ 1.2 d0", ipe, 122, 2, OuterInner, false,
			"the lines nearest the web are e2 = 122/2 − 35 = 26 mm from the inner plates' edge, less than 1.2·d0 = 26.4 mm"},
	}
	for _, r := range rows {
		t.Run(r.name, func(t *testing.T) {
			p := gaugeProblem(r.m, "M20", r.gauge, r.cols, r.arr)
			fits, err := GaugeFits(p)
			require.NoError(t, err)
			require.Len(t, fits, 1)
			assert.Equal(t, r.reason == "", fits[0].Reason == "", "%s (%s, %s): %s", r.name, r.kind, r.source, fits[0].Reason)
			assert.Contains(t, fits[0].Reason, r.reason, r.source)
			c, err := NewCatalogue(p)
			require.NoError(t, err)
			if !r.fits {
				assert.Zero(t, c.Flanges(0), "Size draws no flange with a gauge that cannot be detailed")
				return
			}
			require.NotZero(t, c.Flanges(0))
			for f := range c.Flanges(0) {
				fl, _, _ := c.FlangePart(0, f)
				assert.Equal(t, r.gauge, fl.Gauge)
			}
		})
	}
}

// The sized splice takes the fixed gauge, and its detailing checks say the preference set it.
func TestSizedSpliceUsesThePreferredGauge(t *testing.T) {
	p := workedProblem(t) // IPE 500, b = 200 mm
	p.Detailing.Gauge = 110
	p.Sizing = Sizing{Category: CategoryB, FrictionClass: "A", Gap: 10}
	r, err := Size(p)
	require.NoError(t, err)
	require.Equal(t, Sized, r.Status)
	assert.Equal(t, 110.0, r.Geometry.Flange.Gauge)
	spacing := byID(t, r, IDSpacing)
	assert.Contains(t, spacing.Note, "the gauge is the preferred 110 mm (detailing preference)")
	// Verify does not impose the preference on a splice of its own: the note is absent
	v, err := Verify(p, workedGeometry())
	require.NoError(t, err)
	assert.NotContains(t, byID(t, v, IDSpacing).Note, "preferred")
}

// Welds of a welded section keep the web plates off them (the 840 mm plates in an
// 850 mm clear web): the plates fit between the weld toes, h − 2tf − 2s with the leg
// s = √2·a of an equal-leg fillet (EN 1993-1-8 4.5.2(2): a is the height of the largest
// triangle inscribed in the weld, s/√2 for legs s), less the 5 mm clearance each side
// (common practice, Detailing.Clearance), rounded down to the 5 mm setting-out step.
func TestWeldThroatReducesTheWebPlates(t *testing.T) {
	rows := []struct {
		name   string
		throat float64
		clear  float64 // depth between the flanges or weld toes [mm]
		plate  float64 // sized web plate depth [mm]
		inner  float64 // inner flange plate width [mm]
	}{
		// no weld given: 900 − 2×25 = 850; plates down(850 − 10) = 840; inner plates
		// down(300/2 − 12/2 − 5) = down(139) = 135
		{"welds ignored", 0, 850, 840, 135},
		// leg 8 mm (a = 8/√2 = 5.66 mm): 850 − 2×8 = 834; down(834 − 10) = 820;
		// inner plates down(150 − 6 − 8 − 5) = down(131) = 130
		{"leg 8 mm", 8 / math.Sqrt2, 834, 820, 130},
		// a = 6 mm, leg 6√2 = 8.49 mm: 850 − 16.97 = 833.03; down(823.03) = 820; down(130.51) = 130
		{"throat 6 mm", 6, 850 - 12*math.Sqrt2, 820, 130},
	}
	for _, r := range rows {
		t.Run(r.name, func(t *testing.T) {
			m := welded900(t, r.throat)
			assert.InDelta(t, r.clear, m.webDepthClear(), 1e-9)
			det := DefaultDetailing()
			sr := newSectionRules(&m, &det, 10)
			assert.Equal(t, r.plate, sr.hp)
			assert.Equal(t, r.inner, sr.bi)
			p := Problem{Member: m, PlateSteel: steelS355(), ULS: Forces{MMax: knm(800), MMin: knm(-400), V: kn(500)},
				Sizing: Sizing{Category: CategoryA, Gap: 10, Space: smallSpace()}}
			res, err := Size(p)
			require.NoError(t, err)
			require.Equal(t, Sized, res.Status)
			assert.Equal(t, r.plate, res.Geometry.Web.Depth)
			if res.Geometry.Flange.HasInner() {
				assert.Equal(t, r.inner, res.Geometry.Flange.Inner.Width)
			}
		})
	}
	// the sheet names the welds in the rule
	p := Problem{Member: welded900(t, 6), PlateSteel: steelS355(), ULS: Forces{MMax: knm(800), MMin: knm(-400), V: kn(500)},
		Sizing: Sizing{Category: CategoryA, Gap: 10, Space: smallSpace()}}
	res, err := Size(p)
	require.NoError(t, err)
	r, err := Verify(p, res.Geometry)
	require.NoError(t, err)
	assert.Contains(t, byID(t, r, IDFit).Substituted, "web plate depth = 820 ≤ h − 2tf − 2√2·a − 2×clearance = 823")
}

// A weld throat on a rolled section, a negative one, or one whose welds fill the web is
// refused.
func TestWeldThroatRefused(t *testing.T) {
	rolled := ipe450(t)
	rolled.WeldThroat = 5
	big := welded900(t, 400)
	neg := welded900(t, -1)
	for _, m := range []Member{rolled, big, neg} {
		_, err := Size(Problem{Member: m, PlateSteel: steelS355(), Sizing: Sizing{Category: CategoryA, Gap: 10, Space: smallSpace()}})
		assert.ErrorContains(t, err, "weld throat")
	}
}

// min_plate_to_flange: IPE 450 has tf = 14.6 mm (EN 10365), so 0.5·tf = 7.3 mm admits the
// default list's thinnest plate, 8 mm; 0.6·tf = 8.76 mm makes 10 mm the thinnest outer plate;
// with inner plates the outer and inner plates together must reach the ratio (common practice,
// as "Steel Buildings in Europe, Part 5: Joint Design", bearing column splices, note 9, asks
// of external + internal flange covers: at least tf/2 together):
// 1.2·tf = 17.52 mm admits 8 + 10 but not 8 + 8.
func TestMinPlateToFlange(t *testing.T) {
	rows := []struct {
		name     string
		ratio    float64
		arr      Arrangement
		thinnest float64 // least to (outer only) or to + ti (outer + inner) in the catalogue [mm]
	}{
		{"no rule", 0, OuterOnly, 8},
		{"0.5 tf = 7.3 mm", 0.5, OuterOnly, 8},
		{"0.6 tf = 8.76 mm", 0.6, OuterOnly, 10},
		{"1.2 tf = 17.52 mm, outer + inner", 1.2, OuterInner, 18},
	}
	for _, r := range rows {
		t.Run(r.name, func(t *testing.T) {
			p := Problem{Member: ipe450(t), PlateSteel: steelS355(), Detailing: Detailing{MinPlateToFlange: r.ratio},
				Sizing: Sizing{Category: CategoryA, Gap: 10, Space: DesignSpace{Sizes: []string{"M20"}, Classes: []string{"8.8"},
					Arrangements: []Arrangement{r.arr}, FlangeColumns: []int{2}}}}
			c, err := NewCatalogue(p)
			require.NoError(t, err)
			least := math.Inf(1)
			for f := range c.Flanges(0) {
				fl, _, _ := c.FlangePart(0, f)
				least = min(least, fl.Outer.Thickness+fl.Inner.Thickness)
			}
			assert.Equal(t, r.thinnest, least)
		})
	}
	// The fit check states the rule, so that Verify refuses a splice thinner than it.
	p := workedProblem(t) // IPE 500, tf = 16 mm: 0.8·tf = 12.8 mm
	p.Detailing.MinPlateToFlange = 0.8
	g := workedGeometry()
	g.Flange.Outer.Thickness, g.Flange.Inner = 12, Plate{}
	v, err := Verify(p, g)
	require.NoError(t, err)
	fit := byID(t, v, IDFit)
	assert.False(t, fit.Pass)
	assert.Contains(t, fit.Substituted, "flange plate thickness to (preferred minimum) = 12 ≥ 0.8·tf = 12.8 mm FAILS")
	assert.Contains(t, fit.Note, "flange plate thickness to (preferred minimum)")
}

// The bolt-size bounds filter the list by diameter, both ends included; an empty result or
// crossed bounds are errors.
func TestBoltSizeBounds(t *testing.T) {
	def := DefaultDesignSpace().Sizes
	rows := []struct {
		lo, hi string
		list   []string
		want   []string
		err    string
	}{
		{"M20", "M27", def, []string{"M20", "M22", "M24", "M27"}, ""},
		{"", "M22", def, []string{"M16", "M20", "M22"}, ""},
		{"M24", "", []string{"M30", "M20", "M24"}, []string{"M30", "M24"}, ""},
		{"M36", "", def, []string{}, ""},
		{"M27", "M20", def, nil, "bolts.min_size: M27 is larger than max_size M20"},
		{"M18", "", def, nil, `bolt size "M18" is not known`},
	}
	for _, r := range rows {
		got, err := FilterBoltSizes(r.list, r.lo, r.hi)
		if r.err != "" {
			assert.ErrorContains(t, err, r.err)
			continue
		}
		require.NoError(t, err)
		assert.Equal(t, r.want, got, "%s..%s", r.lo, r.hi)
	}
	// Size tries only the sizes within the bounds, and refuses an empty filter.
	p := workedProblem(t)
	p.Sizing = Sizing{Category: CategoryA, Gap: 10, Space: DesignSpace{MinSize: "M24", MaxSize: "M27"}}
	c, err := NewCatalogue(p)
	require.NoError(t, err)
	var sizes []string
	for b := range c.Bolts() {
		sizes = append(sizes, c.Bolt(b).Size)
	}
	assert.Equal(t, []string{"M24", "M24", "M27", "M27"}, sizes) // 8.8 and 10.9 each
	p.Sizing.Space = DesignSpace{Sizes: []string{"M16", "M20"}, MinSize: "M24"}
	_, err = Size(p)
	assert.ErrorContains(t, err, "bolts: no size of M16, M20 lies at M24 or larger")
}

// randomPreferences adds random detailing preferences to a random problem: a fixed gauge
// (sometimes one that some bolts or line counts cannot take), a minimum plate ratio, bolt
// bounds, and now and then a welded section with welds.
func randomPreferences(t testing.TB, rng *rand.Rand, p *Problem) {
	if rng.Intn(4) == 0 {
		m := welded900(t, []float64{0, 4, 6, 8}[rng.Intn(4)])
		scale := m.Section.WplY / p.Member.Section.WplY
		p.Member = m
		p.ULS.MMax, p.ULS.MMin, p.ULS.V = scale*p.ULS.MMax, scale*p.ULS.MMin, 2*p.ULS.V
		if p.SLS != nil {
			sls := *p.SLS
			sls.MMax, sls.MMin, sls.V = scale*sls.MMax, scale*sls.MMin, 2*sls.V
			p.SLS = &sls
		}
	}
	b := p.Member.Section.B
	if rng.Intn(3) > 0 {
		p.Detailing.Gauge = math.Round(b * (0.35 + 0.4*rng.Float64()))
	}
	p.Detailing.MinPlateToFlange = []float64{0, 0, 0.5, 0.8, 1.2}[rng.Intn(5)]
	switch rng.Intn(3) {
	case 1:
		p.Sizing.Space.MinSize = "M24"
	case 2:
		p.Sizing.Space.MaxSize = "M20"
	}
}

// TestSizeEqualsExhaustiveWithPreferences: with detailing preferences the pruned search still
// returns exactly the exhaustive search's splice (seeded).
func TestSizeEqualsExhaustiveWithPreferences(t *testing.T) {
	rng := rand.New(rand.NewSource(12))
	n := 160
	if testing.Short() {
		n = 30
	}
	var sized, gauged int
	for i := 0; i < n; i++ {
		p := randomProblem(t, rng)
		randomPreferences(t, rng, &p)
		a, errA := Size(p)
		b, errB := SizeExhaustive(p)
		if errA != nil || errB != nil {
			require.True(t, errors.Is(errA, ErrNoDetailing) && errors.Is(errB, ErrNoDetailing), "case %d: %v / %v", i, errA, errB)
			continue
		}
		require.Equal(t, b.Status, a.Status, "case %d", i)
		require.Equal(t, b.Geometry, a.Geometry, "case %d", i)
		require.Equal(t, b.Cost, a.Cost, "case %d", i)
		require.Equal(t, b.Utilisation, a.Utilisation, "case %d", i)
		require.Equal(t, b.Governing.ID, a.Governing.ID, "case %d", i)
		if a.Status == Sized {
			sized++
			if g := p.Detailing.Gauge; g > 0 {
				gauged++
				require.Equal(t, g, a.Geometry.Flange.Gauge, "case %d", i)
			}
			ft := a.Geometry.Flange.Outer.Thickness + a.Geometry.Flange.Inner.Thickness
			require.GreaterOrEqual(t, ft, p.Detailing.MinPlateToFlange*p.Member.Section.Tf*(1-1e-9), "case %d", i)
		}
	}
	assert.Greater(t, sized, n/5)
	assert.Greater(t, gauged, n/10)
}

// Without preferences the design space, the sized splices and their sheets are those of the
// zero Detailing: the hooks change nothing by default.
func TestNoPreferencesChangeNothing(t *testing.T) {
	rng := rand.New(rand.NewSource(5))
	for i := 0; i < 20; i++ {
		p := randomProblem(t, rng)
		p.Brief = false
		q := p
		q.Sizing.Space.MinSize, q.Sizing.Space.MaxSize = "M12", "M36" // bounds that exclude nothing
		a, err := Size(p)
		require.NoError(t, err)
		b, err := Size(q)
		require.NoError(t, err)
		require.Equal(t, a, b, "case %d", i)
		for _, c := range a.Checks {
			assert.False(t, strings.Contains(c.Note, "preferred"), "case %d: %s", i, c.Note)
		}
	}
}
