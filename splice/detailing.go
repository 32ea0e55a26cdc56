package splice

import (
	"errors"
	"fmt"
	"math"
)

// Detailing holds the rules that turn a bolt size and a number of rows and columns into
// spacings when sizing. A zero field takes its default; every default is stated below.
//
// Target distances are multiples of d0 rounded up to Round; each is then kept within the
// EN 1993-1-8 Table 3.3 limits (minimum rounded up, maximum rounded down). The defaults give
// full bearing where there is room: e1 ≥ 3 d0 and p1 ≥ 3.75 d0 make αd = 1, e2 ≥ 1.5 d0 and
// p2 ≥ 3 d0 make k1 = 2.5.
type Detailing struct {
	EndFactor   float64 // e1 target / d0, plate ends and beam ends (default 3.0)
	PitchFactor float64 // p1 target / d0, along the beam (default 3.75)
	EdgeFactor  float64 // e2 target / d0, plate long edges and web plate top and bottom (default 1.5)
	GaugeFactor float64 // p2 target / d0 between bolt lines across the load (default 3.0)
	Round       float64 // setting-out step [mm] (default 5)
	Clearance   float64 // clearance of plates from the root fillets [mm] (default 5, common practice)
	// Sheltered drops the Table 3.3 maxima e1, e2 ≤ 4t + 40 mm, which apply to steel exposed
	// to the weather or other corrosive influences (the default, conservative).
	Sheltered bool

	// Gauge fixes the flange gauge when sizing [mm]: with 2 bolt lines the distance between
	// them, with 4 the distance between the two lines nearest the web (FlangeSplice.Gauge);
	// the outer lines of 4 then sit at the edge distance. 0 (the default) lets the sizing
	// choose it. Size leaves out the layouts in which the gauge cannot be detailed whatever
	// the plates (GaugeFits says which and why); Verify does not use it (a fixed splice has
	// its own gauge).
	Gauge float64
	// MinPlateToFlange is the least flange cover-plate thickness, as a fraction of the beam's
	// flange thickness tf: the outer plate alone, or with inner plates the outer and inner
	// plates together, to + ti ≥ MinPlateToFlange·tf (common practice: "Steel Buildings in
	// Europe, Part 5: Joint Design", on bolted bearing column splices, asks the combined
	// external and internal cover thickness to reach tf/2; no EN 1993-1-8 clause sets such a
	// rule). Size leaves out thinner plates and the fit check (detail.fit)
	// reports the rule, Verify included. 0 (the default): no such rule.
	MinPlateToFlange float64
}

// DefaultDetailing returns the default rules (see Detailing).
func DefaultDetailing() Detailing {
	return Detailing{EndFactor: 3.0, PitchFactor: 3.75, EdgeFactor: 1.5, GaugeFactor: 3.0, Round: 5, Clearance: 5}
}

func (d Detailing) resolved() Detailing {
	def := DefaultDetailing()
	pick := func(v, dv float64) float64 {
		if v == 0 {
			return dv
		}
		return v
	}
	return Detailing{
		EndFactor:   pick(d.EndFactor, def.EndFactor),
		PitchFactor: pick(d.PitchFactor, def.PitchFactor),
		EdgeFactor:  pick(d.EdgeFactor, def.EdgeFactor),
		GaugeFactor: pick(d.GaugeFactor, def.GaugeFactor),
		Round:       pick(d.Round, def.Round),
		Clearance:   pick(d.Clearance, def.Clearance),
		Sheltered:   d.Sheltered,

		Gauge:            d.Gauge,
		MinPlateToFlange: d.MinPlateToFlange,
	}
}

