package optimise

import (
	"math"
	"sort"
)

// The dynamic programme of one tier, splice count k and constraint keeps, for each layer
// ℓ = 1..k (the ℓ-th splice), the best partial path to every node of a band: the nodes that
// can lie on a k-splice layout at all. A node j is in layer ℓ's band only when
//
//   - a valid piece reaches it from a node of layer ℓ−1 that has a partial path (the band of
//     the layer before, narrowed to the nodes with a path, spans the pieces' lengths forward),
//   - and k−ℓ more splices may take it to the right end as far as the pieces' lengths go
//     (toEnd), and
//   - for a splice whose class the constraint fixes, it lies in that class's nodes.
//
// Every node of a k-splice layout is in its layer's band, and so is every node with a valid
// piece to it that has a partial path: such a node reaches the end through it (and so lies
// within toEnd, which holds every node that can). So the best
// partial path of a node of a layout is the one the full programme over every node finds, and
// so are the predecessors the enumeration of paths looks at; nodes of a band that lie on no
// layout may hold other values, which nothing reads. The bands are narrow where the limits
// leave little choice (k near the fewest splices, a long beam of short pieces), so the work
// and the memory follow the layouts that exist, not k × sites.

// nodeRange is the nodes lo..hi; empty when lo > hi.
type nodeRange struct{ lo, hi int }

func (a nodeRange) empty() bool { return a.lo > a.hi }

func (a nodeRange) and(b nodeRange) nodeRange { return nodeRange{max(a.lo, b.lo), min(a.hi, b.hi)} }

// layer is one layer of the programme over its band: the best partial path to each node.
type layer struct {
	lo        int // node of the first entry
	cost, tie []int64
	pred      []int32 // −1: no partial path
	tree      []int32 // range-minimum tree over the entries for the enumeration, built when first needed
}

func (ly *layer) hi() int { return ly.lo + len(ly.pred) - 1 }

// ok reports whether a node of the band has a partial path; nodes outside the band have none.
func (ly *layer) ok(node int) bool {
	i := node - ly.lo
	return i >= 0 && i < len(ly.pred) && ly.pred[i] >= 0
}

// lattice is the programme of one (tier, k, constraint): layers 1..k, and the best complete
// path, to the right end. It holds every layer while they are few entries in all; past
// latticeEntries it holds only checkpoints — layers 1, 1+every, 1+2·every, … and k, every
// ≈ √k — and recomputes a layer from the checkpoint below it when asked for it (the same
// steps give the same entries), keeping the layers it recomputed while they stay within
// latticeEntries. So its memory is bounded by about (k/every + every) bands, not k bands,
// however long the beam and however many splices.
type lattice struct {
	s      *search
	t      *tier
	c      *constraint
	k      int
	bands  []nodeRange // per layer: its nodes (index 0 unused)
	held   []*layer    // per layer: its entries, nil when not held
	every  int         // 1 while every layer is held, else the checkpoint interval
	cache  []int       // layers held besides the checkpoints, the least recently computed first
	cached int         // entries of the cache
	fin    pathEnt
}

// latticeEntries bounds the entries a lattice holds beyond its checkpoints (20 bytes each);
// search.budget takes it.
const latticeEntries = 1 << 18

// at returns the best partial path to a node of a layer (0: the left end; k+1: the right end).
func (lt *lattice) at(l, node int) (pathEnt, bool) {
	switch {
	case l == 0:
		return pathEnt{pred: -1}, node == 0
	case l == lt.k+1:
		return lt.fin, true
	}
	ly := lt.layer(l)
	if !ly.ok(node) {
		return pathEnt{}, false
	}
	i := node - ly.lo
	return pathEnt{cost: ly.cost[i], tie: ly.tie[i], pred: ly.pred[i]}, true
}

func (lt *lattice) checkpoint(l int) bool { return (l-1)%lt.every == 0 || l == lt.k }

