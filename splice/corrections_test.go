package splice

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Hand-worked cases for four checks that an independent calculation from the standard found
// wrong: the shear planes of double-shear flange bolts with unequal plies, compression with
// oversize holes, the web plates in tension in a category C joint, and block tearing of inner
// plates whose bolt line is on their centre line. Each case starts from the worked splice of
// checks_test.go (IPE 500, S355, M20 10.9, category B) and changes one thing.

// unequalPlies: a thick outer plate (20 × 200) and thin inner plates (2 × 10 × 65), so the
// outer plate carries Ao/ΣA = 4000/5300 = 75.5 % of the flange force and the inner plates
// 24.5 %.
func unequalPlies() Geometry {
	g := workedGeometry()
	g.Flange.Outer = Plate{Thickness: 20, Width: 200}
	g.Flange.Inner = Plate{Thickness: 10, Width: 65}
	return g
}

// TestFlangeBoltPlanesCarryTheirPlatesShare: EN 1993-1-8 Table 3.4 gives Fv,Rd per shear plane.
// With an outer plate and inner plates, the plane between the outer plate and the beam flange
// transfers the outer plate's force and the plane on the inner side the inner plates' force;
// with shares by area (as the plate checks), the outer plane carries 4000/5300 of Ff,Ed. The
// bolt resistance in flange-force terms is Fv,Rd/s, not 2·Fv,Rd. Likewise each friction surface
// (3.9.1) transfers its own share: Fs,Rd per surface / s.
func TestFlangeBoltPlanesCarryTheirPlatesShare(t *testing.T) {
	r, err := Verify(workedProblem(t), unequalPlies())
	require.NoError(t, err)
	s := 4000.0 / 5300 // share of the outer plate, the larger one

	// Fv,Rd = αv·fub·As/γM2 = 0.5 × 1000 × 245 / 1.25 = 98.0 kN per plane (10.9, thread in the
	// plane); Lj = 2 × 80 = 160 mm < 15d = 300 mm so βLf = 1; no packing, βp = 1.
	fv := 0.5 * 1000 * 245 / 1.25
	shear := byID(t, r, IDFlangeBoltShear)
	assert.InEpsilon(t, fv/s/1e3, shear.Resistance, 1e-9, "98.0/0.755 = 129.9 kN, not 2 × 98.0 = 196.0 kN")
	// Demand per bolt is Ff,Ed/n; the outer plane then carries s·Ff,Ed/n ≤ Fv,Rd, so
	// utilisation = s·(Ff,Ed/n)/Fv,Rd.
	assert.InEpsilon(t, s*shear.Demand/(fv/1e3), shear.Utilisation, 1e-9)
	assert.Contains(t, shear.Formula, "s_i = the share of Ff,Ed through plane i")

	// Slip (category B, SLS): Fs,Rd = ks·μ·Fp,C/γM3,ser = 1 × 0.5 × 0.7 × 1000 × 245 / 1.1 =
	// 77.95 kN per surface; the outer surface governs.
	fs := 0.5 * 0.7 * 1000 * 245 / 1.1
	slip := byID(t, r, IDFlangeSlip)
	assert.InEpsilon(t, fs/s/1e3, slip.Resistance, 1e-9)
	assert.Contains(t, slip.Formula, "γM3,ser")

	// Equal plies give the familiar 2·Fv,Rd: outer 15 × 200 = 3000 and inner 2 × 15 × 100 = 3000.
	g := workedGeometry()
	g.Flange.Inner = Plate{Thickness: 15, Width: 100}
	g.Flange.Gauge = 130
	r, err = Verify(workedProblem(t), g)
	require.NoError(t, err)
	assert.InEpsilon(t, 2*fv/1e3, byID(t, r, IDFlangeBoltShear).Resistance, 1e-9)
	assert.InEpsilon(t, 2*fs/1e3, byID(t, r, IDFlangeSlip).Resistance, 1e-9)
}

