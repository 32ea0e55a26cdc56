package beam

// Cross-section checks of the beam itself to EN 1993-1-1:2005 (+AC:2009): classification
// (5.5.2, Table 5.2) and the resistances of 6.2.3 to 6.2.10 for a doubly symmetric I or H
// section bending about its major axis. Units N, mm, N/mm².

import (
	"errors"
	"fmt"
	"math"
)

// Recommended values used where MemberSettings leaves a field zero.
const (
	// GammaM0Recommended is γM0 = 1.00, EN 1993-1-1 6.1(1) Note 2B (a National Annex may
	// change it).
	GammaM0Recommended = 1.0
	// ShearBucklingEtaRecommended is η = 1.2 of EN 1993-1-5 5.1(2) Note 2, recommended for
	// grades up to S460 (every grade spanbreak knows). It enters only the shear-buckling
	// limit hw/tw > 72ε/η, where the larger η gives the smaller limit, so 1.2 raises the
	// flag earlier than 1.0 would. The shear area Avz keeps η = 1.0 (ShearAreaEta).
	ShearBucklingEtaRecommended = 1.2
)

// UtilisationCap is the utilisation reported when a resistance is zero (a moment resistance
// used up entirely by the axial force and shear), so that results stay finite numbers.
const UtilisationCap = 999.0

// ErrOutsideScope is wrapped by the errors OutsideScope returns: the result lies outside what
// these checks cover (a class 4 cross-section, a web that needs a shear-buckling check).
var ErrOutsideScope = errors.New("outside the scope of the member checks")

// Check ids of the cross-section checks, in the order SectionResult lists them.
const (
	CheckBending           = "bending"             // EN 1993-1-1 6.2.5
	CheckShear             = "shear"               // 6.2.6
	CheckAxial             = "axial"               // 6.2.3 (tension) or 6.2.4 (compression)
	CheckBendingShear      = "bending+shear"       // 6.2.8
	CheckBendingAxial      = "bending+axial"       // 6.2.9.1(5) for class 1 and 2, 6.2.9.2 for class 3
	CheckBendingShearAxial = "bending+shear+axial" // 6.2.10 with 6.2.9
)

// MemberSettings are the choices behind the member checks. The zero value is usable: every
// zero field takes the documented default.
type MemberSettings struct {
	GammaM0 float64    // γM0 [-]; 0 takes GammaM0Recommended (1.00)
	Table   GradeTable // table fy is read from; the zero value is EN 1993-1-1 Table 3.1
	// WeldThroat is the throat a of the web-to-flange fillet welds of a welded section [mm].
	// 0 (the default) ignores the welds: c is measured from the face of the web, the larger
	// and conservative width. Given, the compression widths are measured from the weld toes,
	// a leg √2·a from the face of the web (an equal-leg fillet): flange c = (b − tw)/2 − √2·a,
	// web c = h − 2tf − 2·√2·a. Not allowed for rolled sections, whose c is set by the root
	// radius.
	WeldThroat float64
	Eta        float64 // η in the shear-buckling limit 72ε/η [-]; 0 takes ShearBucklingEtaRecommended (1.2)
}

// resolved applies the defaults.
func (s MemberSettings) resolved() MemberSettings {
	if s.GammaM0 == 0 {
		s.GammaM0 = GammaM0Recommended
	}
	if s.Eta == 0 {
		s.Eta = ShearBucklingEtaRecommended
	}
	return s
}

func (s MemberSettings) validate(sec Section) error {
	var errs []error
	if !finite(s.GammaM0) || s.GammaM0 < 0 {
		errs = append(errs, fmt.Errorf("member: γM0 = %g: must be a positive finite factor (0 takes %g)", s.GammaM0, GammaM0Recommended))
	}
	if !finite(s.Eta) || s.Eta < 0 {
		errs = append(errs, fmt.Errorf("member: η = %g: must be a positive finite factor (0 takes %g)", s.Eta, ShearBucklingEtaRecommended))
	}
	if !finite(s.WeldThroat) || s.WeldThroat < 0 {
		errs = append(errs, fmt.Errorf("member: weld throat a = %g mm: must be zero or a positive finite size", s.WeldThroat))
	} else if s.WeldThroat > 0 && !sec.Welded() {
		errs = append(errs, fmt.Errorf("member: weld throat a = %g mm given for the rolled section %s: only welded sections have web-to-flange welds", s.WeldThroat, sec.Name))
	}
	if s.Table != TableEN1993 && s.Table != TableEN10025 {
		errs = append(errs, fmt.Errorf("member: unknown strength table %v", s.Table))
	}
	return errors.Join(errs...)
}

