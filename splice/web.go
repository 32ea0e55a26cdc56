package splice

import "math"

// webEval evaluates the checks of the web splice (a pair of cover plates).
type webEval struct {
	e  *env
	b  *boltData
	l  *webLayout
	g  webGroup // ULS
	gs webGroup // slip state
}

// analyse distributes the web forces over the bolt group, at ULS and in the slip state.
func (w *webEval) analyse() {
	a := &w.e.act.Web
	w.g = analyseWebGroup(w.l, w.e.gap, a.Moment, a.Axial, a.Shear)
	w.gs = analyseWebGroup(w.l, w.e.gap, a.SlipMoment, a.SlipAxial, a.SlipShear)
}

func (x *webEval) groupText() string {
	g := x.g
	return sprintf("e = gap/2 + e1 + (cols − 1)·p/2 = %s mm; Mg = |Mw| + |V|·e = %s + %s×%s = %s kNm; Ip = Σ(x² + z²) = %s mm²; H = Mg·zmax/Ip + |Nw|/n = %s kN, V = |V|/n + Mg·xmax/Ip = %s kN, R = %s kN",
		mm(g.e), kNm(g.mw), kN(g.shear), fnum(g.e*1e-3, 4), kNm(g.mg), fnum(g.ip, 0), kN(g.h), kN(g.v), kN(g.r))
}

type webShearNums struct {
	lj, bLf, bp, fv, res float64
	gov                  int // the governing plane
}

// shearN: each of the two shear planes carries half the bolt force, so the plane with the
// lower Fv,Rd (thread or shank, groupFit) governs: 2·min(Fv,Rd,1, Fv,Rd,2) per bolt.
func (x *webEval) shearN() (n webShearNums) {
	l, b, f := x.l, x.b, x.l.fit
	n.lj = max(float64(l.cols-1)*l.ph, float64(l.rows-1)*l.pv)
	n.bLf = LongJointFactor(n.lj, b.d)
	n.bp = PackingFactor(l.packing, b.d)
	n.fv = f.fv[0]
	if f.fv[1] < n.fv {
		n.fv, n.gov = f.fv[1], 1
	}
	n.res = 2 * n.bLf * n.bp * n.fv
	return n
}

func (x *webEval) shearU() float64 { return utilisation(x.g.r, x.shearN().res) }

func (x *webEval) shear(d *checkDef, full bool) Check {
	e, b, n := x.e, x.b, x.shearN()
	lj, bLf, bp, res := n.lj, n.bLf, n.bp, n.res
	c := d.check(x.e, "kN", x.g.r, res, toKN)
	if !full {
		return c
	}
	f, st := x.l.fit, e.webStack(x.l)
	c.Formula = "R = √(H² + V²) on the corner bolt (elastic group) ≤ 2·βLf·βp·min(Fv,Rd,1, Fv,Rd,2), Fv,Rd,i = αv·fub·A/γM2 of plane i (A = As, αv of the class in the thread; A = πd²/4, αv = 0.6 on the shank)"
	c.Substituted = x.groupText() + sprintf("; %s; %s (%s); 2 × %s × %s × %s = %s kN",
		planeText(b, f, &st, 0, e.f.GammaM2), planeText(b, f, &st, 1, e.f.GammaM2), ruleText(b, f), f3(bLf), f3(bp), kN(n.fv), kN(res))
	c.Inputs = []Input{in("Mw", x.g.mw*toKNm, "kNm"), in("Nw", x.g.nw*toKN, "kN"), in("V", x.g.shear*toKN, "kN"), in("Lj", lj, "mm"), in("βLf", bLf, ""), in("βp", bp, "")}
	c.Note = "two shear planes, each carrying half the bolt force; governed by " + st.plane[n.gov] + "; Lj is the longer group dimension (conservative); " + e.act.Web.State
	return c
}

