package splice

import "sync"

// Sizer sizes the splices of one problem (member, steels, design space, rates, everything but
// the forces) at many sets of forces, as a scan along a beam does. It keeps what does not
// depend on the forces: the flange and web layouts of each bolt, which the search for the
// closest attempt where nothing passes visits in full. Its Size returns exactly what Size
// returns for the problem with those forces. A Sizer is safe for concurrent use.
type Sizer struct {
	base  Problem
	once  sync.Once
	parts []boltParts // by bolt index of the resolved design space
}

// boltParts are the drawable layouts of one bolt, listed once, read only afterwards, with the
// accumulated detailing checks of each (fdet, wdet), which depend on the geometry alone.
type boltParts struct {
	once       sync.Once
	fls        []flangeLayout
	wls        []webLayout
	fdet, wdet []fastAcc
}

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
	s, err := newSearcher(&p)
	if err != nil {
		return Result{}, err
	}
	z.once.Do(func() { z.parts = make([]boltParts, len(s.bolts)) })
	if len(z.parts) != len(s.bolts) {
		panic("splice: a Sizer's design space resolved to a different number of bolts")
	}
	s.parts = z.parts
	return s.size()
}

// layouts returns the drawable flange and web layouts of bolt bi in design-space order, and
// the detailing part of their accumulators: from the sizer's store when the searcher has one
// (filled on first use), else listed into the buffers given, without the accumulators.
func (s *searcher) layouts(bi int, fls []flangeLayout, wls []webLayout) ([]flangeLayout, []webLayout, []fastAcc, []fastAcc) {
	b := &s.bolts[bi]
	list := func(fls []flangeLayout, wls []webLayout) ([]flangeLayout, []webLayout) {
		s.forEachFlange(b, func(fl *flangeLayout) { fls = append(fls, *fl) })
		s.forEachWeb(b, func(wl *webLayout) { wls = append(wls, *wl) })
		return fls, wls
	}
	if s.parts == nil {
		fls, wls = list(fls[:0], wls[:0])
		return fls, wls, nil, nil
	}
	bp := &s.parts[bi]
	bp.once.Do(func() {
		bp.fls, bp.wls = list(nil, nil)
		var v evaluator // not s.scan: the search may hold it
		bp.fdet = make([]fastAcc, len(bp.fls))
		for i := range bp.fls {
			x := v.flange(s.e, b, &bp.fls[i])
			a := newAcc(false)
			a.flangeOf(x, s.groups.flangeRowFree(), true)
			a.flangeOf(x, s.groups.flangeRows(), true)
			bp.fdet[i] = a
		}
		bp.wdet = make([]fastAcc, len(bp.wls))
		for i := range bp.wls {
			x := v.web(s.e, b, &bp.wls[i])
			a := newAcc(false)
			a.webOf(x, s.groups.webClass(), true)
			a.webOf(x, s.groups.webPlates(), true)
			bp.wdet[i] = a
		}
	})
	return bp.fls, bp.wls, bp.fdet, bp.wdet
}
