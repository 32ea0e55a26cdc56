package optimise

import (
	"cmp"
	"fmt"
	"math"
	"math/bits"
	"slices"
	"sort"

	"spanbreak/splice"
)

// UniformLayout is the best layout of one splice count in which every splice is the same
// design. Its Layout is as the mixed search reports one (positions, pieces, vehicle, trips,
// cost); Sites index the outcome's feasible candidates in order, as the mixed layouts' do, and
// Tie is the sum of the design's utilisation at its splices in millionths.
type UniformLayout struct {
	Layout
	// Design is the one splice design: its cost, bolts, holes, masses, summary and geometry;
	// Utilisation and Governing are those of the splice that works hardest. Zero for the
	// unspliced beam.
	Design SpliceDesign
	// Designs describes each splice at its position, left to right.
	Designs []PlacedSplice
	// Choice is the design's place in the splice package's catalogue of the job's design space.
	Choice splice.Choice

	order splice.Order
}

// PlacedSplice is one splice of a layout at its position.
type PlacedSplice struct {
	X           float64 // [mm]
	Splice      string  // one-line summary of the design
	Cost        float64 // [currency]
	Bolts       int
	Utilisation float64 // governing utilisation at this position
	Governing   string  // id of the governing check there
}

// UniformResult is the outcome of the search for layouts of identical splices.
type UniformResult struct {
	// ByCount is the best uniform layout for each splice count, by the counting rule of the
	// mixed search (LayoutResult.ByCount) applied to uniform layouts; empty when no layout of
	// identical splices satisfies the limits.
	ByCount []UniformLayout
	// Recommended indexes the best of ByCount (UniformLayout.Compare); −1 when it is empty.
	Recommended int
	Stats       UniformStats
}

// UniformStats count the work of the uniform search.
type UniformStats struct {
	Designs     int // whole splices in the design space
	Listed      int // splices listed in cost order before the bounds stopped each count
	Dominated   int // listed splices skipped because an earlier one passes wherever they do, as light
	Searched    int // splices whose layouts were searched
	Parts       int // flange and web parts whose passing positions were found
	Evaluations int // part checks at one set of forces
	Settled     int // counts settled by trying the strongest parts after a long listing without a layout
}

// Compare orders uniform layouts: cheaper first, then fewer splices, then the design first in
// the splice package's order (cost, fewer bolts, lighter plates, design-space order), then the
// smaller sum of utilisations, then by positions compared from the right end (the layout
// whose last splice is further left first), as the mixed search orders positions.
func (l UniformLayout) Compare(o UniformLayout) int {
	a, b := l.key, o.key
	if c := cmp.Or(cmp.Compare(a.total, b.total), cmp.Compare(a.count, b.count)); c != 0 || a.count == 0 {
		return c
	}
	if c := l.order.Compare(o.order); c != 0 {
		return c
	}
	return cmp.Or(cmp.Compare(a.tie, b.tie), compareRevLex(a.nodes, b.nodes))
}

// Uniform finds, for each splice count, the best layout in which every splice is the same
// design of the job's design space, exactly: the least k·cost(D) + transport + erection over
// every design D and every layout of D's feasible positions (those where all of D's checks
// pass, not only those where D is the cheapest), under every piece limit with D's mass on the
// pieces. See uniformSearch for the method. The outcome must come from Run or Optimise with
// the splice package's designer.
func (o *Outcome) Uniform() (UniformResult, error) {
	u, err := newUniformSearch(o)
	if err != nil {
		return UniformResult{}, err
	}
	res := UniformResult{Recommended: -1}
	res.ByCount, res.Recommended = u.byCount()
	for i := range res.ByCount {
		u.describe(&res.ByCount[i])
	}
	res.Stats = u.stats
	return res, nil
}

// PlacedSplices describes each splice of a mixed layout of the outcome at its position.
func (o *Outcome) PlacedSplices(l Layout) []PlacedSplice {
	p := o.layoutProblem()
	out := make([]PlacedSplice, len(l.Sites))
	for i, s := range l.Sites {
		c := o.Candidates[p.Sites[s].Candidate]
		d := c.Design
		out[i] = PlacedSplice{X: c.X, Splice: d.Summary, Cost: d.Cost, Bolts: d.Bolts, Utilisation: d.Utilisation, Governing: d.Governing}
	}
	return out
}