// ShearBuckling is the test of EN 1993-1-1 6.2.6(6): a web with hw/tw > 72ε/η must be checked
// for shear buckling to EN 1993-1-5 section 5, which spanbreak does not do.
type ShearBuckling struct {
	HwTw    float64 // hw/tw, hw = h − 2tf [-]
	Eta     float64 // η [-]
	Limit   float64 // 72ε/η [-]
	Applies bool    // hw/tw > 72ε/η: Vpl,Rd is not the shear resistance; outside scope
}

// Member is a beam prepared for the EN 1993-1-1 cross-section checks: the section, its steel,
// the one yield strength used throughout and the resistances that do not depend on the forces.
// Build it with NewMember.
type Member struct {
	Section  Section
	Grade    Grade
	Settings MemberSettings // with every default applied

	// T is the thickness fy is read for: the thicker of tf and tw, whose fy is the lower (or
	// equal) one, used for the whole section (conservative) [mm].
	T       float64
	Fy      float64 // yield strength [N/mm²]
	Epsilon float64 // ε = √(235/fy), EN 1993-1-1 Table 5.2 [-]

	FlangeC float64 // c of a flange outstand, Table 5.2 sheet 2: (b − tw − 2r)/2 (− √2·a welded) [mm]
	WebC    float64 // c of the web, Table 5.2 sheet 1: h − 2tf − 2r (− 2√2·a welded) [mm]

	NplRd float64 // A·fy/γM0, 6.2.3(2)a and 6.2.4(2) for classes 1 to 3 [N]
	VplRd float64 // Vpl,Rd = Avz·fy/(√3·γM0), 6.2.6(2) [N]
	MplRd float64 // Wpl,y·fy/γM0, 6.2.5(2) for classes 1 and 2 [N·mm]
	MelRd float64 // Wel,y·fy/γM0, 6.2.5(2) for class 3 [N·mm]

	ShearBuckling ShearBuckling
}

// NewMember reads fy of the section in the grade and computes the force-independent
// resistances. Errors, joined: a section with missing or invalid dimensions or properties;
// invalid settings; a thickness outside the grade's table; a weld throat so large that no
// compression width is left.
func NewMember(sec Section, g Grade, settings MemberSettings) (Member, error) {
	if err := errors.Join(checkMemberSection(sec), settings.validate(sec)); err != nil {
		return Member{}, err
	}
	st := settings.resolved()
	t := math.Max(sec.Tf, sec.Tw)
	fy, _, err := g.Strength(t, st.Table)
	if err != nil {
		return Member{}, fmt.Errorf("member %s: fy for the thicker of tf and tw (t = %g mm): %w", sec.Name, t, err)
	}
	leg := math.Sqrt2 * st.WeldThroat
	m := Member{
		Section: sec, Grade: g, Settings: st, T: t, Fy: fy,
		Epsilon: math.Sqrt(235 / fy),
		FlangeC: (sec.B-sec.Tw-2*sec.R)/2 - leg,
		WebC:    sec.H - 2*sec.Tf - 2*sec.R - 2*leg,
	}
	if !(m.FlangeC > 0) || !(m.WebC > 0) {
		return Member{}, fmt.Errorf("member %s: weld throat a = %g mm leaves no compression width (flange c = %g mm, web c = %g mm)",
			sec.Name, st.WeldThroat, m.FlangeC, m.WebC)
	}
	fyd := fy / st.GammaM0
	m.NplRd = sec.A * fyd
	m.VplRd = sec.Avz * fyd / math.Sqrt(3)
	m.MplRd = sec.WplY * fyd
	m.MelRd = sec.WelY * fyd
	hwtw := sec.WebDepth() / sec.Tw
	limit := 72 * m.Epsilon / st.Eta
	m.ShearBuckling = ShearBuckling{HwTw: hwtw, Eta: st.Eta, Limit: limit, Applies: hwtw > limit}
	return m, nil
}

