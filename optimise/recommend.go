package optimise

import (
	"cmp"
	"math"
	"slices"
)

// LayoutKind says which list of an Outcome a layout is from.
type LayoutKind string

// The lists of an Outcome's layouts.
const (
	KindBest        LayoutKind = "best"        // Layouts.ByCount: the best mixed layout of its splice count
	KindAlternative LayoutKind = "alternative" // Layouts.Alternatives: a near-best mixed layout
	KindUniform     LayoutKind = "uniform"     // Identical.ByCount: the best layout of identical splices of its count
)

// LayoutRef points at one layout of an Outcome.
type LayoutRef struct {
	Kind  LayoutKind
	Index int
}

// Layout returns the layout a reference points at, and whether there is one.
func (o *Outcome) Layout(r LayoutRef) (Layout, bool) {
	var list []Layout
	switch r.Kind {
	case KindBest:
		list = o.Layouts.ByCount
	case KindAlternative:
		list = o.Layouts.Alternatives
	case KindUniform:
		if r.Index >= 0 && r.Index < len(o.Identical.ByCount) {
			return o.Identical.ByCount[r.Index].Layout, true
		}
		return Layout{}, false
	}
	if r.Index < 0 || r.Index >= len(list) {
		return Layout{}, false
	}
	return list[r.Index], true
}

// Recommended returns the recommended layout (Outcome.Pick); the zero Layout when no layout
// fits (Infeasible).
func (o *Outcome) Recommended() Layout {
	l, _ := o.Layout(o.Pick)
	return l
}

// IsRecommended reports whether the layout at r is the recommended one.
func (o *Outcome) IsRecommended(r LayoutRef) bool { return o.Infeasible == nil && r == o.Pick }

// LayoutMeasures are the totals a ranking compares layouts by.
type LayoutMeasures struct {
	Bolts       int     // bolt assemblies of all its splices
	PlateMass   float64 // cover plates of all its splices [kg]
	Utilisation float64 // the highest governing utilisation of its splices
}

// Measures totals a layout's splices.
func (o *Outcome) Measures(l Layout) LayoutMeasures {
	var m LayoutMeasures
	for _, x := range l.Splices {
		if c := o.CandidateAt(x); c != nil {
			m.Bolts += c.Design.Bolts
			m.PlateMass += c.Design.PlateMass
			m.Utilisation = math.Max(m.Utilisation, c.Design.Utilisation)
		}
	}
	return m
}

// pick chooses the recommended layout. Under the uniform rule it is the best layout of
// identical splices (when there is one); otherwise the mixed layouts are in play: the best
// of each splice count and the near-best alternatives. By cost (the default ranking) the
// cheapest wins, as the layout search orders them; by bolts, mass or utilisation the one with
// the fewest bolts, the least plate mass or the lowest highest utilisation (the most reserve)
// wins, cost breaking ties, so a user who asks for another ranking gets its recommendation.
func (o *Outcome) pick(uniform bool) LayoutRef {
	if uniform && o.Identical.Recommended >= 0 {
		return o.choose(KindUniform, len(o.Identical.ByCount), LayoutRef{KindUniform, o.Identical.Recommended})
	}
	best := LayoutRef{KindBest, o.Layouts.Recommended}
	if o.Rank == RankCost || o.Rank == "" {
		return best
	}
	r := o.choose(KindBest, len(o.Layouts.ByCount), best)
	for i := range o.Layouts.Alternatives {
		if o.better(LayoutRef{KindAlternative, i}, r) {
			r = LayoutRef{KindAlternative, i}
		}
	}
	return r
}

// choose returns the best of one list under the ranking, starting from the cost choice.
func (o *Outcome) choose(kind LayoutKind, n int, start LayoutRef) LayoutRef {
	r := start
	if o.Rank == RankCost || o.Rank == "" {
		return r
	}
	for i := range n {
		if o.better(LayoutRef{kind, i}, r) {
			r = LayoutRef{kind, i}
		}
	}
	return r
}

// better reports whether layout a ranks before b: the ranking's measure, then cost.
func (o *Outcome) better(a, b LayoutRef) bool {
	la, _ := o.Layout(a)
	lb, _ := o.Layout(b)
	ma, mb := o.Measures(la), o.Measures(lb)
	var c int
	switch o.Rank {
	case RankBolts:
		c = cmp.Compare(ma.Bolts, mb.Bolts)
	case RankMass:
		c = cmp.Compare(ma.PlateMass, mb.PlateMass)
	case RankUtilisation:
		c = cmp.Compare(ma.Utilisation, mb.Utilisation)
	}
	if c == 0 {
		c = la.Compare(lb)
	}
	return c < 0
}

// DistinctBest returns the best-ranked position of each distinct choice, best first, at most
// n of them: a choice is one splice design over one stretch of consecutive admissible
// positions, so a table of best positions lists different designs or different stretches,
// not the same splice a few centimetres apart.
func (o *Outcome) DistinctBest(n int) []Candidate {
	var best []Candidate
	cs := o.Candidates
	for i := 0; i < len(cs); {
		if !cs[i].Feasible {
			i++
			continue
		}
		j, b := i, i
		for j < len(cs) && cs[j].Feasible && cs[j].Design.Summary == cs[i].Design.Summary {
			if cs[j].Rank < cs[b].Rank {
				b = j
			}
			j++
		}
		best = append(best, cs[b])
		i = j
	}
	slices.SortFunc(best, func(a, b Candidate) int { return cmp.Compare(a.Rank, b.Rank) })
	if len(best) > n {
		best = best[:n]
	}
	return best
}