// uniformSearch finds the best layouts of identical splices.
//
// The positions are the feasible candidates of the scan (where no splice passes, none of the
// design space does). A design D = (bolt, flange part, web part) passes at a position exactly
// when its flange part passes with the flange actions there and its web part with the web
// actions (splice.Catalogue), so D's feasible set is S(D) = S(flange) ∩ S(web), and each
// part's set is found once, with one check per distinct set of forces, none at all when the
// part fails below every position's actions or passes above all of them (a part's checks are
// monotone in the actions).
//
// For each splice count k the designs are listed in the sizing's order, that is by cost, from
// the first that could hold a k-splice layout at all: D passes only where it is at least the
// cheapest splice, so D must not be below the least design d for which the positions whose
// cheapest splice is at most d admit k splices. For each listed D:
//
//   - stop when k·cost(D) + the least transport and erection of any k-splice layout (a lower
//     bound from the beam's mass and the vehicles able to carry k+1 pieces) cannot beat the
//     best layout found, since every later design costs no less;
//   - drop every design with D's flange part, or with its web part, when that part's feasible
//     set admits no k-splice layout, or when an earlier part of the same bolt passes wherever
//     it does and is no heavier (dominance of parts);
//   - skip D when an earlier design passes wherever D does and is no heavier (dominance:
//     every layout of D is a layout of that design, no dearer, and it wins ties);
//   - otherwise search D's layouts exactly with the mixed search's dynamic programme, its
//     positions being S(D), each splice at D's cost and mass, tied by D's utilisation there.
//
// Masses only lower a layout's transport when trips are exact (at most MaxExactPacking
// pieces); for more pieces with vehicles, dominance asks for equal masses.
//
// Work: with n positions, u distinct force sets, P parts and k splices, finding the parts'
// sets takes at most P·u checks, and each listed design O(n/64) for its set plus O(m·n/64)
// against the m designs kept for dominance; each searched design costs a layout search,
// O(tiers·k·n) plus the trips enumeration. The bounds usually stop after a handful of designs.
type uniformSearch struct {
	cat      *splice.Catalogue
	designer *SpliceDesigner
	prob     splice.Problem   // the job's splice problem without forces
	p        LayoutProblem    // the mixed layout problem without its sites, which are the positions:
	xs       []float64        // per position: x [mm]
	cand     []int32          // per position: the candidate
	cands    []Candidate      // the outcome's: the positions' forces
	acts     [][10]float64    // per distinct set of forces (a loading): its flange and web actions
	loads    []splice.Loading // the loadings themselves when few (loadingsHeld), else nil
	first    []int32          // per loading: the first position with its forces
	loadOf   []int32          // per position: its loading
	lo, hi   splice.Loading   // below and above every loading
	posets   [2]poset         // of the loadings by flange and by web actions
	orders   []splice.Order   // the positions' cheapest splices, each once
	bestOf   []int32          // per position: its cheapest splice (into orders)
	byBest   []int32          // positions in the order of their cheapest splice
	minCost  int64            // the cheapest splice anywhere [micro-units]
	n        int
	global   *search // every position, splices without cost or mass
	widest   int     // the tier admitting every layout of massless splices that any tier does, or −1

	flanges, webs [][]*partInfo    // per bolt and part, nil until needed
	computed      [2][][]int       // per kind (0 flange, 1 web) and bolt: parts whose sets are known
	witness       map[int][]bitset // per count: positions of layouts known to satisfy the limits
	proofAfter    int              // designs listed without a layout before strongest settles the count
	designs       map[splice.Choice]*designInfo
	kept          []*designInfo // designs not dominated, for the dominance test
	stats         UniformStats
}

// partInfo is what the search knows of one flange or web part of one bolt.
type partInfo struct {
	index          int
	plate, boltsKg float64 // cover plate and bolt assembly masses [kg]
	set            bitset  // positions where it passes; nil until found
	admits         map[int]bool
	dominated      [2]int8 // per mass rule (0 at most as heavy, 1 as heavy): 0 unknown, 1 yes, 2 no
}

// designInfo is a whole splice whose feasible positions are known.
type designInfo struct {
	ch       splice.Choice
	order    splice.Order
	cost     float64 // [currency]
	mass     float64 // plates and bolts [kg], as SpliceDesign.Mass
	set      bitset
	kept     bool    // in uniformSearch.kept
	searched bool    // its layouts have been searched
	ties     []int64 // per loading: its utilisation in millionths, −1 until found; nil until needed
}