// bearingDirs returns the bearing resistances for horizontal and vertical loading.
func (x *webEval) bearingBeamDirs() (rh, rv, k1h, abh, k1v, abv float64) {
	e, l, b := x.e, x.l, x.b
	fu := e.m.FuWeb
	adh := AlphaDEnd(l.eh, b.d0)
	if l.cols > 1 {
		adh = min(adh, AlphaDInner(l.ph, b.d0))
	}
	k1h = 2.5
	if l.rows > 1 {
		k1h = K1Inner(l.pv, b.d0)
	}
	adv := 1.0
	if l.rows > 1 {
		adv = AlphaDInner(l.pv, b.d0)
	}
	p2 := 0.0
	if l.cols > 1 {
		p2 = l.ph
	}
	k1v = K1Edge(l.eh, p2, b.d0)
	abh = AlphaB(adh, b.class.Fub, fu)
	abv = AlphaB(adv, b.class.Fub, fu)
	t := e.m.Section.Tw
	rh = BearingResistance(k1h, abh, fu, b.d, t, e.f.GammaM2, b.hf)
	rv = BearingResistance(k1v, abv, fu, b.d, t, e.f.GammaM2, b.hf)
	return
}

func (x *webEval) bearingPlateDirs() (rh, rv, k1h, abh, k1v, abv float64) {
	e, l, b := x.e, x.l, x.b
	fu := l.fu
	across := 2*l.eh + e.gap
	adh := min(AlphaDEnd(l.eh, b.d0), AlphaDInner(across, b.d0))
	if l.cols > 1 {
		adh = min(adh, AlphaDInner(l.ph, b.d0))
	}
	pv := 0.0
	if l.rows > 1 {
		pv = l.pv
	}
	k1h = K1Edge(l.ev, pv, b.d0)
	adv := AlphaDEnd(l.ev, b.d0)
	if l.rows > 1 {
		adv = min(adv, AlphaDInner(l.pv, b.d0))
	}
	if l.cols > 1 {
		k1v = min(K1Edge(l.eh, l.ph, b.d0), K1Inner(min(l.ph, across), b.d0))
	} else {
		k1v = K1Edge(l.eh, across, b.d0)
	}
	abh = AlphaB(adh, b.class.Fub, fu)
	abv = AlphaB(adv, b.class.Fub, fu)
	rh = BearingResistance(k1h, abh, fu, b.d, l.tp, e.f.GammaM2, b.hf)
	rv = BearingResistance(k1v, abv, fu, b.d, l.tp, e.f.GammaM2, b.hf)
	return
}

// componentCheck compares each load component with the bearing resistance in its own direction
// (EN 1993-1-8 Table 3.4 note 3) and reports the worse.
func componentCheck(e *env, d *checkDef, h, v, rh, rv float64) (Check, string) {
	ch := d.check(e, "kN", h, rh, toKN)
	cv := d.check(e, "kN", v, rv, toKN)
	if cv.Utilisation > ch.Utilisation {
		return cv, "vertical"
	}
	return ch, "horizontal"
}

// bearingBeamU and bearingPlateU are the utilisations of the two component checks.
func (x *webEval) bearingBeamU() float64 {
	rh, rv, _, _, _, _ := x.bearingBeamDirs()
	return max(utilisation(x.g.h, rh), utilisation(x.g.v, rv))
}

func (x *webEval) bearingPlateU() float64 {
	rh, rv, _, _, _, _ := x.bearingPlateDirs()
	return max(utilisation(x.g.h/2, rh), utilisation(x.g.v/2, rv))
}

func (x *webEval) bearingBeam(d *checkDef, full bool) Check {
	e, b := x.e, x.b
	rh, rv, k1h, abh, k1v, abv := x.bearingBeamDirs()
	c, dir := componentCheck(e, d, x.g.h, x.g.v, rh, rv)
	if !full {
		return c
	}
	c.Formula = "H ≤ Fb,Rd,h and V ≤ Fb,Rd,v on the corner bolt, Fb,Rd = k1·αb·fu·d·tw/γM2 with e and p taken in each load direction"
	c.Substituted = sprintf("H = %s kN, V = %s kN; horizontal: k1 = %s, αb = %s, Fb,Rd = %s kN; vertical: k1 = %s, αb = %s, Fb,Rd = %s kN",
		kN(x.g.h), kN(x.g.v), f3(k1h), f3(abh), kN(rh), f3(k1v), f3(abv), kN(rv))
	c.Inputs = []Input{in("tw", e.m.Section.Tw, "mm"), in("fu", e.m.FuWeb, "N/mm²"), in("d", b.d, "mm"), in("d0", b.d0, "mm")}
	c.Note = "beam web, " + dir + " component governs; the web has no free edge at top and bottom; " + e.act.Web.State
	return c
}