// built reports a Member that did not come from NewMember (the zero value, say).
func (m Member) built() error {
	if !(m.Fy > 0) || !(m.Settings.GammaM0 > 0) || !(m.WebC > 0) || !(m.FlangeC > 0) {
		return errors.New("member check: the member was not built with NewMember")
	}
	return nil
}

// checkMemberSection rejects a section whose dimensions or properties cannot be checked.
func checkMemberSection(s Section) error {
	var errs []error
	for _, f := range []struct {
		name  string
		value float64
	}{{"h", s.H}, {"b", s.B}, {"tw", s.Tw}, {"tf", s.Tf}, {"A", s.A}, {"Iy", s.Iy}, {"Wel,y", s.WelY}, {"Wpl,y", s.WplY}, {"Avz", s.Avz}} {
		if !finite(f.value) || !(f.value > 0) {
			errs = append(errs, fmt.Errorf("member: section %q: %s = %g: must be positive and finite", s.Name, f.name, f.value))
		}
	}
	if !finite(s.R) || s.R < 0 {
		errs = append(errs, fmt.Errorf("member: section %q: r = %g mm: must be zero or positive", s.Name, s.R))
	}
	if len(errs) == 0 && 2*s.Tf >= s.H {
		errs = append(errs, fmt.Errorf("member: section %q: two flanges (2tf = %g mm) leave no web in h = %g mm", s.Name, 2*s.Tf, s.H))
	}
	return errors.Join(errs...)
}

// SectionForces are concurrent design forces at one cross-section.
type SectionForces struct {
	M float64 // bending moment, sagging positive [N·mm]
	V float64 // shear [N]
	N float64 // axial force, tension positive [N]
}

func (f SectionForces) finite() bool { return finite(f.M, f.V, f.N) }

// CheckInput is one named value a check uses.
type CheckInput struct {
	Name  string
	Value float64
	Unit  string
}

// SectionCheck is one verification of the cross-section. Demand and Resistance are in Unit
// ("N·mm", "N" or "N/mm²"); Utilisation = Demand/Resistance (UtilisationCap when the
// resistance is zero and the demand is not).
type SectionCheck struct {
	ID          string // CheckBending, CheckShear, ...
	Clause      string // e.g. "EN 1993-1-1 6.2.8(5)"
	Formula     string // in symbols
	Inputs      []CheckInput
	Demand      float64
	Resistance  float64
	Unit        string
	Utilisation float64
	Pass        bool
}

// SectionResult is the cross-section checked under one set of concurrent forces.
type SectionResult struct {
	Forces SectionForces
	Class  Classification
	// Resistances of the section in its class; all zero for class 4, where none is computed.
	McRd  float64 // Mc,Rd: Wpl,y·fy/γM0 (class 1, 2) or Wel,y·fy/γM0 (class 3) [N·mm]
	VcRd  float64 // Vc,Rd = Vpl,Rd = Av·fy/(√3·γM0) [N]
	NplRd float64 // A·fy/γM0 [N]
	// Checks lists bending, shear and axial, then the combined check where one applies (see
	// Member.CheckSection); empty for class 4.
	Checks      []SectionCheck
	Governing   int     // index in Checks of the highest utilisation; −1 for class 4
	Utilisation float64 // of the governing check; 0 for class 4
	// ShearBuckling repeats the member's 6.2.6(6) test so the result states its own scope.
	ShearBuckling ShearBuckling
}

// OutsideScope returns nil when the result is within what the checks cover, or an error
// wrapping ErrOutsideScope naming every reason (class 4; a web that needs a shear-buckling
// check).
func (r SectionResult) OutsideScope() error {
	return scopeError(r.Class, r.ShearBuckling, "")
}