func (d Detailing) validate() error {
	r := d.resolved()
	var errs []error
	check := func(field string, v, lo, hi float64) {
		if !(v >= lo && v <= hi) {
			errs = append(errs, fmt.Errorf("detailing.%s: %g is not between %g and %g", field, v, lo, hi))
		}
	}
	check("end_factor", r.EndFactor, 1.2, 10)
	check("pitch_factor", r.PitchFactor, 2.2, 10)
	check("edge_factor", r.EdgeFactor, 1.2, 10)
	check("gauge_factor", r.GaugeFactor, 2.4, 10)
	check("round", r.Round, 0.1, 50)
	check("clearance", r.Clearance, 0, 50)
	check("gauge", r.Gauge, 0, maxGauge)
	check("min_plate_to_flange", r.MinPlateToFlange, 0, maxPlateToFlange)
	return errors.Join(errs...)
}

// Bounds of the detailing preferences: a gauge no wider than the widest flange of a welded
// section the job file accepts (2000 mm), a cover plate no more than twice the flange.
const (
	maxGauge         = 2000.0
	maxPlateToFlange = 2.0
)

func (d Detailing) up(x float64) float64   { return math.Ceil(x/d.Round-1e-9) * d.Round }
func (d Detailing) down(x float64) float64 { return math.Floor(x/d.Round+1e-9) * d.Round }

// Table 3.3 maxima for the thinner outer connected part t.
func maxEdge(t float64, sheltered bool) float64 {
	if sheltered {
		return math.Inf(1)
	}
	return 4*t + 40
}

func maxPitch(t float64) float64 { return min(14*t, 200) }

// sectionRules are the sizing dimensions fixed by the section [mm].
type sectionRules struct {
	gap       float64
	bo        float64 // outer flange plate width: the flange width rounded down
	bi        float64 // inner plate width: from the fillet clearance to the outer plate's edge
	innerEdge float64 // inner plates' inner edge from the web centreline
	hp        float64 // web plate depth: between the fillets less the clearances, rounded down
	washerFit float64 // least distance of a washer's edge from the web centreline, tw/2 + r (or √2·a)
	gauge     float64 // the fixed flange gauge (Detailing.Gauge), 0 when the sizing chooses it
	minPlate  float64 // least to (+ ti) from Detailing.MinPlateToFlange × tf, 0 when no rule
}

func newSectionRules(m *Member, det *Detailing, gap float64) sectionRules {
	s := m.Section
	r := sectionRules{gap: gap, gauge: det.Gauge, minPlate: det.MinPlateToFlange * s.Tf}
	r.bo = det.down(s.B)
	r.bi = det.down(r.bo/2 - s.Tw/2 - m.fillet() - det.Clearance)
	r.innerEdge = r.bo/2 - r.bi
	r.hp = det.down(m.webDepthClear() - 2*det.Clearance)
	r.washerFit = s.Tw/2 + m.fillet()
	return r
}

// holeRules are the rounded detailing distances of one bolt size and hole [mm].
type holeRules struct {
	d0                 float64
	washer             float64 // washer outside diameter
	e1T, p1T, e2T      float64 // targets rounded up: EndFactor, PitchFactor, EdgeFactor × d0
	eMin, p1Min, p2Min float64 // Table 3.3 minima rounded up: 1.2 d0, 2.2 d0, 2.4 d0
	g4Outer, g4Inner   float64 // gauge of 4 lines without and with inner plates
}

func newHoleRules(m *Member, det *Detailing, sr *sectionRules, size BoltSize, d0 float64) holeRules {
	s := m.Section
	h := holeRules{d0: d0, washer: size.WasherOD}
	h.e1T = det.up(det.EndFactor * d0)
	h.p1T = det.up(det.PitchFactor * d0)
	h.e2T = det.up(det.EdgeFactor * d0)
	h.eMin = det.up(1.2 * d0)
	h.p1Min = det.up(2.2 * d0)
	h.p2Min = det.up(2.4 * d0)
	gMin := s.Tw + 2*m.fillet() + size.WasherOD
	gT := det.up(det.GaugeFactor * d0)
	h.g4Outer = max(det.up(gMin), gT)
	h.g4Inner = max(det.up(max(gMin, 2*(sr.innerEdge+h.e2T))), gT)
	return h
}

