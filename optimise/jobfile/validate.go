package jobfile

import (
	"cmp"
	"maps"
	"math"
	"slices"
	"strconv"
	"strings"
	"unicode/utf8"
)

// LoadJob decodes and checks a job file in one pass: every decoding problem (syntax, unknown
// keys, wrong types, bad units, NaN) and every check that needs no analysis (ranges, counts,
// references between blocks), each with file:line:column and key path. It does not look up
// section or grade names, nor analyse the beam.
//
// The error is nil or a Problems. When the file parsed, the Job is returned even with
// problems, decoded as far as it could be, so the caller can add its own checks to the same
// list; when it did not parse (too large, not YAML, empty) the Job is nil.
func LoadJob(file string, data []byte) (*Job, error) {
	job := new(Job)
	d, parsed := decodeFile(file, data, job)
	if !parsed {
		return nil, d.problems.Err()
	}
	c := newChecker(d)
	c.job(job)
	return job, d.problems.Err()
}

// LoadSpliceFile decodes and checks a fixed-splice file like LoadJob does a job file.
func LoadSpliceFile(file string, data []byte) (*SpliceFile, error) {
	sf := new(SpliceFile)
	d, parsed := decodeFile(file, data, sf)
	if !parsed {
		return nil, d.problems.Err()
	}
	c := newChecker(d)
	c.spliceFile(sf)
	return sf, d.problems.Err()
}

// checker adds the semantic checks to a decoder's problems. A value that already failed to
// decode is not checked again (it holds a zero that would only mislead).
type checker struct {
	failedPaths []string // values that did not decode
	out         *Problems
}

func newChecker(d *Decoder) *checker {
	return &checker{failedPaths: slices.Clone(d.failed), out: &d.problems}
}

// add records a problem unless the value it is about, or one containing it, did not decode.
func (c *checker) add(at Loc, format string, args ...any) {
	if len(*c.out) > maxProblems {
		return // the list is full
	}
	for _, p := range c.failedPaths {
		if ancestorOrSelf(p, at.Path) {
			return
		}
	}
	c.out.Add(at, format, args...)
}

// failed reports whether a value at, inside or around the location's path did not decode: a
// check that sums or counts what is inside (the beam length, the number of supports) is then
// left out.
func (c *checker) failed(at Loc) bool {
	return slices.ContainsFunc(c.failedPaths, func(p string) bool {
		return ancestorOrSelf(p, at.Path) || ancestorOrSelf(at.Path, p)
	})
}

// enum checks that a given string is one of the allowed values.
func (c *checker) enum(m Meta, key, what, got string, allowed []string) {
	if !m.Has(key) || slices.Contains(allowed, got) {
		return
	}
	c.add(m.Where(key), "unknown %s %q%s", what, clip(got), oneOf(got, allowed))
}

// positive checks v > 0 for a present value.
func (c *checker) positive(at Loc, what string, v float64, show string) {
	if !(v > 0) {
		c.add(at, "%s must be greater than 0, got %s", what, show)
	}
}

// nonNegative checks v ≥ 0 for a present value.
func (c *checker) nonNegative(at Loc, what string, v float64, show string) {
	if v < 0 {
		c.add(at, "%s must not be negative, got %s", what, show)
	}
}

// beamLength is the total length when it can be trusted for position checks.
type beamLength struct {
	mm float64
	ok bool
}

func (l beamLength) String() string { return Metres(l.mm).String() }

func (c *checker) job(j *Job) {
	if j.Has("title") {
		c.textLength(j.Where("title"), rangeTitle, j.Title)
	}
	length := c.beam(&j.Beam)
	switch {
	case j.Forces != nil:
		c.imported(j)
	case !j.Has("cases"):
		c.add(j.Where(""), "missing required key %q (or forces: {file: ...} to import the forces of another analysis)", "cases")
	}
	if j.Beam.MemberLength != nil && j.Forces == nil {
		c.add(j.Beam.Where("length"), "beam.length describes a member with no supports of its own, which only imported forces "+
			"(forces: {file: ...}) can load; loads in cases need spans and supports")
	}
	names := c.cases(j, length)
	c.combinations(j.Combinations, names)
	c.spliceOptions(j.Splice)
	c.limits(j.Limits, length)
	c.vehicles(j.Vehicles)
	c.costs(j.Costs, j.Splice)
	c.scan(j.Scan, length)
}

// imported checks a job whose forces come from a table: the table replaces the cases and
// combinations, and the file name must be given (the table itself is read and checked by
// optimise/forcetable).
func (c *checker) imported(j *Job) {
	for _, k := range []string{"cases", "combinations"} {
		if j.Has(k) {
			c.add(j.Where(k), "%s: the forces come from forces.file, so the job has no %s; remove one of the two", k, k)
		}
	}
	if f := j.Forces; f.Has("file") && strings.TrimSpace(f.File) == "" {
		c.add(f.Where("file"), "the forces file name is empty")
	}
	if j.Beam.Has("self_weight") {
		c.add(j.Beam.Where("self_weight"), "self_weight: imported forces already include every load; remove the key")
	}
}

