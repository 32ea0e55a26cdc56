package splice

import (
	"fmt"
	"math"
	"strings"
)

// The bolting assembly of each bolt group of a splice (SelectAssembly) and what it means for the
// shear checks.
//
// # The plies and the head side
//
// A flange bolt clamps, head side first: the outer cover plate, the packing (when there is one),
// the beam flange and the inner plate; the head sits on the outer plate, the nut under the
// flange (the usual arrangement: the nut is turned from inside the section, common practice).
// A web bolt clamps a web plate, its packing, the beam web, the other packing and the other web
// plate, with the head on the first plate (both plates are alike, so the side does not matter).
//
// # The shear planes
//
// The shear planes are where the beam's part meets the plies on either side of it: in the
// flange the face of the beam flange towards the outer plate and, with inner plates, the face
// towards the inner plates; in the web both faces of the beam web. Where a packing lies between,
// the plane is taken at the beam's face, the interface further from the head, which meets the
// thread first: the conservative place. Each plane's distance from the head's bearing face
// (with the thickest head washer, as SelectAssembly takes it) is compared with ls,min of the
// chosen length (Assembly.ThreadsAt): beyond it the thread is in the plane. EN 1993-1-8
// Table 3.4 then gives Fv,Rd = αv·fub·As/γM2 with the class's αv (0.6 or 0.5), and on the
// plain shank Fv,Rd = 0.6·fub·(πd²/4)/γM2 for every class.
//
// # The rule
//
// ShearPlaneRule says whether the checks follow the chosen length (the default) or assume the
// thread, or the shank, in every plane whatever the length. Where no standard length fits the
// grip, every plane is taken in the thread and the detailing check detail.bolt.length fails.

// ShearPlaneRule says where the shear checks take the shear planes of a splice's bolts.
type ShearPlaneRule string

// The rules.
const (
	// PlanesFromLength (the zero value) places each plane against the plain shank of the bolt
	// length chosen for its group (ls,min of the product standard, EN 1090-2 8.2.2).
	PlanesFromLength ShearPlaneRule = ""
	// PlanesInThread takes the thread in every plane, whatever the length (conservative).
	PlanesInThread ShearPlaneRule = "thread"
	// PlanesOnShank takes the plain shank in every plane, whatever the length: the user vouches
	// for it (bolts specified with longer plain shanks, say).
	PlanesOnShank ShearPlaneRule = "shank"
)

// ParseShearPlaneRule reads a rule: "length" (or ""), "thread", "shank".
func ParseShearPlaneRule(s string) (ShearPlaneRule, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "", "length":
		return PlanesFromLength, nil
	case "thread", "threads":
		return PlanesInThread, nil
	case "shank":
		return PlanesOnShank, nil
	}
	return "", fmt.Errorf("%q is not one of length, thread, shank", s)
}

// String names the rule as the job file writes it: "length", "thread" or "shank".
func (r ShearPlaneRule) String() string {
	if r == PlanesFromLength {
		return "length"
	}
	return string(r)
}

// Ply is one clamped part of a bolt group.
type Ply struct {
	Name      string  // "outer plate", "packing", "beam flange", "inner plate", "web plate", "beam web"
	Thickness float64 // [mm]
}

// PlaneUse is one shear plane of a bolt group as the shear check takes it.
type PlaneUse struct {
	Name     string  // the interface, e.g. "outer plate / beam flange"
	Position float64 // from the head's bearing face, the thickest head washer included [mm]
	OnThread bool    // beyond ls,min of the chosen bolt; true where no standard length fits
	Threaded bool    // as the shear check takes it: OnThread, or the rule's assumption
	Area     float64 // A: As in the thread, πd²/4 on the shank [mm²]
	AlphaV   float64 // αv of EN 1993-1-8 Table 3.4
	FvRd     float64 // Fv,Rd = αv·fub·A/γM2 [N]
}

// GroupAssembly is the bolting assembly of one bolt group of a splice: the plies it clamps,
// the assembly chosen for them and where each shear plane meets the bolt.
type GroupAssembly struct {
	Group    string         // "flange" or "web"
	Count    int            // assemblies of the group in the splice: both flanges, or the web, both sides of the joint
	Plies    []Ply          // head side first
	Rule     ShearPlaneRule // how the shear check places the planes
	Assembly Assembly       // the chosen assembly; the zero value when Err is set
	// Err says why no standard length fits the grip (an *AssemblyLengthError); the check
	// detail.bolt.length then fails and every plane is taken in the thread.
	Err error
	// Mass is one assembly's mass [kg]: Assembly.Mass, or where no length fits that of the
	// bolt the check reports, lengthened by the shortfall when the series is too short (for
	// piece masses only).
	Mass   float64
	Planes []PlaneUse
}

// plyStack is the plies of one bolt group and the two faces of the beam's part among them.
type plyStack struct {
	t      [5]float64
	name   [5]string
	n      int
	after  [2]int    // plane i lies after ply after[i]
	plane  [2]string // names of the planes
	np     int
	group  string
	grip   float64
	planeZ [2]float64 // from the head side of the first ply
}

