package optimise

import (
	"cmp"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"github.com/stretchr/testify/require"

	"spanbreak/splice"
)

// tinySpaces are design spaces small enough to try every splice at every position and every
// layout of each: 16 to 48 whole splices.
var tinySpaces = []splice.DesignSpace{
	{Sizes: []string{"M20"}, Classes: []string{"8.8", "10.9"}, Thicknesses: []float64{10, 15},
		Arrangements: []splice.Arrangement{splice.OuterOnly}, FlangeColumns: []int{2}, FlangeRows: []int{2, 3},
		WebColumns: []int{1}, WebRows: []int{2, 3}},
	{Sizes: []string{"M20", "M24"}, Classes: []string{"10.9"}, Thicknesses: []float64{10, 20},
		Arrangements: []splice.Arrangement{splice.OuterOnly, splice.OuterInner}, FlangeColumns: []int{2}, FlangeRows: []int{2},
		WebColumns: []int{1}, WebRows: []int{2, 4}},
	{Sizes: []string{"M24"}, Classes: []string{"8.8"}, Thicknesses: []float64{10, 15, 20},
		Arrangements: []splice.Arrangement{splice.OuterOnly}, FlangeColumns: []int{2, 4}, FlangeRows: []int{2},
		WebColumns: []int{1, 2}, WebRows: []int{3}},
	{Sizes: []string{"M20", "M24"}, Classes: []string{"8.8"}, Thicknesses: []float64{10, 15},
		Arrangements: []splice.Arrangement{splice.OuterOnly}, FlangeColumns: []int{2}, FlangeRows: []int{2, 3},
		WebColumns: []int{1}, WebRows: []int{2, 3, 4}},
	{Sizes: []string{"M20", "M24"}, Classes: []string{"10.9"}, Thicknesses: []float64{10, 20},
		Arrangements: []splice.Arrangement{splice.OuterOnly}, FlangeColumns: []int{2, 4}, FlangeRows: []int{2, 3},
		WebColumns: []int{1, 2}, WebRows: []int{3}},
}

// mediumSpace has 648 whole splices, for jobs with fewer positions.
var mediumSpace = splice.DesignSpace{Sizes: []string{"M20", "M24"}, Classes: []string{"10.9"}, Thicknesses: []float64{10, 15, 20},
	Arrangements: []splice.Arrangement{splice.OuterOnly}, FlangeColumns: []int{2, 4}, FlangeRows: []int{2, 3, 4},
	WebColumns: []int{1, 2}, WebRows: []int{2, 3, 4}}

// uniformJob is a two-span job (invented) whose loads, limits, vehicles and scan step vary;
// the step divides the beam into about divisions parts.
func uniformJob(r *rand.Rand, divisions int) (string, float64) {
	span1, span2 := 7+4*r.Float64(), 8+5*r.Float64()
	length := span1 + span2 + 1.2
	g, q := 2+16*r.Float64(), 1+12*r.Float64()
	cat := "category: A"
	if r.IntN(2) == 0 {
		cat = "category: B\n  friction_class: B"
	}
	maxLen := 7 + 7*r.Float64()
	mass := []string{"", fmt.Sprintf("\n  max_piece_mass: %.0f", 500+700*r.Float64())}[r.IntN(2)]
	vehicles := ""
	for v := r.IntN(3); v > 0; v-- {
		vehicles += fmt.Sprintf("\n  - {name: tier %d, max_length: %.1f, payload: %.0f, cost: %d}", v, 7+8*r.Float64(), 800+5000*r.Float64(), 200+r.IntN(800))
	}
	if vehicles != "" {
		vehicles = "vehicles:" + vehicles
	}
	step := length / float64(divisions+r.IntN(5))
	return fmt.Sprintf(`title: uniform brute-force job (invented)
beam:
  section: IPE 400
  grade: S355
  spans: [%.2f, %.2f]
  overhang: {left: 0.0, right: 1.2}
  supports: [pinned, roller, roller]
  self_weight: true
cases:
  G:
    kind: permanent
    loads:
      - {udl: %.2f}
      - {point: %.0f, at: %.2f}
  Q:
    kind: imposed
    category: B
    loads:
      - {udl: %.2f}
splice:
  %s
  gap: 10
limits:
  max_piece_length: %.2f
  min_piece_length: %.2f%s
  keep_out: {supports: 0.8, point_loads: 0.3}
  splices: {min: 0, max: 4}
%s
costs:
  bolt: {M20: 3.0, M24: 4.2}
  bolt_class_factor: {"10.9": 1.3}
  plate_per_kg: 2.5
  hole: 1.7
  faying_per_m2: 30
  splice: %d
  lift: %d
scan:
  step: %.3f
  alternatives: 0
`, span1, span2, g, 10+60*r.Float64(), span1+1+(span2-2)*r.Float64(), q, cat, maxLen, 1.5+1.5*r.Float64(), mass,
		vehicles, 60+r.IntN(120), r.IntN(3)*80, step), step
}

