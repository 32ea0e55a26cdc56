package splice

import (
	"errors"
	"fmt"
	"math"
	"strings"
)

// Forces are the design forces at the splice position for one limit state: the envelope
// extremes of the bending moment and axial force and the largest shear [N·mm, N].
// M is positive sagging, N positive in tension; only |V| is used.
type Forces struct {
	MMax, MMin float64 // largest and smallest bending moment [N·mm]
	V          float64 // shear paired with them, the largest |V| [N]
	NMax, NMin float64 // largest and smallest axial force [N]
}

func (f Forces) validate(name string) error {
	var errs []error
	for _, x := range []struct {
		n string
		v float64
	}{{"M_max", f.MMax}, {"M_min", f.MMin}, {"V", f.V}, {"N_max", f.NMax}, {"N_min", f.NMin}} {
		if math.IsNaN(x.v) || math.IsInf(x.v, 0) {
			errs = append(errs, fmt.Errorf("%s.%s: %g is not a number", name, x.n, x.v))
		}
	}
	if f.MMax < f.MMin {
		errs = append(errs, fmt.Errorf("%s: M_max = %.3f kNm is less than M_min = %.3f kNm", name, f.MMax*toKNm, f.MMin*toKNm))
	}
	if f.NMax < f.NMin {
		errs = append(errs, fmt.Errorf("%s: N_max = %.3f kN is less than N_min = %.3f kN", name, f.NMax*toKN, f.NMin*toKN))
	}
	return errors.Join(errs...)
}

// MinimumAction is an optional rule raising the design forces to fractions of the beam's own
// resistances, which many specifications and clients require of a splice whatever the
// analysis says (common practice; no EN 1993 clause sets a minimum for beam splices — the
// project specification governs). Zero fractions mean no minimum. Each ULS extreme is raised
// in magnitude to its minimum keeping its sign (M_max and N_max taken as positive, M_min and
// N_min as negative where they are zero); |V| to its minimum.
type MinimumAction struct {
	MomentFraction float64 // of McRd
	ShearFraction  float64 // of VcRd
	AxialFraction  float64 // of NplRd
	// The beam's resistances the fractions apply to [N·mm, N]; zero takes the plastic values
	// of the member: Wpl,y·fy/γM0, Av·fy/(√3·γM0) and A·fy/γM0.
	McRd, VcRd, NplRd float64
}

func (m MinimumAction) validate() error {
	var errs []error
	for _, f := range []struct {
		name string
		v    float64
	}{{"moment", m.MomentFraction}, {"shear", m.ShearFraction}, {"axial", m.AxialFraction}} {
		if !(f.v >= 0 && f.v <= 1) {
			errs = append(errs, fmt.Errorf("minimum_forces.%s: %g is not a fraction between 0 and 1", f.name, f.v))
		}
	}
	for _, r := range []float64{m.McRd, m.VcRd, m.NplRd} {
		if !(r >= 0) || math.IsInf(r, 0) {
			errs = append(errs, fmt.Errorf("minimum_forces: resistance %g is not valid", r))
		}
	}
	return errors.Join(errs...)
}

// active reports whether the rule raises anything.
func (m MinimumAction) active() bool {
	return m.MomentFraction > 0 || m.ShearFraction > 0 || m.AxialFraction > 0
}

// apply raises the ULS forces to the rule's minima and says what it raised ("" when nothing).
func (m MinimumAction) apply(f *Forces, mem Member, pf PartialFactors) string {
	s := mem.Section
	mc, vc, np := m.McRd, m.VcRd, m.NplRd
	if mc == 0 {
		mc = s.WplY * mem.FyFlange / pf.GammaM0
	}
	if vc == 0 {
		vc = s.Avz * mem.FyWeb / (math.Sqrt(3) * pf.GammaM0)
	}
	if np == 0 {
		np = s.A * math.Min(mem.FyFlange, mem.FyWeb) / pf.GammaM0
	}
	mMin, vMin, nMin := m.MomentFraction*mc, m.ShearFraction*vc, m.AxialFraction*np
	var changed []string
	raise := func(name string, v *float64, least, scale float64, negative bool, unit string) {
		if least <= 0 || math.Abs(*v) >= least {
			return
		}
		sign := 1.0
		if *v < 0 || (*v == 0 && negative) {
			sign = -1
		}
		*v = sign * least
		changed = append(changed, fmt.Sprintf("%s raised to %+.1f %s", name, *v*scale, unit))
	}
	raise("M_max", &f.MMax, mMin, toKNm, false, "kNm")
	raise("M_min", &f.MMin, mMin, toKNm, true, "kNm")
	if vMin > 0 && math.Abs(f.V) < vMin {
		f.V = vMin
		changed = append(changed, fmt.Sprintf("|V| raised to %.1f kN", vMin*toKN))
	}
	raise("N_max", &f.NMax, nMin, toKN, false, "kN")
	raise("N_min", &f.NMin, nMin, toKN, true, "kN")
	if len(changed) == 0 {
		return ""
	}
	return fmt.Sprintf("minimum design forces (splice.minimum_forces; common practice, the project specification governs): "+
		"%.0f%% of Mc,Rd = %.1f kNm, %.0f%% of Vc,Rd = %.1f kN, %.0f%% of Npl,Rd = %.1f kN: %s",
		100*m.MomentFraction, mc*toKNm, 100*m.ShearFraction, vc*toKN, 100*m.AxialFraction, np*toKN, strings.Join(changed, "; "))
}