func (s *plyStack) add(name string, t float64) {
	s.t[s.n], s.name[s.n] = t, name
	s.n++
	s.grip += t
}

// mark puts a shear plane after the last ply added.
func (s *plyStack) mark(name string) {
	s.after[s.np], s.plane[s.np], s.planeZ[s.np] = s.n-1, name, s.grip
	s.np++
}

// flangePlies are the plies of a flange bolt, head on the outer plate.
func flangePlies(to, packing, tf, ti float64, inner bool) plyStack {
	s := plyStack{group: "flange"}
	s.add("outer plate", to)
	if packing > 0 {
		s.add("packing", packing)
	}
	s.mark("outer plate / beam flange")
	s.add("beam flange", tf)
	if inner {
		s.mark("beam flange / inner plate")
		s.add("inner plate", ti)
	}
	return s
}

// webPlies are the plies of a web bolt, head on one web plate.
func webPlies(tp, packing, tw float64) plyStack {
	s := plyStack{group: "web"}
	s.add("web plate", tp)
	if packing > 0 {
		s.add("packing", packing)
	}
	s.mark("web plate / beam web")
	s.add("beam web", tw)
	if packing > 0 {
		s.add("packing", packing)
	}
	s.mark("beam web / web plate")
	s.add("web plate", tp)
	return s
}

// groupFit is the assembly of one bolt group as the checks and the cost use it.
type groupFit struct {
	lengthFit
	shankMin float64
	np       int
	z        [2]float64 // planes from the head's bearing face [mm]
	onThread [2]bool    // beyond ls,min (true where no length fits)
	threaded [2]bool    // as the checks take them
	fv       [2]float64 // Fv,Rd per plane [N]
	mass     float64    // one assembly [kg]
}

// newGroupFit chooses the length for a group's plies and places its shear planes.
func newGroupFit(b *boltData, s *plyStack) groupFit {
	g := groupFit{lengthFit: b.asm.fit(s.grip), np: s.np}
	head := float64(b.asm.nh) * g.data.WasherHMax
	if g.ok {
		g.shankMin = g.data.ShankMin(g.length)
	}
	for i := 0; i < s.np; i++ {
		g.z[i] = head + s.planeZ[i]
		g.onThread[i] = !g.ok || g.z[i] > g.shankMin+1e-9
		switch b.rule {
		case PlanesInThread:
			g.threaded[i] = true
		case PlanesOnShank:
			g.threaded[i] = false
		default:
			g.threaded[i] = g.onThread[i]
		}
		g.fv[i] = b.fvThread
		if !g.threaded[i] {
			g.fv[i] = b.fvShank
		}
	}
	g.mass = fitMass(b, &g.lengthFit)
	return g
}

// fitMass is one assembly's mass [kg] at the length the fit reports (lengthFit.length); where
// the grip is too long for the series, the longest bolt lengthened by the shortfall (at the
// shank diameter, at the pitch diameter when fully threaded): so that the mass never falls as
// the grip grows (TestAssemblyMassGrowsWithTheGrip).
func fitMass(b *boltData, f *lengthFit) float64 {
	d, extra := f.data, 0.0
	if f.tooLong {
		extra = max(0, f.requiredLength()-f.length)
	}
	bolt, nut, washer := assemblyMasses(d, f.length)
	if extra > 0 {
		dia := d.D
		if d.rule.thread == threadFull {
			dia = d.D - 0.649519*d.P
		}
		bolt += math.Pi / 4 * dia * dia * extra * steelDensity
	}
	return bolt + nut + float64(b.asm.nh+b.asm.nn)*washer
}

// groupAssembly describes a group's fit for the result.
func groupAssembly(b *boltData, s *plyStack, g *groupFit, count int) GroupAssembly {
	out := GroupAssembly{Group: s.group, Count: count, Rule: b.rule, Mass: g.mass}
	plies := make([]float64, s.n)
	for i := 0; i < s.n; i++ {
		out.Plies = append(out.Plies, Ply{Name: s.name[i], Thickness: s.t[i]})
		plies[i] = s.t[i]
	}
	if g.ok {
		out.Assembly = b.asm.build(&g.lengthFit, plies)
		if g.isAlt {
			out.Assembly.Note = "grip too short for a partly threaded ISO 4014 bolt of the series: fully threaded ISO 4017 used"
		}
	} else {
		out.Err = g.lengthError()
	}
	for i := 0; i < g.np; i++ {
		p := PlaneUse{Name: s.plane[i], Position: g.z[i], OnThread: g.onThread[i], Threaded: g.threaded[i], FvRd: g.fv[i],
			Area: b.size.ShankArea(), AlphaV: 0.6}
		if p.Threaded {
			p.Area, p.AlphaV = b.size.As, b.class.AlphaV
		}
		out.Planes = append(out.Planes, p)
	}
	return out
}