// layer returns layer l's entries, recomputing them (and the layers between) from the
// checkpoint below when they are not held.
func (lt *lattice) layer(l int) *layer {
	if ly := lt.held[l]; ly != nil {
		return ly
	}
	from := l - (l-1)%lt.every
	ly := lt.held[from]
	for m := from + 1; m <= l; m++ {
		if h := lt.held[m]; h != nil {
			ly = h
			continue
		}
		next := lt.s.newLayer(lt.bands[m])
		lt.s.nextLayer(ly, next, m, lt.t, lt.c)
		ly = next
		lt.held[m] = ly
		lt.cache = append(lt.cache, m)
		lt.cached += len(ly.pred)
		for lt.cached > lt.s.budget && len(lt.cache) > 1 && lt.cache[0] != l {
			old := lt.cache[0]
			lt.cache = lt.cache[1:]
			lt.cached -= len(lt.held[old].pred)
			lt.s.recycle(lt.held[old])
			lt.held[old] = nil
		}
	}
	return ly
}

// newLayer returns a layer over a band with no partial path yet, in the memory of a layer
// recycled when one is large enough.
func (s *search) newLayer(b nodeRange) *layer {
	w := b.hi - b.lo + 1
	var ly *layer
	for i, sp := range s.spare {
		if cap(sp.pred) >= w {
			ly = sp
			s.spare[i] = s.spare[len(s.spare)-1]
			s.spare = s.spare[:len(s.spare)-1]
			s.spared -= cap(sp.pred)
			break
		}
	}
	if ly == nil {
		ly = &layer{cost: make([]int64, w), tie: make([]int64, w), pred: make([]int32, w)}
	}
	ly.lo, ly.cost, ly.tie, ly.pred, ly.tree = b.lo, ly.cost[:w], ly.tie[:w], ly.pred[:w], ly.tree[:0]
	for i := range ly.pred {
		ly.pred[i] = -1
	}
	return ly
}

// recycle keeps a layer no lattice holds any more for newLayer, up to latticeEntries entries.
func (s *search) recycle(ly *layer) {
	if ly != nil && s.spared+cap(ly.pred) <= latticeEntries {
		s.spare = append(s.spare, ly)
		s.spared += cap(ly.pred)
	}
}

// release recycles the layers of a lattice that is done with.
func (s *search) release(lt *lattice) {
	if lt == nil {
		return
	}
	for l, ly := range lt.held {
		s.recycle(ly)
		lt.held[l] = nil
	}
}

// lattice runs the programme of one tier, count and constraint (nil: none) over the bands;
// nil when no layout with k splices exists.
func (s *search) lattice(t *tier, k int, c *constraint) *lattice {
	end := s.n + 1
	if k == 0 {
		if !s.valid(0, end, t) {
			return nil
		}
		return &lattice{fin: pathEnt{pred: 0}}
	}
	if k > s.n {
		return nil
	}
	lt := &lattice{s: s, t: t, c: c, k: k, bands: make([]nodeRange, k+1), held: make([]*layer, k+1), every: 1}
	total := 0
	var last *layer
	got := nodeRange{0, 0} // the nodes of the layer before with a partial path
	for l := 1; l <= k; l++ {
		b := s.toEnd(t, k-l).and(s.reachFrom(got, t)).and(nodeRange{1, s.n})
		if c != nil && l <= len(c.fixed) {
			b = b.and(s.classSpan(c.fixed[l-1]))
		}
		if b.empty() {
			if last != nil && lt.held[l-1] == nil {
				s.recycle(last)
			}
			s.release(lt)
			return nil
		}
		lt.bands[l] = b
		ly := s.newLayer(b)
		if l == 1 {
			got = s.firstLayer(ly, t, c)
		} else {
			got = s.nextLayer(last, ly, l, t, c)
		}
		if last != nil && lt.held[l-1] == nil {
			s.recycle(last) // neither held nor needed any more
		}
		if got.empty() {
			s.recycle(ly)
			s.release(lt)
			return nil
		}
		last = ly
		if total += len(ly.pred); lt.every == 1 && total > s.budget {
			lt.every = max(2, int(math.Ceil(math.Sqrt(float64(k)))))
			for m := 1; m < l; m++ {
				if !lt.checkpoint(m) {
					s.recycle(lt.held[m])
					lt.held[m] = nil
				}
			}
		}
		if lt.every == 1 || lt.checkpoint(l) {
			lt.held[l] = ly
		}
	}
	best := -1
	for i := got.lo; i <= got.hi; i++ {
		if !last.ok(i) || !s.valid(i, end, t) {
			continue
		}
		x := i - last.lo
		if best < 0 || better(last.cost[x], last.tie[x], i, last.cost[best-last.lo], last.tie[best-last.lo], best) {
			best = i
		}
	}
	if best < 0 {
		s.release(lt)
		return nil
	}
	x := best - last.lo
	lt.fin = pathEnt{cost: last.cost[x], tie: last.tie[x], pred: int32(best)}
	return lt
}