// TestFlangeBoltPlanesSizing: the sizing search uses the same rule, so a splice it returns
// passes Verify and agrees with the exhaustive search (a regression on the search's bounds).
func TestFlangeBoltPlanesSizing(t *testing.T) {
	p := workedProblem(t)
	p.ULS.MMax, p.ULS.MMin = knm(650), knm(-450)
	p.Sizing = Sizing{Category: CategoryB, FrictionClass: "A", Gap: 10, Space: smallSpace()}
	fast, err := Size(p)
	require.NoError(t, err)
	slow, err := SizeExhaustive(p)
	require.NoError(t, err)
	assert.Equal(t, slow.Geometry, fast.Geometry)
	assert.Equal(t, slow.Cost.Total, fast.Cost.Total)
	if fast.Status == Sized {
		v, err := Verify(p, fast.Geometry)
		require.NoError(t, err)
		assert.True(t, v.Pass, "%s at %.3f", v.Governing.ID, v.Utilisation)
	}
}

// TestCompressionWithOversizeHoles: EN 1993-1-1 6.2.4(3) — holes may be ignored in compression
// only when filled by fasteners and not oversize or slotted. With oversize holes (d0 = 24 mm for
// M20, EN 1090-2) the net areas count: outer (200 − 2 × 24) × 15 = 2280 mm², inner
// 2 × (65 − 24) × 15 = 1230 mm²; resistance in flange-force terms min(2280 × 355 × 4950/3000,
// 1230 × 355 × 4950/1950) = min(1335.5, 1108.4) = 1108.4 kN (inner plates govern).
func TestCompressionWithOversizeHoles(t *testing.T) {
	g := workedGeometry()
	g.Holes = OversizeHoles
	r, err := Verify(workedProblem(t), g)
	require.NoError(t, err)
	c := byID(t, r, IDFlangeCompression)
	want := math.Min(2280*355*4950/3000.0, 1230*355*4950/1950.0) / 1e3
	assert.InEpsilon(t, want, c.Resistance, 1e-9)
	assert.Contains(t, c.Formula, "6.2.4(3)")

	// normal holes filled by bolts are not deducted: ΣA·fy = 4950 × 355 = 1757.3 kN
	r, err = Verify(workedProblem(t), workedGeometry())
	require.NoError(t, err)
	assert.InEpsilon(t, 4950*355/1e3, byID(t, r, IDFlangeCompression).Resistance, 1e-9)
}

// TestWebPlatesCategoryCNetSection: EN 1993-1-1 6.2.3(4) — in a category C joint the tension
// resistance of every part with holes is Nnet,Rd = Anet·fy/γM0, the web plates included. With
// S275 plates (fy 275, fu 430 N/mm², EN 1993-1-1 Table 3.1) it is lower than
// 0.9·Anet·fu/γM2 (275 < 0.9 × 430/1.25 = 309.6 N/mm²).
//
// Web plates 2 × 10 × 400, 4 rows, d0 = 22: A = 8000 mm², Anet = 2 × 10 × (400 − 4 × 22) =
// 6240 mm²; V = 300 kN < 0.5·Vpl,Rd = 0.5 × 8000 × 275/√3 = 635 kN, ρ = 0. Category C:
// Npl,Rd = 6240 × 275 = 1716.0 kN (before: min(2200, 0.9 × 6240 × 430/1.25) = 1931.9 kN).
// The tension-zone holes are deducted: W = 10 × 400²/2 − 2 × 10 × 22 × (50 + 150 + 50 + 150) =
// 800 000 − 176 000 = 624 000 mm³. Nw = 150 × Aw/A (the worked case's N_min).
func TestWebPlatesCategoryCNetSection(t *testing.T) {
	p := workedProblem(t)
	p.PlateSteel = steelS275()
	g := workedGeometry()
	g.Category = CategoryC
	r, err := Verify(p, g)
	require.NoError(t, err)
	c := byID(t, r, IDWebCombined)
	awA := 10.2 * 468 / 11550
	nw := 150e3 * awA
	npl := 6240 * 275.0
	mn := 624000 * 275 * (1 - (nw/npl)*(nw/npl))
	assert.InEpsilon(t, mn/1e6, c.Resistance, 1e-9)
	assert.Contains(t, c.Formula, "6.2.3(4)")

	// with the axial share above Nnet,Rd the check is the axial one, against Anet·fy/γM0
	p.ULS.NMax, p.ULS.NMin = kn(4300), kn(-100) // Nw = 4300 × 0.4133 = 1777 kN > 1716 kN
	p.SLS = nil
	r, err = Verify(p, g)
	require.NoError(t, err)
	c = byID(t, r, IDWebCombined)
	assert.Equal(t, "kN", c.Unit)
	assert.InEpsilon(t, npl/1e3, c.Resistance, 1e-9)
}

