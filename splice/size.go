package splice

import (
	"cmp"
	"errors"
	"fmt"
	"math"
	"slices"
)

// Size finds the cheapest splice in p.Sizing.Space that passes every check at this position.
//
// The result is exactly the one SizeExhaustive finds. The search uses three facts that hold by
// construction: the flange checks depend only on the bolt and the flange configuration and the
// web checks only on the bolt and the web configuration, so with the bolt fixed the cheapest
// splice is the cheapest flange plus the cheapest web; the cost (and the tie-breaks, fewer bolts
// then lighter plates) never falls when a thickness, a column or a row is added, so the scan
// of each list stops at the first passing entry or at the first entry dearer than the best so
// far; and no configuration with fewer bolts than the shear (or slip) resistance needs can pass.
// Costs are summed in whole micro-units, so these comparisons are exact.
//
// When nothing passes, the result (Status NoFeasible) is the configuration with the lowest
// utilisation, cheapest among equals, with its governing check; that search visits every
// configuration.
func Size(p Problem) (Result, error) {
	s, err := newSearcher(&p)
	if err != nil {
		return Result{}, err
	}
	return s.size()
}

// SizeExhaustive evaluates every combination of the design space with every check and returns
// the same result as Size. It exists to prove Size; it is slow.
func SizeExhaustive(p Problem) (Result, error) {
	s, err := newSearcher(&p)
	if err != nil {
		return Result{}, err
	}
	return s.exhaustive()
}

// plan is what a search owes to its problem but not to the forces: the resolved design space,
// the member's and the plates' detailing rules, the bolts with their rates, the check groups
// of the category and the grids of the memos. Size resolves it for each call; a Sizer once,
// and shares it read only between its searches.
type plan struct {
	base   env // the environment without the actions
	sp     space
	sr     sectionRules
	hr     []holeRules // per bolt size
	cr     []capRules  // per plate thickness
	crTf   capRules    // for the beam flange as the thinner outer part
	bolts  []boltData  // index = size index × classes + class index
	rates  []unitRates
	fuMax  float64       // the largest plate fu of the design space [N/mm²]
	groups *sizingGroups // the checks of the category, by sizing step (table.go)
	// The grids of the memos (see searcher).
	gridA, gridW       grid
	gridR0F, gridR0W   grid
	gridFitF, gridFitW grid
	nth                int
	nfc                int
	nwc                int
	nwr                int
	nclass             int
}

type searcher struct {
	*plan
	p       *Problem
	e       *env       // the plan's environment with the actions of p's forces
	scan    evaluator  // the candidate being scanned, and the result
	rowFree flangeSlot // the row-free flange checks, which run inside a flange scan
	measure flangeEval // the part flangeMeasure evaluates, on the part's own layout
	// the layouts flangeHeld and webHeld build without a Sizer
	scratchF heldFlange
	scratchW heldWeb
	// Memos of the groups that do not depend on the bolt class, and the first admissible rows,
	// each over a grid of design-space indices: 0 unknown, 1 pass, 2 fail.
	memoA, memoW []int8 // groupFlangeRowFree on gridA, groupWebPlates on gridW
	// rowFreeU is the utilisation of groupFlangeRowFree's force checks on gridA, for the
	// closest attempt (sizeInfeasible); allocated there, −1 unknown.
	rowFreeU []float64
	r0F, r0W []int // flangeFirstRows on gridR0F, webFirstRows on gridR0W
	// The bolt assemblies of the plies, found when a layout first needs them: per bolt, outer
	// thickness and inner thickness (0 none, i+1 thickness i) for the flange, per bolt and
	// plate thickness for the web.
	fitF, fitW []int32 // 0 not yet chosen, else 1 + the index in fits
	fits       fitPool
	evals      int
	parts      []boltParts   // a Sizer's layouts of each bolt; nil: listed per call
	hold       []heldLayouts // a Sizer's layouts built so far; nil: built per call
}

// newSearcher resolves p and prepares the search at its forces; the errors name every field
// of p that is wrong, forces included.
func newSearcher(p *Problem) (*searcher, error) {
	pl, err := newPlan(p)
	if err != nil {
		return nil, err
	}
	return pl.searcher(p, nil, nil), nil
}