// memberLength checks beam.length, the alternative to spans and supports.
func (c *checker) memberLength(b *Beam) beamLength {
	for _, k := range []string{"spans", "supports", "overhang", "hinges"} {
		if b.Has(k) {
			c.add(b.Where(k), "%s: the beam gives its length, so it has no %s; give either length or spans with supports", k, k)
		}
	}
	l := *b.MemberLength
	if !(l > 0) {
		c.add(b.Where("length"), "the member length must be more than 0, got %s", l)
		return beamLength{}
	}
	return beamLength{mm: l.MM(), ok: c.plausible(b.Where("length"), rangeLength, l.MM())}
}

func (c *checker) beam(b *Beam) beamLength {
	c.section(b.Section)
	if b.Has("grade") && strings.TrimSpace(b.Grade) == "" {
		c.add(b.Where("grade"), "the grade is empty; write a steel grade such as S355")
	}
	c.enum(b.Meta, "grade_table", "grade table", b.GradeTable, []string{GradeTableEN1993, GradeTableEN10025})
	if b.MemberLength != nil {
		return c.memberLength(b)
	}
	for _, k := range []string{"spans", "supports"} {
		if b.Loc.Line > 0 && !b.Has(k) { // (a missing beam block is reported by the decoder)
			c.add(b.Where(""), "missing required key %q (or length, for a member with imported forces)", k)
		}
	}
	ok := !c.failed(b.Where("spans")) && !c.failed(b.Where("overhang"))
	if b.Has("spans") && len(b.Spans) == 0 && ok {
		c.add(b.Where("spans"), "the beam needs at least one span")
		ok = false
	}
	for i, s := range b.Spans {
		at := b.Where(indexPath("spans", i))
		if !(s > 0) {
			c.add(at, "a span must be longer than 0, got %s", s)
			ok = false
			continue
		}
		ok = c.plausible(at, rangeSpan, s.MM()) && ok
	}
	if o := b.Overhang; o != nil {
		for _, side := range []struct {
			key string
			v   Metres
		}{{"left", o.Left}, {"right", o.Right}} {
			if side.v < 0 {
				c.add(o.Where(side.key), "an overhang must not be negative, got %s", side.v)
				ok = false
				continue
			}
			ok = c.plausible(o.Where(side.key), rangeOverhang, side.v.MM()) && ok
		}
	}
	ok = ok && len(b.Spans) > 0
	if ok && !c.failed(b.Where("spans")) {
		// each span and overhang is plausible, so the sum is finite; it may still be too long
		ok = c.plausible(b.Where("spans"), rangeLength, b.Length())
	}
	length := beamLength{mm: b.Length(), ok: ok}
	c.supports(b, length.ok)
	c.hinges(b, length)
	return length
}

func (c *checker) section(s Section) {
	w := s.Welded
	if w == nil {
		return
	}
	dims := []struct {
		key string
		v   Millimetres
	}{{"h", w.H}, {"b", w.B}, {"tw", w.Tw}, {"tf", w.Tf}}
	ranges := map[string]int{"h": rangeWeldedH, "b": rangeWeldedB, "tw": rangeWeldedTw, "tf": rangeWeldedTf}
	allGood := true
	for _, dim := range dims {
		if !w.Has(dim.key) {
			continue
		}
		if !(dim.v > 0) {
			c.add(w.Where(dim.key), "%s must be greater than 0, got %s", dim.key, dim.v)
			allGood = false
			continue
		}
		allGood = c.plausible(w.Where(dim.key), ranges[dim.key], dim.v.MM()) && allGood
	}
	throatGood := c.weldThroat(w)
	if !allGood || c.failed(w.Meta.Loc) {
		return
	}
	if 2*w.Tf >= w.H {
		c.add(w.Where("tf"), "two flanges of tf = %s leave no web in h = %s", w.Tf, w.H)
		return
	}
	if w.Tw >= w.B {
		c.add(w.Where("tw"), "the web (tw = %s) is not narrower than the flange (b = %s)", w.Tw, w.B)
		return
	}
	if !throatGood || w.WeldThroat == nil {
		return
	}
	// the welds' legs √2·a must leave a web between them and a flange outstand beside them
	leg := math.Sqrt2 * w.WeldThroat.MM()
	if hw, out := w.H.MM()-2*w.Tf.MM(), (w.B.MM()-w.Tw.MM())/2; !(2*leg < hw && leg < out) {
		c.add(w.Where("weld_throat"), "welds of throat a = %s have legs √2·a = %s, which leave no web between them "+
			"(h − 2tf = %s) or no flange outstand beside them ((b − tw)/2 = %s)", *w.WeldThroat, Millimetres(leg),
			Millimetres(hw), Millimetres(out))
	}
}

// weldThroat checks a welded section's weld throat: more than 0 and in the plausible range.
func (c *checker) weldThroat(w *Welded) bool {
	if w.WeldThroat == nil {
		return true
	}
	at := w.Where("weld_throat")
	if a := *w.WeldThroat; !(a > 0) {
		c.positive(at, "the weld throat", a.MM(), a.String())
		return false
	}
	return c.plausible(at, rangeWeldThroat, w.WeldThroat.MM())
}

