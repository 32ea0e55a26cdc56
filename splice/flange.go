package splice

import (
	"math"
	"strings"
)

// flangeEval evaluates the checks of one flange splice. The flange force is shared between the
// outer plate and the inner plates in proportion to their gross areas (common practice); a
// plate check's resistance is the flange force at which the first plate reaches its own
// resistance, min over plates of R_p·ΣA/A_p, so demand and resistance stay in flange-force terms.
type flangeEval struct {
	e *env
	b *boltData
	l *flangeLayout
}

func (x *flangeEval) planes() int {
	if x.l.inner {
		return 2
	}
	return 1
}

// maxShare is the larger share of the flange force carried by the plies on one side of the
// beam flange: with inner plates each shear plane (and each friction surface) carries the force
// of the plate on its side, by area the outer plate's Ao/ΣA and the inner plates' Ai/ΣA, so the
// plane next to the larger share governs; an outer plate alone takes it all through one plane.
func (x *flangeEval) maxShare() float64 {
	if !x.l.inner {
		return 1
	}
	ao, ai, sum := x.areas()
	return max(ao, ai) / sum
}

// planeText names the governing shear plane or friction surface and its share.
func (x *flangeEval) planeText() string {
	if !x.l.inner {
		return "one plane (outer plate alone), share 1"
	}
	ao, ai, sum := x.areas()
	side := "outer plate's"
	if ai > ao {
		side = "inner plates'"
	}
	return sprintf("two planes; the %s plane governs with share max(%s, %s)/%s = %s", side, mm(ao), mm(ai), mm(sum), f3(x.maxShare()))
}

func (x *flangeEval) nb() float64 { return float64(x.l.rows * x.l.cols) }

func (x *flangeEval) areas() (ao, ai, sum float64) {
	ao = x.l.to * x.l.bo
	if x.l.inner {
		ai = 2 * x.l.ti * x.l.bi
	}
	return ao, ai, ao + ai
}

// share turns the resistances of the outer plate and of the inner plates into the flange force
// at which the first of them is reached, and says which one governs.
func (x *flangeEval) share(ro, ri float64) (float64, string) {
	ao, ai, sum := x.areas()
	cap := ro * sum / ao
	if x.l.inner {
		if c := ri * sum / ai; c < cap {
			return c, "inner plates"
		}
		return cap, "outer plate"
	}
	return cap, "outer plate"
}

// shareText shows the sharing step of a plate check with inner plates.
func (x *flangeEval) shareText(ro, ri float64) string {
	if !x.l.inner {
		return ""
	}
	ao, ai, sum := x.areas()
	return sprintf("; shared by area: min(%s×%s/%s, %s×%s/%s)", kN(ro), mm(sum), mm(ao), kN(ri), mm(sum), mm(ai))
}

func (x *flangeEval) beamPly() ply {
	y, n := x.l.lines()
	b := x.e.m.Section.B
	return ply{yL: -b / 2, yR: b / 2, y: y, n: n, noPlug: n / 2}
}

func (x *flangeEval) outerPly() ply {
	y, n := x.l.lines()
	return ply{yL: -x.l.bo / 2, yR: x.l.bo / 2, y: y, n: n, noPlug: -1}
}

func (x *flangeEval) innerPly() ply {
	p := ply{yL: x.l.innerEdge(), yR: x.l.bo / 2, noPlug: -1, offCentre: true}
	p.y[0], p.n = x.l.g/2, 1
	if x.l.cols == 4 {
		p.y[1], p.n = x.l.g/2+x.l.p2o, 2
	}
	return p
}

// alphaDBeam: the row nearest the joint is an end bolt to the beam end; others are inner bolts.
func (x *flangeEval) alphaDBeam() float64 {
	a := AlphaDEnd(x.l.e1, x.b.d0)
	if x.l.rows > 1 {
		a = min(a, AlphaDInner(x.l.p1, x.b.d0))
	}
	return a
}

// alphaDPlate: the outer row is an end bolt to the plate end; the row nearest the joint has the
// other side's row 2e1 + gap away; the load reverses, so every term applies.
func (x *flangeEval) alphaDPlate() float64 {
	a := min(AlphaDEnd(x.l.e1, x.b.d0), AlphaDInner(2*x.l.e1+x.e.gap, x.b.d0))
	if x.l.rows > 1 {
		a = min(a, AlphaDInner(x.l.p1, x.b.d0))
	}
	return a
}

func (x *flangeEval) shearLength() float64 {
	lv := x.l.e1 - 0.5*x.b.d0
	if x.l.rows > 1 {
		lv += float64(x.l.rows-1) * (x.l.p1 - x.b.d0)
	}
	return lv
}