func newUniformSearch(o *Outcome) (*uniformSearch, error) {
	s := o.Setup
	designer := s.NewSpliceDesigner(o.Exhaustive)
	cat, err := designer.catalogue()
	if err != nil {
		return nil, err
	}
	u := &uniformSearch{cat: cat, designer: designer, prob: s.Splice, p: o.layoutProblem(),
		designs: map[splice.Choice]*designInfo{}, witness: map[int][]bitset{}, minCost: math.MaxInt64}
	u.p.Alternatives = 0
	u.n = len(u.p.Sites)
	u.xs, u.cand = make([]float64, u.n), make([]int32, u.n)
	for i, site := range u.p.Sites {
		u.xs[i], u.cand[i] = site.X, int32(site.Candidate)
	}
	u.p.Sites = nil
	u.stats.Designs = cat.Len()
	u.cands = o.Candidates
	if err := u.loadings(); err != nil {
		return nil, err
	}
	found := map[splice.Geometry]int32{}
	u.bestOf = make([]int32, u.n)
	for i, ci := range u.cand {
		c := &o.Candidates[ci]
		var g splice.Geometry
		if c.Design.Geometry != nil {
			g = *c.Design.Geometry
		}
		ord, ok := found[g]
		if !ok {
			ch, ok := cat.Find(g)
			if c.Design.Geometry == nil || !ok {
				return nil, fmt.Errorf("optimise: the splice at %s is not in the job's design space; the uniform search needs the candidates sized by the splice package", metres(c.X))
			}
			ord = int32(len(u.orders))
			u.orders = append(u.orders, cat.Order(ch))
			found[g] = ord
		}
		u.bestOf[i] = ord
		u.minCost = min(u.minCost, micro(c.Design.Cost))
	}
	if u.n == 0 {
		u.minCost = 0
	}
	u.posets[0], u.posets[1] = newPoset(u, 0), newPoset(u, 1)
	u.byBest = make([]int32, u.n)
	for i := range u.byBest {
		u.byBest[i] = int32(i)
	}
	slices.SortStableFunc(u.byBest, func(a, b int32) int { return u.best(int(a)).Compare(u.best(int(b))) })
	u.global = u.searchOver(allOf(u.n), 0, 0, nil)
	u.widest = widestTier(u.global)
	for _, l := range append(slices.Clone(o.Layouts.ByCount), o.Layouts.Alternatives...) {
		u.addWitness(l.Sites)
	}
	u.flanges, u.webs = make([][]*partInfo, cat.Bolts()), make([][]*partInfo, cat.Bolts())
	for b := range u.flanges {
		u.flanges[b], u.webs[b] = make([]*partInfo, cat.Flanges(b)), make([]*partInfo, cat.Webs(b))
	}
	u.computed[0], u.computed[1] = make([][]int, cat.Bolts()), make([][]int, cat.Bolts())
	for b := range u.flanges {
		u.proofAfter += len(u.flanges[b]) + len(u.webs[b])
	}
	return u, nil
}

// loadings finds the distinct sets of forces of the positions (the loadings, numbered in the
// order of their first position) and keeps of each its flange and web actions, those the
// checks are monotone in; the splice package's loading, with every other value, is made again
// where a part is checked (loading). The positions are grouped by sorting them by their
// forces (a set with a NaN, which equals nothing, is its own); lo and hi bound every loading
// (splice.Envelope, taken over blocks of loadings and then over the blocks' bounds, which is
// the same).
func (u *uniformSearch) loadings() error {
	force := func(i int32) *PositionForces { return u.forceAt(int(i)) }
	order := make([]int32, u.n)
	for i := range order {
		order[i] = int32(i)
	}
	slices.SortFunc(order, func(a, b int32) int { return cmp.Or(compareForces(force(a), force(b)), cmp.Compare(a, b)) })
	// each run of equal forces, by its first position
	var runs []int32 // index into order of each run's start
	for r, i := range order {
		if r == 0 || *force(i) != *force(order[r-1]) {
			runs = append(runs, int32(r))
		}
	}
	slices.SortFunc(runs, func(a, b int32) int { return cmp.Compare(order[a], order[b]) })
	u.loadOf = make([]int32, u.n)
	u.acts, u.first = make([][10]float64, len(runs)), make([]int32, len(runs))
	var block, los, his []splice.Loading
	flush := func() {
		if len(block) > 0 {
			lo, hi := splice.Envelope(block)
			los, his, block = append(los, lo), append(his, hi), block[:0]
		}
	}
	for l, r := range runs {
		u.first[l] = order[r]
		for k := int(r); k < len(order) && (k == int(r) || *force(order[k]) == *force(order[r])); k++ {
			u.loadOf[order[k]] = int32(l)
		}
		ld, err := u.loadingOf(force(order[r]))
		if err != nil {
			return err
		}
		a := ld.Actions()
		f, w := &a.Flange, &a.Web
		u.acts[l] = [10]float64{f.Tension, f.Compression, f.Bolt, f.SlipBolt,
			w.Moment, w.Axial, w.Shear, w.SlipMoment, w.SlipAxial, w.SlipShear}
		if len(runs) <= loadingsHeld {
			u.loads = append(u.loads, ld)
		}
		if block = append(block, ld); len(block) == 1024 {
			flush()
		}
	}
	flush()
	if len(los) > 0 {
		u.lo, _ = splice.Envelope(los)
		_, u.hi = splice.Envelope(his)
	}
	return nil
}

// forceAt returns the forces at a position.
func (u *uniformSearch) forceAt(i int) *PositionForces {
	return &u.cands[u.cand[i]].Forces
}

// best returns the cheapest splice at a position.
func (u *uniformSearch) best(i int) splice.Order { return u.orders[u.bestOf[i]] }

func (u *uniformSearch) loadingOf(f *PositionForces) (splice.Loading, error) {
	sls := splice.Forces(f.SLS)
	return u.cat.Load(splice.Forces(f.ULS), &sls)
}

// loadingsHeld is the most loadings the search keeps whole (about 700 bytes each); beyond,
// it keeps their actions and makes a loading again for each check.
const loadingsHeld = 1 << 14

// loading returns the splice package's loading of a distinct set of forces: the one kept, or
// one made again in scratch.
func (u *uniformSearch) loading(l int, scratch *splice.Loading) *splice.Loading {
	if u.loads != nil {
		return &u.loads[l]
	}
	var err error
	if *scratch, err = u.loadingOf(u.forceAt(int(u.first[l]))); err != nil {
		panic("optimise: a loading that loaded before fails: " + err.Error())
	}
	return scratch
}

