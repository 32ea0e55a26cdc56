package optimise

import (
	"fmt"
	"math"
	"slices"
)

// DefaultMinPieceLength is the shortest piece of a spliced beam when the job sets no
// min_piece_length [mm]: 1 m (common practice) keeps the cover plates of neighbouring splices
// apart and avoids pieces not worth a splice.
const DefaultMinPieceLength = 1000.0

// Vehicle is one transport tier.
type Vehicle struct {
	Name      string
	MaxLength float64 // longest piece it carries [mm]
	Payload   float64 // mass per trip [kg]
	Cost      float64 // per trip [currency]
}

// PieceLimits bound every piece of a layout.
type PieceLimits struct {
	MaxLength float64 // [mm]; +Inf for no limit
	MinLength float64 // [mm]; applies to the pieces of a spliced beam, not to an unspliced one
	MaxMass   float64 // crane [kg]; +Inf for no limit
	Rigging   float64 // added to the mass of every piece [kg]
}

// Site is an admissible splice position offered to the layout search.
type Site struct {
	X         float64 // [mm], strictly increasing from site to site
	Cost      float64 // the splice's cost [currency]
	Mass      float64 // the splice's plates and bolts [kg]; each piece carries half of it
	Tie       int64   // secondary key, smaller is better, summed over the splices of a layout
	Class     int     // variant class: sites of one class are one stretch of one splice design
	Candidate int     // index of the position in the scan (reporting only)
}

// LayoutProblem is the search for the cheapest layouts of splices along a beam. Costs are
// counted in micro-units of the currency internally, so sums are exact and every search
// order gives the same answer.
type LayoutProblem struct {
	Length        float64 // beam [mm]
	MassPerLength float64 // steel [kg/mm]
	Gap           float64 // between the beam ends at a splice [mm]; a piece ends gap/2 from the splice
	Limits        PieceLimits
	MinSplices    int       // fewest splices allowed
	MaxSplices    int       // most splices allowed; < 0 for no limit
	Vehicles      []Vehicle // the cheapest tier that takes every piece is used; none: no transport
	Lift          float64   // per piece erected [currency]
	Alternatives  int       // near-best alternative layouts to list
	Sites         []Site
	// Extra counts beyond the fewest feasible to report (the brief asks for 2).
	Extra int
}

// Piece is one shipped and erected length of beam.
type Piece struct {
	From, To   float64 // steel ends [mm]: a splice at x ends the pieces at x ∓ gap/2
	Length     float64 // To − From [mm]
	Mass       float64 // steel + SpliceMass + rigging [kg]
	SteelMass  float64 // [kg]
	SpliceMass float64 // half of each splice at its ends [kg]
}

// CostBreakdown is the cost of a layout [currency].
type CostBreakdown struct {
	Splices   float64 // sum of the splice costs
	Transport float64 // trips × cost per trip of the vehicle
	Erection  float64 // pieces × cost per lift
	Total     float64
}

// Layout is one choice of splice positions with its pieces and cost.
type Layout struct {
	Splices []float64 // splice positions [mm], left to right
	Sites   []int     // the splices' indices into LayoutProblem.Sites
	Pieces  []Piece
	Vehicle string // the tier used; "" without vehicles
	Trips   int
	Cost    CostBreakdown
	Tie     int64 // sum of the sites' Tie
	// Proven is false only when the search for the fewest trips stopped at its work bound
	// (see MaxEnumeration) before proving the layout the cheapest of its kind.
	Proven bool

	key layoutKey
}

// LayoutResult is the outcome of the layout search.
type LayoutResult struct {
	// ByCount is the best layout for each splice count from the fewest that satisfies the
	// limits up to that plus Extra, and any larger count whose best is cheaper still.
	ByCount []Layout
	// Recommended indexes the cheapest of ByCount.
	Recommended int
	// Alternatives are the next-best layouts in cost order, each of a variant class not
	// listed before: two layouts are variants when they have the same number of splices and
	// each splice lies in the same stretch of one splice design (same Site.Class).
	Alternatives []Layout
}

// Best returns the recommended layout, the cheapest of ByCount.
func (r LayoutResult) Best() Layout { return r.ByCount[r.Recommended] }

// LimitError says which limit cannot be met. Key is the job-file key path.
type LimitError struct {
	Key      string
	Message  string
	From, To float64 // the stretch of beam at fault [mm], when the positions are the cause
}

func (e *LimitError) Error() string { return e.Key + ": " + e.Message }

// MaxEnumeration bounds the layouts examined for one splice count and vehicle when the
// fewest trips are not met by the cheapest layouts; past it the best found is reported with
// Proven false.
const MaxEnumeration = 200_000

// layoutKey orders layouts: total cost, then fewer splices, then the tie key, then by splice
// positions compared from the right end (the layout whose last splice is further left first).
type layoutKey struct {
	total int64
	count int
	tie   int64
	nodes []int // site indices, left to right
}

func (a layoutKey) compare(b layoutKey) int {
	if a.total != b.total {
		return cmpInt64(a.total, b.total)
	}
	if a.count != b.count {
		return a.count - b.count
	}
	if a.tie != b.tie {
		return cmpInt64(a.tie, b.tie)
	}
	return compareRevLex(a.nodes, b.nodes)
}

func cmpInt64(a, b int64) int {
	switch {
	case a < b:
		return -1
	case a > b:
		return 1
	}
	return 0
}

