package splice

import (
	"errors"
	"math"
	"math/rand"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Sources of the dimensions used by hand below (testdata/assembly-*.csv give every value):
// ISO 261 pitch P (M20 2.5, M24 3); ISO 4014 thread length b = 2d + 6 for l ≤ 125 mm (ISO 888,
// as EN 14399-3 Table 2); ISO 4014 M20 lengths 80–200 and ISO 4017 M20 lengths 40–160, 5 mm
// steps to 70 then 10 mm (a public fastener data set); ISO 4032 nut m max M20 18 mm; ISO 7089
// M20 washer h 3 (2.7–3.3); EN 14399-3 HR: b = 2d + 6, lengths in 5 mm steps to 80 (from
// memory), nut m 18 mm (ISO 4032 style, as assembly.go states); EN 14399-4 HV M24: b = 39,
// ls,min = lg,max − 3P, 5 mm steps, js17; EN 14399-6 washers M20/M24 h 4 (3.7–4.3); the
// run-out ls,min = lg,max − 5P of ISO 4014 and HR from memory; length tolerances ISO 4759-1
// (js15 for ISO 4014/4017 grade A, js17 otherwise; IT values of ISO 286-1 from memory); the
// EN 1090-2 8.2.2 rules as assembly.go paraphrases them: l − Δl ≥ Σt,max + m + P and
// Σt,min ≥ lg,max + n·P (n = 1 non-preloaded, 4 HR, 0 HV).

// byGroup returns a result's assembly of a group.
func byGroup(t *testing.T, r Result, group string) GroupAssembly {
	t.Helper()
	for _, a := range r.Assemblies {
		if a.Group == group {
			return a
		}
	}
	require.Failf(t, "missing assembly", "%s", group)
	return GroupAssembly{}
}

// categoryASplice is workedGeometry as a bearing splice in 8.8 with an outer flange plate of
// thickness to alone and the shear planes found from the length.
func categoryASplice(to float64) Geometry {
	g := workedGeometry()
	g.Bolt = Bolt{Size: "M20", Class: "8.8"}
	g.Category, g.FrictionClass = CategoryA, ""
	g.Flange.Outer.Thickness = to
	g.Flange.Inner = Plate{}
	return g
}

// TestBoltLengthsHandWorked: the bolt assemblies of three bolt groups of checked splices,
// against the standard length series, worked by hand (sources above).
func TestBoltLengthsHandWorked(t *testing.T) {
	ipe600 := Problem{Member: member(t, "IPE 600", steelS355()), ULS: workedProblem(t).ULS, PlateSteel: steelS355()}
	hv := workedGeometry()
	hv.Bolt = Bolt{Size: "M24", Class: "10.9"}
	hv.Flange = FlangeSplice{Outer: Plate{Thickness: 20, Width: 220}, Inner: Plate{Thickness: 20, Width: 80},
		Columns: 2, Rows: 3, Gauge: 140, Pitch: 90, End: 80}
	hr := workedGeometry()
	hr.Bolt = Bolt{Size: "M20", Class: "8.8"}

	for _, row := range []struct {
		name, group, source string
		p                   Problem
		g                   Geometry
		system              AssemblySystem
		length, b, shankMin float64
		threaded            []bool
	}{
		{
			// Category A, ISO 4014 wanted: flange 15 (outer plate) + 16 (IPE 500 flange) = 31,
			// one ISO 7089 washer under the nut: Σt = 33.7–34.3. The shortest ISO 4014 M20, 80
			// mm, has lg,max = 80 − 46 = 34 and wants Σt,min ≥ 34 + 2.5 = 36.5 > 33.7: none fits,
			// so ISO 4017 (fully threaded): l − 0.6 (js15, 50–80 mm) ≥ 34.3 + 18 + 2.5 = 54.8;
			// 55 gives 54.4, 60 gives 59.4 → M20×60, ls,min = 0: the plane is in the thread.
			name: "ISO 4017 M20 flange 15+16", group: "flange", source: "ISO 4014/4017 series, ISO 4032, ISO 7089, EN 1090-2 8.2.2",
			p: workedProblem(t), g: categoryASplice(15), system: SystemISO4017, length: 60, b: 60 - 3*2.5, shankMin: 0, threaded: []bool{true},
		},
		{
			// Category B, 8.8 → HR with one EN 14399-6 washer under the nut: web 10 + 10.2 + 10
			// = 30.2, Σt = 33.9–34.5. l − 1.5 (js17, 50–80) ≥ 34.5 + 18 + 2.5 = 55.0: 55 gives
			// 53.5, 60 gives 58.5 → 60; lg,max = 60 − 46 = 14, Σt,min 33.9 ≥ 14 + 4×2.5 = 24.
			// ls,min = 14 − 5×2.5 = 1.5: planes at 10 and 20.2 are in the thread.
			name: "HR M20 web 10+10.2+10", group: "web", source: "EN 14399-3 Table 2 (b), HR length series from memory, EN 14399-6, EN 1090-2 8.2.2",
			p: workedProblem(t), g: hr, system: SystemHR, length: 60, b: 46, shankMin: 1.5, threaded: []bool{true, true},
		},
		{
			// Category B, 10.9 → HV with washers under head and nut: flange 20 + 19 (IPE 600)
			// + 20 = 59, Σt = 66.4–67.6. l − 1.75 (js17, 80–120) ≥ 67.6 + 20 + 3 = 90.6: 90
			// gives 88.25, 95 gives 93.25 → 95; lg,max = 95 − 39 = 56 ≤ 66.4. ls,min = 56 − 9 =
			// 47: planes at 4.3 + 20 = 24.3 and 4.3 + 39 = 43.3 are both on the plain shank.
			name: "HV M24 flange 20+19+20", group: "flange", source: "EN 14399-4 Table 1 (b, ls,min, 5 mm steps, js17), EN 14399-6; nut m from memory",
			p: ipe600, g: hv, system: SystemHV, length: 95, b: 39, shankMin: 47, threaded: []bool{false, false},
		},
	} {
		t.Run(row.name, func(t *testing.T) {
			r, err := Verify(row.p, row.g)
			require.NoError(t, err)
			a := byGroup(t, r, row.group)
			require.NoError(t, a.Err)
			assert.Equal(t, row.system, a.Assembly.Data.System, row.source)
			assert.Equal(t, row.length, a.Assembly.Length, row.source)
			assert.InDelta(t, row.b, a.Assembly.ThreadLength, 1e-9, row.source)
			assert.InDelta(t, row.shankMin, a.Assembly.ShankMin, 1e-9, row.source)
			got := make([]bool, len(a.Planes))
			for i, p := range a.Planes {
				got[i] = p.Threaded
				assert.Equal(t, p.OnThread, p.Threaded, "the length decides")
			}
			assert.Equal(t, row.threaded, got, row.source)
			c := byID(t, r, IDBoltLength)
			assert.True(t, c.Pass, c.Substituted)
		})
	}
}

// TestShankInThePlaneRaisesTheShear: a longer grip lets a partly threaded bolt in, and its plain
// shank reaches the shear plane. M20 8.8 (ISO 898-1; EN 1993-1-8 Table 3.1: fub = 800 N/mm²),
// γM2 = 1.25: in the thread Fv,Rd = 0.6·800·245/1.25 = 94.1 kN (As = 245 mm², ISO 898-1), on
// the shank 0.6·800·(π·20²/4)/1.25 = 120.6 kN (A = 314 mm²), EN 1993-1-8 Table 3.4.
// Outer plate 15: the ISO 4017 M20×60 of TestBoltLengthsHandWorked, thread in the plane.
// Outer plate 20: grip 36, Σt = 38.7–39.3; ISO 4014 M20×80: lg,max + P = 36.5 ≤ 38.7 and
// 80 − 0.6 ≥ 39.3 + 20.5; ls,min = 34 − 12.5 = 21.5 ≥ the plane at z = 20: plain shank.
func TestShankInThePlaneRaisesTheShear(t *testing.T) {
	thread := 0.6 * 800 * 245 / 1.25
	shank := 0.6 * 800 * math.Pi * 20 * 20 / 4 / 1.25
	assert.InDelta(t, 94.08e3, thread, 1)
	assert.InDelta(t, 120.64e3, shank, 5)
	for _, row := range []struct {
		to       float64
		system   AssemblySystem
		length   float64
		fv       float64
		threaded bool
	}{{15, SystemISO4017, 60, thread, true}, {20, SystemISO4014, 80, shank, false}} {
		r, err := Verify(workedProblem(t), categoryASplice(row.to))
		require.NoError(t, err)
		a := byGroup(t, r, "flange")
		assert.Equal(t, row.system, a.Assembly.Data.System, "outer plate %g", row.to)
		assert.Equal(t, row.length, a.Assembly.Length, "outer plate %g", row.to)
		require.Len(t, a.Planes, 1)
		assert.Equal(t, row.threaded, a.Planes[0].Threaded, "outer plate %g", row.to)
		assert.InEpsilon(t, row.fv, a.Planes[0].FvRd, 1e-12)
		// one plane, share 1; 3 rows at 80 mm: Lj = 160 < 15d = 300, βLf = 1; no packing
		c := byID(t, r, IDFlangeBoltShear)
		assert.InEpsilon(t, row.fv/1e3, c.Resistance, 1e-12, "EN 1993-1-8 Table 3.4, outer plate %g", row.to)
	}
}

// TestPlanesPerPlaneInTheFlange: with inner plates the two planes of a flange bolt can differ.
// Worked splice (M20 10.9 HV, outer 15, IPE 500 flange 16, inner 15): M20×75 (the row of
// TestWorkedSpliceEveryCheck), ls,min = 75 − 33 − 3×2.5 = 34.5 (EN 14399-4 Table 1); planes at
// 4.3 + 15 = 19.3 (shank) and 4.3 + 31 = 35.3 (thread). Each plane carries its plate's share
// (Ao/ΣA = 3000/4950, Ai/ΣA = 1950/4950): min(150.8/0.606, 98.0/0.394) = 248.8 kN per bolt,
// the inner plane governing, where the thread assumed everywhere gives 98.0/0.606 = 161.7 kN.
// The web (10 + 10.2 + 10, M20×60, ls,min = 19.5) has a plane at 24.5 in the thread: 2 × 98.0.
func TestPlanesPerPlaneInTheFlange(t *testing.T) {
	fvS := 0.6 * 1000 * math.Pi * 100 / 1.25
	fvT := 0.5 * 1000 * 245 / 1.25
	so, si := 3000.0/4950, 1950.0/4950
	for _, row := range []struct {
		rule      ShearPlaneRule
		flange    float64 // per bolt [N]
		web       float64
		threadedF []bool
	}{
		{PlanesFromLength, math.Min(fvS/so, fvT/si), 2 * fvT, []bool{false, true}},
		{PlanesInThread, fvT / so, 2 * fvT, []bool{true, true}},
		{PlanesOnShank, fvS / so, 2 * fvS, []bool{false, false}},
	} {
		g := workedGeometry()
		g.Bolt.ShearPlanes = row.rule
		r, err := Verify(workedProblem(t), g)
		require.NoError(t, err)
		assert.InEpsilon(t, row.flange/1e3, byID(t, r, IDFlangeBoltShear).Resistance, 1e-12, "rule %s", row.rule)
		assert.InEpsilon(t, row.web/1e3, byID(t, r, IDWebBoltShear).Resistance, 1e-12, "rule %s", row.rule)
		a := byGroup(t, r, "flange")
		assert.Equal(t, 75.0, a.Assembly.Length)
		assert.Equal(t, []bool{false, true}, []bool{a.Planes[0].OnThread, a.Planes[1].OnThread}, "the length is the same")
		assert.Equal(t, row.threadedF, []bool{a.Planes[0].Threaded, a.Planes[1].Threaded}, "rule %s", row.rule)
		assert.Equal(t, row.rule, r.Geometry.Bolt.ShearPlanes)
	}
}

// TestNoStandardLength: a grip longer than the series takes (M12 HV to 95 mm, from memory) fails
// detail.bolt.length, reports the *AssemblyLengthError and takes the thread in every plane.
// Grip 40 + 16 + 40 = 96 > 95: even the longest bolt leaves no protrusion.
func TestNoStandardLength(t *testing.T) {
	g := workedGeometry()
	g.Bolt = Bolt{Size: "M12", Class: "10.9"}
	g.Flange.Outer.Thickness, g.Flange.Inner.Thickness = 40, 40
	r, err := Verify(workedProblem(t), g)
	require.NoError(t, err)
	c := byID(t, r, IDBoltLength)
	assert.False(t, c.Pass)
	assert.False(t, r.Pass)
	// demand Σt,max + m + P = 96 + 2×3.3 + 10 + 1.75; resistance the longest, 95 − 1.75 (js17)
	assert.InDelta(t, 96+6.6+10+1.75, c.Demand, 1e-9)
	assert.InDelta(t, 95-1.75, c.Resistance, 1e-9)
	a := byGroup(t, r, "flange")
	var le *AssemblyLengthError
	require.True(t, errors.As(a.Err, &le))
	assert.True(t, le.TooLong)
	for _, p := range a.Planes {
		assert.True(t, p.Threaded)
		assert.InEpsilon(t, 0.5*1000*84.3/1.25, p.FvRd, 1e-12)
	}
}

// TestBoltMassAndPriceByLength: the splice's bolt mass is its assemblies' (count × Assembly.Mass,
// tested against the closed form in TestAssemblyMass), and a rate per kg of assembly adds
// rate × class factor × mass to each assembly's price.
func TestBoltMassAndPriceByLength(t *testing.T) {
	p := workedProblem(t)
	r, err := Verify(p, workedGeometry())
	require.NoError(t, err)
	f, w := byGroup(t, r, "flange"), byGroup(t, r, "web")
	assert.Equal(t, 24, f.Count, "2 flanges × 2 sides × 3 rows × 2 lines")
	assert.Equal(t, 16, w.Count, "2 sides × 4 rows × 2 columns")
	assert.InEpsilon(t, 24*f.Assembly.Mass, r.Quantities.FlangeBoltMass, 1e-12)
	assert.InEpsilon(t, 16*w.Assembly.Mass, r.Quantities.WebBoltMass, 1e-12)
	assert.InEpsilon(t, 24*f.Assembly.Mass+16*w.Assembly.Mass, r.Quantities.BoltMass, 1e-12)
	assert.Equal(t, f.Mass, f.Assembly.Mass)

	p.Rates = DefaultRates()
	p.Rates.AssemblyPerKg = 4.5
	priced, err := Verify(p, workedGeometry())
	require.NoError(t, err)
	// indicative rates: M20 3.2 per assembly, class 10.9 × 1.3
	want := 24*(3.2+4.5*f.Assembly.Mass)*1.3 + 16*(3.2+4.5*w.Assembly.Mass)*1.3
	assert.InDelta(t, want, priced.Cost.Bolts, 1e-4, "rounded to a millionth per assembly")
	assert.InDelta(t, r.Cost.Total+want-r.Cost.Bolts, priced.Cost.Total, 1e-4)
}

// TestShearPlaneRuleOrdersTheCost: a plane on the shank never resists less than one in the
// thread, so on random positions the cheapest splice with the planes from the length costs no
// more than with the thread assumed, and no less than with the shank assumed (seeded).
func TestShearPlaneRuleOrdersTheCost(t *testing.T) {
	rng := rand.New(rand.NewSource(31))
	n := 40
	if testing.Short() {
		n = 10
	}
	cheaper := 0
	for i := 0; i < n; i++ {
		p := randomProblem(t, rng)
		cost := map[ShearPlaneRule]float64{}
		ok := true
		for _, rule := range []ShearPlaneRule{PlanesInThread, PlanesFromLength, PlanesOnShank} {
			p.Sizing.ShearPlanes = rule
			r, err := Size(p)
			require.NoError(t, err)
			ok = ok && r.Status == Sized
			cost[rule] = r.Cost.Total
		}
		if !ok {
			continue
		}
		assert.LessOrEqual(t, cost[PlanesFromLength], cost[PlanesInThread], "case %d", i)
		assert.LessOrEqual(t, cost[PlanesOnShank], cost[PlanesFromLength], "case %d", i)
		if cost[PlanesFromLength] < cost[PlanesInThread] {
			cheaper++
		}
	}
	t.Logf("%d of %d positions cheaper with the planes from the length", cheaper, n)
}

// TestAssemblyClampRangeGrows: along every series the upper clamp limit hi = l − Δl − m − P
// grows with l (the length search skips the short lengths by bisection on it) and the lower
// one lo = lg,max + n·P does not fall (so the shortest length with room for the protrusion is
// the only candidate).
func TestAssemblyClampRangeGrows(t *testing.T) {
	for _, sys := range AssemblySystems() {
		for _, size := range boltSizeNames() {
			d, err := LookupAssemblyData(sys, size)
			require.NoError(t, err)
			for i := 1; i < len(d.Lengths); i++ {
				lo0, hi0 := d.ClampRange(d.Lengths[i-1])
				lo1, hi1 := d.ClampRange(d.Lengths[i])
				assert.Greater(t, hi1, hi0, "%s %s at %g", sys, size, d.Lengths[i])
				assert.GreaterOrEqual(t, lo1, lo0, "%s %s at %g", sys, size, d.Lengths[i])
			}
		}
	}
}

// TestAssemblyMassGrowsWithTheGrip: the mass of a group's assembly never falls as the grip
// grows, for every size and default system, so that pricing assemblies by mass keeps the
// sizing's cost monotonic in the plate thicknesses (size.go prunes on it).
func TestAssemblyMassGrowsWithTheGrip(t *testing.T) {
	e := &env{f: PartialFactors{}.resolved(), cat: CategoryA}
	for _, cat := range []Category{CategoryA, CategoryB} {
		e.cat = cat
		for _, size := range BoltSizes() {
			for _, class := range []string{"8.8", "10.9"} {
				c, err := LookupBoltClass(class)
				require.NoError(t, err)
				b, err := newBoltData(e, size, c, PlanesFromLength, "")
				require.NoError(t, err)
				prev := 0.0
				for grip := 4.0; grip <= 260; grip += 0.5 {
					s := plyStack{group: "test"}
					s.add("ply", grip)
					g := newGroupFit(&b, &s)
					require.GreaterOrEqual(t, g.mass, prev, "%s %s %s at grip %g", cat, size.Name, class, grip)
					prev = g.mass
				}
			}
		}
	}
}

// TestFirstRowsBoundEveryThickness: what the memo of the first admissible rows relies on now
// that the flange and web bolt shear depend on the plies through the bolt length: below the
// first rows entry of a bolt, arrangement and columns, no flange of any plate thickness passes
// its checks; likewise for the web (seeded).
func TestFirstRowsBoundEveryThickness(t *testing.T) {
	rng := rand.New(rand.NewSource(37))
	cut := 0
	for k := 0; k < 16; k++ {
		p := randomProblem(t, rng)
		p.Sizing.ShearPlanes = []ShearPlaneRule{PlanesFromLength, PlanesOnShank}[k%2]
		s, err := newSearcher(&p)
		require.NoError(t, err)
		for bi := range s.bolts {
			b := &s.bolts[bi]
			s.forEachFlange(b, func(fl *flangeLayout) {
				r0 := s.r0F[s.gridR0F.at(bi, fl.key[0], fl.key[1])]
				if r0 >= 0 && fl.key[4] >= r0 {
					return
				}
				cut++
				var v evaluator
				x := v.flange(s.e, b, fl)
				a := newAcc(false)
				a.flange(x, s.groups.flangeRowFree())
				a.flange(x, s.groups.flangeRows())
				require.False(t, a.pass, "case %d: flange %v of bolt %d passes below the first rows %d", k, fl.key, bi, r0)
			})
			s.forEachWeb(b, func(wl *webLayout) {
				r0 := s.r0W[s.gridR0W.at(bi, wl.key[0])]
				if r0 >= 0 && wl.key[2] >= r0 {
					return
				}
				cut++
				var v evaluator
				x := v.web(s.e, b, wl)
				a := newAcc(false)
				a.web(x, s.groups.webClass())
				a.web(x, s.groups.webPlates())
				require.False(t, a.pass, "case %d: web %v of bolt %d passes below the first rows %d", k, wl.key, bi, r0)
			})
		}
	}
	assert.Greater(t, cut, 100, "the bound cut configurations")
}