// searchOver builds the layout search whose sites are the positions of a set, each splice
// at one cost and mass, tied by tie(position) (nil: no tie).
func (u *uniformSearch) searchOver(set bitset, cost, mass float64, tie func(int) int64) *search {
	q := u.p // without sites: the search keeps what it needs of those below
	return newSearchOf(&q, set.count(), func(yield func(Site) bool) {
		set.each(func(i int) {
			s := Site{X: u.xs[i], Cost: cost, Mass: mass, Candidate: i}
			if tie != nil {
				s.Tie = tie(i)
			}
			yield(s)
		})
	})
}

// admitsCount reports whether a search admits a k-splice layout on some tier.
func admitsCount(s *search, k int) bool {
	for _, t := range s.tiers {
		if admitsOn(s, t, k) {
			return true
		}
	}
	return false
}

func admitsOn(s *search, t *tier, k int) bool { return s.admits(t, k) }

// widestTier returns the tier whose length and mass limits are each at least every other
// tier's, −1 when there is none: with massless splices the pieces it admits include those of
// every tier, so it alone decides whether a set of positions admits k splices.
func widestTier(s *search) int {
	for i, t := range s.tiers {
		if !slices.ContainsFunc(s.tiers, func(o *tier) bool { return o.maxLen > t.maxLen || o.maxMass > t.maxMass }) {
			return i
		}
	}
	return -1
}

// admits reports whether the positions of a set hold a k-splice layout with massless splices
// (so that no design whose feasible positions lie in the set has one).
func (u *uniformSearch) admits(set bitset, k int) bool {
	switch c := set.count(); {
	case c < k:
		return false
	case c == u.n:
		return admitsCount(u.global, k)
	}
	for _, w := range u.witness[k] {
		if w.subsetOf(set) {
			return true
		}
	}
	s := u.searchOver(set, 0, 0, nil)
	if u.widest < 0 {
		return admitsCount(s, k)
	}
	return admitsOn(s, s.tiers[u.widest], k)
}

// witness keeps the positions of a k-splice layout found, which proves that any set holding
// them admits k splices.
func (u *uniformSearch) addWitness(sites []int) {
	w := newBitset(u.n)
	for _, i := range sites {
		w.add(i)
	}
	u.witness[len(sites)] = append(u.witness[len(sites)], w)
}

// lowest returns the least design that may hold a k-splice layout: the least of the
// positions' cheapest splices d for which the positions whose cheapest splice is at most d
// admit k splices; false when not even every position does.
func (u *uniformSearch) lowest(k int) (splice.Order, bool) {
	if u.n == 0 || !admitsCount(u.global, k) {
		return splice.Order{}, false
	}
	// the positions in the order of their cheapest splice, cut where that splice changes
	var cuts []int
	for j := 1; j <= u.n; j++ {
		if j == u.n || u.best(int(u.byBest[j])).Compare(u.best(int(u.byBest[j-1]))) != 0 {
			cuts = append(cuts, j)
		}
	}
	c := sort.Search(len(cuts), func(c int) bool {
		set := newBitset(u.n)
		for _, i := range u.byBest[:cuts[c]] {
			set.add(int(i))
		}
		return u.admits(set, k)
	})
	return u.best(int(u.byBest[cuts[c]-1])), true
}

// transportLB bounds the transport and erection of any k-splice layout whose splices weigh
// mass each [micro-units]: k+1 lifts, and the fewest trips of the beam's mass on the cheapest
// vehicle whose length and payload could carry k+1 pieces of it. MaxInt64 when none could.
func (u *uniformSearch) transportLB(k int, mass float64) int64 {
	p := &u.p
	lift := micro(p.Lift) * int64(k+1)
	if len(p.Vehicles) == 0 {
		return lift
	}
	steel := p.Length - float64(k)*p.Gap
	total := p.MassPerLength*steel + float64(k)*mass + float64(k+1)*p.Limits.Rigging
	best := int64(math.MaxInt64)
	for _, v := range p.Vehicles {
		maxLen, maxMass := math.Min(p.Limits.MaxLength, v.MaxLength), math.Min(p.Limits.MaxMass, v.Payload)
		if steel > float64(k+1)*(maxLen+lengthTol) || total > float64(k+1)*(maxMass+massTol) {
			continue
		}
		trips := max(1, int(math.Ceil(total/v.Payload-1e-9)))
		best = min(best, micro(v.Cost)*int64(trips))
	}
	if best == math.MaxInt64 {
		return best
	}
	return lift + best
}

// beaten reports whether no k-splice layout of a design of this cost, mass and order can come
// before the layout inc.
func (u *uniformSearch) beaten(k int, cost int64, mass float64, ord splice.Order, inc *UniformLayout) bool {
	t := u.transportLB(k, mass)
	return t == math.MaxInt64 || u.beatenTotal(int64(k)*cost+t, k, ord, inc)
}

