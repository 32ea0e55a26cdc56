package jobfile

import (
	"fmt"
	"math"
	"strconv"
)

// Plausible ranges of the beam's geometry and loads, in the internal units (mm, N, N·mm,
// N/mm). LoadJob refuses a value outside them at its own key. They are far wider than any
// beam spanbreak is meant for, so they never stand in a real design's way; what they catch is
// a slip of unit or of typing (7800 written for 7.8 m, N/m read as kN/m) and numbers that
// are no beam at all (a span of 1e306 m). Within them every product of the analysis (w·L⁴/EI,
// P·L³/EI, factored sums over every load of a 4 MiB file) stays more than 250 orders of
// magnitude inside the range of float64, so a file that passes cannot overflow the analysis.
// The limits are common practice, chosen here, unless a source is named.
// Deflection limits are span/deflection ratios (limits.deflection): from L/10 (a beam that
// sags a tenth of its span is no beam in service) to L/10000 (beyond any limit in use).
const (
	MinDeflectionRatio = 10.0
	MaxDeflectionRatio = 10000.0
)

const (
	// MinSpan is the shortest span, 0.1 m: shorter than the depth of almost every catalogue
	// section, where a span is a bearing detail, not a beam in bending (the analysis is the
	// bending theory of slender members, span many times the depth).
	MinSpan = 100.0
	// MaxSpan is the longest span, 200 m: beyond the longest spans of I-section girders, in
	// buildings or bridges.
	MaxSpan = 200e3
	// MaxOverhang is the longest cantilever beyond an end support, 100 m: half the longest span.
	MaxOverhang = 100e3
	// MaxBeamLength is the longest beam, spans and overhangs together, 1 km: a continuous
	// member that long has no movement joint, which steel frames place far more often. It also
	// keeps the scan at its default step (50 mm) at 20 000 positions, a tenth of the most
	// optimise accepts.
	MaxBeamLength = 1000e3
	// MaxLineLoad bounds the magnitude of a line load (udl, either trapezoid value),
	// 10 000 kN/m = 10 000 N/mm: some ten times the line load of a wall of a tall building on
	// a transfer beam.
	MaxLineLoad = 10e3
	// MaxPointLoad bounds the magnitude of a point or axial load, 100 000 kN = 1e8 N: beyond
	// the column load of the tallest buildings.
	MaxPointLoad = 100e6
	// MaxPointMoment bounds the magnitude of a point moment, 100 000 kNm = 1e11 N·mm.
	MaxPointMoment = 100e9
	// MaxSpringStiffness is the stiffest spring support, 1e9 kN/m = 1e9 N/mm: it settles
	// 0.001 mm under 1000 kN, a rigid support, which is written pinned or roller.
	MaxSpringStiffness = 1e9
	// MinWeldedPlate is the thinnest web or flange of a welded section, 4 mm: the welding
	// rules of EN 1993-1-8 4.1(1) apply to material 4 mm thick and over (from memory); thinner
	// material is cold-formed work (EN 1993-1-3).
	MinWeldedPlate = 4.0
	// MaxWeldedDepth is the deepest welded section, 5000 mm, and MaxWeldedWidth the widest
	// flange, 2000 mm: beyond the plate girders of buildings and bridges.
	MaxWeldedDepth = 5000.0
	MaxWeldedWidth = 2000.0
	// MinWeldThroat is the thinnest throat of a web-to-flange fillet weld, 3 mm: EN 1993-1-8
	// 4.5.2(2) asks a fillet weld's effective throat to be at least 3 mm (from memory).
	MinWeldThroat = 3.0
	// MaxGauge bounds a preferred flange gauge and the flange width it is for, 2000 mm: the
	// widest flange of a welded section (MaxWeldedWidth).
	MaxGauge = MaxWeldedWidth
	// MaxPlateToFlange bounds splice.detailing.min_plate_to_flange, 2: a cover plate twice as
	// thick as the flange it covers is beyond any office's rule (0.5 to 1 are usual).
	MaxPlateToFlange = 2.0

	// MinPlate is the thinnest cover plate, 4 mm, and MaxPlate the thickest, 100 mm. Below
	// 4 mm material is sheet, whose bolted joints EN 1993-1-3 governs (from memory); above
	// 100 mm no strength table of the program gives fy and fu (the EN 10025 thickness steps end
	// at 100 mm; EN 1993-1-1 Table 3.1 at 80 mm, which the plate grade's table then enforces).
	MinPlate = 4.0
	MaxPlate = 100.0
	// MaxGap is the widest gap between the beam ends at a splice, 50 mm: five times the
	// usual 10 mm (common practice: 6 to 20 mm, enough for the fit-up tolerance of the ends).
	// A wider gap is no longer a splice gap: it lengthens every cover plate and the web bolt
	// group's eccentricity, and is usually a slip of unit (5 m for 5 mm).
	MaxGap = 50.0
	// MaxListLength is the most entries a list of the splice's design space may hold (bolt
	// sizes, classes, plate thicknesses, flange arrangements): 100, as the sizing allows. The
	// lists of real jobs have a handful.
	MaxListLength = 100
	// MaxTitleLength is the longest title, 200 characters: two lines of a report's heading.
	// A longer text is not a title, and a huge one would swell every report.
	MaxTitleLength = 200
	// MaxNameLength is the longest name of a case, a vehicle or a combination, 100 characters.
	MaxNameLength = 100
	// MinStep is the finest scan step, 1 mm: positions are reported to the millimetre.
	MinStep = 1.0
	// MaxCandidates is the most positions a scan may have, 200 000 (the beam length over the
	// step): a 1 km beam at 5 mm. It keeps a tiny step from running for hours.
	MaxCandidates = 200_000
	// MaxSplices bounds limits.splices.min and max, 1000: a 1 km beam in 1 m pieces.
	MaxSplices = 1000
	// MaxAlternatives bounds scan.alternatives, 100 near-best layouts: more is no summary.
	MaxAlternatives = 100
	// MaxRate bounds every rate of the cost model and every vehicle's cost per trip, 1e9 in
	// the job's currency: above any price in any currency, and it keeps the sums of a layout,
	// counted exactly in millionths, far inside the range of a 64-bit integer.
	MaxRate = 1e9
	// MaxClassFactor bounds a bolt class factor, 100 (real ones are 1 to 2).
	MaxClassFactor = 100.0
	// MinPayload is the least payload of a vehicle, 100 kg: a van carries several times as
	// much, and a smaller payload makes the trip count of a heavy beam absurd.
	MinPayload = 100.0
)