// Each check has a numeric core (…N), its utilisation alone (…U), which the sizing search calls,
// and the calculation-sheet form, which adds the text; all use the same numbers. The checks are
// listed, with their ids, clauses and limit states, in checkTable (table.go).

type tensionNums struct {
	ao, ai, anetO, anetI, nplO, nuO, nplI, nuI, res float64
	gov                                             string
}

func (x *flangeEval) tensionN() (n tensionNums) {
	l, f := x.l, &x.e.f
	d0, cols := x.b.d0, float64(l.cols)
	catC := x.e.cat == CategoryC
	n.ao, n.ai, _ = x.areas()
	n.anetO = (l.bo - cols*d0) * l.to
	n.nplO = n.ao * l.fyo / f.GammaM0
	if catC {
		n.nuO = n.anetO * l.fyo / f.GammaM0
	} else {
		n.nuO = 0.9 * n.anetO * l.fuo / f.GammaM2
	}
	var rI float64
	if l.inner {
		n.anetI = 2 * (l.bi - cols/2*d0) * l.ti
		n.nplI = n.ai * l.fyi / f.GammaM0
		if catC {
			n.nuI = n.anetI * l.fyi / f.GammaM0
		} else {
			n.nuI = 0.9 * n.anetI * l.fui / f.GammaM2
		}
		rI = min(n.nplI, n.nuI)
	}
	n.res, n.gov = x.share(min(n.nplO, n.nuO), rI)
	return n
}

func (x *flangeEval) tensionU() float64 { return utilisation(x.e.act.Flange.Tension, x.tensionN().res) }

func (x *flangeEval) tension(d *checkDef, full bool) Check {
	e, l, n := x.e, x.l, x.tensionN()
	c := d.check(x.e, "kN", e.act.Flange.Tension, n.res, toKN)
	if !full {
		return c
	}
	d0 := x.b.d0
	net := "Nu,Rd = 0.9·Anet·fu/γM2"
	if e.cat == CategoryC {
		net = "Nnet,Rd = Anet·fy/γM0 (category C, 6.2.3(4))"
	}
	c.Formula = "Ft,Ed ≤ Nt,Rd = min over plates of min(Npl,Rd = A·fy/γM0, " + net + ")·ΣA/A"
	c.Substituted = sprintf("outer: A = %s×%s = %s mm², Anet = (%s − %d×%s)×%s = %s mm², Npl,Rd = %s kN, net %s kN",
		mm(l.bo), mm(l.to), mm(n.ao), mm(l.bo), l.cols, mm(d0), mm(l.to), mm(n.anetO), kN(n.nplO), kN(n.nuO))
	if l.inner {
		c.Substituted += sprintf("; inner: A = 2×%s×%s = %s mm², Anet = 2×(%s − %d×%s)×%s = %s mm², Npl,Rd = %s kN, net %s kN",
			mm(l.bi), mm(l.ti), mm(n.ai), mm(l.bi), l.cols/2, mm(d0), mm(l.ti), mm(n.anetI), kN(n.nplI), kN(n.nuI))
	}
	c.Substituted += x.shareText(math.Min(n.nplO, n.nuO), math.Min(n.nplI, n.nuI))
	c.Substituted += sprintf("; Ft,Ed = %s kN ≤ Nt,Rd = %s kN", kN(e.act.Flange.Tension), kN(n.res))
	c.Inputs = []Input{in("Ft,Ed", e.act.Flange.Tension*toKN, "kN"), in("fy,outer", l.fyo, "N/mm²"), in("fu,outer", l.fuo, "N/mm²"), in("d0", d0, "mm")}
	c.Note = "governed by the " + n.gov + "; " + e.act.Flange.TensionState
	return c
}

type compressionNums struct {
	ao, ai, aO, aI, rO, rI, res float64
	net                         bool // holes deducted (oversize holes, 6.2.4(3))
	gov                         string
}

// compressionN: EN 1993-1-1 6.2.4(3) lets holes be ignored in compression only where they are
// filled by fasteners and are neither oversize nor slotted; oversize holes are deducted.
func (x *flangeEval) compressionN() (n compressionNums) {
	l, f := x.l, &x.e.f
	n.ao, n.ai, _ = x.areas()
	n.aO, n.aI = n.ao, n.ai
	if n.net = x.e.holes != NormalHoles; n.net {
		d0, cols := x.b.d0, float64(l.cols)
		n.aO = (l.bo - cols*d0) * l.to
		if l.inner {
			n.aI = 2 * (l.bi - cols/2*d0) * l.ti
		}
	}
	n.rO = max(0, n.aO) * l.fyo / f.GammaM0
	n.rI = max(0, n.aI) * l.fyi / f.GammaM0
	n.res, n.gov = x.share(n.rO, n.rI)
	return n
}

