package splice

import (
	"cmp"
	"container/heap"
	"fmt"
	"slices"
)

// A Catalogue lists the whole splices of a problem's design space — every bolt, drawable
// flange configuration and drawable web configuration that Size and SizeExhaustive consider —
// and checks any one of them at any set of forces, numbers only. It serves searches that need
// one splice design at many positions (identical splices along a beam).
//
// Structure it exposes, all of it by construction of the checks:
//
//   - A whole splice is a bolt, a flange part and a web part of that bolt. The flange checks
//     read only the flange actions (Actions.Flange) and the web checks only the web actions
//     (Actions.Web), so a splice passes at a Loading exactly when its flange part and its web
//     part each pass there (FlangePasses, WebPasses).
//   - Every check's demand rises with each action it reads and no resistance falls with any
//     action except the web plates' combined resistance, which falls with the shear and the
//     axial force (EN 1993-1-1 6.2.8, 6.2.9): so a part that passes at a Loading passes at
//     every Loading below it (Loading.FlangeBelow, Loading.WebBelow, Envelope).
//   - The cost and the sizing's order (Order) are sums over the parts: cost, then fewer bolts,
//     then lighter plates, then the design-space order; Size returns the first passing splice
//     in this order, and Designs lists the splices in it.
//
// A Catalogue is not changed by its methods and may be shared between goroutines.
type Catalogue struct {
	pl    *plan
	p     Problem // without forces
	bolts []catalogueBolt
}

// catalogueBolt is one bolt (size and class) with its parts in design-space order.
type catalogueBolt struct {
	flanges []flangeLayout
	webs    []webLayout
	fgeo    []FlangeSplice // per flange part, in splice-file terms
	wgeo    []WebSplice    // per web part
	fsc     []score        // per flange part
	wsc     []score        // per web part
	common  score          // the fixed cost per splice
	byScore []int          // web indices in the order (score, index)
}

// Choice names one whole splice of a catalogue: the bolt index, and the flange and web part
// indices within that bolt, each in design-space order (the order of DesignSpace's lists).
type Choice struct {
	Bolt, Flange, Web int
}

// Order is a whole splice's place in the sizing's order; compare two with Compare.
type Order struct {
	sc  score
	key Choice
}

// Compare orders splices as Size ranks them: cheaper, then fewer bolts, then lighter plates
// (in whole grams), then the first in the design space. It returns −1, 0 or +1.
func (a Order) Compare(b Order) int {
	if c := a.sc.cmp(b.sc); c != 0 {
		return c
	}
	return compareChoice(a.key, b.key)
}

// Choice returns the splice the order belongs to.
func (a Order) Choice() Choice { return a.key }

func compareChoice(a, b Choice) int {
	return cmp.Or(cmp.Compare(a.Bolt, b.Bolt), cmp.Compare(a.Flange, b.Flange), cmp.Compare(a.Web, b.Web))
}

// Entry is one whole splice of a catalogue: its geometry, quantities and cost, as Verify and
// Size report them.
type Entry struct {
	Geometry   Geometry
	Quantities Quantities
	Cost       Cost
}

// NewCatalogue lists the design space of p (p.Sizing) for p's member, plate steel, detailing,
// factors, distribution and rates; p's forces are not used. The errors are those of Size.
func NewCatalogue(p Problem) (*Catalogue, error) {
	return NewSizer(p).Catalogue()
}

