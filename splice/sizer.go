package splice

import (
	"slices"
	"sync"
	"sync/atomic"
)

// Sizer sizes the splices of one problem (member, steels, design space, rates, everything but
// the forces) at many sets of forces, as a scan along a beam does. It keeps what does not
// depend on the forces: the flange and web layouts of each bolt, which the search for the
// closest attempt where nothing passes visits in full. Its Size returns exactly what Size
// returns for the problem with those forces. A Sizer is safe for concurrent use.
type Sizer struct {
	base    Problem
	once    sync.Once
	plan    *plan         // nil: the problem does not resolve (each Size says why)
	parts   []boltParts   // by bolt index of the resolved design space
	hold    []heldLayouts // by bolt index
	scratch sync.Pool     // *[]float64: the closest attempt's row-free utilisations
	memos   sync.Pool     // *[]int8: a searcher's memo, zeroed when put back
	fits    sync.Pool     // *fitCache: bolt assemblies chosen for plies, kept between positions
	catOnce sync.Once
	cat     *Catalogue // listed on first use
}

// fitCache is a searcher's store of the bolt assemblies chosen per bolt and plies, which do
// not depend on the forces; a layout points into it, so a fit never moves.
type fitCache struct {
	fitF, fitW []int32
	fits       fitPool
}

// boltParts are the drawable layouts of one bolt, listed once, read only afterwards, with what
// does not depend on the forces: the accumulated detailing checks of each (fdet, wdet), the
// flange parts' scores and their order by score (cheapest first, design-space order among
// equals).
type boltParts struct {
	once       sync.Once
	bolt       int // the bolt index
	fls        []flangeLayout
	wls        []webLayout
	fdet, wdet []fastAcc
	fsc, wsc   []score
	forder     []int
	worder     []int
}

// heldLayouts are the layouts of one bolt that the searches have built, drawable or not, as
// flangeAt and webAt build them with their assembly, each on a grid of design-space indices —
// (arrangement, columns, outer thickness, inner thickness, rows) and (columns, thickness,
// rows) — filled as the searches ask for them, from any goroutine.
type heldLayouts struct {
	once   sync.Once
	fg, wg grid
	fl     []atomic.Pointer[heldFlange]
	wl     []atomic.Pointer[heldWeb]
}

// heldFlange is a flange layout as flangeAt builds it with its assembly, and its score.
type heldFlange struct {
	l  flangeLayout
	ok bool
	sc score
}

type heldWeb struct {
	l  webLayout
	ok bool
	sc score
}

// maxHeldLayouts bounds the grids of a bolt's held layouts (the default design space has 1,764
// flange and 189 web layouts); a larger design space builds its layouts each time.
const maxHeldLayouts = 1 << 15

// NewSizer returns the sizer of p; p's forces are ignored.
func NewSizer(p Problem) *Sizer {
	p.ULS, p.SLS = Forces{}, nil
	return &Sizer{base: p}
}

// Size sizes the cheapest splice for the forces (sls nil: no slip check at the serviceability
// state), as Size does for the sizer's problem with these forces.
func (z *Sizer) Size(uls Forces, sls *Forces) (Result, error) {
	p := z.base
	p.ULS, p.SLS = uls, sls
	pl := z.resolved()
	if pl == nil || uls.validate("uls") != nil || (sls != nil && sls.validate("sls") != nil) {
		return Size(p) // the errors as Size gives them
	}
	memo, _ := z.memos.Get().(*[]int8)
	if memo == nil {
		m := make([]int8, pl.memoCells())
		memo = &m
	}
	fits, _ := z.fits.Get().(*fitCache)
	s := pl.searcher(&p, *memo, fits)
	s.parts, s.hold = z.parts, z.hold
	buf, _ := z.scratch.Get().(*[]float64)
	if buf != nil {
		s.rowFreeU = *buf
	}
	r, err := s.size()
	if s.rowFreeU != nil {
		z.scratch.Put(&s.rowFreeU)
	}
	clear(*memo)
	z.memos.Put(memo)
	z.fits.Put(&fitCache{fitF: s.fitF, fitW: s.fitW, fits: s.fits})
	return r, err
}

// resolved returns the sizer's plan, resolved on first use; nil when the problem does not
// resolve.
func (z *Sizer) resolved() *plan {
	z.once.Do(func() {
		p := z.base
		if pl, err := newPlan(&p); err == nil {
			z.plan = pl
			z.parts, z.hold = make([]boltParts, len(pl.bolts)), make([]heldLayouts, len(pl.bolts))
		}
	})
	return z.plan
}

// layouts returns the drawable flange and web layouts of bolt bi with what does not depend on
// the forces: from the sizer's store when the searcher has one (filled on first use), else
// listed for this search alone.
func (s *searcher) layouts(bi int) *boltParts {
	if s.parts == nil {
		var bp boltParts
		s.listParts(bi, &bp)
		return &bp
	}
	bp := &s.parts[bi]
	bp.once.Do(func() { s.listParts(bi, bp) })
	return bp
}