// What the plausible ranges bound, for the checker's look-up.
const (
	rangeSpan = iota
	rangeOverhang
	rangeLength
	rangeSpring
	rangeWeldedH
	rangeWeldedB
	rangeWeldedTw
	rangeWeldedTf
	rangeUDL
	rangeTrapezoid
	rangePoint
	rangeMoment
	rangeAxial
	rangePlate
	rangeGap
	rangeList
	rangeTitle
	rangeName
	rangeStep
	rangePositions
	rangeSplices
	rangeAlternatives
	rangeRate
	rangeClassFactor
	rangePayload
	rangeWeldThroat
	rangeGauge
	rangeGaugeWidth
)

// PlausibleRange is the range LoadJob (or LoadSpliceFile) accepts for one value.
type PlausibleRange struct {
	Keys       []string // the job-file reference entries that document it, e.g. "beam.spans"
	SpliceKeys []string // the splice-file reference entries that document it, e.g. "gap"
	What       string   // the value bounded, e.g. "a span", "the beam length"
	// Min and Max are the least and largest value in the internal unit (mm, N, N·mm, N/mm,
	// kg, a count); Max is +Inf where there is no upper limit. Loads may act either way: Min
	// is −Max.
	Min, Max float64
	Text     string // the range as the messages and the reference write it: "0.1 m to 200 m"
	// Integer says the value is a count (of characters, entries, positions, splices).
	Integer bool
	id      int
	signed  bool   // a load: the range bounds the magnitude
	hint    string // what the message advises; "" is "check the value and its unit"
	show    func(float64) string
}

