package splice

import (
	"errors"
	"fmt"
)

// DefaultGap is the usual gap between the beam ends [mm] (common practice); Problem.Sizing.Gap
// is used as given, so set it.
const DefaultGap = 10.0

// Problem is everything the checks need at one splice position.
type Problem struct {
	Member       Member
	ULS          Forces  // design forces at ULS [N·mm, N]
	SLS          *Forces // design forces at SLS, nil when none (slip at SLS then uses ULS, with a note)
	PlateSteel   Steel   // grade of the cover plates
	Distribution Distribution
	Factors      PartialFactors // zero fields: recommended values
	Minimum      MinimumAction  // zero: no minimum design action
	Detailing    Detailing      // zero fields: defaults (also used by Verify for clearance and exposure)
	Rates        Rates          // nil Bolt map: DefaultRates
	Sizing       Sizing         // used by Size and SizeExhaustive only
	// Brief leaves the formula text, numbers-in text, inputs and per-bolt table out of the
	// result (the numbers are all there); whole-span scans set it.
	Brief bool
}

// Sizing is the splice type and the design space for Size.
type Sizing struct {
	Category      Category
	FrictionClass FrictionClass // categories B and C
	Holes         HoleType      // "" means normal
	Gap           float64       // between the beam ends [mm]
	// ShearPlanes is where the shear checks take the bolts' shear planes: from the length
	// chosen for each bolt group (PlanesFromLength, the default), or the thread or the shank
	// in every plane (ShearPlaneRule).
	ShearPlanes ShearPlaneRule
	// System is the bolting assembly system of every bolt; "" takes the default of the
	// category and class (see Bolt.System).
	System AssemblySystem
	Space  DesignSpace
}

// Status says what a Result is.
type Status int

const (
	Checked    Status = iota // Verify checked a given splice; Pass says whether it passes
	Sized                    // Size found the cheapest splice that passes
	NoFeasible               // Size found nothing that passes; the result is the best attempt
)

// String returns "checked", "sized" or "no feasible splice".
func (s Status) String() string {
	switch s {
	case Checked:
		return "checked"
	case Sized:
		return "sized"
	case NoFeasible:
		return "no feasible splice"
	}
	return "unknown"
}

// WebGroup is the elastic analysis of the web bolt group on one side of the joint.
type WebGroup struct {
	Eccentricity  float64     // e from the splice centreline to the group centroid [mm]
	Moment        float64     // group moment |Mw| + |V|·e at ULS [N·mm]
	PolarMoment   float64     // Σ(x² + z²) [mm²]
	Corner        BoltForce   // the most loaded bolt at ULS
	SlipResultant float64     // resultant on the corner bolt in the slip state [N]
	Bolts         []BoltForce // every bolt at ULS (nil when Problem.Brief)
}

// Result is a checked or sized splice with every check.
type Result struct {
	Status      Status
	Pass        bool
	Geometry    Geometry
	Checks      []Check
	Governing   Check   // the check with the highest utilisation (a failing detailing check counts)
	Utilisation float64 // of the governing check
	Actions     Actions
	WebGroup    WebGroup
	Quantities  Quantities
	Cost        Cost
	// Assemblies are the bolting assemblies of the flange and the web bolt groups, in that
	// order (nil when Problem.Brief; the bolt masses are in Quantities all the same).
	Assemblies []GroupAssembly
	Notes      []string
	Evaluated  int // configurations the search evaluated (sizing only)
}

// contribution is what a check adds to the splice's utilisation: detailing checks count only
// when they fail, since their ratios are not load effects.
func contribution(c *Check) float64 {
	if c.State == StateDetailing && c.Pass {
		return 0
	}
	return c.Utilisation
}

// sheet appends every check of the splice v is set to, in calculation-sheet order: the rows of
// checkTable that apply to the splice's category.
func sheet(v *evaluator, full bool, checks []Check) []Check {
	pre := v.f.e.cat.Preloaded()
	for i := range checkTable {
		if d := &checkTable[i]; d.applies(pre) {
			checks = d.appendCheck(checks, v, full)
		}
	}
	return checks
}

// explainImpossible gives every check that could not be made (no resistance left, a bolt off
// its part) the reason: its own, or the detailing rule the geometry breaks.
func explainImpossible(checks []Check) {
	cause := ""
	for _, c := range checks {
		if c.Impossible != "" {
			cause = c.Impossible
			break
		}
	}
	for i := range checks {
		c := &checks[i]
		if c.Impossible != "" || !(c.Demand > 0) || c.Resistance > 0 {
			continue
		}
		c.Impossible = "no resistance is left"
		if cause != "" {
			c.Impossible += " (" + cause + ")"
		}
	}
}

// verdict runs every check of the splice v is set to for its utilisation alone (the numbers of
// the sheet, TestCheckTableNumbers): whether all pass, and the splice's utilisation, in which
// detailing checks count only when they fail (as contribution).
func verdict(v *evaluator) (pass bool, measure float64) {
	pass = true
	pre := v.f.e.cat.Preloaded()
	for i := range checkTable {
		d := &checkTable[i]
		if !d.applies(pre) {
			continue
		}
		u := d.utilisation(v)
		ok := passes(u)
		pass = pass && ok
		if !(d.state == stDetailing && ok) {
			measure = max(measure, u)
		}
	}
	return pass, measure
}

