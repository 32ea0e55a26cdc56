package optimise

import (
	"container/heap"
	"math"
	"slices"
	"sort"
)

// The layout search works on nodes: node 0 is the left end of the beam, node s+1 is site s,
// node n+1 is the right end. A layout with k splices is a path 0 → a1 → … → ak → n+1 whose
// every edge (a piece) satisfies the limits of one vehicle tier. For a fixed tier and k the
// erection cost is fixed ((k+1) lifts), so the search minimises the sum of the splice costs
// by dynamic programming over layers ℓ = 1..k (the ℓ-th splice), and the trips, which depend
// on every piece's mass at once, by enumerating paths in cost order (Jiménez and Marzal's
// recursive enumeration of k shortest paths) until a lower bound on the trips proves that no
// later path can be cheaper in total.

const (
	lengthTol = 1e-6 // [mm]
	massTol   = 1e-6 // [kg]
)

// entry is the best partial path ending at a node in one layer; pred < 0 means none.
type entry struct {
	cost, tie int64
	pred      int
}

func (e entry) ok() bool { return e.pred >= 0 }

// better orders partial paths ending at one node: cost, tie, then the predecessor further left.
func better(aCost, aTie int64, aPred int, bCost, bTie int64, bPred int) bool {
	if aCost != bCost {
		return aCost < bCost
	}
	if aTie != bTie {
		return aTie < bTie
	}
	return aPred < bPred
}

// tier is one vehicle (or no vehicle) with the piece limits it implies.
type tier struct {
	name     string
	maxLen   float64 // [mm]
	maxMass  float64 // [kg]
	payload  float64 // [kg]
	tripCost int64   // micro-units
	layers   [][]entry
	dead     bool // an unconstrained layer came out empty: no more splices fit
}

// constraint restricts the classes of the splices (Lawler partitioning of the alternatives):
// splice ℓ ≤ len(fixed) lies in class fixed[ℓ−1]; splice len(fixed)+1 in none of exclude.
type constraint struct {
	fixed   []int
	exclude []int
}

func (c *constraint) allows(layer, class int) bool {
	if c == nil {
		return true
	}
	switch {
	case layer <= len(c.fixed):
		return class == c.fixed[layer-1]
	case layer == len(c.fixed)+1:
		return !slices.Contains(c.exclude, class)
	}
	return true
}

type search struct {
	p          *LayoutProblem
	n          int
	start, end []float64 // steel start of a piece leaving node i, steel end of one arriving at node j
	half       []float64 // half the splice mass at each node [kg]
	cost, tie  []int64
	class      []int
	hmin, hmax float64
	minCost    int64
	lift       int64
	tiers      []*tier
}

func newSearch(p *LayoutProblem) *search {
	n := len(p.Sites)
	s := &search{p: p, n: n, start: make([]float64, n+2), end: make([]float64, n+2), half: make([]float64, n+2),
		cost: make([]int64, n+2), tie: make([]int64, n+2), class: make([]int, n+2), lift: micro(p.Lift)}
	s.start[n+1], s.end[n+1] = p.Length, p.Length
	s.hmin, s.hmax = math.Inf(1), 0
	s.minCost = math.MaxInt64
	for i, site := range p.Sites {
		v := i + 1
		s.start[v], s.end[v] = site.X+p.Gap/2, site.X-p.Gap/2
		s.half[v] = site.Mass / 2
		s.cost[v], s.tie[v], s.class[v] = micro(site.Cost), site.Tie, site.Class
		s.hmin, s.hmax = math.Min(s.hmin, s.half[v]), math.Max(s.hmax, s.half[v])
		s.minCost = min(s.minCost, s.cost[v])
	}
	if n == 0 {
		s.hmin, s.minCost = 0, 0
	}
	lim := p.Limits
	if len(p.Vehicles) == 0 {
		s.tiers = []*tier{{maxLen: lim.MaxLength, maxMass: lim.MaxMass, payload: math.Inf(1)}}
	}
	for _, v := range p.Vehicles {
		s.tiers = append(s.tiers, &tier{name: v.Name, maxLen: math.Min(lim.MaxLength, v.MaxLength),
			maxMass: math.Min(lim.MaxMass, v.Payload), payload: v.Payload, tripCost: micro(v.Cost)})
	}
	return s
}

