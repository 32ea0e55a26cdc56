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
)

// PlausibleRange is the range LoadJob accepts for one value of the beam or its loads.
type PlausibleRange struct {
	Keys []string // the job-file reference entries that document it, e.g. "beam.spans"
	What string   // the value bounded, e.g. "a span", "the beam length"
	// Min and Max are the least and largest value in the internal unit (mm, N, N·mm, N/mm);
	// Max is +Inf where there is no upper limit. Loads may act either way: Min is −Max.
	Min, Max float64
	Text     string // the range as the messages and the reference write it: "0.1 m to 200 m"
	id       int
	signed   bool // a load: the range bounds the magnitude
	show     func(float64) string
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
	c.add(at, "%s of %s is outside the plausible range (%s); check the value and its unit",
		r.What, r.show(v), r.Text)
	return false
}
