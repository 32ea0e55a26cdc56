package plots

import (
	"fmt"
	"math"
	"sort"
	"testing"

	"github.com/stretchr/testify/require"

	"spanbreak/beam"
	"spanbreak/splice"
)

// testBeam is a three-span beam with a right overhang, built directly with package beam so
// that the chart tests depend on nothing but the analysis. Invented data for the tests.
type testBeam struct {
	model beam.Model
	env   beam.Envelopes
}

func newTestBeam(t testing.TB) testBeam {
	t.Helper()
	sec, err := beam.LookupSection("IPE 550")
	require.NoError(t, err)
	m := beam.Model{
		Length: 36200,
		Supports: []beam.Support{
			{X: 0, Kind: beam.Pinned}, {X: 10500, Kind: beam.Roller},
			{X: 23500, Kind: beam.Roller}, {X: 34000, Kind: beam.Roller},
		},
		EI: beam.YoungModulus * sec.Iy,
		EA: beam.YoungModulus * sec.A,
	}
	cases := []beam.Case{
		{Name: "G", Kind: beam.Permanent, Loads: []beam.Load{
			{Kind: beam.Distributed, X1: 0, X2: m.Length, W1: 7.9, W2: 7.9},
			{Kind: beam.PointForce, X1: 17250, P: 35e3},
		}},
		{Name: "Q", Kind: beam.Imposed, Category: "H", Pattern: true, Loads: []beam.Load{
			{Kind: beam.Distributed, X1: 0, X2: m.Length, W1: 8.4, W2: 8.4},
		}},
	}
	an, err := beam.NewAnalysis(m, cases)
	require.NoError(t, err)
	rules, err := beam.NewRules("", "", "", nil)
	require.NoError(t, err)
	combos, err := beam.Combinations(cases, rules)
	require.NoError(t, err)
	st, err := an.Stations(250)
	require.NoError(t, err)
	env, err := an.Envelopes(combos, st)
	require.NoError(t, err)
	return testBeam{model: m, env: env}
}

// keepOut is 1 m each side of every support and a user range, as a job file would set.
func (b testBeam) keepOut() []Range {
	var ko []Range
	for _, s := range b.model.Supports {
		ko = append(ko, Range{From: max(0, s.X-1000), To: min(b.model.Length, s.X+1000)})
	}
	return append(ko, Range{From: 12000, To: 12600})
}

// scan is a synthetic candidate scan over the test beam, every 100 mm: positions in the
// keep-out zones are kept out; elsewhere a made-up splice whose cost and bolt count grow with
// the larger of |M max| and |M min|, and which cannot be made where that exceeds 330 kNm.
// Invented numbers for chart tests; the rank orders feasible positions by cost, then x.
func (b testBeam) scan(t testing.TB) []ScanPoint {
	t.Helper()
	var pts []ScanPoint
	ko := b.keepOut()
	for x := 100.0; x < b.model.Length; x += 100 {
		p := ScanPoint{X: x}
		for _, r := range ko {
			if x >= r.From && x <= r.To {
				p.KeepOut = true
				p.Reason = fmt.Sprintf("keep-out zone %.1f–%.1f m", r.From/1e3, r.To/1e3)
			}
		}
		if !p.KeepOut {
			m := b.momentAt(x)
			switch {
			case m > 330:
				p.Reason = fmt.Sprintf("flange.plate.tension fails, utilisation %.2f", m/330)
				p.Governing = "flange.plate.tension"
			default:
				p.Feasible = true
				p.Bolts = 16 + 4*int(m/80)
				p.Cost = 180 + 3.1*float64(p.Bolts) + 0.4*m
				p.PlateMass = 20 + 0.1*m
				p.Utilisation = 0.35 + 0.6*math.Mod(m, 80)/80
				p.Governing = []string{"flange.bolt.slip", "web.bolt.bearing.beam", "flange.plate.tension"}[int(m/80)%3]
			}
		}
		pts = append(pts, p)
	}
	order := []int{}
	for i, p := range pts {
		if p.Feasible {
			order = append(order, i)
		}
	}
	sort.SliceStable(order, func(a, c int) bool { return pts[order[a]].Cost < pts[order[c]].Cost })
	for r, i := range order {
		pts[i].Rank = r + 1
	}
	return pts
}

// momentAt is max(|M max|, |M min|) at the station nearest x [kNm].
func (b testBeam) momentAt(x float64) float64 {
	best, d := 0, math.Inf(1)
	for i, s := range b.env.Stations {
		if dd := math.Abs(s.X - x); dd < d {
			best, d = i, dd
		}
	}
	return math.Max(math.Abs(b.env.ULS.MMax[best].Value), math.Abs(b.env.ULS.MMin[best].Value)) / 1e6
}

// layouts are invented layouts of the test beam for chart tests, fewest splices first.
func testLayouts() []Layout {
	return []Layout{
		{Splices: []float64{19800}, Cost: LayoutCost{Splices: 410, Transport: 2900, Erection: 330, Total: 3640}, Vehicle: "extendable trailer", Trips: 2},
		{Splices: []float64{8300, 19800}, Cost: LayoutCost{Splices: 760, Transport: 1560, Erection: 495, Total: 2815}, Vehicle: "semi-trailer", Trips: 2},
		{Splices: []float64{8300, 19800, 31000}, Cost: LayoutCost{Splices: 1110, Transport: 780, Erection: 660, Total: 2550}, Vehicle: "semi-trailer", Trips: 1},
		{Splices: []float64{6100, 14000, 21000, 29000}, Cost: LayoutCost{Splices: 1500, Transport: 780, Erection: 825, Total: 3105}, Vehicle: "rigid 10 m", Trips: 2},
	}
}

// testGeometry is an invented splice of an IPE 550 for drawing tests: M20 10.9 preloaded,
// outer and inner flange plates, a two-column web group.
func testGeometry() splice.Geometry {
	return splice.Geometry{
		Bolt:     splice.Bolt{Size: "M20", Class: "10.9", ShearPlanes: splice.PlanesInThread},
		Category: splice.CategoryB, FrictionClass: "A", Holes: splice.NormalHoles, Gap: 10,
		Flange: splice.FlangeSplice{
			Outer: splice.Plate{Thickness: 15, Width: 210}, Inner: splice.Plate{Thickness: 15, Width: 85},
			Columns: 2, Rows: 3, Gauge: 120, Pitch: 70, End: 45, Edge: 45,
		},
		Web: splice.WebSplice{Thickness: 10, Depth: 440, Columns: 2, Rows: 5, Pitch: 80, Spacing: 70, End: 45, Edge: 60},
	}
}
