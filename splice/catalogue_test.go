package splice

import (
	"cmp"
	"math"
	"math/rand"
	"slices"
	"testing"

	"github.com/stretchr/testify/require"
)

// allChoices lists every whole splice of a catalogue by nested loops over bolts, flange parts
// and web parts.
func allChoices(c *Catalogue) []Choice {
	var out []Choice
	for b := 0; b < c.Bolts(); b++ {
		for f := 0; f < c.Flanges(b); f++ {
			for w := 0; w < c.Webs(b); w++ {
				out = append(out, Choice{Bolt: b, Flange: f, Web: w})
			}
		}
	}
	return out
}

// entryOrder sorts splices by the ranking the sizing documents (DesignSpace): cost, fewer
// bolts, lighter plates in whole grams per part, then the design-space order — written here
// from the entries' quantities and costs, not from Order.
func entryOrder(c *Catalogue, choices []Choice) {
	type key struct {
		cost, grams int64
		bolts       int
	}
	keys := map[Choice]key{}
	for _, ch := range choices {
		e := c.Entry(ch)
		q := e.Quantities
		keys[ch] = key{cost: int64(math.Round(e.Cost.Total * 1e6)), bolts: q.Bolts,
			grams: int64(math.Round(q.FlangePlateMass*1000)) + int64(math.Round(q.WebPlateMass*1000))}
	}
	slices.SortFunc(choices, func(a, b Choice) int {
		ka, kb := keys[a], keys[b]
		return cmp.Or(cmp.Compare(ka.cost, kb.cost), cmp.Compare(ka.bolts, kb.bolts), cmp.Compare(ka.grams, kb.grams),
			cmp.Compare(a.Bolt, b.Bolt), cmp.Compare(a.Flange, b.Flange), cmp.Compare(a.Web, b.Web))
	})
}

func listed(it *DesignIter) []Choice {
	var out []Choice
	for {
		ch, _, ok := it.Next()
		if !ok {
			return out
		}
		out = append(out, ch)
	}
}

// TestCatalogueIsTheExhaustiveSpace: the catalogue holds as many splices as SizeExhaustive
// evaluates, and Designs lists each once in the documented ranking (kind: property, exhaustive
// reference).
func TestCatalogueIsTheExhaustiveSpace(t *testing.T) {
	rng := rand.New(rand.NewSource(21))
	for i := 0; i < 6; i++ {
		p := randomProblem(t, rng)
		c, err := NewCatalogue(p)
		require.NoError(t, err)
		ex, err := SizeExhaustive(p)
		require.NoError(t, err)
		require.Equal(t, ex.Evaluated, c.Len(), "case %d", i)
		want := allChoices(c)
		entryOrder(c, want)
		require.Equal(t, want, listed(c.Designs(nil)), "case %d", i)
	}
}

// TestCatalogueFirstPassingIsSize: at random forces the first splice in the catalogue's order
// that passes is the one Size returns, and a splice passes exactly when its flange part and
// its web part do (kind: property, exhaustive reference).
func TestCatalogueFirstPassingIsSize(t *testing.T) {
	rng := rand.New(rand.NewSource(23))
	n := 30
	if testing.Short() {
		n = 8
	}
	sized := 0
	for i := 0; i < n; i++ {
		p := randomProblem(t, rng)
		c, err := NewCatalogue(p)
		require.NoError(t, err)
		l, err := c.Load(p.ULS, p.SLS)
		require.NoError(t, err)
		r, err := Size(p)
		require.NoError(t, err)
		it := c.Designs(nil)
		found := false
		for {
			ch, _, ok := it.Next()
			if !ok {
				break
			}
			pass, _ := c.Check(ch, &l)
			require.Equal(t, pass, c.FlangePasses(ch.Bolt, ch.Flange, &l) && c.WebPasses(ch.Bolt, ch.Web, &l), "case %d %v", i, ch)
			if pass {
				found = true
				require.Equal(t, Sized, r.Status, "case %d", i)
				require.Equal(t, r.Geometry, c.Entry(ch).Geometry, "case %d", i)
				require.Equal(t, r.Cost, c.Entry(ch).Cost, "case %d", i)
				got, ok := c.Find(r.Geometry)
				require.True(t, ok)
				require.Equal(t, ch, got)
				break
			}
		}
		if found {
			sized++
		} else {
			require.Equal(t, NoFeasible, r.Status, "case %d", i)
		}
	}
	require.Greater(t, sized, 0, "some positions have a passing splice")
	require.Less(t, sized, n, "and some have none")
}