// capRules are the Table 3.3 maxima for one thickness of the thinner outer part [mm].
type capRules struct {
	eMax  float64 // 4t + 40 rounded down (infinite when sheltered)
	pMax  float64 // min(14t, 200) rounded down
	e2Two float64 // 2 lines: edge distance that keeps the gauge within min(14t, 200), rounded up
}

func newCapRules(det *Detailing, sr *sectionRules, t float64) capRules {
	pm := maxPitch(t)
	return capRules{eMax: det.down(maxEdge(t, det.Sheltered)), pMax: det.down(pm), e2Two: det.up((sr.bo - pm) / 2)}
}

// clamp keeps a rounded target between a rounded minimum and a rounded-down maximum; when the
// limits cross the minimum wins and the spacing check reports the maximum.
func clamp(target, lo, hi float64) float64 { return max(min(target, hi), lo) }

// sizingFlange builds the flange layout for one point of the design space, or reports that the
// combination cannot be drawn (ok = false): 4 lines with no room between them, inner plates too
// narrow to carry a bolt line, a fixed gauge that cannot be detailed (fixedGauge), plates
// thinner than the preferred minimum. cr holds the maxima of the thinner outer connected part.
//
// e1 and p1 aim at full bearing; the outer plate is as wide as the flange (rounded down); with
// 2 lines they sit at the edge distance (keeping the nuts clear of the fillets) unless that
// makes the gauge exceed min(14t, 200); with 4 lines the inner ones go as close to the web as
// the washers (or the inner plates' edge distance) allow. A fixed gauge (Detailing.Gauge)
// replaces both choices.
func sizingFlange(sr *sectionRules, hr *holeRules, cr *capRules, inner bool, cols, rows int, to, ti float64) (fl flangeLayout, ok bool) {
	fl = flangeLayout{inner: inner, to: to, cols: cols, rows: rows, bo: sr.bo}
	fl.e1 = clamp(hr.e1T, hr.eMin, cr.eMax)
	fl.p1 = clamp(hr.p1T, hr.p1Min, cr.pMax)
	fl.length = flangeLength(sr.gap, fl.e1, fl.p1, rows)
	e2 := clamp(hr.e2T, hr.eMin, cr.eMax)
	if inner {
		fl.ti, fl.bi = ti, sr.bi
	}
	thick := thickEnough(sr, to, ti)
	if sr.gauge > 0 {
		return fl, fixedGauge(&fl, sr, hr, e2) == "" && thick
	}
	switch cols {
	case 2:
		fl.e2 = max(e2, cr.e2Two)
		fl.g = fl.bo - 2*fl.e2
	case 4:
		fl.g = hr.g4Outer
		if inner {
			fl.g = hr.g4Inner
		}
		fl.e2 = e2
		fl.p2o = (fl.bo - 2*e2 - fl.g) / 2
		if fl.p2o < hr.p2Min {
			return fl, false
		}
	default:
		return fl, false
	}
	if fl.g <= 0 || (inner && (fl.bi < 2*hr.eMin || !(fl.g/2 > fl.innerEdge()))) {
		return fl, false
	}
	return fl, thick
}

// thickEnough reports whether the flange plates meet the preferred minimum thickness
// (Detailing.MinPlateToFlange): the outer plate, with the inner plates when there are any.
func thickEnough(sr *sectionRules, to, ti float64) bool {
	return !(to+ti < sr.minPlate*(1-passTolerance))
}