func (x *flangeEval) compressionU() float64 {
	return utilisation(x.e.act.Flange.Compression, x.compressionN().res)
}

func (x *flangeEval) compression(d *checkDef, full bool) Check {
	e, l, n := x.e, x.l, x.compressionN()
	c := d.check(x.e, "kN", e.act.Flange.Compression, n.res, toKN)
	if !full {
		return c
	}
	g0 := e.f.GammaM0
	if n.net {
		c.Formula = "Fc,Ed ≤ Nc,Rd = min over plates of (Anet·fy/γM0)·ΣA/A (oversize holes deducted, 6.2.4(3))"
		c.Substituted = sprintf("outer: Anet = (%s − %d×%s)×%s = %s mm² × %s / %s = %s kN",
			mm(l.bo), l.cols, mm(x.b.d0), mm(l.to), mm(n.aO), fnum(l.fyo, 0), f2(g0), kN(n.rO))
		if l.inner {
			c.Substituted += sprintf("; inner: Anet = 2×(%s − %d×%s)×%s = %s mm² × %s / %s = %s kN",
				mm(l.bi), l.cols/2, mm(x.b.d0), mm(l.ti), mm(n.aI), fnum(l.fyi, 0), f2(g0), kN(n.rI))
		}
	} else {
		c.Formula = "Fc,Ed ≤ Nc,Rd = min over plates of (A·fy/γM0)·ΣA/A (normal holes filled by bolts not deducted, 6.2.4(3))"
		c.Substituted = sprintf("outer: %s mm² × %s / %s = %s kN", mm(n.ao), fnum(l.fyo, 0), f2(g0), kN(n.rO))
		if l.inner {
			c.Substituted += sprintf("; inner: %s mm² × %s / %s = %s kN", mm(n.ai), fnum(l.fyi, 0), f2(g0), kN(n.rI))
		}
	}
	c.Substituted += x.shareText(n.rO, n.rI)
	c.Substituted += sprintf("; Fc,Ed = %s kN ≤ %s kN", kN(e.act.Flange.Compression), kN(n.res))
	c.Inputs = []Input{in("Fc,Ed", e.act.Flange.Compression*toKN, "kN")}
	c.Note = "governed by the " + n.gov + "; " + e.act.Flange.CompressionState
	return c
}

// freeLength is the longest unrestrained length of a flange plate in compression: the pitch,
// or the distance between the rows either side of the joint, 2e1 + gap.
func (x *flangeEval) freeLength() float64 {
	lf := 2*x.l.e1 + x.e.gap
	if x.l.rows > 1 {
		lf = max(lf, x.l.p1)
	}
	return lf
}

// plateChi is χ for a plate of thickness t in compression over the buckling length 0.6·L
// (curve c, solid rectangular section).
func (x *flangeEval) plateChi(t, fy, lf float64) (chi, lambdaBar float64) {
	i := t / math.Sqrt(12)
	lambdaBar = 0.6 * lf / (i * Lambda1(x.e.e, fy))
	return Chi(lambdaBar, 0.49), lambdaBar
}

type bucklingNums struct {
	lf, chiO, lbO, chiI, lbI, rO, rI, res float64
	gov                                   string
}

func (x *flangeEval) bucklingN() (n bucklingNums) {
	l, f := x.l, &x.e.f
	ao, ai, _ := x.areas()
	n.lf = x.freeLength()
	n.chiO, n.lbO = x.plateChi(l.to, l.fyo, n.lf)
	n.rO = n.chiO * ao * l.fyo / f.GammaM1
	if l.inner {
		n.chiI, n.lbI = x.plateChi(l.ti, l.fyi, n.lf)
		n.rI = n.chiI * ai * l.fyi / f.GammaM1
	}
	n.res, n.gov = x.share(n.rO, n.rI)
	return n
}

func (x *flangeEval) bucklingU() float64 {
	return utilisation(x.e.act.Flange.Compression, x.bucklingN().res)
}