// TestCatalogueCheckEqualsVerify: Check, Entry and Load give Verify's verdict, utilisation,
// quantities, cost and actions for random splices of the catalogue at random forces (kind:
// property, reference: Verify).
func TestCatalogueCheckEqualsVerify(t *testing.T) {
	rng := rand.New(rand.NewSource(29))
	passed := 0
	for i := 0; i < 60; i++ {
		p := randomProblem(t, rng)
		c, err := NewCatalogue(p)
		require.NoError(t, err)
		l, err := c.Load(p.ULS, p.SLS)
		require.NoError(t, err)
		all := allChoices(c)
		for j := 0; j < 200; j++ {
			ch := all[rng.Intn(len(all))]
			e := c.Entry(ch)
			r, err := Verify(p, e.Geometry)
			require.NoError(t, err)
			pass, u := c.Check(ch, &l)
			require.Equal(t, r.Pass, pass, "case %d %v", i, ch)
			require.Equal(t, r.Utilisation, u, "case %d %v", i, ch)
			require.Equal(t, r.Cost, e.Cost)
			require.Equal(t, e.Cost.Total, c.Cost(ch))
			require.Equal(t, r.Quantities, e.Quantities)
			require.Equal(t, r.Actions, l.Actions())
			if pass {
				passed++
			}
		}
	}
	require.Greater(t, passed, 20)
}

// TestCataloguePassIsMonotone: a part that passes at a loading passes at every loading below it
// — forces scaled down, or one force reduced — and the envelope of loadings bounds each of
// them (kind: property).
func TestCataloguePassIsMonotone(t *testing.T) {
	rng := rand.New(rand.NewSource(31))
	implications := 0
	for i := 0; i < 12; i++ {
		p := randomProblem(t, rng)
		c, err := NewCatalogue(p)
		require.NoError(t, err)
		var ls []Loading
		for j := 0; j < 10; j++ {
			f := p.ULS
			var sls *Forces
			if p.SLS != nil {
				s := *p.SLS
				sls = &s
			}
			scale := rng.Float64() * 1.6
			switch j % 3 {
			case 0: // every force scaled
				f = Forces{MMax: f.MMax * scale, MMin: f.MMin * scale, V: f.V * scale, NMax: f.NMax * scale, NMin: f.NMin * scale}
				if sls != nil {
					*sls = Forces{MMax: sls.MMax * scale, MMin: sls.MMin * scale, V: sls.V * scale, NMax: sls.NMax * scale, NMin: sls.NMin * scale}
				}
			case 1: // the shear alone
				f.V *= scale
			case 2: // the moments alone
				f.MMax, f.MMin = f.MMax*scale, f.MMin*scale
			}
			l, err := c.Load(f, sls)
			require.NoError(t, err)
			ls = append(ls, l)
		}
		lo, hi := Envelope(ls)
		for j := range ls {
			require.True(t, lo.FlangeBelow(&ls[j]) && lo.WebBelow(&ls[j]))
			require.True(t, ls[j].FlangeBelow(&hi) && ls[j].WebBelow(&hi))
		}
		for b := 0; b < c.Bolts(); b++ {
			for f := 0; f < c.Flanges(b); f++ {
				for a := range ls {
					for o := range ls {
						if ls[a].FlangeBelow(&ls[o]) && c.FlangePasses(b, f, &ls[o]) {
							require.True(t, c.FlangePasses(b, f, &ls[a]), "case %d bolt %d flange %d", i, b, f)
							implications++
						}
					}
				}
			}
			for w := 0; w < c.Webs(b); w++ {
				for a := range ls {
					for o := range ls {
						if ls[a].WebBelow(&ls[o]) && c.WebPasses(b, w, &ls[o]) {
							require.True(t, c.WebPasses(b, w, &ls[a]), "case %d bolt %d web %d", i, b, w)
							implications++
						}
					}
				}
			}
		}
	}
	require.Greater(t, implications, 10000)
}