// newPlan resolves p (its forces are validated, not used).
func newPlan(p *Problem) (*plan, error) {
	var errs []error
	if err := p.validate(); err != nil {
		errs = append(errs, err)
	}
	z := p.Sizing
	cat, err := ParseCategory(string(z.Category))
	if err != nil {
		errs = append(errs, fmt.Errorf("splice.category: %w", err))
	}
	fc := z.FrictionClass
	if cat.Preloaded() {
		if fc, err = ParseFrictionClass(string(z.FrictionClass)); err != nil {
			errs = append(errs, fmt.Errorf("splice.friction_class: %w", err))
		}
	}
	holes, err := ParseHoleType(string(z.Holes))
	if err != nil {
		errs = append(errs, fmt.Errorf("splice.holes: %w", err))
	}
	if !(z.Gap >= 0) || math.IsInf(z.Gap, 0) {
		errs = append(errs, fmt.Errorf("splice.gap: %g mm must not be negative", z.Gap))
	}
	sp, err := z.Space.resolve(cat, p.PlateSteel)
	if err != nil {
		errs = append(errs, err)
	}
	rule, err := ParseShearPlaneRule(string(z.ShearPlanes))
	if err != nil {
		errs = append(errs, fmt.Errorf("splice.assemblies.shear_planes: %w", err))
	}
	if len(errs) > 0 {
		return nil, errors.Join(errs...)
	}
	if len(sp.sizes) == 0 || len(sp.classes) == 0 || len(sp.th) == 0 || len(sp.inner) == 0 {
		return nil, errors.New("splice: the design space is empty")
	}
	e, err := newEnv(p, cat, fc, holes, z.Gap, p.Detailing)
	if err != nil {
		return nil, err
	}
	e.act = Actions{}
	s := &plan{base: *e, sp: sp, fuMax: slices.Max(sp.fu), nth: len(sp.th), nfc: len(sp.fcols), nwc: len(sp.wcols), nwr: len(sp.wrows), nclass: len(sp.classes)}
	e = &s.base
	s.sr = newSectionRules(&e.m, &e.det, e.gap)
	s.hr = make([]holeRules, len(sp.sizes))
	for i, size := range sp.sizes {
		s.hr[i] = newHoleRules(&e.m, &e.det, &s.sr, size, size.HoleDiameter(holes))
	}
	s.cr = make([]capRules, s.nth)
	for i, t := range sp.th {
		s.cr[i] = newCapRules(&e.det, &s.sr, t)
	}
	s.crTf = newCapRules(&e.det, &s.sr, e.m.Section.Tf)
	rates := p.Rates.resolved()
	n := len(sp.sizes) * len(sp.classes)
	s.bolts = make([]boltData, 0, n)
	s.rates = make([]unitRates, 0, n)
	for si, size := range sp.sizes {
		for ci, class := range sp.classes {
			b, err := newBoltData(e, size, class, rule, z.System)
			if err != nil {
				errs = append(errs, fmt.Errorf("splice.assemblies.system: %w", err))
				continue
			}
			b.key = [2]int{si, ci}
			u, err := unitRatesOf(&rates, &b, cat)
			if err != nil {
				errs = append(errs, err)
				continue
			}
			s.bolts = append(s.bolts, b)
			s.rates = append(s.rates, u)
		}
	}
	if len(errs) > 0 {
		return nil, errors.Join(errs...)
	}
	s.groups = groupsFor(cat)
	// The memo keys are what the groups do not depend on: the flange row-free checks are the
	// same for every class and every rows entry from two on, the web plate checks for every
	// class (the inner thickness index is 0 without inner plates).
	s.gridA = newGrid(len(sp.sizes), len(sp.inner), s.nfc, s.nth, s.nth)
	s.gridW = newGrid(len(sp.sizes), s.nwc, s.nth, s.nwr)
	s.gridFitF = newGrid(len(s.bolts), s.nth, s.nth+1)
	s.gridFitW = newGrid(len(s.bolts), s.nth)
	s.gridR0F = newGrid(len(s.bolts), len(sp.inner), s.nfc)
	s.gridR0W = newGrid(len(s.bolts), s.nwc)
	return s, nil
}

// memoCells is the length of the memo slice a searcher of the plan takes.
func (pl *plan) memoCells() int { return pl.gridA.cells() + pl.gridW.cells() }

// searcher prepares the search of the plan at p's forces, which are valid. memo, when not nil,
// is a zeroed slice of memoCells cells; fits, when not nil, the assemblies chosen so far by
// searches of the same plan.
func (pl *plan) searcher(p *Problem, memo []int8, fits *fitCache) *searcher {
	s := &searcher{plan: pl, p: p}
	e := pl.base
	e.act = designActions(p.Member, p.ULS, p.SLS, p.Distribution, p.Minimum, e.f, e.cat == CategoryB)
	s.e = &e
	if memo == nil {
		memo = make([]int8, pl.memoCells())
	}
	s.memoA, s.memoW = memo[:pl.gridA.cells()], memo[pl.gridA.cells():]
	if fits != nil && len(fits.fitF) == pl.gridFitF.cells() && len(fits.fitW) == pl.gridFitW.cells() {
		s.fitF, s.fitW, s.fits = fits.fitF, fits.fitW, fits.fits
	} else {
		idx := make([]int32, pl.gridFitF.cells()+pl.gridFitW.cells())
		s.fitF, s.fitW = idx[:pl.gridFitF.cells()], idx[pl.gridFitF.cells():]
	}
	r0 := make([]int, pl.gridR0F.cells()+pl.gridR0W.cells())
	s.r0F, s.r0W = r0[:pl.gridR0F.cells()], r0[pl.gridR0F.cells():]
	for bi := range s.bolts {
		b := &s.bolts[bi]
		for ai, inner := range pl.sp.inner {
			for ci := range pl.sp.fcols {
				s.r0F[pl.gridR0F.at(bi, ai, ci)] = s.flangeFirstRows(b, ci, inner)
			}
		}
		for ci := range pl.sp.wcols {
			s.r0W[pl.gridR0W.at(bi, ci)] = s.webFirstRows(b, ci)
		}
	}
	return s
}

// grid numbers the cells of a box of design-space indices (one dimension per list, its length
// the list's) in row-major order, so that a memo over several lists is one flat slice.
type grid struct {
	rank int
	dims [5]int
}