// Catalogue returns the catalogue of the sizer's problem, listed once and sharing the sizer's
// layouts. The errors are those of Size.
func (z *Sizer) Catalogue() (*Catalogue, error) {
	pl := z.resolved()
	if pl == nil {
		p := z.base
		_, err := newPlan(&p)
		return nil, err
	}
	z.catOnce.Do(func() {
		p := z.base
		fits, _ := z.fits.Get().(*fitCache)
		s := pl.searcher(&p, nil, fits)
		s.parts, s.hold = z.parts, z.hold
		c := &Catalogue{pl: pl, p: p, bolts: make([]catalogueBolt, len(pl.bolts))}
		e := &pl.base
		for bi := range pl.bolts {
			b, u, cb, bp := &pl.bolts[bi], &pl.rates[bi], &c.bolts[bi], s.layouts(bi)
			cb.common = score{cost: u.splice}
			cb.flanges, cb.webs, cb.fsc, cb.wsc = bp.fls, bp.wls, bp.fsc, bp.wsc
			cb.fgeo = make([]FlangeSplice, len(cb.flanges))
			for i := range cb.flanges {
				cb.fgeo[i] = geometryOf(b, e.cat, e.fc, e.holes, e.gap, &cb.flanges[i], &webLayout{}).Flange
			}
			cb.wgeo = make([]WebSplice, len(cb.webs))
			for i := range cb.webs {
				cb.wgeo[i] = geometryOf(b, e.cat, e.fc, e.holes, e.gap, &flangeLayout{}, &cb.webs[i]).Web
			}
			cb.byScore = bp.worder // by (score, index): byScore's stable order
		}
		z.fits.Put(&fitCache{fitF: s.fitF, fitW: s.fitW, fits: s.fits})
		z.cat = c
	})
	return z.cat, nil
}

// Bolts returns the number of bolts (size and class pairs) of the catalogue.
func (c *Catalogue) Bolts() int { return len(c.bolts) }

// Flanges returns the number of flange parts of a bolt.
func (c *Catalogue) Flanges(bolt int) int { return len(c.bolts[bolt].flanges) }

// Webs returns the number of web parts of a bolt.
func (c *Catalogue) Webs(bolt int) int { return len(c.bolts[bolt].webs) }

// Len returns the number of whole splices: Σ over bolts of flange parts × web parts.
func (c *Catalogue) Len() int {
	n := 0
	for i := range c.bolts {
		n += len(c.bolts[i].flanges) * len(c.bolts[i].webs)
	}
	return n
}

// Bolt returns the bolt of a bolt index, with the sizing's shear-plane rule and system.
func (c *Catalogue) Bolt(bolt int) Bolt {
	b := &c.pl.bolts[bolt]
	return Bolt{Size: b.size.Name, Class: b.class.Name, ShearPlanes: b.rule, System: b.system}
}

// Order returns a splice's place in the sizing's order.
func (c *Catalogue) Order(ch Choice) Order {
	cb := &c.bolts[ch.Bolt]
	return Order{sc: cb.common.add(cb.fsc[ch.Flange]).add(cb.wsc[ch.Web]), key: ch}
}

// Cost returns a whole splice's cost [currency], equal to Entry(ch).Cost.Total.
func (c *Catalogue) Cost(ch Choice) float64 {
	cb := &c.bolts[ch.Bolt]
	return float64(cb.common.cost+cb.fsc[ch.Flange].cost+cb.wsc[ch.Web].cost) / micro
}

// FlangeBefore reports whether flange part f comes before flange part g of the same bolt in
// the sizing's order: with any one web part, the splice with f is ranked before the one with g.
func (c *Catalogue) FlangeBefore(bolt, f, g int) bool {
	cb := &c.bolts[bolt]
	return cmp.Or(cb.fsc[f].cmp(cb.fsc[g]), cmp.Compare(f, g)) < 0
}

// WebBefore reports whether web part w comes before web part v of the same bolt in the
// sizing's order: with any one flange part, the splice with w is ranked before the one with v.
func (c *Catalogue) WebBefore(bolt, w, v int) bool {
	cb := &c.bolts[bolt]
	return cmp.Or(cb.wsc[w].cmp(cb.wsc[v]), cmp.Compare(w, v)) < 0
}

// FlangePart returns a flange part: the flange splice, its bolts (both flanges, both sides)
// and its cover plates' mass [kg].
func (c *Catalogue) FlangePart(bolt, f int) (FlangeSplice, int, float64) {
	q := flangeQty(&c.bolts[bolt].flanges[f], c.pl.base.gap)
	return c.bolts[bolt].fgeo[f], q.bolts, q.mass
}