func scopeError(c Classification, sb ShearBuckling, where string) error {
	var errs []error
	if c.Class == Class4 {
		p := c.Flange
		if p.Class != Class4 {
			p = c.Web
		}
		errs = append(errs, fmt.Errorf("%w: class 4 cross-section%s (%s c/t = %.2f > %.2f, the class 3 limit of EN 1993-1-1 Table 5.2): effective widths to EN 1993-1-5 are not implemented, no resistance is computed",
			ErrOutsideScope, where, p.Part, p.Ratio, p.Limits[2]))
	}
	if sb.Applies {
		errs = append(errs, fmt.Errorf("%w: web hw/tw = %.1f > 72ε/η = %.1f (EN 1993-1-1 6.2.6(6), η = %g): the shear buckling resistance of EN 1993-1-5 section 5 is not checked and may be below Vpl,Rd",
			ErrOutsideScope, sb.HwTw, sb.Limit, sb.Eta))
	}
	return errors.Join(errs...)
}

// evaluation holds the numbers of one cross-section check, without the sheet text, so that
// whole envelopes can be checked without allocating.
type evaluation struct {
	forces SectionForces
	class  Classification

	mcRd float64
	u    [4]float64 // bending, shear, axial, combined
	gov  int        // index into u of the governing check; −1 for class 4

	// combined check
	combined  string  // its id; "" when none applies
	shear     bool    // |VEd| > 0.5 Vpl,Rd, 6.2.8(2)
	rho       float64 // ρ = (2VEd/Vpl,Rd − 1)², capped at 1; 0 without reduction
	aw        float64 // Aw = hw·tw [mm²]
	areaV     float64 // A − ρ·Aw [mm²]
	nplV      float64 // (A − ρ·Aw)·fy/γM0 [N]
	allowance bool    // class 1, 2: the axial force needs no allowance, 6.2.9.1(4)
	mplV      float64 // class 1, 2: (Wpl,y − ρ·Aw²/(4tw))·fy/γM0 [N·mm]
	n, a      float64 // class 1, 2 with an axial allowance: n = NEd/Npl,Rd, a = (A − 2btf)/A ≤ 0.5, of the reduced section
	mnRd      float64 // class 1, 2: the reduced moment resistance [N·mm]
	welV      float64 // class 3: Wel,y of the section with the web thickness (1 − ρ)·tw [mm³]
	sigma     float64 // class 3: σx,Ed = NEd/(A − ρAw) + MEd/Wel,V [N/mm²]
}

// evaluate checks the section under f. The combined check follows one reading of 6.2.8 to
// 6.2.10 (documented on CheckSection).
func (m Member) evaluate(f SectionForces) evaluation {
	e := evaluation{forces: f, class: m.classify(f), gov: -1}
	if e.class.Class == Class4 {
		return e
	}
	s := m.Section
	fyd := m.Fy / m.Settings.GammaM0
	mAbs, vAbs, nAbs := math.Abs(f.M), math.Abs(f.V), math.Abs(f.N)
	plastic := e.class.Class <= Class2
	e.mcRd = m.MelRd
	if plastic {
		e.mcRd = m.MplRd
	}
	e.u[0] = utilisation(mAbs, e.mcRd)
	e.u[1] = utilisation(vAbs, m.VplRd)
	e.u[2] = utilisation(nAbs, m.NplRd)

	// 6.2.8(2), (3): shear above half Vpl,Rd reduces fy in the shear area Aw = hw·tw to
	// (1 − ρ)fy, taken as a web of thickness (1 − ρ)tw.
	if vAbs > 0.5*m.VplRd {
		e.shear = true
		r := 2*vAbs/m.VplRd - 1
		e.rho = math.Min(r*r, 1) // VEd ≥ Vpl,Rd: the shear check itself fails
	}
	hw := s.WebDepth()
	e.aw = hw * s.Tw
	e.areaV = s.A - e.rho*e.aw
	e.nplV = e.areaV * fyd
	demand, resistance := 0.0, 0.0
	if plastic {
		e.mplV = (s.WplY - e.rho*e.aw*e.aw/(4*s.Tw)) * fyd // 6.2.8(5)
		// 6.2.9.1(4), with the web's reduced strength where shear reduces it
		e.allowance = nAbs <= 0.25*e.nplV && nAbs <= 0.5*e.aw*(1-e.rho)*fyd
		if e.shear || !e.allowance {
			e.mnRd = e.mplV
			if !e.allowance { // 6.2.9.1(5)
				e.n = nAbs / e.nplV
				e.a = math.Min((e.areaV-2*s.B*s.Tf)/e.areaV, 0.5)
				e.mnRd = e.mplV * math.Min(1, math.Max(0, 1-e.n)/(1-0.5*e.a))
			}
			e.combined = combinedID(e.shear, !e.allowance)
			demand, resistance = mAbs, e.mnRd
		}
	} else if e.shear || nAbs > 0 { // 6.2.9.2, with 6.2.10 where shear reduces the web
		iyV := s.Iy - e.rho*s.Tw*hw*hw*hw/12
		e.welV = 2 * iyV / s.H
		e.sigma = nAbs/e.areaV + mAbs/e.welV
		e.combined = combinedID(e.shear, nAbs > 0)
		demand, resistance = e.sigma, fyd
	}
	if e.combined != "" {
		e.u[3] = utilisation(demand, resistance)
	}
	e.gov = 0
	for k := 1; k < len(e.u); k++ {
		if e.u[k] > e.u[e.gov] {
			e.gov = k
		}
	}
	return e
}