// beatenTotal reports whether a k-splice layout of the design ord whose total is at least lb
// cannot come before inc.
func (u *uniformSearch) beatenTotal(lb int64, k int, ord splice.Order, inc *UniformLayout) bool {
	if lb != inc.key.total {
		return lb > inc.key.total
	}
	if k != inc.key.count {
		return k > inc.key.count
	}
	return ord.Compare(inc.order) > 0
}

// byCount applies the mixed search's counting rule: the fewest splices with a uniform layout,
// the next Extra counts, and any larger count whose best is better still.
func (u *uniformSearch) byCount() ([]UniformLayout, int) {
	p := &u.p
	var res []UniformLayout
	rec, fewest := -1, -1
	if !u.global.endReachable() {
		return nil, -1
	}
	for k := p.MinSplices; p.MaxSplices < 0 || k <= p.MaxSplices; k++ {
		if k > u.n || k > 0 && u.global.allDead(k) {
			break
		}
		var cutoff *UniformLayout
		if fewest >= 0 && k > fewest+p.Extra {
			t := u.transportLB(k, 0)
			if t == math.MaxInt64 {
				continue
			}
			if int64(k)*u.minCost+t >= res[rec].key.total {
				break
			}
			cutoff = &res[rec]
		}
		l, ok := u.bestFor(k, cutoff)
		if !ok {
			continue
		}
		if fewest < 0 {
			fewest = k
		}
		res = append(res, l)
		if rec < 0 || l.Compare(res[rec]) < 0 {
			rec = len(res) - 1
		}
	}
	return res, rec
}

// bestFor finds the best uniform layout with k splices that comes before cutoff (nil: any).
func (u *uniformSearch) bestFor(k int, cutoff *UniformLayout) (UniformLayout, bool) {
	if k == 0 {
		l, ok := u.global.bestOverTiers(0, nil)
		ul := UniformLayout{Layout: l}
		return ul, ok && (cutoff == nil || ul.Compare(*cutoff) < 0)
	}
	from, ok := u.lowest(k)
	if !ok {
		return UniformLayout{}, false
	}
	rule := 0
	if len(u.p.Vehicles) > 0 && k+1 > MaxExactPacking {
		rule = 1
	}
	var inc *UniformLayout
	if cutoff != nil {
		c := *cutoff
		inc = &c
	}
	found := false
	it := u.cat.Designs(&from)
	for listed := 0; ; listed++ {
		if !found && listed == u.proofAfter {
			// no layout yet: settle whether any design admits k splices at all
			var any bool
			inc, any = u.strongest(k, rule, inc)
			if !any {
				break
			}
			found = inc != nil && (cutoff == nil || inc.Compare(*cutoff) != 0)
		}
		ch, ord, ok := it.Next()
		if !ok {
			break
		}
		u.stats.Listed++
		cost := micro(u.cat.Cost(ch))
		if inc != nil && u.beaten(k, cost, 0, ord, inc) {
			break // every later design costs no less and comes later
		}
		f, w := u.part(0, ch.Bolt, ch.Flange), u.part(1, ch.Bolt, ch.Web)
		mass := (f.plate + w.plate) + (f.boltsKg + w.boltsKg)
		if inc != nil && u.beaten(k, cost, mass, ord, inc) {
			continue
		}
		if !u.useful(0, ch.Bolt, f, k, rule) {
			it.DropFlange(ch.Bolt, ch.Flange)
			continue
		}
		if !u.useful(1, ch.Bolt, w, k, rule) {
			it.DropWeb(ch.Bolt, ch.Web)
			continue
		}
		d := u.design(ch, ord, mass, f, w, rule)
		if d == nil {
			u.stats.Dominated++
			continue
		}
		if l, ok := u.layout(d, k, inc); ok {
			inc, found = &l, true
		}
	}
	if !found {
		return UniformLayout{}, false
	}
	return *inc, true
}

// strongest settles a count after a long listing without a layout: it finds every part's
// feasible positions, keeps for each bolt the parts whose positions no other part's include,
// and tries each pair of them. When no pair's positions admit k massless splices, no design
// has a k-splice layout (any design's positions lie within such a pair's), and it returns
// false; otherwise it searches the layouts of those pairs and returns the best that comes
// before inc (inc itself when none does).
func (u *uniformSearch) strongest(k, rule int, inc *UniformLayout) (*UniformLayout, bool) {
	u.stats.Settled++
	any := false
	for b := 0; b < u.cat.Bolts(); b++ {
		flanges, webs := u.maximal(0, b), u.maximal(1, b)
		for _, f := range flanges {
			for _, w := range webs {
				fi, wi := u.flanges[b][f], u.webs[b][w]
				if !u.admits(fi.set.and(wi.set), k) {
					continue
				}
				any = true
				ch := splice.Choice{Bolt: b, Flange: f, Web: w}
				d := u.design(ch, u.cat.Order(ch), (fi.plate+wi.plate)+(fi.boltsKg+wi.boltsKg), fi, wi, rule)
				if d == nil {
					continue // an earlier design does as well, and is listed or bounded before it
				}
				if l, ok := u.layout(d, k, inc); ok {
					inc = &l
				}
			}
		}
	}
	return inc, any
}