func newGrid(dims ...int) grid {
	var g grid
	if len(dims) > len(g.dims) {
		panic("splice: a grid of more dimensions than it holds")
	}
	g.rank = copy(g.dims[:], dims)
	return g
}

// cells is the number of cells.
func (g *grid) cells() int {
	n := 1
	for _, d := range g.dims[:g.rank] {
		n *= d
	}
	return n
}

// at is the cell of one index per dimension. An index outside its list is a broken invariant.
func (g *grid) at(ix ...int) int {
	if len(ix) != g.rank {
		panic("splice: grid index of the wrong rank")
	}
	c := 0
	for k, v := range ix {
		if uint(v) >= uint(g.dims[k]) {
			panic("splice: grid index outside its list")
		}
		c = c*g.dims[k] + v
	}
	return c
}

// fastAcc collects utilisations the way contribution and Check.Pass do, without building checks.
type fastAcc struct {
	stop    bool    // stop at the first failure
	limit   float64 // stop once the measure exceeds it (+Inf: never)
	pass    bool
	measure float64
}

func newAcc(stop bool) fastAcc { return fastAcc{stop: stop, limit: math.Inf(1), pass: true} }

// newBoundedAcc collects every check until the measure exceeds limit; the measure only grows,
// so a part stopped there measures more than limit.
func newBoundedAcc(limit float64) fastAcc { return fastAcc{limit: limit, pass: true} }

func (a *fastAcc) util(u float64, detailing bool) bool {
	p := passes(u)
	if !(detailing && p) && u > a.measure {
		a.measure = u
		if u > a.limit {
			if !p {
				a.pass = false
			}
			return false
		}
	}
	if !p {
		a.pass = false
		return !a.stop
	}
	return true
}

// flange runs one group of flange checks; false when one fails and the accumulator stops.
func (a *fastAcc) flange(x *flangeEval, g []flangeNum) bool {
	for i := range g {
		if !a.util(g[i].u(x), g[i].detailing) {
			return false
		}
	}
	return true
}

// flangeOf runs the checks of one group that are (detailing) or are not (forces) detailing
// rules; false when one fails and the accumulator stops. Detailing rules depend on the
// geometry alone, so a sizer keeps their part of the accumulator per layout.
func (a *fastAcc) flangeOf(x *flangeEval, g []flangeNum, detailing bool) bool {
	for i := range g {
		if g[i].detailing == detailing && !a.util(g[i].u(x), g[i].detailing) {
			return false
		}
	}
	return true
}

// webOf is flangeOf for web checks.
func (a *fastAcc) webOf(x *webEval, g []webNum, detailing bool) bool {
	for i := range g {
		if g[i].detailing == detailing && !a.util(g[i].u(x), g[i].detailing) {
			return false
		}
	}
	return true
}

// web runs one group of web checks; false when one fails and the accumulator stops.
func (a *fastAcc) web(x *webEval, g []webNum) bool {
	for i := range g {
		if !a.util(g[i].u(x), g[i].detailing) {
			return false
		}
	}
	return true
}

// flangeAt builds a flange layout of the design space with its plate strengths and, when fit is
// set, its bolts' assembly (a lower bound that does not price by mass leaves it out).
func (s *searcher) flangeAt(b *boltData, ai, ci, toI, tiI, ri int, fit bool) (flangeLayout, bool) {
	inner := s.sp.inner[ai]
	ti := 0.0
	cr := &s.crTf
	if inner {
		ti = s.sp.th[tiI]
		cr = &s.cr[min(toI, tiI)]
	} else {
		tiI = 0
		if s.sp.th[toI] < s.e.m.Section.Tf {
			cr = &s.cr[toI]
		}
	}
	fl, ok := sizingFlange(&s.sr, &s.hr[b.key[0]], cr, inner, s.sp.fcols[ci], s.sp.frows[ri], s.sp.th[toI], ti)
	fl.fyo, fl.fuo = s.sp.fy[toI], s.sp.fu[toI]
	if inner {
		fl.fyi, fl.fui = s.sp.fy[tiI], s.sp.fu[tiI]
	}
	fl.key = [5]int{ai, ci, toI, tiI, ri}
	if fit {
		fl.fit = s.flangeFit(b, &fl)
	}
	return fl, ok
}

// flangeFit is the assembly of a flange layout's bolts, chosen once per bolt and plies.
func (s *searcher) flangeFit(b *boltData, fl *flangeLayout) *groupFit {
	bi := b.key[0]*s.nclass + b.key[1]
	inner := 0
	if fl.inner {
		inner = fl.key[3] + 1
	}
	k := s.gridFitF.at(bi, fl.key[2], inner)
	if s.fitF[k] == 0 {
		st := s.e.flangeStack(fl)
		s.fitF[k] = s.fits.add(newGroupFit(b, &st))
	}
	return s.fits.at(s.fitF[k])
}

// webFit is the assembly of a web layout's bolts, chosen once per bolt and plate thickness.
func (s *searcher) webFit(b *boltData, wl *webLayout) *groupFit {
	k := s.gridFitW.at(b.key[0]*s.nclass+b.key[1], wl.key[1])
	if s.fitW[k] == 0 {
		st := s.e.webStack(wl)
		s.fitW[k] = s.fits.add(newGroupFit(b, &st))
	}
	return s.fits.at(s.fitW[k])
}

