package optimise

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strings"

	"spanbreak/optimise/jobfile"
)

// Defaults of the scan when the job and the settings leave them out.
const (
	DefaultStep         = 50.0 // candidate spacing [mm] (DESIGN.md section 6)
	DefaultAlternatives = 3    // near-best alternative layouts listed
	ExtraCounts         = 2    // splice counts reported beyond the fewest feasible
)

// Rank is the measure candidates are ranked by, and the tie-break of equal-cost layouts.
type Rank string

const (
	RankCost        Rank = "cost"        // splice cost, then utilisation
	RankBolts       Rank = "bolts"       // bolt count, then cost
	RankMass        Rank = "mass"        // cover plate mass, then cost
	RankUtilisation Rank = "utilisation" // governing utilisation (most reserve first), then cost
)

// Ranks lists the rankings.
func Ranks() []Rank { return []Rank{RankCost, RankBolts, RankMass, RankUtilisation} }

// ParseRank reads a ranking name; "" is RankCost.
func ParseRank(s string) (Rank, error) {
	if s == "" {
		return RankCost, nil
	}
	for _, r := range Ranks() {
		if string(r) == s {
			return r, nil
		}
	}
	names := make([]string, 0, 4)
	for _, r := range Ranks() {
		names = append(names, string(r))
	}
	return "", fmt.Errorf("unknown ranking %q (want %s)", s, strings.Join(names, ", "))
}

// Settings control one optimisation run. The zero value takes the job's scan block and the
// documented defaults.
type Settings struct {
	Step         float64 // candidate spacing [mm]; 0: the job's scan.step, else DefaultStep
	Rank         Rank    // "": RankCost
	Exhaustive   bool    // reference run: no shared envelopes, no shared sizing, no pruning
	Workers      int     // positions sized at once; 0: GOMAXPROCS; the exhaustive run uses 1
	Alternatives int     // 0: the job's scan.alternatives, else DefaultAlternatives; < 0: none
	Rigging      float64 // rigging allowance added to every piece's mass [kg]
}

// Result is a complete optimisation of one job.
type Result struct {
	File, Title   string
	Section       string
	Length        float64 // [mm]
	MassPerLength float64 // steel [kg/m]
	Step          float64 // [mm]
	Rank          Rank
	Exhaustive    bool
	Gap           float64 // [mm]
	Limits        PieceLimits
	MinSplices    int
	MaxSplices    int // < 0: no limit
	Vehicles      []Vehicle
	Lift          float64 // per piece [currency]
	Zones         []Zone
	Candidates    []Candidate
	Layouts       LayoutResult
	Stats         ScanStats
	Notes         []string
}

// Recommended returns the cheapest layout.
func (r *Result) Recommended() Layout { return r.Layouts.ByCount[r.Layouts.Recommended] }

// InfeasibleError is returned when the scan worked but no layout satisfies the limits. It
// points at the job-file key of the limit that cannot be met.
type InfeasibleError struct {
	At    jobfile.Loc
	Limit *LimitError
}

func (e *InfeasibleError) Error() string {
	return jobfile.Problem{File: e.At.File, Line: e.At.Line, Column: e.At.Column, Path: e.Limit.Key,
		Message: e.Limit.Message}.String()
}

func (e *InfeasibleError) Unwrap() error { return e.Limit }

// Run optimises a job with the splice package's sizing (exhaustive for the reference run).
func Run(s *Setup, set Settings) (*Result, error) {
	d, err := s.NewSpliceDesigner(set.Exhaustive)
	if err != nil {
		return nil, err
	}
	return Optimise(s, d, set)
}