// maximal returns the parts of one kind of a bolt whose feasible positions no other part's
// include (one of each set), finding every part's positions.
func (u *uniformSearch) maximal(kind, bolt int) []int {
	n := u.cat.Flanges(bolt)
	if kind == 1 {
		n = u.cat.Webs(bolt)
	}
	parts := make([]*partInfo, n)
	for i := range parts {
		pi := u.part(kind, bolt, i)
		if pi.set == nil {
			pi.set = u.passSet(kind, bolt, i)
			u.computed[kind][bolt] = append(u.computed[kind][bolt], i)
		}
		parts[i] = pi
	}
	slices.SortStableFunc(parts, func(a, b *partInfo) int { return cmp.Compare(b.set.count(), a.set.count()) })
	var out []int
	var kept []bitset
	for _, pi := range parts {
		if slices.ContainsFunc(kept, pi.set.subsetOf) {
			continue
		}
		kept = append(kept, pi.set)
		out = append(out, pi.index)
	}
	return out
}

// part returns a flange (kind 0) or web (kind 1) part of a bolt with its masses; its set of
// positions is found by useful.
func (u *uniformSearch) part(kind, bolt, i int) *partInfo {
	parts := u.flanges
	if kind == 1 {
		parts = u.webs
	}
	if pi := parts[bolt][i]; pi != nil {
		return pi
	}
	pi := &partInfo{index: i, admits: map[int]bool{}}
	if kind == 0 {
		_, _, pi.plate = u.cat.FlangePart(bolt, i)
		pi.boltsKg = u.cat.FlangeBoltMass(bolt, i)
	} else {
		_, _, pi.plate = u.cat.WebPart(bolt, i)
		pi.boltsKg = u.cat.WebBoltMass(bolt, i)
	}
	parts[bolt][i] = pi
	return pi
}

// useful reports whether a part may still be in the best k-splice layout: its positions admit
// k splices and no earlier part of the bolt dominates it under the mass rule.
func (u *uniformSearch) useful(kind, bolt int, pi *partInfo, k, rule int) bool {
	if pi.set == nil {
		pi.set = u.passSet(kind, bolt, pi.index)
		u.computed[kind][bolt] = append(u.computed[kind][bolt], pi.index)
	}
	if pi.dominated[rule] == 0 {
		pi.dominated[rule] = 2
		for _, j := range u.computed[kind][bolt] {
			if j != pi.index && u.partDominates(kind, bolt, j, pi, rule) {
				pi.dominated[rule] = 1
				break
			}
		}
	}
	if pi.dominated[rule] == 1 {
		return false
	}
	ok, known := pi.admits[k]
	if !known {
		ok = u.admits(pi.set, k)
		pi.admits[k] = ok
	}
	return ok
}

// partDominates reports whether part j of a bolt comes first, passes wherever part pi does
// and weighs no more (the same under mass rule 1), so that swapping it in improves any splice.
func (u *uniformSearch) partDominates(kind, bolt, j int, pi *partInfo, rule int) bool {
	var q *partInfo
	var before bool
	if kind == 0 {
		q, before = u.flanges[bolt][j], u.cat.FlangeBefore(bolt, j, pi.index)
	} else {
		q, before = u.webs[bolt][j], u.cat.WebBefore(bolt, j, pi.index)
	}
	return before && lighter(q.plate, pi.plate, rule) && lighter(q.boltsKg, pi.boltsKg, rule) && pi.set.subsetOf(q.set)
}

// lighter compares masses under a mass rule: at most as heavy (0) or as heavy (1).
func lighter(a, b float64, rule int) bool {
	if rule == 1 {
		return a == b
	}
	return a <= b
}

// passSet finds the positions where a part passes: nothing to check beyond the envelope when
// it fails below every loading or passes above all of them; otherwise the loadings are
// checked in an order that halves the unknown ones (the median of a linear extension of the
// actions' partial order), each pass settling every loading below it and each failure every
// loading above it — a binary search along each chain of loadings. When the settling stops
// paying (loadings that bound none of the others), the rest are checked one by one.
func (u *uniformSearch) passSet(kind, bolt, i int) bitset {
	var scratch splice.Loading
	passes := func(l *splice.Loading) bool {
		u.stats.Evaluations++
		if kind == 0 {
			return u.cat.FlangePasses(bolt, i, l)
		}
		return u.cat.WebPasses(bolt, i, l)
	}
	u.stats.Parts++
	set := newBitset(u.n)
	if u.n == 0 || !passes(&u.lo) {
		return set
	}
	if passes(&u.hi) {
		return allOf(u.n)
	}
	po := &u.posets[kind]
	nl := len(u.acts)
	pass, known := newBitset(nl), newBitset(nl)
	unknown := slices.Clone(po.order) // the unsettled loadings, in order
	for idle := 0; len(unknown) > 0; {
		if idle >= settleIdle {
			for _, l := range unknown {
				if passes(u.loading(int(l), &scratch)) {
					pass.add(int(l))
				}
			}
			break
		}
		mid := len(unknown) / 2
		l := int(unknown[mid])
		var settled int
		if passes(u.loading(l, &scratch)) {
			settled = known.union(po.below(u, kind, l), pass)
		} else {
			settled = known.union(po.above(u, kind, l), nil)
		}
		if settled > 1 {
			unknown, idle = slices.DeleteFunc(unknown, func(l int32) bool { return known.has(int(l)) }), 0
		} else {
			unknown, idle = slices.Delete(unknown, mid, mid+1), idle+1
		}
	}
	for p, l := range u.loadOf {
		if pass.has(int(l)) {
			set.add(p)
		}
	}
	return set
}

