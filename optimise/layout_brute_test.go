package optimise

import (
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"sort"
	"testing"

	"github.com/stretchr/testify/require"
)

// bruteLayout is one layout as the brute force sees it.
type bruteLayout struct {
	sites   []int
	vehicle string
	trips   int
	total   int64
	tie     int64
	pieces  []Piece
}

func (a bruteLayout) less(b bruteLayout) bool {
	ka := layoutKey{total: a.total, count: len(a.sites), tie: a.tie, nodes: a.sites}
	kb := layoutKey{total: b.total, count: len(b.sites), tie: b.tie, nodes: b.sites}
	return ka.compare(kb) < 0
}

// bruteForce evaluates every subset of the sites on every tier, written from the problem's
// definition without the search's machinery: pieces between consecutive splices (steel ends
// gap/2 off the splice), each within the length and mass limits of the tier and of the site,
// trips by Trips, total = splices + trips × cost + lifts × pieces.
func bruteForce(p LayoutProblem) (best map[int]bruteLayout, all []bruteLayout) {
	n := len(p.Sites)
	type tierB struct {
		name              string
		maxLen, maxMass   float64
		payload, tripCost float64
	}
	var tiers []tierB
	if len(p.Vehicles) == 0 {
		tiers = append(tiers, tierB{"", p.Limits.MaxLength, p.Limits.MaxMass, math.Inf(1), 0})
	}
	for _, v := range p.Vehicles {
		tiers = append(tiers, tierB{v.Name, math.Min(p.Limits.MaxLength, v.MaxLength), math.Min(p.Limits.MaxMass, v.Payload), v.Payload, v.Cost})
	}
	best = map[int]bruteLayout{}
	for mask := 0; mask < 1<<n; mask++ {
		var sites []int
		for i := 0; i < n; i++ {
			if mask&(1<<i) != 0 {
				sites = append(sites, i)
			}
		}
		k := len(sites)
		if k < p.MinSplices || (p.MaxSplices >= 0 && k > p.MaxSplices) {
			continue
		}
		// pieces
		var pieces []Piece
		from := 0.0
		halfPrev := 0.0
		for _, s := range sites {
			to := p.Sites[s].X - p.Gap/2
			l := to - from
			pieces = append(pieces, Piece{From: from, To: to, Length: l,
				Mass: p.MassPerLength*l + halfPrev + p.Sites[s].Mass/2 + p.Limits.Rigging})
			from, halfPrev = p.Sites[s].X+p.Gap/2, p.Sites[s].Mass/2
		}
		l := p.Length - from
		pieces = append(pieces, Piece{From: from, To: p.Length, Length: l, Mass: p.MassPerLength*l + halfPrev + p.Limits.Rigging})
		var spl, tie int64
		for _, s := range sites {
			spl += micro(p.Sites[s].Cost)
			tie += p.Sites[s].Tie
		}
		for _, t := range tiers {
			ok := true
			var masses []float64
			for _, pc := range pieces {
				if !(pc.Length > 0) || pc.Length > t.maxLen+lengthTol || (k > 0 && pc.Length < p.Limits.MinLength-lengthTol) ||
					pc.Mass > t.maxMass+massTol {
					ok = false
				}
				masses = append(masses, pc.Mass)
			}
			if !ok {
				continue
			}
			trips := 0
			if !math.IsInf(t.payload, 1) {
				trips = Trips(masses, t.payload)
			}
			total := spl + micro(t.tripCost)*int64(trips) + micro(p.Lift)*int64(len(pieces))
			bl := bruteLayout{sites: sites, vehicle: t.name, trips: trips, total: total, tie: tie, pieces: pieces}
			all = append(all, bl)
			if b, ok := best[k]; !ok || bl.less(b) {
				best[k] = bl
			}
		}
	}
	return best, all
}