// FlangeActions are the forces one flange splice transfers, the worse flange of the two
// (both signs of the moment are checked, so either flange may be the tension flange) [N].
type FlangeActions struct {
	Tension          float64 // largest flange tension Ft,Ed at ULS [N]
	Compression      float64 // largest flange compression Fc,Ed at ULS [N]
	Bolt             float64 // force the flange bolts transfer, max(Ft,Ed, Fc,Ed) [N]
	SlipBolt         float64 // that force in the slip state (SLS for category B, ULS for C) [N]
	TensionState     string  // design state giving Tension
	CompressionState string  // design state giving Compression
}

// WebActions are the forces the web splice transfers at the splice centreline [N·mm, N].
type WebActions struct {
	Moment, Axial, Shear             float64 // |Mw|, |Nw|, |V| at ULS
	SlipMoment, SlipAxial, SlipShear float64 // in the slip state
	State                            string  // design state governing the web
}

// Actions are the design forces at the splice and how they are shared between flanges and web.
type Actions struct {
	ULS          Forces // after any minimum-action policy
	SLS          Forces // the SLS set (the ULS set when none was given)
	SLSGiven     bool
	MinimumNote  string // what the minimum-action policy changed, "" when nothing
	Distribution Distribution
	IwOverIy     float64 // web share of the moment (0 for flanges-only)
	AwOverA      float64 // web share of the axial force
	LeverArm     float64 // h − tf [mm]
	Flange       FlangeActions
	Web          WebActions
}

// designActions applies the minimum policy and shares the forces (DESIGN.md section 5).
//
// The four design states are M_max and M_min, each with the largest |V| and with N_max and
// N_min. The flange force is Ff = (M − Mw)/(h − tf) ± (N − Nw)/2; for a flange it is largest in
// tension with the largest |M| and N_max, in compression with the largest |M| and N_min. Every
// web demand grows with |Mw|, |Nw| and |V|, so the web is governed by the largest |M| with the
// N of larger magnitude.
func designActions(m Member, uls Forces, sls *Forces, dist Distribution, min MinimumAction, f PartialFactors, slipAtSLS bool) Actions {
	s := m.Section
	a := Actions{ULS: uls, Distribution: dist}
	if min.active() {
		a.MinimumNote = min.apply(&a.ULS, m, f)
	}
	if sls != nil {
		a.SLS, a.SLSGiven = *sls, true
	} else {
		a.SLS = a.ULS
	}
	hw := s.H - 2*s.Tf
	iw := s.Tw * hw * hw * hw / 12
	aw := s.Tw * hw
	a.AwOverA = aw / s.A
	if dist != FlangesOnly {
		a.IwOverIy = iw / s.Iy
	}
	a.LeverArm = s.H - s.Tf

	mState, mAbs := stateM(a.ULS)
	mf := mAbs * (1 - a.IwOverIy)
	nf := 1 - a.AwOverA
	a.Flange.Tension = math.Max(0, mf/a.LeverArm+a.ULS.NMax*nf/2)
	a.Flange.Compression = math.Max(0, mf/a.LeverArm-a.ULS.NMin*nf/2)
	a.Flange.Bolt = math.Max(a.Flange.Tension, a.Flange.Compression)
	a.Flange.TensionState = mState + " with N_max"
	a.Flange.CompressionState = mState + " with N_min"

	nState, nAbs := stateN(a.ULS)
	a.Web.Moment = mAbs * a.IwOverIy
	a.Web.Axial = nAbs * a.AwOverA
	a.Web.Shear = math.Abs(a.ULS.V)
	a.Web.State = mState + " with " + nState + ", largest |V|"

	slip := a.ULS
	if slipAtSLS {
		slip = a.SLS
	}
	_, smAbs := stateM(slip)
	_, snAbs := stateN(slip)
	smf := smAbs * (1 - a.IwOverIy)
	a.Flange.SlipBolt = math.Max(math.Max(0, smf/a.LeverArm+slip.NMax*nf/2), math.Max(0, smf/a.LeverArm-slip.NMin*nf/2))
	a.Web.SlipMoment = smAbs * a.IwOverIy
	a.Web.SlipAxial = snAbs * a.AwOverA
	a.Web.SlipShear = math.Abs(slip.V)
	return a
}