// WebPart returns a web part: the web splice, its bolts (both sides) and its plates' mass [kg].
func (c *Catalogue) WebPart(bolt, w int) (WebSplice, int, float64) {
	q := webQty(&c.bolts[bolt].webs[w], c.pl.base.gap)
	return c.bolts[bolt].wgeo[w], q.bolts, q.mass
}

// FlangeBoltMass returns the mass of a flange part's bolt assemblies, both flanges, both sides
// of the joint [kg]: the assembly chosen for its plies, as Entry's Quantities.FlangeBoltMass.
func (c *Catalogue) FlangeBoltMass(bolt, f int) float64 {
	q := flangeQty(&c.bolts[bolt].flanges[f], c.pl.base.gap)
	return float64(q.bolts) * q.boltMass
}

// WebBoltMass returns the mass of a web part's bolt assemblies, both sides [kg].
func (c *Catalogue) WebBoltMass(bolt, w int) float64 {
	q := webQty(&c.bolts[bolt].webs[w], c.pl.base.gap)
	return float64(q.bolts) * q.boltMass
}

// Entry returns a whole splice's geometry, quantities and cost.
func (c *Catalogue) Entry(ch Choice) Entry {
	cb := &c.bolts[ch.Bolt]
	fl, wl := &cb.flanges[ch.Flange], &cb.webs[ch.Web]
	e := &c.pl.base
	q, cost := costOf(&c.pl.rates[ch.Bolt], flangeQty(fl, e.gap), webQty(wl, e.gap))
	q.FlangePlateLength, q.WebPlateLength = fl.length, wl.length
	return Entry{Geometry: geometryOf(&c.pl.bolts[ch.Bolt], e.cat, e.fc, e.holes, e.gap, fl, wl), Quantities: q, Cost: cost}
}

// Find returns the catalogue's splice with a geometry, such as the one Size returns.
func (c *Catalogue) Find(g Geometry) (Choice, bool) {
	for bi := range c.bolts {
		if c.Bolt(bi) != g.Bolt {
			continue
		}
		f := slices.Index(c.bolts[bi].fgeo, g.Flange)
		w := slices.Index(c.bolts[bi].wgeo, g.Web)
		if f >= 0 && w >= 0 {
			return Choice{Bolt: bi, Flange: f, Web: w}, true
		}
	}
	return Choice{}, false
}

// Loading is the design actions of one set of forces on the catalogue's splices: the forces
// after the minimum-action policy, shared between flanges and web by the problem's
// distribution rule.
type Loading struct {
	e env
}

// Load prepares the actions of a set of forces (uls and, when not nil, sls) for the checks.
// The error names a force that is not a number or an inverted pair (M_max < M_min).
func (c *Catalogue) Load(uls Forces, sls *Forces) (Loading, error) {
	if err := uls.validate("uls"); err != nil {
		return Loading{}, err
	}
	if sls != nil {
		if err := sls.validate("sls"); err != nil {
			return Loading{}, err
		}
	}
	e := c.pl.base
	p := &c.p
	e.act = designActions(p.Member, uls, sls, p.Distribution, p.Minimum, e.f, e.cat == CategoryB)
	return Loading{e: e}, nil
}

// Actions returns the design actions of the loading.
func (l *Loading) Actions() Actions { return l.e.act }

// FlangeBelow reports whether every flange action of l is at most o's, so that a flange part
// passing at o passes at l.
func (l *Loading) FlangeBelow(o *Loading) bool {
	a, b := &l.e.act.Flange, &o.e.act.Flange
	return a.Tension <= b.Tension && a.Compression <= b.Compression && a.Bolt <= b.Bolt && a.SlipBolt <= b.SlipBolt
}