func (x *webEval) bearingPlate(d *checkDef, full bool) Check {
	e, l, b := x.e, x.l, x.b
	rh, rv, k1h, abh, k1v, abv := x.bearingPlateDirs()
	c, dir := componentCheck(e, d, x.g.h/2, x.g.v/2, rh, rv)
	if !full {
		return c
	}
	c.Formula = "H/2 ≤ Fb,Rd,h and V/2 ≤ Fb,Rd,v per plate on the corner bolt, Fb,Rd = k1·αb·fu·d·tp/γM2 in each load direction"
	c.Substituted = sprintf("H/2 = %s kN, V/2 = %s kN; horizontal: k1 = %s, αb = %s, Fb,Rd = %s kN; vertical: k1 = %s, αb = %s, Fb,Rd = %s kN",
		kN(x.g.h/2), kN(x.g.v/2), f3(k1h), f3(abh), kN(rh), f3(k1v), f3(abv), kN(rv))
	c.Inputs = []Input{in("tp", l.tp, "mm"), in("fu", l.fu, "N/mm²"), in("e1", l.eh, "mm"), in("e2", l.ev, "mm"), in("d0", b.d0, "mm")}
	c.Note = "each plate takes half the bolt force; " + dir + " component governs; " + e.act.Web.State
	return c
}

// slipN is the slip resistance of a web bolt: two friction surfaces.
func (x *webEval) slipN() float64 { return 2 * x.b.fsPerSur }

func (x *webEval) slipU() float64 { return utilisation(x.gs.r, x.slipN()) }

func (x *webEval) slip(d *checkDef, full bool) Check {
	e, b := x.e, x.b
	res := x.slipN()
	c := d.check(x.e, "kN", x.gs.r, res, toKN)
	if !full {
		return c
	}
	c.Formula = "R (slip state) ≤ Fs,Rd = ks·2·μ·Fp,C/" + e.slipGammaName()
	c.Substituted = sprintf("Mg = %s kNm, H = %s kN, V = %s kN, R = %s kN; Fs,Rd = %s×2×%s×%s/%s = %s kN",
		kNm(x.gs.mg), kN(x.gs.h), kN(x.gs.v), kN(x.gs.r), f2(e.holes.Ks()), f2(e.mu), kN(b.fpC), f2(e.gammaS), kN(res))
	c.Inputs = []Input{in("μ", e.mu, ""), in("ks", e.holes.Ks(), "")}
	c.Note = "two friction surfaces; friction class " + string(e.fc)
	if !b.class.Preloadable {
		c.Note += "; class " + b.class.Name + " cannot be preloaded (see detail.preload)"
	}
	return c
}

func (x *webEval) shearGrossN() float64 {
	return 2 * x.l.hp * x.l.tp * x.l.fy / (math.Sqrt(3) * x.e.f.GammaM0)
}

func (x *webEval) shearGrossU() float64 { return utilisation(x.g.shear, x.shearGrossN()) }

func (x *webEval) shearGross(d *checkDef, full bool) Check {
	e, l := x.e, x.l
	res := x.shearGrossN()
	c := d.check(x.e, "kN", x.g.shear, res, toKN)
	if !full {
		return c
	}
	c.Formula = "VEd ≤ Vpl,Rd = 2·hp·tp·fy/(√3·γM0)"
	c.Substituted = sprintf("2×%s×%s×%s/(√3×%s) = %s kN; VEd = %s kN", mm(l.hp), mm(l.tp), fnum(l.fy, 0), f2(e.f.GammaM0), kN(res), kN(x.g.shear))
	c.Inputs = []Input{in("hp", l.hp, "mm"), in("tp", l.tp, "mm"), in("fy", l.fy, "N/mm²")}
	c.Note = "shear area of a plate taken as its full area (common practice)"
	return c
}