// fitPool holds the group fits a search has chosen, in chunks so that a fit never moves once a
// layout points at it.
type fitPool struct {
	chunks []*[fitChunk]groupFit
	n      int32
}

const fitChunk = 16

// add stores a fit and returns its handle (1 + its index).
func (p *fitPool) add(g groupFit) int32 {
	if int(p.n) == fitChunk*len(p.chunks) {
		p.chunks = append(p.chunks, new([fitChunk]groupFit))
	}
	p.chunks[p.n/fitChunk][p.n%fitChunk] = g
	p.n++
	return p.n
}

// at returns the fit of a handle.
func (p *fitPool) at(h int32) *groupFit { return &p.chunks[(h-1)/fitChunk][(h-1)%fitChunk] }

// webAt builds a web layout of the design space; fit as for flangeAt.
func (s *searcher) webAt(b *boltData, ci, tpI, ri int, fit bool) (webLayout, bool) {
	wl, ok := sizingWeb(&s.sr, &s.hr[b.key[0]], &s.cr[tpI], &s.e.det, s.sp.wcols[ci], s.sp.wrows[ri], s.sp.th[tpI])
	wl.fy, wl.fu = s.sp.fy[tpI], s.sp.fu[tpI]
	wl.key = [3]int{ci, tpI, ri}
	if fit {
		wl.fit = s.webFit(b, &wl)
	}
	return wl, ok
}

// boundMargin keeps the row bounds clear of rounding: a configuration is skipped only when a
// utilisation exceeds 1 by more than this.
const boundMargin = 1e-6

// enough reports whether n bolts of the given resistance can carry the force.
func enough(n, resistance, force float64) bool { return n*resistance*(1+boundMargin) >= force }

// maxBearing is an upper bound of Fb,Rd on a part of thickness t and strength fu (k1 ≤ 2.5,
// αb ≤ min(fub/fu, 1)).
func maxBearing(b *boltData, fu, t, gammaM2 float64) float64 {
	return BearingResistance(2.5, min(b.class.Fub/fu, 1), fu, b.d, t, gammaM2, b.hf)
}

// flangeFirstRows is the first rows entry with enough bolts for shear, slip and bearing on the
// beam flange at their largest possible values, −1 when none has. With inner plates a bolt
// carries at most two planes' worth (the larger share of the two planes is at least one half),
// each plane at most the larger Fv,Rd the shear-plane rule allows (on the shank unless the
// thread is assumed): the bound holds for every plate thickness, which the memo's key leaves out.
func (s *searcher) flangeFirstRows(b *boltData, ci int, inner bool) int {
	np := 1.0
	if inner {
		np = 2
	}
	e := s.e
	a := &e.act.Flange
	fb := maxBearing(b, e.m.FuFlange, e.m.Section.Tf, e.f.GammaM2)
	per := float64(s.sp.fcols[ci])
	for i, r := range s.sp.frows {
		n := float64(r) * per
		if enough(n, np*b.fvMax, a.Bolt) && enough(n, fb, a.Bolt) && (!e.cat.Preloaded() || enough(n, np*b.fsPerSur, a.SlipBolt)) {
			return i
		}
	}
	return -1
}

// webFirstRows is the first rows entry whose corner bolt can pass shear, slip and bearing on the
// beam web and plates, with each bolt-force component bounded from below over every plate of
// the design space: the eccentricity and spacing no less than with the thinnest plate, the
// pitch anywhere between 2.4 d0 and the full spread (EN 1993-1-8 Table 3.3 limits), the
// resistances no more than their largest values (the shear per plane the larger the
// shear-plane rule allows, whatever the plate thickness). −1 when none.
func (s *searcher) webFirstRows(b *boltData, ci int) int {
	e, hr := s.e, &s.hr[b.key[0]]
	a := &e.act.Web
	crLo, crHi := &s.cr[0], &s.cr[s.nth-1]
	fbBeam := maxBearing(b, e.m.FuWeb, e.m.Section.Tw, e.f.GammaM2)
	// 2.5·min(fub/fu, 1)·fu = 2.5·min(fub, fu) grows with fu: the strongest plate at the thickest
	fbPlate := maxBearing(b, s.fuMax, s.sp.th[s.nth-1], e.f.GammaM2)
	c := float64(s.sp.wcols[ci])
	ehLo := clamp(hr.e1T, hr.eMin, crLo.eMax)
	phLo, phHi := 0.0, 0.0
	if c > 1 {
		phLo, phHi = clamp(hr.p1T, hr.p2Min, crLo.pMax), clamp(hr.p1T, hr.p2Min, crHi.pMax)
	}
	for i, rows := range s.sp.wrows {
		r := float64(rows)
		if rows < 2 {
			continue
		}
		pvLo, pvHi := hr.p2Min, min(s.e.det.down((s.sr.hp-2*hr.eMin)/(r-1)), crHi.pMax)
		if pvHi < pvLo {
			continue
		}
		n := r * c
		// z/Ip and x/Ip at the corner: Ip = r·c·(ph²(c² − 1) + pv²(r² − 1))/12.
		ip := func(ph, pv float64) float64 { return r * c * (ph*ph*(c*c-1) + pv*pv*(r*r-1)) / 12 }
		zOverIp := min(0.5*(r-1)*pvLo/ip(phHi, pvLo), 0.5*(r-1)*pvHi/ip(phHi, pvHi))
		xOverIp := 0.0
		if c > 1 {
			xOverIp = min(0.5*(c-1)*phLo/ip(phLo, pvHi), 0.5*(c-1)*phHi/ip(phHi, pvHi))
		}
		eLo := e.gap/2 + ehLo + (c-1)*phLo/2
		comp := func(mw, nw, v float64) (h, vv float64) {
			mg := mw + v*eLo
			return mg*zOverIp + nw/n, v/n + mg*xOverIp
		}
		h, v := comp(a.Moment, a.Axial, a.Shear)
		ok := enough(1, 2*b.fvMax, math.Sqrt(h*h+v*v)) && enough(1, fbBeam, h) && enough(1, fbBeam, v) &&
			enough(1, fbPlate, h/2) && enough(1, fbPlate, v/2)
		if ok && e.cat.Preloaded() {
			hs, vs := comp(a.SlipMoment, a.SlipAxial, a.SlipShear)
			ok = enough(1, 2*b.fsPerSur, math.Sqrt(hs*hs+vs*vs))
		}
		if ok {
			return i
		}
	}
	return -1
}