// listParts fills bp for bolt bi.
func (s *searcher) listParts(bi int, bp *boltParts) {
	b, u, e := &s.bolts[bi], &s.rates[bi], s.e
	bp.bolt = bi
	s.forEachFlange(b, func(fl *flangeLayout) { bp.fls = append(bp.fls, *fl) })
	s.forEachWeb(b, func(wl *webLayout) { bp.wls = append(bp.wls, *wl) })
	var v evaluator // not s.scan: the search may hold it
	bp.fdet, bp.fsc = make([]fastAcc, len(bp.fls)), make([]score, len(bp.fls))
	for i := range bp.fls {
		x := v.flange(e, b, &bp.fls[i])
		a := newAcc(false)
		a.flangeOf(x, s.groups.flangeRowFree(), true)
		a.flangeOf(x, s.groups.flangeRows(), true)
		bp.fdet[i], bp.fsc[i] = a, u.score(flangeQty(&bp.fls[i], e.gap))
	}
	bp.wdet, bp.wsc = make([]fastAcc, len(bp.wls)), make([]score, len(bp.wls))
	for i := range bp.wls {
		x := v.web(e, b, &bp.wls[i])
		a := newAcc(false)
		a.webOf(x, s.groups.webClass(), true)
		a.webOf(x, s.groups.webPlates(), true)
		bp.wdet[i], bp.wsc[i] = a, u.score(webQty(&bp.wls[i], e.gap))
	}
	bp.forder, bp.worder = byScore(bp.fsc), byScore(bp.wsc)
}

// byScore returns the indices of sc ordered by score, cheapest first, in index order among
// equals.
func byScore(sc []score) []int {
	order := make([]int, len(sc))
	for i := range order {
		order[i] = i
	}
	slices.SortStableFunc(order, func(i, j int) int { return sc[i].cmp(sc[j]) })
	return order
}

// held returns the held layouts of bolt bi, nil without a Sizer or past maxHeldLayouts.
func (s *searcher) held(bi int) *heldLayouts {
	if s.hold == nil {
		return nil
	}
	h := &s.hold[bi]
	h.once.Do(func() {
		fg := newGrid(len(s.sp.inner), s.nfc, s.nth, s.nth, len(s.sp.frows))
		wg := newGrid(s.nwc, s.nth, s.nwr)
		if fg.cells() <= maxHeldLayouts && wg.cells() <= maxHeldLayouts {
			h.fg, h.wg = fg, wg
			h.fl, h.wl = make([]atomic.Pointer[heldFlange], fg.cells()), make([]atomic.Pointer[heldWeb], wg.cells())
		}
	})
	if h.fl == nil {
		return nil
	}
	return h
}

// flangeHeld is flangeAt with its score, kept by the Sizer once built (with its assembly
// whatever fit asks: a bound that does not price by mass ignores it). The layout is read only
// (a Sizer's, or the searcher's scratch until the next call); one built without its assembly
// (fit false, no Sizer) has none.
func (s *searcher) flangeHeld(b *boltData, ai, ci, toI, tiI, ri int, fit bool) (*flangeLayout, bool, score) {
	bi := b.key[0]*s.nclass + b.key[1]
	h := s.held(bi)
	if h == nil {
		fl, ok := s.flangeAt(b, ai, ci, toI, tiI, ri, fit)
		s.scratchF = heldFlange{fl, ok, s.rates[bi].score(flangeQty(&fl, s.e.gap))}
		return &s.scratchF.l, ok, s.scratchF.sc
	}
	if !s.sp.inner[ai] {
		tiI = 0
	}
	c := &h.fl[h.fg.at(ai, ci, toI, tiI, ri)]
	p := c.Load()
	if p == nil {
		fl, ok := s.flangeAt(b, ai, ci, toI, tiI, ri, true)
		c.CompareAndSwap(nil, &heldFlange{fl, ok, s.rates[bi].score(flangeQty(&fl, s.e.gap))})
		p = c.Load()
	}
	return &p.l, p.ok, p.sc
}

// webHeld is webAt, kept by the Sizer as flangeHeld.
func (s *searcher) webHeld(b *boltData, ci, tpI, ri int, fit bool) (*webLayout, bool, score) {
	bi := b.key[0]*s.nclass + b.key[1]
	h := s.held(bi)
	if h == nil {
		wl, ok := s.webAt(b, ci, tpI, ri, fit)
		s.scratchW = heldWeb{wl, ok, s.rates[bi].score(webQty(&wl, s.e.gap))}
		return &s.scratchW.l, ok, s.scratchW.sc
	}
	c := &h.wl[h.wg.at(ci, tpI, ri)]
	p := c.Load()
	if p == nil {
		wl, ok := s.webAt(b, ci, tpI, ri, true)
		c.CompareAndSwap(nil, &heldWeb{wl, ok, s.rates[bi].score(webQty(&wl, s.e.gap))})
		p = c.Load()
	}
	return &p.l, p.ok, p.sc
}