// fixedGauge lays out the bolt lines of a flange with the fixed gauge g = sr.gauge (with 4
// lines, the outer ones at the edge distance e2) and returns the rule of EN 1993-1-8 Table 3.3
// or of the fit to the section that the layout breaks whatever the plate thicknesses, with its
// numbers, or "" when it can be detailed: e2 ≥ 1.2·d0 to the plate's edge (2 lines); the
// spacing of the outer lines p2 ≥ 2.4·d0 (4 lines); the gauge p2 ≥ 2.4·d0; without inner
// plates, washers under the flange clear of the web and its fillets (the detail.fit rule);
// with inner plates, an edge distance of 1.2·d0 to the inner plates' edge by the web and
// inner plates wide enough for a bolt line. The maxima of Table 3.3 depend on the plates and
// are left to the spacing check.
func fixedGauge(fl *flangeLayout, sr *sectionRules, hr *holeRules, e2 float64) string {
	g, d0 := sr.gauge, hr.d0
	fl.g = g
	below := func(v, limit float64) bool { return v < limit*(1-passTolerance) }
	switch fl.cols {
	case 2:
		fl.e2 = (fl.bo - g) / 2
		if below(fl.e2, 1.2*d0) {
			return sprintf("e2 = (%s − %s)/2 = %s mm to the edge of the %s mm plate is less than 1.2·d0 = %s mm (EN 1993-1-8 Table 3.3)",
				mm(fl.bo), mm(g), mm(fl.e2), mm(fl.bo), mm(1.2*d0))
		}
	case 4:
		fl.e2 = e2
		fl.p2o = (fl.bo - 2*e2 - g) / 2
		if below(fl.p2o, 2.4*d0) {
			return sprintf("4 lines leave p2 = (%s − 2×%s − %s)/2 = %s mm between the inner and outer lines, less than 2.4·d0 = %s mm (EN 1993-1-8 Table 3.3)",
				mm(fl.bo), mm(e2), mm(g), mm(fl.p2o), mm(2.4*d0))
		}
	default:
		return sprintf("%d bolt lines: a flange has 2 or 4", fl.cols)
	}
	if below(g, 2.4*d0) {
		return sprintf("the gauge p2 = %s mm is less than 2.4·d0 = %s mm (EN 1993-1-8 Table 3.3)", mm(g), mm(2.4*d0))
	}
	if !fl.inner {
		if w := g/2 - hr.washer/2; below(w, sr.washerFit) {
			return sprintf("the washers (Ø%s mm) under the flange reach the web's fillets: g/2 − Ø/2 = %s mm is less than tw/2 + fillet = %s mm",
				mm(hr.washer), mm(w), mm(sr.washerFit))
		}
		return ""
	}
	if below(fl.bi, 2*hr.eMin) {
		return sprintf("the inner plates (%s mm wide) are too narrow for a bolt line: 2 × 1.2·d0 = %s mm", mm(fl.bi), mm(2*hr.eMin))
	}
	if ei := g/2 - fl.innerEdge(); below(ei, 1.2*d0) {
		return sprintf("the lines nearest the web are e2 = %s/2 − %s = %s mm from the inner plates' edge, less than 1.2·d0 = %s mm (EN 1993-1-8 Table 3.3)",
			mm(g), mm(fl.innerEdge()), mm(ei), mm(1.2*d0))
	}
	return ""
}

// sizingWeb builds the web layout for one point of the design space. The plates go as deep as
// the space between the root fillets allows (less the clearance each side, rounded down) and
// the rows are spread over that depth at a pitch rounded down to the setting-out step; the
// edge distance is what remains. The pitch leaves full-bearing edges (EndFactor × d0) when it
// can still be PitchFactor × d0, otherwise EdgeFactor edges. ok = false when the rows do not
// fit at 2.4 d0. cr holds the maxima for the plate thickness.
func sizingWeb(sr *sectionRules, hr *holeRules, cr *capRules, det *Detailing, cols, rows int, tp float64) (wl webLayout, ok bool) {
	wl = webLayout{tp: tp, cols: cols, rows: rows, hp: sr.hp}
	wl.eh = clamp(hr.e1T, hr.eMin, cr.eMax)
	if cols > 1 {
		wl.ph = clamp(hr.p1T, hr.p2Min, cr.pMax)
	}
	wl.length = webLength(sr.gap, wl.eh, wl.ph, cols)
	if rows < 2 || wl.hp <= 0 {
		return wl, false
	}
	n := float64(rows - 1)
	pv := min(det.down((wl.hp-2*hr.e1T)/n), cr.pMax)
	if pv < hr.p1T {
		pv = min(det.down((wl.hp-2*clamp(hr.e2T, hr.eMin, cr.eMax))/n), cr.pMax)
	}
	if pv < hr.p2Min {
		return wl, false
	}
	wl.pv = pv
	wl.ev = (wl.hp - n*pv) / 2
	return wl, true
}