func (x *webEval) shearNetN() (avn, res float64) {
	l := x.l
	avn = 2 * (l.hp - float64(l.rows)*x.b.d0) * l.tp
	return avn, avn * l.fu / (math.Sqrt(3) * x.e.f.GammaM2)
}

func (x *webEval) shearNetU() float64 {
	_, res := x.shearNetN()
	return utilisation(x.g.shear, res)
}

func (x *webEval) shearNet(d *checkDef, full bool) Check {
	l, b := x.l, x.b
	avn, res := x.shearNetN()
	c := d.check(x.e, "kN", x.g.shear, res, toKN)
	if !full {
		return c
	}
	c.Formula = "VEd ≤ Vnet,Rd = Av,net·fu/(√3·γM2), Av,net = 2·(hp − rows·d0)·tp"
	c.Substituted = sprintf("Av,net = 2×(%s − %d×%s)×%s = %s mm²; %s kN; VEd = %s kN", mm(l.hp), l.rows, mm(b.d0), mm(l.tp), mm(avn), kN(res), kN(x.g.shear))
	c.Inputs = []Input{in("fu", l.fu, "N/mm²")}
	return c
}

func (x *webEval) blockN() (ant, anv, res float64) {
	l, b := x.l, x.b
	c1, r1 := float64(l.cols), float64(l.rows)
	ant = l.tp * (l.eh + (c1-1)*l.ph - (c1-0.5)*b.d0)
	anv = l.tp * (l.ev + (r1-1)*l.pv - (r1-0.5)*b.d0)
	return ant, anv, 2 * BlockTearing(l.fu, l.fy, ant, anv, false, x.e.f.GammaM0, x.e.f.GammaM2)
}

func (x *webEval) blockU() float64 {
	_, _, res := x.blockN()
	return utilisation(x.g.shear, res)
}

func (x *webEval) block(d *checkDef, full bool) Check {
	e, l, b := x.e, x.l, x.b
	ant, anv, res := x.blockN()
	c := d.check(x.e, "kN", x.g.shear, res, toKN)
	if !full {
		return c
	}
	c.Formula = "VEd ≤ 2·Veff,2,Rd = 2·(0.5·fu·Ant/γM2 + fy·Anv/(√3·γM0)); Ant = tp·(e1 + (cols − 1)·p − (cols − 0.5)·d0), Anv = tp·(e2 + (rows − 1)·p − (rows − 0.5)·d0)"
	c.Substituted = sprintf("Ant = %s mm², Anv = %s mm²; 2×(0.5×%s×%s/%s + %s×%s/(√3×%s)) = %s kN; VEd = %s kN",
		mm(ant), mm(anv), fnum(l.fu, 0), mm(ant), f2(e.f.GammaM2), fnum(l.fy, 0), mm(anv), f2(e.f.GammaM0), kN(res), kN(x.g.shear))
	c.Inputs = []Input{in("e1", l.eh, "mm"), in("e2", l.ev, "mm"), in("d0", b.d0, "mm")}
	c.Note = "bolt group torn out of each plate through its end and bottom edge, eccentric form (the group carries a moment)"
	return c
}

// combined checks the plate pair at the section through the bolt column nearest the joint:
// M = |Mw| + |V|·(gap/2 + e1), with N and V (EN 1993-1-1 6.2.8, 6.2.9 for a rectangle).
type combinedNums struct {
	med, ned, ved, vpl, rho, w, npl, mn float64
	ignore, axial                       bool
	nplText                             string // the Npl,Rd formula used
}