// combinedID names the combined check by what it combines with the bending moment.
func combinedID(shear, axial bool) string {
	switch {
	case shear && axial:
		return CheckBendingShearAxial
	case shear:
		return CheckBendingShear
	default:
		return CheckBendingAxial
	}
}

// utilisation is demand/resistance, 0 for no demand, UtilisationCap for no resistance.
func utilisation(demand, resistance float64) float64 {
	if !(demand > 0) {
		return 0
	}
	if !(resistance > 0) {
		return UtilisationCap
	}
	return math.Min(demand/resistance, UtilisationCap)
}

// passTolerance absorbs round-off when a demand equals its resistance.
const passTolerance = 1e-9

// CheckSection checks the cross-section under concurrent forces (signs as SectionForces; only
// magnitudes enter the resistances of a doubly symmetric section). Errors: a Member not built
// by NewMember; a force that is NaN or infinite.
//
// The section is classified under f (Member.Classify). Class 4 gives a result with no
// resistance and no checks; its OutsideScope error says why. Otherwise the checks are:
//
//   - bending, 6.2.5: |MEd| ≤ Mc,Rd, Wpl,y·fy/γM0 for class 1 and 2, Wel,y·fy/γM0 for class 3;
//   - shear, 6.2.6: |VEd| ≤ Vpl,Rd = Avz·fy/(√3·γM0) (the 6.2.6(6) shear-buckling test is a
//     flag on the result, see ShearBuckling);
//   - axial, 6.2.3 / 6.2.4: |NEd| ≤ A·fy/γM0 (no holes in the member: Nt,Rd = Npl,Rd);
//   - a combined check where shear or axial force reduces the moment resistance:
//     class 1 and 2 — where |VEd| > 0.5 Vpl,Rd, ρ = (2|VEd|/Vpl,Rd − 1)² (capped at 1) and
//     My,V,Rd = (Wpl,y − ρ·Aw²/(4tw))·fy/γM0 with Aw = hw·tw (6.2.8(5)); where the axial force
//     exceeds the allowance of 6.2.9.1(4) (|NEd| > 0.25 Npl,Rd or > 0.5 hw·tw·fy/γM0),
//     MN,y,Rd = Mpl,y,Rd·(1 − n)/(1 − 0.5a) ≤ Mpl,y,Rd, n = |NEd|/Npl,Rd, a = (A − 2b·tf)/A
//     ≤ 0.5 (6.2.9.1(5)). With both, 6.2.10(3) — fy reduced to (1 − ρ)fy in the shear area —
//     is read as a web of thickness (1 − ρ)·tw over hw: A, Npl,Rd, Mpl,y,Rd, a and the two
//     allowance criteria are all those of that reduced section, so the formula reduces
//     exactly to 6.2.8(5) at NEd = 0 and to 6.2.9.1(5) at ρ = 0. The check is |MEd| ≤ the
//     reduced resistance.
//     class 3 — 6.2.9.2: σx,Ed = |NEd|/A + |MEd|/Wel,y ≤ fy/γM0 wherever NEd ≠ 0, with the
//     same reduced-web reading (A − ρ·Aw, and Wel,y of the section with web thickness
//     (1 − ρ)·tw) where |VEd| > 0.5 Vpl,Rd (6.2.8(3), 6.2.10(3)).
//
// The governing check is the one with the highest utilisation (the first of equals).
func (m Member) CheckSection(f SectionForces) (SectionResult, error) {
	if err := m.built(); err != nil {
		return SectionResult{}, err
	}
	if !f.finite() {
		return SectionResult{}, fmt.Errorf("member check: forces must be finite numbers (M %g N·mm, V %g N, N %g N)", f.M, f.V, f.N)
	}
	return m.dress(m.evaluate(f)), nil
}