func (c *checker) supports(b *Beam, spansOK bool) {
	if spansOK && b.Has("supports") && !c.failed(b.Where("supports")) && len(b.Supports) != len(b.Spans)+1 {
		c.add(b.Where("supports"), "%d span(s) need %d supports, one per span end; got %d",
			len(b.Spans), len(b.Spans)+1, len(b.Supports))
	}
	for _, s := range b.Supports {
		if !slices.Contains(SupportTypes(), s.Type) {
			where := s.Meta.Loc
			if s.Has("type") {
				where = s.Where("type")
			}
			c.add(where, "unknown support type %q%s", clip(s.Type), oneOf(s.Type, SupportTypes()))
			continue
		}
		switch {
		case s.Type == SupportSpring && s.K == nil:
			c.add(s.Meta.Loc, "a spring support needs its stiffness: {type: spring, k: 50000} (kN/m)")
		case s.Type == SupportSpring && !(s.K.NPerMM() > 0):
			c.positive(s.Where("k"), "a spring stiffness", s.K.NPerMM(), s.K.String())
		case s.Type == SupportSpring:
			c.plausible(s.Where("k"), rangeSpring, s.K.NPerMM())
		case s.K != nil:
			c.add(s.Where("k"), "k applies to spring supports only; this one is %s", s.Type)
		}
	}
}

func (c *checker) hinges(b *Beam, length beamLength) {
	if !length.ok {
		return
	}
	seen := make(map[Metres]int)
	for i, h := range b.Hinges {
		at := b.Where(indexPath("hinges", i))
		if !(h > 0 && h.MM() < length.mm) {
			c.add(at, "a hinge at %s is not inside the beam (0 to %s)", h, length)
			continue
		}
		if first, dup := seen[h]; dup {
			c.add(at, "a second hinge at %s (hinges[%d])", h, first)
			continue
		}
		seen[h] = i
	}
}

// cases checks every load case and returns the names combinations may use (SW included when
// the self weight is on).
func (c *checker) cases(j *Job, length beamLength) []string {
	selfWeight := j.Beam.IncludesSelfWeight()
	if j.Has("cases") && len(j.Cases) == 0 && !c.failed(j.Where("cases")) {
		c.add(j.Where("cases"), "at least one load case is needed")
	}
	var names []string
	for _, e := range j.Cases {
		names = append(names, e.Key)
		switch {
		case strings.TrimSpace(e.Key) == "":
			c.add(e.Loc, "a case needs a name")
		case utf8.RuneCountInString(e.Key) > MaxNameLength:
			c.textLength(e.Loc, rangeName, e.Key)
		case e.Key == SelfWeightCase && selfWeight:
			how := "self_weight: true"
			if j.Beam.SelfWeight == nil {
				how = "self_weight is on unless set to false"
			}
			c.add(e.Loc, "the case name %q is taken by the self weight (%s); rename the case or set self_weight: false",
				SelfWeightCase, how)
		}
		c.loadCase(e.Value, length)
	}
	if selfWeight && !slices.Contains(names, SelfWeightCase) {
		names = append(names, SelfWeightCase)
	}
	return names
}

func (c *checker) loadCase(lc Case, length beamLength) {
	c.enum(lc.Meta, "kind", "case kind", lc.Kind, CaseKinds())
	switch lc.Kind {
	case KindImposed:
		c.enum(lc.Meta, "category", "imposed load category", lc.Category, ImposedCategories())
		if !lc.Has("category") && lc.Psi == nil {
			c.add(lc.Meta.Loc, "an imposed case needs a category (A to H, EN 1990 Table A1.1) or psi")
		}
	case KindSnow:
		c.enum(lc.Meta, "category", "snow category", lc.Category, SnowCategories())
	default:
		if lc.Has("category") {
			c.add(lc.Where("category"), "category applies to imposed and snow cases, not %s", clip(lc.Kind))
		}
	}
	if lc.Kind == KindPermanent {
		if lc.Pattern != nil && *lc.Pattern {
			c.add(lc.Where("pattern"), "a permanent case is not patterned: a permanent action from one source takes one γG over the whole beam")
		}
		if lc.Has("psi") {
			c.add(lc.Where("psi"), "psi applies to variable actions, not to a permanent case")
		}
	}
	if lc.Kind == KindOther && !lc.Has("psi") {
		c.add(lc.Meta.Loc, "an 'other' case needs psi: [ψ0, ψ1, ψ2] (EN 1990 Table A1.1 has no row for it; temperature is kind thermal)")
	}
	if lc.Psi != nil {
		for i, psi := range lc.Psi {
			if psi < 0 || psi > 1 {
				c.add(lc.Where(indexPath("psi", i)), "ψ%d must lie between 0 and 1, got %s", i, formatNumber(psi))
			}
		}
	}
	switch {
	case !lc.Has("loads"):
		c.add(lc.Meta.Loc, "the case has no loads")
	case len(lc.Loads) == 0:
		c.add(lc.Where("loads"), "the list of loads is empty")
	}
	for _, l := range lc.Loads {
		c.load(l, length)
	}
}