// bruteDesign is one whole splice as the brute force sees it: its feasible positions from
// Verify, its cost, mass and rank, and its best layout for each count over every subset.
type bruteDesign struct {
	ch    splice.Choice
	rank  [6]int64 // cost in micro-units, bolts, plate grams (per part), bolt, flange, web
	best  map[int]bruteLayout
	sites []int
}

// bruteUniform finds the best uniform layout for each count from the definition: every
// design of the catalogue, its feasible positions by Verify at each position's forces, every
// subset of them by bruteForce (every tier, every limit, the trips), the best over designs
// by total, then count, then the design's rank, then the utilisation ties and positions.
func bruteUniform(t *testing.T, o *Outcome) (byCount []bruteLayout, designs []splice.Choice) {
	t.Helper()
	p := o.layoutProblem()
	cat, err := splice.NewCatalogue(o.Setup.Splice)
	require.NoError(t, err)
	best := map[int]bruteLayout{}
	bestDesign := map[int]bruteDesign{}
	for b := 0; b < cat.Bolts(); b++ {
		for f := 0; f < cat.Flanges(b); f++ {
			for w := 0; w < cat.Webs(b); w++ {
				ch := splice.Choice{Bolt: b, Flange: f, Web: w}
				e := cat.Entry(ch)
				q := e.Quantities
				bd := bruteDesign{ch: ch, rank: [6]int64{micro(e.Cost.Total), int64(q.Bolts),
					int64(math.Round(q.FlangePlateMass*1000)) + int64(math.Round(q.WebPlateMass*1000)), int64(b), int64(f), int64(w)}}
				mass := q.PlateMass + q.BoltMass
				dp := p
				dp.Sites = nil
				for i, s := range p.Sites {
					pr := o.Setup.Splice
					fc := o.Candidates[s.Candidate].Forces
					pr.ULS = splice.Forces(fc.ULS)
					sls := splice.Forces(fc.SLS)
					pr.SLS = &sls
					r, err := splice.Verify(pr, e.Geometry)
					require.NoError(t, err)
					if r.Pass {
						bd.sites = append(bd.sites, i)
						dp.Sites = append(dp.Sites, Site{X: s.X, Cost: e.Cost.Total, Mass: mass,
							Tie: int64(math.Round(math.Min(r.Utilisation, 999) * 1e6)), Candidate: i})
					}
				}
				if len(dp.Sites) == 0 {
					continue
				}
				bd.best, _ = bruteForce(dp)
				for k, l := range bd.best {
					for j, s := range l.sites {
						l.sites[j] = dp.Sites[s].Candidate
					}
					cur, ok := best[k]
					if !ok || bruteUniformLess(l, bd, cur, bestDesign[k]) {
						best[k], bestDesign[k] = l, bd
					}
				}
			}
		}
	}
	var counts []int
	for k := range best {
		counts = append(counts, k)
	}
	slices.Sort(counts)
	rec := -1
	for _, k := range counts {
		l := best[k]
		if len(byCount) > 0 && k > len(byCount[0].sites)+p.Extra && !bruteUniformLess(l, bestDesign[k], byCount[rec], bestDesign[len(byCount[rec].sites)]) {
			continue
		}
		byCount = append(byCount, l)
		designs = append(designs, bestDesign[k].ch)
		if rec < 0 || bruteUniformLess(l, bestDesign[k], byCount[rec], bestDesign[len(byCount[rec].sites)]) {
			rec = len(byCount) - 1
		}
	}
	return byCount, designs
}

// bruteUniformLess is the documented order of uniform layouts: total, count, design rank, tie,
// positions from the right end.
func bruteUniformLess(a bruteLayout, da bruteDesign, b bruteLayout, db bruteDesign) bool {
	if c := cmp.Or(cmp.Compare(a.total, b.total), cmp.Compare(len(a.sites), len(b.sites))); c != 0 || len(a.sites) == 0 {
		return c < 0
	}
	if c := slices.Compare(da.rank[:], db.rank[:]); c != 0 {
		return c < 0
	}
	return cmp.Or(cmp.Compare(a.tie, b.tie), compareRevLex(a.sites, b.sites)) < 0
}

