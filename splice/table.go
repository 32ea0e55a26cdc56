package splice

// The checks of a splice are listed once, in checkTable. The calculation sheet (sheet), the
// number of checks a result carries (sheetLen) and the groups the sizing search evaluates
// (newSizingGroups) are all derived from it, and the tests in table_test.go fail when a row is
// missing from any of them. Adding a check is one row here plus its functions next to its
// clause.

// stateKind is the limit state a check belongs to, as the table states it.
type stateKind uint8

const (
	stULS       stateKind = iota // ultimate limit state
	stSlip                       // the slip state: SLS in category B, ULS in category C (env.states)
	stDetailing                  // a detailing rule: counts towards the utilisation only when it fails
)

// sizingGroup is the step of the sizing search (size.go) that evaluates a check. The memoised
// groups rely on what their checks do not depend on; TestSizingGroupsIndependent verifies it.
type sizingGroup uint8

const (
	// groupNone marks a missing half; a half with no group is a broken table.
	groupNone sizingGroup = iota
	// groupBolt: checks of the bolt alone. DesignSpace.resolve admits only bolts that pass
	// them, so the search need not evaluate them.
	groupBolt
	// groupFlangeRowFree: flange checks that depend neither on the number of rows (from two
	// on) nor on the bolt class; memoised per bolt size, arrangement, columns and thicknesses.
	groupFlangeRowFree
	// groupFlangeRows: flange checks that depend on the rows or on the bolt class.
	groupFlangeRows
	// groupWebClass: web checks that depend on the bolt class.
	groupWebClass
	// groupWebPlates: web checks that do not depend on the bolt class; memoised per bolt size,
	// columns, thickness and rows.
	groupWebPlates
)

// boltHalf is a check of the bolt alone.
type boltHalf struct {
	group sizingGroup
	check func(e *env, b *boltData, d *checkDef, full bool) Check
	u     func(e *env, b *boltData) float64
}

// flangeHalf is a check (or the flange half of a detailing check) of a flange splice: the
// calculation-sheet form and the utilisation alone, which the sizing search uses; the two give
// the same utilisation (TestCheckTableNumbers).
type flangeHalf struct {
	group sizingGroup
	check func(x *flangeEval, d *checkDef, full bool) Check
	u     func(x *flangeEval) float64
}

// webHalf is a check (or the web half of a detailing check) of the web splice.
type webHalf struct {
	group sizingGroup
	check func(x *webEval, d *checkDef, full bool) Check
	u     func(x *webEval) float64
}

// checkDef is one check of a splice. It has a bolt half, or a flange half, or a web half, or
// (a detailing check of the whole splice) a flange and a web half, which the sheet merges into
// one check governed by the worse half.
type checkDef struct {
	id        string
	clause    string
	altClause string // web.plate.combined when the axial share alone exceeds the plates
	state     stateKind
	preloaded bool // categories B and C only
	bolt      boltHalf
	flange    flangeHalf
	web       webHalf
}