// TestDesignsFromAndDrops: a listing started at a splice is the full listing's tail from it,
// and dropping parts on the way removes exactly the later splices that hold them (kind:
// property, reference: the full sorted list).
func TestDesignsFromAndDrops(t *testing.T) {
	rng := rand.New(rand.NewSource(37))
	for i := 0; i < 6; i++ {
		p := randomProblem(t, rng)
		c, err := NewCatalogue(p)
		require.NoError(t, err)
		full := listed(c.Designs(nil))
		start := full[rng.Intn(len(full))]
		from := c.Order(start)
		tail := listed(c.Designs(&from))
		require.Equal(t, full[slices.Index(full, start):], tail)

		// drop the flange of every 7th splice listed and the web of every 11th
		decide := func(k int, ch Choice, dropF map[[2]int]bool, dropW map[[2]int]bool) {
			if k%7 == 3 {
				dropF[[2]int{ch.Bolt, ch.Flange}] = true
			}
			if k%11 == 5 {
				dropW[[2]int{ch.Bolt, ch.Web}] = true
			}
		}
		var want []Choice
		dF, dW := map[[2]int]bool{}, map[[2]int]bool{}
		for _, ch := range full {
			if dF[[2]int{ch.Bolt, ch.Flange}] || dW[[2]int{ch.Bolt, ch.Web}] {
				continue
			}
			want = append(want, ch)
			decide(len(want)-1, ch, dF, dW)
		}
		var got []Choice
		gF, gW := map[[2]int]bool{}, map[[2]int]bool{}
		it := c.Designs(nil)
		for {
			ch, _, ok := it.Next()
			if !ok {
				break
			}
			got = append(got, ch)
			before := len(gF) + len(gW)
			decide(len(got)-1, ch, gF, gW)
			if len(gF)+len(gW) > before {
				for k := range gF {
					it.DropFlange(k[0], k[1])
				}
				for k := range gW {
					it.DropWeb(k[0], k[1])
				}
			}
		}
		require.Equal(t, want, got, "case %d", i)
		require.Less(t, len(got), len(full)*3/4, "the drops removed many")
	}
}

// TestSizerCatalogueIsNewCatalogue: the catalogue a sizer lists from the layouts its sizing
// has kept (after sizing at forces where nothing passes, which lists every layout) equals the
// catalogue of the problem listed afresh: the same splices in the same order, each with the
// same geometry, quantities, cost and verdict (seeded).
func TestSizerCatalogueIsNewCatalogue(t *testing.T) {
	rng := rand.New(rand.NewSource(53))
	for k := 0; k < 4; k++ {
		p := randomProblem(t, rng)
		z := NewSizer(p)
		for _, f := range []float64{0.5, 4, 9} {
			_, err := z.Size(Forces{MMax: f * p.ULS.MMax, MMin: f * p.ULS.MMin, V: f * p.ULS.V}, nil)
			require.NoError(t, err)
		}
		got, err := z.Catalogue()
		require.NoError(t, err)
		again, err := z.Catalogue()
		require.NoError(t, err)
		require.Same(t, got, again, "listed once")
		want, err := NewCatalogue(p)
		require.NoError(t, err)
		require.Equal(t, want.Len(), got.Len(), "case %d", k)
		order := allChoices(want)
		entryOrder(want, order)
		require.Equal(t, order, listed(got.Designs(nil)), "case %d", k)
		lw, err := want.Load(p.ULS, p.SLS)
		require.NoError(t, err)
		lg, err := got.Load(p.ULS, p.SLS)
		require.NoError(t, err)
		for _, ch := range order {
			require.Equal(t, want.Entry(ch), got.Entry(ch), "case %d, %v", k, ch)
			pw, uw := want.Check(ch, &lw)
			pg, ug := got.Check(ch, &lg)
			require.Equal(t, pw, pg, "case %d, %v", k, ch)
			require.Equal(t, uw, ug, "case %d, %v", k, ch)
		}
	}
}
