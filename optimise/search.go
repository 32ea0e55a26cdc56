package optimise

import (
	"container/heap"
	"fmt"
	"iter"
	"math"
	"slices"
)

// The layout search works on nodes: node 0 is the left end of the beam, node s+1 is site s,
// node n+1 is the right end. A layout with k splices is a path 0 → a1 → … → ak → n+1 whose
// every edge (a piece) satisfies the limits of one vehicle tier. For a fixed tier and k the
// erection cost is fixed ((k+1) lifts), so the search minimises the sum of the splice costs
// by dynamic programming over layers ℓ = 1..k (the ℓ-th splice), and the trips, which depend
// on every piece's mass at once, by enumerating paths in cost order (Jiménez and Marzal's
// recursive enumeration of k shortest paths) until a lower bound on the trips proves that no
// later path can be cheaper in total. The programme runs over bands of nodes that can lie on
// a k-splice layout (lattice.go), and the enumeration draws each state's predecessors in
// order as it needs them (enumerate.go), so that neither keeps k × sites entries.

const (
	lengthTol = 1e-6 // [mm]
	massTol   = 1e-6 // [kg]
)

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

	most   int          // the most splices a chain of valid pieces from the left end holds; −1 until known
	admits map[int]bool // whether a layout with k splices exists, as found
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
	x          []float64 // the site's position [mm]
	cost, tie  []int64
	class, ref []int32 // the site's Class and Candidate
	hmin, hmax float64
	minCost    int64
	lift       int64
	tiers      []*tier
	classes    map[int]nodeRange // the nodes from each class's first site to its last
	deque      []int             // nextLayer's, kept between layers
	budget     int               // entries a lattice holds beyond its checkpoints: latticeEntries
	spare      []*layer          // layers of lattices done with, for the next ones
	spared     int               // their entries
}

func newSearch(p *LayoutProblem) *search { return newSearchOf(p, len(p.Sites), slices.Values(p.Sites)) }

// newSearchOf builds the search of a problem over n sites given in order in place of its
// own; the search keeps what it needs of them, not the sites.
func newSearchOf(p *LayoutProblem, n int, sites iter.Seq[Site]) *search {
	s := &search{p: p, n: n, start: make([]float64, n+2), end: make([]float64, n+2), half: make([]float64, n+2),
		x: make([]float64, n+2), cost: make([]int64, n+2), tie: make([]int64, n+2), class: make([]int32, n+2),
		ref: make([]int32, n+2), lift: micro(p.Lift), classes: map[int]nodeRange{}, budget: latticeEntries}
	s.start[n+1], s.end[n+1] = p.Length, p.Length
	s.hmin, s.hmax = math.Inf(1), 0
	s.minCost = math.MaxInt64
	v := 0
	for site := range sites {
		v++
		s.start[v], s.end[v], s.x[v] = site.X+p.Gap/2, site.X-p.Gap/2, site.X
		s.half[v] = site.Mass / 2
		s.cost[v], s.tie[v], s.class[v], s.ref[v] = micro(site.Cost), site.Tie, int32(site.Class), int32(site.Candidate)
		s.hmin, s.hmax = math.Min(s.hmin, s.half[v]), math.Max(s.hmax, s.half[v])
		s.minCost = min(s.minCost, s.cost[v])
		if c, ok := s.classes[site.Class]; ok {
			s.classes[site.Class] = nodeRange{c.lo, v}
		} else {
			s.classes[site.Class] = nodeRange{v, v}
		}
	}
	if v != n {
		panic(fmt.Sprintf("optimise: a search of %d sites given %d", n, v))
	}
	if n == 0 {
		s.hmin, s.minCost = 0, 0
	}
	lim := p.Limits
	if len(p.Vehicles) == 0 {
		s.tiers = []*tier{{maxLen: lim.MaxLength, maxMass: lim.MaxMass, payload: math.Inf(1), most: -1}}
	}
	for _, v := range p.Vehicles {
		s.tiers = append(s.tiers, &tier{name: v.Name, maxLen: math.Min(lim.MaxLength, v.MaxLength),
			maxMass: math.Min(lim.MaxMass, v.Payload), payload: v.Payload, tripCost: micro(v.Cost), most: -1})
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

// admits reports whether a layout with k splices exists on a tier.
func (s *search) admits(t *tier, k int) bool {
	ok, known := t.admits[k]
	if !known {
		lt := s.lattice(t, k, nil)
		ok = lt != nil
		s.release(lt)
		if t.admits == nil {
			t.admits = map[int]bool{}
		}
		t.admits[k] = ok
	}
	return ok
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
	lt := s.lattice(t, k, c)
	if lt == nil {
		return Layout{}, false
	}
	defer s.release(lt)
	en := newEnumerator(s, t, lt)
	lb := s.tripsLowerBound(t, k)
	fixed := s.lift*int64(k+1) + t.tripCost*int64(lb)
	var bestL Layout
	found := false
	for m := 0; ; m++ {
		pe, ok := en.kth(en.end(), m)
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

// allDead reports whether no tier admits k splices or more, not even short of the right end.
func (s *search) allDead(k int) bool {
	for _, t := range s.tiers {
		if k <= s.mostSplices(t) {
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
			classes[i] = int(s.class[site+1])
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