// combinedN: when the axial share alone reaches Npl,Rd the check is an axial one (axial = true,
// demand NEd against Npl,Rd); otherwise MEd against MN,V,Rd.
func (x *webEval) combinedN() (n combinedNums) {
	e, l, b := x.e, x.l, x.b
	f := &e.f
	n.med = x.g.mw + x.g.shear*(e.gap/2+l.eh)
	n.ned, n.ved = x.g.nw, x.g.shear
	a := 2 * l.hp * l.tp
	n.vpl = a * l.fy / (math.Sqrt(3) * f.GammaM0)
	if n.ved > 0.5*n.vpl {
		n.rho = math.Pow(2*n.ved/n.vpl-1, 2)
	}
	fyr := (1 - min(n.rho, 1)) * l.fy
	wpl := 2 * l.tp * l.hp * l.hp / 4
	sumZ := 0.0
	for i := 0; i < l.rows; i++ {
		sumZ += math.Abs((float64(l.rows-1)/2 - float64(i)) * l.pv)
	}
	at := l.tp * l.hp / 2
	atNet := l.tp * (l.hp/2 - float64(l.rows)/2*b.d0)
	catC := e.cat == CategoryC
	// 6.2.5(5): holes in the tension zone may be ignored when 0.9·Anet·fu/γM2 ≥ A·fy/γM0 — never
	// in a category C joint, where Nnet,Rd = Anet·fy/γM0 governs the tension part (6.2.3(4));
	// oversize holes count in the compression zone too (6.2.4(3), 6.2.5(6)). The holes of both
	// zones are then deducted about the plate's centre line (conservative).
	n.ignore = !catC && e.holes == NormalHoles && 0.9*atNet*l.fu/f.GammaM2 >= at*l.fy/f.GammaM0
	n.w = wpl
	if !n.ignore {
		n.w = wpl - 2*l.tp*b.d0*sumZ
	}
	anet := max(0, 2*l.tp*(l.hp-float64(l.rows)*b.d0))
	mpl := max(0, n.w) * fyr / f.GammaM0
	// The web share of N may be tension or compression: the smaller resistance of either sign.
	switch {
	case catC: // 6.2.3(4): Nt,Rd = min(Npl,Rd, Nnet,Rd = Anet·fy/γM0) replaces Nu,Rd
		n.npl = min(a, anet) * fyr / f.GammaM0
		n.nplText = "min(A, Anet)·(1 − ρ)·fy/γM0 (category C, 6.2.3(4))"
	case e.holes != NormalHoles: // 6.2.4(3): oversize holes are deducted in compression as well
		n.npl = min(a*fyr/f.GammaM0, 0.9*anet*l.fu/f.GammaM2, anet*fyr/f.GammaM0)
		n.nplText = "min(A·(1 − ρ)·fy/γM0, 0.9·Anet·fu/γM2, Anet·(1 − ρ)·fy/γM0 (oversize holes in compression, 6.2.4(3)))"
	default:
		n.npl = min(a*fyr/f.GammaM0, 0.9*anet*l.fu/f.GammaM2)
		n.nplText = "min(A·(1 − ρ)·fy/γM0, 0.9·Anet·fu/γM2)"
	}
	if n.ned > 0 && n.ned >= n.npl {
		n.axial = true
		return n
	}
	if n.npl > 0 {
		n.mn = mpl * (1 - (n.ned/n.npl)*(n.ned/n.npl))
	}
	return n
}

func (n *combinedNums) demandResistance() (d, r float64) {
	if n.axial {
		return n.ned, n.npl
	}
	return n.med, n.mn
}

// combined checks the plate pair at the section through the bolt column nearest the joint:
// M = |Mw| + |V|·(gap/2 + e1), with N and V (EN 1993-1-1 6.2.8, 6.2.9 for a rectangle).
func (x *webEval) combinedU() float64 {
	n := x.combinedN()
	return utilisation(n.demandResistance())
}