func (x *flangeEval) buckling(d *checkDef, full bool) Check {
	e, l, n := x.e, x.l, x.bucklingN()
	c := d.check(x.e, "kN", e.act.Flange.Compression, n.res, toKN)
	if !full {
		return c
	}
	c.Formula = "Fc,Ed ≤ Nb,Rd = min over plates of (χ·A·fy/γM1)·ΣA/A, Lcr = 0.6·L, i = t/√12, λ̄ = Lcr/(i·λ1), curve c (α = 0.49)"
	c.Substituted = sprintf("L = max(p1, 2e1 + gap) = %s mm; outer: λ̄ = %s, χ = %s, Nb,Rd = %s kN", mm(n.lf), f3(n.lbO), f3(n.chiO), kN(n.rO))
	if l.inner {
		c.Substituted += sprintf("; inner: λ̄ = %s, χ = %s, Nb,Rd = %s kN", f3(n.lbI), f3(n.chiI), kN(n.rI))
	}
	c.Substituted += x.shareText(n.rO, n.rI)
	c.Substituted += sprintf("; Fc,Ed = %s kN ≤ %s kN", kN(e.act.Flange.Compression), kN(n.res))
	tmin, fy := l.to, l.fyo
	if l.inner && l.ti < tmin {
		tmin, fy = l.ti, l.fyi
	}
	c.Inputs = []Input{in("L", n.lf, "mm"), in("t,min", tmin, "mm"), in("E", e.e, "N/mm²")}
	c.Note = "governed by the " + n.gov + "; " + e.act.Flange.CompressionState
	if l.rows > 1 && l.p1/tmin < 9*Epsilon(fy) {
		c.Note += sprintf("; p1/t = %s < 9ε = %s, so Table 3.3 does not require the check between rows; the span across the joint is checked all the same (common practice)",
			f2(l.p1/tmin), f2(9*Epsilon(fy)))
	}
	return c
}

type beamNetNums struct {
	af, afNet, gross, net, res float64
	// With oversize holes the compression flange is checked too: EN 1993-1-1 6.2.4(3) and
	// 6.2.5(6) deduct oversize holes in compression, Nc,net,Rd = Af,net·fy/γM0.
	oversize          bool
	compNet           float64 // Af,net·fy/γM0 [N] (oversize holes only)
	demand, governing float64 // the governing demand and resistance [N]
	compression       bool    // the compression flange governs
}

func (x *flangeEval) beamNetN() (n beamNetNums) {
	e, f := x.e, &x.e.f
	s := e.m.Section
	n.af = s.B * s.Tf
	n.afNet = (s.B - float64(x.l.cols)*x.b.d0) * s.Tf
	n.gross = n.af * e.m.FyFlange / f.GammaM0
	if e.cat == CategoryC {
		n.net = n.afNet * e.m.FyFlange / f.GammaM0
	} else {
		n.net = 0.9 * n.afNet * e.m.FuFlange / f.GammaM2
	}
	n.res = min(n.gross, n.net)
	n.demand, n.governing = e.act.Flange.Tension, n.res
	if n.oversize = e.holes != NormalHoles; n.oversize {
		n.compNet = max(0, n.afNet) * e.m.FyFlange / f.GammaM0
		if utilisation(e.act.Flange.Compression, n.compNet) > utilisation(n.demand, n.governing) {
			n.demand, n.governing, n.compression = e.act.Flange.Compression, n.compNet, true
		}
	}
	return n
}

func (x *flangeEval) beamNetU() float64 {
	n := x.beamNetN()
	return utilisation(n.demand, n.governing)
}

func (x *flangeEval) beamNet(d *checkDef, full bool) Check {
	e, l, n := x.e, x.l, x.beamNetN()
	s := e.m.Section
	c := d.check(x.e, "kN", n.demand, n.governing, toKN)
	if !full {
		return c
	}
	if e.cat == CategoryC {
		c.Formula = "Ft,Ed ≤ min(Af·fy/γM0, Af,net·fy/γM0) (category C, 6.2.3(4))"
	} else {
		c.Formula = "Ft,Ed ≤ min(Af·fy/γM0, 0.9·Af,net·fu/γM2)"
	}
	if n.oversize {
		c.Formula += "; Fc,Ed ≤ Af,net·fy/γM0 (oversize holes deducted in compression, 6.2.4(3), 6.2.5(6))"
	}
	c.Substituted = sprintf("Af = %s×%s = %s mm², Af,net = (%s − %d×%s)×%s = %s mm²; min(%s, %s) = %s kN; Ft,Ed = %s kN",
		mm(s.B), mm(s.Tf), mm(n.af), mm(s.B), l.cols, mm(x.b.d0), mm(s.Tf), mm(n.afNet), kN(n.gross), kN(n.net), kN(n.res), kN(e.act.Flange.Tension))
	if n.oversize {
		c.Substituted += sprintf("; compression: %s × %s / %s = %s kN; Fc,Ed = %s kN",
			mm(n.afNet), fnum(e.m.FyFlange, 0), f2(e.f.GammaM0), kN(n.compNet), kN(e.act.Flange.Compression))
	}
	c.Inputs = []Input{in("fy", e.m.FyFlange, "N/mm²"), in("fu", e.m.FuFlange, "N/mm²")}
	if 0.9*n.afNet*e.m.FuFlange/e.f.GammaM2 >= n.gross {
		c.Note = "6.2.5(4): 0.9·Af,net·fu/γM2 ≥ Af·fy/γM0, the holes need not be deducted in the beam's bending resistance; " + e.act.Flange.TensionState
	} else {
		c.Note = "6.2.5(4): 0.9·Af,net·fu/γM2 < Af·fy/γM0, the holes reduce the beam's bending resistance at the splice; " + e.act.Flange.TensionState
	}
	if n.compression {
		c.Note += "; the compression flange governs (oversize holes), " + e.act.Flange.CompressionState
	}
	return c
}