// bruteResult turns the brute force into the reported lists: the fewest feasible count and
// the next Extra counts, larger counts that beat the best so far, then the alternatives as
// the best layout of each variant class (count and class of every splice) in order,
// skipping the classes of the layouts reported by count.
func bruteResult(p LayoutProblem) (byCount []bruteLayout, alts []bruteLayout, ok bool) {
	best, all := bruteForce(p)
	if len(best) == 0 {
		return nil, nil, false
	}
	var counts []int
	for k := range best {
		counts = append(counts, k)
	}
	sort.Ints(counts)
	fewest := counts[0]
	rec := -1
	for _, k := range counts {
		b := best[k]
		if k > fewest+p.Extra && !b.less(byCount[rec]) {
			continue
		}
		byCount = append(byCount, b)
		if rec < 0 || b.less(byCount[rec]) {
			rec = len(byCount) - 1
		}
	}
	classKey := func(l bruteLayout) string {
		cs := []int{len(l.sites)}
		for _, s := range l.sites {
			cs = append(cs, p.Sites[s].Class)
		}
		return fmt.Sprint(cs)
	}
	reported := map[int]bool{}
	listed := map[string]bool{}
	for _, b := range byCount {
		reported[len(b.sites)] = true
		listed[classKey(b)] = true
	}
	classBest := map[string]bruteLayout{}
	for _, l := range all {
		if !reported[len(l.sites)] {
			continue
		}
		c := classKey(l)
		if b, ok := classBest[c]; !ok || l.less(b) {
			classBest[c] = l
		}
	}
	var cls []bruteLayout
	for c, l := range classBest {
		if !listed[c] {
			cls = append(cls, l)
		}
	}
	sort.Slice(cls, func(i, j int) bool { return cls[i].less(cls[j]) })
	if len(cls) > p.Alternatives {
		cls = cls[:p.Alternatives]
	}
	return byCount, cls, true
}

// randomProblem makes a small layout problem. With plateau the costs come from a short list,
// so that many layouts tie and the tie-breaking is exercised.
func randomProblem(r *rand.Rand, plateau bool) LayoutProblem {
	L := 12000 + r.Float64()*18000
	n := 4 + r.IntN(9)
	grid := 250.0
	var xs []float64
	for x := grid; x < L-grid/2; x += grid {
		xs = append(xs, x)
	}
	r.Shuffle(len(xs), func(i, j int) { xs[i], xs[j] = xs[j], xs[i] })
	xs = xs[:min(n, len(xs))]
	slices.Sort(xs)
	p := LayoutProblem{Length: L, MassPerLength: 0.04 + r.Float64()*0.12, Gap: []float64{0, 10}[r.IntN(2)],
		Limits:     PieceLimits{MaxLength: math.Inf(1), MaxMass: math.Inf(1)},
		MaxSplices: -1, Lift: float64(r.IntN(3)) * 75, Alternatives: r.IntN(5), Extra: 2}
	if r.IntN(4) > 0 {
		p.Limits.MaxLength = 5000 + r.Float64()*12000
	}
	if r.IntN(2) == 0 {
		p.Limits.MinLength = r.Float64() * 3000
	}
	if r.IntN(3) == 0 {
		p.Limits.MaxMass = 400 + r.Float64()*1500
	}
	if r.IntN(3) == 0 {
		p.Limits.Rigging = r.Float64() * 40
	}
	if r.IntN(4) == 0 {
		p.MinSplices = r.IntN(3)
	}
	if r.IntN(4) == 0 {
		p.MaxSplices = p.MinSplices + r.IntN(4)
	}
	for v := r.IntN(4); v > 0; v-- {
		p.Vehicles = append(p.Vehicles, Vehicle{Name: fmt.Sprintf("tier %d", v), MaxLength: 5000 + r.Float64()*14000,
			Payload: 600 + r.Float64()*4000, Cost: float64(100 + r.IntN(900))})
	}
	class := 0
	for i, x := range xs {
		if i > 0 && r.IntN(3) == 0 {
			class++
		}
		s := Site{X: x, Mass: 10 + r.Float64()*80, Class: class, Candidate: i}
		if plateau {
			s.Cost = []float64{300, 300, 420}[r.IntN(3)]
			s.Tie = int64(r.IntN(2))
		} else {
			s.Cost = 200 + r.Float64()*400
			s.Tie = int64(r.IntN(1000))
		}
		p.Sites = append(p.Sites, s)
	}
	return p
}