func (c *checker) load(l Load, length beamLength) {
	c.loadValue(l)
	if !length.ok || l.Kind == "" {
		return
	}
	onBeam := func(key string, x Metres) bool {
		if x < 0 || x.MM() > length.mm {
			c.add(l.Where(key), "position %s is off the beam (0 to %s)", x, length)
			return false
		}
		return true
	}
	if !l.Distributed() {
		onBeam("at", l.At)
		return
	}
	ends := true
	if l.From != nil {
		ends = onBeam("from", *l.From) && ends
	}
	if l.To != nil {
		ends = onBeam("to", *l.To) && ends
	}
	from, to := l.Range(length.mm)
	if ends && !(from < to) {
		key := "to"
		if l.To == nil {
			key = "from"
		}
		c.add(l.Where(key), "from (%s) must be less than to (%s)", Metres(from), Metres(to))
	}
}

// loadValue checks a load's intensity against its plausible range, at its own key.
func (c *checker) loadValue(l Load) {
	switch l.Kind {
	case LoadUDL:
		c.plausible(l.Where(LoadUDL), rangeUDL, l.W[0].NPerMM())
	case LoadTrapezoid:
		for i, w := range l.W {
			c.plausible(l.Where(indexPath(LoadTrapezoid, i)), rangeTrapezoid, w.NPerMM())
		}
	case LoadPoint:
		c.plausible(l.Where(LoadPoint), rangePoint, l.P.N())
	case LoadMoment:
		c.plausible(l.Where(LoadMoment), rangeMoment, l.M.NMM())
	case LoadAxial:
		c.plausible(l.Where(LoadAxial), rangeAxial, l.P.N())
	}
}

func (c *checker) combinations(cb *Combinations, caseNames []string) {
	if cb == nil {
		return
	}
	c.enum(cb.Meta, "rules", "rule set", cb.Rules, []string{RulesEN1990})
	c.enum(cb.Meta, "uls", "ULS combination", cb.ULS, []string{ULS610, ULS610ab})
	c.enum(cb.Meta, "sls", "SLS combination", cb.SLS, []string{SLSCharacteristic, SLSFrequent, SLSQuasiPermanent})
	for _, o := range cb.Overrides {
		switch {
		case !slices.Contains(OverrideKeys(), o.Key):
			c.add(o.Loc, "unknown override %q%s", clip(o.Key), oneOf(o.Key, OverrideKeys()))
		case o.Key == "xi" && !(o.Value > 0 && o.Value <= 1):
			c.add(o.Loc, "xi must lie in (0, 1], got %s", formatNumber(o.Value))
		default:
			c.nonNegative(o.Loc, o.Key, o.Value, formatNumber(o.Value))
		}
	}
	if sup, ok := cb.Overrides.Get("gamma_G_sup"); ok {
		if inf, ok := cb.Overrides.Get("gamma_G_inf"); ok && inf > sup {
			c.add(cb.Where("overrides.gamma_G_inf"), "gamma_G_inf (%s) exceeds gamma_G_sup (%s)",
				formatNumber(inf), formatNumber(sup))
		}
	}
	seen := make(map[string]int)
	for i, x := range cb.Extra {
		if x.Has("name") {
			if first, dup := seen[x.Name]; dup {
				c.add(x.Where("name"), "a second combination named %q (extra[%d])", clip(x.Name), first)
			} else if strings.TrimSpace(x.Name) == "" {
				c.add(x.Where("name"), "a combination needs a name")
			} else {
				c.textLength(x.Where("name"), rangeName, x.Name)
			}
			seen[x.Name] = i
		}
		c.enum(x.Meta, "state", "limit state", x.State, []string{StateULS, StateSLS})
		if x.Has("factors") && len(x.Factors) == 0 && !c.failed(x.Where("factors")) {
			c.add(x.Where("factors"), "a combination needs at least one factor")
		}
		for _, f := range x.Factors {
			if !slices.Contains(caseNames, f.Key) {
				c.add(f.Loc, "case %q is not defined (cases: %s)%s", clip(f.Key),
					strings.Join(caseNames, ", "), didYouMean(f.Key, caseNames))
			}
			c.nonNegative(f.Loc, "a factor", f.Value, formatNumber(f.Value))
		}
	}
}

// didYouMean returns `; did you mean "x"?` or "".
func didYouMean(got string, allowed []string) string {
	if g := Suggest(got, allowed); g != "" {
		return "; did you mean " + strconv.Quote(g) + "?"
	}
	return ""
}

