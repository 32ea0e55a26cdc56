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
	return errors.Join(errs...)
}

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
	gMin4     float64 // 4 lines: washers clear of the web and fillets, tw + 2r + washer (per size)
}

func newSectionRules(m *Member, det *Detailing, gap float64) sectionRules {
	s := m.Section
	r := sectionRules{gap: gap}
	r.bo = det.down(s.B)
	r.bi = det.down(r.bo/2 - s.Tw/2 - s.R - det.Clearance)
	r.innerEdge = r.bo/2 - r.bi
	r.hp = det.down(m.webDepthClear() - 2*det.Clearance)
	return r
}

// holeRules are the rounded detailing distances of one bolt size and hole [mm].
type holeRules struct {
	d0                 float64
	e1T, p1T, e2T      float64 // targets rounded up: EndFactor, PitchFactor, EdgeFactor × d0
	eMin, p1Min, p2Min float64 // Table 3.3 minima rounded up: 1.2 d0, 2.2 d0, 2.4 d0
	g4Outer, g4Inner   float64 // gauge of 4 lines without and with inner plates
}

func newHoleRules(m *Member, det *Detailing, sr *sectionRules, size BoltSize, d0 float64) holeRules {
	s := m.Section
	h := holeRules{d0: d0}
	h.e1T = det.up(det.EndFactor * d0)
	h.p1T = det.up(det.PitchFactor * d0)
	h.e2T = det.up(det.EdgeFactor * d0)
	h.eMin = det.up(1.2 * d0)
	h.p1Min = det.up(2.2 * d0)
	h.p2Min = det.up(2.4 * d0)
	gMin := s.Tw + 2*s.R + size.WasherOD
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
// narrow to carry a bolt line. cr holds the maxima of the thinner outer connected part.
//
// e1 and p1 aim at full bearing; the outer plate is as wide as the flange (rounded down); with
// 2 lines they sit at the edge distance (keeping the nuts clear of the fillets) unless that
// makes the gauge exceed min(14t, 200); with 4 lines the inner ones go as close to the web as
// the washers (or the inner plates' edge distance) allow.
func sizingFlange(sr *sectionRules, hr *holeRules, cr *capRules, inner bool, cols, rows int, to, ti float64) (fl flangeLayout, ok bool) {
	fl = flangeLayout{inner: inner, to: to, cols: cols, rows: rows, bo: sr.bo}
	fl.e1 = clamp(hr.e1T, hr.eMin, cr.eMax)
	fl.p1 = clamp(hr.p1T, hr.p1Min, cr.pMax)
	fl.length = flangeLength(sr.gap, fl.e1, fl.p1, rows)
	e2 := clamp(hr.e2T, hr.eMin, cr.eMax)
	if inner {
		fl.ti, fl.bi = ti, sr.bi
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
	return fl, true
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