type flangeBest struct {
	found bool
	sc    score
	fl    flangeLayout
}

type webBest struct {
	found bool
	sc    score
	wl    webLayout
}

// prune says whether a score can no longer improve on the part's best (found earlier, so with a
// smaller key: a tie loses) or on the limit from the whole splice (a tie may still win).
func prune(sc score, found bool, best score, haveLimit bool, limit score) bool {
	return (found && sc.cmp(best) >= 0) || (haveLimit && sc.cmp(limit) > 0)
}

// rowFreeFlange runs (once per bolt size) the flange checks that do not depend on the rows.
func (s *searcher) rowFreeFlange(b *boltData, fl *flangeLayout) bool {
	k := s.gridA.at(b.key[0], fl.key[0], fl.key[1], fl.key[2], fl.key[3])
	if m := s.memoA[k]; m != 0 {
		return m == 1
	}
	x := s.rowFree.flange(s.e, b, fl)
	x.l.rows = max(x.l.rows, 2)
	a := newAcc(true)
	s.evals++
	ok := a.flange(x, s.groups.flangeRowFree())
	s.memoA[k] = 2
	if ok {
		s.memoA[k] = 1
	}
	return ok
}

// rowsNeeded is the first rows index from r0 (with two rows or more) whose bolts can carry the
// flange force in shear, slip and bearing on beam and plates; −1 when none.
func (s *searcher) rowsNeeded(b *boltData, fl flangeLayout, r0 int) int {
	if fl.rows < 2 {
		fl.rows = 2
	}
	x := flangeEval{e: s.e, b: b, l: &fl}
	a := &s.e.act.Flange
	fv := PackingFactor(fl.packing, b.d) * x.boltShear()
	fb := min(x.bearingBeamN().res, x.bearingPlateN().res)
	fs := x.slipN()
	per := float64(fl.cols)
	for i := r0; i < len(s.sp.frows); i++ {
		n := float64(s.sp.frows[i]) * per
		if s.sp.frows[i] < 2 {
			return i
		}
		if enough(n, fv, a.Bolt) && enough(n, fb, a.Bolt) && (!s.e.cat.Preloaded() || enough(n, fs, a.SlipBolt)) {
			return i
		}
	}
	return -1
}

func (s *searcher) bestFlange(bi int, haveLimit bool, limit score) flangeBest {
	b, u := &s.bolts[bi], &s.rates[bi]
	var best flangeBest
	for ai, inner := range s.sp.inner {
		nti := 1
		if inner {
			nti = s.nth
		}
		for ci := range s.sp.fcols {
			r0 := s.r0F[s.gridR0F.at(bi, ai, ci)]
			if r0 < 0 {
				continue
			}
		thickness:
			for toI := 0; toI < s.nth; toI++ {
				for tiI := 0; tiI < nti; tiI++ {
					fl, ok, sc := s.flangeHeld(b, ai, ci, toI, tiI, r0, u.byMass())
					if prune(sc, best.found, best.sc, haveLimit, limit) {
						if tiI == 0 {
							break thickness
						}
						break
					}
					if !ok {
						continue
					}
					if fl.fit == nil {
						fl.fit = s.flangeFit(b, fl) // the checks need it (the searcher's scratch)
					}
					if f, ok := s.scanFlangeRows(b, u, fl, r0, &best, haveLimit, limit); ok {
						best = f
					}
				}
			}
		}
	}
	return best
}