// dress turns an evaluation into the complete result with formulas and inputs.
func (m Member) dress(e evaluation) SectionResult {
	r := SectionResult{Forces: e.forces, Class: e.class, Governing: -1, ShearBuckling: m.ShearBuckling}
	if e.class.Class == Class4 {
		return r
	}
	s, fy, g := m.Section, m.Fy, m.Settings.GammaM0
	f := e.forces
	r.McRd, r.VcRd, r.NplRd = e.mcRd, m.VplRd, m.NplRd
	base := []CheckInput{{"fy", fy, "N/mm²"}, {"γM0", g, "-"}}
	with := func(extra ...CheckInput) []CheckInput { return append(append([]CheckInput(nil), base...), extra...) }

	bending := SectionCheck{ID: CheckBending, Clause: "EN 1993-1-1 6.2.5", Unit: "N·mm",
		Formula: "MEd ≤ Mc,Rd = Wpl,y·fy/γM0 (class 1, 2)", Inputs: with(CheckInput{"Wpl,y", s.WplY, "mm³"})}
	if e.class.Class == Class3 {
		bending.Formula = "MEd ≤ Mc,Rd = Wel,y·fy/γM0 (class 3)"
		bending.Inputs = with(CheckInput{"Wel,y", s.WelY, "mm³"})
	}
	bending.Demand, bending.Resistance = math.Abs(f.M), e.mcRd
	shear := SectionCheck{ID: CheckShear, Clause: "EN 1993-1-1 6.2.6", Unit: "N",
		Formula: "VEd ≤ Vpl,Rd = Av·fy/(√3·γM0)", Inputs: with(CheckInput{"Av", s.Avz, "mm²"}),
		Demand: math.Abs(f.V), Resistance: m.VplRd}
	axial := SectionCheck{ID: CheckAxial, Clause: "EN 1993-1-1 6.2.3", Unit: "N",
		Formula: "NEd ≤ Nt,Rd = Npl,Rd = A·fy/γM0 (tension, no holes)", Inputs: with(CheckInput{"A", s.A, "mm²"}),
		Demand: math.Abs(f.N), Resistance: m.NplRd}
	if f.N < 0 {
		axial.Clause, axial.Formula = "EN 1993-1-1 6.2.4", "NEd ≤ Nc,Rd = A·fy/γM0 (compression, class 1 to 3)"
	}
	r.Checks = []SectionCheck{bending, shear, axial}
	if e.combined != "" {
		r.Checks = append(r.Checks, m.combinedCheck(e, with))
	}
	for k := range r.Checks {
		c := &r.Checks[k]
		c.Utilisation = e.u[k]
		c.Pass = c.Utilisation <= 1+passTolerance
	}
	r.Governing, r.Utilisation = e.gov, e.u[e.gov]
	return r
}