// Optimise scans the job's beam with a designer and finds the layouts: candidates every step
// from the left end, keep-out zones, design forces from the envelopes, the cheapest splice at
// each position, then the exact layout search. No layout within the limits is an
// *InfeasibleError; anything the job file causes is a jobfile.Problems.
func Optimise(s *Setup, d Designer, set Settings) (*Result, error) {
	rank, err := ParseRank(string(set.Rank))
	if err != nil {
		return nil, err
	}
	res, err := s.newResult(set, rank)
	if err != nil {
		return nil, err
	}
	an, err := s.Analyse()
	if err != nil {
		return nil, err
	}
	xs, err := Grid(res.Length, res.Step)
	if err != nil {
		var probs jobfile.Problems
		at := s.Job.Where("scan.step")
		probs.Add(at, "%v", err)
		return nil, probs.Err()
	}
	workers := set.Workers
	if set.Exhaustive {
		workers = 1
	}
	cands, stats, err := Scan(an, s.Combinations, xs, res.Zones, d, ScanSettings{Exhaustive: set.Exhaustive, Workers: workers})
	if probs, ok := s.LocateOverflow(err); ok {
		return nil, probs // the envelopes overflow
	}
	if err != nil {
		// the designer refuses the splice options (the forces are the analysis's own)
		var probs jobfile.Problems
		probs.Add(s.Job.Where("splice"), "%v", err)
		return nil, probs.Err()
	}
	res.Candidates, res.Stats = cands, stats
	rankCandidates(res.Candidates, rank)
	p := res.layoutProblem(set.Alternatives, s)
	lr, err := Layouts(p)
	if err != nil {
		var le *LimitError
		if errors.As(err, &le) {
			res.explain(le)
			return nil, &InfeasibleError{At: s.Job.Where(le.Key), Limit: le}
		}
		return nil, err
	}
	res.Layouts = lr
	return res, nil
}

// newResult reads the limits, vehicles and rates of the job into a result without candidates.
func (s *Setup) newResult(set Settings, rank Rank) (*Result, error) {
	job := s.Job
	res := &Result{File: s.File, Title: job.Title, Section: s.Section.Name, Length: s.Model.Length,
		MassPerLength: s.Section.Mass, Rank: rank, Exhaustive: set.Exhaustive, MaxSplices: -1,
		Limits: PieceLimits{MaxLength: math.Inf(1), MaxMass: math.Inf(1), Rigging: set.Rigging}}
	var probs jobfile.Problems
	if set.Rigging < 0 || math.IsNaN(set.Rigging) {
		probs.Add(job.Where(""), "the rigging allowance must not be negative, got %g kg", set.Rigging)
	}
	res.Step = DefaultStep
	if job.Scan != nil && job.Scan.Step != nil {
		res.Step = job.Scan.Step.MM()
	}
	if set.Step != 0 {
		res.Step = set.Step
	}
	var keep KeepOutSpec
	// Without min_piece_length a piece must still be long enough to carry the cover plates of
	// the splices at its ends without the plates of two splices meeting.
	res.Limits.MinLength = DefaultMinPieceLength
	if l := job.Limits; l != nil {
		if l.MaxPieceLength != nil {
			res.Limits.MaxLength = l.MaxPieceLength.MM()
		}
		if l.MinPieceLength != nil {
			res.Limits.MinLength = l.MinPieceLength.MM()
		}
		if l.MaxPieceMass != nil {
			res.Limits.MaxMass = l.MaxPieceMass.KG()
		}
		if l.Rigging != nil && set.Rigging == 0 {
			res.Limits.Rigging = l.Rigging.KG()
		}
		if k := l.KeepOut; k != nil {
			if k.Supports != nil {
				keep.Supports = k.Supports.MM()
			}
			if k.PointLoads != nil {
				keep.PointLoads = k.PointLoads.MM()
			}
			for _, r := range k.Ranges {
				keep.Ranges = append(keep.Ranges, [2]float64{r[0].MM(), r[1].MM()})
			}
		}
		if c := l.Splices; c != nil {
			if c.Min != nil {
				res.MinSplices = *c.Min
			}
			if c.Max != nil {
				res.MaxSplices = *c.Max
			}
		}
	}
	for _, v := range job.Vehicles {
		res.Vehicles = append(res.Vehicles, Vehicle{Name: v.Name, MaxLength: v.MaxLength.MM(), Payload: v.Payload.KG(), Cost: v.Cost})
	}
	if c := job.Costs; c != nil {
		res.Lift = deref(c.Lift)
	} else {
		res.Notes = append(res.Notes, "the job has no costs block: splices are priced at the splice package's indicative rates "+
			"(invented, for ranking only), and lifts cost nothing")
	}
	if len(res.Vehicles) == 0 {
		res.Notes = append(res.Notes, "the job lists no vehicles: transport is not costed and only max_piece_length limits the pieces")
	}
	if len(probs) > 0 {
		return nil, probs.Err()
	}
	sp, err := s.SpliceProblem()
	if err != nil {
		return nil, err
	}
	res.Gap = sp.Sizing.Gap
	res.Zones = KeepOutZones(s.Model, s.Cases, keep, res.Limits.MinLength)
	return res, nil
}

