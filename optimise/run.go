package optimise

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strings"

	"spanbreak/beam"
	"spanbreak/optimise/jobfile"
	"spanbreak/splice"
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
	Rigging      float64 // rigging allowance added to every piece's mass [kg]; 0: the job's
	Uniform      bool    // recommend the best layout of identical splices (also the job's scan.uniform)
	// Fixed, when set, is the one splice checked at every position (optimise --splice): the
	// layouts use only it, and a position is feasible where all its checks pass.
	Fixed *splice.Geometry
}

// ChartIntervals is the number of intervals the envelopes of an Outcome are sampled at for
// charts and member checks (the analysis adds every support, load point and jump on top).
const ChartIntervals = 600

// Outcome is one complete optimisation of a job: the analysis, the scan, the layouts and the
// chosen splices with their full calculation sheets. Every renderer (text, JSON, CSV, charts,
// the report) reads only an Outcome.
type Outcome struct {
	Setup        *Setup
	Step         float64 // candidate spacing used [mm]
	Rank         Rank
	Exhaustive   bool
	Limits       PieceLimits // the job's, with the settings' rigging allowance
	Alternatives int         // near-best alternatives asked for

	Source    Forces         // where the design forces come from: the job's analysis or its table
	Analysis  *beam.Analysis // the job's own analysis; nil for imported forces
	Envelopes beam.Envelopes // the analysis at every key point and ChartIntervals intervals, or the table
	Member    MemberChecks   // the beam's own checks on those envelopes

	Candidates  []Candidate
	Stats       ScanStats
	Layouts     LayoutResult     // empty when Infeasible is set
	Identical   UniformResult    // the best layouts of identical splices for each count (Run only)
	UniformRule bool             // the recommendation is the best layout of identical splices
	Fixed       *splice.Geometry // the one splice checked along the beam (optimise --splice); nil when sized
	Pick        LayoutRef        // the recommended layout (see pick)
	Chosen      []SpliceSheet    // the recommended layout's splices, checked in full, left to right
	Infeasible  *LimitError      // the limit no layout can meet, when none can
	Diagnosis   Diagnosis        // why no layout fits, when Infeasible is set; empty otherwise
	Notes       []string
	// Placed is set on an outcome made by WithLayout: its one layout, the recommended one, was
	// placed by hand and priced by the search's rules, not found by the search.
	Placed bool
}

// Gap is the gap between the beam ends at a splice [mm].
func (o *Outcome) Gap() float64 { return o.Setup.Splice.Sizing.Gap }

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

// Run optimises a job with the splice package's sizing (exhaustive for the reference run)
// and checks the recommended layout's splices in full. When no layout satisfies the limits
// it returns the outcome without layouts together with an *InfeasibleError.
func Run(s *Setup, set Settings) (*Outcome, error) {
	d := s.NewSpliceDesigner(set.Exhaustive)
	d.Fixed = set.Fixed
	o, err := Optimise(s, d, set)
	if o == nil || o.Infeasible != nil {
		return o, err
	}
	o.Fixed = set.Fixed
	if o.Fixed == nil { // with one fixed splice every layout is of identical splices already
		if o.Identical, err = o.Uniform(); err != nil {
			return nil, err
		}
	}
	o.UniformRule = set.Uniform || s.Uniform
	o.Pick = o.pick(o.UniformRule)
	o.Chosen, err = o.Sheets(o.Recommended().Splices)
	if err != nil {
		return nil, err
	}
	return o, nil
}