// WebBelow reports whether every web action of l is at most o's, so that a web part passing at
// o passes at l.
func (l *Loading) WebBelow(o *Loading) bool {
	a, b := &l.e.act.Web, &o.e.act.Web
	return a.Moment <= b.Moment && a.Axial <= b.Axial && a.Shear <= b.Shear &&
		a.SlipMoment <= b.SlipMoment && a.SlipAxial <= b.SlipAxial && a.SlipShear <= b.SlipShear
}

// Envelope returns the loadings whose every flange and web action is the least (lo) and the
// largest (hi) of that action over ls: below, respectively above, every loading of ls. A part
// that fails at lo fails at every loading of ls; one that passes at hi passes at all of them.
// It panics when ls is empty.
func Envelope(ls []Loading) (lo, hi Loading) {
	if len(ls) == 0 {
		panic("splice: Envelope of no loadings")
	}
	lo, hi = ls[0], ls[0]
	for i := range ls[1:] {
		a := &ls[i+1].e.act
		f, w := &a.Flange, &a.Web
		for _, x := range []struct {
			v      float64
			lo, hi *float64
		}{
			{f.Tension, &lo.e.act.Flange.Tension, &hi.e.act.Flange.Tension},
			{f.Compression, &lo.e.act.Flange.Compression, &hi.e.act.Flange.Compression},
			{f.Bolt, &lo.e.act.Flange.Bolt, &hi.e.act.Flange.Bolt},
			{f.SlipBolt, &lo.e.act.Flange.SlipBolt, &hi.e.act.Flange.SlipBolt},
			{w.Moment, &lo.e.act.Web.Moment, &hi.e.act.Web.Moment},
			{w.Axial, &lo.e.act.Web.Axial, &hi.e.act.Web.Axial},
			{w.Shear, &lo.e.act.Web.Shear, &hi.e.act.Web.Shear},
			{w.SlipMoment, &lo.e.act.Web.SlipMoment, &hi.e.act.Web.SlipMoment},
			{w.SlipAxial, &lo.e.act.Web.SlipAxial, &hi.e.act.Web.SlipAxial},
			{w.SlipShear, &lo.e.act.Web.SlipShear, &hi.e.act.Web.SlipShear},
		} {
			*x.lo, *x.hi = min(*x.lo, x.v), max(*x.hi, x.v)
		}
	}
	return lo, hi
}

// FlangePasses reports whether a flange part passes every flange check at a loading.
func (c *Catalogue) FlangePasses(bolt, f int, l *Loading) bool {
	x := flangeEval{e: &l.e, b: &c.pl.bolts[bolt], l: &c.bolts[bolt].flanges[f]}
	g := groupsFor(l.e.cat)
	a := newAcc(true)
	return a.flange(&x, g.flangeRowFree()) && a.flange(&x, g.flangeRows())
}

// WebPasses reports whether a web part passes every web check at a loading.
func (c *Catalogue) WebPasses(bolt, w int, l *Loading) bool {
	x := webEval{e: &l.e, b: &c.pl.bolts[bolt], l: &c.bolts[bolt].webs[w]}
	x.analyse()
	g := groupsFor(l.e.cat)
	a := newAcc(true)
	return a.web(&x, g.webClass()) && a.web(&x, g.webPlates())
}

// Check runs every check of a whole splice at a loading for numbers only: whether all pass and
// the governing utilisation, equal to Verify's Pass and Utilisation for the splice's geometry.
func (c *Catalogue) Check(ch Choice, l *Loading) (pass bool, utilisation float64) {
	cb, b := &c.bolts[ch.Bolt], &c.pl.bolts[ch.Bolt]
	fx := flangeEval{e: &l.e, b: b, l: &cb.flanges[ch.Flange]}
	wx := webEval{e: &l.e, b: b, l: &cb.webs[ch.Web]}
	wx.analyse()
	g := groupsFor(l.e.cat)
	a := newAcc(false)
	a.flange(&fx, g.flangeRowFree())
	a.flange(&fx, g.flangeRows())
	a.web(&wx, g.webClass())
	a.web(&wx, g.webPlates())
	return a.pass, a.measure
}