// reachFrom returns the nodes a piece of valid length can reach from a node of a range: from
// the first whose piece from the range's first node is long enough to the last whose piece
// from its last node is short enough.
func (s *search) reachFrom(from nodeRange, t *tier) nodeRange {
	minL := math.Max(s.p.Limits.MinLength-lengthTol, 0)
	lo := sort.Search(s.n+1, func(j int) bool {
		l := s.length(from.lo, j)
		return j > from.lo && l > 0 && l >= minL
	})
	hi := sort.Search(s.n+1, func(j int) bool { return s.length(from.hi, j) > t.maxLen+lengthTol }) - 1
	return nodeRange{lo, hi}
}

// classSpan returns the nodes of a class's sites (those between its first and its last).
func (s *search) classSpan(class int) nodeRange {
	if sp, ok := s.classes[class]; ok {
		return sp
	}
	return nodeRange{1, 0}
}

// firstLayer: one splice, the piece before it leaving the left end; it returns the nodes with
// a partial path.
func (s *search) firstLayer(ly *layer, t *tier, c *constraint) nodeRange {
	got := nodeRange{ly.hi() + 1, ly.lo - 1}
	for j := ly.lo; j <= ly.hi(); j++ {
		if c.allows(1, int(s.class[j])) && s.valid(0, j, t) {
			x := j - ly.lo
			ly.cost[x], ly.tie[x], ly.pred[x] = s.cost[j], s.tie[j], 0
			got = nodeRange{min(got.lo, j), j}
		}
	}
	return got
}

// nextLayer computes layer ℓ ≥ 2 from layer ℓ−1 and returns the nodes with a partial path.
// For each splice j the admissible previous splices i form a window in x (piece length
// between the limits), found with two pointers that only move right; inside it the mass limit
// holds for certain on the right part (a sliding-window minimum, a monotone deque) and is
// checked piece by piece on a narrow band where it depends on the two splices' masses.
func (s *search) nextLayer(prev, out *layer, l int, t *tier, c *constraint) nodeRange {
	p := s.p
	rho, rig := p.MassPerLength, p.Limits.Rigging
	margin := 1e-9 * math.Max(1, t.maxMass)
	massBinds := !(rho*t.maxLen+2*s.hmax+rig <= t.maxMass-margin)
	surePass := func(i, j int) bool { return rho*s.length(i, j)+2*s.hmax+rig <= t.maxMass-margin }
	minL := math.Max(p.Limits.MinLength-lengthTol, 0)
	plo, phi := prev.lo, prev.hi()
	pc := func(i int) int64 { return prev.cost[i-plo] }
	pt := func(i int) int64 { return prev.tie[i-plo] }
	lo, hi, sp, pushed := plo, plo-1, plo, plo-1
	dq, head := s.deque[:0], 0
	got := nodeRange{out.hi() + 1, out.lo - 1}
	for j := out.lo; j <= out.hi(); j++ {
		for hi+1 < j && hi < phi && s.length(hi+1, j) >= minL && s.length(hi+1, j) > 0 {
			hi++
		}
		for lo <= phi && s.length(lo, j) > t.maxLen+lengthTol {
			lo++
		}
		if massBinds {
			for sp <= phi && !surePass(sp, j) {
				sp++
			}
		}
		bound := max(lo, sp)
		for pushed < hi {
			pushed++
			if pushed < bound || !prev.ok(pushed) {
				continue
			}
			for len(dq) > head {
				b := dq[len(dq)-1]
				if pc(b) < pc(pushed) || pc(b) == pc(pushed) && pt(b) <= pt(pushed) {
					break
				}
				dq = dq[:len(dq)-1]
			}
			dq = append(dq, pushed)
		}
		for len(dq) > head && dq[head] < bound {
			head++
		}
		if !c.allows(l, int(s.class[j])) {
			continue
		}
		best := -1
		if len(dq) > head && dq[head] <= hi {
			best = dq[head]
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
					if !prev.ok(i) || !s.valid(i, j, t) {
						continue
					}
					if best < 0 || better(pc(i), pt(i), i, pc(best), pt(best), best) {
						best = i
					}
				}
			}
		}
		if best >= 0 {
			x := j - out.lo
			out.cost[x], out.tie[x], out.pred[x] = pc(best)+s.cost[j], pt(best)+s.tie[j], int32(best)
			got = nodeRange{min(got.lo, j), j}
		}
	}
	s.deque = dq[:0]
	return got
}