func (s *search) length(i, j int) float64 { return s.end[j] - s.start[i] }

func (s *search) mass(i, j int) float64 {
	return s.p.MassPerLength*s.length(i, j) + s.half[i] + s.half[j] + s.p.Limits.Rigging
}

// lengthOK checks a piece's length; the unspliced beam (0 → n+1) is exempt from the minimum.
func (s *search) lengthOK(i, j int, t *tier) bool {
	l := s.length(i, j)
	if !(l > 0) || l > t.maxLen+lengthTol {
		return false
	}
	return (i == 0 && j == s.n+1) || l >= s.p.Limits.MinLength-lengthTol
}

func (s *search) valid(i, j int, t *tier) bool {
	return s.lengthOK(i, j, t) && s.mass(i, j) <= t.maxMass+massTol
}

// validPath reports whether every piece of a node path is valid on a tier.
func (s *search) validPath(path []int, t *tier) bool {
	for k := 0; k+1 < len(path); k++ {
		if !s.valid(path[k], path[k+1], t) {
			return false
		}
	}
	return true
}

// piece describes the piece between nodes i and j.
func (s *search) piece(i, j int) Piece {
	l := s.length(i, j)
	steel := s.p.MassPerLength * l
	return Piece{From: s.start[i], To: s.end[j], Length: l, SteelMass: steel,
		SpliceMass: s.half[i] + s.half[j], Mass: s.mass(i, j)}
}

// withEnds turns site indices into the node path from the left end to the right end.
func (s *search) withEnds(sites []int) []int {
	path := make([]int, 0, len(sites)+2)
	path = append(path, 0)
	for _, i := range sites {
		path = append(path, i+1)
	}
	return append(path, s.n+1)
}

// firstLayer: one splice, the piece before it leaving the left end.
func (s *search) firstLayer(t *tier, c *constraint) []entry {
	out := noEntries(s.n + 2)
	for j := 1; j <= s.n; j++ {
		if c.allows(1, s.class[j]) && s.valid(0, j, t) {
			out[j] = entry{cost: s.cost[j], tie: s.tie[j], pred: 0}
		}
	}
	return out
}

func noEntries(n int) []entry {
	out := make([]entry, n)
	for i := range out {
		out[i].pred = -1
	}
	return out
}