type shearNums struct {
	lj, bLf, bp, share, perBolt, res float64
	np, gov                          int // planes, and the governing one
}

// planeShares are the shares of the flange force through the outer plane and, with inner
// plates, the inner plane.
func (x *flangeEval) planeShares() [2]float64 {
	if !x.l.inner {
		return [2]float64{1, 0}
	}
	ao, ai, sum := x.areas()
	return [2]float64{ao / sum, ai / sum}
}

// boltShear is one bolt's shear resistance in flange-force terms, before βLf and βp: each
// shear plane carries the share of the plate on its side, so the bolt gives way at the least
// Fv,Rd,i/s_i over its planes (Fv,Rd,i from the plane's thread or shank, groupFit); gov is
// that plane.
func (x *flangeEval) boltShear() float64 {
	r, _ := x.boltShearGov()
	return r
}

func (x *flangeEval) boltShearGov() (res float64, gov int) {
	f := x.l.fit
	if !x.l.inner {
		return f.fv[0], 0
	}
	ao, ai, sum := x.areas()
	ro, ri := f.fv[0]*sum/ao, f.fv[1]*sum/ai
	if ri < ro {
		return ri, 1
	}
	return ro, 0
}

func (x *flangeEval) shearN() (n shearNums) {
	l, b := x.l, x.b
	if l.rows > 1 {
		n.lj = float64(l.rows-1) * l.p1
	}
	n.bLf = LongJointFactor(n.lj, b.d)
	n.bp = PackingFactor(l.packing, b.d)
	n.np = x.planes()
	n.perBolt, n.gov = x.boltShearGov()
	n.share = x.planeShares()[n.gov]
	n.res = n.bLf * n.bp * n.perBolt
	return n
}

func (x *flangeEval) shearU() float64 { return utilisation(x.e.act.Flange.Bolt/x.nb(), x.shearN().res) }

func (x *flangeEval) shear(d *checkDef, full bool) Check {
	e, l, b, n := x.e, x.l, x.b, x.shearN()
	demand := e.act.Flange.Bolt / x.nb()
	c := d.check(x.e, "kN", demand, n.res, toKN)
	if !full {
		return c
	}
	f, st := l.fit, e.flangeStack(l)
	c.Formula = "Fv,Ed = Ff,Ed/n ≤ βLf·βp·min over the shear planes of Fv,Rd,i/s_i, s_i = the share of Ff,Ed through plane i, Fv,Rd,i = αv·fub·A/γM2 (A = As, αv of the class in the thread; A = πd²/4, αv = 0.6 on the shank)"
	shares := x.planeShares()
	planes, ratios := make([]string, n.np), make([]string, n.np)
	for i := range planes {
		planes[i] = planeText(b, f, &st, i, e.f.GammaM2) + sprintf(", s = %s", f3(shares[i]))
		ratios[i] = sprintf("%s/%s", kN(f.fv[i]), f3(shares[i]))
	}
	per := sprintf("%s = %s kN", ratios[0], kN(n.perBolt))
	if n.np > 1 {
		per = sprintf("min(%s) = %s kN at %s", strings.Join(ratios, ", "), kN(n.perBolt), st.plane[n.gov])
	}
	c.Substituted = sprintf("Fv,Ed = %s/%d = %s kN; %s (%s); per bolt %s; %s × %s × %s = %s kN",
		kN(e.act.Flange.Bolt), l.rows*l.cols, kN(demand), strings.Join(planes, "; "), ruleText(b, f),
		per, f3(n.bLf), f3(n.bp), kN(n.perBolt), kN(n.res))
	c.Inputs = []Input{in("n", x.nb(), "bolts"), in("n_p", float64(n.np), "planes"), in("s", n.share, ""), in("Lj", n.lj, "mm"), in("βLf", n.bLf, ""), in("tp", l.packing, "mm"),
		in("βp", n.bp, ""), in("Fv,Rd", f.fv[n.gov]*toKN, "kN")}
	c.Note = "per bolt, bolts share the flange force equally; each shear plane carries the force of the plate on its side (shares by area, as the plate checks); governed by " + st.plane[n.gov] + "; "
	if n.lj > 15*b.d {
		c.Note += sprintf("long joint Lj = %s mm > 15d = %s mm; ", mm(n.lj), mm(15*b.d))
	}
	c.Note += "worse of " + e.act.Flange.TensionState + " and " + e.act.Flange.CompressionState
	return c
}