// checkTable lists every check of a splice in calculation-sheet order. It is read only (Go has
// no constant tables): nothing writes to it after initialisation.
var checkTable = [...]checkDef{
	{id: IDPreload, clause: "EN 1993-1-8 3.1.2(1)", state: stDetailing, preloaded: true,
		bolt: boltHalf{groupBolt, preloadCheck, preloadU}},
	{id: IDSpacing, clause: "EN 1993-1-8 Table 3.3", state: stDetailing,
		flange: flangeHalf{groupFlangeRowFree, (*flangeEval).spacing, (*flangeEval).spacingU},
		web:    webHalf{groupWebPlates, (*webEval).spacing, (*webEval).spacingU}},
	{id: IDFit, clause: "fit of the plates to the section (common practice)", state: stDetailing,
		flange: flangeHalf{groupFlangeRowFree, (*flangeEval).fit, (*flangeEval).fitU},
		web:    webHalf{groupWebPlates, (*webEval).fit, (*webEval).fitU}},
	// The assembly system, and so the length, depends on the class (HV or HR when preloaded).
	{id: IDBoltLength, clause: "EN 1090-2 8.2.2; ISO 4014/4017, EN 14399-3/-4 lengths", state: stDetailing,
		flange: flangeHalf{groupFlangeRows, (*flangeEval).boltLength, (*flangeEval).boltLengthU},
		web:    webHalf{groupWebClass, (*webEval).boltLength, (*webEval).boltLengthU}},

	{id: IDFlangeBoltShear, clause: "EN 1993-1-8 Table 3.4, 3.8, 3.6.1(12)", state: stULS,
		flange: flangeHalf{groupFlangeRows, (*flangeEval).shear, (*flangeEval).shearU}},
	{id: IDFlangeBearingBeam, clause: "EN 1993-1-8 Table 3.4, 3.7", state: stULS,
		flange: flangeHalf{groupFlangeRows, (*flangeEval).bearingBeam, (*flangeEval).bearingBeamU}},
	{id: IDFlangeBearingPl, clause: "EN 1993-1-8 Table 3.4, 3.7", state: stULS,
		flange: flangeHalf{groupFlangeRows, (*flangeEval).bearingPlate, (*flangeEval).bearingPlateU}},
	{id: IDFlangeSlip, clause: "EN 1993-1-8 3.9.1", state: stSlip, preloaded: true,
		flange: flangeHalf{groupFlangeRows, (*flangeEval).slip, (*flangeEval).slipU}},
	{id: IDFlangeTension, clause: "EN 1993-1-1 6.2.3", state: stULS,
		flange: flangeHalf{groupFlangeRowFree, (*flangeEval).tension, (*flangeEval).tensionU}},
	{id: IDFlangeBlock, clause: "EN 1993-1-8 3.10.2 (2005)", state: stULS,
		flange: flangeHalf{groupFlangeRows, (*flangeEval).block, (*flangeEval).blockU}},
	{id: IDFlangeCompression, clause: "EN 1993-1-1 6.2.4", state: stULS,
		flange: flangeHalf{groupFlangeRowFree, (*flangeEval).compression, (*flangeEval).compressionU}},
	{id: IDFlangeBuckling, clause: "EN 1993-1-8 Table 3.3 note 2; EN 1993-1-1 6.3.1", state: stULS,
		flange: flangeHalf{groupFlangeRowFree, (*flangeEval).buckling, (*flangeEval).bucklingU}},
	{id: IDFlangeBeamNet, clause: "EN 1993-1-1 6.2.3, 6.2.5(4)", state: stULS,
		flange: flangeHalf{groupFlangeRowFree, (*flangeEval).beamNet, (*flangeEval).beamNetU}},
	{id: IDFlangeBeamBlock, clause: "EN 1993-1-8 3.10.2 (2005)", state: stULS,
		flange: flangeHalf{groupFlangeRows, (*flangeEval).beamBlock, (*flangeEval).beamBlockU}},

	{id: IDWebBoltShear, clause: "EN 1993-1-8 Table 3.4, 3.8, 3.6.1(12)", state: stULS,
		web: webHalf{groupWebClass, (*webEval).shear, (*webEval).shearU}},
	{id: IDWebBearingBeam, clause: "EN 1993-1-8 Table 3.4 (note 3)", state: stULS,
		web: webHalf{groupWebClass, (*webEval).bearingBeam, (*webEval).bearingBeamU}},
	{id: IDWebBearingPlate, clause: "EN 1993-1-8 Table 3.4 (note 3)", state: stULS,
		web: webHalf{groupWebClass, (*webEval).bearingPlate, (*webEval).bearingPlateU}},
	{id: IDWebSlip, clause: "EN 1993-1-8 3.9.1", state: stSlip, preloaded: true,
		web: webHalf{groupWebClass, (*webEval).slip, (*webEval).slipU}},
	{id: IDWebShearGross, clause: "EN 1993-1-1 6.2.6", state: stULS,
		web: webHalf{groupWebPlates, (*webEval).shearGross, (*webEval).shearGrossU}},
	{id: IDWebShearNet, clause: "EN 1993-1-8 3.10.2 (common practice for net shear)", state: stULS,
		web: webHalf{groupWebPlates, (*webEval).shearNet, (*webEval).shearNetU}},
	{id: IDWebBlock, clause: "EN 1993-1-8 3.10.2 (2005)", state: stULS,
		web: webHalf{groupWebPlates, (*webEval).block, (*webEval).blockU}},
	{id: IDWebCombined, clause: "EN 1993-1-1 6.2.8, 6.2.9.1", altClause: "EN 1993-1-1 6.2.3, 6.2.9.1", state: stULS,
		web: webHalf{groupWebPlates, (*webEval).combined, (*webEval).combinedU}},
	{id: IDWebBeamNetShear, clause: "EN 1993-1-1 6.2.6; EN 1993-1-8 3.10.2", state: stULS,
		web: webHalf{groupWebPlates, (*webEval).beamNetShear, (*webEval).beamNetShearU}},
}