func stateM(f Forces) (string, float64) {
	if math.Abs(f.MMax) >= math.Abs(f.MMin) {
		return "M_max", math.Abs(f.MMax)
	}
	return "M_min", math.Abs(f.MMin)
}

func stateN(f Forces) (string, float64) {
	if math.Abs(f.NMax) >= math.Abs(f.NMin) {
		return "N_max", math.Abs(f.NMax)
	}
	return "N_min", math.Abs(f.NMin)
}

// BoltForce is the force on one web bolt of one side, from the elastic (polar moment of
// inertia) distribution, each component taken with its adverse sign [mm, N].
type BoltForce struct {
	Column, Row int     // 1-based; column 1 is nearest the joint, row 1 is the top row
	X, Z        float64 // position from the group centroid, along the beam and upward [mm]
	H, V, R     float64 // horizontal and vertical components and resultant [N]
}

// webGroup is the elastic analysis of one side's web bolt group.
type webGroup struct {
	e      float64 // eccentricity of the group centroid from the splice centreline [mm]
	mg     float64 // group moment |Mw| + |V|·e [N·mm]
	ip     float64 // polar moment Σ(x² + z²) [mm²]
	n      int
	xmax   float64
	zmax   float64
	h, v   float64 // components on the corner bolt [N]
	r      float64 // resultant on the corner bolt [N]
	mw, nw float64
	shear  float64
}

// analyseWebGroup distributes the web forces over the bolts: the group moment is
// |Mw| + |V|·e with e = gap/2 + end + half the group width; the axial share adds to the
// horizontal component and the shear to the vertical one, each with the adverse sign.
func analyseWebGroup(w *webLayout, gap, mw, nw, v float64) webGroup {
	g := webGroup{mw: mw, nw: nw, shear: v}
	c, r := float64(w.cols), float64(w.rows)
	g.n = w.cols * w.rows
	g.xmax = (c - 1) * w.ph / 2
	g.zmax = (r - 1) * w.pv / 2
	g.e = gap/2 + w.eh + g.xmax
	g.mg = mw + v*g.e
	g.ip = r*w.ph*w.ph*c*(c*c-1)/12 + c*w.pv*w.pv*r*(r*r-1)/12
	n := float64(g.n)
	if g.ip > 0 {
		g.h = g.mg*g.zmax/g.ip + nw/n
		g.v = v/n + g.mg*g.xmax/g.ip
	} else {
		g.h = nw / n
		g.v = v / n
	}
	g.r = math.Sqrt(g.h*g.h + g.v*g.v)
	return g
}

// bolts lists every bolt of one side with its components (worst sign at each bolt).
func (g webGroup) bolts(w *webLayout) []BoltForce {
	out := make([]BoltForce, 0, g.n)
	n := float64(g.n)
	for j := 0; j < w.cols; j++ {
		x := (float64(j) - float64(w.cols-1)/2) * w.ph
		for i := 0; i < w.rows; i++ {
			z := (float64(w.rows-1)/2 - float64(i)) * w.pv
			bf := BoltForce{Column: j + 1, Row: i + 1, X: x, Z: z}
			if g.ip > 0 {
				bf.H = g.mg*math.Abs(z)/g.ip + g.nw/n
				bf.V = g.shear/n + g.mg*math.Abs(x)/g.ip
			} else {
				bf.H, bf.V = g.nw/n, g.shear/n
			}
			bf.R = math.Sqrt(bf.H*bf.H + bf.V*bf.V)
			out = append(out, bf)
		}
	}
	return out
}