// settleIdle is the number of checks in a row that settle no other loading after which
// passSet checks the remaining loadings one by one.
const settleIdle = 8

// poset is the partial order of the loadings by the flange (kind 0) or web (kind 1) actions:
// a part that passes at a loading passes at every loading below it.
type poset struct {
	order    []int32          // the loadings in a linear extension of the order
	down, up map[int32]bitset // of some loadings: those below it and above it (itself included), as found
	held     int              // words in down and up, at most posetWords
	scratch  bitset           // below and above of a loading not kept
}

// posetWords bounds the words of the sets below and above loadings a poset keeps (1 MiB).
const posetWords = 1 << 17

// newPoset orders the loadings by the sum of their actions, each relative to its largest
// value, which never decreases from a loading to one above it.
func newPoset(u *uniformSearch, kind int) poset {
	nl := len(u.acts)
	po := poset{order: make([]int32, nl), down: map[int32]bitset{}, up: map[int32]bitset{}}
	key := make([]float64, nl)
	hi := u.hi.Actions()
	f, w := &hi.Flange, &hi.Web
	hs := []float64{f.Tension, f.Compression, f.Bolt, f.SlipBolt}
	from := 0
	if kind == 1 {
		hs, from = []float64{w.Moment, w.Axial, w.Shear, w.SlipMoment, w.SlipAxial, w.SlipShear}, 4
	}
	for l := range u.acts {
		for j, x := range u.acts[l][from : from+len(hs)] {
			if hs[j] > 0 {
				key[l] += x / hs[j]
			}
		}
		po.order[l] = int32(l)
	}
	slices.SortStableFunc(po.order, func(a, b int32) int { return cmp.Compare(key[a], key[b]) })
	return po
}

// le reports whether every flange (kind 0) or web (kind 1) action of loading a is at most
// b's (splice.Loading.FlangeBelow, WebBelow), so that a part passing at b passes at a.
func (po *poset) le(u *uniformSearch, kind, a, b int) bool {
	x, y := &u.acts[a], &u.acts[b]
	if kind == 0 {
		return x[0] <= y[0] && x[1] <= y[1] && x[2] <= y[2] && x[3] <= y[3]
	}
	return x[4] <= y[4] && x[5] <= y[5] && x[6] <= y[6] && x[7] <= y[7] && x[8] <= y[8] && x[9] <= y[9]
}

// below returns the loadings below l (l included).
func (po *poset) below(u *uniformSearch, kind, l int) bitset {
	return po.kept(po.down, u, l, func(m int) bool { return po.le(u, kind, m, l) })
}

// above returns the loadings above l (l included).
func (po *poset) above(u *uniformSearch, kind, l int) bitset {
	return po.kept(po.up, u, l, func(m int) bool { return po.le(u, kind, l, m) })
}

// kept returns the loadings m with in(m), from the sets kept when it was found before; it
// keeps it while the poset holds fewer than posetWords words, else it is in the scratch set,
// good until the next call.
func (po *poset) kept(sets map[int32]bitset, u *uniformSearch, l int, in func(m int) bool) bitset {
	if b, ok := sets[int32(l)]; ok {
		return b
	}
	words := (len(u.acts) + 63) / 64
	var b bitset
	if po.held+words <= posetWords {
		b = newBitset(len(u.acts))
		sets[int32(l)] = b
		po.held += words
	} else {
		if po.scratch == nil {
			po.scratch = newBitset(len(u.acts))
		}
		b = po.scratch
		clear(b)
	}
	for m := range u.acts {
		if in(m) {
			b.add(m)
		}
	}
	return b
}

// design returns a whole splice with its feasible positions, or nil when an earlier design
// dominates it under the mass rule.
func (u *uniformSearch) design(ch splice.Choice, ord splice.Order, mass float64, f, w *partInfo, rule int) *designInfo {
	d := u.designs[ch]
	if d == nil {
		d = &designInfo{ch: ch, order: ord, cost: u.cat.Cost(ch), mass: mass, set: f.set.and(w.set)}
		u.designs[ch] = d
	}
	for _, e := range u.kept {
		if e != d && e.order.Compare(d.order) < 0 && lighter(e.mass, d.mass, rule) && d.set.subsetOf(e.set) {
			return nil
		}
	}
	if !d.kept {
		d.kept = true
		u.kept = append(u.kept, d)
	}
	return d
}