// alternatives returns the number of alternatives asked for.
func alternatives(set int, s *Setup) int {
	switch {
	case set < 0:
		return 0
	case set > 0:
		return set
	case s.Job.Scan != nil && s.Job.Scan.Alternatives != nil:
		return *s.Job.Scan.Alternatives
	}
	return DefaultAlternatives
}

// layoutProblem offers the feasible candidates to the layout search, grouping neighbours with
// the same splice design into one variant class.
func (r *Result) layoutProblem(alts int, s *Setup) LayoutProblem {
	p := LayoutProblem{Length: r.Length, MassPerLength: r.MassPerLength / 1000, Gap: r.Gap, Limits: r.Limits,
		MinSplices: r.MinSplices, MaxSplices: r.MaxSplices, Vehicles: r.Vehicles, Lift: r.Lift,
		Alternatives: alternatives(alts, s), Extra: ExtraCounts}
	class := -1
	for i, c := range r.Candidates {
		if !c.Feasible {
			continue
		}
		if i == 0 || !r.Candidates[i-1].Feasible || !sameDesign(r.Candidates[i-1].Design, c.Design) {
			class++
		}
		p.Sites = append(p.Sites, Site{X: c.X, Cost: c.Design.Cost, Mass: c.Design.Mass(), Tie: tieKey(c.Design, r.Rank),
			Class: class, Candidate: i})
	}
	return p
}

// sameDesign reports whether two positions take the same splice.
func sameDesign(a, b SpliceDesign) bool {
	return a.Summary == b.Summary && a.Cost == b.Cost && a.Mass() == b.Mass()
}

// tieKey is the secondary key of a site under a ranking: the ranking's measure in integer
// units, then the utilisation in millionths (below 10⁹, since utilisations are capped).
func tieKey(d SpliceDesign, rank Rank) int64 {
	u := int64(math.Round(math.Min(d.Utilisation, 999) * 1e6))
	switch rank {
	case RankBolts:
		return int64(d.Bolts)*1e9 + u
	case RankMass:
		return int64(math.Round(d.PlateMass*1000))*1e9 + u // grams
	}
	return u
}

// rankCandidates numbers the feasible candidates 1, 2, … by the ranking (then cost, then x).
func rankCandidates(cands []Candidate, rank Rank) {
	var idx []int
	for i, c := range cands {
		if c.Feasible {
			idx = append(idx, i)
		}
	}
	measure := func(d SpliceDesign) float64 {
		switch rank {
		case RankBolts:
			return float64(d.Bolts)
		case RankMass:
			return d.PlateMass
		case RankUtilisation:
			return d.Utilisation
		}
		return d.Cost
	}
	sort.SliceStable(idx, func(a, b int) bool {
		da, db := cands[idx[a]].Design, cands[idx[b]].Design
		if ma, mb := measure(da), measure(db); ma != mb {
			return ma < mb
		}
		if da.Cost != db.Cost {
			return da.Cost < db.Cost
		}
		if da.Utilisation != db.Utilisation {
			return da.Utilisation < db.Utilisation
		}
		return idx[a] < idx[b]
	})
	for r, i := range idx {
		cands[i].Rank = r + 1
	}
}

// explain adds to a limit error about a stretch without positions the reasons found there.
func (r *Result) explain(le *LimitError) {
	if le.To <= le.From {
		return
	}
	seen := map[string]bool{}
	var reasons []string
	for _, c := range r.Candidates {
		if c.X <= le.From || c.X >= le.To || c.Feasible {
			continue
		}
		why := c.Reason
		if c.Zone != nil {
			why = c.Zone.Reason + " (" + c.Zone.Key + ")"
		} else if c.Design.Governing != "" {
			why = "no splice passes (" + c.Design.Governing + ")"
		}
		if !seen[why] {
			seen[why] = true
			reasons = append(reasons, why)
		}
	}
	if len(reasons) > 5 {
		reasons = append(reasons[:5], fmt.Sprintf("%d more", len(reasons)-5))
	}
	if len(reasons) > 0 {
		le.Message += "; there: " + strings.Join(reasons, "; ")
	}
}