func requireSameLayout(t *testing.T, want bruteLayout, got Layout, what string) {
	t.Helper()
	require.Equal(t, want.sites, got.Sites, "%s: sites", what)
	require.Equal(t, want.total, micro(got.Cost.Total), "%s: total", what)
	require.Equal(t, want.trips, got.Trips, "%s: trips", what)
	require.Equal(t, want.vehicle, got.Vehicle, "%s: vehicle", what)
	require.True(t, got.Proven, "%s: proven", what)
	require.Len(t, got.Pieces, len(want.pieces))
	for i := range want.pieces {
		require.InDelta(t, want.pieces[i].Length, got.Pieces[i].Length, 1e-9, "%s: piece %d length", what, i)
		require.InDelta(t, want.pieces[i].Mass, got.Pieces[i].Mass, 1e-9, "%s: piece %d mass", what, i)
	}
}

// TestLayoutsEqualBruteForce: the layout search (dynamic programme, path enumeration for
// the trips, Lawler partitioning for the alternatives) equals the brute force over every
// subset of the sites, on random small problems (kind: property, exhaustive reference).
func TestLayoutsEqualBruteForce(t *testing.T) {
	r := rand.New(rand.NewPCG(4, 2026))
	feasible, trials := 0, 3000
	if testing.Short() {
		trials = 300
	}
	for trial := 0; trial < trials; trial++ {
		p := randomProblem(r, trial%2 == 1)
		wantBy, wantAlts, ok := bruteResult(p)
		got, err := Layouts(p)
		name := fmt.Sprintf("trial %d", trial)
		if !ok {
			require.Error(t, err, name)
			var le *LimitError
			require.ErrorAs(t, err, &le, name)
			continue
		}
		feasible++
		require.NoError(t, err, name)
		require.Len(t, got.ByCount, len(wantBy), name)
		for i := range wantBy {
			requireSameLayout(t, wantBy[i], got.ByCount[i], fmt.Sprintf("%s: count %d", name, len(wantBy[i].sites)))
		}
		require.Len(t, got.Alternatives, len(wantAlts), name)
		for i := range wantAlts {
			requireSameLayout(t, wantAlts[i], got.Alternatives[i], fmt.Sprintf("%s: alternative %d", name, i))
		}
	}
	require.Greater(t, feasible, trials/2, "most random problems have a layout")
}

// TestEnumeratorListsPathsInOrder: the recursive path enumeration lists every valid layout of
// one tier and splice count exactly once, in the order (splice cost, tie, positions from the
// right), against a brute-force sort (kind: property, exhaustive reference).
func TestEnumeratorListsPathsInOrder(t *testing.T) {
	r := rand.New(rand.NewPCG(9, 17))
	checked := 0
	for trial := 0; trial < 400; trial++ {
		p := randomProblem(r, trial%2 == 0)
		p.MinSplices, p.MaxSplices = 0, -1
		s := newSearch(&p)
		_, all := bruteForce(p)
		for ti, tr := range s.tiers {
			for k := 0; k <= len(p.Sites); k++ {
				var want [][]int
				for _, l := range all {
					if len(l.sites) == k && l.vehicle == tr.name {
						want = append(want, l.sites)
					}
				}
				keyOf := func(sites []int) layoutKey {
					var c, tie int64
					for _, i := range sites {
						c += micro(p.Sites[i].Cost)
						tie += p.Sites[i].Tie
					}
					return layoutKey{total: c, count: k, tie: tie, nodes: sites}
				}
				sort.Slice(want, func(i, j int) bool { return keyOf(want[i]).compare(keyOf(want[j])) < 0 })
				var got [][]int
				if lt := s.lattice(tr, k, nil); lt != nil {
					en := newEnumerator(s, tr, lt)
					for m := 0; ; m++ {
						if _, ok := en.kth(en.end(), m); !ok {
							break
						}
						got = append(got, en.sites(m))
					}
				}
				require.Equal(t, len(want), len(got), "trial %d tier %d k %d", trial, ti, k)
				for i := range want {
					require.Equal(t, want[i], got[i], "trial %d tier %d k %d path %d", trial, ti, k, i)
				}
				checked += len(want)
			}
		}
	}
	require.Greater(t, checked, 10000)
}