// TestWebPlatesOversizeCompression: with oversize holes the web plates' axial resistance is at
// most Anet·fy/γM0 (EN 1993-1-1 6.2.4(3)), and the holes count in W even where 6.2.5(5) would
// let the tension-zone holes be ignored (6.2.5(6): compression-zone holes are ignored only when
// filled and not oversize). IPE 600 (EN 10365), S235 plates (235/360 N/mm², EN 1993-1-1
// Table 3.1), M16 in oversize holes d0 = 20 mm (EN 1090-2), category A; web plates
// 2 × 10 × 500 with 2 rows at 100 mm.
//
//	Tension zone: 0.9 × 10 × (250 − 20) × 360/1.25 = 596.2 kN ≥ 10 × 250 × 235 = 587.5 kN, so
//	6.2.5(5) alone would ignore the holes; oversize holes are deducted all the same:
//	W = 10 × 500²/2 − 2 × 10 × 20 × (50 + 50) = 1 250 000 − 40 000 = 1 210 000 mm³.
//	A = 10 000 mm², Anet = 2 × 10 × (500 − 2 × 20) = 9200 mm²: Npl,Rd = min(2350, 0.9 × 9200 ×
//	360/1.25 = 2384.6, 9200 × 235 = 2162.0) = 2162.0 kN.
func TestWebPlatesOversizeCompression(t *testing.T) {
	p := workedProblem(t)
	p.Member = member(t, "IPE 600", steelS355())
	p.PlateSteel = Steel{Name: "S235", Strength: func(t float64) (float64, float64, error) { return 235, 360, nil }}
	g := workedGeometry()
	g.Bolt = Bolt{Size: "M16", Class: "8.8", ShearPlanes: PlanesInThread}
	g.Category = CategoryA
	g.Holes = OversizeHoles
	g.Web.Rows, g.Web.Pitch, g.Web.Depth = 2, 100, 500
	r, err := Verify(p, g)
	require.NoError(t, err)
	c := byID(t, r, IDWebCombined)
	awA := 12 * (600 - 2*19.0) / 15600 // Aw/A of the IPE 600
	nw := 150e3 * awA
	npl := 9200 * 235.0
	mn := 1210000 * 235 * (1 - (nw/npl)*(nw/npl))
	assert.InEpsilon(t, mn/1e6, c.Resistance, 1e-9)
	assert.Contains(t, c.Substituted, "oversize")
}

