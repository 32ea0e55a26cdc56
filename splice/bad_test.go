package splice

import (
	"math"
	"math/rand"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestBadSpliceFiles: splices that break a rule give failing detailing checks naming the rule;
// splices that cannot be drawn give errors naming the field.
func TestBadSpliceFiles(t *testing.T) {
	p := workedProblem(t)
	failing := []struct {
		name   string
		edit   func(g *Geometry)
		id     string
		rule   string
		source string
	}{
		{"bolt too close to the plate edge", func(g *Geometry) { g.Flange.Gauge = 160 }, IDSpacing,
			"flange e2 (outer plate)", "EN 1993-1-8 Table 3.3: e2 = 20 < 1.2 d0 = 26.4"},
		{"end distance too small", func(g *Geometry) { g.Web.End = 20 }, IDSpacing,
			"web e1 (end)", "EN 1993-1-8 Table 3.3: e1 = 20 < 26.4"},
		{"pitch too large for a thin plate", func(g *Geometry) { g.Web.Thickness = 6; g.Web.Pitch = 100 }, IDSpacing,
			"web pitch", "EN 1993-1-8 Table 3.3: p ≤ 14t = 84"},
		{"plate wider than the flange", func(g *Geometry) { g.Flange.Outer.Width = 220; g.Flange.Gauge = 150 }, IDFit,
			"flange outer plate width", "plate 220 > flange 200"},
		{"web plate deeper than the fillets allow", func(g *Geometry) { g.Web.Depth = 430; g.Web.Pitch = 110 }, IDFit,
			"web plate depth", "430 > 500 − 32 − 42 − 10 = 416"},
		{"inner plates into the root fillet", func(g *Geometry) { g.Flange.Inner.Width = 80 }, IDFit,
			"inner plate edge from web centre", "inner edge 20 < tw/2 + r + 5 = 31.1"},
		{"category B with class 4.6", func(g *Geometry) { g.Bolt.Class = "4.6" }, IDPreload,
			"", "EN 1993-1-8 3.1.2(1)"},
	}
	for _, row := range failing {
		t.Run(row.name, func(t *testing.T) {
			g := workedGeometry()
			row.edit(&g)
			r, err := Verify(p, g)
			require.NoError(t, err)
			c := byID(t, r, row.id)
			assert.False(t, c.Pass, row.source)
			assert.False(t, r.Pass)
			assert.Equal(t, StateDetailing, c.State)
			if row.rule != "" {
				assert.Contains(t, c.Note, row.rule, row.source)
			}
		})
	}

	errorsCases := []struct {
		name  string
		edit  func(g *Geometry)
		field string
	}{
		{"bolt lines outside the plate", func(g *Geometry) { g.Flange.Gauge = 210 }, "flange.gauge"},
		{"three flange columns", func(g *Geometry) { g.Flange.Columns = 3 }, "flange.columns"},
		{"edge that contradicts width and gauge", func(g *Geometry) { g.Flange.Edge = 50 }, "flange.edge"},
		{"web edge that contradicts depth and pitch", func(g *Geometry) { g.Web.Edge = 40 }, "web.edge"},
		{"web shallower than its rows", func(g *Geometry) { g.Web.Depth = 250 }, "web.depth"},
		{"single web bolt", func(g *Geometry) { g.Web.Columns, g.Web.Rows = 1, 1 }, "web"},
		{"zero plate thickness", func(g *Geometry) { g.Flange.Outer.Thickness = 0 }, "flange.outer.thickness"},
		{"negative gap", func(g *Geometry) { g.Gap = -2 }, "gap"},
		{"unknown bolt", func(g *Geometry) { g.Bolt.Size = "M21" }, "bolt.size"},
		{"unknown class", func(g *Geometry) { g.Bolt.Class = "9.9" }, "bolt.class"},
		{"no friction class for category B", func(g *Geometry) { g.FrictionClass = "" }, "friction_class"},
		{"plate thicker than the steel table", func(g *Geometry) { g.Web.Thickness = 90 }, "web.thickness"},
		{"NaN dimension", func(g *Geometry) { g.Web.Spacing = math.NaN() }, "web.spacing"},
	}
	for _, row := range errorsCases {
		t.Run(row.name, func(t *testing.T) {
			g := workedGeometry()
			row.edit(&g)
			_, err := Verify(p, g)
			require.Error(t, err)
			assert.Contains(t, err.Error(), row.field)
		})
	}
}

// TestSizingRejectsNonPreloadable: a slip-resistant design space with class 4.6 is an error.
func TestSizingRejectsNonPreloadable(t *testing.T) {
	p := workedProblem(t)
	p.Sizing = Sizing{Category: CategoryB, FrictionClass: "A", Gap: 10, Space: DesignSpace{Classes: []string{"4.6", "8.8"}}}
	_, err := Size(p)
	require.Error(t, err)
	assert.Contains(t, err.Error(), "4.6")
	assert.Contains(t, err.Error(), "3.1.2")
}

// TestRandomGeometriesNeverPanic: arbitrary splice files, sensible or not, give an error or a
// result with finite numbers, never a panic (seeded, so a failure repeats).
func TestRandomGeometriesNeverPanic(t *testing.T) {
	rng := rand.New(rand.NewSource(20260101))
	p := workedProblem(t)
	pick := func(vals ...float64) float64 { return vals[rng.Intn(len(vals))] }
	sizes := []string{"M12", "M16", "M20", "M24", "M30", "M36", "M5"}
	classes := []string{"4.6", "8.8", "10.9", "x"}
	cats := []Category{CategoryA, CategoryB, CategoryC, "Z"}
	for i := 0; i < 3000; i++ {
		g := Geometry{
			Bolt:     Bolt{Size: sizes[rng.Intn(len(sizes))], Class: classes[rng.Intn(len(classes))], ShearPlanes: []ShearPlaneRule{PlanesFromLength, PlanesInThread, PlanesOnShank, "x"}[rng.Intn(4)]},
			Category: cats[rng.Intn(len(cats))], FrictionClass: FrictionClass([]string{"A", "B", "D", ""}[rng.Intn(4)]),
			Holes: []HoleType{NormalHoles, OversizeHoles, ""}[rng.Intn(3)], Gap: pick(-5, 0, 10, 30),
			Flange: FlangeSplice{
				Outer:   Plate{Thickness: pick(0, 8, 15, 30, 100), Width: pick(0, 100, 200, 260)},
				Inner:   Plate{Thickness: pick(0, 0, 10, 20), Width: pick(0, 40, 65, 120)},
				Columns: []int{2, 4, 3, 0}[rng.Intn(4)], Rows: rng.Intn(8) - 1,
				Gauge: pick(0, 60, 110, 130, 190), Pitch: pick(0, 30, 80, 300), End: pick(0, 10, 50, 120), Edge: pick(0, 0, 20, 35),
				Packing: pick(0, 0, 5, 15),
			},
			Web: WebSplice{Thickness: pick(0, 6, 10, 25), Depth: pick(0, 200, 400, 600), Columns: rng.Intn(5) - 1, Rows: rng.Intn(9) - 1,
				Pitch: pick(0, 40, 100, 250), Spacing: pick(0, 30, 80, 250), End: pick(0, 15, 60, 150), Edge: pick(0, 0, 50), Packing: pick(0, 4, 12)},
		}
		r, err := Verify(p, g)
		if err != nil {
			assert.NotEmpty(t, err.Error())
			continue
		}
		for _, c := range r.Checks {
			for _, v := range []float64{c.Demand, c.Resistance, c.Utilisation} {
				require.False(t, math.IsNaN(v) || math.IsInf(v, 0), "check %s of %+v: %v", c.ID, g, v)
			}
		}
		require.False(t, math.IsNaN(r.Utilisation) || math.IsNaN(r.Cost.Total))
	}
}

// TestImpossibleGeometryIsNamed: a splice whose bolts are off the beam flange cannot be
// checked at all. Its checks say what is impossible instead of a placeholder utilisation,
// and it fails. The worked splice on IPE 500 (b = 200 mm, EN 10365) with an outer plate of
// 340 mm and a gauge of 240 mm puts the bolt lines 240/2 = 120 mm from the web centre, so the
// edge distance to the beam flange's edge is e2 = 200/2 − 120 = −20 mm (EN 1993-1-8 Table 3.3
// asks e2 ≥ 1.2 d0 > 0), and with it k1 = 0 in the bearing resistance of Table 3.4.
func TestImpossibleGeometryIsNamed(t *testing.T) {
	g := workedGeometry()
	g.Flange.Outer.Width, g.Flange.Gauge, g.Flange.Inner = 340, 240, Plate{}
	r, err := Verify(workedProblem(t), g)
	require.NoError(t, err)
	assert.False(t, r.Pass)
	spacing := byID(t, r, IDSpacing)
	assert.Equal(t, UtilisationCap, spacing.Utilisation)
	assert.False(t, spacing.Pass)
	assert.Equal(t, "flange e2 (beam flange) = -20 mm: the outer bolt lines are off the beam flange", spacing.Impossible)
	bearing := byID(t, r, IDFlangeBearingBeam)
	assert.False(t, bearing.Pass)
	assert.Equal(t, "no resistance is left (flange e2 (beam flange) = -20 mm: the outer bolt lines are off the beam flange)",
		bearing.Impossible)
	assert.NotEmpty(t, r.Governing.Impossible, "the governing check says what is impossible")
	// the checks that can be made say nothing of the kind
	assert.Empty(t, byID(t, r, IDFlangeBoltShear).Impossible)
	ok, err := Verify(workedProblem(t), workedGeometry())
	require.NoError(t, err)
	for _, c := range ok.Checks {
		assert.Empty(t, c.Impossible, c.ID)
	}
}