// GaugeFit says whether the fixed flange gauge of a problem (Detailing.Gauge) can be detailed
// with one bolt size, flange arrangement and number of bolt lines of its design space.
type GaugeFit struct {
	Size        string      // bolt size, "M20"
	Arrangement Arrangement // OuterOnly or OuterInner
	Columns     int         // bolt lines across the flange: 2 or 4
	// Reason is "" when the gauge can be detailed, else the rule it breaks with its numbers
	// and clause, e.g. "e2 = (190 − 140)/2 = 25 mm to the edge of the 190 mm plate is less
	// than 1.2·d0 = 26.4 mm (EN 1993-1-8 Table 3.3)".
	Reason string
}

// GaugeFits lists, in design-space order (sizes, then arrangements, then columns), whether
// p.Detailing.Gauge can be detailed on p's member with each bolt size, flange arrangement and
// number of bolt lines of p.Sizing.Space for some plate thickness of the space: the minima of
// EN 1993-1-8 Table 3.3 (e2 ≥ 1.2·d0, p2 ≥ 2.4·d0), washers clear of the web's fillets or
// welds, the bolt lines nearest the web on the inner plates. Size leaves out exactly the
// layouts that cannot be detailed. It returns nil when no gauge is fixed; the errors are those
// of Size. p's forces are not used.
func GaugeFits(p Problem) ([]GaugeFit, error) {
	if p.Detailing.Gauge == 0 {
		return nil, nil
	}
	p.ULS, p.SLS = Forces{}, nil
	s, err := newSearcher(&p)
	if err != nil {
		return nil, err
	}
	var out []GaugeFit
	for si, size := range s.sp.sizes {
		hr := &s.hr[si]
		for _, inner := range s.sp.inner {
			arr := OuterOnly
			if inner {
				arr = OuterInner
			}
			for _, cols := range s.sp.fcols {
				out = append(out, GaugeFit{Size: size.Name, Arrangement: arr, Columns: cols, Reason: s.gaugeReason(hr, inner, cols)})
			}
		}
	}
	return out, nil
}

// gaugeReason is the rule a fixed gauge breaks with one bolt size, arrangement and number of
// lines for every plate thickness of the space (the first thickness's reason), "" when some
// thickness lets it be detailed. Only the edge distance of 4 lines depends on the thickness,
// through the Table 3.3 maximum of the thinner outer part that caps it (flangeAt's choice:
// the thinner plate with inner plates, else the outer plate or the beam flange).
func (s *searcher) gaugeReason(hr *holeRules, inner bool, cols int) string {
	caps := make([]*capRules, 0, s.nth)
	for i, t := range s.sp.th {
		if !inner && t >= s.e.m.Section.Tf {
			caps = append(caps, &s.crTf)
			continue
		}
		caps = append(caps, &s.cr[i])
	}
	first := ""
	for i, cr := range caps {
		fl := flangeLayout{inner: inner, cols: cols, bo: s.sr.bo}
		if inner {
			fl.bi = s.sr.bi
		}
		r := fixedGauge(&fl, &s.sr, hr, clamp(hr.e2T, hr.eMin, cr.eMax))
		if r == "" {
			return ""
		}
		if i == 0 {
			first = r
		}
	}
	return first
}