type bearingBeamNums struct {
	k1, ad, ab, res float64
	lap             bool // single lap with one bolt row: 3.6.1(10) limit applied
}

// singleLapOneRow: an outer plate alone with one row each side is a single lap joint with one
// bolt row, where EN 1993-1-8 3.6.1(10) limits Fb,Rd to 1.5·fu·d·t/γM2.
func (x *flangeEval) singleLapOneRow() bool { return !x.l.inner && x.l.rows == 1 }

func (x *flangeEval) bearingBeamN() (n bearingBeamNums) {
	e, b := x.e, x.b
	p := x.beamPly()
	n.k1 = p.k1Min(b.d0)
	n.ad = x.alphaDBeam()
	n.ab = AlphaB(n.ad, b.class.Fub, e.m.FuFlange)
	n.res = BearingResistance(n.k1, n.ab, e.m.FuFlange, b.d, e.m.Section.Tf, e.f.GammaM2, b.hf)
	if x.singleLapOneRow() {
		n.lap = true
		n.res = min(n.res, 1.5*e.m.FuFlange*b.d*e.m.Section.Tf/e.f.GammaM2)
	}
	return n
}

func (x *flangeEval) bearingBeamU() float64 {
	return utilisation(x.e.act.Flange.Bolt/x.nb(), x.bearingBeamN().res)
}

func (x *flangeEval) bearingBeam(d *checkDef, full bool) Check {
	e, l, b, n := x.e, x.l, x.b, x.bearingBeamN()
	s := e.m.Section
	demand := e.act.Flange.Bolt / x.nb()
	c := d.check(x.e, "kN", demand, n.res, toKN)
	if !full {
		return c
	}
	c.Formula = "Fb,Ed = Ff,Ed/n ≤ Fb,Rd = k1·αb·fu·d·t/γM2 (smallest over the bolts; group = n × smallest, 3.7)"
	c.Substituted = sprintf("k1 = %s, αd = %s, αb = min(αd, %s/%s, 1) = %s; Fb,Rd = %s×%s×%s×%s×%s/%s",
		f3(n.k1), f3(n.ad), fnum(b.class.Fub, 0), fnum(e.m.FuFlange, 0), f3(n.ab), f3(n.k1), f3(n.ab), fnum(e.m.FuFlange, 0), mm(b.d), mm(s.Tf), f2(e.f.GammaM2))
	if b.hf != 1 {
		c.Substituted += sprintf(" × %s (oversize holes)", f2(b.hf))
	}
	c.Substituted += sprintf(" = %s kN; Fb,Ed = %s kN", kN(n.res), kN(demand))
	p := x.beamPly()
	c.Inputs = []Input{in("e1", l.e1, "mm"), in("p1", l.p1, "mm"), in("e2", s.B/2-p.y[p.n-1], "mm"), in("d0", b.d0, "mm"), in("t", s.Tf, "mm")}
	c.Note = "beam flange; e1 to the beam end; the load reverses, so end and inner terms both apply"
	if n.lap {
		c.Note += sprintf("; single lap with one bolt row: Fb,Rd ≤ 1.5·fu·d·t/γM2 = %s kN (3.6.1(10)), washers under head and nut", kN(1.5*e.m.FuFlange*b.d*s.Tf/e.f.GammaM2))
	}
	return c
}

type bearingPlateNums struct {
	ad, k1o, abo, rO, k1i, abi, rI, res float64
	gov                                 string
}