// layout searches the best k-splice layout of one design over its feasible positions that
// comes before inc (nil: any). The least total does not depend on the utilisation ties, so
// the search without them decides whether the design can come first at all, and only then
// is it searched again with them, for the layout that wins ties.
func (u *uniformSearch) layout(d *designInfo, k int, inc *UniformLayout) (UniformLayout, bool) {
	if d.set.count() < k {
		return UniformLayout{}, false
	}
	if !d.searched {
		u.stats.Searched++
		d.searched = true
	}
	// the searches are built anew for each count: they are cheap beside what they would hold
	l, ok := u.searchOver(d.set, d.cost, d.mass, nil).bestOverTiers(k, nil)
	if !ok {
		return UniformLayout{}, false
	}
	u.addWitness(l.Sites)
	if inc != nil && u.beatenTotal(l.key.total, k, d.order, inc) {
		return UniformLayout{}, false
	}
	tied := u.searchOver(d.set, d.cost, d.mass, u.ties(d))
	l, _ = tied.bestOverTiers(k, nil)
	for i, s := range l.Sites {
		l.Sites[i] = int(tied.ref[s+1])
	}
	l.key.nodes = l.Sites
	ul := UniformLayout{Layout: l, Choice: d.ch, order: d.order}
	return ul, inc == nil || ul.Compare(*inc) < 0
}

// ties returns a design's utilisation at each position in millionths, the mixed search's
// tie key (the design's bolts and plate mass, the other parts of that key, are the same at
// every position).
func (u *uniformSearch) ties(d *designInfo) func(int) int64 {
	if d.ties == nil {
		d.ties = make([]int64, len(u.acts))
		for i := range d.ties {
			d.ties[i] = -1
		}
	}
	ties := d.ties
	var scratch splice.Loading
	return func(i int) int64 {
		l := u.loadOf[i]
		if ties[l] < 0 {
			pass, ut := u.cat.Check(d.ch, u.loading(int(l), &scratch))
			if !pass {
				panic(fmt.Sprintf("optimise: design %v fails at %s where its parts pass", d.ch, metres(u.xs[i])))
			}
			ties[l] = int64(math.Round(math.Min(ut, 999) * 1e6))
		}
		return ties[l]
	}
}

// describe fills in the design of a layout and each splice's utilisation and governing check,
// from Verify at each position.
func (u *uniformSearch) describe(l *UniformLayout) {
	if len(l.Sites) == 0 {
		return
	}
	e := u.cat.Entry(l.Choice)
	g, q := e.Geometry, e.Quantities
	d := SpliceDesign{Feasible: true, Cost: e.Cost.Total, Bolts: q.Bolts, Holes: q.Holes, PlateMass: q.PlateMass,
		BoltMass: q.BoltMass, FayingArea: q.FayingArea,
		Summary: summary(g), Geometry: &g}
	for i, s := range l.Sites {
		p := u.prob
		f := *u.forceAt(s)
		p.ULS = splice.Forces(f.ULS)
		sls := splice.Forces(f.SLS)
		p.SLS = &sls
		r, err := splice.Verify(p, g)
		if err != nil || !r.Pass {
			panic(fmt.Sprintf("optimise: the uniform design %q does not verify at %s: %v", d.Summary, metres(l.Splices[i]), err))
		}
		if r.Utilisation > d.Utilisation {
			d.Utilisation, d.Governing = r.Utilisation, r.Governing.ID
		}
		l.Designs = append(l.Designs, PlacedSplice{X: l.Splices[i], Splice: d.Summary, Cost: d.Cost, Bolts: d.Bolts,
			Utilisation: r.Utilisation, Governing: r.Governing.ID})
	}
	l.Design = d
}

// bitset is a set of positions.
type bitset []uint64

func newBitset(n int) bitset { return make(bitset, (n+63)/64) }

func allOf(n int) bitset {
	b := newBitset(n)
	for i := range b {
		b[i] = math.MaxUint64
	}
	if r := n % 64; r != 0 {
		b[len(b)-1] = 1<<r - 1
	}
	return b
}

func (b bitset) add(i int) { b[i/64] |= 1 << (i % 64) }

func (b bitset) has(i int) bool { return b[i/64]&(1<<(i%64)) != 0 }

// union adds o to b, and to also (when not nil) the members of o that b did not hold; it
// returns how many those were.
func (b bitset) union(o, also bitset) int {
	n := 0
	for i := range b {
		fresh := o[i] &^ b[i]
		n += bits.OnesCount64(fresh)
		if also != nil {
			also[i] |= fresh
		}
		b[i] |= o[i]
	}
	return n
}

func (b bitset) and(o bitset) bitset {
	out := make(bitset, len(b))
	for i := range b {
		out[i] = b[i] & o[i]
	}
	return out
}

func (b bitset) subsetOf(o bitset) bool {
	for i := range b {
		if b[i]&^o[i] != 0 {
			return false
		}
	}
	return true
}

func (b bitset) count() int {
	n := 0
	for _, w := range b {
		n += bits.OnesCount64(w)
	}
	return n
}

// each visits the members in increasing order.
func (b bitset) each(visit func(int)) {
	for i, w := range b {
		for w != 0 {
			visit(i*64 + bits.TrailingZeros64(w))
			w &= w - 1
		}
	}
}