// toEnd returns the nodes from which c more splices (c+1 pieces) may reach the right end as
// far as the pieces' lengths go: the pieces of a chain from node i to the right end sum to
// length(i, n+1) − c·gap, and each lies within the length limits. It holds every node that
// can (the mass limit and the positions between may rule out some of them), which is all
// the programme needs of it; a margin of a micrometre covers the rounding of the sums.
func (s *search) toEnd(t *tier, c int) nodeRange {
	p := s.p
	const slack = 1e-3 // [mm]
	pieces := float64(c + 1)
	least := pieces*math.Max(p.Limits.MinLength-lengthTol, 0) + float64(c)*p.Gap - slack
	most := pieces*(t.maxLen+lengthTol) + float64(c)*p.Gap + slack
	end := s.n + 1
	// length(i, end) falls as i rises
	lo := 1 + sort.Search(s.n, func(k int) bool { return s.length(k+1, end) <= most })
	hi := sort.Search(s.n, func(k int) bool { return s.length(k+1, end) < least })
	return nodeRange{lo, hi}
}

// mostSplices returns the most splices a chain of valid pieces from the left end can hold on
// a tier (a layer ℓ of the programme has a partial path exactly when ℓ is at most this),
// found once by a longest-path programme with the same windows as nextLayer.
func (s *search) mostSplices(t *tier) int {
	if t.most >= 0 {
		return t.most
	}
	p, n := s.p, s.n
	rho, rig := p.MassPerLength, p.Limits.Rigging
	margin := 1e-9 * math.Max(1, t.maxMass)
	massBinds := !(rho*t.maxLen+2*s.hmax+rig <= t.maxMass-margin)
	surePass := func(i, j int) bool { return rho*s.length(i, j)+2*s.hmax+rig <= t.maxMass-margin }
	minL := math.Max(p.Limits.MinLength-lengthTol, 0)
	count := make([]int32, n+1) // splices of the longest chain ending at each site; 0: none
	lo, hi, sp, pushed := 1, 0, 1, 0
	var dq []int
	head := 0
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
			if pushed < bound || count[pushed] == 0 {
				continue
			}
			for len(dq) > head && count[dq[len(dq)-1]] <= count[pushed] {
				dq = dq[:len(dq)-1]
			}
			dq = append(dq, pushed)
		}
		for len(dq) > head && dq[head] < bound {
			head++
		}
		var best int32
		if s.valid(0, j, t) {
			best = 1
		}
		if len(dq) > head {
			best = max(best, count[dq[head]]+1)
		}
		if massBinds && lo <= hi {
			for i := lo; i <= min(hi, sp-1); i++ {
				if count[i] > 0 && count[i]+1 > best && s.valid(i, j, t) {
					best = count[i] + 1
				}
			}
		}
		count[j] = best
		t.most = max(t.most, int(best))
	}
	t.most = max(t.most, 0)
	return t.most
}