func (x *flangeEval) bearingPlateN() (n bearingPlateNums) {
	e, l, b := x.e, x.l, x.b
	n.ad = x.alphaDPlate()
	po := x.outerPly()
	n.k1o = po.k1Min(b.d0)
	n.abo = AlphaB(n.ad, b.class.Fub, l.fuo)
	n.rO = BearingResistance(n.k1o, n.abo, l.fuo, b.d, l.to, e.f.GammaM2, b.hf)
	if x.singleLapOneRow() {
		n.rO = min(n.rO, 1.5*l.fuo*b.d*l.to/e.f.GammaM2)
	}
	if l.inner {
		pi := x.innerPly()
		n.k1i = pi.k1Min(b.d0)
		n.abi = AlphaB(n.ad, b.class.Fub, l.fui)
		n.rI = BearingResistance(n.k1i, n.abi, l.fui, b.d, l.ti, e.f.GammaM2, b.hf)
	}
	n.res, n.gov = x.share(n.rO, n.rI)
	return n
}

func (x *flangeEval) bearingPlateU() float64 {
	return utilisation(x.e.act.Flange.Bolt/x.nb(), x.bearingPlateN().res)
}

func (x *flangeEval) bearingPlate(d *checkDef, full bool) Check {
	e, l, b, n := x.e, x.l, x.b, x.bearingPlateN()
	demand := e.act.Flange.Bolt / x.nb()
	c := d.check(x.e, "kN", demand, n.res, toKN)
	if !full {
		return c
	}
	c.Formula = "Fb,Ed = Ff,Ed/n ≤ min over plates of Fb,Rd·ΣA/A, Fb,Rd = k1·αb·fu·d·t/γM2"
	c.Substituted = sprintf("αd = %s; outer: k1 = %s, αb = %s, Fb,Rd = %s kN", f3(n.ad), f3(n.k1o), f3(n.abo), kN(n.rO))
	if l.inner {
		c.Substituted += sprintf("; inner: k1 = %s, αb = %s, Fb,Rd = %s kN", f3(n.k1i), f3(n.abi), kN(n.rI))
	}
	c.Substituted += x.shareText(n.rO, n.rI)
	c.Substituted += sprintf("; Fb,Ed = %s kN ≤ %s kN", kN(demand), kN(n.res))
	c.Inputs = []Input{in("e1", l.e1, "mm"), in("p1", l.p1, "mm"), in("e2", l.e2, "mm"), in("gauge", l.g, "mm"), in("d0", b.d0, "mm")}
	c.Note = "governed by the " + n.gov + "; plates share the bolt force by area"
	if x.singleLapOneRow() {
		c.Note += "; single lap with one bolt row: Fb,Rd ≤ 1.5·fu·d·t/γM2 (3.6.1(10)), washers under head and nut"
	}
	return c
}

// slipN is the slip resistance per bolt in flange-force terms: each friction surface carries
// the share of the plate on its side, so the surface with the larger share slips first.
func (x *flangeEval) slipN() float64 { return x.b.fsPerSur / x.maxShare() }

func (x *flangeEval) slipU() float64 { return utilisation(x.e.act.Flange.SlipBolt/x.nb(), x.slipN()) }

func (x *flangeEval) slip(d *checkDef, full bool) Check {
	e, l, b := x.e, x.l, x.b
	ns := x.planes()
	res := x.slipN()
	demand := e.act.Flange.SlipBolt / x.nb()
	c := d.check(x.e, "kN", demand, res, toKN)
	if !full {
		return c
	}
	c.Formula = "Fv,Ed/n ≤ Fs,Rd/s, Fs,Rd = ks·μ·Fp,C/" + e.slipGammaName() + " per friction surface, s = the larger share of the force through one surface, Fp,C = 0.7·fub·As"
	c.Substituted = sprintf("Fp,C = 0.7×%s×%s = %s kN; Fs,Rd = %s×%s×%s/%s = %s kN per surface; %s; %s / %s = %s kN; Fv,Ed = %s/%d = %s kN",
		fnum(b.class.Fub, 0), mm(b.size.As), kN(b.fpC), f2(e.holes.Ks()), f2(e.mu), kN(b.fpC), f2(e.gammaS), kN(b.fsPerSur),
		strings.Replace(x.planeText(), "plane", "surface", -1), kN(b.fsPerSur), f3(x.maxShare()), kN(res),
		kN(e.act.Flange.SlipBolt), l.rows*l.cols, kN(demand))
	c.Inputs = []Input{in("μ", e.mu, ""), in("ks", e.holes.Ks(), ""), in("n_s", float64(ns), "surfaces"), in("s", x.maxShare(), "")}
	c.Note = "each friction surface carries the share of the plate on its side (by area); friction class " + string(e.fc)
	if !b.class.Preloadable {
		c.Note += "; class " + b.class.Name + " cannot be preloaded (see detail.preload)"
	}
	return c
}