// nextLayer computes layer ℓ ≥ 2 from layer ℓ−1. For each splice j the admissible previous
// splices i form a window in x (piece length between the limits), found with two pointers
// that only move right; inside it the mass limit holds for certain on the right part (a
// sliding-window minimum, a monotone deque) and is checked piece by piece on a narrow band
// where it depends on the two splices' masses.
func (s *search) nextLayer(prev []entry, layer int, t *tier, c *constraint) []entry {
	n, p := s.n, s.p
	out := noEntries(n + 2)
	rho, rig := p.MassPerLength, p.Limits.Rigging
	margin := 1e-9 * math.Max(1, t.maxMass)
	massBinds := !(rho*t.maxLen+2*s.hmax+rig <= t.maxMass-margin)
	surePass := func(i, j int) bool { return rho*s.length(i, j)+2*s.hmax+rig <= t.maxMass-margin }
	minL := math.Max(p.Limits.MinLength-lengthTol, 0)
	lo, hi, sp, pushed := 1, 0, 1, 0
	dq := make([]int, 0, 64)
	for j := 1; j <= n; j++ {
		for hi+1 < j && s.length(hi+1, j) >= minL && s.length(hi+1, j) > 0 {
			hi++
		}
		for lo <= n && s.length(lo, j) > t.maxLen+lengthTol {
			lo++
		}
		if massBinds {
			for sp <= n && !surePass(sp, j) {
				sp++
			}
		}
		bound := max(lo, sp)
		for pushed < hi {
			pushed++
			e := prev[pushed]
			if pushed < bound || !e.ok() {
				continue
			}
			for len(dq) > 0 {
				b := prev[dq[len(dq)-1]]
				if b.cost < e.cost || b.cost == e.cost && b.tie <= e.tie {
					break
				}
				dq = dq[:len(dq)-1]
			}
			dq = append(dq, pushed)
		}
		for len(dq) > 0 && dq[0] < bound {
			dq = dq[1:]
		}
		if !c.allows(layer, s.class[j]) {
			continue
		}
		best := -1
		if len(dq) > 0 && dq[0] <= hi {
			best = dq[0]
		}
		if massBinds && lo <= hi {
			// the band [first i that may pass, min(hi, sp−1)], checked piece by piece
			top := min(hi, sp-1)
			if top >= lo {
				first := lo + sort.Search(top-lo+1, func(k int) bool {
					i := lo + k
					return rho*s.length(i, j)+s.hmin+s.half[j]+rig <= t.maxMass+massTol
				})
				for i := first; i <= top; i++ {
					e := prev[i]
					if !e.ok() || !s.valid(i, j, t) {
						continue
					}
					if best < 0 || better(e.cost, e.tie, i, prev[best].cost, prev[best].tie, best) {
						best = i
					}
				}
			}
		}
		if best >= 0 {
			out[j] = entry{cost: prev[best].cost + s.cost[j], tie: prev[best].tie + s.tie[j], pred: best}
		}
	}
	return out
}

// final returns the best complete path with k splices (the entry of the right end).
func (s *search) final(layers [][]entry, k int, t *tier) entry {
	end := s.n + 1
	if k == 0 {
		if s.valid(0, end, t) {
			return entry{pred: 0}
		}
		return entry{pred: -1}
	}
	best := entry{pred: -1}
	for i, e := range layers[k] {
		if i == 0 || i > s.n || !e.ok() || !s.valid(i, end, t) {
			continue
		}
		if !best.ok() || better(e.cost, e.tie, i, best.cost, best.tie, best.pred) {
			best = entry{cost: e.cost, tie: e.tie, pred: i}
		}
	}
	return best
}

// unconstrained returns layers 1..k of a tier, computing and keeping them as needed.
func (s *search) unconstrained(t *tier, k int) [][]entry {
	if t.layers == nil {
		t.layers = [][]entry{nil}
	}
	for len(t.layers) <= k && !t.dead {
		l := len(t.layers)
		var e []entry
		if l == 1 {
			e = s.firstLayer(t, nil)
		} else {
			e = s.nextLayer(t.layers[l-1], l, t, nil)
		}
		if !slices.ContainsFunc(e, entry.ok) {
			t.dead = true
		}
		t.layers = append(t.layers, e)
	}
	if len(t.layers) <= k {
		return nil
	}
	return t.layers[:k+1]
}

func (s *search) constrained(t *tier, k int, c *constraint) [][]entry {
	layers := [][]entry{nil}
	for l := 1; l <= k; l++ {
		var e []entry
		if l == 1 {
			e = s.firstLayer(t, c)
		} else {
			e = s.nextLayer(layers[l-1], l, t, c)
		}
		if !slices.ContainsFunc(e, entry.ok) {
			return nil
		}
		layers = append(layers, e)
	}
	return layers
}

// tripsLowerBound bounds the trips of any k-splice layout on a tier from the least total mass.
func (s *search) tripsLowerBound(t *tier, k int) int {
	if math.IsInf(t.payload, 1) {
		return 0 // no vehicle: no trips
	}
	p := s.p
	total := p.MassPerLength*(p.Length-float64(k)*p.Gap) + float64(k)*2*s.hmin + float64(k+1)*p.Limits.Rigging
	return max(1, int(math.Ceil(total/t.payload-1e-9)))
}