// compareRevLex compares index sequences from their last element; a sequence that runs out
// first is smaller.
func compareRevLex(a, b []int) int {
	for i, j := len(a)-1, len(b)-1; i >= 0 && j >= 0; i, j = i-1, j-1 {
		if a[i] != b[j] {
			if a[i] < b[j] {
				return -1
			}
			return 1
		}
	}
	return len(a) - len(b)
}

// micro converts currency to integer micro-units.
func micro(v float64) int64 { return int64(math.Round(v * 1e6)) }

// fromMicro converts micro-units back to currency.
func fromMicro(v int64) float64 { return float64(v) / 1e6 }

// Compare orders two layouts as the search does: cheaper first, then fewer splices, then the
// smaller tie key, then by positions from the right end. It is exported for tests and callers that merge
// results.
func (l Layout) Compare(o Layout) int { return l.key.compare(o.key) }

// validate reports a problem that is a programmer error (the job file checks catch users').
func (p *LayoutProblem) validate() {
	switch {
	case !(p.Length > 0):
		panic(fmt.Sprintf("optimise: beam length %g mm", p.Length))
	case p.MassPerLength < 0 || p.Gap < 0 || p.Limits.Rigging < 0 || p.Limits.MinLength < 0:
		panic("optimise: negative mass per length, gap, rigging or minimum length")
	case p.MinSplices < 0:
		panic("optimise: negative MinSplices")
	}
	for i, s := range p.Sites {
		if i > 0 && !(s.X > p.Sites[i-1].X) {
			panic("optimise: sites not in increasing x")
		}
		if !(s.X > 0 && s.X < p.Length) || s.Cost < 0 || s.Mass < 0 {
			panic(fmt.Sprintf("optimise: site %d: x %g mm, cost %g, mass %g", i, s.X, s.Cost, s.Mass))
		}
	}
	for _, v := range p.Vehicles {
		if !(v.MaxLength > 0 && v.Payload > 0 && v.Cost >= 0) {
			panic(fmt.Sprintf("optimise: vehicle %q: length %g mm, payload %g kg, cost %g", v.Name, v.MaxLength, v.Payload, v.Cost))
		}
	}
}

// Layouts finds the best layout for each splice count from the fewest that satisfies every
// limit up to that plus p.Extra, any larger count that is cheaper still, and the near-best
// alternatives, by dynamic programming over the sites: exact, with ties broken by the tie
// key and then by position (see Layout.Compare). When no layout satisfies the limits the
// error is a *LimitError naming the limit that cannot be met.
func Layouts(p LayoutProblem) (LayoutResult, error) {
	p.validate()
	s := newSearch(&p)
	res, ok := s.byCount()
	if !ok {
		return LayoutResult{}, diagnose(p)
	}
	res.Alternatives = s.alternatives(res.ByCount)
	return res, nil
}

// layoutFrom builds the reported layout from a node path of the search.
func (s *search) layoutFrom(nodes []int, t *tier, trips int) Layout {
	p := s.p
	l := Layout{Sites: slices.Clone(nodes), Vehicle: t.name, Trips: trips, Proven: true}
	var spl int64
	for _, n := range nodes {
		l.Splices = append(l.Splices, s.x[n+1])
		spl += s.cost[n+1]
		l.Tie += s.tie[n+1]
	}
	path := s.withEnds(nodes)
	for k := 0; k+1 < len(path); k++ {
		l.Pieces = append(l.Pieces, s.piece(path[k], path[k+1]))
	}
	lift := micro(p.Lift) * int64(len(l.Pieces))
	transport := t.tripCost * int64(trips)
	total := spl + lift + transport
	l.Cost = CostBreakdown{Splices: fromMicro(spl), Transport: fromMicro(transport), Erection: fromMicro(lift), Total: fromMicro(total)}
	l.key = layoutKey{total: total, count: len(nodes), tie: l.Tie, nodes: l.Sites}
	return l
}

// Price prices the layout through the given sites (indices into p.Sites, strictly
// increasing) by the rules of the search, with its arithmetic: the pieces between them, the
// cheapest vehicle tier that takes every piece within the piece limits, the fewest trips and
// the cost. The search's best layout of those sites prices at exactly its reported cost. ok
// is false when no tier takes every piece; the Layout then has its splices and pieces only.
// The splice-count limits are not checked here.
func (p *LayoutProblem) Price(sites []int) (l Layout, ok bool) {
	p.validate()
	for i, site := range sites {
		if site < 0 || site >= len(p.Sites) || i > 0 && site <= sites[i-1] {
			panic(fmt.Sprintf("optimise: Price: sites %v not increasing indices of %d sites", sites, len(p.Sites)))
		}
	}
	s := newSearch(p)
	path := s.withEnds(sites)
	for _, t := range s.tiers {
		if !s.validPath(path, t) {
			continue
		}
		if c := s.layoutFrom(sites, t, s.trips(sites, t)); !ok || c.key.compare(l.key) < 0 {
			l, ok = c, true
		}
	}
	if ok {
		return l, true
	}
	l = Layout{Sites: slices.Clone(sites), Proven: true}
	for _, n := range sites {
		l.Splices = append(l.Splices, p.Sites[n].X)
	}
	for k := 0; k+1 < len(path); k++ {
		l.Pieces = append(l.Pieces, s.piece(path[k], path[k+1]))
	}
	return l, false
}