// combined is the check in its table form; when the axial share alone reaches Npl,Rd it is the
// axial check, with the table's other clause.
func (x *webEval) combined(d *checkDef, full bool) Check {
	e, l := x.e, x.l
	n := x.combinedN()
	if n.axial {
		c := d.check(x.e, "kN", n.ned, n.npl, toKN)
		c.Clause = d.altClause
		if full {
			c.Formula = "NEd ≤ Npl,Rd = " + n.nplText + ", before any moment"
			c.Substituted = sprintf("NEd = %s kN ≥ Npl,Rd = %s kN", kN(n.ned), kN(n.npl))
			c.Note = "the axial share alone exceeds the web plates; " + e.act.Web.State
		}
		return c
	}
	c := d.check(x.e, "kNm", n.med, n.mn, toKNm)
	if !full {
		return c
	}
	c.Formula = "MEd = |Mw| + |V|·(gap/2 + e1) ≤ MN,V,Rd = Wpl·(1 − ρ)·fy/γM0·[1 − (NEd/Npl,Rd)²], Npl,Rd = " + n.nplText + ", ρ = (2VEd/Vpl,Rd − 1)² when VEd > 0.5·Vpl,Rd"
	sec := "gross (holes in the tension zone may be ignored, 6.2.5(5))"
	switch {
	case n.ignore:
	case e.cat == CategoryC:
		sec = "net of the holes: category C, Nnet,Rd governs the tension zone (6.2.3(4))"
	case e.holes != NormalHoles:
		sec = "net of the holes: oversize holes (6.2.4(3), 6.2.5(6))"
	default:
		sec = "net of the holes (6.2.5(5) not met)"
	}
	c.Substituted = sprintf("MEd = %s + %s×%s = %s kNm; Vpl,Rd = %s kN, ρ = %s; Wpl = %s mm³ (plastic, of the two plates as solid rectangles, %s), Npl,Rd = %s kN, NEd = %s kN; MN,V,Rd = %s kNm",
		kNm(x.g.mw), kN(n.ved), fnum((e.gap/2+l.eh)*1e-3, 4), kNm(n.med), kN(n.vpl), f3(n.rho), fnum(n.w, 0), sec, kN(n.npl), kN(n.ned), kNm(n.mn))
	c.Inputs = []Input{in("hp", l.hp, "mm"), in("tp", l.tp, "mm"), in("fy", l.fy, "N/mm²"), in("fu", l.fu, "N/mm²")}
	c.Note = "both plates together; " + e.act.Web.State
	return c
}

func (x *webEval) beamNetShearN() (vpl, avn, vnet, res float64) {
	e := x.e
	s := e.m.Section
	vpl = s.Avz * e.m.FyWeb / (math.Sqrt(3) * e.f.GammaM0)
	avn = s.Avz - float64(x.l.rows)*x.b.d0*s.Tw
	vnet = avn * e.m.FuWeb / (math.Sqrt(3) * e.f.GammaM2)
	return vpl, avn, vnet, min(vpl, vnet)
}

func (x *webEval) beamNetShearU() float64 {
	_, _, _, res := x.beamNetShearN()
	return utilisation(x.g.shear, res)
}

func (x *webEval) beamNetShear(d *checkDef, full bool) Check {
	e := x.e
	s := e.m.Section
	vpl, avn, vnet, res := x.beamNetShearN()
	c := d.check(x.e, "kN", x.g.shear, res, toKN)
	if !full {
		return c
	}
	c.Formula = "VEd ≤ min(Vpl,Rd = Av·fy/(√3·γM0), Vnet,Rd = (Av − rows·d0·tw)·fu/(√3·γM2))"
	c.Substituted = sprintf("Av = %s mm², Av,net = %s mm²; min(%s, %s) = %s kN; VEd = %s kN", mm(s.Avz), mm(avn), kN(vpl), kN(vnet), kN(res), kN(x.g.shear))
	c.Inputs = []Input{in("Av", s.Avz, "mm²"), in("fy", e.m.FyWeb, "N/mm²"), in("fu", e.m.FuWeb, "N/mm²")}
	c.Note = "beam web at the bolt column"
	return c
}