// best finds the cheapest k-splice layout on one tier under a constraint (nil: none).
func (s *search) best(t *tier, k int, c *constraint) (Layout, bool) {
	var layers [][]entry
	if c == nil {
		layers = s.unconstrained(t, k)
	} else {
		layers = s.constrained(t, k, c)
	}
	if k > 0 && layers == nil {
		return Layout{}, false
	}
	fin := s.final(layers, k, t)
	if !fin.ok() {
		return Layout{}, false
	}
	en := &enumerator{s: s, t: t, k: k, c: c, layers: layers, paths: map[int][]pathEnt{}, heaps: map[int]*candHeap{}}
	en.paths[en.state(k+1, s.n+1)] = []pathEnt{{cost: fin.cost, tie: fin.tie, pred: fin.pred}}
	lb := s.tripsLowerBound(t, k)
	fixed := s.lift*int64(k+1) + t.tripCost*int64(lb)
	var bestL Layout
	found := false
	for m := 0; ; m++ {
		pe, ok := en.kth(en.state(k+1, s.n+1), m)
		if !ok {
			break
		}
		var sites []int
		if found {
			bound := layoutKey{total: pe.cost + fixed, count: k, tie: pe.tie}
			if bound.total > bestL.key.total || bound.total == bestL.key.total && pe.tie > bestL.key.tie {
				break
			}
			sites = en.sites(m)
			bound.nodes = sites
			if bound.compare(bestL.key) >= 0 {
				break
			}
		} else {
			sites = en.sites(m)
		}
		l := s.layoutFrom(sites, t, s.trips(sites, t))
		if !found || l.key.compare(bestL.key) < 0 {
			bestL, found = l, true
		}
		if bestL.Trips == lb && m == 0 {
			break // the cheapest path meets the least trips: nothing can beat it
		}
		if m+1 >= MaxEnumeration {
			bestL.Proven = false
			break
		}
	}
	return bestL, found
}

// trips counts the trips of the layout through the given sites on a tier.
func (s *search) trips(sites []int, t *tier) int {
	if math.IsInf(t.payload, 1) {
		return 0
	}
	path := s.withEnds(sites)
	masses := make([]float64, len(path)-1)
	for k := range masses {
		masses[k] = s.mass(path[k], path[k+1])
	}
	return Trips(masses, t.payload)
}

// bestOverTiers finds the cheapest k-splice layout on any tier.
func (s *search) bestOverTiers(k int, c *constraint) (Layout, bool) {
	var best Layout
	found := false
	for _, t := range s.tiers {
		if l, ok := s.best(t, k, c); ok && (!found || l.key.compare(best.key) < 0) {
			best, found = l, true
		}
	}
	return best, found
}

// allDead reports whether no tier admits a path with more splices.
func (s *search) allDead(k int) bool {
	for _, t := range s.tiers {
		if s.unconstrained(t, k) != nil {
			return false
		}
	}
	return true
}

// endReachable reports whether some tier admits a last piece to the right end (else no
// number of splices helps, and the count loop need not run to the last site).
func (s *search) endReachable() bool {
	for _, t := range s.tiers {
		for i := 0; i <= s.n; i++ {
			if s.valid(i, s.n+1, t) {
				return true
			}
		}
	}
	return false
}