// part names the part of the splice a check belongs to, as its id starts: "detail", "flange"
// or "web"; "" for a row with no check.
func (d *checkDef) part() string {
	switch {
	case d.bolt.check != nil, d.flange.check != nil && d.web.check != nil:
		return "detail"
	case d.flange.check != nil:
		return "flange"
	case d.web.check != nil:
		return "web"
	}
	return ""
}

// applies reports whether the check is made in a splice of this category.
func (d *checkDef) applies(preloaded bool) bool { return preloaded || !d.preloaded }

// check starts a Check with the row's id, clause and limit state in e and its numbers:
// demand and resistance are internal values, scale converts them to unit.
func (d *checkDef) check(e *env, unit string, demand, resistance, scale float64) Check {
	u := utilisation(demand, resistance)
	return Check{ID: d.id, Clause: d.clause, State: e.states[d.state], Unit: unit,
		Demand: demand * scale, Resistance: resistance * scale, Utilisation: u, Pass: passes(u)}
}

// appendCheck makes the check for the splice v is set to and appends it to checks.
func (d *checkDef) appendCheck(checks []Check, v *evaluator, full bool) []Check {
	switch {
	case d.bolt.check != nil:
		return append(checks, d.bolt.check(v.f.e, v.f.b, d, full))
	case d.flange.check != nil && d.web.check != nil:
		return append(checks, merge(d.flange.check(&v.f, d, full), d.web.check(&v.w, d, full)))
	case d.flange.check != nil:
		return append(checks, d.flange.check(&v.f, d, full))
	}
	return append(checks, d.web.check(&v.w, d, full))
}

// utilisation is the check's utilisation alone for the splice v is set to: the sheet's (merge
// takes the worse half), without building the check.
func (d *checkDef) utilisation(v *evaluator) float64 {
	switch {
	case d.bolt.u != nil:
		return d.bolt.u(v.f.e, v.f.b)
	case d.flange.u != nil && d.web.u != nil:
		return max(d.flange.u(&v.f), d.web.u(&v.w))
	case d.flange.u != nil:
		return d.flange.u(&v.f)
	}
	return d.web.u(&v.w)
}

// sheetLen is the number of checks on the sheet of a splice of this category.
func sheetLen(preloaded bool) int {
	n := 0
	for i := range checkTable {
		if checkTable[i].applies(preloaded) {
			n++
		}
	}
	return n
}

// evaluator holds the flange and web evaluators of one splice while its checks run. The checks
// are called through the table's function values, so what they are handed lives on the heap:
// each caller keeps an evaluator and sets it for every splice it evaluates rather than
// allocating one per evaluation.
type evaluator struct {
	flangeSlot
	webSlot
}

// flangeSlot is a flange evaluator on its own copy of the layout.
type flangeSlot struct {
	fl flangeLayout
	f  flangeEval // on fl
}

// webSlot is a web evaluator on its own copy of the layout.
type webSlot struct {
	wl webLayout
	w  webEval // on wl
}

// flange sets the flange evaluator to a copy of fl.
func (v *flangeSlot) flange(e *env, b *boltData, fl *flangeLayout) *flangeEval {
	v.fl = *fl
	setPointer(&v.f.e, e)
	setPointer(&v.f.b, b)
	setPointer(&v.f.l, &v.fl)
	return &v.f
}

// web sets the web evaluator to a copy of wl and analyses its bolt group.
func (v *webSlot) web(e *env, b *boltData, wl *webLayout) *webEval {
	v.wl = *wl
	setPointer(&v.w.e, e)
	setPointer(&v.w.b, b)
	setPointer(&v.w.l, &v.wl)
	v.w.analyse()
	return &v.w
}