func (c *checker) spliceOptions(s *SpliceOptions) {
	if s == nil {
		return
	}
	c.enum(s.Meta, "category", "splice category", s.Category, SpliceCategories())
	c.enum(s.Meta, "friction_class", "friction class", s.FrictionClass, FrictionClasses())
	c.enum(s.Meta, "distribution", "force distribution", s.Distribution,
		[]string{DistributionProportional, DistributionFlangesOnly})
	if m := s.MinimumForces; m != nil {
		for _, f := range []struct {
			key string
			v   *float64
		}{{"moment", m.Moment}, {"shear", m.Shear}, {"axial", m.Axial}} {
			if f.v != nil && !(*f.v >= 0 && *f.v <= 1) {
				c.add(m.Where(f.key), "minimum_forces.%s: %g is not a fraction of the resistance between 0 and 1", f.key, *f.v)
			}
		}
	}
	if b := s.Bolts; b != nil {
		list(c, b.Meta, "sizes", "bolt sizes", b.Sizes, c.boltSize)
		list(c, b.Meta, "classes", "bolt classes", b.Classes, func(at Loc, class string) {
			c.boltClass(at, class, s.Category)
		})
		c.boltBounds(b)
	}
	if d := s.Detailing; d != nil {
		c.detailing(d)
	}
	if p := s.Plates; p != nil {
		if p.Has("grade") && strings.TrimSpace(p.Grade) == "" {
			c.add(p.Where("grade"), "the plate grade is empty; write a steel grade such as S355")
		}
		list(c, p.Meta, "thicknesses", "plate thicknesses", p.Thicknesses, func(at Loc, t Millimetres) {
			c.plateThickness(at, "a plate thickness", t)
		})
	}
	list(c, s.Meta, "flange_plates", "flange plate arrangements", s.FlangePlates, func(at Loc, f string) {
		if !slices.Contains([]string{FlangeOuter, FlangeOuterInner}, f) {
			c.add(at, "unknown flange plate arrangement %q%s", clip(f), oneOf(f, []string{FlangeOuter, FlangeOuterInner}))
		}
	})
	if s.Gap != nil {
		c.gap(s.Where("gap"), *s.Gap)
	}
	if a := s.Assemblies; a != nil {
		c.enum(a.Meta, "shear_planes", "shear-plane rule", a.ShearPlanes, ShearPlaneRules())
		c.assemblySystem(a.Meta, a.System, s.Category)
	}
}

// assemblySystem checks an assembly system against the splice category: the EN 14399 systems
// (HR, HV) are for preloaded bolts, categories B and C; the ISO ones for category A. The
// classes a system is made in are checked where the classes are resolved (optimise).
func (c *checker) assemblySystem(m Meta, system, category string) {
	c.enum(m, "system", "bolting assembly system", system, AssemblySystems())
	if !m.Has("system") || !slices.Contains(AssemblySystems(), system) {
		return
	}
	preloaded := category == CategoryB || category == CategoryC
	if category == "" {
		category = CategoryA
	}
	switch {
	case PreloadedSystem(system) && !preloaded:
		c.add(m.Where("system"), "%s assemblies are for preloaded bolts; a category %s splice takes %s or %s", system, clip(category), SystemISO4014, SystemISO4017)
	case !PreloadedSystem(system) && preloaded:
		c.add(m.Where("system"), "%s assemblies cannot be preloaded; a category %s splice takes %s or %s", system, clip(category), SystemHV, SystemHR)
	}
}

// textLength checks the length of a text in characters against a plausible range.
func (c *checker) textLength(at Loc, id int, text string) bool {
	return c.plausible(at, id, float64(utf8.RuneCountInString(text)))
}

// plateThickness checks a cover plate thickness: more than 0, and in the plausible range.
func (c *checker) plateThickness(at Loc, what string, t Millimetres) {
	if !(t > 0) {
		c.positive(at, what, t.MM(), t.String())
		return
	}
	c.plausible(at, rangePlate, t.MM())
}

// gap checks the gap between the beam ends: not negative, and in the plausible range.
func (c *checker) gap(at Loc, g Millimetres) {
	if g < 0 {
		c.nonNegative(at, "the gap", g.MM(), g.String())
		return
	}
	c.plausible(at, rangeGap, g.MM())
}

// list checks a present list is not empty, has no repeated entry, and each entry passes each.
func list[T comparable](c *checker, m Meta, key, what string, xs []T, each func(Loc, T)) {
	if !m.Has(key) || c.failed(m.Where(key)) {
		return
	}
	if len(xs) == 0 {
		c.add(m.Where(key), "the list of %s is empty", what)
	}
	if !c.plausible(m.Where(key), rangeList, float64(len(xs))) {
		return
	}
	seen := make(map[T]int)
	for i, x := range xs {
		at := m.Where(indexPath(key, i))
		if first, dup := seen[x]; dup {
			c.add(at, "%v is listed twice (also [%d])", x, first)
			continue
		}
		seen[x] = i
		each(at, x)
	}
}

// boltBounds checks min_size and max_size: metric sizes, the smaller first.
func (c *checker) boltBounds(b *BoltOptions) {
	ok := true
	for _, k := range []struct{ key, v string }{{"min_size", b.MinSize}, {"max_size", b.MaxSize}} {
		if b.Has(k.key) && !isBoltSize(k.v) {
			c.boltSize(b.Where(k.key), k.v)
			ok = false
		}
	}
	if ok && b.Has("min_size") && b.Has("max_size") && boltDiameter(b.MinSize) > boltDiameter(b.MaxSize) {
		c.add(b.Where("min_size"), "min_size %s is larger than max_size %s", b.MinSize, b.MaxSize)
	}
}

// boltDiameter is the diameter of a metric size that isBoltSize accepts [mm].
func boltDiameter(size string) int {
	d, _ := strconv.Atoi(strings.TrimPrefix(size, "M"))
	return d
}