// TestLayoutsOfARealScanEqualBruteForce: the same comparison on the candidates of a real scan
// (the small test job every 1 m, and the demo every 2 m).
func TestLayoutsOfARealScanEqualBruteForce(t *testing.T) {
	for _, tc := range []struct {
		name  string
		setup *Setup
		step  float64
	}{
		{"small job every 1 m", loadJob(t, "small-space.yaml"), 1000},
		{"demo every 2.2 m", demoSetup(t), 2200},
	} {
		t.Run(tc.name, func(t *testing.T) {
			r, err := Run(tc.setup, Settings{Step: tc.step})
			require.NoError(t, err)
			p := r.layoutProblem()
			require.LessOrEqual(t, len(p.Sites), 16, "small enough for every subset")
			require.GreaterOrEqual(t, len(p.Sites), 6)
			wantBy, wantAlts, ok := bruteResult(p)
			require.True(t, ok)
			got := r.Layouts
			require.Len(t, got.ByCount, len(wantBy))
			for i := range wantBy {
				requireSameLayout(t, wantBy[i], got.ByCount[i], "by count")
			}
			require.Len(t, got.Alternatives, len(wantAlts))
			for i := range wantAlts {
				requireSameLayout(t, wantAlts[i], got.Alternatives[i], "alternative")
			}
		})
	}
}

// TestCheckpointedLatticeEqualsHeld: a lattice that holds only its checkpoints and recomputes
// the other layers (its budget cut to one entry, so that every layer but the checkpoints is
// recomputed, and recomputed again after each use) lists the same paths in the same order as
// one that holds every layer, and the layout search over it gives the same layouts and
// alternatives (kind: property, equality with the plain version).
func TestCheckpointedLatticeEqualsHeld(t *testing.T) {
	r := rand.New(rand.NewPCG(23, 5))
	checked := 0
	for trial := 0; trial < 300; trial++ {
		p := randomProblem(r, trial%2 == 0)
		p.MinSplices, p.MaxSplices = 0, -1
		held, tight := newSearch(&p), newSearch(&p)
		tight.budget = 1
		for ti := range held.tiers {
			for k := 0; k <= len(p.Sites); k++ {
				a, b := held.lattice(held.tiers[ti], k, nil), tight.lattice(tight.tiers[ti], k, nil)
				require.Equal(t, a == nil, b == nil, "trial %d tier %d k %d", trial, ti, k)
				if a == nil {
					continue
				}
				if k > 1 {
					require.Greater(t, b.every, 1, "trial %d: the tight lattice holds checkpoints only", trial)
				}
				ea, eb := newEnumerator(held, held.tiers[ti], a), newEnumerator(tight, tight.tiers[ti], b)
				for m := 0; ; m++ {
					pa, oka := ea.kth(ea.end(), m)
					pb, okb := eb.kth(eb.end(), m)
					require.Equal(t, oka, okb, "trial %d tier %d k %d path %d", trial, ti, k, m)
					if !oka {
						break
					}
					require.Equal(t, pa, pb)
					require.Equal(t, ea.sites(m), eb.sites(m), "trial %d tier %d k %d path %d", trial, ti, k, m)
					checked++
				}
			}
		}
		want, errWant := Layouts(p)
		q := p
		s := newSearch(&q)
		s.budget = 1
		got, ok := s.byCount()
		require.Equal(t, errWant == nil, ok, "trial %d", trial)
		if ok {
			got.Alternatives = s.alternatives(got.ByCount)
			require.Equal(t, want, got, "trial %d", trial)
		}
	}
	require.Greater(t, checked, 10000)
}
