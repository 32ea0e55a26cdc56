package splice

import (
	"math"
	"strings"
)

// rules gathers detailing rules into one check: each rule is a minimum (utilisation =
// required/provided) or a maximum (utilisation = provided/limit); the check reports the worst.
type rules struct {
	full       bool
	u          float64
	name       string
	dem, res   float64
	lines      []string
	haveWorst  bool
	failedList []string
	impossible string // the first rule whose provided distance or limit is zero or less
	preference string // the detailing preference behind the layout, for the note; "" when none
}

func (r *rules) take(name string, dem, res float64, line string) {
	u := utilisation(dem, res)
	if dem > 0 && !(res > 0) && r.impossible == "" {
		r.impossible = sprintf("%s = %s mm: %s", name, mm(res), offPart(name))
	}
	if !r.haveWorst || u > r.u {
		r.u, r.name, r.dem, r.res, r.haveWorst = u, name, dem, res, true
	}
	if r.full {
		mark := "ok"
		if !passes(u) {
			mark = "FAILS"
			r.failedList = append(r.failedList, name)
		}
		r.lines = append(r.lines, line+" "+mark)
	}
}

// atLeast records value ≥ required.
func (r *rules) atLeast(name string, value, required float64, reqText string) {
	line := ""
	if r.full {
		line = sprintf("%s = %s ≥ %s = %s mm", name, mm(value), reqText, mm(required))
	}
	r.take(name, required, value, line)
}

// atMost records value ≤ limit; an infinite limit (no rule) is skipped.
func (r *rules) atMost(name string, value, limit float64, limText string) {
	if math.IsInf(limit, 1) {
		return
	}
	line := ""
	if r.full {
		line = sprintf("%s = %s ≤ %s = %s mm", name, mm(value), limText, mm(limit))
	}
	r.take(name, value, limit, line)
}

// offPart says what a detailing distance of zero or less means: which part the bolts or
// plates have left.
func offPart(rule string) string {
	switch rule {
	case "flange e2 (beam flange)":
		return "the outer bolt lines are off the beam flange"
	case "flange e2 (inner plate, web side)":
		return "the bolt lines nearest the web are off the inner plates"
	case "washer edge from web centre":
		return "the washers under the flange run into the web"
	case "inner plate edge from web centre":
		return "the inner plates run into the web"
	case "web plate depth":
		return "the web has no depth between the root fillets for a plate"
	}
	return "the bolts are off the part"
}

func (r *rules) check(e *env, d *checkDef) Check {
	c := d.check(e, "mm", r.dem, r.res, 1)
	if c.Utilisation >= UtilisationCap {
		c.Impossible = r.impossible
	}
	if r.full {
		c.Substituted = strings.Join(r.lines, "; ")
		c.Note = "worst rule: " + r.name
		if len(r.failedList) > 0 {
			c.Note += "; failing: " + strings.Join(r.failedList, ", ")
		}
		if r.preference != "" {
			c.Note += "; " + r.preference
		}
	}
	return c
}

// flangeSpacing applies EN 1993-1-8 Table 3.3 to the flange splice; t is the thinner outer
// connected part (outer plate and flange, or outer and inner plates).
func (x *flangeEval) spacing(d *checkDef, full bool) Check {
	r := x.spacingR(full)
	return r.check(x.e, d)
}

func (x *flangeEval) spacingU() float64 { return x.spacingR(false).u }

func (x *flangeEval) spacingR(full bool) rules {
	e, l, b := x.e, x.l, x.b
	s := e.m.Section
	d0 := b.d0
	t := math.Min(l.to, s.Tf)
	if l.inner {
		t = math.Min(l.to, l.ti)
	}
	eMax := maxEdge(t, e.det.Sheltered)
	pMax := maxPitch(t)
	r := rules{full: full, preference: x.gaugePreference()}
	y, n := l.lines()
	r.atLeast("flange e1", l.e1, 1.2*d0, "1.2d0")
	r.atMost("flange e1", l.e1, eMax, "4t + 40")
	r.atLeast("flange e2 (outer plate)", l.e2, 1.2*d0, "1.2d0")
	r.atMost("flange e2 (outer plate)", l.e2, eMax, "4t + 40")
	r.atLeast("flange e2 (beam flange)", s.B/2-y[n-1], 1.2*d0, "1.2d0")
	if l.inner {
		ei := l.g/2 - l.innerEdge()
		r.atLeast("flange e2 (inner plate, web side)", ei, 1.2*d0, "1.2d0")
		r.atMost("flange e2 (inner plate, web side)", ei, eMax, "4t + 40")
	}
	if l.rows > 1 {
		r.atLeast("flange p1", l.p1, 2.2*d0, "2.2d0")
		r.atMost("flange p1", l.p1, pMax, "min(14t, 200)")
	}
	r.atLeast("flange gauge", l.g, 2.4*d0, "2.4d0")
	r.atMost("flange gauge", l.g, pMax, "min(14t, 200)")
	if l.cols == 4 {
		r.atLeast("flange p2 (outer lines)", l.p2o, 2.4*d0, "2.4d0")
		r.atMost("flange p2 (outer lines)", l.p2o, pMax, "min(14t, 200)")
	}
	return r
}