// scanFlangeRows tries the rows from r0 up for one plate set and returns the first that passes.
func (s *searcher) scanFlangeRows(b *boltData, u *unitRates, start *flangeLayout, r0 int, best *flangeBest, haveLimit bool, limit score) (flangeBest, bool) {
	e := s.e
	x := s.scan.flange(e, b, start)
	fl := x.l    // the evaluator's copy, which the scan changes row by row
	rowFree := 0 // 0 not yet run, 1 passes, 2 fails
	for ri := r0; ri < len(s.sp.frows); ri++ {
		fl.rows = s.sp.frows[ri]
		fl.length = flangeLength(e.gap, fl.e1, fl.p1, fl.rows)
		fl.key[4] = ri
		sc := u.score(flangeQty(fl, e.gap))
		if prune(sc, best.found, best.sc, haveLimit, limit) {
			return flangeBest{}, false
		}
		a := newAcc(true)
		if fl.rows >= 2 {
			if rowFree == 0 {
				rowFree = 2
				if s.rowFreeFlange(b, fl) {
					rowFree = 1
					next := s.rowsNeeded(b, *fl, ri)
					if next < 0 {
						return flangeBest{}, false
					}
					if next > ri {
						ri = next - 1
						continue
					}
				}
			}
			if rowFree != 1 {
				return flangeBest{}, false
			}
		} else if !a.flange(x, s.groups.flangeRowFree()) {
			s.evals++
			continue
		}
		s.evals++
		if a.flange(x, s.groups.flangeRows()) {
			return flangeBest{found: true, sc: sc, fl: *fl}, true
		}
	}
	return flangeBest{}, false
}

// webRowFree reports whether the plates can pass the checks that do not depend on the rows: the
// gross shear resistance, and the combined resistance bounded by the gross plastic modulus.
func (s *searcher) webRowFree(b *boltData, wl *webLayout) bool {
	e := s.e
	x := webEval{e: e, b: b, l: wl}
	v := e.act.Web.Shear
	if !passes(utilisation(v, x.shearGrossN())) {
		return false
	}
	f := &e.f
	a := 2 * wl.hp * wl.tp
	vpl := a * wl.fy / (math.Sqrt(3) * f.GammaM0)
	rho := 0.0
	if v > 0.5*vpl {
		rho = math.Pow(2*v/vpl-1, 2)
	}
	fyr := (1 - min(rho, 1)) * wl.fy
	npl := a * fyr / f.GammaM0
	n := e.act.Web.Axial
	if n >= npl {
		return true // the combined check decides
	}
	mUpper := 2 * wl.tp * wl.hp * wl.hp / 4 * fyr / f.GammaM0 * (1 - (n/npl)*(n/npl))
	med := e.act.Web.Moment + v*(e.gap/2+wl.eh)
	return med <= mUpper*(1+boundMargin)
}

func (s *searcher) webPlates(b *boltData, x *webEval) bool {
	k := s.gridW.at(b.key[0], x.l.key[0], x.l.key[1], x.l.key[2])
	if m := s.memoW[k]; m != 0 {
		return m == 1
	}
	a := newAcc(true)
	ok := a.web(x, s.groups.webPlates())
	s.memoW[k] = 2
	if ok {
		s.memoW[k] = 1
	}
	return ok
}

func (s *searcher) bestWeb(bi int, haveLimit bool, limit score) webBest {
	b, u, e := &s.bolts[bi], &s.rates[bi], s.e
	var best webBest
	for ci := range s.sp.wcols {
		r0 := s.r0W[s.gridR0W.at(bi, ci)]
		if r0 < 0 {
			continue
		}
		for tpI := range s.sp.th {
			wl, _, sc := s.webHeld(b, ci, tpI, r0, u.byMass())
			if prune(sc, best.found, best.sc, haveLimit, limit) {
				break
			}
			if !s.webRowFree(b, wl) {
				continue
			}
			for ri := r0; ri < s.nwr; ri++ {
				wl, ok, sc := s.webHeld(b, ci, tpI, ri, u.byMass())
				if prune(sc, best.found, best.sc, haveLimit, limit) {
					break
				}
				if !ok {
					continue
				}
				if wl.fit == nil {
					wl.fit = s.webFit(b, wl) // the checks need it (the searcher's scratch)
				}
				s.evals++
				x := s.scan.web(e, b, wl)
				a := newAcc(true)
				if a.web(x, s.groups.webClass()) && s.webPlates(b, x) {
					best = webBest{found: true, sc: sc, wl: *x.l}
					break
				}
			}
		}
	}
	return best
}

// lowerBounds are the cheapest flange and web any passing splice with this bolt can have:
// thinnest plates, fewest admissible rows, every arrangement and column count.
func (s *searcher) lowerBounds(bi int) (lf, lw score, ok bool) {
	b, u := &s.bolts[bi], &s.rates[bi]
	var hf, hw bool
	for ai := range s.sp.inner {
		for ci := range s.sp.fcols {
			r0 := s.r0F[s.gridR0F.at(bi, ai, ci)]
			if r0 < 0 {
				continue
			}
			if _, _, sc := s.flangeHeld(b, ai, ci, 0, 0, r0, u.byMass()); !hf || sc.cmp(lf) < 0 {
				lf, hf = sc, true
			}
		}
	}
	for ci := range s.sp.wcols {
		r0 := s.r0W[s.gridR0W.at(bi, ci)]
		if r0 < 0 {
			continue
		}
		if _, _, sc := s.webHeld(b, ci, 0, r0, u.byMass()); !hw || sc.cmp(lw) < 0 {
			lw, hw = sc, true
		}
	}
	return lf, lw, hf && hw
}

func sub(a, b score) score {
	return score{cost: a.cost - b.cost, bolts: a.bolts - b.bolts, mass: a.mass - b.mass}
}

// choice is a whole splice of the design space.
type choice struct {
	found   bool
	bi      int
	fl      flangeLayout
	wl      webLayout
	sc      score
	measure float64
}

