package optimise

import (
	"container/heap"
	"slices"
	"sort"
)

// Recursive enumeration of paths in cost order (Jiménez and Marzal 1999): the r-th best path
// to a state extends the best paths of its predecessors, so each state keeps the paths found
// so far and a heap of candidates for the next. Jiménez and Marzal put every predecessor's
// best path into a state's heap at once; here a state takes its predecessors one at a time,
// in order, from a range-minimum tree over the layer before (each layer's tree built when
// first needed), so a state holds only the candidates it has drawn. The memory follows the
// paths listed, not the predecessors of every state they pass through.

// pathEnt is the r-th best path to a state: its cost, tie, predecessor node and the rank of
// the predecessor's path it extends. As a candidate it is the path it would be.
type pathEnt struct {
	cost, tie int64
	pred      int32
	rank      int32
}

// before orders candidate paths to one state: cost, tie, the predecessor further left, then
// the lower rank.
func (a pathEnt) before(b pathEnt) bool {
	if a.cost != b.cost || a.tie != b.tie || a.pred != b.pred {
		return better(a.cost, a.tie, int(a.pred), b.cost, b.tie, int(b.pred))
	}
	return a.rank < b.rank
}

type candHeap []pathEnt

func (h candHeap) Len() int           { return len(h) }
func (h candHeap) Less(i, j int) bool { return h[i].before(h[j]) }
func (h candHeap) Swap(i, j int)      { h[i], h[j] = h[j], h[i] }
func (h *candHeap) Push(x any)        { *h = append(*h, x.(pathEnt)) }
func (h *candHeap) Pop() any {
	old := *h
	x := old[len(old)-1]
	*h = old[:len(old)-1]
	return x
}

// stateOf is what the enumeration knows of one state.
type stateOf struct {
	paths []pathEnt  // the best paths to it found so far, in order
	next  candHeap   // the next-ranked extensions of predecessors already used
	preds *predOrder // the predecessors not yet used, in order of their best path; nil until needed
}

// enumerator lists the paths to the right end of one (tier, k, constraint) search in the
// order (splice cost, tie, positions from the right). State (ℓ, j) is the ℓ-th splice at
// node j; (0, 0) is the left end and (k+1, n+1) the right end.
type enumerator struct {
	s      *search
	t      *tier
	k      int
	lt     *lattice
	states map[int]*stateOf
}

func newEnumerator(s *search, t *tier, lt *lattice) *enumerator {
	return &enumerator{s: s, t: t, k: lt.k, lt: lt, states: map[int]*stateOf{}}
}

func (en *enumerator) state(layer, node int) int { return layer*(en.s.n+2) + node }

func (en *enumerator) split(st int) (layer, node int) { return st / (en.s.n + 2), st % (en.s.n + 2) }

// end is the state of the right end.
func (en *enumerator) end() int { return en.state(en.k+1, en.s.n+1) }

// kth returns the m-th best path (0-based) to a state.
func (en *enumerator) kth(st, m int) (pathEnt, bool) {
	layer, node := en.split(st)
	so := en.states[st]
	if so == nil {
		f, ok := en.lt.at(layer, node)
		if !ok {
			return pathEnt{}, false
		}
		so = &stateOf{paths: []pathEnt{f}}
		en.states[st] = so
	}
	if layer == 0 {
		return so.paths[0], m == 0
	}
	add, addTie := en.s.cost[node], en.s.tie[node]
	for len(so.paths) <= m {
		if so.preds == nil {
			so.preds = en.predOrder(layer, node, int(so.paths[0].pred))
		}
		last := so.paths[len(so.paths)-1]
		if q, ok := en.kth(en.state(layer-1, int(last.pred)), int(last.rank)+1); ok {
			heap.Push(&so.next, pathEnt{cost: q.cost + add, tie: q.tie + addTie, pred: last.pred, rank: last.rank + 1})
		}
		var c pathEnt
		if i, ok := so.preds.peek(); ok {
			f, _ := en.lt.at(layer-1, i)
			c = pathEnt{cost: f.cost + add, tie: f.tie + addTie, pred: int32(i)}
		}
		switch {
		case so.preds.empty() && so.next.Len() == 0:
			return pathEnt{}, false
		case !so.preds.empty() && (so.next.Len() == 0 || c.before(so.next[0])):
			so.preds.pop()
		default:
			c = heap.Pop(&so.next).(pathEnt)
		}
		so.paths = append(so.paths, c)
	}
	return so.paths[m], true
}

// sites returns the site indices of the m-th path to the right end, left to right.
func (en *enumerator) sites(m int) []int {
	var rev []int
	st, r := en.end(), m
	for {
		layer, node := en.split(st)
		if layer == 0 {
			break
		}
		pe, _ := en.kth(st, r)
		if layer <= en.k {
			rev = append(rev, node-1)
		}
		st, r = en.state(layer-1, int(pe.pred)), int(pe.rank)
	}
	slices.Reverse(rev)
	return rev
}

// predOrder gives the predecessors of a state other than its best path's, in the order of
// their best paths: the nodes of the layer before with a partial path and a valid piece to
// this node. It looks only at the window of nodes whose piece length can be within the
// limits (the piece starts rise with the node index), drawing the next best from the
// layer's range-minimum tree and splitting the window around it.
type predOrder struct {
	en       *enumerator
	layer    int // the layer before the state's
	node     int
	skip     int
	parts    []part // the window's unsplit parts, a heap by their best node
	settled  bool   // the top of parts is a valid predecessor
	emptyNow bool
}