// byCount finds the best layout for the fewest feasible splice count and the next p.Extra
// counts, then any larger count whose least possible cost is below the best found.
func (s *search) byCount() (LayoutResult, bool) {
	p := s.p
	var res LayoutResult
	fewest := -1
	minTrip := int64(math.MaxInt64)
	for _, t := range s.tiers {
		minTrip = min(minTrip, t.tripCost)
	}
	if len(p.Vehicles) == 0 {
		minTrip = 0
	}
	if !s.endReachable() {
		return res, false
	}
	for k := p.MinSplices; p.MaxSplices < 0 || k <= p.MaxSplices; k++ {
		if k > s.n || k > 0 && s.allDead(k) {
			break
		}
		if fewest >= 0 && k > fewest+p.Extra {
			best := res.ByCount[res.Recommended].key.total
			if int64(k)*s.minCost+int64(k+1)*s.lift+minTrip >= best {
				break
			}
		}
		l, ok := s.bestOverTiers(k, nil)
		if !ok {
			continue
		}
		if fewest < 0 {
			fewest = k
		}
		if k > fewest+p.Extra && l.key.compare(res.ByCount[res.Recommended].key) >= 0 {
			continue
		}
		res.ByCount = append(res.ByCount, l)
		if l.key.compare(res.ByCount[res.Recommended].key) < 0 {
			res.Recommended = len(res.ByCount) - 1
		}
	}
	return res, fewest >= 0
}

// subproblem is one cell of the Lawler partition of the variant classes of one splice count.
type subproblem struct {
	c    constraint
	best Layout
	root bool
}

type subHeap []*subproblem

func (h subHeap) Len() int           { return len(h) }
func (h subHeap) Less(i, j int) bool { return h[i].best.key.compare(h[j].best.key) < 0 }
func (h subHeap) Swap(i, j int)      { h[i], h[j] = h[j], h[i] }
func (h *subHeap) Push(x any)        { *h = append(*h, x.(*subproblem)) }
func (h *subHeap) Pop() any {
	old := *h
	x := old[len(old)-1]
	*h = old[:len(old)-1]
	return x
}

// alternatives lists the next-best variant classes over the reported splice counts, in cost
// order, skipping the layouts already reported by count: Lawler's partitioning of the
// solution space by the class of each splice in turn.
func (s *search) alternatives(byCount []Layout) []Layout {
	if s.p.Alternatives <= 0 {
		return nil
	}
	h := &subHeap{}
	for _, l := range byCount {
		heap.Push(h, &subproblem{best: l, root: true})
	}
	var out []Layout
	for h.Len() > 0 && len(out) < s.p.Alternatives {
		sp := heap.Pop(h).(*subproblem)
		if !sp.root {
			out = append(out, sp.best)
		}
		k := len(sp.best.Sites)
		classes := make([]int, k)
		for i, site := range sp.best.Sites {
			classes[i] = s.class[site+1]
		}
		for m := len(sp.c.fixed); m < k; m++ {
			child := constraint{fixed: classes[:m:m], exclude: []int{classes[m]}}
			if m == len(sp.c.fixed) {
				child.exclude = append(slices.Clone(sp.c.exclude), classes[m])
			}
			if l, ok := s.bestOverTiers(k, &child); ok {
				heap.Push(h, &subproblem{c: child, best: l})
			}
		}
	}
	return out
}

// --- recursive enumeration of paths in cost order --------------------------------------------

// pathEnt is the r-th best path to a state: its cost, tie, predecessor node and the rank of
// the predecessor's path it extends.
type pathEnt struct {
	cost, tie int64
	pred      int
	rank      int
}

type cand struct {
	cost, tie  int64
	pred, rank int
}

type candHeap []cand

func (h candHeap) Len() int { return len(h) }
func (h candHeap) Less(i, j int) bool {
	a, b := h[i], h[j]
	if a.cost != b.cost || a.tie != b.tie || a.pred != b.pred {
		return better(a.cost, a.tie, a.pred, b.cost, b.tie, b.pred)
	}
	return a.rank < b.rank
}
func (h candHeap) Swap(i, j int) { h[i], h[j] = h[j], h[i] }
func (h *candHeap) Push(x any)   { *h = append(*h, x.(cand)) }
func (h *candHeap) Pop() any {
	old := *h
	x := old[len(old)-1]
	*h = old[:len(old)-1]
	return x
}