// keyLess orders whole splices by their position in the sorted design space.
func keyLess(abi int, afl *flangeLayout, awl *webLayout, bbi int, bfl *flangeLayout, bwl *webLayout) bool {
	if abi != bbi {
		return abi < bbi
	}
	if afl.key != bfl.key {
		return slices.Compare(afl.key[:], bfl.key[:]) < 0
	}
	return slices.Compare(awl.key[:], bwl.key[:]) < 0
}

func (c *choice) better(o *choice) bool {
	if !c.found {
		return true
	}
	if k := o.sc.cmp(c.sc); k != 0 {
		return k < 0
	}
	return keyLess(o.bi, &o.fl, &o.wl, c.bi, &c.fl, &c.wl)
}

func (c *choice) betterInfeasible(o *choice) bool {
	if !c.found {
		return true
	}
	if o.measure != c.measure {
		return o.measure < c.measure
	}
	return c.better(o)
}

func (s *searcher) size() (Result, error) {
	type cand struct {
		bi         int
		lb, lf, lw score
	}
	cands := make([]cand, 0, len(s.bolts))
	for bi := range s.bolts {
		if lf, lw, ok := s.lowerBounds(bi); ok {
			common := score{cost: s.rates[bi].splice}
			cands = append(cands, cand{bi: bi, lb: common.add(lf).add(lw), lf: lf, lw: lw})
		}
	}
	// in order of the lower bound, then of the bolt; sorted by pointer, the candidates being large
	order := make([]*cand, len(cands))
	for i := range cands {
		order[i] = &cands[i]
	}
	slices.SortFunc(order, func(a, b *cand) int { return cmp.Or(a.lb.cmp(b.lb), cmp.Compare(a.bi, b.bi)) })
	var best choice
	for _, c := range order {
		if best.found {
			if k := c.lb.cmp(best.sc); k > 0 || (k == 0 && c.bi > best.bi) {
				break
			}
		}
		common := score{cost: s.rates[c.bi].splice}
		// The web first: its lower bound is the weaker one, so its exact cost prunes the flange.
		w := s.bestWeb(c.bi, best.found, sub(sub(best.sc, common), c.lf))
		if !w.found {
			continue
		}
		f := s.bestFlange(c.bi, best.found, sub(sub(best.sc, common), w.sc))
		if !f.found {
			continue
		}
		o := choice{found: true, bi: c.bi, fl: f.fl, wl: w.wl, sc: common.add(f.sc).add(w.sc)}
		if best.better(&o) {
			best = o
		}
	}
	if best.found {
		return s.result(&best, Sized), nil
	}
	return s.sizeInfeasible()
}

// sizeInfeasible finds, when nothing passes, the splice with the lowest utilisation (cheapest
// among equals). With the bolt fixed that is the larger of the lowest flange and lowest web
// utilisations (the level), made with the cheapest flange and web that reach it.
//
// The search is bounded without changing the answer, in two steps per bolt and part (web,
// then flange). First the part's level, its lowest utilisation: the parts are visited dearest
// first (mostly the strongest, so that the lowest falls early), each stopped as soon as its
// utilisation, which only grows, reaches the lowest so far or exceeds the best splice so far —
// it can then lower neither. A bolt whose level is above the best splice so far cannot win.
// Then the bolt's level, the larger of the two, and the cheapest part of each within it,
// visited cheapest first (design-space order among equals) and each stopped once above the
// level. Detailing rules, which depend on the geometry alone, are checked once per part, and
// the parts listed once per Sizer (boltParts).
func (s *searcher) sizeInfeasible() (Result, error) {
	var best choice
	s.rowFreeU = slices.Grow(s.rowFreeU[:0], s.gridA.cells())[:s.gridA.cells()]
	for i := range s.rowFreeU {
		s.rowFreeU[i] = -1
	}
	for bi := len(s.bolts) - 1; bi >= 0; bi-- { // strongest bolts first: a low bound early (the order decides no tie)
		u := &s.rates[bi]
		bp := s.layouts(bi)
		if len(bp.fls) == 0 || len(bp.wls) == 0 {
			continue
		}
		bound := math.Inf(1) // the best splice's utilisation so far
		if best.found {
			bound = best.measure
		}
		// stopLimit stops a part once its utilisation reaches low or exceeds the bound
		stopLimit := func(low float64) float64 {
			return math.Nextafter(min(low, math.Nextafter(bound, math.Inf(1))), math.Inf(-1))
		}
		// the web level, as the flange level below
		minW := math.Inf(1)
		for k := len(bp.worder) - 1; k >= 0; k-- {
			s.evals++
			if m, ok := s.webMeasure(bp, bp.worder[k], stopLimit(minW)); ok {
				minW = m
			}
		}
		if minW > bound {
			continue
		}
		// the flange level: the lowest flange utilisation, each part stopped once its
		// utilisation (which only grows) reaches the lowest so far or exceeds the bound, as it
		// can then not lower it; dearest (mostly the strongest) parts first, so that it falls
		// early
		minF := math.Inf(1)
		for k := len(bp.forder) - 1; k >= 0; k-- {
			i := bp.forder[k]
			s.evals++
			if m, ok := s.flangeMeasure(bp, i, stopLimit(minF)); ok {
				minF = m
			}
		}
		level := max(minF, minW)
		if level > bound || math.IsInf(level, 1) {
			continue
		}
		// the cheapest part within the level (design-space order among equals): one exists,
		// the part at minF
		fi := -1
		for _, i := range bp.forder {
			s.evals++
			if _, ok := s.flangeMeasure(bp, i, level); ok {
				fi = i
				break
			}
		}
		wi := -1
		for _, i := range bp.worder {
			s.evals++
			if _, ok := s.webMeasure(bp, i, level); ok {
				wi = i
				break
			}
		}
		common := score{cost: u.splice}
		o := choice{found: true, bi: bi, fl: bp.fls[fi], wl: bp.wls[wi], measure: level,
			sc: common.add(bp.fsc[fi]).add(bp.wsc[wi])}
		if best.betterInfeasible(&o) {
			best = o
		}
	}
	if !best.found {
		return Result{}, ErrNoDetailing
	}
	return s.result(&best, NoFeasible), nil
}

