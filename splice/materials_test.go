package splice

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestMaterialsOfTheWorkedSplice: the bill of the worked splice (checks_test.go), by hand.
// Bolts: 2 flanges × 2 sides × 3 rows × 2 lines = 24 flange assemblies M20×75 HV (two washers
// each, EN 1090-2 8.2.4 for 10.9, from memory) and 2 sides × 4 rows × 2 columns = 16 web
// assemblies M20×60 (TestWorkedSpliceEveryCheck works the lengths). Plates, mass t·b·L·ρ with
// ρ = 7850 kg/m³ (EN 1991-1-1 Table A.4): 2 outer plates 15 × 200 × 610 (610 = 10 + 2 × (2 × 70
// + 2 × 80)), 4 inner plates 15 × 65 × 610, 2 web plates 10 × 400 × 410 (410 = 10 + 2 × (2 ×
// 60 + 80)). Holes: 24 × 3 + 16 × 3 = 120 (every ply); faying surfaces, category B:
// 2 × 2 × (200 + 2 × 65) × 600 + 2 × 2 × 400 × 400 mm².
func TestMaterialsOfTheWorkedSplice(t *testing.T) {
	r, err := Verify(workedProblem(t), workedGeometry())
	require.NoError(t, err)
	m := r.Materials("S355")
	const rho = 7850e-9 // kg/mm³
	type line struct {
		item, part, size, grade string
		length, t, b            float64
		qty                     int
		unit                    float64 // 0: checked against the assembly below
	}
	want := []line{
		{"bolt", "flange", "M20", "10.9", 75, 0, 0, 24, 0},
		// the same nuts and washers in both groups; nut class 10 with 10.9 bolts (EN 14399-4),
		// washers through-hardened 300–370 HV (EN 14399-6), both from memory
		{"nut", "flange and web", "M20", "10", 0, 0, 0, 24 + 16, 0},
		{"washer", "flange and web", "M20", "300–370 HV", 0, 0, 0, 2 * (24 + 16), 0},
		{"bolt", "web", "M20", "10.9", 60, 0, 0, 16, 0},
		{"plate", "flange", "", "S355", 610, 15, 200, 2, 15 * 200 * 610 * rho},
		{"plate", "flange", "", "S355", 610, 15, 65, 4, 15 * 65 * 610 * rho},
		{"plate", "web", "", "S355", 410, 10, 400, 2, 10 * 400 * 410 * rho},
	}
	require.Len(t, m.Items, len(want))
	asm := map[string]GroupAssembly{"flange": byGroup(t, r, "flange"), "web": byGroup(t, r, "web")}
	plates := 0.0
	for i, w := range want {
		it := m.Items[i]
		assert.Equal(t, w.item, it.Item, "line %d", i)
		assert.Equal(t, w.part, it.Part, "line %d", i)
		assert.Equal(t, w.size, it.Size, "line %d", i)
		assert.Equal(t, w.grade, it.Grade, "line %d", i)
		assert.Equal(t, w.length, it.Length, "line %d", i)
		assert.Equal(t, w.t, it.Thickness, "line %d", i)
		assert.Equal(t, w.b, it.Width, "line %d", i)
		assert.Equal(t, w.qty, it.Quantity, "line %d", i)
		if w.item == "plate" {
			assert.InEpsilon(t, w.unit, it.UnitMass, 1e-12, "line %d: t·b·L·ρ", i)
			plates += it.TotalMass()
			continue
		}
		a := asm[strings.Fields(w.part)[0]].Assembly
		for _, p := range a.Parts {
			if p.Item == w.item {
				assert.InEpsilon(t, p.Mass, it.UnitMass, 1e-12, "line %d", i)
				assert.Equal(t, p.Standard, it.Standard, "line %d", i)
			}
		}
		names := map[string]string{"bolt": map[string]string{"flange": "M20×75 HV 10.9 (EN 14399-4)", "web": "M20×60 HV 10.9 (EN 14399-4)"}[w.part],
			"nut": "M20 nut EN 14399-4", "washer": "M20 washer EN 14399-6"}
		assert.Equal(t, names[w.item], it.Name, "line %d", i)
	}
	// the plates add up to the splice's plate mass, by hand and as the result states it
	assert.InEpsilon(t, 2*(15*200+2*15*65)*610*rho+2*10*400*410*rho, plates, 1e-12)
	assert.InEpsilon(t, r.Quantities.PlateMass, plates, 1e-12)
	bolts := 0.0
	for _, it := range m.Items {
		if it.Item != "plate" {
			bolts += it.TotalMass()
		}
	}
	assert.InEpsilon(t, r.Quantities.BoltMass, bolts, 1e-12, "bolts, nuts and washers add up to the bolt mass")
	assert.Equal(t, 120, m.Holes)
	assert.InEpsilon(t, (2*2*330*600+2*2*400*400)*1e-6, m.FayingArea, 1e-12)
}

// TestSumMaterials: identical lines of two bills add up; different ones stay apart, in the order
// they first appear.
func TestSumMaterials(t *testing.T) {
	r, err := Verify(workedProblem(t), workedGeometry())
	require.NoError(t, err)
	a := r.Materials("S355")
	g := workedGeometry()
	g.Web.Thickness = 15
	r2, err := Verify(workedProblem(t), g)
	require.NoError(t, err)
	b := r2.Materials("S355")
	// a bill is its own sum
	one := SumMaterials(a)
	assert.Equal(t, a, one)
	s := SumMaterials(a, a)
	require.Len(t, s.Items, len(one.Items))
	for i := range one.Items {
		assert.Equal(t, 2*one.Items[i].Quantity, s.Items[i].Quantity)
	}
	assert.Equal(t, 2*a.Holes, s.Holes)
	assert.InEpsilon(t, 2*a.FayingArea, s.FayingArea, 1e-12)
	// with 15 mm web plates the web bolts are longer (grip 40.2: M20×70) and the plates new lines
	ab := SumMaterials(a, b)
	assert.Equal(t, len(one.Items)+2, len(ab.Items), "a longer web bolt and a thicker web plate")
	assert.Equal(t, a.Items[0].Quantity+b.Items[0].Quantity, ab.Items[0].Quantity, "flange bolts are the same")
	total := func(m Materials, item string) (n int) {
		for _, it := range m.Items {
			if it.Item == item {
				n += it.Quantity
			}
		}
		return n
	}
	for _, item := range []string{"bolt", "nut", "washer", "plate"} {
		assert.Equal(t, total(a, item)+total(b, item), total(ab, item), item)
	}
}