// Optimise scans the job's beam with a designer and finds the layouts: candidates every step
// from the left end, keep-out zones, design forces from the envelopes, the cheapest splice at
// each position, then the exact layout search. No layout within the limits gives the outcome
// so far (candidates, no layouts, the Diagnosis) with an *InfeasibleError; anything the job
// file causes is a jobfile.Problems and no outcome, and a step of the settings that cannot be
// used (too many positions) a *SettingError naming "step". The outcome's Chosen is left empty
// (Run fills it).
func Optimise(s *Setup, d Designer, set Settings) (*Outcome, error) {
	rank, err := ParseRank(string(set.Rank))
	if err != nil {
		return nil, err
	}
	o, err := s.newOutcome(set, rank)
	if err != nil {
		return nil, err
	}
	xs, err := Grid(s.Model.Length, o.Step)
	switch {
	case err != nil && set.Step != 0:
		return nil, &SettingError{"step", err} // the settings' step, not the job's
	case err != nil:
		var probs jobfile.Problems
		probs.Add(s.Where("scan.step"), "%v", err)
		return nil, probs.Err()
	}
	if o.Source, err = s.Forces(); err != nil {
		return nil, err
	}
	o.Analysis = o.Source.Analysis()
	if o.Envelopes, err = o.Source.Chart(); err != nil {
		return nil, err
	}
	if o.Member, err = o.Source.Member(&o.Envelopes); err != nil {
		return nil, err
	}
	workers := set.Workers
	if set.Exhaustive {
		workers = 1
	}
	cands, stats, err := Scan(o.Source, xs, s.Zones, d, ScanSettings{Exhaustive: set.Exhaustive, Workers: workers})
	if probs, ok := s.LocateOverflow(err); ok {
		return nil, probs // the envelopes overflow
	}
	if err != nil {
		// the designer refuses the splice options (the forces are the analysis's own)
		var probs jobfile.Problems
		probs.Add(s.Where("splice"), "%v", err)
		return nil, probs.Err()
	}
	o.Candidates, o.Stats = cands, stats
	rankCandidates(o.Candidates, rank)
	lr, err := Layouts(o.layoutProblem())
	if err != nil {
		var le *LimitError
		if errors.As(err, &le) {
			o.explain(le)
			o.Infeasible = le
			o.Diagnosis = o.diagnosis(le)
			return o, &InfeasibleError{At: s.Where(le.Key), Limit: le}
		}
		return nil, err
	}
	o.Layouts = lr
	o.Pick = o.pick(false)
	return o, nil
}

// newOutcome applies the settings to the setup: step, rigging, alternatives and the notes.
func (s *Setup) newOutcome(set Settings, rank Rank) (*Outcome, error) {
	o := &Outcome{Setup: s, Rank: rank, Exhaustive: set.Exhaustive, Limits: s.Limits, Step: s.Step, Alternatives: s.Alternatives}
	if set.Rigging < 0 || math.IsNaN(set.Rigging) {
		var probs jobfile.Problems
		probs.Add(s.Where(""), "the rigging allowance must not be negative, got %g kg", set.Rigging)
		return nil, probs.Err()
	}
	if set.Rigging != 0 {
		o.Limits.Rigging = set.Rigging
	}
	if set.Step != 0 {
		o.Step = set.Step
	}
	switch {
	case set.Alternatives < 0:
		o.Alternatives = 0
	case set.Alternatives > 0:
		o.Alternatives = set.Alternatives
	}
	if !s.Costed {
		o.Notes = append(o.Notes, "the job has no costs block: splices are priced at the splice package's indicative rates "+
			"(invented, for ranking only), and lifts cost nothing")
	}
	if len(s.Vehicles) == 0 {
		o.Notes = append(o.Notes, "the job lists no vehicles: transport is not costed and only max_piece_length limits the pieces")
	}
	return o, nil
}

// layoutProblem offers the feasible candidates to the layout search, grouping neighbours with
// the same splice design into one variant class.
func (r *Outcome) layoutProblem() LayoutProblem {
	s := r.Setup
	p := LayoutProblem{Length: s.Model.Length, MassPerLength: s.Section.Mass / 1000, Gap: r.Gap(), Limits: r.Limits,
		MinSplices: s.MinSplices, MaxSplices: s.MaxSplices, Vehicles: s.Vehicles, Lift: s.Lift,
		Alternatives: r.Alternatives, Extra: ExtraCounts}
	feasible := 0
	for _, c := range r.Candidates {
		if c.Feasible {
			feasible++
		}
	}
	if feasible > 0 {
		p.Sites = make([]Site, 0, feasible)
	}
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
func (r *Outcome) explain(le *LimitError) {
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