// part is a range of the layer's entries lo..hi (indices into the layer) with its best entry.
type part struct{ lo, hi, best int }

func (en *enumerator) predOrder(layer, node, skip int) *predOrder {
	po := &predOrder{en: en, node: node, skip: skip}
	if layer == 1 {
		po.emptyNow = true // the left end is the only predecessor
		return po
	}
	s := en.s
	po.layer = layer - 1
	ly := po.ly()
	lo := 1 + sort.Search(s.n, func(k int) bool { return s.length(k+1, node) <= en.t.maxLen+lengthTol })
	hi := lo - 1
	for hi+1 <= s.n && hi+1 < node {
		if l := s.length(hi+1, node); l <= 0 || l < s.p.Limits.MinLength-lengthTol {
			break
		}
		hi++
	}
	lo, hi = max(lo, ly.lo)-ly.lo, min(hi, ly.hi())-ly.lo
	if lo > hi {
		po.emptyNow = true
		return po
	}
	if b := queryTree(ly, lo, hi); b >= 0 {
		po.parts = []part{{lo, hi, b}}
	}
	return po
}

// ly returns the entries of the layer before (the lattice may have recomputed them).
func (po *predOrder) ly() *layer {
	ly := po.en.lt.layer(po.layer)
	if len(ly.tree) == 0 {
		ly.tree = buildTree(ly)
	}
	return ly
}

func (po *predOrder) less(a, b part) bool {
	ly := po.ly()
	return better(ly.cost[a.best], ly.tie[a.best], a.best, ly.cost[b.best], ly.tie[b.best], b.best)
}

// settle drops from the top of the heap the nodes that are no predecessor (the best path's
// own, or a piece over the mass limit) until a valid one is on top or none is left.
func (po *predOrder) settle() {
	if po.settled || po.emptyNow {
		return
	}
	for len(po.parts) > 0 {
		i := po.parts[0].best + po.ly().lo
		if i != po.skip && po.en.s.valid(i, po.node, po.en.t) {
			po.settled = true
			return
		}
		po.splitTop()
	}
	po.emptyNow = true
}

// splitTop removes the top part's best node and puts back the two ranges either side of it.
func (po *predOrder) splitTop() {
	top := po.parts[0]
	po.parts[0] = po.parts[len(po.parts)-1]
	po.parts = po.parts[:len(po.parts)-1]
	po.down(0)
	for _, r := range [2][2]int{{top.lo, top.best - 1}, {top.best + 1, top.hi}} {
		if r[0] > r[1] {
			continue
		}
		if b := queryTree(po.ly(), r[0], r[1]); b >= 0 {
			po.parts = append(po.parts, part{r[0], r[1], b})
			po.up(len(po.parts) - 1)
		}
	}
	po.settled = false
}

func (po *predOrder) up(i int) {
	for i > 0 {
		p := (i - 1) / 2
		if !po.less(po.parts[i], po.parts[p]) {
			return
		}
		po.parts[i], po.parts[p] = po.parts[p], po.parts[i]
		i = p
	}
}

func (po *predOrder) down(i int) {
	for {
		l, m := 2*i+1, i
		if l < len(po.parts) && po.less(po.parts[l], po.parts[m]) {
			m = l
		}
		if r := l + 1; r < len(po.parts) && po.less(po.parts[r], po.parts[m]) {
			m = r
		}
		if m == i {
			return
		}
		po.parts[i], po.parts[m] = po.parts[m], po.parts[i]
		i = m
	}
}

func (po *predOrder) empty() bool {
	po.settle()
	return po.emptyNow
}

// peek returns the next predecessor node without taking it.
func (po *predOrder) peek() (int, bool) {
	if po.empty() {
		return 0, false
	}
	return po.parts[0].best + po.ly().lo, true
}

// pop takes the next predecessor.
func (po *predOrder) pop() {
	if !po.empty() {
		po.splitTop()
	}
}

// buildTree builds the range-minimum tree of a layer's entries: leaves in the second half,
// each inner node the better of its children (−1 where no entry has a partial path).
func buildTree(ly *layer) []int32 {
	n := len(ly.pred)
	size := 1
	for size < n {
		size *= 2
	}
	tree := ly.tree[:0]
	if cap(tree) < 2*size {
		tree = make([]int32, 2*size)
	}
	tree = tree[:2*size]
	for i := range size {
		tree[size+i] = -1
		if i < n && ly.pred[i] >= 0 {
			tree[size+i] = int32(i)
		}
	}
	for v := size - 1; v >= 1; v-- {
		tree[v] = bestOf(ly, tree[2*v], tree[2*v+1])
	}
	return tree
}

func bestOf(ly *layer, a, b int32) int32 {
	switch {
	case a < 0:
		return b
	case b < 0:
		return a
	case better(ly.cost[b], ly.tie[b], int(b), ly.cost[a], ly.tie[a], int(a)):
		return b
	}
	return a
}

// queryTree returns the best entry in lo..hi, −1 when none has a partial path.
func queryTree(ly *layer, lo, hi int) int {
	size := len(ly.tree) / 2
	best := int32(-1)
	for l, r := lo+size, hi+size+1; l < r; l, r = l/2, r/2 {
		if l&1 == 1 {
			best = bestOf(ly, best, ly.tree[l])
			l++
		}
		if r&1 == 1 {
			r--
			best = bestOf(ly, best, ly.tree[r])
		}
	}
	return int(best)
}