// combinedCheck writes the combined check of an evaluation.
func (m Member) combinedCheck(e evaluation, with func(...CheckInput) []CheckInput) SectionCheck {
	s := m.Section
	f := e.forces
	shearInputs := []CheckInput{{"VEd", math.Abs(f.V), "N"}, {"Vpl,Rd", m.VplRd, "N"}, {"ρ", e.rho, "-"}, {"Aw = hw·tw", e.aw, "mm²"}}
	c := SectionCheck{ID: e.combined}
	if e.class.Class <= Class2 {
		c.Unit, c.Demand, c.Resistance = "N·mm", math.Abs(f.M), e.mnRd
		c.Inputs = with(CheckInput{"Wpl,y", s.WplY, "mm³"}, CheckInput{"tw", s.Tw, "mm"})
		switch e.combined {
		case CheckBendingShear:
			c.Clause = "EN 1993-1-1 6.2.8(5)"
			c.Formula = "MEd ≤ My,V,Rd = (Wpl,y − ρ·Aw²/(4·tw))·fy/γM0 ≤ Mc,Rd, ρ = (2VEd/Vpl,Rd − 1)²"
			c.Inputs = append(c.Inputs, shearInputs...)
			c.Inputs = append(c.Inputs, CheckInput{"NEd", math.Abs(f.N), "N"}) // within the 6.2.9.1(4) allowance
		case CheckBendingAxial:
			c.Clause = "EN 1993-1-1 6.2.9.1(5)"
			c.Formula = "MEd ≤ MN,y,Rd = Mpl,y,Rd·(1 − n)/(1 − 0.5a) ≤ Mpl,y,Rd, n = NEd/Npl,Rd, a = (A − 2b·tf)/A ≤ 0.5"
			c.Inputs = append(c.Inputs, CheckInput{"NEd", math.Abs(f.N), "N"}, CheckInput{"Npl,Rd", e.nplV, "N"},
				CheckInput{"n", e.n, "-"}, CheckInput{"a", e.a, "-"}, CheckInput{"Mpl,y,Rd", e.mplV, "N·mm"})
		default:
			c.Clause = "EN 1993-1-1 6.2.10 with 6.2.8(5) and 6.2.9.1(5)"
			c.Formula = "MEd ≤ MN,V,Rd = Mpl,V,Rd·(1 − n)/(1 − 0.5a) ≤ Mpl,V,Rd; web thickness (1 − ρ)·tw over hw: " +
				"Mpl,V,Rd = (Wpl,y − ρ·Aw²/(4·tw))·fy/γM0, Npl,V,Rd = (A − ρ·Aw)·fy/γM0, n = NEd/Npl,V,Rd, a = (A − ρ·Aw − 2b·tf)/(A − ρ·Aw) ≤ 0.5"
			c.Inputs = append(c.Inputs, shearInputs...)
			c.Inputs = append(c.Inputs, CheckInput{"NEd", math.Abs(f.N), "N"}, CheckInput{"Npl,V,Rd", e.nplV, "N"},
				CheckInput{"n", e.n, "-"}, CheckInput{"a", e.a, "-"}, CheckInput{"Mpl,V,Rd", e.mplV, "N·mm"})
		}
		return c
	}
	c.Unit, c.Demand, c.Resistance = "N/mm²", e.sigma, m.Fy/m.Settings.GammaM0
	c.Inputs = with(CheckInput{"MEd", math.Abs(f.M), "N·mm"}, CheckInput{"NEd", math.Abs(f.N), "N"},
		CheckInput{"A", s.A, "mm²"}, CheckInput{"Wel,y", s.WelY, "mm³"})
	switch e.combined {
	case CheckBendingAxial:
		c.Clause = "EN 1993-1-1 6.2.9.2"
		c.Formula = "σx,Ed = NEd/A + MEd/Wel,y ≤ fy/γM0"
	case CheckBendingShear:
		c.Clause = "EN 1993-1-1 6.2.8(3)"
		c.Formula = "σx,Ed = MEd/Wel,V ≤ fy/γM0; Wel,V of the section with web thickness (1 − ρ)·tw over hw, ρ = (2VEd/Vpl,Rd − 1)²"
	default:
		c.Clause = "EN 1993-1-1 6.2.10 with 6.2.9.2"
		c.Formula = "σx,Ed = NEd/(A − ρ·Aw) + MEd/Wel,V ≤ fy/γM0; Wel,V of the section with web thickness (1 − ρ)·tw over hw, ρ = (2VEd/Vpl,Rd − 1)²"
	}
	if e.shear {
		c.Inputs = append(c.Inputs, shearInputs...)
		c.Inputs = append(c.Inputs, CheckInput{"Wel,V", e.welV, "mm³"})
	}
	return c
}