// TestInnerPlateBlockContinuous: block tearing (EN 1993-1-8 3.10.2) of inner flange plates.
// With the bolt line at g/2 = 65 mm and the plates' outer edge at b/2 = 100 mm, an inner plate
// 70 mm wide has its line on its centre line (e2 = 35 mm both sides). The plate is loaded
// through that line beside the web and may tear out either edge strip with one shear plane
// (eccentric, Veff,2): per plate 0.5 × 490 × (35 − 11) × 15/1.25 + 355 × 175 × 15/√3 =
// 70.6 + 538.0 = 608.6 kN (Lv = 70 + 2 × 80 − 2.5 × 22 = 175 mm). Before the fix the centred
// line left no admissible pattern and the check reported a utilisation of 999.
func TestInnerPlateBlockContinuous(t *testing.T) {
	lv := 70 + 2*80 - 2.5*22
	perPlate := 0.5*490*(35-11)*15/1.25 + 355*lv*15/math.Sqrt(3)
	var prev float64
	for i, w := 0, 66.0; w <= 74.001; i, w = i+1, w+0.5 {
		g := workedGeometry()
		g.Flange.Inner = Plate{Thickness: 15, Width: w}
		r, err := Verify(workedProblem(t), g)
		require.NoError(t, err)
		c := byID(t, r, IDFlangeBlock)
		require.Less(t, c.Utilisation, 1.0, "width %g mm: %s", w, c.Substituted)
		// the inner plates' own resistance, taken back out of flange-force terms
		ao, ai := 3000.0, 2*15*w
		if w == 70 {
			outer := math.Min(490*(2*(35-11))*15/1.25+355*(2*lv*15)/math.Sqrt(3), 490*(130-22)*15/1.25+355*(2*lv*15)/math.Sqrt(3))
			want := math.Min(outer*(ao+ai)/ao, 2*perPlate*(ao+ai)/ai) / 1e3
			assert.InEpsilon(t, want, c.Resistance, 1e-9, "at the centred width")
		}
		if i > 0 {
			// a 0.5 mm step changes the resistance smoothly: by far less than 5 %
			assert.InEpsilon(t, prev, c.Resistance, 0.05, "width %g mm", w)
		}
		prev = c.Resistance
	}
}

// TestBeamCompressionFlangeWithOversizeHoles: EN 1993-1-1 6.2.4(3) and 6.2.5(6) — oversize
// holes are deducted in compression, so the beam's compression flange at the splice has the
// net resistance Af,net·fy/γM0 as well as the tension flange its 6.2.3 one. Hand-worked
// (independent review): IPE 500, S355, M20 oversize holes d0 = 24 mm (EN 1090-2: 4 mm
// clearance), 2 bolt lines: Af,net = (200 − 2 × 24) × 16 = 2432 mm², Nc,net,Rd = 2432 × 355 =
// 863.4 kN. Forces M = ±420 kNm, N = −600 kN (compression): Iw/Iy = 10.2 × 468³/12/48200e4 =
// 0.18076, Aw/A = 10.2 × 468/11550 = 0.41330, so Fc,Ed = 420e6 × 0.81924/484 + 600e3 ×
// 0.58670/2 = 710.9 + 176.0 = 886.9 kN > 863.4 kN (utilisation 1.027: fails), while Ft,Ed =
// 710.9 − 176.0 = 534.9 kN against min(3200 × 355, 0.9 × 2432 × 490/1.25) = 858.0 kN
// (0.623). With normal holes (filled, not deducted) the check stays the tension one.
func TestBeamCompressionFlangeWithOversizeHoles(t *testing.T) {
	p := workedProblem(t)
	p.ULS = Forces{MMax: knm(420), MMin: knm(-420), V: kn(300), NMax: kn(-600), NMin: kn(-600)}
	g := workedGeometry()
	g.Holes = OversizeHoles
	r, err := Verify(p, g)
	require.NoError(t, err)

	iwIy := 10.2 * 468 * 468 * 468 / 12 / 48200e4
	awA := 10.2 * 468 / 11550
	fm := 420e6 * (1 - iwIy) / 484
	fc := fm + 600e3*(1-awA)/2
	ft := fm - 600e3*(1-awA)/2
	net := byID(t, r, IDFlangeBeamNet)
	assert.InEpsilon(t, fc/1e3, net.Demand, 1e-6, "Fc,Ed = 886.9 kN governs")
	assert.InEpsilon(t, 2432*355/1e3, net.Resistance, 1e-9, "Af,net·fy/γM0 = 863.4 kN")
	assert.InEpsilon(t, 1.027, net.Utilisation, 1e-3)
	assert.False(t, net.Pass)
	assert.Contains(t, net.Formula, "6.2.4(3)")

	// Normal holes: the compression flange is not deducted; the tension check stays.
	r, err = Verify(p, workedGeometry())
	require.NoError(t, err)
	net = byID(t, r, IDFlangeBeamNet)
	assert.InEpsilon(t, ft/1e3, net.Demand, 1e-6)
	assert.InEpsilon(t, math.Min(3200*355, 0.9*(200-2*22)*16*490/1.25)/1e3, net.Resistance, 1e-9)
}