// flangeMeasure is the utilisation of flange part i of bp at the searcher's forces, and true,
// when it does not exceed limit; false as soon as it does.
func (s *searcher) flangeMeasure(bp *boltParts, i int, limit float64) (float64, bool) {
	acc := newBoundedAcc(limit)
	acc.pass, acc.measure = bp.fdet[i].pass, bp.fdet[i].measure
	if acc.measure > limit {
		return 0, false
	}
	b, fl := &s.bolts[bp.bolt], &bp.fls[i]
	s.measure = flangeEval{e: s.e, b: b, l: fl} // read only: no copy of the layout
	x := &s.measure
	// the row-free checks depend neither on the rows nor on the bolt class (the memoised
	// group): once per cell of gridA, in full
	k := s.gridA.at(b.key[0], fl.key[0], fl.key[1], fl.key[2], fl.key[3])
	if s.rowFreeU[k] < 0 {
		a := newAcc(false)
		a.flangeOf(x, s.groups.flangeRowFree(), false)
		s.rowFreeU[k] = a.measure
	}
	if !acc.util(s.rowFreeU[k], false) {
		return 0, false
	}
	if acc.flangeOf(x, s.groups.flangeRows(), false) {
		return acc.measure, true
	}
	return 0, false
}

// webMeasure is flangeMeasure for web part i. The web evaluator analyses the part's bolt group
// on s.scan's own copy of the layout.
func (s *searcher) webMeasure(bp *boltParts, i int, limit float64) (float64, bool) {
	acc := newBoundedAcc(limit)
	acc.pass, acc.measure = bp.wdet[i].pass, bp.wdet[i].measure
	if acc.measure > limit {
		return 0, false
	}
	x := s.scan.web(s.e, &s.bolts[bp.bolt], &bp.wls[i])
	if acc.webOf(x, s.groups.webClass(), false) && acc.webOf(x, s.groups.webPlates(), false) {
		return acc.measure, true
	}
	return 0, false
}

// forEachFlange visits every drawable flange configuration in design-space order.
func (s *searcher) forEachFlange(b *boltData, visit func(*flangeLayout)) {
	var fl flangeLayout // one per call: visit may keep the pointer no longer than the call
	var ok bool
	for ai, inner := range s.sp.inner {
		nti := 1
		if inner {
			nti = len(s.sp.th)
		}
		for ci := range s.sp.fcols {
			for toI := range s.sp.th {
				for tiI := 0; tiI < nti; tiI++ {
					for ri := range s.sp.frows {
						if fl, ok = s.flangeAt(b, ai, ci, toI, tiI, ri, true); ok {
							visit(&fl)
						}
					}
				}
			}
		}
	}
}

// forEachWeb visits every drawable web configuration in design-space order.
func (s *searcher) forEachWeb(b *boltData, visit func(*webLayout)) {
	var wl webLayout // as in forEachFlange
	var ok bool
	for ci := range s.sp.wcols {
		for tpI := range s.sp.th {
			for ri := range s.sp.wrows {
				if wl, ok = s.webAt(b, ci, tpI, ri, true); ok {
					visit(&wl)
				}
			}
		}
	}
}

func (s *searcher) exhaustive() (Result, error) {
	var feasible, infeasible choice
	for bi := range s.bolts {
		b, u, e := &s.bolts[bi], &s.rates[bi], s.e
		common := score{cost: u.splice}
		s.forEachFlange(b, func(fl *flangeLayout) {
			fsc := u.score(flangeQty(fl, e.gap))
			s.forEachWeb(b, func(wl *webLayout) {
				s.evals++
				pass, measure := verdict(s.scan.splice(e, b, fl, wl))
				o := choice{found: true, bi: bi, fl: *fl, wl: *wl, measure: measure,
					sc: common.add(fsc).add(u.score(webQty(wl, e.gap)))}
				if pass {
					if feasible.better(&o) {
						feasible = o
					}
				} else if infeasible.betterInfeasible(&o) {
					infeasible = o
				}
			})
		})
	}
	switch {
	case feasible.found:
		return s.result(&feasible, Sized), nil
	case infeasible.found:
		return s.result(&infeasible, NoFeasible), nil
	}
	return Result{}, ErrNoDetailing
}

func (s *searcher) result(c *choice, st Status) Result {
	r := assemble(&s.scan, s.e, &s.bolts[c.bi], &c.fl, &c.wl, &s.rates[c.bi], !s.p.Brief)
	r.Status = st
	r.Evaluated = s.evals
	return r
}