// detailing checks the detailing preferences that need no section: sizes and ratios in
// range, gauge or gauges but not both, each gauge narrower than the flange it is for and each
// width listed once. Whether a gauge can be detailed on the section is optimise's check.
func (c *checker) detailing(d *Detailing) {
	if g := d.Gauge; g != nil {
		c.gauge(d.Where("gauge"), "a gauge", *g)
	}
	if d.Has("gauge") && d.Has("gauges") {
		c.add(d.Where("gauges"), "give gauge (one gauge for every section) or gauges (a gauge by flange width), not both")
	}
	if d.Has("gauges") && len(d.Gauges) == 0 && !c.failed(d.Where("gauges")) {
		c.add(d.Where("gauges"), "the list of gauges is empty")
	}
	if c.plausible(d.Where("gauges"), rangeList, float64(len(d.Gauges))) {
		seen := make(map[Millimetres]int)
		for i, e := range d.Gauges {
			widthOK := e.Has("width") && e.Width > 0 && c.plausible(e.Where("width"), rangeGaugeWidth, e.Width.MM())
			if e.Has("width") && !(e.Width > 0) {
				c.positive(e.Where("width"), "a flange width", e.Width.MM(), e.Width.String())
			}
			gaugeOK := e.Has("gauge") && c.gauge(e.Where("gauge"), "a gauge", e.Gauge)
			if widthOK {
				if first, dup := seen[e.Width]; dup {
					c.add(e.Where("width"), "a second gauge for flanges %s wide (gauges[%d])", e.Width, first)
				}
				seen[e.Width] = i
			}
			if widthOK && gaugeOK && e.Gauge >= e.Width {
				c.add(e.Where("gauge"), "a gauge of %s is not less than the flange width %s it is for", e.Gauge, e.Width)
			}
		}
	}
	if r := d.MinPlateToFlange; r != nil && !(*r > 0 && *r <= MaxPlateToFlange) {
		c.add(d.Where("min_plate_to_flange"), "min_plate_to_flange: %s is not a ratio of cover-plate to flange thickness "+
			"above 0 and at most %s (0.5 to 1 are usual)", formatNumber(*r), formatNumber(MaxPlateToFlange))
	}
}

// gauge checks a preferred flange gauge: more than 0, and in the plausible range.
func (c *checker) gauge(at Loc, what string, g Millimetres) bool {
	if !(g > 0) {
		c.positive(at, what, g.MM(), g.String())
		return false
	}
	return c.plausible(at, rangeGauge, g.MM())
}

func (c *checker) boltSize(at Loc, size string) {
	if !isBoltSize(size) {
		c.add(at, "bolt size %q is not a metric size such as M20", clip(size))
	}
}

// isBoltSize reports whether s reads "M" and a whole diameter in mm.
func isBoltSize(s string) bool {
	d, ok := strings.CutPrefix(s, "M")
	return ok && d != "" && d[0] != '0' && digitsAt(d, 0) == len(d) && len(d) <= 3
}

func (c *checker) boltClass(at Loc, class, category string) {
	if !slices.Contains(BoltClasses(), class) {
		c.add(at, "unknown bolt class %q%s", clip(class), oneOf(class, BoltClasses()))
		return
	}
	if (category == CategoryB || category == CategoryC) && !PreloadableClass(class) {
		c.add(at, "class %s bolts cannot be preloaded (EN 1993-1-8 3.1.2: 8.8 and 10.9 only), as category %s needs",
			class, category)
	}
}

func (c *checker) limits(l *Limits, length beamLength) {
	if l == nil {
		return
	}
	if l.MaxPieceLength != nil {
		c.positive(l.Where("max_piece_length"), "max_piece_length", l.MaxPieceLength.MM(), l.MaxPieceLength.String())
	}
	if l.MinPieceLength != nil {
		c.nonNegative(l.Where("min_piece_length"), "min_piece_length", l.MinPieceLength.MM(), l.MinPieceLength.String())
	}
	if l.MaxPieceMass != nil {
		c.positive(l.Where("max_piece_mass"), "max_piece_mass", l.MaxPieceMass.KG(), l.MaxPieceMass.String())
	}
	if l.Rigging != nil {
		c.nonNegative(l.Where("rigging"), "rigging", l.Rigging.KG(), l.Rigging.String())
	}
	if l.MinPieceLength != nil && l.MaxPieceLength != nil && *l.MaxPieceLength > 0 &&
		*l.MinPieceLength >= *l.MaxPieceLength {
		c.add(l.Where("min_piece_length"), "min_piece_length (%s) must be less than max_piece_length (%s)",
			*l.MinPieceLength, *l.MaxPieceLength)
	}
	if k := l.KeepOut; k != nil {
		c.keepOut(k, length)
	}
	if d := l.Deflection; d != nil {
		for _, r := range []struct {
			key string
			v   *float64
		}{{"span", d.Span}, {"overhang", d.Overhang}} {
			if r.v != nil && !(*r.v >= MinDeflectionRatio && *r.v <= MaxDeflectionRatio) {
				c.add(d.Where(r.key), "deflection.%s: %g is not a span/deflection ratio between %g and %g (L/%g is usual for spans)",
					r.key, *r.v, MinDeflectionRatio, MaxDeflectionRatio, 250.0)
			}
		}
	}
	if s := l.Splices; s != nil {
		for _, k := range []struct {
			key string
			v   *int
		}{{"min", s.Min}, {"max", s.Max}} {
			switch {
			case k.v == nil:
			case *k.v < 0:
				c.add(s.Where(k.key), "splices.%s must not be negative, got %d", k.key, *k.v)
			default:
				c.plausible(s.Where(k.key), rangeSplices, float64(*k.v))
			}
		}
		if s.Min != nil && s.Max != nil && *s.Min > *s.Max {
			c.add(s.Where("min"), "splices.min (%d) exceeds splices.max (%d)", *s.Min, *s.Max)
		}
	}
}