// enumerator lists the paths to the right end of one (tier, k, constraint) search in the
// order (splice cost, tie, positions from the right). State (ℓ, j) is the ℓ-th splice at
// node j; (0, 0) is the left end and (k+1, n+1) the right end.
type enumerator struct {
	s      *search
	t      *tier
	k      int
	c      *constraint
	layers [][]entry
	paths  map[int][]pathEnt
	heaps  map[int]*candHeap
}

func (en *enumerator) state(layer, node int) int { return layer*(en.s.n+2) + node }

func (en *enumerator) split(st int) (layer, node int) { return st / (en.s.n + 2), st % (en.s.n + 2) }

// first returns the best path to a state from the dynamic programme.
func (en *enumerator) first(layer, node int) (pathEnt, bool) {
	if layer == 0 {
		return pathEnt{pred: -1}, node == 0
	}
	e := en.layers[layer][node]
	return pathEnt{cost: e.cost, tie: e.tie, pred: e.pred}, e.ok()
}

// preds lists the predecessors of a state: the nodes of the layer before with a path and a
// valid piece to this node. Only the nodes whose piece length can be within the limits are
// looked at (the piece starts rise with the node index).
func (en *enumerator) preds(layer, node int) []int {
	if layer == 1 || (layer == en.k+1 && en.k == 0) {
		return []int{0}
	}
	s := en.s
	lo := 1 + sort.Search(s.n, func(k int) bool { return s.length(k+1, node) <= en.t.maxLen+lengthTol })
	var out []int
	for i := lo; i <= s.n && i < node; i++ {
		if l := s.length(i, node); l <= 0 || l < s.p.Limits.MinLength-lengthTol {
			break
		}
		if en.layers[layer-1][i].ok() && s.valid(i, node, en.t) {
			out = append(out, i)
		}
	}
	return out
}

// kth returns the m-th best path (0-based) to a state.
func (en *enumerator) kth(st, m int) (pathEnt, bool) {
	layer, node := en.split(st)
	ents, ok := en.paths[st]
	if !ok {
		f, ok := en.first(layer, node)
		if !ok {
			return pathEnt{}, false
		}
		ents = []pathEnt{f}
		en.paths[st] = ents
	}
	if layer == 0 {
		return ents[0], m == 0
	}
	add := en.s.cost[node]
	addTie := en.s.tie[node]
	for len(ents) <= m {
		h := en.heaps[st]
		if h == nil {
			h = &candHeap{}
			for _, i := range en.preds(layer, node) {
				if i == ents[0].pred {
					continue
				}
				f, _ := en.first(layer-1, i)
				heap.Push(h, cand{cost: f.cost + add, tie: f.tie + addTie, pred: i, rank: 0})
			}
			en.heaps[st] = h
		}
		last := ents[len(ents)-1]
		if q, ok := en.kth(en.state(layer-1, last.pred), last.rank+1); ok {
			heap.Push(h, cand{cost: q.cost + add, tie: q.tie + addTie, pred: last.pred, rank: last.rank + 1})
		}
		ents = en.paths[st] // the recursion may not touch this state, but keep the slice current
		if h.Len() == 0 {
			return pathEnt{}, false
		}
		c := heap.Pop(h).(cand)
		ents = append(ents, pathEnt{cost: c.cost, tie: c.tie, pred: c.pred, rank: c.rank})
		en.paths[st] = ents
	}
	return ents[m], true
}

// sites returns the site indices of the m-th path to the right end, left to right.
func (en *enumerator) sites(m int) []int {
	var rev []int
	st, r := en.state(en.k+1, en.s.n+1), m
	for {
		layer, _ := en.split(st)
		if layer == 0 {
			break
		}
		pe, _ := en.kth(st, r)
		if layer <= en.k {
			_, node := en.split(st)
			rev = append(rev, node-1)
		}
		st, r = en.state(layer-1, pe.pred), pe.rank
	}
	slices.Reverse(rev)
	return rev
}