// TestUniformEqualsBruteForce: the uniform search (part sets, bounds, dominance, the layout
// search per design) equals trying every splice of a small design space at every position
// and every subset of its feasible positions, on random two-span jobs: tiny spaces with up to
// 14 positions, a 648-splice space with up to 9 (kind: property, exhaustive reference).
func TestUniformEqualsBruteForce(t *testing.T) {
	r := rand.New(rand.NewPCG(8, 2027))
	tiny, medium := 240, 10
	if testing.Short() {
		tiny, medium = 30, 2
	}
	var seen struct{ compared, dearer, listed, dominated, searched, settled int }
	for trial := 0; trial < tiny+medium; trial++ {
		space, divisions, most := tinySpaces[trial%len(tinySpaces)], 14, 14
		if trial >= tiny {
			space, divisions, most = mediumSpace, 8, 9
		}
		src, step := uniformJob(r, divisions)
		s, err := Prepare("uniform.yaml", []byte(src))
		require.NoError(t, err, src)
		s.Splice.Sizing.Space = space
		o, err := Run(s, Settings{Step: step * 1000})
		name := fmt.Sprintf("trial %d", trial)
		if err != nil {
			var ie *InfeasibleError
			require.ErrorAs(t, err, &ie, name)
		}
		require.LessOrEqual(t, len(o.layoutProblem().Sites), most, name)
		want, designs := bruteUniform(t, o)
		got, err := o.Uniform()
		require.NoError(t, err, name)
		require.Len(t, got.ByCount, len(want), name)
		for i, w := range want {
			g := got.ByCount[i]
			what := fmt.Sprintf("%s: count %d", name, len(w.sites))
			require.Equal(t, w.total, micro(g.Cost.Total), what)
			require.Equal(t, w.sites, g.Sites, what)
			require.Equal(t, w.trips, g.Trips, what)
			require.Equal(t, w.vehicle, g.Vehicle, what)
			require.Equal(t, w.tie, g.Tie, what)
			require.Len(t, g.Pieces, len(w.pieces), what)
			for j := range w.pieces {
				require.InDelta(t, w.pieces[j].Mass, g.Pieces[j].Mass, 1e-9, what)
			}
			if len(w.sites) > 0 {
				require.Equal(t, designs[i], g.Choice, what)
				require.Len(t, g.Designs, len(w.sites), what)
			}
			seen.compared++
			if mixed := sameCount(o.Layouts.ByCount, len(w.sites)); mixed != nil && micro(mixed.Cost.Total) != w.total {
				seen.dearer++
			}
		}
		if len(want) > 0 {
			require.GreaterOrEqual(t, got.Recommended, 0, name)
		} else {
			require.Equal(t, -1, got.Recommended, name)
		}
		seen.listed = max(seen.listed, got.Stats.Listed)
		seen.dominated += got.Stats.Dominated
		seen.searched += got.Stats.Searched
		seen.settled += got.Stats.Settled
	}
	t.Logf("%+v", seen)
	require.Greater(t, seen.compared, tiny, "most jobs have uniform layouts")
	require.Greater(t, seen.dearer, 0, "some uniform layouts cost more than the mixed ones")
	require.Greater(t, seen.dominated, 0, "dominance was exercised")
	require.Greater(t, seen.listed, 20, "some searches listed many designs")
}

func sameCount(ls []Layout, k int) *Layout {
	for i := range ls {
		if len(ls[i].Sites) == k {
			return &ls[i]
		}
	}
	return nil
}

// TestUniformSettlingFirst: settling each count by the strongest parts before listing any
// design (the step taken after a long listing without a layout) gives the same layouts as
// listing alone, on the brute-force test's jobs (kind: property, reference: the listing,
// itself checked against brute force).
func TestUniformSettlingFirst(t *testing.T) {
	r := rand.New(rand.NewPCG(8, 2027))
	trials := 60
	if testing.Short() {
		trials = 15
	}
	settled := 0
	for trial := 0; trial < trials; trial++ {
		src, step := uniformJob(r, 14)
		s, err := Prepare("uniform.yaml", []byte(src))
		require.NoError(t, err)
		s.Splice.Sizing.Space = tinySpaces[trial%len(tinySpaces)]
		o, _ := Run(s, Settings{Step: step * 1000})
		want, err := o.Uniform()
		require.NoError(t, err)
		u, err := newUniformSearch(o)
		require.NoError(t, err)
		u.proofAfter = 0
		got, rec := u.byCount()
		require.Equal(t, want.Recommended, rec)
		require.Len(t, got, len(want.ByCount))
		for i := range got {
			require.Zero(t, want.ByCount[i].Compare(got[i]), "trial %d count %d", trial, len(got[i].Sites))
			require.Equal(t, want.ByCount[i].Sites, got[i].Sites)
			require.Equal(t, want.ByCount[i].Choice, got[i].Choice)
		}
		settled += u.stats.Settled
	}
	require.Greater(t, settled, trials/2)
}