func (c *checker) keepOut(k *KeepOut, length beamLength) {
	if k.Supports != nil {
		c.nonNegative(k.Where("supports"), "keep_out.supports", k.Supports.MM(), k.Supports.String())
	}
	if k.PointLoads != nil {
		c.nonNegative(k.Where("point_loads"), "keep_out.point_loads", k.PointLoads.MM(), k.PointLoads.String())
	}
	type span struct {
		i      int
		lo, hi Metres
	}
	var good []span
	for i, r := range k.Ranges {
		at := k.Where(indexPath("ranges", i))
		if c.failed(at) {
			continue
		}
		switch {
		case !(r[0] < r[1]):
			c.add(at, "the range [%s, %s] is inverted or empty: write [from, to] with from < to", r[0], r[1])
			continue
		case length.ok && (r[0] < 0 || r[1].MM() > length.mm):
			c.add(at, "the range [%s, %s] is not on the beam (0 to %s)", r[0], r[1], length)
		}
		good = append(good, span{i, r[0], r[1]})
	}
	slices.SortStableFunc(good, func(a, b span) int { return cmp.Compare(a.lo, b.lo) })
	for j := 1; j < len(good); j++ {
		prev, cur := good[j-1], good[j]
		if cur.lo < prev.hi {
			later, earlier := cur, prev
			if later.i < earlier.i {
				later, earlier = earlier, later
			}
			c.add(k.Where(indexPath("ranges", later.i)), "the range [%s, %s] overlaps ranges[%d] [%s, %s]; merge them",
				later.lo, later.hi, earlier.i, earlier.lo, earlier.hi)
		}
	}
}

func (c *checker) vehicles(vs []Vehicle) {
	seen := make(map[string]int)
	for i, v := range vs {
		if v.Has("name") {
			if first, dup := seen[v.Name]; dup {
				c.add(v.Where("name"), "a second vehicle named %q (vehicles[%d])", clip(v.Name), first)
			} else if strings.TrimSpace(v.Name) == "" {
				c.add(v.Where("name"), "a vehicle needs a name")
			} else {
				c.textLength(v.Where("name"), rangeName, v.Name)
			}
			seen[v.Name] = i
		}
		if v.Has("max_length") {
			c.positive(v.Where("max_length"), "max_length", v.MaxLength.MM(), v.MaxLength.String())
		}
		switch {
		case !v.Has("payload"):
		case !(v.Payload > 0):
			c.positive(v.Where("payload"), "payload", v.Payload.KG(), v.Payload.String())
		default:
			c.plausible(v.Where("payload"), rangePayload, v.Payload.KG())
		}
		if v.Has("cost") {
			c.rate(v.Where("cost"), "cost", v.Cost)
		}
	}
}

func (c *checker) costs(k *Costs, s *SpliceOptions) {
	if k == nil {
		return
	}
	for _, e := range k.Bolt {
		if !isBoltSize(e.Key) {
			c.add(e.Loc, "bolt size %q is not a metric size such as M20", clip(e.Key))
		}
		c.rate(e.Loc, "a bolt rate", e.Value)
	}
	for _, e := range k.BoltClassFactor {
		if !slices.Contains(BoltClasses(), e.Key) {
			c.add(e.Loc, "unknown bolt class %q%s", clip(e.Key), oneOf(e.Key, BoltClasses()))
		}
		if e.Value > 0 {
			c.plausible(e.Loc, rangeClassFactor, e.Value)
		} else {
			c.positive(e.Loc, "a class factor", e.Value, formatNumber(e.Value))
		}
	}
	rates := []struct {
		key string
		v   *float64
	}{{"plate_per_kg", k.PlatePerKg}, {"hole", k.Hole}, {"faying_per_m2", k.FayingPerM2},
		{"splice", k.Splice}, {"lift", k.Lift}, {"assembly_per_kg", k.AssemblyPerKg}}
	for _, r := range rates {
		if r.v != nil {
			c.rate(k.Where(r.key), r.key, *r.v)
		}
	}
	if len(k.Bolt) == 0 || s == nil || s.Bolts == nil {
		return
	}
	for i, size := range s.Bolts.Sizes {
		if isBoltSize(size) && !k.Bolt.Has(size) {
			c.add(s.Bolts.Where(indexPath("sizes", i)), "costs.bolt has no rate for %s (rates for: %s)",
				size, strings.Join(k.Bolt.Keys(), ", "))
		}
	}
}

// rate checks a rate or a cost: not negative, and in the plausible range.
func (c *checker) rate(at Loc, what string, v float64) {
	if v < 0 {
		c.nonNegative(at, what, v, formatNumber(v))
		return
	}
	c.plausible(at, rangeRate, v)
}