// setPointer writes p to *dst only when it differs: the evaluators live on the heap, where a
// pointer write costs a write barrier while the collector runs, and the search sets them
// thousands of times with mostly the same env, bolt and layout.
func setPointer[T any](dst **T, p *T) {
	if *dst != p {
		*dst = p
	}
}

// splice sets both evaluators.
func (v *evaluator) splice(e *env, b *boltData, fl *flangeLayout, wl *webLayout) *evaluator {
	v.flange(e, b, fl)
	v.web(e, b, wl)
	return v
}

// flangeNum and webNum are one numeric check of a sizing group.
type flangeNum struct {
	u         func(*flangeEval) float64
	detailing bool
}

type webNum struct {
	u         func(*webEval) float64
	detailing bool
}

// sizingGroups are the table's checks of one category sorted into the steps of the sizing
// search, each group in table order. The groups are held in arrays, so the search allocates
// nothing for them.
type sizingGroups struct {
	flange            [len(checkTable)]flangeNum // groupFlangeRowFree, then groupFlangeRows
	web               [len(checkTable)]webNum    // groupWebClass, then groupWebPlates
	nfRowFree, nfRows int
	nwClass, nwPlates int
}

func (g *sizingGroups) flangeRowFree() []flangeNum { return g.flange[:g.nfRowFree] }

func (g *sizingGroups) flangeRows() []flangeNum {
	return g.flange[g.nfRowFree : g.nfRowFree+g.nfRows]
}

func (g *sizingGroups) webClass() []webNum { return g.web[:g.nwClass] }

func (g *sizingGroups) webPlates() []webNum { return g.web[g.nwClass : g.nwClass+g.nwPlates] }

// groupsByCategory are the sizing groups of category A (index 0) and of categories B and C
// (index 1), derived from checkTable at initialisation and, like it, read only.
var groupsByCategory = [2]sizingGroups{newSizingGroups(checkTable[:], false), newSizingGroups(checkTable[:], true)}

// groupsFor returns the sizing groups of a category.
func groupsFor(c Category) *sizingGroups {
	if c.Preloaded() {
		return &groupsByCategory[1]
	}
	return &groupsByCategory[0]
}

// newSizingGroups sorts the checks of a category into the sizing groups. A half in the wrong
// part's group, or in none, is a broken table.
func newSizingGroups(rows []checkDef, preloaded bool) sizingGroups {
	var f [2][len(checkTable)]flangeNum // groupFlangeRowFree, groupFlangeRows
	var w [2][len(checkTable)]webNum    // groupWebClass, groupWebPlates
	var nf, nw [2]int
	for i := range rows {
		d := &rows[i]
		if !d.applies(preloaded) {
			continue
		}
		detailing := d.state == stDetailing
		if d.bolt.check != nil && d.bolt.group != groupBolt {
			panic("splice: check " + d.id + ": a bolt check outside groupBolt")
		}
		if d.flange.check != nil {
			k := 0
			switch d.flange.group {
			case groupFlangeRowFree:
			case groupFlangeRows:
				k = 1
			default:
				panic("splice: check " + d.id + ": a flange half outside the flange groups")
			}
			f[k][nf[k]] = flangeNum{u: d.flange.u, detailing: detailing}
			nf[k]++
		}
		if d.web.check != nil {
			k := 0
			switch d.web.group {
			case groupWebClass:
			case groupWebPlates:
				k = 1
			default:
				panic("splice: check " + d.id + ": a web half outside the web groups")
			}
			w[k][nw[k]] = webNum{u: d.web.u, detailing: detailing}
			nw[k]++
		}
	}
	g := sizingGroups{nfRowFree: nf[0], nfRows: nf[1], nwClass: nw[0], nwPlates: nw[1]}
	copy(g.flange[:], f[0][:nf[0]])
	copy(g.flange[nf[0]:], f[1][:nf[1]])
	copy(g.web[:], w[0][:nw[0]])
	copy(g.web[nw[0]:], w[1][:nw[1]])
	return g
}
