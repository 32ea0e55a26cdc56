package splice

import (
	"fmt"
	"math"
)

// boltData caches one bolt size and class with the resistances that do not depend on the plies,
// and the chooser of its assemblies (the plies decide the length: groupFit).
type boltData struct {
	size     BoltSize
	class    BoltClass
	rule     ShearPlaneRule
	system   AssemblySystem // as given; "" for the default of the category and class
	asm      assemblyChooser
	d, d0    float64
	fvThread float64 // Fv,Rd per shear plane in the thread [N]
	fvShank  float64 // Fv,Rd per shear plane on the shank [N]
	fvMax    float64 // the larger Fv,Rd per plane the rule allows (an upper bound for the sizing) [N]
	fpC      float64 // Fp,C [N]
	fsPerSur float64 // Fs,Rd per friction surface in the slip state [N] (0 for category A)
	hf       float64 // bearing factor for the hole type
	key      [2]int  // size and class index in the design space
}

// env is everything fixed for one evaluation: member, factors, actions and the splice type.
type env struct {
	m       Member
	f       PartialFactors
	det     Detailing
	act     Actions
	cat     Category
	fc      FrictionClass
	mu      float64
	holes   HoleType
	gap     float64
	gammaS  float64   // γM3,ser (B) or γM3 (C)
	states  [3]string // the limit state of each stateKind: StateULS, the slip state (SLS in category B), StateDetailing
	e       float64   // Young's modulus [N/mm²]
	rFit    float64   // r (or the weld leg √2·a) + clearance [mm]
	minimum MinimumAction
}

// newBoltData prepares a bolt; the error is an assembly system the class or category cannot
// have (HV in class 8.8, a non-preloaded system in category B).
func newBoltData(e *env, size BoltSize, class BoltClass, rule ShearPlaneRule, system AssemblySystem) (boltData, error) {
	b := boltData{size: size, class: class, rule: rule, system: system, d: size.D, d0: size.HoleDiameter(e.holes)}
	spec, err := assemblySpec(size, class, e.cat, system)
	if err != nil {
		return b, err
	}
	if b.asm, err = newAssemblyChooser(spec); err != nil {
		return b, err
	}
	b.fvThread = ShearResistancePerPlane(size, class, true, e.f.GammaM2)
	b.fvShank = ShearResistancePerPlane(size, class, false, e.f.GammaM2)
	b.fvMax = max(b.fvThread, b.fvShank)
	if rule == PlanesInThread {
		b.fvMax = b.fvThread
	}
	b.fpC = PreloadForce(class.Fub, size.As)
	if e.cat.Preloaded() {
		b.fsPerSur = SlipResistance(e.holes.Ks(), 1, e.mu, b.fpC, e.gammaS)
	}
	b.hf = e.holes.BearingFactor()
	return b, nil
}

func newEnv(p *Problem, cat Category, fc FrictionClass, holes HoleType, gap float64, det Detailing) (*env, error) {
	e := &env{m: p.Member, f: p.Factors.resolved(), det: det.resolved(), cat: cat, fc: fc, holes: holes, gap: gap,
		e: youngModulus, minimum: p.Minimum}
	if cat.Preloaded() {
		e.mu = fc.SlipFactor()
		if e.mu == 0 {
			return nil, fmt.Errorf("friction_class: %q is not one of A, B, C, D", fc)
		}
	}
	e.gammaS = e.f.GammaM3
	e.states = [3]string{stULS: StateULS, stSlip: StateULS, stDetailing: StateDetailing}
	if cat == CategoryB {
		e.gammaS = e.f.GammaM3Ser
		e.states[stSlip] = StateSLS
	}
	e.act = designActions(p.Member, p.ULS, p.SLS, p.Distribution, p.Minimum, e.f, cat == CategoryB)
	e.rFit = p.Member.fillet() + e.det.Clearance
	return e, nil
}

// slipGammaName names the partial factor of the slip checks: γM3,ser at SLS (category B),
// γM3 at ULS (category C), EN 1993-1-8 Table 2.1 and 3.9.1.
func (e *env) slipGammaName() string {
	if e.cat == CategoryB {
		return "γM3,ser"
	}
	return "γM3"
}

// notes are the warnings the sheet prints beside the checks.
func (e *env) notes(fl *flangeLayout, wl *webLayout) []string {
	var out []string
	s := e.m.Section
	if e.act.MinimumNote != "" {
		out = append(out, e.act.MinimumNote)
	}
	if e.cat == CategoryB && !e.act.SLSGiven {
		out = append(out, "no SLS forces given: the slip checks use the ULS forces (conservative)")
	}
	mpl := s.WplY * e.m.FyFlange / e.f.GammaM0
	vpl := s.Avz * e.m.FyWeb / (math.Sqrt(3) * e.f.GammaM0)
	if _, mAbs := stateM(e.act.ULS); mpl > 0 && mAbs > mpl {
		out = append(out, fmt.Sprintf("|M| = %.1f kNm exceeds the section's Mpl,Rd = Wpl,y·fy/γM0 = %.1f kNm: the beam itself is overstressed here", mAbs*toKNm, mpl*toKNm))
	}
	if v := math.Abs(e.act.ULS.V); v > vpl {
		out = append(out, fmt.Sprintf("|V| = %.1f kN exceeds the section's Vpl,Rd = %.1f kN: the beam itself is overstressed here", v*toKN, vpl*toKN))
	}
	npl := s.A * e.m.FyWeb / e.f.GammaM0
	nmax := math.Max(math.Abs(e.act.ULS.NMax), math.Abs(e.act.ULS.NMin))
	if nmax > 0.05*npl {
		out = append(out, fmt.Sprintf("|N| = %.1f kN exceeds 5%% of Npl,Rd = %.1f kN: the joint methods of EN 1993-1-8 6.2.7 assume less; treat the splice as a member splice and confirm the load path",
			nmax*toKN, 0.05*npl*toKN))
	}
	if fl != nil && wl != nil && fl.inner && math.Min(fl.ti, wl.tp) > e.rFit {
		out = append(out, fmt.Sprintf("inner flange plates (%g mm) and web plates (%g mm) are both thicker than %s + clearance = %g mm: confirm by drawing that they do not clash", fl.ti, wl.tp, e.m.filletName(), e.rFit))
	}
	return out
}