// planeText describes a plane for the shear checks' sheets, with Fv,Rd worked out.
func planeText(b *boltData, g *groupFit, s *plyStack, i int, gammaM2 float64) string {
	where, av, area, a := "shank", 0.6, "πd²/4", b.size.ShankArea()
	if g.threaded[i] {
		where, av, area, a = "thread", b.class.AlphaV, "As", b.size.As
	}
	return sprintf("%s at z = %s mm on the %s (A = %s): Fv,Rd = %s×%s×%s/%s = %s kN", s.plane[i], mm(g.z[i]), where, area,
		f2(av), fnum(b.class.Fub, 0), mm(a), f2(gammaM2), kN(g.fv[i]))
}

// ruleText says how the planes were placed.
func ruleText(b *boltData, g *groupFit) string {
	switch {
	case b.rule == PlanesInThread:
		return "thread assumed in every plane"
	case b.rule == PlanesOnShank:
		return "plain shank assumed in every plane"
	case !g.ok:
		return "no standard length fits (detail.bolt.length): thread taken in every plane"
	}
	return sprintf("planes against ls,min = %s mm of the %s×%s %s bolt", mm(g.shankMin), b.size.Name, mm(g.length), g.data.BoltStandard)
}

// lengthNames are the names of the two length rules of a group (constants, so that the
// search's utilisations allocate nothing).
type lengthNames struct{ least, clamp string }

var (
	flangeLengthNames = lengthNames{"flange bolt least length", "flange clamp Σt,min"}
	webLengthNames    = lengthNames{"web bolt least length", "web clamp Σt,min"}
)

// lengthRules are the EN 1090-2 8.2.2 rules of a group's length: the protrusion at the
// least-material length l − Δl (ISO 4759-1), and the thread reaching into the clamp. Where no
// length fits, the length shown is the longest of the series (the protrusion fails) or the
// shortest with room for the protrusion (the thread stops short of the clamp).
func lengthRules(n lengthNames, g *groupFit, full bool) rules {
	r := rules{full: full}
	d := g.data
	l := g.length
	least := l - d.LengthTolerance(l)
	r.atLeast(n.least, least, g.requiredLength(), "Σt,max + m + P")
	r.atLeast(n.clamp, g.cMin, g.lo, "lg,max + n·P")
	if full {
		// the lines in the assembly's own terms, each still ending in its ok or FAILS
		_, mark0, _ := strings.Cut(r.lines[0], " mm ")
		_, mark1, _ := strings.Cut(r.lines[1], " mm ")
		r.lines[0] = sprintf("%s×%s (%s) least length l − Δl = %s − %s = %s ≥ Σt,max + m + P = %s + %s + %s = %s mm %s",
			d.Size, mm(l), d.BoltStandard, mm(l), f2(d.LengthTolerance(l)), mm(least), mm(g.cMax), mm(d.NutM), mm(d.P), mm(g.requiredLength()), mark0)
		r.lines[1] = sprintf("clamp Σt,min = %s ≥ lg,max + n·P = %s + %s×%s = %s mm %s",
			mm(g.cMin), mm(d.ThreadStart(l)), fnum(d.rule.clearThreads, 0), mm(d.P), mm(g.lo), mark1)
	}
	return r
}

func (x *flangeEval) boltLengthU() float64 {
	r := lengthRules(flangeLengthNames, x.l.fit, false)
	return r.u
}

func (x *flangeEval) boltLength(d *checkDef, full bool) Check {
	r := lengthRules(flangeLengthNames, x.l.fit, full)
	return r.check(x.e, d)
}

func (x *webEval) boltLengthU() float64 {
	r := lengthRules(webLengthNames, x.l.fit, false)
	return r.u
}

func (x *webEval) boltLength(d *checkDef, full bool) Check {
	r := lengthRules(webLengthNames, x.l.fit, full)
	return r.check(x.e, d)
}

// flangeStack is the ply stack of a flange layout.
func (e *env) flangeStack(fl *flangeLayout) plyStack {
	return flangePlies(fl.to, fl.packing, e.m.Section.Tf, fl.ti, fl.inner)
}

// webStack is the ply stack of a web layout.
func (e *env) webStack(wl *webLayout) plyStack {
	return webPlies(wl.tp, wl.packing, e.m.Section.Tw)
}

// assemblySpec is the spec of a bolt's assemblies in a category, system as given ("" for the
// default of the category and class). A class that cannot be preloaded takes a non-preloaded
// system by default even in a slip-resistant category: detail.preload fails there, and the
// assembly still has a length to report.
func assemblySpec(size BoltSize, class BoltClass, cat Category, system AssemblySystem) (resolvedSpec, error) {
	preloaded := cat.Preloaded() && (class.Preloadable || system != "")
	return resolveBoltSystem(AssemblySpec{Size: size.Name, Class: class.Name, Preloaded: preloaded, System: system})
}