// assemble builds the complete result of one splice, evaluated with v.
func assemble(v *evaluator, e *env, b *boltData, fl *flangeLayout, wl *webLayout, u *unitRates, full bool) Result {
	r := Result{Pass: true, Actions: e.act}
	v.splice(e, b, fl, wl)
	r.Checks = sheet(v, full, make([]Check, 0, sheetLen(e.cat.Preloaded())))
	gov := -1
	for i := range r.Checks {
		c := &r.Checks[i]
		if !c.Pass {
			r.Pass = false
		}
		if m := contribution(c); gov < 0 || m > r.Utilisation {
			r.Utilisation, gov = m, i
		}
	}
	explainImpossible(r.Checks)
	r.Governing = r.Checks[gov]
	r.Geometry = geometryOf(b, e.cat, e.fc, e.holes, e.gap, fl, wl)
	wx := &v.w
	r.WebGroup = WebGroup{Eccentricity: wx.g.e, Moment: wx.g.mg, PolarMoment: wx.g.ip, SlipResultant: wx.gs.r}
	r.WebGroup.Corner = BoltForce{Column: 1, Row: 1, X: -wx.g.xmax, Z: wx.g.zmax, H: wx.g.h, V: wx.g.v, R: wx.g.r}
	if full {
		r.WebGroup.Bolts = wx.g.bolts(wl)
	}
	fq, wq := flangeQty(fl, e.gap), webQty(wl, e.gap)
	r.Quantities, r.Cost = costOf(u, fq, wq)
	r.Quantities.FlangePlateLength, r.Quantities.WebPlateLength = fl.length, wl.length
	if full {
		fs, ws := e.flangeStack(fl), e.webStack(wl)
		r.Assemblies = []GroupAssembly{groupAssembly(b, &fs, fl.fit, fq.bolts), groupAssembly(b, &ws, wl.fit, wq.bolts)}
	}
	r.Notes = e.notes(fl, wl)
	return r
}

// validateProblem checks the parts of a problem that Verify and Size share.
func (p *Problem) validate() error {
	var errs []error
	if err := p.Member.validate(); err != nil {
		errs = append(errs, err)
	}
	if err := p.ULS.validate("uls"); err != nil {
		errs = append(errs, err)
	}
	if p.SLS != nil {
		if err := p.SLS.validate("sls"); err != nil {
			errs = append(errs, err)
		}
	}
	if p.Distribution != "" && p.Distribution != Proportional && p.Distribution != FlangesOnly {
		errs = append(errs, fmt.Errorf("distribution: %q is not one of proportional, flanges-only", p.Distribution))
	}
	for _, err := range []error{p.Factors.validate(), p.Minimum.validate(), p.Detailing.validate(), p.Rates.validate()} {
		if err != nil {
			errs = append(errs, err)
		}
	}
	return errors.Join(errs...)
}

func unitRatesOf(r *Rates, b *boltData, cat Category) (unitRates, error) {
	br, perKg, err := r.boltRate(b.size.Name, b.class.Name)
	if err != nil {
		return unitRates{}, err
	}
	return unitRates{bolt: toMicro(br), boltPerKg: perKg, hole: toMicro(r.Hole), plate: r.PlatePerKg, faying: r.FayingPerM2,
		splice: toMicro(r.Splice), preloaded: cat.Preloaded()}, nil
}

// Verify checks a given splice at one position: every check of EN 1993-1-8 / EN 1993-1-1 the
// package knows, with the quantities and cost. A geometry that cannot be drawn (bolt lines
// outside a plate, missing dimensions) is an error naming the splice-file field; one that can
// be drawn but breaks a rule (a bolt too close to an edge, a plate wider than the flange, a
// non-preloadable class in a slip-resistant joint) gives failing detailing checks.
func Verify(p Problem, g Geometry) (Result, error) {
	var errs []error
	if err := p.validate(); err != nil {
		errs = append(errs, err)
	}
	cat, err := ParseCategory(string(g.Category))
	if err != nil {
		errs = append(errs, fmt.Errorf("category: %w", err))
	}
	fc := g.FrictionClass
	if cat.Preloaded() {
		if fc, err = ParseFrictionClass(string(g.FrictionClass)); err != nil {
			errs = append(errs, fmt.Errorf("friction_class: %w", err))
		}
	}
	holes, err := ParseHoleType(string(g.Holes))
	if err != nil {
		errs = append(errs, fmt.Errorf("holes: %w", err))
	}
	size, err := LookupBoltSize(g.Bolt.Size)
	if err != nil {
		errs = append(errs, fmt.Errorf("bolt.size: %w", err))
	}
	class, err := LookupBoltClass(g.Bolt.Class)
	if err != nil {
		errs = append(errs, fmt.Errorf("bolt.class: %w", err))
	}
	fl, wl, err := g.resolve(p.PlateSteel)
	if err != nil {
		errs = append(errs, err)
	}
	if len(errs) > 0 {
		return Result{}, errors.Join(errs...)
	}
	e, err := newEnv(&p, cat, fc, holes, g.Gap, p.Detailing)
	if err != nil {
		return Result{}, err
	}
	rule, err := ParseShearPlaneRule(string(g.Bolt.ShearPlanes))
	if err != nil {
		return Result{}, fmt.Errorf("bolt.shear_planes: %w", err)
	}
	b, err := newBoltData(e, size, class, rule, g.Bolt.System)
	if err != nil {
		return Result{}, fmt.Errorf("bolt.system: %w", err)
	}
	fs, ws := e.flangeStack(&fl), e.webStack(&wl)
	ff, wf := newGroupFit(&b, &fs), newGroupFit(&b, &ws)
	fl.fit, wl.fit = &ff, &wf
	rates := p.Rates.resolved()
	u, err := unitRatesOf(&rates, &b, cat)
	if err != nil {
		return Result{}, err
	}
	r := assemble(new(evaluator), e, &b, &fl, &wl, &u, !p.Brief)
	r.Status = Checked
	return r, nil
}