type blockNums struct {
	lv, antO, anvO, rO, antI, anvI, rI, res float64
	concO, concI                            bool
	gov                                     string
}

func (x *flangeEval) blockN() (n blockNums) {
	l, b, f := x.l, x.b, &x.e.f
	n.lv = x.shearLength()
	po := x.outerPly()
	var bo, bi float64
	bo, n.antO, n.anvO, n.concO = po.block(b.d0, n.lv, l.fyo, l.fuo, f.GammaM0, f.GammaM2)
	n.rO = bo * l.to
	if l.inner {
		pi := x.innerPly()
		bi, n.antI, n.anvI, n.concI = pi.block(b.d0, n.lv, l.fyi, l.fui, f.GammaM0, f.GammaM2)
		n.rI = 2 * bi * l.ti
	}
	n.res, n.gov = x.share(n.rO, n.rI)
	return n
}

func (x *flangeEval) blockU() float64 { return utilisation(x.e.act.Flange.Tension, x.blockN().res) }

func (x *flangeEval) block(d *checkDef, full bool) Check {
	e, l, n := x.e, x.l, x.blockN()
	c := d.check(x.e, "kN", e.act.Flange.Tension, n.res, toKN)
	if !full {
		return c
	}
	c.Formula = "Ft,Ed ≤ min over plates and tear-out patterns of Veff·ΣA/A; Veff,1 = fu·Ant/γM2 + fy·Anv/(√3·γM0), Veff,2 = 0.5·fu·Ant/γM2 + fy·Anv/(√3·γM0)"
	c.Substituted = sprintf("Lv = e1 + (rows − 1)·p1 − (rows − 0.5)·d0 = %s mm; outer: Ant = %s×%s mm², Anv = %s×%s mm², %s → %s kN",
		mm(n.lv), mm(n.antO), mm(l.to), mm(n.anvO), mm(l.to), veffName(n.concO), kN(n.rO))
	if l.inner {
		c.Substituted += sprintf("; inner (×2): Ant = %s×%s mm², Anv = %s×%s mm², %s → %s kN", mm(n.antI), mm(l.ti), mm(n.anvI), mm(l.ti), veffName(n.concI), kN(n.rI))
	}
	c.Substituted += x.shareText(n.rO, n.rI)
	c.Substituted += sprintf("; Ft,Ed = %s kN ≤ %s kN", kN(e.act.Flange.Tension), kN(n.res))
	c.Inputs = []Input{in("Lv", n.lv, "mm"), in("d0", x.b.d0, "mm")}
	c.Note = "governed by the " + n.gov + "; " + e.act.Flange.TensionState
	return c
}

func veffName(concentric bool) string {
	if concentric {
		return "Veff,1"
	}
	return "Veff,2"
}

type beamBlockNums struct {
	lv, ant, anv, res float64
	conc              bool
}

func (x *flangeEval) beamBlockN() (n beamBlockNums) {
	e, b, f := x.e, x.b, &x.e.f
	n.lv = x.shearLength()
	p := x.beamPly()
	var r float64
	r, n.ant, n.anv, n.conc = p.block(b.d0, n.lv, e.m.FyFlange, e.m.FuFlange, f.GammaM0, f.GammaM2)
	n.res = r * e.m.Section.Tf
	return n
}

func (x *flangeEval) beamBlockU() float64 {
	return utilisation(x.e.act.Flange.Tension, x.beamBlockN().res)
}

func (x *flangeEval) beamBlock(d *checkDef, full bool) Check {
	e, n := x.e, x.beamBlockN()
	s := e.m.Section
	c := d.check(x.e, "kN", e.act.Flange.Tension, n.res, toKN)
	if !full {
		return c
	}
	c.Formula = "Ft,Ed ≤ Veff over the flange outstands (the strip holding the web cannot tear out)"
	c.Substituted = sprintf("Ant = %s×%s mm², Anv = %s×%s mm², %s = %s kN; Ft,Ed = %s kN",
		mm(n.ant), mm(s.Tf), mm(n.anv), mm(s.Tf), veffName(n.conc), kN(n.res), kN(e.act.Flange.Tension))
	c.Inputs = []Input{in("Lv", n.lv, "mm"), in("fy", e.m.FyFlange, "N/mm²"), in("fu", e.m.FuFlange, "N/mm²")}
	c.Note = "beam flange end; " + e.act.Flange.TensionState
	return c
}