// gaugePreference says, for the notes of the detailing checks, that the flange gauge is the
// preferred one (Detailing.Gauge); "" when the sizing chose it or the splice has another.
func (x *flangeEval) gaugePreference() string {
	g := x.e.det.Gauge
	if !(g > 0) || math.Abs(x.l.g-g) > 1e-9 {
		return ""
	}
	return sprintf("the gauge is the preferred %s mm (detailing preference)", mm(g))
}

// fit checks that the flange plates fit the section: outer plate no wider than the flange,
// inner plates clear of the root fillets (or the welds of a welded section), washers under
// the flange clear of the fillets, and the plates no thinner than the preferred minimum
// (Detailing.MinPlateToFlange) where there is one.
func (x *flangeEval) fit(d *checkDef, full bool) Check {
	r := x.fitR(full)
	return r.check(x.e, d)
}

func (x *flangeEval) fitU() float64 { return x.fitR(false).u }

func (x *flangeEval) fitR(full bool) rules {
	e, l, b := x.e, x.l, x.b
	s := e.m.Section
	r := rules{full: full, preference: x.gaugePreference()}
	f, fn := e.m.fillet(), e.m.filletName()
	r.atMost("flange outer plate width", l.bo, s.B, "b")
	if l.inner {
		r.atLeast("inner plate edge from web centre", l.innerEdge(), s.Tw/2+f+e.det.Clearance, "tw/2 + "+fn+" + clearance")
	} else {
		r.atLeast("washer edge from web centre", l.g/2-b.size.WasherOD/2, s.Tw/2+f, "tw/2 + "+fn)
	}
	if k := e.det.MinPlateToFlange; k > 0 {
		name, t := "flange plate thickness to (preferred minimum)", l.to
		if l.inner {
			name, t = "flange plate thickness to + ti (preferred minimum)", l.to+l.ti
		}
		r.atLeast(name, t, k*s.Tf, fnum(k, -1)+"·tf")
	}
	return r
}

// spacing applies EN 1993-1-8 Table 3.3 to the web splice; the outer connected parts are the
// cover plates. The bolts carry load both ways, so both spacings use 2.4 d0.
func (x *webEval) spacing(d *checkDef, full bool) Check {
	r := x.spacingR(full)
	return r.check(x.e, d)
}

func (x *webEval) spacingU() float64 { return x.spacingR(false).u }

func (x *webEval) spacingR(full bool) rules {
	e, l, b := x.e, x.l, x.b
	d0 := b.d0
	eMax := maxEdge(l.tp, e.det.Sheltered)
	pMax := maxPitch(l.tp)
	r := rules{full: full}
	r.atLeast("web e1 (end)", l.eh, 1.2*d0, "1.2d0")
	r.atMost("web e1 (end)", l.eh, eMax, "4t + 40")
	r.atLeast("web e2 (top and bottom)", l.ev, 1.2*d0, "1.2d0")
	r.atMost("web e2 (top and bottom)", l.ev, eMax, "4t + 40")
	if l.cols > 1 {
		r.atLeast("web spacing", l.ph, 2.4*d0, "2.4d0")
		r.atMost("web spacing", l.ph, pMax, "min(14t, 200)")
	}
	if l.rows > 1 {
		r.atLeast("web pitch", l.pv, 2.4*d0, "2.4d0")
		r.atMost("web pitch", l.pv, pMax, "min(14t, 200)")
	}
	return r
}

func (x *webEval) fit(d *checkDef, full bool) Check {
	r := x.fitR(full)
	return r.check(x.e, d)
}

func (x *webEval) fitU() float64 { return x.fitR(false).u }

func (x *webEval) fitR(full bool) rules {
	r := rules{full: full}
	m := &x.e.m
	r.atMost("web plate depth", x.l.hp, m.webDepthClear()-2*x.e.det.Clearance, "h − 2tf − 2"+m.filletName()+" − 2×clearance")
	return r
}

// preload checks that a slip-resistant category uses a preloadable class (EN 1993-1-8 3.1.2(1):
// 8.8 and 10.9, the only classes with fub ≥ 800 N/mm²).
func preloadU(e *env, b *boltData) float64 { return utilisation(800, b.class.Fub) }

func preloadCheck(e *env, b *boltData, d *checkDef, full bool) Check {
	c := d.check(e, "N/mm²", 800, b.class.Fub, 1)
	if full {
		c.Formula = "categories B and C: bolt class 8.8 or 10.9 (fub ≥ 800 N/mm²)"
		c.Substituted = sprintf("class %s, fub = %s N/mm²", b.class.Name, fnum(b.class.Fub, 0))
		if !b.class.Preloadable {
			c.Note = "class " + b.class.Name + " may not be preloaded"
		}
	}
	return c
}

// merge joins the flange and web halves of a detailing check into one (the worse governs).
func merge(fc, wc Check) Check {
	out := fc
	if wc.Utilisation > fc.Utilisation {
		out = wc
	}
	if fc.Substituted != "" || wc.Substituted != "" {
		out.Formula = "every rule: minimum ≤ provided ≤ maximum"
		out.Substituted = "flange: " + fc.Substituted + "; web: " + wc.Substituted
		out.Note = "flange " + fc.Note + "; web " + wc.Note
	}
	return out
}