// PlausibleRanges lists every plausible range LoadJob enforces.
func PlausibleRanges() []PlausibleRange {
	m := func(v float64) string { return Metres(v).String() }
	mm := func(v float64) string { return Millimetres(v).String() }
	kn := func(v float64) string { return KiloNewtons(v).String() }
	kNm := func(v float64) string { return KiloNewtonMetres(v).String() }
	line := func(v float64) string { return LineLoad(v).String() }
	// ten digits, so that the limit reads 1000000000 kN/m rather than 1e+09
	spring := func(v float64) string { return strconv.FormatFloat(v, 'g', 10, 64) + " kN/m" }
	inf := math.Inf(1)
	count := func(unit string) func(float64) string {
		return func(v float64) string { return strconv.FormatFloat(v, 'f', -1, 64) + " " + unit }
	}
	plain := func(v float64) string { return strconv.FormatFloat(v, 'f', -1, 64) }
	kg := func(v float64) string { return Kilograms(v).String() }
	splicePlates := []string{"flange.outer.thickness", "flange.inner.thickness", "web.thickness"}
	rates := []string{"costs.bolt", "costs.plate_per_kg", "costs.hole", "costs.faying_per_m2", "costs.splice",
		"costs.lift", "costs.assembly_per_kg", "vehicles[].cost"}
	ranges := []PlausibleRange{
		{id: rangeSpan, Keys: []string{"beam.spans"}, What: "a span", Min: MinSpan, Max: MaxSpan, show: m},
		{id: rangeLength, Keys: []string{"beam.spans"}, What: "a beam length (spans and overhangs)", Max: MaxBeamLength, show: m},
		{id: rangeOverhang, Keys: []string{"beam.overhang.left", "beam.overhang.right"}, What: "an overhang", Max: MaxOverhang, show: m},
		{id: rangeSpring, Keys: []string{"beam.supports[].k"}, What: "a spring stiffness", Max: MaxSpringStiffness, show: spring},
		{id: rangeWeldedH, Keys: []string{"beam.section.welded.h"}, What: "a depth h", Max: MaxWeldedDepth, show: mm},
		{id: rangeWeldedB, Keys: []string{"beam.section.welded.b"}, What: "a flange width b", Max: MaxWeldedWidth, show: mm},
		{id: rangeWeldedTw, Keys: []string{"beam.section.welded.tw"}, What: "a web thickness tw", Min: MinWeldedPlate, Max: inf, show: mm},
		{id: rangeWeldedTf, Keys: []string{"beam.section.welded.tf"}, What: "a flange thickness tf", Min: MinWeldedPlate, Max: inf, show: mm},
		{id: rangeUDL, Keys: []string{"cases.NAME.loads[].udl"}, What: "a line load", Max: MaxLineLoad, signed: true, show: line},
		{id: rangeTrapezoid, Keys: []string{"cases.NAME.loads[].trapezoid"}, What: "a line load", Max: MaxLineLoad, signed: true, show: line},
		{id: rangePoint, Keys: []string{"cases.NAME.loads[].point"}, What: "a point load", Max: MaxPointLoad, signed: true, show: kn},
		{id: rangeMoment, Keys: []string{"cases.NAME.loads[].moment"}, What: "a point moment", Max: MaxPointMoment, signed: true, show: kNm},
		{id: rangeAxial, Keys: []string{"cases.NAME.loads[].axial"}, What: "an axial load", Max: MaxPointLoad, signed: true, show: kn},
		{id: rangePlate, Keys: []string{"splice.plates.thicknesses"}, SpliceKeys: splicePlates, What: "a plate thickness",
			Min: MinPlate, Max: MaxPlate, show: mm},
		{id: rangeGap, Keys: []string{"splice.gap"}, SpliceKeys: []string{"gap"}, What: "a gap between the beam ends",
			Max: MaxGap, show: mm},
		{id: rangeList, Keys: []string{"splice.bolts.sizes", "splice.bolts.classes", "splice.plates.thicknesses", "splice.flange_plates"},
			What: "a list", Max: MaxListLength, Integer: true, show: count("entries"), hint: "leave out the entries that cannot win"},
		{id: rangeTitle, Keys: []string{"title"}, What: "a title", Max: MaxTitleLength, Integer: true, show: count("characters"),
			hint: "put the description in a comment"},
		{id: rangeName, Keys: []string{"cases", "vehicles[].name", "combinations.extra[].name"}, What: "a name",
			Max: MaxNameLength, Integer: true, show: count("characters"), hint: "shorten it"},
		{id: rangeStep, Keys: []string{"scan.step"}, What: "a scan step", Min: MinStep, Max: inf, show: mm},
		{id: rangePositions, Keys: []string{"scan.step"}, What: "a scan", Max: MaxCandidates, Integer: true, show: count("positions"),
			hint: "take a coarser step"},
		{id: rangeSplices, Keys: []string{"limits.splices.min", "limits.splices.max"}, What: "a number of splices",
			Max: MaxSplices, Integer: true, show: plain, hint: "a beam's layout needs far fewer"},
		{id: rangeAlternatives, Keys: []string{"scan.alternatives"}, What: "a number of alternatives",
			Max: MaxAlternatives, Integer: true, show: plain, hint: "a few near-best layouts show the choice"},
		{id: rangeRate, Keys: rates, What: "a rate", Max: MaxRate, show: plain},
		{id: rangeClassFactor, Keys: []string{"costs.bolt_class_factor"}, What: "a class factor", Max: MaxClassFactor, show: plain},
		{id: rangePayload, Keys: []string{"vehicles[].payload"}, What: "a payload", Min: MinPayload, Max: inf, show: kg},
		{id: rangeWeldThroat, Keys: []string{"beam.section.welded.weld_throat"}, What: "a weld throat a", Min: MinWeldThroat, Max: inf, show: mm},
		{id: rangeGauge, Keys: []string{"splice.detailing.gauge", "splice.detailing.gauges[].gauge"}, What: "a flange gauge",
			Max: MaxGauge, show: mm},
		{id: rangeGaugeWidth, Keys: []string{"splice.detailing.gauges[].width"}, What: "a flange width", Max: MaxGauge, show: mm},
	}
	for i := range ranges {
		r := &ranges[i]
		switch {
		case r.signed:
			r.Min = -r.Max
			r.Text = "magnitude at most " + r.show(r.Max)
		case math.IsInf(r.Max, 1):
			r.Text = "at least " + r.show(r.Min)
		case r.Min == 0:
			r.Text = "at most " + r.show(r.Max)
		default:
			r.Text = r.show(r.Min) + " to " + r.show(r.Max)
		}
	}
	return ranges
}

// plausibleRange returns one of the ranges; an unknown id is a programmer error.
func plausibleRange(id int) PlausibleRange {
	for _, r := range PlausibleRanges() {
		if r.id == id {
			return r
		}
	}
	panic(fmt.Sprintf("jobfile: no plausible range %d", id))
}

// plausible checks a present value, already checked for its sign where that has its own
// rule, against one of the ranges, and reports it at its own location: "a span of 1e+306 m
// is outside the plausible range (0.1 m to 200 m); check the value and its unit".
func (c *checker) plausible(at Loc, id int, v float64) bool {
	r := plausibleRange(id)
	if v >= r.Min && v <= r.Max {
		return true
	}
	hint := r.hint
	if hint == "" {
		hint = "check the value and its unit"
	}
	c.add(at, "%s of %s is outside the plausible range (%s); %s", r.What, r.show(v), r.Text, hint)
	return false
}