// Designs lists the whole splices of the catalogue in the sizing's order, from the first that
// is not before from (nil: from the first of all). The caller may drop flange and web parts
// on the way; the listing then skips every splice that has one.
func (c *Catalogue) Designs(from *Order) *DesignIter {
	it := &DesignIter{c: c, dropF: make([][]bool, len(c.bolts)), dropW: make([][]bool, len(c.bolts))}
	for bi := range c.bolts {
		cb := &c.bolts[bi]
		it.dropF[bi] = make([]bool, len(cb.flanges))
		it.dropW[bi] = make([]bool, len(cb.webs))
		if len(cb.webs) == 0 {
			continue
		}
		for f := range cb.flanges {
			pos := 0
			if from != nil && c.row(bi, f, 0).ord.Compare(*from) < 0 {
				pos, _ = slices.BinarySearchFunc(cb.byScore, *from, func(w int, o Order) int {
					return c.Order(Choice{Bolt: bi, Flange: f, Web: w}).Compare(o)
				})
			}
			if pos < len(cb.byScore) {
				it.h = append(it.h, c.row(bi, f, pos))
			}
		}
	}
	heap.Init(&it.h)
	return it
}

func (c *Catalogue) row(bolt, f, pos int) designRow {
	return designRow{pos: pos, ord: c.Order(Choice{Bolt: bolt, Flange: f, Web: c.bolts[bolt].byScore[pos]})}
}

// DesignIter lists whole splices in the sizing's order; see Catalogue.Designs.
type DesignIter struct {
	c            *Catalogue
	h            rowHeap
	dropF, dropW [][]bool
}

// designRow is the splices of one flange part with the web parts in order; pos indexes the
// bolt's webs by score, ord is the splice at pos.
type designRow struct {
	pos int
	ord Order
}

type rowHeap []designRow

func (h rowHeap) Len() int           { return len(h) }
func (h rowHeap) Less(i, j int) bool { return h[i].ord.Compare(h[j].ord) < 0 }
func (h rowHeap) Swap(i, j int)      { h[i], h[j] = h[j], h[i] }
func (h *rowHeap) Push(x any)        { *h = append(*h, x.(designRow)) }
func (h *rowHeap) Pop() any {
	old := *h
	x := old[len(old)-1]
	*h = old[:len(old)-1]
	return x
}

// Next returns the next splice in order and its place; false when none is left.
func (it *DesignIter) Next() (Choice, Order, bool) {
	for len(it.h) > 0 {
		top := it.h[0]
		ch := top.ord.key
		if it.dropF[ch.Bolt][ch.Flange] {
			heap.Pop(&it.h)
			continue
		}
		it.advance()
		if it.dropW[ch.Bolt][ch.Web] {
			continue
		}
		return ch, top.ord, true
	}
	return Choice{}, Order{}, false
}

// advance moves the first row on to its next web part that is not dropped.
func (it *DesignIter) advance() {
	top := &it.h[0]
	ch := top.ord.key
	cb := &it.c.bolts[ch.Bolt]
	pos := top.pos + 1
	for pos < len(cb.byScore) && it.dropW[ch.Bolt][cb.byScore[pos]] {
		pos++
	}
	if pos == len(cb.byScore) {
		heap.Pop(&it.h)
		return
	}
	*top = it.c.row(ch.Bolt, ch.Flange, pos)
	heap.Fix(&it.h, 0)
}

// DropFlange removes every later splice with flange part f of the bolt.
func (it *DesignIter) DropFlange(bolt, f int) { it.dropF[bolt][f] = true }

// DropWeb removes every later splice with web part w of the bolt.
func (it *DesignIter) DropWeb(bolt, w int) { it.dropW[bolt][w] = true }

// String describes a choice by its indices, for messages.
func (ch Choice) String() string {
	return fmt.Sprintf("bolt %d, flange %d, web %d", ch.Bolt, ch.Flange, ch.Web)
}