func (c *checker) scan(s *Scan, length beamLength) {
	if s == nil {
		return
	}
	if s.Step != nil {
		at := s.Where("step")
		switch step := s.Step.MM(); {
		case !(step > 0):
			c.positive(at, "the scan step", step, s.Step.String())
		case !c.plausible(at, rangeStep, step):
		case length.ok && step > length.mm:
			c.add(at, "the scan step %s exceeds the beam length %s", *s.Step, length)
		case length.ok && ScanPositions(length.mm, step) > MaxCandidates:
			c.add(at, "a scan of %d positions (a step of %s on the %s beam) is outside the plausible range (%s); take a coarser step",
				ScanPositions(length.mm, step), s.Step, length, plausibleRange(rangePositions).Text)
		}
	}
	if a := s.Alternatives; a != nil {
		if *a < 0 {
			c.add(s.Where("alternatives"), "alternatives must not be negative, got %d", *a)
		} else {
			c.plausible(s.Where("alternatives"), rangeAlternatives, float64(*a))
		}
	}
}

// ScanPositions is the number of candidate positions on a beam of the given length [mm] at
// a step [mm]: every step from the left end, strictly inside the beam. The scan places them
// so (optimise.Grid), and refuses more than MaxCandidates.
func ScanPositions(length, step float64) int {
	return int(math.Ceil(length/step-1e-9)) - 1
}

func (c *checker) spliceFile(sf *SpliceFile) {
	b := sf.Bolt
	if b.Has("size") {
		c.boltSize(b.Where("size"), b.Size)
	}
	if b.Has("class") {
		c.boltClass(b.Where("class"), b.Class, sf.Category)
	}
	c.assemblySystem(b.Meta, b.System, sf.Category)
	if b.System == SystemHV && b.Has("class") && b.Class != "10.9" && slices.Contains(BoltClasses(), b.Class) {
		c.add(b.Where("system"), "HV assemblies (EN 14399-4) are made in class 10.9 only, not %s; use HR", b.Class)
	}
	c.enum(sf.Meta, "category", "splice category", sf.Category, SpliceCategories())
	c.enum(sf.Meta, "friction_class", "friction class", sf.FrictionClass, FrictionClasses())
	if (sf.Category == CategoryB || sf.Category == CategoryC) && !sf.Has("friction_class") {
		c.add(sf.Where("category"), "a category %s (slip-resistant) splice needs friction_class (%s)",
			sf.Category, strings.Join(FrictionClasses(), ", "))
	}
	c.enum(sf.Meta, "holes", "hole type", sf.Holes, []string{HolesNormal, HolesOversize})
	if sf.Has("gap") {
		c.gap(sf.Where("gap"), sf.Gap)
	}
	c.flangeSpec(&sf.Flange)
	c.webSpec(&sf.Web)
}

// sizes checks that each present size is greater than 0.
func (c *checker) sizes(m Meta, sizes map[string]Millimetres) {
	for _, k := range slices.Sorted(maps.Keys(sizes)) {
		if m.Has(k) {
			c.positive(m.Where(k), k, sizes[k].MM(), sizes[k].String())
		}
	}
}

func (c *checker) plateSpec(p *PlateSpec) {
	c.sizes(p.Meta, map[string]Millimetres{"width": p.Width})
	if p.Has("thickness") {
		c.plateThickness(p.Where("thickness"), "thickness", p.Thickness)
	}
}

func (c *checker) flangeSpec(f *FlangeSpec) {
	if !f.Has("") {
		return
	}
	c.plateSpec(&f.Outer)
	if f.Inner != nil {
		c.plateSpec(f.Inner)
	}
	c.sizes(f.Meta, map[string]Millimetres{"gauge": f.Gauge, "end": f.End, "edge": f.Edge})
	if f.Has("columns") && f.Columns != 2 && f.Columns != 4 {
		c.add(f.Where("columns"), "a flange has 2 or 4 bolt lines, got %d", f.Columns)
	}
	c.rowsAndPitch(f.Meta, "rows", f.Rows, "pitch", f.Pitch)
}

func (c *checker) webSpec(w *WebSpec) {
	if !w.Has("") {
		return
	}
	c.sizes(w.Meta, map[string]Millimetres{"depth": w.Depth, "end": w.End, "edge": w.Edge})
	if w.Has("thickness") {
		c.plateThickness(w.Where("thickness"), "thickness", w.Thickness)
	}
	c.rowsAndPitch(w.Meta, "columns", w.Columns, "spacing", w.Spacing)
	c.rowsAndPitch(w.Meta, "rows", w.Rows, "pitch", w.Pitch)
}

// rowsAndPitch checks a bolt count (≥ 1) and the spacing it needs when above 1.
func (c *checker) rowsAndPitch(m Meta, countKey string, count int, spacingKey string, spacing *Millimetres) {
	if !m.Has(countKey) || c.failed(m.Where(countKey)) {
		return
	}
	if count < 1 {
		c.add(m.Where(countKey), "%s must be at least 1, got %d", countKey, count)
		return
	}
	switch {
	case spacing != nil:
		c.positive(m.Where(spacingKey), spacingKey, spacing.MM(), spacing.String())
	case count > 1:
		c.add(m.Where(countKey), "%d %s need %s (mm)", count, countKey, spacingKey)
	}
}
